//! The chart importer on invented chart layouts (tests/charts/*.txt).
//!
//! Every number in the fixtures is invented. Expected values are worked out by hand from the
//! fixture text: millimetres as written, centimetres × 10, inches × 25.4.
//! Source: 1 in = 25.4 mm exactly (international yard and pound agreement, 1959) [read];
//! 1 cm = 10 mm (SI).

// Helpers outside `#[test]` functions may stop loudly too (clippy.toml allows it in tests).
#![allow(
    clippy::panic,
    clippy::expect_used,
    clippy::unwrap_used,
    clippy::indexing_slicing
)]

use framewise_formats::chart::{
    import_chart, import_chart_with, Answers, ChartError, ChartImport, Note,
};

fn chart(name: &str) -> ChartImport {
    let path = format!("{}/../../tests/charts/{name}", env!("CARGO_MANIFEST_DIR"));
    let text = std::fs::read_to_string(&path).unwrap_or_else(|e| panic!("{path}: {e}"));
    import_chart(&text).unwrap_or_else(|e| panic!("{name}: {e}"))
}

fn labels(c: &ChartImport) -> Vec<&str> {
    c.sizes.iter().map(|s| s.label.as_str()).collect()
}

/// The row of `key` across the sizes (NaN where a size has no value).
fn row(c: &ChartImport, key: &str) -> Vec<f64> {
    c.sizes
        .iter()
        .map(|s| s.frame.get(key).copied().unwrap_or(f64::NAN))
        .collect()
}

/// Asserts the row of `key`; NaN in `want` means the size has no value for it.
fn assert_row(c: &ChartImport, key: &str, want: &[f64]) {
    let got = row(c, key);
    assert_eq!(got.len(), want.len(), "{key}: {got:?} vs {want:?}");
    for (g, w) in got.iter().zip(want) {
        assert!(
            (g - w).abs() < 1e-9 || (g.is_nan() && w.is_nan()),
            "{key}: got {got:?}, expected {want:?}"
        );
    }
}

fn wheels(c: &ChartImport) -> Vec<(String, String)> {
    let name = |w: &Option<framewise_kernel::WheelSpec>| match w {
        Some(framewise_kernel::WheelSpec::Designation(d)) => d.clone(),
        _ => String::new(),
    };
    c.sizes
        .iter()
        .map(|s| (name(&s.wheels.front), name(&s.wheels.rear)))
        .collect()
}

fn has_note(c: &ChartImport, row: &str, part: &str) -> bool {
    c.notes
        .iter()
        .any(|n| n.row == row && n.message.contains(part))
}

/// The notes that say a unit was inferred from the size of the numbers.
fn unit_notes(c: &ChartImport) -> Vec<&Note> {
    c.notes
        .iter()
        .filter(|n| n.message.contains("from the size of the numbers"))
        .collect()
}

/// Asserts that the chart says once that `rows` (in this order) were read as `unit`: one note
/// with no `row`, the rows in `rows` and named in its message.
fn assert_unit_note(c: &ChartImport, unit: &str, rows: &[&str]) {
    let tail = format!(": read as {unit} from the size of the numbers");
    let said: Vec<&Note> = unit_notes(c)
        .into_iter()
        .filter(|n| n.message.ends_with(&tail))
        .collect();
    assert_eq!(said.len(), 1, "one note for {unit}: {:#?}", c.notes);
    let note = said[0];
    assert_eq!(note.row, "");
    assert_eq!(note.rows, rows);
    assert_eq!(
        note.message,
        format!("no unit given for {}{tail}", rows.join(", "))
    );
}

#[test]
fn sizes_as_columns_tab_separated_web_copy() {
    let c = chart("01_web_tab_columns.txt");
    assert_eq!(labels(&c), ["S", "M", "L", "XL"]);
    assert_row(&c, "reach_mm", &[425.0, 450.0, 475.0, 500.0]);
    assert_row(&c, "stack_mm", &[610.0, 619.0, 628.0, 637.0]);
    assert_row(&c, "head_angle_deg", &[64.5; 4]);
    assert_row(&c, "seat_angle_effective_deg", &[77.0; 4]);
    assert_row(&c, "chainstay_mm", &[435.0, 435.0, 440.0, 440.0]);
    assert_row(&c, "wheelbase_mm", &[1175.0, 1203.0, 1232.0, 1261.0]);
    assert_row(&c, "bb_drop_mm", &[32.0; 4]);
    assert_row(&c, "fork_offset_mm", &[44.0; 4]);
    // 29" without a tyre width: the stated default 2.4 in, and a note says so.
    let w = ("29x2.4".to_string(), "29x2.4".to_string());
    assert_eq!(wheels(&c), vec![w; 4]);
    assert!(has_note(&c, "Wheel size", "2.4 in"));
    assert!(c.unrecognised.is_empty() && c.questions.is_empty());
}

#[test]
fn sizes_as_rows_csv() {
    let c = chart("02_csv_rows.txt");
    assert_eq!(labels(&c), ["XS", "S", "M", "L"]);
    assert_row(&c, "reach_mm", &[380.0, 395.0, 410.0, 425.0]);
    assert_row(&c, "stack_mm", &[560.0, 575.0, 590.0, 605.0]);
    assert_row(&c, "head_angle_deg", &[70.5, 70.5, 71.0, 71.0]);
    assert_row(&c, "seat_angle_effective_deg", &[74.5, 74.5, 74.0, 74.0]);
    assert_row(&c, "top_tube_effective_mm", &[525.0, 545.0, 565.0, 585.0]);
    assert_row(&c, "chainstay_mm", &[420.0, 420.0, 425.0, 425.0]);
    assert_row(&c, "wheelbase_mm", &[1010.0, 1031.0, 1055.0, 1078.0]);
    assert_row(&c, "bb_height_mm", &[290.0, 290.0, 295.0, 295.0]);
    // No units anywhere: one note says the length rows were read as mm from the numbers' size.
    let mm = [
        "Reach",
        "Stack",
        "Top tube (eff.)",
        "Chainstay",
        "Wheelbase",
        "BB height",
    ];
    assert_unit_note(&c, "mm", &mm);
    assert_eq!(unit_notes(&c).len(), 1);
}

#[test]
fn semicolons_with_decimal_commas_european_spreadsheet() {
    let c = chart("03_semicolon_decimal_comma.txt");
    assert_eq!(labels(&c), ["S", "M", "L"]);
    assert_row(&c, "reach_mm", &[440.5, 465.5, 490.5]);
    assert_row(&c, "stack_mm", &[615.2, 624.3, 633.4]);
    assert_row(&c, "head_angle_deg", &[65.5; 3]);
    assert_row(&c, "seat_angle_effective_deg", &[76.5; 3]);
    // "1.180" in a decimal-comma chart is one thousand one hundred and eighty.
    assert_row(&c, "wheelbase_mm", &[1180.0, 1206.0, 1233.0]);
    assert_row(&c, "bb_drop_mm", &[35.0; 3]);
}

#[test]
fn pdf_aligned_spaces_with_reference_letters_and_units_column() {
    let c = chart("04_pdf_aligned_units_column.txt");
    assert_eq!(labels(&c), ["S", "M", "L", "XL"]);
    assert_row(&c, "seat_tube_mm", &[380.0, 410.0, 440.0, 470.0]);
    assert_row(&c, "top_tube_effective_mm", &[575.0, 600.0, 625.0, 650.0]);
    assert_row(&c, "head_tube_mm", &[95.0, 105.0, 115.0, 125.0]);
    assert_row(&c, "head_angle_deg", &[66.0; 4]);
    assert_row(&c, "wheelbase_mm", &[1150.0, 1177.0, 1204.0, 1231.0]);
    assert_row(&c, "reach_mm", &[430.0, 452.0, 474.0, 496.0]);
    assert_row(&c, "stack_mm", &[605.0, 614.0, 623.0, 632.0]);
    // "Seat tube angle" alone is ambiguous: asked, default effective.
    assert_row(&c, "seat_angle_effective_deg", &[76.5; 4]);
    let q = &c.questions[0];
    assert_eq!(
        (q.row.as_str(), q.chosen.as_str()),
        ("Seat tube angle", "effective")
    );
    assert_eq!(q.options, ["effective", "actual"]);
}

#[test]
fn inches_with_quote_marks_and_inch_size_names() {
    let c = chart("05_inches_marks.txt");
    assert_eq!(labels(&c), ["15\"", "17\"", "19\"", "21\""]);
    // 15" 17" 19" 21" × 25.4
    assert_row(&c, "seat_tube_mm", &[381.0, 431.8, 482.6, 533.4]);
    // 22.4 23.0 23.6 24.2 in
    assert_row(
        &c,
        "top_tube_effective_mm",
        &[568.96, 584.2, 599.44, 614.68],
    );
    // 16.1 16.7 17.3 17.9 in
    assert_row(&c, "reach_mm", &[408.94, 424.18, 439.42, 454.66]);
    // 23.5 23.9 24.3 24.7 in
    assert_row(&c, "stack_mm", &[596.9, 607.06, 617.22, 627.38]);
    // 4.0 4.5 5.0 5.5 in
    assert_row(&c, "head_tube_mm", &[101.6, 114.3, 127.0, 139.7]);
    assert_row(&c, "head_angle_deg", &[69.0; 4]);
    assert_row(&c, "seat_angle_effective_deg", &[73.5; 4]);
    assert_row(&c, "chainstay_mm", &[429.26; 4]);
    // 28.9 29.8 30.7 31.5 in
    assert_row(&c, "standover_mm", &[734.06, 756.92, 779.78, 800.1]);
}

