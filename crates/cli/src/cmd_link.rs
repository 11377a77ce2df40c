//! `framewise link FILE|-` and `framewise open LINK` (DESIGN.md §8, §9): the same codec as the page.

use framewise_formats::{decode_link, encode_link, scenario_from_json};

/// The link fragment, with its leading `#`, of the scenario JSON text.
///
/// # Errors
/// The scenario does not read, or a value cannot go in a link: the message says which.
pub fn link(scenario_json: &str) -> Result<String, String> {
    let scenario = scenario_from_json(scenario_json).map_err(|e| e.to_string())?;
    encode_link(&scenario)
        .map(|frag| format!("#{frag}"))
        .map_err(|e| format!("cannot make a link: {e}"))
}

/// The scenario JSON (pretty) of a link: a fragment with or without `#`, or a whole URL.
///
/// # Errors
/// The link's problem in plain words.
pub fn open(link: &str) -> Result<String, String> {
    let scenario = decode_link(link).map_err(|e| format!("cannot open the link: {e}"))?;
    serde_json::to_string_pretty(&scenario).map_err(|e| e.to_string())
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn link_then_open_gives_the_scenario_back() {
        let json = std::fs::read_to_string(concat!(
            env!("CARGO_MANIFEST_DIR"),
            "/../../tests/links/v1-one-bike.json"
        ))
        .unwrap();
        let golden = std::fs::read_to_string(concat!(
            env!("CARGO_MANIFEST_DIR"),
            "/../../tests/links/v1-one-bike.txt"
        ))
        .unwrap();
        let frag = link(&json).unwrap();
        assert_eq!(frag, golden.trim());
        let url = format!("http://127.0.0.1:8080/{frag}");
        let back = scenario_from_json(&open(&url).unwrap()).unwrap();
        let want = scenario_from_json(&json).unwrap();
        assert_eq!(back, want);
        assert!(open("#@@")
            .unwrap_err()
            .starts_with("cannot open the link: the link is damaged"));
    }
}
