//! Text aligned with runs of spaces (a PDF copy): the columns its cells stand in.
//!
//! A line is first split at runs of two or more spaces (`grid::split_spaces`). What a single
//! space hides is then read from the columns:
//! - two cells parted by one space read as one (`27.5" / 29" 29"` in a narrow column, or
//!   `Wheel size 27.5" / 29"` after its label): [`place`] cuts a run of words where a word
//!   stands under another column than the words before it, when every part then reads as a cell
//!   (a number, a size name, a unit, a wheel size; words of the line's first run that stand
//!   under no column are its label). Words under no column stay with the words before them.
//! - a units row without a label (`      mm     mm     °`) loses its blank cells: [`place`] puts
//!   each unit in the cell of the column it stands in.
//! - a blank cell between values leaves a wider gap: `blanks::align_values` puts an empty cell
//!   there.
//!
//! The columns are the character spans of the one-word cells after each line's first cell (size
//! names, numbers, units, one-word labels) on the lines with a run of spaces, merged where they
//! overlap. When two one-word cells of one line fall in one column the text is not aligned, and
//! [`place`] moves nothing.

use super::cell::{is_value_token, Mark};
use super::grid::{is_size_token, split_spaces, Row};
use super::wheels::parse_wheel_cell;

/// A span of character columns `[start, end)` in a line.
pub(super) type Span = (usize, usize);

/// The character columns of each cell of a line, found left to right (a cell's text stands in
/// the line as written); `None` when a cell cannot be found.
pub(super) fn cell_spans(line: &str, cells: &[String]) -> Option<Vec<Span>> {
    // Character columns counted as the search moves on: one pass over the line.
    let (mut from, mut col) = (0, 0);
    let mut out = Vec::with_capacity(cells.len());
    for c in cells {
        let at = from + line.get(from..)?.find(c.as_str())?;
        let start = col + line.get(from..at)?.chars().count();
        col = start + c.chars().count();
        from = at + c.len();
        out.push((start, col));
    }
    Some(out)
}

/// The spans of all lines merged where they overlap, in order. Each line's spans are in order
/// (its cells left to right), so each is merged into the columns so far in one pass: no sort
/// routine in the module, and hostile text with thousands of cells stays quick.
pub(super) fn merge<'a>(lines: impl Iterator<Item = &'a [Span]>) -> Vec<Span> {
    let mut columns: Vec<Span> = Vec::new();
    for spans in lines {
        let mut merged: Vec<Span> = Vec::with_capacity(columns.len() + spans.len());
        let (mut a, mut b) = (columns.iter().peekable(), spans.iter().peekable());
        loop {
            let next = match (a.peek(), b.peek()) {
                (Some(x), Some(y)) if x <= y => a.next(),
                (_, Some(_)) => b.next(),
                (Some(_), None) => a.next(),
                (None, None) => break,
            };
            let Some(&s) = next else { break };
            match merged.last_mut() {
                Some(c) if s.0 < c.1 => c.1 = c.1.max(s.1),
                _ => merged.push(s),
            }
        }
        columns = merged;
    }
    columns
}

/// The first column a span shares a character column with. The columns are in order and
/// apart, so a binary search finds it.
pub(super) fn column_over(columns: &[Span], s: Span) -> Option<usize> {
    let i = columns.partition_point(|c| c.1 <= s.0);
    columns.get(i).filter(|c| c.0 < s.1).map(|_| i)
}

/// The column that holds a span whole.
pub(super) fn column_holding(columns: &[Span], s: Span) -> Option<usize> {
    let i = columns.partition_point(|c| c.1 <= s.0);
    columns
        .get(i)
        .filter(|c| c.0 <= s.0 && s.1 <= c.1)
        .map(|_| i)
}

/// The columns of the aligned lines (none when two one-word cells of a line share one), and
/// whether a line fills each of them with a one-word cell after its first cell: then a line's
/// cell `i + 1` stands in column `i`.
fn columns(lines: &[String], rows: &[Row]) -> (Vec<Span>, bool) {
    // Per aligned line: the spans of its one-word cells after the first, and whether every
    // cell after the first is one.
    let mut lined: Vec<(Vec<Span>, bool)> = Vec::new();
    for (line, row) in lines.iter().zip(rows) {
        if !line.contains("  ") {
            continue;
        }
        let Some(spans) = cell_spans(line, &row.cells) else {
            continue;
        };
        let one_word = |c: &String| !c.is_empty() && !c.contains(char::is_whitespace);
        let clean: Vec<Span> = row
            .cells
            .iter()
            .zip(spans)
            .skip(1)
            .filter(|(c, _)| one_word(c))
            .map(|(_, s)| s)
            .collect();
        let all = row.cells.iter().skip(1).all(one_word);
        lined.push((clean, all));
    }
    let columns = merge(lined.iter().map(|(s, _)| s.as_slice()));
    let mut full = false;
    for (clean, all) in &lined {
        let cols: Option<Vec<usize>> = clean.iter().map(|s| column_holding(&columns, *s)).collect();
        let Some(cols) = cols else {
            return (Vec::new(), false);
        };
        if cols.windows(2).any(|w| matches!(w, [a, b] if a >= b)) {
            return (Vec::new(), false);
        }
        full |= *all && cols.len() == columns.len();
    }
    (columns, full)
}

