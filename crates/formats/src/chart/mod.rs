//! Geometry chart import: a table pasted from a web page, a PDF or a spreadsheet → a size run.
//!
//! Output (DESIGN.md §8, plus two additive lists):
//!
//! ```json
//! { "sizes": [ { "label": "M", "frame": { "reach_mm": 470.0, "head_angle_deg": 65.0 },
//!                "wheels": { "front": "29x2.4", "rear": "29x2.4" } } ],
//!   "unrecognised": [ "Stem length" ],
//!   "questions": [ { "id": "Seat tube angle#meaning", "row": "Seat tube angle",
//!                    "message": "…", "options": ["effective", "actual"], "chosen": "effective" } ],
//!   "notes": [ { "row": "", "rows": [ "Reach", "Stack" ],
//!                "message": "no unit given for Reach, Stack: read as mm from the size of the numbers" },
//!              { "row": "Head angle", "message": "one value for every size; used it for all" } ] }
//! ```
//!
//! Values are in the §5 units (mm, degrees), rounded to 0.01. Sizes may be columns or rows;
//! separators tabs, semicolons, pipes, commas or aligned spaces (cells parted by a single space
//! are cut where a word stands under another column, when every part reads as a cell: a number,
//! a size name, a unit or a wheel size); units in the row label (`Reach (mm)`), in a units
//! column (sizes as columns: before or after the labels, or on the right), in a units row
//! (sizes as rows: under or above the labels, or at the foot; a column of units after the
//! sizes' values names no measurement: one length unit for every size is read as the unit of
//! lengths, anything else is listed in `unrecognised`), in each cell
//! (`470 mm`, `18.5"`, `65°`), in a title line (`All measurements in mm`; a footnote line such
//! as `¹ measured with 0 mm spacers` is not one), or absent: then each length row's unit is
//! inferred from the size of its numbers against the catalogue's plausible range (reach 18.5 →
//! in, 47.0 → cm, 470 → mm) and one note per unit says so, naming the rows; a row whose numbers
//! fit two units, or none, gets a question of its own (the default follows the other rows' unit
//! when it fits). Angles are always degrees (without a note: there is nothing to infer). Also
//! read: a header of labels that lost its cell borders (single spaces; split to the data's
//! width), a phone copy with one cell per line, drawing-reference or row-number columns, one
//! value standing for every size, a row short of values (read from the left; asked when the
//! cells lost their places), `470-475` ranges (midpoint), `65/64.5` two settings (asked), one
//! length in two units (`470 mm (18.5")`).
//! Nothing is dropped silently: rows it does not know are listed in `unrecognised`, rows naming
//! a part the page has an input for (stem length, crank length, bar width) get a note saying
//! where to set it, lines of text and ignored columns are in `notes`, guesses in `questions`
//! (with the options and the one chosen). Answers to questions are passed back by `id` through
//! [`import_chart_with`].

mod aligned;
mod assemble;
mod blanks;
pub mod cell;
mod grid;
pub mod label;
mod lines;
mod log;
mod orient;
mod row_units;
mod rows;
mod segment;
mod short_rows;
mod unit_columns;
mod wheel_row;
pub mod wheels;

use framewise_kernel::WheelsInput;
use serde::Serialize;
use std::collections::BTreeMap;
use std::fmt;

/// Longest text accepted, in bytes (a chart is a few kilobytes).
pub const MAX_BYTES: usize = 256 * 1024;
/// Most non-blank lines accepted (a chart has a few dozen).
pub const MAX_LINES: usize = 400;
/// Most sizes accepted in one chart.
pub const MAX_SIZES: usize = 40;

/// Answers to earlier questions: question `id` → chosen option.
pub type Answers = BTreeMap<String, String>;

/// The imported size run.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct ChartImport {
    /// One entry per size, in the chart's order.
    pub sizes: Vec<ChartSize>,
    /// Row labels that name nothing the importer reads, as written.
    pub unrecognised: Vec<String>,
    /// Choices the importer made that the person should confirm.
    pub questions: Vec<Question>,
    /// What the importer did that the person should know (inferred units, ignored lines …).
    pub notes: Vec<Note>,
}

