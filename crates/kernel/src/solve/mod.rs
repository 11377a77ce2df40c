//! The frame solver (DESIGN.md §6.1): from whatever published numbers are given to the core
//! [`FrameParams`], with a residual for every given value, the values that disagree, and the
//! measurements that are missing.
//!
//! Unknowns (mm and degrees): rear centre, reach, stack, head angle, head tube, lower headset
//! stack, axle-to-crown, offset, actual seat angle, seat axis offset, seat tube. The BB drop is
//! not an unknown: the tyres-on-the-ground condition `F.y − R.y = r_front − r_rear` (§8a) fixes
//! it ([`FrameParams::grounded_bb_drop`]). Every published key is predicted through
//! [`Geometry::measure_values`](crate::geometry::Geometry::measure_values), so the solver and the
//! report share one definition per number.
//!
//! Method: weighted nonlinear least squares, `min Σ ((predicted − given) / tolerance)²`, by
//! Levenberg–Marquardt (`levenberg-marquardt` crate on nalgebra). Before fitting, the rank of the
//! weighted Jacobian (SVD) shows which unknowns nothing fixes: those with a stated prior (lower
//! headset stack 0 mm, seat axis offset 0 mm) take it, the others a typical value, each with a
//! warning, and `missing` names measurements that would fix them. A fixed unknown lies along a
//! direction the published numbers cannot see, so it does not move the determined ones.
//! A given value is inconsistent when `|solved − given| > 2.5 × tolerance`, or when what the
//! other values alone predict for it is further off than that and than rounding explains
//! (`diagnose`); the warning quotes those predictions (`explain`).
//!
//! Robust-fit rule: a value identified as a lone misprint gets weight zero. When exactly one
//! value's removal lets the rest agree (and what they give for it is plausible), the solved frame
//! is the refit without it ([`lone_misprint`]); the other values keep their published values.
//! Several such values form one loop and cannot be told apart: the weighted fit spreads them.
//! A solved value nothing published gives, outside its plausible range, is cautioned (`unusual`).

mod blame;
mod diagnose;
mod explain;
mod fit;
mod model;
mod plan;
mod unknowns;
mod unusual;

use crate::catalogue::{lookup, Unit};
use crate::error::{fmt_measure, in_sentence, FieldError, Warning};
use crate::geometry::{measured_index, FrameParams, Radii, MEASURED_KEYS};
use fit::{fit, Fitted};
use model::{Model, Row};
use serde::Serialize;
use std::collections::BTreeMap;
use unknowns::{fork_stand_in, ix, to_params, typical, FrontTyre, UNKNOWNS, X};

/// One published value, validated: value and tolerance in catalogue units (mm or degrees).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Given {
    /// The published number.
    pub value: f64,
    /// Its rounding (weight = 1 / tolerance).
    pub tolerance: f64,
}

/// What the solver reports for one given value.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct Residual {
    /// As published.
    pub given: f64,
    /// As reconstructed from the solved frame.
    pub solved: f64,
    /// `solved − given`.
    pub residual: f64,
    /// False when the value disagrees with the rest: its residual exceeds 2.5 × its tolerance,
    /// or what the other values alone predict for it (`from_others`) is further from it than
    /// 2.5 × its tolerance and than rounding explains (`diagnose::checks`).
    pub consistent: bool,
    /// What the *other* given values alone predict for this one, in its unit: when some value
    /// disagrees, the frame refitted without it; else the first-order leave-one-out estimate;
    /// `None` (left out of the JSON, which has no nulls) when no other value checks it.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub from_others: Option<f64>,
    /// True for a value whose removal lets the rest agree, what they give for it being plausible:
    /// a likely misprint. Several suspects are one loop that any one of them would close. Left out
    /// of the JSON when false.
    #[serde(skip_serializing_if = "is_false")]
    pub suspect: bool,
}

fn is_false(b: &bool) -> bool {
    !*b
}

