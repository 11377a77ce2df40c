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

    std::thread_local! {
        /// The report of the last linked evaluation that evaluated, for [`last_drawing_patch`].
        static LAST_REPORT: std::cell::RefCell<Option<Report>> =
            const { std::cell::RefCell::new(None) };
        /// The drawing [`last_drawing_patch`] made last, for [`last_drawing_svg`].
        static LAST_DRAWING: std::cell::RefCell<Option<framewise_draw::Drawing>> =
            const { std::cell::RefCell::new(None) };
    }

    /// The drawing of the last [`evaluate_form_linked_to_json`] that evaluated (a form with a
    /// field that does not read leaves the one before), as `{structure, patch}` JSON text, or
    /// `null` before any. The drawing is kept for [`last_drawing_svg`].
    pub fn last_drawing_patch() -> String {
        let Some(d) = last_drawing() else {
            return "null".into();
        };
        let json = serde_json::to_string(&patch_of(&d)).unwrap_or_else(|_| "null".into());
        keep_drawing(d);
        json
    }

    /// The drawing of the last linked evaluation that evaluated, made now, in the view box of
    /// the drawing kept last while that still fits ([`framewise_draw::view::steady`]).
    pub(crate) fn last_drawing() -> Option<framewise_draw::Drawing> {
        let shown = shown_view();
        LAST_REPORT.with(|r| {
            r.borrow()
                .as_ref()
                .and_then(|r| r.bikes.first().map(|b| drawing_of(b, shown)))
        })
    }

    /// The view box of the drawing kept last (the one the page shows), if any.
    fn shown_view() -> Option<framewise_draw::ViewBox> {
        LAST_DRAWING.with(|d| d.borrow().as_ref().map(framewise_draw::Drawing::view))
    }

    /// Keeps a drawing for [`last_drawing_svg`].
    pub(crate) fn keep_drawing(d: framewise_draw::Drawing) {
        LAST_DRAWING.with(|last| *last.borrow_mut() = Some(d));
    }

    /// The SVG of the drawing [`last_drawing_patch`] made last, or empty text.
    pub fn last_drawing_svg() -> String {
        LAST_DRAWING.with(|d| d.borrow().as_ref().map(|d| d.svg()).unwrap_or_default())
    }

    /// One bike's drawing with its handling limits (crates/draw), in the view box `shown` while
    /// that still fits.
    fn drawing_of(
        bike: &framewise_kernel::report::BikeReport,
        shown: Option<framewise_draw::ViewBox>,
    ) -> framewise_draw::Drawing {
        let scene = framewise_draw::Scene {
            label: &bike.label,
            ridden: &bike.outline,
            stock: &bike.stock_outline,
            numbers: &bike.ridden,
            seated: limits(&bike.handling.seated),
            standing: limits(&bike.handling.standing),
        };
        framewise_draw::drawing_in(&scene, shown)
    }

    fn patch_of(d: &framewise_draw::Drawing) -> DrawingPatch<'_> {
        DrawingPatch {
            structure: d.structure(),
            patch: d.patch(),
        }
    }

    /// The drawing's patch (crates/draw `Drawing::patch`): the page applies it in place when
    /// `structure` equals that of the drawing it shows, else writes the SVG.
    #[derive(Serialize)]
    struct DrawingPatch<'a> {
        structure: String,
        patch: Vec<framewise_draw::Patch<'a>>,
    }

    /// The report as the page's per-edit call writes it: every member the page reads, without
    /// the bikes' outlines (the page draws from `drawing`) or the per-change effects (not shown
    /// on the page). The JSON is about a third shorter: less to write in wasm and to parse.
    #[derive(Serialize)]
    struct PageReport<'a> {
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
    enum ReportJson<'a> {
        Whole(&'a Report),
        Page(PageReport<'a>),
    }

    #[derive(Serialize)]
    struct FormResult<'a> {
        report: ReportJson<'a>,
        svg: Option<String>,
        #[serde(skip_serializing_if = "Option::is_none")]
        drawing: Option<DrawingPatch<'a>>,
        /// One sentence per inconsistent published value, keyed like the residuals.
        #[serde(skip_serializing_if = "Option::is_none")]
        notes: Option<std::collections::BTreeMap<String, String>>,
        field_errors: Vec<framewise_kernel::FieldError>,
        /// Notes beside fields that do not stop the evaluation, code `read_as`: a length typed
        /// without a unit read in cm or inches, a wheel without its tyre width
        /// (`framewise_formats::form_units`). The error type's shape: `{code, field, message}`.
        #[serde(skip_serializing_if = "Vec::is_empty")]
        field_notes: Vec<framewise_kernel::FieldError>,
        /// `Some(link)` for [`evaluate_form_linked_to_json`] (a member, `null` when `None`),
        /// `None` for the plain form result (no member). A plain member rather than a
        /// `#[serde(flatten)]` wrapper: the same text, without flatten's map serializer.
        #[serde(skip_serializing_if = "Option::is_none")]
        link: Option<Option<String>>,
    }

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

    /// The form's fields, or the whole error result as JSON text when the text does not read.
    fn read_form(fields_json: &str) -> Result<std::collections::BTreeMap<String, String>, String> {
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
        scenario: framewise_kernel::Scenario,
        form_errors: usize,
        evaluated: Evaluated,
    }

    /// A scenario's report (empty when a field did not read), every field error (form field
    /// names) and the notes beside fields.
    pub(crate) struct Evaluated {
        report: Report,
        field_errors: Vec<framewise_kernel::FieldError>,
        field_notes: Vec<framewise_kernel::FieldError>,
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

    /// Writes an evaluated form (and draws it); `link: Some(_)` adds the `link` member.
    fn form_result_json(
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

    /// The handling limits written on the centre-of-mass lines, from one posture's statics.
    fn limits(n: &framewise_kernel::report::Numbers) -> framewise_draw::Limits {
        framewise_draw::Limits {
            braking_g: n.get("pitch_over_decel_g").copied(),
            descent_deg: n.get("front_tip_slope_deg").copied(),
            climb_deg: n.get("rear_tip_slope_deg").copied(),
        }
    }

    /// The page's words as JSON text (see [`framewise_formats::PageWords`]).
    pub fn page_words_json() -> String {
        serde_json::to_string(&framewise_formats::page_words()).unwrap_or_else(|_| "{}".into())
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
            "Head tube angle must be between 45 and 85°, got 95"
        );
        assert!(v["svg"].is_null());
    }

    /// A form with the given reach and rider height texts (the rest as the page's demo).
    fn form_with(reach: &str, height: &str) -> String {
        format!(
            r#"{{"frame.reach_mm":"{reach}","frame.stack_mm":"635","frame.head_angle_deg":"65",
            "frame.head_tube_mm":"110","frame.fork_a2c_mm":"561","frame.fork_offset_mm":"44",
            "frame.chainstay_mm":"435","frame.bb_drop_mm":"35","setup.stem_mm":"45",
            "rider.height_mm":"{height}","rider.mass_kg":"74"}}"#
        )
    }

    #[test]
    fn a_length_typed_without_its_unit_is_read_in_cm_or_inches_when_only_one_fits() {
        let view = r#"{"posture":"seated"}"#;
        let parse =
            |json: String| -> serde_json::Value { serde_json::from_str(&json).unwrap_or_default() };
        // A reach of 47,5 (cm, as a phone's number pad types it) and a height of 70 (inches).
        let guessed = parse(evaluate_form_linked_to_json(&form_with("47,5", "70"), view));
        let typed = parse(evaluate_form_linked_to_json(
            &form_with("475", "1778"),
            view,
        ));
        assert_eq!(guessed["field_errors"], serde_json::json!([]), "{guessed}");
        assert_eq!(guessed["report"], typed["report"]);
        assert_eq!(guessed["link"], typed["link"]);
        assert!(
            typed.get("field_notes").is_none(),
            "no notes when nothing was guessed"
        );
        let notes = guessed["field_notes"]
            .as_array()
            .cloned()
            .unwrap_or_default();
        assert_eq!(notes.len(), 2, "{notes:?}");
        let note = |field: &str| {
            notes
                .iter()
                .find(|n| n["field"] == field)
                .and_then(|n| n["message"].as_str())
                .unwrap_or_default()
                .to_string()
        };
        let said = note("frame.reach_mm");
        assert!(said.starts_with("Read as 47,5 cm = 475 mm"), "{said}");
        let said = note("rider.height_mm");
        assert!(said.starts_with("Read as 70 in = 1778 mm"), "{said}");

        // A reach of 30 is read as cm: 762 mm (in) is no published reach.
        let reach = parse(evaluate_form_linked_to_json(&form_with("30", "1780"), view));
        assert_eq!(
            reach["field_notes"][0]["field"], "frame.reach_mm",
            "{reach}"
        );
        // A saddle height of 40 (allowed 300–1200 mm) fits 400 mm (cm) and 1016 mm (in): the
        // error says both and nothing is guessed.
        let form = form_with("470", "1780").replace(
            r#""setup.stem_mm":"45""#,
            r#""setup.stem_mm":"45","setup.saddle_height_mm":"40""#,
        );
        let both = parse(evaluate_form_linked_to_json(&form, view));
        assert!(both.get("field_notes").is_none(), "{both}");
        assert_eq!(
            both["field_errors"][0]["field"], "setup.saddle_height_mm",
            "{both}"
        );
        let said = both["field_errors"][0]["message"]
            .as_str()
            .unwrap_or_default();
        assert!(
            said.ends_with("got 40. In cm that is 400 mm, in inches 1016 mm: type the value in mm, or add cm or in"),
            "{said}"
        );
    }

    #[test]
    fn a_second_reading_keeps_the_hint_of_a_length_that_fits_both_units() {
        // Reach 47,5 is read as cm (a second reading); saddle height 40 fits cm and inches, so
        // its error, on the second reading, still says both.
        let form = form_with("47,5", "1780").replace(
            r#""setup.stem_mm":"45""#,
            r#""setup.stem_mm":"45","setup.saddle_height_mm":"40""#,
        );
        let v: serde_json::Value =
            serde_json::from_str(&evaluate_form_linked_to_json(&form, "{}")).unwrap_or_default();
        assert_eq!(v["field_notes"][0]["field"], "frame.reach_mm", "{v}");
        assert_eq!(
            v["field_errors"][0]["field"], "setup.saddle_height_mm",
            "{v}"
        );
        let said = v["field_errors"][0]["message"].as_str().unwrap_or_default();
        assert!(
            said.ends_with("got 40. In cm that is 400 mm, in inches 1016 mm: type the value in mm, or add cm or in"),
            "{said}"
        );
    }

    #[test]
    fn a_wheel_named_without_its_tyre_width_is_read_with_the_common_width() {
        let view = r#"{"posture":"seated"}"#;
        let with_wheel = |w: &str| {
            let form = form_with("470", "1780").replace(
                r#""setup.stem_mm":"45""#,
                &format!(r#""setup.stem_mm":"45","wheels.front":"{w}","wheels.rear":"29x2.4""#),
            );
            let json = evaluate_form_linked_to_json(&form, view);
            serde_json::from_str::<serde_json::Value>(&json).unwrap_or_default()
        };
        let named = with_wheel("27.5");
        let full = with_wheel("27.5x2.4");
        assert_eq!(named["field_errors"], serde_json::json!([]), "{named}");
        assert_eq!(named["report"], full["report"]);
        assert_eq!(named["field_notes"][0]["field"], "wheels.front");
        let said = named["field_notes"][0]["message"]
            .as_str()
            .unwrap_or_default();
        assert!(
            said.starts_with("Read as 27.5x2.4: \"27.5\" gives no tyre width"),
            "{said}"
        );
        // A size no wheel has stays an error, in words a person can act on.
        let bad = with_wheel("31");
        let said = bad["field_errors"][0]["message"]
            .as_str()
            .unwrap_or_default();
        assert!(
            said.starts_with(
                "Wheel size \"31\" is not recognised: enter a wheel and tyre size such as 29x2.4"
            ),
            "{said}"
        );
        assert!(
            !said.contains('{'),
            "no JSON in a message for a person: {said}"
        );
    }

    #[test]
    fn an_inconsistent_published_value_is_explained_and_the_drawing_has_every_layer() {
        // Reach, stack, head angle, head tube, fork and offset fix the front; a wheelbase 40 mm
        // longer than the frame with a 435 mm chainstay allows cannot also hold.
        let json = evaluate_form_to_json(
            r#"{"frame.reach_mm":"470","frame.stack_mm":"635","frame.head_angle_deg":"65",
            "frame.head_tube_mm":"110","frame.fork_a2c_mm":"561","frame.fork_offset_mm":"44",
            "frame.chainstay_mm":"435","frame.bb_drop_mm":"35","frame.wheelbase_mm":"1272",
            "setup.stem_mm":"45","setup.saddle_height_mm":"735","setup.crank_mm":"170",
            "rider.height_mm":"1780","rider.mass_kg":"74","setup.bar_type":"flat"}"#,
        );
        let v: serde_json::Value = serde_json::from_str(&json).unwrap_or_default();
        assert_eq!(
            v["field_errors"].as_array().map(Vec::len),
            Some(0),
            "{json}"
        );
        let note = v["notes"]["wheelbase_mm"].as_str().unwrap_or_default();
        assert!(
            note.starts_with("Wheelbase is published as 1272 mm"),
            "{note}"
        );
        let svg = v["svg"].as_str().unwrap_or_default();
        for class in [
            "fork fork-leg",
            "posture seated",
            "posture standing",
            "stem",
            "saddle",
        ] {
            assert!(svg.contains(&format!("class=\"{class}\"")), "{class}");
        }
        assert!(
            svg.contains("braking limit"),
            "handling numbers label the centre of mass"
        );
    }

    #[test]
    fn the_linked_form_gives_the_same_result_and_the_same_link_as_two_calls() {
        let form = r#"{"label":"Trail M","frame.reach_mm":"47 cm","frame.stack_mm":"635",
            "frame.head_angle_deg":"64,5°","frame.head_tube_mm":"110","frame.fork_a2c_mm":"561",
            "frame.fork_offset_mm":"44","wheels.front":"29x2.4","wheels.rear":"29x2.4",
            "setup.stem_mm":"45","rider.height_mm":"1780"}"#;
        let view = r#"{"posture":"standing","dimensions":true}"#;
        let mut linked: serde_json::Value =
            serde_json::from_str(&evaluate_form_linked_to_json(form, view)).unwrap_or_default();
        let mut alone: serde_json::Value =
            serde_json::from_str(&evaluate_form_to_json(form)).unwrap_or_default();
        // The linked (page) call leaves out what the page does not read: each bike's outlines
        // (it draws from `drawing`) and per-change effects; every other member is the same.
        let whole_bike = alone["report"]["bikes"][0].clone();
        for member in ["outline", "stock_outline", "effects"] {
            assert!(
                whole_bike.get(member).is_some(),
                "{member} in the whole report"
            );
            assert!(
                linked["report"]["bikes"][0].get(member).is_none(),
                "{member} left out"
            );
            if let Some(bike) = alone["report"]["bikes"][0].as_object_mut() {
                bike.remove(member);
            }
        }
        let link = crate::link::link_core::link_from_form(form, view).unwrap_or_default();
        assert!(link.starts_with('#') && link.len() > 8, "{link}");
        assert_eq!(linked["link"], link.as_str());
        // The linked call leaves the drawing to `last_drawing_patch` (then the SVG text to
        // `last_drawing_svg`): the same drawing as the plain call's.
        let patch: serde_json::Value =
            serde_json::from_str(&last_drawing_patch()).unwrap_or_default();
        assert!(patch["patch"].as_array().is_some_and(|p| p.len() > 40));
        assert_eq!(patch, alone["drawing"]);
        assert_eq!(last_drawing_svg(), alone["svg"].as_str().unwrap_or("none"));
        if let (Some(obj), Some(whole)) = (linked.as_object_mut(), alone.as_object_mut()) {
            obj.remove("link");
            assert_eq!(obj.remove("svg"), Some(serde_json::Value::Null));
            assert_eq!(obj.get("drawing"), None);
            whole.remove("svg");
            whole.remove("drawing");
        }
        assert_eq!(linked, alone);
        // A field that does not read, or a view that does not: no link, the errors as before.
        let bad: serde_json::Value = serde_json::from_str(&evaluate_form_linked_to_json(
            r#"{"frame.reach_mm":"long"}"#,
            "",
        ))
        .unwrap_or_default();
        assert!(bad["link"].is_null());
        assert_eq!(bad["field_errors"][0]["field"], "frame.reach_mm");
        // … and the drawing stays the last good one.
        let kept: serde_json::Value =
            serde_json::from_str(&last_drawing_patch()).unwrap_or_default();
        assert_eq!(kept, patch);
        let bad_view: serde_json::Value =
            serde_json::from_str(&evaluate_form_linked_to_json(form, "[1]")).unwrap_or_default();
        assert!(bad_view["link"].is_null());
        assert!(bad_view["report"]["bikes"][0]["stock"]["reach_mm"].is_number());
    }

    /// The page's call leaves the link for later: the same result less the `link` member, and
    /// `last_link` then gives the link the one-call form gives. A form with a field that does
    /// not read, or a view that does not read, has no link of its own: the last good one stays.
    #[test]
    fn the_page_call_gives_the_one_call_result_and_its_link_later() {
        let form = r#"{"label":"Trail M","frame.reach_mm":"47 cm","frame.stack_mm":"635",
            "frame.head_angle_deg":"64,5°","wheels.front":"29x2.4","wheels.rear":"29x2.4",
            "setup.stem_mm":"45","rider.height_mm":"1780"}"#;
        let view = r#"{"posture":"standing","dimensions":true}"#;
        let mut whole: serde_json::Value =
            serde_json::from_str(&evaluate_form_linked_to_json(form, view)).unwrap_or_default();
        let page: serde_json::Value =
            serde_json::from_str(&evaluate_form_page_json(form, view)).unwrap_or_default();
        let link = whole
            .as_object_mut()
            .and_then(|o| o.remove("link"))
            .unwrap_or_default();
        assert!(link
            .as_str()
            .is_some_and(|l| l.starts_with('#') && l.len() > 8));
        assert_eq!(page, whole);
        assert_eq!(last_link(), link.as_str().unwrap_or("none"));
        let good = last_link();
        evaluate_form_page_json(r#"{"frame.reach_mm":"long"}"#, view);
        assert_eq!(
            last_link(),
            good,
            "a field that does not read keeps the last good link"
        );
        let too_short = form.replace("\"47 cm\"", "\"4\"");
        let refused = evaluate_form_page_json(&too_short, view);
        assert!(refused.contains("frame.reach_mm"), "{refused}");
        assert_eq!(last_link(), good, "a reach the kernel refuses keeps it");
        evaluate_form_page_json(form, "[1]");
        assert_eq!(last_link(), good, "a view that does not read keeps it");
        evaluate_form_page_json("not json", view);
        assert_eq!(last_link(), good, "a form that does not read keeps it");
        let other = form.replace("\"45\"", "\"60\"");
        evaluate_form_page_json(&other, view);
        assert_ne!(last_link(), good, "the next good form has its own link");
    }

    /// The page's solve memo changes only the time: a series of form edits (frame, rider,
    /// change, a field that does not read, back to the start) gives, edit by edit, the same text
    /// as the same call with the memo emptied first.
    /// Source: the memo's invariant (crates/kernel/src/memo.rs).
    #[test]
    fn remembered_solves_give_the_same_result_as_fresh_ones() {
        let mut form: std::collections::BTreeMap<String, String> = serde_json::from_str(
            r#"{"label":"Memo","frame.reach_mm":"470","frame.stack_mm":"635",
            "frame.head_angle_deg":"65","frame.head_tube_mm":"110","frame.fork_a2c_mm":"561",
            "frame.fork_offset_mm":"44","frame.chainstay_mm":"435","wheels.front":"29x2.4",
            "wheels.rear":"29x2.4","setup.stem_mm":"45","setup.saddle_height_mm":"735",
            "setup.crank_mm":"170","rider.height_mm":"1780","rider.mass_kg":"74"}"#,
        )
        .unwrap_or_default();
        let view = r#"{"posture":"seated","dimensions":false,"ghost":true}"#;
        let edits = [
            ("frame.reach_mm", "475"),
            ("rider.height_mm", "1850"),
            ("changes.fork_a2c_delta_mm", "20"),
            ("setup.stem_mm", "60"),
            ("frame.reach_mm", "long"),
            ("frame.reach_mm", "470"),
            ("wheels.front", "27.5x2.5"),
            ("frame.wheelbase_mm", "1300"),
            ("frame.wheelbase_mm", ""),
            ("wheels.front", "29x2.4"),
            ("rider.height_mm", "1780"),
            ("changes.fork_a2c_delta_mm", ""),
            ("setup.stem_mm", "45"),
        ];
        forget_solves();
        let start =
            evaluate_form_linked_to_json(&serde_json::to_string(&form).unwrap_or_default(), view);
        for (field, value) in edits {
            form.insert(field.to_string(), value.to_string());
            let text = serde_json::to_string(&form).unwrap_or_default();
            let remembered = evaluate_form_linked_to_json(&text, view);
            let plain = evaluate_form_to_json(&text);
            forget_solves();
            assert_eq!(
                remembered,
                evaluate_form_linked_to_json(&text, view),
                "{field}"
            );
            forget_solves();
            assert_eq!(plain, evaluate_form_to_json(&text), "{field}");
            assert!(remembered.contains("\"report\""), "{remembered}");
        }
        // Back at the start: the same result as the first call.
        let text = serde_json::to_string(&form).unwrap_or_default();
        assert_eq!(evaluate_form_linked_to_json(&text, view), start);
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
