//! Wheel and tyre sizes: ISO 5775 / ETRTO designations, common names and diameter overrides.
//!
//! Outer radius = BSD / 2 + section height, with section height ≈ section width, plus 2.5 mm for
//! widths under 28 mm.
//! Source: ISO 5775-1 designation `width-BSD`; the height estimate as given in Wikipedia,
//! "ISO 5775" (so 61-622 → 372.0 mm, 25-622 → 338.5 mm).

use crate::error::FieldError;
use serde::{Deserialize, Serialize};

/// A wheel as a person writes it: a designation string or an explicit outer diameter.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(untagged)]
pub enum WheelSpec {
    /// `"62-622"`, `"29x2.4"`, `"27.5x2.5"`, `"26x2.3"`, `"700x32c"`, `"650bx47"`.
    Designation(String),
    /// Outer tyre diameter in millimetres, measured by the user.
    Diameter {
        /// Outer diameter of the inflated tyre, mm.
        diameter_mm: f64,
    },
}

/// A resolved wheel: bead seat diameter (when known) and outer radius.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Wheel {
    /// Bead seat diameter, mm (0 when only a diameter was given).
    pub bsd_mm: f64,
    /// Tyre section width, mm (0 when only a diameter was given).
    pub width_mm: f64,
    /// Outer radius of the unloaded tyre, mm.
    pub radius_mm: f64,
}

/// The accepted forms, listed in every error message.
pub const ACCEPTED_FORMS: &str = "a wheel and tyre size such as 29x2.4, 27.5x2.5, 26x2.3, 24x2.0, \
20x1.75, 700x32c, 650bx47 or 650cx23 (tyre width in inches below 5, else mm), or ETRTO 62-622 \
(width-BSD in mm)";

/// Common size names → bead seat diameter (mm).
/// Source: ISO 5775 bead seat diameters (Wikipedia, "ISO 5775"): 622, 584, 559, 507, 406, 305 read;
/// 571 (650C), 630 (27 in), 590 (650A) from memory.
const NAMES: &[(&str, f64)] = &[
    ("29", 622.0),
    ("28", 622.0),
    ("700", 622.0),
    ("700c", 622.0),
    ("27.5", 584.0),
    ("650b", 584.0),
    ("650", 584.0),
    ("26", 559.0),
    ("24", 507.0),
    ("20", 406.0),
    ("16", 305.0),
    ("650c", 571.0),
    ("650a", 590.0),
    ("27", 630.0),
];

/// Plausible bead seat diameters for an ETRTO designation (any ISO BSD between these).
const BSD_RANGE: (f64, f64) = (150.0, 700.0);
/// Plausible tyre widths, mm.
const WIDTH_RANGE: (f64, f64) = (15.0, 130.0);
/// Plausible outer diameters, mm.
const DIAMETER_RANGE: (f64, f64) = (250.0, 900.0);

/// Section height estimate: width, plus 2.5 mm under 28 mm width (ISO 5775 article, see module docs).
pub fn section_height_mm(width_mm: f64) -> f64 {
    if width_mm < 28.0 {
        width_mm + 2.5
    } else {
        width_mm
    }
}

impl WheelSpec {
    /// Resolves the designation to a wheel.
    ///
    /// # Errors
    /// An unknown designation, or a width, BSD or diameter outside plausible limits, returns a
    /// [`FieldError`] naming `field`, the value and the accepted forms.
    pub fn resolve(&self, field: impl std::fmt::Display) -> Result<Wheel, FieldError> {
        match self {
            WheelSpec::Diameter { diameter_mm } => {
                let d = *diameter_mm;
                if !(d.is_finite() && (DIAMETER_RANGE.0..=DIAMETER_RANGE.1).contains(&d)) {
                    return Err(FieldError::out_of_range(
                        &field.to_string(),
                        "wheel outer diameter",
                        d,
                        DIAMETER_RANGE.0,
                        DIAMETER_RANGE.1,
                        "mm",
                    ));
                }
                Ok(Wheel {
                    bsd_mm: 0.0,
                    width_mm: 0.0,
                    radius_mm: d / 2.0,
                })
            }
            WheelSpec::Designation(text) => parse_designation(text).ok_or_else(|| {
                FieldError::new(
                    "unknown_wheel",
                    field.to_string(),
                    format!(
                        "Wheel size \"{}\" is not recognised: enter {ACCEPTED_FORMS}",
                        text.trim()
                    ),
                )
            }),
        }
    }
}

