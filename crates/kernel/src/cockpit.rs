//! The cockpit, forward: upper headset stack, spacers, stem and bar → the grip point
//! (DESIGN.md §6.4 and §8a "Cockpit").
//!
//! In frame axes: stem clamp centre `S = T′ − d′·(headset_upper + spacers + stem_stack/2)`; the
//! stem points along `n′` turned up by `stem_angle` for `stem` mm to the bar clamp `B`; the grip
//! centre is `bar_pullback` behind and `bar_rise` above `B`, in frame axes. Because the re-pose is
//! a rigid rotation θ about the BB, the same construction is done directly in the ridden axes
//! with `T′`, `d′` taken from the posed geometry and the frame's x axis read as `(cos θ, sin θ)`.

use crate::geometry::Geometry;
use nalgebra::{Point2, Rotation2, Vector2};

/// Where a flat bar bends into its sweep, measured sideways from the bar's centre, mm.
/// A stated model value [practice]: riser and sweep bends usually sit 80–120 mm from the centre.
pub const FLAT_BEND_MM: f64 = 100.0;
/// Half the width of a hand on the grip: the grip centre lies this far in from the bar end, mm
/// [practice].
pub const GRIP_HALF_MM: f64 = 65.0;

/// Which part of a drop bar the hands hold for the fit.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum HandPosition {
    /// On the brake hoods.
    Hoods,
    /// In the drops.
    Drops,
    /// On the tops, next to the stem.
    Tops,
}

/// The bar, resolved to numbers (mm, radians).
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum Bar {
    /// Explicit rise and pullback of the grip centre from the bar clamp, frame axes (§8a).
    Offset {
        /// Grip centre above the clamp, mm.
        rise: f64,
        /// Grip centre behind the clamp, mm.
        pullback: f64,
    },
    /// A flat or riser bar described by its catalogue numbers (see [`Bar::grip_offset`]).
    Flat {
        /// Rise, mm.
        rise: f64,
        /// Backsweep, radians.
        backsweep: f64,
        /// Upsweep, radians.
        upsweep: f64,
        /// Width end to end, mm.
        width: f64,
        /// Roll about the clamp, radians (positive turns the rise rearwards).
        roll: f64,
    },
    /// A drop bar.
    Drop {
        /// Clamp centre forward to the furthest point of the bend, mm.
        reach: f64,
        /// Clamp centre down to the drops, mm.
        drop: f64,
        /// Clamp centre forward to the hand on the hoods, mm.
        hood_reach: f64,
        /// Hand on the hoods below the clamp centre, mm (negative = above).
        hood_drop: f64,
        /// Roll about the clamp, radians (positive turns the bar rearwards).
        roll: f64,
        /// Where the hands are for the fit.
        hand: HandPosition,
    },
}

impl Bar {
    /// The grip centre relative to the bar clamp centre in frame axes, as `(pullback, rise)`:
    /// pullback behind, rise above.
    ///
    /// - `Offset`: as given.
    /// - `Flat` (a stated model): the bar runs straight sideways from the clamp to a bend
    ///   [`FLAT_BEND_MM`] from the centre, rising by `rise`; outside the bend it sweeps back by
    ///   `backsweep` and up by `upsweep` to the grip centre, which lies [`GRIP_HALF_MM`] in from
    ///   the end. With `ℓ = max(width/2 − FLAT_BEND_MM − GRIP_HALF_MM, 0)` the sideways length of
    ///   the swept part, the offset before roll is `(ℓ·tan backsweep, rise + ℓ·tan upsweep)`.
    /// - `Drop`: hoods `(−hood_reach, −hood_drop)`; drops `(−reach/2, −drop)` (the hand at the
    ///   middle of the lower bend, a stated model); tops `(0, 0)`.
    ///
    /// Roll `ρ` turns the offset about the clamp: in side view (x forward, y up) the vector
    /// `(−pullback, rise)` is rotated counter-clockwise by `ρ`, so a positive roll turns the
    /// rise rearwards.
    pub fn grip_offset(&self) -> (f64, f64) {
        match *self {
            Bar::Offset { rise, pullback } => (pullback, rise),
            Bar::Flat {
                rise,
                backsweep,
                upsweep,
                width,
                roll,
            } => {
                let swept = (width / 2.0 - FLAT_BEND_MM - GRIP_HALF_MM).max(0.0);
                rolled(swept * backsweep.tan(), rise + swept * upsweep.tan(), roll)
            }
            Bar::Drop {
                reach,
                drop,
                hood_reach,
                hood_drop,
                roll,
                hand,
            } => {
                let (p, r) = match hand {
                    HandPosition::Hoods => (-hood_reach, -hood_drop),
                    HandPosition::Drops => (-reach / 2.0, -drop),
                    HandPosition::Tops => (0.0, 0.0),
                };
                rolled(p, r, roll)
            }
        }
    }
}

