//! Which published values put a solved number outside the range any frame can have, so that the
//! error can stand beside a value the person gave and name the others in play.
//!
//! Method (first order): the fit's solution `x(g)` of the weighted least squares moves with the
//! published values `g` as `∂x/∂g = J⁺ · diag(1/tol)` (`J` the weighted Jacobian over the free
//! unknowns, of full column rank, `J⁺ = (JᵀJ)⁻¹Jᵀ` its pseudo-inverse). A solved quantity `q(x)`
//! then moves as `s_i = ∇q · ∂x/∂g_i` per unit of value `i`. All of them at once, from the thin
//! QR `J = QR`: `J⁺ᵀ ∇q = Q R⁻ᵀ ∇q` (one forward substitution, no pseudo-inverse: the SVD's
//! recomposition and the matrix product cost about 5 kB of the page's wasm). Its share in the excess is
//! `s_i · (g_i − c_i)`, with `c_i` the middle of the value's plausible range (catalogue): how far
//! this value, being where it is rather than at a typical bike's, moved `q` towards the bound it
//! crossed. The value with the largest share is the one to check first.

use super::model::{Model, Row};
use super::unknowns::X;
use crate::catalogue::lookup;
use crate::error::{fmt_measure, fmt_num, in_sentence, FieldError};
use crate::geometry::MEASURED_KEYS;

/// One published value's share in pushing a solved quantity past a bound.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Share {
    /// Its key in [`MEASURED_KEYS`].
    pub key: &'static str,
    /// The published value (mm or degrees).
    pub value: f64,
    /// How far it moved the quantity towards the bound it crossed (mm or degrees, > 0).
    pub push: f64,
}

/// Finite-difference step for the gradient of the quantity (mm or degrees).
const STEP: f64 = 1e-4;

/// The shares of the published `rows` in moving `q` past a bound (`towards` = +1 above the upper
/// bound, −1 below the lower), largest first; only those that push towards it. `None` when the
/// Jacobian cannot be formed or inverted.
pub fn shares(
    model: &Model,
    x: &X,
    rows: &[Row],
    free: &[usize],
    q: impl Fn(&X) -> f64,
    towards: f64,
) -> Option<Vec<Share>> {
    let idx: Vec<usize> = rows.iter().map(|r| r.index).collect();
    let tol: Vec<f64> = rows.iter().map(|r| r.tolerance).collect();
    let j = model.jacobian_central(x, &idx, &tol, free)?;
    let grad = gradient(x, free, &q)?;
    let along = pinv_transpose_times(j, &grad)?;
    let mut out = Vec::new();
    for (row, a) in rows.iter().zip(along) {
        let key = MEASURED_KEYS.get(row.index).copied()?;
        let per_unit = a / row.tolerance;
        let centre = lookup(key).map_or(row.value, |m| (m.plausible.0 + m.plausible.1) / 2.0);
        let push = per_unit * (row.value - centre) * towards;
        if push.is_finite() && push > 0.0 {
            out.push(Share {
                key,
                value: row.value,
                push,
            });
        }
    }
    super::sort_short(&mut out, |a, b| a.push > b.push);
    Some(out)
}

/// `J⁺ᵀ g` for a full-column-rank `j` (m × k, m ≥ k): `Q y` with `Rᵀ y = g` (`J = QR`, thin).
/// `None` when `j` has fewer rows than columns or `R` has a (near) zero on its diagonal.
fn pinv_transpose_times(j: nalgebra::DMatrix<f64>, g: &[f64]) -> Option<Vec<f64>> {
    let (m, k) = j.shape();
    if m < k || g.len() != k {
        return None;
    }
    let qr = j.qr();
    let (q, r) = (qr.q(), qr.r());
    let mut y = vec![0.0; k];
    for c in 0..k {
        let mut s = *g.get(c)?;
        for p in 0..c {
            s -= r.get((p, c))? * y.get(p)?;
        }
        let d = *r.get((c, c))?;
        if d.abs() < 1e-12 {
            return None;
        }
        *y.get_mut(c)? = s / d;
    }
    (0..m)
        .map(|i| (0..k).map(|c| Some(q.get((i, c))? * y.get(c)?)).sum())
        .collect()
}