/// The solved frame with its diagnostics.
#[derive(Debug, Clone, PartialEq)]
pub struct Solution {
    /// The core parameters.
    pub params: FrameParams,
    /// Per given key: given, solved, residual, consistent.
    pub residuals: BTreeMap<String, Residual>,
    /// Measurements that would fix an unknown nothing determines.
    pub missing: Vec<String>,
    /// Assumptions made and inconsistencies found.
    pub warnings: Vec<Warning>,
    /// The keys of the suspects ([`Residual::suspect`]) in the order the `inconsistent` warning
    /// names them: the likelier misprints first (fewest of their own rounding steps from what the
    /// others give), ties in key order. Empty when there is none.
    pub suspects: Vec<String>,
}

/// Factor on the tolerance past which a residual is inconsistent.
pub const INCONSISTENT_FACTOR: f64 = 2.5;

/// What the solver needs besides the published values.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct SolveInput<'a> {
    /// Tyre outer radii of the stock wheels, mm.
    pub radii: Radii,
    /// Section width of the stock front tyre, mm (`None` when only its diameter is known): with
    /// the radius it chooses the stand-in axle-to-crown when nothing published fixes it.
    pub front_tyre_width_mm: Option<f64>,
    /// Height above the BB at which the effective seat angle is read (`None` = stack), mm.
    pub seat_ref: Option<f64>,
    /// Field path of the frame block for errors, e.g. `bikes[0].frame`.
    pub field_prefix: &'a str,
}

/// Solves the frame from the given measurements.
///
/// # Errors
/// A [`FieldError`] for an impossible combination (a chainstay no longer than the BB drop, a rear
/// centre longer than the chainstay, a wheelbase no longer than the front or rear centre), for
/// numbers that together imply a frame outside the catalogue's hard ranges, or when no start
/// converges.
pub fn solve(
    given: &BTreeMap<String, Given>,
    input: SolveInput<'_>,
) -> Result<Solution, FieldError> {
    let prefix = input.field_prefix;
    precheck(given, prefix)?;
    let model = Model {
        radii: input.radii,
        seat_ref: input.seat_ref,
    };
    let rows: Vec<Row> = given
        .iter()
        .filter_map(|(k, g)| {
            measured_index(k).map(|index| Row {
                index,
                value: g.value,
                tolerance: g.tolerance,
            })
        })
        .collect();
    let front = FrontTyre {
        radius_mm: input.radii.front,
        width_mm: input.front_tyre_width_mm,
    };
    let typical = typical(front);
    let mut x0 = first_guess(given, input.radii, &typical);
    let plan = plan::plan(&model, &rows, &mut x0, &typical).ok_or_else(|| no_solution(prefix))?;
    let best =
        best_fit(&model, &rows, &plan.free, &x0, &typical).ok_or_else(|| no_solution(prefix))?;
    postcheck(
        given,
        (&model, &best.x, &rows, &plan.free),
        &to_params(&best.x, input.radii),
        prefix,
    )?;
    let diag = diagnosis(&model, &best.x, &rows, &plan.free).ok_or_else(|| no_solution(prefix))?;
    let params = to_params(&diag.x, input.radii);
    let mut warnings = assumption_warnings(&plan, &x0, front);
    // Inserted one by one: collecting into a map sorts, one more sort in the page's wasm.
    let mut residuals = BTreeMap::new();
    for f in &diag.findings {
        let key = MEASURED_KEYS.get(f.index).copied().unwrap_or("?");
        residuals.insert(key.to_string(), residual(f));
    }
    warnings.extend(diag.warning);
    warnings.extend(unusual::warning(&model, &diag.x, &rows, &plan.pinned));
    let suspects = diag
        .suspects
        .iter()
        .filter_map(|&i| MEASURED_KEYS.get(i).map(|k| k.to_string()))
        .collect();
    Ok(Solution {
        params,
        residuals,
        missing: plan.missing,
        warnings,
        suspects,
    })
}

fn residual(f: &explain::Finding) -> Residual {
    Residual {
        given: f.given,
        solved: f.solved,
        residual: f.solved - f.given,
        consistent: f.consistent,
        from_others: f.from_others,
        suspect: f.suspect,
    }
}

/// The solved unknowns, one finding per given row, the `inconsistent` warning if any, and the
/// suspects in the order it names them.
struct Diagnosis {
    x: X,
    findings: Vec<explain::Finding>,
    warning: Option<Warning>,
    suspects: Vec<usize>,
}

