//! The chart-paste binding: pasted text in, size run JSON out. Never throws.

use framewise_formats::chart::{self, Answers};
use wasm_bindgen::prelude::*;

/// Imports a pasted geometry chart (a table copied from a web page, a PDF or a spreadsheet).
///
/// Returns JSON text, always of this shape (DESIGN.md §8 plus `questions`, `notes`, `error`):
///
/// ```json
/// { "sizes": [ { "label": "M",
///                "frame": { "reach_mm": 470.0, "stack_mm": 630.0, "head_angle_deg": 65.0 },
///                "wheels": { "front": "29x2.4", "rear": "29x2.4" } } ],
///   "unrecognised": [ "Stem length" ],
///   "questions": [ { "id": "Seat tube angle#meaning", "row": "Seat tube angle",
///                    "message": "\"Seat tube angle\" does not say effective or actual; …",
///                    "options": ["effective", "actual"], "chosen": "effective" } ],
///   "notes": [ { "row": "", "rows": [ "Reach", "Stack" ],
///                "message": "no unit given for Reach, Stack: read as mm from the size of the numbers" } ],
///   "error": null }
/// ```
///
/// - `sizes[].frame`: DESIGN.md §5 keys, in mm and degrees, ready for a scenario's `frame`.
/// - `sizes[].wheels`: `front`/`rear` designations the kernel accepts, or `{}` when the chart
///   has no wheel-size row.
/// - `unrecognised`: row labels that name nothing the importer reads (show them; never hide).
/// - `questions`: guesses to confirm; pass an answer back by `id` with
///   [`import_chart_with_answers`]. `row: ""` / notes with `row: ""` concern the whole chart;
///   a note said once for several rows (a unit inferred from the size of the numbers) has
///   `row: ""` and lists them in `rows`, which other notes leave out.
/// - `error`: `null`, or `{ "code": "empty_chart" | "chart_too_large" | "chart_too_long" |
///   "not_a_table" | "one_row" | "too_many_sizes" | "nothing_recognised", "message": "…" }`
///   with the lists empty; the message says what to paste instead.
#[wasm_bindgen]
pub fn import_chart(text: &str) -> String {
    chart::chart_to_json(&chart::import_chart(text))
}

/// As [`import_chart`], with answers to earlier questions: `answers_json` is a JSON object
/// `{ "<question id>": "<option>" }`. Unknown ids and options not offered are ignored; text
/// that is not such an object is an error in the returned JSON (`code: "bad_answers"`).
#[wasm_bindgen]
pub fn import_chart_with_answers(text: &str, answers_json: &str) -> String {
    match serde_json::from_str::<Answers>(answers_json) {
        Ok(answers) => chart::chart_to_json(&chart::import_chart_with(text, &answers)),
        Err(e) => bad_answers(&e.to_string()),
    }
}

fn bad_answers(why: &str) -> String {
    // Built by hand (no `json!`): a fixed shape with one escaped message.
    let message = serde_json::to_string(&format!(
        "The answers must be a JSON object of question id to option: {why}"
    ))
    .unwrap_or_else(|_| "\"The answers could not be read.\"".into());
    format!(
        "{{\"sizes\":[],\"unrecognised\":[],\"questions\":[],\"notes\":[],\"error\":{{\"code\":\"bad_answers\",\"message\":{message}}}}}"
    )
}

#[cfg(test)]
mod tests {
    use super::*;

    fn parse(s: &str) -> serde_json::Value {
        serde_json::from_str(s).unwrap_or_default()
    }

    #[test]
    fn a_chart_comes_back_as_json() {
        let v = parse(&import_chart(
            "Size\tS\tM\nReach\t45 cm\t47.5 cm\nSTA\t77\t77\n",
        ));
        assert_eq!(v["sizes"][1]["frame"]["reach_mm"], 475.0);
        assert_eq!(v["questions"][0]["id"], "STA#meaning");
        assert!(v["error"].is_null());
    }

    #[test]
    fn answers_change_the_reading_and_bad_answers_are_an_error() {
        let text = "Size\tS\tM\nReach\t450\t475\nSTA\t77\t77\n";
        let v = parse(&import_chart_with_answers(
            text,
            r#"{"STA#meaning":"actual"}"#,
        ));
        assert_eq!(v["sizes"][0]["frame"]["seat_angle_actual_deg"], 77.0);
        assert_eq!(v["questions"][0]["chosen"], "actual");
        let v = parse(&import_chart_with_answers(text, "[1,2]"));
        assert_eq!(v["error"]["code"], "bad_answers");
    }

    #[test]
    fn junk_is_an_error_not_a_throw() {
        let v = parse(&import_chart("\u{0}\u{1}garbage"));
        assert_eq!(v["error"]["code"], "not_a_table");
        assert_eq!(v["sizes"].as_array().map(Vec::len), Some(0));
    }
}
