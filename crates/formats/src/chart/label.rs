//! Row labels in the usual trade wording → DESIGN.md §5 keys.
//!
//! A label is cleaned (footnote marks, a unit in brackets or at the end), split into words,
//! abbreviations are expanded (`HTA` → head tube angle, `ETT` → effective top tube, `CS` →
//! chainstay, `A2C` → axle crown …) and filler words dropped (`length`, `to`, `of` …). The
//! remaining words are matched by rules in a fixed order. Words that name something else
//! (stem, saddle, travel, ratio, rider …) make the row unrecognised rather than misread.

use super::cell::{strip_footnotes, Mark};

/// Which wheel a wheel-size row describes.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum WheelSlot {
    /// Both wheels (a "Wheel size" row).
    Both,
    /// The front wheel only.
    Front,
    /// The rear wheel only.
    Rear,
}

/// A label that could name two keys.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Ambiguity {
    /// "Seat tube angle" without effective or actual.
    SeatAngle,
    /// "Top tube" without effective or actual.
    TopTube,
}

/// What a row label names.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Kind {
    /// A §5 frame key.
    Key(&'static str),
    /// One of two keys; the importer asks.
    Ambiguous(Ambiguity),
    /// A wheel size row.
    Wheels(WheelSlot),
    /// The size row ("Size", "Frame size", or a blank corner cell).
    Size,
    /// A part the page has an input for but that is no frame number ("Stem length", "Crank
    /// length", "Bar width").
    Part(Part),
    /// A column of row numbers ("#", "No.").
    RowNumber,
    /// A seat tube measured centre to centre ("Seat tube (c-c)"): to the top tube's centre,
    /// shorter than the seat tube length the page uses (to the top of the seat tube), so it is
    /// listed as not recognised, with a note saying why, and never read as the seat tube.
    SeatTubeToCentre,
    /// Anything else.
    Unknown,
}

impl Kind {
    /// Whether the label names something the importer reads per size.
    pub fn is_measurement(self) -> bool {
        matches!(self, Kind::Key(_) | Kind::Ambiguous(_) | Kind::Wheels(_))
    }
}

/// A classified label.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct Label {
    /// The label as shown back to the person (footnote marks removed, spaces collapsed).
    pub text: String,
    /// What it names.
    pub kind: Kind,
    /// A unit written in the label, e.g. "Reach (mm)".
    pub unit: Option<Mark>,
}

/// Words that mean the row is about something other than the frame's §5 numbers.
const BLOCKERS: &[&str] = &[
    "ratio",
    "stem",
    "bar",
    "handlebar",
    "handlebars",
    "saddle",
    "crank",
    "cranks",
    "rider",
    "suggested",
    "recommended",
    "dropper",
    "seatpost",
    "post",
    "spacer",
    "spacers",
    "insertion",
    "max",
    "maximum",
    "min",
    "minimum",
    "travel",
    "weight",
    "shock",
    "stroke",
    "mechanical",
    "clearance",
    "inseam",
    "price",
    "colour",
    "color",
    "bottle",
    "width",
];

/// A part the page has an input for: the form field's name, label and group title
/// (`crate::fields`, written here again so the on-demand module does not carry every field's
/// words; a test keeps them equal).
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub struct Part {
    /// The page form field's name (`setup.stem_mm`).
    pub field: &'static str,
    /// Its label in lower case ("stem length").
    pub label: &'static str,
    /// The title of its group of inputs ("Cockpit").
    pub group: &'static str,
}

const STEM: Part = Part {
    field: "setup.stem_mm",
    label: "stem length",
    group: "Cockpit",
};
const CRANK: Part = Part {
    field: "setup.crank_mm",
    label: "crank length",
    group: "Saddle, seatpost and cranks",
};
const BAR_WIDTH: Part = Part {
    field: "setup.bar_width_mm",
    label: "bar width",
    group: "Cockpit",
};

/// Parts the page has an input for, by the whole of their label's words (after fillers such
/// as "length" are dropped).
pub static PARTS: &[(&[&str], Part)] = &[
    (&["stem"], STEM),
    (&["crank"], CRANK),
    (&["cranks"], CRANK),
    (&["crank", "arm"], CRANK),
    (&["bar", "width"], BAR_WIDTH),
    (&["handlebar", "width"], BAR_WIDTH),
    (&["handlebars", "width"], BAR_WIDTH),
];

