//! The rider figure and the centre of mass with its lines to the tyre contacts.

use crate::model::Node;
use crate::shapes::{join, mid, num, text, PathData};
use crate::Limits;
use framewise_kernel::report::{Leg, RiderFigure, Xy};
use framewise_kernel::Outline;

/// The hip joint's drawn radius, mm.
const JOINT_R: f64 = 14.0;
/// The centre-of-mass mark's radius, mm.
const COM_R: f64 = 24.0;

fn foot(l: &Leg) -> [Xy; 5] {
    [l.ankle, l.heel, l.toe, l.ball, l.ankle]
}

/// The rider as a stick figure, keys prefixed by `posture`: the far leg (its own group, drawn
/// fainter), then torso, head, the near limbs (neck, arm, near leg: one part), the near foot
/// and the hip joint. One colour under one group opacity, so merging limbs changes nothing seen.
pub fn rider(f: &RiderFigure, posture: &str) -> Node {
    let [near, far] = f.legs;
    let k = |name: &str| join(&[posture, "-", name]);
    let far_leg = Node::Group {
        class: "leg far".into(),
        children: vec![
            PathData::new()
                .polyline(&[f.hip, far.knee, far.ankle])
                .node(k("far-limb"), "limb"),
            PathData::new()
                .polyline(&foot(&far))
                .node(k("far-foot"), "foot"),
        ],
    };
    let limbs = PathData::new()
        .line(f.shoulder, f.head)
        .polyline(&[f.shoulder, f.elbow, f.hand])
        .polyline(&[f.hip, near.knee, near.ankle]);
    Node::Group {
        class: "rider".into(),
        children: vec![
            far_leg,
            PathData::new()
                .line(f.hip, f.shoulder)
                .node(k("torso"), "limb torso"),
            PathData::new()
                .circle(f.head, f.head_radius)
                .node(k("head"), "head"),
            limbs.node(k("limbs"), "limb"),
            PathData::new()
                .polyline(&foot(&near))
                .node(k("foot"), "foot"),
            PathData::new()
                .circle(f.hip, JOINT_R)
                .node(k("joint"), "joint"),
        ],
    }
}

/// The step of the handling labels' positions, mm: a label stays put while the centre of mass
/// moves less than this, so most edits do not lay its text out again (about 1.5 px on a phone).
const LABEL_STEP_MM: f64 = 10.0;

fn snap(p: Xy) -> Xy {
    p.map(|v| (v / LABEL_STEP_MM).round() * LABEL_STEP_MM)
}

/// The braking label's baseline height: 30 mm above the centre of mass, but when the grip is
/// known never lower than clear above the BB-to-grip dimension label (baseline
/// [`crate::dims::GRIP_LABEL_RISE`] above the grip), whose line it would otherwise share on
/// most bikes: that label's capitals (0.75 em) and this one's descenders (0.25 em) in the
/// largest type ([`crate::LABEL_EM_MAX_MM`]) and a 16 mm gap, rounded up to the labels' grid
/// (so [`snap`] keeps it). The same with the dimensions hidden, so showing them moves nothing.
fn braking_label_y(c: Xy, o: &Outline) -> f64 {
    let own = c[1] + 30.0;
    let Some(ck) = &o.cockpit else { return own };
    let clear = ck.grip[1] + crate::dims::GRIP_LABEL_RISE + crate::LABEL_EM_MAX_MM + 16.0;
    own.max((clear / LABEL_STEP_MM).ceil() * LABEL_STEP_MM)
}

/// The centre of mass, its lines to both contact points, and the limits written on them (at
/// positions on a [`LABEL_STEP_MM`] grid).
pub fn com(c: Xy, o: &Outline, limits: &Limits, posture: &str) -> Node {
    let k = |name: &str| join(&[posture, "-", name]);
    let mut kids = vec![
        PathData::new()
            .line(c, o.rear_contact)
            .line(c, o.front_contact)
            .node(k("tip-lines"), "tip-line"),
        PathData::new()
            .circle(c, COM_R)
            .node(k("com-mark"), "com-mark"),
        PathData::new()
            .line([c[0] - COM_R, c[1]], [c[0] + COM_R, c[1]])
            .line([c[0], c[1] - COM_R], [c[0], c[1] + COM_R])
            .node(k("com-cross"), "com-cross"),
    ];
    let class = "label com-label";
    if let Some(b) = limits.braking_g {
        kids.push(text(
            k("braking"),
            snap([c[0] + 40.0, braking_label_y(c, o)]),
            format!("braking limit {} g", num(b, 2)),
            "start",
            class,
        ));
    }
    if let Some(d) = limits.climb_deg {
        kids.push(text(
            k("climb"),
            snap(mid(c, o.rear_contact)),
            format!("climb {}°", num(d, 0)),
            "end",
            class,
        ));
    }
    if let Some(d) = limits.descent_deg {
        kids.push(text(
            k("descent"),
            snap(mid(c, o.front_contact)),
            format!("descent {}°", num(d, 0)),
            "start",
            class,
        ));
    }
    Node::Group {
        class: "com".into(),
        children: kids,
    }
}
