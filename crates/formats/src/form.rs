//! The page's form: raw typed text per field → a one-bike scenario, with a message per bad field.
//!
//! Field names are the scenario paths below the bike: `frame.reach_mm`, `wheels.front`,
//! `setup.stem_mm`, `changes.front_sag_pct`, `changes.wheels.rear`, `rider.height_mm`, `label`.
//! Blank optional fields are left out; a blank required field is an error.

use crate::fields::{field, Field, Kind};
use crate::units::{parse_number, parse_quantity, Quantity, UnitError, MM_PER_IN};
use framewise_kernel::error::fmt_num;
use framewise_kernel::{BikeInput, FieldError, Published, RiderInput, Scenario, WheelSpec};
use std::collections::BTreeMap;

/// Frame fields that may not be blank on the page: every listing gives them, and the solver
/// needs them to place the frame (the rest it solves or assumes, and names what is missing).
pub const REQUIRED: &[&str] = &["frame.reach_mm", "frame.stack_mm", "frame.head_angle_deg"];

/// Builds a scenario from the form. Errors carry the form field name in `field`.
pub fn scenario_from_form(fields: &BTreeMap<String, String>) -> (Scenario, Vec<FieldError>) {
    scenario_from_form_with(fields, &[])
}

/// [`scenario_from_form`] with the text of some fields replaced (`(field name, text)`: a second
/// reading, `crate::form_units`), without copying the form.
pub fn scenario_from_form_with(
    fields: &BTreeMap<String, String>,
    replaced: &[(String, String)],
) -> (Scenario, Vec<FieldError>) {
    let mut bike = BikeInput::default();
    let mut rider = serde_json::Map::new();
    let mut errors = Vec::new();
    let mut setup = serde_json::Map::new();
    let mut changes = serde_json::Map::new();
    for (name, text) in fields {
        let text = replaced
            .iter()
            .find(|(n, _)| n == name)
            .map_or(text, |(_, t)| t);
        let blank = text.trim().is_empty();
        if blank && !REQUIRED.contains(&name.as_str()) {
            continue;
        }
        let (group, key) = name.split_once('.').unwrap_or(("", name.as_str()));
        if name == "label" {
            bike.label = text.trim().chars().take(80).collect();
            continue;
        }
        if let Some(which) = name
            .strip_prefix("wheels.")
            .or_else(|| name.strip_prefix("changes.wheels."))
        {
            let spec = WheelSpec::Designation(text.trim().to_string());
            let target = if name.starts_with("changes.") {
                &mut bike.changes.wheels
            } else {
                &mut bike.wheels
            };
            match which {
                "front" => target.front = Some(spec),
                "rear" => target.rear = Some(spec),
                _ => errors.push(unknown(name)),
            }
            continue;
        }
        if field(name).is_some_and(|f| f.kind == Kind::Choice) {
            if let Some(word) = choice(name, text, &mut errors) {
                setup.insert(key.to_string(), word.into());
            }
            continue;
        }
        if group == "frame" {
            if let Some(p) = published(name, key, text, &mut errors) {
                bike.frame.insert(key.to_string(), p);
            }
            continue;
        }
        let Some(v) = number(name, key, text, &mut errors) else {
            continue;
        };
        match group {
            "setup" => {
                setup.insert(key.to_string(), v.into());
            }
            "changes" => {
                changes.insert(key.to_string(), v.into());
            }
            "rider" => {
                rider.insert(key.to_string(), v.into());
            }
            _ => errors.push(unknown(name)),
        }
    }
    match crate::json::from_value_at(setup.into()) {
        Ok(s) => bike.setup = s,
        Err((_, e)) => errors.push(FieldError::new("unknown_field", "setup", e.to_string())),
    }
    let wheels = bike.changes.wheels.clone();
    match crate::json::from_value_at::<framewise_kernel::Changes>(changes.into()) {
        Ok(c) => bike.changes = framewise_kernel::Changes { wheels, ..c },
        Err((_, e)) => errors.push(FieldError::new("unknown_field", "changes", e.to_string())),
    }
    let has_rider = !rider.is_empty();
    let rider: Option<RiderInput> = match crate::json::from_value_at(rider.into()) {
        Ok(r) => has_rider.then_some(r),
        Err((_, e)) => {
            errors.push(FieldError::new("unknown_field", "rider", e.to_string()));
            None
        }
    };
    let scenario = Scenario {
        version: framewise_kernel::scenario::SCENARIO_VERSION,
        rider,
        bikes: vec![bike],
        view: Default::default(),
    };
    (scenario, errors)
}

