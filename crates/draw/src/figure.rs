//! The rider figure and the centre of mass with its lines to the tyre contacts.

use crate::shapes::{circle, line, mid, num, polyline, text};
use crate::Limits;
use framewise_kernel::report::{Leg, RiderFigure, Xy};
use framewise_kernel::Outline;
use svg::node::element::Group;

fn leg(hip: Xy, l: &Leg, class: &str) -> Group {
    Group::new()
        .set("class", format!("leg {class}"))
        .add(polyline(&[hip, l.knee, l.ankle], "limb"))
        .add(polyline(&[l.ankle, l.heel, l.toe, l.ball, l.ankle], "foot"))
}

/// The rider as a stick figure: far leg, torso, head, arm, near leg.
pub fn rider(f: &RiderFigure) -> Group {
    let [near, far] = f.legs;
    Group::new()
        .set("class", "rider")
        .add(leg(f.hip, &far, "far"))
        .add(line(f.hip, f.shoulder, "limb torso"))
        .add(line(f.shoulder, f.head, "limb neck"))
        .add(circle(f.head, f.head_radius, "head"))
        .add(polyline(&[f.shoulder, f.elbow, f.hand], "limb arm"))
        .add(leg(f.hip, &near, "near"))
        .add(circle(f.hip, 14.0, "joint"))
}

/// The centre of mass, its lines to both contact points, and the limits written on them.
pub fn com(c: Xy, o: &Outline, limits: &Limits) -> Group {
    let mut g = Group::new()
        .set("class", "com")
        .add(line(c, o.rear_contact, "tip-line rear"))
        .add(line(c, o.front_contact, "tip-line front"))
        .add(circle(c, 24.0, "com-mark"))
        .add(line([c[0] - 24.0, c[1]], [c[0] + 24.0, c[1]], "com-cross"))
        .add(line([c[0], c[1] - 24.0], [c[0], c[1] + 24.0], "com-cross"));
    if let Some(b) = limits.braking_g {
        g = g.add(text(
            [c[0] + 40.0, c[1] + 30.0],
            &format!("braking limit {} g", num(b, 2)),
            "start",
            "label com-label",
        ));
    }
    if let Some(d) = limits.climb_deg {
        g = g.add(text(
            mid(c, o.rear_contact),
            &format!("climb {}°", num(d, 0)),
            "end",
            "label com-label",
        ));
    }
    if let Some(d) = limits.descent_deg {
        g = g.add(text(
            mid(c, o.front_contact),
            &format!("descent {}°", num(d, 0)),
            "start",
            "label com-label",
        ));
    }
    g
}
