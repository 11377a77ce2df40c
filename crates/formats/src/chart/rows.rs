//! The values of each row: labels resolved to keys, units chosen (given, or inferred from the
//! size of the numbers), values converted to mm and degrees and written per size.

use super::cell::{parse_cell, Cell, Mark, Num, Spread};
use super::label::{Ambiguity, Kind, Label, Part, WheelSlot};
use super::log::{shorten, Log};
use super::wheels::{default_note, parse_wheel_cell, rejoin, Rejoined};
use super::ChartSize;
use framewise_kernel::{lookup, Measurement, Unit, WheelSpec};

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
struct Keyed {
    /// Its place among the table's rows.
    place: usize,
    text: String,
    m: &'static Measurement,
    unit: Option<Mark>,
    cells: Vec<Cell>,
}

const LENGTHS: [Mark; 3] = [Mark::Mm, Mark::Cm, Mark::In];

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

/// A row of one value for `n` sizes: one value standing for every size (a merged cell), with a
/// note. When the cells lost their places the person is also asked, since the value may be the
/// first or the last size's alone (question id `<row>#sizes`).
fn one_for_all(cells: Vec<Cell>, n: usize, ask: bool, row: &str, log: &mut Log) -> Vec<Cell> {
    let one = cells.into_iter().next().unwrap_or(Cell::Missing);
    const ALL: &str = "every size";
    const FIRST: &str = "the first size";
    const LAST: &str = "the last size";
    let chosen = if ask {
        log.ask(
            row,
            "sizes",
            |c| {
                let used = if c == ALL {
                    "every size".to_string()
                } else {
                    format!("{c} only")
                };
                format!("\"{row}\" gives one value for {n} sizes; used it for {used}")
            },
            &[ALL, FIRST, LAST],
            ALL,
        )
    } else {
        log.note(row, "one value for every size; used it for all".into());
        ALL.to_string()
    };
    let mut out = vec![Cell::Missing; n];
    let place = match chosen.as_str() {
        FIRST => out.first_mut(),
        LAST => out.last_mut(),
        _ => return vec![one; n],
    };
    if let Some(c) = place {
        *c = one;
    }
    out
}

/// A row of fewer values than it has places for: its label, whether to ask, and what the
/// places are ("sizes", or "measurements" for a size row of a chart with sizes as rows).
pub(super) struct Short<'a> {
    /// The row's label as written.
    pub row: &'a str,
    /// Whether the person is asked (the cells lost their places).
    pub ask: bool,
    /// What the places are, plural.
    pub what: &'static str,
}