/// A word-valued field (`setup.bar_type`, `setup.hand_position`): `Some(word)` when the field is
/// one and the word is allowed; an error naming the allowed words otherwise.
fn choice(name: &str, text: &str, errors: &mut Vec<FieldError>) -> Option<String> {
    let f = field(name).filter(|f| f.kind == Kind::Choice)?;
    let word = text.trim().to_ascii_lowercase(); // the allowed words are ASCII
    if f.choices.contains(&word.as_str()) {
        return Some(word);
    }
    errors.push(FieldError::new(
        "bad_choice",
        name,
        format!(
            "{} must be one of {}, got \"{}\"",
            f.label,
            f.choices.join(", "),
            text.trim()
        ),
    ));
    None
}

/// The rider's lengths that may be typed in feet and inches.
const BODY_LENGTHS: [&str; 4] = [
    "rider.height_mm",
    "rider.inseam_mm",
    "rider.arm_mm",
    "rider.torso_mm",
];

/// A numeric field: its unit suffix says how to read it (`_g` is a plain number); a body's
/// length may also be feet and inches ([`Quantity::BodyLength`], [`BODY_LENGTHS`]).
fn number(name: &str, key: &str, text: &str, errors: &mut Vec<FieldError>) -> Option<f64> {
    if key.ends_with("_g") {
        let v = parse_number(text.trim().trim_end_matches('g'));
        if v.is_none() {
            errors.push(FieldError::new(
                "bad_number",
                name,
                format!(
                    "{} \"{}\" is not a number; enter a multiple of g such as 0.8.",
                    label_of(name),
                    text.trim()
                ),
            ));
        }
        return v;
    }
    let Some(q) = Quantity::from_key(key) else {
        errors.push(unknown(name));
        return None;
    };
    let q = match q {
        // Body lengths people know in feet and inches; not the shoe stack or foot position
        // (a few mm, which a foot mark would read as 305 mm).
        Quantity::Length if BODY_LENGTHS.contains(&name) => Quantity::BodyLength,
        q => q,
    };
    parse_quantity(text, q)
        .map_err(|e| bad_number(name, q, &e, errors))
        .ok()
}

/// Records a text that does not read as a number of quantity `q` (see [`unit_message`]).
fn bad_number(name: &str, q: Quantity, e: &UnitError, errors: &mut Vec<FieldError>) {
    errors.push(FieldError::new(
        "bad_number",
        name,
        unit_message(name, q, e),
    ));
}

/// A published frame value with the rounding its typed text shows: the tolerance is one unit of
/// the last typed digit of a length ([`crate::units::parse_quantity_step`]: `99 cm` → 10 mm; an
/// angle keeps the default), but never finer than the catalogue's default (1 mm, 0.1°).
///
/// Why the floor: a value typed finer than the rest of a listing (`470.5` among whole
/// millimetres) is not known better than the numbers it is checked against were rounded, and a
/// listing's numbers come from one drawing rounded for print; a 0.1 mm tolerance would call an
/// ordinary 1 mm rounding of another value a disagreement. A value at the default stays a plain
/// [`Published::Value`] (a link then carries no tolerance for it).
fn published(name: &str, key: &str, text: &str, errors: &mut Vec<FieldError>) -> Option<Published> {
    let q = Quantity::from_key(key).filter(|q| matches!(q, Quantity::Length | Quantity::Angle));
    let Some(q) = q else {
        errors.push(unknown(name));
        return None;
    };
    let (value, step) = crate::units::parse_quantity_step(text, q)
        .map_err(|e| bad_number(name, q, &e, errors))
        .ok()?;
    // A key outside the catalogue is the kernel's to refuse; it keeps the plain value.
    let floor = framewise_kernel::lookup(key).map_or(f64::INFINITY, |m| m.default_tolerance());
    Some(match step {
        Some(step) if step > floor * (1.0 + 1e-9) => Published::WithTolerance {
            value,
            tolerance: step,
        },
        _ => Published::Value(value),
    })
}

/// The field's label as the page shows it ("Reach", "Height"), or its name.
fn label_of(name: &str) -> &str {
    field(name).map_or(name, |f| f.label)
}

