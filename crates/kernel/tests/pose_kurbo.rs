//! The pose and every change (DESIGN.md §8a) recomputed independently with `kurbo` (points,
//! lines, rotations about a point) and a numerical re-pose, compared with the kernel's `ridden`
//! numbers and per-change `effects`. No kernel geometry code is used on the expected side.
//!
//! Source: DESIGN.md §8a (definitions); kurbo's `Affine::rotate_about` and `Line` for the maths.
#![allow(clippy::unwrap_used, clippy::indexing_slicing, clippy::panic)]

use framewise_kernel::{evaluate, Scenario};
use kurbo::{Affine, Line, Point, Vec2};
use std::collections::BTreeMap;

const DEG: f64 = std::f64::consts::PI / 180.0;

#[derive(Clone, Copy, Default)]
struct Changes {
    a2c_delta: f64,
    offset: Option<f64>,
    cups_deg: f64,
    r_front: Option<f64>,
    r_rear: Option<f64>,
    front_sag: f64,
    rear_rise: f64,
    pivot: Option<Point>,
}

// Stock frame (invented demo numbers), and wheels 29x2.4 front (311 + 60.96) and 27.5x2.6 rear
// (292 + 66.04): mixed wheels.
const REACH: f64 = 470.0;
const STACK: f64 = 630.0;
const HA: f64 = 64.5;
const HT: f64 = 115.0;
const HL: f64 = 11.0;
const A2C: f64 = 575.0;
const OFF: f64 = 44.0;
const CS: f64 = 440.0;
const SA: f64 = 77.0;
const SAO: f64 = -15.0;
const ST: f64 = 430.0;
const RF: f64 = 311.0 + 60.96;
const RR: f64 = 292.0 + 66.04;

fn dir_down(h_deg: f64) -> Vec2 {
    Vec2::new((h_deg * DEG).cos(), -(h_deg * DEG).sin())
}

fn normal(h_deg: f64) -> Vec2 {
    Vec2::new((h_deg * DEG).sin(), (h_deg * DEG).cos())
}

/// Independent ridden numbers for the changes.
fn expected(c: Changes) -> BTreeMap<&'static str, f64> {
    // Stock: T, fork, front axle; tyres on the ground fixes the BB drop; chainstay → rear centre.
    let t = Point::new(REACH, STACK);
    let d = dir_down(HA);
    let f_stock = t + d * (HT + HL + A2C) + normal(HA) * OFF;
    let drop = f_stock.y - (RF - RR);
    let rear = Point::new(-(CS * CS - drop * drop).sqrt(), drop);
    // Cups: rotate the steering axis about the head-tube midpoint (negative = slacker).
    let mid = t + d * (HT / 2.0);
    let cup = Affine::rotate_about(-c.cups_deg * DEG, mid);
    let t2 = cup * t;
    let h2 = HA + c.cups_deg;
    let d2 = dir_down(h2);
    let crown = t2 + d2 * (HT + HL);
    let mut front = crown + d2 * (A2C + c.a2c_delta) + normal(h2) * c.offset.unwrap_or(OFF);
    front -= d2 * c.front_sag;
    // Rear sag: straight up, or on the arc about the pivot (smaller rotation).
    let rear2 = match (c.rear_rise, c.pivot) {
        (0.0, _) => rear,
        (r, None) => Point::new(rear.x, rear.y + r),
        (r, Some(p)) => {
            let v = rear - p;
            let rho = v.hypot();
            let a0 = v.y.atan2(v.x);
            let s = ((rear.y + r - p.y) / rho).asin();
            let pick = [s - a0, std::f64::consts::PI - s - a0].map(|x| {
                (x + std::f64::consts::PI).rem_euclid(2.0 * std::f64::consts::PI)
                    - std::f64::consts::PI
            });
            let phi = if pick[0].abs() <= pick[1].abs() {
                pick[0]
            } else {
                pick[1]
            };
            Affine::rotate_about(phi, p) * rear
        }
    };
    let rf = c.r_front.unwrap_or(RF);
    let rr = c.r_rear.unwrap_or(RR);
    // Re-pose: rotate about the BB until the axle height difference equals rf − rr (Newton).
    let g = |th: f64| (Affine::rotate(th) * front).y - (Affine::rotate(th) * rear2).y - (rf - rr);
    let mut th = 0.0;
    for _ in 0..50 {
        let dg = (g(th + 1e-7) - g(th - 1e-7)) / 2e-7;
        th -= g(th) / dg;
    }
    let rot = Affine::rotate(th);
    let (t3, f3, r3) = (rot * t2, rot * front, rot * rear2);
    let d3 = rot * (t2 + d2) - t3;
    let ground = r3.y - rr;
    let axis = Line::new(t3, t3 + d3 * 2000.0);
    let ground_line = Line::new(Point::new(-3000.0, ground), Point::new(3000.0, ground));
    let gp = axis.crossing_point(ground_line).unwrap();
    // Seat axis: through (sao, 0), up (−cos a, sin a), rotated with the frame.
    let s0 = rot * Point::new(SAO, 0.0);
    let s1 = rot * (Point::new(SAO, 0.0) + Vec2::new(-(SA * DEG).cos(), (SA * DEG).sin()));
    let seat_axis = Line::new(s0 + (s0 - s1) * 3.0, s1 + (s1 - s0) * 3000.0);
    let at = |y: f64| {
        seat_axis
            .crossing_point(Line::new(Point::new(-3000.0, y), Point::new(3000.0, y)))
            .unwrap()
    };
    let mut m = BTreeMap::new();
    m.insert("reach_mm", t3.x);
    m.insert("stack_mm", t3.y);
    m.insert("head_angle_deg", (-d3.y).atan2(d3.x) / DEG);
    m.insert("front_centre_mm", f3.x);
    m.insert("rear_centre_mm", -r3.x);
    m.insert("wheelbase_mm", f3.x - r3.x);
    m.insert("bb_drop_mm", r3.y);
    m.insert("bb_height_mm", -ground);
    m.insert("chainstay_mm", r3.to_vec2().hypot());
    m.insert("trail_mm", gp.x - f3.x);
    m.insert("seat_angle_actual_deg", SA - th / DEG);
    m.insert("seat_axis_offset_mm", at(0.0).x);
    m.insert("top_tube_effective_mm", t3.x - at(t3.y).x);
    m
}

