//! Impossible frames: combinations of published values no frame can have, found before solving
//! ([`precheck`]), and solved frames outside the catalogue's hard ranges, found after
//! ([`postcheck`]). Each is an `impossible` error naming a published field, or `no_solution`.
//!
//! **Invariant:** a solved frame that passes [`postcheck`] has every solved parameter and its BB
//! drop within the hard ranges widened by [`HARD_SLACK`] roundings ([`within_hard_ranges`]), and
//! a chainstay (when published) longer than the BB drop.

use super::blame;
use super::model::{Model, Row};
use super::unknowns::{to_params, UNKNOWNS, X};
use super::Given;
use crate::catalogue::{lookup, Unit};
use crate::error::{fmt_measure, in_sentence, FieldError};
use crate::geometry::FrameParams;
use std::collections::BTreeMap;

/// The error when no start converges.
pub fn no_solution(prefix: &str) -> FieldError {
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
pub fn precheck(given: &BTreeMap<String, Given>, prefix: &str) -> Result<(), FieldError> {
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
pub fn postcheck(
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
pub const HARD_SLACK: f64 = 10.0;

fn inside_hard(m: &crate::catalogue::Measurement, v: f64) -> bool {
    let slack = HARD_SLACK * m.default_tolerance();
    v.is_finite() && (m.hard.0 - slack..=m.hard.1 + slack).contains(&v)
}

/// True when every solved parameter and the BB drop lie within the hard ranges (with slack).
pub fn within_hard_ranges(model: &Model, x: &X) -> bool {
    let drop = to_params(x, model.radii).bb_drop;
    UNKNOWNS
        .iter()
        .zip(x.iter())
        .map(|(u, v)| (u.key, *v))
        .chain([("bb_drop_mm", drop)])
        .all(|(k, v)| lookup(k).is_none_or(|m| inside_hard(m, v)))
}
