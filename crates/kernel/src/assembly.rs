//! Puts one bike together with its rider: cockpit, seat, cranks, the seated and standing
//! postures, handling and the fit checks, all in the ridden axes (BB at the origin, x forward,
//! y up, mm). Called by [`crate::evaluate`] once the frame is solved and posed.

use crate::cockpit::{bb_to_grip, frame_x_axis, Bar, Cockpit};
use crate::error::{fmt_num, Warning};
use crate::fit;
use crate::fitting::{RiderValues, SetupValues};
use crate::geometry::Geometry;
use crate::handling::{
    combine, pedal_strike_lean, statics, toe_clearance, Support, DEFAULT_BIKE_COM_Y_MM,
    DEFAULT_BIKE_MASS_KG,
};
use crate::parts::{search, PartsSearch};
use crate::report::{BikeReport, CockpitOutline, CrankOutline, Numbers, SeatOutline};
use crate::seat::Seat;
use crate::seated::{seated, Contacts, Posture};
use crate::standing::{standing, Stance};
use nalgebra::{Point2, Vector2};

/// What the cockpit search needs of a bike after its evaluation.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct SearchContext {
    /// Ridden geometry.
    pub geometry: Geometry,
    /// The frame's x axis in ridden axes.
    pub frame_x: Vector2<f64>,
    /// The cockpit in use.
    pub cockpit: Cockpit,
    /// Fork spacer limit, mm.
    pub spacer_limit: f64,
}

/// Runs the cockpit search for a target point and names where the target came from.
pub fn parts_search(ctx: &SearchContext, target: Point2<f64>, from: &str) -> PartsSearch {
    PartsSearch {
        target_x_mm: target.x,
        target_y_mm: target.y,
        target_from: from.to_string(),
        spacer_limit_mm: ctx.spacer_limit,
        choices: search(
            &ctx.geometry,
            ctx.frame_x,
            &ctx.cockpit,
            target,
            ctx.spacer_limit,
        ),
    }
}

fn xy(p: Point2<f64>) -> [f64; 2] {
    [p.x, p.y]
}

fn put(n: &mut Numbers, k: &'static str, v: f64) {
    n.insert(k.into(), v);
}

fn warn(r: &mut BikeReport, code: &str, msg: String) {
    r.warnings.push(Warning::new(code, msg));
}

/// Fills the cockpit, seat, rider, handling and check parts of `report`. Returns the search
/// context when the bike has a cockpit.
pub fn rider_and_handling(
    s: &SetupValues,
    rider: Option<&RiderValues>,
    g: &Geometry,
    theta: f64,
    report: &mut BikeReport,
) -> Option<SearchContext> {
    let fx = frame_x_axis(theta);
    let rider = rider.filter(|_| s.load.is_none());
    let grip = s
        .cockpit
        .map(|c| cockpit(&c, s.spacer_limit, g, fx, report));
    let (crank, crank_given) = s.crank;
    if crank_given || rider.is_some() {
        report.outline.cranks = Some(CrankOutline {
            pedal_near: [crank, 0.0],
            pedal_far: [-crank, 0.0],
        });
        if !crank_given {
            warn(
                report,
                "assumed",
                format!("crank length not given: assumed {} mm.", fmt_num(crank)),
            );
        }
        let lean = pedal_strike_lean(-g.ground_y(), crank, s.pedal_outer).to_degrees();
        put(&mut report.ridden, "pedal_strike_lean_deg", lean);
        report.checks.push(fit::pedal_strike(lean));
    }
    let seat = seat_in_use(s, rider, report);
    let saddle = seat.map(|seat| seat_numbers(&seat, g, fx, report));
    if let (Some(gp), Some(sp)) = (grip, saddle) {
        put(&mut report.ridden, "saddle_to_grip_mm", (gp - sp).norm());
        put(&mut report.ridden, "saddle_to_grip_drop_mm", sp.y - gp.y);
    }
    let support = Support {
        rear_x: g.rear_axle.x,
        front_x: g.front_axle.x,
        ground_y: g.ground_y(),
    };
    if let Some((point, mass)) = s.load {
        match statics(point, &support, mass, 0.0, 0.0) {
            Some(n) => report.handling.load = n,
            None => warn(
                report,
                "load_below_ground",
                "The load's point is not above the ground; no handling numbers for it.".into(),
            ),
        }
    }
    if let Some(r) = rider {
        match (grip, saddle) {
            (Some(gp), Some(sp)) => rider_on_bike(s, r, g, gp, sp, &support, report),
            _ => warn(report, "rider_incomplete", "The rider is placed only when the setup gives a stem length (and a saddle height or an inseam).".into()),
        }
    }
    s.cockpit.map(|cockpit| SearchContext {
        geometry: *g,
        frame_x: fx,
        cockpit,
        spacer_limit: s.spacer_limit,
    })
}

