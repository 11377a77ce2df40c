//! Wheel-size cells → wheel designations the kernel's `WheelSpec` accepts.
//!
//! Charts name the wheel without the tyre: `29"`, `27.5`, `650b`, `700c`, `MX` (29 front,
//! 27.5 rear), `29/27.5`. A designation needs a tyre width, so a stated default is added per
//! size family and the importer says so in a note; a width in the cell (`29x2.5`, `700x35c`,
//! `62-622`) is kept.

use framewise_kernel::WheelSpec;

/// Default tyre per wheel name, used when the chart gives no width. [practice]: common stock
/// tyre widths for each wheel family.
pub const DEFAULTS: &[(&str, &str)] = &[
    ("29", "29x2.4"),
    ("29er", "29x2.4"),
    ("27.5+", "27.5x2.8"),
    ("27.5", "27.5x2.4"),
    ("275", "27.5x2.4"),
    ("26", "26x2.4"),
    ("24", "24x2.2"),
    ("20", "20x2.0"),
    ("16", "16x2.0"),
    ("650b", "650bx47"),
    ("650c", "650cx23"),
    ("700c", "700x32c"),
    ("700", "700x32c"),
    ("28", "700x32c"),
    ("27", "27x1.25"),
];

/// A wheel read from one cell: front and rear designations, and whether a width was assumed.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct WheelCell {
    /// Front wheel designation.
    pub front: String,
    /// Rear wheel designation.
    pub rear: String,
    /// True when the tyre width was not in the cell and a default was used.
    pub width_assumed: bool,
}

/// Reads one wheel-size cell; `None` when it names no wheel the kernel knows.
pub fn parse_wheel_cell(text: &str) -> Option<WheelCell> {
    let t: String = super::cell::strip_footnotes(text)
        .to_lowercase()
        .replace(',', ".")
        .replace(['"', '″', '”', '×', '*'], "")
        .replace("inches", "")
        .replace("inch", "")
        .chars()
        .filter(|c| !c.is_whitespace())
        .collect();
    let t = t.trim_end_matches("in").to_string();
    if matches!(t.as_str(), "mx" | "mullet" | "mixed" | "mixedwheels") {
        let (front, _) = one("29")?;
        let (rear, _) = one("27.5")?;
        return Some(WheelCell {
            front,
            rear,
            width_assumed: true,
        });
    }
    if let Some((f, r)) = t.split_once(['/', '&']) {
        let (front, a) = one(f.trim_end_matches('f').trim_start_matches("f"))?;
        let (rear, b) = one(r.trim_end_matches('r').trim_start_matches("r"))?;
        return Some(WheelCell {
            front,
            rear,
            width_assumed: a || b,
        });
    }
    let (d, assumed) = one(&t)?;
    Some(WheelCell {
        front: d.clone(),
        rear: d,
        width_assumed: assumed,
    })
}

/// One wheel: a designation with width as written, or a name with its default width.
fn one(t: &str) -> Option<(String, bool)> {
    if t.is_empty() {
        return None;
    }
    let accepted = |d: &str| WheelSpec::Designation(d.to_string()).resolve("").is_ok();
    if t.contains(['x', '-']) && accepted(t) {
        return Some((t.to_string(), false));
    }
    if let Some(named) = t.strip_suffix('c').filter(|n| n.contains('x')) {
        let d = format!("{named}c");
        if accepted(&d) {
            return Some((d, false));
        }
    }
    DEFAULTS
        .iter()
        .find(|(name, _)| *name == t)
        .map(|(_, d)| ((*d).to_string(), true))
        .filter(|(d, _)| accepted(d))
}

/// A wheel row whose cells single spaces joined (`Wheel size 27.5" 27.5" 27.5" / 29" 29"`
/// read as the label `Wheel size 27.5" 27.5" 27.5" /` and two cells), read again.
#[derive(Debug, Clone, PartialEq, Eq)]
pub enum Rejoined {
    /// Nothing was joined: the row's cells are its wheels.
    Kept,
    /// One wheel per size, from the left: the label's name and the cells.
    Cut(String, Vec<String>),
    /// Not one wheel per size: the label's name and how many wheels the row holds.
    Unplaced(String, usize),
}