#[test]
fn centimetres_without_units_are_inferred_and_said() {
    let c = chart("06_cm_no_units.txt");
    assert_eq!(labels(&c), ["S", "M", "L"]);
    assert_row(&c, "reach_mm", &[420.0, 445.0, 470.0]);
    assert_row(&c, "stack_mm", &[600.0, 615.0, 630.0]);
    assert_row(&c, "seat_tube_mm", &[400.0, 430.0, 460.0]);
    assert_row(&c, "head_tube_mm", &[100.0, 115.0, 130.0]);
    assert_row(&c, "chainstay_mm", &[430.0; 3]);
    assert_row(&c, "wheelbase_mm", &[1120.0, 1146.0, 1172.0]);
    assert_row(&c, "head_angle_deg", &[67.0; 3]);
    // One note for the seven length rows, in the chart's order: "Top tube" is placed by a
    // question after the others are read, and still named third.
    let cm = [
        "Reach",
        "Stack",
        "Top tube",
        "Seat tube",
        "Head tube",
        "Chainstay",
        "Wheelbase",
    ];
    assert_unit_note(&c, "cm", &cm);
    assert_eq!(unit_notes(&c).len(), 1);
    // "Top tube" alone: asked, read as effective.
    assert_row(&c, "top_tube_effective_mm", &[575.0, 600.0, 625.0]);
    assert!(c
        .questions
        .iter()
        .any(|q| q.row == "Top tube" && q.chosen == "effective"));
}

#[test]
fn footnote_marks_in_labels_cells_and_lines() {
    let c = chart("07_footnotes.txt");
    assert_eq!(labels(&c), ["S", "M", "L"]);
    assert_row(&c, "reach_mm", &[430.0, 455.0, 480.0]);
    assert_row(&c, "stack_mm", &[615.0, 625.0, 635.0]);
    assert_row(&c, "head_angle_deg", &[65.5; 3]);
    assert_row(&c, "seat_angle_effective_deg", &[76.5; 3]);
    assert_row(&c, "chainstay_mm", &[435.0, 435.0, 445.0]);
    assert_row(&c, "trail_mm", &[118.0; 3]);
    assert_row(&c, "bb_drop_mm", &[30.0; 3]);
    assert!(c.unrecognised.is_empty(), "{:?}", c.unrecognised);
    // The three footnote lines are listed as ignored text, not dropped silently.
    let ignored = c
        .notes
        .iter()
        .filter(|n| n.message.starts_with("ignored a line of text"))
        .count();
    assert_eq!(ignored, 3);
}

#[test]
fn mixed_case_abbreviations() {
    let c = chart("08_mixed_case_abbreviations.txt");
    assert_eq!(labels(&c), ["S1", "S2", "S3", "S4", "S5"]);
    assert_row(&c, "reach_mm", &[405.0, 430.0, 455.0, 480.0, 505.0]);
    assert_row(&c, "stack_mm", &[620.0, 629.0, 638.0, 647.0, 656.0]);
    assert_row(&c, "head_angle_deg", &[64.0; 5]);
    assert_row(&c, "seat_angle_effective_deg", &[77.5; 5]);
    assert_row(
        &c,
        "top_tube_effective_mm",
        &[578.0, 598.0, 618.0, 638.0, 659.0],
    );
    assert_row(&c, "chainstay_mm", &[437.0, 437.0, 437.0, 442.0, 442.0]);
    assert_row(
        &c,
        "wheelbase_mm",
        &[1186.0, 1213.0, 1240.0, 1272.0, 1300.0],
    );
    assert_row(&c, "fork_a2c_mm", &[571.0; 5]);
    assert_row(&c, "fork_offset_mm", &[44.0; 5]);
    assert_row(&c, "head_tube_mm", &[95.0, 100.0, 110.0, 120.0, 130.0]);
    assert_row(&c, "bb_height_mm", &[340.0; 5]);
    assert!(c.unrecognised.is_empty() && c.questions.is_empty());
}

#[test]
fn unknown_rows_are_listed_not_dropped() {
    let c = chart("09_unknown_rows.txt");
    assert_eq!(c.unrecognised, ["Rider height (cm)"]);
    // Parts the page has inputs for are recognised, said where to set them, and not read.
    for row in ["Stem length", "Handlebar width", "Crank length"] {
        assert!(
            has_note(&c, row, "not a frame number: set it under"),
            "{row}"
        );
    }
    assert_row(&c, "reach_mm", &[440.0, 465.0, 490.0]);
    assert_row(&c, "stack_mm", &[620.0, 630.0, 640.0]);
    assert_row(&c, "head_angle_deg", &[64.0; 3]);
    assert_eq!(c.sizes[0].frame.len(), 3);
}

#[test]
fn wheel_size_row_differing_per_size() {
    let c = chart("10_wheels_per_size.txt");
    assert_eq!(labels(&c), ["XS", "S", "M", "L", "XL"]);
    let pair = |f: &str, r: &str| (f.to_string(), r.to_string());
    assert_eq!(
        wheels(&c),
        vec![
            pair("27.5x2.4", "27.5x2.4"),
            pair("27.5x2.4", "27.5x2.4"),
            pair("29x2.4", "29x2.4"),
            pair("29x2.4", "29x2.4"),
            pair("29x2.4", "27.5x2.4"),
        ]
    );
    assert!(has_note(&c, "Wheel size", "no tyre width"));
    assert_row(&c, "reach_mm", &[400.0, 425.0, 450.0, 475.0, 500.0]);
    assert_row(&c, "chainstay_mm", &[430.0, 430.0, 438.0, 438.0, 438.0]);
    // Every designation is one the kernel resolves.
    for s in &c.sizes {
        for w in [&s.wheels.front, &s.wheels.rear].into_iter().flatten() {
            assert!(w.resolve("w").is_ok(), "{w:?}");
        }
    }
}

#[test]
fn title_line_blank_lines_and_a_stated_unit() {
    let c = chart("11_title_blank_lines.txt");
    assert_eq!(labels(&c), ["S", "M", "L"]);
    assert_row(&c, "reach_mm", &[445.0, 470.0, 495.0]);
    assert_row(&c, "stack_mm", &[621.0, 630.0, 639.0]);
    assert_row(&c, "head_angle_deg", &[65.0; 3]);
    assert_row(&c, "seat_angle_effective_deg", &[77.0; 3]);
    assert_row(&c, "chainstay_mm", &[437.0; 3]);
    assert!(has_note(
        &c,
        "",
        "ignored a line of text: \"Invented Trail 140"
    ));
    assert!(has_note(
        &c,
        "",
        "read as mm, as \"All measurements in mm\" says"
    ));
    assert!(c.unrecognised.is_empty() && c.questions.is_empty());
}

#[test]
fn sizes_as_rows_with_row_numbers_and_a_range() {
    let c = chart("12_rows_numbers_ranges.txt");
    assert_eq!(labels(&c), ["S", "M", "L"]);
    // L publishes reach as 470-475: the midpoint 472.5, with a note.
    assert_row(&c, "reach_mm", &[430.0, 455.0, 472.5]);
    assert!(has_note(
        &c,
        "Reach",
        "L: the range 470–475 was read as its midpoint 472.5"
    ));
    assert_row(&c, "stack_mm", &[612.0, 621.0, 630.0]);
    assert_row(&c, "head_angle_deg", &[65.0; 3]);
    assert_row(&c, "seat_angle_effective_deg", &[77.0; 3]);
    assert_row(&c, "chainstay_mm", &[435.0, 435.0, 440.0]);
    assert_eq!(c.unrecognised, ["Rider height"]);
    assert!(has_note(&c, "#", "row numbers"));
    assert!(c.questions.iter().any(|q| q.row == "STA"));
}

#[test]
fn quoted_csv_with_decimal_commas_in_inches_without_units() {
    let c = chart("13_quoted_csv_inches_no_units.txt");
    assert_eq!(labels(&c), ["M", "L"]);
    // 17,5 and 18,3 in; 23,9 and 24,6 in; 44,1 and 45,2 in.
    assert_row(&c, "reach_mm", &[444.5, 464.82]);
    assert_row(&c, "stack_mm", &[607.06, 624.84]);
    assert_row(&c, "wheelbase_mm", &[1120.14, 1148.08]);
    assert_row(&c, "head_angle_deg", &[68.5; 2]);
    assert_unit_note(&c, "inches", &["Reach", "Stack", "Wheelbase"]);
    assert_eq!(unit_notes(&c).len(), 1);
}

#[test]
fn a_unit_that_fits_cm_or_inches_is_asked_and_can_be_answered() {
    // Head tube 9 and 9.5: 90/95 mm as cm, 228.6/241.3 mm as inches: both plausible.
    let text = "Size\tS\tM\nHead tube\t9\t9.5\nHead angle\t65\t65\n";
    let c = import_chart(text).unwrap();
    let q = c.questions.iter().find(|q| q.row == "Head tube").unwrap();
    assert_eq!(q.options, ["cm", "in"]);
    assert_eq!(q.chosen, "cm");
    assert_row(&c, "head_tube_mm", &[90.0, 95.0]);
    let answers: Answers = [(q.id.clone(), "in".to_string())].into_iter().collect();
    let c = import_chart_with(text, &answers).unwrap();
    assert_row(&c, "head_tube_mm", &[228.6, 241.3]);
    assert_eq!(c.questions[0].chosen, "in");
}

