//! Benchmarks: a full evaluate of one bike with a rider (frame solve, pose, cockpit, seat,
//! seated and standing postures, handling, checks), and one cockpit parts search.
//! Targets (issue 4): evaluate under 100 µs median, search under 1 ms. Run: `scripts/bench`.

#![allow(
    missing_docs,
    clippy::unwrap_used,
    clippy::expect_used,
    clippy::indexing_slicing
)]

use criterion::{criterion_group, criterion_main, Criterion};
use framewise_kernel::{evaluate, Scenario};
use std::hint::black_box;

fn scenario(target: bool) -> Scenario {
    let mut setup = serde_json::json!({
        "headset_upper_mm": 8, "spacers_mm": 10, "stem_stack_mm": 40, "stem_mm": 45,
        "stem_angle_deg": 0, "bar_rise_mm": 25, "bar_backsweep_deg": 8, "bar_upsweep_deg": 5,
        "bar_width_mm": 780, "crank_mm": 170, "saddle_height_mm": 735,
        "post_length_mm": 430, "post_min_insertion_mm": 100, "max_insertion_mm": 280 });
    if target {
        setup["target_grip_x_mm"] = serde_json::json!(440);
        setup["target_grip_y_mm"] = serde_json::json!(730);
    }
    serde_json::from_value(serde_json::json!({
        "rider": { "height_mm": 1780, "mass_kg": 74, "inseam_mm": 840 },
        "bikes": [{ "label": "bench",
            "frame": { "reach_mm": 470, "stack_mm": 635, "head_angle_deg": 65.0,
                       "head_tube_mm": 110, "headset_lower_mm": 12, "fork_a2c_mm": 561,
                       "fork_offset_mm": 44, "chainstay_mm": 435,
                       "seat_angle_actual_deg": 76.5, "seat_tube_mm": 430 },
            "wheels": { "front": "29x2.4", "rear": "29x2.4" },
            "setup": setup,
            "changes": { "fork_travel_mm": 150, "front_sag_pct": 20, "rear_travel_mm": 140,
                         "rear_sag_pct": 30 } }] }))
    .expect("bench scenario")
}

fn bench(c: &mut Criterion) {
    let plain = scenario(false);
    let report = evaluate(&plain);
    assert!(report.errors.is_empty() && report.bikes[0].outline.rider_standing.is_some());
    c.bench_function("evaluate one bike with a rider, seated and standing", |b| {
        b.iter(|| evaluate(black_box(&plain)))
    });
    // The page's path for an edit that leaves the frame numbers and stock wheels as they were.
    let mut memo = framewise_kernel::SolveMemo::default();
    c.bench_function(
        "evaluate one bike with a rider, frame solve remembered",
        |b| b.iter(|| framewise_kernel::evaluate_with(black_box(&plain), &mut memo)),
    );
    let mut frame_only = plain.clone();
    frame_only.rider = None;
    frame_only.bikes[0].setup = Default::default();
    c.bench_function("evaluate one bike, frame only (for comparison)", |b| {
        b.iter(|| evaluate(black_box(&frame_only)))
    });
    let with_target = scenario(true);
    c.bench_function(
        "evaluate one bike with a rider and a cockpit parts search",
        |b| b.iter(|| evaluate(black_box(&with_target))),
    );
}

/// The parts search alone, on a frame placed directly (no solve): the target is 1 ms.
fn search_alone(c: &mut Criterion) {
    use framewise_kernel::cockpit::{frame_x_axis, Bar, Cockpit};
    use framewise_kernel::{search, FrameParams, Radii};
    let p = FrameParams {
        rear_centre: 435.0,
        bb_drop: 30.0,
        reach: 470.0,
        stack: 635.0,
        head_angle: 65f64.to_radians(),
        head_tube: 110.0,
        headset_lower: 12.0,
        a2c: 561.0,
        offset: 44.0,
        seat_angle: 76.5f64.to_radians(),
        seat_axis_offset: 0.0,
        seat_tube: 430.0,
    };
    let g = p.geometry(Radii {
        front: 372.0,
        rear: 372.0,
    });
    let current = Cockpit {
        headset_upper: 8.0,
        spacers: 10.0,
        stem_stack: 40.0,
        stem: 45.0,
        stem_angle: 0.0,
        bar: Bar::Flat {
            rise: 25.0,
            backsweep: 8f64.to_radians(),
            upsweep: 5f64.to_radians(),
            width: 780.0,
            roll: 0.0,
        },
    };
    let target = nalgebra::Point2::new(440.0, 730.0);
    c.bench_function("cockpit parts search alone", |b| {
        b.iter(|| {
            search(
                &g,
                frame_x_axis(0.0),
                black_box(&current),
                black_box(target),
                40.0,
            )
        })
    });
}

criterion_group!(benches, bench, search_alone);
criterion_main!(benches);
