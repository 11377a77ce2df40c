//! One test per class of bad input: text, NaN, infinities, negative lengths, impossible
//! combinations. Each gets a typed error naming the field, the value and what is allowed; no
//! panic, no NaN in a report.
#![allow(clippy::unwrap_used, clippy::indexing_slicing, clippy::panic)]

use framewise_kernel::{evaluate, Published, Report, Scenario};

fn base() -> Scenario {
    serde_json::from_value(serde_json::json!({
        "version": 1,
        "bikes": [{ "label": "bad input",
            "frame": { "reach_mm": 450, "stack_mm": 620, "head_angle_deg": 66, "head_tube_mm": 110,
                       "fork_a2c_mm": 560, "fork_offset_mm": 44, "chainstay_mm": 435,
                       "seat_angle_actual_deg": 75, "seat_tube_mm": 430 },
            "wheels": { "front": "29x2.4", "rear": "29x2.4" } }]
    }))
    .unwrap()
}

fn with(key: &str, v: f64) -> Report {
    let mut s = base();
    s.bikes[0].frame.insert(key.into(), Published::Value(v));
    evaluate(&s)
}

fn only_error(r: &Report) -> (&str, &str, &str) {
    assert!(r.bikes.is_empty(), "no bike report on bad input");
    assert_eq!(r.errors.len(), 1, "{:?}", r.errors);
    let e = &r.errors[0];
    (e.code.as_str(), e.field.as_str(), e.message.as_str())
}

#[test]
fn text_where_a_wheel_or_key_is_expected() {
    let mut s = base();
    s.bikes[0].wheels.front = Some(framewise_kernel::WheelSpec::Designation("big".into()));
    let r = evaluate(&s);
    let (code, field, msg) = only_error(&r);
    assert_eq!((code, field), ("unknown_wheel", "bikes[0].wheels.front"));
    assert!(msg.contains("\"big\"") && msg.contains("62-622"), "{msg}");
    let r = with("reach", 450.0);
    let (code, field, msg) = only_error(&r);
    assert_eq!((code, field), ("unknown_key", "bikes[0].frame.reach"));
    assert!(msg.contains("reach_mm"));
}

#[test]
fn nan() {
    let r = with("stack_mm", f64::NAN);
    let (code, field, msg) = only_error(&r);
    assert_eq!((code, field), ("not_a_number", "bikes[0].frame.stack_mm"));
    assert!(
        msg.contains("NaN") && msg.contains("250") && msg.contains("900"),
        "{msg}"
    );
}

#[test]
fn infinities() {
    for v in [f64::INFINITY, f64::NEG_INFINITY] {
        let r = with("head_angle_deg", v);
        let (code, field, msg) = only_error(&r);
        assert_eq!(
            (code, field),
            ("not_a_number", "bikes[0].frame.head_angle_deg")
        );
        assert!(
            msg.contains("inf") && msg.contains("45") && msg.contains("85"),
            "{msg}"
        );
    }
}

#[test]
fn negative_lengths() {
    let r = with("head_tube_mm", -110.0);
    let (code, field, msg) = only_error(&r);
    assert_eq!(
        (code, field),
        ("out_of_range", "bikes[0].frame.head_tube_mm")
    );
    // A negative number in a message has a minus sign (U+2212), not a hyphen.
    assert_eq!(
        msg,
        "Head tube length must be between 30 and 400 mm, got \u{2212}110"
    );
}

#[test]
fn impossible_combinations() {
    // A chainstay shorter than the BB drop it must span: here the drop the tall stack, short
    // fork and wheels imply (tyres on the ground). The hard ranges alone cannot catch it.
    let mut s = base();
    s.bikes[0]
        .frame
        .insert("chainstay_mm".into(), Published::Value(260.0));
    s.bikes[0]
        .frame
        .insert("fork_a2c_mm".into(), Published::Value(250.0));
    s.bikes[0]
        .frame
        .insert("stack_mm".into(), Published::Value(800.0));
    let r = evaluate(&s);
    let (code, field, msg) = only_error(&r);
    assert_eq!((code, field), ("impossible", "bikes[0].frame.chainstay_mm"));
    assert!(
        msg.contains("260") && msg.contains("must be longer"),
        "{msg}"
    );
    // A wheelbase no longer than the front centre.
    let mut s = base();
    s.bikes[0]
        .frame
        .insert("front_centre_mm".into(), Published::Value(780.0));
    s.bikes[0]
        .frame
        .insert("wheelbase_mm".into(), Published::Value(700.0));
    let r = evaluate(&s);
    let (code, field, msg) = only_error(&r);
    assert_eq!((code, field), ("impossible", "bikes[0].frame.wheelbase_mm"));
    assert!(msg.contains("700") && msg.contains("780"), "{msg}");
}

