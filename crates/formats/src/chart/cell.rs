//! One cell of a pasted chart: a number with its unit mark, a range, two alternatives, or nothing.
//!
//! Accepted: `470`, `470 mm`, `47,0 cm`, `18.5"`, `18½″`, `17 1/2 in`, `65°`, `65º`, `65 deg`,
//! `1,180` (thousands comma), `1.180,5` (European), `470-475` (a range), `65/64.5` (two settings),
//! footnote marks (`*`, `†`, `¹`, `(1)`, `[a]`), `~470`, and `-`, `–`, `n/a` for "not given".

/// A unit written beside a number or in a label.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Mark {
    /// Millimetres.
    Mm,
    /// Centimetres.
    Cm,
    /// Inches.
    In,
    /// Degrees.
    Deg,
}

impl Mark {
    /// Millimetres per unit (degrees: 1).
    pub fn factor(self) -> f64 {
        match self {
            Mark::Mm | Mark::Deg => 1.0,
            Mark::Cm => 10.0,
            Mark::In => 25.4,
        }
    }

    /// The short name used in notes and question options.
    pub fn name(self) -> &'static str {
        match self {
            Mark::Mm => "mm",
            Mark::Cm => "cm",
            Mark::In => "in",
            Mark::Deg => "deg",
        }
    }

    /// The name used in sentences: "mm", "cm", "inches", "degrees".
    pub fn words(self) -> &'static str {
        match self {
            Mark::Mm => "mm",
            Mark::Cm => "cm",
            Mark::In => "inches",
            Mark::Deg => "degrees",
        }
    }

    /// Reads a unit word or mark (`mm`, `millimetres`, `cm`, `in`, `inches`, `"`, `″`, `°`, `º`,
    /// `deg`, `degrees`), ignoring case and surrounding space.
    pub fn from_word(word: &str) -> Option<Mark> {
        let w = word.trim().trim_end_matches('.').to_lowercase();
        match w.as_str() {
            "mm" | "millimetre" | "millimetres" | "millimeter" | "millimeters" => Some(Mark::Mm),
            "cm" | "centimetre" | "centimetres" | "centimeter" | "centimeters" => Some(Mark::Cm),
            "in" | "inch" | "inches" | "\"" | "″" | "''" | "”" | "“" => Some(Mark::In),
            "°" | "º" | "˚" | "deg" | "degree" | "degrees" => Some(Mark::Deg),
            _ => None,
        }
    }
}

/// How many numbers a cell carries.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum Spread {
    /// One number.
    Single,
    /// A range `lo-hi`; the value is its midpoint.
    Range(f64, f64),
    /// Two alternatives `a/b` (e.g. a flip-chip's two settings); the value is `a`.
    Pair(f64, f64),
}

/// A parsed number with its mark.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Num {
    /// The number as written (before unit conversion).
    pub value: f64,
    /// The unit written beside it, if any.
    pub mark: Option<Mark>,
    /// Single value, range or pair.
    pub spread: Spread,
    /// How it was rounded, in the written unit: one unit of the last written digit (`99` → 1,
    /// `64.5` → 0.1), the fraction's step (`17½` → 0.5), for a range its width (`64–65` → 1).
    pub step: f64,
}

/// What a cell holds.
#[derive(Debug, Clone, PartialEq)]
pub enum Cell {
    /// Blank, a dash or "n/a".
    Missing,
    /// A number.
    Number(Num),
    /// Text that is not a number.
    Text,
}

/// Characters that only ever mark a footnote or an approximation.
const FOOTNOTE_CHARS: &[char] = &[
    '*', '†', '‡', '§', '¹', '²', '³', '⁴', '⁵', '⁶', '⁷', '⁸', '⁹', '⁰', '~', '≈', '±',
];

/// Whether a line of text is a footnote: it starts with a footnote mark (`*`, `†`, `‡`, `§`,
/// a superscript digit) or a bracketed one (`(1)`, `[a]`). "¹ measured with 0 mm spacers" says
/// how one row was measured, not the unit of the chart.
pub fn is_footnote_line(line: &str) -> bool {
    let t = line.trim_start();
    let Some(first) = t.chars().next() else {
        return false;
    };
    if FOOTNOTE_CHARS.contains(&first) && !matches!(first, '~' | '≈' | '±') {
        return true;
    }
    let close = match first {
        '(' => ')',
        '[' => ']',
        _ => return false,
    };
    let inner = t
        .get(1..)
        .and_then(|r| r.split_once(close))
        .map_or("", |(inner, _)| inner);
    let digits = (1..=2).contains(&inner.len()) && inner.chars().all(|c| c.is_ascii_digit());
    let letter = inner.chars().count() == 1 && inner.chars().all(char::is_alphabetic);
    digits || letter
}

