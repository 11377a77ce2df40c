//! `evaluate`: scenario in, report out. Validates every field, solves, poses, measures.
//!
//! **Invariant:** total and deterministic: any scenario returns a report; bad input becomes
//! entries in `errors`, never a panic, NaN or infinity.

use crate::assembly;
use crate::catalogue::{all_keys, lookup, Measurement};
use crate::error::{fmt_num, FieldError, Warning};
use crate::geometry::{FrameParams, Geometry, Radii, MEASURED_KEYS};
use crate::memo::SolveMemo;
use crate::pose::{pose, ChangeSet};
use crate::report::{BikeReport, Numbers, Outline, Report, REPORT_VERSION};
use crate::scenario::{BikeInput, Scenario, WheelsInput, SCENARIO_VERSION};
use crate::scene;
use crate::solve::{Given, SolveInput};
use crate::validate::{limit, Checker, Path};
use crate::wheel::{Wheel, WheelSpec};
use nalgebra::{Point2, Vector2};
use std::collections::BTreeMap;

/// The wheel assumed when none is given (with a warning).
pub const DEFAULT_WHEEL: &str = "29x2.4";

/// Evaluates every bike of the scenario.
pub fn evaluate(scenario: &Scenario) -> Report {
    evaluate_with(scenario, &mut SolveMemo::default())
}

/// [`evaluate`], reusing the frame solves `memo` remembers from earlier calls (and remembering
/// this call's). The report is the same as [`evaluate`]'s; only the time differs.
pub fn evaluate_with(scenario: &Scenario, memo: &mut SolveMemo) -> Report {
    let mut report = Report {
        version: REPORT_VERSION,
        bikes: Vec::new(),
        errors: Vec::new(),
    };
    if scenario.version != SCENARIO_VERSION {
        report.errors.push(FieldError::new(
            "unsupported_version",
            "version",
            format!(
                "scenario version {} is not supported; this build reads version {SCENARIO_VERSION}",
                scenario.version
            ),
        ));
        return report;
    }
    let rider = scene::scenario_rider(scenario.rider.as_ref(), &mut report.errors);
    let mut pending = Vec::new();
    let mut done = Vec::new();
    for (i, bike) in scenario.bikes.iter().enumerate() {
        match evaluate_bike(bike, &format!("bikes[{i}]"), &rider, memo) {
            Ok((b, ctx)) => {
                done.push(Some(report.bikes.len()));
                if let Some((ctx, target_bike)) = ctx {
                    pending.push(scene::Pending {
                        bike: i,
                        ctx,
                        target_bike,
                    });
                }
                report.bikes.push(b);
            }
            Err(mut errs) => {
                done.push(None);
                report.errors.append(&mut errs);
            }
        }
    }
    scene::targets_from_bikes(&pending, &done, &mut report);
    report
}

fn check_published(
    prefix: &str,
    bike: &BikeInput,
    c: &mut Checker,
    warnings: &mut Vec<Warning>,
) -> BTreeMap<String, Given> {
    let mut given = BTreeMap::new();
    let frame = format!("{prefix}.frame");
    for (key, p) in &bike.frame {
        let field = Path(&frame, key);
        let Some(m) = lookup(key) else {
            c.errors.push(FieldError::new(
                "unknown_key",
                field,
                format!(
                    "\"{key}\" is not a frame measurement; allowed keys: {}",
                    all_keys()
                ),
            ));
            continue;
        };
        let Some(value) = c.range(
            field,
            limit(m.label, m.hard.0, m.hard.1, m.unit.symbol()),
            Some(p.value()),
        ) else {
            continue;
        };
        let max_tol = if m.unit.symbol() == "mm" { 50.0 } else { 5.0 };
        let tolerance = match p.tolerance() {
            None => m.default_tolerance(),
            Some(t) => match c.range(
                format!("{field}.tolerance"),
                limit(
                    &format!("{} rounding", m.label),
                    1e-6,
                    max_tol,
                    m.unit.symbol(),
                ),
                Some(t),
            ) {
                Some(t) => t,
                None => continue,
            },
        };
        if !(m.plausible.0..=m.plausible.1).contains(&value) {
            warnings.push(implausible(m, value));
        }
        given.insert(key.clone(), Given { value, tolerance });
    }
    given
}

