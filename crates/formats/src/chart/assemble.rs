//! The table's shape: text lines out, short rows repaired, sizes as columns or rows, the label
//! column, a units column (or, with sizes as rows, a units row), the size row. The values
//! themselves are read in `rows`.
//!
//! [`build`] runs the steps in order; the lines are read in `lines`, the orientation in
//! `orient`, units beside the values in `unit_columns`. Here: the steps, the row of size names
//! and the size labels, and the columns that turn out not to be sizes.
//!
//! **Invariant:** every line of the grid ends up in the table or in a note ("ignored a line of
//! text"), and the size run has between 1 and [`MAX_SIZES`] sizes, else a [`ChartError`].

use super::cell::{is_footnote_line, parse_cell, strip_footnotes, Cell};
use super::grid::Grid;
use super::label::{classify, Kind};
use super::lines::{regroup_single_column, split_headers, unit_hint, wheels_in_words};
use super::log::{shorten, Log};
use super::orient::{repair_short_rows, runs_across, turn};
use super::rows::{fill, TableRow};
use super::unit_columns::{label_first, take_trailing_units, units_after_sizes};
use super::{Answers, ChartError, ChartImport, ChartSize, MAX_SIZES};
use std::collections::BTreeMap;

/// Reads the grid into a size run.
pub(super) fn build(grid: &Grid, answers: &Answers) -> Result<ChartImport, ChartError> {
    let mut log = Log::new(answers);
    let mut global_unit = None;
    let mut table: Vec<Vec<String>> = Vec::new();
    let rows = regroup_single_column(grid, &mut log).unwrap_or_else(|| split_headers(grid));
    let widest = rows.iter().map(|r| r.cells.len()).max().unwrap_or(0);
    for row in &rows {
        let filled = row.cells.iter().filter(|c| !c.is_empty()).count();
        let numeric = row
            .cells
            .iter()
            .any(|c| matches!(parse_cell(c, grid.decimal_comma), Cell::Number(_)));
        // "Geometry 2027" above a wide table is a title, not a row with one value.
        let titled = filled == 2
            && widest >= 4
            && row.cells.first().is_some_and(|c| {
                let kind = classify(c).kind;
                !c.is_empty() && kind == Kind::Unknown
            });
        if (filled <= 1 && !numeric && !wheels_in_words(row)) || titled {
            let line = row.cells.join(" ");
            let short = shorten(line.trim());
            // A footnote says how one row was measured, not the chart's unit.
            let hint = (!is_footnote_line(&line))
                .then(|| unit_hint(&line))
                .flatten();
            if let Some(u) = hint {
                global_unit = Some(u);
                let name = u.words();
                log.note(
                    "",
                    format!("lengths without a unit read as {name}, as \"{short}\" says"),
                );
            } else {
                log.note("", format!("ignored a line of text: \"{short}\""));
            }
        } else {
            table.push(row.cells.clone());
        }
    }
    match table.len() {
        0 => return Err(ChartError::NotATable),
        1 => return Err(ChartError::OneRow),
        _ => {}
    }
    let width = table.iter().map(Vec::len).max().unwrap_or(0);
    if width > 4 * MAX_SIZES {
        return Err(ChartError::TooManySizes { count: width - 1 });
    }
    // Units are read in the table with sizes as columns: in a chart with sizes as rows a units
    // row (under or above the labels, or at the foot) becomes a units column once the table is
    // turned, and a units column on the right is the last measurement's unit and a hint.
    let across = runs_across(&table);
    if across {
        log.note(
            "",
            "the measurements run across the top, so each row was read as one size".into(),
        );
    }
    let ends = take_trailing_units(&mut table, grid.decimal_comma);
    let mut trailing = Vec::new();
    let mut hint = None;
    if across {
        hint = units_after_sizes(&ends, &mut log);
    } else if !ends.is_empty() {
        log.note(
            "",
            "read each row's unit from the units column on the right".into(),
        );
        trailing = ends;
    }
    repair_short_rows(&mut table);
    if across {
        table = turn(table, grid, &mut log)?;
        trailing = take_trailing_units(&mut table, grid.decimal_comma);
        if !trailing.is_empty() {
            log.note(
                "",
                "read each measurement's unit from the units row under the sizes".into(),
            );
        } else if hint.is_some() {
            // The unit written after each size's last value is at least that value's ("3,5 cm").
            trailing = vec![None; table.len()];
            if let Some(last) = trailing.last_mut() {
                *last = hint;
            }
        }
    }
    let (table, units_col) = label_first(table, across, &mut log)?;
    let header = find_header(&table);
    let value_count = table
        .iter()
        .enumerate()
        .filter(|(i, _)| Some(*i) != header)
        .map(|(_, r)| r.len().saturating_sub(1))
        .max()
        .unwrap_or(0);
    let header_cells: Vec<String> = header
        .and_then(|h| table.get(h))
        .map(|r| r.iter().skip(1).cloned().collect())
        .unwrap_or_default();
    if let Some(u) = header.and_then(|h| table.get(h)).and_then(|r| r.first()) {
        global_unit = classify(u).unit.or(global_unit);
    }
    let n = value_count.max(header_cells.len());
    if n == 0 {
        return Err(ChartError::NotATable);
    }
    if n > MAX_SIZES {
        return Err(ChartError::TooManySizes { count: n });
    }
    if header.is_none() {
        log.note(
            "",
            "no row of size names found; the sizes are numbered from the left".into(),
        );
    }
    let mut sizes = size_labels(&header_cells, n);
    let rows: Vec<TableRow> = table
        .iter()
        .enumerate()
        .filter(|(i, _)| Some(*i) != header)
        .map(|(i, r)| {
            let label = classify(r.first().map_or("", String::as_str));
            let unit = label
                .unit
                .or(units_col.get(i).copied().flatten())
                .or(trailing.get(i).copied().flatten());
            TableRow {
                label,
                unit,
                cells: r.iter().skip(1).cloned().collect(),
            }
        })
        .collect();
    // A short row of a chart with sizes as columns whose cells lost their places (single
    // spaces) does not say which sizes it skips: the person is asked.
    let read = super::rows::Reading {
        global: global_unit,
        hint,
        decimal_comma: grid.decimal_comma,
        short_rows_ask: !grid.placed && !across,
    };
    fill(&mut sizes, rows, read, &mut log);
    drop_empty_sizes(&mut sizes, &header_cells, &mut log);
    Ok(ChartImport {
        sizes,
        unrecognised: log.unrecognised,
        questions: log.questions,
        notes: log.notes,
    })
}

