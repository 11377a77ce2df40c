//! Share links on the page: the form ↔ a link fragment. The QR code of a link is drawn by the
//! on-demand module (crates/extras), not here.
//! The wasm functions only convert; the logic is in [`link_core`], tested natively.

use wasm_bindgen::prelude::*;

/// The link fragment (with its leading `#`) of the page's form and view choices.
/// `fields_json`: `{ "<field name>": "<typed text>", … }`; `view_json`: the view choices as a
/// JSON object, or an empty string for none.
///
/// # Errors
/// A field that does not read (the message names it) or a value a link cannot hold.
#[wasm_bindgen]
pub fn link_from_form(fields_json: &str, view_json: &str) -> Result<String, JsError> {
    link_core::link_from_form(fields_json, view_json).map_err(|e| JsError::new(&e))
}

/// Reads a link (a fragment with or without `#`, or a whole URL) into the page's form:
/// JSON text `{ "fields": {…}, "view": {…}, "bikes": n, "omitted": ["<path>", …] }`.
///
/// # Errors
/// The link's problem in plain words (cut short, damaged, from a newer version, …).
#[wasm_bindgen]
pub fn form_from_link(link: &str) -> Result<String, JsError> {
    link_core::form_from_link(link).map_err(|e| JsError::new(&e))
}

/// Native-testable core of the link functions: text in, text or a message out.
pub mod link_core {
    use framewise_formats::{decode_link, encode_link, form_view, scenario_from_form};
    use framewise_kernel::View;
    use std::collections::BTreeMap;

    /// See [`super::link_from_form`].
    ///
    /// # Errors
    /// The first field problem, or the link codec's message.
    pub fn link_from_form(fields_json: &str, view_json: &str) -> Result<String, String> {
        let fields: BTreeMap<String, String> = serde_json::from_str(fields_json)
            .map_err(|e| format!("the form could not be read: {e}"))?;
        let (mut scenario, errors) = scenario_from_form(&fields);
        if let Some(e) = errors.first() {
            return Err(format!("{}: {}", e.field, e.message));
        }
        if !view_json.trim().is_empty() {
            scenario.view = serde_json::from_str::<View>(view_json)
                .map_err(|e| format!("the view choices could not be read: {e}"))?;
        }
        encode_link(&scenario)
            .map(|frag| format!("#{frag}"))
            .map_err(|e| e.to_string())
    }

    /// See [`super::form_from_link`].
    ///
    /// # Errors
    /// The link codec's message.
    pub fn form_from_link(link: &str) -> Result<String, String> {
        let scenario = decode_link(link).map_err(|e| e.to_string())?;
        serde_json::to_string(&form_view(&scenario)).map_err(|e| e.to_string())
    }
}

#[cfg(test)]
mod tests {
    use super::link_core::*;

    const FORM: &str = r#"{"label":"Trail M","frame.reach_mm":"47 cm","frame.stack_mm":"635",
        "frame.head_angle_deg":"64,5°","frame.head_tube_mm":"110","frame.fork_a2c_mm":"561",
        "frame.fork_offset_mm":"44","wheels.front":"29x2.4","wheels.rear":"29x2.4",
        "setup.stem_mm":"45","rider.height_mm":"1780"}"#;

    #[test]
    fn a_form_becomes_a_link_and_the_link_fills_the_form_again() {
        let link = link_from_form(FORM, r#"{"units":"in","dimensions":true}"#).unwrap();
        assert!(link.starts_with('#'));
        let v: serde_json::Value = serde_json::from_str(&form_from_link(&link).unwrap()).unwrap();
        // "47 cm" is good to the centimetre: the link keeps that rounding, so the form shows it
        // as typed (a "470" would read as good to the millimetre).
        assert_eq!(v["fields"]["frame.reach_mm"], "47 cm");
        assert_eq!(v["fields"]["frame.stack_mm"], "635");
        assert_eq!(v["omitted"], serde_json::json!([]));
        // The same form gives the same link again.
        let form = serde_json::to_string(&v["fields"]).unwrap();
        assert_eq!(
            link_from_form(&form, r#"{"units":"in","dimensions":true}"#).unwrap(),
            link
        );
        assert_eq!(v["fields"]["frame.head_angle_deg"], "64.5");
        assert_eq!(v["fields"]["label"], "Trail M");
        assert_eq!(v["fields"]["rider.height_mm"], "1780");
        assert_eq!(v["view"]["units"], "in");
        assert_eq!(v["view"]["dimensions"], true);
        assert_eq!(v["bikes"], 1);
    }

    #[test]
    fn a_bad_field_or_a_bad_link_gives_a_message() {
        let e = link_from_form(r#"{"frame.reach_mm":"long"}"#, "").unwrap_err();
        assert!(e.starts_with("frame.reach_mm:"), "{e}");
        let e = form_from_link("#AdwCeInU").unwrap_err();
        assert!(e.contains("copy the whole link again"), "{e}");
    }

    #[test]
    fn a_hostile_label_from_a_link_is_inert_in_the_drawing() {
        // The label is shown in the drawing's <title> and aria-label: the drawing's writer must escape it.
        for label in [
            "<script>alert(1)</script>",
            "\"><img src=x onerror=alert(1)>",
        ] {
            let mut s = framewise_formats::decode_link(
                &std::fs::read_to_string(concat!(
                    env!("CARGO_MANIFEST_DIR"),
                    "/../../tests/links/v1-minimal.txt"
                ))
                .unwrap(),
            )
            .unwrap();
            s.bikes[0].label = label.to_string();
            let s = framewise_formats::decode_link(&framewise_formats::encode_link(&s).unwrap())
                .unwrap();
            assert_eq!(s.bikes[0].label, label);
            let report = framewise_kernel::evaluate(&s);
            assert!(report.errors.is_empty(), "{:?}", report.errors);
            let svg = framewise_draw::draw_bike(&report.bikes[0]);
            assert!(!svg.contains("<script"), "raw script tag in: {svg}");
            assert!(!svg.contains("<img"), "raw img tag in the drawing");
            assert!(!svg.contains("\"><"), "attribute broken out of");
            assert!(svg.contains("&lt;"), "label not escaped");
        }
    }
}
