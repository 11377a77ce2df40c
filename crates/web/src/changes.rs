//! The page's drawing as only what changed: the per-edit answer carries the few polylines and
//! labels that moved instead of the whole patch list (about 14 kB of JSON, mostly the same
//! values again), so less is written in wasm, parsed and compared on the page.
//!
//! Protocol (invariant): each answer has a number `seq`; the page passes the `seq` of the last
//! answer it applied. The changes are relative to the last answer sent, so they are given only
//! when the page says it applied that one and the structure is the same; otherwise the whole
//! patch list is sent. A page that failed to apply an answer therefore gets the whole list next
//! time, never changes against values it does not show.

use crate::framewise_web_core::{keep_drawing, last_drawing};
use serde::Serialize;
use std::cell::RefCell;

/// The last answer sent: its number, and the drawing's structure and patch values.
struct Sent {
    seq: u32,
    structure: String,
    values: Vec<String>,
}

thread_local! {
    static SENT: RefCell<Option<Sent>> = const { RefCell::new(None) };
}

/// The whole patch list (crates/draw `Drawing::patch`).
#[derive(Serialize)]
struct Whole<'a> {
    seq: u32,
    structure: &'a str,
    patch: &'a [framewise_draw::Patch<'a>],
}

/// The entries whose value changed: `(index in the patch list, new value)`.
#[derive(Serialize)]
struct Changes<'a> {
    seq: u32,
    structure: &'a str,
    changes: Vec<(usize, &'a str)>,
}

/// See the module's protocol; `null` before any evaluation.
pub fn last_drawing_changes(shown: u32) -> String {
    let Some(d) = last_drawing() else {
        return "null".into();
    };
    let structure = d.structure();
    let patch = d.patch();
    let json = SENT.with(|sent| {
        let Ok(mut sent) = sent.try_borrow_mut() else {
            return "null".into();
        };
        // Never 0 (the page's "nothing shown"), so a page that shows nothing gets the whole list.
        let seq = sent.as_ref().map_or(1, |s| s.seq.wrapping_add(1).max(1));
        let json = match sent.as_ref() {
            Some(last)
                if last.seq == shown
                    && last.structure == structure
                    && last.values.len() == patch.len() =>
            {
                let changes = patch
                    .iter()
                    .zip(&last.values)
                    .enumerate()
                    .filter(|(_, (p, was))| p.2 != was.as_str())
                    .map(|(i, (p, _))| (i, p.2))
                    .collect();
                serde_json::to_string(&Changes {
                    seq,
                    structure: &structure,
                    changes,
                })
            }
            _ => serde_json::to_string(&Whole {
                seq,
                structure: &structure,
                patch: &patch,
            }),
        };
        remember(&mut sent, seq, &structure, &patch);
        json.unwrap_or_else(|_| "null".into())
    });
    keep_drawing(d);
    json
}

/// Records the answer just sent. The values of the same structure are overwritten in place
/// (each keeps its allocation: an edit changes a few of about a hundred), else made afresh.
fn remember(sent: &mut Option<Sent>, seq: u32, structure: &str, patch: &[framewise_draw::Patch]) {
    match sent {
        Some(last) if last.structure == structure && last.values.len() == patch.len() => {
            last.seq = seq;
            for (was, p) in last.values.iter_mut().zip(patch) {
                if was.as_str() != p.2 {
                    p.2.clone_into(was);
                }
            }
        }
        _ => {
            *sent = Some(Sent {
                seq,
                structure: structure.to_string(),
                values: patch.iter().map(|p| p.2.to_string()).collect(),
            });
        }
    }
}

#[cfg(test)]
pub(crate) mod tests {
    use super::*;
    use crate::framewise_web_core::{evaluate_form_linked_to_json, last_drawing_patch};
    use serde_json::Value;

