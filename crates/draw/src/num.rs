//! The drawing's number writer: a length in millimetres as a multiple of 0.1 mm, written with
//! integer arithmetic. Never `NaN`, `inf` or `-0`; no trailing `.0`; no exponent.
//!
//! Why our own: `f64`'s `Display` and `format!` per number were most of the drawing's cost, and
//! the drawing needs no more than 0.1 mm (a tenth of a millimetre of bike is far below a pixel).

/// The largest magnitude written, in tenths of a millimetre (1 km of drawing): a bound so the
/// integer conversion can never overflow; the kernel's outlines are a few metres at most.
const LIMIT_TENTHS: i64 = 10_000_000;

/// `v` in tenths of a millimetre, rounded half away from zero, clamped to ±[`LIMIT_TENTHS`];
/// a non-finite `v` (which the kernel never sends) becomes 0 rather than text a browser rejects.
pub fn tenths(v: f64) -> i64 {
    if !v.is_finite() {
        return 0;
    }
    // `as` saturates and the clamp bounds it: no overflow, no panic.
    ((v * 10.0).round() as i64).clamp(-LIMIT_TENTHS, LIMIT_TENTHS)
}

/// Appends `v` rounded to 0.1 mm: `12`, `-3.5`, `0` (never `-0`). Integers are written by the
/// standard library's integer formatting (cheap, unlike `f64`'s).
pub fn push_mm(out: &mut String, v: f64) {
    use std::fmt::Write;
    let t = tenths(v);
    let sign = if t < 0 { "-" } else { "" };
    let a = t.unsigned_abs();
    // Writing to a String cannot fail.
    let _ = match a % 10 {
        0 => write!(out, "{sign}{}", a / 10),
        frac => write!(out, "{sign}{}.{frac}", a / 10),
    };
}

/// `v` rounded to 0.1 mm as a new string.
pub fn mm(v: f64) -> String {
    let mut s = String::with_capacity(8);
    push_mm(&mut s, v);
    s
}

#[cfg(test)]
mod tests {
    use super::*;

    /// The expected text, computed independently of the writer: Rust's own `{:.1}` formatting of
    /// the value rounded to tenths, with a trailing `.0` and a `-0` removed.
    fn reference(v: f64) -> String {
        let s = format!("{:.1}", (v * 10.0).round() / 10.0);
        let s = s.strip_suffix(".0").unwrap_or(&s).to_string();
        if s == "-0" {
            "0".into()
        } else {
            s
        }
    }

    #[test]
    fn rounds_to_tenths_half_away_from_zero() {
        assert_eq!(mm(12.34), "12.3");
        assert_eq!(mm(12.35), "12.4");
        assert_eq!(mm(0.05), "0.1");
        assert_eq!(mm(-0.05), "-0.1");
        assert_eq!(mm(1234.96), "1235");
        assert_eq!(mm(372.0), "372");
    }

    #[test]
    fn negatives_keep_their_sign_and_tenths() {
        assert_eq!(mm(-435.0), "-435");
        assert_eq!(mm(-0.7), "-0.7");
        assert_eq!(mm(-12.25), "-12.3");
    }

    #[test]
    fn minus_zero_is_never_written() {
        for v in [-0.0, -0.04, -0.000_001, 0.04] {
            assert_eq!(mm(v), "0", "{v}");
        }
    }

    #[test]
    fn nan_and_infinity_are_never_written() {
        for v in [f64::NAN, f64::INFINITY, f64::NEG_INFINITY] {
            assert_eq!(mm(v), "0");
        }
        assert_eq!(mm(1e300), "1000000", "clamped to 1 km");
        assert_eq!(mm(-1e300), "-1000000");
    }

    #[test]
    fn agrees_with_std_formatting_over_a_sweep() {
        // Source: Rust std `{:.1}` formatting of the value rounded to tenths (an independent
        // implementation); steps of 0.37 mm cover every tenth digit and both signs.
        let mut v = -2000.0;
        while v < 2000.0 {
            assert_eq!(mm(v), reference(v), "{v}");
            v += 0.37;
        }
    }
}
