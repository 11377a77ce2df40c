//! Test helpers: an independent implementation of the §8a definitions (plain trigonometry, no
//! kernel code), used to make published sets and to check the kernel's numbers.
#![allow(dead_code, clippy::indexing_slicing, clippy::unwrap_used)]

use framewise_kernel::{FrameParams, Given};
use std::collections::BTreeMap;

/// A frame in plain numbers: lengths in mm, angles in degrees.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Frame {
    pub rear_centre: f64,
    pub reach: f64,
    pub stack: f64,
    pub head_angle_deg: f64,
    pub head_tube: f64,
    pub headset_lower: f64,
    pub a2c: f64,
    pub offset: f64,
    pub seat_angle_deg: f64,
    pub seat_axis_offset: f64,
    pub seat_tube: f64,
    pub r_front: f64,
    pub r_rear: f64,
}

/// The measured keys in the kernel's order (a list of names, not a computation).
pub use framewise_kernel::geometry::MEASURED_KEYS as KEYS;

pub const PARAM_NAMES: [&str; 11] = [
    "rear_centre",
    "reach",
    "stack",
    "head_angle_deg",
    "head_tube",
    "headset_lower",
    "a2c",
    "offset",
    "seat_angle_deg",
    "seat_axis_offset",
    "seat_tube",
];

impl Frame {
    pub fn params(&self) -> [f64; 11] {
        [
            self.rear_centre,
            self.reach,
            self.stack,
            self.head_angle_deg,
            self.head_tube,
            self.headset_lower,
            self.a2c,
            self.offset,
            self.seat_angle_deg,
            self.seat_axis_offset,
            self.seat_tube,
        ]
    }

    pub fn with_params(&self, p: [f64; 11]) -> Frame {
        Frame {
            rear_centre: p[0],
            reach: p[1],
            stack: p[2],
            head_angle_deg: p[3],
            head_tube: p[4],
            headset_lower: p[5],
            a2c: p[6],
            offset: p[7],
            seat_angle_deg: p[8],
            seat_axis_offset: p[9],
            seat_tube: p[10],
            ..*self
        }
    }

    /// Every §5 number by the §8a definitions, written out independently of the kernel.
    pub fn published(&self) -> BTreeMap<&'static str, f64> {
        let h = self.head_angle_deg.to_radians();
        let (c, s) = (h.cos(), h.sin());
        let along = self.head_tube + self.headset_lower + self.a2c;
        let fx = self.reach + along * c + self.offset * s;
        let fy = self.stack - along * s + self.offset * c;
        // Both tyres on the ground: F.y − R.y = r_front − r_rear.
        let drop = fy - (self.r_front - self.r_rear);
        let ground = drop - self.r_rear;
        let a = self.seat_angle_deg.to_radians();
        let seat_x_at = |y: f64| self.seat_axis_offset - y / a.tan();
        let gx = self.reach + (self.stack - ground) / s * c;
        let mut m = BTreeMap::new();
        m.insert("reach_mm", self.reach);
        m.insert("stack_mm", self.stack);
        m.insert("head_angle_deg", self.head_angle_deg);
        m.insert("head_tube_mm", self.head_tube);
        m.insert("headset_lower_mm", self.headset_lower);
        m.insert("fork_a2c_mm", self.a2c);
        m.insert("fork_offset_mm", self.offset);
        m.insert("chainstay_mm", self.rear_centre.hypot(drop));
        m.insert("rear_centre_mm", self.rear_centre);
        m.insert("front_centre_mm", fx);
        m.insert("wheelbase_mm", fx + self.rear_centre);
        m.insert("bb_drop_mm", drop);
        m.insert("bb_height_mm", self.r_rear - drop);
        m.insert("seat_angle_actual_deg", self.seat_angle_deg);
        m.insert("seat_axis_offset_mm", self.seat_axis_offset);
        m.insert(
            "seat_angle_effective_deg",
            self.stack.atan2(-seat_x_at(self.stack)).to_degrees(),
        );
        m.insert("top_tube_effective_mm", self.reach - seat_x_at(self.stack));
        m.insert("seat_tube_mm", self.seat_tube);
        m.insert("trail_mm", gx - fx);
        m
    }
}

pub fn params_of(p: &FrameParams) -> [f64; 11] {
    [
        p.rear_centre,
        p.reach,
        p.stack,
        p.head_angle.to_degrees(),
        p.head_tube,
        p.headset_lower,
        p.a2c,
        p.offset,
        p.seat_angle.to_degrees(),
        p.seat_axis_offset,
        p.seat_tube,
    ]
}

pub fn is_angle(key: &str) -> bool {
    key.ends_with("_deg")
}

/// Given values with default tolerances (1 mm, 0.1°), optionally rounded to them.
pub fn givens(
    published: &BTreeMap<&'static str, f64>,
    keys: &[&str],
    round: bool,
) -> BTreeMap<String, Given> {
    keys.iter()
        .map(|&k| {
            let tol = if is_angle(k) { 0.1 } else { 1.0 };
            let v = published[k];
            let value = if round { (v / tol).round() * tol } else { v };
            (
                k.to_string(),
                Given {
                    value,
                    tolerance: tol,
                },
            )
        })
        .collect()
}

/// Rank of the published numbers `keys` over the 11 parameters, by central differences on the
/// independent formulas above (weights 1/tolerance).
pub fn determining(frame: &Frame, keys: &[&str]) -> bool {
    let p0 = frame.params();
    let step = 1e-5;
    let mut j = nalgebra::DMatrix::<f64>::zeros(keys.len(), 11);
    for c in 0..11 {
        let mut up = p0;
        let mut dn = p0;
        up[c] += step;
        dn[c] -= step;
        let mu = frame.with_params(up).published();
        let md = frame.with_params(dn).published();
        for (r, k) in keys.iter().enumerate() {
            let tol = if is_angle(k) { 0.1 } else { 1.0 };
            j[(r, c)] = (mu[k] - md[k]) / (2.0 * step * tol);
        }
    }
    if keys.len() < 11 {
        return false;
    }
    let s = j.svd(false, false).singular_values;
    let max = s.iter().cloned().fold(0.0, f64::max);
    s.iter().filter(|&&v| v > max * 1e-7).count() == 11
}

/// A typical trail bike (invented demo numbers).
pub fn demo() -> Frame {
    Frame {
        rear_centre: 435.0,
        reach: 470.0,
        stack: 625.0,
        head_angle_deg: 65.0,
        head_tube: 110.0,
        headset_lower: 12.0,
        a2c: 570.0,
        offset: 44.0,
        seat_angle_deg: 76.0,
        seat_axis_offset: 0.0,
        seat_tube: 430.0,
        r_front: 372.0,
        r_rear: 372.0,
    }
}
