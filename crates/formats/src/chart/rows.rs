//! The values of each row: labels resolved to keys, units chosen (given, or inferred from the
//! size of the numbers), values converted to mm and degrees and written per size.
//!
//! Here: the rows by kind ([`fill`]), a frame row's cells read and checked, the seat angle or
//! top tube that does not say which, and each value written. Units without a mark are chosen in
//! `row_units`, rows short of values placed in `short_rows`, wheel rows read in `wheel_row`.
//!
//! **Invariant:** every row is read, noted or listed in `unrecognised`; a value is written in
//! §5 units, rounded to 0.01, only inside the measurement's hard range, else left out with a
//! note; rows are written (and named in notes) in the chart's order.

use super::cell::{parse_cell, Cell, Mark, Spread};
use super::label::{Ambiguity, Kind, Label, Part};
use super::log::{shorten, Log};
use super::row_units::{consensus, length_unit};
use super::short_rows::{one_for_all, place_short, Short};
use super::wheel_row::read_wheels;
use super::ChartSize;
use framewise_kernel::{lookup, Measurement, Unit};

/// One row below the size row.
pub(super) struct TableRow {
    /// Its classified label.
    pub label: Label,
    /// Its unit from the label or a units column.
    pub unit: Option<Mark>,
    /// Its cells, one per size.
    pub cells: Vec<String>,
}

/// A row that names a frame key, with its cells read.
pub(super) struct Keyed {
    /// Its place among the table's rows.
    pub place: usize,
    /// Its label as written.
    pub text: String,
    /// The measurement it gives.
    pub m: &'static Measurement,
    /// Its unit from the label or a units column.
    pub unit: Option<Mark>,
    /// Its cells, one per size.
    pub cells: Vec<Cell>,
}

/// How the rows are read: the unit of lengths without one, decimal commas, and whether a row
/// with fewer values than sizes asks which sizes they belong to (else they are read from the
/// left, with a note).
pub(super) struct Reading {
    /// The unit of lengths given without one.
    pub global: Option<Mark>,
    /// A unit that decides between the units a row's unmarked numbers fit (a column of units
    /// after a chart's size rows): never one the numbers do not fit.
    pub hint: Option<Mark>,
    /// Whether the chart writes decimal commas.
    pub decimal_comma: bool,
    /// Whether a short row asks which sizes its values belong to.
    pub short_rows_ask: bool,
}

/// Reads every row into `sizes`.
pub(super) fn fill(sizes: &mut [ChartSize], rows: Vec<TableRow>, read: Reading, log: &mut Log) {
    let global = read.global;
    let n = sizes.len();
    let mut keyed: Vec<Keyed> = Vec::new();
    let mut ambiguous: Vec<(usize, TableRow, Ambiguity)> = Vec::new();
    for (place, row) in rows.into_iter().enumerate() {
        match row.label.kind {
            Kind::Key(k) => push_keyed(&mut keyed, (place, row), k, n, &read, log),
            Kind::Ambiguous(a) => ambiguous.push((place, row, a)),
            Kind::Wheels(slot) => read_wheels(sizes, &row, slot, log),
            Kind::RowNumber => log.note(&row.label.text, "ignored the row numbers".into()),
            Kind::Part(part) => log.note(&row.label.text, part_note(part)),
            Kind::SeatTubeToCentre => {
                log.unrecognised.push(shorten(&row.label.text));
                log.note(&row.label.text, SEAT_TUBE_TO_CENTRE.into());
            }
            Kind::Size | Kind::Unknown => {
                let name = if row.label.text.is_empty() {
                    "(a row without a label)".to_string()
                } else {
                    shorten(&row.label.text)
                };
                log.unrecognised.push(name);
            }
        }
    }
    for (place, row, a) in ambiguous {
        if let Some(k) = resolve(&row, a, &keyed, log) {
            push_keyed(&mut keyed, (place, row), k, n, &read, log);
        }
    }
    // Rows placed by `resolve` after the others go back to their places: the rows are written,
    // and named in notes, in the chart's order.
    keyed.sort_by_key(|k| k.place);
    let consensus = consensus(&keyed, global.or(read.hint));
    for row in &keyed {
        write_row(sizes, row, global, consensus, log);
    }
}

/// What a seat tube row measured centre to centre says (`Kind::SeatTubeToCentre`).
const SEAT_TUBE_TO_CENTRE: &str = "measured centre to centre, to the top tube's centre: shorter \
     than the seat tube length used here (BB centre to the top of the seat tube), so not read";

/// What a row naming a part the page has an input for says: it is read as that part, is no
/// frame number, and where the page's input is ("recognised as the stem length, not a frame
/// number: set it under Cockpit").
fn part_note(part: Part) -> String {
    format!(
        "recognised as the {}, not a frame number: set it under {}",
        part.label, part.group
    )
}