/// Checks the fit `x`; when values disagree, refits without each in turn (what the others give
/// for it, and the suspects). A lone suspect is a misprint and gets weight zero
/// ([`lone_misprint`]); several suspects (one loop) keep the weighted fit, which spreads them.
fn diagnosis(model: &Model, x: &X, rows: &[Row], free: &[usize]) -> Option<Diagnosis> {
    let checks = diagnose::checks(model, x, rows, free)?;
    let mut findings = findings(rows, &model.predict(x)?, &checks, None);
    if findings.iter().all(|f| f.consistent) {
        return Some(Diagnosis {
            x: *x,
            findings,
            warning: None,
            suspects: Vec::new(),
        });
    }
    let left_out = diagnose::leave_each_out(model, x, rows, free);
    let mut suspects = Vec::new();
    for f in &mut findings {
        let Some(l) = left_out.iter().find(|l| l.index == f.index) else {
            continue;
        };
        if let Some(p) = l.predicted {
            f.from_others = Some(p);
            // A suspect is a misprint the rest would mend: what they give for it must be a value
            // a frame has (inside the catalogue's plausible range), or "off by 241 mm" would be
            // offered for a 110 mm head tube.
            f.suspect = l.rest_agree && plausible(l.index, p);
        }
        if f.suspect {
            suspects.push(l);
        }
    }
    if let [one] = suspects.as_slice() {
        if let Some(d) = lone_misprint(model, one, rows, free) {
            return Some(d);
        }
    }
    let mut named: Vec<usize> = suspects.iter().map(|l| l.index).collect();
    explain::in_named_order(&findings, &mut named);
    let warning = Some(explain::warning(&findings, &named, false));
    Some(Diagnosis {
        x: *x,
        findings,
        warning,
        suspects: named,
    })
}

/// The robust-fit rule: a value identified as a lone misprint gets weight zero. The solved frame
/// is the refit without it, so the other values keep their published values; its own row keeps
/// its published value and what the others make it. `None` when that refit leaves the hard ranges.
fn lone_misprint(
    model: &Model,
    one: &diagnose::LeftOut,
    rows: &[Row],
    free: &[usize],
) -> Option<Diagnosis> {
    if !within_hard_ranges(model, &one.x) {
        return None;
    }
    let k = rows.iter().position(|r| r.index == one.index)?;
    let checks = diagnose::checks(model, &one.x, &diagnose::without(rows, k), free)?;
    let findings = findings(rows, &model.predict(&one.x)?, &checks, Some(one.index));
    let warning = Some(explain::warning(&findings, &[one.index], true));
    Some(Diagnosis {
        x: one.x,
        findings,
        warning,
        suspects: vec![one.index],
    })
}

/// One finding per row from the solved values and the checks of the rows fitted (every row but
/// `left_out`, which is the suspect, its solved value being what the others give for it).
fn findings(
    rows: &[Row],
    predicted: &[f64],
    checks: &[diagnose::Check],
    left_out: Option<usize>,
) -> Vec<explain::Finding> {
    let mut checks = checks.iter();
    let mut out = Vec::new();
    for row in rows {
        let solved = predicted.get(row.index).copied().unwrap_or(row.value);
        let mut f = explain::Finding {
            index: row.index,
            given: row.value,
            solved,
            tolerance: row.tolerance,
            from_others: Some(solved),
            consistent: false,
            suspect: true,
        };
        if left_out != Some(row.index) {
            let c = checks.next();
            f.from_others = c.and_then(|c| c.from_others);
            f.consistent = c.is_none_or(|c| c.consistent);
            f.suspect = false;
        }
        out.push(f);
    }
    out
}

/// Whether `v` lies in the plausible range of measurement `index` (true for a key outside the
/// catalogue).
fn plausible(index: usize, v: f64) -> bool {
    MEASURED_KEYS
        .get(index)
        .and_then(|k| lookup(k))
        .is_none_or(|m| (m.plausible.0..=m.plausible.1).contains(&v))
}

