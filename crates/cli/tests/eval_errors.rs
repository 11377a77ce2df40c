//! `framewise eval` with bad input: the errors are in the report and the exit status is non-zero.
#![allow(clippy::unwrap_used, clippy::indexing_slicing, clippy::panic)]

use std::io::Write;
use std::process::{Command, Stdio};

fn eval(text: &str) -> (bool, String, String) {
    let mut child = Command::new(env!("CARGO_BIN_EXE_framewise"))
        .args(["eval", "-"])
        .stdin(Stdio::piped())
        .stdout(Stdio::piped())
        .stderr(Stdio::piped())
        .spawn()
        .unwrap();
    child
        .stdin
        .take()
        .unwrap()
        .write_all(text.as_bytes())
        .unwrap();
    let out = child.wait_with_output().unwrap();
    (
        out.status.success(),
        String::from_utf8_lossy(&out.stdout).into_owned(),
        String::from_utf8_lossy(&out.stderr).into_owned(),
    )
}

#[test]
fn text_for_a_number_fails_with_the_field() {
    let (ok, _, err) = eval(r#"{"version":1,"bikes":[{"label":"x","frame":{"reach_mm":"long"}}]}"#);
    assert!(!ok);
    assert!(err.contains("bikes[0].frame.reach_mm"), "{err}");
}

#[test]
fn negative_length_is_in_the_reports_errors_and_exits_non_zero() {
    let (ok, out, err) =
        eval(r#"{"version":1,"bikes":[{"label":"x","frame":{"reach_mm":-450,"stack_mm":620}}]}"#);
    assert!(!ok);
    let v: serde_json::Value = serde_json::from_str(&out).unwrap();
    let e = &v["errors"][0];
    assert_eq!(e["field"], "bikes[0].frame.reach_mm");
    assert_eq!(e["code"], "out_of_range");
    // The message writes a minus sign (U+2212); the JSON number stays a number.
    assert!(e["message"].as_str().unwrap().contains("\u{2212}450"));
    assert!(err.contains("reach_mm"), "{err}");
}

#[test]
fn catalogue_lists_every_key_with_ranges() {
    let out = Command::new(env!("CARGO_BIN_EXE_framewise"))
        .arg("catalogue")
        .output()
        .unwrap();
    assert!(out.status.success());
    let v: serde_json::Value = serde_json::from_slice(&out.stdout).unwrap();
    let rows = v.as_array().unwrap();
    assert_eq!(rows.len(), framewise_kernel::CATALOGUE.len());
    let reach = rows.iter().find(|r| r["key"] == "reach_mm").unwrap();
    assert_eq!(reach["unit"], "mm");
    assert_eq!(reach["hard"][0], 100.0);
}
