//! Checks the setup, rider and load fields of a scenario and resolves them to numbers with
//! their stated defaults (cockpit, seat, rider, handling inputs). Every bad value becomes a typed
//! error naming the field, the value and what is allowed.

use crate::cockpit::{Bar, Cockpit, HandPosition};
use crate::error::{FieldError, Warning};
use crate::handling::DEFAULT_PEDAL_OUTER_MM;
use crate::parts::DEFAULT_SPACER_LIMIT_MM;
use crate::rider::{Body, Overrides, INSEAM_RATIO};
use crate::scenario::{BikeInput, RiderInput};
use crate::seat::Seat;
use crate::validate::{limit, Checker, Path};
use nalgebra::Point2;

/// Crank length assumed when none is given, mm.
pub const DEFAULT_CRANK_MM: f64 = 170.0;
/// Rider mass assumed when none is given, kg.
pub const DEFAULT_RIDER_MASS_KG: f64 = 75.0;
/// Seated elbow bend assumed when none is given, degrees [practice].
pub const DEFAULT_ELBOW_BEND_DEG: f64 = 20.0;
/// Standing knee bend assumed when none is given, degrees [practice].
pub const DEFAULT_STANDING_KNEE_BEND_DEG: f64 = 30.0;
/// Standing trunk angle assumed when none is given, degrees [practice].
pub const DEFAULT_STANDING_TORSO_DEG: f64 = 40.0;
/// Braking for the front-load check when none is given, g.
pub const DEFAULT_BRAKING_G: f64 = 0.5;

/// The rider, resolved.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct RiderValues {
    /// The body.
    pub body: Body,
    /// Whether the inseam was measured (the inseam checks need it).
    pub inseam_given: bool,
    /// Seated elbow bend, radians.
    pub elbow_bend: f64,
    /// Standing knee bend, radians.
    pub knee_bend: f64,
    /// Standing trunk angle, radians.
    pub standing_torso: f64,
    /// Braking for the front-load check, g.
    pub braking_g: f64,
    /// Slope for the braking limit, radians (positive = uphill).
    pub slope: f64,
}

/// A bike's setup, resolved.
#[derive(Debug, Clone, PartialEq)]
pub struct SetupValues {
    /// The cockpit, when a stem length is given.
    pub cockpit: Option<Cockpit>,
    /// The saddle and post (its height is 0 when not given; see `saddle_given`).
    pub seat: Seat,
    /// Saddle height given.
    pub saddle_given: bool,
    /// Saddle setback given (else the saddle is centred over the post's clamp: the post's
    /// offset).
    pub setback_given: bool,
    /// Fork spacer limit, mm.
    pub spacer_limit: f64,
    /// Crank length, mm, and whether it was given.
    pub crank: (f64, bool),
    /// Bike mass, kg, when given.
    pub bike_mass: Option<f64>,
    /// Bike centre of mass ahead of the BB (ridden axes), mm, when given.
    pub bike_com_x: Option<f64>,
    /// Bike centre of mass above the BB (ridden axes), mm, when given.
    pub bike_com_y: Option<f64>,
    /// Pedal outer end from the centre plane, mm.
    pub pedal_outer: f64,
    /// Target grip point given directly.
    pub target: Option<Point2<f64>>,
    /// Target grip point from another bike (index).
    pub target_bike: Option<usize>,
    /// Point load `(point, kg)`.
    pub load: Option<(Point2<f64>, f64)>,
}

