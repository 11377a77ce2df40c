//! Drawing primitives from kernel points. Every point passes through [`flip`] exactly once, in
//! [`PathData`] or [`text`]; numbers are written by [`crate::num`].

use crate::model::Node;
use crate::num::push_mm;
use framewise_kernel::report::Xy;

/// The one place where kernel coordinates (y up) become SVG coordinates (y down).
pub fn flip(p: Xy) -> (f64, f64) {
    (p[0], -p[1])
}

/// An SVG path's `d` text, built from kernel points: lines, polylines and circles that share a
/// class become subpaths of one `<path>`.
#[derive(Debug, Default)]
pub struct PathData(String);

impl PathData {
    /// An empty path.
    pub fn new() -> Self {
        PathData(String::with_capacity(64))
    }

    fn point(&mut self, cmd: char, p: Xy) {
        let (x, y) = flip(p);
        self.0.push(cmd);
        push_mm(&mut self.0, x);
        self.0.push(',');
        push_mm(&mut self.0, y);
    }

    /// A straight segment from `a` to `b` (a new subpath).
    pub fn line(mut self, a: Xy, b: Xy) -> Self {
        self.point('M', a);
        self.point('L', b);
        self
    }

    /// An open polyline through the points (a new subpath).
    pub fn polyline(mut self, points: &[Xy]) -> Self {
        let mut cmd = 'M';
        for p in points {
            self.point(cmd, *p);
            cmd = 'L';
        }
        self
    }

    /// A circle about `c` of radius `r` mm: two half arcs, closed.
    pub fn circle(mut self, c: Xy, r: f64) -> Self {
        let mut radius = String::new();
        push_mm(&mut radius, r);
        self.point('M', [c[0] - r, c[1]]);
        for end in [[c[0] + r, c[1]], [c[0] - r, c[1]]] {
            self.0.push('A');
            self.0.push_str(&radius);
            self.0.push(',');
            self.0.push_str(&radius);
            self.0.push_str(" 0 1 0 ");
            let (x, y) = flip(end);
            push_mm(&mut self.0, x);
            self.0.push(',');
            push_mm(&mut self.0, y);
        }
        self.0.push('Z');
        self
    }

    /// Appends every subpath of `other`.
    pub fn append(mut self, other: PathData) -> Self {
        self.0.push_str(&other.0);
        self
    }

    /// The path as an element with a stable key and its class.
    pub fn node(self, key: String, class: &str) -> Node {
        Node::Path {
            key,
            class: class.into(),
            d: self.0,
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
