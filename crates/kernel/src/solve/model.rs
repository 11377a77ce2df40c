//! The measurement model: unknowns → every published number, through the one
//! [`Geometry::measure_values`](crate::geometry::Geometry::measure_values), and its Jacobian.

use super::unknowns::{to_params_ungrounded, X};
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
        // One placement: the BB drop of `to_params` is `F.y − (r_front − r_rear)`, so place
        // once and set the rear axle height from the front axle (same as `to_params`).
        let mut p = to_params_ungrounded(x);
        p.bb_drop = 0.0;
        let mut g = p.geometry(self.radii);
        g.rear_axle.y = g.front_axle.y - (self.radii.front - self.radii.rear);
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

impl Model {
    /// Like [`Model::jacobian`] by central differences (step 10⁻⁴), for the rank analysis, where
    /// the difference error must stay far below the rank threshold.
    pub fn jacobian_central(
        &self,
        x: &X,
        indices: &[usize],
        tolerances: &[f64],
        cols: &[usize],
    ) -> Option<DMatrix<f64>> {
        let h = 1e-4;
        let mut j = DMatrix::zeros(indices.len(), cols.len());
        for (c, &col) in cols.iter().enumerate() {
            let mut up = *x;
            let mut down = *x;
            *up.get_mut(col)? += h;
            *down.get_mut(col)? -= h;
            let pu = self.predict(&up)?;
            let pd = self.predict(&down)?;
            for (r, (&i, &tol)) in indices.iter().zip(tolerances).enumerate() {
                if let Some(e) = j.get_mut((r, c)) {
                    *e = (pu.get(i)? - pd.get(i)?) / (2.0 * h * tol);
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

/// An orthonormal basis (columns) of the null space of `j`: the directions of the unknowns that
/// change none of the given numbers. Singular values at or below `1e-7 ×` the largest (or
/// `1e-9`) count as zero. `j` is padded with zero rows so that a short `j` still yields every
/// null direction.
pub fn null_space(j: &DMatrix<f64>) -> DMatrix<f64> {
    let (m, k) = j.shape();
    // nalgebra's SVD panics on an empty matrix.
    if k == 0 {
        return DMatrix::zeros(0, 0);
    }
    if m == 0 {
        return DMatrix::identity(k, k);
    }
    let padded = if m < k {
        let mut p = DMatrix::zeros(k, k);
        p.view_mut((0, 0), (m, k)).copy_from(j);
        p
    } else {
        j.clone()
    };
    let svd = padded.svd(false, true);
    let max = svd.singular_values.iter().copied().fold(0.0_f64, f64::max);
    let thresh = (max * 1e-7).max(1e-9);
    let Some(vt) = svd.v_t else {
        return DMatrix::identity(k, k);
    };
    let null: Vec<usize> = svd
        .singular_values
        .iter()
        .enumerate()
        .filter(|(_, &s)| s <= thresh)
        .map(|(i, _)| i)
        .collect();
    DMatrix::from_fn(k, null.len(), |r, c| {
        null.get(c)
            .and_then(|&i| vt.get((i, r)))
            .copied()
            .unwrap_or(0.0)
    })
}

/// Leverages `h_i` (diagonal of the hat matrix `J (JᵀJ)⁻¹ Jᵀ`) of the rows of the weighted,
/// full-column-rank Jacobian `j`, from its thin QR: `h_i = Σ_c Q_ic²`. How much of value `i` the
/// fit takes from value `i` itself; a value nothing else checks has leverage 1.
pub fn leverages(j: &DMatrix<f64>) -> Vec<f64> {
    let m = j.nrows();
    if m == 0 || j.ncols() == 0 {
        return vec![0.0; m];
    }
    let q = j.clone().qr().q();
    q.row_iter().map(|r| r.norm_squared()).collect()
}
