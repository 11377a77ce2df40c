//! The cockpit, inverse: which common stem, spacers and bar put the grip closest to a target
//! point (DESIGN.md §6.4).
//!
//! The catalogue lists common parts [practice]: stem lengths 30–140 mm in 5 mm steps, the usual
//! stem angles (±6°, ±10°, ±17° and 0°), spacer stacks in 5 mm steps up to the fork's spacer
//! limit, and common riser-bar rises and backsweeps. Every combination is tried (a few tens of
//! thousands of additions: the grip is linear in each part once the stem angle's direction is
//! known), and the closest are returned, ranked by their miss.

use crate::cockpit::{stem_direction, Bar, Cockpit};
use crate::geometry::Geometry;
use nalgebra::{Point2, Vector2};
use serde::Serialize;

/// Shortest catalogue stem, mm.
pub const STEM_MIN_MM: f64 = 30.0;
/// Stem length step, mm.
pub const STEM_STEP_MM: f64 = 5.0;
/// How many stem lengths: 30 to 140 mm.
pub const STEM_COUNT: u32 = 23;

/// Common stem lengths, mm: 30 to 140 in 5 mm steps.
pub fn stem_lengths_mm() -> impl Iterator<Item = f64> {
    (0..STEM_COUNT).map(|i| STEM_MIN_MM + f64::from(i) * STEM_STEP_MM)
}
/// Common stem angles to the steerer's normal, degrees.
pub const STEM_ANGLES_DEG: [f64; 7] = [-17.0, -10.0, -6.0, 0.0, 6.0, 10.0, 17.0];
/// Common riser-bar rises, mm.
pub const BAR_RISES_MM: [f64; 9] = [0.0, 10.0, 15.0, 20.0, 25.0, 30.0, 35.0, 40.0, 50.0];
/// Common flat-bar backsweeps, degrees.
pub const BAR_BACKSWEEPS_DEG: [f64; 6] = [0.0, 5.0, 7.0, 8.0, 9.0, 12.0];
/// Spacer step, mm.
pub const SPACER_STEP_MM: f64 = 5.0;
/// Fork spacer limit assumed when none is given, mm (check the fork maker's own limit).
pub const DEFAULT_SPACER_LIMIT_MM: f64 = 40.0;
/// How many combinations the search returns.
pub const RESULTS: usize = 10;

/// One combination of parts and where it puts the grip.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct PartsChoice {
    /// Stem length, mm.
    pub stem_mm: f64,
    /// Stem angle, degrees.
    pub stem_angle_deg: f64,
    /// Spacers under the stem, mm.
    pub spacers_mm: f64,
    /// Bar rise, mm.
    pub bar_rise_mm: f64,
    /// Bar backsweep, degrees (flat bars described by their sweep; absent otherwise).
    #[serde(skip_serializing_if = "Option::is_none")]
    pub bar_backsweep_deg: Option<f64>,
    /// Grip centre ahead of the BB, mm (ridden axes).
    pub grip_x_mm: f64,
    /// Grip centre above the BB, mm (ridden axes).
    pub grip_y_mm: f64,
    /// Straight distance from the target, mm.
    pub miss_mm: f64,
}

/// The search's answer for one bike.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct PartsSearch {
    /// Target grip point ahead of the BB, mm.
    pub target_x_mm: f64,
    /// Target grip point above the BB, mm.
    pub target_y_mm: f64,
    /// Where the target came from: `"given"` or `"bikes[i]"`.
    pub target_from: String,
    /// Spacer limit used, mm.
    pub spacer_limit_mm: f64,
    /// The closest combinations, best first.
    pub choices: Vec<PartsChoice>,
}

/// The bars tried: each a bar rise / optional backsweep (degrees) and its bar.
fn bars(current: &Bar) -> Vec<(f64, Option<f64>, Bar)> {
    match *current {
        Bar::Flat {
            width,
            upsweep,
            roll,
            ..
        } => BAR_RISES_MM
            .iter()
            .flat_map(|&rise| {
                BAR_BACKSWEEPS_DEG.iter().map(move |&sweep| {
                    let bar = Bar::Flat {
                        rise,
                        backsweep: sweep.to_radians(),
                        upsweep,
                        width,
                        roll,
                    };
                    (rise, Some(sweep), bar)
                })
            })
            .collect(),
        Bar::Offset { pullback, .. } => BAR_RISES_MM
            .iter()
            .map(|&rise| (rise, None, Bar::Offset { rise, pullback }))
            .collect(),
        Bar::Drop { .. } => vec![(0.0, None, *current)],
    }
}

