//! `framewise import CHART|-`: a pasted geometry chart → a size run as JSON (DESIGN.md §8).
//!
//! Prints `{"sizes": [...], "unrecognised": [...], "questions": [...], "notes": [...],
//! "error": null}`. A chart that cannot be read prints its error on stderr and exits 1; a file
//! that cannot be opened exits 2 (like every command).

use framewise_formats::chart::{chart_to_json, import_chart};
use std::io::Read;
use std::process::ExitCode;

/// Reads the chart as text. Files saved in a single-byte code page (a `°` as byte 0xB0) are
/// read as Latin-1 rather than refused.
pub fn read_chart(path: Option<&str>) -> Result<String, String> {
    let bytes = match path {
        None => return Err("missing CHART (use - for standard input)".into()),
        Some("-") => {
            let mut b = Vec::new();
            std::io::stdin()
                .read_to_end(&mut b)
                .map_err(|e| format!("cannot read standard input: {e}"))?;
            b
        }
        Some(p) => std::fs::read(p).map_err(|e| format!("cannot read {p}: {e}"))?,
    };
    Ok(decode(bytes))
}

/// UTF-8, else Latin-1 (every byte is one character).
fn decode(bytes: Vec<u8>) -> String {
    String::from_utf8(bytes)
        .unwrap_or_else(|e| e.into_bytes().iter().map(|&b| char::from(b)).collect())
}

/// Imports the text: the JSON to print, or the message for stderr.
pub fn import_text(text: &str) -> Result<String, String> {
    let result = import_chart(text);
    match &result {
        Ok(_) => Ok(chart_to_json(&result)),
        Err(e) => Err(format!("{e} [{}]", e.code())),
    }
}

/// Runs the command on `path`.
pub fn run(path: Option<&str>) -> Result<ExitCode, String> {
    let text = read_chart(path)?;
    Ok(match import_text(&text) {
        Ok(json) => {
            out!("{json}");
            ExitCode::SUCCESS
        }
        Err(msg) => {
            eprintln!("error: {msg}");
            ExitCode::FAILURE
        }
    })
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn a_chart_becomes_the_size_run_json() {
        let json = import_text("Size\tS\tM\nReach (mm)\t450\t475\nSaddle\t50\t60\n").unwrap();
        let v: serde_json::Value = serde_json::from_str(&json).unwrap();
        assert_eq!(v["sizes"][1]["label"], "M");
        assert_eq!(v["sizes"][1]["frame"]["reach_mm"], 475.0);
        assert_eq!(v["unrecognised"][0], "Saddle");
    }

    #[test]
    fn unreadable_input_is_an_error_message() {
        let e = import_text("").unwrap_err();
        assert!(e.contains("empty") && e.contains("[empty_chart]"), "{e}");
        assert!(read_chart(Some("/nonexistent/chart.txt"))
            .unwrap_err()
            .starts_with("cannot read /nonexistent/chart.txt"));
        assert!(read_chart(None).is_err());
    }

    #[test]
    fn latin_1_files_are_read() {
        // "Head angle;65\xb0" in Latin-1: 0xB0 is the degree sign.
        let mut bytes = b"Size;M\nHead angle;65".to_vec();
        bytes.push(0xb0);
        assert_eq!(decode(bytes), "Size;M\nHead angle;65°");
    }
}
