//! Bad rider, setup and load inputs: one typed error per kind, naming the field; the seat and
//! post fit; the fit checks with their sources; the cockpit search from a point or another bike.

// Test helpers may unwrap, index and panic, like the tests themselves (see clippy.toml).
#![allow(
    clippy::unwrap_used,
    clippy::expect_used,
    clippy::panic,
    clippy::indexing_slicing
)]

use framewise_kernel::{evaluate, Report, Scenario};
use serde_json::{json, Value};

fn bike(setup: Value) -> Value {
    json!({ "label": "a", "frame": { "reach_mm": 470, "stack_mm": 635, "head_angle_deg": 65.0,
              "head_tube_mm": 110, "headset_lower_mm": 12, "fork_a2c_mm": 561, "fork_offset_mm": 44,
              "chainstay_mm": 435, "seat_angle_actual_deg": 76.5, "seat_tube_mm": 430 },
            "wheels": { "front": "29x2.4", "rear": "29x2.4" }, "setup": setup })
}

fn setup() -> Value {
    json!({ "stem_mm": 45, "bar_rise_mm": 25, "bar_pullback_mm": 30, "crank_mm": 170,
            "saddle_height_mm": 735 })
}

fn run(v: Value) -> Report {
    let s: Scenario = serde_json::from_value(v).unwrap();
    evaluate(&s)
}

fn one_error(r: &Report, field: &str, code: &str) {
    let e = r
        .errors
        .iter()
        .find(|e| e.field == field)
        .unwrap_or_else(|| panic!("no error for {field}: {:?}", r.errors));
    assert_eq!(e.code, code, "{}", e.message);
}

#[test]
fn rider_out_of_range() {
    let r = run(json!({ "rider": { "height_mm": 3000 }, "bikes": [bike(setup())] }));
    one_error(&r, "rider.height_mm", "out_of_range");
    assert!(r.errors[0].message.contains("900") && r.errors[0].message.contains("3000"));
    // The bike is still evaluated, without a rider.
    assert_eq!(r.bikes.len(), 1);
    assert!(r.bikes[0].fit.seated.is_empty());
}

#[test]
fn rider_not_a_number() {
    let mut s: Scenario =
        serde_json::from_value(json!({ "rider": { "height_mm": 1780 }, "bikes": [bike(setup())] }))
            .unwrap();
    s.rider.as_mut().unwrap().elbow_bend_deg = Some(f64::NAN);
    one_error(&evaluate(&s), "rider.elbow_bend_deg", "not_a_number");
}

#[test]
fn rider_without_height_or_inseam_is_a_warning() {
    let r = run(json!({ "rider": { "mass_kg": 70 }, "bikes": [bike(setup())] }));
    assert!(r.errors.is_empty());
    assert!(r.bikes[0]
        .warnings
        .iter()
        .any(|w| w.code == "rider_incomplete"));
}

#[test]
fn setup_out_of_range() {
    let mut s = setup();
    s["stem_mm"] = json!(500);
    one_error(
        &run(json!({ "bikes": [bike(s)] })),
        "bikes[0].setup.stem_mm",
        "out_of_range",
    );
}

#[test]
fn unknown_bar_type_and_hand_position() {
    let mut s = setup();
    s["bar_type"] = json!("aero");
    s["hand_position"] = json!("middle");
    let r = run(json!({ "bikes": [bike(s)] }));
    one_error(&r, "bikes[0].setup.bar_type", "bad_choice");
    one_error(&r, "bikes[0].setup.hand_position", "bad_choice");
}

#[test]
fn half_a_target_point() {
    let mut s = setup();
    s["target_grip_x_mm"] = json!(450);
    one_error(
        &run(json!({ "bikes": [bike(s)] })),
        "bikes[0].setup.target_grip_y_mm",
        "needs_pair",
    );
}

#[test]
fn target_from_a_missing_bike() {
    let mut s = setup();
    s["target_grip_bike"] = json!(5);
    one_error(
        &run(json!({ "bikes": [bike(s)] })),
        "bikes[0].setup.target_grip_bike",
        "bad_target",
    );
}

#[test]
fn load_out_of_range() {
    let mut b = bike(setup());
    b["load"] = json!({ "x_mm": 0, "y_mm": 800, "mass_kg": 0 });
    one_error(
        &run(json!({ "bikes": [b] })),
        "bikes[0].load.mass_kg",
        "out_of_range",
    );
}