/// Checks the rider once for the whole scenario. Errors go to `errors` (field `rider.…`); a bad
/// or height-less rider gives `None` with a warning in `warnings`.
pub fn check_rider(
    r: &RiderInput,
    errors: &mut Vec<FieldError>,
    warnings: &mut Vec<Warning>,
) -> Option<RiderValues> {
    let mut c = Checker::default();
    let f = |k: &'static str| Path("rider", k);
    let height = c.range(
        f("height_mm"),
        limit("height", 900.0, 2300.0, "mm"),
        r.height_mm,
    );
    let mass = c.range(
        f("mass_kg"),
        limit("body mass", 20.0, 250.0, "kg"),
        r.mass_kg,
    );
    let inseam = c.range(
        f("inseam_mm"),
        limit("inseam", 400.0, 1200.0, "mm"),
        r.inseam_mm,
    );
    let o = Overrides {
        inseam,
        arm: c.range(
            f("arm_mm"),
            limit("arm length", 400.0, 1000.0, "mm"),
            r.arm_mm,
        ),
        torso: c.range(
            f("torso_mm"),
            limit("torso length", 300.0, 900.0, "mm"),
            r.torso_mm,
        ),
        shoe_stack: c.range(
            f("shoe_stack_mm"),
            limit("shoe stack", 0.0, 60.0, "mm"),
            r.shoe_stack_mm,
        ),
        foot_position: c.range(
            f("foot_position_mm"),
            limit("foot position on the pedal", -80.0, 80.0, "mm"),
            r.foot_position_mm,
        ),
    };
    let deg = |c: &mut Checker,
               k: &'static str,
               label: &str,
               lo: f64,
               hi: f64,
               v: Option<f64>,
               d: f64| {
        c.range_or(f(k), limit(label, lo, hi, "°"), v, d)
            .to_radians()
    };
    let elbow_bend = deg(
        &mut c,
        "elbow_bend_deg",
        "elbow bend",
        0.0,
        120.0,
        r.elbow_bend_deg,
        DEFAULT_ELBOW_BEND_DEG,
    );
    let knee_bend = deg(
        &mut c,
        "standing_knee_bend_deg",
        "standing knee bend",
        0.0,
        120.0,
        r.standing_knee_bend_deg,
        DEFAULT_STANDING_KNEE_BEND_DEG,
    );
    let standing_torso = deg(
        &mut c,
        "standing_torso_deg",
        "standing torso angle",
        0.0,
        90.0,
        r.standing_torso_deg,
        DEFAULT_STANDING_TORSO_DEG,
    );
    let slope = deg(&mut c, "slope_deg", "slope", -45.0, 45.0, r.slope_deg, 0.0);
    let braking_g = c.range_or(
        f("braking_g"),
        limit("braking", 0.0, 1.5, "g"),
        r.braking_g,
        DEFAULT_BRAKING_G,
    );
    if !c.ok() {
        errors.append(&mut c.errors);
        return None;
    }
    let height = match (height, inseam) {
        (Some(h), _) => h,
        (None, Some(i)) => {
            let h = i / INSEAM_RATIO;
            warnings.push(Warning::new(
                "assumed",
                format!("height not given: estimated {h:.0} mm from the inseam."),
            ));
            h
        }
        (None, None) => {
            warnings.push(Warning::new(
                "rider_incomplete",
                "The rider needs a height (or an inseam) to be placed on the bike.",
            ));
            return None;
        }
    };
    let mass = mass.unwrap_or_else(|| {
        warnings.push(Warning::new(
            "assumed",
            format!("body mass not given: assumed {DEFAULT_RIDER_MASS_KG} kg."),
        ));
        DEFAULT_RIDER_MASS_KG
    });
    Some(RiderValues {
        body: Body::new(height, mass, o),
        inseam_given: inseam.is_some(),
        elbow_bend,
        knee_bend,
        standing_torso,
        braking_g,
        slope,
    })
}

