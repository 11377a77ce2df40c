//! A rehearsal of the page's per-edit work, run while the page is idle after loading.
//!
//! Why: V8 first runs a wasm function as quickly compiled, unoptimised code and optimises it
//! only once it has run for a while. Measured in the page (docs/BENCHMARKS.md): an edit's wasm
//! work took about 1.5–1.8 ms over the first 50 edits and 0.7–0.9 ms after 300, and a few
//! hundred rehearsals at load bring the first real edit to the faster figure.
//!
//! Invariant: a rehearsal changes nothing the page sees. It runs the work of an edit (solve the
//! frame, evaluate, write the report and the link, make and write the drawing) on the whole
//! form, read from JSON text as a whole-form call reads it (an edit of one field changes the
//! form the module holds instead, [`crate::edit`]: a few lines apart from the same
//! evaluation). It solves without the page's memo and keeps neither the report, the drawing
//! nor the form, so [`crate::drawing_changes`], [`crate::drawing_svg`],
//! [`crate::page_form_seq`] and the memo answer exactly as before it.

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

        let held = crate::framewise_web_core::evaluate_form_page_json(&mine, "");
        let held_seq = crate::edit::form_seq();
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
        // The form the module holds for one-field edits is the page's, still.
        assert_eq!(crate::edit::form_seq(), held_seq);
        let again = crate::edit::evaluate_field_page_json(held_seq, "setup.stem_mm", "45", "");
        assert_eq!(again, held);
        // A form that does not read is rehearsed without a throw.
        assert!(rehearse("not json", "") > 0);
    }
}