fn wheel(bsd_mm: f64, width_mm: f64) -> Option<Wheel> {
    let ok = (BSD_RANGE.0..=BSD_RANGE.1).contains(&bsd_mm)
        && (WIDTH_RANGE.0..=WIDTH_RANGE.1).contains(&width_mm);
    ok.then(|| Wheel {
        bsd_mm,
        width_mm,
        radius_mm: bsd_mm / 2.0 + section_height_mm(width_mm),
    })
}

fn parse_designation(text: &str) -> Option<Wheel> {
    let t: String = text
        .trim()
        .to_ascii_lowercase() // designations are ASCII: only ASCII case matters
        .chars()
        .filter(|c| !c.is_whitespace())
        .collect();
    let t = t
        .replace(',', ".")
        .replace(['×', '*'], "x")
        .replace('"', "");
    if let Some((w, b)) = t.split_once('-') {
        let width: f64 = w.parse().ok()?;
        let bsd: f64 = b.parse().ok()?;
        return wheel(bsd, width);
    }
    let (name, size) = t.split_once('x')?;
    let name = name.trim_end_matches("in");
    let bsd = NAMES.iter().find(|(n, _)| *n == name).map(|(_, b)| *b)?;
    let size = size.trim_end_matches("mm");
    let (size, forced_mm) = match size.strip_suffix('c') {
        Some(s) => (s, true),
        None => (size, false),
    };
    let size = size.trim_end_matches("in");
    let number: f64 = size.parse().ok()?;
    let width = if forced_mm || number >= 5.0 {
        number
    } else {
        number * 25.4
    };
    wheel(bsd, width)
}

#[cfg(test)]
mod tests {
    use super::*;

    fn radius(s: &str) -> f64 {
        WheelSpec::Designation(s.into())
            .resolve("w")
            .map(|w| w.radius_mm)
            .unwrap_or(f64::NAN)
    }

    /// Source: ISO 5775 radii as computed in REFERENCES.md (Wikipedia, "ISO 5775"):
    /// 61-622 → 372.0, 61-584 → 353.0, 25-622 → 338.5.
    #[test]
    fn iso_5775_reference_radii() {
        assert!((radius("61-622") - 372.0).abs() < 1e-9);
        assert!((radius("61-584") - 353.0).abs() < 1e-9);
        assert!((radius("25-622") - 338.5).abs() < 1e-9);
    }

    #[test]
    fn common_names() {
        assert!((radius("29x2.4") - (311.0 + 60.96)).abs() < 1e-9);
        assert!((radius("27.5 x 2.5") - (292.0 + 63.5)).abs() < 1e-9);
        assert!((radius("700x32c") - (311.0 + 32.0)).abs() < 1e-9);
        assert!((radius("700x25C") - (311.0 + 27.5)).abs() < 1e-9);
        assert!((radius("650bx47") - (292.0 + 47.0)).abs() < 1e-9);
        assert!((radius("26x2.3") - (279.5 + 58.42)).abs() < 1e-9);
    }

    #[test]
    fn diameter_override() {
        let w = WheelSpec::Diameter { diameter_mm: 750.0 }
            .resolve("w")
            .map(|w| w.radius_mm);
        assert_eq!(w, Ok(375.0));
        assert!(WheelSpec::Diameter {
            diameter_mm: f64::NAN
        }
        .resolve("w")
        .is_err());
        assert!(WheelSpec::Diameter { diameter_mm: -3.0 }
            .resolve("w")
            .is_err());
    }

    #[test]
    fn unknown_designation_lists_accepted_forms() {
        let e = WheelSpec::Designation("31x9".into()).resolve("bikes[0].wheels.front");
        let e = e
            .err()
            .map(|e| (e.code, e.field, e.message))
            .unwrap_or_default();
        assert_eq!(e.0, "unknown_wheel");
        assert_eq!(e.1, "bikes[0].wheels.front");
        assert!(e.2.contains("\"31x9\"") && e.2.contains("62-622"));
    }
}