fn bar(s: &crate::scenario::Setup, p: &str, c: &mut Checker) -> Bar {
    let f = |k: &'static str| Path(p, k);
    let rise = c.range_or(
        f("bar_rise_mm"),
        limit("bar rise", -50.0, 150.0, "mm"),
        s.bar_rise_mm,
        0.0,
    );
    let pullback = c.range(
        f("bar_pullback_mm"),
        limit("bar pullback", -100.0, 200.0, "mm"),
        s.bar_pullback_mm,
    );
    let roll = c
        .range_or(
            f("bar_roll_deg"),
            limit("bar roll", -30.0, 30.0, "°"),
            s.bar_roll_deg,
            0.0,
        )
        .to_radians();
    let backsweep = c
        .range_or(
            f("bar_backsweep_deg"),
            limit("bar backsweep", -10.0, 45.0, "°"),
            s.bar_backsweep_deg,
            0.0,
        )
        .to_radians();
    let upsweep = c
        .range_or(
            f("bar_upsweep_deg"),
            limit("bar upsweep", -10.0, 20.0, "°"),
            s.bar_upsweep_deg,
            0.0,
        )
        .to_radians();
    let width = c.range_or(
        f("bar_width_mm"),
        limit("bar width", 300.0, 1000.0, "mm"),
        s.bar_width_mm,
        760.0,
    );
    let reach = c.range_or(
        f("bar_reach_mm"),
        limit("drop bar reach", 30.0, 150.0, "mm"),
        s.bar_reach_mm,
        80.0,
    );
    let drop = c.range_or(
        f("bar_drop_mm"),
        limit("drop bar drop", 60.0, 200.0, "mm"),
        s.bar_drop_mm,
        125.0,
    );
    let hood_reach = c.range_or(
        f("hood_reach_mm"),
        limit("hood reach", 30.0, 250.0, "mm"),
        s.hood_reach_mm,
        reach + 45.0,
    );
    let hood_drop = c.range_or(
        f("hood_drop_mm"),
        limit("hood drop", -100.0, 100.0, "mm"),
        s.hood_drop_mm,
        -10.0,
    );
    let hand = match s.hand_position.as_deref() {
        None | Some("hoods") => HandPosition::Hoods,
        Some("drops") => HandPosition::Drops,
        Some("tops") => HandPosition::Tops,
        Some(other) => {
            c.errors.push(FieldError::new(
                "bad_choice",
                f("hand_position"),
                format!("hand position must be \"hoods\", \"drops\" or \"tops\", got \"{other}\""),
            ));
            HandPosition::Hoods
        }
    };
    match s.bar_type.as_deref() {
        Some("drop") => Bar::Drop {
            reach,
            drop,
            hood_reach,
            hood_drop,
            roll,
            hand,
        },
        None | Some("flat") => match pullback {
            Some(pullback) => Bar::Offset { rise, pullback },
            None => Bar::Flat {
                rise,
                backsweep,
                upsweep,
                width,
                roll,
            },
        },
        Some(other) => {
            c.errors.push(FieldError::new(
                "bad_choice",
                f("bar_type"),
                format!("bar type must be \"flat\" or \"drop\", got \"{other}\""),
            ));
            Bar::Offset {
                rise,
                pullback: 0.0,
            }
        }
    }
}

