//! Label placement: each label goes to the cheapest of its candidate spots, where a spot costs
//! what its box crosses (a tube or a tyre much, a limb less, a thin dashed line little) plus how
//! far it strays from the label's first choice; another label's box, or the view box's edge, is
//! never crossed while a spot that keeps clear of them exists.
//!
//! A label's box is estimated from its words ([`width_em`], [`ink_rect`], [`box_rect`]) in the largest type the page uses
//! ([`crate::LABEL_EM_MAX_MM`]); in smaller type the box shrinks towards the same anchor and
//! stays inside the larger one, so a spot clear in the largest type is clear in every size.
//! Everything here is in kernel axes (y up): drawing layout, not bike geometry.

use framewise_kernel::report::Xy;

/// A rectangle `[x0, y0, x1, y1]` in kernel axes (y up), `x0 <= x1`, `y0 <= y1`.
pub type Rect = [f64; 4];

/// A character's advance in the labels' type, em: DejaVu Sans Bold's (the `system-ui` of the
/// Debian Chromium the browser tests run in, and among the widest of the usual system fonts:
/// Roboto's and San Francisco's digits are 0.56 and 0.6 em against its 0.7), measured in the
/// browser and rounded up; 0.8 em for a character not listed.
fn advance_em(c: char) -> f64 {
    const LOWER: [f64; 26] = [
        0.675, 0.716, 0.593, 0.716, 0.678, 0.435, 0.716, 0.712, 0.343, 0.343, 0.665, 0.343, 1.042,
        0.712, 0.687, 0.716, 0.716, 0.493, 0.595, 0.478, 0.712, 0.652, 0.924, 0.645, 0.652, 0.582,
    ];
    const UPPER: [f64; 26] = [
        0.774, 0.762, 0.734, 0.830, 0.683, 0.683, 0.821, 0.837, 0.372, 0.372, 0.775, 0.637, 0.995,
        0.837, 0.850, 0.733, 0.850, 0.770, 0.720, 0.682, 0.812, 0.774, 1.103, 0.771, 0.724, 0.725,
    ];
    let at = |table: &[f64; 26], base: char| {
        let i = u32::from(c) - u32::from(base);
        usize::try_from(i).ok().and_then(|i| table.get(i)).copied()
    };
    match c {
        '0'..='9' => 0.696,
        ' ' => 0.348,
        '.' | ',' => 0.38,
        '-' => 0.415,
        '°' => 0.5,
        'a'..='z' => at(&LOWER, 'a').unwrap_or(0.8),
        'A'..='Z' => at(&UPPER, 'A').unwrap_or(0.8),
        _ => 0.8,
    }
}

/// The width of a label's words, em: the characters' advances ([`advance_em`]) and 2 % more.
pub fn width_em(words: &str) -> f64 {
    words.chars().map(advance_em).sum::<f64>() * 1.02
}

/// A label's ink above its baseline, em: capitals, digits and ascenders (0.73 em) with a little
/// room. What a label keeps off the drawing's lines.
pub const ASCENT_EM: f64 = 0.75;
/// A label's ink below its baseline, em: descenders.
pub const DESCENT_EM: f64 = 0.25;
/// A label's text box above its baseline, em: the font's ascent (DejaVu Sans's 0.93 em; the
/// box the browser gives, which is taller than the ink). What a label keeps off other labels'
/// boxes and inside the view box.
pub const BOX_ASCENT_EM: f64 = 0.93;
/// A label's text box below its baseline, em: the font's descent.
pub const BOX_DESCENT_EM: f64 = 0.24;
/// The labels' paper-coloured halo on each side of the type, mm (half of `stroke-width: 18` on
/// `.bike-drawing .label` in web/style.css): what a label's box keeps off lines and other boxes.
pub const HALO_MM: f64 = 9.0;

