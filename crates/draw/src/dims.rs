//! Dimension labels on demand: reach, stack, wheelbase, BB height, trail and BB-to-grip, each a
//! thin line between kernel points with its number from the report (hidden unless the page
//! shows them). The lines are one part; each label keeps its own group `dim dim-{key}`.

use crate::model::Node;
use crate::shapes::{join, num, text, PathData};
use framewise_kernel::glossary::short_label;
use framewise_kernel::report::{Numbers, Xy};
use framewise_kernel::Outline;

/// How far a dimension line stands off the part it measures, mm of drawing.
const OFF: f64 = 70.0;

/// How far the wheelbase line lies below the ground, mm: below the trail line (half [`OFF`]),
/// with room under it for the labels of both (see [`BELOW_LINE`]).
const WHEELBASE_DROP: f64 = 60.0;

/// The wheelbase and trail labels' baseline below the wheelbase line, mm: the ascenders of the
/// largest type (0.76 × [`crate::LABEL_EM_MAX_MM`], 61 mm), the labels' halo
/// (`stroke-width: 18` in web/style.css) and a gap, so that no halo cuts the line; the type's
/// box, 0.2 em under the baseline, stays inside the view box (at least 160 mm below the ground,
/// [`crate::view::fit`]).
const BELOW_LINE: f64 = 80.0;

/// The BB-to-grip label's baseline above the grip, mm (its start is [`GRIP_LABEL_AHEAD`] ahead
/// of the grip).
pub const GRIP_LABEL_RISE: f64 = 30.0;

/// The BB-to-grip label's start ahead of the grip, mm.
pub const GRIP_LABEL_AHEAD: f64 = 40.0;

/// The BB-to-grip label's width, estimated for the largest type, mm: "BB to grip 1000", 15
/// characters at 0.6 em each (the estimate tests.rs uses) of [`crate::LABEL_EM_MAX_MM`]. The
/// view box reaches past its end ([`crate::view::fit`]): on a bike whose grip is far forward (a
/// road bike's hoods) the label would otherwise run off the drawing's edge.
pub const GRIP_LABEL_WIDTH: f64 = 15.0 * 0.6 * crate::LABEL_EM_MAX_MM;

/// One dimension: the line from `a` to `b` and the label at `at`.
struct Dim {
    key: &'static str,
    a: Xy,
    b: Xy,
    at: Xy,
    anchor: &'static str,
}

/// Where each label goes, chosen so that on the demo bike (and bikes like it) no label lies on a
/// tyre or on another label in any type size the page uses, [`crate::LABEL_EM_MM`] to
/// [`crate::LABEL_EM_MAX_MM`] (tested in `tests.rs` and tests/browser/labels.test.mjs): reach
/// above its line; stack beside its line, halfway between the head tube top and the front tyre;
/// wheelbase and trail below the ground, trail from the front contact forward (centred under its
/// short line, it met the wheelbase label on a road bike); BB height low between the wheels,
/// centred between the axles like the wheelbase, its line ending on it (the widest room between
/// the tyres: beside the foot of its line, the largest type reached the front tyre); BB-to-grip
/// beyond the grip.
fn dims_of(o: &Outline) -> Vec<Dim> {
    let t = o.head_top;
    let gy = o.ground_y;
    let ry = t[1];
    let sx = t[0] + OFF * 2.0;
    let wy = gy - WHEELBASE_DROP;
    let (r, f) = (o.rear_axle[0], o.front_axle[0]);
    let ty = gy - OFF / 2.0;
    let (c, s) = (o.front_contact[0], o.steer_ground[0]);
    // The top of the front tyre, stroke included, and the baseline that centres a label
    // between it and the head tube top.
    let tyre_top = o.front_axle[1] + o.front_radius + TYRE_HALF_STROKE;
    let stack_y = (t[1] + tyre_top) / 2.0 - LABEL_MID;
    let d = |key, a, b, at, anchor| Dim {
        key,
        a,
        b,
        at,
        anchor,
    };
    let mut v = vec![
        d(
            "reach_mm",
            [0.0, ry],
            [t[0], ry],
            [t[0] / 2.0, ry + 25.0],
            "middle",
        ),
        d(
            "stack_mm",
            [sx, 0.0],
            [sx, t[1]],
            [sx + 20.0, stack_y],
            "start",
        ),
        d(
            "wheelbase_mm",
            [r, wy],
            [f, wy],
            [(r + f) / 2.0, wy - BELOW_LINE],
            "middle",
        ),
        d(
            "bb_height_mm",
            [-OFF, gy],
            [-OFF, 0.0],
            [(r + f) / 2.0, gy + 22.0],
            "middle",
        ),
        d("trail_mm", [c, ty], [s, ty], [c, wy - BELOW_LINE], "start"),
    ];
    if let Some(ck) = &o.cockpit {
        v.push(d(
            "bb_to_grip_mm",
            [0.0, 0.0],
            ck.grip,
            [ck.grip[0] + GRIP_LABEL_AHEAD, ck.grip[1] + GRIP_LABEL_RISE],
            "start",
        ));
    }
    v
}

/// Half the tyre's stroke width in the page's CSS (`.tyre { stroke-width: 30 }`), mm.
const TYRE_HALF_STROKE: f64 = 15.0;
/// From a label's baseline to the middle of its capitals: about 0.35 of the 64 mm type, mm.
const LABEL_MID: f64 = 22.0;

/// The words of a dimension label: its name and number, a length without its unit (millimetres,
/// as in a dimensioned drawing; the tables say the unit), so that the labels fit in the phone's
/// larger type ([`crate::LABEL_EM_MAX_MM`]: "BB height 337 mm" was wider than the room between
/// the tyres). Names are the glossary's short ones ("BB to grip",
/// [`framewise_kernel::glossary::SHORT_LABELS`]) so that the label fits beside the front wheel.
fn words_of(key: &str, v: f64) -> String {
    let unit = if key.ends_with("_deg") { "°" } else { "" };
    let name = short_label(key).unwrap_or(key);
    format!("{name} {}{unit}", num(v, 0))
}

/// The dimension group of one outline.
pub fn dimensions(o: &Outline, n: &Numbers) -> Node {
    let mut lines = PathData::new();
    let mut labels = Vec::new();
    for dim in dims_of(o) {
        let Some(v) = n.get(dim.key) else { continue };
        let words = words_of(dim.key, *v);
        lines = lines.line(dim.a, dim.b);
        labels.push(Node::Group {
            class: join(&["dim dim-", dim.key]),
            children: vec![text(
                join(&["dim-", dim.key]),
                dim.at,
                words,
                dim.anchor,
                "label dim-label",
            )],
        });
    }
    let mut children = vec![
        lines.node("dim-lines".into(), "dim-line"),
        PathData::new()
            .line(o.head_top, o.steer_ground)
            .node("steer-axis".into(), "steer-axis"),
    ];
    children.extend(labels);
    Node::Group {
        class: "dims".into(),
        children,
    }
}
