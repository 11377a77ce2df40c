//! Handling: statics of rider + bike, toe clearance and pedal strike (DESIGN.md §6.7, §8a).
//!
//! Moment balance about the tyre contacts (any statics text, e.g. Meriam & Kraige,
//! *Engineering Mechanics: Statics*; braking on a slope from Riel, "Maximal Braking on a
//! Standard Bicycle", 2005). With the centre of mass at `(x, y)` relative to the BB in the
//! ridden axes, contacts under the axles at `R.x` and `F.x`, wheelbase `WB = F.x − R.x` and
//! height `h = y + bb_height`:
//!
//! - front load share `100·(x − R.x)/WB`; braking at `a` g adds `a·h/WB` of the weight;
//! - braking limit (rear wheel lifts) `(F.x − x)/h` g; on a slope α (α > 0 uphill)
//!   `(F.x − x)/h·cos α + sin α` g;
//! - steepest static descent `atan((F.x − x)/h)`, steepest static climb `atan((x − R.x)/h)`.

use crate::report::Numbers;
use crate::rider::{Body, BALL_FROM_HEEL};
use nalgebra::{Point2, Vector2};

/// Bike mass assumed when none is given, kg (a stated assumption for a typical adult bike).
pub const DEFAULT_BIKE_MASS_KG: f64 = 14.0;
/// Bike centre of mass above the BB when none is given, mm (a stated assumption).
pub const DEFAULT_BIKE_COM_Y_MM: f64 = 150.0;
/// Lateral distance from the bike's centre plane to the outer end of the pedal, default mm
/// [practice: half a common Q-factor plus a pedal body].
pub const DEFAULT_PEDAL_OUTER_MM: f64 = 180.0;
/// Pedal body below the spindle centre, mm [practice].
pub const PEDAL_BELOW_SPINDLE_MM: f64 = 10.0;

/// Where the bike stands: tyre contacts and ground, ridden axes.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Support {
    /// Rear contact x (under the rear axle), mm.
    pub rear_x: f64,
    /// Front contact x (under the front axle), mm.
    pub front_x: f64,
    /// Ground height relative to the BB (negative), mm.
    pub ground_y: f64,
}

/// The combined centre of mass of point masses `(kg, point)`; `None` when the total is not
/// positive.
pub fn combine(parts: &[(f64, Point2<f64>)]) -> Option<Point2<f64>> {
    let total: f64 = parts.iter().map(|(m, _)| m).sum();
    if total <= 0.0 {
        return None;
    }
    let sum = parts
        .iter()
        .fold(Vector2::zeros(), |acc, (m, p)| acc + p.coords * *m);
    Some(Point2::from(sum / total))
}

/// The statics numbers of one centre of mass (see the module docs); `None` when the centre of
/// mass is not above the ground or the wheelbase is not positive.
pub fn statics(
    com: Point2<f64>,
    s: &Support,
    mass_kg: f64,
    braking_g: f64,
    slope: f64,
) -> Option<Numbers> {
    let h = com.y - s.ground_y;
    let wb = s.front_x - s.rear_x;
    if h <= 0.0 || wb <= 0.0 {
        return None;
    }
    let (to_rear, to_front) = (com.x - s.rear_x, s.front_x - com.x);
    let mut n = Numbers::new();
    let mut put = |k: &'static str, v: f64| {
        n.insert(k.into(), v);
    };
    put("com_x_mm", com.x);
    put("com_y_mm", com.y);
    put("com_height_mm", h);
    put("total_mass_kg", mass_kg);
    put("front_load_pct", 100.0 * to_rear / wb);
    put("braking_g", braking_g);
    put(
        "front_load_braking_pct",
        100.0 * (to_rear + braking_g * h) / wb,
    );
    put("pitch_over_decel_g", to_front / h);
    put("front_tip_slope_deg", to_front.atan2(h).to_degrees());
    put("rear_tip_slope_deg", to_rear.atan2(h).to_degrees());
    put("slope_deg", slope.to_degrees());
    put(
        "pitch_over_decel_slope_g",
        to_front / h * slope.cos() + slope.sin(),
    );
    Some(n)
}

/// Toe clearance at straight ahead, mm: the smallest side-view gap between the toe tip and the
/// front tyre over a whole crank turn (negative = the toe overlaps the tyre and would touch it
/// when the wheel turns). The sole is level, so the toe tip traces a circle of radius `crank`
/// about `o`, the toe tip's offset from the spindle (`foot·(1 − BALL_FROM_HEEL) + foot_position`
/// ahead, `shoe_stack` up). Its nearest approach to the front axle `F` is `| |F − o| − crank |`,
/// so the clearance is `| |F − o| − crank | − R_front`.
pub fn toe_clearance(body: &Body, crank: f64, front_axle: Point2<f64>, front_radius: f64) -> f64 {
    let toe = Vector2::new(
        body.foot_position + body.foot * (1.0 - BALL_FROM_HEEL),
        body.shoe_stack,
    );
    ((front_axle - Point2::from(toe)).norm() - crank).abs() - front_radius
}

/// Lean angle at which the lower pedal touches the ground, radians: with the crank straight
/// down the pedal's outer lower edge is `p = bb_height − crank − PEDAL_BELOW_SPINDLE_MM` above
/// the ground and `w` out from the centre plane; leaning about the contact line by φ brings it
/// down to `p·cos φ − w·sin φ`, zero at `φ = atan(p / w)`. Compare with 16 CFR 1512.17(c) (25°).
pub fn pedal_strike_lean(bb_height: f64, crank: f64, pedal_outer: f64) -> f64 {
    (bb_height - crank - PEDAL_BELOW_SPINDLE_MM).atan2(pedal_outer)
}