/// Words with no meaning for the match.
const FILLERS: &[&str] = &[
    "length", "len", "lgth", "lg", "l", "of", "the", "to", "frame", "in", "at", "c", "ct", "cc",
    "and", "measured", "angle_", "value", "values",
];

/// Abbreviations and joined words, expanded before matching.
const EXPAND: &[(&str, &[&str])] = &[
    ("hta", &["head", "tube", "angle"]),
    ("ha", &["head", "angle"]),
    ("sta", &["seat", "tube", "angle"]),
    ("esta", &["effective", "seat", "tube", "angle"]),
    ("asta", &["actual", "seat", "tube", "angle"]),
    ("ett", &["effective", "top", "tube"]),
    ("htt", &["effective", "top", "tube"]),
    ("tt", &["top", "tube"]),
    ("ht", &["head", "tube"]),
    ("htl", &["head", "tube"]),
    ("st", &["seat", "tube"]),
    ("stl", &["seat", "tube"]),
    ("cs", &["chainstay"]),
    ("csl", &["chainstay"]),
    ("wb", &["wheelbase"]),
    ("a2c", &["axle", "crown"]),
    ("atc", &["axle", "crown"]),
    ("axc", &["axle", "crown"]),
    ("ac", &["axle", "crown"]),
    ("bbh", &["bb", "height"]),
    ("bbd", &["bb", "drop"]),
    ("fc", &["front", "center"]),
    ("rc", &["rear", "center"]),
    ("so", &["standover"]),
    ("eff", &["effective"]),
    ("effec", &["effective"]),
    ("effect", &["effective"]),
    ("virtual", &["effective"]),
    ("horizontal", &["effective"]),
    ("horiz", &["effective"]),
    ("hor", &["effective"]),
    ("act", &["actual"]),
    ("real", &["actual"]),
    ("true", &["actual"]),
    ("centre", &["center"]),
    ("centres", &["center"]),
    ("chainstays", &["chainstay"]),
    ("toptube", &["top", "tube"]),
    ("seattube", &["seat", "tube"]),
    ("headtube", &["head", "tube"]),
    ("headangle", &["head", "angle"]),
    ("seatangle", &["seat", "angle"]),
    ("wheelsize", &["wheel", "size"]),
    ("stand", &["standover"]),
    ("over", &[]),
    ("ang", &["angle"]),
    ("wheels", &["wheel"]),
    ("sizes", &["size"]),
    ("tyre", &["wheel"]),
    ("tire", &["wheel"]),
];

/// Characters of a label looked at.
const MAX_LABEL_CHARS: usize = 120;

/// Classifies a row label.
pub fn classify(raw: &str) -> Label {
    // No label is longer than this; a longer "label" is text and is only shown shortened.
    let raw: String = raw.chars().take(MAX_LABEL_CHARS).collect();
    let raw = raw.as_str();
    let text = collapse(&strip_footnotes(raw));
    let trimmed = raw.trim().to_lowercase();
    if matches!(
        trimmed.trim_end_matches('.'),
        "#" | "no" | "nr" | "nº" | "n°" | "row" | "pos" | "ref" | "item"
    ) {
        return Label {
            text,
            kind: Kind::RowNumber,
            unit: None,
        };
    }
    let (words, unit) = words_and_unit(&text);
    let has = |w: &str| words.iter().any(|x| x == w);
    let kind = if trimmed.is_empty() || matches!(trimmed.as_str(), "frame" | "model") {
        Kind::Size
    } else if has("seat")
        && has("tube")
        && !has("angle")
        && !words.iter().any(|w| BLOCKERS.contains(&w.as_str()))
        && centre_to_centre(&text)
    {
        // Before the other rules: "Seat tube (BB centre to top tube centre)" names a top tube.
        Kind::SeatTubeToCentre
    } else {
        match_words(&words)
    };
    Label { text, kind, unit }
}

