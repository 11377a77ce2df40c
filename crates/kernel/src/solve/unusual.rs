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
use crate::error::{fmt_measure, join_and, Warning};
use crate::geometry::MEASURED_KEYS;

/// The stand-ins that can be named, with what to enter instead.
const STAND_INS: [(usize, &str, &str); 2] = [
    (ix::A2C, "fork", "fork_a2c_mm"),
    (ix::REAR_CENTRE, "rear centre", "chainstay_mm"),
];

/// The warning for the solved frame `x` (see the module documentation); `pinned` are the unknowns
/// set to typical values (`plan::Plan::pinned`).
pub fn warning(model: &Model, x: &X, rows: &[Row], pinned: &[usize]) -> Option<Warning> {
    let predicted = model.predict(x)?;
    let odd: Vec<(usize, f64)> = predicted
        .iter()
        .enumerate()
        .filter(|(i, v)| !rows.iter().any(|r| r.index == *i) && !super::plausible(*i, **v))
        .map(|(i, v)| (i, *v))
        .collect();
    let list: Vec<String> = odd
        .iter()
        .filter_map(|&(i, v)| {
            let m = lookup(MEASURED_KEYS.get(i)?)?;
            Some(format!(
                "{} {} ({})",
                m.label,
                fmt_measure(v, m.unit),
                m.most_bikes()
            ))
        })
        .collect();
    if list.is_empty() {
        return None;
    }
    let mut msg = format!("The solved frame is unusual: {}.", list.join(", "));
    let (names, enter) = causes(model, x, &odd, pinned);
    if !names.is_empty() {
        msg.push_str(&format!(
            " The stand-in {} {} the likely cause: enter {}.",
            join_and(&names),
            if names.len() > 1 { "are" } else { "is" },
            join_and(&enter)
        ));
    }
    Some(Warning::new("caution_solved_frame", msg))
}

/// The stand-ins that move the unusual values (each nudged by 10 mm), and the labels of the
/// measurements that would replace them.
fn causes(
    model: &Model,
    x: &X,
    odd: &[(usize, f64)],
    pinned: &[usize],
) -> (Vec<&'static str>, Vec<&'static str>) {
    let mut names = Vec::new();
    let mut enter = Vec::new();
    for (u, name, key) in STAND_INS {
        let mut nudged = *x;
        let moves = pinned.contains(&u)
            && nudged.get_mut(u).is_some_and(|v| {
                *v += 10.0;
                true
            })
            && model.predict(&nudged).is_some_and(|p| {
                odd.iter()
                    .any(|&(i, v)| p.get(i).is_some_and(|q| (q - v).abs() > 0.5))
            });
        if moves {
            names.push(name);
            enter.push(lookup(key).map_or(key, |m| m.label));
        }
    }
    (names, enter)
}