/// Reads a wheel row again when single spaces joined its cells: words after the label's name
/// (the first word that starts with a digit and every word after it) or a cell holding
/// several wheels. Its wheels ([`wheel_groups`]) are one per size when there are exactly
/// `sizes` of them, each a wheel; else which size each belongs to is not known.
pub fn rejoin(label: &str, cells: &[String], sizes: usize) -> Rejoined {
    let words: Vec<&str> = label.split_whitespace().collect();
    let at = words
        .iter()
        .position(|w| w.starts_with(|c: char| c.is_ascii_digit()))
        .filter(|at| *at > 0) // a label that starts with a number ("29er wheels") is a name
        .unwrap_or(words.len());
    let (name, spilled) = words.split_at(at);
    let several = cells.iter().any(|c| wheel_groups(c).len() > 1);
    if spilled.is_empty() && !several {
        return Rejoined::Kept;
    }
    let text = spilled
        .iter()
        .copied()
        .chain(cells.iter().map(String::as_str))
        .collect::<Vec<&str>>()
        .join(" ");
    let groups = wheel_groups(&text);
    let name = name.join(" ");
    if groups.len() == sizes && groups.iter().all(|g| parse_wheel_cell(g).is_some()) {
        Rejoined::Cut(name, groups)
    } else {
        Rejoined::Unplaced(name, groups.len())
    }
}

/// The wheels of a text of single spaces: words joined where a `/`, `&` or `x` links them
/// (`27.5" / 29"`, `700 x 28c`), a lone unit joined to the number before it.
pub fn wheel_groups(text: &str) -> Vec<String> {
    let mut groups: Vec<String> = Vec::new();
    let mut linked = false;
    for t in super::grid::join_units(text) {
        let link = matches!(t.as_str(), "/" | "&" | "x" | "X" | "×");
        match groups.last_mut() {
            Some(g) if linked || link || t.starts_with('/') => {
                g.push(' ');
                g.push_str(&t);
            }
            _ => groups.push(t.clone()),
        }
        linked = link || t.ends_with('/');
    }
    groups
}

/// The default widths of [`DEFAULTS`] in words, for the notes that say one was assumed (the
/// chart importer's and the form's, `crate::form_units`).
pub const DEFAULT_WIDTHS: &str = "29 and 27.5: 2.4 in; 700c: 32 mm; 650b: 47 mm";

/// The note that says a default width was assumed for a chart's wheel row.
pub fn default_note() -> String {
    format!(
        "the chart gives no tyre width, so a common stock width was assumed ({DEFAULT_WIDTHS}); change the tyres under wheels if yours differ"
    )
}

#[cfg(test)]
mod tests {
    use super::*;

    fn both(t: &str) -> Option<(String, String, bool)> {
        parse_wheel_cell(t).map(|w| (w.front, w.rear, w.width_assumed))
    }

    #[test]
    fn wheel_names_get_a_default_width_and_say_so() {
        let s = |a: &str| a.to_string();
        assert_eq!(both("29\""), Some((s("29x2.4"), s("29x2.4"), true)));
        assert_eq!(both("27,5 in"), Some((s("27.5x2.4"), s("27.5x2.4"), true)));
        assert_eq!(both("700C"), Some((s("700x32c"), s("700x32c"), true)));
        assert_eq!(both("29 x 2.5"), Some((s("29x2.5"), s("29x2.5"), false)));
        assert_eq!(both("62-622"), Some((s("62-622"), s("62-622"), false)));
        assert_eq!(both("MX"), Some((s("29x2.4"), s("27.5x2.4"), true)));
        assert_eq!(
            both("29\" / 27.5\""),
            Some((s("29x2.4"), s("27.5x2.4"), true))
        );
        assert_eq!(both("700x35c"), Some((s("700x35c"), s("700x35c"), false)));
        assert_eq!(both("31"), None);
        assert_eq!(both(""), None);
    }

    #[test]
    fn a_wheel_row_joined_by_single_spaces_is_read_again() {
        let cells = |c: &[&str]| c.iter().map(|s| s.to_string()).collect::<Vec<String>>();
        assert_eq!(
            wheel_groups("27.5\" 27.5\" / 29\" 700 x 28c 27.5\"/ 29\""),
            ["27.5\"", "27.5\" / 29\"", "700 x 28c", "27.5\"/ 29\""]
        );
        assert_eq!(
            rejoin("Wheel size 27.5\" 27.5\" /", &cells(&["29\"", "29\""]), 3),
            Rejoined::Cut(
                "Wheel size".into(),
                cells(&["27.5\"", "27.5\" / 29\"", "29\""])
            )
        );
        assert_eq!(
            rejoin("Wheel size 27.5\" 27.5\" /", &cells(&["29\"", "29\""]), 4),
            Rejoined::Unplaced("Wheel size".into(), 3)
        );
        // One cell holding several wheels.
        assert_eq!(
            rejoin("Wheels", &cells(&["650b 700c"]), 2),
            Rejoined::Cut("Wheels".into(), cells(&["650b", "700c"]))
        );
        assert_eq!(
            rejoin("Wheel size", &cells(&["29\"", "27.5\" / 29\""]), 2),
            Rejoined::Kept
        );
        assert_eq!(
            rejoin("29er wheels", &cells(&["29\"", "29\""]), 2),
            Rejoined::Kept
        );
    }
}