/// Target from another bike: the second bike searches for the first bike's grip point; the
/// first's parts are catalogue parts, so the best choice hits it exactly.
#[test]
fn target_from_another_bike() {
    let mut s2 = setup();
    s2["stem_mm"] = json!(70);
    s2["target_grip_bike"] = json!(0);
    let mut s1 = setup();
    s1["spacers_mm"] = json!(15);
    s1["stem_angle_deg"] = json!(6);
    let r = run(json!({ "bikes": [bike(s1), bike(s2)] }));
    assert!(r.errors.is_empty(), "{:?}", r.errors);
    let p = r.bikes[1].cockpit_parts.as_ref().unwrap();
    assert_eq!(p.target_from, "bikes[0]");
    assert!((p.target_x_mm - r.bikes[0].ridden["grip_x_mm"]).abs() < 1e-12);
    let best = &p.choices[0];
    assert!(best.miss_mm < 1e-6, "{best:?}");
    assert!(p.choices.iter().any(|c| c.stem_mm == 45.0
        && c.spacers_mm == 15.0
        && c.stem_angle_deg == 6.0
        && c.bar_rise_mm == 25.0));
}

/// Spacers past the limit give a caution that defers to the fork maker.
#[test]
fn spacers_past_the_limit() {
    let mut s = setup();
    s["spacers_mm"] = json!(50);
    let r = run(json!({ "bikes": [bike(s)] }));
    let w = r.bikes[0]
        .warnings
        .iter()
        .find(|w| w.code == "caution_spacers")
        .unwrap();
    assert!(w.message.contains("fork maker"));
}

/// Effective seat angle at saddle height for a seat axis offset from the BB: the axis passes
/// through (offset, 0) with upward direction (−cos a, sin a) (DESIGN.md §8a); its point at
/// distance H from the point nearest the BB; angle atan2(y, −x).
#[test]
fn seat_angle_at_saddle_height_with_an_offset_axis() {
    let mut b = bike(setup());
    b["frame"]["seat_axis_offset_mm"] = json!(-20);
    let r = run(json!({ "bikes": [b] }));
    assert!(r.errors.is_empty(), "{:?}", r.errors);
    let br = &r.bikes[0];
    let a = 76.5f64.to_radians();
    let u = (-a.cos(), a.sin());
    let p = (br.stock["seat_axis_offset_mm"], 0.0);
    let t = -(p.0 * u.0 + p.1 * u.1);
    let o = (p.0 + u.0 * t, p.1 + u.1 * t);
    let s = (o.0 + u.0 * 735.0, o.1 + u.1 * 735.0);
    let expected = s.1.atan2(-s.0).to_degrees();
    assert!((br.ridden["seat_angle_at_saddle_deg"] - expected).abs() < 1e-6);
    assert!(
        expected < 76.5,
        "an axis behind the BB slackens the effective angle"
    );
}

/// Post fit: exposed post = saddle height − saddle stack − seat tube; a post above its minimum
/// insertion and a dropper that is too long give cautions.
#[test]
fn post_fit_cautions() {
    let mut s = setup();
    s["saddle_height_mm"] = json!(850);
    s["saddle_stack_mm"] = json!(40);
    s["post_length_mm"] = json!(400);
    s["post_min_insertion_mm"] = json!(100);
    s["max_insertion_mm"] = json!(200);
    s["dropper_travel_mm"] = json!(250);
    let r = run(json!({ "bikes": [bike(s)] }));
    let b = &r.bikes[0];
    assert!((b.ridden["post_exposed_mm"] - (850.0 - 40.0 - 430.0)).abs() < 1e-9);
    assert!((b.ridden["saddle_height_highest_mm"] - (430.0 + 40.0 + 300.0)).abs() < 1e-9);
    assert!((b.ridden["saddle_height_lowest_mm"] - (430.0 + 40.0 + 200.0)).abs() < 1e-9);
    // 380 mm exposed, 200 mm insertion: t + 40 ≤ 380 and 2t + 90 − 380 ≤ 200 → t ≤ 245: 240.
    assert!((b.ridden["dropper_max_travel_mm"] - 240.0).abs() < 1e-9);
    let codes: Vec<_> = b.warnings.iter().map(|w| w.code.as_str()).collect();
    assert!(
        codes.contains(&"caution_post_insertion") && codes.contains(&"dropper_too_long"),
        "{codes:?}"
    );
}

