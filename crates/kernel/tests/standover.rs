//! Standover is not derivable from the frame's points (DESIGN.md §5): the report gives it as
//! published, with nothing that checks it, and never as a solved or ridden number.

// Test helpers may unwrap and index, like the tests themselves (see clippy.toml).
#![allow(clippy::unwrap_used, clippy::indexing_slicing)]

use framewise_kernel::{evaluate, Scenario};
use serde_json::json;

#[test]
fn standover_is_reported_as_published_not_as_solved() {
    // An invented frame (the page's demo numbers) with a published standover of 780 mm.
    let s: Scenario = serde_json::from_value(json!({ "bikes": [{ "label": "a",
        "frame": { "reach_mm": 470, "stack_mm": 635, "head_angle_deg": 65.0, "head_tube_mm": 110,
                   "headset_lower_mm": 12, "fork_a2c_mm": 561, "fork_offset_mm": 44,
                   "chainstay_mm": 435, "seat_angle_actual_deg": 76.5, "seat_tube_mm": 430,
                   "standover_mm": 780 },
        "wheels": { "front": "29x2.4", "rear": "29x2.4" } }] }))
    .unwrap();
    let r = evaluate(&s);
    assert!(r.errors.is_empty(), "{:?}", r.errors);
    let b = &r.bikes[0];
    let so = b.residuals["standover_mm"];
    assert_eq!(
        (so.given, so.residual, so.consistent, so.from_others),
        (780.0, 0.0, true, None)
    );
    assert!(!b.stock.contains_key("standover_mm"));
    assert!(!b.ridden.contains_key("standover_mm"));
}
