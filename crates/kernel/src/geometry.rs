//! Frame parameters, the points they define, and every §5 measurement read from those points.
//!
//! Coordinates (DESIGN.md §4, §8a): BB centre at the origin, x forward, y up, millimetres,
//! radians inside. Rear axle `R = (−rear_centre, bb_drop)`; head tube top `T = (reach, stack)`;
//! steering axis downward `d = (cos h, −sin h)`, forward normal `n = (sin h, cos h)`; crown race
//! seat `C = T + d·(head_tube + headset_lower)`; front axle `F = C + d·a2c + n·offset`.
//!
//! **Invariant:** the same [`Geometry::measure`] reads the stock and the ridden numbers, so the two
//! can never disagree about a definition.

use nalgebra::{Point2, Rotation2, Vector2};
use std::collections::BTreeMap;

/// The core parameters of a frame and fork (DESIGN.md §6.1), mm and radians.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct FrameParams {
    /// Horizontal BB → rear axle, mm.
    pub rear_centre: f64,
    /// Rear axle above the BB centre, mm (the published BB drop).
    pub bb_drop: f64,
    /// Head tube top, horizontal from the BB, mm.
    pub reach: f64,
    /// Head tube top, vertical from the BB, mm.
    pub stack: f64,
    /// Head angle to the ground, radians.
    pub head_angle: f64,
    /// Head tube length, mm.
    pub head_tube: f64,
    /// Lower headset stack, mm.
    pub headset_lower: f64,
    /// Fork axle-to-crown, mm.
    pub a2c: f64,
    /// Fork offset, mm.
    pub offset: f64,
    /// Actual seat angle, radians.
    pub seat_angle: f64,
    /// Seat axis offset at BB height, mm (positive = in front of the BB).
    pub seat_axis_offset: f64,
    /// Seat tube length, mm.
    pub seat_tube: f64,
}

/// Tyre outer radii, mm.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Radii {
    /// Front tyre outer radius, mm.
    pub front: f64,
    /// Rear tyre outer radius, mm.
    pub rear: f64,
}

/// A frame placed in some axes: the points every measurement is read from.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Geometry {
    /// Rear axle centre.
    pub rear_axle: Point2<f64>,
    /// Front axle centre.
    pub front_axle: Point2<f64>,
    /// Top of the head tube (the cockpit starts here; after angle cups, `T′`).
    pub head_top: Point2<f64>,
    /// Bottom of the head tube (the frame's own, unchanged by cups).
    pub head_bottom: Point2<f64>,
    /// Fork crown race seat.
    pub crown: Point2<f64>,
    /// Unit direction down the steering axis.
    pub steer_down: Vector2<f64>,
    /// A point of the seat axis (the one at frame BB height in the stock pose).
    pub seat_point: Point2<f64>,
    /// Unit direction up the seat axis.
    pub seat_up: Vector2<f64>,
    /// Top of the seat tube.
    pub seat_top: Point2<f64>,
    /// Tyre radii.
    pub radii: Radii,
    /// Head tube length, lower headset stack, a2c, offset, mm (carried for the report).
    pub lengths: ForkLengths,
    /// Height above the BB at which the effective seat angle is read (`None` = stack).
    pub seat_ref_height: Option<f64>,
}

/// Lengths along the steering assembly, mm.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct ForkLengths {
    /// Head tube length.
    pub head_tube: f64,
    /// Lower headset stack.
    pub headset_lower: f64,
    /// Axle-to-crown.
    pub a2c: f64,
    /// Offset.
    pub offset: f64,
    /// Seat tube length.
    pub seat_tube: f64,
}

/// Steering axis downward direction for head angle `h` (radians): `(cos h, −sin h)`.
pub fn steer_down(h: f64) -> Vector2<f64> {
    Vector2::new(h.cos(), -h.sin())
}

/// Forward normal of the steering axis: `(sin h, cos h)`.
pub fn steer_normal(h: f64) -> Vector2<f64> {
    Vector2::new(h.sin(), h.cos())
}