/// A row of `k` values for `n` places, `k < n`: read from the left with a note when the cells'
/// places are known (a blank at the end of a row is the last places' blank); else the person
/// is asked whether the values belong to the first places (the default) or the last ones (a
/// measurement given only for the bigger sizes), or to none (a blank in the middle: the values
/// are left out), and the row is read that way: with the last, `n - k` blanks go before the
/// values. Question id: `<row>#<what>`.
pub(super) fn place_short<T: Clone>(
    cells: &mut Vec<T>,
    n: usize,
    blank: T,
    short: Short<'_>,
    log: &mut Log,
) {
    let Short { row, ask, what } = short;
    let k = cells.len();
    if !ask {
        log.note(
            row,
            format!("{k} values for {n} {what}; read from the left"),
        );
        return;
    }
    let (first, last) = (
        format!("the first {k} {what}"),
        format!("the last {k} {what}"),
    );
    // A blank in the middle of the row fits neither: its values can be left out and typed in.
    const NONE: &str = "none of them (leave the values out)";
    let chosen = log.ask(
        row,
        what,
        |c| {
            if c == NONE {
                format!("\"{row}\" gives {k} values for {n} {what}; they were left out")
            } else {
                format!("\"{row}\" gives {k} values for {n} {what}; read as {c}")
            }
        },
        &[&first, &last, NONE],
        &first,
    );
    if chosen == last {
        let mut placed = vec![blank; n - k];
        placed.append(cells);
        *cells = placed;
    } else if chosen == NONE {
        *cells = vec![blank; n];
    }
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

/// The row's own unit for lengths (cells marked, or from label or units column), if any.
fn row_length_unit(row: &Keyed) -> Option<Mark> {
    row.unit.filter(|u| *u != Mark::Deg).or_else(|| {
        let marks: Vec<Mark> = row
            .cells
            .iter()
            .filter_map(|c| match c {
                Cell::Number(n) => Some(n.mark),
                _ => None,
            })
            .collect::<Option<Vec<Mark>>>()?;
        let first = *marks.first()?;
        (first != Mark::Deg && marks.iter().all(|m| *m == first)).then_some(first)
    })
}

/// Units whose conversion puts every unmarked value of the row inside `range`.
fn candidates(row: &Keyed, range: (f64, f64)) -> Vec<Mark> {
    let values: Vec<f64> = unmarked(row).map(|n| n.value).collect();
    LENGTHS
        .into_iter()
        .filter(|u| {
            values
                .iter()
                .all(|v| (range.0..=range.1).contains(&(v * u.factor())))
        })
        .collect()
}

fn unmarked(row: &Keyed) -> impl Iterator<Item = &Num> {
    row.cells.iter().filter_map(|c| match c {
        Cell::Number(n) if n.mark.is_none() => Some(n),
        _ => None,
    })
}

/// The length unit most rows agree on (given, or the only one that fits).
fn consensus(keyed: &[Keyed], global: Option<Mark>) -> Option<Mark> {
    if global.is_some() {
        return global;
    }
    let mut votes = [0usize; 3];
    for row in keyed.iter().filter(|r| r.m.unit == Unit::Mm) {
        let unit =
            row_length_unit(row).or_else(|| match candidates(row, row.m.plausible).as_slice() {
                [one] => Some(*one),
                _ => None,
            });
        if let Some(i) = unit.and_then(|u| LENGTHS.iter().position(|l| *l == u)) {
            if let Some(v) = votes.get_mut(i) {
                *v += 1;
            }
        }
    }
    let best = votes.iter().copied().max().unwrap_or(0);
    let winners: Vec<usize> = (0..3).filter(|i| votes.get(*i) == Some(&best)).collect();
    match winners.as_slice() {
        [i] if best > 0 => LENGTHS.get(*i).copied(),
        _ => None,
    }
}

/// The unit for the row's unmarked length values.
fn length_unit(row: &Keyed, global: Option<Mark>, consensus: Option<Mark>, log: &mut Log) -> Mark {
    if let Some(u) = row.unit.filter(|u| *u != Mark::Deg).or(global) {
        return u;
    }
    if unmarked(row).next().is_none() {
        return Mark::Mm;
    }
    let text = &row.text;
    let plausible = candidates(row, row.m.plausible);
    let list = if plausible.is_empty() {
        candidates(row, row.m.hard)
    } else {
        plausible
    };
    match list.as_slice() {
        [one] => {
            let one = *one;
            // One note per unit for all the rows read so: the rows' notes were alike.
            log.note_rows(&format!("unit#{}", one.name()), text, |rows| {
                format!(
                    "no unit given for {}: read as {} from the size of the numbers",
                    rows.join(", "),
                    one.words()
                )
            });
            one
        }
        [] => pick(log, text, &["mm", "cm", "in"], "mm", |c| {
            format!(
                    "the numbers of \"{text}\" fit no usual range for {} in mm, cm or inches; read as {}",
                    row.m.label,
                    unit_words(c)
                )
        }),
        _ => {
            let names: Vec<&str> = list.iter().map(|m| m.name()).collect();
            let words: Vec<&str> = list.iter().map(|m| m.words()).collect();
            let default = consensus
                .filter(|c| list.contains(c))
                .unwrap_or_else(|| nearest_mid(row, &list));
            let why = if Some(default) == consensus {
                "like the other rows"
            } else {
                "as the most usual value"
            };
            pick(log, text, &names, default.name(), |c| {
                let why = if c == default.name() {
                    why
                } else {
                    "as chosen"
                };
                format!(
                    "no unit given and the numbers of \"{text}\" fit {}; read as {} {why}",
                    words.join(" or "),
                    unit_words(c)
                )
            })
        }
    }
}

/// The words of a length unit's name (`"in"` → `"inches"`).
fn unit_words(name: &str) -> &'static str {
    LENGTHS
        .into_iter()
        .find(|m| m.name() == name)
        .unwrap_or(Mark::Mm)
        .words()
}

