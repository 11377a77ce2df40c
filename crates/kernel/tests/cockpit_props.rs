//! Properties of the cockpit: the grip moves monotonically with stem length and spacers, and the
//! inverse search finds the exact parts when the target came from catalogue parts.

// Test helpers may unwrap, index and panic, like the tests themselves (see clippy.toml).
#![allow(
    clippy::unwrap_used,
    clippy::expect_used,
    clippy::panic,
    clippy::indexing_slicing
)]

use framewise_kernel::cockpit::{frame_x_axis, Bar, Cockpit};
use framewise_kernel::parts::{
    search, stem_lengths_mm, BAR_BACKSWEEPS_DEG, BAR_RISES_MM, STEM_ANGLES_DEG,
};
use framewise_kernel::{FrameParams, Geometry, Radii};
use proptest::prelude::*;

fn geometry(head_deg: f64, theta: f64) -> Geometry {
    let p = FrameParams {
        rear_centre: 435.0,
        bb_drop: 30.0,
        reach: 470.0,
        stack: 630.0,
        head_angle: head_deg.to_radians(),
        head_tube: 110.0,
        headset_lower: 12.0,
        a2c: 560.0,
        offset: 44.0,
        seat_angle: 76f64.to_radians(),
        seat_axis_offset: 0.0,
        seat_tube: 430.0,
    };
    p.geometry(Radii {
        front: 372.0,
        rear: 372.0,
    })
    .rotated(theta)
}

fn cockpit(spacers: f64, stem: f64, angle_deg: f64, bar: Bar) -> Cockpit {
    Cockpit {
        headset_upper: 8.0,
        spacers,
        stem_stack: 40.0,
        stem,
        stem_angle: angle_deg.to_radians(),
        bar,
    }
}

proptest! {
    /// A longer stem moves the grip forward (along the stem, whose direction has a forward
    /// component for head angles 62–75° and stem angles within ±17°); more spacers move it up
    /// and back along the steering axis.
    #[test]
    fn grip_is_monotonic_in_stem_and_spacers(
        head in 62.0..75.0f64,
        theta in -0.03..0.03f64,
        angle in -17.0..17.0f64,
        stem in 30.0..130.0f64,
        extra in 1.0..30.0f64,
        spacers in 0.0..30.0f64,
        rise in 0.0..50.0f64,
        pullback in -20.0..60.0f64,
    ) {
        let g = geometry(head, theta);
        let fx = frame_x_axis(theta);
        let bar = Bar::Offset { rise, pullback };
        let a = cockpit(spacers, stem, angle, bar).points(&g, fx).grip;
        let longer = cockpit(spacers, stem + extra, angle, bar).points(&g, fx).grip;
        prop_assert!(longer.x > a.x);
        prop_assert!(((longer - a).norm() - extra).abs() < 1e-9);
        let higher = cockpit(spacers + extra, stem, angle, bar).points(&g, fx).grip;
        prop_assert!(higher.y > a.y && higher.x < a.x);
        prop_assert!(((higher - a).norm() - extra).abs() < 1e-9);
    }
}

proptest! {
    // Each case searches the whole catalogue; the brute-force check below is slow in debug.
    #![proptest_config(ProptestConfig::with_cases(64))]

    /// A target built from catalogue parts is found exactly: the best choice misses by
    /// (almost) nothing and the very parts are among the exact hits.
    #[test]
    fn inverse_returns_the_catalogue_parts(
        head in 63.0..74.0f64,
        theta in -0.03..0.03f64,
        s in 0u32..=8,
        stem_i in 0usize..23,
        angle_i in 0usize..7,
        rise_i in 0usize..9,
        sweep_i in 0usize..6,
    ) {
        let g = geometry(head, theta);
        let fx = frame_x_axis(theta);
        let stem = stem_lengths_mm().nth(stem_i).unwrap();
        let angle = STEM_ANGLES_DEG[angle_i];
        let rise = BAR_RISES_MM[rise_i];
        let sweep = BAR_BACKSWEEPS_DEG[sweep_i];
        let bar = |rise: f64, sweep: f64| Bar::Flat {
            rise,
            backsweep: sweep.to_radians(),
            upsweep: 5f64.to_radians(),
            width: 780.0,
            roll: 0.0,
        };
        let spacers = f64::from(s) * 5.0;
        let target = cockpit(spacers, stem, angle, bar(rise, sweep)).points(&g, fx).grip;
        // The search starts from different parts: only width, upsweep and roll are kept.
        let current = cockpit(0.0, 50.0, 0.0, bar(0.0, 0.0));
        let found = search(&g, fx, &current, target, 40.0);
        prop_assert!(!found.is_empty());
        prop_assert!(found[0].miss_mm < 1e-6);
        prop_assert!(found.windows(2).all(|w| w[0].miss_mm <= w[1].miss_mm));
        let hit = found.iter().any(|c| c.miss_mm < 1e-6
            && c.stem_mm == stem && c.stem_angle_deg == angle && c.spacers_mm == spacers
            && c.bar_rise_mm == rise && c.bar_backsweep_deg == Some(sweep));
        prop_assert!(hit, "parts not found: {:?}", &found[..3]);
    }
}

proptest! {
    #![proptest_config(ProptestConfig::with_cases(12))]
    /// The search walks each line of stems outward from the nearest stem; a brute-force pass over
    /// every combination finds the same ten smallest misses.
    #[test]
    fn search_equals_brute_force(
        head in 63.0..74.0f64,
        tx in 300.0..600.0f64,
        ty in 550.0..800.0f64,
        limit in 0.0..40.0f64,
    ) {
        let g = geometry(head, 0.0);
        let fx = frame_x_axis(0.0);
        let target = nalgebra::Point2::new(tx, ty);
        let current = cockpit(0.0, 50.0, 0.0, Bar::Offset { rise: 0.0, pullback: 20.0 });
        let found = search(&g, fx, &current, target, limit);
        let mut all = Vec::new();
        let mut s = 0.0;
        while s <= limit {
            for angle in STEM_ANGLES_DEG {
                for stem in stem_lengths_mm() {
                    for rise in BAR_RISES_MM {
                        let grip = cockpit(s, stem, angle, Bar::Offset { rise, pullback: 20.0 }).points(&g, fx).grip;
                        all.push((grip - target).norm());
                    }
                }
            }
            s += 5.0;
        }
        all.sort_by(f64::total_cmp);
        prop_assert_eq!(found.len(), 10);
        for (c, m) in found.iter().zip(all.iter()) {
            prop_assert!((c.miss_mm - m).abs() < 1e-9, "{} vs {}", c.miss_mm, m);
        }
    }
}

#[test]
fn search_respects_the_spacer_limit() {
    let g = geometry(66.0, 0.0);
    let fx = frame_x_axis(0.0);
    let current = cockpit(
        0.0,
        50.0,
        0.0,
        Bar::Offset {
            rise: 20.0,
            pullback: 0.0,
        },
    );
    // A target far above: the search would like many spacers but stops at the limit.
    let top = current.points(&g, fx).grip + nalgebra::Vector2::new(0.0, 300.0);
    let found = search(&g, fx, &current, top, 25.0);
    assert!(found.iter().all(|c| c.spacers_mm <= 25.0));
    assert!(found.iter().any(|c| c.spacers_mm == 25.0));
}
