//! The bike: wheels, frame, fork, headset and spacers, stem and bar, seatpost and saddle,
//! cranks and pedals. Drawn back to front so the near parts cover the far ones.

use crate::shapes::{circle, line};
use framewise_kernel::report::{CockpitOutline, CrankOutline, SeatOutline};
use framewise_kernel::Outline;
use svg::node::element::Group;

/// The BB shell radius drawn, mm.
const BB_R: f64 = 22.0;
/// The pedal's drawn half length, mm (a drawing size, not a measurement).
const PEDAL_HALF: f64 = 45.0;

fn wheels(o: &Outline, mut g: Group) -> Group {
    for (axle, r, rim) in [
        (o.rear_axle, o.rear_radius, o.rear_rim_radius),
        (o.front_axle, o.front_radius, o.front_rim_radius),
    ] {
        g = g.add(circle(axle, r, "tyre"));
        if rim > 0.0 {
            g = g.add(circle(axle, rim, "rim"));
        }
        g = g.add(circle(axle, 10.0, "hub"));
    }
    g
}

fn frame(o: &Outline, g: Group) -> Group {
    let bb = [0.0, 0.0];
    g.add(line(bb, o.rear_axle, "tube chainstay"))
        .add(line(o.seat_top, o.rear_axle, "tube seatstay"))
        .add(line(bb, o.seat_top, "tube seat-tube"))
        .add(line(o.seat_top, o.head_top, "tube top-tube"))
        .add(line(bb, o.head_bottom, "tube down-tube"))
        .add(line(o.head_top, o.head_bottom, "tube head-tube"))
        .add(line(o.head_bottom, o.crown, "headset"))
        .add(line(o.crown, o.fork_leg_top, "fork fork-crown"))
        .add(line(o.fork_leg_top, o.front_axle, "fork fork-leg"))
}

fn cockpit(o: &Outline, c: &CockpitOutline, g: Group) -> Group {
    g.add(line(o.head_top, c.headset_top, "headset"))
        .add(line(c.headset_top, c.spacers_top, "spacers"))
        .add(line(c.spacers_top, c.steerer_top, "stem-clamp"))
        .add(line(c.stem_clamp, c.bar_clamp, "stem"))
        .add(line(c.bar_clamp, c.grip, "bar"))
        .add(circle(c.grip, 16.0, "grip"))
}

fn seat(s: &SeatOutline, g: Group) -> Group {
    g.add(line(s.post_exit, s.post_top, "post"))
        .add(line(s.post_top, s.saddle, "saddle-clamp"))
        .add(line(s.saddle_tail, s.saddle_nose, "saddle"))
}

fn crank(bb: [f64; 2], pedal: [f64; 2], class: &str, g: Group) -> Group {
    g.add(line(bb, pedal, &format!("crank {class}"))).add(line(
        [pedal[0] - PEDAL_HALF, pedal[1]],
        [pedal[0] + PEDAL_HALF, pedal[1]],
        &format!("pedal {class}"),
    ))
}

/// One bike as a group with the given class (`ridden` or `ghost`).
pub fn bike(o: &Outline, class: &str) -> Group {
    let bb = [0.0, 0.0];
    let mut g = Group::new().set("class", format!("bike {class}"));
    let cranks: Option<&CrankOutline> = o.cranks.as_ref();
    if let Some(c) = cranks {
        g = crank(bb, c.pedal_far, "far", g);
    }
    g = wheels(o, g);
    g = frame(o, g);
    if let Some(c) = &o.cockpit {
        g = cockpit(o, c, g);
    }
    if let Some(s) = &o.seat {
        g = seat(s, g);
    }
    g = g.add(circle(bb, BB_R, "bb"));
    if let Some(c) = cranks {
        g = crank(bb, c.pedal_near, "near", g);
    }
    g
}