/// Searches the catalogue for the parts that put the grip closest to `target` (ridden axes,
/// relative to the BB). `current` gives the parts that are kept (headset stack, stem clamp
/// height, bar width, upsweep, roll, drop-bar shape); `frame_x` is the frame's x axis in the
/// ridden axes. Spacers run from 0 to `spacer_limit` in 5 mm steps.
///
/// Returns at most [`RESULTS`] choices, sorted by miss, then by fewer spacers, then by shorter
/// stem. Grip = `T′ − d′·(headset_upper + spacers + stem_stack/2) + u(angle)·stem + bar offset`.
pub fn search(
    g: &Geometry,
    frame_x: Vector2<f64>,
    current: &Cockpit,
    target: Point2<f64>,
    spacer_limit: f64,
) -> Vec<PartsChoice> {
    let d = g.steer_down;
    let base = g.head_top - d * (current.headset_upper + current.stem_stack / 2.0);
    let frame_y = Vector2::new(-frame_x.y, frame_x.x);
    let bar_list: Vec<(f64, Option<f64>, Vector2<f64>)> = bars(&current.bar)
        .into_iter()
        .map(|(rise, sweep, bar)| {
            let (p, r) = bar.grip_offset();
            (rise, sweep, frame_y * r - frame_x * p)
        })
        .collect();
    let steps = (spacer_limit / SPACER_STEP_MM).floor().max(0.0) as u32;
    let mut best: Vec<PartsChoice> = Vec::with_capacity(RESULTS + 1);
    for s in 0..=steps {
        let spacers = f64::from(s) * SPACER_STEP_MM;
        let clamp = base - d * spacers;
        for &angle in &STEM_ANGLES_DEG {
            let u = stem_direction(d, angle.to_radians());
            for &(rise, sweep, off) in &bar_list {
                let line = Line {
                    start: clamp + off,
                    dir: u,
                    parts: (spacers, angle, rise, sweep),
                };
                line.scan(target, &mut best);
            }
        }
    }
    best
}

/// The grips of one spacer stack, stem angle and bar: a line `start + dir·stem` in stem length.
struct Line {
    start: Point2<f64>,
    dir: Vector2<f64>,
    parts: (f64, f64, f64, Option<f64>),
}

impl Line {
    /// Offers the line's stems to `best`, walking out from the stem nearest the target in both
    /// directions; the miss grows with the distance from that stem along the line, so each walk
    /// stops at the first stem that cannot enter the list. Exact, and much faster than trying
    /// every stem.
    fn scan(&self, target: Point2<f64>, best: &mut Vec<PartsChoice>) {
        let along = (target - self.start).dot(&self.dir);
        let nearest = ((along - STEM_MIN_MM) / STEM_STEP_MM)
            .round()
            .clamp(0.0, f64::from(STEM_COUNT - 1)) as u32;
        let mut down = Some(nearest);
        while let Some(i) = down {
            if !self.offer(i, target, best) {
                break;
            }
            down = i.checked_sub(1);
        }
        for i in nearest + 1..STEM_COUNT {
            if !self.offer(i, target, best) {
                break;
            }
        }
    }

    /// Tries stem number `i`; false when it could not enter the list.
    fn offer(&self, i: u32, target: Point2<f64>, best: &mut Vec<PartsChoice>) -> bool {
        let stem = STEM_MIN_MM + f64::from(i) * STEM_STEP_MM;
        let grip = self.start + self.dir * stem;
        let miss = (grip - target).norm();
        let worst = best.last().map_or(f64::INFINITY, |c| c.miss_mm);
        if best.len() >= RESULTS && miss >= worst {
            return false;
        }
        let (spacers, angle, rise, sweep) = self.parts;
        insert(
            best,
            PartsChoice {
                stem_mm: stem,
                stem_angle_deg: angle,
                spacers_mm: spacers,
                bar_rise_mm: rise,
                bar_backsweep_deg: sweep,
                grip_x_mm: grip.x,
                grip_y_mm: grip.y,
                miss_mm: miss,
            },
        );
        true
    }
}

fn insert(best: &mut Vec<PartsChoice>, c: PartsChoice) {
    let key = |c: &PartsChoice| (c.miss_mm, c.spacers_mm, c.stem_mm);
    let at = best
        .iter()
        .position(|b| key(&c).partial_cmp(&key(b)) == Some(std::cmp::Ordering::Less))
        .unwrap_or(best.len());
    best.insert(at, c);
    best.truncate(RESULTS);
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn catalogue_steps() {
        let stems: Vec<f64> = stem_lengths_mm().collect();
        assert_eq!(stems.first(), Some(&30.0));
        assert_eq!(stems.last(), Some(&140.0));
        assert!(stems.windows(2).all(|w| (w[1] - w[0] - 5.0).abs() < 1e-12));
    }
}
