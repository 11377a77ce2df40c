//! The solver's stand-ins for what a listing leaves out: a road listing without fork numbers
//! (reach, stack, head angle, head tube, BB drop) solves with the offset standing in and the
//! axle-to-crown from the BB drop, and an axle-to-crown nothing fixes fits the front wheel.
//!
//! Expected values are worked out here by plain trigonometry from DESIGN.md §8a, not by the
//! kernel: with equal wheels both axles are level, so
//! `bb_drop = stack − (head_tube + lower_stack + a2c)·sin h + offset·cos h`.
#![allow(clippy::unwrap_used, clippy::indexing_slicing, clippy::panic)]

use framewise_kernel::{solve, Given, Radii, Solution, SolveInput};
use std::collections::BTreeMap;

/// Outer radius of a 700x28c tyre: BSD 622 / 2 + 28 mm (section height = width from 28 mm).
/// Source: ISO 5775 outer radius estimate (REFERENCES.md, Wikipedia "ISO 5775") [read].
const ROAD_R: f64 = 622.0 / 2.0 + 28.0;
/// Outer radius of a 29x2.4 tyre: 622 / 2 + 2.4 × 25.4 mm (same source).
const TRAIL_R: f64 = 622.0 / 2.0 + 2.4 * 25.4;

fn given(values: &[(&str, f64)]) -> BTreeMap<String, Given> {
    values
        .iter()
        .map(|&(k, v)| {
            let tolerance = if k.ends_with("_deg") { 0.1 } else { 1.0 };
            (
                k.to_string(),
                Given {
                    value: v,
                    tolerance,
                },
            )
        })
        .collect()
}

fn run(values: &[(&str, f64)], r: f64, width: Option<f64>) -> Solution {
    let input = SolveInput {
        radii: Radii { front: r, rear: r },
        front_tyre_width_mm: width,
        seat_ref: None,
        field_prefix: "bikes[0].frame",
    };
    match solve(&given(values), input) {
        Ok(s) => s,
        Err(e) => panic!("{e}"),
    }
}

/// The road listing of the user review: reach, stack, head angle, head tube and BB drop.
const ROAD: [(&str, f64); 5] = [
    ("reach_mm", 385.0),
    ("stack_mm", 555.0),
    ("head_angle_deg", 72.0),
    ("head_tube_mm", 145.0),
    ("bb_drop_mm", 70.0),
];

fn underdetermined(sol: &Solution) -> &str {
    sol.warnings
        .iter()
        .find(|w| w.code == "underdetermined")
        .map_or("", |w| w.message.as_str())
}

#[test]
fn a_road_listing_without_fork_numbers_solves_the_a2c_from_the_bb_drop() {
    let sol = run(&ROAD, ROAD_R, Some(28.0));
    let p = sol.params;
    // The offset stands in at its typical 44 mm and says so; the BB drop then fixes the a2c
    // (lower headset stack at its stated prior, 0 mm).
    assert!((p.offset - 44.0).abs() < 1e-9, "offset {}", p.offset);
    assert!(p.headset_lower.abs() < 1e-9);
    let h = 72f64.to_radians();
    let a2c = (555.0 - 70.0 + 44.0 * h.cos()) / h.sin() - 145.0;
    assert!((p.a2c - a2c).abs() < 0.01, "a2c {} expected {a2c}", p.a2c);
    // 379 mm: a road fork's length. Road forks for 25–28 mm tyres measure about 365–400 mm
    // [practice, from memory]; the old order pinned a2c at 560 mm and put the offset at 600 mm.
    assert!((365.0..=400.0).contains(&p.a2c), "a2c {}", p.a2c);
    // BB height = tyre radius − BB drop (§8a, equal wheels): 339 − 70 = 269 mm, a road bike's
    // (about 260–280 mm [practice]).
    let bb_height = sol_number(&sol, "bb_height_mm", ROAD_R);
    assert!((bb_height - (ROAD_R - 70.0)).abs() < 0.01, "{bb_height}");
    // Wheelbase = rear centre (no chainstay given: the narrow tyre's stand-in, 415 mm; road
    // chainstays measure about 405–415 mm, gravel ones 415–430 mm [practice, from memory]) +
    // front centre `reach + (head_tube + a2c)·cos h + offset·sin h` (§8a); 1004 mm, inside the
    // 950–1050 mm of road bikes [practice].
    assert!(
        (p.rear_centre - 415.0).abs() < 1e-9,
        "rear centre {}",
        p.rear_centre
    );
    let wheelbase = sol_number(&sol, "wheelbase_mm", ROAD_R);
    let expected = 415.0 + 385.0 + (145.0 + a2c) * h.cos() + 44.0 * h.sin();
    assert!(
        (wheelbase - expected).abs() < 0.01,
        "{wheelbase} vs {expected}"
    );
    assert!((950.0..=1050.0).contains(&wheelbase), "{wheelbase}");
    let said = underdetermined(&sol);
    assert!(said.contains("fork offset 44 mm"), "{said}");
    assert!(!said.contains("axle-to-crown 5"), "{said}");
    assert!(
        said.contains(
            "rear centre 415 mm (a road or gravel bike's, as common for a 28 mm front tyre)"
        ),
        "{said}"
    );
    assert!(sol.residuals.values().all(|r| r.consistent));
}