#[test]
fn an_ambiguous_unit_follows_the_other_rows() {
    // Reach 17.5 fits only inches (444.5 mm; 175 mm and 17.5 mm are no reach), stack 24.0 too
    // (609.6 mm); BB drop 1.2 fits mm (1.2), cm (12) and in (30.48): the other rows say inches.
    let text = "Size,M\nReach,17.5\nStack,24.0\nBB drop,1.2\n";
    let c = import_chart(text).unwrap();
    assert_row(&c, "reach_mm", &[444.5]);
    assert_row(&c, "stack_mm", &[609.6]);
    assert_row(&c, "bb_drop_mm", &[30.48]);
    let q = c.questions.iter().find(|q| q.row == "BB drop").unwrap();
    assert_eq!(q.chosen, "in");
    assert!(q.message.contains("like the other rows"));
}

#[test]
fn two_settings_in_one_cell_ask_which() {
    let text = "Size\tS\tM\nHead angle\t65/64.5\t65/64.5\nReach\t450\t475\n";
    let c = import_chart(text).unwrap();
    assert_row(&c, "head_angle_deg", &[65.0, 65.0]);
    let q = c.questions.iter().find(|q| q.row == "Head angle").unwrap();
    assert_eq!(q.options, ["first", "second"]);
    let answers: Answers = [(q.id.clone(), "second".to_string())].into_iter().collect();
    let c = import_chart_with(text, &answers).unwrap();
    assert_row(&c, "head_angle_deg", &[64.5, 64.5]);
}

#[test]
fn single_spaces_pdf_copy_and_thousands_commas() {
    let text =
        "S M L\nReach 430 455 480\nWheelbase 1,180 1,205 1,230\nHead angle 64.5° 64.5° 64.5°\n";
    let c = import_chart(text).unwrap();
    assert_eq!(labels(&c), ["S", "M", "L"]);
    assert_row(&c, "wheelbase_mm", &[1180.0, 1205.0, 1230.0]);
    assert_row(&c, "head_angle_deg", &[64.5; 3]);
}

#[test]
fn one_value_for_all_sizes_and_both_seat_angles() {
    let text = "Size\tS\tM\tL\nHead angle\t64\nSeat tube angle (actual)\t73\t73\t73\nSeat tube angle\t77\t77.5\t78\n";
    let c = import_chart(text).unwrap();
    assert_row(&c, "head_angle_deg", &[64.0; 3]);
    assert!(has_note(&c, "Head angle", "used it for all"));
    assert_row(&c, "seat_angle_actual_deg", &[73.0; 3]);
    // The plain "Seat tube angle" must be the other one: effective, without a question.
    assert_row(&c, "seat_angle_effective_deg", &[77.0, 77.5, 78.0]);
    assert!(c.questions.is_empty());
}

#[test]
fn one_wheel_size_for_all_sizes_is_used_for_all_and_said() {
    // A merged "Wheel size" cell: one designation for every size, said like any other row of
    // one value; a row with a wheel per size gets no such note.
    let text = "Size\tS\tM\tL\nReach\t430\t455\t480\nWheel size\t29x2.4\n";
    let c = import_chart(text).unwrap();
    let each = ("29x2.4".to_string(), "29x2.4".to_string());
    assert_eq!(wheels(&c), vec![each.clone(), each.clone(), each]);
    assert!(has_note(&c, "Wheel size", "one wheel size for every size"));
    let per_size =
        import_chart("Size\tS\tM\nReach\t430\t455\nWheel size\t27.5x2.4\t29x2.4\n").unwrap();
    assert!(!has_note(&per_size, "Wheel size", "every size"));
}

#[test]
fn impossible_values_and_text_cells_are_left_out_with_a_note() {
    let text = "Size\tS\tM\nReach\t450\tTBD soon\nHead angle\t65\t120\n";
    let c = import_chart(text).unwrap();
    assert_eq!(c.sizes[1].frame.get("reach_mm"), None);
    assert!(has_note(&c, "Reach", "M: not a number"));
    // 120° is past the hard limit for a head angle (45°–85°, kernel catalogue).
    assert_eq!(c.sizes[0].frame.get("head_angle_deg"), Some(&65.0));
    assert!(!c.sizes[1].frame.contains_key("head_angle_deg"));
    assert!(has_note(&c, "Head angle", "outside what any frame has"));
}

#[test]
fn errors_say_what_to_do() {
    let code = |t: &str| import_chart(t).err().map(|e| e.code());
    assert_eq!(code(""), Some("empty_chart"));
    assert_eq!(code("  \n\t \n"), Some("empty_chart"));
    assert_eq!(code("just some words\nand more words"), Some("not_a_table"));
    assert_eq!(code("Reach 450 470 490"), Some("one_row"));
    assert_eq!(
        code("Size\tS\tM\nSaddle height\t700\t720\nStem\t50\t60"),
        Some("nothing_recognised")
    );
    let wide = format!("Size{}\nReach{}", "\tM".repeat(60), "\t450".repeat(60));
    assert_eq!(code(&wide), Some("too_many_sizes"));
    let huge = "Reach 450\n".repeat(40_000);
    assert_eq!(code(&huge), Some("chart_too_large"));
    let long = "Reach 450\n".repeat(401);
    assert_eq!(code(&long), Some("chart_too_long"));
    let e = import_chart("Size\tS\nStem\t50\nSaddle\t700").unwrap_err();
    assert!(matches!(e, ChartError::NothingRecognised { .. }));
    let msg = e.to_string();
    assert!(
        msg.contains("Stem") && msg.contains("Reach, Stack"),
        "{msg}"
    );
    assert!(ChartError::OneRow
        .to_string()
        .contains("paste the size names"));
}

#[test]
fn json_has_the_design_shape() {
    let c = framewise_formats::chart_to_json(&import_chart(
        "Size\tM\nReach (mm)\t470\nWheel size\t29x2.5\nSaddle\t700\n",
    ));
    let v: serde_json::Value = serde_json::from_str(&c).unwrap();
    assert_eq!(v["sizes"][0]["label"], "M");
    assert_eq!(v["sizes"][0]["frame"]["reach_mm"], 470.0);
    assert_eq!(v["sizes"][0]["wheels"]["front"], "29x2.5");
    assert_eq!(v["unrecognised"][0], "Saddle");
    assert!(v["questions"].is_array() && v["notes"].is_array() && v["error"].is_null());
    let e = framewise_formats::chart_to_json(&import_chart(""));
    let v: serde_json::Value = serde_json::from_str(&e).unwrap();
    assert_eq!(v["error"]["code"], "empty_chart");
    assert_eq!(v["sizes"].as_array().map(Vec::len), Some(0));
}

#[test]
fn size_names_of_every_kind() {
    let c = import_chart("Frame size\tSize 1\tSize 2\t52 cm\t54cm\nReach\t400\t420\t440\t460\n")
        .unwrap();
    assert_eq!(labels(&c), ["Size 1", "Size 2", "52 cm", "54cm"]);
    let c = import_chart("\tXS¹\tM\tM\t\nReach\t400\t420\t440\t460\n").unwrap();
    // A footnote mark is dropped, a repeated name is numbered, a blank one is named by place.
    assert_eq!(labels(&c), ["XS", "M", "M (3)", "Size 4"]);
}

#[test]
fn sizes_as_rows_with_a_units_row_under_the_labels() {
    let text = "Size;Reach;Stack;Head angle;Chainstay\n;cm;cm;deg;mm\nS;43;60,5;66;435\nM;45,5;61,5;66;435\n";
    let c = import_chart(text).unwrap();
    assert_eq!(labels(&c), ["S", "M"]);
    assert_row(&c, "reach_mm", &[430.0, 455.0]);
    assert_row(&c, "stack_mm", &[605.0, 615.0]);
    assert_row(&c, "head_angle_deg", &[66.0, 66.0]);
    assert_row(&c, "chainstay_mm", &[435.0, 435.0]);
    assert!(has_note(&c, "", "units row under the labels"));
}

#[test]
fn one_cell_per_line_phone_copy() {
    let c = chart("14_one_cell_per_line.txt");
    assert_eq!(labels(&c), ["S", "M", "L"]);
    assert_row(&c, "reach_mm", &[432.0, 457.0, 482.0]);
    assert_row(&c, "stack_mm", &[611.0, 620.0, 629.0]);
    assert_row(&c, "head_angle_deg", &[64.5; 3]);
    assert_row(&c, "chainstay_mm", &[436.0; 3]);
    assert!(has_note(&c, "", "one cell per line"));
}

#[test]
fn windows_and_old_mac_line_ends() {
    for eol in ["\r\n", "\r"] {
        let text = ["Size\tS\tM", "Reach\t430\t455", "Stack\t611\t620", ""].join(eol);
        let c = import_chart(&text).unwrap();
        assert_eq!(labels(&c), ["S", "M"]);
        assert_row(&c, "reach_mm", &[430.0, 455.0]);
        assert_row(&c, "stack_mm", &[611.0, 620.0]);
    }
}

#[test]
fn row_numbers_before_labels_and_labels_repeated_on_the_right() {
    let text = "#\tSize\tS\tM\tL\t\n1\tReach\t430\t455\t480\tReach\n2\tStack\t611\t620\t629\tStack\n3\tHead angle\t65\t65\t\tHead angle\n";
    let c = import_chart(text).unwrap();
    assert_eq!(labels(&c), ["S", "M", "L"]);
    assert_row(&c, "reach_mm", &[430.0, 455.0, 480.0]);
    assert_row(&c, "stack_mm", &[611.0, 620.0, 629.0]);
    // L's head angle cell is blank: missing, not shifted.
    assert_eq!(c.sizes[2].frame.get("head_angle_deg"), None);
    assert_eq!(c.sizes[1].frame.get("head_angle_deg"), Some(&65.0));
    assert!(has_note(&c, "", "column(s) before the labels"));
    assert!(has_note(&c, "", "column 4 has no size name and no numbers"));
}

