//! The table's orientation: whether the sizes run down the side (the measurements' labels
//! across the top), a table of sizes as rows turned into sizes as columns, and rows one cell
//! short given back their blank label.
//!
//! **Invariant:** after [`turn`] every row is one measurement (its label first) and every column
//! after the labels one size; a size row short of cells has been placed (read from the left
//! with a note, or as the person answers) before it is turned.

use super::cell::{is_value_token, parse_cell, strip_footnotes, Cell, Mark};
use super::grid::{is_size_token, Grid};
use super::label::{classify, Kind};
use super::log::{shorten, Log};
use super::short_rows::{place_short, Short};
use super::{ChartError, MAX_SIZES};
use std::collections::BTreeMap;

/// A row one cell short whose first cell is a size name or a number, or whose cells are all
/// units, lacks its (blank) label.
pub(super) fn repair_short_rows(table: &mut [Vec<String>]) {
    let mut counts: BTreeMap<usize, usize> = BTreeMap::new();
    for r in table.iter().filter(|r| r.len() >= 2) {
        *counts.entry(r.len()).or_default() += 1;
    }
    let Some(mode) = counts
        .iter()
        .max_by(|a, b| a.1.cmp(b.1).then(b.0.cmp(a.0)))
        .map(|(len, _)| *len)
    else {
        return;
    };
    // Rows led by a drawing reference ("A", "1") make a header without one a cell short.
    let is_ref = |r: &Vec<String>| {
        r.first().is_some_and(|c| {
            let short =
                (1..=2).contains(&c.chars().count()) && c.chars().all(char::is_alphanumeric);
            short || classify(c).kind == Kind::RowNumber
        })
    };
    let full = table.iter().filter(|r| r.len() == mode).count();
    let refs = table
        .iter()
        .filter(|r| r.len() == mode && is_ref(r))
        .count();
    let referenced = refs * 2 > full;
    // A size name before plain values ("M 455 620") is the label of a size row (sizes as
    // rows), not the first of a row of size names.
    let sizes_only = |r: &Vec<String>| {
        r.iter()
            .skip(1)
            .all(|c| c.is_empty() || is_size_token(c) || !is_value_token(c))
    };
    // A units row ("mm  mm  °") has no label either.
    let units_only = |r: &Vec<String>| r.iter().all(|c| Mark::from_word(c).is_some());
    for r in table.iter_mut() {
        let first = r.first().map_or("", String::as_str);
        let unlabelled = first.is_empty()
            || units_only(r)
            || (is_size_token(first) && sizes_only(r))
            || is_value_token(first)
            || (referenced && !is_ref(r));
        if r.len() + 1 == mode && unlabelled {
            r.insert(0, String::new());
        }
    }
}

pub(super) fn measurement(cell: &str) -> bool {
    classify(cell).kind.is_measurement()
}

/// Whether the sizes run down the side (the measurements' labels across the top): more
/// labels in one of the first rows than in any of the first three columns.
pub(super) fn runs_across(table: &[Vec<String>]) -> bool {
    let col_best = (0..3)
        .map(|c| {
            table
                .iter()
                .filter(|r| r.get(c).is_some_and(|s| measurement(s)))
                .count()
        })
        .max()
        .unwrap_or(0);
    let row_best = table
        .iter()
        .take(8)
        .map(|r| r.iter().filter(|s| measurement(s)).count())
        .max()
        .unwrap_or(0);
    row_best > col_best
}

/// A table of sizes as rows turned into sizes as columns. A size row with fewer values than the
/// table has columns is placed first ([`place_short_size_rows`]).
pub(super) fn turn(
    mut table: Vec<Vec<String>>,
    grid: &Grid,
    log: &mut Log,
) -> Result<Vec<Vec<String>>, ChartError> {
    if table.len() > MAX_SIZES + 4 {
        return Err(ChartError::TooManySizes {
            count: table.len() - 1,
        });
    }
    let width = table.iter().map(Vec::len).max().unwrap_or(0);
    place_short_size_rows(&mut table, width, grid, log);
    let turned = (0..width)
        .map(|c| {
            let mut col: Vec<String> = table
                .iter()
                .map(|r| r.get(c).cloned().unwrap_or_default())
                .collect();
            while col.last().is_some_and(String::is_empty) {
                col.pop();
            }
            col
        })
        .collect();
    Ok(turned)
}

/// The size rows of a chart with sizes as rows that have fewer cells than the widest row:
/// read from the left with a note when the cells kept their places (tabs, separators, aligned
/// columns: a blank at the end of a line is lost when it is copied), else the person is asked
/// whether the values are the first or the last measurements ([`place_short`]). Rows without a
/// number (the labels across the top, a units row) are left as they are.
fn place_short_size_rows(table: &mut [Vec<String>], width: usize, grid: &Grid, log: &mut Log) {
    for r in table.iter_mut() {
        let numbers = r
            .iter()
            .skip(1)
            .filter(|c| matches!(parse_cell(c, grid.decimal_comma), Cell::Number(_)))
            .count();
        if numbers == 0 || r.len() >= width || r.len() < 2 {
            continue;
        }
        let label = strip_footnotes(r.first().map_or("", String::as_str));
        let label = if label.is_empty() {
            "(a size row without a name)".to_string()
        } else {
            shorten(&label)
        };
        let mut cells = r.split_off(1);
        let short = Short {
            row: &label,
            ask: !grid.placed,
            what: "measurements",
        };
        place_short(&mut cells, width - 1, String::new(), short, log);
        r.append(&mut cells);
    }
}