/// Whether a label (footnote marks removed) says its length runs centre to centre: a mark
/// ("c-c", "c–c", "c/c", "c - c", "c.c", "C to C", "ctc", "cc", "c2c") or two centres in words
/// ("centre-centre", "centre to centre", "BB centre to top tube centre"). Any character not a
/// letter or digit (brackets, dashes of every kind, slashes, dots) separates words.
fn centre_to_centre(label: &str) -> bool {
    let lower = label.to_lowercase();
    let words: Vec<&str> = lower
        .split(|c: char| !c.is_alphanumeric())
        .filter(|w| !w.is_empty())
        .collect();
    let end = |w: &str| matches!(w, "c" | "centre" | "center" | "ctr" | "cntr");
    let spelled = |w: &str| matches!(w, "centre" | "center" | "ctr" | "cntr");
    words.iter().any(|w| matches!(*w, "ctc" | "cc" | "c2c"))
        || words
            .windows(2)
            .any(|p| matches!(p, [a, b] if end(a) && end(b)))
        || words
            .windows(3)
            .any(|p| matches!(p, [a, "to", b] if end(a) && end(b)))
        || words.iter().filter(|w| spelled(w)).count() >= 2
}

fn collapse(s: &str) -> String {
    s.split_whitespace().collect::<Vec<_>>().join(" ")
}

/// Lower-case words with units taken out and abbreviations expanded.
fn words_and_unit(text: &str) -> (Vec<String>, Option<Mark>) {
    let mut unit = None;
    let mut plain = String::with_capacity(text.len());
    let mut rest = text.to_lowercase();
    // Bracketed groups: a unit inside is the row's unit; other content stays as words.
    while let Some(open) = rest.find(['(', '[']) {
        let close = rest
            .get(open..)
            .and_then(|r| r.find([')', ']']))
            .map(|c| c + open);
        let Some(close) = close else { break };
        let inner = rest.get(open + 1..close).unwrap_or("").to_string();
        plain.push_str(rest.get(..open).unwrap_or(""));
        plain.push(' ');
        match Mark::from_word(&inner) {
            Some(m) => unit = Some(m),
            None => plain.push_str(&inner),
        }
        plain.push(' ');
        rest = rest.get(close + 1..).unwrap_or("").to_string();
    }
    plain.push_str(&rest);
    if plain.contains(['°', 'º']) {
        unit = Some(Mark::Deg);
    }
    if plain.trim_end().ends_with(['"', '″']) {
        unit = Some(Mark::In);
    }
    let cleaned: String = plain
        .chars()
        .map(|c| if c.is_alphanumeric() { c } else { ' ' })
        .collect();
    let mut words = Vec::new();
    let mut singles = String::new();
    for w in cleaned.split_whitespace() {
        // "B.B." arrives as "b", "b": join single letters.
        if w.chars().count() == 1 && w.chars().all(|c| c.is_ascii_alphabetic()) {
            singles.push_str(w);
            continue;
        }
        flush_singles(&mut singles, &mut words, &mut unit);
        push_word(w, &mut words, &mut unit);
    }
    flush_singles(&mut singles, &mut words, &mut unit);
    (words, unit)
}

fn flush_singles(singles: &mut String, words: &mut Vec<String>, unit: &mut Option<Mark>) {
    // One letter alone is a drawing reference ("A  Reach"), not a word.
    if singles.len() > 1 {
        push_word(singles, words, unit);
    }
    singles.clear();
}

fn push_word(w: &str, words: &mut Vec<String>, unit: &mut Option<Mark>) {
    // A row number or reference written into the label ("1 Reach", "3) Stack").
    if w.chars().all(|c| c.is_ascii_digit()) {
        return;
    }
    if w != "in" {
        if let Some(m) = Mark::from_word(w) {
            *unit = Some(m);
            return;
        }
    }
    if FILLERS.contains(&w) {
        return;
    }
    match EXPAND.iter().find(|(k, _)| *k == w) {
        Some((_, parts)) => words.extend(parts.iter().map(|p| (*p).to_string())),
        None => words.push(w.to_string()),
    }
}

/// Whether every word of the label belongs to what it names ("Stack Head angle" does not:
/// "stack" is no part of a head angle). Used to split headers that lost their cell borders.
pub fn is_tight(raw: &str) -> bool {
    let label = classify(raw);
    let (words, _) = words_and_unit(&label.text);
    let vocabulary: &[&str] = match label.kind {
        Kind::Key(key) => key_words(key),
        Kind::Ambiguous(Ambiguity::SeatAngle) => &["seat", "tube", "angle"],
        Kind::Ambiguous(Ambiguity::TopTube) => &["top", "tube"],
        Kind::Wheels(_) => &["wheel", "size", "front", "rear", "diameter", "rim"],
        _ => return false,
    };
    words.iter().all(|w| vocabulary.contains(&w.as_str()))
}

