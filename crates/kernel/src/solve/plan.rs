//! Rank analysis: which unknowns the published numbers fix, which take a stated prior, which are
//! pinned to a typical value, and which measurements would fix those (`missing`).

use super::model::{free_columns, rank, Model, Row};
use super::unknowns::{N_UNKNOWNS, PIN_ORDER, UNKNOWNS, X};
use crate::geometry::{measured_index, MEASURED_KEYS};

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
/// Writes the prior or typical value into `x` for each fixed unknown.
pub fn plan(model: &Model, rows: &[Row], x: &mut X) -> Option<Plan> {
    let idx: Vec<usize> = rows.iter().map(|r| r.index).collect();
    let tol: Vec<f64> = rows.iter().map(|r| r.tolerance).collect();
    let mut p = Plan {
        free: (0..N_UNKNOWNS).collect(),
        ..Plan::default()
    };
    loop {
        let j = model.jacobian(x, &idx, &tol, &p.free)?;
        let loose = free_columns(&j);
        let pick = PIN_ORDER.iter().copied().find(|u| {
            p.free
                .iter()
                .position(|f| f == u)
                .and_then(|c| loose.get(c).copied())
                .unwrap_or(false)
        });
        let Some(u) = pick else { break };
        p.free.retain(|&f| f != u);
        let unknown = UNKNOWNS.get(u)?;
        let value = match unknown.prior {
            Some(v) => {
                p.priors.push(u);
                v
            }
            None => {
                p.pinned.push(u);
                unknown.typical
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

/// Greedily adds measurement keys (in [`SUGGEST`] order) that raise the rank over the free and
/// pinned unknowns until they are all determined.
fn suggest(model: &Model, x: &X, idx: &[usize], tol: &[f64], p: &Plan) -> Option<Vec<String>> {
    let mut cols = p.free.clone();
    cols.extend(&p.pinned);
    let mut idx = idx.to_vec();
    let mut tol = tol.to_vec();
    let mut have = rank(&model.jacobian(x, &idx, &tol, &cols)?);
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
        let r = rank(&model.jacobian(x, &idx, &tol, &cols)?);
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
