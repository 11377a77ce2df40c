//! Typed errors and warnings a person can act on.
//!
//! Every error names the field (as a dotted JSON path such as `bikes[0].frame.reach_mm`), the value
//! that was given and what is allowed. Validation collects every problem at once.

use serde::Serialize;
use std::fmt;

/// One problem with one input field.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct FieldError {
    /// Stable machine-readable code, e.g. `out_of_range`, `not_a_number`, `unknown_key`.
    pub code: String,
    /// Dotted path of the field, e.g. `bikes[0].frame.head_angle_deg`.
    pub field: String,
    /// One sentence naming the field, the value and what is allowed.
    pub message: String,
    /// For a value outside its range: the allowed `(min, max)` in the field's unit, so that a
    /// caller can offer another reading of the typed text (not part of the JSON).
    #[serde(skip)]
    pub allowed: Option<(f64, f64)>,
}

impl FieldError {
    /// A new error; `message` should name the value and the allowed range.
    pub fn new(code: &str, field: impl Into<String>, message: impl Into<String>) -> Self {
        Self {
            code: code.to_string(),
            field: field.into(),
            message: message.into(),
            allowed: None,
        }
    }

    /// The standard "must be between" message for a value outside `[min, max]`.
    pub fn out_of_range(
        field: &str,
        label: &str,
        value: f64,
        min: f64,
        max: f64,
        unit: &str,
    ) -> Self {
        // A sentence: the label's first letter in capitals ("rider height" → "Rider height";
        // labels are ASCII, and Unicode case tables would add kilobytes to the page's module).
        let mut label = label.to_string();
        if let Some(first) = label.get_mut(..1) {
            first.make_ascii_uppercase();
        }
        // Degrees and percent follow the number directly ("85°"); other units after a space.
        let unit = match unit {
            "°" | "%" | "" => unit.to_string(),
            u => format!(" {u}"),
        };
        let message = if value.is_finite() {
            format!(
                "{label} must be between {} and {}{unit}, got {}",
                fmt_num(min),
                fmt_num(max),
                fmt_num(value)
            )
        } else {
            format!(
                "{label} must be a finite number between {} and {}{unit}, got {value}",
                fmt_num(min),
                fmt_num(max)
            )
        };
        let mut e = Self::new(
            if value.is_finite() {
                "out_of_range"
            } else {
                "not_a_number"
            },
            field,
            message,
        );
        e.allowed = value.is_finite().then_some((min, max));
        e
    }
}

impl fmt::Display for FieldError {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        write!(f, "{}: {}", self.field, self.message)
    }
}

impl std::error::Error for FieldError {}

/// A non-fatal observation: an implausible value, an inconsistency, a caution.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Warning {
    /// Stable machine-readable code, e.g. `inconsistent`, `implausible`, `caution_fork_length`.
    pub code: String,
    /// One or two plain sentences.
    pub message: String,
}

impl Warning {
    /// A new warning.
    pub fn new(code: &str, message: impl Into<String>) -> Self {
        Self {
            code: code.to_string(),
            message: message.into(),
        }
    }
}

/// A published value, the value the other numbers give and their difference, as text with the
/// unit: whole millimetres or tenths of a degree, one digit more when the difference would
/// otherwise read as one step or less ("0.1° away" for 0.06°), so the difference is never
/// shown smaller or larger than the values beside it show.
pub fn fmt_disagreement(given: f64, solved: f64, degrees: bool) -> [String; 3] {
    let (step, unit) = if degrees { (0.1, "°") } else { (1.0, " mm") };
    let fine = (solved - given).abs() <= step * 1.5;
    let d = usize::from(degrees) + usize::from(fine);
    let n = |v: f64| {
        let s = format!("{v:.d$}");
        match s.strip_prefix('-') {
            // "-0.0" is written without its sign.
            Some(rest) if rest.bytes().all(|b| b == b'0' || b == b'.') => format!("{rest}{unit}"),
            _ => format!("{}{unit}", minus(&s)),
        }
    };
    [n(given), n(solved), n((solved - given).abs())]
}

/// A measured value for a message, as the page writes it: whole millimetres ("183 mm") or
/// tenths of a degree ("45.0°"); "-0" is written "0", a negative value with a minus sign
/// ([`minus`]).
pub fn fmt_measure(v: f64, unit: crate::catalogue::Unit) -> String {
    let s = match unit {
        crate::catalogue::Unit::Mm => format!("{v:.0} mm"),
        crate::catalogue::Unit::Deg => format!("{v:.1}°"),
    };
    match s.strip_prefix('-') {
        Some(rest) if rest.bytes().all(|b| !b.is_ascii_digit() || b == b'0') => rest.to_string(),
        _ => minus(&s),
    }
}