fn rolled(pullback: f64, rise: f64, roll: f64) -> (f64, f64) {
    let v = Rotation2::new(roll) * Vector2::new(-pullback, rise);
    (-v.x, v.y)
}

/// Stem, spacers and bar, resolved to numbers (mm, radians).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Cockpit {
    /// Upper headset stack above the head tube top, mm.
    pub headset_upper: f64,
    /// Spacers under the stem, mm.
    pub spacers: f64,
    /// Stem clamp height on the steerer, mm.
    pub stem_stack: f64,
    /// Stem length, mm.
    pub stem: f64,
    /// Stem angle to the steerer's normal, radians (positive = up).
    pub stem_angle: f64,
    /// The bar.
    pub bar: Bar,
}

/// The cockpit's points in some axes (those of the geometry it was built on).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct CockpitPoints {
    /// Top of the upper headset stack.
    pub headset_top: Point2<f64>,
    /// Top of the spacers.
    pub spacers_top: Point2<f64>,
    /// Stem clamp centre on the steerer.
    pub stem_clamp: Point2<f64>,
    /// Top of the stem clamp.
    pub steerer_top: Point2<f64>,
    /// Bar clamp centre.
    pub bar_clamp: Point2<f64>,
    /// Grip centre.
    pub grip: Point2<f64>,
}

/// The stem's direction: the steerer's forward normal `n = (−d.y, d.x)` turned
/// counter-clockwise (up) by `stem_angle`.
pub fn stem_direction(steer_down: Vector2<f64>, stem_angle: f64) -> Vector2<f64> {
    Rotation2::new(stem_angle) * Vector2::new(-steer_down.y, steer_down.x)
}

/// The frame's own x axis in the axes of a frame re-posed by `theta`: `(cos θ, sin θ)`.
pub fn frame_x_axis(theta: f64) -> Vector2<f64> {
    Vector2::new(theta.cos(), theta.sin())
}

impl Cockpit {
    /// The cockpit points on a geometry whose frame x axis is `frame_x` in the same axes
    /// (use [`frame_x_axis`] with the pose's θ; `(1, 0)` in frame axes).
    pub fn points(&self, g: &Geometry, frame_x: Vector2<f64>) -> CockpitPoints {
        let t = g.head_top;
        let d = g.steer_down;
        let headset_top = t - d * self.headset_upper;
        let spacers_top = headset_top - d * self.spacers;
        let stem_clamp = spacers_top - d * (self.stem_stack / 2.0);
        let steerer_top = spacers_top - d * self.stem_stack;
        let bar_clamp = stem_clamp + stem_direction(d, self.stem_angle) * self.stem;
        let (pullback, rise) = self.bar.grip_offset();
        let frame_y = Vector2::new(-frame_x.y, frame_x.x);
        let grip = bar_clamp - frame_x * pullback + frame_y * rise;
        CockpitPoints {
            headset_top,
            spacers_top,
            stem_clamp,
            steerer_top,
            bar_clamp,
            grip,
        }
    }
}

/// BB-to-grip distance (mm) and its angle above horizontal (radians) for a grip point relative
/// to the BB.
pub fn bb_to_grip(grip: Point2<f64>) -> (f64, f64) {
    (grip.coords.norm(), grip.y.atan2(grip.x))
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn flat_bar_without_sweep_is_pure_rise() {
        let bar = Bar::Flat {
            rise: 20.0,
            backsweep: 0.0,
            upsweep: 0.0,
            width: 780.0,
            roll: 0.0,
        };
        let (p, r) = bar.grip_offset();
        assert!(p.abs() < 1e-12 && (r - 20.0).abs() < 1e-12);
    }

    #[test]
    fn rolling_back_moves_the_grip_back() {
        let bar = |roll: f64| Bar::Flat {
            rise: 30.0,
            backsweep: 9f64.to_radians(),
            upsweep: 5f64.to_radians(),
            width: 780.0,
            roll,
        };
        let (p0, _) = bar(0.0).grip_offset();
        let (p1, _) = bar(5f64.to_radians()).grip_offset();
        assert!(p1 > p0);
    }
}
