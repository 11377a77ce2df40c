//! The page's form: raw typed text per field → a one-bike scenario, with a message per bad field.
//!
//! Field names are the scenario paths below the bike: `frame.reach_mm`, `wheels.front`,
//! `setup.stem_mm`, `changes.front_sag_pct`, `changes.wheels.rear`, `rider.height_mm`, `label`.
//! Blank optional fields are left out; a blank required field is an error.

use crate::fields::{field, Kind};
use crate::units::{parse_quantity, Quantity};
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

/// A numeric field: its unit suffix says how to read it (`_g` is a plain number).
fn number(name: &str, key: &str, text: &str, errors: &mut Vec<FieldError>) -> Option<f64> {
    if key.ends_with("_g") {
        let v = crate::units::parse_number(text.trim().trim_end_matches('g'));
        if v.is_none() {
            errors.push(FieldError::new(
                "bad_number",
                name,
                format!(
                    "\"{}\" is not a number: enter a multiple of g such as 0.8",
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
    parse_quantity(text, q)
        .map_err(|e| errors.push(FieldError::new("bad_number", name, e.to_string())))
        .ok()
}

/// A published frame value with the rounding its typed text shows: the tolerance is one unit of
/// the last typed digit ([`crate::units::parse_quantity_step`]: `99 cm` → 10 mm, `65` → 1°), but
/// never finer than the catalogue's default (1 mm, 0.1°).
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
        .map_err(|e| errors.push(FieldError::new("bad_number", name, e.to_string())))
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
    fn bad_and_blank_required_fields_are_named() {
        let (_, e) = scenario_from_form(&form(&[
            ("frame.reach_mm", "long"),
            ("frame.stack_mm", " "),
        ]));
        let fields: Vec<_> = e.iter().map(|e| e.field.as_str()).collect();
        assert_eq!(fields, vec!["frame.reach_mm", "frame.stack_mm"]);
        assert!(e.iter().all(|e| e.code == "bad_number"));
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
