//! A solved frame that bikes do not have: a number the published values did not give (BB drop,
//! BB height, wheelbase, trail, …) outside its plausible range (catalogue) gets the warning
//! `caution_solved_frame`, naming each such value and the range. A published value outside its
//! range has its own warning (`implausible`, in `evaluate`).
//!
//! When a stand-in for a number not given (the fork's axle-to-crown, the rear centre:
//! [`super::unknowns::fork_stand_in`], [`super::unknowns::typical`]) moves those values, it is
//! named as the likely cause with the measurement to enter: a 150 mm suspension fork under a low
//! stack puts the BB 115 mm above the axles.

use super::model::{Model, Row};
use super::unknowns::{ix, X};
use crate::catalogue::lookup;
use crate::error::{fmt_measure, Warning};
use crate::geometry::MEASURED_KEYS;

/// The stand-ins that can be named, with what to enter instead.
const STAND_INS: [(usize, &str); 2] = [
    (
        ix::A2C,
        " The stand-in fork is the likely cause: enter Fork axle-to-crown.",
    ),
    (
        ix::REAR_CENTRE,
        " The stand-in rear centre is the likely cause: enter Chainstay.",
    ),
];

/// Whether the solved value `v` of measurement `i` is unusual: not published, and outside its
/// plausible range.
fn odd(i: usize, v: f64, rows: &[Row]) -> bool {
    !rows.iter().any(|r| r.index == i) && !super::plausible(i, v)
}

/// The warning for the solved frame `x` (see the module documentation); `pinned` are the unknowns
/// set to typical values (`plan::Plan::pinned`). A stand-in is named when nudging it by 10 mm
/// moves an unusual value.
pub fn warning(model: &Model, x: &X, rows: &[Row], pinned: &[usize]) -> Option<Warning> {
    let predicted = model.predict(x)?;
    let mut msg = String::new();
    for (i, &v) in predicted.iter().enumerate() {
        let Some(m) = MEASURED_KEYS.get(i).and_then(|k| lookup(k)) else {
            continue;
        };
        if odd(i, v, rows) {
            msg.push_str(if msg.is_empty() {
                "The solved frame is unusual: "
            } else {
                ", "
            });
            msg.push_str(&format!(
                "{} {} ({})",
                m.label,
                fmt_measure(v, m.unit),
                m.most_bikes()
            ));
        }
    }
    if msg.is_empty() {
        return None;
    }
    msg.push('.');
    for (u, cause) in STAND_INS {
        let mut nudged = *x;
        if let (true, Some(n)) = (pinned.contains(&u), nudged.get_mut(u)) {
            *n += 10.0;
            let p = model.predict(&nudged)?;
            let moved = predicted
                .iter()
                .zip(p)
                .enumerate()
                .any(|(i, (&v, q))| odd(i, v, rows) && (q - v).abs() > 0.5);
            if moved {
                msg.push_str(cause);
            }
        }
    }
    Some(Warning::new("caution_solved_frame", msg))
}