/// A number of the solved frame in its stock pose.
fn sol_number(sol: &Solution, key: &str, r: f64) -> f64 {
    let g = sol.params.geometry(Radii { front: r, rear: r });
    g.measure()[key]
}

#[test]
fn a_road_chart_without_wheelbase_or_fork_numbers_solves() {
    // An invented road chart's size: no wheelbase, no fork numbers, a BB drop. Its effective
    // top tube agrees with reach, stack and effective seat angle within the rounding:
    // 382 + 550 / tan 73.5° = 544.9 → 545.
    let chart = [
        ("reach_mm", 382.0),
        ("stack_mm", 550.0),
        ("head_angle_deg", 72.0),
        ("seat_angle_effective_deg", 73.5),
        ("top_tube_effective_mm", 545.0),
        ("chainstay_mm", 408.0),
        ("bb_drop_mm", 72.0),
        ("seat_tube_mm", 500.0),
        ("head_tube_mm", 140.0),
    ];
    let sol = run(&chart, ROAD_R, Some(28.0));
    let p = sol.params;
    assert!((p.offset - 44.0).abs() < 1e-9);
    let h = 72f64.to_radians();
    let a2c = (550.0 - 72.0 + 44.0 * h.cos()) / h.sin() - 140.0;
    // Within 1 mm: the fit shares the rounding of the published values among them.
    assert!((p.a2c - a2c).abs() < 1.0, "a2c {} expected {a2c}", p.a2c);
    assert!((365.0..=400.0).contains(&p.a2c), "a2c {}", p.a2c);
    // Rear centre from chainstay and BB drop: √(408² − 72²) (Pythagoras, §8a).
    let rc = (408.0f64.powi(2) - 72.0f64.powi(2)).sqrt();
    assert!((p.rear_centre - rc).abs() < 1.0, "{}", p.rear_centre);
    let wheelbase = sol_number(&sol, "wheelbase_mm", ROAD_R);
    let expected = rc + 382.0 + (140.0 + a2c) * h.cos() + 44.0 * h.sin();
    assert!(
        (wheelbase - expected).abs() < 2.0,
        "{wheelbase} vs {expected}"
    );
    assert!((950.0..=1050.0).contains(&wheelbase), "{wheelbase}");
    assert!(sol.residuals.values().all(|r| r.consistent));
}

#[test]
fn an_a2c_nothing_fixes_fits_a_narrow_tyre_with_a_rigid_fork() {
    // Before the BB drop is typed nothing fixes the fork: a rigid fork for a 28 mm tyre,
    // tyre radius + 35 mm [practice] = 374 mm, not the trail bike's 560 mm.
    let sol = run(&ROAD[..4], ROAD_R, Some(28.0));
    assert!(
        (sol.params.a2c - (ROAD_R + 35.0)).abs() < 1e-9,
        "{}",
        sol.params.a2c
    );
    let said = underdetermined(&sol);
    assert!(
        said.contains("fork axle-to-crown 374 mm (a rigid fork, as common for a 28 mm front tyre)"),
        "{said}"
    );
    // BB height = radius − drop, drop from §8a with both fork numbers standing in: 270 mm, a
    // road bike's [practice].
    let h = 72f64.to_radians();
    let drop = 555.0 - (145.0 + ROAD_R + 35.0) * h.sin() + 44.0 * h.cos();
    let bb_height = sol_number(&sol, "bb_height_mm", ROAD_R);
    assert!((bb_height - (ROAD_R - drop)).abs() < 0.01, "{bb_height}");
    assert!((250.0..=290.0).contains(&bb_height), "{bb_height}");
}