fn implausible(m: &Measurement, value: f64) -> Warning {
    Warning::new(
        "implausible",
        format!(
            "{} of {} {} is unusual ({}); check it.",
            m.label,
            fmt_num(value),
            m.unit.symbol(),
            m.most_bikes()
        ),
    )
}

fn resolve_wheel(
    spec: Option<&WheelSpec>,
    field: Path<'_>,
    fallback: Option<Wheel>,
    c: &mut Checker,
    warnings: &mut Vec<Warning>,
) -> Option<Wheel> {
    match spec {
        Some(s) => s.resolve(field).map_err(|e| c.errors.push(e)).ok(),
        None => {
            if fallback.is_some() {
                return fallback;
            }
            warnings.push(Warning::new(
                "assumed",
                format!("{field} not given: assumed {DEFAULT_WHEEL}."),
            ));
            WheelSpec::Designation(DEFAULT_WHEEL.into())
                .resolve(field)
                .ok()
        }
    }
}

fn wheels(
    w: &WheelsInput,
    prefix: &str,
    fallback: Option<(Wheel, Wheel)>,
    c: &mut Checker,
    warnings: &mut Vec<Warning>,
) -> Option<(Wheel, Wheel)> {
    let f = resolve_wheel(
        w.front.as_ref(),
        Path(prefix, "front"),
        fallback.map(|p| p.0),
        c,
        warnings,
    );
    let r = resolve_wheel(
        w.rear.as_ref(),
        Path(prefix, "rear"),
        fallback.map(|p| p.1),
        c,
        warnings,
    );
    Some((f?, r?))
}

/// A bike's report and, when its cockpit search waits for another bike, the search context.
type BikeResult =
    Result<(BikeReport, Option<(assembly::SearchContext, Option<usize>)>), Vec<FieldError>>;

