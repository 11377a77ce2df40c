//! Statics of rider + bike: worked examples computed by hand from the textbook formulas, the
//! point load of DESIGN.md §8, toe clearance and pedal strike, and the centre of mass moving
//! forward with the saddle.
//!
//! Source: moment balance (Meriam & Kraige, *Engineering Mechanics: Statics*) [read as textbook
//! physics]; braking on a slope `a = g·(x_f/h·cos α + sin α)`: Riel, "Maximal Braking on a
//! Standard Bicycle", 2005 [read]; both as listed in /work/shared/REFERENCES.md.

// Test helpers may unwrap, index and panic, like the tests themselves (see clippy.toml).
#![allow(
    clippy::unwrap_used,
    clippy::expect_used,
    clippy::panic,
    clippy::indexing_slicing
)]

use framewise_kernel::handling::{combine, pedal_strike_lean, statics, toe_clearance, Support};
use framewise_kernel::rider::{Body, Overrides, BALL_FROM_HEEL};
use framewise_kernel::{evaluate, Scenario};
use nalgebra::Point2;
use proptest::prelude::*;
use serde_json::json;

fn close(a: f64, b: f64, tol: f64) {
    assert!((a - b).abs() <= tol, "expected {b}, got {a}");
}

/// Worked example: wheelbase 1000 mm, centre of mass 400 mm ahead of the rear contact and
/// 600 mm behind the front one, 1000 mm above the ground.
/// front share 400/1000 = 40 %; braking 0.5 g adds 0.5·1000/1000 = 50 % → 90 %;
/// rear lifts at 600/1000 = 0.6 g; uphill 10°: 0.6·cos 10° + sin 10° = 0.59088 + 0.17365 =
/// 0.76453 g; descent tip atan(0.6) = 30.964°; climb tip atan(0.4) = 21.801°.
#[test]
fn worked_example() {
    let s = Support {
        rear_x: -400.0,
        front_x: 600.0,
        ground_y: -300.0,
    };
    let n = statics(Point2::new(0.0, 700.0), &s, 90.0, 0.5, 10f64.to_radians()).unwrap();
    close(n["com_height_mm"], 1000.0, 1e-9);
    close(n["front_load_pct"], 40.0, 1e-9);
    close(n["front_load_braking_pct"], 90.0, 1e-9);
    close(n["pitch_over_decel_g"], 0.6, 1e-12);
    close(n["pitch_over_decel_slope_g"], 0.76453, 1e-5);
    close(n["front_tip_slope_deg"], 30.964, 1e-3);
    close(n["rear_tip_slope_deg"], 21.801, 1e-3);
}

/// [memory: *Bicycling Science*] a typical upright bicycle and rider pitch over near 0.5–0.6 g:
/// centre of mass ~1100 mm up and ~600 mm behind the front contact gives 0.55 g.
#[test]
fn typical_rider_pitches_over_near_half_a_g() {
    let s = Support {
        rear_x: -420.0,
        front_x: 620.0,
        ground_y: -280.0,
    };
    let n = statics(Point2::new(20.0, 820.0), &s, 85.0, 0.0, 0.0).unwrap();
    let g = n["pitch_over_decel_g"];
    assert!((0.5..=0.6).contains(&g), "{g}");
}

#[test]
fn centre_below_ground_has_no_statics() {
    let s = Support {
        rear_x: -400.0,
        front_x: 600.0,
        ground_y: -300.0,
    };
    assert!(statics(Point2::new(0.0, -400.0), &s, 80.0, 0.0, 0.0).is_none());
}

#[test]
fn combined_centre_is_the_mass_weighted_mean() {
    let c = combine(&[
        (75.0, Point2::new(-100.0, 800.0)),
        (25.0, Point2::new(200.0, 0.0)),
    ])
    .unwrap();
    close(c.x, (75.0 * -100.0 + 25.0 * 200.0) / 100.0, 1e-12);
    close(c.y, 600.0, 1e-12);
    assert!(combine(&[]).is_none());
}

