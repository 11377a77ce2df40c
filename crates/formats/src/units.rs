//! Numbers as people type them: units with their usual marks, decimal commas.
//!
//! Lengths: `470`, `470 mm`, `47 cm`, `470 (mm)`, `18.5 in`, `18.5"`, `18,5″`, and the inch
//! marks that phones and copied web text write: `18.5”` (curly quote), `18.5''` / `18.5’’`
//! (two apostrophes), `18.5′′` (two primes). A body's lengths also in feet and inches:
//! `5'10"`, `5′10″`, `5’10”`, `5 ft 10 in`, `6'`. Angles: `65`, `65°`, `65 deg`, `64,5º`,
//! `65˚` (ring above). Plain numbers for percent and kilograms, with `%` / `kg` accepted.
//!
//! Conversions: 1 in = 25.4 mm and 1 ft = 12 in = 304.8 mm exactly (international yard and
//! pound agreement, 1959) [read]; 1 cm = 10 mm (SI).

use std::fmt;

/// What kind of quantity a field holds.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Quantity {
    /// Length, result in millimetres.
    Length,
    /// A length of the body (rider height, inseam), result in millimetres: as [`Quantity::Length`],
    /// and also in feet and inches (`5'10"`).
    BodyLength,
    /// Angle, result in degrees.
    Angle,
    /// Percentage.
    Percent,
    /// Mass, result in kilograms.
    Mass,
}

impl Quantity {
    /// From a JSON key's unit suffix (`_mm`, `_deg`, `_pct`, `_kg`).
    pub fn from_key(key: &str) -> Option<Quantity> {
        if key.ends_with("_mm") {
            Some(Quantity::Length)
        } else if key.ends_with("_deg") {
            Some(Quantity::Angle)
        } else if key.ends_with("_pct") {
            Some(Quantity::Percent)
        } else if key.ends_with("_kg") {
            Some(Quantity::Mass)
        } else {
            None
        }
    }

    fn accepted(self) -> &'static str {
        match self {
            Quantity::Length => "a length such as 470, 470 mm, 47 cm or 18.5 in",
            Quantity::BodyLength => "a length such as 1780 mm, 178 cm or 5'10\"",
            Quantity::Angle => "an angle in degrees such as 65 or 64.5°",
            Quantity::Percent => "a percentage such as 25 or 25 %",
            Quantity::Mass => "a mass such as 74 or 74 kg",
        }
    }
}

/// Why a typed value could not be read.
#[derive(Debug, Clone, PartialEq, Eq)]
pub enum UnitError {
    /// Nothing was typed.
    Empty {
        /// What the field accepts.
        accepted: &'static str,
    },
    /// The text is not a number with an accepted unit.
    NotANumber {
        /// The text as typed.
        text: String,
        /// What the field accepts.
        accepted: &'static str,
    },
}

impl fmt::Display for UnitError {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self {
            UnitError::Empty { accepted } => write!(f, "Required: enter {accepted}"),
            UnitError::NotANumber { text, accepted } => {
                write!(f, "\"{text}\" is not a number: enter {accepted}")
            }
        }
    }
}

impl std::error::Error for UnitError {}

/// Parses a decimal number, accepting a decimal comma and a leading `+` or `−`.
// Called from several places: one copy keeps the page's module small.
#[inline(never)]
pub fn parse_number(text: &str) -> Option<f64> {
    let t = text.trim().replace('\u{2212}', "-").replace(',', ".");
    if t.is_empty()
        || t.chars()
            .any(|c| !(c.is_ascii_digit() || matches!(c, '.' | '-' | '+' | 'e' | 'E')))
    {
        return None;
    }
    let v: f64 = t.parse().ok()?;
    v.is_finite().then_some(v)
}

/// Parses a typed value of the given quantity into mm, degrees, percent or kg: a number with a
/// unit after it, in brackets or not (module docs), times the unit's factor (mm 1, cm 10,
/// in 25.4, m 1000; degrees 1; lb 0.45359237 kg). A [`Quantity::BodyLength`] may also be feet
/// and inches: `5'10"` = 5 × 304.8 + 10 × 25.4 = 1778 mm.
///
/// # Errors
/// [`UnitError::Empty`] for blank text; [`UnitError::NotANumber`] for anything else unreadable.
pub fn parse_quantity(text: &str, q: Quantity) -> Result<f64, UnitError> {
    let accepted = q.accepted();
    let t = text.trim();
    if t.is_empty() {
        return Err(UnitError::Empty { accepted });
    }
    // Unit words are ASCII (the marks ° ″ have no case): ASCII lower case is enough and keeps
    // the Unicode case tables out of the wasm module.
    let lower = unbracket(&t.to_ascii_lowercase());
    let bad = || UnitError::NotANumber {
        text: t.to_string(),
        accepted,
    };
    if q == Quantity::BodyLength {
        if let Some(mm) = feet_and_inches(&lower) {
            return Ok(mm);
        }
    }
    let (num, factor) = split_unit(&lower, q).ok_or_else(bad)?;
    parse_number(num).map(|v| v * factor).ok_or_else(bad)
}

