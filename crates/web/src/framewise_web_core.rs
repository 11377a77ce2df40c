//! Native-testable core of the binding: pure functions from text to text.
//!
//! Here: the scenario JSON call and the page's words and catalogue. The form's calls are in
//! `linked`, reading and evaluating a form in `reading`, the JSON they write in `page_json`, and
//! the last drawing in `drawing`; what the rest of the crate and the tests call is re-exported
//! here, so every path is `framewise_web_core::…`.
//!
//! **Invariant:** no function here panics or throws: a text that does not read (form, view,
//! scenario) comes back as JSON text with the error in it, so the page always gets a result.

mod drawing;
mod linked;
mod page_json;
mod reading;

pub(crate) use drawing::{keep_drawing, last_drawing};
pub use drawing::{last_drawing_patch, last_drawing_svg};
pub use linked::{
    evaluate_form_linked_to_json, evaluate_form_page_json, evaluate_form_to_json, last_link,
};
pub(crate) use linked::{linked, linked_fields, Link, Run};
pub use reading::forget_solves;

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

/// The page's words as JSON text (see [`framewise_formats::PageWords`]).
pub fn page_words_json() -> String {
    serde_json::to_string(&framewise_formats::page_words()).unwrap_or_else(|_| "{}".into())
}

/// The catalogue as JSON text.
pub fn catalogue_json() -> String {
    serde_json::to_string(CATALOGUE).unwrap_or_else(|_| "[]".into())
}
