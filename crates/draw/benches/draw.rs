//! Benchmarks: the drawing of one evaluated bike with a rider in both postures (the page's
//! drawing on every edit): the SVG document, and the model with its patch list and structure
//! (what the page applies in place). Target (issue 5 point 5): a small share of the 16 ms
//! input-to-page budget. Run: `scripts/bench draw` or `cargo bench -p framewise-draw`.

#![allow(
    missing_docs,
    clippy::unwrap_used,
    clippy::expect_used,
    clippy::indexing_slicing
)]

use criterion::{criterion_group, criterion_main, Criterion};
use framewise_kernel::{evaluate, Scenario};
use std::hint::black_box;

/// An invented trail bike with a rider, a fork change and sag (ghost and ridden differ).
fn scenario() -> Scenario {
    serde_json::from_value(serde_json::json!({
        "rider": { "height_mm": 1780, "mass_kg": 74, "inseam_mm": 840 },
        "bikes": [{ "label": "bench",
            "frame": { "reach_mm": 470, "stack_mm": 635, "head_angle_deg": 65.0,
                       "head_tube_mm": 110, "headset_lower_mm": 12, "fork_a2c_mm": 561,
                       "fork_offset_mm": 44, "chainstay_mm": 435,
                       "seat_angle_actual_deg": 76.5, "seat_tube_mm": 430 },
            "wheels": { "front": "29x2.4", "rear": "29x2.4" },
            "setup": { "headset_upper_mm": 8, "spacers_mm": 10, "stem_stack_mm": 40,
                       "stem_mm": 45, "stem_angle_deg": 0, "bar_rise_mm": 25,
                       "crank_mm": 170, "saddle_height_mm": 735 },
            "changes": { "fork_travel_mm": 150, "front_sag_pct": 20, "rear_travel_mm": 140,
                         "rear_sag_pct": 30 } }] }))
    .expect("bench scenario")
}

fn bench(c: &mut Criterion) {
    let report = evaluate(&scenario());
    assert!(report.errors.is_empty(), "{:?}", report.errors);
    let bike = &report.bikes[0];
    assert!(bike.outline.rider_standing.is_some());
    c.bench_function("draw one bike with a rider: SVG document", |b| {
        b.iter(|| framewise_draw::draw_bike(black_box(bike)))
    });
    c.bench_function(
        "draw one bike with a rider: model, patch list and structure",
        |b| {
            b.iter(|| {
                let d = framewise_draw::drawing_of_bike(black_box(bike));
                black_box((d.patch().len(), d.structure()));
            })
        },
    );
    c.bench_function(
        "draw one bike with a rider: model, SVG, patch and structure",
        |b| {
            b.iter(|| {
                let d = framewise_draw::drawing_of_bike(black_box(bike));
                black_box((d.svg(), d.patch().len(), d.structure()));
            })
        },
    );
}

criterion_group!(benches, bench);
criterion_main!(benches);
