//! framewise drawing: a bike report's outline → an SVG document (written by `model.rs`).
//!
//! **Invariant:** no geometry is computed here; every point comes from the kernel's
//! [`framewise_kernel::Outline`] (the stock ghost only moved up or down to stand on the ridden
//! bike's ground, [`ghost`]). The kernel is y-up; the only y flip is [`flip`].
//!
//! The document carries both rider postures, both centres of mass, the stock ghost and the
//! dimension labels; the page shows or hides them with classes on the drawing's container
//! (`posture-standing`, `show-dims`, `hide-ghost`), so a toggle needs no new drawing.
//! Lengths are in millimetres (the viewBox is the bike in mm), so strokes and text scale with
//! the bike; thin annotation lines use `vector-effect: non-scaling-stroke` in the page's CSS.
//!
//! **Cheap to change, stable structure:** every line and polyline is a `<polyline>` and every
//! circle a `<circle>` in a marker placed by a polyline at its centre ([`model::Ring`]), because
//! in Chromium changing a polyline's `points` needs no restyle, unlike a path's `d` or a circle's
//! `cx` ([`shapes::PathData`]); numbers are written at 0.1 mm by our
//! own integer writer ([`num`]). Every polyline and text has a stable key (`data-k`) and the set of
//! elements depends only on which parts exist, so the page patches the changed values
//! ([`Drawing::patch`]) instead of replacing the document when [`Drawing::structure`] is
//! unchanged. One model ([`drawing`]), two serialisations ([`Drawing::svg`], [`Drawing::patch`]).
#![deny(missing_docs)]

mod dims;
mod figure;
mod ghost;
mod layout;
pub mod model;
pub mod num;
mod parts;
mod place;
mod shapes;
pub mod view;

pub use model::{Drawing, Node, Patch};
pub use shapes::flip;
pub use view::{ViewBox, VIEW_SLACK_MM, VIEW_STEP_MM};

use framewise_kernel::report::{Numbers, Xy};
use framewise_kernel::{BikeReport, Outline};
use shapes::PathData;

/// The labels' type size on a desk, mm of drawing (`.bike-drawing .label` in web/style.css):
/// about 14 px in the demo's 496 px tall drawing at 1280×800.
pub const LABEL_EM_MM: f64 = 61.0;

/// The largest type size the page sets the labels in, mm of drawing: on a small drawing the page
/// makes them larger, so that they stay about 12 px on the screen (about 79 mm on a 360 px
/// phone, 86 mm in the 304 px tall drawing of a 568×320 phone held sideways, web/style.css).
/// Labels are placed for this size ([`layout`]): in smaller type each stays inside its spot, so
/// they keep off the bike and each other at every size from [`LABEL_EM_MM`] to this one
/// (tests/labels.rs). A 320 px phone upright drew in a 294 px box: 86 mm is 11.5 px there
/// (86 × 294 / 2200), and 12 px would need 90 mm, which does not place cleanly: "descent 36°"
/// is then 614 mm wide, and the room for it inside a 700c front wheel (under the hub, off the
/// fork's end and the tyre) or between the tyres (above BB height's label) is about 600 mm. So
/// the page gives such a phone's drawing its card's whole width instead: 310 px, 12.1 px.
pub const LABEL_EM_MAX_MM: f64 = 86.0;

/// The handling limits written on the centre-of-mass lines, for one posture.
#[derive(Debug, Clone, Copy, PartialEq, Default)]
pub struct Limits {
    /// Braking on level ground at which the rear wheel lifts, in g.
    pub braking_g: Option<f64>,
    /// Steepest static descent, degrees.
    pub descent_deg: Option<f64>,
    /// Steepest static climb, degrees.
    pub climb_deg: Option<f64>,
}

impl Limits {
    /// One posture's limits from its statics numbers (the report's `handling.seated` or
    /// `handling.standing`).
    pub fn of(n: &Numbers) -> Self {
        Limits {
            braking_g: n.get("pitch_over_decel_g").copied(),
            descent_deg: n.get("front_tip_slope_deg").copied(),
            climb_deg: n.get("rear_tip_slope_deg").copied(),
        }
    }
}

/// Everything one drawing shows.
#[derive(Debug, Clone, Copy)]
pub struct Scene<'a> {
    /// The bike's name.
    pub label: &'a str,
    /// The ridden bike (changes and sag applied).
    pub ridden: &'a Outline,
    /// The stock frame, drawn as a ghost.
    pub stock: &'a Outline,
    /// Ridden numbers for the dimension labels (reach, stack, wheelbase, BB height, trail,
    /// BB-to-grip).
    pub numbers: &'a Numbers,
    /// Limits on the seated centre-of-mass lines.
    pub seated: Limits,
    /// Limits on the standing centre-of-mass lines.
    pub standing: Limits,
}