#[test]
fn fewer_values_than_sizes_are_read_from_the_left_and_said() {
    let c = import_chart("Size\tS\tM\tL\nReach\t430\t455\t480\nStack\t611\t620\n").unwrap();
    assert_eq!(c.sizes[0].frame.get("stack_mm"), Some(&611.0));
    assert_eq!(c.sizes[1].frame.get("stack_mm"), Some(&620.0));
    assert!(!c.sizes[2].frame.contains_key("stack_mm"));
    assert!(has_note(&c, "Stack", "2 values for 3 sizes"));
}

/// A PDF copy with single spaces loses a blank cell's place: "Chainstay 435 440" under three
/// sizes may be S and M or M and L. The import asks (default: the first sizes, read from the
/// left) and an answer moves the values under the last sizes. A chart whose cells keep their
/// places (tabs) does not ask.
#[test]
fn a_short_row_without_places_asks_which_sizes_it_belongs_to() {
    let text = "Size S M L\nReach 430 455 480\nStack 611 620 629\nChainstay 435 440\n";
    let c = import_chart(text).unwrap();
    assert_eq!(labels(&c), ["S", "M", "L"]);
    let q = c.questions.iter().find(|q| q.row == "Chainstay").unwrap();
    assert_eq!(
        q.options,
        [
            "the first 2 sizes",
            "the last 2 sizes",
            "none of them (leave the values out)"
        ]
    );
    assert!(
        q.message
            .starts_with("\"Chainstay\" gives 2 values for 3 sizes"),
        "{}",
        q.message
    );
    assert_eq!(q.chosen, "the first 2 sizes");
    let chainstay = row(&c, "chainstay_mm");
    assert_eq!(chainstay[..2], [435.0, 440.0]);
    assert!(chainstay[2].is_nan(), "{chainstay:?}");
    assert_eq!(c.questions.len(), 1, "{:?}", c.questions);

    let answers: Answers = [(q.id.clone(), "the last 2 sizes".to_string())]
        .into_iter()
        .collect();
    let c = import_chart_with(text, &answers).unwrap();
    let chainstay = row(&c, "chainstay_mm");
    assert!(chainstay[0].is_nan(), "{chainstay:?}");
    assert_eq!(chainstay[1..], [435.0, 440.0]);
    assert_row(&c, "reach_mm", &[430.0, 455.0, 480.0]);

    let tabs = import_chart("Size\tS\tM\tL\nReach\t430\t455\t480\nChainstay\t435\t440\n").unwrap();
    assert!(tabs.questions.is_empty(), "{:?}", tabs.questions);
    assert!(has_note(&tabs, "Chainstay", "read from the left"));
}

#[test]
fn pdf_single_spaces_sizes_as_rows() {
    let c = chart("15_pdf_single_spaces_rows.txt");
    assert_eq!(labels(&c), ["S", "M", "L"]);
    assert_row(&c, "reach_mm", &[430.0, 455.0, 480.0]);
    assert_row(&c, "stack_mm", &[612.0, 621.0, 630.0]);
    assert_row(&c, "head_angle_deg", &[65.0, 65.0, 64.5]);
    assert_row(&c, "seat_angle_effective_deg", &[77.0, 77.0, 77.5]);
    assert_row(&c, "chainstay_mm", &[435.0, 435.0, 440.0]);
    let fronts: Vec<String> = wheels(&c).into_iter().map(|w| w.0).collect();
    assert_eq!(fronts, ["27.5x2.4", "29x2.4", "29x2.4"]);
    assert!(has_note(
        &c,
        "",
        "ignored a line of text: \"Geometry 2027\""
    ));
    assert!(c.unrecognised.is_empty());
}

/// A PDF copy aligned with spaces where some cells are blank: each value stays under its own
/// size (by its columns), a blank cell is a missing value, and a blank at the end of a row is
/// read from the left and said.
#[test]
fn aligned_spaces_with_blank_cells_keep_values_under_their_sizes() {
    let c = chart("16_pdf_aligned_blank_cells.txt");
    assert_eq!(labels(&c), ["S", "M", "L", "XL"]);
    assert_row(&c, "reach_mm", &[430.0, 452.0, 474.0, 496.0]);
    let stack = row(&c, "stack_mm");
    assert!(stack[1].is_nan(), "M has no stack: {stack:?}");
    assert_eq!([stack[0], stack[2], stack[3]], [605.0, 623.0, 632.0]);
    let chainstay = row(&c, "chainstay_mm");
    assert!(chainstay[0].is_nan(), "S has no chainstay: {chainstay:?}");
    assert_eq!(chainstay[1..], [435.0, 435.0, 440.0]);
    let wheelbase = row(&c, "wheelbase_mm");
    assert_eq!(wheelbase[..3], [1150.0, 1177.0, 1204.0]);
    assert!(wheelbase[3].is_nan());
    assert!(has_note(&c, "Wheelbase", "read from the left"));
    assert!(!has_note(&c, "Stack", "read from the left"));
    assert_row(&c, "head_tube_mm", &[95.0, 105.0, 115.0, 125.0]);
}

/// Sizes as rows, copied from a PDF with single spaces: the size row "M" has one value fewer
/// than there are measurements (its reach is blank), and nothing says which one is missing, so
/// the import asks whether its values are the first measurements (the default) or the last
/// ones. With tabs the row's places are known (a blank last cell is lost in a copy) and it is
/// read from the left with a note.
#[test]
fn a_short_size_row_without_places_asks_which_measurements_it_gives() {
    let text = "Size Reach Stack Chainstay\nS 430 611 435\nM 620 437\nL 480 629 440\n";
    let c = import_chart(text).unwrap();
    assert_eq!(labels(&c), ["S", "M", "L"]);
    let q = c.questions.iter().find(|q| q.row == "M").unwrap();
    assert_eq!(q.id, "M#measurements");
    assert_eq!(
        q.options,
        [
            "the first 2 measurements",
            "the last 2 measurements",
            "none of them (leave the values out)"
        ]
    );
    assert!(
        q.message
            .starts_with("\"M\" gives 2 values for 3 measurements"),
        "{}",
        q.message
    );
    assert_eq!(q.chosen, "the first 2 measurements");
    assert_eq!(c.questions.len(), 1, "{:?}", c.questions);
    // Read as the first two: M's 620 is its reach and 437 its stack (the person sees it is
    // wrong and answers), and it has no chainstay.
    assert_row(&c, "reach_mm", &[430.0, 620.0, 480.0]);
    assert_row(&c, "stack_mm", &[611.0, 437.0, 629.0]);
    let chainstay = row(&c, "chainstay_mm");
    assert!(chainstay[1].is_nan(), "{chainstay:?}");

    // Answered "the last": 620 and 437 are M's stack and chainstay, and it has no reach.
    let answers: Answers = [(q.id.clone(), "the last 2 measurements".to_string())]
        .into_iter()
        .collect();
    let c = import_chart_with(text, &answers).unwrap();
    // The question now says the answer, not the default.
    assert!(
        c.questions[0]
            .message
            .ends_with("; read as the last 2 measurements"),
        "{}",
        c.questions[0].message
    );
    let reach = row(&c, "reach_mm");
    assert!(reach[1].is_nan(), "{reach:?}");
    assert_eq!([reach[0], reach[2]], [430.0, 480.0]);
    assert_row(&c, "stack_mm", &[611.0, 620.0, 629.0]);
    assert_row(&c, "chainstay_mm", &[435.0, 437.0, 440.0]);

    // Answered "none": M has none of the three, the other sizes keep theirs.
    let none: Answers = [(
        q.id.clone(),
        "none of them (leave the values out)".to_string(),
    )]
    .into_iter()
    .collect();
    let c = import_chart_with(text, &none).unwrap();
    assert!(c.sizes[1].frame.is_empty(), "{:?}", c.sizes[1].frame);
    let reach = row(&c, "reach_mm");
    assert_eq!([reach[0], reach[2]], [430.0, 480.0]);
    assert!(
        c.questions[0].message.ends_with("; they were left out"),
        "{}",
        c.questions[0].message
    );

    let tabs = import_chart(
        "Size\tReach\tStack\tChainstay\nS\t430\t611\t435\nM\t455\t620\nL\t480\t629\t440\n",
    )
    .unwrap();
    assert!(tabs.questions.is_empty(), "{:?}", tabs.questions);
    assert!(has_note(
        &tabs,
        "M",
        "2 values for 3 measurements; read from the left"
    ));
    assert_row(&tabs, "stack_mm", &[611.0, 620.0, 629.0]);
    let chainstay = row(&tabs, "chainstay_mm");
    assert!(chainstay[1].is_nan(), "{chainstay:?}");
}

