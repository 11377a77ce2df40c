//! Which published values disagree, and which single value most likely explains it.
//!
//! Leave-one-out: for each given value whose removal still leaves the frame determined, refit
//! without it; if every remaining value is then consistent, it is a suspect.

use super::fit::fit;
use super::model::{leverages, rank, Model, Row};
use super::unknowns::X;
use super::INCONSISTENT_FACTOR;
use crate::catalogue::lookup;
use crate::error::{fmt_disagreement, Warning};
use crate::geometry::MEASURED_KEYS;

fn key(index: usize) -> &'static str {
    MEASURED_KEYS.get(index).copied().unwrap_or("?")
}

/// The measurement's name as the page and the charts say it (its catalogue label), not its key.
fn label(index: usize) -> String {
    let k = key(index);
    lookup(k).map_or(k, |m| m.label).to_string()
}

/// Per row, whether it is consistent. A value is inconsistent when its residual exceeds
/// `INCONSISTENT_FACTOR ×` its tolerance, or when it disagrees with what the *other* values alone
/// predict: the leave-one-out discrepancy `d = r / (1 − h)` (first order, `h` the row's leverage,
/// in tolerance units) exceeds both `INCONSISTENT_FACTOR` and four standard deviations of what
/// rounding alone can cause, `4 / √(12 (1 − h))` (rounding errors uniform within ± half a step,
/// variance 1/12 per value). A value nothing else checks (`1 − h < 10⁻³`) is judged by its
/// residual alone. Without the second test, a wrong value that the fit mostly absorbs (high
/// leverage) would pass unnoticed.
pub fn consistency(model: &Model, x: &X, rows: &[Row], free: &[usize]) -> Option<Vec<bool>> {
    let r = model.residuals(x, rows)?;
    let idx: Vec<usize> = rows.iter().map(|r| r.index).collect();
    let tol: Vec<f64> = rows.iter().map(|r| r.tolerance).collect();
    let h = leverages(&model.jacobian(x, &idx, &tol, free)?);
    let limit = INCONSISTENT_FACTOR * (1.0 + 1e-9);
    Some(
        r.iter()
            .zip(h)
            .map(|(&r, h)| {
                let checked = 1.0 - h;
                if r.abs() > limit {
                    return false;
                }
                if checked < 1e-3 {
                    return true;
                }
                let rounding = 4.0 / (12.0 * checked).sqrt();
                (r / checked).abs() <= limit.max(rounding)
            })
            .collect(),
    )
}

/// True when every row is consistent (see [`consistency`]).
pub fn all_consistent(model: &Model, x: &X, rows: &[Row], free: &[usize]) -> bool {
    consistency(model, x, rows, free).is_some_and(|c| c.iter().all(|&ok| ok))
}

/// The rows whose removal lets the rest agree (with the frame still determined).
pub fn suspects(model: &Model, x: &X, rows: &[Row], free: &[usize]) -> Vec<usize> {
    let mut out = Vec::new();
    for (k, row) in rows.iter().enumerate() {
        let rest: Vec<Row> = rows
            .iter()
            .enumerate()
            .filter(|(i, _)| *i != k)
            .map(|(_, r)| *r)
            .collect();
        let idx: Vec<usize> = rest.iter().map(|r| r.index).collect();
        let tol: Vec<f64> = rest.iter().map(|r| r.tolerance).collect();
        let determined = model
            .jacobian_central(x, &idx, &tol, free)
            .is_some_and(|j| rank(&j) == free.len());
        if !determined {
            continue;
        }
        if let Some(f) = fit(model, &rest, free, x) {
            if all_consistent(model, &f.x, &rest, free) {
                out.push(row.index);
            }
        }
    }
    out
}

/// The warning for inconsistent values: each one with its given and solved value, then the
/// value(s) most likely wrong, in plain sentences.
pub fn warning(bad: &[(usize, f64, f64)], suspects: &[usize]) -> Warning {
    let list: Vec<String> = bad
        .iter()
        .map(|(i, given, solved)| {
            let [given, solved, _] = fmt_disagreement(*given, *solved, key(*i).ends_with("_deg"));
            format!(
                "{} is published as {given} but the other numbers give {solved}",
                label(*i)
            )
        })
        .collect();
    let mut msg = format!("The published numbers disagree: {}.", list.join("; "));
    let names: Vec<String> = suspects.iter().map(|&i| label(i)).collect();
    match names.as_slice() {
        [] => msg.push_str(
            " No single value explains it; more than one may be wrong, or they were measured differently.",
        ),
        [one] => msg.push_str(&format!(
            " Most likely wrong: {one}; without it the rest agree."
        )),
        many => msg.push_str(&format!(
            " Most likely wrong: one of {}; without any one of these the rest agree.",
            many.join(", ")
        )),
    }
    Warning::new("inconsistent", msg)
}
