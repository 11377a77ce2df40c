//! A solved frame that bikes do not have: a number the published values did not give (BB drop,
//! BB height, wheelbase, trail, …) outside its plausible range (catalogue) gets the warning
//! `caution_solved_frame`, naming each such value and the range. A published value outside its
//! range has its own warning (`implausible`, in `evaluate`).
//!
//! When a stand-in for a number not given (the fork's axle-to-crown, the rear centre:
//! [`super::unknowns::fork_stand_in`], [`super::unknowns::typical`]) moves those values, it is
//! named with the measurement to enter:
//!
//! - the stand-in fork as the likely cause when some fork of most bikes' axle-to-crown (340 to
//!   600 mm, catalogue `fork_a2c_mm`, tried every 5 mm) would bring every unusual value it moves
//!   back inside its range without pushing another out of it: it stands for forks across that
//!   span, so it alone can put a frame out of range (a 150 mm suspension fork under a low stack
//!   puts the BB 115 mm above the axles); otherwise (no fork of most bikes would: a misprint, or
//!   another stand-in, is the more likely cause) the values it moves are said to also depend on
//!   it, with its length, as for the rear centre;
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
        let Some(at_mm) = x.get(u).copied() else {
            continue;
        };
        let labels = labels_of(&moved);
        if u == ix::A2C && a_fork_clears(model, x, rows, (&predicted, &moved)) {
            msg.push_str(" The stand-in fork is the likely cause: enter Fork axle-to-crown.");
        } else if u == ix::A2C {
            msg.push_str(&depends_on(
                &labels,
                "fork axle-to-crown",
                at_mm,
                "Fork axle-to-crown",
            ));
        } else {
            msg.push_str(&depends_on(&labels, "rear centre", at_mm, "Chainstay"));
        }
    }
    Some(Warning::new("caution_solved_frame", msg))
}

/// The indices of the unusual values that nudging unknown `u` of `x` by 10 mm moves by more than
/// 0.5 mm; `None` when the nudged frame cannot be measured.
fn moved_by(
    model: &Model,
    x: &X,
    u: usize,
    predicted: &[f64; MEASURED_COUNT],
    rows: &[Row],
) -> Option<Vec<usize>> {
    let mut nudged = *x;
    *nudged.get_mut(u)? += 10.0;
    let p = model.predict(&nudged)?;
    let mut out = Vec::new();
    for (i, (&v, q)) in predicted.iter().zip(p).enumerate() {
        if odd(i, v, rows) && (q - v).abs() > 0.5 {
            out.push(i);
        }
    }
    Some(out)
}

/// The labels, in a sentence, of measurements `indices`.
fn labels_of(indices: &[usize]) -> Vec<String> {
    let label = |&i: &usize| {
        MEASURED_KEYS
            .get(i)
            .and_then(|k| lookup(k))
            .map(|m| in_sentence(m.label))
    };
    indices.iter().filter_map(label).collect()
}

/// Whether some fork of most bikes' axle-to-crown (the catalogue's plausible range of
/// `fork_a2c_mm`, every [`FORK_STEP_MM`] from its low end) in place of the stand-in in `x` would
/// leave the frame usual but for what the fork does not move: every value it makes unusual is
/// one that was already unusual at the stand-in (`predicted`) and that the fork does not move
/// (`moved`, indices). A fork that brings the front centre into range only by pushing the BB
/// drop out of it clears nothing.
fn a_fork_clears(
    model: &Model,
    x: &X,
    rows: &[Row],
    (predicted, moved): (&[f64; MEASURED_COUNT], &[usize]),
) -> bool {
    let Some((lo, hi)) = lookup("fork_a2c_mm").map(|m| m.plausible) else {
        return false;
    };
    if !(lo.is_finite() && hi.is_finite() && lo <= hi) {
        return false;
    }
    let mut tried = *x;
    let steps = ((hi - lo) / FORK_STEP_MM).floor().min(1000.0) as u32;
    (0..=steps).any(|k| {
        let Some(slot) = tried.get_mut(ix::A2C) else {
            return false;
        };
        *slot = lo + FORK_STEP_MM * f64::from(k);
        model.predict(&tried).is_some_and(|p| {
            p.iter().zip(predicted).enumerate().all(|(i, (&v, &was))| {
                !odd(i, v, rows) || (odd(i, was, rows) && !moved.contains(&i))
            })
        })
    })
}

/// The step between the forks [`a_fork_clears`] tries, mm.
const FORK_STEP_MM: f64 = 5.0;

/// The sentence for a stand-in `what` of `at_mm` that the unusual values `moved` depend on, and
/// the field to `enter`: " The wheelbase also depends on the stand-in rear centre of 435 mm:
/// enter Chainstay."
fn depends_on(moved: &[String], what: &str, at_mm: f64, enter: &str) -> String {
    let verb = if moved.len() == 1 {
        "depends"
    } else {
        "depend"
    };
    format!(
        " The {} also {verb} on the stand-in {what} of {}: enter {enter}.",
        moved.join(" and "),
        fmt_measure(at_mm, crate::catalogue::Unit::Mm)
    )
}
