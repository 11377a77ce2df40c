//! Where every label of a drawing goes: the dimension labels (shown with either posture) and
//! the handling limits of each posture, placed by [`crate::place`] so that none crosses a frame
//! tube, the fork, a tyre or another label it can be seen with, and each stays next to the line
//! or mark it belongs to.
//!
//! Order: the dimensions first (their lines are fixed, so their labels have the fewest good
//! spots), below the ground before above it; then each posture's limits, braking, descent and
//! climb. A dimension label keeps off both riders; a posture's limits keep off that posture's
//! rider and every dimension label, shown or not, so that showing the dimensions moves nothing.

use crate::dims::{self, Below, Dim};
use crate::place::{
    box_rect, cost, costliest_first, width_em,
    Anchor::{self, End, Middle, Start},
    Board, Candidate, Obstacle, Rect, Scratch, Shape, Spot, ASCENT_EM, DESCENT_EM, HALO_MM,
    STRAY_PER_MM,
};
use crate::{Scene, ViewBox, LABEL_EM_MAX_MM as EM};
use framewise_kernel::report::{RiderFigure, Xy};
use framewise_kernel::Outline;

/// The gap between a label's ink and the line it sits beside, mm: its halo and a little more,
/// so that the halo does not cut the line.
const GAP: f64 = HALO_MM + 6.0;

/// The baseline that puts a label's ink `gap` above `y`.
fn above(y: f64, gap: f64) -> f64 {
    y + gap + DESCENT_EM * EM
}

/// The baseline that puts a label's ink `gap` below `y`.
fn below(y: f64, gap: f64) -> f64 {
    y - gap - ASCENT_EM * EM
}

/// The baseline that centres a label's ink (in the largest type) on `y`.
fn level(y: f64) -> f64 {
    y - (ASCENT_EM - DESCENT_EM) / 2.0 * EM
}

/// Adds a candidate anchored at `(x, y)`.
fn put(v: &mut Vec<Candidate>, x: f64, y: f64, anchor: Anchor, stray: f64) {
    v.push(Candidate {
        spot: Spot { at: [x, y], anchor },
        stray,
    });
}

/// The step of the handling labels' positions, mm: a label stays put while the centre of mass
/// moves less than this, so most edits do not lay its text out again (about 1.5 px on a phone).
pub const LABEL_STEP_MM: f64 = 10.0;

/// `v` rounded to the nearest whole number, halves away from zero: `f64::round`, but by a
/// truncation and a comparison (in wasm `round` is a library call, `trunc` an instruction; the
/// fraction `v − trunc(v)` is exact).
fn round(v: f64) -> f64 {
    let t = v.trunc();
    if (v - t).abs() >= 0.5 {
        t + 1f64.copysign(v)
    } else {
        t
    }
}

/// Moves every candidate's anchor point to the nearest point of the [`LABEL_STEP_MM`] grid.
fn snap(v: &mut [Candidate]) {
    let on_grid = |v: f64| round(v / LABEL_STEP_MM) * LABEL_STEP_MM;
    for c in v {
        c.spot.at = [on_grid(c.spot.at[0]), on_grid(c.spot.at[1])];
    }
}

/// A label placed: its spot and its words.
#[derive(Debug, Clone, PartialEq)]
pub struct Placed {
    /// Where it goes.
    pub spot: Spot,
    /// What it says.
    pub words: String,
}

/// One posture's handling labels.
#[derive(Debug, Clone, Default)]
pub struct LimitSpots {
    /// "braking limit …".
    pub braking: Option<Placed>,
    /// "descent …°".
    pub descent: Option<Placed>,
    /// "climb …°".
    pub climb: Option<Placed>,
}

