//! The grip point against an independent construction with `kurbo` (DESIGN.md §8a "Cockpit").
//!
//! Source: DESIGN.md §8a: stem clamp centre `T′ − d′·(headset_upper + spacers + stem_stack/2)`,
//! stem along `n′` turned up by the stem angle, grip `bar_pullback` behind and `bar_rise` above
//! the bar clamp in frame axes, read in the ridden axes (rotated by the re-pose θ).

// Test helpers may unwrap, index and panic, like the tests themselves (see clippy.toml).
#![allow(
    clippy::unwrap_used,
    clippy::expect_used,
    clippy::panic,
    clippy::indexing_slicing
)]

use framewise_kernel::{evaluate, Scenario};
use kurbo::{Affine, Point, Vec2};
use serde_json::json;

fn run(v: serde_json::Value) -> framewise_kernel::BikeReport {
    let s: Scenario = serde_json::from_value(v).unwrap();
    let r = evaluate(&s);
    assert!(r.errors.is_empty(), "{:?}", r.errors);
    r.bikes.into_iter().next().unwrap()
}

fn frame() -> serde_json::Value {
    json!({ "reach_mm": 470, "stack_mm": 635, "head_angle_deg": 65.0, "head_tube_mm": 110,
            "headset_lower_mm": 12, "fork_a2c_mm": 561, "fork_offset_mm": 44,
            "chainstay_mm": 435, "seat_angle_actual_deg": 76.5, "seat_tube_mm": 430 })
}

fn down(h: f64) -> Vec2 {
    Vec2::new(h.cos(), -h.sin())
}

/// The grip in frame axes for head top `t`, head angle `h` (radians) and the setup numbers.
fn grip_frame(
    t: Point,
    h: f64,
    stack_below: f64,
    stem: f64,
    angle: f64,
    pullback: f64,
    rise: f64,
) -> Point {
    let d = down(h);
    let n = Vec2::new(h.sin(), h.cos());
    let clamp = t - d * stack_below;
    let u = Affine::rotate(angle) * n.to_point();
    clamp + u.to_vec2() * stem + Vec2::new(-pullback, rise)
}

fn ridden_grip(b: &framewise_kernel::BikeReport) -> Point {
    Point::new(b.ridden["grip_x_mm"], b.ridden["grip_y_mm"])
}

#[test]
fn stock_grip_matches_kurbo() {
    let b = run(
        json!({ "bikes": [{ "frame": frame(), "wheels": { "front": "29x2.4", "rear": "29x2.4" },
        "setup": { "headset_upper_mm": 8, "spacers_mm": 10, "stem_stack_mm": 40, "stem_mm": 45,
                   "stem_angle_deg": 6, "bar_rise_mm": 25, "bar_pullback_mm": 30 } }] }),
    );
    let g = grip_frame(
        Point::new(470.0, 635.0),
        65f64.to_radians(),
        8.0 + 10.0 + 20.0,
        45.0,
        6f64.to_radians(),
        30.0,
        25.0,
    );
    let got = ridden_grip(&b);
    assert!((got - g).hypot() < 1e-6, "kurbo {g:?} kernel {got:?}");
    assert!((b.ridden["bb_to_grip_mm"] - g.to_vec2().hypot()).abs() < 1e-6);
    let angle = g.y.atan2(g.x).to_degrees();
    assert!((b.ridden["bb_to_grip_angle_deg"] - angle).abs() < 1e-6);
}

