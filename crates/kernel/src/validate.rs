//! Range checks for scenario fields, collecting every problem at once.

use crate::error::FieldError;
use std::fmt;

/// A field's path `prefix.key` (e.g. `bikes[0].setup` and `stem_mm`), written out only when an
/// error names it: the checks run on every edit and most find nothing to report.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub struct Path<'a>(pub &'a str, pub &'a str);

impl fmt::Display for Path<'_> {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        write!(f, "{}.{}", self.0, self.1)
    }
}

impl From<Path<'_>> for String {
    fn from(p: Path<'_>) -> String {
        p.to_string()
    }
}

/// What a field allows: its label for messages, range and unit symbol.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Limit<'a> {
    /// Human label, e.g. "fork offset".
    pub label: &'a str,
    /// Smallest allowed value.
    pub min: f64,
    /// Largest allowed value.
    pub max: f64,
    /// Unit symbol, e.g. "mm".
    pub unit: &'a str,
}

/// Shorthand constructor for a [`Limit`].
pub const fn limit<'a>(label: &'a str, min: f64, max: f64, unit: &'a str) -> Limit<'a> {
    Limit {
        label,
        min,
        max,
        unit,
    }
}

/// Collects field errors.
#[derive(Debug, Default)]
pub struct Checker {
    /// The errors found so far.
    pub errors: Vec<FieldError>,
}

impl Checker {
    /// Checks an optional number against the limit; `None` passes.
    /// Returns the value when present and valid.
    pub fn range(
        &mut self,
        field: impl fmt::Display,
        lim: Limit<'_>,
        value: Option<f64>,
    ) -> Option<f64> {
        let v = value?;
        if v.is_finite() && (lim.min..=lim.max).contains(&v) {
            Some(v)
        } else {
            self.errors.push(FieldError::out_of_range(
                &field.to_string(),
                lim.label,
                v,
                lim.min,
                lim.max,
                lim.unit,
            ));
            None
        }
    }

    /// Like [`Checker::range`] with a default used when the value is absent or bad.
    pub fn range_or(
        &mut self,
        field: impl fmt::Display,
        lim: Limit<'_>,
        value: Option<f64>,
        default: f64,
    ) -> f64 {
        self.range(field, lim, value).unwrap_or(default)
    }

    /// True when no error was found.
    pub fn ok(&self) -> bool {
        self.errors.is_empty()
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn collects_every_problem() {
        let mut c = Checker::default();
        assert_eq!(
            c.range("a", limit("a", 0.0, 1.0, "mm"), Some(0.5)),
            Some(0.5)
        );
        assert_eq!(c.range("b", limit("b", 0.0, 1.0, "mm"), Some(2.0)), None);
        assert_eq!(
            c.range_or("c", limit("c", 0.0, 1.0, "mm"), Some(f64::INFINITY), 0.25),
            0.25
        );
        assert_eq!(
            c.range_or("d", limit("d", 0.0, 1.0, "mm"), None, 0.75),
            0.75
        );
        let fields: Vec<_> = c.errors.iter().map(|e| e.field.as_str()).collect();
        assert_eq!(fields, ["b", "c"]);
    }
}
