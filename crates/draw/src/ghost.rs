//! The stock ghost stood on the ridden bike's ground.
//!
//! Both outlines come from the kernel with the BB at the origin. A ridden bike on sag, a longer
//! fork or other wheels has its BB at another height above the ground than the stock one, so a
//! ghost drawn at the same BB would have its tyres sunk into (or floating over) the ground. The
//! ghost is moved straight up or down by the difference of the two grounds, so both bikes stand
//! on one ground and the BB's change in height shows (the BB keeps its place along the ground).
//! A translation only: every point still comes from the kernel's outline.

use framewise_kernel::report::{Leg, RiderFigure, Xy};
use framewise_kernel::Outline;

/// `stock` moved by `ground_y − stock.ground_y` vertically (no change when both grounds agree),
/// with where its BB now is.
pub fn on_ground(stock: &Outline, ground_y: f64) -> (Outline, Xy) {
    let dy = ground_y - stock.ground_y;
    let m = |p: Xy| [p[0], p[1] + dy];
    let mut o = *stock;
    o.ground_y = ground_y;
    for p in [
        &mut o.rear_axle,
        &mut o.front_axle,
        &mut o.head_top,
        &mut o.head_bottom,
        &mut o.crown,
        &mut o.fork_leg_top,
        &mut o.seat_top,
        &mut o.steer_ground,
        &mut o.rear_contact,
        &mut o.front_contact,
    ] {
        *p = m(*p);
    }
    if let Some(c) = &mut o.cockpit {
        for p in [
            &mut c.headset_top,
            &mut c.spacers_top,
            &mut c.stem_clamp,
            &mut c.steerer_top,
            &mut c.bar_clamp,
            &mut c.grip,
        ] {
            *p = m(*p);
        }
    }
    if let Some(s) = &mut o.seat {
        for p in [
            &mut s.post_exit,
            &mut s.post_top,
            &mut s.saddle,
            &mut s.saddle_nose,
            &mut s.saddle_tail,
        ] {
            *p = m(*p);
        }
    }
    if let Some(c) = &mut o.cranks {
        c.pedal_near = m(c.pedal_near);
        c.pedal_far = m(c.pedal_far);
    }
    for f in [&mut o.rider_seated, &mut o.rider_standing]
        .into_iter()
        .flatten()
    {
        move_figure(f, &m);
    }
    for c in [&mut o.com_seated, &mut o.com_standing]
        .into_iter()
        .flatten()
    {
        *c = m(*c);
    }
    (o, m([0.0, 0.0]))
}

fn move_figure(f: &mut RiderFigure, m: &impl Fn(Xy) -> Xy) {
    for p in [
        &mut f.head,
        &mut f.shoulder,
        &mut f.elbow,
        &mut f.hand,
        &mut f.hip,
    ] {
        *p = m(*p);
    }
    for Leg {
        knee,
        ankle,
        ball,
        heel,
        toe,
    } in &mut f.legs
    {
        for p in [knee, ankle, ball, heel, toe] {
            *p = m(*p);
        }
    }
}
