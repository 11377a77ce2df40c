//! Second readings of what the kernel refused:
//! - a length typed as a bare number that millimetres put outside its allowed range: read again
//!   in centimetres or inches when exactly one of them fits, so a listing's "47.5" (cm) or
//!   "18.5" (in) can be typed on a phone's number pad, which has no letters;
//! - a wheel named without its tyre width (`29`, `27.5"`, `700c`, `650b`): read with the common
//!   stock width the chart importer uses ([`crate::chart::wheels`]), with a note.
//!
//! **Invariant:** a value the kernel accepts as millimetres is never read another way; only a
//! field the kernel refused as out of range is looked at, and only when the person typed no
//! unit. A reading in cm or inches must land inside the allowed range and, for a frame
//! measurement, inside the catalogue's plausible range (the range published frames use), so a
//! half-typed "4" of a reach of 470 is not read as 4 inches. When both units fit, nothing is
//! guessed: the error says both readings and how to say which.
//!
//! Conversions: 1 cm = 10 mm (SI); 1 in = 25.4 mm exactly (international yard and pound
//! agreement, 1959) [read].

use crate::fields::{field, Kind};
use crate::units::parse_number;
use framewise_kernel::error::fmt_num;
use framewise_kernel::{lookup, FieldError};
use std::collections::BTreeMap;

/// Millimetres per centimetre (SI).
const MM_PER_CM: f64 = 10.0;
/// Millimetres per inch, exactly (international yard and pound agreement, 1959) [read].
const MM_PER_IN: f64 = 25.4;

/// What the second reading found for one field.
#[derive(Debug, Clone, PartialEq)]
pub enum Reread {
    /// Read in another unit: the form text to use (`"47.5 cm"`) and a note for the field.
    Unit {
        /// The form field name.
        field: String,
        /// The text with its unit, read in place of the typed text.
        text: String,
        /// One sentence for beside the field: what was read and why.
        note: String,
    },
    /// Both cm and inches fit: nothing is read; `hint` is added to the field's error.
    Either {
        /// The form field name.
        field: String,
        /// One sentence: both readings and how to say which.
        hint: String,
    },
}

/// The second readings of the fields `errors` refused (form field names): lengths out of range,
/// wheel names without a width.
pub fn second_readings(fields: &BTreeMap<String, String>, errors: &[FieldError]) -> Vec<Reread> {
    errors
        .iter()
        .filter_map(|e| match e.code.as_str() {
            "out_of_range" => reread_length(fields, e),
            "unknown_wheel" => reread_wheel(fields, e),
            _ => None,
        })
        .collect()
}

/// A wheel field (`wheels.front`, `changes.wheels.rear` …) whose text names a wheel without its
/// tyre width: the designation with the common width.
fn reread_wheel(fields: &BTreeMap<String, String>, e: &FieldError) -> Option<Reread> {
    field(&e.field).filter(|f| f.kind == Kind::Wheel)?;
    let typed = fields.get(&e.field)?.trim();
    let text = bare_wheel(typed)?.to_string();
    Some(Reread::Unit {
        field: e.field.clone(),
        note: format!(
            "Read as {text}: \"{typed}\" gives no tyre width, so a common stock width was assumed ({}). Type the width, such as 29x2.6, if yours differs.",
            crate::chart::wheels::DEFAULT_WIDTHS
        ),
        text,
    })
}

/// A length refused as below its range, read as cm or inches when exactly one fits.
fn reread_length(fields: &BTreeMap<String, String>, e: &FieldError) -> Option<Reread> {
    let (min, max) = e.allowed?;
    let f = field(&e.field).filter(|f| f.kind == Kind::Mm)?;
    let typed = fields.get(&e.field)?.trim();
    let v = parse_number(typed).filter(|v| *v > 0.0 && *v < min)?;
    let likely = e
        .field
        .strip_prefix("frame.")
        .and_then(lookup)
        .map_or((min, max), |m| m.plausible);
    let fits = |mm: f64| (min..=max).contains(&mm) && (likely.0..=likely.1).contains(&mm);
    let (cm, inch) = (v * MM_PER_CM, v * MM_PER_IN);
    let field = e.field.clone();
    let label = f.label.to_ascii_lowercase();
    match (fits(cm), fits(inch)) {
        (true, false) => Some(unit(field, typed, ("cm", cm), &label, min)),
        (false, true) => Some(unit(field, typed, ("in", inch), &label, min)),
        (true, true) => Some(Reread::Either {
            field,
            hint: format!(
                "In cm that is {} mm, in inches {} mm: type the value in mm, or add cm or in",
                fmt_num(cm),
                fmt_num(inch)
            ),
        }),
        (false, false) => None,
    }
}

/// The reading in `mark` (`"cm"` or `"in"`), `mm` millimetres.
fn unit(field: String, typed: &str, (mark, mm): (&str, f64), label: &str, min: f64) -> Reread {
    Reread::Unit {
        field,
        text: format!("{typed} {mark}"),
        note: format!(
            "Read as {typed} {mark} = {} mm: no unit was typed, and a {label} of {typed} mm is below the allowed {} mm. Type mm, cm or in after the number to say otherwise.",
            fmt_num(mm),
            fmt_num(min)
        ),
    }
}