/// One value under three sizes in a copy whose cells lost their places (single spaces): it is
/// used for every size (a merged cell, the usual case), and the person is asked, since it may
/// be the first or the last size's alone. With tabs it is used for all with a note only.
#[test]
fn one_value_without_places_asks_whether_it_is_every_size() {
    let text = "Size S M L\nReach 430 455 480\nHead angle 64\n";
    let c = import_chart(text).unwrap();
    assert_row(&c, "head_angle_deg", &[64.0; 3]);
    let q = c.questions.iter().find(|q| q.row == "Head angle").unwrap();
    assert_eq!(q.id, "Head angle#sizes");
    assert_eq!(q.options, ["every size", "the first size", "the last size"]);
    assert_eq!(q.chosen, "every size");
    assert!(q.message.contains("one value for 3 sizes"), "{}", q.message);

    let last: Answers = [(q.id.clone(), "the last size".to_string())]
        .into_iter()
        .collect();
    let answered = import_chart_with(text, &last).unwrap();
    assert!(
        answered.questions[0]
            .message
            .ends_with("; used it for the last size only"),
        "{}",
        answered.questions[0].message
    );
    let head = row(&answered, "head_angle_deg");
    assert!(head[0].is_nan() && head[1].is_nan(), "{head:?}");
    assert_eq!(head[2], 64.0);
    let first: Answers = [(q.id.clone(), "the first size".to_string())]
        .into_iter()
        .collect();
    let head = row(&import_chart_with(text, &first).unwrap(), "head_angle_deg");
    assert_eq!(head[0], 64.0);
    assert!(head[1].is_nan() && head[2].is_nan(), "{head:?}");

    let tabs = import_chart("Size\tS\tM\tL\nReach\t430\t455\t480\nHead angle\t64\n").unwrap();
    assert!(tabs.questions.is_empty(), "{:?}", tabs.questions);
    assert!(has_note(&tabs, "Head angle", "used it for all"));
}

/// Twelve length rows without a unit: one note names them all, instead of one note per row.
/// A row with its unit, the angle rows and an unknown row are not named; a row's own note (one
/// value for every size) stays its own.
#[test]
fn unitless_length_rows_share_one_note() {
    let text = "Size\tS\tM\tL\n\
        Reach\t430\t455\t480\n\
        Stack\t610\t620\t630\n\
        Head angle\t65\t65\t65\n\
        Seat angle (effective)\t77\t77\t77\n\
        Top tube\t590\t615\t640\n\
        Head tube\t95\t105\t115\n\
        Seat tube\t400\t430\t460\n\
        Chainstay\t435\t435\t440\n\
        Wheelbase\t1180\t1205\t1230\n\
        BB drop\t30\t30\t30\n\
        BB height\t310\t310\t310\n\
        Fork offset\t44\n\
        Standover\t740\t760\t780\n\
        Axle to crown\t561\t561\t561\n\
        Front centre (mm)\t720\t745\t770\n\
        Stem length\t50\t60\t70\n";
    let c = import_chart(text).unwrap();
    let mm = [
        "Reach",
        "Stack",
        "Top tube",
        "Head tube",
        "Seat tube",
        "Chainstay",
        "Wheelbase",
        "BB drop",
        "BB height",
        "Fork offset",
        "Standover",
        "Axle to crown",
    ];
    assert_unit_note(&c, "mm", &mm);
    assert_eq!(unit_notes(&c).len(), 1, "{:#?}", c.notes);
    // No note names a row on its own for its unit.
    assert!(
        !c.notes
            .iter()
            .any(|n| n.message.starts_with("no unit given;")),
        "{:#?}",
        c.notes
    );
    assert!(has_note(&c, "Fork offset", "one value for every size"));
    assert!(c.unrecognised.is_empty(), "{:?}", c.unrecognised);
    assert!(has_note(&c, "Stem length", "set it under Cockpit"));
    // The values are read as before.
    assert_row(&c, "reach_mm", &[430.0, 455.0, 480.0]);
    assert_row(&c, "top_tube_effective_mm", &[590.0, 615.0, 640.0]);
    assert_row(&c, "fork_offset_mm", &[44.0; 3]);
    assert_row(&c, "fork_a2c_mm", &[561.0; 3]);
    assert_row(&c, "front_centre_mm", &[720.0, 745.0, 770.0]);
    assert_row(&c, "head_angle_deg", &[65.0; 3]);
    // In the JSON the shared note lists its rows; a note about one row has no "rows".
    let json = framewise_formats::chart_to_json(&Ok(c));
    let v: serde_json::Value = serde_json::from_str(&json).unwrap();
    let notes = v["notes"].as_array().unwrap();
    let shared = notes.iter().find(|n| n["rows"].is_array()).unwrap();
    assert_eq!(shared["row"], "");
    assert_eq!(shared["rows"], serde_json::json!(mm));
    let own = notes.iter().find(|n| n["row"] == "Fork offset").unwrap();
    assert!(own.get("rows").is_none(), "{own}");
}

/// Length rows read as two different units get one note each; angle rows, always degrees,
/// get none.
#[test]
fn unitless_rows_of_two_units_get_one_note_per_unit() {
    // Reach 17.5/18.1 and stack 24.0/24.6 fit only inches (444.5/459.74 and 609.6/624.84 mm);
    // chainstay 435 and wheelbase 1180/1205 fit only mm.
    let text = "Size\tS\tM\n\
        Reach\t17.5\t18.1\n\
        Chainstay\t435\t435\n\
        Head angle\t65\t65.5\n\
        Stack\t24.0\t24.6\n\
        Seat angle (effective)\t77\t77\n\
        Wheelbase\t1180\t1205\n";
    let c = import_chart(text).unwrap();
    assert_unit_note(&c, "inches", &["Reach", "Stack"]);
    assert_unit_note(&c, "mm", &["Chainstay", "Wheelbase"]);
    let said = unit_notes(&c);
    assert_eq!(said.len(), 2, "{:#?}", c.notes);
    // Each stands where its first row's note stood: inches (Reach) before mm (Chainstay).
    assert!(said[0].message.contains("inches") && said[1].message.contains("as mm"));
    assert!(!c
        .notes
        .iter()
        .any(|n| n.message.contains("degrees") || n.rows.iter().any(|r| r.contains("angle"))));
    assert!(c.questions.is_empty(), "{:#?}", c.questions);
    assert_row(&c, "reach_mm", &[444.5, 459.74]);
    assert_row(&c, "stack_mm", &[609.6, 624.84]);
    assert_row(&c, "chainstay_mm", &[435.0; 2]);
    assert_row(&c, "head_angle_deg", &[65.0, 65.5]);
}

/// A row whose numbers fit two units, or no usual range, says why in a question of its own
/// and is not named in the shared note, answered or not.
#[test]
fn rows_with_a_reason_of_their_own_keep_their_own_question() {
    // Head tube 9/9.5 fits cm (90/95 mm) and inches (228.6/241.3 mm); BB drop 1.2 fits mm, cm
    // and inches; seat tube 4000 fits no range in any unit. Reach, stack and wheelbase fit mm only.
    let text = "Size\tS\tM\n\
        Reach\t450\t475\n\
        Head tube\t9\t9.5\n\
        Stack\t620\t630\n\
        BB drop\t1.2\t1.2\n\
        Seat tube\t4000\t4000\n\
        Wheelbase\t1180\t1205\n";
    for answers in [
        Answers::new(),
        [("Head tube#unit".to_string(), "in".to_string())]
            .into_iter()
            .collect(),
    ] {
        let c = import_chart_with(text, &answers).unwrap();
        assert_unit_note(&c, "mm", &["Reach", "Stack", "Wheelbase"]);
        assert_eq!(unit_notes(&c).len(), 1, "{:#?}", c.notes);
        let ask = |row: &str| {
            c.questions
                .iter()
                .find(|q| q.row == row && q.id == format!("{row}#unit"))
                .unwrap_or_else(|| panic!("{row}: {:#?}", c.questions))
        };
        let head = ask("Head tube");
        assert!(head.message.starts_with(
            "no unit given and the numbers of \"Head tube\" fit cm or inches; read as"
        ));
        let drop = ask("BB drop");
        assert_eq!(
            drop.message,
            "no unit given and the numbers of \"BB drop\" fit mm or cm or inches; read as mm like the other rows"
        );
        let seat = ask("Seat tube");
        assert!(seat.message.starts_with(
            "the numbers of \"Seat tube\" fit no usual range for Seat tube length in mm, cm or inches"
        ));
        if answers.is_empty() {
            assert_eq!(head.chosen, "cm");
            assert_row(&c, "head_tube_mm", &[90.0, 95.0]);
        } else {
            assert_eq!(head.chosen, "in");
            assert!(
                head.message.ends_with("read as inches as chosen"),
                "{}",
                head.message
            );
            assert_row(&c, "head_tube_mm", &[228.6, 241.3]);
        }
        // Their values' own notes stay per row too.
        assert!(has_note(&c, "Seat tube", "S: 4000 mm is outside"));
    }
}

/// No note says a row's value was not a number, and no unit was guessed from the numbers.
fn assert_read_cleanly(c: &ChartImport) {
    let bad: Vec<&Note> = c
        .notes
        .iter()
        .filter(|n| n.message.contains("not a number") || n.message.contains("no size name"))
        .collect();
    assert!(bad.is_empty(), "{bad:?}");
    assert!(unit_notes(c).is_empty(), "{:?}", unit_notes(c));
}

