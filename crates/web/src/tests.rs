//! Native tests of the binding's core (`framewise_web_core`): the form's calls, their JSON, the
//! share link and the drawing, as the page sees them.

use super::framewise_web_core::*;

#[test]
fn bad_json_comes_back_as_an_error_not_a_throw() {
    let v: serde_json::Value = serde_json::from_str(&evaluate_to_json("{oops")).unwrap_or_default();
    assert_eq!(v["report"]["errors"][0]["code"], "bad_json");
    assert!(v["svg"].is_null());
}

#[test]
fn form_errors_use_form_field_names() {
    let json = evaluate_form_to_json(
        r#"{"frame.reach_mm":"470","frame.stack_mm":"635","frame.head_angle_deg":"95",
        "frame.head_tube_mm":"110","frame.fork_a2c_mm":"561","frame.fork_offset_mm":"44"}"#,
    );
    let v: serde_json::Value = serde_json::from_str(&json).unwrap_or_default();
    assert_eq!(v["field_errors"][0]["field"], "frame.head_angle_deg");
    assert_eq!(
        v["field_errors"][0]["message"],
        "Head tube angle must be between 45 and 85°, got 95"
    );
    assert!(v["svg"].is_null());
}

/// A form with the given reach and rider height texts (the rest as the page's demo).
fn form_with(reach: &str, height: &str) -> String {
    format!(
        r#"{{"frame.reach_mm":"{reach}","frame.stack_mm":"635","frame.head_angle_deg":"65",
        "frame.head_tube_mm":"110","frame.fork_a2c_mm":"561","frame.fork_offset_mm":"44",
        "frame.chainstay_mm":"435","frame.bb_drop_mm":"35","setup.stem_mm":"45",
        "rider.height_mm":"{height}","rider.mass_kg":"74"}}"#
    )
}

#[test]
fn a_length_typed_without_its_unit_is_read_in_cm_or_inches_when_only_one_fits() {
    let view = r#"{"posture":"seated"}"#;
    let parse =
        |json: String| -> serde_json::Value { serde_json::from_str(&json).unwrap_or_default() };
    // A reach of 47,5 (cm, as a phone's number pad types it) and a height of 70 (inches).
    let guessed = parse(evaluate_form_linked_to_json(&form_with("47,5", "70"), view));
    let typed = parse(evaluate_form_linked_to_json(
        &form_with("475", "1778"),
        view,
    ));
    assert_eq!(guessed["field_errors"], serde_json::json!([]), "{guessed}");
    assert_eq!(guessed["report"], typed["report"]);
    assert_eq!(guessed["link"], typed["link"]);
    assert!(
        typed.get("field_notes").is_none(),
        "no notes when nothing was guessed"
    );
    let notes = guessed["field_notes"]
        .as_array()
        .cloned()
        .unwrap_or_default();
    assert_eq!(notes.len(), 2, "{notes:?}");
    let note = |field: &str| {
        notes
            .iter()
            .find(|n| n["field"] == field)
            .and_then(|n| n["message"].as_str())
            .unwrap_or_default()
            .to_string()
    };
    let said = note("frame.reach_mm");
    assert!(said.starts_with("Read as 47,5 cm = 475 mm"), "{said}");
    let said = note("rider.height_mm");
    assert!(said.starts_with("Read as 70 in = 1778 mm"), "{said}");

    // A reach of 30 is read as cm: 762 mm (in) is no published reach.
    let reach = parse(evaluate_form_linked_to_json(&form_with("30", "1780"), view));
    assert_eq!(
        reach["field_notes"][0]["field"], "frame.reach_mm",
        "{reach}"
    );
    // A saddle height of 40 (allowed 300–1200 mm) fits 400 mm (cm) and 1016 mm (in): the
    // error says both and nothing is guessed.
    let form = form_with("470", "1780").replace(
        r#""setup.stem_mm":"45""#,
        r#""setup.stem_mm":"45","setup.saddle_height_mm":"40""#,
    );
    let both = parse(evaluate_form_linked_to_json(&form, view));
    assert!(both.get("field_notes").is_none(), "{both}");
    assert_eq!(
        both["field_errors"][0]["field"], "setup.saddle_height_mm",
        "{both}"
    );
    let said = both["field_errors"][0]["message"]
        .as_str()
        .unwrap_or_default();
    assert!(
        said.ends_with("got 40. In cm that is 400 mm, in inches 1016 mm: type the value in mm, or add cm or in"),
        "{said}"
    );
}