/// The first guess: typical values, overwritten by every value published directly; without a
/// published axle-to-crown, the one that puts the BB at the published (or, from chainstay and rear
/// centre, the positive) BB drop, so the search starts on the usual side of the axles.
fn first_guess(given: &BTreeMap<String, Given>, radii: Radii, typical: &X) -> X {
    let mut x = *typical;
    for (slot, u) in x.iter_mut().zip(UNKNOWNS.iter()) {
        if let Some(g) = given.get(u.key) {
            *slot = g.value;
        }
    }
    let get = |k: &str| given.get(k).map(|g| g.value);
    if get("rear_centre_mm").is_none() {
        if let Some(cs) = get("chainstay_mm") {
            let drop = get("bb_drop_mm").unwrap_or(30.0);
            x[ix::REAR_CENTRE] = (cs * cs - drop * drop).max(100.0).sqrt();
        }
    }
    let drop = get("bb_drop_mm")
        .or_else(|| get("bb_height_mm").map(|h| radii.rear - h))
        .or_else(|| {
            let (cs, rc) = (get("chainstay_mm")?, get("rear_centre_mm")?);
            Some((cs * cs - rc * rc).max(0.0).sqrt())
        });
    if let (None, Some(drop)) = (get("fork_a2c_mm"), drop) {
        // drop = stack − L sin h + offset cos h − (r_front − r_rear), solved for a2c.
        let h = x[ix::HEAD_ANGLE].to_radians();
        let along = (x[ix::STACK] + x[ix::OFFSET] * h.cos() - drop - (radii.front - radii.rear))
            / h.sin().max(0.3);
        let a2c = along - x[ix::HEAD_TUBE] - x[ix::HEADSET_LOWER];
        if a2c.is_finite() && (250.0..=700.0).contains(&a2c) {
            x[ix::A2C] = a2c;
        }
    }
    if get("seat_angle_actual_deg").is_none() {
        if let Some(a) = get("seat_angle_effective_deg") {
            x[ix::SEAT_ANGLE] = a;
        }
    }
    x
}

/// Fits from the first guess; when that fails or leaves values inconsistent, tries other starts
/// and keeps the converged fit with the lowest cost.
fn best_fit(model: &Model, rows: &[Row], free: &[usize], x0: &X, typical: &X) -> Option<Fitted> {
    let good = |f: &Fitted| {
        within_hard_ranges(model, &f.x) && diagnose::all_consistent(model, &f.x, rows, free)
    };
    let first = fit(model, rows, free, x0);
    // A fit whose residuals are all within the tolerance needs no other start (cheap test first).
    let small = |f: &Fitted| {
        model
            .residuals(&f.x, rows)
            .is_some_and(|r| r.iter().all(|v| v.abs() <= 1.0))
    };
    if first
        .as_ref()
        .is_some_and(|f| small(f) && within_hard_ranges(model, &f.x))
    {
        return first;
    }
    if first.as_ref().is_some_and(good) {
        return first;
    }
    let mut best = first;
    let mut others = [*typical, *x0, *x0];
    others[1][ix::HEAD_ANGLE] = 70.0;
    others[1][ix::SEAT_ANGLE] = 73.0;
    others[2][ix::REAR_CENTRE] = 400.0;
    others[2][ix::HEAD_ANGLE] = 63.0;
    for mut start in others {
        // Unknowns outside `free` keep their planned (prior or typical) value.
        for (i, v) in start.iter_mut().enumerate() {
            if !free.contains(&i) {
                *v = x0.get(i).copied().unwrap_or(*v);
            }
        }
        if let Some(f) = fit(model, rows, free, &start) {
            if good(&f) {
                return Some(f);
            }
            let rank = |f: &Fitted| (!within_hard_ranges(model, &f.x), f.cost);
            if best.as_ref().is_none_or(|b| rank(&f) < rank(b)) {
                best = Some(f);
            }
        }
    }
    best
}

fn no_solution(prefix: &str) -> FieldError {
    FieldError::new(
        "no_solution",
        prefix,
        "The published numbers could not be fitted to one frame from any start; check them for typing errors.",
    )
}

fn value(given: &BTreeMap<String, Given>, key: &str) -> Option<f64> {
    given.get(key).map(|g| g.value)
}