/// Every label, placed.
#[derive(Debug, Clone, Default)]
pub struct Spots {
    /// The dimension labels: key (`reach_mm` …) and label.
    pub dims: Vec<(&'static str, Placed)>,
    /// The seated limits.
    pub seated: LimitSpots,
    /// The standing limits.
    pub standing: LimitSpots,
}

impl Spots {
    /// The dimension label of a key, taken out.
    pub fn take_dim(&mut self, key: &str) -> Option<Placed> {
        let i = self.dims.iter().position(|(k, _)| *k == key)?;
        Some(self.dims.swap_remove(i).1)
    }
}

fn seg(a: Xy, b: Xy, half: f64, cost: f64) -> Obstacle {
    Obstacle::new(Shape::Seg { a, b, half }, cost)
}

fn disc(c: Xy, r: f64, cost: f64) -> Obstacle {
    Obstacle::new(Shape::Disc { c, r }, cost)
}

fn ring(c: Xy, r: f64, half: f64, cost: f64) -> Obstacle {
    Obstacle::new(Shape::Ring { c, r, half }, cost)
}

/// Half a thin line's width, mm (1–2 px on the screen, about 10 mm on a phone).
const THIN_HALF: f64 = 4.0;

/// The frame's points, named by the constants below: head tube bottom, BB, rear axle, seat tube
/// top, head tube top, crown, fork leg top, front axle.
fn frame_points<'a>(o: &'a Outline, bb: &'a Xy) -> [&'a Xy; 8] {
    [
        &o.head_bottom,
        bb,
        &o.rear_axle,
        &o.seat_top,
        &o.head_top,
        &o.crown,
        &o.fork_leg_top,
        &o.front_axle,
    ]
}

// Indices into `frame_points`.
const HB: usize = 0;
const BB: usize = 1;
const RA: usize = 2;
const ST: usize = 3;
const HT: usize = 4;
const CR: usize = 5;
const FL: usize = 6;
const FA: usize = 7;

/// The frame's tubes, the head tube and the fork as pairs of [`frame_points`], with half their
/// stroke widths in web/style.css.
const TUBES: [(usize, usize, f64); 9] = [
    (HB, BB, 13.0),
    (BB, RA, 13.0),
    (RA, ST, 13.0),
    (ST, HT, 13.0),
    (BB, ST, 13.0),
    (CR, FL, 13.0),
    (HT, HB, 20.0),
    (HB, CR, 17.0),
    (FL, FA, 10.0),
];

/// The stock ghost's tubes and fork as pairs of [`frame_points`] (the ghost's head tube and
/// crown are one line).
const GHOST_TUBES: [(usize, usize); 7] = [
    (HB, BB),
    (BB, RA),
    (RA, ST),
    (ST, HT),
    (BB, ST),
    (HT, CR),
    (FL, FA),
];

/// The bike's parts as shapes, with half their stroke widths in web/style.css.
fn bike(o: &Outline, out: &mut Vec<Obstacle>) {
    use cost::{FRAME, PART, RIM};
    let bb = [0.0, 0.0];
    let p = frame_points(o, &bb);
    for (i, j, half) in TUBES {
        if let (Some(&&a), Some(&&b)) = (p.get(i), p.get(j)) {
            out.push(seg(a, b, half, FRAME));
        }
    }
    for (&c, r, rim) in [
        (&o.rear_axle, o.rear_radius, o.rear_rim_radius),
        (&o.front_axle, o.front_radius, o.front_rim_radius),
    ] {
        out.push(ring(c, r, 15.0, FRAME));
        if rim > 0.0 {
            out.push(ring(c, rim, 4.0, RIM));
        }
        out.push(disc(c, 10.0, RIM));
    }
    out.push(disc(bb, 27.0, PART));
    if let Some(c) = &o.cockpit {
        out.push(seg(o.head_top, c.headset_top, 17.0, PART));
        out.push(seg(c.headset_top, c.spacers_top, 15.0, PART));
        out.push(seg(c.spacers_top, c.steerer_top, 17.0, PART));
        out.push(seg(c.stem_clamp, c.bar_clamp, 13.0, PART));
        out.push(seg(c.bar_clamp, c.grip, 9.0, PART));
        out.push(disc(c.grip, 16.0, PART));
    }
    if let Some(s) = &o.seat {
        out.push(seg(s.post_exit, s.post_top, 11.0, PART));
        out.push(seg(s.post_top, s.saddle, 6.0, PART));
        out.push(seg(s.saddle_tail, s.saddle_nose, 13.0, PART));
    }
    if let Some(c) = &o.cranks {
        for &p in [&c.pedal_near, &c.pedal_far] {
            out.push(seg(bb, p, 9.0, PART));
            out.push(seg([p[0] - 45.0, p[1]], [p[0] + 45.0, p[1]], 7.0, PART));
        }
    }
}

/// Whether two points lie within 2 mm of each other on both axes.
fn same(a: Xy, b: Xy) -> bool {
    (a[0] - b[0]).abs() < 2.0 && (a[1] - b[1]).abs() < 2.0
}

