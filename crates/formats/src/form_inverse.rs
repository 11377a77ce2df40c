//! The inverse of [`crate::form`]: a scenario's first bike as the page's form fields, so that
//! opening a link can fill the page. `scenario_from_form(form_from_scenario(s))` gives back `s`
//! for every value the form can hold; [`form_view`] also lists what it cannot.

use crate::units::Quantity;
use framewise_kernel::{BikeInput, Scenario, WheelSpec, WheelsInput};
use serde::Serialize;
use serde_json::{Map, Value};
use std::collections::BTreeMap;

/// The form fields of the scenario's first bike and its rider (see [`form_view`]).
pub fn form_from_scenario(scenario: &Scenario) -> BTreeMap<String, String> {
    form_view(scenario).fields
}

/// What the page shows of a scenario: the form fields, the view choices, the number of bikes and
/// the paths of values the form has no field for (they are left out, not guessed).
#[derive(Debug, Clone, PartialEq, Default, Serialize)]
pub struct FormView {
    /// Form field name → text, e.g. `"frame.reach_mm" → "470"`.
    pub fields: BTreeMap<String, String>,
    /// The scenario's view choices.
    pub view: framewise_kernel::View,
    /// How many bikes the scenario has (the form shows the first).
    pub bikes: usize,
    /// Paths of values the form cannot hold, e.g. `bikes[0].load`.
    pub omitted: Vec<String>,
}

/// Splits a scenario into the page's form fields and the rest; see [`FormView`].
pub fn form_view(scenario: &Scenario) -> FormView {
    let mut out = FormView {
        view: scenario.view.clone(),
        bikes: scenario.bikes.len(),
        ..FormView::default()
    };
    if let Some(rider) = &scenario.rider {
        numbers(&mut out, "rider", &to_map(rider));
    }
    if let Some(bike) = scenario.bikes.first() {
        first_bike(&mut out, bike);
    }
    for i in 1..scenario.bikes.len() {
        out.omitted.push(format!("bikes[{i}]"));
    }
    out
}

fn first_bike(out: &mut FormView, bike: &BikeInput) {
    if !bike.label.trim().is_empty() {
        out.fields
            .insert("label".into(), bike.label.trim().to_string());
    }
    for (key, p) in &bike.frame {
        out.fields
            .insert(format!("frame.{key}"), number_text(p.value()));
        if p.tolerance().is_some() {
            out.omitted.push(format!("bikes[0].frame.{key}.tolerance"));
        }
    }
    wheels(out, "wheels", &bike.wheels);
    wheels(out, "changes.wheels", &bike.changes.wheels);
    numbers(out, "setup", &to_map(&bike.setup));
    let mut changes = to_map(&bike.changes);
    changes.remove("wheels");
    numbers(out, "changes", &changes);
    if bike.seat_angle_ref_mm.is_some() {
        out.omitted.push("bikes[0].seat_angle_ref_mm".into());
    }
    if bike.load.is_some() {
        out.omitted.push("bikes[0].load".into());
    }
}

fn to_map<T: Serialize>(value: &T) -> Map<String, Value> {
    match serde_json::to_value(value) {
        Ok(Value::Object(m)) => m,
        _ => Map::new(),
    }
}

/// Numbers whose key has a unit the form reads (`_mm`, `_deg`, `_pct`, `_kg`) become fields, and
/// so do words of a choice field the form has (`setup.bar_type`: `flat` or `drop`).
fn numbers(out: &mut FormView, group: &str, values: &Map<String, Value>) {
    for (key, v) in values {
        let name = format!("{group}.{key}");
        let text = match v {
            Value::Number(n) if Quantity::from_key(key).is_some() => n.as_f64().map(number_text),
            Value::String(word) if is_choice(&name, word) => Some(word.clone()),
            _ => None,
        };
        match text {
            Some(text) => {
                out.fields.insert(name, text);
            }
            None => out.omitted.push(name),
        }
    }
}

/// Whether the form has a choice field `name` that allows `word`.
fn is_choice(name: &str, word: &str) -> bool {
    crate::fields::field(name)
        .is_some_and(|f| f.kind == crate::fields::Kind::Choice && f.choices.contains(&word))
}

fn wheels(out: &mut FormView, prefix: &str, w: &WheelsInput) {
    for (side, spec) in [("front", &w.front), ("rear", &w.rear)] {
        match spec {
            Some(WheelSpec::Designation(text)) => {
                out.fields.insert(format!("{prefix}.{side}"), text.clone());
            }
            Some(WheelSpec::Diameter { .. }) => out.omitted.push(format!("{prefix}.{side}")),
            None => {}
        }
    }
}

/// The shortest decimal text that reads back as the same number (`470`, `64.55`, `-1.5`).
pub fn number_text(x: f64) -> String {
    format!("{x}")
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::form::scenario_from_form;

    fn demo() -> Scenario {
        serde_json::from_value(serde_json::json!({
            "version": 1,
            "rider": { "height_mm": 1780, "mass_kg": 74.5, "inseam_mm": 840 },
            "bikes": [{ "label": "Trail M",
                "frame": { "reach_mm": 470, "stack_mm": 625, "head_angle_deg": 64.55,
                           "head_tube_mm": 110, "fork_a2c_mm": 561, "fork_offset_mm": 44 },
                "wheels": { "front": "29x2.4", "rear": "62-584" },
                "setup": { "stem_mm": 45, "stem_angle_deg": -6, "crank_mm": 172.5 },
                "changes": { "front_sag_pct": 22.5, "fork_a2c_delta_mm": 10,
                             "wheels": { "rear": "27.5x2.5" } } }]
        }))
        .unwrap()
    }

    #[test]
    fn the_form_of_a_scenario_reads_back_as_the_same_scenario() {
        let s = demo();
        let fields = form_from_scenario(&s);
        assert_eq!(fields["frame.head_angle_deg"], "64.55");
        assert_eq!(fields["changes.wheels.rear"], "27.5x2.5");
        let (back, errors) = scenario_from_form(&fields);
        assert!(errors.is_empty(), "{errors:?}");
        assert_eq!(back, s);
    }

    /// Source: the module's contract (every value the form can hold reads back the same). The
    /// bar type and the hand position are choices of the page's form: a drop bar opened from a
    /// link stays a drop bar (it came back as the form's first choice, a flat bar).
    #[test]
    fn the_form_holds_the_bar_type_and_the_hand_position() {
        let mut s = demo();
        s.bikes[0].setup.bar_type = Some("drop".into());
        s.bikes[0].setup.hand_position = Some("drops".into());
        let v = form_view(&s);
        assert_eq!(v.fields["setup.bar_type"], "drop");
        assert_eq!(v.fields["setup.hand_position"], "drops");
        assert!(v.omitted.is_empty(), "{:?}", v.omitted);
        let (back, errors) = scenario_from_form(&v.fields);
        assert!(errors.is_empty(), "{errors:?}");
        assert_eq!(back, s);
    }

    #[test]
    fn values_the_form_cannot_hold_are_listed_not_guessed() {
        let mut s = demo();
        s.bikes.push(s.bikes[0].clone());
        s.bikes[0].wheels.front = Some(WheelSpec::Diameter { diameter_mm: 740.0 });
        s.bikes[0].setup.hand_position = Some("aero".into()); // not a word the form allows
        let v = form_view(&s);
        assert_eq!(v.bikes, 2);
        assert!(!v.fields.contains_key("wheels.front"));
        for path in ["wheels.front", "setup.hand_position", "bikes[1]"] {
            assert!(
                v.omitted.iter().any(|p| p == path),
                "{path}: {:?}",
                v.omitted
            );
        }
    }
}
