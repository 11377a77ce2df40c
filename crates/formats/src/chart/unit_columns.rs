//! Units written beside the values rather than in each cell: a units column on the right, a
//! column of units after the sizes' values (sizes as rows), and a units column beside the labels
//! (a units row under or above them, once the table is turned), which [`label_first`] takes out
//! as it moves the label column first.
//!
//! **Invariant:** a column is read as units only when its cells are unit words or blanks in the
//! rows that name a measurement; the cells taken out are returned as each row's unit, never
//! dropped unread (a column of units that cannot be read is listed in `unrecognised`).

use super::cell::{parse_cell, strip_footnotes, Cell, Mark};
use super::log::{shorten, Log};
use super::orient::measurement;
use super::ChartError;

/// A units column on the right ("Reach  37,0  37,8  38,5  cm"): each row whose last cell is a
/// unit word (`cm`, `mm`, `in`, `°` …) after at least one number loses that cell, and the word
/// is the row's unit. Read as a column when at least two rows end so and they are at least
/// half of the rows with numbers; else nothing changes. The column's title ("Unit") in the
/// same place goes too. Returns each row's unit (by its place in `table`), or nothing.
pub(super) fn take_trailing_units(table: &mut [Vec<String>], decimal_comma: bool) -> Units {
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
pub(super) fn units_after_sizes(ends: &[Option<Mark>], log: &mut Log) -> Option<Mark> {
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

/// Each row's unit from a units column or row, by the row's place in the table (`None`: none).
pub(super) type Units = Vec<Option<Mark>>;

/// Moves the label column first (dropping row-number columns before it) and takes out a
/// units column after it, or just before it. Returns the table and each row's unit from that
/// column. `across`: the table was turned, so the column was a units row under (or above) the
/// measurements' labels.
pub(super) fn label_first(
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
