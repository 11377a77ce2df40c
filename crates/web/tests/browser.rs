//! wasm-bindgen tests: the binding runs inside headless Chromium.
#![cfg(target_arch = "wasm32")]

use wasm_bindgen_test::*;

wasm_bindgen_test_configure!(run_in_browser);

// An invented bike as the page's form sends it (field name → typed text).
const FORM: &str = r#"{"label":"Trail M","frame.reach_mm":"470","frame.stack_mm":"635",
    "frame.head_angle_deg":"65","frame.head_tube_mm":"110","frame.fork_a2c_mm":"561",
    "frame.fork_offset_mm":"44","wheels.front":"29x2.4","wheels.rear":"29x2.4",
    "setup.stem_mm":"45","rider.height_mm":"1780"}"#;

#[wasm_bindgen_test]
fn a_form_evaluates_draws_and_links_in_the_browser() {
    let out = framewise_web::evaluate_form_page(FORM, "");
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
    // The per-edit call leaves the drawing to drawing_changes() and its SVG document to
    // drawing_svg(). The page's writer asks for what changed since the answer it shows (none:
    // the whole list); a rehearsal of another form leaves that answer as it was.
    assert!(v.get("drawing").is_none());
    let whole: serde_json::Value =
        serde_json::from_str(&framewise_web::drawing_changes(0)).unwrap_or_default();
    assert!(whole["patch"].as_array().is_some_and(|p| p.len() > 40));
    assert!(framewise_web::drawing_svg().starts_with("<svg"));
    let seq = u32::try_from(whole["seq"].as_u64().unwrap_or(0)).unwrap_or(0);
    assert!(framewise_web::rehearse(r#"{"frame.reach_mm":"500"}"#, "") > 0);
    let none: serde_json::Value =
        serde_json::from_str(&framewise_web::drawing_changes(seq)).unwrap_or_default();
    assert_eq!(none["changes"], serde_json::json!([]));
    // The link, made after the call (last_link), opens into the same numbers; a rehearsal
    // did not change it.
    assert!(v.get("link").is_none());
    let link = framewise_web::last_link();
    assert!(link.starts_with('#'), "{link}");
    let link = link.as_str();
    let opened: serde_json::Value = serde_json::from_str(
        &framewise_web::link::link_core::form_from_link(link).unwrap_or_default(),
    )
    .unwrap_or_default();
    assert_eq!(opened["fields"]["frame.head_angle_deg"], "65");
}

#[wasm_bindgen_test]
fn text_in_a_number_field_is_an_error_not_a_throw() {
    let out = framewise_web::evaluate_form_page(r#"{"frame.reach_mm":"abc"}"#, "");
    let v: serde_json::Value = serde_json::from_str(&out).unwrap_or_default();
    assert_eq!(v["field_errors"][0]["field"], "frame.reach_mm");
}
