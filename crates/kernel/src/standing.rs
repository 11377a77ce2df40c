//! The standing posture: level cranks, level soles, hands on the grips, hips placed for a
//! stated knee bend with the body's centre of mass over the feet (DESIGN.md §6.6).
//!
//! Model: the hip height is the one at which, with the hip midway between the two ankles, each
//! knee bends by the stated angle (`y = ankle_y + √(span² − (Δx/2)²)`, `span` the hip–ankle
//! distance of [`Body::leg_span`]). The trunk leans forward at the stated standing torso angle.
//! The hip then moves fore and aft (bracketed regula falsi, [`balance_root`]) until the body's
//! centre of mass is straight above the midpoint of the balls of the feet. Both hands hold the
//! grips; the elbow angle follows.

use crate::error::{fmt_num, Warning};
use crate::posture::{describe, foot_on_pedal, interior, two_link, Figure, Foot, Reach};
use crate::rider::Body;
use crate::seated::Posture;
use nalgebra::{Point2, Vector2};
use std::f64::consts::PI;

/// Elbow bend at which the arms count as folded for the room figure, degrees from straight
/// (a right angle at the elbow) [practice].
pub const FOLDED_ELBOW_BEND_DEG: f64 = 90.0;

/// The standing rider's contacts and stated posture (ridden axes; mm, radians).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Stance {
    /// Grip centre.
    pub grip: Point2<f64>,
    /// Crank length.
    pub crank: f64,
    /// Knee bend from straight.
    pub knee_bend: f64,
    /// Trunk angle above horizontal.
    pub torso_angle: f64,
    /// Ground height (for the hip height above the ground).
    pub ground_y: f64,
}

fn limb(p: Point2<f64>, q: Point2<f64>, a: f64, b: f64, side: f64) -> Point2<f64> {
    two_link(p, q, a, b, side).unwrap_or_else(|_| {
        let dir = (q - p).try_normalize(1e-12).unwrap_or(Vector2::x());
        p + dir * a
    })
}

fn figure(body: &Body, s: &Stance, hip: Point2<f64>, feet: [Foot; 2]) -> Figure {
    let shoulder = hip + Vector2::new(s.torso_angle.cos(), s.torso_angle.sin()) * body.torso;
    let [f0, f1] = feet;
    Figure {
        hip,
        shoulder,
        elbow: limb(
            shoulder,
            s.grip,
            body.upper_arm,
            body.forearm_to_grip(),
            -1.0,
        ),
        grip: s.grip,
        knees: [
            limb(hip, f0.ankle, body.thigh, body.shank, 1.0),
            limb(hip, f1.ankle, body.thigh, body.shank, 1.0),
        ],
        feet,
    }
}

/// Solves the standing posture.
pub fn standing(body: &Body, s: &Stance) -> Posture {
    let mut out = Posture::default();
    let feet = [
        foot_on_pedal(body, Point2::new(s.crank, 0.0), 0.0),
        foot_on_pedal(body, Point2::new(-s.crank, 0.0), 0.0),
    ];
    let [f0, f1] = feet;
    let span = body.leg_span(s.knee_bend);
    let half = (f0.ankle.x - f1.ankle.x).abs() / 2.0;
    if span <= half {
        out.warnings.push(Warning::new(
            "unreachable",
            format!(
                "standing, the feet are {} mm too far apart for the stated knee bend; the standing numbers are left out.",
                fmt_num(2.0 * (half - span))
            ),
        ));
        return out;
    }
    let hip_y = (f0.ankle.y + f1.ankle.y) / 2.0 + (span * span - half * half).sqrt();
    let target = (f0.ball.x + f1.ball.x) / 2.0;
    let mid = (f0.ankle.x + f1.ankle.x) / 2.0;
    let excess = |x: f64| {
        let fig = figure(body, s, Point2::new(x, hip_y), feet);
        fig.centre_of_mass(body).x - target
    };
    let (lo, hi) = (mid - 2.0 * span, mid + 2.0 * span);
    let (f_lo, f_hi) = (excess(lo), excess(hi));
    if f_lo > 0.0 || f_hi < 0.0 {
        out.warnings.push(Warning::new(
            "unreachable",
            "standing, no hip position puts the centre of mass over the feet; the standing numbers are left out.",
        ));
        return out;
    }
    let hip_x = balance_root(excess, (lo, f_lo), (hi, f_hi));
    let hip = Point2::new(hip_x, hip_y);
    let fig = figure(body, s, hip, feet);
    report(body, s, fig, out)
}