#[test]
fn an_a2c_nothing_fixes_fits_a_wide_tyre_with_a_suspension_fork() {
    // A 61 mm (2.4 in) tyre: a suspension fork of about 150 mm travel, radius + 190 mm
    // [practice, from memory] = 562 mm; without a width (only a diameter) the same.
    for width in [Some(2.4 * 25.4), None] {
        let sol = run(&ROAD[..4], TRAIL_R, width);
        assert!(
            (sol.params.a2c - (TRAIL_R + 190.0)).abs() < 1e-9,
            "{}",
            sol.params.a2c
        );
        let said = underdetermined(&sol);
        assert!(
            said.contains("fork axle-to-crown 562 mm (a suspension fork of about 150 mm travel"),
            "{said}"
        );
    }
}

fn solved_frame_caution(sol: &Solution) -> Option<&str> {
    sol.warnings
        .iter()
        .find(|w| w.code == "caution_solved_frame")
        .map(|w| w.message.as_str())
}

#[test]
fn a_solved_frame_no_bike_has_is_cautioned_naming_the_stand_in_fork() {
    // The user review: reach 475, stack 475, head angle 65 and nothing else, 29x2.4 tyres. The
    // stand-ins (said in the `underdetermined` warning): head tube 110 mm, lower stack 0, offset
    // 44 mm, a2c = radius + 190 mm. By §8a the BB is 115 mm above the axles:
    let h = 65f64.to_radians();
    let drop = 475.0 - (110.0 + TRAIL_R + 190.0) * h.sin() + 44.0 * h.cos();
    assert!((drop + 115.41).abs() < 0.01, "{drop}");
    let frame = [
        ("reach_mm", 475.0),
        ("stack_mm", 475.0),
        ("head_angle_deg", 65.0),
    ];
    let sol = run(&frame, TRAIL_R, Some(2.4 * 25.4));
    assert!(
        (sol.params.bb_drop - drop).abs() < 0.01,
        "{}",
        sol.params.bb_drop
    );
    // Ranges: the catalogue's plausible ones (BB drop −30 to 85 mm, BB height 240 to 380 mm);
    // BB height = radius − drop = 371.96 + 115.41 = 487 mm.
    assert_eq!(
        solved_frame_caution(&sol),
        Some(
            "The solved frame is unusual: BB drop −115 mm (most bikes: −30 to 85 mm), BB height \
             487 mm (most bikes: 240 to 380 mm). The stand-in fork is the likely cause: enter Fork \
             axle-to-crown."
        )
    );
    // With a published rigid fork of 400 mm: drop = 475 − 510 sin 65° + 44 cos 65° = 31 mm, a
    // frame bikes have: no caution.
    let mut with_fork = frame.to_vec();
    with_fork.push(("fork_a2c_mm", 400.0));
    let sol = run(&with_fork, TRAIL_R, Some(2.4 * 25.4));
    assert!(
        (sol.params.bb_drop - 31.38).abs() < 0.01,
        "{}",
        sol.params.bb_drop
    );
    assert_eq!(solved_frame_caution(&sol), None);
}