/// Impossible combinations of given values, found before solving.
fn precheck(given: &BTreeMap<String, Given>, prefix: &str) -> Result<(), FieldError> {
    let v = |k| value(given, k);
    if let (Some(cs), Some(drop)) = (v("chainstay_mm"), v("bb_drop_mm")) {
        if cs <= drop.abs() {
            return Err(short_chainstay(prefix, cs, drop));
        }
    }
    if let (Some(cs), Some(rc)) = (v("chainstay_mm"), v("rear_centre_mm")) {
        if rc > cs + HARD_SLACK {
            return Err(FieldError::new(
                "impossible",
                format!("{prefix}.rear_centre_mm"),
                format!(
                    "Rear centre {} is longer than the chainstay {}; the horizontal distance can be at most the straight one.",
                    fmt_measure(rc, Unit::Mm),
                    fmt_measure(cs, Unit::Mm)
                ),
            ));
        }
    }
    if let Some(wb) = v("wheelbase_mm") {
        for part in ["front_centre_mm", "rear_centre_mm"] {
            if let Some(p) = v(part) {
                if wb <= p {
                    return Err(FieldError::new(
                        "impossible",
                        format!("{prefix}.wheelbase_mm"),
                        format!(
                            "Wheelbase {} is not longer than the {} of {}; it must be longer (wheelbase = front centre + rear centre).",
                            fmt_measure(wb, Unit::Mm),
                            lookup(part).map_or(part.to_string(), |m| in_sentence(m.label)),
                            fmt_measure(p, Unit::Mm)
                        ),
                    ));
                }
            }
        }
    }
    Ok(())
}

fn short_chainstay(prefix: &str, cs: f64, drop: f64) -> FieldError {
    FieldError::new(
        "impossible",
        format!("{prefix}.chainstay_mm"),
        format!(
            "Chainstay {} is not longer than the {} between the BB and rear axle heights (BB drop); it must be longer.",
            fmt_measure(cs, Unit::Mm),
            fmt_measure(drop.abs(), Unit::Mm)
        ),
    )
}

/// Impossible frames found after solving: a chainstay no longer than the solved BB drop, and
/// solved parameters outside the catalogue's hard ranges (attached to the published value that
/// moved them most, [`blame::out_of_range`]).
fn postcheck(
    given: &BTreeMap<String, Given>,
    fit: (&Model, &X, &[Row], &[usize]),
    params: &FrameParams,
    prefix: &str,
) -> Result<(), FieldError> {
    if let Some(cs) = value(given, "chainstay_mm") {
        if cs <= params.bb_drop.abs() + 1.0 {
            return Err(short_chainstay(prefix, cs, params.bb_drop));
        }
    }
    let (model, x, _, _) = fit;
    for (k, u) in UNKNOWNS.iter().enumerate() {
        let v = x.get(k).copied().unwrap_or(f64::NAN);
        if lookup(u.key).is_some_and(|m| !inside_hard(m, v)) {
            let q = |x: &X| x.get(k).copied().unwrap_or(f64::NAN);
            return Err(blame::out_of_range(fit, u.key, v, q, prefix));
        }
    }
    let drop = |x: &X| to_params(x, model.radii).bb_drop;
    if lookup("bb_drop_mm").is_some_and(|m| !inside_hard(m, params.bb_drop)) {
        return Err(blame::out_of_range(
            fit,
            "bb_drop_mm",
            params.bb_drop,
            drop,
            prefix,
        ));
    }
    Ok(())
}

/// Slack on the hard ranges for solved values: ten default roundings (10 mm, 1°), so that a
/// fit that spreads one wrong value is reported as inconsistent rather than impossible.
const HARD_SLACK: f64 = 10.0;

fn inside_hard(m: &crate::catalogue::Measurement, v: f64) -> bool {
    let slack = HARD_SLACK * m.default_tolerance();
    v.is_finite() && (m.hard.0 - slack..=m.hard.1 + slack).contains(&v)
}

/// True when every solved parameter and the BB drop lie within the hard ranges (with slack).
fn within_hard_ranges(model: &Model, x: &X) -> bool {
    let drop = to_params(x, model.radii).bb_drop;
    UNKNOWNS
        .iter()
        .zip(x.iter())
        .map(|(u, v)| (u.key, *v))
        .chain([("bb_drop_mm", drop)])
        .all(|(k, v)| lookup(k).is_none_or(|m| inside_hard(m, v)))
}

