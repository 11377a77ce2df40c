//! Numbers as people type them: units with their usual marks, decimal commas.
//!
//! Lengths: `470`, `470 mm`, `47 cm`, `18.5 in`, `18.5"`, `18,5″`. Angles: `65`, `65°`,
//! `65 deg`, `64,5º`. Plain numbers for percent and kilograms, with `%` / `kg` accepted.

use std::fmt;

/// What kind of quantity a field holds.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Quantity {
    /// Length, result in millimetres.
    Length,
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

/// Parses a typed value of the given quantity into mm, degrees, percent or kg.
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
    let lower = t.to_ascii_lowercase();
    let bad = || UnitError::NotANumber {
        text: t.to_string(),
        accepted,
    };
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
    let lower = text.trim().to_ascii_lowercase();
    if q == Quantity::Angle {
        return Ok((value, None));
    }
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

fn split_unit(t: &str, q: Quantity) -> Option<(&str, f64)> {
    let units: &[(&str, f64)] = match q {
        Quantity::Length => &[
            ("mm", 1.0),
            ("cm", 10.0),
            ("inches", 25.4),
            ("inch", 25.4),
            ("in", 25.4),
            ("\"", 25.4),
            ("″", 25.4),
            ("m", 1000.0),
        ],
        Quantity::Angle => &[
            ("degrees", 1.0),
            ("degree", 1.0),
            ("deg", 1.0),
            ("°", 1.0),
            ("º", 1.0),
        ],
        Quantity::Percent => &[("%", 1.0), ("pct", 1.0)],
        Quantity::Mass => &[("kg", 1.0), ("lb", 0.453_592_37), ("lbs", 0.453_592_37)],
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

    #[test]
    fn the_step_is_one_unit_of_the_last_typed_digit() {
        let step = |t: &str, q| parse_quantity_step(t, q).ok().and_then(|(_, s)| s);
        let close = |a: Option<f64>, b: f64| a.is_some_and(|a| (a - b).abs() < 1e-9);
        assert!(close(step("99 cm", Quantity::Length), 10.0));
        assert!(close(step("99,5 cm", Quantity::Length), 1.0));
        assert!(close(step("470", Quantity::Length), 1.0));
        assert!(close(step("470.5 mm", Quantity::Length), 0.1));
        assert!(close(step("18.5\"", Quantity::Length), 2.54));
        // Angles keep the default rounding (see the function's doc).
        assert_eq!(step("65°", Quantity::Angle), None);
        assert_eq!(step("64.5", Quantity::Angle), None);
        assert_eq!(step("4.7e2", Quantity::Length), None);
        assert!(parse_quantity_step("long", Quantity::Length).is_err());
    }

    #[test]
    fn angles_and_decimal_commas() {
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
