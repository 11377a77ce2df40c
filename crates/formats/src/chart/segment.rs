//! A header of labels copied with single spaces ("Size Reach Stack Head angle STA") has lost
//! its cell boundaries. The data rows say how many cells it must have; this finds a split of
//! its words into exactly that many labels, each of which names a measurement with no foreign
//! word in it (the first may be the size column's "Size"). Among several such splits the one
//! with the longest first labels wins.

use super::label::{classify, is_tight, Kind};
use std::collections::HashSet;

/// Most words in one label.
const MAX_WORDS: usize = 6;
/// Longest header (in words) this tries to split.
const MAX_HEADER_WORDS: usize = 80;

/// Splits `text` into `cells` labels, or `None` when no such split exists.
pub fn split_header(text: &str, cells: usize) -> Option<Vec<String>> {
    let words: Vec<&str> = text.split_whitespace().collect();
    if cells < 2 || words.len() < cells || words.len() > MAX_HEADER_WORDS {
        return None;
    }
    // The first cell names the size column ("Size", "Frame size") or is itself a label.
    let mut failed = HashSet::new();
    for first_len in (1..=MAX_WORDS.min(words.len())).rev() {
        let first = words.get(..first_len)?.join(" ");
        let kind = classify(&first).kind;
        if kind == Kind::Size || is_tight(&first) {
            if let Some(mut rest) = labels(&words, first_len, cells - 1, &mut failed) {
                rest.insert(0, first);
                return Some(rest);
            }
        }
    }
    None
}

/// Exactly `n` measurement labels covering `words[at..]`, longest first labels preferred.
/// `failed` remembers the (position, count) pairs with no split, so the search stays small.
fn labels(
    words: &[&str],
    at: usize,
    n: usize,
    failed: &mut HashSet<(usize, usize)>,
) -> Option<Vec<String>> {
    let left = words.len().saturating_sub(at);
    if n == 0 {
        return (left == 0).then(Vec::new);
    }
    if left < n || failed.contains(&(at, n)) {
        return None;
    }
    for len in (1..=MAX_WORDS.min(left)).rev() {
        let label = words.get(at..at + len)?.join(" ");
        if !is_tight(&label) {
            continue;
        }
        if let Some(mut rest) = labels(words, at + len, n - 1, failed) {
            rest.insert(0, label);
            return Some(rest);
        }
    }
    failed.insert((at, n));
    None
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn splits_a_single_spaced_header_into_the_needed_labels() {
        let got = split_header("Size Reach Stack Head angle Seat tube angle Fork offset", 6);
        assert_eq!(
            got.unwrap(),
            [
                "Size",
                "Reach",
                "Stack",
                "Head angle",
                "Seat tube angle",
                "Fork offset"
            ]
        );
        let got = split_header("Frame size Wheel size Top tube (eff.) BB drop", 4);
        assert_eq!(
            got.unwrap(),
            ["Frame size", "Wheel size", "Top tube (eff.)", "BB drop"]
        );
        assert_eq!(split_header("Size Reach Stack", 4), None);
        assert_eq!(split_header("Geometry of the frame", 2), None);
        // Many words that combine in many ways: the search stays small and finds no split.
        let long = "Head tube angle ".repeat(26);
        assert_eq!(split_header(&long, 30), None);
    }
}
