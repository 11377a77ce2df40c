//! The stock ghost stood on the ridden bike's ground.
//!
//! Both outlines come from the kernel with the BB at the origin. A ridden bike on sag, a longer
//! fork or other wheels has its BB at another height above the ground than the stock one, so a
//! ghost drawn at the same BB would have its tyres sunk into (or floating over) the ground. The
//! ghost is moved straight up or down by the difference of the two grounds, so both bikes stand
//! on one ground and the BB's change in height shows (the BB keeps its place along the ground).
//! A translation only: every point still comes from the kernel's outline.

use framewise_kernel::report::Xy;
use framewise_kernel::Outline;

/// `stock`'s frame and wheels moved by `ground_y − stock.ground_y` vertically (no change when
/// both grounds agree), with where its BB now is.
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
    // The ghost is the stock frame and wheels alone, as the kernel gives it (no cockpit, seat,
    // cranks or rider): nothing else is drawn unmoved.
    (o.cockpit, o.seat, o.cranks) = (None, None, None);
    (
        o.rider_seated,
        o.rider_standing,
        o.com_seated,
        o.com_standing,
    ) = (None, None, None, None);
    (o, m([0.0, 0.0]))
}
