//! Hostile input for the chart importer: random text, binary junk, very long lines, unicode,
//! and tables built from real fragments in random order. It must never panic, never produce a
//! NaN or infinity, always return JSON that parses, and only choose offered answers.

// Helpers outside `#[test]` functions may stop loudly too (clippy.toml allows it in tests).
#![allow(
    clippy::panic,
    clippy::expect_used,
    clippy::unwrap_used,
    clippy::indexing_slicing
)]

use framewise_formats::chart::{chart_to_json, import_chart, ChartImport};
use proptest::prelude::*;

fn check(text: &str) {
    let result = import_chart(text);
    if let Ok(c) = &result {
        check_import(c);
    }
    let json = chart_to_json(&result);
    let v: serde_json::Value = serde_json::from_str(&json).expect("valid JSON");
    assert!(v["sizes"].is_array(), "{json}");
}

fn check_import(c: &ChartImport) {
    assert!(!c.sizes.is_empty());
    for s in &c.sizes {
        for (k, v) in &s.frame {
            assert!(v.is_finite(), "{k} = {v}");
            let m = framewise_kernel::lookup(k).expect("a catalogue key");
            assert!((m.hard.0..=m.hard.1).contains(v), "{k} = {v}");
        }
        for w in [&s.wheels.front, &s.wheels.rear].into_iter().flatten() {
            assert!(w.resolve("w").is_ok(), "{w:?}");
        }
    }
    for q in &c.questions {
        assert!(q.options.contains(&q.chosen), "{q:?}");
    }
}

const FRAGMENTS: &[&str] = &[
    "Reach",
    "REACH (mm)",
    "Stack",
    "HTA",
    "Head angle",
    "Eff. STA",
    "Seat tube angle",
    "ETT",
    "Top tube",
    "CS",
    "WB",
    "BB drop",
    "BB height",
    "Rake",
    "A2C",
    "Standover",
    "Trail",
    "Wheel size",
    "Size",
    "S",
    "M",
    "L",
    "XL",
    "S3",
    "52 cm",
    "15\"",
    "470",
    "470-475",
    "65/64.5",
    "64,5°",
    "18.5\"",
    "47,0",
    "1,180",
    "1.180",
    "-",
    "n/a",
    "*",
    "¹",
    "(1)",
    "[a]",
    "mm",
    "cm",
    "in",
    "deg",
    "°",
    "29\"",
    "27.5",
    "MX",
    "700c",
    "0",
    "-0",
    "1e308",
    "99999999999",
    "NaN",
    "inf",
    "\u{0}",
    "\u{feff}",
    "\u{202e}",
    "€",
    "𝔘",
    "\"",
    "\"\"",
    "#",
    "|",
    "---",
];

fn fragment_table() -> impl Strategy<Value = String> {
    let cell = prop::sample::select(FRAGMENTS);
    let sep = prop::sample::select(&["\t", ",", ";", " | ", "   ", " ", ""][..]);
    let line = (prop::collection::vec(cell, 0..8), sep).prop_map(|(cells, sep)| cells.join(sep));
    prop::collection::vec(line, 0..12).prop_map(|lines| lines.join("\n"))
}

proptest! {
    #![proptest_config(ProptestConfig::with_cases(400))]

    #[test]
    fn random_unicode_never_panics(text in "\\PC{0,400}") {
        check(&text);
    }

    #[test]
    fn random_bytes_never_panic(bytes in prop::collection::vec(any::<u8>(), 0..600)) {
        check(&String::from_utf8_lossy(&bytes));
    }

    #[test]
    fn tables_of_real_fragments_never_panic(text in fragment_table()) {
        check(&text);
    }

    #[test]
    fn numbers_of_any_size_stay_finite(
        values in prop::collection::vec(any::<f64>(), 1..6),
        sep in prop::sample::select(&["\t", ";", ","][..]),
    ) {
        let cells: Vec<String> = values.iter().map(|v| format!("{v}")).collect();
        let header: Vec<String> = (0..values.len()).map(|i| format!("S{i}")).collect();
        let text = format!(
            "Size{sep}{}\nReach{sep}{}\nHead angle{sep}{}\nBB drop{sep}{}",
            header.join(sep), cells.join(sep), cells.join(sep), cells.join(sep)
        );
        check(&text);
    }
}

#[test]
fn very_long_lines_and_many_cells() {
    check(&"9".repeat(200_000));
    check(&format!("Reach {}", "4".repeat(250_000)));
    check(&format!(
        "Size\t{}\nReach\t{}",
        "M\t".repeat(5_000),
        "470\t".repeat(5_000)
    ));
    check(&format!(
        "Size {}\nReach {}",
        "S ".repeat(30_000),
        "1 ".repeat(30_000)
    ));
    // Aligned text (runs of spaces) of many cells: its columns are not read (too many sizes),
    // and the lines of a chart's width are read in one pass each.
    check(&format!("Reach  {}", "12  ".repeat(60_000)));
    let rows = format!("Reach  {}\n", "1  ".repeat(200)).repeat(300);
    check(&format!("Size  {}\n{rows}", "M  ".repeat(200)));
    check(
        &(0..400)
            .map(|i| {
                format!(
                    "L{i}  {}{}\n",
                    " ".repeat(i * 3 % 500),
                    "1 2 x  ".repeat(60)
                )
            })
            .collect::<String>(),
    );
    check(&"Reach\t470\n".repeat(20_000));
    check(&"(".repeat(50_000));
    check(&"[[[[((((1)))]]]]".repeat(5_000));
    check(&"\u{0}\u{1}\u{7f}\u{ffff}".repeat(10_000));
    check(&"Reach 4\u{0301}70 ¹²³ 𝟒𝟕𝟎\nStack ٤٧٠ 470".repeat(100));
    // Headers of many label words and wide data rows: the header split must stay small.
    let header = "Head tube angle ".repeat(20);
    let data = format!("S {}\n", "65 ".repeat(40)).repeat(300);
    check(&format!("{}\n{data}", [header.as_str(); 8].join("\n")));
}