#[test]
fn units_column_on_the_right_of_an_aligned_pdf_table() {
    let c = chart("17_pdf_aligned_units_on_the_right.txt");
    // The header's first cell ("GEOMETRY") titles the label column; the sizes keep their names.
    assert_eq!(labels(&c), ["XS", "S", "M", "L"]);
    assert!(c.unrecognised.is_empty(), "{:?}", c.unrecognised);
    // Rows marked cm: × 10.
    assert_row(&c, "seat_tube_mm", &[400.0, 440.0, 480.0, 520.0]);
    assert_row(&c, "top_tube_effective_mm", &[515.0, 530.0, 545.0, 560.0]);
    assert_row(&c, "head_tube_mm", &[100.0, 115.0, 135.0, 155.0]);
    assert_row(&c, "chainstay_mm", &[415.0; 4]);
    assert_row(&c, "wheelbase_mm", &[970.0, 980.0, 990.0, 1000.0]);
    // 7,5 cm fits mm or cm by its size alone; the units column says cm.
    assert_row(&c, "bb_drop_mm", &[75.0; 4]);
    assert_row(&c, "stack_mm", &[510.0, 525.0, 545.0, 565.0]);
    assert_row(&c, "reach_mm", &[365.0, 372.0, 379.0, 386.0]);
    // Rows marked °.
    assert_row(&c, "head_angle_deg", &[70.5, 71.0, 71.5, 72.0]);
    assert_row(&c, "seat_angle_effective_deg", &[74.5, 74.0, 73.5, 73.5]);
    assert!(has_note(&c, "", "units column on the right"));
    assert_read_cleanly(&c);
    assert!(c.questions.iter().all(|q| !q.id.ends_with("#unit")));
}

#[test]
fn units_column_on_the_right_without_reference_letters() {
    for sep in ["      ", "\t"] {
        let text = [
            "GEOMETRY|XS|S|M|L",
            "Seat tube|39|43|47|51|cm",
            "Head angle|70,5|71,0|71,5|72,0|°",
            "Stack|51,5|53,0|55,0|57,0|cm",
            "Reach|36,0|36,8|37,5|38,2|cm",
        ]
        .join("\n")
        .replace('|', sep);
        let c = import_chart(&text).unwrap();
        assert_eq!(labels(&c), ["XS", "S", "M", "L"], "{sep:?}");
        assert!(c.unrecognised.is_empty(), "{:?}", c.unrecognised);
        assert_row(&c, "seat_tube_mm", &[390.0, 430.0, 470.0, 510.0]);
        assert_row(&c, "head_angle_deg", &[70.5, 71.0, 71.5, 72.0]);
        assert_row(&c, "stack_mm", &[515.0, 530.0, 550.0, 570.0]);
        assert_row(&c, "reach_mm", &[360.0, 368.0, 375.0, 382.0]);
        assert_read_cleanly(&c);
    }
}

#[test]
fn units_column_after_the_labels_under_a_header_without_it() {
    // The size names have no cell above the units column: they keep all their names.
    let text = "GEOMETRY          XS      S       M\n\
                Seat tube    mm   390     430     470\n\
                Head angle   °    70,5    71,0    71,5\n\
                Reach        in   14.2    14.5    14.8\n";
    let c = import_chart(text).unwrap();
    assert_eq!(labels(&c), ["XS", "S", "M"]);
    assert!(c.unrecognised.is_empty(), "{:?}", c.unrecognised);
    assert_row(&c, "seat_tube_mm", &[390.0, 430.0, 470.0]);
    assert_row(&c, "head_angle_deg", &[70.5, 71.0, 71.5]);
    // 14.2 14.5 14.8 in × 25.4
    assert_row(&c, "reach_mm", &[360.68, 368.3, 375.92]);
    assert_read_cleanly(&c);
}

#[test]
fn a_unit_word_ending_one_row_is_no_units_column() {
    // One row ends in "mm" after its numbers; the other rows do not: no column is taken out.
    let c = import_chart("Size\tS\tM\nReach\t450\t470 mm\nStack\t620\t630\nHead angle\t65\t65\n")
        .unwrap();
    assert_row(&c, "reach_mm", &[450.0, 470.0]);
    assert!(!has_note(&c, "", "units column"));
}

#[test]
fn part_rows_point_to_their_inputs_and_footnotes_state_no_unit() {
    let c = chart("18_parts_rows_and_footnotes.txt");
    assert_eq!(labels(&c), ["S", "M", "L"]);
    // The footnote line names cm only; read as the chart's unit it would make 440 mm of
    // reach 4400 mm. The numbers are read as mm.
    assert_row(&c, "reach_mm", &[440.0, 462.0, 484.0]);
    assert_row(&c, "stack_mm", &[618.0, 627.0, 636.0]);
    assert_row(&c, "chainstay_mm", &[436.0, 436.0, 441.0]);
    assert_row(&c, "seat_angle_effective_deg", &[77.0; 3]);
    assert!(has_note(&c, "", "ignored a line of text: \"¹ measured"));
    assert!(!c.notes.iter().any(|n| n.message.contains("as \"¹")));
    assert_unit_note(&c, "mm", &["Reach", "Stack", "Chainstay"]);
    // Stem, crank and bar rows are recognised and sent to the page's inputs, not listed as
    // unrecognised; no frame key is made of them.
    assert!(c.unrecognised.is_empty(), "{:?}", c.unrecognised);
    let said = |row: &str| {
        c.notes
            .iter()
            .find(|n| n.row == row)
            .map(|n| n.message.clone())
            .unwrap_or_default()
    };
    assert_eq!(
        said("Stem length"),
        "recognised as the stem length, not a frame number: set it under Cockpit"
    );
    assert_eq!(
        said("Crank Length"),
        "recognised as the crank length, not a frame number: set it under Saddle, seatpost and cranks"
    );
    assert_eq!(
        said("Bar Width (mm)"),
        "recognised as the bar width, not a frame number: set it under Cockpit"
    );
    for s in &c.sizes {
        assert_eq!(s.frame.len(), 5, "{}: {:?}", s.label, s.frame);
    }
}

#[test]
fn footnote_lines_of_every_mark_state_no_unit() {
    for mark in ["*", "†", "¹", "(1)", "[a]"] {
        let text =
            format!("Size\tS\tM\nReach\t450\t470\nStack\t620\t630\n{mark} all values in cm\n");
        let c = import_chart(&text).unwrap();
        assert_row(&c, "reach_mm", &[450.0, 470.0]);
        assert!(has_note(&c, "", "ignored a line of text"), "{mark}");
    }
    // A title line that is no footnote still says the unit.
    let c = import_chart("All values in cm\nSize\tS\tM\nReach\t45\t47\nStack\t62\t63\n").unwrap();
    assert_row(&c, "reach_mm", &[450.0, 470.0]);
}

#[test]
fn every_chart_error_is_a_sentence() {
    let errors = [
        ChartError::Empty,
        ChartError::TooLarge { bytes: 300_000 },
        ChartError::TooManyLines { lines: 500 },
        ChartError::NotATable,
        ChartError::OneRow,
        ChartError::TooManySizes { count: 50 },
        ChartError::NothingRecognised {
            labels: vec!["Saddle".into()],
        },
    ];
    for e in errors {
        let m = e.to_string();
        assert!(m.starts_with(char::is_uppercase), "{m}");
        assert!(m.ends_with('.'), "{m}");
    }
    let junk = import_chart("this is not a table at all, just some words 123 and 456").unwrap_err();
    assert_eq!(
        junk.to_string(),
        "Only one row of the table was found: paste the size names and at least one measurement row."
    );
}

// Units in both orientations. With sizes as columns a units column sits after the labels or on
// the right (fixtures 04, 17); with sizes as rows each column is one measurement, so its unit is
// in a units row: under the labels, above them or at the foot of the table.

/// No question asks a unit, and no note says one was guessed: every unit came from the chart.
fn assert_units_given(c: &ChartImport) {
    assert_read_cleanly(c);
    let asked: Vec<&str> = c
        .questions
        .iter()
        .map(|q| q.id.as_str())
        .filter(|id| id.ends_with("#unit"))
        .collect();
    assert!(asked.is_empty(), "{asked:?}");
}

#[test]
fn sizes_as_rows_with_an_aligned_units_row_under_the_labels() {
    let c = chart("19_pdf_aligned_units_row_under_labels.txt");
    assert_eq!(labels(&c), ["XS", "S", "M", "L"]);
    assert!(c.unrecognised.is_empty(), "{:?}", c.unrecognised);
    // cm × 10; the wheel-size column has no unit, and the units after it stay in their columns.
    assert_row(&c, "reach_mm", &[370.0, 380.0, 390.0, 400.0]);
    assert_row(&c, "stack_mm", &[525.0, 540.0, 560.0, 580.0]);
    assert_row(&c, "head_angle_deg", &[70.5, 71.0, 71.5, 72.0]);
    assert_row(&c, "seat_angle_effective_deg", &[75.0, 74.5, 74.0, 73.5]);
    // mm as written.
    assert_row(&c, "chainstay_mm", &[415.0, 415.0, 420.0, 420.0]);
    assert_row(&c, "wheelbase_mm", &[975.0, 985.0, 1000.0, 1015.0]);
    // 7,2 cm: mm or cm by the size of the number alone; the units row says cm.
    assert_row(&c, "bb_drop_mm", &[72.0, 72.0, 70.0, 70.0]);
    let w275 = ("27.5x2.4".to_string(), "27.5x2.4".to_string());
    let w29 = ("29x2.4".to_string(), "29x2.4".to_string());
    assert_eq!(wheels(&c), [w275.clone(), w275, w29.clone(), w29]);
    assert!(has_note(&c, "", "units row under the labels"));
    assert_units_given(&c);
}

#[test]
fn sizes_as_rows_with_a_units_row_above_the_labels() {
    let c = chart("20_tab_units_row_above_labels.txt");
    assert_eq!(labels(&c), ["S", "M", "L"]);
    assert!(c.unrecognised.is_empty(), "{:?}", c.unrecognised);
    assert_row(&c, "reach_mm", &[425.0, 450.0, 475.0]);
    assert_row(&c, "stack_mm", &[600.0, 610.0, 620.0]);
    assert_row(&c, "head_angle_deg", &[65.5; 3]);
    assert_row(&c, "seat_angle_effective_deg", &[77.0, 77.0, 77.5]);
    assert_row(&c, "chainstay_mm", &[435.0, 435.0, 440.0]);
    assert_row(&c, "wheelbase_mm", &[1180.0, 1205.0, 1230.0]);
    // 3,5 cm: read from the units row, not asked.
    assert_row(&c, "bb_drop_mm", &[35.0; 3]);
    assert!(has_note(&c, "", "units row above the labels"));
    // The units row is no ignored column of row numbers.
    assert!(!has_note(&c, "", "before the labels"), "{:#?}", c.notes);
    assert_units_given(&c);
}

