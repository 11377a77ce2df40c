//! Benchmarks: solve + pose of a typical 12-value published set, and a pose-only update.
//! Run with `scripts/bench` (target: solve + pose under 50 µs median, DESIGN issue 3).
#![allow(missing_docs)]

use criterion::{criterion_group, criterion_main, Criterion};
use framewise_kernel::{pose, solve, ChangeSet, Given, Radii, SolveInput};
use nalgebra::Point2;
use std::collections::BTreeMap;
use std::hint::black_box;

/// A typical sheet: 12 values, rounded as published (invented demo numbers).
fn published() -> BTreeMap<String, Given> {
    [
        ("reach_mm", 470.0, 1.0),
        ("stack_mm", 625.0, 1.0),
        ("head_angle_deg", 65.0, 0.1),
        ("head_tube_mm", 110.0, 1.0),
        ("fork_a2c_mm", 570.0, 1.0),
        ("fork_offset_mm", 44.0, 1.0),
        ("chainstay_mm", 436.0, 1.0),
        ("bb_drop_mm", 27.0, 1.0),
        ("seat_angle_effective_deg", 76.0, 0.1),
        ("top_tube_effective_mm", 626.0, 1.0),
        ("seat_tube_mm", 430.0, 1.0),
        ("wheelbase_mm", 1232.0, 1.0),
    ]
    .into_iter()
    .map(|(k, value, tolerance)| (k.to_string(), Given { value, tolerance }))
    .collect()
}

fn changes(radii: Radii, offset: f64) -> ChangeSet {
    ChangeSet {
        radii,
        a2c_delta: 10.0,
        offset,
        cup_angle: (-1.0f64).to_radians(),
        front_sag: 30.0,
        rear_sag: 42.0,
        pivot: Some(Point2::new(-20.0, 160.0)),
    }
}

fn bench(c: &mut Criterion) {
    let given = published();
    let radii = Radii {
        front: 372.0,
        rear: 372.0,
    };
    let input = SolveInput {
        radii,
        front_tyre_width_mm: Some(60.96),
        seat_ref: None,
        field_prefix: "bikes[0].frame",
    };
    c.bench_function("solve + pose (12 published values)", |b| {
        b.iter(|| {
            let sol = solve(black_box(&given), input).ok();
            sol.map(|s| pose(&s.params, radii, &changes(radii, s.params.offset)))
        })
    });
    let Ok(sol) = solve(&given, input) else {
        return;
    };
    let ch = changes(radii, sol.params.offset);
    c.bench_function("pose only", |b| {
        b.iter(|| pose(black_box(&sol.params), radii, black_box(&ch)))
    });
}

criterion_group! {
    name = benches;
    config = Criterion::default()
        .warm_up_time(std::time::Duration::from_millis(500))
        .measurement_time(std::time::Duration::from_secs(3));
    targets = bench
}
criterion_main!(benches);
