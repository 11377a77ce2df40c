//! The verdict on a fit (DESIGN.md §6.1): which given values disagree with the rest, which are
//! suspects (a value whose removal lets the rest agree, what they give for it plausible), and the
//! robust-fit rule.
//!
//! **Invariant:** a lone suspect gets weight zero: the solved frame is the refit without it
//! ([`lone_misprint`]), unless that refit leaves the hard ranges; several suspects (one loop) keep
//! the weighted fit, which spreads them. [`Diagnosis::suspects`] lists the suspects in the order
//! the `inconsistent` warning names them ([`explain::in_named_order`]).

use super::diagnose;
use super::explain;
use super::impossible::within_hard_ranges;
use super::model::{Model, Row};
use super::plausible;
use super::unknowns::X;
use crate::error::Warning;

/// The solved unknowns, one finding per given row, the `inconsistent` warning if any, and the
/// suspects in the order it names them.
pub struct Diagnosis {
    /// The solved unknowns (the refit without a lone misprint, else the fit checked).
    pub x: X,
    /// One finding per given row, in row order.
    pub findings: Vec<explain::Finding>,
    /// The `inconsistent` warning, when a value disagrees.
    pub warning: Option<Warning>,
    /// The suspects (measurement indices), in the order the warning names them.
    pub suspects: Vec<usize>,
}

/// Checks the fit `x`; when values disagree, refits without each in turn (what the others give
/// for it, and the suspects). A lone suspect is a misprint and gets weight zero
/// ([`lone_misprint`]); several suspects (one loop) keep the weighted fit, which spreads them.
pub fn diagnosis(model: &Model, x: &X, rows: &[Row], free: &[usize]) -> Option<Diagnosis> {
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
