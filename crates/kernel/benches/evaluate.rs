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

/// The project's invented demo scenario (tests/scenarios/demo.json) with a fork change and sag,
/// a flat bar's sweep and width, and (`target`) a grip point for the cockpit parts search.
fn scenario(target: bool) -> Scenario {
    let mut v: serde_json::Value =
        serde_json::from_str(include_str!("../../../tests/scenarios/demo.json")).expect("demo");
    let bike = &mut v["bikes"][0];
    bike["changes"] = serde_json::json!({ "fork_travel_mm": 150, "front_sag_pct": 20,
        "rear_travel_mm": 140, "rear_sag_pct": 30 });
    bike["setup"]["bar_backsweep_deg"] = serde_json::json!(8);
    bike["setup"]["bar_upsweep_deg"] = serde_json::json!(5);
    bike["setup"]["bar_width_mm"] = serde_json::json!(780);
    if target {
        bike["setup"]["target_grip_x_mm"] = serde_json::json!(440);
        bike["setup"]["target_grip_y_mm"] = serde_json::json!(730);
    }
    serde_json::from_value(v).expect("bench scenario")
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
