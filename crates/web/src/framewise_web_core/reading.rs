//! A form read and evaluated: the form's JSON text read into fields, each field read into the
//! scenario (a second time for a length or wheel that reads another way), and the scenario
//! evaluated with the page's solve memo, kernel errors renamed to the form's field names.
//!
//! **Invariant:** a scenario is evaluated only when every field read; the solve memo changes only
//! the time an evaluation takes, never its report (crates/kernel/src/memo.rs).

use super::page_json::{FormResult, ReportJson};
use super::Run;
use framewise_kernel::{evaluate, report::REPORT_VERSION, Report};

thread_local! {
    /// The page's last frame solves: an edit that leaves the published frame numbers and
    /// the stock wheels as they were skips the solve (the report stays the same).
    static SOLVES: std::cell::RefCell<framewise_kernel::SolveMemo> =
        std::cell::RefCell::default();
}

/// [`evaluate`] with this thread's solve memo.
fn evaluate_remembered(scenario: &framewise_kernel::Scenario) -> Report {
    SOLVES.with(|memo| match memo.try_borrow_mut() {
        Ok(mut memo) => framewise_kernel::evaluate_with(scenario, &mut memo),
        Err(_) => evaluate(scenario),
    })
}

/// Forgets this thread's remembered solves (for tests and measurements: the next form
/// evaluation solves afresh).
pub fn forget_solves() {
    SOLVES.with(|memo| {
        if let Ok(mut memo) = memo.try_borrow_mut() {
            *memo = framewise_kernel::SolveMemo::default();
        }
    });
}

/// The form's fields, or the whole error result as JSON text when the text does not read.
pub(super) fn read_form(
    fields_json: &str,
) -> Result<std::collections::BTreeMap<String, String>, String> {
    serde_json::from_str(fields_json).map_err(|e| {
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
        serde_json::to_string(&FormResult {
            report: ReportJson::Whole(&report),
            svg: None,
            drawing: None,
            notes: None,
            field_errors: Vec::new(),
            field_notes: Vec::new(),
            link: None,
        })
        .unwrap_or_else(|_| "{}".into())
    })
}

/// A form read and evaluated: its scenario, how many of its fields did not read, and the
/// evaluation.
pub(crate) struct Read {
    pub(super) scenario: framewise_kernel::Scenario,
    pub(super) form_errors: usize,
    pub(super) evaluated: Evaluated,
}

/// A scenario's report (empty when a field did not read), every field error (form field
/// names) and the notes beside fields.
pub(crate) struct Evaluated {
    pub(super) report: Report,
    pub(super) field_errors: Vec<framewise_kernel::FieldError>,
    pub(super) field_notes: Vec<framewise_kernel::FieldError>,
}

/// Reads and evaluates a form, and reads it a second time when the kernel refused a field
/// that reads another way (`framewise_formats::form_units`): a length typed without a unit
/// that fits cm or inches alone, a wheel without its tyre width. Each such reading gets a
/// note beside its field; a length that fits both gets both readings in its error. The
/// re-read form is what the link and the drawing show.
pub(crate) fn read_and_evaluate(
    fields: &std::collections::BTreeMap<String, String>,
    run: Run,
) -> Read {
    use framewise_formats::form_units::{second_readings, Reread};
    let first = read_once(fields, &[], run);
    let mut replaced = Vec::new();
    let mut notes = Vec::new();
    let mut hints = Vec::new();
    for r in second_readings(fields, &first.evaluated.field_errors) {
        match r {
            Reread::Unit { field, text, note } => {
                replaced.push((field.clone(), text));
                notes.push(framewise_kernel::FieldError::new("read_as", field, note));
            }
            Reread::Either { field, hint } => hints.push((field, hint)),
        }
    }
    let mut read = if notes.is_empty() {
        first
    } else {
        let mut again = read_once(fields, &replaced, run);
        again.evaluated.field_notes = notes;
        again
    };
    // Said on the final reading's errors (a second reading keeps them: it changes only the
    // fields read another way).
    for (field, hint) in hints {
        let errors = read.evaluated.field_errors.iter_mut();
        for e in errors.filter(|e| e.field == field) {
            e.message = format!("{}. {hint}", e.message);
        }
    }
    read
}

/// One reading and evaluation of a form, with the text of the `replaced` fields replaced
/// (never inlined: [`read_and_evaluate`] calls it twice, and two inlined copies of the
/// evaluation would add kilobytes to the page's module).
#[inline(never)]
fn read_once(
    fields: &std::collections::BTreeMap<String, String>,
    replaced: &[(String, String)],
    run: Run,
) -> Read {
    let (scenario, errors) = framewise_formats::form::scenario_from_form_with(fields, replaced);
    let form_errors = errors.len();
    let evaluated = evaluated(&scenario, errors, run);
    Read {
        scenario,
        form_errors,
        evaluated,
    }
}

/// Evaluates a form's scenario when every field read (`field_errors` empty); kernel errors
/// are renamed from `bikes[0].frame.x` to the form's `frame.x`.
fn evaluated(
    scenario: &framewise_kernel::Scenario,
    mut field_errors: Vec<framewise_kernel::FieldError>,
    run: Run,
) -> Evaluated {
    let mut report = Report {
        version: REPORT_VERSION,
        bikes: Vec::new(),
        errors: Vec::new(),
    };
    if field_errors.is_empty() {
        report = match run {
            Run::Page => evaluate_remembered(scenario),
            Run::Rehearsal => evaluate(scenario),
        };
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
    Evaluated {
        report,
        field_errors,
        field_notes: Vec::new(),
    }
}