#[test]
fn a_solved_value_no_frame_can_have_is_said_beside_the_published_value_that_moved_it() {
    // A head angle of 45° (inside its own 45–85° range) with the other numbers puts the BB
    // drop far below the axles. Equal wheels, so the axles are level (DESIGN.md §8a):
    // drop = stack − (head_tube + lower_stack + a2c)·sin h + offset·cos h, lower stack 0 (its
    // stated prior).
    let r = with("head_angle_deg", 45.0);
    let (code, field, msg) = only_error(&r);
    let h = 45f64.to_radians();
    let drop = 620.0 - (110.0 + 560.0) * h.sin() + 44.0 * h.cos();
    assert!((170.0..180.0).contains(&drop), "{drop}");
    // Beside the head angle the person typed, not on the blank BB drop; the values in play,
    // largest share first (head angle 203 mm, stack 45 mm, head tube 32 mm of the excess over
    // a typical bike's, see solve/blame.rs), in whole mm and tenths of a degree.
    assert_eq!(
        (code, field),
        ("impossible", "bikes[0].frame.head_angle_deg")
    );
    assert_eq!(
        msg,
        format!(
            "The published head tube angle 45.0°, stack 620 mm and head tube length 110 mm \
             together put the BB drop at {drop:.0} mm, which no frame can have (allowed \u{2212}150 to \
             150 mm); check the head tube angle first: of these it moves the BB drop most."
        )
    );
    // A wheelbase far longer than reach and fork allow: the rear centre (a solved unknown,
    // wheelbase − front centre) goes past 600 mm; only the wheelbase pushes it there.
    let mut s = base();
    s.bikes[0].frame.remove("chainstay_mm");
    s.bikes[0]
        .frame
        .insert("wheelbase_mm".into(), Published::Value(1700.0));
    let r = evaluate(&s);
    let (code, field, msg) = only_error(&r);
    assert_eq!((code, field), ("impossible", "bikes[0].frame.wheelbase_mm"));
    assert!(
        msg.starts_with(
            "With the other published numbers, the wheelbase 1700 mm puts the rear centre at "
        ) && msg.ends_with("which no frame can have (allowed 200 to 600 mm); check the wheelbase."),
        "{msg}"
    );
}

#[test]
fn a_report_never_holds_a_non_finite_number() {
    for v in [0.0, 1e300, -1e300, f64::MIN_POSITIVE, f64::NAN] {
        for key in [
            "reach_mm",
            "seat_angle_effective_deg",
            "trail_mm",
            "bb_height_mm",
        ] {
            let r = with(key, v);
            for b in &r.bikes {
                let all = b
                    .stock
                    .values()
                    .chain(b.ridden.values())
                    .chain(b.derived.values());
                assert!(all.clone().all(|x| x.is_finite()), "{key} = {v}");
                assert!(b
                    .residuals
                    .values()
                    .all(|x| x.solved.is_finite() && x.residual.is_finite()));
            }
            assert!(!r.bikes.is_empty() || !r.errors.is_empty());
        }
    }
}

proptest::proptest! {
    #![proptest_config(proptest::prelude::ProptestConfig {
        cases: 64,
        rng_seed: proptest::test_runner::RngSeed::Fixed(0xbad_1257),
        failure_persistence: None,
        ..proptest::prelude::ProptestConfig::default()
    })]

    /// Any values inside the hard ranges, any subset: a report or typed errors, never a panic
    /// and never a non-finite number.
    #[test]
    fn any_values_in_range_give_finite_numbers_or_errors(
        picks in proptest::collection::vec((0..20usize, 0.0..1.0f64), 0..14),
    ) {
        let mut s = base();
        s.bikes[0].frame.clear();
        for (i, t) in picks {
            let m = &framewise_kernel::CATALOGUE[i];
            let v = m.hard.0 + t * (m.hard.1 - m.hard.0);
            s.bikes[0].frame.insert(m.key.into(), Published::Value(v));
        }
        let r = evaluate(&s);
        proptest::prop_assert!(!r.bikes.is_empty() || !r.errors.is_empty());
        for b in &r.bikes {
            let all = b.stock.values().chain(b.ridden.values()).chain(b.derived.values());
            proptest::prop_assert!(all.clone().all(|x| x.is_finite()));
        }
    }
}
