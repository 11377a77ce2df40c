//! The table's shape: text lines out, short rows repaired, sizes as columns or rows, the label
//! column, a units column (or, with sizes as rows, a units row), the size row. The values
//! themselves are read in `rows`.

use super::cell::{is_footnote_line, is_value_token, parse_cell, strip_footnotes, Cell, Mark};
use super::grid::{is_size_token, Grid, Row, Sep};
use super::label::{classify, Kind};
use super::log::{shorten, Log};
use super::rows::{fill, place_short, Short, TableRow};
use super::segment::{split_header, split_units_row};
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

/// A line of one cell that names the wheels and gives some ("Wheel 650b 650b 700c"): a row
/// whose cells single spaces joined to its label (read by `rows`), not a line of text.
fn wheels_in_words(row: &Row) -> bool {
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
fn regroup_single_column(grid: &Grid, log: &mut Log) -> Option<Vec<Row>> {
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

/// Space-separated text: a line of labels with single spaces ("Size Reach Stack HTA") is split
/// into as many labels as the data rows have cells; then, when the sizes are rows, a units row
/// with single spaces ("cm cm deg mm") with one unit per measurement gets a cell per unit.
fn split_headers(grid: &Grid) -> Vec<Row> {
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
fn unit_hint(line: &str) -> Option<Mark> {
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

/// A units column on the right ("Reach  37,0  37,8  38,5  cm"): each row whose last cell is a
/// unit word (`cm`, `mm`, `in`, `°` …) after at least one number loses that cell, and the word
/// is the row's unit. Read as a column when at least two rows end so and they are at least
/// half of the rows with numbers; else nothing changes. The column's title ("Unit") in the
/// same place goes too. Returns each row's unit (by its place in `table`), or nothing.
fn take_trailing_units(table: &mut [Vec<String>], decimal_comma: bool) -> Units {
    let number = |c: &String| matches!(parse_cell(c, decimal_comma), Cell::Number(_));
    let unit_at_end = |r: &Vec<String>| -> Option<(usize, Mark)> {
        let (i, last) = r
            .iter()
            .enumerate()
            .rev()
            .find(|(_, c)| !c.trim().is_empty())?;
        let mark = Mark::from_word(last)?;
        r.iter().take(i).any(number).then_some((i, mark))
    };
    let ended = table.iter().filter(|r| unit_at_end(r).is_some()).count();
    let with_numbers = table.iter().filter(|r| r.iter().any(number)).count();
    if ended < 2 || ended * 2 < with_numbers {
        return Vec::new();
    }
    let at = table.iter().find_map(&unit_at_end).map(|(i, _)| i);
    table
        .iter_mut()
        .map(|r| {
            let Some((i, mark)) = unit_at_end(r) else {
                if at.is_some_and(|i| i + 1 == r.len() && r.get(i).is_some_and(|c| units_title(c)))
                {
                    r.truncate(r.len() - 1);
                }
                return None;
            };
            r.truncate(i);
            Some(mark)
        })
        .collect()
}

/// The title of a units column or row ("Unit", "Units").
fn units_title(cell: &str) -> bool {
    let t = cell.trim().trim_end_matches(['.', ':']).to_lowercase();
    matches!(t.as_str(), "unit" | "units")
}

/// A column of units after the values of a chart with sizes as rows (each size's row ends in
/// "cm", taken off by [`take_trailing_units`]). With sizes as rows each column is one
/// measurement, so it is surely the last column's unit only. When it says the same length unit
/// for every size that has one, and for at least two, that unit is returned: the caller gives it
/// to the last column and, as a hint, to lengths without a unit whose numbers fit more than one
/// unit (it never overrides the size of the numbers), with a note; otherwise it is listed in
/// `unrecognised` with a note saying where units can go.
fn units_after_sizes(ends: &[Option<Mark>], log: &mut Log) -> Option<Mark> {
    let marks: Vec<Mark> = ends.iter().flatten().copied().collect();
    let first = *marks.first()?;
    if first != Mark::Deg && marks.len() >= 2 && marks.iter().all(|m| *m == first) {
        log.note(
            "",
            format!(
                "each size's row ends in {}: read as the unit of the last column and, where their numbers fit it, of the other lengths without a unit",
                first.name()
            ),
        );
        return Some(first);
    }
    let mut names: Vec<&str> = Vec::new();
    for m in &marks {
        if !names.contains(&m.name()) {
            names.push(m.name());
        }
    }
    let names = names.join(", ");
    log.note(
        "",
        format!(
            "a column of units ({names}) after the sizes' values was not read: with the sizes as rows each column is one measurement, so its unit goes in its label (\"Reach (mm)\") or in a units row under the labels"
        ),
    );
    log.unrecognised
        .push(format!("(a column of units: {names})"));
    None
}

/// A row one cell short whose first cell is a size name or a number, or whose cells are all
/// units, lacks its (blank) label.
fn repair_short_rows(table: &mut [Vec<String>]) {
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

fn measurement(cell: &str) -> bool {
    classify(cell).kind.is_measurement()
}

/// Whether the sizes run down the side (the measurements' labels across the top): more
/// labels in one of the first rows than in any of the first three columns.
fn runs_across(table: &[Vec<String>]) -> bool {
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
fn turn(
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

type Units = Vec<Option<Mark>>;

/// Moves the label column first (dropping row-number columns before it) and takes out a
/// units column after it, or just before it. Returns the table and each row's unit from that
/// column. `across`: the table was turned, so the column was a units row under (or above) the
/// measurements' labels.
fn label_first(
    table: Vec<Vec<String>>,
    across: bool,
    log: &mut Log,
) -> Result<(Vec<Vec<String>>, Units), ChartError> {
    let scores: Vec<usize> = (0..3)
        .map(|c| {
            table
                .iter()
                .filter(|r| r.get(c).is_some_and(|s| measurement(s)))
                .count()
        })
        .collect();
    let best = scores.iter().copied().max().unwrap_or(0);
    let label_col = scores.iter().position(|s| *s == best).unwrap_or(0);
    if best == 0 {
        let mut labels: Vec<String> = Vec::new();
        for r in &table {
            let first = r.iter().find(|c| !c.is_empty());
            let l = strip_footnotes(first.map_or("", String::as_str));
            if !l.is_empty() && !labels.contains(&l) {
                labels.push(shorten(&l));
            }
        }
        return Err(ChartError::NothingRecognised { labels });
    }
    // A units column just before the labels (a units row above them, once turned).
    let before = label_col
        .checked_sub(1)
        .filter(|c| units_at(&table, label_col, *c));
    let ignored = label_col - usize::from(before.is_some());
    if ignored > 0 {
        log.note(
            "",
            format!(
                "ignored {ignored} column(s) before the labels (row numbers or drawing references)"
            ),
        );
    }
    let before: Units = before.map_or_else(Vec::new, |c| {
        log.note("", units_said(across, "above"));
        table.iter().map(|r| unit_at(r, c)).collect()
    });
    let mut table: Vec<Vec<String>> = table
        .into_iter()
        .map(|r| r.into_iter().skip(label_col).collect())
        .collect();
    if !units_at(&table, 0, 1) {
        return Ok((table, before));
    }
    log.note("", units_said(across, "under"));
    let units = table
        .iter()
        .enumerate()
        .map(|(i, r)| unit_at(r, 1).or(before.get(i).copied().flatten()))
        .collect();
    // A row as wide as the table has a cell in the units column (its title, "Unit"); a
    // shorter row without a unit there (the size names "GEOMETRY  XS  S  M") has none.
    let width = table.iter().map(Vec::len).max().unwrap_or(0);
    for r in &mut table {
        let in_column = r.len() == width
            || r.get(1)
                .is_some_and(|c| c.is_empty() || Mark::from_word(c).is_some());
        if r.len() > 1 && in_column {
            r.remove(1);
        }
    }
    Ok((table, units))
}

fn unit_at(r: &[String], col: usize) -> Option<Mark> {
    r.get(col).and_then(|c| Mark::from_word(c))
}

/// Whether column `col` holds units: a unit word in some row, and only unit words or blanks
/// in the rows whose label (in column `label`) names a measurement.
fn units_at(table: &[Vec<String>], label: usize, col: usize) -> bool {
    table.iter().any(|r| unit_at(r, col).is_some())
        && table
            .iter()
            .filter(|r| measurement(r.get(label).map_or("", String::as_str)))
            .all(|r| {
                r.get(col)
                    .is_none_or(|c| c.is_empty() || Mark::from_word(c).is_some())
            })
}

/// The note that says where the units were read: a column beside the labels, or (the table
/// turned) a units row `place` ("under", "above") the measurements' labels.
fn units_said(across: bool, place: &str) -> String {
    if across {
        format!("read each measurement's unit from the units row {place} the labels")
    } else {
        "read each row's unit from the units column".into()
    }
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