    /// The test bike's form with this reach and stem (shared with the rehearsal's tests).
    pub(crate) fn form(reach: &str, stem: &str) -> String {
        format!(
            r#"{{"label":"Trail M","frame.reach_mm":"{reach}","frame.stack_mm":"635",
            "frame.head_angle_deg":"65","frame.head_tube_mm":"110","frame.fork_a2c_mm":"561",
            "frame.fork_offset_mm":"44","wheels.front":"29x2.4","wheels.rear":"29x2.4",
            "setup.stem_mm":"{stem}","rider.height_mm":"1780"}}"#
        )
    }

    /// Applies an answer's changes to the shown values; returns how many there were.
    fn apply(answer: &Value, shown: &mut [Value]) -> usize {
        let changes = answer["changes"].as_array().cloned().unwrap_or_default();
        assert!(answer.get("patch").is_none(), "{answer}");
        for c in &changes {
            let i = c[0].as_u64().and_then(|i| usize::try_from(i).ok());
            match i.and_then(|i| shown.get_mut(i)) {
                Some(v) => *v = c[1].clone(),
                None => panic!("index out of the list: {c}"),
            }
        }
        changes.len()
    }

    /// The whole patch values of the last evaluation's drawing, from `last_drawing_patch`.
    fn now() -> (Vec<Value>, Value) {
        let whole: Value = serde_json::from_str(&last_drawing_patch()).unwrap_or_default();
        (values(&whole), whole["structure"].clone())
    }

    fn call(shown: u64) -> Value {
        let shown = u32::try_from(shown).unwrap_or(0);
        serde_json::from_str(&last_drawing_changes(shown)).unwrap_or_default()
    }

    /// The patch values of a whole answer, or of `last_drawing_patch`.
    fn values(whole: &Value) -> Vec<Value> {
        whole["patch"]
            .as_array()
            .map(|p| p.iter().map(|e| e[2].clone()).collect())
            .unwrap_or_default()
    }

    /// Source: the module's protocol. The changes, applied to the values the page shows, give
    /// exactly the new drawing's whole patch list; a page that did not apply the last answer, or
    /// shows nothing, gets the whole list.
    #[test]
    fn changes_applied_to_the_shown_values_give_the_new_drawing() {
        evaluate_form_linked_to_json(&form("470", "45"), "");
        let first = call(0);
        let mut shown = values(&first);
        assert!(shown.len() > 40, "{first}");
        let seq = first["seq"].as_u64().unwrap_or(0);
        assert!(seq > 0);

        // A frame edit moves most of the bike; a stem edit only the cockpit, the rider's hands
        // and what follows them.
        evaluate_form_linked_to_json(&form("485", "45"), "");
        let next = call(seq);
        let moved = apply(&next, &mut shown);
        let (whole, structure) = now();
        assert_eq!(shown, whole);
        assert_eq!(next["structure"], structure);
        assert!(moved > 0 && moved < shown.len(), "{moved}");

        evaluate_form_linked_to_json(&form("485", "60"), "");
        let next = call(next["seq"].as_u64().unwrap_or(0));
        let moved = apply(&next, &mut shown);
        assert_eq!(shown, now().0);
        assert!(
            moved > 0 && moved < shown.len() / 2,
            "{moved} of {}",
            shown.len()
        );

        // Nothing changed since: no changes.
        let again = call(next["seq"].as_u64().unwrap_or(0));
        assert_eq!(
            again["changes"].as_array().map(Vec::len),
            Some(0),
            "{again}"
        );

        // A stale or unknown number: the whole list.
        evaluate_form_linked_to_json(&form("475", "45"), "");
        let stale = call(seq);
        assert!(stale.get("changes").is_none() && values(&stale).len() == shown.len());
        assert!(call(0).get("patch").is_some());
    }

    /// The `viewBox` of the last page drawing, and that of the same form drawn afresh.
    fn view_boxes(reach: &str) -> (Value, Value) {
        evaluate_form_linked_to_json(&form(reach, "45"), "");
        let fresh: Value = serde_json::from_str(&crate::framewise_web_core::evaluate_form_to_json(
            &form(reach, "45"),
        ))
        .unwrap_or_default();
        (now().0[0].clone(), fresh["drawing"]["patch"][0][2].clone())
    }

    fn width(view_box: &Value) -> f64 {
        let parts: Vec<f64> = view_box
            .as_str()
            .unwrap_or("")
            .split(' ')
            .filter_map(|v| v.parse().ok())
            .collect();
        parts.get(2).copied().unwrap_or(f64::NAN)
    }

    /// Source: crates/draw `view` (the rule) and this crate's `last_drawing`. The page's drawing
    /// keeps the view box it shows while the bike still fits in it: a longer reach widens it,
    /// and going back keeps the wider box, where a drawing made afresh is fitted again.
    #[test]
    fn the_page_keeps_its_view_box_while_the_bike_still_fits() {
        let (first, fitted) = view_boxes("470");
        assert_eq!(first, fitted, "nothing shown yet: the fit");
        let (longer, _) = view_boxes("520");
        assert!(width(&longer) > width(&first), "{longer} vs {first}");
        let (back, fitted) = view_boxes("470");
        assert_eq!(back, longer, "kept");
        assert_eq!(fitted, first, "a fresh drawing is fitted again");
        assert!(width(&back) - width(&fitted) <= framewise_draw::VIEW_SLACK_MM);
    }
}
