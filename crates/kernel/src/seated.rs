//! The seated posture: hip over the saddle, feet on the pedals, hands on the grips
//! (DESIGN.md §6.6).
//!
//! The hip joint is `hip_above_saddle` straight above the saddle's sit point. Legs: the two-link
//! chain hip → knee → ankle, the knee ahead of the hip–ankle line, the sole tilted toe-down by
//! the stated ankle angle. Trunk and arms: with the elbows bent by the stated angle the shoulder
//! is `arm_span(bend)` from the grip and `torso` from the hip, above the hip–grip line (a
//! two-link chain hip → shoulder → grip); the elbow lies below the shoulder–grip line.

use crate::error::Warning;
use crate::posture::{describe, foot_on_pedal, interior, two_link, Figure, Reach};
use crate::report::Numbers;
use crate::rider::Body;
use nalgebra::Point2;
use std::f64::consts::PI;

/// Toe-down sole angle assumed while seated, degrees [practice: riders pedal with the heel
/// somewhat up; 10–20° is common].
pub const SEATED_TOE_DOWN_DEG: f64 = 15.0;

/// Where the seated rider touches the bike (ridden axes, mm and radians).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Contacts {
    /// Saddle sit point.
    pub saddle: Point2<f64>,
    /// Grip centre.
    pub grip: Point2<f64>,
    /// Crank length, mm.
    pub crank: f64,
    /// Elbow bend from straight, radians.
    pub elbow_bend: f64,
}

/// A solved posture: numbers, warnings, and the figure and body centre of mass when every limb
/// reaches.
#[derive(Debug, Clone, PartialEq, Default)]
pub struct Posture {
    /// Joint angles and positions, keys with unit suffixes.
    pub numbers: Numbers,
    /// Why a part of the posture is out of reach.
    pub warnings: Vec<Warning>,
    /// The posed body, when every limb reaches.
    pub figure: Option<Figure>,
    /// The body's centre of mass (rider only), when the figure exists.
    pub com: Option<Point2<f64>>,
}

fn unreachable(what: &str, r: Reach) -> Warning {
    Warning::new(
        "unreachable",
        format!("{}; those numbers are left out.", describe(what, r)),
    )
}

fn put(n: &mut Numbers, key: &'static str, v: f64) {
    n.insert(key.into(), v);
}

/// Solves the seated posture.
pub fn seated(body: &Body, c: &Contacts) -> Posture {
    let mut out = Posture::default();
    let toe_down = SEATED_TOE_DOWN_DEG.to_radians();
    let hip = c.saddle + nalgebra::Vector2::new(0.0, body.hip_above_saddle);
    put(&mut out.numbers, "hip_x_mm", hip.x);
    put(&mut out.numbers, "hip_y_mm", hip.y);
    let knee_at = |pedal: Point2<f64>| {
        let f = foot_on_pedal(body, pedal, toe_down);
        two_link(hip, f.ankle, body.thigh, body.shank, 1.0).map(|k| (k, f))
    };
    match knee_at(Point2::new(0.0, -c.crank)) {
        Ok((k, f)) => put(
            &mut out.numbers,
            "knee_flexion_bdc_deg",
            (PI - interior(k, hip, f.ankle)).to_degrees(),
        ),
        Err(r) => out
            .warnings
            .push(unreachable("seated, the pedal at bottom dead centre is", r)),
    }
    let tdc = knee_at(Point2::new(0.0, c.crank));
    if let Ok((k, f)) = tdc {
        put(
            &mut out.numbers,
            "knee_angle_tdc_deg",
            interior(k, hip, f.ankle).to_degrees(),
        );
    } else if let Err(r) = tdc {
        out.warnings
            .push(unreachable("seated, the pedal at top dead centre is", r));
    }
    let span = body.arm_span(c.elbow_bend);
    let shoulder = match two_link(hip, c.grip, body.torso, span, 1.0) {
        Ok(s) => s,
        Err(r) => {
            let straight = (c.grip - hip).norm() - (body.torso + body.arm_reach());
            let what = match r {
                Reach::TooFar(_) if straight > 0.0 => {
                    return with(
                        out,
                        unreachable("seated, the grips are", Reach::TooFar(straight)),
                    )
                }
                Reach::TooFar(_) => "seated with the stated elbow bend, the grips are",
                Reach::TooClose(_) => "seated, the grips are",
            };
            return with(out, unreachable(what, r));
        }
    };
    let elbow = match two_link(
        shoulder,
        c.grip,
        body.upper_arm,
        body.forearm_to_grip(),
        -1.0,
    ) {
        Ok(e) => e,
        Err(r) => return with(out, unreachable("seated, the grips are", r)),
    };
    let n = &mut out.numbers;
    put(
        n,
        "torso_angle_deg",
        (shoulder.y - hip.y).atan2(shoulder.x - hip.x).to_degrees(),
    );
    put(
        n,
        "shoulder_angle_deg",
        interior(shoulder, hip, elbow).to_degrees(),
    );
    put(
        n,
        "elbow_angle_deg",
        interior(elbow, shoulder, c.grip).to_degrees(),
    );
    put(n, "shoulder_x_mm", shoulder.x);
    put(n, "shoulder_y_mm", shoulder.y);
    if let Ok((k, _)) = tdc {
        put(
            n,
            "hip_angle_tdc_deg",
            interior(hip, shoulder, k).to_degrees(),
        );
    }
    let near = knee_at(Point2::new(c.crank, 0.0));
    let far = knee_at(Point2::new(-c.crank, 0.0));
    match (near, far) {
        (Ok((k0, f0)), Ok((k1, f1))) => {
            let fig = Figure {
                hip,
                shoulder,
                elbow,
                grip: c.grip,
                knees: [k0, k1],
                feet: [f0, f1],
            };
            out.com = Some(fig.centre_of_mass(body));
            out.figure = Some(fig);
        }
        (Err(r), _) | (_, Err(r)) => out
            .warnings
            .push(unreachable("seated, with level cranks a pedal is", r)),
    }
    out
}

fn with(mut p: Posture, w: Warning) -> Posture {
    p.warnings.push(w);
    p
}