/// The stock ghost's thin dashed outline: its tubes, fork and tyres, where they are not under
/// the ridden bike's (with no changes the ghost lies under the ridden bike, hidden).
fn ghost(g: &Outline, g_bb: Xy, o: &Outline, out: &mut Vec<Obstacle>) {
    let (gp, op) = (frame_points(g, &g_bb), frame_points(o, &[0.0, 0.0]));
    for (i, j) in GHOST_TUBES {
        let (Some(&&a), Some(&&b), Some(&&ra), Some(&&rb)) =
            (gp.get(i), gp.get(j), op.get(i), op.get(j))
        else {
            continue;
        };
        if !(same(a, ra) && same(b, rb)) {
            out.push(seg(a, b, THIN_HALF, cost::THIN));
        }
    }
    for (&c, r, &rc, rr) in [
        (&g.rear_axle, g.rear_radius, &o.rear_axle, o.rear_radius),
        (&g.front_axle, g.front_radius, &o.front_axle, o.front_radius),
    ] {
        if !(same(c, rc) && (r - rr).abs() < 2.0) {
            out.push(ring(c, r, THIN_HALF, cost::THIN));
        }
    }
}

/// One posture's rider, centre-of-mass mark and tip lines.
fn posture(o: &Outline, f: Option<&RiderFigure>, com: Option<Xy>, out: &mut Vec<Obstacle>) {
    use cost::{LIMB, MARK, THIN};
    if let Some(c) = com {
        out.push(disc(c, 28.0, MARK));
    }
    if let Some(f) = f {
        out.push(seg(f.hip, f.shoulder, 30.0, LIMB));
        out.push(seg(f.shoulder, f.head, 19.0, LIMB));
        out.push(seg(f.shoulder, f.elbow, 19.0, LIMB));
        out.push(seg(f.elbow, f.hand, 19.0, LIMB));
        out.push(disc(f.head, f.head_radius, LIMB));
        for l in &f.legs {
            out.push(seg(f.hip, l.knee, 19.0, LIMB));
            out.push(seg(l.knee, l.ankle, 19.0, LIMB));
            for (a, b) in [(&l.ankle, &l.heel), (&l.heel, &l.toe), (&l.toe, &l.ball)] {
                out.push(seg(*a, *b, 7.0, LIMB));
            }
        }
    }
    if let Some(c) = com {
        out.push(seg(c, o.rear_contact, THIN_HALF, THIN));
        out.push(seg(c, o.front_contact, THIN_HALF, THIN));
    }
}

/// The view box in kernel axes.
fn view_rect(v: &ViewBox) -> Rect {
    [v.min_x, -v.max_y(), v.max_x(), -v.min_y]
}

/// The corner of the drawing under the page's Fit button (44 px and a 6 px margin at the top
/// right of the drawing's box, web/style.css `.tool.fit`), mm: about 4.2 ems of the type, which
/// the page sets at about 12 px on a phone.
pub const BUTTON_MM: f64 = 4.2 * EM;

/// Candidates on the sides of a point `p` of a slanted line, `d` the line's direction: beside
/// the line on the sides it leaves free (for a line up to the right, above-left and
/// below-right), then level with the point on either side; each [`GAP`] off the line and 60 mm
/// farther (each millimetre farther a stray of [`STRAY_PER_MM`]).
fn beside(p: Xy, d: Xy, stray: f64, out: &mut Vec<Candidate>) {
    let up_right = d[0] * d[1] > 0.0;
    for far in [0.0, 60.0] {
        let g = GAP + far;
        let s = stray + STRAY_PER_MM * far;
        let (x_right, x_left) = (p[0] + g, p[0] - g);
        let (y_up, y_down) = (above(p[1], g), below(p[1], g));
        if up_right {
            put(out, x_left, y_up, End, s);
            put(out, x_right, y_down, Start, s);
        } else {
            put(out, x_right, y_up, Start, s);
            put(out, x_left, y_down, End, s);
        }
        put(out, x_right, level(p[1]), Start, s + 1.0);
        put(out, x_left, level(p[1]), End, s + 1.0);
    }
}

/// The point a fraction `t` of the way from `a` to `b`.
fn lerp(a: Xy, b: Xy, t: f64) -> Xy {
    [a[0] + (b[0] - a[0]) * t, a[1] + (b[1] - a[1]) * t]
}

