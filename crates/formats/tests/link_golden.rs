//! Golden vectors: every `tests/links/v1-*.txt` fragment must decode, forever, to the scenario in
//! the `.json` file beside it (written by hand, not by the codec). While the writer's version is
//! 1 it must also produce the same fragment byte for byte. Refresh the fragments only with
//! `UPDATE_LINKS=1 cargo test -p framewise-formats --test link_golden` and say why in the commit.
// Test helpers outside #[test] functions may unwrap, index and panic too (clippy.toml).
#![allow(
    clippy::unwrap_used,
    clippy::expect_used,
    clippy::panic,
    clippy::indexing_slicing
)]

use framewise_formats::{decode_link, encode_link, LINK_VERSION};
use framewise_kernel::Scenario;
use std::path::PathBuf;

fn dir() -> PathBuf {
    PathBuf::from(env!("CARGO_MANIFEST_DIR")).join("../../tests/links")
}

fn cases() -> Vec<(String, Scenario, PathBuf)> {
    let mut out = Vec::new();
    for entry in std::fs::read_dir(dir()).unwrap() {
        let path = entry.unwrap().path();
        let name = path.file_name().unwrap().to_string_lossy().to_string();
        if name.starts_with("v1-") && name.ends_with(".json") {
            let text = std::fs::read_to_string(&path).unwrap();
            let s: Scenario = serde_json::from_str(&text).unwrap_or_else(|e| panic!("{name}: {e}"));
            out.push((name, s, path.with_extension("txt")));
        }
    }
    out.sort_by(|a, b| a.0.cmp(&b.0));
    out
}

#[test]
fn version_1_golden_links_decode_to_their_scenarios() {
    let cases = cases();
    assert!(cases.len() >= 5, "golden vectors missing: {}", cases.len());
    for (name, scenario, txt) in cases {
        if std::env::var_os("UPDATE_LINKS").is_some() && LINK_VERSION == 1 {
            std::fs::write(&txt, format!("#{}\n", encode_link(&scenario).unwrap())).unwrap();
        }
        let link = std::fs::read_to_string(&txt).unwrap_or_else(|e| panic!("{txt:?}: {e}"));
        let decoded = decode_link(&link).unwrap_or_else(|e| panic!("{name}: {e}"));
        assert_eq!(decoded, scenario, "{name}");
        if LINK_VERSION == 1 {
            assert_eq!(
                format!("#{}", encode_link(&scenario).unwrap()),
                link.trim(),
                "{name}"
            );
        }
    }
}
