//! The wasm-bindgen boundary: convert, call, return. No logic that native tests cannot reach.
#![deny(missing_docs)]

use wasm_bindgen::prelude::*;

// Share links (issue 6): link_from_form, form_from_link. The chart importer and the QR code are
// in the on-demand module (crates/extras), kept out of the module every visit loads.
pub mod link;

// The drawing as only what changed since the page's last one (drawing_changes).
pub mod changes;

// The page's per-edit work run for nothing once the page is idle (rehearse).
pub mod rehearse;

// The page's form kept between edits: an edit sends one field (evaluate_field_page).
pub mod edit;

// Not exported to the page (it never calls them; each export keeps its code in the module):
// scenario JSON and the form without its link are evaluated by the native core functions
// `framewise_web_core::evaluate_to_json` and `evaluate_form_to_json` (tests, CLI); the whole
// patch list of the last drawing by `last_drawing_patch` (tests; the page's
// `drawing_changes(0)` gives the same list).

/// Evaluates the page's form: the page's call on every edit. `fields_json`: `{ "<field name>":
/// "<typed text>", … }`; `view_json`: the view choices as a JSON object (or empty). Returns
/// `{report, svg, notes, field_errors}` as JSON text; each error's `field` is a form field name.
/// No drawing (`svg` is `null`): the page asks [`drawing_changes`] for it when it writes the
/// drawing, and [`drawing_svg`] for the document when the structure changed. No share link: the
/// page asks [`last_link`] for it in the next task, with the address.
#[wasm_bindgen]
pub fn evaluate_form_page(fields_json: &str, view_json: &str) -> String {
    framewise_web_core::evaluate_form_page_json(fields_json, view_json)
}

/// [`evaluate_form_page`] of the form the last [`evaluate_form_page`] call read, numbered
/// `form` by [`page_form_seq`], with the field `name` now `value`: the page's call on an edit
/// of one field (it sends neither the other fields nor has them read again). The same text as
/// [`evaluate_form_page`] of the whole edited form; `null` when the module no longer holds that
/// form (then the page sends the whole form). See [`edit`].
#[wasm_bindgen]
pub fn evaluate_field_page(form: u32, name: &str, value: &str, view_json: &str) -> String {
    edit::evaluate_field_page_json(form, name, value, view_json)
}

/// The number of the form the module holds for [`evaluate_field_page`] (0: none).
#[wasm_bindgen]
pub fn page_form_seq() -> u32 {
    edit::form_seq()
}

/// The share link fragment (`#…`) of the last [`evaluate_form_page`] or
/// [`evaluate_field_page`] call's form and view, or empty text when a field did not read, the
/// view did not read or the link cannot hold a value.
#[wasm_bindgen]
pub fn last_link() -> String {
    framewise_web_core::last_link()
}

/// The drawing of the last [`evaluate_form_page`] or [`evaluate_field_page`] call that
/// evaluated, as only what changed since the drawing the page shows: `shown` is the `seq` of
/// the last answer the page applied (0 for none). JSON text:
/// `{seq, structure, changes: [[index, value], …]}` (indexes into the patch list) when `shown`
/// is the last answer and the structure is the same, else `{seq, structure, patch}` (the whole
/// list); `null` before any evaluation. See [`changes`].
#[wasm_bindgen]
pub fn drawing_changes(shown: u32) -> String {
    changes::last_drawing_changes(shown)
}

/// Runs the page's per-edit work once on a form without changing anything the page shows, and
/// returns the length of the text it made: the page calls it in idle time after loading so
/// that the engine has optimised the module's code before the person's first edits. See
/// [`rehearse`].
#[wasm_bindgen]
pub fn rehearse(fields_json: &str, view_json: &str) -> usize {
    rehearse::rehearse(fields_json, view_json)
}

/// The SVG document of the drawing the last [`drawing_changes`] call made
/// (empty text when it made none): asked for only when the drawing's structure changed.
#[wasm_bindgen]
pub fn drawing_svg() -> String {
    framewise_web_core::last_drawing_svg()
}

/// The frame measurement catalogue (keys, labels, definitions, units, ranges) as JSON text.
#[wasm_bindgen]
pub fn catalogue_json() -> String {
    framewise_web_core::catalogue_json()
}

/// The page's words: input groups and fields (labels, units, demo values, definitions) and the
/// definitions of the report's other numbers, as JSON text.
#[wasm_bindgen]
pub fn page_words_json() -> String {
    framewise_web_core::page_words_json()
}

pub mod framewise_web_core;

#[cfg(test)]
mod tests;
