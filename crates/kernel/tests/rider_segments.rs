//! The body model's tables against their source, and the scaling from height and overrides.
//!
//! Source (every value here): Drillis & Contini 1966 segment-length ratios as reproduced in
//! Winter, *Biomechanics and Motor Control of Human Movement*, 4th ed., Wiley 2009, Fig. 4.1;
//! Dempster segment masses and centre-of-mass positions via Winter Table 4.1 [read, from a
//! transcription; /work/shared/REFERENCES.md "Human body segments"].

// Test helpers may unwrap, index and panic, like the tests themselves (see clippy.toml).
#![allow(
    clippy::unwrap_used,
    clippy::expect_used,
    clippy::panic,
    clippy::indexing_slicing
)]

use framewise_kernel::rider::{height_ratio, segment, Body, Overrides, SEGMENTS};

fn close(a: f64, b: f64, tol: f64) {
    assert!((a - b).abs() <= tol, "expected {b}, got {a}");
}

/// Source: Winter Table 4.1 (Dempster): mass fraction / COM from the proximal end.
#[test]
fn mass_fractions_and_com_positions_match_the_table() {
    let expected = [
        ("hand", 0.006, 0.506),
        ("forearm", 0.016, 0.430),
        ("upper_arm", 0.028, 0.436),
        ("foot", 0.0145, 0.50),
        ("shank", 0.0465, 0.433),
        ("thigh", 0.100, 0.433),
        ("trunk", 0.497, 0.50),
    ];
    for (name, mass, com) in expected {
        let s = segment(name).unwrap();
        close(s.mass, mass, 1e-12);
        close(s.com, com, 1e-12);
    }
    close(segment("head_neck").unwrap().mass, 0.081, 1e-12);
}

/// Source: REFERENCES.md: "Two arms, two legs, head-neck and trunk sum to 1.000".
#[test]
fn mass_fractions_sum_to_one() {
    let total: f64 = SEGMENTS.iter().map(|s| s.mass * f64::from(s.count)).sum();
    close(total, 1.0, 1e-12);
    let limbs = SEGMENTS.iter().filter(|s| s.count == 2).count();
    assert_eq!(
        limbs, 6,
        "hand, forearm, upper arm, foot, shank, thigh come in pairs"
    );
}

/// Source: Winter Fig. 4.1 (Drillis & Contini): joint heights and segment lengths as fractions
/// of height; thigh 0.530 − 0.285 = 0.245 H, shank 0.285 − 0.039 = 0.246 H.
#[test]
fn length_ratios_match_the_figure() {
    close(height_ratio::SHOULDER, 0.818, 0.0);
    close(height_ratio::ELBOW, 0.630, 0.0);
    close(height_ratio::WRIST, 0.485, 0.0);
    close(height_ratio::HIP, 0.530, 0.0);
    close(height_ratio::KNEE, 0.285, 0.0);
    close(height_ratio::ANKLE, 0.039, 0.0);
    close(height_ratio::UPPER_ARM, 0.186, 0.0);
    close(height_ratio::FOREARM, 0.146, 0.0);
    close(height_ratio::HAND, 0.108, 0.0);
    close(height_ratio::FOOT, 0.152, 0.0);
    close(height_ratio::SHOULDER_WIDTH, 0.259, 0.0);
    let b = Body::new(1000.0, 70.0, Overrides::default());
    close(b.thigh, 245.0, 1e-9);
    close(b.shank, 246.0, 1e-9);
    close(b.upper_arm, 186.0, 1e-9);
    close(b.forearm, 146.0, 1e-9);
    close(b.foot, 152.0, 1e-9);
    close(b.torso, 288.0, 1e-9);
    // Upper arm from the joint heights as well: shoulder − elbow = 0.188 ≈ 0.186 (the figure's
    // own rounding; within 0.005 H).
    close(
        height_ratio::SHOULDER - height_ratio::ELBOW,
        height_ratio::UPPER_ARM,
        0.005,
    );
}

#[test]
fn measured_lengths_override_the_ratios() {
    let h = 1780.0;
    let base = Body::new(h, 74.0, Overrides::default());
    let b = Body::new(
        h,
        74.0,
        Overrides {
            inseam: Some(900.0),
            arm: Some(700.0),
            torso: Some(550.0),
            shoe_stack: Some(20.0),
            foot_position: Some(-10.0),
        },
    );
    // The leg chain scales by inseam / default inseam; its ratio of thigh to shank is kept.
    let k = 900.0 / base.inseam;
    close(b.thigh, base.thigh * k, 1e-9);
    close(b.shank, base.shank * k, 1e-9);
    close(b.ankle_height, base.ankle_height * k, 1e-9);
    close(b.arm_reach(), 700.0, 1e-9);
    close(b.upper_arm / b.forearm, 0.186 / 0.146, 1e-12);
    close(b.torso, 550.0, 0.0);
    close(b.shoe_stack, 20.0, 0.0);
    close(b.foot_position, -10.0, 0.0);
}
