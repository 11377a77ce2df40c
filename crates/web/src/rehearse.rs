//! A rehearsal of the page's per-edit work, run while the page is idle after loading.
//!
//! Why: V8 first runs a wasm function as quickly compiled, unoptimised code and optimises it
//! only once it has run for a while. Measured in the page (docs/BENCHMARKS.md): an edit's wasm
//! work took about 1.5–1.8 ms over the first 50 edits and 0.7–0.9 ms after 300, and a few
//! hundred rehearsals at load bring the first real edit to the faster figure.
//!
//! Invariant: a rehearsal changes nothing the page sees. It runs the same code as an edit
//! (read the form, solve the frame, evaluate, write the report and the link, make and write
//! the drawing) but solves without the page's memo and keeps neither the report nor the
//! drawing, so [`crate::drawing_changes`], [`crate::drawing_svg`] and the memo answer exactly
//! as before it.

use crate::framewise_web_core::{linked, Link, Run};

/// One rehearsal of the page's per-edit work on the form `fields_json` with the view
/// `view_json`; returns the length of the text made (so the work cannot be skipped as unused).
pub fn rehearse(fields_json: &str, view_json: &str) -> usize {
    linked(fields_json, view_json, Run::Rehearsal, Link::Now).len()
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::changes::last_drawing_changes;
    use crate::changes::tests::form;
    use crate::framewise_web_core::{evaluate_form_linked_to_json, last_drawing_patch};

    /// Source: the module's invariant. Rehearsals of another form change neither the page's
    /// next answer nor its drawing; they do the whole work (report, link and drawing text).
    #[test]
    fn a_rehearsal_changes_nothing_the_page_sees() {
        let (mine, other) = (form("470", "45"), form("490", "45"));
        let view = r#"{"posture":"standing"}"#;
        let other_call = evaluate_form_linked_to_json(&other, view).len();

        let edit = evaluate_form_linked_to_json(&mine, "");
        let drawing = last_drawing_patch();
        let first: serde_json::Value =
            serde_json::from_str(&last_drawing_changes(0)).unwrap_or_default();
        let seq = u32::try_from(first["seq"].as_u64().unwrap_or(0)).unwrap_or(0);

        let made = rehearse(&other, view);
        assert!(made > other_call, "{made}: the report and the drawing");
        assert_eq!(rehearse(&other, view), made);

        // The page's state as after `edit`: the same drawing, no changes since the answer it
        // shows, and the same answer to the same form.
        assert_eq!(last_drawing_patch(), drawing);
        let next: serde_json::Value =
            serde_json::from_str(&last_drawing_changes(seq)).unwrap_or_default();
        assert_eq!(next["changes"].as_array().map(Vec::len), Some(0), "{next}");
        assert_eq!(evaluate_form_linked_to_json(&mine, ""), edit);
        // A form that does not read is rehearsed without a throw.
        assert!(rehearse("not json", "") > 0);
    }
}
