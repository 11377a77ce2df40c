//! Drawing primitives from kernel points. Every point passes through [`flip`] exactly once, in
//! [`PathData`] or [`text`]; numbers are written by [`crate::num`].

use crate::model::{Line, Node};
use crate::num::push_mm_bytes;
use framewise_kernel::report::Xy;

/// The one place where kernel coordinates (y up) become SVG coordinates (y down).
pub fn flip(p: Xy) -> (f64, f64) {
    (p[0], -p[1])
}

/// The polylines of one styled part, built from kernel points: each line, polyline and circle
/// is one `<polyline>` (its `points` text); the part becomes one [`Node::Lines`].
///
/// Why polylines and not one `<path>`: in Chromium a path's `d` (like a circle's `cx`, `cy`, `r`
/// or any `transform`) is a CSS property, so changing it restyles the element, about 15 µs an
/// element; a polyline's `points` is not, and changing it costs only the layout (40 changed
/// elements: 0.6–0.7 ms as paths, 0.0–0.1 ms as polylines, docs/BENCHMARKS.md). The number of
/// polylines depends only on which calls were made, never on the numbers, so the drawing's
/// structure stays stable across edits.
#[derive(Debug, Default)]
pub struct PathData(Vec<Vec<u8>>);

/// The largest gap between a circle and the polygon drawn for it, mm: about a pixel at the
/// page's closest zoom (150 mm across a desk drawing, web/ui/zoom.js), a twentieth of one at
/// the fitted view. (At 0.5 mm the tyres' facets showed at the closest zoom.)
const CIRCLE_SAGITTA_MM: f64 = 0.2;
/// Fewest and most vertices of a circle's polygon.
const CIRCLE_VERTICES: (usize, usize) = (12, 128);

/// Vertices of the regular polygon drawn for a circle of radius `r` mm: the fewest for which
/// the sagitta `r (1 − cos(π / n))` stays under [`CIRCLE_SAGITTA_MM`] (within the bounds).
pub fn circle_vertices(r: f64) -> usize {
    let (fewest, most) = CIRCLE_VERTICES;
    if !(r.is_finite() && r > CIRCLE_SAGITTA_MM) {
        return fewest;
    }
    let half_angle = (1.0 - CIRCLE_SAGITTA_MM / r).acos();
    // π / half_angle is finite and positive here; `as` saturates.
    ((std::f64::consts::PI / half_angle).ceil() as usize).clamp(fewest, most)
}

impl PathData {
    /// No polylines yet.
    pub fn new() -> Self {
        PathData(Vec::with_capacity(2))
    }

    fn push_point(out: &mut Vec<u8>, p: Xy) {
        let (x, y) = flip(p);
        if !out.is_empty() {
            out.push(b' ');
        }
        push_mm_bytes(out, x);
        out.push(b',');
        push_mm_bytes(out, y);
    }

    /// A straight segment from `a` to `b` (a polyline of two points).
    pub fn line(self, a: Xy, b: Xy) -> Self {
        self.polyline(&[a, b])
    }

    /// An open polyline through the points.
    pub fn polyline(mut self, points: &[Xy]) -> Self {
        let mut out = Vec::with_capacity(12 * points.len());
        for p in points {
            Self::push_point(&mut out, *p);
        }
        self.0.push(out);
        self
    }

    /// A circle about `c` of radius `r` mm: a closed regular polygon ([`circle_vertices`]),
    /// first vertex repeated at the end. A radius of zero or less (a part not drawn) gives an
    /// empty polyline, so the number of polylines does not depend on the radius.
    pub fn circle(mut self, c: Xy, r: f64) -> Self {
        if !(r.is_finite() && r > 0.0) {
            self.0.push(Vec::new());
            return self;
        }
        let n = circle_vertices(r);
        let mut out = Vec::with_capacity(12 * (n + 1));
        // Vertex i at angle 2πi/n, by rotating the unit vector one step at a time (4 products a
        // vertex instead of a sine and a cosine; the error after 128 steps is near 1e-14).
        let (step_sin, step_cos) = (std::f64::consts::TAU / n as f64).sin_cos();
        let (mut cos, mut sin) = (1.0_f64, 0.0_f64);
        for i in 0..=n {
            if i == n {
                (cos, sin) = (1.0, 0.0); // closed exactly on the first vertex
            }
            Self::push_point(&mut out, [c[0] + r * cos, c[1] + r * sin]);
            (cos, sin) = (
                cos * step_cos - sin * step_sin,
                sin * step_cos + cos * step_sin,
            );
        }
        self.0.push(out);
        self
    }

    /// Appends every polyline of `other`.
    pub fn append(mut self, other: PathData) -> Self {
        self.0.extend(other.0);
        self
    }

    /// The part as a node with its class; the polylines' keys are `key`, then `key.1`, `key.2`….
    pub fn node(self, key: String, class: &str) -> Node {
        let lines = self
            .0
            .into_iter()
            .enumerate()
            .map(|(i, points)| Line {
                key: if i == 0 {
                    key.clone()
                } else {
                    format!("{key}.{i}")
                },
                // Only ASCII digits, '-', '.', ',' and ' ' are written: always valid text.
                points: String::from_utf8(points).unwrap_or_default(),
            })
            .collect();
        Node::Lines {
            class: class.into(),
            lines,
        }
    }
}

/// A label anchored at a kernel point (`anchor`: `start`, `middle` or `end`).
pub fn text(key: String, at: Xy, words: String, anchor: &'static str, class: &str) -> Node {
    let (x, y) = flip(at);
    Node::Text {
        key,
        class: class.into(),
        anchor,
        x: crate::num::mm(x),
        y: crate::num::mm(y),
        words,
    }
}

/// The midpoint of two kernel points (for placing a label, not for geometry).
pub fn mid(a: Xy, b: Xy) -> Xy {
    [(a[0] + b[0]) / 2.0, (a[1] + b[1]) / 2.0]
}

/// A number for a label: whole millimetres or tenths of a degree, never NaN.
pub fn num(v: f64, decimals: usize) -> String {
    if v.is_finite() {
        let s = format!("{v:.decimals$}");
        match s.strip_prefix('-') {
            // "-0" and "-0.00" are written without the sign.
            Some(rest) if rest.bytes().all(|b| b == b'0' || b == b'.') => rest.to_string(),
            _ => s,
        }
    } else {
        "–".into()
    }
}
