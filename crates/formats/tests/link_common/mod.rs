//! Shared pieces of the link tests: invented scenarios and the field lists of the scenario types.
#![allow(
    dead_code,
    clippy::expect_used,
    clippy::panic,
    clippy::indexing_slicing
)]

use framewise_kernel::Scenario;
use serde_json::{json, Value};

/// The field names of a `deny_unknown_fields` type, read from serde's "expected one of" message,
/// so a field added to the type later shows up here without editing the tests.
pub fn field_names<T: serde::de::DeserializeOwned>() -> Vec<String> {
    let err = match serde_json::from_str::<T>(r#"{"zz_probe_zz": 0}"#) {
        Err(e) => e.to_string(),
        Ok(_) => panic!("the probe field was accepted"),
    };
    let expected = err.split("expected").nth(1).expect("an 'expected' list");
    expected
        .split('`')
        .skip(1)
        .step_by(2)
        .map(str::to_string)
        .collect()
}

pub fn scenario(v: Value) -> Scenario {
    serde_json::from_value(v).expect("a valid scenario")
}

/// An invented trail bike with its setup (numbers of the kind a listing publishes).
pub fn trail_bike(label: &str, reach: f64) -> Value {
    json!({
        "label": label,
        "frame": { "reach_mm": reach, "stack_mm": 625, "head_angle_deg": 64.5,
                   "head_tube_mm": 110, "headset_lower_mm": 12, "fork_a2c_mm": 561,
                   "fork_offset_mm": 44, "chainstay_mm": 435, "seat_angle_effective_deg": 77,
                   "bb_drop_mm": 30 },
        "wheels": { "front": "29x2.4", "rear": "29x2.4" },
        "setup": { "headset_upper_mm": 8, "spacers_mm": 10, "stem_stack_mm": 40, "stem_mm": 45,
                   "stem_angle_deg": 0, "bar_rise_mm": 25, "bar_pullback_mm": 30,
                   "crank_mm": 170, "saddle_height_mm": 735 }
    })
}

/// An invented rider.
pub fn rider() -> Value {
    json!({ "height_mm": 1780, "mass_kg": 74, "inseam_mm": 840 })
}

/// One bike with its setup and a rider.
pub fn one_bike() -> Scenario {
    scenario(json!({ "version": 1, "rider": rider(),
                     "bikes": [trail_bike("Demo trail bike, size 3", 470.0)] }))
}

/// Four bikes and a rider: a size run compared, one of them a drop-bar bike with changes.
pub fn four_bikes() -> Scenario {
    let gravel = json!({
        "label": "Gravel 56",
        "frame": { "reach_mm": 392, "stack_mm": 585, "head_angle_deg": 71.5, "head_tube_mm": 150,
                   "fork_a2c_mm": 400, "fork_offset_mm": 50, "chainstay_mm": 430,
                   "seat_angle_effective_deg": 73.5, "bb_drop_mm": 72 },
        "wheels": { "front": "700x40c", "rear": "700x40c" },
        "setup": { "spacers_mm": 20, "stem_mm": 90, "stem_angle_deg": -6, "bar_type": "drop",
                   "bar_reach_mm": 75, "bar_drop_mm": 120, "hood_reach_mm": 110, "hood_drop_mm": 20,
                   "bar_width_mm": 440, "crank_mm": 172.5, "saddle_height_mm": 745 },
        "changes": { "wheels": { "front": "650bx47", "rear": "650bx47" } }
    });
    scenario(json!({
        "version": 1,
        "rider": rider(),
        "bikes": [trail_bike("Trail S", 445.0), trail_bike("Trail M", 470.0),
                  trail_bike("Trail L", 495.0), gravel],
        "view": { "align": "bb", "units": "mm" }
    }))
}
