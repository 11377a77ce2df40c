//! Pasted text → rows of cells.
//!
//! The separator is chosen from the text: tabs (a web table or spreadsheet copy), semicolons
//! (European CSV), pipes (text tables), commas (CSV, with quotes), or runs of spaces (a PDF
//! copy; the columns of its lines then mend what single spaces hide, `aligned`). Commas that
//! only ever sit between digits with one or two digits after them are decimal commas, not
//! separators. Lines of dashes or equals signs are dropped.

use super::cell::{is_value_token, Mark};
use super::MAX_SIZES;
use super::{aligned, blanks};

/// The separator found in the text.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Sep {
    /// Tab.
    Tab,
    /// Semicolon.
    Semicolon,
    /// Pipe (`|`).
    Pipe,
    /// Comma.
    Comma,
    /// Runs of spaces or single spaces.
    Spaces,
}

/// One line of the table.
#[derive(Debug, Clone, PartialEq)]
pub struct Row {
    /// Its cells, trimmed; trailing empty cells removed.
    pub cells: Vec<String>,
}

/// The text split into rows.
#[derive(Debug, Clone, PartialEq)]
pub struct Grid {
    /// Non-blank lines as rows.
    pub rows: Vec<Row>,
    /// The separator used.
    pub sep: Sep,
    /// Whether the chart writes decimal commas (then `1.180` reads as 1180).
    pub decimal_comma: bool,
    /// Whether each cell's place in its line is known: a separator marks every cell, or the
    /// values stand in aligned columns. Single spaces or ragged columns lose a blank cell's
    /// place, so a row with fewer values than sizes does not say which sizes it skips.
    pub placed: bool,
}

/// Splits the text. `lines` are the cleaned, non-blank lines.
pub fn split(lines: &[String]) -> Grid {
    let sep = choose_sep(lines);
    let rows: Vec<Row> = lines
        .iter()
        .map(|l| {
            let mut cells = match sep {
                Sep::Tab => split_quoted(l, '\t'),
                Sep::Semicolon => split_quoted(l, ';'),
                Sep::Comma => split_quoted(l, ','),
                Sep::Pipe => split_pipe(l),
                Sep::Spaces => split_spaces(l),
            };
            while cells.last().is_some_and(|c| c.is_empty()) {
                cells.pop();
            }
            Row { cells }
        })
        .collect();
    let mut rows = rows;
    // A row wider than any chart's is refused later (too many sizes): its columns need no
    // reading, and hostile text of thousands of cells stays quick.
    let chart_wide = rows.iter().all(|r| r.cells.len() <= 4 * MAX_SIZES + 4);
    let spaces = sep == Sep::Spaces && chart_wide;
    if spaces {
        aligned::place(lines, &mut rows);
    }
    let placed = sep != Sep::Spaces || (spaces && blanks::align_values(lines, &mut rows));
    let decimal_comma = rows
        .iter()
        .flat_map(|r| r.cells.iter())
        .any(|c| has_decimal_comma(c));
    Grid {
        rows,
        sep,
        decimal_comma,
        placed,
    }
}

/// Whether a line is decoration: only dashes, equals, underscores, pipes, colons, plus signs.
pub fn is_rule_line(line: &str) -> bool {
    line.chars()
        .all(|c| matches!(c, '-' | '=' | '_' | '|' | ':' | '+' | '—' | '–') || c.is_whitespace())
}

fn count_lines(lines: &[String], c: char) -> usize {
    lines.iter().filter(|l| l.contains(c)).count()
}

fn choose_sep(lines: &[String]) -> Sep {
    let half = lines.len().div_ceil(2).max(1);
    if count_lines(lines, '\t') >= half {
        return Sep::Tab;
    }
    if count_lines(lines, ';') >= half {
        return Sep::Semicolon;
    }
    if count_lines(lines, '|') >= half {
        return Sep::Pipe;
    }
    let comma_lines: Vec<&String> = lines.iter().filter(|l| l.contains(',')).collect();
    if comma_lines.len() >= half {
        let decimal_only = comma_lines.iter().filter(|l| all_commas_decimal(l)).count();
        if decimal_only * 5 < comma_lines.len() * 4 {
            return Sep::Comma;
        }
    }
    Sep::Spaces
}

