//! Rows with fewer values than places: one value standing for every size (a merged cell), and a
//! row of `k < n` values, read from the left or placed as the person answers. Used for the rows
//! of sizes as columns (`rows`) and for the size rows of a chart with sizes as rows (`orient`).
//!
//! **Invariant:** no value is placed without the person being told: either a note says how the
//! row was read, or a question (id `<row>#<what>`) offers the other readings, and the answer
//! passed back is the reading applied.

use super::cell::Cell;
use super::log::Log;

/// A row of one value for `n` sizes: one value standing for every size (a merged cell), with a
/// note. When the cells lost their places the person is also asked, since the value may be the
/// first or the last size's alone (question id `<row>#sizes`).
pub(super) fn one_for_all(
    cells: Vec<Cell>,
    n: usize,
    ask: bool,
    row: &str,
    log: &mut Log,
) -> Vec<Cell> {
    let one = cells.into_iter().next().unwrap_or(Cell::Missing);
    const ALL: &str = "every size";
    const FIRST: &str = "the first size";
    const LAST: &str = "the last size";
    let chosen = if ask {
        log.ask(
            row,
            "sizes",
            |c| {
                let used = if c == ALL {
                    "every size".to_string()
                } else {
                    format!("{c} only")
                };
                format!("\"{row}\" gives one value for {n} sizes; used it for {used}")
            },
            &[ALL, FIRST, LAST],
            ALL,
        )
    } else {
        log.note(row, "one value for every size; used it for all".into());
        ALL.to_string()
    };
    let mut out = vec![Cell::Missing; n];
    let place = match chosen.as_str() {
        FIRST => out.first_mut(),
        LAST => out.last_mut(),
        _ => return vec![one; n],
    };
    if let Some(c) = place {
        *c = one;
    }
    out
}

/// A row of fewer values than it has places for: its label, whether to ask, and what the
/// places are ("sizes", or "measurements" for a size row of a chart with sizes as rows).
pub(super) struct Short<'a> {
    /// The row's label as written.
    pub row: &'a str,
    /// Whether the person is asked (the cells lost their places).
    pub ask: bool,
    /// What the places are, plural.
    pub what: &'static str,
}

/// A row of `k` values for `n` places, `k < n`: read from the left with a note when the cells'
/// places are known (a blank at the end of a row is the last places' blank); else the person
/// is asked whether the values belong to the first places (the default) or the last ones (a
/// measurement given only for the bigger sizes), or to none (a blank in the middle: the values
/// are left out), and the row is read that way: with the last, `n - k` blanks go before the
/// values. Question id: `<row>#<what>`.
pub(super) fn place_short<T: Clone>(
    cells: &mut Vec<T>,
    n: usize,
    blank: T,
    short: Short<'_>,
    log: &mut Log,
) {
    let Short { row, ask, what } = short;
    let k = cells.len();
    if !ask {
        log.note(
            row,
            format!("{k} values for {n} {what}; read from the left"),
        );
        return;
    }
    let (first, last) = (
        format!("the first {k} {what}"),
        format!("the last {k} {what}"),
    );
    // A blank in the middle of the row fits neither: its values can be left out and typed in.
    const NONE: &str = "none of them (leave the values out)";
    let chosen = log.ask(
        row,
        what,
        |c| {
            if c == NONE {
                format!("\"{row}\" gives {k} values for {n} {what}; they were left out")
            } else {
                format!("\"{row}\" gives {k} values for {n} {what}; read as {c}")
            }
        },
        &[&first, &last, NONE],
        &first,
    );
    if chosen == last {
        let mut placed = vec![blank; n - k];
        placed.append(cells);
        *cells = placed;
    } else if chosen == NONE {
        *cells = vec![blank; n];
    }
}