fn evaluate_bike(
    bike: &BikeInput,
    prefix: &str,
    rider: &scene::ScenarioRider,
    memo: &mut SolveMemo,
) -> BikeResult {
    let mut c = Checker::default();
    let mut warnings = Vec::new();
    let given = check_published(prefix, bike, &mut c, &mut warnings);
    let setup = crate::fitting::check_setup(bike, prefix, &mut c);
    let seat_ref = c.range(
        Path(prefix, "seat_angle_ref_mm"),
        limit("seat angle reference height", 100.0, 1200.0, "mm"),
        bike.seat_angle_ref_mm,
    );
    let stock_wheels = wheels(
        &bike.wheels,
        &format!("{prefix}.wheels"),
        None,
        &mut c,
        &mut warnings,
    );
    let ch = &bike.changes;
    let cp = format!("{prefix}.changes");
    let ridden_wheels = wheels(
        &ch.wheels,
        &format!("{cp}.wheels"),
        stock_wheels,
        &mut c,
        &mut warnings,
    );
    let a2c_delta = c.range_or(
        Path(&cp, "fork_a2c_delta_mm"),
        limit("fork length change", -150.0, 150.0, "mm"),
        ch.fork_a2c_delta_mm,
        0.0,
    );
    let new_offset = c.range(
        Path(&cp, "fork_offset_mm"),
        limit("fork offset", -20.0, 100.0, "mm"),
        ch.fork_offset_mm,
    );
    let cups = c.range_or(
        Path(&cp, "headset_angle_deg"),
        limit("angle headset", -5.0, 5.0, "°"),
        ch.headset_angle_deg,
        0.0,
    );
    let fork_travel = c.range_or(
        Path(&cp, "fork_travel_mm"),
        limit("fork travel", 0.0, 300.0, "mm"),
        ch.fork_travel_mm,
        0.0,
    );
    let front_sag = c.range_or(
        Path(&cp, "front_sag_pct"),
        limit("front sag", 0.0, 60.0, "%"),
        ch.front_sag_pct,
        0.0,
    );
    let rear_travel = c.range_or(
        Path(&cp, "rear_travel_mm"),
        limit("rear travel", 0.0, 300.0, "mm"),
        ch.rear_travel_mm,
        0.0,
    );
    let rear_sag = c.range_or(
        Path(&cp, "rear_sag_pct"),
        limit("rear sag", 0.0, 60.0, "%"),
        ch.rear_sag_pct,
        0.0,
    );
    let px = c.range(
        Path(&cp, "pivot_x_mm"),
        limit("pivot x", -400.0, 400.0, "mm"),
        ch.pivot_x_mm,
    );
    let py = c.range(
        Path(&cp, "pivot_y_mm"),
        limit("pivot y", -200.0, 600.0, "mm"),
        ch.pivot_y_mm,
    );
    if front_sag > 0.0 && fork_travel == 0.0 {
        c.errors.push(FieldError::new(
            "needs_travel",
            format!("{cp}.fork_travel_mm"),
            "front sag needs the fork travel (mm), greater than 0",
        ));
    }
    if rear_sag > 0.0 && rear_travel == 0.0 {
        c.errors.push(FieldError::new(
            "needs_travel",
            format!("{cp}.rear_travel_mm"),
            "rear sag needs the rear wheel travel (mm), greater than 0",
        ));
    }
    let (Some((sf, sr)), Some((rf, rr)), true) = (stock_wheels, ridden_wheels, c.ok()) else {
        return Err(c.errors);
    };
    let stock_radii = Radii {
        front: sf.radius_mm,
        rear: sr.radius_mm,
    };
    let frame_field = format!("{prefix}.frame");
    let input = SolveInput {
        radii: stock_radii,
        // 0 when only the outer diameter was given (`Wheel::width_mm`).
        front_tyre_width_mm: (sf.width_mm > 0.0).then_some(sf.width_mm),
        seat_ref,
        field_prefix: &frame_field,
    };
    let solution = memo.solve(&given, input).map_err(|e| vec![e])?;
    warnings.extend(solution.warnings.iter().cloned());
    let params = solution.params;
    let changes = ChangeSet {
        radii: Radii {
            front: rf.radius_mm,
            rear: rr.radius_mm,
        },
        a2c_delta,
        offset: new_offset.unwrap_or(params.offset),
        cup_angle: cups.to_radians(),
        front_sag: front_sag / 100.0 * fork_travel,
        rear_sag: rear_sag / 100.0 * rear_travel,
        pivot: px.zip(py).map(|(x, y)| Point2::new(x, y)),
    };
    let mut stock_geom = params.geometry(stock_radii);
    stock_geom.seat_ref_height = seat_ref;
    let stock = to_numbers(&stock_geom);
    // Standover is not derivable from the frame's points (DESIGN.md §5): it is reported as
    // published, with nothing that checks it, and not as a solved number.
    let mut residuals = solution.residuals;
    if let Some(g) = given.get("standover_mm") {
        residuals.insert(
            "standover_mm".into(),
            crate::solve::Residual {
                given: g.value,
                solved: g.value,
                residual: 0.0,
                consistent: true,
                from_others: None,
                suspect: false,
            },
        );
    }
    let (posed, pose_warnings) = pose(&params, stock_radii, &changes);
    warnings.extend(pose_warnings);
    let mut ridden_geom = posed.geometry;
    ridden_geom.seat_ref_height = seat_ref;
    let ridden = to_numbers(&ridden_geom);
    let effects = change_effects(&params, stock_radii, &changes, &ridden, &stock);
    let derived = derived(&ridden_geom);
    warnings.extend(iso_window_note(
        &derived,
        ridden_geom.head_angle().to_degrees(),
    ));
    cautions(&changes, &params, &mut warnings);
    let mut report = BikeReport {
        label: bike.label.clone(),
        residuals,
        missing: solution.missing,
        stock,
        ridden,
        effects,
        derived,
        fit: Default::default(),
        handling: Default::default(),
        checks: Vec::new(),
        cockpit_parts: None,
        warnings,
        suspects: solution.suspects,
        outline: outline(&ridden_geom, rf, rr),
        stock_outline: outline(&stock_geom, sf, sr),
    };
    let ctx = scene::attach(&setup, rider, &ridden_geom, posed.theta, &mut report);
    finite_or_error(report, prefix).map(|r| (r, ctx))
}