/// One size of the run.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct ChartSize {
    /// The size's name as the chart writes it ("M", "S3", "52 cm").
    pub label: String,
    /// Published frame numbers, §5 keys and units.
    pub frame: BTreeMap<String, f64>,
    /// The rounding of the lengths written coarser than the solver's default 1 mm: one unit of
    /// the last written digit in the chart's unit (`99 cm` → 10 mm), as a scenario's
    /// `{"value", "tolerance"}` takes it, when the page's form can hold it too (a range or a
    /// fraction keeps the default). Angles keep the default 0.1°. Left out of the JSON when empty.
    #[serde(skip_serializing_if = "BTreeMap::is_empty")]
    pub tolerances: BTreeMap<String, f64>,
    /// Each frame value as the page's form writes it, keeping its rounding (`99 cm`, `65`,
    /// `470`): the form reads it back with the same value and tolerance.
    pub text: BTreeMap<String, String>,
    /// Wheels, when the chart has a wheel-size row.
    pub wheels: WheelsInput,
}

/// A choice made on the person's behalf.
#[derive(Debug, Clone, PartialEq, Eq, Serialize)]
pub struct Question {
    /// Stable id; pass it back with an option in [`Answers`].
    pub id: String,
    /// The row label as written.
    pub row: String,
    /// One sentence: what is unclear and what was done.
    pub message: String,
    /// The possible answers.
    pub options: Vec<String>,
    /// The option used.
    pub chosen: String,
}

/// Something the importer did, about one row, several rows or the whole chart.
///
/// A note about one row names it in `row`; a note said once for several rows (the unit
/// inferred from the size of the numbers) has an empty `row`, lists them in `rows` and names
/// them in its message; a note about the whole chart has neither.
#[derive(Debug, Clone, PartialEq, Eq, Serialize)]
pub struct Note {
    /// The row label as written, or empty.
    pub row: String,
    /// The row labels as written of a note about several rows, in the chart's order; else
    /// empty (and left out of the JSON).
    #[serde(skip_serializing_if = "Vec::is_empty")]
    pub rows: Vec<String>,
    /// One sentence.
    pub message: String,
}

/// Why a text could not be read as a chart. Each message says what to do.
#[derive(Debug, Clone, PartialEq, Eq)]
pub enum ChartError {
    /// Nothing was pasted.
    Empty,
    /// The text is longer than [`MAX_BYTES`].
    TooLarge {
        /// Its length in bytes.
        bytes: usize,
    },
    /// More non-blank lines than [`MAX_LINES`].
    TooManyLines {
        /// How many were found.
        lines: usize,
    },
    /// No line has a label and a number.
    NotATable,
    /// Only one row of the table was found.
    OneRow,
    /// More columns (or rows) of sizes than [`MAX_SIZES`].
    TooManySizes {
        /// How many were found.
        count: usize,
    },
    /// No row label names a frame measurement.
    NothingRecognised {
        /// The labels that were found.
        labels: Vec<String>,
    },
}

impl ChartError {
    /// Stable machine-readable code.
    pub fn code(&self) -> &'static str {
        match self {
            ChartError::Empty => "empty_chart",
            ChartError::TooLarge { .. } => "chart_too_large",
            ChartError::TooManyLines { .. } => "chart_too_long",
            ChartError::NotATable => "not_a_table",
            ChartError::OneRow => "one_row",
            ChartError::TooManySizes { .. } => "too_many_sizes",
            ChartError::NothingRecognised { .. } => "nothing_recognised",
        }
    }
}

