//! The wasm-bindgen boundary: convert, call, return. No logic that native tests cannot reach.
#![deny(missing_docs)]

use wasm_bindgen::prelude::*;

mod chart;
pub use chart::{import_chart, import_chart_with_answers};
// Share links and QR codes (issue 6): link_from_form, form_from_link, qr_svg.
pub mod link;

/// Evaluates a scenario given as JSON text; returns `{report, svg}` as JSON text.
/// Bad input never throws: errors come back in `report.errors`.
#[wasm_bindgen]
pub fn evaluate_json(scenario_json: &str) -> String {
    framewise_web_core::evaluate_to_json(scenario_json)
}

/// Evaluates the page's form: `{ "<field name>": "<typed text>", … }` as JSON text. Returns
/// `{report, svg, field_errors}` as JSON text, where each error's `field` is a form field name.
#[wasm_bindgen]
pub fn evaluate_form(fields_json: &str) -> String {
    framewise_web_core::evaluate_form_to_json(fields_json)
}

/// The frame measurement catalogue (keys, labels, definitions, units, ranges) as JSON text.
#[wasm_bindgen]
pub fn catalogue_json() -> String {
    framewise_web_core::catalogue_json()
}

/// Native-testable core of the binding: pure functions from text to text.
pub mod framewise_web_core {
    use framewise_formats::scenario_from_json;
    use framewise_kernel::{evaluate, report::REPORT_VERSION, Report, CATALOGUE};
    use serde::Serialize;

    #[derive(Serialize)]
    struct PageResult<'a> {
        report: &'a Report,
        svg: Option<String>,
    }

    /// Evaluate and draw the first bike; JSON text `{ "report": …, "svg": "<svg…>" | null }`.
    pub fn evaluate_to_json(scenario_json: &str) -> String {
        let report = match scenario_from_json(scenario_json) {
            Ok(s) => framewise_kernel::evaluate(&s),
            Err(e) => Report {
                version: REPORT_VERSION,
                bikes: Vec::new(),
                errors: vec![e],
            },
        };
        let svg = if report.errors.is_empty() {
            report.bikes.first().map(framewise_draw::draw_bike)
        } else {
            None
        };
        let _ = evaluate;
        serde_json::to_string(&PageResult {
            report: &report,
            svg,
        })
        .unwrap_or_else(|_| "{}".into())
    }

    #[derive(Serialize)]
    struct FormResult<'a> {
        report: &'a Report,
        svg: Option<String>,
        field_errors: Vec<framewise_kernel::FieldError>,
    }

    /// The form path: parse typed text, evaluate if every field reads, draw the first bike.
    /// Kernel errors are renamed from `bikes[0].frame.x` to the form's `frame.x`.
    pub fn evaluate_form_to_json(fields_json: &str) -> String {
        let fields: std::collections::BTreeMap<String, String> =
            match serde_json::from_str(fields_json) {
                Ok(f) => f,
                Err(e) => {
                    let err = framewise_kernel::FieldError::new(
                        "bad_form",
                        "",
                        format!("the form could not be read: {e}"),
                    );
                    let report = Report {
                        version: REPORT_VERSION,
                        bikes: Vec::new(),
                        errors: vec![err],
                    };
                    return serde_json::to_string(&FormResult {
                        report: &report,
                        svg: None,
                        field_errors: Vec::new(),
                    })
                    .unwrap_or_else(|_| "{}".into());
                }
            };
        let (scenario, mut field_errors) = framewise_formats::scenario_from_form(&fields);
        let mut report = Report {
            version: REPORT_VERSION,
            bikes: Vec::new(),
            errors: Vec::new(),
        };
        if field_errors.is_empty() {
            report = framewise_kernel::evaluate(&scenario);
            for e in &report.errors {
                let mut e = e.clone();
                e.field = e
                    .field
                    .strip_prefix("bikes[0].")
                    .unwrap_or(&e.field)
                    .to_string();
                field_errors.push(e);
            }
        }
        let svg = if field_errors.is_empty() {
            report.bikes.first().map(framewise_draw::draw_bike)
        } else {
            None
        };
        serde_json::to_string(&FormResult {
            report: &report,
            svg,
            field_errors,
        })
        .unwrap_or_else(|_| "{}".into())
    }

    /// The catalogue as JSON text.
    pub fn catalogue_json() -> String {
        serde_json::to_string(CATALOGUE).unwrap_or_else(|_| "[]".into())
    }
}

#[cfg(test)]
mod tests {
    use super::framewise_web_core::*;

    #[test]
    fn bad_json_comes_back_as_an_error_not_a_throw() {
        let v: serde_json::Value =
            serde_json::from_str(&evaluate_to_json("{oops")).unwrap_or_default();
        assert_eq!(v["report"]["errors"][0]["code"], "bad_json");
        assert!(v["svg"].is_null());
    }

    #[test]
    fn form_errors_use_form_field_names() {
        let json = evaluate_form_to_json(
            r#"{"frame.reach_mm":"470","frame.stack_mm":"635","frame.head_angle_deg":"95",
            "frame.head_tube_mm":"110","frame.fork_a2c_mm":"561","frame.fork_offset_mm":"44"}"#,
        );
        let v: serde_json::Value = serde_json::from_str(&json).unwrap_or_default();
        assert_eq!(v["field_errors"][0]["field"], "frame.head_angle_deg");
        assert_eq!(
            v["field_errors"][0]["message"],
            "Head tube angle must be between 45 and 85 °, got 95"
        );
        assert!(v["svg"].is_null());
    }

    #[test]
    fn catalogue_lists_every_key() {
        let v: serde_json::Value = serde_json::from_str(&catalogue_json()).unwrap_or_default();
        assert_eq!(
            v.as_array().map(Vec::len),
            Some(framewise_kernel::CATALOGUE.len())
        );
    }
}
