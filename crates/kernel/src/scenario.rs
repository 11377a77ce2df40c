//! The scenario: everything a person enters (DESIGN.md §8). Plain data with serde derives; the
//! kernel never reads or writes JSON text itself (that is `framewise-formats`).
//!
//! Every number is optional where a sensible default exists; validation happens in
//! [`crate::evaluate`], which reports every bad field at once.

use crate::wheel::WheelSpec;
use serde::{Deserialize, Serialize};
use std::collections::BTreeMap;

/// The scenario format version this kernel reads and writes.
pub const SCENARIO_VERSION: u32 = 1;

fn version_one() -> u32 {
    SCENARIO_VERSION
}

/// The whole state: rider, bikes, view choices.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct Scenario {
    /// Format version; 1.
    #[serde(default = "version_one")]
    pub version: u32,
    /// The rider, if any.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub rider: Option<RiderInput>,
    /// One or more bikes.
    #[serde(default)]
    pub bikes: Vec<BikeInput>,
    /// View choices of the page.
    #[serde(default)]
    pub view: View,
}

/// A published value: a plain number, or a number with its own rounding.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
#[serde(untagged)]
pub enum Published {
    /// A number with the catalogue's default rounding (1 mm, 0.1°).
    Value(f64),
    /// A number with its own rounding, e.g. an angle published to 0.5°.
    WithTolerance {
        /// The published number.
        value: f64,
        /// Its rounding: half the step it was published to is *not* implied; give the step.
        tolerance: f64,
    },
}

impl Published {
    /// The number.
    pub fn value(&self) -> f64 {
        match *self {
            Published::Value(v) | Published::WithTolerance { value: v, .. } => v,
        }
    }
    /// The stated rounding, if any.
    pub fn tolerance(&self) -> Option<f64> {
        match *self {
            Published::Value(_) => None,
            Published::WithTolerance { tolerance, .. } => Some(tolerance),
        }
    }
}

/// The rider's body (issue 4 extends the optional measurements).
#[derive(Debug, Clone, PartialEq, Default, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct RiderInput {
    /// Standing height, mm.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub height_mm: Option<f64>,
    /// Body mass, kg.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub mass_kg: Option<f64>,
    /// Inseam (floor to crotch, barefoot), mm.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub inseam_mm: Option<f64>,
    /// Arm length, shoulder joint to the grip centre of a closed fist, mm.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub arm_mm: Option<f64>,
    /// Torso length, greater trochanter (hip joint) to shoulder joint, mm.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub torso_mm: Option<f64>,
    /// Sole thickness plus pedal/cleat stack: pedal spindle to the ball of the foot, mm.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub shoe_stack_mm: Option<f64>,
    /// Ball of the foot ahead of the pedal spindle, mm (negative = behind).
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub foot_position_mm: Option<f64>,
    /// Seated: elbow bend assumed, degrees from straight.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub elbow_bend_deg: Option<f64>,
    /// Standing: knee bend, degrees from straight.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub standing_knee_bend_deg: Option<f64>,
    /// Standing: trunk angle above horizontal, degrees (default 40).
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub standing_torso_deg: Option<f64>,
    /// Braking deceleration for the front-load check, in g.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub braking_g: Option<f64>,
    /// Slope for the braking-on-a-slope check, degrees (positive = uphill, negative = downhill).
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub slope_deg: Option<f64>,
}

/// Front and rear wheel sizes.
#[derive(Debug, Clone, PartialEq, Default, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct WheelsInput {
    /// Front wheel.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub front: Option<WheelSpec>,
    /// Rear wheel.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub rear: Option<WheelSpec>,
}

/// One bike: its published frame numbers, wheels, setup and the changes made to it.
#[derive(Debug, Clone, PartialEq, Default, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct BikeInput {
    /// A short name shown on the page, plain text.
    #[serde(default)]
    pub label: String,
    /// Published frame numbers keyed as in the catalogue (DESIGN.md §5).
    #[serde(default)]
    pub frame: BTreeMap<String, Published>,
    /// Height above the BB at which the published effective seat angle was read; default stack.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub seat_angle_ref_mm: Option<f64>,
    /// Stock wheels.
    #[serde(default)]
    pub wheels: WheelsInput,
    /// Cockpit, saddle and crank setup.
    #[serde(default)]
    pub setup: Setup,
    /// Changes from stock: fork, cups, wheels, sag.
    #[serde(default)]
    pub changes: Changes,
    /// A point load that replaces the rider for handling checks.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub load: Option<Load>,
}