/// The ink of a label `width` em wide ([`width_em`]) in type of `em` mm, its baseline's anchor
/// point at `at` (`start`, `middle` or `end` of the words, as SVG's `text-anchor`).
pub fn ink_rect(at: Xy, anchor: &str, width: f64, em: f64) -> Rect {
    let x0 = left(at[0], anchor, width * em);
    [
        x0,
        at[1] - DESCENT_EM * em,
        x0 + width * em,
        at[1] + ASCENT_EM * em,
    ]
}

/// The text box of the same label ([`BOX_ASCENT_EM`], [`BOX_DESCENT_EM`]).
pub fn box_rect(at: Xy, anchor: &str, width: f64, em: f64) -> Rect {
    let x0 = left(at[0], anchor, width * em);
    [
        x0,
        at[1] - BOX_DESCENT_EM * em,
        x0 + width * em,
        at[1] + BOX_ASCENT_EM * em,
    ]
}

/// The left end of words `w` wide anchored at `x`.
fn left(x: f64, anchor: &str, w: f64) -> f64 {
    match anchor {
        "middle" => x - w / 2.0,
        "end" => x - w,
        _ => x,
    }
}

/// The rectangle grown by `m` on every side.
pub fn grow(r: Rect, m: f64) -> Rect {
    [r[0] - m, r[1] - m, r[2] + m, r[3] + m]
}

/// Whether two rectangles overlap (touching edges do not).
pub fn overlap(a: Rect, b: Rect) -> bool {
    a[0] < b[2] && b[0] < a[2] && a[1] < b[3] && b[1] < a[3]
}

/// Distance from a point to a rectangle (0 inside).
pub fn point_rect(p: Xy, r: Rect) -> f64 {
    let dx = (r[0] - p[0]).max(p[0] - r[2]).max(0.0);
    let dy = (r[1] - p[1]).max(p[1] - r[3]).max(0.0);
    (dx * dx + dy * dy).sqrt()
}

/// Distance from a point to the segment `a`–`b`.
fn point_seg(p: Xy, a: Xy, b: Xy) -> f64 {
    let (dx, dy) = (b[0] - a[0], b[1] - a[1]);
    let len2 = dx * dx + dy * dy;
    let t = if len2 > 0.0 {
        (((p[0] - a[0]) * dx + (p[1] - a[1]) * dy) / len2).clamp(0.0, 1.0)
    } else {
        0.0
    };
    {
        let (ex, ey) = (p[0] - a[0] - t * dx, p[1] - a[1] - t * dy);
        (ex * ex + ey * ey).sqrt()
    }
}

/// Whether the segment `a`–`b` passes through the rectangle (touching counts): their boxes
/// overlap and the rectangle's corners do not all lie on one side of the segment's line (the
/// separating axes of a segment and a rectangle).
fn seg_hits_rect(a: Xy, b: Xy, r: Rect) -> bool {
    if a[0].max(b[0]) < r[0]
        || a[0].min(b[0]) > r[2]
        || a[1].max(b[1]) < r[1]
        || a[1].min(b[1]) > r[3]
    {
        return false;
    }
    let d = [b[0] - a[0], b[1] - a[1]];
    let side = |x: f64, y: f64| d[0] * (y - a[1]) - d[1] * (x - a[0]);
    let s = [
        side(r[0], r[1]),
        side(r[2], r[1]),
        side(r[2], r[3]),
        side(r[0], r[3]),
    ];
    !(s.iter().all(|&v| v > 0.0) || s.iter().all(|&v| v < 0.0))
}

/// Distance from the segment `a`–`b` to a rectangle (0 when it passes through): for two convex
/// shapes apart, the nearest pair has a corner of one on the other.
pub fn seg_rect(a: Xy, b: Xy, r: Rect) -> f64 {
    if seg_hits_rect(a, b, r) {
        return 0.0;
    }
    let corners = [[r[0], r[1]], [r[2], r[1]], [r[2], r[3]], [r[0], r[3]]];
    let ends = point_rect(a, r).min(point_rect(b, r));
    corners
        .iter()
        .map(|&c| point_seg(c, a, b))
        .fold(ends, f64::min)
}