/// The message for a blank required field or text that is not a number: the field's label,
/// the text, and what to type with an example that fits the field
/// (`Reach "abc" is not a number; enter a length such as 470 mm, 47 cm or 18.5 in.`).
fn unit_message(name: &str, q: Quantity, e: &UnitError) -> String {
    let label = label_of(name);
    let wanted = wanted(example(field(name).as_ref()), q);
    match e {
        UnitError::Empty { .. } => format!("{label} is required: enter {wanted}."),
        UnitError::NotANumber { text, .. } => {
            format!("{label} \"{text}\" is not a number; enter {wanted}.")
        }
    }
}

/// A value that fits the field, in mm, degrees, percent or kg: its demo value, else for a frame
/// measurement the middle of the catalogue's plausible range (to 5 mm or 0.5°).
fn example(f: Option<&Field>) -> Option<f64> {
    let f = f?;
    if let Some(v) = parse_number(f.demo) {
        return Some(v);
    }
    let m = f
        .name
        .strip_prefix("frame.")
        .and_then(framewise_kernel::lookup)?;
    let step = if f.kind == Kind::Deg { 0.5 } else { 5.0 };
    Some(nearest((m.plausible.0 + m.plausible.1) / 2.0 / step) as f64 * step)
}

/// The whole number nearest a positive `v` (an integer cast: `f64::round` is a library call in
/// wasm).
fn nearest(v: f64) -> i64 {
    (v + 0.5) as i64
}

/// What a field of quantity `q` takes, with `example` written in the units it accepts:
/// a length in mm, cm (÷ 10) and inches (÷ 25.4, to 0.1); a body's length also in feet and
/// inches (to the whole inch; 1 ft = 12 in). Source: 1 in = 25.4 mm exactly (international
/// yard and pound agreement, 1959) [read].
fn wanted(example: Option<f64>, q: Quantity) -> String {
    let Some(v) = example.filter(|v| v.is_finite()) else {
        return match q {
            Quantity::Length => "a length in mm, or add cm or in after the number".into(),
            Quantity::BodyLength => {
                "a length in mm, or add cm or in after the number, or feet and inches such as 5'10\"".into()
            }
            Quantity::Angle => "an angle in degrees".into(),
            Quantity::Percent => "a percentage, with or without %".into(),
            Quantity::Mass => "a mass in kg, or add lb after the number".into(),
        };
    };
    let inches = nearest(v / MM_PER_IN * 10.0) as f64 / 10.0;
    let (mm, cm, inch) = (fmt_num(v), fmt_num(v / 10.0), fmt_num(inches));
    match q {
        Quantity::Length if v > 0.0 => format!("a length such as {mm} mm, {cm} cm or {inch} in"),
        Quantity::Length => format!("a length in mm such as {mm}"),
        Quantity::BodyLength => {
            let whole = nearest(v / MM_PER_IN);
            let (feet, rest) = (whole / 12, whole % 12);
            format!("a length such as {mm} mm, {cm} cm or {feet}'{rest}\"")
        }
        Quantity::Angle => format!("an angle in degrees such as {}°", fmt_num(v)),
        Quantity::Percent => format!("a percentage such as {} %", fmt_num(v)),
        Quantity::Mass => format!("a mass such as {} kg", fmt_num(v)),
    }
}

fn unknown(name: &str) -> FieldError {
    FieldError::new(
        "unknown_field",
        name,
        format!("\"{name}\" is not a field of this form"),
    )
}

#[cfg(test)]
mod tests {
    use super::*;

    fn form(pairs: &[(&str, &str)]) -> BTreeMap<String, String> {
        pairs
            .iter()
            .map(|(k, v)| (k.to_string(), v.to_string()))
            .collect()
    }

    #[test]
    fn typed_text_becomes_a_scenario() {
        let (s, e) = scenario_from_form(&form(&[
            ("frame.reach_mm", "47 cm"),
            ("frame.head_angle_deg", "64,5°"),
            ("wheels.front", "29x2.4"),
            ("setup.stem_mm", "45"),
            ("changes.front_sag_pct", "20 %"),
            ("setup.spacers_mm", ""),
        ]));
        let b = s.bikes.first().cloned().unwrap_or_default();
        assert_eq!(b.frame.get("reach_mm").map(|p| p.value()), Some(470.0));
        assert_eq!(b.frame.get("head_angle_deg").map(|p| p.value()), Some(64.5));
        assert_eq!(b.setup.stem_mm, Some(45.0));
        assert_eq!(b.setup.spacers_mm, None);
        assert_eq!(b.changes.front_sag_pct, Some(20.0));
        assert!(e.is_empty(), "{e:?}");
    }