/// The numbers of [`Geometry::measure`], keyed for the report. Built by inserting, not by
/// `collect`: a map collected from an iterator sorts a vector first, and each key type sorted
/// puts one more copy of the standard library's stable sort in the page's module.
fn to_numbers(g: &Geometry) -> Numbers {
    let mut out = Numbers::new();
    for (k, v) in MEASURED_KEYS.iter().zip(g.measure_values()) {
        if let Some(v) = v {
            out.insert((*k).into(), v);
        }
    }
    out
}

/// Each change applied alone to the stock frame: its effect on every number.
fn change_effects(
    params: &FrameParams,
    radii: Radii,
    all: &ChangeSet,
    _ridden: &Numbers,
    stock: &Numbers,
) -> BTreeMap<String, Numbers> {
    let base = ChangeSet::stock(params, radii);
    let singles: [(&str, ChangeSet); 6] = [
        (
            "fork",
            ChangeSet {
                a2c_delta: all.a2c_delta,
                offset: all.offset,
                ..base
            },
        ),
        (
            "headset_cups",
            ChangeSet {
                cup_angle: all.cup_angle,
                ..base
            },
        ),
        (
            "wheels",
            ChangeSet {
                radii: all.radii,
                ..base
            },
        ),
        (
            "front_sag",
            ChangeSet {
                front_sag: all.front_sag,
                ..base
            },
        ),
        (
            "rear_sag",
            ChangeSet {
                rear_sag: all.rear_sag,
                pivot: all.pivot,
                ..base
            },
        ),
        ("all", *all),
    ];
    let mut out = BTreeMap::new();
    for (name, cs) in singles {
        if cs == base {
            continue;
        }
        let (p, _) = pose(params, radii, &cs);
        let m = to_numbers(&p.geometry);
        // Inserted, not collected (see `to_numbers`).
        let mut delta = Numbers::new();
        for (k, v) in &m {
            if let Some(s) = stock.get(k) {
                delta.insert(k.clone(), v - s);
            }
        }
        out.insert(name.to_string(), delta);
    }
    out
}

/// Mechanical trail `Tm = T sin h`, wheel flop `f = T sin h cos h`, and the steering-axis height
/// above the ground on the vertical through the front axle `T tan h`, with the ISO 4210-2 Annex A
/// window 0.15 R … 0.60 R. Source: Wikipedia, "Bicycle and motorcycle geometry"; ISO 4210-2:2015
/// Annex A (informative).
fn derived(g: &Geometry) -> Numbers {
    let mut d = Numbers::new();
    let h = g.head_angle();
    if let Some(t) = g.trail() {
        d.insert("trail_mm".into(), t);
        d.insert("mechanical_trail_mm".into(), t * h.sin());
        d.insert("wheel_flop_mm".into(), t * h.sin() * h.cos());
        d.insert("steer_axis_height_at_axle_mm".into(), t * h.tan());
        d.insert("iso_window_min_mm".into(), 0.15 * g.radii.front);
        d.insert("iso_window_max_mm".into(), 0.60 * g.radii.front);
    }
    d
}