/// Fit checks carry their sources: knee 25–35° (Peveler 2005 / Holmes 1994), 0.883 × inseam and
/// 1.09 × inseam (Peveler 2005; Hamley & Thomas 1967), ISO 4210-2 §4.7.5 ≥ 25 %, 16 CFR
/// 1512.17(d) 89 mm, 16 CFR 1512.17(c) 25°.
#[test]
fn checks_with_sources() {
    let r = run(
        json!({ "rider": { "height_mm": 1780, "mass_kg": 74, "inseam_mm": 840 }, "bikes": [bike(setup())] }),
    );
    let b = &r.bikes[0];
    let get = |code: &str| {
        b.checks
            .iter()
            .find(|c| c.code == code)
            .unwrap_or_else(|| panic!("{code}"))
    };
    let knee = get("knee_flexion_bdc");
    assert_eq!((knee.min, knee.max), (Some(25.0), Some(35.0)));
    assert!(knee.source.contains("Peveler"));
    assert_eq!(knee.within, Some((25.0..=35.0).contains(&knee.value)));
    assert!((get("saddle_height_0883_inseam").target.unwrap() - 741.72).abs() < 1e-9);
    assert!((get("saddle_to_pedal_109_inseam").target.unwrap() - 915.6).abs() < 1e-9);
    assert!((get("saddle_to_pedal_109_inseam").value - (735.0 + 170.0)).abs() < 1e-9);
    assert_eq!(get("iso_4210_front_load").min, Some(25.0));
    assert!(get("iso_4210_front_load").source.contains("4.7.5"));
    assert_eq!(get("toe_clearance").min, Some(89.0));
    assert!(get("toe_clearance").source.contains("1512.17(d)"));
    assert_eq!(get("pedal_strike_lean").min, Some(25.0));
    assert!(get("torso_angle").source.contains("common practice"));
    // Sources are shown to people: plain words, a recalled one marked so, no bracketed tags.
    assert!(get("saddle_to_pedal_109_inseam")
        .source
        .contains("Hamley & Thomas 1967 (from memory)"));
    assert!(b.checks.iter().all(|c| !c.source.contains('[')));
}

/// A saddle setback not given is the post's offset (the saddle centred over the clamp): the
/// report says so among its assumptions, and says nothing when the setback is given.
#[test]
fn a_saddle_setback_not_given_is_an_assumption_said() {
    let said = |setup: Value| {
        let r = run(json!({ "version": 1, "bikes": [bike(setup)] }));
        assert!(r.errors.is_empty(), "{:?}", r.errors);
        r.bikes[0]
            .warnings
            .iter()
            .filter(|w| w.code == "assumed" && w.message.starts_with("saddle setback"))
            .map(|w| w.message.clone())
            .collect::<Vec<_>>()
    };
    let mut with_offset = setup();
    with_offset["post_offset_mm"] = json!(20);
    assert_eq!(
        said(with_offset),
        ["saddle setback not given: assumed 20 mm (the saddle centred over the seatpost clamp)."]
    );
    let mut given = setup();
    given["saddle_setback_mm"] = json!(30);
    assert!(said(given).is_empty());
    let r = run(json!({ "version": 1, "bikes": [bike(setup())] }));
    assert_eq!(r.bikes[0].ridden["saddle_setback_mm"], 0.0);
}

/// The number in a message, after `before` (e.g. "by ").
fn number_after(message: &str, before: &str) -> f64 {
    let at = message.find(before).unwrap() + before.len();
    let digits: String = message[at..]
        .chars()
        .take_while(|c| c.is_ascii_digit() || *c == '.')
        .collect();
    digits.parse().unwrap()
}

#[test]
fn toe_overlap_and_the_assumed_bike_centre_are_said_in_whole_mm() {
    // A short frame with a steep head angle and long cranks: the shoe reaches the front tyre.
    let mut b = bike(json!({ "stem_mm": 45, "crank_mm": 175, "saddle_height_mm": 735 }));
    b["frame"]["reach_mm"] = json!(360);
    b["frame"]["head_angle_deg"] = json!(73.0);
    b["frame"]["fork_a2c_mm"] = json!(400);
    let r = run(json!({ "rider": { "height_mm": 1900 }, "bikes": [b] }));
    let bike = &r.bikes[0];
    let overlap = bike.ridden["toe_overlap_mm"];
    assert!(overlap > 0.0, "the example overlaps: {overlap}");
    let toe = bike
        .warnings
        .iter()
        .find(|w| w.code == "caution_toe_overlap")
        .unwrap();
    // Whole mm, rounded up: an overlap is never said smaller than it is.
    assert_eq!(
        number_after(&toe.message, "by "),
        overlap.ceil(),
        "{}",
        toe.message
    );
    let assumed = bike
        .warnings
        .iter()
        .find(|w| w.message.contains("bike mass and centre of mass"))
        .unwrap();
    let ahead = number_after(&assumed.message, "kg at ");
    assert_eq!(ahead, ahead.round(), "{}", assumed.message);
}