/// Removes footnote marks: the characters above, up to three trailing `(1)`/`[a]`/`(ii)` groups
/// (digits, one letter or a small roman numeral), and a leading `ca.`/`approx.`.
pub fn strip_footnotes(text: &str) -> String {
    let mut s: String = text
        .chars()
        .filter(|c| !FOOTNOTE_CHARS.contains(c))
        .collect();
    loop {
        let t = s.trim_end();
        let Some(open) = t
            .ends_with(')')
            .then(|| t.rfind('('))
            .or_else(|| t.ends_with(']').then(|| t.rfind('[')))
            .flatten()
        else {
            break;
        };
        let inner = t.get(open + 1..t.len().saturating_sub(1)).unwrap_or("");
        // Footnote groups: digits, one letter, or a small roman numeral ("(eff)" is a word).
        let digits = inner.len() <= 3 && inner.chars().all(|c| c.is_ascii_digit());
        let letter = inner.chars().count() == 1 && inner.chars().all(char::is_alphabetic);
        let roman = matches!(inner, "ii" | "iii" | "iv");
        if !(digits || letter || roman) || Mark::from_word(inner).is_some() {
            break;
        }
        s = t.get(..open).unwrap_or("").to_string();
    }
    let t = s.trim();
    let lower = t.to_lowercase();
    for prefix in ["approx.", "approx", "ca."] {
        if lower.starts_with(prefix) {
            return t.get(prefix.len()..).unwrap_or("").trim().to_string();
        }
    }
    t.to_string()
}

/// Parses a cell. `thousands_dot`: the chart writes decimal commas, so `1.180` means 1180.
pub fn parse_cell(text: &str, thousands_dot: bool) -> Cell {
    // No number with its unit and marks is this long.
    if text.len() > 64 {
        return Cell::Text;
    }
    let s = strip_footnotes(text);
    let s = s.trim().trim_start_matches('\'').trim();
    let lower = s.to_lowercase();
    if matches!(
        lower.as_str(),
        "" | "-" | "–" | "—" | "n/a" | "na" | "n.a." | "-/-" | "/" | "?" | "tbc" | "tba" | "x"
    ) {
        return Cell::Missing;
    }
    parse_spread(&lower, thousands_dot).map_or(Cell::Text, Cell::Number)
}

fn parse_spread(s: &str, thousands_dot: bool) -> Option<Num> {
    if let Some(n) = parse_marked(s, thousands_dot) {
        return Some(n);
    }
    // One length in two units: "470 mm (18.5")", "470 mm / 18.5 in".
    let dual = s
        .strip_suffix(')')
        .and_then(|t| t.split_once('('))
        .or_else(|| s.split_once('/'));
    if let Some(n) = dual.and_then(|(a, b)| same_length(a, b, thousands_dot)) {
        return Some(n);
    }
    for sep in [" to ", "–", "—", "-"] {
        if let Some((a, b)) = s.split_once(sep) {
            if a.trim().is_empty() {
                continue;
            }
            let (a, b) = (
                parse_marked(a, thousands_dot)?,
                parse_marked(b, thousands_dot)?,
            );
            let lo = a.value.min(b.value);
            let hi = a.value.max(b.value);
            return Some(Num {
                value: (lo + hi) / 2.0,
                mark: b.mark.or(a.mark),
                spread: Spread::Range(lo, hi),
                step: a.step.max(b.step).max(hi - lo),
            });
        }
    }
    let (a, b) = s.split_once('/')?;
    let (a, b) = (
        parse_marked(a, thousands_dot)?,
        parse_marked(b, thousands_dot)?,
    );
    Some(Num {
        value: a.value,
        mark: a.mark.or(b.mark),
        spread: Spread::Pair(a.value, b.value),
        step: a.step.max(b.step),
    })
}

/// `a` when `a` and `b` carry different units and say the same length within 2 %.
fn same_length(a: &str, b: &str, thousands_dot: bool) -> Option<Num> {
    let (a, b) = (
        parse_marked(a, thousands_dot)?,
        parse_marked(b, thousands_dot)?,
    );
    let (ma, mb) = (a.mark?, b.mark?);
    let (la, lb) = (a.value * ma.factor(), b.value * mb.factor());
    let agree = ma != mb && ma != Mark::Deg && mb != Mark::Deg;
    (agree && (la - lb).abs() <= 0.02 * la.abs().max(lb.abs())).then_some(a)
}

