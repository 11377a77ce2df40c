//! The unit of a row's length values written without one: the row's own (label, units column,
//! marked cells), the chart's (a title line, the size row's label), or inferred from the size
//! of the numbers against the measurement's plausible range (else its hard range), with the
//! unit most rows agree on breaking ties.
//!
//! **Invariant:** an inferred unit always comes with words for the person: a note naming the
//! rows read so when only one unit fits, else a question (id `<row>#unit`) offering the units
//! that fit (mm, cm and inches when none does).

use super::cell::{Cell, Mark, Num};
use super::log::Log;
use super::rows::Keyed;
use framewise_kernel::Unit;

/// The length units a number without one may be in.
const LENGTHS: [Mark; 3] = [Mark::Mm, Mark::Cm, Mark::In];

/// The row's own unit for lengths (cells marked, or from label or units column), if any.
fn row_length_unit(row: &Keyed) -> Option<Mark> {
    row.unit.filter(|u| *u != Mark::Deg).or_else(|| {
        let marks: Vec<Mark> = row
            .cells
            .iter()
            .filter_map(|c| match c {
                Cell::Number(n) => Some(n.mark),
                _ => None,
            })
            .collect::<Option<Vec<Mark>>>()?;
        let first = *marks.first()?;
        (first != Mark::Deg && marks.iter().all(|m| *m == first)).then_some(first)
    })
}

/// Units whose conversion puts every unmarked value of the row inside `range`.
fn candidates(row: &Keyed, range: (f64, f64)) -> Vec<Mark> {
    let values: Vec<f64> = unmarked(row).map(|n| n.value).collect();
    LENGTHS
        .into_iter()
        .filter(|u| {
            values
                .iter()
                .all(|v| (range.0..=range.1).contains(&(v * u.factor())))
        })
        .collect()
}

fn unmarked(row: &Keyed) -> impl Iterator<Item = &Num> {
    row.cells.iter().filter_map(|c| match c {
        Cell::Number(n) if n.mark.is_none() => Some(n),
        _ => None,
    })
}

/// The length unit most rows agree on (given, or the only one that fits).
pub(super) fn consensus(keyed: &[Keyed], global: Option<Mark>) -> Option<Mark> {
    if global.is_some() {
        return global;
    }
    let mut votes = [0usize; 3];
    for row in keyed.iter().filter(|r| r.m.unit == Unit::Mm) {
        let unit =
            row_length_unit(row).or_else(|| match candidates(row, row.m.plausible).as_slice() {
                [one] => Some(*one),
                _ => None,
            });
        if let Some(i) = unit.and_then(|u| LENGTHS.iter().position(|l| *l == u)) {
            if let Some(v) = votes.get_mut(i) {
                *v += 1;
            }
        }
    }
    let best = votes.iter().copied().max().unwrap_or(0);
    let winners: Vec<usize> = (0..3).filter(|i| votes.get(*i) == Some(&best)).collect();
    match winners.as_slice() {
        [i] if best > 0 => LENGTHS.get(*i).copied(),
        _ => None,
    }
}

/// The unit for the row's unmarked length values.
pub(super) fn length_unit(
    row: &Keyed,
    global: Option<Mark>,
    consensus: Option<Mark>,
    log: &mut Log,
) -> Mark {
    if let Some(u) = row.unit.filter(|u| *u != Mark::Deg).or(global) {
        return u;
    }
    if unmarked(row).next().is_none() {
        return Mark::Mm;
    }
    let text = &row.text;
    let plausible = candidates(row, row.m.plausible);
    let list = if plausible.is_empty() {
        candidates(row, row.m.hard)
    } else {
        plausible
    };
    match list.as_slice() {
        [one] => {
            let one = *one;
            // One note per unit for all the rows read so: the rows' notes were alike.
            log.note_rows(&format!("unit#{}", one.name()), text, |rows| {
                format!(
                    "no unit given for {}: read as {} from the size of the numbers",
                    rows.join(", "),
                    one.words()
                )
            });
            one
        }
        [] => pick(log, text, &["mm", "cm", "in"], "mm", |c| {
            format!(
                    "the numbers of \"{text}\" fit no usual range for {} in mm, cm or inches; read as {}",
                    row.m.label,
                    unit_words(c)
                )
        }),
        _ => {
            let names: Vec<&str> = list.iter().map(|m| m.name()).collect();
            let words: Vec<&str> = list.iter().map(|m| m.words()).collect();
            let default = consensus
                .filter(|c| list.contains(c))
                .unwrap_or_else(|| nearest_mid(row, &list));
            let why = if Some(default) == consensus {
                "like the other rows"
            } else {
                "as the most usual value"
            };
            pick(log, text, &names, default.name(), |c| {
                let why = if c == default.name() {
                    why
                } else {
                    "as chosen"
                };
                format!(
                    "no unit given and the numbers of \"{text}\" fit {}; read as {} {why}",
                    words.join(" or "),
                    unit_words(c)
                )
            })
        }
    }
}

/// The words of a length unit's name (`"in"` → `"inches"`).
fn unit_words(name: &str) -> &'static str {
    LENGTHS
        .into_iter()
        .find(|m| m.name() == name)
        .unwrap_or(Mark::Mm)
        .words()
}

fn pick(
    log: &mut Log,
    row: &str,
    options: &[&str],
    default: &str,
    message: impl FnOnce(&str) -> String,
) -> Mark {
    let chosen = log.ask(row, "unit", message, options, default);
    LENGTHS
        .into_iter()
        .find(|m| m.name() == chosen)
        .unwrap_or(Mark::Mm)
}

/// The unit that puts the row's values nearest the middle of the plausible range.
fn nearest_mid(row: &Keyed, list: &[Mark]) -> Mark {
    let (lo, hi) = row.m.plausible;
    let mid = (lo + hi) / 2.0;
    let span = (hi - lo).max(1.0);
    let cost = |u: &Mark| {
        unmarked(row)
            .map(|n| ((n.value * u.factor() - mid) / span).abs())
            .sum::<f64>()
    };
    list.iter()
        .copied()
        .min_by(|a, b| cost(a).total_cmp(&cost(b)))
        .unwrap_or(Mark::Mm)
}