/// A drawn shape a label keeps off.
#[derive(Debug, Clone, Copy)]
pub enum Shape {
    /// A line from `a` to `b`, drawn `half` wide on each side.
    Seg {
        /// One end.
        a: Xy,
        /// The other end.
        b: Xy,
        /// Half the stroke width, mm.
        half: f64,
    },
    /// A circle of radius `r` stroked `half` wide on each side (a tyre, a rim).
    Ring {
        /// Centre.
        c: Xy,
        /// Radius.
        r: f64,
        /// Half the stroke width, mm.
        half: f64,
    },
    /// A filled disc (a head, a hub, the centre-of-mass mark).
    Disc {
        /// Centre.
        c: Xy,
        /// Radius, its stroke included.
        r: f64,
    },
}

impl Shape {
    /// Distance from the shape's centre line (or its disc) to the rectangle.
    pub fn distance(&self, r: Rect) -> f64 {
        match *self {
            Shape::Seg { a, b, .. } => seg_rect(a, b, r),
            Shape::Disc { c, r: radius } => (point_rect(c, r) - radius).max(0.0),
            Shape::Ring { c, r: radius, .. } => (point_rect(c, r) - radius).max(0.0),
        }
    }

    /// Whether the shape comes within `m` of the rectangle (a segment's test counts the
    /// rectangle's corners as square, up to 0.41 of `m` and the half width more).
    pub fn meets(&self, r: Rect, m: f64) -> bool {
        match *self {
            // The segment through the rectangle grown by the stroke and the margin: at the
            // corners a little more than the exact distance, never less.
            Shape::Seg { a, b, half } => seg_hits_rect(a, b, grow(r, half + m)),
            Shape::Disc { c, r: radius } => point_rect(c, r) < radius + m,
            Shape::Ring { c, r: radius, half } => {
                let far = [[r[0], r[1]], [r[2], r[1]], [r[2], r[3]], [r[0], r[3]]]
                    .iter()
                    .map(|p| (p[0] - c[0]).powi(2) + (p[1] - c[1]).powi(2))
                    .fold(0.0, f64::max);
                point_rect(c, r) < radius + half + m && far > (radius - half - m).max(0.0).powi(2)
            }
        }
    }
}

/// What crossing a shape costs: a frame tube, the fork or a tyre most, then the other parts of
/// the bike, the centre-of-mass mark, the rider's limbs (drawn see-through), a rim or hub, and
/// least a thin line (the dimension and tip lines, the steering axis, the ground, the stock
/// ghost): a label crosses a dashed line rather than a tube.
pub mod cost {
    /// A frame tube, the fork, a tyre.
    pub const FRAME: f64 = 100.0;
    /// Cockpit, seatpost, saddle, cranks, pedals.
    pub const PART: f64 = 80.0;
    /// The centre-of-mass mark.
    pub const MARK: f64 = 60.0;
    /// A limb, the torso or the head of the rider.
    pub const LIMB: f64 = 30.0;
    /// A rim or a hub.
    pub const RIM: f64 = 20.0;
    /// A thin line.
    pub const THIN: f64 = 3.0;
    /// Overlapping another label or leaving the view box: never, while a clear spot exists.
    pub const NEVER: f64 = 1.0e6;
}

/// A shape, what crossing it costs, and the box within which a label's ink meets it.
#[derive(Debug, Clone, Copy)]
pub struct Obstacle {
    /// The shape.
    pub shape: Shape,
    /// Its cost ([`cost`]).
    pub cost: f64,
    /// The shape's bounding box grown by its half width and [`HALO_MM`]: a label's ink that
    /// does not overlap it keeps clear (a quick test before the exact one).
    reach: Rect,
}

