//! The drawing of the page's last evaluation: the report it is made from, the drawing the page
//! shows (its view box and SVG), and the patch the page applies in place.
//!
//! **Invariant:** `LAST_REPORT` holds only a report the page shows (a form whose fields all read
//! and whose bike the kernel drew), so a form that does not read leaves the last good drawing;
//! a new drawing keeps the view box of the one shown while that still fits.

use framewise_kernel::Report;
use serde::Serialize;

std::thread_local! {
    /// The report of the last linked evaluation that evaluated, for [`last_drawing_patch`].
    pub(super) static LAST_REPORT: std::cell::RefCell<Option<Report>> =
        const { std::cell::RefCell::new(None) };
    /// The drawing [`last_drawing_patch`] made last, for [`last_drawing_svg`].
    static LAST_DRAWING: std::cell::RefCell<Option<framewise_draw::Drawing>> =
        const { std::cell::RefCell::new(None) };
}

/// The drawing of the last [`evaluate_form_linked_to_json`] that evaluated (a form with a
/// field that does not read leaves the one before), as `{structure, patch}` JSON text, or
/// `null` before any. The drawing is kept for [`last_drawing_svg`].
///
/// [`evaluate_form_linked_to_json`]: super::evaluate_form_linked_to_json
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
pub(super) fn shown_view() -> Option<framewise_draw::ViewBox> {
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
pub(super) fn drawing_of(
    bike: &framewise_kernel::report::BikeReport,
    shown: Option<framewise_draw::ViewBox>,
) -> framewise_draw::Drawing {
    framewise_draw::drawing_in(&framewise_draw::Scene::of_bike(bike, true), shown)
}

pub(super) fn patch_of(d: &framewise_draw::Drawing) -> DrawingPatch<'_> {
    DrawingPatch {
        structure: d.structure(),
        patch: d.patch(),
    }
}

/// The drawing's patch (crates/draw `Drawing::patch`): the page applies it in place when
/// `structure` equals that of the drawing it shows, else writes the SVG.
#[derive(Serialize)]
pub(super) struct DrawingPatch<'a> {
    structure: String,
    patch: Vec<framewise_draw::Patch<'a>>,
}
