//! Dimension labels on demand: reach, stack, wheelbase, BB height, trail and BB-to-grip, each a
//! thin line between kernel points with its number from the report (hidden unless the page
//! shows them).

use crate::shapes::{line, mid, num, text};
use framewise_kernel::glossary::label;
use framewise_kernel::report::{Numbers, Xy};
use framewise_kernel::Outline;
use svg::node::element::Group;

/// How far a dimension line stands off the part it measures, mm of drawing.
const OFF: f64 = 70.0;

fn dim(g: Group, a: Xy, b: Xy, at: Xy, key: &str, numbers: &Numbers, anchor: &str) -> Group {
    let Some(v) = numbers.get(key) else {
        return g;
    };
    let unit = if key.ends_with("_deg") { "°" } else { " mm" };
    let words = format!("{} {}{unit}", label(key).unwrap_or(key), num(*v, 0));
    g.add(
        Group::new()
            .set("class", format!("dim dim-{key}"))
            .add(line(a, b, "dim-line"))
            .add(text(at, &words, anchor, "label dim-label")),
    )
}

/// The dimension group of one outline.
pub fn dimensions(o: &Outline, n: &Numbers) -> Group {
    let t = o.head_top;
    let gy = o.ground_y;
    let mut g = Group::new().set("class", "dims");
    let ry = t[1];
    g = dim(
        g,
        [0.0, ry],
        [t[0], ry],
        [t[0] / 2.0, ry + 25.0],
        "reach_mm",
        n,
        "middle",
    );
    let sx = t[0] + OFF * 2.0;
    g = dim(
        g,
        [sx, 0.0],
        [sx, t[1]],
        [sx + 20.0, t[1] / 4.0],
        "stack_mm",
        n,
        "start",
    );
    let wy = gy - OFF;
    let (r, f) = (o.rear_axle[0], o.front_axle[0]);
    g = dim(
        g,
        [r, wy],
        [f, wy],
        [(r + f) / 2.0, wy - 50.0],
        "wheelbase_mm",
        n,
        "middle",
    );
    let bx = -OFF;
    g = dim(
        g,
        [bx, gy],
        [bx, 0.0],
        [bx - 20.0, gy / 2.0],
        "bb_height_mm",
        n,
        "end",
    );
    let ty = gy - OFF / 2.0;
    let (c, s) = (o.front_contact[0], o.steer_ground[0]);
    g = g.add(line(o.head_top, o.steer_ground, "steer-axis"));
    g = dim(
        g,
        [c, ty],
        [s, ty],
        [(c + s) / 2.0, gy - OFF - 50.0],
        "trail_mm",
        n,
        "middle",
    );
    if let Some(ck) = &o.cockpit {
        let m = mid([0.0, 0.0], ck.grip);
        g = dim(
            g,
            [0.0, 0.0],
            ck.grip,
            [m[0] - 30.0, m[1]],
            "bb_to_grip_mm",
            n,
            "end",
        );
    }
    g
}