impl FrameParams {
    /// Places the frame in the stock frame axes (BB at the origin) with the given tyre radii.
    /// The caller is responsible for the tyres-on-the-ground condition (see [`crate::solve`]).
    pub fn geometry(&self, radii: Radii) -> Geometry {
        let d = steer_down(self.head_angle);
        let n = steer_normal(self.head_angle);
        let top = Point2::new(self.reach, self.stack);
        let bottom = top + d * self.head_tube;
        let crown = bottom + d * self.headset_lower;
        let front = crown + d * self.a2c + n * self.offset;
        let seat_up = Vector2::new(-self.seat_angle.cos(), self.seat_angle.sin());
        let seat_point = Point2::new(self.seat_axis_offset, 0.0);
        // Point of the axis nearest the BB, then along the axis by the seat tube length.
        let nearest = seat_point - seat_up * seat_point.coords.dot(&seat_up);
        Geometry {
            rear_axle: Point2::new(-self.rear_centre, self.bb_drop),
            front_axle: front,
            head_top: top,
            head_bottom: bottom,
            crown,
            steer_down: d,
            seat_point,
            seat_up,
            seat_top: nearest + seat_up * self.seat_tube,
            radii,
            lengths: ForkLengths {
                head_tube: self.head_tube,
                headset_lower: self.headset_lower,
                a2c: self.a2c,
                offset: self.offset,
                seat_tube: self.seat_tube,
            },
            seat_ref_height: None,
        }
    }

    /// The BB drop that puts both tyres on level ground: `F.y − R.y = r_front − r_rear` (§8a).
    pub fn grounded_bb_drop(&self, radii: Radii) -> f64 {
        let g = self.geometry(radii);
        g.front_axle.y - (radii.front - radii.rear)
    }
}

impl Geometry {
    /// Rotates every point and direction about the BB (the origin) by `theta` radians,
    /// counter-clockwise (θ > 0 lifts the front).
    pub fn rotated(&self, theta: f64) -> Geometry {
        let r = Rotation2::new(theta);
        Geometry {
            rear_axle: r * self.rear_axle,
            front_axle: r * self.front_axle,
            head_top: r * self.head_top,
            head_bottom: r * self.head_bottom,
            crown: r * self.crown,
            steer_down: r * self.steer_down,
            seat_point: r * self.seat_point,
            seat_up: r * self.seat_up,
            seat_top: r * self.seat_top,
            ..*self
        }
    }

    /// Ground height in these axes: the rear tyre's bottom, `R.y − r_rear`.
    pub fn ground_y(&self) -> f64 {
        self.rear_axle.y - self.radii.rear
    }

    /// Head angle to the ground in these axes, radians.
    pub fn head_angle(&self) -> f64 {
        (-self.steer_down.y).atan2(self.steer_down.x)
    }

    /// Actual seat angle to the ground (rear side) in these axes, radians.
    pub fn seat_angle(&self) -> f64 {
        self.seat_up.y.atan2(-self.seat_up.x)
    }

    /// The point of the seat axis at height `y` above the BB, if the axis is not horizontal.
    pub fn seat_axis_at(&self, y: f64) -> Option<Point2<f64>> {
        if self.seat_up.y.abs() < 1e-9 {
            return None;
        }
        let t = (y - self.seat_point.y) / self.seat_up.y;
        Some(self.seat_point + self.seat_up * t)
    }

    /// Where the steering axis meets the ground, if the axis is not horizontal.
    pub fn steer_ground_point(&self) -> Option<Point2<f64>> {
        if self.steer_down.y.abs() < 1e-9 {
            return None;
        }
        let t = (self.ground_y() - self.head_top.y) / self.steer_down.y;
        Some(self.head_top + self.steer_down * t)
    }

    /// Ground trail: steering-axis ground point minus front contact point, horizontally (§8a).
    pub fn trail(&self) -> Option<f64> {
        self.steer_ground_point().map(|g| g.x - self.front_axle.x)
    }

    /// Every derivable §5 measurement in these axes, keyed as in the catalogue.
    /// `standover_mm` is not derivable and is absent; a degenerate axis omits its keys.
    pub fn measure(&self) -> BTreeMap<&'static str, f64> {
        MEASURED_KEYS
            .iter()
            .zip(self.measure_values())
            .filter_map(|(k, v)| v.map(|v| (*k, v)))
            .collect()
    }

    /// The same numbers as [`Geometry::measure`], in the order of [`MEASURED_KEYS`], without
    /// allocating (the solver calls this many times). `None` where an axis is degenerate
    /// (horizontal), so no NaN or infinity can leave this function for finite points.
    ///
    /// Definitions (DESIGN.md §5, §8a): reach / stack = `T`; chainstay `|R|`; rear centre `−R.x`;
    /// front centre `F.x`; wheelbase `F.x − R.x`; BB drop `R.y`; BB height `r_rear − R.y`; seat
    /// axis offset = the axis point at y = 0; effective seat angle = angle of the line BB → axis
    /// point at the reference height (default stack); effective top tube `T.x − S.x` with `S` the
    /// axis point at `T.y`; trail = steering-axis ground point minus front axle, horizontally.
    pub fn measure_values(&self) -> [Option<f64>; MEASURED_COUNT] {
        let r = self.rear_axle;
        let f = self.front_axle;
        let t = self.head_top;
        let ref_y = self.seat_ref_height.unwrap_or(t.y);
        let eff = self
            .seat_axis_at(ref_y)
            .map(|s| s.y.atan2(-s.x).to_degrees());
        [
            Some(t.x),
            Some(t.y),
            Some(self.head_angle().to_degrees()),
            Some(self.lengths.head_tube),
            Some(self.lengths.headset_lower),
            Some(self.lengths.a2c),
            Some(self.lengths.offset),
            Some(r.coords.norm()),
            Some(-r.x),
            Some(f.x),
            Some(f.x - r.x),
            Some(r.y),
            Some(-self.ground_y()),
            Some(self.seat_angle().to_degrees()),
            self.seat_axis_at(0.0).map(|p| p.x),
            eff,
            self.seat_axis_at(t.y).map(|s| t.x - s.x),
            Some(self.lengths.seat_tube),
            self.trail(),
        ]
    }
}