/// With angle cups and a longer fork the frame re-poses by θ; the head top moves to
/// `T′ = M − d′·ht/2` and the grip is the frame-axes construction rotated by θ about the BB.
#[test]
fn changed_grip_matches_kurbo() {
    let b = run(
        json!({ "bikes": [{ "frame": frame(), "wheels": { "front": "29x2.4", "rear": "29x2.4" },
        "setup": { "headset_upper_mm": 5, "spacers_mm": 20, "stem_stack_mm": 38, "stem_mm": 60,
                   "stem_angle_deg": -6, "bar_rise_mm": 40, "bar_pullback_mm": 15 },
        "changes": { "headset_angle_deg": -1.5, "fork_a2c_delta_mm": 20,
                     "wheels": { "rear": "27.5x2.5" } } }] }),
    );
    let h = 65f64.to_radians();
    let h2 = 63.5f64.to_radians();
    let t = Point::new(470.0, 635.0);
    let mid = t + down(h) * 55.0;
    let t2 = mid - down(h2) * 55.0;
    // Frame-axes axles: front from the changed fork, rear from the stock numbers.
    let crown = t2 + down(h2) * (110.0 + 12.0);
    let front = crown + down(h2) * (561.0 + 20.0) + Vec2::new(h2.sin(), h2.cos()) * 44.0;
    let rear = Point::new(-b.stock["rear_centre_mm"], b.stock["bb_drop_mm"]);
    let o = &b.outline;
    let ridden_axis = Vec2::new(
        o.front_axle[0] - o.rear_axle[0],
        o.front_axle[1] - o.rear_axle[1],
    );
    let theta = ridden_axis.atan2() - (front - rear).atan2();
    let g = grip_frame(
        t2,
        h2,
        5.0 + 20.0 + 19.0,
        60.0,
        (-6f64).to_radians(),
        15.0,
        40.0,
    );
    let expected = Affine::rotate(theta) * g;
    let got = ridden_grip(&b);
    assert!(
        (got - expected).hypot() < 1e-6,
        "kurbo {expected:?} kernel {got:?}"
    );
    // The rotated frame really is re-posed: the front axle agrees too.
    let f = Affine::rotate(theta) * front;
    assert!((f - Point::new(o.front_axle[0], o.front_axle[1])).hypot() < 1e-6);
}

/// The stated flat-bar model: ℓ = width/2 − 100 − 65; pullback ℓ·tan(backsweep), rise
/// + ℓ·tan(upsweep), then rolled (counter-clockwise in side view for a positive roll).
#[test]
fn flat_bar_model_matches_kurbo() {
    let b = run(
        json!({ "bikes": [{ "frame": frame(), "wheels": { "front": "29x2.4", "rear": "29x2.4" },
        "setup": { "headset_upper_mm": 8, "spacers_mm": 10, "stem_stack_mm": 40, "stem_mm": 45,
                   "bar_rise_mm": 20, "bar_backsweep_deg": 9, "bar_upsweep_deg": 5,
                   "bar_width_mm": 780, "bar_roll_deg": 4 } }] }),
    );
    let l = 390.0 - 165.0;
    let v = Vec2::new(
        -l * 9f64.to_radians().tan(),
        20.0 + l * 5f64.to_radians().tan(),
    );
    let rolled = (Affine::rotate(4f64.to_radians()) * v.to_point()).to_vec2();
    let g = grip_frame(
        Point::new(470.0, 635.0),
        65f64.to_radians(),
        38.0,
        45.0,
        0.0,
        -rolled.x,
        rolled.y,
    );
    assert!((ridden_grip(&b) - g).hypot() < 1e-6);
}

/// Drop bars: hoods `hood_reach` ahead and `hood_drop` below the clamp; drops half the bar
/// reach ahead and `bar_drop` below; tops at the clamp.
#[test]
fn drop_bar_hand_positions() {
    let with = |hand: &str| {
        let b = run(
            json!({ "bikes": [{ "frame": frame(), "wheels": { "front": "700x28c", "rear": "700x28c" },
            "setup": { "headset_upper_mm": 8, "spacers_mm": 10, "stem_stack_mm": 40, "stem_mm": 100,
                       "stem_angle_deg": -6, "bar_type": "drop", "bar_reach_mm": 80,
                       "bar_drop_mm": 125, "hood_reach_mm": 120, "hood_drop_mm": -15,
                       "hand_position": hand } }] }),
        );
        let clamp = Point::new(b.ridden["bar_clamp_x_mm"], b.ridden["bar_clamp_y_mm"]);
        ridden_grip(&b) - clamp
    };
    assert!((with("hoods") - Vec2::new(120.0, 15.0)).hypot() < 1e-6);
    assert!((with("drops") - Vec2::new(40.0, -125.0)).hypot() < 1e-6);
    assert!(with("tops").hypot() < 1e-6);
}