/// Candidates in pairs moving apart from `p`, `n` steps of `step` each way: the `k`th pair at
/// `p + k·step` and `p − k·step`, their strays `s + k·per[0]` and `s + k·per[1]` (the last
/// argument is `(s, per)`).
fn pairs(
    v: &mut Vec<Candidate>,
    p: Xy,
    step: Xy,
    n: i32,
    anchor: Anchor,
    (s, per): (f64, [f64; 2]),
) {
    for k in 0..n + 1 {
        let k = f64::from(k);
        put(
            v,
            p[0] + step[0] * k,
            p[1] + step[1] * k,
            anchor,
            s + per[0] * k,
        );
        put(
            v,
            p[0] - step[0] * k,
            p[1] - step[1] * k,
            anchor,
            s + per[1] * k,
        );
    }
}

/// The candidates of each dimension label, first choice first (see [`dims`] for the lines).
fn dim_candidates(o: &Outline, rows: &Below, d: &Dim) -> Vec<Candidate> {
    let mut v = Vec::with_capacity(48);
    let (a, b) = (d.a, d.b);
    match d.key {
        "wheelbase_mm" => {
            // Under the line, centred between the axles or moved along.
            let y = rows.wheelbase_baseline();
            let m = (a[0] + b[0]) / 2.0;
            pairs(&mut v, [m, y], [-50.0, 0.0], 8, Middle, (0.0, [0.3, 0.3]));
        }
        "trail_mm" => {
            // Under its line from the front contact forward (in BB height's row, or the
            // wheelbase label's), else back, else past the steering axis's foot.
            let y = if rows.bb_height {
                rows.upper_baseline()
            } else {
                rows.wheelbase_baseline()
            };
            let (l, r) = (a[0].min(b[0]), a[0].max(b[0]));
            put(&mut v, l, y, Start, 0.0);
            put(&mut v, r, y, End, 1.0);
            put(&mut v, (l + r) / 2.0, y, Middle, 1.0);
            for k in 1..9 {
                let k = f64::from(k);
                put(&mut v, l - 50.0 * k, y, Start, 0.5 * k);
                put(&mut v, r + 50.0 * k, y, Start, 1.0 + 0.5 * k);
            }
        }
        "bb_height_mm" if rows.bb_height => {
            // Under the ground, its line ending on it: centred on the line, else moved back.
            let y = rows.upper_baseline();
            pairs(
                &mut v,
                [a[0], y],
                [-40.0, 0.0],
                10,
                Middle,
                (0.0, [0.3, 0.5]),
            );
        }
        "bb_height_mm" => {
            // Low between the wheels, centred between the axles, the line's foot on it; on the
            // ground line if need be.
            let m = (o.rear_axle[0] + o.front_axle[0]) / 2.0;
            let g = o.ground_y;
            for (row, &y) in [above(g, 4.0), above(g, -10.0), level(g)]
                .iter()
                .enumerate()
            {
                let s = 2.0 * row as f64;
                pairs(&mut v, [m, y], [-40.0, 0.0], 6, Middle, (s, [0.3, 0.3]));
            }
        }
        "stack_mm" => {
            // Right of its line, halfway between the head tube top and the front tyre, else
            // higher or lower; left of it; over its top.
            let x = a[0] + GAP;
            let tyre_top = o.front_axle[1] + o.front_radius + 15.0;
            let mid = level((b[1] + tyre_top) / 2.0);
            pairs(&mut v, [x, mid], [0.0, 20.0], 8, Start, (0.0, [0.3, 0.3]));
            put(&mut v, a[0] - GAP, mid, End, 2.0);
            put(&mut v, a[0], above(b[1], GAP), Middle, 2.0);
            put(&mut v, x, above(b[1], GAP), Start, 2.0);
        }
        "reach_mm" => {
            // Above its line, else below it, else past the head tube, above the line's level
            // or on it, else before the line's start.
            let (x0, x1, y) = (a[0], b[0], a[1]);
            for (k, &t) in [0.5, 0.4, 0.6, 0.3, 0.7, 0.2, 0.8].iter().enumerate() {
                let x = x0 + (x1 - x0) * t;
                let s = 0.3 * k as f64;
                put(&mut v, x, above(y, GAP), Middle, s);
                put(&mut v, x, below(y, GAP), Middle, 2.0 + s);
            }
            put(&mut v, x1, above(y, GAP), End, 1.0);
            put(&mut v, x0, above(y, GAP), Start, 1.0);
            let past = o.head_top[0].max(o.head_bottom[0]) + 20.0 + GAP;
            for k in 0..5 {
                let k = f64::from(k);
                let s = 2.0 + 0.5 * k;
                let x = past + 30.0 * k;
                put(&mut v, x, above(y, GAP), Start, s);
                put(&mut v, x, level(y), Start, s + 0.5);
            }
            put(&mut v, x0 - GAP, level(y), End, 3.0);
            // Past the cockpit (a long stem, a drop bar's hoods).
            if let Some(c) = &o.cockpit {
                let past = [c.steerer_top[0], c.bar_clamp[0], c.grip[0]]
                    .iter()
                    .fold(past, |m, x| m.max(x + 16.0 + GAP));
                // Each millimetre past the head tube top a stray.
                let s = 3.0 + STRAY_PER_MM * (past - x1);
                for (k, &yb) in [level(y), above(y, GAP), below(y, GAP)].iter().enumerate() {
                    put(&mut v, past, yb, Start, s + 0.5 * k as f64);
                }
            }
        }
        "bb_to_grip_mm" => {
            // Beyond the grip, else beside the line.
            let x = b[0] + dims::GRIP_LABEL_AHEAD;
            let y = b[1] + dims::GRIP_LABEL_RISE;
            pairs(&mut v, [x, y], [0.0, 20.0], 8, Start, (0.0, [0.3, 0.3]));
            let d = [b[0] - a[0], b[1] - a[1]];
            for (k, &t) in [0.8, 0.65, 0.5].iter().enumerate() {
                beside(lerp(a, b, t), d, 2.0 + k as f64, &mut v);
            }
        }
        _ => {}
    }
    v
}