/// Every comma has a digit before it and one or two digits (then no digit) after it.
fn all_commas_decimal(line: &str) -> bool {
    let chars: Vec<char> = line.chars().collect();
    chars.iter().enumerate().all(|(i, &c)| {
        if c != ',' {
            return true;
        }
        let before = i
            .checked_sub(1)
            .and_then(|j| chars.get(j))
            .is_some_and(char::is_ascii_digit);
        let after = chars
            .iter()
            .skip(i + 1)
            .take_while(|d| d.is_ascii_digit())
            .count();
        before && (1..=2).contains(&after)
    })
}

/// A cell with a comma between digits that is not a `1,180` thousands separator.
fn has_decimal_comma(cell: &str) -> bool {
    let chars: Vec<char> = cell.chars().collect();
    chars
        .windows(3)
        .any(|w| matches!(w, [a, ',', b] if a.is_ascii_digit() && b.is_ascii_digit()))
        && !all_thousands(cell)
}

/// `1,180`-style commas only (then they say nothing about decimals).
fn all_thousands(line: &str) -> bool {
    line.split(|c: char| !(c.is_ascii_digit() || c == ','))
        .filter(|t| t.contains(','))
        .all(|t| t.split(',').skip(1).all(|g| g.len() == 3))
}

/// Splits on `sep`, honouring double quotes (`"42,5"`, `""` inside quotes).
fn split_quoted(line: &str, sep: char) -> Vec<String> {
    let mut cells = Vec::new();
    let mut cur = String::new();
    let mut quoted = false;
    let mut chars = line.chars().peekable();
    let mut at_start = true;
    while let Some(c) = chars.next() {
        if quoted {
            if c == '"' {
                if chars.peek() == Some(&'"') {
                    cur.push('"');
                    chars.next();
                } else {
                    quoted = false;
                }
            } else {
                cur.push(c);
            }
        } else if c == sep {
            cells.push(cur.trim().to_string());
            cur.clear();
            at_start = true;
            continue;
        } else if c == '"' && at_start && cur.trim().is_empty() {
            cur.clear();
            quoted = true;
        } else {
            cur.push(c);
        }
        at_start = false;
    }
    cells.push(cur.trim().to_string());
    cells
}

fn split_pipe(line: &str) -> Vec<String> {
    let t = line.trim();
    let t = t.strip_prefix('|').unwrap_or(t);
    let t = t.strip_suffix('|').unwrap_or(t);
    t.split('|').map(|c| c.trim().to_string()).collect()
}

/// Whether a token is a unit on its own (`mm`, `°`, `"`), to join to the number before it.
fn is_unit_token(t: &str) -> bool {
    Mark::from_word(t).is_some()
}

/// A size name written as one token: `XS`…`XXL`, `S1`…`S9`, `52cm`, `15"`.
pub fn is_size_token(t: &str) -> bool {
    let u = t.trim().to_ascii_uppercase();
    let letters = [
        "XXS", "XS", "S", "SM", "M", "MD", "ML", "L", "LG", "XL", "XXL", "XXXL", "2XL", "3XL",
        "S/M", "M/L", "L/XL",
    ];
    if letters.contains(&u.as_str()) {
        return true;
    }
    let mut chars = u.chars();
    let first = chars.next();
    let rest: String = chars.collect();
    let coded = matches!(first, Some('S' | 'T' | 'R' | 'P' | 'F'))
        && !rest.is_empty()
        && rest.len() <= 2
        && rest.chars().all(|c| c.is_ascii_digit());
    let num = u
        .trim_end_matches(['"', '″'])
        .trim_end_matches("CM")
        .trim_end_matches("IN");
    let sized_number = num.len() < u.len()
        && !num.is_empty()
        && num.chars().all(|c| c.is_ascii_digit() || c == '.');
    coded || sized_number
}

