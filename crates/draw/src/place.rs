//! Label placement: each label goes to the cheapest of its candidate spots, where a spot costs
//! what its ink crosses (a frame tube, the fork or a tyre most, a limb less, a thin dashed line
//! little, [`cost`]) plus how far it strays from the label's first choice and from what it
//! belongs to ([`Candidate::stray`]). Another label's box, the view box's edge and the corner
//! under the page's Fit button are never crossed while a spot that keeps clear of them exists.
//!
//! A label's ink and box are estimated from its words ([`width_em`], [`ink_rect`],
//! [`box_rect`]) in the largest type the page uses ([`crate::LABEL_EM_MAX_MM`]); in smaller type
//! they shrink towards the same anchor point and stay inside the larger ones, so a spot clear in
//! the largest type is clear in every size. Everything here is in kernel axes (y up): drawing
//! layout, not bike geometry.

use framewise_kernel::report::Xy;

/// A rectangle `[x0, y0, x1, y1]` in kernel axes (y up), `x0 <= x1`, `y0 <= y1`.
pub type Rect = [f64; 4];

/// A character's advance in the labels' type, em: DejaVu Sans Bold's (the `system-ui` of the
/// Debian Chromium the browser tests run in, and among the widest of the usual system fonts:
/// Roboto's and San Francisco's digits are 0.56 and 0.6 em against its 0.7), measured in the
/// browser and rounded up; 0.8 em for a character not listed. The letters' tables are in
/// thousandths of an em (a quarter of the bytes of the floats, and the same numbers: a quotient
/// of whole numbers rounds to the nearest float as the literal does).
fn advance_em(c: char) -> f64 {
    const LOWER: [u16; 26] = [
        675, 716, 593, 716, 678, 435, 716, 712, 343, 343, 665, 343, 1042, 712, 687, 716, 716, 493,
        595, 478, 712, 652, 924, 645, 652, 582,
    ];
    const UPPER: [u16; 26] = [
        774, 762, 734, 830, 683, 683, 821, 837, 372, 372, 775, 637, 995, 837, 850, 733, 850, 770,
        720, 682, 812, 774, 1103, 771, 724, 725,
    ];
    let at = |table: &[u16; 26], base: char| {
        let i = u32::from(c).checked_sub(u32::from(base))?;
        let m = usize::try_from(i).ok().and_then(|i| table.get(i))?;
        Some(f64::from(*m) / 1000.0)
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

/// Which point of a label's words its anchor point is (SVG's `text-anchor`).
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Anchor {
    /// The words' start (left end).
    Start,
    /// Their middle.
    Middle,
    /// Their end (right end).
    End,
}

impl Anchor {
    /// The `text-anchor` value.
    pub fn svg(self) -> &'static str {
        match self {
            Anchor::Start => "start",
            Anchor::Middle => "middle",
            Anchor::End => "end",
        }
    }
}

/// The ink of a label `width` em wide ([`width_em`]) in type of `em` mm, its baseline's anchor
/// point at `at`.
#[inline(always)]
pub fn ink_rect(at: Xy, anchor: Anchor, width: f64, em: f64) -> Rect {
    let x0 = left(at[0], anchor, width * em);
    [
        x0,
        at[1] - DESCENT_EM * em,
        x0 + width * em,
        at[1] + ASCENT_EM * em,
    ]
}

/// The text box of the same label ([`BOX_ASCENT_EM`], [`BOX_DESCENT_EM`]).
#[inline(always)]
pub fn box_rect(at: Xy, anchor: Anchor, width: f64, em: f64) -> Rect {
    let x0 = left(at[0], anchor, width * em);
    [
        x0,
        at[1] - BOX_DESCENT_EM * em,
        x0 + width * em,
        at[1] + BOX_ASCENT_EM * em,
    ]
}

/// The left end of words `w` wide anchored at `x`.
fn left(x: f64, anchor: Anchor, w: f64) -> f64 {
    match anchor {
        Anchor::Middle => x - w / 2.0,
        Anchor::End => x - w,
        Anchor::Start => x,
    }
}

/// The larger of two numbers (a comparison: `f64::max` can be a library call).
fn mx(a: f64, b: f64) -> f64 {
    if a > b {
        a
    } else {
        b
    }
}

/// The smaller of two numbers.
fn mn(a: f64, b: f64) -> f64 {
    if a < b {
        a
    } else {
        b
    }
}

/// The rectangle grown by `m` on every side.
pub fn grow(r: Rect, m: f64) -> Rect {
    [r[0] - m, r[1] - m, r[2] + m, r[3] + m]
}

/// Whether two rectangles overlap (touching edges do not).
#[inline(always)]
pub fn overlap(a: Rect, b: Rect) -> bool {
    a[0] < b[2] && b[0] < a[2] && a[1] < b[3] && b[1] < a[3]
}

/// Distance from a point to a rectangle (0 inside).
#[inline(always)]
pub fn point_rect(p: Xy, r: Rect) -> f64 {
    let dx = mx(mx(r[0] - p[0], p[0] - r[2]), 0.0);
    let dy = mx(mx(r[1] - p[1], p[1] - r[3]), 0.0);
    (dx * dx + dy * dy).sqrt()
}

/// Whether the segment `a`–`b` passes through the rectangle (touching counts): their boxes
/// overlap and the rectangle's corners do not all lie on one side of the segment's line (the
/// separating axes of a segment and a rectangle).
fn seg_hits_rect(a: Xy, b: Xy, r: Rect) -> bool {
    if mx(a[0], b[0]) < r[0]
        || mn(a[0], b[0]) > r[2]
        || mx(a[1], b[1]) < r[1]
        || mn(a[1], b[1]) > r[3]
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
    /// Whether the shape comes within `m` of the rectangle (a segment's test counts the
    /// rectangle's corners as square, up to 0.41 of `m` and the half width more).
    pub fn meets(&self, r: Rect, m: f64) -> bool {
        match *self {
            // The segment through the rectangle grown by the stroke and the margin: at the
            // corners a little more than the exact distance, never less.
            Shape::Seg { a, b, half } => seg_hits_rect(a, b, grow(r, half + m)),
            Shape::Disc { c, r: radius } => point_rect(c, r) < radius + m,
            Shape::Ring { c, r: radius, half } => {
                // The farthest corner, squared: the larger offset on each axis.
                let dx = mx(c[0] - r[0], r[2] - c[0]);
                let dy = mx(c[1] - r[1], r[3] - c[1]);
                let inner = mx(radius - half - m, 0.0);
                point_rect(c, r) < radius + half + m && dx * dx + dy * dy > inner * inner
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
                [mn(a[0], b[0]), mn(a[1], b[1])],
                [mx(a[0], b[0]), mx(a[1], b[1])],
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

/// Sorts obstacles costliest first, keeping the order of equal costs (an insertion sort: a
/// drawing's few dozen shapes come nearly in order, and the library's sort added kilobytes to
/// the page's module). [`Board::choose`] sums the costs in this order, and equal costs in any
/// order give the same sums.
pub fn costliest_first(v: &mut [Obstacle]) {
    for i in 1..v.len() {
        for j in (1..=i).rev() {
            let Some([a, b]) = v.get_mut(j - 1..=j) else {
                break;
            };
            if a.cost >= b.cost {
                break;
            }
            std::mem::swap(a, b);
        }
    }
}

/// A label's spot: its anchor point (on the baseline) and which point of the words it is.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Spot {
    /// The anchor point, kernel axes.
    pub at: Xy,
    /// Which point of the words `at` is.
    pub anchor: Anchor,
}

/// A candidate spot and the cost of straying there from the label's first choice.
#[derive(Debug, Clone, Copy)]
pub struct Candidate {
    /// The spot.
    pub spot: Spot,
    /// The cost of straying there, on [`cost`]'s scale (a thin line crossed is 3): from the
    /// label's first choice, and [`STRAY_PER_MM`] a millimetre farther from what it belongs to.
    pub stray: f64,
}

/// What labels keep off, the view box and the type size; and buffers reused from one label
/// to the next.
pub struct Board<'a> {
    /// The view box, kernel axes.
    pub view: Rect,
    /// The type size boxes are estimated in, mm.
    pub em: f64,
    /// Shapes every label keeps off.
    pub shapes: &'a [Obstacle],
    /// Places no label's box may overlap (under the page's buttons).
    pub keep_out: &'a [Rect],
    /// Reused: the candidates' order and the shapes near them.
    pub scratch: Scratch,
}

/// Buffers [`Board::choose`] reuses from one label to the next (a drawing places a dozen).
#[derive(Default)]
pub struct Scratch {
    /// The candidates' indices, the least stray first ([`Board::sort_by_stray`]).
    order: Vec<u16>,
    /// The shapes within reach of some candidate ([`Board::gather_near`]).
    near: Vec<Obstacle>,
}

/// A candidate's stray in whole quarters of a point, up to [`QUARTERS`] − 1.
fn quarter(c: &Candidate) -> usize {
    let q = c.stray * 4.0;
    if q >= (QUARTERS - 1) as f64 {
        QUARTERS - 1
    } else if q > 0.0 {
        q as usize
    } else {
        0
    }
}

impl Board<'_> {
    /// The cheapest of `candidates` for a label `width` em wide, keeping off `extra` shapes (the
    /// label's own posture's rider and lines) and `placed` (the text boxes, [`box_rect`], of the
    /// labels it may be seen with), and inside the view box and off [`Board::keep_out`]; of
    /// equal costs, one of the least stray. The first candidate when none keeps inside and off
    /// the other labels.
    pub fn choose(
        &mut self,
        width: f64,
        candidates: &[Candidate],
        extra: &[Obstacle],
        placed: &[Rect],
    ) -> Spot {
        let all = self.sort_by_stray(candidates, width);
        self.gather_near(all, extra);
        let mut best = (f64::INFINITY, candidates.first().map(|c| c.spot));
        for &i in &self.scratch.order {
            let Some(c) = candidates.get(usize::from(i)) else {
                continue;
            };
            // Once a candidate's quarter costs as much as the best, so does every later one's.
            if quarter(c) as f64 / 4.0 >= best.0 {
                break;
            }
            if c.stray >= best.0 || !self.clear(c.spot, width, placed) {
                continue;
            }
            let r = ink_rect(c.spot.at, c.spot.anchor, width, self.em);
            let total = crossed(&self.scratch.near, r, c.stray, best.0);
            if total < best.0 {
                best = (total, Some(c.spot));
            }
        }
        best.1.unwrap_or(Spot {
            at: [0.0, 0.0],
            anchor: Anchor::Start,
        })
    }

    /// Puts the candidates' indices in [`Scratch::order`], the least stray first, by a counting
    /// sort on whole quarters of a point ([`quarter`]; a tenth of the work of sorting the
    /// floats, equal quarters in their given order); and returns the box holding every
    /// candidate's ink, for a label `width` em wide.
    fn sort_by_stray(&mut self, candidates: &[Candidate], width: f64) -> Rect {
        let mut starts = [0u16; QUARTERS];
        let mut top = 0;
        let mut all = [f64::MAX, f64::MAX, f64::MIN, f64::MIN];
        for c in candidates {
            let q = quarter(c);
            if let Some(n) = starts.get_mut(q) {
                *n += 1;
            }
            top = top.max(q);
            let r = ink_rect(c.spot.at, c.spot.anchor, width, self.em);
            all = [
                mn(all[0], r[0]),
                mn(all[1], r[1]),
                mx(all[2], r[2]),
                mx(all[3], r[3]),
            ];
        }
        // Each quarter's count becomes where its first candidate goes.
        let mut sum = 0;
        for n in starts.get_mut(..=top).unwrap_or_default() {
            let count = *n;
            *n = sum;
            sum += count;
        }
        let order = &mut self.scratch.order;
        order.clear();
        order.resize(candidates.len(), 0);
        for (i, c) in candidates.iter().enumerate() {
            if let Some(at) = starts.get_mut(quarter(c)) {
                if let Some(slot) = order.get_mut(usize::from(*at)) {
                    *slot = i as u16;
                }
                *at += 1;
            }
        }
        all
    }

    /// Keeps in [`Scratch::near`] the shapes within reach of `all` (every candidate's ink), the
    /// costliest first as given: [`crossed`] stops once a candidate costs more than the best.
    fn gather_near(&mut self, all: Rect, extra: &[Obstacle]) {
        let near = &mut self.scratch.near;
        near.clear();
        for list in [self.shapes, extra] {
            for o in list {
                if overlap(o.reach, all) {
                    near.push(*o);
                }
            }
        }
    }

    /// Whether a label `width` em wide at `spot` keeps inside the view box, off
    /// [`Board::keep_out`] and, its halo added, off the text boxes `placed`.
    fn clear(&self, spot: Spot, width: f64, placed: &[Rect]) -> bool {
        let b = box_rect(spot.at, spot.anchor, width, self.em);
        let inside = b[0] >= self.view[0]
            && b[1] >= self.view[1]
            && b[2] <= self.view[2]
            && b[3] <= self.view[3];
        let halo = grow(b, HALO_MM);
        inside
            && !self.keep_out.iter().any(|k| overlap(b, *k))
            && !placed.iter().any(|p| overlap(halo, *p))
    }
}

/// `stray` and the costs of the shapes of `near` that the ink `r` meets, added in their order;
/// as soon as the sum reaches `best`, that partial sum (the candidate has lost: costs are not
/// negative). The sum changes only where a shape is met, so it is compared only there.
fn crossed(near: &[Obstacle], r: Rect, stray: f64, best: f64) -> f64 {
    let mut total = stray;
    for o in near {
        if o.meets(r) {
            total += o.cost;
            if total >= best {
                break;
            }
        }
    }
    total
}

/// How many quarter points of stray the candidates are sorted into ([`Board::sort_by_stray`]):
/// up to 32 points, more is sorted last.
const QUARTERS: usize = 128;

/// The stray cost of each millimetre a label lies farther from what it belongs to: 60 mm per
/// thin line crossed ([`cost::THIN`]), 600 mm per limb ([`cost::LIMB`]).
pub const STRAY_PER_MM: f64 = 0.05;

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn segments_and_rectangles() {
        let r = [0.0, 0.0, 10.0, 5.0];
        assert!(
            seg_hits_rect([-5.0, 2.0], [15.0, 2.0], r),
            "straight through"
        );
        assert!(seg_hits_rect([2.0, 2.0], [3.0, 3.0], r), "inside");
        assert!(
            !seg_hits_rect([10.0, 6.0], [11.0, 5.0], r),
            "0.7 off the corner (10, 5)"
        );
        assert!(!seg_hits_rect([2.0, 8.0], [8.0, 8.0], r), "above, parallel");
        // Its box overlaps the rectangle's, but it passes the corner (10, 5) above and right.
        assert!(
            !seg_hits_rect([9.0, 7.0], [13.0, 4.0], r),
            "past the corner"
        );
        assert!(
            seg_hits_rect([9.0, 5.5], [13.0, 2.5], r),
            "cutting the corner"
        );
        assert_eq!(point_rect([5.0, 2.0], r), 0.0);
        assert_eq!(point_rect([13.0, 9.0], r), 5.0, "off the corner by (3, 4)");
        let tube = Shape::Seg {
            a: [-5.0, 8.0],
            b: [15.0, 8.0],
            half: 2.0,
        };
        assert!(!tube.meets(r, 0.5), "3 mm above, 2.5 mm reach");
        assert!(tube.meets(r, 1.5), "3.5 mm reach");
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
    fn costliest_first_keeps_the_order_of_equal_costs() {
        let disc = |x: f64, cost: f64| {
            Obstacle::new(
                Shape::Disc {
                    c: [x, 0.0],
                    r: 1.0,
                },
                cost,
            )
        };
        let mut v = [
            disc(0.0, cost::THIN),
            disc(1.0, cost::FRAME),
            disc(2.0, cost::THIN),
            disc(3.0, cost::LIMB),
            disc(4.0, cost::FRAME),
        ];
        costliest_first(&mut v);
        let got: Vec<(f64, f64)> = v
            .iter()
            .map(|o| match o.shape {
                Shape::Disc { c, .. } => (o.cost, c[0]),
                _ => (o.cost, f64::NAN),
            })
            .collect();
        let want = [
            (cost::FRAME, 1.0),
            (cost::FRAME, 4.0),
            (cost::LIMB, 3.0),
            (cost::THIN, 0.0),
            (cost::THIN, 2.0),
        ];
        assert_eq!(got, want);
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
        let mut board = Board {
            view: [-1000.0, -1000.0, 1000.0, 1000.0],
            em: 10.0,
            shapes: &shapes,
            keep_out: &[],
            scratch: Scratch::default(),
        };
        let at = |x: f64, stray: f64| Candidate {
            spot: Spot {
                at: [x, 0.0],
                anchor: Anchor::Start,
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
        let s = board.choose(3.0, &c, &[], &placed);
        assert_eq!(s.at, [200.0, 0.0], "the last runs out of the view box");
    }
}