#[test]
fn a_second_reading_keeps_the_hint_of_a_length_that_fits_both_units() {
    // Reach 47,5 is read as cm (a second reading); saddle height 40 fits cm and inches, so
    // its error, on the second reading, still says both.
    let form = form_with("47,5", "1780").replace(
        r#""setup.stem_mm":"45""#,
        r#""setup.stem_mm":"45","setup.saddle_height_mm":"40""#,
    );
    let v: serde_json::Value =
        serde_json::from_str(&evaluate_form_linked_to_json(&form, "{}")).unwrap_or_default();
    assert_eq!(v["field_notes"][0]["field"], "frame.reach_mm", "{v}");
    assert_eq!(
        v["field_errors"][0]["field"], "setup.saddle_height_mm",
        "{v}"
    );
    let said = v["field_errors"][0]["message"].as_str().unwrap_or_default();
    assert!(
        said.ends_with("got 40. In cm that is 400 mm, in inches 1016 mm: type the value in mm, or add cm or in"),
        "{said}"
    );
}

#[test]
fn a_wheel_named_without_its_tyre_width_is_read_with_the_common_width() {
    let view = r#"{"posture":"seated"}"#;
    let with_wheel = |w: &str| {
        let form = form_with("470", "1780").replace(
            r#""setup.stem_mm":"45""#,
            &format!(r#""setup.stem_mm":"45","wheels.front":"{w}","wheels.rear":"29x2.4""#),
        );
        let json = evaluate_form_linked_to_json(&form, view);
        serde_json::from_str::<serde_json::Value>(&json).unwrap_or_default()
    };
    let named = with_wheel("27.5");
    let full = with_wheel("27.5x2.4");
    assert_eq!(named["field_errors"], serde_json::json!([]), "{named}");
    assert_eq!(named["report"], full["report"]);
    assert_eq!(named["field_notes"][0]["field"], "wheels.front");
    let said = named["field_notes"][0]["message"]
        .as_str()
        .unwrap_or_default();
    assert!(
        said.starts_with("Read as 27.5x2.4: \"27.5\" gives no tyre width"),
        "{said}"
    );
    // A size no wheel has stays an error, in words a person can act on.
    let bad = with_wheel("31");
    let said = bad["field_errors"][0]["message"]
        .as_str()
        .unwrap_or_default();
    assert!(
        said.starts_with(
            "Wheel size \"31\" is not recognised: enter a wheel and tyre size such as 29x2.4"
        ),
        "{said}"
    );
    assert!(
        !said.contains('{'),
        "no JSON in a message for a person: {said}"
    );
}

#[test]
fn an_inconsistent_published_value_is_explained_and_the_drawing_has_every_layer() {
    // Reach, stack, head angle, head tube, fork and offset fix the front; a wheelbase 40 mm
    // longer than the frame with a 435 mm chainstay allows cannot also hold.
    let json = evaluate_form_to_json(
        r#"{"frame.reach_mm":"470","frame.stack_mm":"635","frame.head_angle_deg":"65",
        "frame.head_tube_mm":"110","frame.fork_a2c_mm":"561","frame.fork_offset_mm":"44",
        "frame.chainstay_mm":"435","frame.bb_drop_mm":"35","frame.wheelbase_mm":"1272",
        "setup.stem_mm":"45","setup.saddle_height_mm":"735","setup.crank_mm":"170",
        "rider.height_mm":"1780","rider.mass_kg":"74","setup.bar_type":"flat"}"#,
    );
    let v: serde_json::Value = serde_json::from_str(&json).unwrap_or_default();
    assert_eq!(
        v["field_errors"].as_array().map(Vec::len),
        Some(0),
        "{json}"
    );
    let note = v["notes"]["wheelbase_mm"].as_str().unwrap_or_default();
    assert!(
        note.starts_with("Wheelbase is published as 1272 mm"),
        "{note}"
    );
    let svg = v["svg"].as_str().unwrap_or_default();
    for class in [
        "fork fork-leg",
        "posture seated",
        "posture standing",
        "stem",
        "saddle",
    ] {
        assert!(svg.contains(&format!("class=\"{class}\"")), "{class}");
    }
    assert!(
        svg.contains("braking limit"),
        "handling numbers label the centre of mass"
    );
}

