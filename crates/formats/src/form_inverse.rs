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
        let name = format!("frame.{key}");
        match published_text(key, p.value(), p.tolerance()) {
            Some(text) => {
                out.fields.insert(name, text);
            }
            None => {
                out.fields.insert(name, number_text(p.value()));
                out.omitted.push(format!("bikes[0].frame.{key}.tolerance"));
            }
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

/// Text for a published frame value that the form reads back with the same tolerance
/// (`crate::form`: one unit of the last typed digit of a length, at least the catalogue default;
/// an angle always at the default): 990 mm to 10 mm → `99 cm`, 470 mm → `470`, 65° → `65` (an
/// angle to 1° has no text: `None`). A value
/// and tolerance read from a link are on the link's grid (0.5 mm, 0.05°), so a text within half
/// a grid step of both is taken when none is exact (469.9 mm typed as `18.5 in` comes back from
/// a link as 470 mm to 2.5 mm: `18.5 in`). `None` when no text of mm, cm or inches with up to
/// three decimals gives that tolerance.
pub(crate) fn published_text(key: &str, value: f64, tolerance: Option<f64>) -> Option<String> {
    let m = framewise_kernel::lookup(key)?;
    let default = m.default_tolerance();
    let tolerance = tolerance.unwrap_or(default);
    let angle = key.ends_with("_deg");
    let (q, units, half_grid) = if angle {
        (Quantity::Angle, &[("", 1.0)][..], 0.025)
    } else {
        (
            Quantity::Length,
            &[("", 1.0), (" cm", 10.0), (" in", 25.4)][..],
            0.25,
        )
    };
    let mut texts = vec![number_text(value)];
    for (unit, factor) in units {
        for d in 0..=3 {
            texts.push(format!("{:.d$}{unit}", value / factor));
        }
    }
    let read = |t: &String| {
        let (v, step) = crate::units::parse_quantity_step(t, q).ok()?;
        Some((v, step.map_or(default, |s| s.max(default))))
    };
    let off = |t: &String| read(t).map(|(v, tol)| ((v - value).abs(), (tol - tolerance).abs()));
    let exact = texts
        .iter()
        .find(|t| off(t).is_some_and(|(dv, dt)| dv == 0.0 && dt < 1e-9));
    exact
        .or_else(|| {
            texts
                .iter()
                .find(|t| off(t).is_some_and(|(dv, dt)| dv <= half_grid && dt <= half_grid))
        })
        .cloned()
}

/// The shortest decimal text that reads back as the same number (`470`, `64.55`, `-1.5`).
pub fn number_text(x: f64) -> String {
    format!("{x}")
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::form::scenario_from_form;
    use framewise_kernel::Published;

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

    /// Source: the form's reading of typed rounding (crate::form `published`): the text written
    /// for a published value reads back with the same value and tolerance.
    #[test]
    fn a_published_value_keeps_its_rounding_through_the_form() {
        let mut s = demo();
        let frame = &mut s.bikes[0].frame;
        frame.insert(
            "wheelbase_mm".into(),
            Published::WithTolerance {
                value: 1230.0,
                tolerance: 10.0,
            },
        );
        frame.insert("chainstay_mm".into(), Published::Value(435.0));
        frame.insert("head_angle_deg".into(), Published::Value(65.0));
        let v = form_view(&s);
        assert_eq!(v.fields["frame.wheelbase_mm"], "123 cm");
        assert_eq!(v.fields["frame.chainstay_mm"], "435");
        // Angles keep the default rounding however they are typed (units::parse_quantity_step).
        assert_eq!(v.fields["frame.head_angle_deg"], "65");
        assert!(v.omitted.is_empty(), "{:?}", v.omitted);
        let (back, errors) = scenario_from_form(&v.fields);
        assert!(errors.is_empty(), "{errors:?}");
        assert_eq!(back, s);
        // A tolerance no typed text gives is listed, not lost silently.
        s.bikes[0].frame.insert(
            "stack_mm".into(),
            Published::WithTolerance {
                value: 635.0,
                tolerance: 3.0,
            },
        );
        s.bikes[0].frame.insert(
            "seat_angle_effective_deg".into(),
            Published::WithTolerance {
                value: 77.0,
                tolerance: 1.0,
            },
        );
        let v = form_view(&s);
        assert_eq!(v.fields["frame.stack_mm"], "635");
        assert_eq!(v.fields["frame.seat_angle_effective_deg"], "77");
        assert_eq!(
            v.omitted,
            [
                "bikes[0].frame.seat_angle_effective_deg.tolerance",
                "bikes[0].frame.stack_mm.tolerance"
            ]
        );
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