impl Obstacle {
    /// A shape and its cost.
    pub fn new(shape: Shape, cost: f64) -> Self {
        let (lo, hi, m) = match shape {
            Shape::Seg { a, b, half } => (
                [a[0].min(b[0]), a[1].min(b[1])],
                [a[0].max(b[0]), a[1].max(b[1])],
                half,
            ),
            Shape::Ring { c, r, half } => (c, c, r + half),
            Shape::Disc { c, r } => (c, c, r),
        };
        Obstacle {
            shape,
            cost,
            reach: grow([lo[0], lo[1], hi[0], hi[1]], m + HALO_MM),
        }
    }

    /// Whether a label's ink `r` (its halo added) meets the shape.
    pub fn meets(&self, r: Rect) -> bool {
        overlap(self.reach, r) && self.shape.meets(r, HALO_MM)
    }
}

/// A label's spot: its anchor point (on the baseline) and SVG `text-anchor`.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Spot {
    /// The anchor point, kernel axes.
    pub at: Xy,
    /// `start`, `middle` or `end`.
    pub anchor: &'static str,
}

/// A candidate spot and the cost of straying there from the label's first choice.
#[derive(Debug, Clone, Copy)]
pub struct Candidate {
    /// The spot.
    pub spot: Spot,
    /// The cost of straying ([`cost`]'s scale: a thin line crossed is 3).
    pub stray: f64,
}

/// What labels keep off, the view box and the type size.
pub struct Board<'a> {
    /// The view box, kernel axes.
    pub view: Rect,
    /// The type size boxes are estimated in, mm.
    pub em: f64,
    /// Shapes every label keeps off.
    pub shapes: &'a [Obstacle],
    /// Places no label's box may overlap (under the page's buttons).
    pub keep_out: &'a [Rect],
}

impl Board<'_> {
    /// The cheapest of `candidates` for a label `width` em wide that belongs to `target`
    /// (its line or mark), keeping off `extra` shapes (the label's own posture's rider and
    /// lines) and `placed` (the boxes of the labels it may be seen with). Each candidate's stray
    /// grows by [`STRAY_PER_MM`] for each millimetre its box lies farther than [`NEAR_MM`] from
    /// the target; of equal costs the first wins. The first candidate when there is none.
    pub fn choose(
        &self,
        width: f64,
        target: Shape,
        candidates: &[Candidate],
        extra: &[Obstacle],
        placed: &[Rect],
    ) -> Spot {
        let tried: Vec<(f64, Rect, Spot)> = candidates
            .iter()
            .map(|c| {
                let r = ink_rect(c.spot.at, c.spot.anchor, width, self.em);
                let far = (target.distance(r) - NEAR_MM).max(0.0);
                (c.stray + STRAY_PER_MM * far, r, c.spot)
            })
            .collect();
        // Only the shapes within reach of some candidate.
        let all = tried
            .iter()
            .fold([f64::MAX, f64::MAX, f64::MIN, f64::MIN], |u, (_, r, _)| {
                [
                    u[0].min(r[0]),
                    u[1].min(r[1]),
                    u[2].max(r[2]),
                    u[3].max(r[3]),
                ]
            });
        let mut near: Vec<&Obstacle> = self
            .shapes
            .iter()
            .chain(extra)
            .filter(|o| overlap(o.reach, all))
            .collect();
        // The costliest first: a candidate is dropped as soon as it costs more than the best.
        near.sort_unstable_by(|a, b| b.cost.total_cmp(&a.cost));
        let mut best: Option<(f64, Spot)> = None;
        for (stray, r, spot) in tried {
            if best.is_some_and(|(b, _)| stray >= b) {
                continue;
            }
            let mut total = stray;
            let b = box_rect(spot.at, spot.anchor, width, self.em);
            let inside = b[0] >= self.view[0]
                && b[1] >= self.view[1]
                && b[2] <= self.view[2]
                && b[3] <= self.view[3];
            if !inside
                || self.keep_out.iter().any(|k| overlap(b, *k))
                || placed.iter().any(|p| overlap(grow(b, HALO_MM), *p))
            {
                total += cost::NEVER;
            }
            for o in &near {
                if best.is_some_and(|(b, _)| total >= b) {
                    break;
                }
                if o.meets(r) {
                    total += o.cost;
                }
            }
            if best.is_none_or(|(b, _)| total < b) {
                best = Some((total, spot));
            }
        }
        best.map_or(
            candidates.first().map_or(
                Spot {
                    at: [0.0, 0.0],
                    anchor: "start",
                },
                |c| c.spot,
            ),
            |(_, s)| s,
        )
    }
}