fn cockpit(
    c: &Cockpit,
    limit: f64,
    g: &Geometry,
    fx: Vector2<f64>,
    r: &mut BikeReport,
) -> Point2<f64> {
    let p = c.points(g, fx);
    r.outline.cockpit = Some(CockpitOutline {
        headset_top: xy(p.headset_top),
        spacers_top: xy(p.spacers_top),
        stem_clamp: xy(p.stem_clamp),
        steerer_top: xy(p.steerer_top),
        bar_clamp: xy(p.bar_clamp),
        grip: xy(p.grip),
    });
    let (dist, angle) = bb_to_grip(p.grip);
    let n = &mut r.ridden;
    put(n, "grip_x_mm", p.grip.x);
    put(n, "grip_y_mm", p.grip.y);
    put(n, "bb_to_grip_mm", dist);
    put(n, "bb_to_grip_angle_deg", angle.to_degrees());
    put(n, "bar_clamp_x_mm", p.bar_clamp.x);
    put(n, "bar_clamp_y_mm", p.bar_clamp.y);
    put(n, "stem_clamp_x_mm", p.stem_clamp.x);
    put(n, "stem_clamp_y_mm", p.stem_clamp.y);
    let (pullback, rise) = c.bar.grip_offset();
    put(n, "bar_pullback_mm", pullback);
    put(n, "bar_rise_mm", rise);
    if c.spacers > limit {
        warn(r, "caution_spacers", format!(
            "{} mm of spacers is more than the {} mm spacer limit used here. Check the fork maker's limit; too many spacers can overload the steerer. Ask a qualified mechanic if unsure.",
            fmt_num(c.spacers), fmt_num(limit)));
    }
    p.grip
}

fn seat_in_use(s: &SetupValues, rider: Option<&RiderValues>, r: &mut BikeReport) -> Option<Seat> {
    let seat = seat_as_given(s, rider, r)?;
    if !s.setback_given {
        warn(
            r,
            "assumed",
            format!(
                "saddle setback not given: assumed {} mm (the saddle centred over the seatpost clamp).",
                fmt_num(seat.setback)
            ),
        );
    }
    Some(seat)
}

/// The seat with its given height, or with a height from the inseam (said in a warning).
fn seat_as_given(s: &SetupValues, rider: Option<&RiderValues>, r: &mut BikeReport) -> Option<Seat> {
    if s.saddle_given {
        return Some(s.seat);
    }
    let inseam = rider.filter(|v| v.inseam_given)?.body.inseam;
    let height = 0.883 * inseam;
    warn(
        r,
        "assumed",
        format!(
            "saddle height not given: assumed {} mm (0.883 × inseam).",
            fmt_num(height)
        ),
    );
    Some(Seat { height, ..s.seat })
}

