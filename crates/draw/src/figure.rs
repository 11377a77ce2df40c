//! The rider figure and the centre of mass with its lines to the tyre contacts.

use crate::layout::LimitSpots;
use crate::model::Node;
use crate::shapes::{join, num, text, PathData};
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

/// The braking limit's words.
pub fn braking_words(g: f64) -> String {
    format!("braking limit {} g", num(g, 2))
}

/// A slope limit's words: the steepest descent (`front`) or climb.
pub fn slope_words(front: bool, deg: f64) -> String {
    let what = if front { "descent" } else { "climb" };
    format!("{what} {}°", num(deg, 0))
}

/// The centre of mass, its lines to both contact points, and the limits written on them, placed
/// by [`crate::layout`] (braking, climb, descent, as the posture has them).
pub fn com(c: Xy, o: &Outline, mut spots: LimitSpots, posture: &str) -> Node {
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
    for (what, label) in [
        ("braking", &mut spots.braking),
        ("climb", &mut spots.climb),
        ("descent", &mut spots.descent),
    ] {
        if let Some(l) = label.take() {
            kids.push(text(
                k(what),
                l.spot.at,
                l.words,
                l.spot.anchor.svg(),
                class,
            ));
        }
    }
    Node::Group {
        class: "com".into(),
        children: kids,
    }
}
