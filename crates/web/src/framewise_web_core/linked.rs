//! The form's calls: the plain one, the one with its share link, and the page's own (the link
//! made later by [`last_link`]), with how a call runs ([`Run`]) and when its link is made
//! ([`Link`]).
//!
//! **Invariant:** the share link [`last_link`] gives is that of the last page call whose fields
//! and view all read and whose bike the kernel drew; any other call leaves it, and a rehearsal
//! keeps nothing.

use super::page_json::form_result_json;
use super::reading::{read_and_evaluate, read_form, Read};

/// The form path: parse typed text, evaluate if every field reads, draw the first bike.
/// Kernel errors are renamed from `bikes[0].frame.x` to the form's `frame.x`.
pub fn evaluate_form_to_json(fields_json: &str) -> String {
    match read_form(fields_json) {
        Ok(fields) => {
            let read = read_and_evaluate(&fields, Run::Page);
            form_result_json(read.evaluated, None, false, Run::Page)
        }
        Err(json) => json,
    }
}

/// [`evaluate_form_to_json`] plus `"link"`: the share link fragment (`#…`) of the same form
/// and the view choices `view_json` (a JSON object or empty), or `null` when a field does not
/// read, the view does not read or the link cannot hold a value.
pub fn evaluate_form_linked_to_json(fields_json: &str, view_json: &str) -> String {
    linked(fields_json, view_json, Run::Page, Link::Now)
}

/// How a linked evaluation runs: for the page (its solve memo; the report kept for the
/// drawing) or as a rehearsal (a solve of its own, the drawing made and written too; nothing
/// kept), see [`crate::rehearse`].
#[derive(Clone, Copy, PartialEq, Eq)]
pub(crate) enum Run {
    Page,
    Rehearsal,
}

/// [`evaluate_form_linked_to_json`], run as `run` says.
pub(crate) fn linked(fields_json: &str, view_json: &str, run: Run, when: Link) -> String {
    match read_form(fields_json) {
        Ok(fields) => linked_fields(&fields, view_json, run, when),
        Err(json) => json,
    }
}

/// [`linked`] of a form already read (field name → typed text).
pub(crate) fn linked_fields(
    fields: &std::collections::BTreeMap<String, String>,
    view_json: &str,
    run: Run,
    when: Link,
) -> String {
    // Only the page's own call remembers its form for `last_link`, and only a form the page
    // shows (every field and the view read, and the kernel drew a bike): any other keeps
    // the last good form's link, as the page keeps the last good drawing. A rehearsal keeps
    // nothing.
    let later = when == Link::Later && run == Run::Page;
    let Read {
        mut scenario,
        form_errors,
        evaluated,
    } = read_and_evaluate(fields, run);
    let view = if view_json.trim().is_empty() {
        Some(scenario.view.clone())
    } else {
        serde_json::from_str(view_json).ok()
    };
    let linkable = match view {
        Some(view) if form_errors == 0 => {
            scenario.view = view;
            true
        }
        _ => false,
    };
    let link = match when {
        Link::Now => Some(linkable.then(|| link_of(&scenario)).flatten()),
        Link::Later => None,
    };
    // What the page shows: a bike and no field in error (else it keeps its last good one).
    let shown = evaluated.field_errors.is_empty() && !evaluated.report.bikes.is_empty();
    let json = form_result_json(evaluated, link, true, run);
    if later && linkable && shown {
        LINKABLE.with(|l| *l.borrow_mut() = Some(scenario));
    }
    json
}

/// When the share link is made: in the same call (the result's `link` member) or later by
/// [`last_link`] (no member): the page makes it in the task after the edit, with the
/// address, so the edit's own work is about a fifth shorter (callgrind, docs/BENCHMARKS.md).
#[derive(Clone, Copy, PartialEq, Eq)]
pub(crate) enum Link {
    Now,
    Later,
}

thread_local! {
    /// The scenario, with its view, of the page's last [`evaluate_form_page_json`] or
    /// [`crate::edit::evaluate_field_page_json`] call that the page shows (see [`last_link`]);
    /// `None` before any.
    static LINKABLE: std::cell::RefCell<Option<framewise_kernel::Scenario>> =
        const { std::cell::RefCell::new(None) };
}

/// The share link fragment (`#…`) of a scenario, or `None` when the link cannot hold it.
fn link_of(scenario: &framewise_kernel::Scenario) -> Option<String> {
    framewise_formats::encode_link(scenario)
        .ok()
        .map(|frag| format!("#{frag}"))
}

/// [`evaluate_form_linked_to_json`] without the `link` member: the link is made later by
/// [`last_link`]. The page's call for a whole form; the form is kept for
/// [`crate::edit::evaluate_field_page_json`] (a form that does not read keeps none).
pub fn evaluate_form_page_json(fields_json: &str, view_json: &str) -> String {
    match read_form(fields_json) {
        Ok(fields) => crate::edit::keep_and_evaluate(fields, view_json),
        Err(json) => {
            crate::edit::forget();
            json
        }
    }
}

/// The share link fragment of the last good form: that of the last [`evaluate_form_page_json`]
/// or [`crate::edit::evaluate_field_page_json`] call whose fields and view all read and whose
/// bike the kernel drew (any other call leaves it), or empty text before any or when the link
/// cannot hold a value. So the page may make the link any time after an edit (it waits for a
/// pause in typing): a later edit that does not read cannot take the last good link away.
pub fn last_link() -> String {
    LINKABLE.with(|l| l.borrow().as_ref().and_then(link_of).unwrap_or_default())
}
