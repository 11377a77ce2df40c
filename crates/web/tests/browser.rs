//! wasm-bindgen tests: the binding runs inside headless Chromium.
#![cfg(target_arch = "wasm32")]

use wasm_bindgen_test::*;

wasm_bindgen_test_configure!(run_in_browser);

const DEMO: &str = include_str!("../../../tests/scenarios/demo.json");

#[wasm_bindgen_test]
fn demo_scenario_evaluates_and_draws_in_the_browser() {
    let out = framewise_web::evaluate_json(DEMO);
    let v: serde_json::Value = serde_json::from_str(&out).unwrap_or_default();
    assert_eq!(v["report"]["errors"].as_array().map(Vec::len), Some(0));
    // Source: trail T = (R cos h − o) / sin h (Wikipedia, "Bicycle and motorcycle geometry"),
    // R = 311 + 60.96 mm (29x2.4), h = 65°, o = 44 mm.
    let r: f64 = 311.0 + 60.96;
    let h = 65f64.to_radians();
    let expected = (r * h.cos() - 44.0) / h.sin();
    let trail = v["report"]["bikes"][0]["stock"]["trail_mm"]
        .as_f64()
        .unwrap_or(f64::NAN);
    assert!(
        (trail - expected).abs() < 1e-6,
        "trail {trail} expected {expected}"
    );
    assert!(v["svg"].as_str().is_some_and(|s| s.starts_with("<svg")));
}

#[wasm_bindgen_test]
fn text_in_a_number_field_is_an_error_not_a_throw() {
    let out = framewise_web::evaluate_form(r#"{"frame.reach_mm":"abc"}"#);
    let v: serde_json::Value = serde_json::from_str(&out).unwrap_or_default();
    assert_eq!(v["field_errors"][0]["field"], "frame.reach_mm");
}

#[wasm_bindgen_test]
fn a_pasted_chart_becomes_a_size_run_in_the_browser() {
    // Invented chart: sizes as columns, tab-separated, reach in inches with marks.
    let out = framewise_web::import_chart(
        "Size\tS\tM\nReach\t17\"\t18.5\"\nHead angle\t65°\t65°\nSaddle\t1\t2\n",
    );
    let v: serde_json::Value = serde_json::from_str(&out).unwrap_or_default();
    // Source: 1 in = 25.4 mm exactly; 18.5 in = 469.9 mm.
    assert_eq!(v["sizes"][1]["label"], "M");
    assert_eq!(v["sizes"][1]["frame"]["reach_mm"], 469.9);
    assert_eq!(v["sizes"][0]["frame"]["head_angle_deg"], 65.0);
    assert_eq!(v["unrecognised"][0], "Saddle");
    let bad: serde_json::Value =
        serde_json::from_str(&framewise_web::import_chart("")).unwrap_or_default();
    assert_eq!(bad["error"]["code"], "empty_chart");
}
