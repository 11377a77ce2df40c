//! `evaluate` stays total with a rider: any values inside the allowed ranges give a report whose
//! every number is finite, or typed errors.

// Test helpers may unwrap, index and panic, like the tests themselves (see clippy.toml).
#![allow(
    clippy::unwrap_used,
    clippy::expect_used,
    clippy::panic,
    clippy::indexing_slicing
)]

use framewise_kernel::{evaluate, Scenario};
use proptest::prelude::*;
use serde_json::json;

fn all_numbers_finite(v: &serde_json::Value) -> bool {
    match v {
        serde_json::Value::Number(n) => n.as_f64().is_some_and(f64::is_finite),
        serde_json::Value::Array(a) => a.iter().all(all_numbers_finite),
        serde_json::Value::Object(o) => o.values().all(all_numbers_finite),
        // serde_json writes a NaN or infinity as null; a report has no other nulls.
        serde_json::Value::Null => false,
        _ => true,
    }
}

proptest! {
    #![proptest_config(ProptestConfig::with_cases(64))]
    #[test]
    fn any_rider_and_setup_in_range_gives_finite_numbers(
        height in 900.0..2300.0f64,
        mass in 20.0..250.0f64,
        inseam in 400.0..1200.0f64,
        arm in 400.0..1000.0f64,
        torso in 300.0..900.0f64,
        elbow in 0.0..120.0f64,
        knee in 0.0..120.0f64,
        slope in -45.0..45.0f64,
        stem in 0.0..200.0f64,
        stem_angle in -45.0..45.0f64,
        spacers in 0.0..100.0f64,
        saddle in 300.0..1200.0f64,
        crank in 80.0..220.0f64,
        drop_bar in any::<bool>(),
    ) {
        let s: Scenario = serde_json::from_value(json!({
            "rider": { "height_mm": height, "mass_kg": mass, "inseam_mm": inseam, "arm_mm": arm,
                       "torso_mm": torso, "elbow_bend_deg": elbow, "standing_knee_bend_deg": knee,
                       "slope_deg": slope },
            "bikes": [{ "frame": { "reach_mm": 470, "stack_mm": 635, "head_angle_deg": 65.0,
                        "head_tube_mm": 110, "headset_lower_mm": 12, "fork_a2c_mm": 561,
                        "fork_offset_mm": 44, "chainstay_mm": 435, "seat_angle_actual_deg": 76.5,
                        "seat_tube_mm": 430 },
                        "wheels": { "front": "29x2.4", "rear": "29x2.4" },
                        "setup": { "stem_mm": stem, "stem_angle_deg": stem_angle,
                                   "spacers_mm": spacers, "saddle_height_mm": saddle,
                                   "crank_mm": crank,
                                   "bar_type": if drop_bar { "drop" } else { "flat" },
                                   "target_grip_x_mm": 450, "target_grip_y_mm": 700 } }] })).unwrap();
        let r = evaluate(&s);
        let v = serde_json::to_value(&r).unwrap();
        prop_assert!(all_numbers_finite(&v));
        prop_assert!(r.errors.is_empty() || r.errors.iter().all(|e| e.code == "degenerate"), "{:?}", r.errors);
        prop_assert_eq!(r.bikes.len() + r.errors.len(), 1);
    }
}