fn seat_numbers(seat: &Seat, g: &Geometry, fx: Vector2<f64>, r: &mut BikeReport) -> Point2<f64> {
    let p = seat.points(g, fx);
    r.outline.seat = Some(SeatOutline {
        post_exit: xy(p.post_exit),
        post_top: xy(p.post_top),
        saddle: xy(p.saddle),
        saddle_nose: xy(p.nose),
        saddle_tail: xy(p.tail),
    });
    let fit = seat.fit(g.lengths.seat_tube);
    let a = p.axis_at_saddle;
    let n = &mut r.ridden;
    put(n, "saddle_x_mm", p.saddle.x);
    put(n, "saddle_y_mm", p.saddle.y);
    put(n, "saddle_height_mm", seat.height);
    put(n, "saddle_setback_mm", seat.setback);
    put(n, "seat_angle_at_saddle_deg", a.y.atan2(-a.x).to_degrees());
    put(n, "post_exposed_mm", fit.exposed);
    put(n, "dropper_max_travel_mm", fit.longest_dropper);
    if let Some(lo) = fit.lowest {
        put(&mut r.ridden, "saddle_height_lowest_mm", lo);
        if seat.height < lo {
            warn(r, "caution_post_too_deep", format!(
                "At {} mm saddle height the seatpost would have to go deeper than the frame allows (lowest {} mm). Use a shorter post or check the frame maker's insertion depth.",
                fmt_num(seat.height), fmt_num(lo)));
        }
    }
    if let Some(hi) = fit.highest {
        put(&mut r.ridden, "saddle_height_highest_mm", hi);
        if seat.height > hi {
            warn(r, "caution_post_insertion", format!(
                "At {} mm saddle height the seatpost would sit above its minimum-insertion mark (highest {} mm). Never ride a post above its mark; use a longer post and ask a qualified mechanic.",
                fmt_num(seat.height), fmt_num(hi)));
        }
    }
    if seat.dropper_travel > fit.longest_dropper {
        warn(r, "dropper_too_long", format!(
            "A {} mm dropper may not fit at this saddle height; the longest common travel that fits is about {} mm (estimate; check the dropper maker's lengths and the frame's insertion depth).",
            fmt_num(seat.dropper_travel), fmt_num(fit.longest_dropper)));
    }
    p.saddle
}

fn bike_com(s: &SetupValues, g: &Geometry, r: &mut BikeReport) -> (f64, Point2<f64>) {
    let mass = s.bike_mass.unwrap_or(DEFAULT_BIKE_MASS_KG);
    let x = s
        .bike_com_x
        .unwrap_or((g.rear_axle.x + g.front_axle.x) / 2.0);
    let y = s.bike_com_y.unwrap_or(DEFAULT_BIKE_COM_Y_MM);
    if s.bike_mass.is_none() || s.bike_com_x.is_none() || s.bike_com_y.is_none() {
        warn(r, "assumed", format!(
            "bike mass and centre of mass partly not given: used {} kg at {} mm ahead of and {} mm above the BB (stated defaults: 14 kg, midway between the axles, 150 mm above the BB).",
            fmt_num(mass), fmt_num(x.round()), fmt_num(y.round())));
    }
    (mass, Point2::new(x, y))
}

