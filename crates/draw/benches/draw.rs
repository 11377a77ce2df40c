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

/// The project's invented demo scenario (tests/scenarios/demo.json) with a fork change and sag,
/// so that the ghost and the ridden bike differ.
fn scenario() -> Scenario {
    let mut v: serde_json::Value =
        serde_json::from_str(include_str!("../../../tests/scenarios/demo.json")).expect("demo");
    v["bikes"][0]["changes"] = serde_json::json!({ "fork_travel_mm": 150, "front_sag_pct": 20,
        "rear_travel_mm": 140, "rear_sag_pct": 30 });
    serde_json::from_value(v).expect("bench scenario")
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
