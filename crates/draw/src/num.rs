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

/// Appends `v` rounded to 0.1 mm: `12`, `-3.5`, `0` (never `-0`).
pub fn push_mm(out: &mut String, v: f64) {
    out.push_str(Digits::of_mm(v).as_str());
}

/// [`push_mm`] onto bytes (the drawing's polylines are built as bytes and checked as text once
/// each, not number by number).
pub fn push_mm_bytes(out: &mut Vec<u8>, v: f64) {
    out.extend_from_slice(Digits::of_mm(v).bytes());
}

/// The ASCII decimal digit of `d % 10`.
fn digit(d: u64) -> u8 {
    // d % 10 is below 10: the byte is an ASCII digit.
    b'0' + (d % 10) as u8
}

/// Room for the longest number written: a sign, 7 digits ([`LIMIT_TENTHS`]), a point and a
/// tenth, with room to spare.
#[derive(Default)]
struct Digits {
    bytes: [u8; 16],
    len: usize,
}

impl Digits {
    /// `v` rounded to 0.1 mm, digit by digit: the standard formatting machinery cost more than
    /// the digits (a drawing writes about 1 700 numbers; `core::fmt` was most of the drawing's
    /// time in the wasm module).
    fn of_mm(v: f64) -> Self {
        let t = tenths(v);
        let mut buf = Digits::default();
        if t < 0 {
            buf.push(b'-');
        }
        let a = t.unsigned_abs();
        let whole = a / 10;
        let mut unit = 1;
        while unit <= whole / 10 {
            unit *= 10;
        }
        while unit > 0 {
            buf.push(digit(whole / unit));
            unit /= 10;
        }
        let frac = a % 10;
        if frac != 0 {
            buf.push(b'.');
            buf.push(digit(frac));
        }
        buf
    }

    fn bytes(&self) -> &[u8] {
        self.bytes.get(..self.len).unwrap_or_default()
    }

    fn push(&mut self, b: u8) {
        if let Some(slot) = self.bytes.get_mut(self.len) {
            *slot = b;
            self.len += 1;
        }
    }

    fn as_str(&self) -> &str {
        // Only ASCII digits, '-' and '.' are pushed, so this is always valid UTF-8.
        std::str::from_utf8(self.bytes()).unwrap_or_default()
    }
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
    fn every_digit_count_is_written_whole() {
        for (v, want) in [
            (0.0, "0"),
            (9.0, "9"),
            (10.0, "10"),
            (99.9, "99.9"),
            (100.0, "100"),
            (1000.5, "1000.5"),
            (10_000.0, "10000"),
            (123_456.7, "123456.7"),
            (-99_999.9, "-99999.9"),
        ] {
            assert_eq!(mm(v), want);
            assert_eq!(mm(v), reference(v), "{v}");
        }
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
