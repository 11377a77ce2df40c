//! The warnings for what the published numbers leave free: an unknown with a stated prior
//! (`assumed`) and the unknowns pinned to a typical value (`underdetermined`), each with its value
//! and, for the stand-in fork and rear centre, why it has that length.
//!
//! **Invariant:** every value said is the one the solved frame uses (`x` after `plan::plan`), and
//! the measurements suggested are `plan::Plan::missing`.

use super::plan;
use super::unknowns::{fork_stand_in, ix, FrontTyre, UNKNOWNS, X};
use crate::catalogue::lookup;
use crate::error::{fmt_measure, in_sentence, Warning};

/// Warnings for the unknowns the published numbers leave free, with the values `x` they were
/// given (a prior: `assumed`; a typical value: `underdetermined`, the axle-to-crown with the
/// fork it stands for, see [`fork_stand_in`]).
pub fn assumption_warnings(plan: &plan::Plan, x: &X, front: FrontTyre) -> Vec<Warning> {
    let mut out = Vec::new();
    let describe = |u: usize| {
        let unknown = UNKNOWNS.get(u)?;
        let m = lookup(unknown.key)?;
        Some((m.label, fmt_measure(x.get(u).copied()?, m.unit)))
    };
    for (label, value) in plan.priors.iter().filter_map(|&u| describe(u)) {
        out.push(Warning::new(
            "assumed",
            format!(
                "{label} is not fixed by the published numbers: assumed {value} (enter the \
                 published value to replace it)."
            ),
        ));
    }
    if !plan.pinned.is_empty() {
        let list: Vec<String> = plan
            .pinned
            .iter()
            .filter_map(|&u| {
                let (label, value) = describe(u)?;
                let why = match u {
                    ix::A2C => fork_reason(front),
                    ix::REAR_CENTRE => rear_reason(front),
                    _ => String::new(),
                };
                Some(format!("{} {value}{why}", in_sentence(label)))
            })
            .collect();
        out.push(Warning::new(
            "underdetermined",
            format!(
                "The published numbers do not fix the whole frame; these are typical values, not this frame's: {}. Add {} to fix them.",
                list.join(", "),
                plan.missing
                    .iter()
                    .map(|k| crate::catalogue::lookup(k).map_or(k.as_str(), |m| m.label))
                    .collect::<Vec<_>>()
                    .join(", ")
            ),
        ));
    }
    out
}

/// Why the stand-in axle-to-crown has its length, in brackets after it: the fork it stands for
/// and the tyre that chose it (common practice, see [`fork_stand_in`]).
fn fork_reason(front: FrontTyre) -> String {
    let fork = fork_stand_in(front);
    let kind = if fork.suspension {
        "a suspension fork of about 150 mm travel"
    } else {
        "a rigid fork"
    };
    match front.width_mm {
        Some(w) => format!(" ({kind}, as common for a {w:.0} mm front tyre)"),
        None => format!(" ({kind}; the front tyre's width is not known)"),
    }
}

/// Why the stand-in rear centre has its length: said only for the narrow tyre's shorter one
/// ([`super::unknowns::typical`]).
fn rear_reason(front: FrontTyre) -> String {
    match front.width_mm {
        Some(w) if !fork_stand_in(front).suspension => {
            format!(" (a road or gravel bike's, as common for a {w:.0} mm front tyre)")
        }
        _ => String::new(),
    }
}
