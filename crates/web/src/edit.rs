//! The page's form kept in the module between edits, so that an edit of one field sends only
//! that field: the page no longer writes every field as JSON text and the module no longer
//! reads it again (together about a tenth of an edit's work in the page, docs/BENCHMARKS.md).
//!
//! Protocol (invariant): the module holds at most one form, numbered by a `seq` that changes
//! with every whole form it reads. An edit names the `seq` of the form it edits; the module
//! applies it only to that form, else answers `null` and the page sends the whole form. So the
//! module never evaluates a form the page does not show: a whole-form call (a link opened, a
//! chart size, the first draw) starts a new number, and a form that does not read leaves none.

use crate::framewise_web_core::{linked_fields, Link, Run};
use std::cell::RefCell;
use std::collections::BTreeMap;

/// The form the module holds: its number and its fields (name → typed text).
struct Kept {
    seq: u32,
    fields: BTreeMap<String, String>,
}

thread_local! {
    static FORM: RefCell<Option<Kept>> = const { RefCell::new(None) };
    /// The last number given (numbers are never reused, so an old one never matches).
    static LAST_SEQ: std::cell::Cell<u32> = const { std::cell::Cell::new(0) };
}

/// Keeps a whole form read by the page's call, under a new number, and evaluates it as the
/// page's call does.
pub(crate) fn keep_and_evaluate(fields: BTreeMap<String, String>, view_json: &str) -> String {
    // Never 0 (the page's "none").
    let seq = LAST_SEQ.with(|s| {
        let next = s.get().wrapping_add(1).max(1);
        s.set(next);
        next
    });
    FORM.with(|f| match f.try_borrow_mut() {
        Ok(mut f) => {
            let kept = f.insert(Kept { seq, fields });
            linked_fields(&kept.fields, view_json, Run::Page, Link::Later)
        }
        // Not reached (nothing else borrows the form): evaluated without keeping it; the
        // number is spent, and `form_seq` answers that of the form still held (or 0).
        Err(_) => linked_fields(&fields, view_json, Run::Page, Link::Later),
    })
}

/// Forgets the form (the page's whole form did not read).
pub(crate) fn forget() {
    FORM.with(|f| {
        if let Ok(mut f) = f.try_borrow_mut() {
            *f = None;
        }
    });
}

/// The number of the form held, or 0 for none.
pub fn form_seq() -> u32 {
    FORM.with(|f| f.try_borrow().ok().and_then(|f| f.as_ref().map(|k| k.seq)))
        .unwrap_or(0)
}

/// The page's call for an edit of one field of the form numbered `seq`: the held form with
/// `name` set to `value`, evaluated as [`crate::framewise_web_core::evaluate_form_page_json`]
/// evaluates a whole form (the same text); `null` when the module holds no form of that number.
pub fn evaluate_field_page_json(seq: u32, name: &str, value: &str, view_json: &str) -> String {
    FORM.with(|f| {
        let Ok(mut f) = f.try_borrow_mut() else {
            return "null".into();
        };
        match f.as_mut() {
            Some(kept) if kept.seq == seq && seq != 0 => {
                match kept.fields.get_mut(name) {
                    Some(v) => value.clone_into(v),
                    None => {
                        kept.fields.insert(name.to_string(), value.to_string());
                    }
                }
                linked_fields(&kept.fields, view_json, Run::Page, Link::Later)
            }
            _ => "null".into(),
        }
    })
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::changes::tests::form;
    use crate::framewise_web_core::{evaluate_form_page_json, last_link};

    /// Source: the module's protocol. An edit of one field answers exactly what the whole
    /// edited form answers, link included, and keeps the number of the form it edited.
    #[test]
    fn a_field_edit_answers_as_the_whole_edited_form() {
        let view = r#"{"posture":"standing"}"#;
        let whole = evaluate_form_page_json(&form("490", "50"), view);
        let link = last_link();

        evaluate_form_page_json(&form("470", "45"), view);
        let seq = form_seq();
        assert_ne!(seq, 0);
        assert_ne!(last_link(), link, "a different form has a different link");
        let reach = evaluate_field_page_json(seq, "frame.reach_mm", "490", view);
        assert_ne!(reach, whole, "the stem is still 45");
        let edited = evaluate_field_page_json(seq, "setup.stem_mm", "50", view);
        assert_eq!(edited, whole);
        assert_eq!(last_link(), link);
        assert_eq!(form_seq(), seq);

        // A field the form did not send before is added, as a whole form with it would be.
        let with_sag = form("490", "50").replace(
            r#""rider.height_mm""#,
            r#""changes.front_sag_pct":"20","rider.height_mm""#,
        );
        let whole_sag = evaluate_form_page_json(&with_sag, view);
        let seq2 = form_seq();
        assert_ne!(seq2, seq, "every whole form gets a new number");
        evaluate_form_page_json(&form("490", "50"), view);
        let sag = evaluate_field_page_json(form_seq(), "changes.front_sag_pct", "20", view);
        assert_eq!(sag, whole_sag);
    }

    /// Source: the module's protocol. An edit of a form the module no longer holds, or of none,
    /// answers `null` and changes nothing; a whole form that does not read leaves no form (and
    /// the last good link).
    #[test]
    fn an_edit_of_another_form_is_refused() {
        evaluate_form_page_json(&form("470", "45"), "");
        let old = form_seq();
        let answer = evaluate_form_page_json(&form("480", "45"), "");
        let link = last_link();
        assert_eq!(
            evaluate_field_page_json(old, "frame.reach_mm", "500", ""),
            "null"
        );
        assert_eq!(
            evaluate_field_page_json(0, "frame.reach_mm", "500", ""),
            "null"
        );
        assert_eq!(last_link(), link, "a refused edit keeps the last link");
        assert_eq!(
            evaluate_field_page_json(form_seq(), "frame.reach_mm", "480", ""),
            answer
        );

        let bad = evaluate_form_page_json("{not json", "");
        assert!(bad.contains("bad_form"), "{bad}");
        assert_eq!(form_seq(), 0);
        assert_eq!(
            last_link(),
            link,
            "a whole form that does not read keeps the last good link"
        );
        assert_eq!(
            evaluate_field_page_json(old, "frame.reach_mm", "500", ""),
            "null"
        );
    }
}
