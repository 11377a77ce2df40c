//! framewise formats: everything that turns text into a scenario and back.
//!
//! **Invariant:** no geometry here; parsing only. Errors name the field, the value and what is
//! allowed.
#![deny(missing_docs)]

pub mod chart;
pub mod fields;
pub mod form;
pub mod form_inverse;
pub mod form_units;
pub mod json;
pub mod link;
pub mod units;

pub use chart::{
    chart_to_json, import_chart, import_chart_with, Answers, ChartError, ChartImport, ChartSize,
};
pub use fields::{page_words, PageWords};
pub use form::scenario_from_form;
pub use form_inverse::{form_from_scenario, form_view, FormView};
pub use json::{report_to_json, scenario_from_json};
pub use link::{decode_link, encode_link, LinkError, LINK_VERSION};
pub use units::{parse_quantity, parse_quantity_step, Quantity, UnitError};

/// `map` with `(key, value)` inserted: for `fold`, to build a map from an iterator without
/// `collect`, which sorts a vector of the pairs first and so puts one more copy of the standard
/// library's stable sort in the page's module for each pair type collected.
pub(crate) fn inserted<K: Ord, V>(
    mut map: std::collections::BTreeMap<K, V>,
    (key, value): (K, V),
) -> std::collections::BTreeMap<K, V> {
    map.insert(key, value);
    map
}

#[cfg(test)]
mod tests {
    #[test]
    fn folding_with_inserted_is_collecting() {
        let pairs = [("b", 2), ("a", 1), ("c", 3), ("a", 4)];
        let folded = pairs.into_iter().fold(Default::default(), super::inserted);
        let collected: std::collections::BTreeMap<_, _> = pairs.into_iter().collect();
        assert_eq!(folded, collected);
        assert_eq!(
            folded.get("a"),
            Some(&4),
            "the last value of a key wins, as in collect"
        );
    }
}
