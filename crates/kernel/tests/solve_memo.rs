//! The solve memo changes only the time an evaluation takes: a series of edits evaluated with one
//! memo gives, edit by edit, exactly the report of a fresh evaluation.
//!
//! Source: the memo's invariant (crates/kernel/src/memo.rs); the expected reports are computed
//! here by `evaluate` without a memo.

#![allow(clippy::unwrap_used, clippy::indexing_slicing, clippy::panic)]

use framewise_kernel::{evaluate, evaluate_with, Scenario, SolveMemo};
use proptest::prelude::*;
use serde_json::{json, Value};

/// The project's invented demo scenario (tests/scenarios/demo.json), with no changes.
fn base() -> Value {
    let mut v: Value =
        serde_json::from_str(include_str!("../../../tests/scenarios/demo.json")).unwrap();
    v["bikes"][0]["changes"] = json!({});
    v
}

/// Sets the member at a JSON pointer, making it when missing.
fn set(v: &mut Value, path: &str, value: Value) {
    let mut at = v;
    for part in path.trim_start_matches('/').split('/') {
        at = match part.parse::<usize>() {
            Ok(i) => &mut at[i],
            Err(_) => &mut at[part],
        };
    }
    *at = value;
}

fn scenario(v: &Value) -> Scenario {
    serde_json::from_value(v.clone()).unwrap()
}

/// One edit of the series: a JSON pointer and the value it takes.
fn edits() -> Vec<(&'static str, Value)> {
    vec![
        ("/bikes/0/frame/reach_mm", json!(475)),
        ("/rider/height_mm", json!(1850)),
        ("/bikes/0/changes/fork_a2c_delta_mm", json!(20)),
        ("/bikes/0/setup/stem_mm", json!(60)),
        ("/bikes/0/frame/reach_mm", json!(470)),
        ("/bikes/0/wheels/front", json!("27.5x2.5")),
        ("/bikes/0/frame/head_angle_deg", json!(64.0)),
        ("/bikes/0/frame/head_angle_deg", json!(95.0)),
        ("/bikes/0/frame/head_angle_deg", json!(65.0)),
        ("/bikes/0/frame/wheelbase_mm", json!(1300)),
        (
            "/bikes/0/frame/reach_mm",
            json!({ "value": 470, "tolerance": 2 }),
        ),
        ("/bikes/0/wheels/front", json!("29x2.4")),
        ("/rider/height_mm", json!(1780)),
    ]
}

#[test]
fn a_series_of_edits_gives_the_reports_of_fresh_evaluations() {
    let mut memo = SolveMemo::default();
    let mut v = base();
    let first = evaluate_with(&scenario(&v), &mut memo);
    assert_eq!(first, evaluate(&scenario(&v)));
    assert_eq!(memo.len(), 1);
    for (path, value) in edits() {
        set(&mut v, path, value);
        let s = scenario(&v);
        let fresh = evaluate(&s);
        assert_eq!(evaluate_with(&s, &mut memo), fresh, "after {path}");
        // Twice: the second call is a hit and still the same.
        assert_eq!(evaluate_with(&s, &mut memo), fresh, "again after {path}");
    }
    // The frame at the start is solved again only if the memo forgot it; either way the same.
    assert_eq!(evaluate_with(&scenario(&base()), &mut memo), first);
}

#[test]
fn a_rider_edit_reuses_the_solve_and_a_frame_edit_does_not() {
    let mut memo = SolveMemo::default();
    let mut v = base();
    evaluate_with(&scenario(&v), &mut memo);
    v["rider"]["height_mm"] = json!(1700);
    v["bikes"][0]["changes"]["headset_angle_deg"] = json!(-1);
    evaluate_with(&scenario(&v), &mut memo);
    assert_eq!(memo.len(), 1, "the same frame and wheels: one solve");
    v["bikes"][0]["frame"]["stack_mm"] = json!(640);
    evaluate_with(&scenario(&v), &mut memo);
    assert_eq!(memo.len(), 2, "a frame edit: a new solve");
    v["bikes"][0]["wheels"]["rear"] = json!("27.5x2.6");
    evaluate_with(&scenario(&v), &mut memo);
    assert_eq!(memo.len(), 3, "a stock wheel edit: a new solve");
    // Changed wheels (the ridden bike's) are not read by the solve.
    v["bikes"][0]["changes"]["wheels"] = json!({ "front": "27.5x2.5" });
    evaluate_with(&scenario(&v), &mut memo);
    assert_eq!(memo.len(), 3);
}

proptest! {
    #![proptest_config(ProptestConfig::with_cases(24))]
    /// Random walks over frame, rider and change edits: memo and fresh reports always agree.
    #[test]
    fn random_edit_walks_agree(steps in prop::collection::vec((0usize..6, -30.0f64..30.0), 1..8)) {
        let mut memo = SolveMemo::default();
        let mut v = base();
        for (which, d) in steps {
            let (path, start) = [
                ("/bikes/0/frame/reach_mm", 470.0),
                ("/bikes/0/frame/stack_mm", 635.0),
                ("/rider/height_mm", 1780.0),
                ("/bikes/0/setup/stem_mm", 45.0),
                ("/bikes/0/changes/fork_a2c_delta_mm", 0.0),
                ("/bikes/0/frame/head_angle_deg", 65.0),
            ][which];
            let step = if which == 5 { d / 10.0 } else { d };
            // Rounded steps so that walks come back to values seen before.
            set(&mut v, path, json!(start + step.round()));
            let s = scenario(&v);
            prop_assert_eq!(evaluate_with(&s, &mut memo), evaluate(&s));
        }
    }
}
