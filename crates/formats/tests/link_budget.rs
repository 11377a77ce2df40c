//! Link length budgets (issue 6): one bike with its setup and a rider in at most 120 characters
//! of fragment, four bikes and a rider in at most 400. Prints the measured length against the
//! information bound (`cargo test -p framewise-formats --test link_budget -- --nocapture`).
// Test helpers outside #[test] functions may unwrap, index and panic too (clippy.toml).
#![allow(
    clippy::unwrap_used,
    clippy::expect_used,
    clippy::panic,
    clippy::indexing_slicing
)]

mod link_common;

use framewise_formats::link::bound::information_bound_bits;
use framewise_formats::{decode_link, encode_link};
use framewise_kernel::Scenario;
use link_common::*;

/// Measured fragment length, payload bits (without the version and check bytes) and the bound.
fn measure(name: &str, s: &Scenario) -> usize {
    let frag = encode_link(s).unwrap();
    assert_eq!(&decode_link(&frag).unwrap(), s, "{name} round trip");
    let bytes = frag.len() * 6 / 8;
    let bound = information_bound_bits(s).unwrap();
    println!(
        "{name}: {} characters; payload {} bits (+16 version and check); bound {:.0} bits = {:.0} \
         characters with the 2 overhead bytes",
        frag.len(),
        (bytes - 2) * 8,
        bound,
        ((bound + 16.0) / 6.0).ceil()
    );
    // The bound is a bound: no code of these fields fits in fewer bits than it when values
    // spread over their ranges; ours must not be absurdly above it either.
    assert!(
        bound > 0.0 && ((bytes - 2) * 8) as f64 <= bound * 2.0,
        "{name}"
    );
    frag.len()
}

#[test]
fn one_bike_with_setup_and_rider_fits_in_120_characters() {
    // Source: issue 6 budget (a link short enough for a text message) [practice].
    let len = measure("one bike + setup + rider", &one_bike());
    assert!(len <= 120, "{len} characters");
}

#[test]
fn four_bikes_and_a_rider_fit_in_400_characters() {
    // Source: issue 6 budget [practice].
    let len = measure("four bikes + rider", &four_bikes());
    assert!(len <= 400, "{len} characters");
}

#[test]
fn the_design_example_with_changes_fits_in_120_characters() {
    // The scenario of DESIGN.md §8, with its changes block and view choices.
    let s = scenario(serde_json::json!({ "version": 1,
      "rider": { "height_mm": 1780, "mass_kg": 74, "inseam_mm": 840 },
      "bikes": [ { "label": "Demo trail bike, size 3",
                   "frame":   { "reach_mm": 470, "stack_mm": 625, "head_angle_deg": 65.0,
                                "head_tube_mm": 110, "fork_a2c_mm": 561, "fork_offset_mm": 44 },
                   "wheels":  { "front": "29x2.4", "rear": "62-584" },
                   "setup":   { "headset_upper_mm": 8, "spacers_mm": 10, "stem_stack_mm": 40,
                                "stem_mm": 45, "stem_angle_deg": 0, "bar_rise_mm": 25,
                                "bar_pullback_mm": 30, "crank_mm": 170, "saddle_height_mm": 735 },
                   "changes": { "fork_a2c_delta_mm": 10, "fork_offset_mm": 44,
                                "headset_angle_deg": -1.0, "wheels": { "rear": "27.5x2.5" },
                                "fork_travel_mm": 150,
                                "front_sag_pct": 20, "rear_travel_mm": 140, "rear_sag_pct": 30,
                                "pivot_x_mm": -20, "pivot_y_mm": 160 } } ],
      "view": { "align": "bb", "units": "mm" } }));
    let len = measure("design example with changes", &s);
    assert!(len <= 120, "{len} characters");
}