#[test]
fn sizes_as_rows_with_a_units_row_at_the_foot() {
    let c = chart("21_pipes_units_row_at_the_foot.txt");
    // The units row is no fourth size.
    assert_eq!(labels(&c), ["S", "M", "L"]);
    assert!(c.unrecognised.is_empty(), "{:?}", c.unrecognised);
    // Inches × 25.4.
    assert_row(&c, "reach_mm", &[408.94, 429.26, 449.58]);
    assert_row(&c, "stack_mm", &[607.06, 619.76, 629.92]);
    assert_row(&c, "top_tube_effective_mm", &[556.26, 579.12, 601.98]);
    assert_row(&c, "head_angle_deg", &[67.0, 67.0, 67.5]);
    assert_row(&c, "chainstay_mm", &[429.26, 429.26, 434.34]);
    assert!(has_note(&c, "", "units row under the sizes"));
    assert_units_given(&c);
}

#[test]
fn size_rows_ending_in_one_length_unit_give_the_unit_of_lengths() {
    let c = chart("22_pdf_aligned_size_rows_end_in_a_unit.txt");
    assert_eq!(labels(&c), ["S", "M", "L"]);
    assert!(c.unrecognised.is_empty(), "{:?}", c.unrecognised);
    assert_row(&c, "reach_mm", &[410.0, 435.0, 460.0]);
    assert_row(&c, "stack_mm", &[595.0, 605.0, 615.0]);
    assert_row(&c, "head_angle_deg", &[66.0; 3]);
    assert_row(&c, "seat_angle_effective_deg", &[76.0, 76.0, 76.5]);
    assert_row(&c, "chainstay_mm", &[430.0, 430.0, 435.0]);
    assert_row(&c, "wheelbase_mm", &[1175.0, 1200.0, 1225.0]);
    // 3,5 cm fits mm or cm by its size; the column says cm.
    assert_row(&c, "bb_drop_mm", &[35.0, 35.0, 30.0]);
    assert!(has_note(
        &c,
        "",
        "each size's row ends in cm: read as the unit of the last column and, where their numbers fit it, of the other lengths without a unit"
    ));
    assert!(!has_note(&c, "", "units column"), "{:#?}", c.notes);
    // The others are read by the size of their numbers (which the column agrees with), and said;
    // nothing is asked.
    assert!(has_note(&c, "", "read as cm from the size of the numbers"));
    assert!(c.questions.is_empty(), "{:?}", c.questions);
}

#[test]
fn a_units_column_beside_size_rows_that_names_no_one_unit_is_listed() {
    // Each size row ends in a different unit: no measurement's unit, so not read, and said.
    let text = "Size\tReach\tStack\tHead angle\nS\t430\t605\t66\tmm\nM\t455\t615\t66\t°\n";
    let c = import_chart(text).unwrap();
    assert_eq!(labels(&c), ["S", "M"]);
    assert_row(&c, "reach_mm", &[430.0, 455.0]);
    assert_row(&c, "stack_mm", &[605.0, 615.0]);
    assert_row(&c, "head_angle_deg", &[66.0, 66.0]);
    assert_eq!(c.unrecognised, ["(a column of units: mm, deg)"]);
    assert!(has_note(
        &c,
        "",
        "a column of units (mm, deg) after the sizes' values was not read"
    ));
    // Degrees alone say nothing about lengths either.
    let text = "Size\tReach\tStack\tHead angle\nS\t430\t605\t66\t°\nM\t455\t615\t66\t°\n";
    let c = import_chart(text).unwrap();
    assert_eq!(c.unrecognised, ["(a column of units: deg)"]);
    assert_row(&c, "reach_mm", &[430.0, 455.0]);
}

#[test]
fn a_units_column_after_size_rows_never_forces_a_unit_the_numbers_do_not_fit() {
    // Each size row ends in "mm", but reach and stack are written in cm (41,0 cm is a reach;
    // 41 mm is none): the unit is the last value's (the BB drop, 35 mm), and for the others only
    // decides between units their numbers fit, so reach and stack are read as cm by their size.
    let text = "Size\tReach\tStack\tHead angle\tBB drop\nS\t41,0\t59,5\t66\t35\tmm\nM\t43,5\t60,5\t66\t35\tmm\nL\t46,0\t61,5\t66\t32\tmm\n";
    let c = import_chart(text).unwrap();
    assert_eq!(labels(&c), ["S", "M", "L"]);
    assert_row(&c, "reach_mm", &[410.0, 435.0, 460.0]);
    assert_row(&c, "stack_mm", &[595.0, 605.0, 615.0]);
    assert_row(&c, "bb_drop_mm", &[35.0, 35.0, 32.0]);
}

#[test]
fn a_units_column_title_on_the_right_is_no_size() {
    let text = "Size\tS\tM\tL\tUnit\nReach\t43\t45,5\t48\tcm\nStack\t60,5\t61,5\t62,5\tcm\nHead angle\t65\t65\t65\t°\n";
    let c = import_chart(text).unwrap();
    assert_eq!(labels(&c), ["S", "M", "L"]);
    assert_row(&c, "reach_mm", &[430.0, 455.0, 480.0]);
    assert_row(&c, "stack_mm", &[605.0, 615.0, 625.0]);
    assert_row(&c, "head_angle_deg", &[65.0; 3]);
    assert_units_given(&c);
    // The same with sizes as rows: the title heads the units after each size's values.
    let text = "Size\tReach\tStack\tHead angle\tUnit\nS\t43\t60,5\t66\tcm\nM\t45,5\t61,5\t66\tcm\n";
    let c = import_chart(text).unwrap();
    assert_eq!(labels(&c), ["S", "M"]);
    assert!(c.unrecognised.is_empty(), "{:?}", c.unrecognised);
    assert_row(&c, "reach_mm", &[430.0, 455.0]);
    assert_row(&c, "stack_mm", &[605.0, 615.0]);
}

// Aligned text (runs of spaces) that writes one space between two cells.

#[test]
fn a_wheel_row_with_one_space_between_cells_keeps_each_size_s_wheel() {
    let c = chart("23_pdf_aligned_wheel_row_single_spaces.txt");
    assert_eq!(labels(&c), ["S", "M", "L", "XL"]);
    let w = |f: &str, r: &str| (f.to_string(), r.to_string());
    assert_eq!(
        wheels(&c),
        [
            w("27.5x2.4", "27.5x2.4"),
            // "27.5" / 29"": front and rear.
            w("27.5x2.4", "29x2.4"),
            w("29x2.4", "29x2.4"),
            w("29x2.4", "29x2.4"),
        ]
    );
    assert!(
        !has_note(&c, "Wheel size", "not recognised"),
        "{:#?}",
        c.notes
    );
    assert_row(&c, "reach_mm", &[430.0, 455.0, 480.0, 505.0]);
    assert_row(&c, "head_angle_deg", &[64.5; 4]);
    assert_row(&c, "wheelbase_mm", &[1190.0, 1218.0, 1246.0, 1275.0]);
}

#[test]
fn a_wheel_row_of_single_spaces_only_is_cut_at_the_columns() {
    let c = chart("24_pdf_aligned_road_wheels_single_spaces.txt");
    assert_eq!(labels(&c), ["49", "52", "54", "56", "58"]);
    let w = |d: &str| (d.to_string(), d.to_string());
    assert_eq!(
        wheels(&c),
        [
            w("700x28c"),
            w("700x28c"),
            w("700x32c"),
            w("700x32c"),
            w("700x32c")
        ]
    );
    // A width in the cell: nothing assumed.
    assert!(
        !has_note(&c, "Wheels", "common stock width"),
        "{:#?}",
        c.notes
    );
    assert!(
        !has_note(&c, "", "ignored a line of text"),
        "{:#?}",
        c.notes
    );
    assert_row(&c, "reach_mm", &[372.0, 380.0, 387.0, 395.0, 402.0]);
    assert_row(&c, "head_angle_deg", &[71.0, 72.0, 72.5, 73.0, 73.0]);
    assert_row(&c, "chainstay_mm", &[415.0, 415.0, 415.0, 418.0, 418.0]);
    assert_row(&c, "wheelbase_mm", &[975.0, 982.0, 991.0, 1001.0, 1012.0]);
}

// A table aligned with runs of spaces whose lines do not all start alike (fixtures 25–27).