impl<'a> Scene<'a> {
    /// A report's bike: ridden and stock outlines, ridden numbers, and the handling limits of
    /// both postures when `with_limits` (the page), none otherwise (the CLI's `draw`).
    pub fn of_bike(report: &'a BikeReport, with_limits: bool) -> Self {
        let limits = |n| {
            if with_limits {
                Limits::of(n)
            } else {
                Limits::default()
            }
        };
        Scene {
            label: &report.label,
            ridden: &report.outline,
            stock: &report.stock_outline,
            numbers: &report.ridden,
            seated: limits(&report.handling.seated),
            standing: limits(&report.handling.standing),
        }
    }
}

/// Bounding box `(min_x, min_y, max_x, max_y)` in kernel coordinates: tyres, frame, cockpit,
/// saddle and rider.
pub fn extent(o: &Outline) -> (f64, f64, f64, f64) {
    let mut pts: Vec<Xy> = vec![
        [
            o.rear_axle[0] - o.rear_radius,
            o.rear_axle[1] + o.rear_radius,
        ],
        [
            o.front_axle[0] + o.front_radius,
            o.front_axle[1] + o.front_radius,
        ],
        [o.rear_axle[0], o.ground_y],
        o.head_top,
        o.seat_top,
    ];
    if let Some(c) = &o.cockpit {
        pts.extend([c.steerer_top, c.grip, c.bar_clamp]);
    }
    if let Some(s) = &o.seat {
        pts.extend([s.saddle_nose, s.saddle_tail, s.saddle]);
    }
    for r in [&o.rider_seated, &o.rider_standing].into_iter().flatten() {
        let h = r.head;
        pts.extend([
            [h[0], h[1] + r.head_radius],
            [h[0] - r.head_radius, h[1]],
            r.hip,
        ]);
    }
    pts.iter().fold(
        (f64::MAX, f64::MAX, f64::MIN, f64::MIN),
        |(a, b, c, d), p| (a.min(p[0]), b.min(p[1]), c.max(p[0]), d.max(p[1])),
    )
}

/// The side view of one scene as an SVG document (see [`drawing`]).
pub fn draw(scene: &Scene) -> String {
    drawing(scene).svg()
}

/// The side view of one scene: ground, the stock ghost, the ridden bike, riders, centres of
/// mass and dimensions, fitted to its own extent ([`view::fit`]).
pub fn drawing(scene: &Scene) -> Drawing {
    drawing_in(scene, None)
}

/// [`drawing`] in the view box `shown` while it still fits the scene ([`view::steady`]), else
/// in the scene's own fit: the page passes the view box of the drawing it shows.
pub fn drawing_in(scene: &Scene, shown: Option<ViewBox>) -> Drawing {
    let o = scene.ridden;
    let (stock, stock_bb) = ghost::on_ground(scene.stock, o.ground_y);
    let fit = view::fit(scene);
    let below = dims::Below::of(o, scene.numbers);
    let mut spots = layout::spots(scene, &below, &fit, (&stock, stock_bb));
    let view = view::steady(shown, fit);
    let (min_x, max_x) = (view.min_x, view.max_x());
    let mut nodes = vec![
        PathData::new()
            .line([min_x, o.ground_y], [max_x, o.ground_y])
            .node("ground".into(), "ground"),
        parts::bike(&stock, "ghost", stock_bb),
        parts::bike(o, "ridden", [0.0, 0.0]),
    ];
    for (fig, com, at, posture) in [
        (&o.rider_seated, o.com_seated, &mut spots.seated, "seated"),
        (
            &o.rider_standing,
            o.com_standing,
            &mut spots.standing,
            "standing",
        ),
    ] {
        let mut children = Vec::new();
        if let Some(f) = fig {
            children.push(figure::rider(f, posture));
        }
        if let Some(c) = com {
            children.push(figure::com(c, o, std::mem::take(at), posture));
        }
        nodes.push(Node::Group {
            class: shapes::join(&["posture ", posture]),
            children,
        });
    }
    nodes.push(dims::dimensions(o, &below, spots));
    Drawing {
        view_box: view.attr(),
        view,
        title: format!("Side view of {}", scene.label),
        nodes,
    }
}

/// The drawing of a report's bike with no handling labels (the CLI's `draw`).
pub fn draw_bike(report: &BikeReport) -> String {
    drawing_of_bike(report).svg()
}

/// The model of [`draw_bike`].
pub fn drawing_of_bike(report: &BikeReport) -> Drawing {
    drawing(&Scene::of_bike(report, false))
}

#[cfg(test)]
mod tests;
