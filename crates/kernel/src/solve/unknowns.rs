//! The solver's unknowns: the eleven core parameters in millimetres and degrees, how they map to
//! [`FrameParams`], their typical values and which of them have a stated prior.

use crate::geometry::{FrameParams, Radii};

/// Number of unknowns (BB drop is not one: the tyres-on-the-ground condition fixes it).
pub const N_UNKNOWNS: usize = 11;

/// One unknown of the solver.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Unknown {
    /// The catalogue key that measures this parameter directly.
    pub key: &'static str,
    /// The value used when nothing determines it and it has no prior (mm or degrees), also the
    /// first guess.
    pub typical: f64,
    /// A weak, stated prior used only when the published numbers leave the parameter free.
    pub prior: Option<f64>,
}

/// Index of each unknown in the solver's vector.
pub mod ix {
    /// Rear centre, mm.
    pub const REAR_CENTRE: usize = 0;
    /// Reach, mm.
    pub const REACH: usize = 1;
    /// Stack, mm.
    pub const STACK: usize = 2;
    /// Head angle, degrees.
    pub const HEAD_ANGLE: usize = 3;
    /// Head tube, mm.
    pub const HEAD_TUBE: usize = 4;
    /// Lower headset stack, mm.
    pub const HEADSET_LOWER: usize = 5;
    /// Fork axle-to-crown, mm.
    pub const A2C: usize = 6;
    /// Fork offset, mm.
    pub const OFFSET: usize = 7;
    /// Actual seat angle, degrees.
    pub const SEAT_ANGLE: usize = 8;
    /// Seat axis offset, mm.
    pub const SEAT_OFFSET: usize = 9;
    /// Seat tube length, mm.
    pub const SEAT_TUBE: usize = 10;
}

/// The unknowns in vector order. Typical values describe a mid-size trail bike [practice]; they
/// are only a start for the search and a stated stand-in for a parameter nothing fixes. The
/// axle-to-crown's is replaced by one that fits the front wheel ([`fork_stand_in`]).
/// Priors: lower headset stack 0 mm (internal cups) and seat axis offset 0 mm (straight seat
/// tube through the BB) [practice].
pub const UNKNOWNS: [Unknown; N_UNKNOWNS] = [
    u("rear_centre_mm", 435.0, None),
    u("reach_mm", 450.0, None),
    u("stack_mm", 620.0, None),
    u("head_angle_deg", 66.0, None),
    u("head_tube_mm", 110.0, None),
    u("headset_lower_mm", 0.0, Some(0.0)),
    u("fork_a2c_mm", 560.0, None),
    u("fork_offset_mm", 44.0, None),
    u("seat_angle_actual_deg", 75.0, None),
    u("seat_axis_offset_mm", 0.0, Some(0.0)),
    u("seat_tube_mm", 430.0, None),
];

const fn u(key: &'static str, typical: f64, prior: Option<f64>) -> Unknown {
    Unknown {
        key,
        typical,
        prior,
    }
}

/// The order in which free parameters without a prior are pinned to their typical value: the
/// rarely published fork first, and of the fork the offset before the axle-to-crown. When one
/// equation links the two (a BB drop or BB height, a wheelbase or a front centre, as on a road
/// chart without fork numbers), pinning the offset and solving the a2c is far less wrong: offsets
/// vary little across bikes (about 40 to 55 mm), axle-to-crown lengths a lot (about 360 to
/// 600 mm, with wheel size and suspension travel) [practice].
pub const PIN_ORDER: [usize; N_UNKNOWNS] = [
    ix::HEADSET_LOWER,
    ix::SEAT_OFFSET,
    ix::OFFSET,
    ix::A2C,
    ix::HEAD_TUBE,
    ix::SEAT_TUBE,
    ix::REAR_CENTRE,
    ix::SEAT_ANGLE,
    ix::HEAD_ANGLE,
    ix::STACK,
    ix::REACH,
];

/// The unknown vector (mm and degrees).
pub type X = [f64; N_UNKNOWNS];

/// The frame parameters for `x`, with the BB drop that puts both tyres on the ground
/// (`F.y − R.y = r_front − r_rear`, DESIGN.md §8a).
pub fn to_params(x: &X, radii: Radii) -> FrameParams {
    let mut p = to_params_ungrounded(x);
    p.bb_drop = p.grounded_bb_drop(radii);
    p
}

