//! Seated and standing postures: joint angles against the law of cosines, the standing balance,
//! and one test per kind of position the body cannot reach.
//!
//! Source: law of cosines (any trigonometry text); the body model of REFERENCES.md "Human body
//! segments" (Winter 2009, Fig. 4.1 and Table 4.1).

// Test helpers may unwrap, index and panic, like the tests themselves (see clippy.toml).
#![allow(
    clippy::unwrap_used,
    clippy::expect_used,
    clippy::panic,
    clippy::indexing_slicing
)]

use framewise_kernel::posture::foot_on_pedal;
use framewise_kernel::rider::{Body, Overrides};
use framewise_kernel::seated::{seated, Contacts, SEATED_TOE_DOWN_DEG};
use framewise_kernel::standing::{standing, Stance};
use framewise_kernel::{evaluate, Scenario};
use nalgebra::Point2;
use serde_json::json;

fn body() -> Body {
    Body::new(
        1780.0,
        74.0,
        Overrides {
            inseam: Some(840.0),
            ..Default::default()
        },
    )
}

fn contacts(saddle_y: f64, grip: Point2<f64>) -> Contacts {
    Contacts {
        saddle: Point2::new(-175.0, saddle_y),
        grip,
        crank: 170.0,
        elbow_bend: 20f64.to_radians(),
    }
}

/// Knee flexion at bottom dead centre = 180° − acos((t² + s² − D²)/2ts), D the hip–ankle
/// distance; the elbow angle is 180° − the stated bend; the shoulder is `torso` from the hip and
/// `√(u² + f² + 2uf·cos bend)` from the grip.
#[test]
fn seated_angles_follow_the_law_of_cosines() {
    let b = body();
    let c = contacts(720.0, Point2::new(470.0, 700.0));
    let p = seated(&b, &c);
    assert!(p.warnings.is_empty(), "{:?}", p.warnings);
    let hip = Point2::new(-175.0, 720.0 + b.hip_above_saddle);
    let ankle = foot_on_pedal(
        &b,
        Point2::new(0.0, -170.0),
        SEATED_TOE_DOWN_DEG.to_radians(),
    )
    .ankle;
    let d = (ankle - hip).norm();
    let knee = ((b.thigh.powi(2) + b.shank.powi(2) - d * d) / (2.0 * b.thigh * b.shank)).acos();
    let flexion = 180.0 - knee.to_degrees();
    assert!((p.numbers["knee_flexion_bdc_deg"] - flexion).abs() < 1e-9);
    assert!((p.numbers["elbow_angle_deg"] - 160.0).abs() < 1e-9);
    let sh = Point2::new(p.numbers["shoulder_x_mm"], p.numbers["shoulder_y_mm"]);
    assert!(((sh - hip).norm() - b.torso).abs() < 1e-9);
    let (u, f) = (b.upper_arm, b.forearm_to_grip());
    let span = (u * u + f * f + 2.0 * u * f * 20f64.to_radians().cos()).sqrt();
    assert!(((sh - c.grip).norm() - span).abs() < 1e-9);
    let torso = (sh.y - hip.y).atan2(sh.x - hip.x).to_degrees();
    assert!((p.numbers["torso_angle_deg"] - torso).abs() < 1e-9);
    assert!(p.figure.is_some() && p.com.is_some());
}

/// Standing: the body's centre of mass ends straight above the midpoint of the balls of the
/// feet, and the hip height is the stated knee bend's (hip midway between the ankles).
#[test]
fn standing_balances_over_the_feet() {
    let b = body();
    let s = Stance {
        grip: Point2::new(470.0, 700.0),
        crank: 170.0,
        knee_bend: 30f64.to_radians(),
        torso_angle: 40f64.to_radians(),
        ground_y: -340.0,
    };
    let p = standing(&b, &s);
    assert!(p.warnings.is_empty(), "{:?}", p.warnings);
    let fig = p.figure.unwrap();
    let [f0, f1] = fig.feet;
    assert!((p.com.unwrap().x - (f0.ball.x + f1.ball.x) / 2.0).abs() < 1e-6);
    let half = (f0.ankle.x - f1.ankle.x).abs() / 2.0;
    let span = b.leg_span(30f64.to_radians());
    let hip_y = f0.ankle.y + (span * span - half * half).sqrt();
    assert!((fig.hip.y - hip_y).abs() < 1e-9);
    assert!((p.numbers["hip_height_mm"] - (hip_y + 340.0)).abs() < 1e-9);
    let room = b.arm_reach() - (s.grip - fig.shoulder).norm();
    assert!((p.numbers["arm_extension_room_mm"] - room).abs() < 1e-9);
}