/// Parses a typed value like [`parse_quantity`] and also returns its rounding step in the result
/// unit: one unit of its last typed digit times the unit's factor. `99 cm` → (990, 10 mm),
/// `99.5 cm` → (995, 1 mm), `470` → (470, 1 mm), `470.5` → (470.5, 0.1 mm), `18.5 in` →
/// (469.9, 2.54 mm). A number in exponent notation has no step (`None`): its digits do not say
/// how it was rounded.
///
/// An angle has no step either (`65°` → (65, `None`)): charts print angles in whole or half
/// degrees as design values, not as measurements rounded to the degree, and a degree of play
/// would let one wrong length turn the solved head angle by degrees (a wheelbase 40 mm long made
/// it 61° for a published 65°). Angles keep the solver's default rounding (0.1°).
///
/// # Errors
/// As [`parse_quantity`].
pub fn parse_quantity_step(text: &str, q: Quantity) -> Result<(f64, Option<f64>), UnitError> {
    let value = parse_quantity(text, q)?;
    if q == Quantity::Angle {
        return Ok((value, None));
    }
    let lower = unbracket(&text.trim().to_ascii_lowercase());
    let step = split_unit(&lower, q).and_then(|(num, factor)| {
        let num = num.replace(',', ".");
        if num.contains(['e', 'E']) {
            return None;
        }
        let decimals = num.split_once('.').map_or(0, |(_, frac)| frac.len());
        let decimals = i32::try_from(decimals).ok()?;
        Some(factor * 10f64.powi(-decimals))
    });
    Ok((value, step))
}

/// Millimetres per inch, exactly (international yard and pound agreement, 1959) [read].
pub const MM_PER_IN: f64 = 25.4;
/// Millimetres per foot: 12 in, exactly 304.8 mm (the same agreement) [read].
pub const MM_PER_FT: f64 = 12.0 * MM_PER_IN;

/// Marks written after a number of feet: apostrophe, curly apostrophe, prime, `ft`.
static FOOT_MARKS: &[&str] = &["feet", "foot", "ft", "'", "’", "′"];

/// A unit in brackets after the number (`470 (mm)`, `47 [cm]`, `65 (°)`) without them.
fn unbracket(t: &str) -> String {
    let inner = t
        .strip_suffix(')')
        .and_then(|r| r.rsplit_once('('))
        .or_else(|| t.strip_suffix(']').and_then(|r| r.rsplit_once('[')));
    match inner {
        Some((num, unit)) if !unit.trim().is_empty() => {
            let mut joined = num.trim_end().to_string();
            joined.push_str(unit.trim());
            joined
        }
        _ => t.to_string(),
    }
}

/// Feet and inches: `5'10"` = 5 × 304.8 + 10 × 25.4 = 1778 mm. The feet are one digit
/// followed by a foot mark ([`FOOT_MARKS`]); the inches after it, if any, are a number from 0 to
/// under 12 with or without an inch unit (those of [`LENGTH_UNITS`]: `in`, `"`, `”`, `''` …). `None` when the text is not
/// written so (`5.5'` is not read: it could mean 5'5" or 5'6").
#[inline(never)]
fn feet_and_inches(t: &str) -> Option<f64> {
    // The first foot mark after the digits (a plain scan: no substring searcher in the page's
    // module).
    let (feet, rest) = t.char_indices().find_map(|(at, _)| {
        let tail = t.get(at..)?;
        let mark = FOOT_MARKS.iter().find(|m| tail.starts_with(**m))?;
        Some((t.get(..at)?, tail.get(mark.len()..)?))
    })?;
    // One digit: a person is 1 to 9 feet tall.
    let [digit @ b'0'..=b'9'] = feet.trim().as_bytes() else {
        return None;
    };
    let feet = f64::from(digit - b'0');
    let rest = rest.trim();
    let rest = LENGTH_UNITS
        .iter()
        .filter(|(_, per)| *per == MM_PER_IN)
        .find_map(|(m, _)| rest.strip_suffix(m))
        .unwrap_or(rest)
        .trim();
    let inches = if rest.is_empty() {
        0.0
    } else {
        parse_number(rest).filter(|i| (0.0..12.0).contains(i))?
    };
    Some(feet * MM_PER_FT + inches * MM_PER_IN)
}