/// Checks a bike's setup and load fields (prefix `bikes[i]`); errors go to `c`.
pub fn check_setup(bike: &BikeInput, prefix: &str, c: &mut Checker) -> SetupValues {
    let s = &bike.setup;
    let p = format!("{prefix}.setup");
    let f = |k: &'static str| Path(&p, k);
    let headset_upper = c.range_or(
        f("headset_upper_mm"),
        limit("upper headset stack", 0.0, 60.0, "mm"),
        s.headset_upper_mm,
        8.0,
    );
    let spacers = c.range_or(
        f("spacers_mm"),
        limit("spacers", 0.0, 100.0, "mm"),
        s.spacers_mm,
        0.0,
    );
    let stem_stack = c.range_or(
        f("stem_stack_mm"),
        limit("stem clamp height", 15.0, 80.0, "mm"),
        s.stem_stack_mm,
        40.0,
    );
    let stem = c.range(
        f("stem_mm"),
        limit("stem length", 0.0, 200.0, "mm"),
        s.stem_mm,
    );
    let stem_angle = c
        .range_or(
            f("stem_angle_deg"),
            limit("stem angle", -45.0, 45.0, "°"),
            s.stem_angle_deg,
            0.0,
        )
        .to_radians();
    let bar = bar(s, &p, c);
    let cockpit = stem.map(|stem| Cockpit {
        headset_upper,
        spacers,
        stem_stack,
        stem,
        stem_angle,
        bar,
    });
    let post_offset = c.range_or(
        f("post_offset_mm"),
        limit("seatpost offset", -20.0, 60.0, "mm"),
        s.post_offset_mm,
        0.0,
    );
    let saddle_height = c.range(
        f("saddle_height_mm"),
        limit("saddle height", 300.0, 1200.0, "mm"),
        s.saddle_height_mm,
    );
    let seat = Seat {
        height: saddle_height.unwrap_or(0.0),
        setback: c.range_or(
            f("saddle_setback_mm"),
            limit("saddle setback", -100.0, 150.0, "mm"),
            s.saddle_setback_mm,
            post_offset,
        ),
        post_offset,
        saddle_stack: c.range_or(
            f("saddle_stack_mm"),
            limit("saddle stack", 0.0, 120.0, "mm"),
            s.saddle_stack_mm,
            45.0,
        ),
        max_insertion: c.range(
            f("max_insertion_mm"),
            limit("maximum insertion", 0.0, 700.0, "mm"),
            s.max_insertion_mm,
        ),
        post_length: c.range(
            f("post_length_mm"),
            limit("seatpost length", 100.0, 700.0, "mm"),
            s.post_length_mm,
        ),
        post_min_insertion: c.range(
            f("post_min_insertion_mm"),
            limit("seatpost minimum insertion", 0.0, 300.0, "mm"),
            s.post_min_insertion_mm,
        ),
        dropper_travel: c.range_or(
            f("dropper_travel_mm"),
            limit("dropper travel", 0.0, 300.0, "mm"),
            s.dropper_travel_mm,
            0.0,
        ),
    };
    let crank = c.range(
        f("crank_mm"),
        limit("crank length", 80.0, 220.0, "mm"),
        s.crank_mm,
    );
    let tx = c.range(
        f("target_grip_x_mm"),
        limit("target grip x", -300.0, 1200.0, "mm"),
        s.target_grip_x_mm,
    );
    let ty = c.range(
        f("target_grip_y_mm"),
        limit("target grip y", -300.0, 1500.0, "mm"),
        s.target_grip_y_mm,
    );
    if tx.is_some() != ty.is_some() && c.ok() {
        c.errors.push(FieldError::new(
            "needs_pair",
            f("target_grip_y_mm"),
            "a target grip point needs both target_grip_x_mm and target_grip_y_mm",
        ));
    }
    let load = bike.load.and_then(|l| {
        let lp = format!("{prefix}.load");
        let x = c.range(
            Path(&lp, "x_mm"),
            limit("load x", -800.0, 1500.0, "mm"),
            Some(l.x_mm),
        );
        let y = c.range(
            Path(&lp, "y_mm"),
            limit("load y", -300.0, 2000.0, "mm"),
            Some(l.y_mm),
        );
        let m = c.range(
            Path(&lp, "mass_kg"),
            limit("load mass", 1.0, 400.0, "kg"),
            Some(l.mass_kg),
        );
        Some((Point2::new(x?, y?), m?))
    });
    SetupValues {
        cockpit,
        seat,
        saddle_given: saddle_height.is_some(),
        setback_given: s.saddle_setback_mm.is_some(),
        spacer_limit: c.range_or(
            f("spacer_limit_mm"),
            limit("spacer limit", 0.0, 100.0, "mm"),
            s.spacer_limit_mm,
            DEFAULT_SPACER_LIMIT_MM,
        ),
        crank: (crank.unwrap_or(DEFAULT_CRANK_MM), crank.is_some()),
        bike_mass: c.range(
            f("bike_mass_kg"),
            limit("bike mass", 3.0, 60.0, "kg"),
            s.bike_mass_kg,
        ),
        bike_com_x: c.range(
            f("bike_com_x_mm"),
            limit("bike centre of mass x", -500.0, 1000.0, "mm"),
            s.bike_com_x_mm,
        ),
        bike_com_y: c.range(
            f("bike_com_y_mm"),
            limit("bike centre of mass y", -300.0, 800.0, "mm"),
            s.bike_com_y_mm,
        ),
        pedal_outer: c.range_or(
            f("pedal_outer_mm"),
            limit("pedal outer end", 50.0, 300.0, "mm"),
            s.pedal_outer_mm,
            DEFAULT_PEDAL_OUTER_MM,
        ),
        target: tx.zip(ty).map(|(x, y)| Point2::new(x, y)),
        target_bike: s.target_grip_bike.map(|i| i as usize),
        load,
    }
}