fn push_keyed(
    keyed: &mut Vec<Keyed>,
    (place, row): (usize, TableRow),
    key: &'static str,
    n: usize,
    read: &Reading,
    log: &mut Log,
) {
    let Some(m) = lookup(key) else { return };
    if keyed.iter().any(|k| k.m.key == key) {
        log.note(
            &row.label.text,
            format!("a second row for {}; the first one was used", m.label),
        );
        log.unrecognised.push(shorten(&row.label.text));
        return;
    }
    let mut cells: Vec<Cell> = row
        .cells
        .iter()
        .map(|c| parse_cell(c, read.decimal_comma))
        .collect();
    let given: Vec<&Cell> = cells.iter().filter(|c| **c != Cell::Missing).collect();
    if n > 1 && cells.len() == 1 && given.len() == 1 {
        cells = one_for_all(cells, n, read.short_rows_ask, &row.label.text, log);
    }
    if (2..n).contains(&cells.len()) {
        let short = Short {
            row: &row.label.text,
            ask: read.short_rows_ask,
            what: "sizes",
        };
        place_short(&mut cells, n, Cell::Missing, short, log);
    }
    if cells.len() > n {
        log.note(
            &row.label.text,
            format!(
                "{} values for {n} sizes; the extra ones were left out",
                cells.len()
            ),
        );
        cells.truncate(n);
    }
    keyed.push(Keyed {
        place,
        text: row.label.text,
        m,
        unit: row.unit,
        cells,
    });
}

/// Seat angle or top tube without "effective"/"actual": the other row of the pair decides,
/// else the person is asked (default: effective).
fn resolve(row: &TableRow, a: Ambiguity, keyed: &[Keyed], log: &mut Log) -> Option<&'static str> {
    let has = |k: &str| keyed.iter().any(|r| r.m.key == k);
    let text = &row.label.text;
    let (eff, act, what) = match a {
        Ambiguity::SeatAngle => (
            "seat_angle_effective_deg",
            Some("seat_angle_actual_deg"),
            "seat tube angle",
        ),
        Ambiguity::TopTube => ("top_tube_effective_mm", None, "top tube"),
    };
    let choice = match (has(eff), act.is_some_and(has)) {
        (true, false) => "actual".to_string(),
        (false, true) => "effective".to_string(),
        _ => log.ask(
            text,
            "meaning",
            |c| format!("\"{text}\" does not say effective or actual; read as the {c} {what}"),
            &["effective", "actual"],
            "effective",
        ),
    };
    if has(eff) || act.is_some_and(has) {
        log.note(
            text,
            format!("the chart has the other {what} row, so this one was read as {choice}"),
        );
    }
    match (choice.as_str(), act) {
        ("effective", _) => Some(eff),
        ("actual", Some(k)) => Some(k),
        _ => {
            log.note(
                text,
                "the actual top tube (along the tube) is not used; it follows from the other numbers"
                    .into(),
            );
            log.unrecognised.push(shorten(text));
            None
        }
    }
}

fn write_row(
    sizes: &mut [ChartSize],
    row: &Keyed,
    global: Option<Mark>,
    consensus: Option<Mark>,
    log: &mut Log,
) {
    let angle = row.m.unit == Unit::Deg;
    let row_unit = if angle {
        Mark::Deg
    } else {
        length_unit(row, global, consensus, log)
    };
    let mut second = None;
    for (size, cell) in sizes.iter_mut().zip(&row.cells) {
        let num = match cell {
            Cell::Missing => continue,
            Cell::Text => {
                log.note(&row.text, format!("{}: not a number; left out", size.label));
                continue;
            }
            Cell::Number(n) => n,
        };
        let unit = num.mark.unwrap_or(row_unit);
        if angle != (unit == Mark::Deg) {
            log.note(
                &row.text,
                format!(
                    "{}: the unit {} does not fit {}; left out",
                    size.label,
                    unit.words(),
                    row.m.label
                ),
            );
            continue;
        }
        let raw = match num.spread {
            Spread::Single => num.value,
            Spread::Range(lo, hi) => {
                log.note(
                    &row.text,
                    format!(
                        "{}: the range {lo}–{hi} was read as its midpoint {}",
                        size.label, num.value
                    ),
                );
                num.value
            }
            Spread::Pair(a, b) => {
                let which = *second.get_or_insert_with(|| {
                    log.ask(
                        &row.text,
                        "setting",
                        |c| format!("\"{}\" gives two values per size (such as two settings); the {c} was used", row.text),
                        &["first", "second"],
                        "first",
                    ) == "second"
                });
                if which {
                    b
                } else {
                    a
                }
            }
        };
        let value = (raw * unit.factor() * 100.0).round() / 100.0;
        let (lo, hi) = row.m.hard;
        if !(value.is_finite() && (lo..=hi).contains(&value)) {
            log.note(
                &row.text,
                format!(
                    "{}: {value} {} is outside what any frame has for {}; left out",
                    size.label,
                    row.m.unit.symbol(),
                    row.m.label
                ),
            );
            continue;
        }
        let key = row.m.key;
        let tolerance = num.step * unit.factor();
        // Angles keep the default rounding ([`crate::units::parse_quantity_step`]).
        let angle = row.m.unit.symbol() == "°";
        let coarse = !angle && tolerance > row.m.default_tolerance() * (1.0 + 1e-9);
        // Only a rounding the page's form can hold (a text that reads back with it): a range
        // (`430–440`, 10 mm about 435) or a fraction (`17½"`) has none, and keeps the default, so
        // the page and a scenario made from the chart judge it alike.
        let kept = coarse
            .then(|| crate::form_inverse::published_text(key, value, Some(tolerance)))
            .flatten();
        if kept.is_some() {
            size.tolerances.insert(key.to_string(), tolerance);
        }
        let text = kept.unwrap_or_else(|| crate::form_inverse::number_text(value));
        size.frame.insert(key.to_string(), value);
        size.text.insert(key.to_string(), text);
    }
}
