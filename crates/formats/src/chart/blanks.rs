//! Blank cells in a table aligned with runs of spaces (a PDF copy).
//!
//! A blank cell leaves a wider gap, not an empty cell: "Stack  610         640" under
//! "S  M  L" would read as S 610, M 640. When every line with values is aligned and its cells
//! fall into columns that no two cells of one line share, [`align_values`] puts an empty cell
//! in each column a line skips, so each value stays under its own size.
//!
//! Which cells are placed by column: a line's cells from its first number on (text among them
//! too, such as a trailing units cell, `Reach  455  470  mm`), and before it any cell after
//! the first that stands under a column of numbers (a wheel named `MX` where the other sizes
//! give `29"`). The cells before them are the line's label, kept as written. A line with
//! values written with single spaces only is taken as it is, or cut at every space, when that
//! gives one cell per column, each a number under a column of numbers or a word under a column
//! of words (`27.5" M 450 610` under `27.5"   S   425   600`); else nothing is placed.

use super::aligned::{cell_spans, column_holding, column_over, merge, Span};
use super::cell::is_value_token;
use super::grid::{join_units, Row};

/// A line with values written with runs of spaces.
struct Aligned {
    /// Its row's index.
    row: usize,
    /// The character columns of each of its cells.
    spans: Vec<Span>,
    /// The index of its first cell placed by column (the cells before are its label).
    start: usize,
}

impl Aligned {
    /// The spans of its placed cells.
    fn placed(&self) -> &[Span] {
        self.spans.get(self.start..).unwrap_or_default()
    }
}

/// What a column holds: numbers, words, or both.
#[derive(Clone, Copy, Default)]
struct Held {
    numbers: bool,
    words: bool,
}

impl Held {
    /// Whether a cell of this kind may stand in the column.
    fn takes(self, cell: &str) -> bool {
        if is_value_token(cell) {
            self.numbers
        } else {
            self.words && !cell.is_empty()
        }
    }
}

/// Puts an empty cell where a line of an aligned table skips a column (module docs). Returns
/// whether the lines are aligned (then every cell's place is known); when they are not,
/// nothing changes.
pub(super) fn align_values(lines: &[String], rows: &mut [Row]) -> bool {
    let Some((mut aligned, single)) = read_lines(lines, rows) else {
        return false;
    };
    extend_starts(&mut aligned, rows);
    let columns = merge(aligned.iter().map(Aligned::placed));
    let Some(placed) = place_all(&aligned, &columns) else {
        return false;
    };
    // The label's length on the lines that fill every column.
    let full: Vec<usize> = aligned
        .iter()
        .zip(&placed)
        .filter(|(_, cols)| cols.len() == columns.len())
        .map(|(a, _)| a.start)
        .collect();
    let Some(&prefix) = full.first() else {
        return false; // no line fills every column
    };
    if !single.is_empty() {
        if full.iter().any(|p| *p != prefix) {
            return false;
        }
        let held = held(&aligned, &placed, rows, columns.len());
        for &i in &single {
            let (Some(line), Some(row)) = (lines.get(i), rows.get_mut(i)) else {
                return false;
            };
            if !fit_single(line, row, prefix, &held) {
                return false;
            }
        }
    }
    for (a, cols) in aligned.iter().zip(&placed) {
        if let Some(row) = rows.get_mut(a.row) {
            put_in_columns(row, a.start, cols);
        }
    }
    true
}

/// The lines with values: those written with runs of spaces, with their cells' spans and
/// first number, and the indices of those written with single spaces only. `None` when a
/// cell cannot be found in its line.
fn read_lines(lines: &[String], rows: &[Row]) -> Option<(Vec<Aligned>, Vec<usize>)> {
    let mut aligned = Vec::new();
    let mut single = Vec::new();
    for (i, (line, row)) in lines.iter().zip(rows).enumerate() {
        let Some(first) = row.cells.iter().position(|c| is_value_token(c)) else {
            continue;
        };
        if !line.contains("  ") {
            single.push(i);
            continue;
        }
        let spans = cell_spans(line, &row.cells)?;
        aligned.push(Aligned {
            row: i,
            spans,
            start: first,
        });
    }
    Some((aligned, single))
}

/// Moves each line's start back over the words after its first cell that stand under a
/// column of numbers (of the other lines): they are cells, not part of the label.
fn extend_starts(aligned: &mut [Aligned], rows: &[Row]) {
    let numbers: Vec<Vec<Span>> = aligned
        .iter()
        .map(|a| {
            let cells = rows.get(a.row).map_or(&[][..], |r| r.cells.as_slice());
            cells
                .iter()
                .zip(&a.spans)
                .skip(a.start)
                .filter(|(c, _)| is_value_token(c))
                .map(|(_, s)| *s)
                .collect()
        })
        .collect();
    let columns = merge(numbers.iter().map(Vec::as_slice));
    for a in aligned.iter_mut() {
        let cells = rows.get(a.row).map_or(&[][..], |r| r.cells.as_slice());
        while a.start > 1 {
            let before = a.start - 1;
            let under = a
                .spans
                .get(before)
                .and_then(|s| column_over(&columns, *s))
                .is_some();
            if !under || cells.get(before).is_none_or(String::is_empty) {
                break;
            }
            a.start = before;
        }
    }
}

/// The column of each placed cell of each line; `None` when a cell stands in no column or two
/// cells of one line share one (the text is not aligned).
fn place_all(aligned: &[Aligned], columns: &[Span]) -> Option<Vec<Vec<usize>>> {
    aligned
        .iter()
        .map(|a| {
            let cols: Vec<usize> = a
                .placed()
                .iter()
                .map(|s| column_holding(columns, *s))
                .collect::<Option<_>>()?;
            let ordered = cols.windows(2).all(|w| matches!(w, [a, b] if a < b));
            ordered.then_some(cols)
        })
        .collect()
}

