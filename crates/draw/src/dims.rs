//! Dimension labels on demand: reach, stack, wheelbase, BB height, trail and BB-to-grip, each a
//! thin line between kernel points with its number from the report (hidden unless the page
//! shows them). The lines are one part; each label keeps its own group `dim dim-{key}`.

use crate::layout::Spots;
use crate::model::Node;
use crate::place::{width_em, ASCENT_EM, BOX_DESCENT_EM, DESCENT_EM, HALO_MM};
use crate::shapes::{join, num, text, PathData};
use framewise_kernel::glossary::short_label;
use framewise_kernel::report::{Numbers, Xy};
use framewise_kernel::Outline;

/// How far a dimension line stands off the part it measures, mm of drawing.
const OFF: f64 = 70.0;

/// How far the trail line lies below the ground, mm (half [`OFF`]).
const TRAIL_DROP: f64 = OFF / 2.0;

/// The gap between a row of labels' ink and the line above it, mm: the labels' halo
/// ([`HALO_MM`]) and a little more, so that no halo cuts the line.
const UNDER_LINE: f64 = HALO_MM + 6.0;

/// The largest type's ink above its baseline and text box below it, mm.
const ASCENT: f64 = ASCENT_EM * crate::LABEL_EM_MAX_MM;
const BOX_DESCENT: f64 = BOX_DESCENT_EM * crate::LABEL_EM_MAX_MM;

/// The BB-to-grip label's baseline above the grip, mm (its start is [`GRIP_LABEL_AHEAD`] ahead
/// of the grip).
pub const GRIP_LABEL_RISE: f64 = 30.0;

/// The BB-to-grip label's start ahead of the grip, mm.
pub const GRIP_LABEL_AHEAD: f64 = 40.0;

/// The BB-to-grip label's width in the largest type, mm. The view box reaches past its end
/// ([`crate::view::fit`]): on a bike whose grip is far forward (a road bike's hoods) the label
/// would otherwise run off the drawing's edge.
pub fn grip_label_width(n: &Numbers) -> f64 {
    let v = n.get("bb_to_grip_mm").copied().unwrap_or(1000.0);
    width_em(&words_of("bb_to_grip_mm", v)) * crate::LABEL_EM_MAX_MM
}

/// Where the labels below the ground go. The trail line lies just below the ground and the
/// wheelbase line under it, its label in a row under it, the trail label in that row from the
/// front contact forward. BB height's label goes low between the tyres, on the ground line if
/// need be; where it does not fit there in the largest type (a short wheelbase, large wheels),
/// it goes under the ground below its line, with the trail label, in a row of its own above the
/// wheelbase line, which moves down a row.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Below {
    /// Whether BB height's label goes below the ground.
    pub bb_height: bool,
    ground: f64,
}

impl Below {
    /// The rows of an outline, for BB height's words from `n`.
    pub fn of(o: &Outline, n: &Numbers) -> Self {
        let v = n.get("bb_height_mm").copied().unwrap_or(0.0);
        let w = width_em(&words_of("bb_height_mm", v)) * crate::LABEL_EM_MAX_MM;
        Below {
            bb_height: !fits_between_tyres(o, w),
            ground: o.ground_y,
        }
    }

    /// The trail line's height.
    pub fn trail_y(&self) -> f64 {
        self.ground - TRAIL_DROP
    }

    /// The baseline of the row under the trail line (BB height and trail), when there is one:
    /// its ink [`UNDER_LINE`] under the trail line.
    pub fn upper_baseline(&self) -> f64 {
        self.trail_y() - UNDER_LINE - ASCENT
    }

    /// The wheelbase line's height: under the trail line, or under the upper row.
    pub fn wheelbase_y(&self) -> f64 {
        if self.bb_height {
            self.upper_baseline() - BOX_DESCENT - UNDER_LINE
        } else {
            self.ground - TRAIL_DROP - 20.0
        }
    }

    /// The baseline of the row under the wheelbase line.
    pub fn wheelbase_baseline(&self) -> f64 {
        self.wheelbase_y() - UNDER_LINE - ASCENT
    }

    /// How far below the ground the lowest label's text box reaches, mm.
    pub fn depth(&self) -> f64 {
        self.ground - (self.wheelbase_baseline() - BOX_DESCENT)
    }
}

