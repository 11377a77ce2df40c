//! framewise drawing: a bike report's outline → an SVG document (the `svg` crate).
//!
//! **Invariant:** no geometry is computed here; every point comes from the kernel's
//! [`framewise_kernel::Outline`]. The kernel is y-up; the only y flip is [`flip`].
#![deny(missing_docs)]

use framewise_kernel::report::Xy;
use framewise_kernel::{BikeReport, Outline};
use svg::node::element::{Circle, Group, Line, Title};
use svg::Document;

/// The one place where kernel coordinates (y up) become SVG coordinates (y down).
pub fn flip(p: Xy) -> (f64, f64) {
    (p[0], -p[1])
}

fn line(a: Xy, b: Xy, class: &str) -> Line {
    let (x1, y1) = flip(a);
    let (x2, y2) = flip(b);
    Line::new()
        .set("x1", round(x1))
        .set("y1", round(y1))
        .set("x2", round(x2))
        .set("y2", round(y2))
        .set("class", class)
}

fn circle(c: Xy, r: f64, class: &str) -> Circle {
    let (x, y) = flip(c);
    Circle::new()
        .set("cx", round(x))
        .set("cy", round(y))
        .set("r", round(r))
        .set("class", class)
}

fn round(v: f64) -> f64 {
    (v * 10.0).round() / 10.0
}

/// The frame, fork and wheels of one outline as a group with the given class.
pub fn bike_group(o: &Outline, class: &str) -> Group {
    let bb = [0.0, 0.0];
    let mut g = Group::new().set("class", class);
    for (axle, r, rim) in [
        (o.rear_axle, o.rear_radius, o.rear_rim_radius),
        (o.front_axle, o.front_radius, o.front_rim_radius),
    ] {
        g = g.add(circle(axle, r, "tyre"));
        if rim > 0.0 {
            g = g.add(circle(axle, rim, "rim"));
        }
        g = g.add(circle(axle, 6.0, "hub"));
    }
    g = g
        .add(line(bb, o.rear_axle, "tube chainstay"))
        .add(line(o.seat_top, o.rear_axle, "tube seatstay"))
        .add(line(bb, o.seat_top, "tube seat-tube"))
        .add(line(o.seat_top, o.head_top, "tube top-tube"))
        .add(line(bb, o.head_bottom, "tube down-tube"))
        .add(line(o.head_top, o.head_bottom, "tube head-tube"))
        .add(line(o.head_bottom, o.crown, "headset"))
        .add(line(o.crown, o.front_axle, "fork"))
        .add(circle(bb, 18.0, "bb"));
    g
}

/// Bounding box `(min_x, min_y, max_x, max_y)` in kernel coordinates, tyres included.
pub fn extent(o: &Outline) -> (f64, f64, f64, f64) {
    let min_x = (o.rear_axle[0] - o.rear_radius).min(o.head_top[0]);
    let max_x = (o.front_axle[0] + o.front_radius).max(o.head_top[0]);
    let max_y = [
        o.head_top[1],
        o.seat_top[1],
        o.rear_axle[1] + o.rear_radius,
        o.front_axle[1] + o.front_radius,
    ]
    .into_iter()
    .fold(f64::MIN, f64::max);
    (min_x, o.ground_y, max_x, max_y)
}

/// The side view of one bike: ground, the stock ghost, the ridden bike.
pub fn draw_bike(report: &BikeReport) -> String {
    let o = &report.outline;
    let s = &report.stock_outline;
    let (x0, y0, x1, y1) = extent(o);
    let (gx0, _, gx1, gy1) = extent(s);
    let pad = 40.0;
    let min_x = x0.min(gx0) - pad;
    let max_x = x1.max(gx1) + pad;
    let top = y1.max(gy1) + pad;
    let bottom = y0 - pad;
    let ground = line([min_x, o.ground_y], [max_x, o.ground_y], "ground");
    let doc = Document::new()
        .set(
            "viewBox",
            (
                round(min_x),
                round(-top),
                round(max_x - min_x),
                round(top - bottom),
            ),
        )
        .set("class", "bike-drawing")
        .set("role", "img")
        .set("aria-label", format!("Side view of {}", report.label))
        .add(Title::new(format!("Side view of {}", report.label)))
        .add(ground)
        .add(bike_group(s, "ghost"))
        .add(bike_group(o, "ridden"));
    doc.to_string()
}

#[cfg(test)]
mod tests {
    use super::*;

    fn outline() -> Outline {
        Outline {
            ground_y: -340.0,
            rear_axle: [-435.0, 32.0],
            front_axle: [800.0, 32.0],
            rear_radius: 372.0,
            front_radius: 372.0,
            rear_rim_radius: 311.0,
            front_rim_radius: 311.0,
            head_top: [470.0, 625.0],
            head_bottom: [516.0, 525.0],
            crown: [521.0, 514.0],
            seat_top: [-100.0, 420.0],
            steer_ground: [840.0, -340.0],
            rear_contact: [-435.0, -340.0],
            front_contact: [800.0, -340.0],
            cockpit: None,
            seat: None,
            cranks: None,
            rider_seated: None,
            rider_standing: None,
            com_seated: None,
            com_standing: None,
        }
    }

    #[test]
    fn kernel_y_up_becomes_svg_y_down() {
        assert_eq!(flip([3.0, 5.0]), (3.0, -5.0));
    }

    #[test]
    fn extent_includes_tyres_and_ground() {
        let (x0, y0, x1, y1) = extent(&outline());
        assert_eq!((x0, y0, x1, y1), (-807.0, -340.0, 1172.0, 625.0));
    }

    #[test]
    fn group_has_both_wheels_and_the_frame() {
        let svg = bike_group(&outline(), "ridden").to_string();
        assert_eq!(svg.matches("class=\"tyre\"").count(), 2);
        assert!(svg.contains("cx=\"800\"") && svg.contains("cy=\"-32\""));
        assert!(svg.contains("class=\"tube down-tube\""));
    }
}