#[test]
fn size_rows_led_by_a_wheel_column_keep_their_values_under_their_labels() {
    // The wheel column comes first and holds numbers (27.5", 29"); the M row is written with
    // single spaces and the L row has a blank stack.
    let c = chart("25_pdf_aligned_wheel_column_first_single_spaces.txt");
    assert_eq!(labels(&c), ["S", "M", "L", "XL"]);
    assert!(c.unrecognised.is_empty(), "{:?}", c.unrecognised);
    assert_row(&c, "reach_mm", &[425.0, 450.0, 475.0, 500.0]);
    assert_row(&c, "stack_mm", &[600.0, 610.0, f64::NAN, 630.0]);
    assert_row(&c, "head_angle_deg", &[65.0, 65.0, 64.5, 64.5]);
    assert_row(&c, "seat_angle_effective_deg", &[77.0, 77.0, 77.5, 77.5]);
    assert_row(&c, "chainstay_mm", &[430.0, 435.0, 440.0, 445.0]);
    assert_row(&c, "wheelbase_mm", &[1180.0, 1205.0, 1230.0, 1255.0]);
    let w275 = ("27.5x2.4".to_string(), "27.5x2.4".to_string());
    let w29 = ("29x2.4".to_string(), "29x2.4".to_string());
    assert_eq!(wheels(&c), [w275.clone(), w275, w29.clone(), w29]);
    // The blank stack of L is placed, not asked about, and no value was refused.
    assert!(c.questions.is_empty(), "{:?}", c.questions);
    assert!(
        !c.notes.iter().any(|n| n.message.contains("left out")),
        "{:#?}",
        c.notes
    );
}

#[test]
fn a_wheel_named_in_words_among_numbers_keeps_its_size_s_values() {
    // "MX" is no number, where the other sizes' wheels are: it is the M row's wheel cell, not
    // part of its label, so M's values stay under their labels.
    let c = chart("26_pdf_aligned_wheel_name_among_numbers.txt");
    assert_eq!(labels(&c), ["S", "M", "L", "XL"]);
    assert!(c.unrecognised.is_empty(), "{:?}", c.unrecognised);
    assert_row(&c, "reach_mm", &[415.0, 440.0, 465.0, 490.0]);
    assert_row(&c, "stack_mm", &[595.0, 605.0, f64::NAN, 625.0]);
    assert_row(&c, "head_angle_deg", &[65.5, 65.5, 65.0, 65.0]);
    assert_row(&c, "chainstay_mm", &[430.0, 435.0, 440.0, 445.0]);
    // XL's wheelbase is a trailing blank: read from the left and said.
    assert_row(&c, "wheelbase_mm", &[1170.0, 1195.0, 1221.0, f64::NAN]);
    assert!(has_note(
        &c,
        "XL",
        "5 values for 6 measurements; read from the left"
    ));
    let w = |f: &str, r: &str| (f.to_string(), r.to_string());
    assert_eq!(
        wheels(&c),
        [
            w("27.5x2.4", "27.5x2.4"),
            w("29x2.4", "27.5x2.4"),
            w("29x2.4", "29x2.4"),
            w("29x2.4", "29x2.4")
        ]
    );
    assert!(c.questions.is_empty(), "{:?}", c.questions);
    assert!(
        !c.notes.iter().any(|n| n.message.contains("left out")),
        "{:#?}",
        c.notes
    );
}

#[test]
fn aligned_rows_ending_in_a_units_cell_keep_blank_cells_in_place() {
    let c = chart("27_pdf_aligned_units_column_on_the_right_blank_cells.txt");
    assert_eq!(labels(&c), ["S", "M", "L", "XL"]);
    assert!(c.unrecognised.is_empty(), "{:?}", c.unrecognised);
    assert_row(&c, "reach_mm", &[428.0, 452.0, 476.0, 500.0]);
    // Blank under M, S and XL: each value stays under its own size.
    assert_row(&c, "stack_mm", &[604.0, f64::NAN, 624.0, 634.0]);
    assert_row(&c, "chainstay_mm", &[f64::NAN, 436.0, 438.0, 440.0]);
    assert_row(&c, "wheelbase_mm", &[1182.0, 1206.0, 1230.0, f64::NAN]);
    assert_row(&c, "bb_drop_mm", &[30.0, 30.0, 35.0, 35.0]);
    assert_row(&c, "head_angle_deg", &[65.5, 65.5, 65.0, 65.0]);
    assert_row(&c, "seat_angle_effective_deg", &[77.0, 77.0, 77.5, 77.5]);
    assert!(has_note(&c, "", "units column on the right"));
    // Nothing is asked: the blanks kept their places.
    assert!(c.questions.is_empty(), "{:?}", c.questions);
    assert!(
        !has_note(&c, "Wheelbase", "read from the left"),
        "{:#?}",
        c.notes
    );
}

#[test]
fn a_single_spaced_units_row_under_size_rows_gives_each_column_its_unit() {
    let c = chart("28_single_spaces_units_row_under_labels.txt");
    assert_eq!(labels(&c), ["S", "M", "L"]);
    assert!(c.unrecognised.is_empty(), "{:?}", c.unrecognised);
    // cm × 10, mm as written; 3,5 fits mm or cm by its size alone: the units row says cm.
    assert_row(&c, "reach_mm", &[425.0, 450.0, 475.0]);
    assert_row(&c, "stack_mm", &[600.0, 610.0, 620.0]);
    assert_row(&c, "head_angle_deg", &[65.0, 65.0, 64.5]);
    assert_row(&c, "chainstay_mm", &[430.0, 435.0, 440.0]);
    assert_row(&c, "bb_drop_mm", &[35.0, 35.0, 30.0]);
    assert!(
        has_note(&c, "", "units row under the labels"),
        "{:#?}",
        c.notes
    );
    assert!(
        !has_note(&c, "", "ignored a line of text"),
        "{:#?}",
        c.notes
    );
    assert_units_given(&c);
    // One unit short of the columns (the wheel column has none): which columns the units
    // belong to is not known, so the row is not read as one; the notes say what was done.
    let text = "Size Wheel Reach Stack Head angle\ncm cm deg\nS 27.5\" 42,5 60,0 65\nM 29\" 45,0 61,0 65\n";
    let c = import_chart(text).unwrap();
    assert!(!has_note(&c, "", "units row"), "{:#?}", c.notes);
    assert!(has_note(&c, "", "as \"cm cm deg\" says"), "{:#?}", c.notes);
    assert_row(&c, "reach_mm", &[425.0, 450.0]);
}

#[test]
fn a_ragged_wheel_row_is_cut_one_per_size_or_said_never_copied_to_all() {
    // The wheel row's words stand under no column, so the columns cannot cut it: read as the
    // label "Wheel size 27.5" 27.5" 27.5" /" and two cells, it gave XS and S a 29" wheel.
    let c = chart("29_pdf_aligned_ragged_wheel_row.txt");
    assert_eq!(labels(&c), ["XS", "S", "M", "L"]);
    let w = |f: &str, r: &str| (f.to_string(), r.to_string());
    assert_eq!(
        wheels(&c),
        [
            w("27.5x2.4", "27.5x2.4"),
            w("27.5x2.4", "27.5x2.4"),
            w("27.5x2.4", "29x2.4"),
            w("29x2.4", "29x2.4")
        ]
    );
    assert!(has_note(
        &c,
        "Wheel size",
        "the wheel sizes were parted by single spaces; read one per size, from the left"
    ));
    assert_row(&c, "reach_mm", &[405.0, 425.0, 445.0, 465.0]);
    assert_row(&c, "head_angle_deg", &[65.0, 65.0, 64.5, 64.5]);
    // Read as one cell ("29"") this row gave every size a 29" wheel, without a word.
    let text =
        "Size   S      M      L\nReach  430    455    480\nWheel size 29\" 29\" 27.5\" / 29\"\n";
    let c = import_chart(text).unwrap();
    assert_eq!(
        wheels(&c),
        [
            w("29x2.4", "29x2.4"),
            w("29x2.4", "29x2.4"),
            w("27.5x2.4", "29x2.4")
        ]
    );
    // Three wheels for four sizes: which size each is for is not known, so none is used.
    let text =
        "Size S M L XL\nWheel 650b 700c 700c\nReach 430 455 480 505\nStack 610 620 630 640\n";
    let c = import_chart(text).unwrap();
    let none = (String::new(), String::new());
    assert_eq!(wheels(&c), [none.clone(), none.clone(), none.clone(), none]);
    assert!(has_note(
        &c,
        "Wheel",
        "3 wheel sizes parted by single spaces for 4 sizes: which size each belongs to is not known, so none was used; set the wheels under Wheels and fork"
    ));
    assert!(
        !has_note(&c, "", "ignored a line of text"),
        "{:#?}",
        c.notes
    );
    assert_row(&c, "reach_mm", &[430.0, 455.0, 480.0, 505.0]);
}

#[test]
fn a_seat_tube_measured_centre_to_centre_is_listed_not_read() {
    // The seat tube length here runs from the BB centre to the top of the seat tube (DESIGN.md
    // §5); a centre-to-centre length stops at the top tube's centre, shorter. With both rows the
    // centre-to-top one is the seat tube, whichever comes first; the other is listed as not
    // recognised, with a note saying why.
    let c = chart("30_road_rows_seat_tube_c_c_and_c_t.txt");
    assert_eq!(labels(&c), ["S", "M", "L"]);
    assert_row(&c, "seat_tube_mm", &[420.0, 460.0, 500.0]);
    assert_row(&c, "reach_mm", &[380.0, 390.0, 400.0]);
    assert_eq!(c.unrecognised, ["Seat tube (c-c)"]);
    assert!(has_note(&c, "Seat tube (c-c)", "measured centre to centre"));
    assert!(
        !c.notes.iter().any(|n| n.message.contains("second row")),
        "{:#?}",
        c.notes
    );
    // Alone, it gives no seat tube length at all rather than a wrong one.
    let alone =
        import_chart("Size\tS\tM\nSeat tube, centre to centre\t400\t440\nReach\t380\t390\n")
            .unwrap();
    assert_row(&alone, "seat_tube_mm", &[f64::NAN, f64::NAN]);
    assert_eq!(alone.unrecognised, ["Seat tube, centre to centre"]);
}
