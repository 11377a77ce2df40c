//! Postures: the rider's body placed on the bike, seated and standing (DESIGN.md §6.6).
//!
//! All points are in the ridden axes (BB at the origin, x forward, y up, mm). Each limb is a
//! two-link chain solved in closed form ([`two_link`]); a position the body cannot reach is a
//! [`Reach`] error that the caller turns into a warning with the reason, never a number.

use crate::report::{Leg, RiderFigure};
use crate::rider::{segment, Body, SegmentTable, ANKLE_FROM_HEEL, BALL_FROM_HEEL};
use nalgebra::{Point2, Vector2};

/// Why a two-link chain cannot reach.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum Reach {
    /// The end is this many mm beyond the chain's full length.
    TooFar(f64),
    /// The end is this many mm closer than the chain can fold.
    TooClose(f64),
}

/// Closed-form two-link solution: the middle joint `J` with `|J − p| = a`, `|J − q| = b`.
/// `side = +1.0` puts `J` to the left of the direction `p → q` (counter-clockwise), `−1.0` to the
/// right. With `D = |q − p|`: along `p → q` by `x = (a² − b² + D²) / 2D`, across by
/// `√(a² − x²)`.
///
/// # Errors
/// [`Reach::TooFar`] when `D > a + b`, [`Reach::TooClose`] when `D < |a − b|`.
pub fn two_link(
    p: Point2<f64>,
    q: Point2<f64>,
    a: f64,
    b: f64,
    side: f64,
) -> Result<Point2<f64>, Reach> {
    let v = q - p;
    let dist = v.norm();
    if dist > a + b {
        return Err(Reach::TooFar(dist - (a + b)));
    }
    if dist < (a - b).abs() || dist <= f64::EPSILON {
        return Err(Reach::TooClose((a - b).abs() - dist));
    }
    let along = (a * a - b * b + dist * dist) / (2.0 * dist);
    let across = (a * a - along * along).max(0.0).sqrt();
    let u = v / dist;
    let left = Vector2::new(-u.y, u.x);
    Ok(p + u * along + left * (across * side))
}

/// Interior angle at `vertex` between the rays to `a` and `b`, radians in `[0, π]`.
pub fn interior(vertex: Point2<f64>, a: Point2<f64>, b: Point2<f64>) -> f64 {
    let (u, v) = (a - vertex, b - vertex);
    u.perp(&v).abs().atan2(u.dot(&v))
}

/// A foot on a pedal: heel, ankle, ball and toe.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Foot {
    /// Heel (sole level).
    pub heel: Point2<f64>,
    /// Ankle joint.
    pub ankle: Point2<f64>,
    /// Ball of the foot.
    pub ball: Point2<f64>,
    /// Toe tip (sole level).
    pub toe: Point2<f64>,
}

/// The foot on a pedal spindle with the sole tilted toe-down by `toe_down` radians: the ball is
/// `foot_position` ahead of the spindle along the sole and `shoe_stack` above it across the
/// sole; heel and toe on the sole line, the ankle `ankle_height` above the sole.
pub fn foot_on_pedal(body: &Body, pedal: Point2<f64>, toe_down: f64) -> Foot {
    let sole = Vector2::new(toe_down.cos(), -toe_down.sin());
    let up = Vector2::new(-sole.y, sole.x);
    let ball = pedal + sole * body.foot_position + up * body.shoe_stack;
    let heel = ball - sole * (BALL_FROM_HEEL * body.foot);
    Foot {
        heel,
        ankle: heel + sole * (ANKLE_FROM_HEEL * body.foot) + up * body.ankle_height,
        ball,
        toe: heel + sole * body.foot,
    }
}

/// Every joint of a posed body.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Figure {
    /// Hip joint.
    pub hip: Point2<f64>,
    /// Shoulder joint.
    pub shoulder: Point2<f64>,
    /// Elbow.
    pub elbow: Point2<f64>,
    /// Grip centre (hand).
    pub grip: Point2<f64>,
    /// Knees, near then far.
    pub knees: [Point2<f64>; 2],
    /// Feet, near then far.
    pub feet: [Foot; 2],
}

fn lerp(a: Point2<f64>, b: Point2<f64>, t: f64) -> Point2<f64> {
    a + (b - a) * t
}

