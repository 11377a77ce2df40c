//! The report: everything the kernel computes for a scenario (DESIGN.md §8).
//!
//! **Invariant:** every `f64` in a report is finite; [`crate::evaluate`] drops a bike's numbers
//! and reports an error rather than let a NaN or infinity through.

use crate::error::{FieldError, Warning};
use crate::fit::Check;
use crate::parts::PartsSearch;
use crate::solve::Residual;
use serde::Serialize;
use std::collections::BTreeMap;

/// The report format version.
pub const REPORT_VERSION: u32 = 1;

/// The whole report.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Report {
    /// Format version; 1.
    pub version: u32,
    /// One entry per bike that could be evaluated.
    pub bikes: Vec<BikeReport>,
    /// Every bad input, each naming its field.
    pub errors: Vec<FieldError>,
}

/// Named numbers, keyed with their unit suffix. Every key the kernel writes is a fixed name,
/// borrowed: a report of about 150 numbers allocates no key (the page evaluates one on every
/// edit, docs/BENCHMARKS.md).
pub type Numbers = BTreeMap<std::borrow::Cow<'static, str>, f64>;

/// Everything about one bike.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct BikeReport {
    /// The bike's label.
    pub label: String,
    /// Per published value: given, solved, residual, consistent.
    pub residuals: BTreeMap<String, Residual>,
    /// Measurements that would fix an unknown nothing determines.
    pub missing: Vec<String>,
    /// Every §5 number, solved, stock pose.
    pub stock: Numbers,
    /// The §5 numbers after changes and sag, plus cockpit numbers.
    pub ridden: Numbers,
    /// Per change, its effect on each ridden number (ridden with only that change − stock).
    pub effects: BTreeMap<String, Numbers>,
    /// Derived steering numbers (mechanical trail, wheel flop, ISO 4210-2 Annex A window).
    pub derived: Numbers,
    /// The rider's fit numbers, seated and standing (estimates; see [`crate::fit::CAUTION`]).
    pub fit: Fit,
    /// Centre of mass and statics, seated, standing and for a given point load.
    pub handling: Handling,
    /// Fit and safety checks with their sources, shown as information.
    pub checks: Vec<Check>,
    /// Closest catalogue cockpit parts for a target grip point, when one is asked for.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub cockpit_parts: Option<PartsSearch>,
    /// Assumptions, inconsistencies, cautions.
    pub warnings: Vec<Warning>,
    /// The keys of the residuals marked `suspect`, in the order the `inconsistent` warning names
    /// them ([`crate::solve::Solution::suspects`]), for words that name them too (the page's row
    /// notes). Not in the JSON: each residual says whether it is a suspect.
    #[serde(skip)]
    pub suspects: Vec<String>,
    /// Points for the drawing, in ridden axes (BB at the origin, y up, mm).
    pub outline: Outline,
    /// The stock frame's points, for the ghost behind the ridden one (stock axes, BB at origin).
    pub stock_outline: Outline,
}

/// The rider's fit numbers (keys with unit suffixes; empty when there is no rider).
#[derive(Debug, Clone, PartialEq, Default, Serialize)]
pub struct Fit {
    /// Seated: knee flexion at bottom dead centre, knee and hip angles at top dead centre,
    /// torso, shoulder and elbow angles, hip and shoulder points.
    pub seated: Numbers,
    /// Standing: elbow angle, hip point and height, room before the arms lock or fold.
    pub standing: Numbers,
}

/// Statics blocks (DESIGN.md §8: `com_x_mm`, `com_y_mm`, `com_height_mm`, `front_load_pct`,
/// `pitch_over_decel_g`, `front_tip_slope_deg`, `rear_tip_slope_deg`, and more).
#[derive(Debug, Clone, PartialEq, Default, Serialize)]
pub struct Handling {
    /// Rider seated + bike.
    pub seated: Numbers,
    /// Rider standing + bike.
    pub standing: Numbers,
    /// The given point load (replaces the rider).
    pub load: Numbers,
}

/// A point as `[x, y]` in millimetres.
pub type Xy = [f64; 2];