/// Cockpit, saddle and cranks (DESIGN.md §6.4–6.5).
#[derive(Debug, Clone, PartialEq, Default, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct Setup {
    /// Upper headset stack above the head tube top, mm.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub headset_upper_mm: Option<f64>,
    /// Spacers under the stem, mm.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub spacers_mm: Option<f64>,
    /// Stem clamp height on the steerer, mm.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub stem_stack_mm: Option<f64>,
    /// Stem length, mm.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub stem_mm: Option<f64>,
    /// Stem angle to the steerer's normal, degrees (positive = up).
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub stem_angle_deg: Option<f64>,
    /// Bar rise, mm.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub bar_rise_mm: Option<f64>,
    /// Bar pullback (grip centre behind the clamp), mm.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub bar_pullback_mm: Option<f64>,
    /// `"flat"` (flat or riser bar, the default) or `"drop"`.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub bar_type: Option<String>,
    /// Flat bar backsweep, degrees.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub bar_backsweep_deg: Option<f64>,
    /// Flat bar upsweep, degrees.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub bar_upsweep_deg: Option<f64>,
    /// Bar width, end to end, mm.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub bar_width_mm: Option<f64>,
    /// Bar roll about the clamp, degrees (positive = rolled back/up).
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub bar_roll_deg: Option<f64>,
    /// Drop bar reach: clamp centre to the furthest forward point of the bend, mm.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub bar_reach_mm: Option<f64>,
    /// Drop bar drop: clamp centre down to the centre of the drops, mm.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub bar_drop_mm: Option<f64>,
    /// Drop bar: clamp centre forward to where the hand holds the hoods, mm.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub hood_reach_mm: Option<f64>,
    /// Drop bar: hood hand point below the clamp centre, mm (negative = above).
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub hood_drop_mm: Option<f64>,
    /// Drop bar hand position used for the fit: `"hoods"` (default), `"drops"` or `"tops"`.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub hand_position: Option<String>,
    /// The fork maker's maximum spacer stack under the stem, mm (default 40).
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub spacer_limit_mm: Option<f64>,
    /// Saddle setback: saddle reference point behind the seat axis, mm.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub saddle_setback_mm: Option<f64>,
    /// Seatpost head offset (setback) of the clamp behind the post axis, mm.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub post_offset_mm: Option<f64>,
    /// Height of the saddle top above the seatpost's clamp, mm.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub saddle_stack_mm: Option<f64>,
    /// Frame: deepest a seatpost can go below the top of the seat tube, mm.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub max_insertion_mm: Option<f64>,
    /// Seatpost total length, mm.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub post_length_mm: Option<f64>,
    /// Seatpost minimum insertion (mark), mm.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub post_min_insertion_mm: Option<f64>,
    /// Dropper post travel, mm (0 or absent = rigid post).
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub dropper_travel_mm: Option<f64>,
    /// Bike mass, kg.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub bike_mass_kg: Option<f64>,
    /// Bike centre of mass ahead of the BB, mm (ridden axes).
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub bike_com_x_mm: Option<f64>,
    /// Bike centre of mass above the BB, mm (ridden axes).
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub bike_com_y_mm: Option<f64>,
    /// Crank length, mm.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub crank_mm: Option<f64>,
    /// Saddle height, BB centre to saddle top along the seat axis, mm.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub saddle_height_mm: Option<f64>,
    /// Lateral distance from the bike's centre plane to the outer end of the pedal, mm
    /// (default 180), for the pedal-strike lean angle.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub pedal_outer_mm: Option<f64>,
    /// Cockpit search: target grip centre ahead of the BB, ridden axes, mm (with
    /// `target_grip_y_mm`). The report then lists the closest catalogue parts.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub target_grip_x_mm: Option<f64>,
    /// Cockpit search: target grip centre above the BB, ridden axes, mm.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub target_grip_y_mm: Option<f64>,
    /// Cockpit search: take the target grip point from another bike of the scenario (its
    /// index in `bikes`, from 0). Used when no target point is given.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub target_grip_bike: Option<u32>,
}

/// Changes from stock (DESIGN.md §6.3, §8a).
#[derive(Debug, Clone, PartialEq, Default, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct Changes {
    /// Fork axle-to-crown change, mm (positive = longer).
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub fork_a2c_delta_mm: Option<f64>,
    /// New fork offset, mm (replaces the stock offset).
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub fork_offset_mm: Option<f64>,
    /// Angle-adjusting headset cups, degrees (negative = slacker).
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub headset_angle_deg: Option<f64>,
    /// Replacement wheels for the ridden pose.
    #[serde(default)]
    pub wheels: WheelsInput,
    /// Fork travel, mm.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub fork_travel_mm: Option<f64>,
    /// Front sag, percent of fork travel.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub front_sag_pct: Option<f64>,
    /// Rear wheel travel, mm.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub rear_travel_mm: Option<f64>,
    /// Rear sag, percent of rear wheel travel.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub rear_sag_pct: Option<f64>,
    /// Main pivot, x from the BB in frame axes, mm.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub pivot_x_mm: Option<f64>,
    /// Main pivot, y from the BB in frame axes, mm.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub pivot_y_mm: Option<f64>,
}

/// A point load (total centre of mass) relative to the BB in the ridden pose.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct Load {
    /// Forward of the BB, mm.
    pub x_mm: f64,
    /// Above the BB, mm.
    pub y_mm: f64,
    /// Total mass, kg.
    pub mass_kg: f64,
}

/// View choices of the page, carried in links.
#[derive(Debug, Clone, PartialEq, Default, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct View {
    /// Where several bikes are aligned: `"bb"`, `"rear_axle"`, `"front_axle"`, `"grip"`.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub align: Option<String>,
    /// Display units: `"mm"` or `"in"`.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub units: Option<String>,
    /// Rider posture drawn: `"seated"` or `"standing"`.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub posture: Option<String>,
    /// Dimension labels shown.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub dimensions: Option<bool>,
    /// The stock frame drawn as a ghost behind the ridden one.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub ghost: Option<bool>,
    /// Index of the bike shown first / selected.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub selected: Option<u32>,
}