fn table(name: &str) -> SegmentTable {
    segment(name).unwrap_or(SegmentTable {
        name: "",
        mass: 0.0,
        com: 0.0,
        count: 0,
    })
}

impl Figure {
    /// Head centre and radius: the head-neck runs from the shoulder along the bisector of the
    /// trunk direction and the vertical (a stated drawing model); radius a third of its length.
    pub fn head(&self, body: &Body) -> (Point2<f64>, f64) {
        let trunk = (self.shoulder - self.hip)
            .try_normalize(1e-12)
            .unwrap_or(Vector2::y());
        let dir = (trunk + Vector2::y())
            .try_normalize(1e-12)
            .unwrap_or(Vector2::y());
        let r = body.head_neck / 3.0;
        (self.shoulder + dir * (body.head_neck - r), r)
    }

    /// The body's centre of mass: each segment's mass fraction at its centre-of-mass point
    /// (Dempster via Winter Table 4.1), both arms on the same side-view line.
    pub fn centre_of_mass(&self, body: &Body) -> Point2<f64> {
        let to_grip = (self.grip - self.elbow)
            .try_normalize(1e-12)
            .unwrap_or(Vector2::x());
        let wrist = self.elbow + to_grip * body.forearm;
        let (head, _) = self.head(body);
        let mut sum = Vector2::zeros();
        let mut add = |name: &str, a: Point2<f64>, b: Point2<f64>, times: f64| {
            let t = table(name);
            sum += lerp(a, b, t.com).coords * (t.mass * times);
        };
        add("upper_arm", self.shoulder, self.elbow, 2.0);
        add("forearm", self.elbow, wrist, 2.0);
        add("hand", wrist, wrist + to_grip * body.hand, 2.0);
        add("trunk", self.hip, self.shoulder, 1.0);
        add("head_neck", self.shoulder, head, 1.0);
        for (knee, foot) in self.knees.iter().zip(self.feet.iter()) {
            add("thigh", self.hip, *knee, 1.0);
            add("shank", *knee, foot.ankle, 1.0);
            add("foot", foot.ankle, foot.ball, 1.0);
        }
        Point2::from(sum)
    }

    /// The figure for the report (drawing points).
    pub fn to_report(&self, body: &Body) -> RiderFigure {
        let xy = |p: Point2<f64>| [p.x, p.y];
        let leg = |k: Point2<f64>, f: &Foot| Leg {
            knee: xy(k),
            ankle: xy(f.ankle),
            ball: xy(f.ball),
            heel: xy(f.heel),
            toe: xy(f.toe),
        };
        let (head, head_radius) = self.head(body);
        let [k0, k1] = self.knees;
        let [f0, f1] = &self.feet;
        RiderFigure {
            head: xy(head),
            head_radius,
            shoulder: xy(self.shoulder),
            elbow: xy(self.elbow),
            hand: xy(self.grip),
            hip: xy(self.hip),
            legs: [leg(k0, f0), leg(k1, f1)],
        }
    }
}

/// A reason a posture is out of reach, in words, e.g. "grips 42 mm beyond arm reach".
pub fn describe(what: &str, r: Reach) -> String {
    match r {
        // Whole millimetres up: a gap under 1 mm is still a gap ("1 mm", never "0 mm").
        Reach::TooFar(mm) => format!("{what} {:.0} mm beyond reach", mm.ceil()),
        Reach::TooClose(mm) => {
            format!(
                "{what} {:.0} mm too close: the limb would have to fold further than it can",
                mm.ceil()
            )
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn knee_goes_forward_of_a_vertical_leg() {
        let k = two_link(
            Point2::new(0.0, 800.0),
            Point2::new(0.0, 0.0),
            430.0,
            430.0,
            1.0,
        )
        .unwrap();
        assert!(k.x > 0.0);
        assert!((k.y - 400.0).abs() < 1e-9);
    }

    #[test]
    fn unreachable_is_an_error_with_the_gap() {
        let r = two_link(Point2::origin(), Point2::new(900.0, 0.0), 430.0, 430.0, 1.0);
        assert_eq!(r, Err(Reach::TooFar(40.0)));
    }
}
