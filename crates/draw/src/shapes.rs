//! Drawing primitives from kernel points. Every point passes through [`flip`] exactly once, in
//! [`PathData`] or [`text`]; numbers are written by [`crate::num`].

use crate::model::{Line, Node, Ring};
use crate::num::push_mm_bytes;
use framewise_kernel::report::Xy;

/// `parts` as one string: keys and classes, made on every edit (plain copies: `format!` cost
/// about a tenth of the page's drawing work).
pub fn join(parts: &[&str]) -> String {
    let mut s = String::with_capacity(parts.iter().map(|p| p.len()).sum());
    for p in parts {
        s.push_str(p);
    }
    s
}

/// `key.i`: the key of a part's polyline after its first.
fn indexed(key: &str, i: usize) -> String {
    let mut s = String::with_capacity(key.len() + 3);
    s.push_str(key);
    s.push('.');
    push_decimal(&mut s, i);
    s
}

/// Appends `i` in decimal digits.
fn push_decimal(s: &mut String, i: usize) {
    if i >= 10 {
        push_decimal(s, i / 10);
    }
    let digit = u32::try_from(i % 10)
        .ok()
        .and_then(|d| char::from_digit(d, 10));
    s.extend(digit);
}

/// The one place where kernel coordinates (y up) become SVG coordinates (y down).
pub fn flip(p: Xy) -> (f64, f64) {
    (p[0], -p[1])
}

/// The polylines and circles of one styled part, built from kernel points: each line and
/// polyline is one `<polyline>` (its `points` text), each circle one ring ([`crate::model::Ring`]);
/// the part becomes one [`Node::Lines`].
///
/// Why polylines and not one `<path>`: in Chromium a path's `d` (like a circle's `cx`, `cy`, `r`
/// or any `transform`) is a CSS property, so changing it restyles the element, about 15 µs an
/// element; a polyline's `points` is not, and changing it costs only the layout (40 changed
/// elements: 0.6–0.7 ms as paths, 0.0–0.1 ms as polylines, docs/BENCHMARKS.md). A circle is a
/// `<circle>` of fixed centre inside a `<marker>`, placed by a two-point polyline at its centre:
/// moving it changes only that polyline's `points`; its `r` changes only with the radius (a
/// wheel size, a rider's height). The number of elements depends only on which calls were made,
/// never on the numbers, so the drawing's structure stays stable across edits.
#[derive(Debug, Default)]
pub struct PathData(Vec<(Vec<u8>, Option<f64>)>);

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
        self.0.push((out, None));
        self
    }

    /// A circle about `c` of radius `r` mm: a ring whose anchor is the centre written twice
    /// (Chromium draws a polyline's markers only when it has two points or more). A radius of
    /// zero or less, or not finite (a part not drawn), is written as 0: SVG draws no circle of
    /// radius 0, and the elements stay the same.
    pub fn circle(mut self, c: Xy, r: f64) -> Self {
        let mut out = Vec::with_capacity(24);
        Self::push_point(&mut out, c);
        Self::push_point(&mut out, c);
        let r = if r.is_finite() && r > 0.0 { r } else { 0.0 };
        self.0.push((out, Some(r)));
        self
    }

    /// Appends every polyline of `other`.
    pub fn append(mut self, other: PathData) -> Self {
        self.0.extend(other.0);
        self
    }

    /// The part as a node with its class; the polylines' keys are `key`, then `key.1`, `key.2`…,
    /// a ring's circle the polyline's key and `.r`.
    pub fn node(self, key: String, class: &str) -> Node {
        let lines = self
            .0
            .into_iter()
            .enumerate()
            .map(|(i, (points, ring))| {
                let key = if i == 0 {
                    key.clone()
                } else {
                    indexed(&key, i)
                };
                Line {
                    ring: ring.map(|r| Ring {
                        key: join(&[&key, ".r"]),
                        r: crate::num::mm(r),
                    }),
                    key,
                    // Only ASCII digits, '-', '.', ',' and ' ' are written: always valid text.
                    points: String::from_utf8(points).unwrap_or_default(),
                }
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