/// A number followed by an optional unit mark.
fn parse_marked(s: &str, thousands_dot: bool) -> Option<Num> {
    let s = s.trim();
    let split = s
        .char_indices()
        .find(|(_, c)| !(c.is_ascii_digit() || matches!(c, '.' | ',' | '-' | '+' | '−' | ' ')))
        .map_or(s.len(), |(i, _)| i);
    let (num, unit) = (s.get(..split)?, s.get(split..)?.trim());
    let (num, unit, frac) = split_fraction(num, unit);
    let mark = if unit.is_empty() {
        None
    } else {
        Some(Mark::from_word(unit)?)
    };
    let value = parse_plain(num, thousands_dot)? + frac;
    let step = if frac > 0.0 {
        fraction_step(frac)
    } else {
        plain_step(num, thousands_dot)
    };
    Some(Num {
        value,
        mark,
        spread: Spread::Single,
        step,
    })
}

/// The step of a vulgar fraction: ½ → 0.5, ¾ → 0.25, ⅜ → 0.125 (up to 1/32).
fn fraction_step(frac: f64) -> f64 {
    [2.0, 4.0, 8.0, 16.0, 32.0]
        .into_iter()
        .find(|b| (frac * b - (frac * b).round()).abs() < 1e-9)
        .map_or(1.0 / 32.0, |b| 1.0 / b)
}

/// One unit of the last written digit of a plain number (`470` → 1, `1.180,5` → 0.1); 1 when
/// the text does not read.
pub fn plain_step(text: &str, thousands_dot: bool) -> f64 {
    let decimals = normalise(text, thousands_dot)
        .and_then(|n| n.split_once('.').map(|(_, f)| f.len()))
        .unwrap_or(0);
    i32::try_from(decimals).map_or(1.0, |d| 10f64.powi(-d))
}

/// Splits a trailing vulgar fraction: `17½`, `17 1/2` (the `/2` arrives in `unit`).
fn split_fraction<'a>(num: &'a str, unit: &'a str) -> (&'a str, &'a str, f64) {
    const VULGAR: &[(char, f64)] = &[
        ('½', 0.5),
        ('¼', 0.25),
        ('¾', 0.75),
        ('⅛', 0.125),
        ('⅜', 0.375),
        ('⅝', 0.625),
        ('⅞', 0.875),
    ];
    for (c, v) in VULGAR {
        if let Some(rest) = unit.strip_prefix(*c) {
            let num = if num.trim().is_empty() { "0" } else { num };
            return (num, rest.trim(), *v);
        }
    }
    if let (Some((whole, top)), Some(rest)) = (num.trim().rsplit_once(' '), unit.strip_prefix('/'))
    {
        let digits: String = rest.chars().take_while(char::is_ascii_digit).collect();
        if let (Ok(t), Ok(b)) = (top.parse::<u32>(), digits.parse::<u32>()) {
            if matches!(b, 2 | 4 | 8 | 16 | 32) && t < b {
                let after = rest.get(digits.len()..).unwrap_or("").trim();
                return (whole, after, f64::from(t) / f64::from(b));
            }
        }
    }
    (num, unit, 0.0)
}

/// A plain decimal number: decimal point or comma, thousands separators, a sign.
pub fn parse_plain(text: &str, thousands_dot: bool) -> Option<f64> {
    let normal = normalise(text, thousands_dot)?;
    let v: f64 = normal.parse().ok()?;
    v.is_finite().then_some(v)
}

/// The number as Rust reads it (`1.180,5` → `1180.5`), or `None` when it is not one.
fn normalise(text: &str, thousands_dot: bool) -> Option<String> {
    let t = text.trim().replace('−', "-");
    let t = collapse_spaced_thousands(&t)?;
    let has_comma = t.contains(',');
    let has_dot = t.contains('.');
    let normal = if has_comma && has_dot {
        let (dec, other) = if t.rfind(',') > t.rfind('.') {
            (',', '.')
        } else {
            ('.', ',')
        };
        t.replace(other, "").replace(dec, ".")
    } else if has_comma {
        if is_thousands(&t, ',') {
            t.replace(',', "")
        } else {
            t.replace(',', ".")
        }
    } else if has_dot && thousands_dot && is_thousands(&t, '.') {
        t.replace('.', "")
    } else {
        t
    };
    let digits = normal.trim_start_matches(['-', '+']);
    let ok = !digits.is_empty()
        && digits.chars().any(|c| c.is_ascii_digit())
        && digits.chars().all(|c| c.is_ascii_digit() || c == '.');
    ok.then_some(normal)
}