/// Information (not an error) when the ridden bike falls outside the ISO 4210-2:2015 Annex A
/// (informative) window: head angle 65°–75°, steering-axis height at the front axle 0.15 R–0.60 R.
/// Long-travel mountain bikes often do. Only the part that is outside is named, and a value
/// within the page's rounding of a bound (0.05°, 0.5 mm) counts as inside, so the note never
/// calls a shown 65.0° outside 65° to 75°.
pub fn iso_window_note(d: &Numbers, head_angle_deg: f64) -> Option<Warning> {
    let height = *d.get("steer_axis_height_at_axle_mm")?;
    let (lo, hi) = (*d.get("iso_window_min_mm")?, *d.get("iso_window_max_mm")?);
    let angle_out = !(64.95..=75.05).contains(&head_angle_deg);
    let height_out = !((lo - 0.5)..=(hi + 0.5)).contains(&height);
    if !angle_out && !height_out {
        return None;
    }
    // Tenths of a degree and whole mm, as the page shows them.
    let angle = format!(
        "the head angle of {}° is outside its 65° to 75°",
        fmt_num((head_angle_deg * 10.0).round() / 10.0)
    );
    let axis = format!(
        "the steering axis meets the vertical through the front axle {} mm above the ground, outside its {} to {} mm (0.15 to 0.60 times the tyre radius)",
        fmt_num(height.round()),
        fmt_num(lo.round()),
        fmt_num(hi.round())
    );
    let what = match (angle_out, height_out) {
        (true, false) => angle,
        (false, _) => axis,
        (true, true) => format!("{angle}, and {axis}"),
    };
    Some(Warning::new(
        "info_iso_window",
        format!(
            "For information: against the ISO 4210-2 Annex A steering guide, {what}. Many long-travel bikes are outside it; it is not a fault."
        ),
    ))
}

fn cautions(ch: &ChangeSet, params: &FrameParams, warnings: &mut Vec<Warning>) {
    if ch.a2c_delta > 0.0 {
        warnings.push(Warning::new(
            "caution_fork_length",
            format!(
                "The fork is {} mm longer than stock. Check the frame maker's maximum fork length before fitting it; ask a qualified mechanic if unsure.",
                fmt_num(ch.a2c_delta)
            ),
        ));
    }
    if ch.cup_angle != 0.0 {
        warnings.push(Warning::new(
            "caution_angle_cups",
            "Angle-adjusting headset cups are only safe on frames their maker approves for them; check with the frame maker or a qualified mechanic.",
        ));
    }
    let _ = params;
}

fn outline(g: &Geometry, front: Wheel, rear: Wheel) -> Outline {
    let xy = |p: Point2<f64>| [p.x, p.y];
    Outline {
        ground_y: g.ground_y(),
        rear_axle: xy(g.rear_axle),
        front_axle: xy(g.front_axle),
        rear_radius: g.radii.rear,
        front_radius: g.radii.front,
        rear_rim_radius: rear.bsd_mm / 2.0,
        front_rim_radius: front.bsd_mm / 2.0,
        head_top: xy(g.head_top),
        head_bottom: xy(g.head_bottom),
        crown: xy(g.crown),
        fork_leg_top: xy(g.crown + Vector2::new(-g.steer_down.y, g.steer_down.x) * g.lengths.offset),
        seat_top: xy(g.seat_top),
        steer_ground: xy(g.steer_ground_point().unwrap_or(g.front_axle)),
        rear_contact: [g.rear_axle.x, g.ground_y()],
        front_contact: [g.front_axle.x, g.ground_y()],
        cockpit: None,
        seat: None,
        cranks: None,
        rider_seated: None,
        rider_standing: None,
        com_seated: None,
        com_standing: None,
    }
}

fn finite_or_error(report: BikeReport, prefix: &str) -> Result<BikeReport, Vec<FieldError>> {
    let all_finite = [&report.stock, &report.ridden, &report.derived]
        .iter()
        .all(|m| m.values().all(|v| v.is_finite()))
        && report
            .effects
            .values()
            .all(|m| m.values().all(|v| v.is_finite()))
        && assembly::all_finite(&report);
    if all_finite {
        Ok(report)
    } else {
        Err(vec![FieldError::new(
            "degenerate",
            prefix.to_string(),
            "these numbers do not describe a frame that can stand on two wheels; check the angles and lengths",
        )])
    }
}