/// How far a label's box may lie from its line or mark at no cost, mm: the gap a label keeps
/// from its line and its halo.
pub const NEAR_MM: f64 = 30.0;

/// The cost of each millimetre farther: 60 mm (a thin line's worth) per 3 points, so a label
/// moves about 600 mm rather than cross a limb, never so far as to leave its line for a tube.
pub const STRAY_PER_MM: f64 = 0.05;

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn segments_and_rectangles() {
        let r = [0.0, 0.0, 10.0, 5.0];
        assert_eq!(
            seg_rect([-5.0, 2.0], [15.0, 2.0], r),
            0.0,
            "straight through"
        );
        assert_eq!(seg_rect([2.0, 8.0], [8.0, 8.0], r), 3.0, "above, parallel");
        assert_eq!(
            seg_rect([13.0, 9.0], [20.0, 9.0], r),
            5.0,
            "off the corner (3, 4)"
        );
        assert!((seg_rect([12.0, 0.0], [16.0, 8.0], r) - 2.0).abs() < 1e-12);
        // A diagonal passing the corner (10, 5) at a distance of √2 / 2.
        let d = seg_rect([10.0, 6.0], [11.0, 5.0], r);
        assert!((d - 0.5_f64.sqrt()).abs() < 1e-12, "{d}");
        assert_eq!(point_rect([5.0, 2.0], r), 0.0);
    }

    #[test]
    fn rings_are_met_only_by_their_band() {
        let tyre = Shape::Ring {
            c: [0.0, 0.0],
            r: 100.0,
            half: 10.0,
        };
        assert!(
            !tyre.meets([-20.0, -20.0, 20.0, 20.0], 5.0),
            "inside the rim"
        );
        assert!(
            tyre.meets([-20.0, -20.0, 86.0, 20.0], 5.0),
            "within the halo of the band"
        );
        assert!(!tyre.meets([-20.0, -20.0, 80.0, 20.0], 5.0), "short of it");
        assert!(!tyre.meets([120.0, -20.0, 200.0, 20.0], 5.0), "outside");
        assert!(
            tyre.meets([114.0, -20.0, 200.0, 20.0], 5.0),
            "within the halo"
        );
    }

    #[test]
    fn the_cheapest_clear_candidate_wins() {
        let shapes = [Obstacle::new(
            Shape::Seg {
                a: [0.0, -100.0],
                b: [0.0, 100.0],
                half: 10.0,
            },
            cost::FRAME,
        )];
        let board = Board {
            view: [-1000.0, -1000.0, 1000.0, 1000.0],
            em: 10.0,
            shapes: &shapes,
            keep_out: &[],
        };
        let at = |x: f64, stray: f64| Candidate {
            spot: Spot {
                at: [x, 0.0],
                anchor: "start",
            },
            stray,
        };
        // 3 em: 30 mm wide. On the tube, then clear but over a placed box, then clear.
        let c = [
            at(-20.0, 0.0),
            at(30.0, 1.0),
            at(200.0, 2.0),
            at(980.0, 0.5),
        ];
        let placed = [[25.0, -5.0, 40.0, 5.0]];
        let near = Shape::Disc {
            c: [0.0, 0.0],
            r: 2000.0,
        };
        let s = board.choose(3.0, near, &c, &[], &placed);
        assert_eq!(s.at, [200.0, 0.0], "the last runs out of the view box");
    }
}
