//! A solved frame that bikes do not have: a number the published values did not give (BB drop,
//! BB height, wheelbase, trail, …) outside its plausible range (catalogue) gets the warning
//! `caution_solved_frame`, naming each such value and the range. A published value outside its
//! range has its own warning (`implausible`, in `evaluate`).
//!
//! When a stand-in for a number not given (the fork's axle-to-crown, the rear centre:
//! [`super::unknowns::fork_stand_in`], [`super::unknowns::typical`]) moves those values, it is
//! named with the measurement to enter:
//!
//! - the stand-in fork as the likely cause: its axle-to-crown stands for forks from about 340 to
//!   600 mm, so it alone can put a frame out of range (a 150 mm suspension fork under a low stack
//!   puts the BB 115 mm above the axles);
//! - the stand-in rear centre, with its length, as something the values it moves also depend
//!   on, never as the cause: a stand-in of 415 or 435 mm cannot put them out of range by itself.
//!   The chainstay `√(rc² + drop²)` stays inside 380–470 mm for any BB drop inside the hard
//!   range (`√(435² + 160²) = 463.5 mm`, 150 mm and its slack), and the wheelbase = front
//!   centre + rear centre leaves 950–1350 mm only with a front centre outside most bikes'
//!   550–900 mm (`950 − 435 = 515 mm`, `1350 − 435 = 915 mm`).

use super::model::{Model, Row};
use super::unknowns::{ix, X};
use crate::catalogue::lookup;
use crate::error::{fmt_measure, in_sentence, Warning};
use crate::geometry::{MEASURED_COUNT, MEASURED_KEYS};

/// Whether the solved value `v` of measurement `i` is unusual: not published, and outside its
/// plausible range.
fn odd(i: usize, v: f64, rows: &[Row]) -> bool {
    !rows.iter().any(|r| r.index == i) && !super::plausible(i, v)
}

/// The warning for the solved frame `x` (see the module documentation); `pinned` are the unknowns
/// set to typical values (`plan::Plan::pinned`). A stand-in is named when nudging it by 10 mm
/// moves an unusual value by more than 0.5 mm (not when the nudged frame cannot be measured).
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
                in_sentence(m.label),
                fmt_measure(v, m.unit),
                m.most_bikes()
            ));
        }
    }
    if msg.is_empty() {
        return None;
    }
    msg.push('.');
    for u in [ix::A2C, ix::REAR_CENTRE] {
        if !pinned.contains(&u) {
            continue;
        }
        let moved = moved_by(model, x, u, &predicted, rows).unwrap_or_default();
        if moved.is_empty() {
            continue;
        }
        if u == ix::A2C {
            msg.push_str(" The stand-in fork is the likely cause: enter Fork axle-to-crown.");
        } else {
            msg.push_str(&depends_on(&moved, x.get(u).copied()?));
        }
    }
    Some(Warning::new("caution_solved_frame", msg))
}

/// The labels (in a sentence) of the unusual values that nudging unknown `u` of `x` by 10 mm
/// moves by more than 0.5 mm; `None` when the nudged frame cannot be measured.
fn moved_by(
    model: &Model,
    x: &X,
    u: usize,
    predicted: &[f64; MEASURED_COUNT],
    rows: &[Row],
) -> Option<Vec<String>> {
    let mut nudged = *x;
    *nudged.get_mut(u)? += 10.0;
    let p = model.predict(&nudged)?;
    let mut out = Vec::new();
    for (i, (&v, q)) in predicted.iter().zip(p).enumerate() {
        let label = MEASURED_KEYS
            .get(i)
            .and_then(|k| lookup(k))
            .map(|m| m.label);
        if let (true, Some(label)) = (odd(i, v, rows) && (q - v).abs() > 0.5, label) {
            out.push(in_sentence(label));
        }
    }
    Some(out)
}

/// The sentence for the stand-in rear centre of `rc_mm` that the unusual values `moved` depend
/// on: " The wheelbase also depends on the stand-in rear centre of 435 mm: enter Chainstay."
fn depends_on(moved: &[String], rc_mm: f64) -> String {
    let verb = if moved.len() == 1 {
        "depends"
    } else {
        "depend"
    };
    format!(
        " The {} also {verb} on the stand-in rear centre of {}: enter Chainstay.",
        moved.join(" and "),
        fmt_measure(rc_mm, crate::catalogue::Unit::Mm)
    )
}
