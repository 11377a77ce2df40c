//! Scenario JSON in, report JSON out (DESIGN.md §8).

use framewise_kernel::{FieldError, Report, Scenario};

/// Parses a scenario from JSON text.
///
/// The text is read into a [`serde_json::Value`] first and the scenario from that, so every
/// scenario type is deserialised by one deserializer ([`from_value_at`]); the wasm module then
/// carries one copy of that code instead of one per reader (docs/BENCHMARKS.md, page bytes).
///
/// # Errors
/// Malformed JSON, a value of the wrong type or an unknown key returns a [`FieldError`] whose
/// `field` is the JSON path (e.g. `bikes[0].setup.stem_mm`) and whose message says what was
/// expected. Without the `field-paths` feature (the wasm build) `field` is empty for a value of
/// the wrong type; the message still says what was found and what was expected.
pub fn scenario_from_json(text: &str) -> Result<Scenario, FieldError> {
    let value: serde_json::Value = serde_json::from_str(text).map_err(|e| {
        FieldError::new(
            "bad_json",
            "",
            format!("the scenario is not valid JSON: {e}"),
        )
    })?;
    from_value_at(value).map_err(|(field, inner)| {
        let message = if field.is_empty() {
            format!("the scenario is not valid JSON: {inner}")
        } else {
            format!("{field}: {inner}")
        };
        FieldError::new("bad_value", field, message)
    })
}

/// Deserialises `T` from a JSON value. On error: the path of the bad value (`bikes[0].frame`,
/// empty for the top level or without the `field-paths` feature) and serde's message.
///
/// # Errors
/// A value of the wrong type or an unknown key.
pub fn from_value_at<T: serde::de::DeserializeOwned>(
    value: serde_json::Value,
) -> Result<T, (String, serde_json::Error)> {
    #[cfg(feature = "field-paths")]
    {
        serde_path_to_error::deserialize(value).map_err(|e| {
            let path = e.path().to_string();
            let field = if path == "." { String::new() } else { path };
            (field, e.into_inner())
        })
    }
    #[cfg(not(feature = "field-paths"))]
    {
        serde_json::from_value(value).map_err(|e| (String::new(), e))
    }
}

/// The report as pretty JSON. Every number in a report is finite (kernel invariant).
pub fn report_to_json(report: &Report) -> String {
    serde_json::to_string_pretty(report).unwrap_or_else(|e| {
        format!("{{\"errors\":[{{\"code\":\"internal\",\"field\":\"\",\"message\":\"{e}\"}}]}}")
    })
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    #[cfg(feature = "field-paths")]
    fn text_where_a_number_belongs_names_the_path() {
        let e = scenario_from_json(r#"{"bikes":[{"setup":{"stem_mm":"long"}}]}"#).err();
        let e = e.map(|e| (e.code, e.field)).unwrap_or_default();
        assert_eq!(
            e,
            (
                "bad_value".to_string(),
                "bikes[0].setup.stem_mm".to_string()
            )
        );
    }

    #[test]
    #[cfg(feature = "field-paths")]
    fn unknown_keys_and_bad_json_are_errors() {
        assert_eq!(
            scenario_from_json(r#"{"bikes":[{"colour":"red"}]}"#)
                .err()
                .map(|e| e.field),
            Some("bikes[0].colour".into())
        );
        assert_eq!(
            scenario_from_json("{").err().map(|e| e.code),
            Some("bad_json".into())
        );
    }

    #[test]
    fn published_values_with_their_own_rounding() {
        let s = scenario_from_json(
            r#"{"bikes":[{"frame":{"head_angle_deg":{"value":64.5,"tolerance":0.5},"reach_mm":470}}]}"#,
        );
        let s = s
            .ok()
            .and_then(|s| s.bikes.first().cloned())
            .unwrap_or_default();
        assert_eq!(
            s.frame.get("head_angle_deg").and_then(|p| p.tolerance()),
            Some(0.5)
        );
        assert_eq!(s.frame.get("reach_mm").map(|p| p.value()), Some(470.0));
    }
}