/// The points the drawing needs. Only the kernel computes them; the drawing only draws them.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct Outline {
    /// Ground height (negative: below the BB).
    pub ground_y: f64,
    /// Rear axle centre.
    pub rear_axle: Xy,
    /// Front axle centre.
    pub front_axle: Xy,
    /// Rear tyre outer radius.
    pub rear_radius: f64,
    /// Front tyre outer radius.
    pub front_radius: f64,
    /// Rim (bead seat) radius, rear; 0 when unknown.
    pub rear_rim_radius: f64,
    /// Rim (bead seat) radius, front; 0 when unknown.
    pub front_rim_radius: f64,
    /// Head tube top (frame's own).
    pub head_top: Xy,
    /// Head tube bottom.
    pub head_bottom: Xy,
    /// Crown race seat.
    pub crown: Xy,
    /// Top of the fork leg: the crown race seat moved forward by the fork offset, normal to the
    /// steering axis; the leg runs parallel to the axis from here to the front axle.
    pub fork_leg_top: Xy,
    /// Top of the seat tube.
    pub seat_top: Xy,
    /// Where the steering axis meets the ground.
    pub steer_ground: Xy,
    /// Rear tyre contact point on the ground.
    pub rear_contact: Xy,
    /// Front tyre contact point on the ground.
    pub front_contact: Xy,
    /// Cockpit points, when the setup gives a stem.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub cockpit: Option<CockpitOutline>,
    /// Saddle and seatpost points, when the setup gives a saddle height.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub seat: Option<SeatOutline>,
    /// Crank and pedal points (the near crank forward-horizontal, the far one rearward).
    #[serde(skip_serializing_if = "Option::is_none")]
    pub cranks: Option<CrankOutline>,
    /// The rider seated, when a rider is given and the position is reachable.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub rider_seated: Option<RiderFigure>,
    /// The rider standing, when a rider is given and the position is reachable.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub rider_standing: Option<RiderFigure>,
    /// Rider + bike centre of mass, seated.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub com_seated: Option<Xy>,
    /// Rider + bike centre of mass, standing.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub com_standing: Option<Xy>,
}

/// Steerer, spacers, stem and bar.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct CockpitOutline {
    /// Top of the upper headset stack (bottom of the spacers).
    pub headset_top: Xy,
    /// Top of the spacers (bottom of the stem clamp).
    pub spacers_top: Xy,
    /// Stem clamp centre on the steerer.
    pub stem_clamp: Xy,
    /// Top of the steerer / stem clamp.
    pub steerer_top: Xy,
    /// Bar clamp centre (stem end).
    pub bar_clamp: Xy,
    /// Grip centre (hand point used for the fit; hoods or drops on a drop bar).
    pub grip: Xy,
}

/// Seatpost and saddle.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct SeatOutline {
    /// Where the post leaves the frame (top of the seat tube).
    pub post_exit: Xy,
    /// Seatpost clamp (rails).
    pub post_top: Xy,
    /// Saddle reference point (top, at the rider's sit point).
    pub saddle: Xy,
    /// Saddle nose.
    pub saddle_nose: Xy,
    /// Saddle tail.
    pub saddle_tail: Xy,
}

/// Cranks and pedal spindles.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct CrankOutline {
    /// Near pedal spindle.
    pub pedal_near: Xy,
    /// Far pedal spindle.
    pub pedal_far: Xy,
}

/// A planar stick figure of the rider, kernel coordinates.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct RiderFigure {
    /// Head centre.
    pub head: Xy,
    /// Head radius, mm.
    pub head_radius: f64,
    /// Shoulder joint.
    pub shoulder: Xy,
    /// Elbow.
    pub elbow: Xy,
    /// Hand (on the grip).
    pub hand: Xy,
    /// Hip joint.
    pub hip: Xy,
    /// Near and far leg.
    pub legs: [Leg; 2],
}

/// One leg of the figure.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct Leg {
    /// Knee.
    pub knee: Xy,
    /// Ankle.
    pub ankle: Xy,
    /// Ball of the foot (over the pedal).
    pub ball: Xy,
    /// Heel.
    pub heel: Xy,
    /// Toe tip.
    pub toe: Xy,
}
