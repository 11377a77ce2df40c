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
//! is the refit without it (`robust::lone_misprint`); the other values keep their published
//! values. Several such values form one loop and cannot be told apart: the weighted fit spreads
//! them. A solved value nothing published gives, outside its plausible range, is cautioned
//! (`unusual`).
//!
//! Files: this one holds the public types and [`solve`], which runs the steps in order:
//! `impossible` (prechecks), `plan` (rank, priors, stand-ins), `start` (first guess, other
//! starts) with `fit` (Levenberg–Marquardt), `impossible` again (hard ranges, `blame`), `robust`
//! (verdict, lone misprint) with `diagnose` and `explain`, `assumptions` and `unusual` (warnings).

mod assumptions;
mod blame;
mod diagnose;
mod explain;
mod fit;
mod impossible;
mod model;
mod plan;
mod robust;
mod start;
mod unknowns;
mod unusual;

use crate::catalogue::lookup;
use crate::error::{FieldError, Warning};
use crate::geometry::{measured_index, FrameParams, Radii, MEASURED_KEYS};
use assumptions::assumption_warnings;
use impossible::{no_solution, postcheck, precheck};
use model::{Model, Row};
use robust::diagnosis;
use serde::Serialize;
use start::{best_fit, first_guess};
use std::collections::BTreeMap;
use unknowns::{to_params, typical, FrontTyre};

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

/// Whether `v` lies in the plausible range of measurement `index` (true for a key outside the
/// catalogue).
fn plausible(index: usize, v: f64) -> bool {
    MEASURED_KEYS
        .get(index)
        .and_then(|k| lookup(k))
        .is_none_or(|m| (m.plausible.0..=m.plausible.1).contains(&v))
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