/// The designation with the chart importer's common width for a wheel named without one (`29`,
/// `27,5"`, `700C`, `650b`, `29 in`), or `None`. ASCII only: the page's module stays small.
fn bare_wheel(typed: &str) -> Option<&'static str> {
    let t: String = typed
        .to_ascii_lowercase()
        .replace(',', ".")
        .chars()
        .filter(|c| !c.is_whitespace() && !matches!(c, '"' | '\u{2033}' | '\u{201d}'))
        .collect();
    let t = t
        .strip_suffix("inches")
        .or_else(|| t.strip_suffix("inch"))
        .or_else(|| t.strip_suffix("in"))
        .unwrap_or(&t);
    crate::chart::wheels::DEFAULTS
        .iter()
        .find(|(name, _)| *name == t)
        .map(|(_, designation)| *designation)
}

#[cfg(test)]
mod tests {
    use super::*;

    fn form(pairs: &[(&str, &str)]) -> BTreeMap<String, String> {
        pairs
            .iter()
            .map(|(k, v)| ((*k).to_string(), (*v).to_string()))
            .collect()
    }

    fn refused(field: &str, v: f64, min: f64, max: f64) -> FieldError {
        FieldError::out_of_range(field, "x", v, min, max, "mm")
    }

    #[test]
    fn a_reach_in_cm_or_inches_is_read_again() {
        // Reach: allowed 100–800 mm, plausible 250–560 mm (kernel catalogue).
        let fields = form(&[("frame.reach_mm", "47,5"), ("frame.stack_mm", "18.5")]);
        let errors = [
            refused("frame.reach_mm", 47.5, 100.0, 800.0),
            refused("frame.stack_mm", 18.5, 250.0, 900.0),
        ];
        let got = second_readings(&fields, &errors);
        let Some(Reread::Unit { text, note, .. }) = got.first() else {
            panic!("{got:?}");
        };
        assert_eq!(text, "47,5 cm");
        assert!(note.starts_with("Read as 47,5 cm = 475 mm"), "{note}");
        // Stack 18.5: 185 mm (cm) is under the plausible 450, 469.9 mm (in) inside it.
        let Some(Reread::Unit { text, .. }) = got.get(1) else {
            panic!("{got:?}");
        };
        assert_eq!(text, "18.5 in");
    }

    #[test]
    fn both_units_fitting_or_neither_reads_nothing() {
        // A rider height of 70: 700 mm (cm) is too short, 1778 mm (in) fits.
        let fields = form(&[
            ("rider.height_mm", "70"),
            ("setup.stem_mm", "0.5"),
            ("frame.reach_mm", "4"),
        ]);
        let errors = [
            refused("rider.height_mm", 70.0, 1000.0, 2300.0),
            // A made-up range in which both readings fit.
            refused("setup.stem_mm", 0.5, 1.0, 200.0),
            // A half-typed reach: 40 mm (cm) and 101.6 mm (in) are not plausible reaches.
            refused("frame.reach_mm", 4.0, 100.0, 800.0),
        ];
        let got = second_readings(&fields, &errors);
        assert_eq!(got.len(), 2, "{got:?}");
        assert!(matches!(&got[0], Reread::Unit { text, .. } if text == "70 in"));
        let Reread::Either { field, hint } = &got[1] else {
            panic!("{got:?}");
        };
        assert_eq!(field, "setup.stem_mm");
        assert!(hint.contains("5 mm, in inches 12.7 mm"), "{hint}");
    }

    #[test]
    fn a_wheel_named_without_its_width_gets_the_common_width_and_says_so() {
        let fields = form(&[
            ("wheels.front", "29\""),
            ("changes.wheels.rear", "27,5 in"),
            ("wheels.rear", "31"),
            ("changes.wheels.front", "700C"),
        ]);
        let errors: Vec<FieldError> = [
            "wheels.front",
            "changes.wheels.rear",
            "wheels.rear",
            "changes.wheels.front",
        ]
        .iter()
        .map(|f| FieldError::new("unknown_wheel", *f, "not recognised"))
        .collect();
        let got = second_readings(&fields, &errors);
        let texts: Vec<&str> = got
            .iter()
            .filter_map(|r| match r {
                Reread::Unit { text, .. } => Some(text.as_str()),
                Reread::Either { .. } => None,
            })
            .collect();
        assert_eq!(texts, ["29x2.4", "27.5x2.4", "700x32c"], "{got:?}");
        let Reread::Unit { note, .. } = &got[0] else {
            panic!("{got:?}");
        };
        assert!(
            note.starts_with("Read as 29x2.4: \"29\"\" gives no tyre width"),
            "{note}"
        );
    }

    #[test]
    fn typed_units_too_large_values_and_other_errors_are_left_alone() {
        let fields = form(&[
            ("frame.reach_mm", "47 cm"),
            ("frame.stack_mm", "6300"),
            ("frame.head_angle_deg", "6.5"),
        ]);
        let errors = [
            refused("frame.reach_mm", 47.0, 100.0, 800.0),
            refused("frame.stack_mm", 6300.0, 250.0, 900.0),
            refused("frame.head_angle_deg", 6.5, 45.0, 85.0),
            FieldError::new("bad_number", "frame.reach_mm", "no"),
        ];
        assert!(second_readings(&fields, &errors).is_empty());
    }
}