fn scenario(changes: serde_json::Value) -> Scenario {
    serde_json::from_value(serde_json::json!({
        "version": 1,
        "bikes": [{
            "label": "pose check",
            "frame": {
                "reach_mm": REACH, "stack_mm": STACK, "head_angle_deg": HA, "head_tube_mm": HT,
                "headset_lower_mm": HL, "fork_a2c_mm": A2C, "fork_offset_mm": OFF,
                "chainstay_mm": CS, "seat_angle_actual_deg": SA, "seat_axis_offset_mm": SAO,
                "seat_tube_mm": ST
            },
            "wheels": { "front": "29x2.4", "rear": "27.5x2.6" },
            "changes": changes
        }]
    }))
    .unwrap()
}

fn compare(label: &str, got: &framewise_kernel::report::Numbers, want: &BTreeMap<&str, f64>) {
    for (k, w) in want {
        let g = got.get(*k).copied().unwrap_or(f64::NAN);
        assert!(
            (g - w).abs() < 1e-6,
            "{label} {k}: kernel {g}, independent {w}"
        );
    }
}

#[test]
fn stock_pose_with_mixed_wheels() {
    let rep = evaluate(&scenario(serde_json::json!({})));
    assert!(rep.errors.is_empty(), "{:?}", rep.errors);
    let want = expected(Changes::default());
    compare("stock", &rep.bikes[0].stock, &want);
    compare("ridden", &rep.bikes[0].ridden, &want);
}

#[test]
fn every_change_alone_and_all_together() {
    let pivot = Point::new(-20.0, 160.0);
    let singles: [(&str, serde_json::Value, Changes); 6] = [
        (
            "fork",
            serde_json::json!({ "fork_a2c_delta_mm": 10, "fork_offset_mm": 51 }),
            Changes {
                a2c_delta: 10.0,
                offset: Some(51.0),
                ..Changes::default()
            },
        ),
        (
            "headset_cups",
            serde_json::json!({ "headset_angle_deg": -1.5 }),
            Changes {
                cups_deg: -1.5,
                ..Changes::default()
            },
        ),
        (
            "wheels",
            // Mixed the other way round: 27.5x2.5 front (292 + 63.5), 29x2.3 rear (311 + 58.42).
            serde_json::json!({ "wheels": { "front": "27.5x2.5", "rear": "29x2.3" } }),
            Changes {
                r_front: Some(292.0 + 63.5),
                r_rear: Some(311.0 + 58.42),
                ..Changes::default()
            },
        ),
        (
            "front_sag",
            serde_json::json!({ "fork_travel_mm": 160, "front_sag_pct": 20 }),
            Changes {
                front_sag: 32.0,
                ..Changes::default()
            },
        ),
        (
            "rear_sag",
            serde_json::json!({ "rear_travel_mm": 150, "rear_sag_pct": 30 }),
            Changes {
                rear_rise: 45.0,
                ..Changes::default()
            },
        ),
        (
            "rear_sag",
            serde_json::json!({ "rear_travel_mm": 150, "rear_sag_pct": 30,
                                "pivot_x_mm": pivot.x, "pivot_y_mm": pivot.y }),
            Changes {
                rear_rise: 45.0,
                pivot: Some(pivot),
                ..Changes::default()
            },
        ),
    ];
    let stock = expected(Changes::default());
    for (name, json, c) in &singles {
        let rep = evaluate(&scenario(json.clone()));
        assert!(rep.errors.is_empty(), "{name}: {:?}", rep.errors);
        let want = expected(*c);
        compare(name, &rep.bikes[0].ridden, &want);
        let effect = &rep.bikes[0].effects[*name];
        let delta: BTreeMap<&str, f64> = want.iter().map(|(k, v)| (*k, v - stock[k])).collect();
        compare(&format!("{name} effect"), effect, &delta);
    }
    let all = serde_json::json!({
        "fork_a2c_delta_mm": 10, "fork_offset_mm": 51, "headset_angle_deg": -1.5,
        "wheels": { "front": "27.5x2.5", "rear": "29x2.3" },
        "fork_travel_mm": 160, "front_sag_pct": 20,
        "rear_travel_mm": 150, "rear_sag_pct": 30, "pivot_x_mm": pivot.x, "pivot_y_mm": pivot.y
    });
    let rep = evaluate(&scenario(all));
    assert!(rep.errors.is_empty(), "{:?}", rep.errors);
    let want = expected(Changes {
        a2c_delta: 10.0,
        offset: Some(51.0),
        cups_deg: -1.5,
        r_front: Some(292.0 + 63.5),
        r_rear: Some(311.0 + 58.42),
        front_sag: 32.0,
        rear_rise: 45.0,
        pivot: Some(pivot),
    });
    compare("all", &rep.bikes[0].ridden, &want);
}