/// Space-separated line: cells at runs of two or more spaces when present; a first cell with
/// numbers after its words is split; otherwise single spaces with the leading words as label.
pub(super) fn split_spaces(line: &str) -> Vec<String> {
    let trimmed = line.trim();
    let runs: Vec<&str> = trimmed
        .split("  ")
        .map(str::trim)
        .filter(|c| !c.is_empty())
        .collect();
    let mut cells = Vec::new();
    if runs.len() >= 2 {
        for (i, run) in runs.iter().enumerate() {
            let tokens = join_units(run);
            if i == 0 && tokens.len() > 1 {
                cells.extend(label_and_values(&tokens));
            } else if tokens.len() > 1 && tokens.iter().all(|t| is_value_token(t)) {
                cells.extend(tokens);
            } else {
                cells.push((*run).to_string());
            }
        }
        return cells;
    }
    label_and_values(&join_units(trimmed))
}

/// Tokens on single spaces, with a lone unit joined to the number before it.
pub(super) fn join_units(text: &str) -> Vec<String> {
    let mut out: Vec<String> = Vec::new();
    for t in text.split_whitespace() {
        match out.last_mut() {
            Some(prev) if is_unit_token(t) && t != "in" && is_value_token(prev) => {
                prev.push(' ');
                prev.push_str(t);
            }
            _ => out.push(t.to_string()),
        }
    }
    out
}

/// Leading words form the label; the trailing values (or size names) are cells.
fn label_and_values(tokens: &[String]) -> Vec<String> {
    let value_tail = tokens
        .iter()
        .rev()
        .take_while(|t| is_value_token(t))
        .count();
    let tail = if value_tail > 0 {
        value_tail
    } else {
        tokens.iter().rev().take_while(|t| is_size_token(t)).count()
    };
    let split = tokens.len().saturating_sub(tail);
    let label = tokens.get(..split).unwrap_or_default().join(" ");
    let mut cells = vec![label];
    cells.extend(tokens.get(split..).unwrap_or_default().iter().cloned());
    cells
}

/// The grid of a pasted text, for the chart modules' tests.
#[cfg(test)]
pub(super) fn grid(text: &str) -> Grid {
    let lines: Vec<String> = text.lines().map(String::from).collect();
    split(&lines)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn separators() {
        assert_eq!(grid("a\tb\nc\td").sep, Sep::Tab);
        assert_eq!(grid("a;1,5\nb;2,5").sep, Sep::Semicolon);
        assert_eq!(grid("Reach,420,440\nStack,600,610").sep, Sep::Comma);
        assert_eq!(grid("Reach 42,0 44,5\nStack 60,0 61,0").sep, Sep::Spaces);
        assert!(grid("Reach 42,0 44,5\nStack 60,0 61,0").decimal_comma);
        assert!(!grid("Wheelbase 1,180 1,200").decimal_comma);
        assert!(grid("Reach,\"42,5\",\"45,0\"\nStack,600,610").decimal_comma);
        assert!(!grid("Reach,425,450\nStack,600,610").decimal_comma);
        assert_eq!(grid("| a | 1 |\n| b | 2 |").sep, Sep::Pipe);
    }

    #[test]
    fn cells() {
        let g = grid("\"Head angle\",\"64,5\",65\nReach,420,440");
        assert_eq!(g.rows[0].cells, vec!["Head angle", "64,5", "65"]);
        let g = grid("Head tube angle   64.5 °  65°\nReach  420  440");
        assert_eq!(g.rows[0].cells, vec!["Head tube angle", "64.5 °", "65°"]);
        let g = grid("Seat tube angle 76 76.5 77\nS M L");
        assert_eq!(g.rows[0].cells, vec!["Seat tube angle", "76", "76.5", "77"]);
        assert_eq!(g.rows[1].cells, vec!["", "S", "M", "L"]);
        let g = grid("Reach 420  440 460\n x");
        assert_eq!(g.rows[0].cells, vec!["Reach", "420", "440", "460"]);
    }
}