/// How far a slope limit's spots beside its line are also tried higher, mm: three steps of the
/// [`LABEL_STEP_MM`] grid (with two, the climb of a small rider on a tall frame with small
/// wheels still lay on the rear tyre, 0.5 mm too low; lower ones as well placed nothing better
/// in the tests' 270 views, for a third more candidates).
const NUDGE_MM: f64 = 30.0;

/// The candidates of a slope limit on its tip line from the centre of mass `c` to a contact
/// under the axle `axle`: beside the line, from its middle outwards, each also [`NUDGE_MM`]
/// higher (half a point of stray more); then inside the wheel,
/// under the hub or over it (the line crosses the wheel on its way to the contact); on the
/// [`LABEL_STEP_MM`] grid.
fn tip_candidates(c: Xy, contact: Xy, axle: Xy) -> Vec<Candidate> {
    let mut v = Vec::with_capacity(192);
    let d = [contact[0] - c[0], contact[1] - c[1]];
    for (k, &t) in [0.5, 0.35, 0.65, 0.2, 0.8].iter().enumerate() {
        beside(lerp(c, contact, t), d, 0.5 * k as f64, &mut v);
    }
    // Each of those also a little higher: beside a climb's line, the room between the rear
    // tyre's top and the saddle can be a few millimetres taller than the label.
    for i in 0..v.len() {
        if let Some(&c) = v.get(i) {
            let (x, y) = (c.spot.at[0], c.spot.at[1] + NUDGE_MM);
            put(&mut v, x, y, c.spot.anchor, c.stray + 0.5);
        }
    }
    // Inside the wheel, where nothing beside the line is clear: under the hub (and lower, under
    // a chainstay sloping from the hub), or over it; centred on the axle or moved along.
    for k in 0..5 {
        let dx = 40.0 * f64::from(k);
        for x in [axle[0] - dx, axle[0] + dx] {
            for (j, &drop) in [0.0, 40.0, 80.0].iter().enumerate() {
                let s = 4.0 + 0.3 * f64::from(k) + 0.5 * j as f64;
                put(&mut v, x, below(axle[1], 10.0 + GAP + drop), Middle, s);
            }
            put(
                &mut v,
                x,
                above(axle[1], 10.0 + GAP),
                Middle,
                5.0 + 0.3 * f64::from(k),
            );
        }
    }
    snap(&mut v);
    v
}