    #[test]
    fn a_typed_minus_sign_reads_as_a_negative_number() {
        // Messages write negative numbers with a minus sign (U+2212, kernel `error::minus`):
        // a person may type one, or paste one back, in any number field.
        let (s, e) = scenario_from_form(&form(&[
            ("setup.stem_angle_deg", "\u{2212}6°"),
            ("setup.saddle_setback_mm", "\u{2212}15"),
            ("frame.seat_axis_offset_mm", "\u{2212}2 cm"),
        ]));
        let b = s.bikes.first().cloned().unwrap_or_default();
        assert_eq!(b.setup.stem_angle_deg, Some(-6.0));
        assert_eq!(b.setup.saddle_setback_mm, Some(-15.0));
        // Its rounding is read as with a hyphen: "2 cm" is good to 10 mm.
        let offset = b.frame.get("seat_axis_offset_mm");
        assert_eq!(offset.map(|p| p.value()), Some(-20.0));
        assert_eq!(offset.and_then(|p| p.tolerance()), Some(10.0));
        assert!(e.is_empty(), "{e:?}");
    }

    #[test]
    fn bad_and_blank_required_fields_are_named() {
        let (_, e) = scenario_from_form(&form(&[
            ("frame.reach_mm", "long"),
            ("frame.stack_mm", " "),
        ]));
        let fields: Vec<_> = e.iter().map(|e| e.field.as_str()).collect();
        assert_eq!(fields, vec!["frame.reach_mm", "frame.stack_mm"]);
        assert!(e.iter().all(|e| e.code == "bad_number"));
    }

    /// The message of the one error `form` gives for `name`.
    fn message(pairs: &[(&str, &str)], name: &str) -> String {
        let (_, e) = scenario_from_form(&form(pairs));
        let mine: Vec<&FieldError> = e.iter().filter(|e| e.field == name).collect();
        assert_eq!(mine.len(), 1, "{e:?}");
        mine[0].message.clone()
    }

    #[test]
    fn messages_name_the_field_and_an_example_that_fits_it() {
        // Demo values (fields.rs): reach 470 mm, head tube angle 65°, height 1780 mm, inseam
        // 840 mm, mass 74 kg. Inches: 470 / 25.4 = 18.50; 1780 / 25.4 = 70.08 → 70 in = 5'10";
        // 840 / 25.4 = 33.07 → 33 in = 2'9".
        assert_eq!(
            message(&[("frame.reach_mm", "abc")], "frame.reach_mm"),
            "Reach \"abc\" is not a number; enter a length such as 470 mm, 47 cm or 18.5 in."
        );
        assert_eq!(
            message(&[("frame.head_angle_deg", "steep")], "frame.head_angle_deg"),
            "Head tube angle \"steep\" is not a number; enter an angle in degrees such as 65°."
        );
        assert_eq!(
            message(&[("rider.height_mm", "tall")], "rider.height_mm"),
            "Height \"tall\" is not a number; enter a length such as 1780 mm, 178 cm or 5'10\"."
        );
        assert_eq!(
            message(&[("rider.inseam_mm", "?")], "rider.inseam_mm"),
            "Inseam \"?\" is not a number; enter a length such as 840 mm, 84 cm or 2'9\"."
        );
        assert_eq!(
            message(&[("rider.mass_kg", "heavy")], "rider.mass_kg"),
            "Body mass \"heavy\" is not a number; enter a mass such as 74 kg."
        );
        // No demo value: the middle of the catalogue's plausible range (wheelbase 950–1350 mm
        // → 1150 mm = 115 cm = 45.28 in; effective seat angle 68–82° → 75°).
        assert_eq!(
            message(&[("frame.wheelbase_mm", "x")], "frame.wheelbase_mm"),
            "Wheelbase \"x\" is not a number; enter a length such as 1150 mm, 115 cm or 45.3 in."
        );
        assert_eq!(
            message(
                &[("frame.seat_angle_effective_deg", "x")],
                "frame.seat_angle_effective_deg"
            ),
            "Seat tube angle (effective) \"x\" is not a number; enter an angle in degrees such as 75°."
        );
        // No demo value and no catalogue range: what to type, without an example.
        assert_eq!(
            message(&[("setup.bar_width_mm", "wide")], "setup.bar_width_mm"),
            "Bar width \"wide\" is not a number; enter a length in mm, or add cm or in after the number."
        );
        assert_eq!(
            message(&[("rider.braking_g", "hard")], "rider.braking_g"),
            "Braking \"hard\" is not a number; enter a multiple of g such as 0.8."
        );
        assert_eq!(
            message(&[("frame.reach_mm", " ")], "frame.reach_mm"),
            "Reach is required: enter a length such as 470 mm, 47 cm or 18.5 in."
        );
    }