/// Cuts the cells that single spaces joined and places the units of a units row (module docs).
pub(super) fn place(lines: &[String], rows: &mut [Row]) {
    let (columns, full) = columns(lines, rows);
    if columns.len() < 2 {
        return;
    }
    // Every line: one written with single spaces only is cut at the others' columns too.
    for (line, row) in lines.iter().zip(rows.iter_mut()) {
        if let Some(cut) = cut_line(line, &columns) {
            let mut cells = split_spaces(&cut);
            while cells.last().is_some_and(|c| c.is_empty()) {
                cells.pop();
            }
            row.cells = cells;
        }
        if full {
            place_units(line, row, &columns);
        }
    }
}

/// A word of a line: its character columns and its bytes.
#[derive(Clone, Copy)]
struct Word {
    cols: Span,
    bytes: (usize, usize),
}

/// The words of a line, split at spaces.
fn words(line: &str) -> Vec<Word> {
    let mut out = Vec::new();
    let mut start: Option<(usize, usize)> = None;
    let mut end = (0, 0);
    for (col, (byte, ch)) in line.char_indices().enumerate() {
        end = (col + 1, byte + ch.len_utf8());
        match (ch.is_whitespace(), start) {
            (true, Some((c0, b0))) => {
                out.push(Word {
                    cols: (c0, col),
                    bytes: (b0, byte),
                });
                start = None;
            }
            (false, None) => start = Some((col, byte)),
            _ => {}
        }
    }
    if let Some((c0, b0)) = start {
        out.push(Word {
            cols: (c0, end.0),
            bytes: (b0, end.1),
        });
    }
    out
}

/// The line with a second space where a cell starts after a single space, or `None` when no
/// run needs a cut.
fn cut_line(line: &str, columns: &[Span]) -> Option<String> {
    // Runs: words parted by single spaces.
    let mut runs: Vec<Vec<Word>> = Vec::new();
    for w in words(line) {
        let run = runs
            .last_mut()
            .filter(|r| r.last().is_some_and(|p| w.cols.0 <= p.cols.1 + 1));
        match run {
            Some(run) => run.push(w),
            None => runs.push(vec![w]),
        }
    }
    let cuts: Vec<usize> = runs
        .iter()
        .enumerate()
        .flat_map(|(i, run)| run_cuts(line, run, i == 0, columns))
        .collect();
    if cuts.is_empty() {
        return None;
    }
    let mut out = line.to_string();
    for at in cuts.into_iter().rev() {
        out.insert(at, ' ');
    }
    Some(out)
}

/// Where one run of words is cut (byte offsets of the words that start a cell): where a word
/// stands under another column than the words before it, when every part reads as a cell.
/// In the line's first run the words before the first column are the label.
fn run_cuts(line: &str, run: &[Word], first: bool, columns: &[Span]) -> Vec<usize> {
    let text = |a: &Word, b: &Word| line.get(a.bytes.0..b.bytes.1).unwrap_or("");
    // A unit after a number belongs to it ("64.5 °"), as `grid::split_spaces` reads it.
    let mut tokens: Vec<Word> = Vec::new();
    for w in run {
        let unit = text(w, w) != "in" && Mark::from_word(text(w, w)).is_some();
        match tokens.last_mut() {
            Some(prev) if unit && is_value_token(text(prev, prev)) => {
                prev.cols.1 = w.cols.1;
                prev.bytes.1 = w.bytes.1;
            }
            _ => tokens.push(*w),
        }
    }
    // Groups: the index of their first token and their column.
    let mut groups: Vec<(usize, Option<usize>)> = vec![(0, None)];
    for (i, t) in tokens.iter().enumerate() {
        let Some(c) = column_over(columns, t.cols) else {
            continue;
        };
        match groups.last_mut() {
            Some((_, None)) if first && i > 0 => groups.push((i, Some(c))),
            Some((_, g @ None)) => *g = Some(c),
            Some((_, Some(g))) if *g < c => groups.push((i, Some(c))),
            Some((_, Some(g))) if *g > c => return Vec::new(), // out of order: not aligned
            _ => {}
        }
    }
    if groups.len() < 2 {
        return Vec::new();
    }
    let reads = groups.iter().enumerate().all(|(k, (at, col))| {
        let end = groups.get(k + 1).map_or(tokens.len(), |g| g.0);
        let (Some(a), Some(b)) = (tokens.get(*at), tokens.get(end.saturating_sub(1))) else {
            return false;
        };
        (k == 0 && col.is_none()) || reads_as_cell(text(a, b))
    });
    if !reads {
        return Vec::new();
    }
    groups
        .iter()
        .skip(1)
        .filter_map(|(at, _)| tokens.get(*at).map(|t| t.bytes.0))
        .collect()
}

