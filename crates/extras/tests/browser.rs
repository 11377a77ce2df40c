//! wasm-bindgen tests: the on-demand module runs inside headless Chromium.
#![cfg(target_arch = "wasm32")]

use wasm_bindgen_test::*;

wasm_bindgen_test_configure!(run_in_browser);

#[wasm_bindgen_test]
fn a_pasted_chart_becomes_a_size_run_in_the_browser() {
    // Invented chart: sizes as columns, tab-separated, reach in inches with marks.
    let out = framewise_extras::import_chart(
        "Size\tS\tM\nReach\t17\"\t18.5\"\nHead angle\t65°\t65°\nSaddle\t1\t2\n",
    );
    let v: serde_json::Value = serde_json::from_str(&out).unwrap_or_default();
    // Source: 1 in = 25.4 mm exactly; 18.5 in = 469.9 mm.
    assert_eq!(v["sizes"][1]["label"], "M");
    assert_eq!(v["sizes"][1]["frame"]["reach_mm"], 469.9);
    assert_eq!(v["sizes"][0]["frame"]["head_angle_deg"], 65.0);
    assert_eq!(v["unrecognised"][0], "Saddle");
    let bad: serde_json::Value =
        serde_json::from_str(&framewise_extras::import_chart("")).unwrap_or_default();
    assert_eq!(bad["error"]["code"], "empty_chart");
}

#[wasm_bindgen_test]
fn answers_to_a_question_change_the_reading_in_the_browser() {
    // "STA" does not say effective or actual; answering "actual" files it under the actual angle.
    let out = framewise_extras::import_chart_with_answers(
        "Size\tS\tM\nReach\t450\t475\nSTA\t77\t77\n",
        r#"{"STA#meaning":"actual"}"#,
    );
    let v: serde_json::Value = serde_json::from_str(&out).unwrap_or_default();
    assert_eq!(v["sizes"][0]["frame"]["seat_angle_actual_deg"], 77.0);
}

#[wasm_bindgen_test]
fn the_qr_code_is_svg_of_the_size_the_standard_gives_in_the_browser() {
    // Source: ISO/IEC 18004, capacity table [memory]: 100 bytes at level M need version 6,
    // 17 + 4·6 = 41 modules a side, plus a 4-module quiet zone on each side = 49.
    let svg = framewise_extras::qr::qr_svg_text(&"x".repeat(100)).unwrap_or_default();
    assert!(svg.starts_with("<svg role=\"img\""), "{svg:.60}");
    let width: u32 = svg
        .split("viewBox=\"0 0 ")
        .nth(1)
        .and_then(|vb| vb.split(' ').next())
        .and_then(|w| w.parse().ok())
        .unwrap_or(0);
    assert!(width > 0 && width % 49 == 0, "viewBox width {width}");
    assert!(framewise_extras::qr::qr_svg_text(&"x".repeat(4000)).is_err());
}