/// Hip position is found to this, mm: far below any drawn or reported precision.
pub const HIP_TOLERANCE_MM: f64 = 1e-9;

/// The root of `f` in the bracket `lo.0 ≤ x ≤ hi.0`, where `f(lo) ≤ 0 ≤ f(hi)`: regula falsi with
/// the Illinois modification (when the same end is kept twice its value is halved), which keeps
/// the bracket and converges superlinearly; the centre-of-mass offset is nearly linear in the hip
/// position, so a handful of placements of the figure replace the 40 of a bisection. Stops when
/// `|f| ≤ HIP_TOLERANCE_MM` or the bracket is narrower than it, and after at most 100 steps.
/// Source: Dowell and Jarratt, "A modified regula falsi method for computing the root of an
/// equation", BIT 11 (1971) 168–174.
fn balance_root(f: impl Fn(f64) -> f64, lo: (f64, f64), hi: (f64, f64)) -> f64 {
    let ((mut a, mut fa), (mut b, mut fb)) = (lo, hi);
    let mut side = 0i8;
    let mut x = (a + b) / 2.0;
    for _ in 0..100 {
        if b - a <= HIP_TOLERANCE_MM {
            return (a + b) / 2.0;
        }
        let cut = a - fa * (b - a) / (fb - fa);
        x = if cut > a && cut < b {
            cut
        } else {
            (a + b) / 2.0
        };
        let fx = f(x);
        if fx.abs() <= HIP_TOLERANCE_MM {
            return x;
        }
        if fx < 0.0 {
            (a, fa) = (x, fx);
            if side == -1 {
                fb /= 2.0;
            }
            side = -1;
        } else {
            (b, fb) = (x, fx);
            if side == 1 {
                fa /= 2.0;
            }
            side = 1;
        }
    }
    x
}

fn report(body: &Body, s: &Stance, fig: Figure, mut out: Posture) -> Posture {
    let n = &mut out.numbers;
    let dist = (s.grip - fig.shoulder).norm();
    n.insert("hip_x_mm".into(), fig.hip.x);
    n.insert("hip_y_mm".into(), fig.hip.y);
    n.insert("hip_height_mm".into(), fig.hip.y - s.ground_y);
    n.insert("torso_angle_deg".into(), s.torso_angle.to_degrees());
    n.insert("arm_extension_room_mm".into(), body.arm_reach() - dist);
    n.insert(
        "arm_fold_room_mm".into(),
        dist - body.arm_span(FOLDED_ELBOW_BEND_DEG.to_radians()),
    );
    let mut ok = true;
    match two_link(
        fig.shoulder,
        s.grip,
        body.upper_arm,
        body.forearm_to_grip(),
        -1.0,
    ) {
        Ok(e) => {
            n.insert(
                "elbow_angle_deg".into(),
                interior(e, fig.shoulder, s.grip).to_degrees(),
            );
        }
        Err(r) => {
            ok = false;
            out.warnings
                .push(reach_warning("standing, the grips are", r));
        }
    }
    let names = ["knee_angle_front_deg", "knee_angle_rear_deg"];
    for (name, foot) in names.iter().zip(fig.feet.iter()) {
        match two_link(fig.hip, foot.ankle, body.thigh, body.shank, 1.0) {
            Ok(k) => {
                let a = interior(k, fig.hip, foot.ankle);
                out.numbers.insert((*name).into(), a.to_degrees());
                out.numbers
                    .entry("knee_bend_max_deg".into())
                    .and_modify(|v| *v = v.max((PI - a).to_degrees()))
                    .or_insert((PI - a).to_degrees());
            }
            Err(r) => {
                ok = false;
                out.warnings.push(reach_warning("standing, a pedal is", r));
            }
        }
    }
    if ok {
        out.com = Some(fig.centre_of_mass(body));
        out.figure = Some(fig);
    }
    out
}

fn reach_warning(what: &str, r: Reach) -> Warning {
    Warning::new(
        "unreachable",
        format!("{}; the standing figure is left out.", describe(what, r)),
    )
}