fn rider_on_bike(
    s: &SetupValues,
    rv: &RiderValues,
    g: &Geometry,
    grip: Point2<f64>,
    saddle: Point2<f64>,
    support: &Support,
    r: &mut BikeReport,
) {
    let body = &rv.body;
    let crank = s.crank.0;
    let mut sit = seated(
        body,
        &Contacts {
            saddle,
            grip,
            crank,
            elbow_bend: rv.elbow_bend,
        },
    );
    let stand = standing(
        body,
        &Stance {
            grip,
            crank,
            knee_bend: rv.knee_bend,
            torso_angle: rv.standing_torso,
            ground_y: g.ground_y(),
        },
    );
    let height = r.ridden.get("saddle_height_mm").copied().unwrap_or(0.0);
    put(&mut sit.numbers, "saddle_to_pedal_mm", height + crank);
    let (bike_mass, bike_point) = bike_com(s, g, r);
    let drop_bar = s.cockpit.is_some_and(|c| matches!(c.bar, Bar::Drop { .. }));
    checks(rv, &sit, height + crank, drop_bar, r);
    let toe = toe_clearance(body, crank, g.front_axle, g.radii.front);
    put(&mut r.ridden, "toe_clearance_mm", toe);
    put(&mut r.ridden, "toe_overlap_mm", (-toe).max(0.0));
    r.checks.push(fit::toe_clearance(toe));
    if toe < 0.0 {
        warn(r, "caution_toe_overlap", format!(
            "The shoe overlaps the front tyre by {} mm in side view: the toe can touch the tyre when turning at low speed. Take care, or ask a qualified fitter about shorter cranks or a different shoe position.",
            fmt_num((-toe).ceil())));
    }
    let block = |p: &Posture| {
        let com = combine(&[(body.mass, p.com?), (bike_mass, bike_point)])?;
        let n = statics(com, support, body.mass + bike_mass, rv.braking_g, rv.slope)?;
        Some((com, n))
    };
    if let Some((com, n)) = block(&sit) {
        r.checks.push(fit::front_load(
            n.get("front_load_pct").copied().unwrap_or(0.0),
        ));
        r.outline.com_seated = Some(xy(com));
        r.handling.seated = n;
    }
    if let Some((com, n)) = block(&stand) {
        r.outline.com_standing = Some(xy(com));
        r.handling.standing = n;
    }
    r.outline.rider_seated = sit.figure.map(|f| f.to_report(body));
    r.outline.rider_standing = stand.figure.map(|f| f.to_report(body));
    r.warnings.extend(sit.warnings);
    r.warnings.extend(stand.warnings);
    r.fit.seated = sit.numbers;
    r.fit.standing = stand.numbers;
    r.warnings.push(Warning::new("fit_estimate", fit::CAUTION));
}

fn checks(
    rv: &RiderValues,
    sit: &Posture,
    saddle_to_pedal: f64,
    drop_bar: bool,
    r: &mut BikeReport,
) {
    if let Some(k) = sit.numbers.get("knee_flexion_bdc_deg") {
        r.checks.push(fit::knee_flexion(*k));
    }
    if rv.inseam_given {
        let height = r.ridden.get("saddle_height_mm").copied().unwrap_or(0.0);
        r.checks
            .push(fit::saddle_height_inseam(height, rv.body.inseam));
        r.checks
            .push(fit::saddle_pedal_inseam(saddle_to_pedal, rv.body.inseam));
    }
    if let Some(t) = sit.numbers.get("torso_angle_deg") {
        r.checks.push(fit::torso_angle(*t, drop_bar));
    }
}

/// True when every number this module adds to a report is finite.
pub fn all_finite(r: &BikeReport) -> bool {
    let maps = [
        &r.fit.seated,
        &r.fit.standing,
        &r.handling.seated,
        &r.handling.standing,
        &r.handling.load,
    ];
    let o = &r.outline;
    let mut pts: Vec<[f64; 2]> = Vec::new();
    if let Some(c) = o.cockpit {
        pts.extend([
            c.headset_top,
            c.spacers_top,
            c.stem_clamp,
            c.steerer_top,
            c.bar_clamp,
            c.grip,
        ]);
    }
    if let Some(s) = o.seat {
        pts.extend([
            s.post_exit,
            s.post_top,
            s.saddle,
            s.saddle_nose,
            s.saddle_tail,
        ]);
    }
    if let Some(c) = o.cranks {
        pts.extend([c.pedal_near, c.pedal_far]);
    }
    pts.extend(o.com_seated);
    pts.extend(o.com_standing);
    for f in [o.rider_seated, o.rider_standing].into_iter().flatten() {
        pts.extend([
            f.head,
            f.shoulder,
            f.elbow,
            f.hand,
            f.hip,
            [f.head_radius, 0.0],
        ]);
        for l in f.legs {
            pts.extend([l.knee, l.ankle, l.ball, l.heel, l.toe]);
        }
    }
    maps.iter().all(|m| m.values().all(|v| v.is_finite()))
        && pts.iter().flatten().all(|v| v.is_finite())
        && r.checks.iter().all(|c| c.value.is_finite())
        && r.cockpit_parts.as_ref().is_none_or(|p| {
            p.choices.iter().all(|c| {
                c.miss_mm.is_finite() && c.grip_x_mm.is_finite() && c.grip_y_mm.is_finite()
            })
        })
}
