//! Two-link (leg, arm) solutions against the independent closed form, the law of cosines.
//!
//! Source: law of cosines, `c² = a² + b² − 2ab·cos γ` (any trigonometry text).

// Test helpers may unwrap, index and panic, like the tests themselves (see clippy.toml).
#![allow(
    clippy::unwrap_used,
    clippy::expect_used,
    clippy::panic,
    clippy::indexing_slicing
)]

use framewise_kernel::posture::{interior, two_link, Reach};
use framewise_kernel::rider::{law_of_cosines, Body, Overrides};
use nalgebra::Point2;
use proptest::prelude::*;

proptest! {
    /// The joint angle of the solution equals `acos((a² + b² − D²) / 2ab)`, both links keep
    /// their lengths, and the joint lies on the asked side.
    #[test]
    fn joint_angle_matches_the_law_of_cosines(
        a in 100.0..600.0f64,
        b in 100.0..600.0f64,
        t in 0.05..0.95f64,
        dir in 0.0..std::f64::consts::TAU,
        px in -500.0..500.0f64,
        side in prop::sample::select(vec![1.0f64, -1.0]),
    ) {
        let lo = (a - b).abs();
        let dist = lo + t * (a + b - lo);
        let p = Point2::new(px, 100.0);
        let q = p + nalgebra::Vector2::new(dir.cos(), dir.sin()) * dist;
        let j = two_link(p, q, a, b, side).unwrap();
        prop_assert!(((j - p).norm() - a).abs() < 1e-6);
        prop_assert!(((j - q).norm() - b).abs() < 1e-6);
        let expected = ((a * a + b * b - dist * dist) / (2.0 * a * b)).clamp(-1.0, 1.0).acos();
        prop_assert!((interior(j, p, q) - expected).abs() < 1e-6);
        let cross = (q - p).perp(&(j - p));
        prop_assert!(cross * side >= -1e-6);
    }

    /// `law_of_cosines` against the coordinates of a triangle built from the angle.
    #[test]
    fn law_of_cosines_matches_coordinates(a in 1.0..900.0f64, b in 1.0..900.0f64, g in 0.0..std::f64::consts::PI) {
        let third = Point2::new(b * g.cos(), b * g.sin());
        let c = (third - Point2::new(a, 0.0)).norm();
        prop_assert!((law_of_cosines(a, b, g) - c).abs() < 1e-6);
    }
}

#[test]
fn too_far_and_too_close_report_the_gap() {
    let p = Point2::new(0.0, 0.0);
    assert_eq!(
        two_link(p, Point2::new(0.0, -1000.0), 450.0, 450.0, 1.0),
        Err(Reach::TooFar(100.0))
    );
    let r = two_link(p, Point2::new(50.0, 0.0), 450.0, 300.0, 1.0);
    assert_eq!(r, Err(Reach::TooClose(100.0)));
}

/// Leg span for a bent knee: thigh 0.245 H, shank 0.246 H (Winter Fig. 4.1), knee bent 30°
/// from straight → interior 150°, span² = t² + s² − 2ts·cos 150°.
#[test]
fn leg_span_for_a_bent_knee() {
    let b = Body::new(1800.0, 75.0, Overrides::default());
    let (t, s) = (0.245 * 1800.0, 0.246 * 1800.0);
    let expected = (t * t + s * s + 2.0 * t * s * (30f64.to_radians()).cos()).sqrt();
    assert!((b.leg_span(30f64.to_radians()) - expected).abs() < 1e-9);
    assert!((b.leg_span(0.0) - (t + s)).abs() < 1e-9);
}
