//! The frame solver: from whatever published numbers are given to the core [`FrameParams`].
//!
//! This first version solves the common published set directly (closed form); the weighted
//! least-squares solver of DESIGN.md §6.1 replaces it behind the same signature.

use crate::catalogue::lookup;
use crate::error::{fmt_num, FieldError, Warning};
use crate::geometry::{FrameParams, Radii};
use serde::Serialize;
use std::collections::BTreeMap;

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
    /// `|residual| ≤ 2.5 × tolerance`.
    pub consistent: bool,
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
}

/// Factor on the tolerance past which a residual is inconsistent.
pub const INCONSISTENT_FACTOR: f64 = 2.5;

fn get(given: &BTreeMap<String, Given>, key: &str) -> Option<f64> {
    given.get(key).map(|g| g.value)
}

/// Solves the frame from the given measurements with the given tyre radii.
///
/// # Errors
/// Returns a [`FieldError`] when the given values cannot place the head tube and fork
/// (reach, stack, head angle, head tube, axle-to-crown and offset are needed in this version),
/// or when the chainstay is shorter than the BB drop it must span.
pub fn solve(
    given: &BTreeMap<String, Given>,
    radii: Radii,
    field_prefix: &str,
) -> Result<Solution, FieldError> {
    let mut warnings = Vec::new();
    let mut missing = Vec::new();
    let need = |key: &str| -> Result<f64, FieldError> {
        get(given, key).ok_or_else(|| {
            FieldError::new(
                "missing_value",
                format!("{field_prefix}.{key}"),
                format!(
                    "{} is needed to place the frame",
                    lookup(key).map(|m| m.label).unwrap_or(key)
                ),
            )
        })
    };
    let reach = need("reach_mm")?;
    let stack = need("stack_mm")?;
    let head_angle = need("head_angle_deg")?.to_radians();
    let head_tube = need("head_tube_mm")?;
    let a2c = need("fork_a2c_mm")?;
    let offset = need("fork_offset_mm")?;
    let headset_lower = get(given, "headset_lower_mm").unwrap_or_else(|| {
        warnings.push(Warning::new(
            "assumed",
            "Lower headset stack not given: assumed 0 mm (internal cups).",
        ));
        0.0
    });
    let seat_axis_offset = get(given, "seat_axis_offset_mm").unwrap_or(0.0);
    let seat_angle = get(given, "seat_angle_actual_deg")
        .or_else(|| get(given, "seat_angle_effective_deg"))
        .unwrap_or_else(|| {
            missing.push("seat_angle_actual_deg".to_string());
            75.0
        })
        .to_radians();
    let seat_tube = get(given, "seat_tube_mm").unwrap_or_else(|| {
        missing.push("seat_tube_mm".to_string());
        420.0
    });
    let mut params = FrameParams {
        rear_centre: 0.0,
        bb_drop: 0.0,
        reach,
        stack,
        head_angle,
        head_tube,
        headset_lower,
        a2c,
        offset,
        seat_angle,
        seat_axis_offset,
        seat_tube,
    };
    params.bb_drop = params.grounded_bb_drop(radii);
    params.rear_centre = match (get(given, "rear_centre_mm"), get(given, "chainstay_mm")) {
        (Some(rc), _) => rc,
        (None, Some(cs)) => {
            let sq = cs * cs - params.bb_drop * params.bb_drop;
            if sq <= 0.0 {
                return Err(FieldError::new(
                    "impossible",
                    format!("{field_prefix}.chainstay_mm"),
                    format!(
                        "chainstay {} mm is shorter than the {} mm the rear axle sits above the BB; it must be longer",
                        fmt_num(cs),
                        fmt_num(params.bb_drop.abs())
                    ),
                ));
            }
            sq.sqrt()
        }
        (None, None) => {
            missing.push("chainstay_mm".to_string());
            435.0
        }
    };
    let measured = params.geometry(radii).measure();
    let mut residuals = BTreeMap::new();
    for (key, g) in given {
        if let Some(&solved) = measured.get(key.as_str()) {
            let residual = solved - g.value;
            let consistent = residual.abs() <= INCONSISTENT_FACTOR * g.tolerance;
            if !consistent {
                warnings.push(Warning::new(
                    "inconsistent",
                    format!(
                        "{} is published as {} but the other numbers give {}.",
                        lookup(key).map(|m| m.label).unwrap_or(key),
                        fmt_num(g.value),
                        fmt_num(solved)
                    ),
                ));
            }
            residuals.insert(
                key.clone(),
                Residual {
                    given: g.value,
                    solved,
                    residual,
                    consistent,
                },
            );
        }
    }
    Ok(Solution {
        params,
        residuals,
        missing,
        warnings,
    })
}