    #[test]
    fn every_number_message_is_a_sentence_naming_its_field() {
        for f in crate::fields::fields() {
            if matches!(f.kind, Kind::Text | Kind::Choice | Kind::Wheel) {
                continue;
            }
            let m = message(&[(f.name, "zz")], f.name);
            assert!(m.starts_with(f.label), "{}: {m}", f.name);
            assert!(m.contains("\"zz\" is not a number; enter "), "{m}");
            assert!(m.ends_with('.'), "{m}");
            assert!(!m.contains("NaN") && !m.contains("inf"), "{m}");
        }
    }

    /// Source: 1 in = 25.4 mm, 1 ft = 304.8 mm exactly (international yard and pound
    /// agreement, 1959) [read].
    #[test]
    fn usual_marks_are_read_in_the_form() {
        let (s, e) = scenario_from_form(&form(&[
            ("frame.reach_mm", "18.5\u{201d}"),
            ("frame.stack_mm", "635 (mm)"),
            ("frame.head_angle_deg", "65\u{2da}"),
            ("frame.head_tube_mm", "4.5''"),
            ("rider.height_mm", "5'10\""),
            ("rider.inseam_mm", "2\u{2019}9\u{201d}"),
        ]));
        assert!(e.is_empty(), "{e:?}");
        let b = s.bikes.first().cloned().unwrap_or_default();
        let frame = |k: &str| b.frame.get(k).map(|p| p.value()).unwrap_or(f64::NAN);
        assert!((frame("reach_mm") - 469.9).abs() < 1e-9);
        assert!((frame("stack_mm") - 635.0).abs() < 1e-9);
        assert!((frame("head_angle_deg") - 65.0).abs() < 1e-9);
        assert!((frame("head_tube_mm") - 114.3).abs() < 1e-9);
        let rider = s.rider.unwrap_or_default();
        // 5 × 304.8 + 10 × 25.4 = 1778; 2 × 304.8 + 9 × 25.4 = 838.2.
        assert!((rider.height_mm.unwrap_or(f64::NAN) - 1778.0).abs() < 1e-9);
        assert!((rider.inseam_mm.unwrap_or(f64::NAN) - 838.2).abs() < 1e-9);
        // Feet are a body's unit: a frame length in feet is refused, naming the field.
        let m = message(&[("frame.reach_mm", "1'6\"")], "frame.reach_mm");
        assert!(m.starts_with("Reach \"1'6\"\" is not a number"), "{m}");
        // So is a shoe stack or foot position of a few mm: "1'" is not 304.8 mm there, and the
        // message offers no feet.
        let m = message(&[("rider.shoe_stack_mm", "1'")], "rider.shoe_stack_mm");
        assert!(m.contains("is not a number") && !m.contains("5'10"), "{m}");
    }

    #[test]
    fn words_and_g_fields_are_read() {
        let (s, e) = scenario_from_form(&form(&[
            ("setup.bar_type", "Drop"),
            ("setup.hand_position", "drops"),
            ("rider.braking_g", "0,8"),
        ]));
        let b = s.bikes.first().cloned().unwrap_or_default();
        assert_eq!(b.setup.bar_type.as_deref(), Some("drop"));
        assert_eq!(b.setup.hand_position.as_deref(), Some("drops"));
        assert_eq!(s.rider.and_then(|r| r.braking_g), Some(0.8));
        assert!(e.is_empty(), "{e:?}");
        let (_, e) = scenario_from_form(&form(&[("setup.bar_type", "bullhorn")]));
        assert_eq!(e.len(), 1);
        assert_eq!(
            e[0].message,
            "Bar type must be one of flat, drop, got \"bullhorn\""
        );
    }
}