/// The frame parameters for `x` with the BB drop left at 0 (the caller grounds it).
pub fn to_params_ungrounded(x: &X) -> FrameParams {
    FrameParams {
        rear_centre: x[ix::REAR_CENTRE],
        bb_drop: 0.0,
        reach: x[ix::REACH],
        stack: x[ix::STACK],
        head_angle: x[ix::HEAD_ANGLE].to_radians(),
        head_tube: x[ix::HEAD_TUBE],
        headset_lower: x[ix::HEADSET_LOWER],
        a2c: x[ix::A2C],
        offset: x[ix::OFFSET],
        seat_angle: x[ix::SEAT_ANGLE].to_radians(),
        seat_axis_offset: x[ix::SEAT_OFFSET],
        seat_tube: x[ix::SEAT_TUBE],
    }
}

/// The typical frame for these wheels: [`UNKNOWNS`]' typical values with the axle-to-crown of
/// [`fork_stand_in`] and, on a rigid fork's narrow tyre, the rear centre of
/// [`RIGID_REAR_CENTRE_MM`].
pub fn typical(front: FrontTyre) -> X {
    let mut x = UNKNOWNS.map(|u| u.typical);
    let fork = fork_stand_in(front);
    x[ix::A2C] = fork.a2c_mm;
    if !fork.suspension {
        x[ix::REAR_CENTRE] = RIGID_REAR_CENTRE_MM;
    }
    x
}

/// The rear centre that stands in for a bike on narrow tyres (the rigid-fork stand-in's bikes:
/// road, gravel, touring), mm [practice; from memory, road chainstays measure about 405–415 mm
/// and gravel ones about 415–430 mm]. A trail bike's [`UNKNOWNS`] value, 435 mm, stands in
/// otherwise.
pub const RIGID_REAR_CENTRE_MM: f64 = 415.0;

/// The front tyre, as far as the solver's stand-in fork needs it.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct FrontTyre {
    /// Outer radius, mm.
    pub radius_mm: f64,
    /// Section width, mm; `None` when only the outer diameter was given.
    pub width_mm: Option<f64>,
}

/// Tyres at least this wide (mm; about 2.1 in) are taken as a mountain bike's, on a suspension
/// fork; narrower ones (road, gravel, touring) on a rigid fork [practice].
pub const SUSPENSION_TYRE_MIN_MM: f64 = 53.0;

/// A rigid fork's axle-to-crown over the front tyre's outer radius, mm: tyre clearance and the
/// crown below the crown race [practice; from memory, road forks for 25–28 mm tyres measure
/// about 365–375 mm].
pub const RIGID_A2C_OVER_RADIUS_MM: f64 = 35.0;

/// A suspension fork's axle-to-crown over the front tyre's outer radius, mm: about 150 mm of
/// travel plus the clearance at full compression [practice; from memory, 150 mm forks measure
/// about 545 mm for 27.5 in and 560 mm for 29 in wheels].
pub const SUSPENSION_A2C_OVER_RADIUS_MM: f64 = 190.0;

/// The axle-to-crown the solver stands in when nothing published fixes it, and which kind of fork
/// it assumes.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct ForkStandIn {
    /// Axle-to-crown, mm.
    pub a2c_mm: f64,
    /// `true` for a suspension fork, `false` for a rigid one.
    pub suspension: bool,
}

/// The stand-in fork for a front tyre (a simple rule, common practice):
///
/// - tyre narrower than [`SUSPENSION_TYRE_MIN_MM`]: a rigid fork,
///   `a2c = r + RIGID_A2C_OVER_RADIUS_MM` (700x28c, r = 339 mm → 374 mm);
/// - as wide or wider, or of unknown width (only a diameter given): a suspension fork of about
///   150 mm travel, `a2c = r + SUSPENSION_A2C_OVER_RADIUS_MM` (29x2.4, r = 371.96 mm → 562 mm).
pub fn fork_stand_in(front: FrontTyre) -> ForkStandIn {
    let suspension = front.width_mm.is_none_or(|w| w >= SUSPENSION_TYRE_MIN_MM);
    let over = if suspension {
        SUSPENSION_A2C_OVER_RADIUS_MM
    } else {
        RIGID_A2C_OVER_RADIUS_MM
    };
    ForkStandIn {
        a2c_mm: front.radius_mm + over,
        suspension,
    }
}
