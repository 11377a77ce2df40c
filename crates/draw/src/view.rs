//! The drawing's view box: fitted to the bike on whole steps, and kept while edits leave it
//! fitting.
//!
//! **Invariants:** a view box holds the whole bike and rider with at least the padding of
//! [`fit`]; its edges are whole [`VIEW_STEP_MM`] steps; a kept view box is at most
//! [`VIEW_SLACK_MM`] (100 mm) wider and taller than the fit, about 5 % of a full-size bike's
//! fit, so the bike never shrinks on the screen by more than that.
//!
//! Why keep it: while a person edits, a drawing at one scale shows what moved, where a new fit
//! after each edit would rescale everything and hide a 10 mm change. It is also cheaper in the
//! page: a new view box makes Chromium lay out every element of the drawing again, a kept one
//! only the polylines that moved (docs/BENCHMARKS.md).

use crate::{extent, num, Scene};

/// The step of the view box's edges, mm.
pub const VIEW_STEP_MM: f64 = 50.0;

/// How much wider and how much taller than the fit a kept view box may be, mm.
pub const VIEW_SLACK_MM: f64 = 2.0 * VIEW_STEP_MM;

/// A view box in the drawing's coordinates (SVG: x right, y down), mm.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct ViewBox {
    /// Left edge.
    pub min_x: f64,
    /// Top edge.
    pub min_y: f64,
    /// Width (positive).
    pub width: f64,
    /// Height (positive).
    pub height: f64,
}

impl ViewBox {
    /// Right edge.
    pub fn max_x(&self) -> f64 {
        self.min_x + self.width
    }

    /// Bottom edge.
    pub fn max_y(&self) -> f64 {
        self.min_y + self.height
    }

    /// Whether `inner` lies inside this box (edges may touch).
    pub fn holds(&self, inner: &ViewBox) -> bool {
        self.min_x <= inner.min_x
            && self.min_y <= inner.min_y
            && self.max_x() >= inner.max_x()
            && self.max_y() >= inner.max_y()
    }

    /// The `viewBox` attribute: `min-x min-y width height` at 0.1 mm.
    pub fn attr(&self) -> String {
        [self.min_x, self.min_y, self.width, self.height]
            .map(num::mm)
            .join(" ")
    }
}

/// The view box fitted to a scene: the extent of the ridden bike and the stock ghost (tyres,
/// frame, cockpit, saddle, riders) with 80 mm at the sides and above, below the ground room
/// for the dimension labels there ([`crate::dims::Below`]) and at least 160 mm (the climb and
/// descent lines), and in front at least 30 mm past the BB-to-grip label's end (the label's
/// halo and a gap; whether or not the dimensions are shown, so that showing them does not
/// rescale the drawing), each edge moved outward to a whole [`VIEW_STEP_MM`] step, so that an
/// edit that moves the bike a few millimetres usually gives the same box. The handling labels
/// keep inside it ([`crate::layout`]).
pub fn fit(scene: &Scene) -> ViewBox {
    let (x0, y0, x1, y1) = extent(scene.ridden);
    // The ghost stands on the ridden ground (ghost.rs): its extent moved with it.
    let lift = scene.ridden.ground_y - scene.stock.ground_y;
    let (gx0, gy0, gx1, gy1) = extent(scene.stock);
    let (gy0, gy1) = (gy0 + lift, gy1 + lift);
    let pad = 80.0;
    let out = |v: f64, up: bool| {
        let q = v / VIEW_STEP_MM;
        (if up { q.ceil() } else { q.floor() }) * VIEW_STEP_MM
    };
    let min_x = out(x0.min(gx0) - pad, false);
    let grip_label_end = scene.ridden.cockpit.as_ref().map_or(f64::MIN, |c| {
        c.grip[0]
            + crate::dims::GRIP_LABEL_AHEAD
            + crate::dims::grip_label_width(scene.numbers)
            + 30.0
    });
    let max_x = out((x1.max(gx1) + pad).max(grip_label_end), true);
    let top = out(y1.max(gy1) + pad, true);
    let below = crate::dims::Below::of(scene.ridden, scene.numbers).depth();
    let ground = scene.ridden.ground_y;
    let bottom = out((y0.min(gy0) - 2.0 * pad).min(ground - below - 4.0), false);
    ViewBox {
        min_x,
        min_y: -top,
        width: max_x - min_x,
        height: top - bottom,
    }
}

/// The view box to draw in: `shown` (the one on the screen) while it holds `fit` and is at
/// most [`VIEW_SLACK_MM`] wider and taller than it, else `fit`. Nothing shown: `fit`.
pub fn steady(shown: Option<ViewBox>, fit: ViewBox) -> ViewBox {
    match shown {
        Some(s)
            if s.holds(&fit)
                && s.width <= fit.width + VIEW_SLACK_MM
                && s.height <= fit.height + VIEW_SLACK_MM =>
        {
            s
        }
        _ => fit,
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn b(min_x: f64, min_y: f64, width: f64, height: f64) -> ViewBox {
        ViewBox {
            min_x,
            min_y,
            width,
            height,
        }
    }

    /// Source: the module's rule. A shown box that holds the fit and is at most the slack larger
    /// stays; one that is too large, too small or off to one side gives way to the fit.
    #[test]
    fn a_shown_box_stays_while_it_holds_the_fit_and_is_not_too_loose() {
        let fit = b(-600.0, -1900.0, 2000.0, 2100.0);
        assert_eq!(steady(None, fit), fit);
        // (shown box, whether it stays)
        let cases = [
            ("the same box", fit, true),
            ("wider", b(-650.0, -1900.0, 2100.0, 2100.0), true),
            ("wider and taller", b(-700.0, -1950.0, 2100.0, 2200.0), true),
            ("too wide", b(-650.0, -1900.0, 2150.0, 2100.0), false),
            ("too tall", b(-600.0, -2050.0, 2000.0, 2250.0), false),
            ("narrower", b(-600.0, -1900.0, 1950.0, 2100.0), false),
            ("shifted", b(-550.0, -1900.0, 2050.0, 2100.0), false),
        ];
        for (name, shown, stays) in cases {
            let want = if stays { shown } else { fit };
            assert_eq!(steady(Some(shown), fit), want, "{name}");
        }
    }

    #[test]
    fn the_attribute_lists_min_x_min_y_width_height() {
        assert_eq!(
            b(-650.0, -1900.0, 2100.0, 2100.5).attr(),
            "-650 -1900 2100 2100.5"
        );
        assert!(b(0.0, 0.0, 10.0, 10.0).holds(&b(0.0, 0.0, 10.0, 10.0)));
        assert!(!b(0.0, 0.0, 10.0, 10.0).holds(&b(-0.1, 0.0, 10.0, 10.0)));
    }
}
