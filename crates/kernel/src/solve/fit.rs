//! Weighted nonlinear least squares over the free unknowns (Levenberg–Marquardt).
//!
//! Minimises `Σ ((predicted_i − given_i) / tolerance_i)²` over the free unknowns, the others held
//! at their fixed values. Several starts are tried; a start counts only when the minimiser reports
//! convergence and every number is finite.

use super::model::{Model, Row};
use super::unknowns::X;
use levenberg_marquardt::{LeastSquaresProblem, LevenbergMarquardt};
use nalgebra::{storage::Owned, DMatrix, DVector, Dyn};

struct Problem<'a> {
    model: &'a Model,
    rows: &'a [Row],
    free: &'a [usize],
    x: X,
}

impl Problem<'_> {
    fn with(&self, p: &DVector<f64>) -> X {
        let mut x = self.x;
        for (&i, &v) in self.free.iter().zip(p.iter()) {
            if let Some(e) = x.get_mut(i) {
                *e = v;
            }
        }
        x
    }
}

impl LeastSquaresProblem<f64, Dyn, Dyn> for Problem<'_> {
    type ResidualStorage = Owned<f64, Dyn>;
    type JacobianStorage = Owned<f64, Dyn, Dyn>;
    type ParameterStorage = Owned<f64, Dyn>;

    fn set_params(&mut self, p: &DVector<f64>) {
        self.x = self.with(p);
    }

    fn params(&self) -> DVector<f64> {
        DVector::from_iterator(
            self.free.len(),
            self.free
                .iter()
                .map(|&i| self.x.get(i).copied().unwrap_or(0.0)),
        )
    }

    fn residuals(&self) -> Option<DVector<f64>> {
        self.model
            .residuals(&self.x, self.rows)
            .map(DVector::from_vec)
    }

    fn jacobian(&self) -> Option<DMatrix<f64>> {
        let idx: Vec<usize> = self.rows.iter().map(|r| r.index).collect();
        let tol: Vec<f64> = self.rows.iter().map(|r| r.tolerance).collect();
        self.model.jacobian(&self.x, &idx, &tol, self.free)
    }
}

/// A converged fit: the unknowns and the weighted sum of squares.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Fitted {
    /// All unknowns (free ones fitted, the rest as fixed).
    pub x: X,
    /// `Σ r²` of the weighted residuals.
    pub cost: f64,
}

/// Fits the `free` unknowns from `start`; `None` unless the minimiser converged to finite values.
pub fn fit(model: &Model, rows: &[Row], free: &[usize], start: &X) -> Option<Fitted> {
    let problem = Problem {
        model,
        rows,
        free,
        x: *start,
    };
    let x = if free.is_empty() {
        *start
    } else {
        let (done, report) = LevenbergMarquardt::new()
            .with_ftol(1e-10)
            .with_xtol(1e-10)
            .with_gtol(1e-10)
            .minimize(problem);
        if !report.termination.was_successful() {
            return None;
        }
        done.x
    };
    let r = model.residuals(&x, rows)?;
    let cost: f64 = r.iter().map(|v| v * v).sum();
    (cost.is_finite() && x.iter().all(|v| v.is_finite())).then_some(Fitted { x, cost })
}
