//! The JSON of a form's evaluation: the result the page's calls return (`FormResult`), the
//! report as the page reads it (`PageReport`, without the members it does not read), and
//! [`form_result_json`], which writes an evaluated form (and, for the plain call, its drawing).
//!
//! **Invariant:** the page's report has the whole report's members, in the same order, less
//! `effects`, `outline` and `stock_outline`; a page call writes no drawing (the page asks for
//! it), and remembers the report only when it is one the page shows.

use super::drawing::{drawing_of, patch_of, shown_view, DrawingPatch, LAST_REPORT};
use super::reading::Evaluated;
use super::Run;
use framewise_kernel::Report;
use serde::Serialize;

/// The report as the page's per-edit call writes it: every member the page reads, without
/// the bikes' outlines (the page draws from `drawing`) or the per-change effects (not shown
/// on the page). The JSON is about a third shorter: less to write in wasm and to parse.
#[derive(Serialize)]
pub(super) struct PageReport<'a> {
    version: u32,
    bikes: Vec<PageBike<'a>>,
    errors: &'a [framewise_kernel::FieldError],
}

/// One bike of a [`PageReport`]: [`framewise_kernel::report::BikeReport`]'s members by
/// reference, in the same order, less `effects`, `outline` and `stock_outline`.
#[derive(Serialize)]
struct PageBike<'a> {
    label: &'a str,
    residuals: &'a std::collections::BTreeMap<String, framewise_kernel::solve::Residual>,
    missing: &'a [String],
    stock: &'a framewise_kernel::report::Numbers,
    ridden: &'a framewise_kernel::report::Numbers,
    derived: &'a framewise_kernel::report::Numbers,
    fit: &'a framewise_kernel::report::Fit,
    handling: &'a framewise_kernel::report::Handling,
    checks: &'a [framewise_kernel::Check],
    #[serde(skip_serializing_if = "Option::is_none")]
    cockpit_parts: Option<&'a framewise_kernel::PartsSearch>,
    warnings: &'a [framewise_kernel::Warning],
}

impl<'a> PageReport<'a> {
    fn of(report: &'a Report) -> Self {
        let bikes = report
            .bikes
            .iter()
            .map(|b| PageBike {
                label: &b.label,
                residuals: &b.residuals,
                missing: &b.missing,
                stock: &b.stock,
                ridden: &b.ridden,
                derived: &b.derived,
                fit: &b.fit,
                handling: &b.handling,
                checks: &b.checks,
                cockpit_parts: b.cockpit_parts.as_ref(),
                warnings: &b.warnings,
            })
            .collect();
        PageReport {
            version: report.version,
            bikes,
            errors: &report.errors,
        }
    }
}

/// The whole report (the plain form call) or the page's view of it (the linked call).
#[derive(Serialize)]
#[serde(untagged)]
pub(super) enum ReportJson<'a> {
    Whole(&'a Report),
    Page(PageReport<'a>),
}

#[derive(Serialize)]
pub(super) struct FormResult<'a> {
    pub(super) report: ReportJson<'a>,
    pub(super) svg: Option<String>,
    #[serde(skip_serializing_if = "Option::is_none")]
    pub(super) drawing: Option<DrawingPatch<'a>>,
    /// One sentence per inconsistent published value, keyed like the residuals.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub(super) notes: Option<std::collections::BTreeMap<String, String>>,
    pub(super) field_errors: Vec<framewise_kernel::FieldError>,
    /// Notes beside fields that do not stop the evaluation, code `read_as`: a length typed
    /// without a unit read in cm or inches, a wheel without its tyre width
    /// (`framewise_formats::form_units`). The error type's shape: `{code, field, message}`.
    #[serde(skip_serializing_if = "Vec::is_empty")]
    pub(super) field_notes: Vec<framewise_kernel::FieldError>,
    /// `Some(link)` for [`evaluate_form_linked_to_json`] (a member, `null` when `None`),
    /// `None` for the plain form result (no member). A plain member rather than a
    /// `#[serde(flatten)]` wrapper: the same text, without flatten's map serializer.
    ///
    /// [`evaluate_form_linked_to_json`]: super::evaluate_form_linked_to_json
    #[serde(skip_serializing_if = "Option::is_none")]
    pub(super) link: Option<Option<String>>,
}

/// Writes an evaluated form (and draws it); `link: Some(_)` adds the `link` member.
pub(super) fn form_result_json(
    evaluated: Evaluated,
    link: Option<Option<String>>,
    page_call: bool,
    run: Run,
) -> String {
    let Evaluated {
        report,
        field_errors,
        field_notes,
    } = evaluated;
    let ok = field_errors.is_empty() && !report.bikes.is_empty();
    let notes = report
        .bikes
        .first()
        .filter(|_| ok)
        .map(framewise_formats::fields::residual_notes);
    if page_call {
        // The page's per-edit call: no drawing here. The page asks `drawing_changes` for it
        // when it writes the drawing, which is in the next task when the drawing is off the
        // screen (a person typing in a field lower down): the report is remembered for it.
        let json = serde_json::to_string(&FormResult {
            report: ReportJson::Page(PageReport::of(&report)),
            svg: None,
            drawing: None,
            notes,
            field_errors,
            field_notes,
            link,
        })
        .unwrap_or_else(|_| "{}".into());
        match run {
            Run::Page if ok => LAST_REPORT.with(|last| *last.borrow_mut() = Some(report)),
            Run::Page => {}
            // The rehearsal also makes and writes the drawing the page would ask for.
            Run::Rehearsal => {
                let shown = shown_view();
                let drawn = report.bikes.first().filter(|_| ok);
                if let Some(d) = drawn.map(|b| drawing_of(b, shown)) {
                    let patch = serde_json::to_string(&patch_of(&d)).unwrap_or_default();
                    return format!("{json}{patch}");
                }
            }
        }
        return json;
    }
    let drawn = report
        .bikes
        .first()
        .filter(|_| ok)
        .map(|b| drawing_of(b, None));
    let svg = drawn.as_ref().map(framewise_draw::Drawing::svg);
    let drawing = drawn.as_ref().map(patch_of);
    serde_json::to_string(&FormResult {
        report: ReportJson::Whole(&report),
        svg,
        drawing,
        notes,
        field_errors,
        field_notes,
        link,
    })
    .unwrap_or_else(|_| "{}".into())
}