/// The candidates of the braking limit, `width` mm wide, written by the centre of mass `c`:
/// right of it and a little above, else higher or farther right (each millimetre farther a
/// stray of [`STRAY_PER_MM`]), else left of it, else under it; and in each row above it, the
/// spots flush with the view box's edges `view` (a small bike's view box is about twice the
/// label's width, so that the spots on the 100 mm steps can all run out of it or over the
/// rider's arm); on the [`LABEL_STEP_MM`] grid.
fn braking_candidates(c: Xy, view: Rect, width: f64) -> Vec<Candidate> {
    let mut v = Vec::with_capacity(160);
    // How far a box's corner `(dx, dy)` from the mark's centre lies from its edge.
    let stray = |dx: f64, dy: f64, k: f64| STRAY_PER_MM * (dx.hypot(dy) - 30.0) + 0.1 * k;
    for i in 0..5 {
        for j in 0..8 {
            let (fi, fj) = (f64::from(i), f64::from(j));
            let y = c[1] + 30.0 + 50.0 * fj;
            let s = stray(40.0 + 100.0 * fi, 30.0 + 50.0 * fj, fi + fj);
            put(&mut v, c[0] + 40.0 + 100.0 * fi, y, Start, s);
            put(&mut v, c[0] - 40.0 - 100.0 * fi, y, End, s + 1.0);
            if j < 4 {
                let y = c[1] - 30.0 - ASCENT_EM * EM - 50.0 * fj;
                put(&mut v, c[0] + 40.0 + 100.0 * fi, y, Start, s + 2.0);
            }
        }
    }
    snap(&mut v);
    // Flush with the edges, on the grid inside them.
    let (right, left) = (
        ((view[2] - width) / LABEL_STEP_MM).floor() * LABEL_STEP_MM,
        ((view[0] + width) / LABEL_STEP_MM).ceil() * LABEL_STEP_MM,
    );
    for j in 0..8 {
        let fj = f64::from(j);
        let y = round((c[1] + 30.0 + 50.0 * fj) / LABEL_STEP_MM) * LABEL_STEP_MM;
        if right > c[0] + 40.0 {
            put(
                &mut v,
                right,
                y,
                Start,
                stray(right - c[0], y - c[1], fj) + 0.5,
            );
        }
        if left < c[0] - 40.0 {
            put(&mut v, left, y, End, stray(c[0] - left, y - c[1], fj) + 1.5);
        }
    }
    v
}

/// Every label's spot in a scene's drawing fitted to `fit`, its rows below the ground `below`,
/// its stock ghost `g` with the ghost's BB `g_bb` ([`crate::ghost::on_ground`]).
pub fn spots(scene: &Scene, below: &Below, fit: &ViewBox, (g, g_bb): (&Outline, Xy)) -> Spots {
    let (o, n) = (scene.ridden, scene.numbers);
    let mut shapes = Vec::with_capacity(96);
    bike(o, &mut shapes);
    ghost(g, g_bb, o, &mut shapes);
    let view = view_rect(fit);
    shapes.push(seg(
        [view[0], o.ground_y],
        [view[2], o.ground_y],
        THIN_HALF,
        cost::THIN,
    ));
    shapes.push(seg(o.head_top, o.steer_ground, THIN_HALF, cost::THIN));
    costliest_first(&mut shapes);
    let keep_out = [[view[2] - BUTTON_MM, view[3] - BUTTON_MM, view[2], view[3]]];
    let lines = dims::dims_of(o, below);
    let mut dim_lines = Vec::with_capacity(lines.len());
    for l in &lines {
        dim_lines.push(seg(l.a, l.b, THIN_HALF, cost::THIN));
    }
    let mut seated_rider = Vec::with_capacity(48);
    let mut standing_rider = Vec::with_capacity(48);
    posture(o, o.rider_seated.as_ref(), o.com_seated, &mut seated_rider);
    posture(
        o,
        o.rider_standing.as_ref(),
        o.com_standing,
        &mut standing_rider,
    );
    let mut board = Board {
        view,
        em: EM,
        shapes: &shapes,
        keep_out: &keep_out,
        scratch: Scratch::default(),
    };
    let mut riders = Vec::with_capacity(seated_rider.len() + standing_rider.len() + lines.len());
    riders.extend_from_slice(&seated_rider);
    riders.extend_from_slice(&standing_rider);
    let (dims, mut placed) = dim_spots(&mut board, o, n, below, &lines, &dim_lines, riders);
    seated_rider.extend_from_slice(&dim_lines);
    standing_rider.extend_from_slice(&dim_lines);
    Spots {
        dims,
        seated: limit_spots(
            &mut board,
            o,
            &scene.seated,
            o.com_seated,
            &seated_rider,
            &mut placed,
        ),
        standing: limit_spots(
            &mut board,
            o,
            &scene.standing,
            o.com_standing,
            &standing_rider,
            &mut placed,
        ),
    }
}