/// Length units after a number, with millimetres per unit; the inch's include the marks phones
/// and copied text write: straight and curly double quotes, the double prime, two apostrophes or
/// two primes (a keyboard without `"`).
static LENGTH_UNITS: &[(&str, f64)] = &[
    ("mm", 1.0),
    ("cm", 10.0),
    ("inches", MM_PER_IN),
    ("inch", MM_PER_IN),
    ("in", MM_PER_IN),
    ("\"", MM_PER_IN),
    ("″", MM_PER_IN),
    ("”", MM_PER_IN),
    ("“", MM_PER_IN),
    ("''", MM_PER_IN),
    ("’’", MM_PER_IN),
    ("′′", MM_PER_IN),
    ("m", 1000.0),
];
/// Angle units after a number (degrees).
static ANGLE_UNITS: &[(&str, f64)] = &[
    ("degrees", 1.0),
    ("degree", 1.0),
    ("deg", 1.0),
    ("°", 1.0),
    ("º", 1.0),
    ("˚", 1.0),
];
/// Percent marks after a number.
static PERCENT_UNITS: &[(&str, f64)] = &[("%", 1.0), ("pct", 1.0)];
/// Kilograms per pound, exactly (the same 1959 agreement).
static MASS_UNITS: &[(&str, f64)] = &[("kg", 1.0), ("lb", 0.453_592_37), ("lbs", 0.453_592_37)];

#[inline(never)]
fn split_unit(t: &str, q: Quantity) -> Option<(&str, f64)> {
    let units = match q {
        Quantity::Length | Quantity::BodyLength => LENGTH_UNITS,
        Quantity::Angle => ANGLE_UNITS,
        Quantity::Percent => PERCENT_UNITS,
        Quantity::Mass => MASS_UNITS,
    };
    for (u, f) in units {
        if let Some(n) = t.strip_suffix(u) {
            return Some((n.trim(), *f));
        }
    }
    Some((t, 1.0))
}

#[cfg(test)]
mod tests {
    use super::*;

    fn len(t: &str) -> Option<f64> {
        parse_quantity(t, Quantity::Length).ok()
    }

    #[test]
    fn lengths_in_every_usual_form() {
        assert_eq!(len("470"), Some(470.0));
        assert_eq!(len(" 470 mm "), Some(470.0));
        assert_eq!(len("47cm"), Some(470.0));
        assert_eq!(len("18.5 in"), Some(469.9));
        assert_eq!(len("18,5\""), Some(469.9));
        assert_eq!(len("abc"), None);
        assert_eq!(len("4 70"), None);
    }

    fn body(t: &str) -> Option<f64> {
        parse_quantity(t, Quantity::BodyLength).ok()
    }

    fn close(got: Option<f64>, want: f64, text: &str) {
        let ok = got.is_some_and(|g| (g - want).abs() < 1e-9);
        assert!(ok, "{text:?}: expected {want}, got {got:?}");
    }

    /// Source: 1 in = 25.4 mm exactly (international yard and pound agreement, 1959) [read].
    #[test]
    fn inch_marks_from_phones_and_copied_text() {
        for text in [
            "18.5\u{201d}",         // ” right double quotation mark (smart punctuation)
            "18.5 \u{201c}",        // “ left double quotation mark
            "18.5''",               // two apostrophes
            "18,5\u{2019}\u{2019}", // ’’ two right single quotation marks
            "18.5\u{2033}",         // ″ double prime
            "18.5\u{2032}\u{2032}", // ′′ two primes
        ] {
            close(len(text), 469.9, text);
        }
        close(len("29\u{201d}"), 736.6, "29”");
        // One apostrophe or prime is a foot mark: no frame length is written in feet.
        assert_eq!(len("18.5'"), None);
        assert_eq!(len("18.5\u{2019}"), None);
        assert_eq!(len("18.5\u{2032}"), None);
    }