/// The words a label of `key` may use.
fn key_words(key: &str) -> &'static [&'static str] {
    match key {
        "reach_mm" => &["reach"],
        "stack_mm" => &["stack", "height"],
        "head_angle_deg" => &["head", "tube", "angle"],
        "head_tube_mm" => &["head", "tube"],
        "seat_axis_offset_mm" => &["seat", "tube", "axis", "offset"],
        "chainstay_mm" => &["chainstay", "chain", "stay"],
        "rear_centre_mm" => &["rear", "center"],
        "front_centre_mm" => &["front", "center"],
        "wheelbase_mm" => &["wheelbase", "wheel", "base"],
        "bb_drop_mm" => &["bb", "bottom", "bracket", "drop", "offset"],
        "bb_height_mm" => &["bb", "bottom", "bracket", "height"],
        "fork_a2c_mm" => &["fork", "axle", "crown"],
        "fork_offset_mm" => &["fork", "offset", "rake"],
        "standover_mm" => &["standover", "height"],
        "trail_mm" => &["trail", "fork", "ground"],
        "headset_lower_mm" => &["headset", "lower", "stack"],
        "seat_angle_effective_deg" | "seat_angle_actual_deg" => {
            &["seat", "tube", "angle", "effective", "actual"]
        }
        "top_tube_effective_mm" => &["top", "tube", "effective"],
        "seat_tube_mm" => &["seat", "tube"],
        _ => &[],
    }
}

/// The rules, in order.
fn match_words(words: &[String]) -> Kind {
    let has = |w: &str| words.iter().any(|x| x == w);
    let only = |allowed: &[&str]| words.iter().all(|x| allowed.contains(&x.as_str()));
    if let Some((_, part)) = PARTS.iter().find(|(p, _)| p.iter().eq(words.iter())) {
        return Kind::Part(*part);
    }
    if words.iter().any(|w| BLOCKERS.contains(&w.as_str())) {
        return Kind::Unknown;
    }
    if has("size") && only(&["size", "model", "label", "nominal", "name"]) {
        return Kind::Size;
    }
    let effective = has("effective");
    let actual = has("actual");
    let qualified =
        |eff: &'static str, act: Option<&'static str>, amb: Ambiguity| match (effective, actual) {
            (true, false) => Kind::Key(eff),
            (false, true) => act.map_or(Kind::Unknown, Kind::Key),
            _ => Kind::Ambiguous(amb),
        };
    if has("wheel") || has("rim") {
        return match (has("front"), has("rear")) {
            (true, false) => Kind::Wheels(WheelSlot::Front),
            (false, true) => Kind::Wheels(WheelSlot::Rear),
            _ if has("base") => Kind::Key("wheelbase_mm"),
            _ => Kind::Wheels(WheelSlot::Both),
        };
    }
    let rules: &[(&[&str], &[&str], Kind)] = &[
        (&["head", "angle"], &[], Kind::Key("head_angle_deg")),
        (&["head", "tube"], &[], Kind::Key("head_tube_mm")),
        (&["seat", "offset"], &[], Kind::Key("seat_axis_offset_mm")),
        (&["chainstay"], &[], Kind::Key("chainstay_mm")),
        (&["chain", "stay"], &[], Kind::Key("chainstay_mm")),
        (&["rear", "center"], &[], Kind::Key("rear_centre_mm")),
        (&["front", "center"], &[], Kind::Key("front_centre_mm")),
        (&["wheelbase"], &[], Kind::Key("wheelbase_mm")),
        (&["bb", "drop"], &[], Kind::Key("bb_drop_mm")),
        (&["bb", "offset"], &[], Kind::Key("bb_drop_mm")),
        (&["bottom", "drop"], &[], Kind::Key("bb_drop_mm")),
        (&["drop"], &["drop"], Kind::Key("bb_drop_mm")),
        (&["bb", "height"], &[], Kind::Key("bb_height_mm")),
        (&["bottom", "height"], &[], Kind::Key("bb_height_mm")),
        (&["axle", "crown"], &[], Kind::Key("fork_a2c_mm")),
        (&["fork"], &["fork"], Kind::Key("fork_a2c_mm")),
        (
            &["offset"],
            &["fork", "offset", "rake"],
            Kind::Key("fork_offset_mm"),
        ),
        (
            &["rake"],
            &["fork", "offset", "rake"],
            Kind::Key("fork_offset_mm"),
        ),
        (&["standover"], &[], Kind::Key("standover_mm")),
        (
            &["trail"],
            &["trail", "fork", "ground"],
            Kind::Key("trail_mm"),
        ),
        (&["reach"], &["reach"], Kind::Key("reach_mm")),
        (&["stack"], &["stack", "height"], Kind::Key("stack_mm")),
        (&["headset", "lower"], &[], Kind::Key("headset_lower_mm")),
    ];
    if has("seat") && has("angle") {
        return qualified(
            "seat_angle_effective_deg",
            Some("seat_angle_actual_deg"),
            Ambiguity::SeatAngle,
        );
    }
    // "top" right before "tube": "Seat tube length (centre to top)" is no top tube.
    if words
        .windows(2)
        .any(|w| w.first().is_some_and(|a| a == "top") && w.get(1).is_some_and(|b| b == "tube"))
    {
        return qualified("top_tube_effective_mm", None, Ambiguity::TopTube);
    }
    for (needed, allowed, kind) in rules {
        if needed.iter().all(|w| has(w)) && (allowed.is_empty() || only(allowed)) {
            return *kind;
        }
    }
    if has("seat") && has("tube") {
        return Kind::Key("seat_tube_mm");
    }
    Kind::Unknown
}