/// The standing hip found by the bracketed regula falsi is the one a plain 60-step bisection finds
/// (the method used before), to 1e-6 mm, for several stances; every standing number agrees to
/// 1e-6. The figure is rebuilt here from the stated model (shoulder at the torso angle, elbow and
/// knees by the law of cosines) without the kernel's posture code.
/// Source: bisection of a bracketed root (any numerical analysis text); the body model of
/// REFERENCES.md "Human body segments".
#[test]
fn standing_hip_matches_a_plain_bisection() {
    use framewise_kernel::posture::{two_link, Figure};
    let b = body();
    for (gx, gy, bend, torso) in [
        (470.0, 700.0, 30.0, 40.0),
        (440.0, 720.0, 30.0, 35.0),
        (500.0, 680.0, 35.0, 45.0),
        (460.0, 740.0, 40.0, 50.0),
    ] {
        let s = Stance {
            grip: Point2::new(gx, gy),
            crank: 170.0,
            knee_bend: f64::to_radians(bend),
            torso_angle: f64::to_radians(torso),
            ground_y: -340.0,
        };
        let feet = [
            foot_on_pedal(&b, Point2::new(170.0, 0.0), 0.0),
            foot_on_pedal(&b, Point2::new(-170.0, 0.0), 0.0),
        ];
        let half = (feet[0].ankle.x - feet[1].ankle.x).abs() / 2.0;
        let span = b.leg_span(s.knee_bend);
        let hip_y = (feet[0].ankle.y + feet[1].ankle.y) / 2.0 + (span * span - half * half).sqrt();
        let target = (feet[0].ball.x + feet[1].ball.x) / 2.0;
        // Out of reach (far from the balance, inside the bracket): the limb points straight at
        // its end.
        let limb = |p: Point2<f64>, q: Point2<f64>, a: f64, c: f64, side: f64| {
            two_link(p, q, a, c, side).unwrap_or_else(|_| p + (q - p).normalize() * a)
        };
        let excess = |x: f64| {
            let hip = Point2::new(x, hip_y);
            let shoulder =
                hip + nalgebra::Vector2::new(s.torso_angle.cos(), s.torso_angle.sin()) * b.torso;
            let fig = Figure {
                hip,
                shoulder,
                elbow: limb(shoulder, s.grip, b.upper_arm, b.forearm_to_grip(), -1.0),
                grip: s.grip,
                knees: [
                    limb(hip, feet[0].ankle, b.thigh, b.shank, 1.0),
                    limb(hip, feet[1].ankle, b.thigh, b.shank, 1.0),
                ],
                feet,
            };
            fig.centre_of_mass(&b).x - target
        };
        let mid = (feet[0].ankle.x + feet[1].ankle.x) / 2.0;
        let (mut lo, mut hi) = (mid - 2.0 * span, mid + 2.0 * span);
        for _ in 0..60 {
            let m = (lo + hi) / 2.0;
            if excess(m) < 0.0 {
                lo = m;
            } else {
                hi = m;
            }
        }
        let bisected = (lo + hi) / 2.0;
        let p = standing(&b, &s);
        assert!(p.warnings.is_empty(), "{gx} {gy}: {:?}", p.warnings);
        let hip = p.figure.unwrap().hip;
        assert!((hip.x - bisected).abs() < 1e-6, "{} vs {bisected}", hip.x);
        assert!((p.numbers["hip_x_mm"] - bisected).abs() < 1e-6);
        assert!(excess(hip.x).abs() < 1e-6);
    }
}

#[test]
fn saddle_too_high_is_a_warning_not_a_number() {
    let p = seated(&body(), &contacts(950.0, Point2::new(470.0, 700.0)));
    assert!(!p.numbers.contains_key("knee_flexion_bdc_deg"));
    let w = p
        .warnings
        .iter()
        .find(|w| w.message.contains("bottom dead centre"))
        .unwrap();
    assert_eq!(w.code, "unreachable");
    assert!(w.message.contains("mm beyond reach"), "{}", w.message);
    assert!(p.figure.is_none());
}

#[test]
fn grips_beyond_arm_reach_give_the_gap() {
    let b = body();
    let grip = Point2::new(1300.0, 700.0);
    let p = seated(&b, &contacts(720.0, grip));
    assert!(!p.numbers.contains_key("torso_angle_deg"));
    let hip = Point2::new(-175.0, 720.0 + b.hip_above_saddle);
    let gap = (grip - hip).norm() - b.torso - b.arm_reach();
    let w = &p.warnings[0];
    assert!(w.message.contains("grips"), "{}", w.message);
    // Whole millimetres up: the gap of a body model scaled from height, not a measurement.
    let text = format!("grips are {:.0} mm beyond reach", gap.ceil());
    assert!(w.message.contains(&text), "{} vs {text}", w.message);
}