/// A catalogue label inside a sentence: its first letter in lower case unless the label starts
/// with an abbreviation ("Head tube angle" → "head tube angle", "BB drop" stays).
pub fn in_sentence(label: &str) -> String {
    let mut chars = label.chars();
    let (Some(first), second) = (chars.next(), chars.next()) else {
        return label.to_string();
    };
    if second.is_some_and(|c| c.is_ascii_uppercase()) {
        return label.to_string();
    }
    format!(
        "{}{}",
        first.to_ascii_lowercase(),
        label.get(first.len_utf8()..).unwrap_or("")
    )
}

/// Formats a number for a message: at most two decimals, no trailing zeros, a negative number
/// with a minus sign ([`minus`]): "between −150 and 150 mm".
pub fn fmt_num(v: f64) -> String {
    if !v.is_finite() {
        return format!("{v}");
    }
    let s = format!("{v:.2}");
    let s = s.trim_end_matches('0').trim_end_matches('.');
    if s == "-0" {
        "0".to_string()
    } else {
        minus(s)
    }
}

/// A number's text for a sentence a person reads, its leading hyphen-minus made a minus sign
/// (U+2212, as type sets a negative number: "−150", not "-150"). Only for messages: JSON
/// numbers, links and the drawing keep the hyphen-minus, and the form reads either back
/// (`framewise_formats::units::parse_number`).
// Called from the three number writers above: one copy keeps the page's module small.
#[inline(never)]
pub fn minus(s: &str) -> String {
    match s.strip_prefix('-') {
        Some(rest) => format!("\u{2212}{rest}"),
        None => s.to_string(),
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn out_of_range_message_names_field_value_and_range() {
        let e = FieldError::out_of_range(
            "frame.head_angle_deg",
            "head tube angle",
            95.0,
            45.0,
            85.0,
            "°",
        );
        assert_eq!(e.code, "out_of_range");
        assert_eq!(e.allowed, Some((45.0, 85.0)));
        assert_eq!(
            e.message,
            "Head tube angle must be between 45 and 85°, got 95"
        );
        let e = FieldError::out_of_range("x", "reach", f64::NAN, 0.0, 1.0, "mm");
        assert_eq!(e.code, "not_a_number");
        assert!(e.message.contains("NaN"));
    }

    #[test]
    fn disagreements_show_a_digit_more_when_the_difference_is_one_step() {
        assert_eq!(
            fmt_disagreement(64.5, 64.56, true),
            ["64.50°", "64.56°", "0.06°"]
        );
        assert_eq!(
            fmt_disagreement(64.5, 65.1, true),
            ["64.5°", "65.1°", "0.6°"]
        );
        assert_eq!(
            fmt_disagreement(1272.0, 1232.1, false),
            ["1272 mm", "1232 mm", "40 mm"]
        );
        assert_eq!(
            fmt_disagreement(440.0, 439.42, false),
            ["440.0 mm", "439.4 mm", "0.6 mm"]
        );
    }

    #[test]
    fn measures_are_whole_mm_or_tenths_of_a_degree() {
        use crate::catalogue::Unit;
        assert_eq!(fmt_measure(183.16, Unit::Mm), "183 mm");
        assert_eq!(fmt_measure(-0.4, Unit::Mm), "0 mm");
        assert_eq!(fmt_measure(-12.6, Unit::Mm), "\u{2212}13 mm");
        assert_eq!(fmt_measure(45.0, Unit::Deg), "45.0°");
        assert_eq!(fmt_measure(64.96, Unit::Deg), "65.0°");
    }

    #[test]
    fn labels_in_a_sentence_keep_their_abbreviations() {
        assert_eq!(in_sentence("Head tube angle"), "head tube angle");
        assert_eq!(in_sentence("BB drop"), "BB drop");
        assert_eq!(in_sentence("Fork axle-to-crown"), "fork axle-to-crown");
        assert_eq!(in_sentence(""), "");
    }

    #[test]
    fn numbers_are_trimmed() {
        assert_eq!(fmt_num(65.0), "65");
        assert_eq!(fmt_num(64.25), "64.25");
        assert_eq!(fmt_num(-0.001), "0");
    }

    #[test]
    fn negative_numbers_in_messages_have_a_minus_sign() {
        assert_eq!(fmt_num(-150.0), "\u{2212}150");
        assert_eq!(fmt_num(-2.5), "\u{2212}2.5");
        assert_eq!(minus("-12"), "\u{2212}12");
        assert_eq!(minus("12"), "12");
        let e = FieldError::out_of_range(
            "setup.stem_angle_deg",
            "stem angle",
            -60.0,
            -45.0,
            45.0,
            "°",
        );
        assert_eq!(
            e.message,
            "Stem angle must be between \u{2212}45 and 45°, got \u{2212}60"
        );
        // The range for a second reading keeps the numbers themselves.
        assert_eq!(e.allowed, Some((-45.0, 45.0)));
        assert_eq!(
            fmt_disagreement(-10.0, -30.0, false),
            ["\u{2212}10 mm", "\u{2212}30 mm", "20 mm"]
        );
    }
}
