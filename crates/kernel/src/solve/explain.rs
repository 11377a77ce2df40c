//! The `inconsistent` warning in plain words: what the other numbers predict for each value that
//! disagrees, and which value (or which one of several) would explain it.
//!
//! Three cases, from the suspects of [`super::diagnose::leave_each_out`] (the values whose removal
//! lets the rest agree):
//! - one suspect: it is named, with what the other numbers give for it, and said to be left out
//!   of the solved frame (weight zero, `super::robust::lone_misprint`);
//! - several: the values form one loop that does not close (say reach, head angle, fork and
//!   chainstay against a published wheelbase). Any one of them would close it, so they are named
//!   once, each with the change that would do it, and the sentence says the numbers cannot tell
//!   which;
//! - none: every value that disagrees is listed; more than one may be wrong.
//!
//! Every figure quoted is the leave-one-out prediction (the frame refitted without the value,
//! [`super::diagnose::LeftOut::predicted`], or to first order
//! [`super::diagnose::Check::from_others`]), never the best fit, which includes the published
//! value itself.

use crate::catalogue::lookup;
use crate::error::{fmt_disagreement, in_sentence, Warning};
use crate::geometry::MEASURED_KEYS;

/// One given value as the explanation needs it.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Finding {
    /// Index into [`MEASURED_KEYS`].
    pub index: usize,
    /// As published.
    pub given: f64,
    /// As the solved frame has it.
    pub solved: f64,
    /// Its tolerance (rounding step), same unit.
    pub tolerance: f64,
    /// What the other values alone predict (`None`: nothing else checks it).
    pub from_others: Option<f64>,
    /// Whether it agrees with the rest.
    pub consistent: bool,
    /// Whether it is a suspect (see [`super::Residual::suspect`]).
    pub suspect: bool,
}

fn key(index: usize) -> &'static str {
    MEASURED_KEYS.get(index).copied().unwrap_or("?")
}

/// The measurement's name as the page and the charts say it (its catalogue label), not its key.
fn label(index: usize) -> &'static str {
    let k = key(index);
    lookup(k).map_or(k, |m| m.label)
}

/// `[given, predicted, gap]` as text (whole mm or tenths of a degree, see [`fmt_disagreement`]);
/// `None` when nothing else checks the value, the prediction is no value a frame has (outside the
/// plausible range: never offered as what the number should be) or the two read alike.
fn quoted(f: &Finding) -> Option<[String; 3]> {
    let p = f.from_others.filter(|&p| super::plausible(f.index, p))?;
    let t = fmt_disagreement(f.given, p, key(f.index).ends_with("_deg"));
    (t[0] != t[1]).then_some(t)
}

/// "Reach is published as 490 mm but the other numbers give 470 mm, 20 mm away", or, for a value
/// nothing else checks or whose prediction is not quoted ([`quoted`]), what the fit makes of it.
fn disagreement(f: &Finding) -> String {
    let name = label(f.index);
    if let Some([given, other, gap]) = quoted(f) {
        return format!(
            "{name} is published as {given} but the other numbers give {other}, {gap} away"
        );
    }
    let [given, solved, _] = fmt_disagreement(f.given, f.solved, key(f.index).ends_with("_deg"));
    let unchecked = if f.from_others.is_none() {
        ", which no other number checks,"
    } else {
        ","
    };
    format!("{name} is published as {given}{unchecked} but the fit makes it {solved}")
}

/// Puts the suspects (measurement indices) in the order the warning and the row notes name
/// them: the values needing the fewest of their own rounding steps of change first (the likelier
/// misprints), ties in the order given (the published values' key order, a stable sort).
pub fn in_named_order(findings: &[Finding], suspects: &mut [usize]) {
    let steps = |i: &usize| {
        findings
            .iter()
            .find(|f| f.index == *i)
            .map_or(f64::INFINITY, steps_off)
    };
    super::sort_short(suspects, |a, b| steps(a) < steps(b));
}

/// The warning for inconsistent values (see the module documentation); `suspects` in the order
/// to name them ([`in_named_order`]); `left_out` when the one suspect was left out of the solved
/// frame (`super::robust::lone_misprint`).
pub fn warning(findings: &[Finding], suspects: &[usize], left_out: bool) -> Warning {
    let of = |i: usize| findings.iter().find(|f| f.index == i);
    let named: Vec<&Finding> = suspects.iter().filter_map(|&i| of(i)).collect();
    let msg = match named.as_slice() {
        [one] => one_suspect(one, left_out),
        [] => no_suspect(findings),
        many => one_loop(many),
    };
    Warning::new("inconsistent", msg)
}

fn one_suspect(suspect: &Finding, left_out: bool) -> String {
    format!(
        "The published numbers disagree: {}. Most likely wrong: {}; without it the rest agree{}.",
        disagreement(suspect),
        label(suspect.index),
        if left_out {
            ", so the solved frame leaves it out"
        } else {
            ""
        }
    )
}

fn no_suspect(findings: &[Finding]) -> String {
    let list: Vec<String> = findings
        .iter()
        .filter(|f| !f.consistent)
        .map(disagreement)
        .collect();
    format!(
        "The published numbers disagree: {}. No single value explains it; more than one may be wrong, or they were measured differently.",
        list.join("; ")
    )
}

/// Several suspects: one loop of values that does not close, said once, the members in the
/// order given ([`in_named_order`]).
fn one_loop(members: &[&Finding]) -> String {
    // The names inside the sentence: "chainstay, reach and wheelbase", "BB drop" as written.
    let names: Vec<String> = members
        .iter()
        .map(|f| in_sentence(label(f.index)))
        .collect();
    let names: Vec<&str> = names.iter().map(String::as_str).collect();
    let changes: Vec<String> = members
        .iter()
        .filter_map(|f| {
            let [given, other, gap] = quoted(f)?;
            Some(format!(
                "{} by {gap} ({given} published, {other} from the others)",
                in_sentence(label(f.index))
            ))
        })
        .collect();
    format!(
        "The published numbers disagree: {} do not fit one frame together. Any one of them being off by about this much would explain it: {}. The numbers alone cannot tell which one it is.",
        join_and(&names),
        changes.join("; ")
    )
}

/// How many of its own rounding steps a value is from what the others give (infinite when nothing
/// else checks it).
fn steps_off(f: &Finding) -> f64 {
    f.from_others
        .map_or(f64::INFINITY, |p| ((p - f.given) / f.tolerance).abs())
}

/// "A, B and C".
fn join_and(names: &[&str]) -> String {
    match names {
        [] => String::new(),
        [one] => (*one).to_string(),
        [rest @ .., last] => format!("{} and {last}", rest.join(", ")),
    }
}
