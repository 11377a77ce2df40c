//! From the grid's lines to the table's rows, before the table's shape is read: a phone copy of
//! one cell per line regrouped, a header or units row of single spaces split into cells, and
//! what tells a line of text (a title, "All measurements in mm") from a row of the table.
//!
//! **Invariant:** nothing here drops a line: a line is regrouped, split or kept as it is; the
//! caller decides which lines are text and notes each one.

use super::cell::{is_value_token, Mark};
use super::grid::{is_size_token, Grid, Row, Sep};
use super::label::{classify, Kind};
use super::log::Log;
use super::orient::runs_across;
use super::segment::{split_header, split_units_row};
use std::collections::BTreeMap;

/// A line of one cell that names the wheels and gives some ("Wheel 650b 650b 700c"): a row
/// whose cells single spaces joined to its label (read by `rows`), not a line of text.
pub(super) fn wheels_in_words(row: &Row) -> bool {
    let mut filled = row.cells.iter().filter(|c| !c.is_empty());
    match (filled.next(), filled.next()) {
        (Some(only), None) => {
            matches!(classify(only).kind, Kind::Wheels(_))
                && only.chars().any(|c| c.is_ascii_digit())
        }
        _ => false,
    }
}

/// A table copied from a phone's stacked layout arrives one cell per line: each label line
/// starts a row and the lines after it are its cells ("Reach", "430", "455", "Stack", …).
pub(super) fn regroup_single_column(grid: &Grid, log: &mut Log) -> Option<Vec<Row>> {
    let filled = |r: &Row| r.cells.iter().filter(|c| !c.is_empty()).count();
    if grid.rows.len() < 4 || grid.rows.iter().any(|r| filled(r) > 1) {
        return None;
    }
    let mut rows: Vec<Row> = Vec::new();
    let cells = grid
        .rows
        .iter()
        .filter_map(|r| r.cells.iter().find(|c| !c.is_empty()));
    for cell in cells {
        let kind = classify(cell).kind;
        let starts = kind.is_measurement()
            || (kind == Kind::Size && !cell.is_empty())
            || (!is_value_token(cell) && !is_size_token(cell));
        match rows.last_mut() {
            Some(row) if !starts => row.cells.push(cell.clone()),
            _ => rows.push(Row {
                cells: vec![cell.clone()],
            }),
        }
    }
    let grouped = rows.iter().filter(|r| r.cells.len() > 1).count();
    (grouped >= 2).then(|| {
        log.note(
            "",
            "the chart had one cell per line; each label was read with the lines after it".into(),
        );
        rows
    })
}

/// Space-separated text: a line of labels with single spaces ("Size Reach Stack HTA") is split
/// into as many labels as the data rows have cells; then, when the sizes are rows, a units row
/// with single spaces ("cm cm deg mm") with one unit per measurement gets a cell per unit.
pub(super) fn split_headers(grid: &Grid) -> Vec<Row> {
    let mut rows = grid.rows.clone();
    if grid.sep != Sep::Spaces {
        return rows;
    }
    let mut counts: BTreeMap<usize, usize> = BTreeMap::new();
    for r in rows.iter().filter(|r| r.cells.len() >= 3) {
        *counts.entry(r.cells.len()).or_default() += 1;
    }
    let Some(width) = counts.iter().max_by_key(|(_, n)| **n).map(|(w, _)| *w) else {
        return rows;
    };
    // Only the first few lines can be the header.
    for r in rows.iter_mut().take(8) {
        let mut filled = r.cells.iter().filter(|c| !c.is_empty());
        if let (Some(only), None) = (filled.next(), filled.next()) {
            if let Some(cells) = split_header(only, width) {
                r.cells = cells;
            }
        }
    }
    split_units_rows(&mut rows, width);
    rows
}

/// With sizes as rows, each row whose one cell is a units row of single spaces
/// ([`split_units_row`]) is split into its units.
fn split_units_rows(rows: &mut [Row], width: usize) {
    let table: Vec<Vec<String>> = rows.iter().map(|r| r.cells.clone()).collect();
    if !runs_across(&table) {
        return;
    }
    for r in rows.iter_mut() {
        let mut filled = r.cells.iter().filter(|c| !c.is_empty());
        if let (Some(only), None) = (filled.next(), filled.next()) {
            if let Some(cells) = split_units_row(only, width) {
                r.cells = cells;
            }
        }
    }
}

/// A unit named in a line of text such as "All measurements in mm".
pub(super) fn unit_hint(line: &str) -> Option<Mark> {
    let lower = line.to_lowercase();
    let words: Vec<&str> = lower
        .split(|c: char| !(c.is_alphanumeric() || c == '"'))
        .filter(|w| !w.is_empty() && *w != "in")
        .collect();
    let marks: Vec<Mark> = words
        .iter()
        .filter_map(|w| Mark::from_word(w))
        .filter(|m| *m != Mark::Deg)
        .collect();
    let first = *marks.first()?;
    marks.iter().all(|m| *m == first).then_some(first)
}
