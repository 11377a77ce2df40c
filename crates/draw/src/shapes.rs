//! SVG primitives from kernel points. Every point passes through [`flip`] exactly once.

use framewise_kernel::report::Xy;
use svg::node::element::{Circle, Line, Polyline, Text};

/// The one place where kernel coordinates (y up) become SVG coordinates (y down).
pub fn flip(p: Xy) -> (f64, f64) {
    (p[0], -p[1])
}

/// Rounds to 0.1 mm: the drawing needs no more, and the text stays short.
pub fn round(v: f64) -> f64 {
    (v * 10.0).round() / 10.0 + 0.0
}

/// A straight line between two kernel points.
pub fn line(a: Xy, b: Xy, class: &str) -> Line {
    let (x1, y1) = flip(a);
    let (x2, y2) = flip(b);
    Line::new()
        .set("x1", round(x1))
        .set("y1", round(y1))
        .set("x2", round(x2))
        .set("y2", round(y2))
        .set("class", class)
}

/// A circle about a kernel point.
pub fn circle(c: Xy, r: f64, class: &str) -> Circle {
    let (x, y) = flip(c);
    Circle::new()
        .set("cx", round(x))
        .set("cy", round(y))
        .set("r", round(r))
        .set("class", class)
}

/// An open polyline through kernel points.
pub fn polyline(points: &[Xy], class: &str) -> Polyline {
    let pts = points
        .iter()
        .map(|p| {
            let (x, y) = flip(*p);
            format!("{},{}", round(x), round(y))
        })
        .collect::<Vec<_>>()
        .join(" ");
    Polyline::new().set("points", pts).set("class", class)
}

/// A label anchored at a kernel point (`anchor`: `start`, `middle` or `end`).
pub fn text(at: Xy, words: &str, anchor: &str, class: &str) -> Text {
    let (x, y) = flip(at);
    Text::new(words)
        .set("x", round(x))
        .set("y", round(y))
        .set("text-anchor", anchor)
        .set("class", class)
}

/// The midpoint of two kernel points (for placing a label, not for geometry).
pub fn mid(a: Xy, b: Xy) -> Xy {
    [(a[0] + b[0]) / 2.0, (a[1] + b[1]) / 2.0]
}

/// A number for a label: whole millimetres or tenths of a degree, never NaN.
pub fn num(v: f64, decimals: usize) -> String {
    if v.is_finite() {
        format!("{v:.decimals$}")
    } else {
        "–".into()
    }
}
