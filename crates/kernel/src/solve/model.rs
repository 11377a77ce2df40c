//! The measurement model: unknowns → every published number, through the one
//! [`Geometry::measure_values`](crate::geometry::Geometry::measure_values), and its Jacobian.

use super::unknowns::{to_params, X};
use crate::geometry::{Radii, MEASURED_COUNT};
use nalgebra::DMatrix;

/// One given value the model must predict: the measurement index, the value, its tolerance.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Row {
    /// Index into [`crate::geometry::MEASURED_KEYS`].
    pub index: usize,
    /// Published value (mm or degrees).
    pub value: f64,
    /// Tolerance (mm or degrees); the weight is its inverse.
    pub tolerance: f64,
}

/// The fixed inputs of the model: tyre radii and the effective seat angle's reference height.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Model {
    /// Tyre radii of the stock pose.
    pub radii: Radii,
    /// Reference height of the effective seat angle (`None` = stack).
    pub seat_ref: Option<f64>,
}

/// Finite-difference step for the Jacobian (mm or degrees). Forward differences: the Jacobian
/// steers the search and the rank test; the solution itself is where the residuals are least.
const STEP: f64 = 1e-6;

impl Model {
    /// Every derivable number for `x`; `None` when a number is degenerate or not finite.
    pub fn predict(&self, x: &X) -> Option<[f64; MEASURED_COUNT]> {
        let mut g = to_params(x, self.radii).geometry(self.radii);
        g.seat_ref_height = self.seat_ref;
        let v = g.measure_values();
        let mut out = [0.0; MEASURED_COUNT];
        for (o, v) in out.iter_mut().zip(v) {
            *o = v.filter(|v| v.is_finite())?;
        }
        Some(out)
    }

    /// Weighted residuals `(predicted − given) / tolerance` of `rows`.
    pub fn residuals(&self, x: &X, rows: &[Row]) -> Option<Vec<f64>> {
        let p = self.predict(x)?;
        rows.iter()
            .map(|r| p.get(r.index).map(|v| (v - r.value) / r.tolerance))
            .collect()
    }

    /// Jacobian of the predictions of `indices` (each row divided by `weights_inv`) with respect
    /// to the unknowns `cols`, by forward differences.
    pub fn jacobian(
        &self,
        x: &X,
        indices: &[usize],
        tolerances: &[f64],
        cols: &[usize],
    ) -> Option<DMatrix<f64>> {
        let mut j = DMatrix::zeros(indices.len(), cols.len());
        let pd = self.predict(x)?;
        for (c, &col) in cols.iter().enumerate() {
            let mut up = *x;
            *up.get_mut(col)? += STEP;
            let pu = self.predict(&up)?;
            for (r, (&i, &tol)) in indices.iter().zip(tolerances).enumerate() {
                let d = (pu.get(i)? - pd.get(i)?) / (STEP * tol);
                if let Some(e) = j.get_mut((r, c)) {
                    *e = d;
                }
            }
        }
        Some(j)
    }
}

/// Numerical rank of `j`: singular values above `1e-7 ×` the largest (and above `1e-9`).
pub fn rank(j: &DMatrix<f64>) -> usize {
    if j.nrows() == 0 || j.ncols() == 0 {
        return 0;
    }
    let s = j.clone().svd(false, false).singular_values;
    let max = s.iter().copied().fold(0.0_f64, f64::max);
    s.iter().filter(|&&v| v > (max * 1e-7).max(1e-9)).count()
}

/// For each of `cols`, whether the rows of `j` leave it free: its unit vector is not in the row
/// space (the part of it outside, squared, exceeds `1e-8`).
pub fn free_columns(j: &DMatrix<f64>) -> Vec<bool> {
    let n = j.ncols();
    if j.nrows() == 0 {
        return vec![true; n];
    }
    let svd = j.clone().svd(false, true);
    let max = svd.singular_values.iter().copied().fold(0.0_f64, f64::max);
    let thresh = (max * 1e-7).max(1e-9);
    let Some(vt) = svd.v_t else {
        return vec![true; n];
    };
    (0..n)
        .map(|c| {
            let inside: f64 = svd
                .singular_values
                .iter()
                .enumerate()
                .filter(|(_, &s)| s > thresh)
                .filter_map(|(r, _)| vt.get((r, c)).map(|v| v * v))
                .sum();
            1.0 - inside > 1e-8
        })
        .collect()
}

/// Leverages `h_i` (diagonal of the hat matrix `J (JᵀJ)⁺ Jᵀ`) of the rows of the weighted
/// Jacobian `j`: how much of value `i` the fit takes from value `i` itself. A value nothing else
/// checks has leverage 1.
pub fn leverages(j: &DMatrix<f64>) -> Vec<f64> {
    let m = j.nrows();
    if m == 0 || j.ncols() == 0 {
        return vec![0.0; m];
    }
    let svd = j.clone().svd(true, false);
    let max = svd.singular_values.iter().copied().fold(0.0_f64, f64::max);
    let thresh = (max * 1e-7).max(1e-9);
    let Some(u) = svd.u else {
        return vec![1.0; m];
    };
    (0..m)
        .map(|i| {
            svd.singular_values
                .iter()
                .enumerate()
                .filter(|(_, &s)| s > thresh)
                .filter_map(|(c, _)| u.get((i, c)).map(|v| v * v))
                .sum()
        })
        .collect()
}
