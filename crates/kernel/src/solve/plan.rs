//! Rank analysis: which unknowns the published numbers fix, which take a stated prior, which are
//! pinned to a typical value, and which measurements would fix those (`missing`).

use super::model::{null_space, rank, Model, Row};
use super::unknowns::{N_UNKNOWNS, PIN_ORDER, UNKNOWNS, X};
use crate::geometry::{measured_index, MEASURED_KEYS};
use nalgebra::DMatrix;

/// The outcome of the rank analysis.
#[derive(Debug, Clone, PartialEq, Default)]
pub struct Plan {
    /// Unknowns the fit adjusts (the published numbers fix them).
    pub free: Vec<usize>,
    /// Unknowns set to their stated prior because nothing fixes them.
    pub priors: Vec<usize>,
    /// Unknowns set to a typical value because nothing fixes them and they have no prior.
    pub pinned: Vec<usize>,
    /// Measurement keys that would fix the pinned unknowns.
    pub missing: Vec<String>,
}

/// The order in which measurements are suggested for `missing`: those most often found on a
/// geometry sheet or easy to measure come first.
const SUGGEST: [&str; 19] = [
    "fork_a2c_mm",
    "fork_offset_mm",
    "reach_mm",
    "stack_mm",
    "head_angle_deg",
    "head_tube_mm",
    "chainstay_mm",
    "seat_angle_actual_deg",
    "seat_tube_mm",
    "bb_drop_mm",
    "bb_height_mm",
    "wheelbase_mm",
    "top_tube_effective_mm",
    "seat_angle_effective_deg",
    "rear_centre_mm",
    "front_centre_mm",
    "trail_mm",
    "headset_lower_mm",
    "seat_axis_offset_mm",
];

/// Analyses the Jacobian of `rows` at `x` and fixes every unknown nothing determines: first the
/// ones with a prior, then the others in [`PIN_ORDER`], until the rest are fully determined.
/// Writes the prior or the `typical` value into `x` for each fixed unknown.
pub fn plan(model: &Model, rows: &[Row], x: &mut X, typical: &X) -> Option<Plan> {
    let idx: Vec<usize> = rows.iter().map(|r| r.index).collect();
    let tol: Vec<f64> = rows.iter().map(|r| r.tolerance).collect();
    let mut p = Plan {
        free: (0..N_UNKNOWNS).collect(),
        ..Plan::default()
    };
    // An unknown published directly is determined: every null direction has 0 in it. So the SVD
    // only needs the other columns (fewer columns, same null space).
    let direct: Vec<usize> = UNKNOWNS
        .iter()
        .enumerate()
        .filter(|(_, u)| measured_index(u.key).is_some_and(|i| idx.contains(&i)))
        .map(|(c, _)| c)
        .collect();
    let cols: Vec<usize> = p
        .free
        .iter()
        .copied()
        .filter(|c| !direct.contains(c))
        .collect();
    let j = model.jacobian_central(x, &idx, &tol, &cols)?;
    let reduced = null_space(&j);
    let basis = DMatrix::from_fn(N_UNKNOWNS, reduced.ncols(), |r, c| {
        cols.iter()
            .position(|&u| u == r)
            .and_then(|i| reduced.get((i, c)))
            .copied()
            .unwrap_or(0.0)
    });
    for u in pins(&basis) {
        p.free.retain(|&f| f != u);
        let unknown = UNKNOWNS.get(u)?;
        let value = match unknown.prior {
            Some(v) => {
                p.priors.push(u);
                v
            }
            None => {
                p.pinned.push(u);
                typical.get(u).copied().unwrap_or(unknown.typical)
            }
        };
        if let Some(e) = x.get_mut(u) {
            *e = value;
        }
    }
    if !p.pinned.is_empty() {
        p.missing = suggest(model, x, &idx, &tol, &p)?;
    }
    Some(p)
}

/// The unknowns to fix so that no free direction remains: walking [`PIN_ORDER`], an unknown is
/// fixed when its row of the null-space basis `n` (unknowns × free directions) adds a new
/// direction to the rows already fixed; fixing those removes every free direction.
fn pins(n: &DMatrix<f64>) -> Vec<usize> {
    let d = n.ncols();
    let mut picked: Vec<usize> = Vec::new();
    if d == 0 {
        return picked;
    }
    for u in PIN_ORDER {
        if picked.len() >= d {
            break;
        }
        let mut trial = picked.clone();
        trial.push(u);
        let rows = DMatrix::from_fn(trial.len(), d, |r, c| {
            trial
                .get(r)
                .and_then(|&t| n.get((t, c)))
                .copied()
                .unwrap_or(0.0)
        });
        let s = rows.svd(false, false).singular_values;
        if s.iter().filter(|&&v| v > 1e-3).count() == trial.len() {
            picked = trial;
        }
    }
    picked
}

/// Greedily adds measurement keys (in [`SUGGEST`] order) that raise the rank over the free and
/// pinned unknowns until they are all determined.
fn suggest(model: &Model, x: &X, idx: &[usize], tol: &[f64], p: &Plan) -> Option<Vec<String>> {
    let mut cols = p.free.clone();
    cols.extend(&p.pinned);
    let mut idx = idx.to_vec();
    let mut tol = tol.to_vec();
    let mut have = rank(&model.jacobian_central(x, &idx, &tol, &cols)?);
    let mut out = Vec::new();
    for key in SUGGEST {
        if have >= cols.len() {
            break;
        }
        let Some(i) = measured_index(key) else {
            continue;
        };
        if idx.contains(&i) {
            continue;
        }
        idx.push(i);
        tol.push(1.0);
        let r = rank(&model.jacobian_central(x, &idx, &tol, &cols)?);
        if r > have {
            have = r;
            out.push(key.to_string());
        } else {
            idx.pop();
            tol.pop();
        }
    }
    debug_assert!(MEASURED_KEYS.len() == SUGGEST.len());
    Some(out)
}