/// `∂q/∂x_c` for each free unknown `c`, by central differences.
fn gradient(x: &X, free: &[usize], q: &impl Fn(&X) -> f64) -> Option<Vec<f64>> {
    free.iter()
        .map(|&c| {
            let (mut up, mut down) = (*x, *x);
            *up.get_mut(c)? += STEP;
            *down.get_mut(c)? -= STEP;
            let d = (q(&up) - q(&down)) / (2.0 * STEP);
            d.is_finite().then_some(d)
        })
        .collect()
}

/// How many published values an error names at most.
const NAMED: usize = 3;

/// A value whose share is below this fraction of the largest is not named.
const NAMED_SHARE: f64 = 0.1;

/// The error for a solved quantity `key` at `v`, outside its hard range: attached to the
/// published value with the largest share (see [`shares`]), naming up to three values in play
/// with their values, in whole mm or tenths of a degree, and what to check. Without any share
/// (no published value pushes it), attached to `key` itself.
pub fn out_of_range(
    fit: (&Model, &X, &[Row], &[usize]),
    key: &str,
    v: f64,
    q: impl Fn(&X) -> f64,
    prefix: &str,
) -> FieldError {
    let (model, x, rows, free) = fit;
    let Some(m) = lookup(key) else {
        // The callers pass catalogue keys; a message all the same.
        return FieldError::new(
            "impossible",
            format!("{prefix}.{key}"),
            "Together the published numbers give no frame; check them for typing errors.",
        );
    };
    let towards = if v > m.hard.1 { 1.0 } else { -1.0 };
    let all = shares(model, x, rows, free, q, towards).unwrap_or_default();
    let top = all.first().map_or(0.0, |s| s.push);
    let named: Vec<Share> = all
        .into_iter()
        .filter(|s| s.push >= NAMED_SHARE * top)
        .take(NAMED)
        .collect();
    let what = in_sentence(m.label);
    let unit = match m.unit.symbol() {
        "°" => "°".to_string(),
        u => format!(" {u}"),
    };
    let cannot = format!(
        "puts the {what} at {}, which no frame can have (allowed {} to {}{unit})",
        fmt_measure(v, m.unit),
        fmt_num(m.hard.0),
        fmt_num(m.hard.1)
    );
    let (field, message) = match named.as_slice() {
        [] => (
            key.to_string(),
            format!(
                "Together the published numbers {}; check them for typing errors.",
                cannot.replacen("puts", "put", 1)
            ),
        ),
        [one] => (
            one.key.to_string(),
            format!(
                "With the other published numbers, the {} {cannot}; check the {}.",
                described(one),
                label_in_sentence(one.key)
            ),
        ),
        [first, ..] => {
            let mut list: Vec<String> = named.iter().map(described).collect();
            let last = list.pop().unwrap_or_default();
            (
                first.key.to_string(),
                format!(
                    "The published {} and {last} together {}; check the {} first: of these it moves the {what} most.",
                    list.join(", "),
                    cannot.replacen("puts", "put", 1),
                    label_in_sentence(first.key)
                ),
            )
        }
    };
    FieldError::new("impossible", format!("{prefix}.{field}"), message)
}

/// "head tube angle 45.0°": a published value with its label, in a sentence.
fn described(s: &Share) -> String {
    match lookup(s.key) {
        Some(m) => format!("{} {}", in_sentence(m.label), fmt_measure(s.value, m.unit)),
        None => format!("{} {}", s.key, fmt_num(s.value)),
    }
}

fn label_in_sentence(key: &str) -> String {
    lookup(key).map_or_else(|| key.to_string(), |m| in_sentence(m.label))
}