fn pick(
    log: &mut Log,
    row: &str,
    options: &[&str],
    default: &str,
    message: impl FnOnce(&str) -> String,
) -> Mark {
    let chosen = log.ask(row, "unit", message, options, default);
    LENGTHS
        .into_iter()
        .find(|m| m.name() == chosen)
        .unwrap_or(Mark::Mm)
}

/// The unit that puts the row's values nearest the middle of the plausible range.
fn nearest_mid(row: &Keyed, list: &[Mark]) -> Mark {
    let (lo, hi) = row.m.plausible;
    let mid = (lo + hi) / 2.0;
    let span = (hi - lo).max(1.0);
    let cost = |u: &Mark| {
        unmarked(row)
            .map(|n| ((n.value * u.factor() - mid) / span).abs())
            .sum::<f64>()
    };
    list.iter()
        .copied()
        .min_by(|a, b| cost(a).total_cmp(&cost(b)))
        .unwrap_or(Mark::Mm)
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

/// A wheel-size row: designations per size, with a note when a tyre width was assumed. A row
/// whose cells single spaces joined ([`rejoin`]) is cut one wheel per size, with a note, or,
/// when it holds another number of wheels, left out with a note: never one wheel for every
/// size when the row held several.
fn read_wheels(sizes: &mut [ChartSize], row: &TableRow, slot: WheelSlot, log: &mut Log) {
    let (text, cells) = match rejoin(&row.label.text, &row.cells, sizes.len()) {
        Rejoined::Kept => (row.label.text.clone(), one_or_each(&row.cells, sizes.len())),
        Rejoined::Cut(name, cells) => {
            log.note(
                &name,
                "the wheel sizes were parted by single spaces; read one per size, from the left"
                    .into(),
            );
            (name, cells)
        }
        Rejoined::Unplaced(name, k) => {
            let n = sizes.len();
            log.note(
                &name,
                format!(
                    "{k} wheel sizes parted by single spaces for {n} sizes: which size each belongs to is not known, so none was used; set the wheels under Wheels and fork"
                ),
            );
            return;
        }
    };
    let text = &text;
    let mut assumed = false;
    for (size, cell) in sizes.iter_mut().zip(&cells) {
        if cell.trim().is_empty() {
            continue;
        }
        let Some(w) = parse_wheel_cell(cell) else {
            log.note(
                text,
                format!(
                    "{}: wheel size \"{}\" not recognised; left out",
                    size.label,
                    shorten(cell)
                ),
            );
            continue;
        };
        assumed |= w.width_assumed;
        if slot != WheelSlot::Rear {
            size.wheels.front = Some(WheelSpec::Designation(w.front));
        }
        if slot != WheelSlot::Front {
            size.wheels.rear = Some(WheelSpec::Designation(w.rear));
        }
    }
    if assumed {
        log.note(text, default_note());
    }
}

/// A wheel row's cells, one per size: a lone cell stands for every size.
fn one_or_each(cells: &[String], n: usize) -> Vec<String> {
    let given: Vec<&String> = cells.iter().filter(|c| !c.trim().is_empty()).collect();
    match given.as_slice() {
        [one] if n > 1 && cells.len() == 1 => vec![(*one).clone(); n],
        _ => cells.to_vec(),
    }
}