/// `1 180` → `1180` (a space before exactly three digits); any other inner space fails.
fn collapse_spaced_thousands(t: &str) -> Option<String> {
    let parts: Vec<&str> = t.split_whitespace().collect();
    if parts.len() <= 1 {
        return Some(parts.concat());
    }
    let groups_ok = parts
        .iter()
        .skip(1)
        .all(|p| p.len() == 3 && p.chars().all(|c| c.is_ascii_digit()));
    groups_ok.then(|| parts.concat())
}

/// One separator followed by exactly three digits, with one to two digits before it (`1,180`).
fn is_thousands(t: &str, sep: char) -> bool {
    let digits = t.trim_start_matches(['-', '+']);
    match digits.split_once(sep) {
        Some((a, b)) => {
            (1..=2).contains(&a.len())
                && a != "0"
                && b.len() == 3
                && a.chars().chain(b.chars()).all(|c| c.is_ascii_digit())
        }
        None => false,
    }
}

/// Whether a token reads as a value cell (a number with optional unit, range, pair, or a dash).
pub fn is_value_token(text: &str) -> bool {
    matches!(parse_cell(text, false), Cell::Number(_))
        || matches!(text.trim(), "-" | "–" | "—" | "n/a")
}

#[cfg(test)]
mod tests {
    use super::*;

    fn num(t: &str) -> Option<(f64, Option<Mark>)> {
        match parse_cell(t, false) {
            Cell::Number(n) => Some((n.value, n.mark)),
            _ => None,
        }
    }

    #[test]
    fn numbers_marks_and_footnotes() {
        assert_eq!(num("470"), Some((470.0, None)));
        assert_eq!(num("470 mm"), Some((470.0, Some(Mark::Mm))));
        assert_eq!(num("47,5cm"), Some((47.5, Some(Mark::Cm))));
        assert_eq!(num("18.5\""), Some((18.5, Some(Mark::In))));
        assert_eq!(num("18½″"), Some((18.5, Some(Mark::In))));
        assert_eq!(num("17 1/4 in"), Some((17.25, Some(Mark::In))));
        assert_eq!(num("65°"), Some((65.0, Some(Mark::Deg))));
        assert_eq!(num("64,5º*"), Some((64.5, Some(Mark::Deg))));
        assert_eq!(num("470¹"), Some((470.0, None)));
        assert_eq!(num("470 (2)"), Some((470.0, None)));
        assert_eq!(num("470[a]"), Some((470.0, None)));
        assert_eq!(num("1,180"), Some((1180.0, None)));
        assert_eq!(num("1.180,5"), Some((1180.5, None)));
        assert_eq!(num("1 180 mm"), Some((1180.0, Some(Mark::Mm))));
        assert_eq!(num("−12"), Some((-12.0, None)));
        assert_eq!(num("abc"), None);
        assert_eq!(num("4 70"), None);
        assert_eq!(parse_cell("–", false), Cell::Missing);
        assert_eq!(parse_cell("n/a", false), Cell::Missing);
    }

    #[test]
    fn thousands_dot_only_when_asked() {
        assert!(matches!(parse_cell("1.180", true), Cell::Number(n) if n.value == 1180.0));
        assert!(matches!(parse_cell("1.180", false), Cell::Number(n) if n.value == 1.18));
    }

    #[test]
    fn ranges_and_pairs() {
        let Cell::Number(r) = parse_cell("470-475", false) else {
            panic!("range")
        };
        assert_eq!((r.value, r.spread), (472.5, Spread::Range(470.0, 475.0)));
        let Cell::Number(p) = parse_cell("65/64.5°", false) else {
            panic!("pair")
        };
        assert_eq!(
            (p.value, p.mark, p.spread),
            (65.0, Some(Mark::Deg), Spread::Pair(65.0, 64.5))
        );
        assert!(matches!(parse_cell("-35", false), Cell::Number(n) if n.value == -35.0));
        // One length in two units is one value, not two settings.
        for dual in ["470 mm (18.5\")", "470mm / 18.5 in", "47 cm (18.5in)"] {
            let Cell::Number(n) = parse_cell(dual, false) else {
                panic!("{dual}")
            };
            assert_eq!(n.spread, Spread::Single, "{dual}");
            assert_eq!(n.value * n.mark.map_or(0.0, Mark::factor), 470.0, "{dual}");
        }
    }
}