/// Whether a label `w` mm wide in the largest type fits between the tyres, centred between the
/// axles with its ink centred on the ground line (the lowest of its spots there): the room
/// between the tyres' outer edges (stroke and halo included) at the ink's top, half the ink's
/// height (([`ASCENT_EM`] + [`DESCENT_EM`]) / 2 em) above the ground and its halo more. (It was
/// half the ascent, 0.375 em: 11 mm low in the largest type, where a wider label then lay on
/// the rear tyre; seen in 90 mm type.)
fn fits_between_tyres(o: &Outline, w: f64) -> bool {
    let top = o.ground_y + (ASCENT_EM + DESCENT_EM) / 2.0 * crate::LABEL_EM_MAX_MM + HALO_MM;
    let half = |axle: Xy, r: f64| {
        let (big, dy) = (r + 15.0 + HALO_MM, axle[1] - top);
        if dy >= big {
            0.0
        } else {
            (big * big - dy * dy).sqrt()
        }
    };
    let room = (o.front_axle[0] - half(o.front_axle, o.front_radius))
        - (o.rear_axle[0] + half(o.rear_axle, o.rear_radius));
    room >= w
}

/// One dimension: its key and its line from `a` to `b`.
pub struct Dim {
    /// The report's key.
    pub key: &'static str,
    /// One end of the line.
    pub a: Xy,
    /// The other end.
    pub b: Xy,
}

/// The dimension lines: reach at the head tube top's height from above the BB to it; stack
/// [`OFF`] twice ahead of the head tube top, from the BB's height up; wheelbase below the
/// ground between the axles; BB height [`OFF`] behind the BB, from the ground up (from its
/// label's top when that is below the ground); trail just below the ground from the front
/// contact to the steering axis's foot; BB to grip from the BB to the grip. Their labels are
/// placed by [`crate::layout`].
pub fn dims_of(o: &Outline, below: &Below) -> Vec<Dim> {
    let t = o.head_top;
    let sx = t[0] + OFF * 2.0;
    let wy = below.wheelbase_y();
    let ty = below.trail_y();
    let (c, s) = (o.front_contact[0], o.steer_ground[0]);
    let foot = if below.bb_height {
        below.upper_baseline() + ASCENT
    } else {
        o.ground_y
    };
    let d = |key, a, b| Dim { key, a, b };
    let mut v = vec![
        d("reach_mm", [0.0, t[1]], [t[0], t[1]]),
        d("stack_mm", [sx, 0.0], [sx, t[1]]),
        d("wheelbase_mm", [o.rear_axle[0], wy], [o.front_axle[0], wy]),
        d("bb_height_mm", [-OFF, foot], [-OFF, 0.0]),
        d("trail_mm", [c, ty], [s, ty]),
    ];
    if let Some(ck) = &o.cockpit {
        v.push(d("bb_to_grip_mm", [0.0, 0.0], ck.grip));
    }
    v
}

/// The words of a dimension label: its name and number, a length without its unit (millimetres,
/// as in a dimensioned drawing; the tables say the unit), so that the labels fit in the phone's
/// larger type ([`crate::LABEL_EM_MAX_MM`]: "BB height 337 mm" was wider than the room between
/// the tyres). Names are the glossary's short ones ("BB to grip",
/// [`framewise_kernel::glossary::SHORT_LABELS`]) so that the label fits beside the front wheel.
pub fn words_of(key: &str, v: f64) -> String {
    let unit = if key.ends_with("_deg") { "°" } else { "" };
    let name = short_label(key).unwrap_or(key);
    format!("{name} {}{unit}", num(v, 0))
}

/// The dimension group of one outline, its rows below the ground `below`, its labels placed in
/// `spots` (a dimension the report lacks has no label there, and no line).
pub fn dimensions(o: &Outline, below: &Below, mut spots: Spots) -> Node {
    let mut lines = PathData::new();
    let mut labels = Vec::new();
    for dim in dims_of(o, below) {
        let Some(l) = spots.take_dim(dim.key) else {
            continue;
        };
        lines = lines.line(dim.a, dim.b);
        labels.push(Node::Group {
            class: join(&["dim dim-", dim.key]),
            children: vec![text(
                join(&["dim-", dim.key]),
                l.spot.at,
                l.words,
                l.spot.anchor.svg(),
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