/// What each column holds on the aligned lines.
fn held(aligned: &[Aligned], placed: &[Vec<usize>], rows: &[Row], n: usize) -> Vec<Held> {
    let mut held = vec![Held::default(); n];
    for (a, cols) in aligned.iter().zip(placed) {
        let cells = rows.get(a.row).map_or(&[][..], |r| r.cells.as_slice());
        for (cell, col) in cells.iter().skip(a.start).zip(cols) {
            if let Some(h) = held.get_mut(*col) {
                if is_value_token(cell) {
                    h.numbers = true;
                } else {
                    h.words = true;
                }
            }
        }
    }
    held
}

/// A line with values written with single spaces: its cells as split, or else its words (a
/// unit joined to the number before it), when they are a label of `prefix` words-cells
/// followed by one cell per column, each of the kind its column holds. Returns whether one
/// fits (then the row has it).
fn fit_single(line: &str, row: &mut Row, prefix: usize, held: &[Held]) -> bool {
    let fits = |cells: &[String]| {
        cells.len() == prefix + held.len()
            && cells
                .iter()
                .take(prefix)
                .all(|c| !c.is_empty() && !is_value_token(c))
            && cells.iter().skip(prefix).zip(held).all(|(c, h)| h.takes(c))
    };
    if fits(&row.cells) {
        return true;
    }
    let words = join_units(line.trim());
    if fits(&words) {
        row.cells = words;
        return true;
    }
    false
}

/// The row's cells from `start` put in their columns, an empty cell in each column skipped
/// (none after the last cell).
fn put_in_columns(row: &mut Row, start: usize, cols: &[usize]) {
    if cols.iter().enumerate().all(|(i, c)| i == *c) {
        return; // no gap before its last cell
    }
    let cells: Vec<String> = row.cells.split_off(start.min(row.cells.len()));
    let last = cols.last().copied().unwrap_or(0);
    let mut out = vec![String::new(); last + 1];
    for (v, c) in cells.into_iter().zip(cols) {
        if let Some(slot) = out.get_mut(*c) {
            *slot = v;
        }
    }
    row.cells.extend(out);
}

#[cfg(test)]
mod tests {
    use super::super::grid::grid;

    #[test]
    fn a_blank_cell_in_an_aligned_table_stays_under_its_size() {
        let g = grid(
            "Size        S      M      L\n\
             Reach       430    455    480\n\
             Stack       610           640\n\
             Chainstay          435    440\n\
             Wheelbase   1180   1204",
        );
        assert!(g.placed);
        assert_eq!(g.rows[2].cells, vec!["Stack", "610", "", "640"]);
        assert_eq!(g.rows[3].cells, vec!["Chainstay", "", "435", "440"]);
        // A trailing blank needs no place holder: the row is read from the left.
        assert_eq!(g.rows[4].cells, vec!["Wheelbase", "1180", "1204"]);
        assert_eq!(g.rows[0].cells, vec!["Size", "S", "M", "L"]);
    }

    #[test]
    fn right_aligned_numbers_keep_their_columns() {
        let g = grid("Head tube     95    105\nWheelbase   1150   1177\nTrail              118");
        assert_eq!(g.rows[2].cells, vec!["Trail", "", "118"]);
    }

    #[test]
    fn single_spaces_or_ragged_columns_are_left_as_they_are() {
        // Single spaces: no alignment to go by.
        let g = grid("Reach 430 455 480\nStack 610 640");
        assert!(!g.placed);
        assert_eq!(g.rows[1].cells, vec!["Stack", "610", "640"]);
        // Two values of one line under one column of the others: not aligned.
        let g = grid("Reach      430      455\nStack  610  640");
        assert!(!g.placed);
        assert_eq!(g.rows[1].cells, vec!["Stack", "610", "640"]);
    }

    #[test]
    fn a_trailing_units_cell_stands_in_its_column() {
        let g = grid(
            "Size     S     M     L\n\
             Reach    430   455   480   mm\n\
             Stack    610         640   mm\n\
             Trail    118   118         mm",
        );
        assert!(g.placed);
        assert_eq!(g.rows[2].cells, ["Stack", "610", "", "640", "mm"]);
        assert_eq!(g.rows[3].cells, ["Trail", "118", "118", "", "mm"]);
    }

    #[test]
    fn a_word_under_a_column_of_numbers_is_a_cell_not_the_label() {
        let g = grid(
            "Size  Wheel  Reach  Stack\n\
             S     27.5\"  425    600\n\
             M     MX     450    610\n\
             L     29\"    475",
        );
        assert!(g.placed);
        assert_eq!(g.rows[2].cells, ["M", "MX", "450", "610"]);
        assert_eq!(g.rows[3].cells, ["L", "29\"", "475"]);
    }

    #[test]
    fn a_single_spaced_line_is_cut_into_the_columns_kinds() {
        let g = grid(
            "Wheel   Size   Reach   Stack\n\
             27.5\"   S      425     600\n\
             27.5\" M 450 610\n\
             29\"     L              620",
        );
        assert!(g.placed);
        assert_eq!(g.rows[2].cells, ["27.5\"", "M", "450", "610"]);
        assert_eq!(g.rows[3].cells, ["29\"", "L", "", "620"]);
        // Words where the columns hold numbers: not cut, and nothing is placed.
        let g = grid(
            "Size   Reach   Stack\n\
             S      425     600\n\
             Extra long label 450",
        );
        assert!(!g.placed);
    }
}