/// Warnings for the unknowns the published numbers leave free, with the values `x` they were
/// given (a prior: `assumed`; a typical value: `underdetermined`, the axle-to-crown with the
/// fork it stands for, see [`fork_stand_in`]).
fn assumption_warnings(plan: &plan::Plan, x: &X, front: FrontTyre) -> Vec<Warning> {
    let mut out = Vec::new();
    let describe = |u: usize| {
        let unknown = UNKNOWNS.get(u)?;
        let m = lookup(unknown.key)?;
        Some((m.label, fmt_measure(x.get(u).copied()?, m.unit)))
    };
    for (label, value) in plan.priors.iter().filter_map(|&u| describe(u)) {
        out.push(Warning::new(
            "assumed",
            format!(
                "{label} is not fixed by the published numbers: assumed {value} (enter the \
                 published value to replace it)."
            ),
        ));
    }
    if !plan.pinned.is_empty() {
        let list: Vec<String> = plan
            .pinned
            .iter()
            .filter_map(|&u| {
                let (label, value) = describe(u)?;
                let why = match u {
                    ix::A2C => fork_reason(front),
                    ix::REAR_CENTRE => rear_reason(front),
                    _ => String::new(),
                };
                Some(format!("{} {value}{why}", in_sentence(label)))
            })
            .collect();
        out.push(Warning::new(
            "underdetermined",
            format!(
                "The published numbers do not fix the whole frame; these are typical values, not this frame's: {}. Add {} to fix them.",
                list.join(", "),
                plan.missing
                    .iter()
                    .map(|k| crate::catalogue::lookup(k).map_or(k.as_str(), |m| m.label))
                    .collect::<Vec<_>>()
                    .join(", ")
            ),
        ));
    }
    out
}

/// Why the stand-in axle-to-crown has its length, in brackets after it: the fork it stands for
/// and the tyre that chose it (common practice, see [`fork_stand_in`]).
fn fork_reason(front: FrontTyre) -> String {
    let fork = fork_stand_in(front);
    let kind = if fork.suspension {
        "a suspension fork of about 150 mm travel"
    } else {
        "a rigid fork"
    };
    match front.width_mm {
        Some(w) => format!(" ({kind}, as common for a {w:.0} mm front tyre)"),
        None => format!(" ({kind}; the front tyre's width is not known)"),
    }
}

/// Why the stand-in rear centre has its length: said only for the narrow tyre's shorter one
/// ([`unknowns::typical`]).
fn rear_reason(front: FrontTyre) -> String {
    match front.width_mm {
        Some(w) if !fork_stand_in(front).suspension => {
            format!(" (a road or gravel bike's, as common for a {w:.0} mm front tyre)")
        }
        _ => String::new(),
    }
}

/// Sorts a short list in place (insertion sort, stable): `before(a, b)` when `a` goes first. The
/// page's wasm has no room for the standard library's sorts of one more type (about 5 kB each);
/// the lists sorted here have a few dozen entries at most.
pub(crate) fn sort_short<T>(v: &mut [T], before: impl Fn(&T, &T) -> bool) {
    for i in 1..v.len() {
        let mut j = i;
        while j > 0 {
            let swap = match (v.get(j), v.get(j - 1)) {
                (Some(a), Some(b)) => before(a, b),
                _ => false,
            };
            if !swap {
                break;
            }
            v.swap(j, j - 1);
            j -= 1;
        }
    }
}

#[cfg(test)]
mod sort_tests {
    #[test]
    fn sort_short_orders_and_keeps_ties_in_place() {
        let mut v = [(3, 'a'), (1, 'b'), (3, 'c'), (0, 'd'), (1, 'e')];
        super::sort_short(&mut v, |a, b| a.0 < b.0);
        assert_eq!(v, [(0, 'd'), (1, 'b'), (1, 'e'), (3, 'a'), (3, 'c')]);
        let mut empty: [u8; 0] = [];
        super::sort_short(&mut empty, |a, b| a < b);
    }
}