#[test]
fn the_linked_form_gives_the_same_result_and_the_same_link_as_two_calls() {
    let form = r#"{"label":"Trail M","frame.reach_mm":"47 cm","frame.stack_mm":"635",
        "frame.head_angle_deg":"64,5°","frame.head_tube_mm":"110","frame.fork_a2c_mm":"561",
        "frame.fork_offset_mm":"44","wheels.front":"29x2.4","wheels.rear":"29x2.4",
        "setup.stem_mm":"45","rider.height_mm":"1780"}"#;
    let view = r#"{"posture":"standing","dimensions":true}"#;
    let mut linked: serde_json::Value =
        serde_json::from_str(&evaluate_form_linked_to_json(form, view)).unwrap_or_default();
    let mut alone: serde_json::Value =
        serde_json::from_str(&evaluate_form_to_json(form)).unwrap_or_default();
    // The linked (page) call leaves out what the page does not read: each bike's outlines
    // (it draws from `drawing`) and per-change effects; every other member is the same.
    let whole_bike = alone["report"]["bikes"][0].clone();
    for member in ["outline", "stock_outline", "effects"] {
        assert!(
            whole_bike.get(member).is_some(),
            "{member} in the whole report"
        );
        assert!(
            linked["report"]["bikes"][0].get(member).is_none(),
            "{member} left out"
        );
        if let Some(bike) = alone["report"]["bikes"][0].as_object_mut() {
            bike.remove(member);
        }
    }
    let link = crate::link::link_core::link_from_form(form, view).unwrap_or_default();
    assert!(link.starts_with('#') && link.len() > 8, "{link}");
    assert_eq!(linked["link"], link.as_str());
    // The linked call leaves the drawing to `last_drawing_patch` (then the SVG text to
    // `last_drawing_svg`): the same drawing as the plain call's.
    let patch: serde_json::Value = serde_json::from_str(&last_drawing_patch()).unwrap_or_default();
    assert!(patch["patch"].as_array().is_some_and(|p| p.len() > 40));
    assert_eq!(patch, alone["drawing"]);
    assert_eq!(last_drawing_svg(), alone["svg"].as_str().unwrap_or("none"));
    if let (Some(obj), Some(whole)) = (linked.as_object_mut(), alone.as_object_mut()) {
        obj.remove("link");
        assert_eq!(obj.remove("svg"), Some(serde_json::Value::Null));
        assert_eq!(obj.get("drawing"), None);
        whole.remove("svg");
        whole.remove("drawing");
    }
    assert_eq!(linked, alone);
    // A field that does not read, or a view that does not: no link, the errors as before.
    let bad: serde_json::Value = serde_json::from_str(&evaluate_form_linked_to_json(
        r#"{"frame.reach_mm":"long"}"#,
        "",
    ))
    .unwrap_or_default();
    assert!(bad["link"].is_null());
    assert_eq!(bad["field_errors"][0]["field"], "frame.reach_mm");
    // … and the drawing stays the last good one.
    let kept: serde_json::Value = serde_json::from_str(&last_drawing_patch()).unwrap_or_default();
    assert_eq!(kept, patch);
    let bad_view: serde_json::Value =
        serde_json::from_str(&evaluate_form_linked_to_json(form, "[1]")).unwrap_or_default();
    assert!(bad_view["link"].is_null());
    assert!(bad_view["report"]["bikes"][0]["stock"]["reach_mm"].is_number());
}