/// How many numbers [`Geometry::measure_values`] returns.
pub const MEASURED_COUNT: usize = 19;

/// The keys of [`Geometry::measure_values`], in order: every §5 key except `standover_mm`.
pub const MEASURED_KEYS: [&str; MEASURED_COUNT] = [
    "reach_mm",
    "stack_mm",
    "head_angle_deg",
    "head_tube_mm",
    "headset_lower_mm",
    "fork_a2c_mm",
    "fork_offset_mm",
    "chainstay_mm",
    "rear_centre_mm",
    "front_centre_mm",
    "wheelbase_mm",
    "bb_drop_mm",
    "bb_height_mm",
    "seat_angle_actual_deg",
    "seat_axis_offset_mm",
    "seat_angle_effective_deg",
    "top_tube_effective_mm",
    "seat_tube_mm",
    "trail_mm",
];

/// Index of `key` in [`MEASURED_KEYS`], if it is derivable.
pub fn measured_index(key: &str) -> Option<usize> {
    MEASURED_KEYS.iter().position(|k| *k == key)
}

#[cfg(test)]
mod tests {
    use super::*;

    fn demo() -> FrameParams {
        FrameParams {
            rear_centre: 435.0,
            bb_drop: 0.0,
            reach: 470.0,
            stack: 625.0,
            head_angle: 65f64.to_radians(),
            head_tube: 110.0,
            headset_lower: 12.0,
            a2c: 570.0,
            offset: 44.0,
            seat_angle: 76f64.to_radians(),
            seat_axis_offset: 0.0,
            seat_tube: 430.0,
        }
    }

    #[test]
    fn front_axle_follows_the_definition() {
        let p = demo();
        let g = p.geometry(Radii {
            front: 372.0,
            rear: 372.0,
        });
        let h = 65f64.to_radians();
        let along = 110.0 + 12.0 + 570.0;
        let fx = 470.0 + along * h.cos() + 44.0 * h.sin();
        let fy = 625.0 - along * h.sin() + 44.0 * h.cos();
        assert!((g.front_axle.x - fx).abs() < 1e-9 && (g.front_axle.y - fy).abs() < 1e-9);
    }

    /// Source: trail T = (R cos h − o) / sin h (Wikipedia, "Bicycle and motorcycle geometry");
    /// REFERENCES.md worked value R 372, h 65°, o 44 → T 124.9178.
    #[test]
    fn trail_matches_the_published_formula_when_grounded() {
        let mut p = demo();
        let radii = Radii {
            front: 372.0,
            rear: 372.0,
        };
        p.bb_drop = p.grounded_bb_drop(radii);
        let g = p.geometry(radii);
        let trail = g.trail().unwrap_or(f64::NAN);
        assert!((trail - 124.9178).abs() < 1e-4, "trail {trail}");
    }

    #[test]
    fn rotation_changes_head_angle_by_theta() {
        let g = demo().geometry(Radii {
            front: 372.0,
            rear: 372.0,
        });
        let r = g.rotated(1f64.to_radians());
        assert!((r.head_angle().to_degrees() - 64.0).abs() < 1e-9);
        assert!((r.seat_angle().to_degrees() - 75.0).abs() < 1e-9);
    }

    #[test]
    fn seat_numbers() {
        let g = demo().geometry(Radii {
            front: 372.0,
            rear: 372.0,
        });
        let m = g.measure();
        // Straight seat tube through the BB: effective = actual, ETT = reach + stack / tan(a).
        assert!((m["seat_angle_effective_deg"] - 76.0).abs() < 1e-9);
        let ett = 470.0 + 625.0 / 76f64.to_radians().tan();
        assert!((m["top_tube_effective_mm"] - ett).abs() < 1e-9);
        assert!(m["seat_axis_offset_mm"].abs() < 1e-9);
    }
}
