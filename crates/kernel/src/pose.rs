//! Changes from stock and the re-pose that puts both tyres back on the ground (DESIGN.md §8a).

use crate::error::{fmt_num, Warning};
use crate::geometry::{steer_down, steer_normal, FrameParams, Geometry, Radii};
use nalgebra::{Point2, Rotation2};

/// The changes, resolved to numbers (all zero / stock when nothing changes).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct ChangeSet {
    /// Tyre radii of the ridden wheels, mm.
    pub radii: Radii,
    /// Fork axle-to-crown change, mm.
    pub a2c_delta: f64,
    /// Fork offset in use, mm.
    pub offset: f64,
    /// Angle cups, radians (negative = slacker).
    pub cup_angle: f64,
    /// Front axle travel towards the crown from sag, mm.
    pub front_sag: f64,
    /// Rear axle rise from sag in frame y, mm.
    pub rear_sag: f64,
    /// Main pivot in frame axes, if given.
    pub pivot: Option<Point2<f64>>,
}

impl ChangeSet {
    /// No change from the stock frame.
    pub fn stock(params: &FrameParams, radii: Radii) -> Self {
        ChangeSet {
            radii,
            a2c_delta: 0.0,
            offset: params.offset,
            cup_angle: 0.0,
            front_sag: 0.0,
            rear_sag: 0.0,
            pivot: None,
        }
    }
}

/// A posed bike: the changed frame rotated so both tyres touch the ground.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Posed {
    /// The frame in ridden axes: BB at the origin, ground at `geometry.ground_y()`.
    pub geometry: Geometry,
    /// The re-pose rotation, radians (θ > 0 lifts the front).
    pub theta: f64,
}

/// Applies `changes` to the stock frame (in frame axes), then re-poses.
///
/// Cups rotate the steering axis about the head tube midpoint `M = T + d·ht/2`; the cockpit starts
/// at `T′ = M − d′·ht/2`. The fork hangs from the frame's own head tube bottom, continued along
/// the new axis: `C′ = T′ + d′·(ht + lower)`, `F′ = C′ + d′·a2c′ + n′·offset′`. Front sag moves
/// `F′` towards the crown along `d′`; rear sag raises the rear axle in frame y, on the arc about
/// the pivot when one is given (the smaller rotation), else straight up.
///
/// Re-pose: θ solves `(F−R)ₓ sin θ + (F−R)ᵧ cos θ = r_front − r_rear`, i.e.
/// `θ = asin(Δr / |F−R|) − atan2((F−R)ᵧ, (F−R)ₓ)`, the root nearest zero.
///
/// Returns warnings for a sag arc that cannot reach the requested rise (then straight up is used).
pub fn pose(
    params: &FrameParams,
    stock_radii: Radii,
    changes: &ChangeSet,
) -> (Posed, Vec<Warning>) {
    let mut warnings = Vec::new();
    let mut g = params.geometry(stock_radii);
    let ht = params.head_tube;
    let mid = g.head_top + g.steer_down * (ht / 2.0);
    let h2 = params.head_angle + changes.cup_angle;
    let d2 = steer_down(h2);
    let n2 = steer_normal(h2);
    let top2 = mid - d2 * (ht / 2.0);
    let crown2 = top2 + d2 * (ht + params.headset_lower);
    let a2c2 = params.a2c + changes.a2c_delta;
    let mut front = crown2 + d2 * a2c2 + n2 * changes.offset;
    front -= d2 * changes.front_sag;
    let rear = rear_after_sag(g.rear_axle, changes.rear_sag, changes.pivot, &mut warnings);
    g.head_top = top2;
    g.crown = crown2;
    g.steer_down = d2;
    g.front_axle = front;
    g.rear_axle = rear;
    g.radii = changes.radii;
    g.lengths.a2c = a2c2;
    g.lengths.offset = changes.offset;
    let v = front - rear;
    let len = v.norm();
    let dr = changes.radii.front - changes.radii.rear;
    let ratio = if len > 0.0 {
        (dr / len).clamp(-1.0, 1.0)
    } else {
        0.0
    };
    let theta = ratio.asin() - v.y.atan2(v.x);
    (
        Posed {
            geometry: g.rotated(theta),
            theta,
        },
        warnings,
    )
}

fn rear_after_sag(
    rear: Point2<f64>,
    rise: f64,
    pivot: Option<Point2<f64>>,
    warnings: &mut Vec<Warning>,
) -> Point2<f64> {
    if rise == 0.0 {
        return rear;
    }
    let straight = Point2::new(rear.x, rear.y + rise);
    let Some(p) = pivot else { return straight };
    let arm = rear - p;
    let radius = arm.norm();
    let target_dy = rear.y + rise - p.y;
    if radius <= 0.0 || target_dy.abs() > radius {
        warnings.push(Warning::new(
            "sag_arc_unreachable",
            format!(
                "The rear axle cannot rise {} mm on an arc about the pivot {} mm away; it was moved straight up instead.",
                fmt_num(rise),
                fmt_num(radius)
            ),
        ));
        return straight;
    }
    // Two points on the circle at that height; take the one reached by the smaller rotation.
    let dx = (radius * radius - target_dy * target_dy).sqrt();
    let cands = [
        Point2::new(p.x + dx, p.y + target_dy),
        Point2::new(p.x - dx, p.y + target_dy),
    ];
    let angle = |q: &Point2<f64>| Rotation2::rotation_between(&arm, &(q - p)).angle().abs();
    if angle(&cands[0]) <= angle(&cands[1]) {
        cands[0]
    } else {
        cands[1]
    }
}