/// A column with no size name and no number in any row (say, labels repeated on the right)
/// is not a size, unless no size has numbers.
fn drop_empty_sizes(sizes: &mut Vec<ChartSize>, header: &[String], log: &mut Log) {
    let empty =
        |s: &ChartSize| s.frame.is_empty() && s.wheels.front.is_none() && s.wheels.rear.is_none();
    if sizes.iter().all(empty) {
        return;
    }
    let mut i = 0;
    sizes.retain(|s| {
        let unnamed = header.get(i).is_none_or(|h| h.trim().is_empty());
        i += 1;
        let keep = !(unnamed && empty(s));
        if !keep {
            log.note(
                "",
                format!("column {i} has no size name and no numbers, so it is not read as a size"),
            );
        }
        keep
    });
}

/// The row of size names: labelled "Size" (or blank), else an unlabelled first row.
fn find_header(table: &[Vec<String>]) -> Option<usize> {
    let values = |r: &Vec<String>| r.iter().skip(1).filter(|c| !c.is_empty()).count();
    let kinds: Vec<Kind> = table
        .iter()
        .map(|r| classify(r.first().map_or("", String::as_str)).kind)
        .collect();
    let sized = kinds
        .iter()
        .zip(table)
        .position(|(k, r)| *k == Kind::Size && values(r) > 0);
    if sized.is_some() {
        return sized;
    }
    let first_measure = kinds.iter().position(|k| k.is_measurement()).unwrap_or(0);
    let most = table
        .iter()
        .zip(&kinds)
        .filter(|(_, k)| k.is_measurement())
        .map(|(r, _)| values(r))
        .max()
        .unwrap_or(0);
    (0..first_measure).find(|&i| {
        kinds.get(i) == Some(&Kind::Unknown) && table.get(i).is_some_and(|r| values(r) >= most)
    })
}

/// Size names from the header cells; blanks and repeats get a number.
fn size_labels(cells: &[String], n: usize) -> Vec<ChartSize> {
    let mut out: Vec<ChartSize> = Vec::with_capacity(n);
    for i in 0..n {
        let raw = cells.get(i).map_or("", String::as_str);
        let mut label = strip_footnotes(raw)
            .split_whitespace()
            .collect::<Vec<_>>()
            .join(" ");
        if label.is_empty() {
            label = format!("Size {}", i + 1);
        }
        if out.iter().any(|s| s.label == label) {
            label = format!("{label} ({})", i + 1);
        }
        out.push(ChartSize {
            label,
            frame: BTreeMap::new(),
            tolerances: BTreeMap::new(),
            text: BTreeMap::new(),
            wheels: Default::default(),
        });
    }
    out
}