#[test]
fn grips_reachable_only_with_straighter_arms_say_so() {
    let b = body();
    let hip = Point2::new(-175.0, 720.0 + b.hip_above_saddle);
    // Just beyond the bent-arm span but within the straight-arm reach.
    let dist = b.torso + (b.arm_span(20f64.to_radians()) + b.arm_reach()) / 2.0;
    let grip = hip + nalgebra::Vector2::new(dist * 0.9, dist * (1.0f64 - 0.81).sqrt());
    let p = seated(&b, &contacts(720.0, grip));
    assert!(
        p.warnings[0].message.contains("stated elbow bend"),
        "{}",
        p.warnings[0].message
    );
}

#[test]
fn grips_too_close_are_a_warning() {
    let b = Body::new(
        1780.0,
        74.0,
        Overrides {
            torso: Some(800.0),
            ..Default::default()
        },
    );
    let hip = Point2::new(-175.0, 720.0 + b.hip_above_saddle);
    let p = seated(
        &b,
        &contacts(720.0, hip + nalgebra::Vector2::new(20.0, 0.0)),
    );
    assert!(
        p.warnings[0].message.contains("too close"),
        "{}",
        p.warnings[0].message
    );
    assert!(p.figure.is_none());
}

#[test]
fn standing_feet_too_far_apart() {
    let b = Body::new(1000.0, 30.0, Overrides::default());
    let s = Stance {
        grip: Point2::new(300.0, 400.0),
        crank: 600.0,
        knee_bend: 60f64.to_radians(),
        torso_angle: 40f64.to_radians(),
        ground_y: -300.0,
    };
    let p = standing(&b, &s);
    assert!(p.numbers.is_empty() && p.figure.is_none());
    assert!(p.warnings[0].message.contains("too far apart"));
}

#[test]
fn standing_arms_too_short_for_the_grips() {
    let b = body();
    let s = Stance {
        grip: Point2::new(1500.0, 700.0),
        crank: 170.0,
        knee_bend: 30f64.to_radians(),
        torso_angle: 40f64.to_radians(),
        ground_y: -340.0,
    };
    let p = standing(&b, &s);
    assert!(p.figure.is_none());
    assert!(
        p.warnings.iter().any(|w| w.message.contains("grips")),
        "{:?}",
        p.warnings
    );
    assert!(p.numbers["arm_extension_room_mm"] < 0.0);
}

fn bike(setup: serde_json::Value) -> serde_json::Value {
    json!({ "frame": { "reach_mm": 470, "stack_mm": 635, "head_angle_deg": 65.0, "head_tube_mm": 110,
                       "headset_lower_mm": 12, "fork_a2c_mm": 561, "fork_offset_mm": 44,
                       "chainstay_mm": 435, "seat_angle_actual_deg": 76.5, "seat_tube_mm": 430 },
            "wheels": { "front": "29x2.4", "rear": "29x2.4" }, "setup": setup })
}

#[test]
fn evaluate_places_the_rider_and_fills_every_block() {
    let s: Scenario = serde_json::from_value(json!({
        "rider": { "height_mm": 1780, "mass_kg": 74, "inseam_mm": 840 },
        "bikes": [bike(json!({ "stem_mm": 45, "bar_rise_mm": 25, "bar_pullback_mm": 30,
                               "crank_mm": 170, "saddle_height_mm": 730 }))] }))
    .unwrap();
    let r = evaluate(&s);
    let b = &r.bikes[0];
    for k in [
        "knee_flexion_bdc_deg",
        "knee_angle_tdc_deg",
        "hip_angle_tdc_deg",
        "torso_angle_deg",
        "shoulder_angle_deg",
        "elbow_angle_deg",
    ] {
        assert!(b.fit.seated.contains_key(k), "{k}");
    }
    for k in [
        "elbow_angle_deg",
        "hip_height_mm",
        "arm_extension_room_mm",
        "arm_fold_room_mm",
    ] {
        assert!(b.fit.standing.contains_key(k), "{k}");
    }
    for block in [&b.handling.seated, &b.handling.standing] {
        for k in [
            "com_x_mm",
            "com_y_mm",
            "com_height_mm",
            "front_load_pct",
            "pitch_over_decel_g",
            "front_tip_slope_deg",
            "rear_tip_slope_deg",
        ] {
            assert!(block.contains_key(k), "{k}");
        }
    }
    for k in [
        "grip_x_mm",
        "grip_y_mm",
        "bb_to_grip_mm",
        "bb_to_grip_angle_deg",
        "saddle_to_grip_mm",
    ] {
        assert!(b.ridden.contains_key(k), "{k}");
    }
    let o = &b.outline;
    assert!(o.rider_seated.is_some() && o.rider_standing.is_some() && o.com_seated.is_some());
    assert!(o.cockpit.is_some() && o.seat.is_some() && o.cranks.is_some());
    assert!(b.warnings.iter().any(|w| w.code == "fit_estimate"));
}