#[cfg(test)]
mod tests {
    use super::*;

    fn key(label: &str) -> Kind {
        classify(label).kind
    }

    #[test]
    fn trade_wording_maps_to_keys() {
        let cases = [
            ("Reach", "reach_mm"),
            ("REACH (mm)", "reach_mm"),
            ("Stack*", "stack_mm"),
            ("Head Tube Angle", "head_angle_deg"),
            ("HTA", "head_angle_deg"),
            ("Head angle", "head_angle_deg"),
            ("Seat tube angle (effective)", "seat_angle_effective_deg"),
            ("Eff. STA", "seat_angle_effective_deg"),
            ("Seat angle, actual", "seat_angle_actual_deg"),
            ("Top tube (effective)", "top_tube_effective_mm"),
            ("ETT", "top_tube_effective_mm"),
            ("Horizontal top tube", "top_tube_effective_mm"),
            ("Chainstay length", "chainstay_mm"),
            ("CS", "chainstay_mm"),
            ("Chain stay", "chainstay_mm"),
            ("Wheelbase", "wheelbase_mm"),
            ("WB", "wheelbase_mm"),
            ("Wheel base", "wheelbase_mm"),
            ("BB drop", "bb_drop_mm"),
            ("B.B. Drop", "bb_drop_mm"),
            ("Bottom bracket height", "bb_height_mm"),
            ("BB height", "bb_height_mm"),
            ("Fork offset", "fork_offset_mm"),
            ("Rake", "fork_offset_mm"),
            ("Axle to crown", "fork_a2c_mm"),
            ("A2C", "fork_a2c_mm"),
            ("Fork length", "fork_a2c_mm"),
            ("Head tube", "head_tube_mm"),
            ("HT length", "head_tube_mm"),
            ("Standover", "standover_mm"),
            ("Stand over height", "standover_mm"),
            ("Seat tube", "seat_tube_mm"),
            ("Seat tube length (c-t)", "seat_tube_mm"),
            ("Front centre", "front_centre_mm"),
            ("Front center", "front_centre_mm"),
            ("Rear centre", "rear_centre_mm"),
            ("Trail", "trail_mm"),
            ("Trail¹", "trail_mm"),
            ("Lower headset stack", "headset_lower_mm"),
            ("Seat tube length (centre to top)", "seat_tube_mm"),
            ("Fork length (A-C)", "fork_a2c_mm"),
            ("TT length (eff)", "top_tube_effective_mm"),
            ("Seat tube c-t", "seat_tube_mm"),
            ("Seat tube (centre-top)", "seat_tube_mm"),
        ];
        for (label, want) in cases {
            assert_eq!(key(label), Kind::Key(want), "{label}");
        }
    }