impl fmt::Display for ChartError {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self {
            ChartError::Empty => write!(
                f,
                "The chart is empty: paste the geometry table, including the row or column of size names."
            ),
            ChartError::TooLarge { bytes } => write!(
                f,
                "The pasted text is {bytes} bytes, more than the {MAX_BYTES} a chart can be: paste only the geometry table."
            ),
            ChartError::TooManyLines { lines } => write!(
                f,
                "The pasted text has {lines} lines, more than the {MAX_LINES} a chart can have: paste only the geometry table."
            ),
            ChartError::NotATable => write!(
                f,
                "No table found: paste rows that each have a label and numbers, such as \"Reach  450  470  490\"."
            ),
            ChartError::OneRow => write!(
                f,
                "Only one row of the table was found: paste the size names and at least one measurement row."
            ),
            ChartError::TooManySizes { count } => write!(
                f,
                "The table has {count} columns of sizes, more than {MAX_SIZES}: paste one model's geometry table only."
            ),
            ChartError::NothingRecognised { labels } => {
                let shown: Vec<&str> = labels.iter().take(8).map(String::as_str).collect();
                write!(
                    f,
                    "None of the row labels names a frame measurement (found: {}); use labels such as Reach, Stack, Head tube angle, Seat tube angle, Chainstay, Wheelbase.",
                    if shown.is_empty() { "none".to_string() } else { shown.join(", ") }
                )
            }
        }
    }
}

impl std::error::Error for ChartError {}

/// Imports a pasted chart with the default choice for every question.
///
/// # Errors
/// A [`ChartError`] when the text is empty, too long (bytes or lines), has no table, only one row, too many
/// sizes, or no row label that names a frame measurement.
pub fn import_chart(text: &str) -> Result<ChartImport, ChartError> {
    import_chart_with(text, &Answers::new())
}

/// Imports a pasted chart, using `answers` (question id → option) where given.
///
/// # Errors
/// As [`import_chart`].
pub fn import_chart_with(text: &str, answers: &Answers) -> Result<ChartImport, ChartError> {
    if text.trim().is_empty() {
        return Err(ChartError::Empty);
    }
    if text.len() > MAX_BYTES {
        return Err(ChartError::TooLarge { bytes: text.len() });
    }
    // Old Mac line ends (a lone CR) count as line ends too.
    let lines: Vec<String> = text
        .split(['\n', '\r'])
        .map(clean_line)
        .filter(|l| !l.trim().is_empty() && !grid::is_rule_line(l))
        .collect();
    if lines.len() > MAX_LINES {
        return Err(ChartError::TooManyLines { lines: lines.len() });
    }
    if !lines.iter().any(|l| l.chars().any(|c| c.is_ascii_digit())) {
        return Err(ChartError::NotATable);
    }
    assemble::build(&grid::split(&lines), answers)
}

/// No-break and thin spaces become spaces; other control and format characters go.
fn clean_line(line: &str) -> String {
    line.chars()
        .filter_map(|c| match c {
            '\t' => Some('\t'),
            '\u{a0}' | '\u{2007}' | '\u{202f}' | '\u{2009}' | '\u{3000}' => Some(' '),
            '\u{feff}' | '\u{200b}' | '\u{200c}' | '\u{200d}' | '\u{2060}' => None,
            c if c.is_control() => None,
            c => Some(c),
        })
        .collect::<String>()
        .trim_end()
        .to_string()
}

/// The error part of [`chart_to_json`].
#[derive(Serialize)]
struct ErrorJson {
    code: &'static str,
    message: String,
}

#[derive(Serialize)]
struct ImportJson<'a> {
    #[serde(flatten)]
    import: &'a ChartImport,
    error: Option<ErrorJson>,
}

/// The import as JSON text: the [`ChartImport`] fields plus `"error": null`, or, when the text
/// cannot be read, empty lists and `"error": {"code": …, "message": …}`.
pub fn chart_to_json(result: &Result<ChartImport, ChartError>) -> String {
    let empty = ChartImport {
        sizes: Vec::new(),
        unrecognised: Vec::new(),
        questions: Vec::new(),
        notes: Vec::new(),
    };
    let out = match result {
        Ok(import) => ImportJson {
            import,
            error: None,
        },
        Err(e) => ImportJson {
            import: &empty,
            error: Some(ErrorJson {
                code: e.code(),
                message: e.to_string(),
            }),
        },
    };
    serde_json::to_string_pretty(&out).unwrap_or_else(|_| "{}".into())
}