/// A number, a size name, a unit or a wheel size.
fn reads_as_cell(text: &str) -> bool {
    is_value_token(text)
        || is_size_token(text)
        || Mark::from_word(text).is_some()
        || parse_wheel_cell(text).is_some()
}

/// A units row without a label (every cell a unit): each unit in the cell of its column, blank
/// cells between, a blank label first. Left as it is when a unit stands under no column.
fn place_units(line: &str, row: &mut Row, columns: &[Span]) {
    if row.cells.is_empty() || !row.cells.iter().all(|c| Mark::from_word(c).is_some()) {
        return;
    }
    let Some(spans) = cell_spans(line, &row.cells) else {
        return;
    };
    let mut out = vec![String::new(); columns.len() + 1];
    let mut last = None;
    for (cell, s) in row.cells.iter().zip(spans) {
        let Some(col) = column_over(columns, s) else {
            return;
        };
        if last.is_some_and(|l| col <= l) {
            return;
        }
        last = Some(col);
        if let Some(slot) = out.get_mut(col + 1) {
            slot.clone_from(cell);
        }
    }
    while out.last().is_some_and(String::is_empty) {
        out.pop();
    }
    row.cells = out;
}

#[cfg(test)]
mod tests {
    use super::super::grid::grid;

    #[test]
    fn cells_parted_by_one_space_are_cut_at_the_columns() {
        let g = grid(
            "Size       S           M           L\n\
             Wheel size 27.5\"       27.5\" / 29\" 29\"\n\
             Reach      430         455         480",
        );
        assert_eq!(
            g.rows[1].cells,
            ["Wheel size", "27.5\"", "27.5\" / 29\"", "29\""]
        );
        // A line of single spaces only, its label one space before the first cell.
        let g = grid(
            "Size   49        52\n\
             Wheels 700 x 28c 700 x 32c\n\
             Reach  372       380",
        );
        assert_eq!(g.rows[1].cells, ["Wheels", "700 x 28c", "700 x 32c"]);
    }

    #[test]
    fn a_cut_must_leave_cells() {
        // "size" stands under the first column: the label reaches into it, and "size 29\"" is
        // no cell, so the line is read as before.
        let g = grid(
            "Size   S      M      L\n\
             Reach  430    455    480\n\
             Wheel size 29\" 29\" 27.5\" / 29\"",
        );
        assert_eq!(g.rows[2].cells, ["Wheel size 29\" 29\" 27.5\" /", "29\""]);
        // A label's words under a column are no cells either.
        let g = grid("Size    S     M\nReach   430   455\nSeat tube angle 74 74");
        assert_eq!(g.rows[2].cells, ["Seat tube angle", "74", "74"]);
    }

    #[test]
    fn a_units_row_keeps_its_units_in_their_columns() {
        let lines = [
            "Size   Wheel   Reach   Stack   Head angle",
            "               cm      cm      °",
            "S      29\"     43,0    60,5    66",
            "M      29\"     45,5    61,5    66",
        ];
        let g = grid(&lines.join("\n"));
        assert_eq!(g.rows[1].cells, ["", "", "cm", "cm", "°"]);
        // Single spaces between the units: cut, then placed.
        let lines = [
            "Size Reach Stack HA",
            "     cm    cm    °",
            "S    43,0  60,5  66",
            "M    45,5  61,5  66",
        ];
        let g = grid(&lines.join("\n"));
        assert_eq!(g.rows[1].cells, ["", "cm", "cm", "°"]);
        let lines = [
            "Size Reach Stack HA",
            "     cm cm   °",
            "S    43 60,5 66",
            "M    45 61,5 66",
        ];
        let g = grid(&lines.join("\n"));
        assert_eq!(g.rows[1].cells, ["", "cm", "cm", "°"]);
    }
}