/// The page's call leaves the link for later: the same result less the `link` member, and
/// `last_link` then gives the link the one-call form gives. A form with a field that does
/// not read, or a view that does not read, has no link of its own: the last good one stays.
#[test]
fn the_page_call_gives_the_one_call_result_and_its_link_later() {
    let form = r#"{"label":"Trail M","frame.reach_mm":"47 cm","frame.stack_mm":"635",
        "frame.head_angle_deg":"64,5°","wheels.front":"29x2.4","wheels.rear":"29x2.4",
        "setup.stem_mm":"45","rider.height_mm":"1780"}"#;
    let view = r#"{"posture":"standing","dimensions":true}"#;
    let mut whole: serde_json::Value =
        serde_json::from_str(&evaluate_form_linked_to_json(form, view)).unwrap_or_default();
    let page: serde_json::Value =
        serde_json::from_str(&evaluate_form_page_json(form, view)).unwrap_or_default();
    let link = whole
        .as_object_mut()
        .and_then(|o| o.remove("link"))
        .unwrap_or_default();
    assert!(link
        .as_str()
        .is_some_and(|l| l.starts_with('#') && l.len() > 8));
    assert_eq!(page, whole);
    assert_eq!(last_link(), link.as_str().unwrap_or("none"));
    let good = last_link();
    evaluate_form_page_json(r#"{"frame.reach_mm":"long"}"#, view);
    assert_eq!(
        last_link(),
        good,
        "a field that does not read keeps the last good link"
    );
    let too_short = form.replace("\"47 cm\"", "\"4\"");
    let refused = evaluate_form_page_json(&too_short, view);
    assert!(refused.contains("frame.reach_mm"), "{refused}");
    assert_eq!(last_link(), good, "a reach the kernel refuses keeps it");
    evaluate_form_page_json(form, "[1]");
    assert_eq!(last_link(), good, "a view that does not read keeps it");
    evaluate_form_page_json("not json", view);
    assert_eq!(last_link(), good, "a form that does not read keeps it");
    let other = form.replace("\"45\"", "\"60\"");
    evaluate_form_page_json(&other, view);
    assert_ne!(last_link(), good, "the next good form has its own link");
}

/// The page's solve memo changes only the time: a series of form edits (frame, rider,
/// change, a field that does not read, back to the start) gives, edit by edit, the same text
/// as the same call with the memo emptied first.
/// Source: the memo's invariant (crates/kernel/src/memo.rs).
#[test]
fn remembered_solves_give_the_same_result_as_fresh_ones() {
    let mut form: std::collections::BTreeMap<String, String> = serde_json::from_str(
        r#"{"label":"Memo","frame.reach_mm":"470","frame.stack_mm":"635",
        "frame.head_angle_deg":"65","frame.head_tube_mm":"110","frame.fork_a2c_mm":"561",
        "frame.fork_offset_mm":"44","frame.chainstay_mm":"435","wheels.front":"29x2.4",
        "wheels.rear":"29x2.4","setup.stem_mm":"45","setup.saddle_height_mm":"735",
        "setup.crank_mm":"170","rider.height_mm":"1780","rider.mass_kg":"74"}"#,
    )
    .unwrap_or_default();
    let view = r#"{"posture":"seated","dimensions":false,"ghost":true}"#;
    let edits = [
        ("frame.reach_mm", "475"),
        ("rider.height_mm", "1850"),
        ("changes.fork_a2c_delta_mm", "20"),
        ("setup.stem_mm", "60"),
        ("frame.reach_mm", "long"),
        ("frame.reach_mm", "470"),
        ("wheels.front", "27.5x2.5"),
        ("frame.wheelbase_mm", "1300"),
        ("frame.wheelbase_mm", ""),
        ("wheels.front", "29x2.4"),
        ("rider.height_mm", "1780"),
        ("changes.fork_a2c_delta_mm", ""),
        ("setup.stem_mm", "45"),
    ];
    forget_solves();
    let start =
        evaluate_form_linked_to_json(&serde_json::to_string(&form).unwrap_or_default(), view);
    for (field, value) in edits {
        form.insert(field.to_string(), value.to_string());
        let text = serde_json::to_string(&form).unwrap_or_default();
        let remembered = evaluate_form_linked_to_json(&text, view);
        let plain = evaluate_form_to_json(&text);
        forget_solves();
        assert_eq!(
            remembered,
            evaluate_form_linked_to_json(&text, view),
            "{field}"
        );
        forget_solves();
        assert_eq!(plain, evaluate_form_to_json(&text), "{field}");
        assert!(remembered.contains("\"report\""), "{remembered}");
    }
    // Back at the start: the same result as the first call.
    let text = serde_json::to_string(&form).unwrap_or_default();
    assert_eq!(evaluate_form_linked_to_json(&text, view), start);
}

#[test]
fn catalogue_lists_every_key() {
    let v: serde_json::Value = serde_json::from_str(&catalogue_json()).unwrap_or_default();
    assert_eq!(
        v.as_array().map(Vec::len),
        Some(framewise_kernel::CATALOGUE.len())
    );
}