#[test]
fn a_wheelbase_out_of_range_names_the_stand_in_rear_centre_it_depends_on() {
    // An invented long-travel frame in its largest size: the whole front published, nothing of
    // the rear, 29x2.4 tyres. The rear centre stands in at a trail bike's 435 mm (said in the
    // `underdetermined` warning). By §8a, with equal wheels (axles level, lower stack 0 by its
    // prior):
    //   front centre = reach + (head_tube + a2c)·cos h + offset·sin h
    //                = 540 + 720 cos 61° + 44 sin 61° = 927.55 mm,
    //   wheelbase    = front centre + rear centre = 927.55 + 435 = 1362.55 mm.
    let h = 61f64.to_radians();
    let front_centre = 540.0 + (130.0 + 590.0) * h.cos() + 44.0 * h.sin();
    assert!((front_centre - 927.55).abs() < 0.01, "{front_centre}");
    let frame = [
        ("reach_mm", 540.0),
        ("stack_mm", 650.0),
        ("head_angle_deg", 61.0),
        ("head_tube_mm", 130.0),
        ("fork_a2c_mm", 590.0),
        ("fork_offset_mm", 44.0),
    ];
    let sol = run(&frame, TRAIL_R, Some(2.4 * 25.4));
    assert!((sol.params.rear_centre - 435.0).abs() < 1e-9);
    let wheelbase = sol_number(&sol, "wheelbase_mm", TRAIL_R);
    assert!(
        (wheelbase - (front_centre + 435.0)).abs() < 0.01,
        "{wheelbase}"
    );
    // Both leave the catalogue's plausible ranges (front centre 550 to 900 mm, wheelbase 950 to
    // 1350 mm). The rear centre moves only the wheelbase, and the front centre is out of range
    // without it: the stand-in is named as what the wheelbase also depends on, with its length
    // and the measurement that replaces it, not as the cause. Labels inside the sentence are in
    // lower case.
    assert_eq!(
        solved_frame_caution(&sol),
        Some(
            "The solved frame is unusual: front centre 928 mm (most bikes: 550 to 900 mm), \
             wheelbase 1363 mm (most bikes: 950 to 1350 mm). The wheelbase also depends on the \
             stand-in rear centre of 435 mm: enter Chainstay."
        )
    );
    // With a published chainstay of 445 mm the rear centre is this frame's, √(445² − drop²)
    // with drop = stack − (head_tube + a2c)·sin h + offset·cos h = 41.61 mm (§8a): 443.05 mm,
    // the wheelbase 1370.6 mm. Still unusual, but no stand-in is named.
    let drop = 650.0 - (130.0 + 590.0) * h.sin() + 44.0 * h.cos();
    let rc = (445.0f64.powi(2) - drop.powi(2)).sqrt();
    assert!((rc - 443.05).abs() < 0.01, "{rc}");
    let mut with_chainstay = frame.to_vec();
    with_chainstay.push(("chainstay_mm", 445.0));
    let sol = run(&with_chainstay, TRAIL_R, Some(2.4 * 25.4));
    let wheelbase = sol_number(&sol, "wheelbase_mm", TRAIL_R);
    assert!(
        (wheelbase - (front_centre + rc)).abs() < 0.01,
        "{wheelbase}"
    );
    assert_eq!(
        solved_frame_caution(&sol),
        Some(
            "The solved frame is unusual: front centre 928 mm (most bikes: 550 to 900 mm), \
             wheelbase 1371 mm (most bikes: 950 to 1350 mm)."
        )
    );
}

#[test]
fn the_stand_in_fork_is_not_called_the_cause_when_no_fork_of_most_bikes_would_clear_it() {
    // A listing with a misprinted reach (680 for 480 mm), no fork length and no rear: the stand-in
    // fork (29x2.4: a2c = radius + 190 = 561.96 mm) and rear centre (435 mm) are used. By §8a
    // with equal wheels (lower stack 0 by its prior):
    //   front centre = reach + (head_tube + a2c)·cos h + offset·sin h
    //                = 680 + 691.96 cos 61° + 44 sin 61° = 1053.95 mm, wheelbase 1488.95 mm;
    //   BB drop = stack − (head_tube + a2c)·sin h + offset·cos h = 66.13 mm (inside its range);
    //   effective top tube = reach + stack / tan(seat angle) = 680 + 650 / tan 75° = 854.17 mm
    //   (the seat angle's stand-in of 75°, which no fork moves).
    // The shortest fork of most bikes (catalogue fork_a2c_mm: 340 mm) still leaves the front
    // centre at 680 + 470 cos 61° + 44 sin 61° = 946.34 mm, over 900: the fork moves both
    // unusual values but cannot be their cause; the sentence says they depend on it, with its
    // length, as for the rear centre. (Before, any fork that moved them was "the likely cause".)
    let h = 61f64.to_radians();
    let fc = |a2c: f64| 680.0 + (130.0 + a2c) * h.cos() + 44.0 * h.sin();
    assert!(
        (fc(TRAIL_R + 190.0) - 1053.95).abs() < 0.01,
        "{}",
        fc(TRAIL_R + 190.0)
    );
    assert!((fc(340.0) - 946.34).abs() < 0.01, "{}", fc(340.0));
    let frame = [
        ("reach_mm", 680.0),
        ("stack_mm", 650.0),
        ("head_angle_deg", 61.0),
        ("head_tube_mm", 130.0),
        ("fork_offset_mm", 44.0),
    ];
    let sol = run(&frame, TRAIL_R, Some(2.4 * 25.4));
    let wheelbase = sol_number(&sol, "wheelbase_mm", TRAIL_R);
    assert!(
        (wheelbase - (fc(TRAIL_R + 190.0) + 435.0)).abs() < 0.01,
        "{wheelbase}"
    );
    assert_eq!(
        solved_frame_caution(&sol),
        Some(
            "The solved frame is unusual: front centre 1054 mm (most bikes: 550 to 900 mm), \
             wheelbase 1489 mm (most bikes: 950 to 1350 mm), effective top tube 854 mm (most \
             bikes: 450 to 720 mm). The front centre and wheelbase also \
             depend on the stand-in fork axle-to-crown of 562 mm: enter Fork axle-to-crown. The \
             wheelbase also depends on the stand-in rear centre of 435 mm: enter Chainstay."
        )
    );
    // The reach as printed on the next size (480 mm): the front centre 853.95 mm, the wheelbase
    // 1288.95 mm and the effective top tube 654.17 mm are a bike's: no caution at all.
    let mut fixed = frame.to_vec();
    fixed[0] = ("reach_mm", 480.0);
    let sol = run(&fixed, TRAIL_R, Some(2.4 * 25.4));
    assert_eq!(solved_frame_caution(&sol), None);
}