    #[test]
    fn units_in_brackets() {
        close(len("470 (mm)"), 470.0, "470 (mm)");
        close(len("47 [cm]"), 470.0, "47 [cm]");
        close(len("18.5 (in)"), 469.9, "18.5 (in)");
        close(
            parse_quantity("65 (°)", Quantity::Angle).ok(),
            65.0,
            "65 (°)",
        );
        assert_eq!(len("470 ()"), None);
        assert_eq!(len("470 (mm"), None);
    }

    /// Source: 1 ft = 304.8 mm and 1 in = 25.4 mm exactly (international yard and pound
    /// agreement, 1959) [read]. 5 ft 10 in = 1524 + 254 = 1778 mm; 6 ft = 1828.8 mm;
    /// 5 ft 10.5 in = 1790.7 mm; 2 ft 9 in = 838.2 mm.
    #[test]
    fn feet_and_inches_for_a_body() {
        for text in [
            "5'10\"",
            "5' 10\"",
            "5'10",
            "5'10''",
            "5\u{2032}10\u{2033}",
            "5\u{2019}10\u{201d}",
            "5 ft 10 in",
            "5ft10",
        ] {
            close(body(text), 1778.0, text);
        }
        close(body("6'"), 1828.8, "6'");
        close(body("5 feet"), 1524.0, "5 feet");
        close(body("5'10.5\""), 1790.7, "5'10.5\"");
        close(body("2'9\""), 838.2, "2'9\"");
        // Inches alone and the other units still read.
        close(body("70\""), 1778.0, "70\"");
        close(body("70''"), 1778.0, "70''");
        close(body("178 cm"), 1780.0, "178 cm");
        close(body("1780"), 1780.0, "1780");
        // Not simple: decimal feet, 12 inches or more, nothing before the mark.
        assert_eq!(body("5.5'"), None);
        assert_eq!(body("5'12\""), None);
        assert_eq!(body("'10\""), None);
        assert_eq!(body("5'x"), None);
        // Feet are a body's unit only.
        assert_eq!(len("5'10\""), None);
    }

    #[test]
    fn the_step_is_one_unit_of_the_last_typed_digit() {
        let step = |t: &str, q| parse_quantity_step(t, q).ok().and_then(|(_, s)| s);
        let close = |a: Option<f64>, b: f64| a.is_some_and(|a| (a - b).abs() < 1e-9);
        assert!(close(step("99 cm", Quantity::Length), 10.0));
        assert!(close(step("99,5 cm", Quantity::Length), 1.0));
        assert!(close(step("470", Quantity::Length), 1.0));
        assert!(close(step("470.5 mm", Quantity::Length), 0.1));
        assert!(close(step("18.5\"", Quantity::Length), 2.54));
        assert!(close(step("18.5”", Quantity::Length), 2.54));
        assert!(close(step("47 (cm)", Quantity::Length), 10.0));
        // Angles keep the default rounding (see the function's doc).
        assert_eq!(step("65°", Quantity::Angle), None);
        assert_eq!(step("64.5", Quantity::Angle), None);
        assert_eq!(step("4.7e2", Quantity::Length), None);
        assert!(parse_quantity_step("long", Quantity::Length).is_err());
    }

    #[test]
    fn angles_and_decimal_commas() {
        close(
            parse_quantity("65\u{2da}", Quantity::Angle).ok(),
            65.0,
            "65˚",
        );
        close(
            parse_quantity("64,5 \u{2da}", Quantity::Angle).ok(),
            64.5,
            "64,5 ˚",
        );
        assert_eq!(parse_quantity("64,5°", Quantity::Angle), Ok(64.5));
        assert_eq!(parse_quantity("65 deg", Quantity::Angle), Ok(65.0));
        assert_eq!(parse_quantity("\u{2212}1", Quantity::Angle), Ok(-1.0));
    }

    #[test]
    fn empty_and_text_have_their_own_messages() {
        assert!(matches!(
            parse_quantity("  ", Quantity::Length),
            Err(UnitError::Empty { .. })
        ));
        let e = parse_quantity("long", Quantity::Length)
            .err()
            .map(|e| e.to_string())
            .unwrap_or_default();
        assert_eq!(
            e,
            "\"long\" is not a number: enter a length such as 470, 470 mm, 47 cm or 18.5 in"
        );
        assert!(
            parse_number("inf").is_none()
                && parse_number("NaN").is_none()
                && parse_number("1e999").is_none()
        );
    }
}