/// Toe clearance against a brute-force walk of the toe tip round a whole crank turn (every
/// 0.1°), measuring its gap to the tyre circle each time.
#[test]
fn toe_clearance_matches_the_closed_form() {
    let b = Body::new(
        1750.0,
        70.0,
        Overrides {
            shoe_stack: Some(20.0),
            foot_position: Some(5.0),
            ..Default::default()
        },
    );
    let toe = nalgebra::Vector2::new(5.0 + b.foot * (1.0 - BALL_FROM_HEEL), 20.0);
    let front = Point2::new(640.0, 10.0);
    let expected = (0..3600)
        .map(|i| {
            let a = (f64::from(i) / 10.0).to_radians();
            let tip = Point2::new(172.5 * a.cos(), 172.5 * a.sin()) + toe;
            (tip - front).norm() - 350.0
        })
        .fold(f64::INFINITY, f64::min);
    close(toe_clearance(&b, 172.5, front, 350.0), expected, 0.01);
}

/// 16 CFR 1512.17(c) asks 25° of lean with the crank down. For BB height 300 mm, crank
/// 170 mm, pedal 10 mm below the spindle and 180 mm out: atan(120/180) = 33.690°.
#[test]
fn pedal_strike_lean_angle() {
    close(
        pedal_strike_lean(300.0, 170.0, 180.0).to_degrees(),
        33.690,
        1e-3,
    );
}

fn scenario(setback: f64, load: Option<serde_json::Value>) -> Scenario {
    let mut bike = json!({
        "frame": { "reach_mm": 470, "stack_mm": 635, "head_angle_deg": 65.0, "head_tube_mm": 110,
                   "headset_lower_mm": 12, "fork_a2c_mm": 561, "fork_offset_mm": 44,
                   "chainstay_mm": 435, "seat_angle_actual_deg": 76.5, "seat_tube_mm": 430 },
        "wheels": { "front": "29x2.4", "rear": "29x2.4" },
        "setup": { "headset_upper_mm": 8, "spacers_mm": 10, "stem_stack_mm": 40, "stem_mm": 45,
                   "bar_rise_mm": 25, "bar_pullback_mm": 30, "crank_mm": 170,
                   "saddle_height_mm": 740, "saddle_setback_mm": setback,
                   "bike_mass_kg": 14, "bike_com_x_mm": 150, "bike_com_y_mm": 200 } });
    if let Some(l) = load {
        bike["load"] = l;
    }
    serde_json::from_value(
        json!({ "rider": { "height_mm": 1780, "mass_kg": 74, "inseam_mm": 840 },
                                   "bikes": [bike] }),
    )
    .unwrap()
}

/// The load point of DESIGN.md §8 replaces the rider: the handling numbers follow §8a from the
/// load point and the ridden contacts alone.
#[test]
fn point_load_follows_the_definition() {
    let r = evaluate(&scenario(
        0.0,
        Some(json!({ "x_mm": 50, "y_mm": 800, "mass_kg": 90 })),
    ));
    assert!(r.errors.is_empty(), "{:?}", r.errors);
    let b = &r.bikes[0];
    let o = &b.outline;
    let h = 800.0 - o.ground_y;
    let (rx, fx) = (o.rear_axle[0], o.front_axle[0]);
    let n = &b.handling.load;
    close(n["front_load_pct"], 100.0 * (50.0 - rx) / (fx - rx), 1e-9);
    close(n["pitch_over_decel_g"], (fx - 50.0) / h, 1e-12);
    close(
        n["front_tip_slope_deg"],
        ((fx - 50.0) / h).atan().to_degrees(),
        1e-9,
    );
    close(
        n["rear_tip_slope_deg"],
        ((50.0 - rx) / h).atan().to_degrees(),
        1e-9,
    );
    assert!(b.handling.seated.is_empty() && b.outline.rider_seated.is_none());
}

proptest! {
    #![proptest_config(ProptestConfig::with_cases(32))]
    /// Moving the saddle forward (less setback) moves the seated centre of mass forward.
    #[test]
    fn com_moves_forward_with_the_saddle(setback in -20.0..60.0f64, step in 2.0..30.0f64) {
        let back = evaluate(&scenario(setback, None));
        let fwd = evaluate(&scenario(setback - step, None));
        let x = |r: &framewise_kernel::Report| r.bikes[0].handling.seated["com_x_mm"];
        prop_assert!(x(&fwd) > x(&back));
    }
}