#[test]
fn a_fork_that_clears_one_value_only_by_pushing_out_another_is_not_the_cause() {
    // 29x2.4, head angle 61°, head tube 130, offset 44, reach 546, stack 644, nothing else: the
    // stand-in fork of 561.96 mm and rear centre of 435 mm. By §8a (equal wheels):
    //   front centre = 546 + 691.96 cos 61° + 44 sin 61° = 919.95 mm (most bikes: ≤ 900),
    //   wheelbase = 919.95 + 435 = 1354.95 mm (≤ 1350),
    //   BB drop = 644 − 691.96 sin 61° + 44 cos 61° = 60.13 mm (−30 to 85: usual).
    // The front centre comes to 900 mm only with a fork of at most
    // (900 − 546 − 44 sin 61°) / cos 61° − 130 = 520.8 mm, and at 520 mm the BB drop is
    // 644 − 650 sin 61° + 44 cos 61° = 96.83 mm, over 85; a shorter fork raises it further.
    // No fork of most bikes makes this frame usual, so the fork is not "the likely cause".
    let h = 61f64.to_radians();
    let fc = |a2c: f64| 546.0 + (130.0 + a2c) * h.cos() + 44.0 * h.sin();
    let drop = |a2c: f64| 644.0 - (130.0 + a2c) * h.sin() + 44.0 * h.cos();
    assert!(
        (fc(TRAIL_R + 190.0) - 919.95).abs() < 0.01,
        "{}",
        fc(TRAIL_R + 190.0)
    );
    assert!(
        (drop(TRAIL_R + 190.0) - 60.13).abs() < 0.01,
        "{}",
        drop(TRAIL_R + 190.0)
    );
    assert!(
        fc(520.0) < 900.0 && fc(525.0) > 900.0,
        "{} {}",
        fc(520.0),
        fc(525.0)
    );
    assert!((drop(520.0) - 96.83).abs() < 0.01, "{}", drop(520.0));
    let frame = [
        ("reach_mm", 546.0),
        ("stack_mm", 644.0),
        ("head_angle_deg", 61.0),
        ("head_tube_mm", 130.0),
        ("fork_offset_mm", 44.0),
    ];
    let sol = run(&frame, TRAIL_R, Some(2.4 * 25.4));
    assert_eq!(
        solved_frame_caution(&sol),
        Some(
            "The solved frame is unusual: front centre 920 mm (most bikes: 550 to 900 mm), \
             wheelbase 1355 mm (most bikes: 950 to 1350 mm). The front centre and wheelbase also \
             depend on the stand-in fork axle-to-crown of 562 mm: enter Fork axle-to-crown. The \
             wheelbase also depends on the stand-in rear centre of 435 mm: enter Chainstay."
        )
    );
}