    #[test]
    fn a_seat_tube_measured_centre_to_centre_is_not_the_seat_tube() {
        for label in [
            "Seat tube c-c",
            "Seat tube length (c-c)",
            "ST (c/c)",
            "Seat tube CTC",
            "Seat tube, centre to centre",
            "Seat tube length center-center",
            "Seat tube cc",
            "Seat tube (centre-centre)",
            "Seat tube length (centre-to-centre)",
            "Seat tube c–c",
            "Seat tube c—c",
            "Seat tube c‑c",
            "Seat tube c - c",
            "Seat tube C to C",
            "Seat tube c-c*",
            "Seat tube c-c¹",
            "Seat tube c-c.",
            "Seat tube c.c",
            "Seat tube c2c",
            "Seat tube (BB centre to top tube centre)",
            "Seat tube (centre to centre of top tube)",
        ] {
            assert_eq!(key(label), Kind::SeatTubeToCentre, "{label}");
        }
        // Centre to top is the seat tube; other rows keep their key whatever they say.
        for label in [
            "Seat tube c-t",
            "Seat tube (centre to top)",
            "ST (c/t)",
            "Seat tube ctt",
        ] {
            assert_eq!(key(label), Kind::Key("seat_tube_mm"), "{label}");
        }
        assert_eq!(key("Chainstay (c-c)"), Kind::Key("chainstay_mm"));
        assert_eq!(key("Seat tube max insertion (c-c)"), Kind::Unknown);
        assert_eq!(
            key("Seat tube angle (c-c)"),
            Kind::Ambiguous(Ambiguity::SeatAngle)
        );
    }

    #[test]
    fn wheels_sizes_ambiguities_and_others() {
        assert_eq!(key("Wheel size"), Kind::Wheels(WheelSlot::Both));
        assert_eq!(key("Rear wheel"), Kind::Wheels(WheelSlot::Rear));
        assert_eq!(
            key("Seat tube angle"),
            Kind::Ambiguous(Ambiguity::SeatAngle)
        );
        assert_eq!(key("STA"), Kind::Ambiguous(Ambiguity::SeatAngle));
        assert_eq!(key("Top tube"), Kind::Ambiguous(Ambiguity::TopTube));
        assert_eq!(key("Top tube (actual)"), Kind::Unknown);
        assert_eq!(key("Frame size"), Kind::Size);
        assert_eq!(key("Size"), Kind::Size);
        assert_eq!(key(""), Kind::Size);
        assert_eq!(key("#"), Kind::RowNumber);
        assert_eq!(key("A"), Kind::Unknown);
        assert_eq!(key("Tyre size"), Kind::Wheels(WheelSlot::Both));
        assert_eq!(key("B  Reach"), Kind::Key("reach_mm"));
        assert_eq!(key("3) Stack"), Kind::Key("stack_mm"));
        assert!(is_tight("Seat tube angle (eff.)") && is_tight("Fork offset"));
        assert!(!is_tight("Stack Head angle") && !is_tight("Top tube (eff.) BB"));
        assert_eq!(key("Stem length"), Kind::Part(STEM));
        assert_eq!(key("Stem (mm)"), Kind::Part(STEM));
        assert_eq!(key("Crank Length"), Kind::Part(CRANK));
        assert_eq!(key("Crank arm length"), Kind::Part(CRANK));
        assert_eq!(key("Bar Width"), Kind::Part(BAR_WIDTH));
        assert_eq!(key("Handlebar width"), Kind::Part(BAR_WIDTH));
        for other in [
            "Stem angle",
            "Bar rise",
            "Stack/reach ratio",
            "Rider height",
            "Fork travel",
            "Max. seatpost insertion",
            "Mechanical trail",
            "Saddle height",
        ] {
            assert_eq!(key(other), Kind::Unknown, "{other}");
        }
    }

    #[test]
    fn parts_name_the_page_inputs_as_the_page_does() {
        for (_, part) in PARTS {
            let f = crate::fields::field(part.field).unwrap();
            assert_eq!(part.label, f.label.to_ascii_lowercase());
            let group = crate::fields::GROUPS.iter().find(|g| g.id == f.group);
            assert_eq!(Some(part.group), group.map(|g| g.title));
        }
    }

    #[test]
    fn units_in_labels() {
        assert_eq!(classify("REACH (mm)").unit, Some(Mark::Mm));
        assert_eq!(classify("Reach [in]").unit, Some(Mark::In));
        assert_eq!(classify("Head angle (°)").unit, Some(Mark::Deg));
        assert_eq!(classify("Stack in mm").unit, Some(Mark::Mm));
        assert_eq!(classify("Stack cm").unit, Some(Mark::Cm));
        assert_eq!(classify("Reach (\")").unit, Some(Mark::In));
        assert_eq!(classify("Reach").unit, None);
    }
}
