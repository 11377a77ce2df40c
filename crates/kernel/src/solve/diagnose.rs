//! Which published values disagree, and which single value most likely explains it.
//!
//! Leave-one-out: to first order from the leverages for every value ([`checks`]); when some value
//! disagrees, for each given value whose removal still leaves the frame determined, refit without
//! it ([`leave_each_out`]): what the refit gives for it is what the others predict, and if every
//! remaining value is then consistent, it is a suspect.

use super::fit::fit;
use super::model::{leverages, rank, Model, Row};
use super::unknowns::X;
use super::INCONSISTENT_FACTOR;

/// What the diagnosis finds for one given value.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Check {
    /// Whether the value agrees with the others (see [`checks`]).
    pub consistent: bool,
    /// What the *other* values alone predict for it, in its own unit (mm or degrees): the
    /// leave-one-out prediction `given + (solved − given) / (1 − h)` (first order, `h` the row's
    /// leverage; Cook & Weisberg, *Residuals and Influence in Regression*, 1982, §2.2). `None`
    /// when nothing else checks the value (`1 − h < 10⁻³`).
    pub from_others: Option<f64>,
}

/// Below this `1 − h` a value counts as checked by nothing else.
const UNCHECKED: f64 = 1e-3;

/// Per row, whether it is consistent and what the other values predict for it. A value is
/// inconsistent when its residual exceeds `INCONSISTENT_FACTOR ×` its tolerance, or when it
/// disagrees with what the *other* values alone predict: the leave-one-out discrepancy
/// `d = r / (1 − h)` (first order, `h` the row's leverage, in tolerance units) exceeds both
/// `INCONSISTENT_FACTOR` and four standard deviations of what rounding alone can cause,
/// `4 / √(12 (1 − h))` (rounding errors uniform within ± half a step, the step being the
/// tolerance: variance 1/12 per value). A value nothing else checks (`1 − h < 10⁻³`) is judged
/// by its residual alone. Without the second test, a wrong value that the fit mostly absorbs
/// (high leverage) would pass unnoticed.
pub fn checks(model: &Model, x: &X, rows: &[Row], free: &[usize]) -> Option<Vec<Check>> {
    let r = model.residuals(x, rows)?;
    let idx: Vec<usize> = rows.iter().map(|r| r.index).collect();
    let tol: Vec<f64> = rows.iter().map(|r| r.tolerance).collect();
    let h = leverages(&model.jacobian(x, &idx, &tol, free)?);
    Some(
        rows.iter()
            .zip(r)
            .zip(h)
            .map(|((row, r), h)| check(row, r, 1.0 - h))
            .collect(),
    )
}

/// One row's [`Check`] from its weighted residual `r` and `checked = 1 − h`.
fn check(row: &Row, r: f64, checked: f64) -> Check {
    let limit = INCONSISTENT_FACTOR * (1.0 + 1e-9);
    if checked < UNCHECKED {
        return Check {
            consistent: r.abs() <= limit,
            from_others: None,
        };
    }
    let d = r / checked;
    let rounding = 4.0 / (12.0 * checked).sqrt();
    let from_others = row.value + d * row.tolerance;
    Check {
        consistent: r.abs() <= limit && d.abs() <= limit.max(rounding),
        from_others: from_others.is_finite().then_some(from_others),
    }
}

/// True when every row is consistent (see [`checks`]).
pub fn all_consistent(model: &Model, x: &X, rows: &[Row], free: &[usize]) -> bool {
    checks(model, x, rows, free).is_some_and(|c| c.iter().all(|c| c.consistent))
}

/// One given value left out and the rest refitted.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct LeftOut {
    /// Index into [`crate::geometry::MEASURED_KEYS`].
    pub index: usize,
    /// What the refitted frame gives for the value left out: the exact leave-one-out prediction
    /// (the first-order one of [`Check::from_others`] drifts when the value is far off).
    pub predicted: Option<f64>,
    /// Whether every remaining value then agrees: the value is a suspect.
    pub rest_agree: bool,
    /// The refitted unknowns: the solved frame when this value is a lone misprint.
    pub x: X,
}

/// Every row but the `k`-th.
pub fn without(rows: &[Row], k: usize) -> Vec<Row> {
    rows.iter()
        .enumerate()
        .filter(|(i, _)| *i != k)
        .map(|(_, r)| *r)
        .collect()
}

/// Each row left out in turn, the rest refitted, for the rows whose removal leaves the frame
/// determined (a row nothing else checks is skipped).
pub fn leave_each_out(model: &Model, x: &X, rows: &[Row], free: &[usize]) -> Vec<LeftOut> {
    let mut out = Vec::new();
    for (k, row) in rows.iter().enumerate() {
        let rest = without(rows, k);
        let idx: Vec<usize> = rest.iter().map(|r| r.index).collect();
        let tol: Vec<f64> = rest.iter().map(|r| r.tolerance).collect();
        let determined = model
            .jacobian_central(x, &idx, &tol, free)
            .is_some_and(|j| rank(&j) == free.len());
        if !determined {
            continue;
        }
        if let Some(f) = fit(model, &rest, free, x) {
            let predicted = model
                .predict(&f.x)
                .and_then(|p| p.get(row.index).copied())
                .filter(|v| v.is_finite());
            out.push(LeftOut {
                index: row.index,
                predicted,
                rest_agree: all_consistent(model, &f.x, &rest, free),
                x: f.x,
            });
        }
    }
    out
}
