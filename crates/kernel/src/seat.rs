//! The seat: saddle height, setback, seatpost offset, the effective seat angle at the rider's
//! saddle height, and whether the seatpost or dropper fits the frame (DESIGN.md §6.5).
//!
//! Definitions. `O` is the point of the seat axis nearest the BB centre and `u` the axis's upward
//! unit direction. The saddle height `H` is measured from the BB centre along the seat axis:
//! the axis point at the saddle top is `A = O + u·H`. The saddle's reference (sit) point is
//! `setback` behind `A` along the frame's x axis; the post clamp is `saddle_stack` below the
//! saddle top along the axis and `post_offset` behind it. The post leaves the frame at the top of
//! the seat tube, `seat_tube` along the axis from `O`; the exposed post (seat tube top to the
//! clamp, along the axis) is `E = H − saddle_stack − seat_tube`.

use crate::geometry::Geometry;
use nalgebra::{Point2, Vector2};

/// Saddle nose ahead of the sit point, mm (drawing only, a stated shape).
pub const SADDLE_NOSE_MM: f64 = 170.0;
/// Saddle tail behind the sit point, mm (drawing only, a stated shape).
pub const SADDLE_TAIL_MM: f64 = 100.0;
/// Common dropper travels, mm [practice].
pub const DROPPER_TRAVELS_MM: [f64; 10] = [
    100.0, 125.0, 150.0, 170.0, 180.0, 200.0, 210.0, 230.0, 240.0, 250.0,
];
/// A dropper of travel `t` needs at least `t + DROPPER_HEAD_MM` exposed above the seat tube
/// (collar and head) [practice].
pub const DROPPER_HEAD_MM: f64 = 40.0;
/// A dropper of travel `t` is about `2·t + DROPPER_BODY_MM` long in total [practice].
pub const DROPPER_BODY_MM: f64 = 90.0;

/// The saddle and seatpost, resolved to millimetres.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Seat {
    /// Saddle height along the seat axis, mm.
    pub height: f64,
    /// Sit point behind the seat axis, horizontally in frame axes, mm.
    pub setback: f64,
    /// Post clamp behind the post axis, mm.
    pub post_offset: f64,
    /// Saddle top above the post clamp, along the axis, mm.
    pub saddle_stack: f64,
    /// Frame: deepest the post can go below the seat tube top, mm.
    pub max_insertion: Option<f64>,
    /// Post length, mm.
    pub post_length: Option<f64>,
    /// Post minimum insertion, mm.
    pub post_min_insertion: Option<f64>,
    /// Dropper travel, mm (0 = rigid).
    pub dropper_travel: f64,
}

/// The seat's points in the axes of the geometry.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct SeatPoints {
    /// Axis point at the saddle height (`A`).
    pub axis_at_saddle: Point2<f64>,
    /// Sit point on the saddle top.
    pub saddle: Point2<f64>,
    /// Post clamp.
    pub post_top: Point2<f64>,
    /// Top of the seat tube.
    pub post_exit: Point2<f64>,
    /// Saddle nose.
    pub nose: Point2<f64>,
    /// Saddle tail.
    pub tail: Point2<f64>,
}

/// Whether the post fits: saddle heights reachable and the longest common dropper.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct PostFit {
    /// Exposed post, seat tube top to the clamp along the axis, mm.
    pub exposed: f64,
    /// Lowest saddle height the post allows (`max_insertion` limits it), mm.
    pub lowest: Option<f64>,
    /// Highest saddle height the post allows (`post_min_insertion` limits it), mm.
    pub highest: Option<f64>,
    /// Longest common dropper travel that fits at this saddle height, mm (0 = none).
    pub longest_dropper: f64,
}

/// The point of the seat axis nearest the BB centre (origin).
pub fn axis_origin(g: &Geometry) -> Point2<f64> {
    let t = -g.seat_point.coords.dot(&g.seat_up);
    g.seat_point + g.seat_up * t
}

impl Seat {
    /// The seat's points; `frame_x` is the frame's x axis in the geometry's axes.
    pub fn points(&self, g: &Geometry, frame_x: Vector2<f64>) -> SeatPoints {
        let o = axis_origin(g);
        let u = g.seat_up;
        let a = o + u * self.height;
        let saddle = a - frame_x * self.setback;
        SeatPoints {
            axis_at_saddle: a,
            saddle,
            post_top: o + u * (self.height - self.saddle_stack) - frame_x * self.post_offset,
            post_exit: g.seat_top,
            nose: saddle + frame_x * SADDLE_NOSE_MM,
            tail: saddle - frame_x * SADDLE_TAIL_MM,
        }
    }

    /// Seatpost and dropper fit for a seat tube of `seat_tube` mm.
    ///
    /// With post length `L`, minimum insertion `m` and frame maximum insertion `I`: the exposed
    /// post must satisfy `L − E ≥ m` (so `H ≤ seat_tube + saddle_stack + L − m`) and
    /// `L − E ≤ I` (so `H ≥ seat_tube + saddle_stack + max(L − I, 0)`). A dropper of travel `t`
    /// fits when `E ≥ t + DROPPER_HEAD_MM` and, when `I` is known, `2t + DROPPER_BODY_MM − E ≤ I`.
    pub fn fit(&self, seat_tube: f64) -> PostFit {
        let base = seat_tube + self.saddle_stack;
        let exposed = self.height - base;
        let lowest = self
            .post_length
            .zip(self.max_insertion)
            .map(|(l, i)| base + (l - i).max(0.0));
        let highest = self
            .post_length
            .zip(self.post_min_insertion)
            .map(|(l, m)| base + l - m);
        let longest_dropper = DROPPER_TRAVELS_MM
            .iter()
            .copied()
            .filter(|&t| {
                exposed >= t + DROPPER_HEAD_MM
                    && self
                        .max_insertion
                        .is_none_or(|i| 2.0 * t + DROPPER_BODY_MM - exposed <= i)
            })
            .fold(0.0, f64::max);
        PostFit {
            exposed,
            lowest,
            highest,
            longest_dropper,
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn seat() -> Seat {
        Seat {
            height: 740.0,
            setback: 0.0,
            post_offset: 0.0,
            saddle_stack: 40.0,
            max_insertion: Some(280.0),
            post_length: Some(400.0),
            post_min_insertion: Some(100.0),
            dropper_travel: 0.0,
        }
    }

    #[test]
    fn post_limits_follow_the_lengths() {
        let f = seat().fit(430.0);
        assert!((f.exposed - 270.0).abs() < 1e-9);
        assert_eq!(f.lowest, Some(430.0 + 40.0 + 120.0));
        assert_eq!(f.highest, Some(430.0 + 40.0 + 300.0));
        // 270 exposed: t + 40 ≤ 270 → t ≤ 230; 2t + 90 − 270 ≤ 280 → t ≤ 230.
        assert_eq!(f.longest_dropper, 230.0);
    }
}
