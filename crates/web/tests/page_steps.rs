//! The page's steps from a user review, replayed on the form the page sends (field name → typed
//! text): the demo's fields, then what the person did. What the page shows is the result's
//! `field_errors` (each beside its field) or the report's numbers.
#![allow(clippy::unwrap_used, clippy::indexing_slicing, clippy::panic)]

use framewise_web::framewise_web_core::evaluate_form_to_json;
use std::collections::BTreeMap;

/// The page's first form: every field with its demo value.
fn demo_form() -> BTreeMap<String, String> {
    framewise_formats::fields::fields()
        .into_iter()
        .map(|f| (f.name.to_string(), f.demo.to_string()))
        .collect()
}

/// "Clear frame and fork numbers": the bike name and every `frame.` field blank.
fn cleared(mut form: BTreeMap<String, String>) -> BTreeMap<String, String> {
    for (name, text) in form.iter_mut() {
        if name == "label" || name.starts_with("frame.") {
            text.clear();
        }
    }
    form
}

fn typed(mut form: BTreeMap<String, String>, edits: &[(&str, &str)]) -> BTreeMap<String, String> {
    for (name, text) in edits {
        form.insert((*name).to_string(), (*text).to_string());
    }
    form
}

fn evaluate(form: &BTreeMap<String, String>) -> serde_json::Value {
    let json = evaluate_form_to_json(&serde_json::to_string(form).unwrap());
    serde_json::from_str(&json).unwrap()
}

/// The road listing of the review: "Clear frame and fork numbers", five numbers, 700x28c.
fn road_listing() -> BTreeMap<String, String> {
    typed(
        cleared(demo_form()),
        &[
            ("frame.reach_mm", "385"),
            ("frame.stack_mm", "555"),
            ("frame.head_angle_deg", "72"),
            ("frame.head_tube_mm", "145"),
            ("frame.bb_drop_mm", "70"),
            ("wheels.front", "700x28c"),
            ("wheels.rear", "700x28c"),
        ],
    )
}

fn stock(v: &serde_json::Value, key: &str) -> f64 {
    v["report"]["bikes"][0]["stock"][key]
        .as_f64()
        .unwrap_or(f64::NAN)
}

fn underdetermined(v: &serde_json::Value) -> String {
    let warnings = v["report"]["bikes"][0]["warnings"].as_array().cloned();
    warnings
        .unwrap_or_default()
        .iter()
        .find(|w| w["code"] == "underdetermined")
        .and_then(|w| w["message"].as_str())
        .unwrap_or_default()
        .to_string()
}

#[test]
fn a_road_listing_without_fork_numbers_is_drawn() {
    let v = evaluate(&road_listing());
    assert_eq!(
        v["field_errors"],
        serde_json::json!([]),
        "{}",
        v["field_errors"]
    );
    // The offset stands in (44 mm, said in the warning); the BB drop fixes the a2c:
    // (555 − 70 + 44 cos 72°) / sin 72° − 145 = 379 mm (DESIGN.md §8a, level axles).
    let h = 72f64.to_radians();
    let a2c = (555.0 - 70.0 + 44.0 * h.cos()) / h.sin() - 145.0;
    assert!((stock(&v, "fork_a2c_mm") - a2c).abs() < 0.01);
    assert!((stock(&v, "fork_offset_mm") - 44.0).abs() < 1e-9);
    // BB height = 700x28c radius (622 / 2 + 28, ISO 5775 estimate) − 70 = 269 mm.
    assert!((stock(&v, "bb_height_mm") - 269.0).abs() < 0.01);
    let wb = stock(&v, "wheelbase_mm");
    assert!((950.0..=1050.0).contains(&wb), "{wb}"); // road bikes' [practice]
    assert!(underdetermined(&v).contains("fork offset 44 mm"), "{v}");
}

#[test]
fn before_the_bb_drop_the_stand_in_fork_fits_the_road_wheels() {
    let mut form = road_listing();
    form.insert("frame.bb_drop_mm".into(), String::new());
    let v = evaluate(&form);
    assert_eq!(v["field_errors"], serde_json::json!([]));
    // A rigid fork for a 28 mm tyre: radius 339 + 35 mm [practice], not the trail bike's 560.
    assert!((stock(&v, "fork_a2c_mm") - 374.0).abs() < 1e-9);
    let said = underdetermined(&v);
    assert!(
        said.contains("fork axle-to-crown 374 mm (a rigid fork, as common for a 28 mm front tyre)"),
        "{said}"
    );
}

#[test]
fn a_pasted_road_chart_without_wheelbase_or_fork_numbers_is_drawn() {
    // An invented road chart: no wheelbase, no fork numbers, a BB drop.
    let text = "Size\t50\t53\t56\n\
                Reach\t375\t382\t390\n\
                Stack\t530\t550\t570\n\
                Head tube angle\t71.5\t72\t72.5\n\
                Head tube\t125\t140\t160\n\
                Chainstay\t408\t408\t410\n\
                BB drop\t72\t72\t70\n";
    let chart = framewise_formats::chart::import_chart(text).unwrap();
    assert_eq!(chart.sizes.len(), 3);
    for key in ["head_tube_mm", "bb_drop_mm", "chainstay_mm"] {
        assert!(
            chart.sizes.iter().all(|s| s.frame.contains_key(key)),
            "{key}"
        );
    }
    for key in ["wheelbase_mm", "fork_a2c_mm", "fork_offset_mm"] {
        assert!(
            chart.sizes.iter().all(|s| !s.frame.contains_key(key)),
            "{key}"
        );
    }
    for size in &chart.sizes {
        // As the page applies a size: every frame field from the chart, blank where it has none.
        let mut form = road_listing();
        for (name, text) in form.iter_mut() {
            if let Some(key) = name.strip_prefix("frame.") {
                *text = size.frame.get(key).map(f64::to_string).unwrap_or_default();
            }
        }
        let v = evaluate(&form);
        assert_eq!(v["field_errors"], serde_json::json!([]), "{}", size.label);
        let a2c = stock(&v, "fork_a2c_mm");
        assert!((365.0..=400.0).contains(&a2c), "{}: a2c {a2c}", size.label); // [practice]
        let bb_height = stock(&v, "bb_height_mm");
        let drop = size.frame["bb_drop_mm"];
        assert!((bb_height - (339.0 - drop)).abs() < 0.5, "{bb_height}");
    }
}

#[test]
fn an_impossible_head_angle_is_said_beside_the_head_angle() {
    let v = evaluate(&typed(demo_form(), &[("frame.head_angle_deg", "45")]));
    let errors = v["field_errors"].as_array().cloned().unwrap_or_default();
    assert_eq!(errors.len(), 1, "{errors:?}");
    assert_eq!(errors[0]["field"], "frame.head_angle_deg");
    // The demo: stack 635, head tube 110, lower stack 12, a2c 561, offset 44, equal wheels:
    // drop = 635 − (110 + 12 + 561)·sin 45° + 44·cos 45° = 183 mm (DESIGN.md §8a).
    let h = 45f64.to_radians();
    let drop = 635.0 - (110.0 + 12.0 + 561.0) * h.sin() + 44.0 * h.cos();
    assert_eq!(
        errors[0]["message"],
        format!(
            "The published head tube angle 45.0°, stack 635 mm and head tube length 110 mm \
             together put the BB drop at {drop:.0} mm, which no frame can have (allowed \u{2212}150 to \
             150 mm); check the head tube angle first: of these it moves the BB drop most."
        )
    );
}
