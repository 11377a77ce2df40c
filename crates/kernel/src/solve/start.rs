//! Where the search starts and which fit is kept: a first guess from the published values, then,
//! when its fit fails or leaves values inconsistent, a few other starts.
//!
//! **Invariant:** in every start the unknowns outside `free` keep their planned value (prior or
//! typical, `plan::plan`); only a converged fit counts, and one within the hard ranges whose
//! values all agree is taken as soon as it is found.

use super::diagnose;
use super::fit::{fit, Fitted};
use super::impossible::within_hard_ranges;
use super::model::{Model, Row};
use super::unknowns::{ix, UNKNOWNS, X};
use super::Given;
use crate::geometry::Radii;
use std::collections::BTreeMap;

/// The first guess: typical values, overwritten by every value published directly; without a
/// published axle-to-crown, the one that puts the BB at the published (or, from chainstay and rear
/// centre, the positive) BB drop, so the search starts on the usual side of the axles.
pub fn first_guess(given: &BTreeMap<String, Given>, radii: Radii, typical: &X) -> X {
    let mut x = *typical;
    for (slot, u) in x.iter_mut().zip(UNKNOWNS.iter()) {
        if let Some(g) = given.get(u.key) {
            *slot = g.value;
        }
    }
    let get = |k: &str| given.get(k).map(|g| g.value);
    if get("rear_centre_mm").is_none() {
        if let Some(cs) = get("chainstay_mm") {
            let drop = get("bb_drop_mm").unwrap_or(30.0);
            x[ix::REAR_CENTRE] = (cs * cs - drop * drop).max(100.0).sqrt();
        }
    }
    let drop = get("bb_drop_mm")
        .or_else(|| get("bb_height_mm").map(|h| radii.rear - h))
        .or_else(|| {
            let (cs, rc) = (get("chainstay_mm")?, get("rear_centre_mm")?);
            Some((cs * cs - rc * rc).max(0.0).sqrt())
        });
    if let (None, Some(drop)) = (get("fork_a2c_mm"), drop) {
        // drop = stack − L sin h + offset cos h − (r_front − r_rear), solved for a2c.
        let h = x[ix::HEAD_ANGLE].to_radians();
        let along = (x[ix::STACK] + x[ix::OFFSET] * h.cos() - drop - (radii.front - radii.rear))
            / h.sin().max(0.3);
        let a2c = along - x[ix::HEAD_TUBE] - x[ix::HEADSET_LOWER];
        if a2c.is_finite() && (250.0..=700.0).contains(&a2c) {
            x[ix::A2C] = a2c;
        }
    }
    if get("seat_angle_actual_deg").is_none() {
        if let Some(a) = get("seat_angle_effective_deg") {
            x[ix::SEAT_ANGLE] = a;
        }
    }
    x
}

/// Fits from the first guess; when that fails or leaves values inconsistent, tries other starts
/// and keeps the converged fit with the lowest cost.
pub fn best_fit(
    model: &Model,
    rows: &[Row],
    free: &[usize],
    x0: &X,
    typical: &X,
) -> Option<Fitted> {
    let good = |f: &Fitted| {
        within_hard_ranges(model, &f.x) && diagnose::all_consistent(model, &f.x, rows, free)
    };
    let first = fit(model, rows, free, x0);
    // A fit whose residuals are all within the tolerance needs no other start (cheap test first).
    let small = |f: &Fitted| {
        model
            .residuals(&f.x, rows)
            .is_some_and(|r| r.iter().all(|v| v.abs() <= 1.0))
    };
    if first
        .as_ref()
        .is_some_and(|f| small(f) && within_hard_ranges(model, &f.x))
    {
        return first;
    }
    if first.as_ref().is_some_and(good) {
        return first;
    }
    let mut best = first;
    let mut others = [*typical, *x0, *x0];
    others[1][ix::HEAD_ANGLE] = 70.0;
    others[1][ix::SEAT_ANGLE] = 73.0;
    others[2][ix::REAR_CENTRE] = 400.0;
    others[2][ix::HEAD_ANGLE] = 63.0;
    for mut start in others {
        // Unknowns outside `free` keep their planned (prior or typical) value.
        for (i, v) in start.iter_mut().enumerate() {
            if !free.contains(&i) {
                *v = x0.get(i).copied().unwrap_or(*v);
            }
        }
        if let Some(f) = fit(model, rows, free, &start) {
            if good(&f) {
                return Some(f);
            }
            let rank = |f: &Fitted| (!within_hard_ranges(model, &f.x), f.cost);
            if best.as_ref().is_none_or(|b| rank(&f) < rank(b)) {
                best = Some(f);
            }
        }
    }
    best
}