/// A label of `words` at the cheapest of its `candidates` ([`Board::choose`]), keeping off
/// `extra` and the text boxes `placed`, to which its own is added.
fn place(
    board: &mut Board,
    words: String,
    candidates: &[Candidate],
    extra: &[Obstacle],
    placed: &mut Vec<Rect>,
) -> Placed {
    let width = width_em(&words);
    let spot = board.choose(width, candidates, extra, placed);
    placed.push(box_rect(spot.at, spot.anchor, width, EM));
    Placed { spot, words }
}

/// The dimension labels' spots, below the ground first, then the frame's, then BB to grip,
/// each keeping off both riders (`riders`) and the other dimension lines (`dim_lines`, the
/// shapes of `lines`); and their text boxes.
fn dim_spots(
    board: &mut Board,
    o: &Outline,
    n: &framewise_kernel::report::Numbers,
    below: &Below,
    lines: &[Dim],
    dim_lines: &[Obstacle],
    riders: Vec<Obstacle>,
) -> (Vec<(&'static str, Placed)>, Vec<Rect>) {
    let order = [
        "bb_height_mm",
        "wheelbase_mm",
        "trail_mm",
        "stack_mm",
        "reach_mm",
        "bb_to_grip_mm",
    ];
    let mut spots = Vec::with_capacity(order.len());
    let mut placed: Vec<Rect> = Vec::with_capacity(12);
    let mut extra = riders;
    let rider_count = extra.len();
    for key in order {
        let Some(i) = lines.iter().position(|l| l.key == key) else {
            continue;
        };
        let (Some(d), Some(v)) = (lines.get(i), n.get(key)) else {
            continue;
        };
        extra.truncate(rider_count);
        for (j, line) in dim_lines.iter().enumerate() {
            if j != i {
                extra.push(*line);
            }
        }
        let words = dims::words_of(d.key, *v);
        let candidates = dim_candidates(o, below, d);
        spots.push((d.key, place(board, words, &candidates, &extra, &mut placed)));
    }
    (spots, placed)
}

/// One posture's handling labels' spots (centre of mass `com`; none, no labels), keeping off
/// `extra` (that posture's rider and tip lines, and the dimension lines) and the boxes `placed`
/// (the dimension labels', shown or not; as they were when it returns).
fn limit_spots(
    board: &mut Board,
    o: &Outline,
    limits: &crate::Limits,
    com: Option<Xy>,
    extra: &[Obstacle],
    placed: &mut Vec<Rect>,
) -> LimitSpots {
    let Some(c) = com else {
        return LimitSpots::default();
    };
    let dims = placed.len();
    let mut s = LimitSpots::default();
    if let Some(b) = limits.braking_g {
        let words = crate::figure::braking_words(b);
        let candidates = braking_candidates(c, board.view, width_em(&words) * EM);
        s.braking = Some(place(board, words, &candidates, extra, placed));
    }
    for (deg, contact, axle, front) in [
        (limits.descent_deg, &o.front_contact, &o.front_axle, true),
        (limits.climb_deg, &o.rear_contact, &o.rear_axle, false),
    ] {
        let Some(deg) = deg else { continue };
        let words = crate::figure::slope_words(front, deg);
        let candidates = tip_candidates(c, *contact, *axle);
        let placed = Some(place(board, words, &candidates, extra, placed));
        if front {
            s.descent = placed;
        } else {
            s.climb = placed;
        }
    }
    placed.truncate(dims);
    s
}

#[cfg(test)]
mod tests {
    /// The truncating `round` gives what `f64::round` gives, halves and the largest fractions
    /// below a half included.
    #[test]
    fn round_is_f64_round() {
        let below_half = 0.5 - f64::EPSILON / 4.0;
        for v in [
            0.0,
            -0.0,
            0.3,
            -0.3,
            0.5,
            -0.5,
            below_half,
            -below_half,
            1.5,
            -2.5,
            2.4999999999999996,
            -123.49999999999999,
            4503599627370495.5,
            9007199254740993.0,
            1e300,
            f64::INFINITY,
            f64::NEG_INFINITY,
        ] {
            let (got, want) = (super::round(v), v.round());
            assert_eq!(got.to_bits(), want.to_bits(), "{v}: {got} against {want}");
        }
        assert!(super::round(f64::NAN).is_nan());
    }
}
