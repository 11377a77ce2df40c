//! A header of labels copied with single spaces ("Size Reach Stack Head angle STA") has lost
//! its cell boundaries. The data rows say how many cells it must have; this finds a split of
//! its words into exactly that many labels, each of which names a measurement with no foreign
//! word in it (the first may be the size column's "Size"). Among several such splits the one
//! with the longest first labels wins.

use super::cell::Mark;
use super::label::{classify, is_tight, Kind};
use std::collections::BTreeSet;

/// Most words in one label.
const MAX_WORDS: usize = 6;
/// Longest header (in words) this tries to split.
const MAX_HEADER_WORDS: usize = 60;

/// The search state: the words, which word runs are labels (worked out once), dead ends.
struct Search<'a> {
    words: Vec<&'a str>,
    /// `tight[at][len - 1]`: words `at..at + len` form one label.
    tight: Vec<[bool; MAX_WORDS]>,
    failed: BTreeSet<(usize, usize)>,
}

/// Splits `text` into `cells` labels, or `None` when no such split exists.
pub fn split_header(text: &str, cells: usize) -> Option<Vec<String>> {
    let words: Vec<&str> = text.split_whitespace().collect();
    if cells < 2 || words.len() < cells || words.len() > MAX_HEADER_WORDS {
        return None;
    }
    let tight = (0..words.len())
        .map(|at| {
            let mut row = [false; MAX_WORDS];
            for (i, slot) in row.iter_mut().enumerate() {
                *slot = words
                    .get(at..at + i + 1)
                    .is_some_and(|w| is_tight(&w.join(" ")));
            }
            row
        })
        .collect();
    let mut search = Search {
        words,
        tight,
        failed: BTreeSet::new(),
    };
    // The first cell names the size column ("Size", "Frame size") or is itself a label.
    for first_len in (1..=MAX_WORDS.min(search.words.len())).rev() {
        let first = search.words.get(..first_len)?.join(" ");
        if classify(&first).kind == Kind::Size || search.is_label(0, first_len) {
            if let Some(mut rest) = search.labels(first_len, cells - 1) {
                rest.insert(0, first);
                return Some(rest);
            }
        }
    }
    None
}

/// A units row copied with single spaces ("mm mm deg mm"), in a table of `cells` cells a row
/// with sizes as rows: one unit word per measurement column, the size column's cell blank.
/// `None` unless every word is a unit and there is exactly one per column after the first
/// (with fewer, which columns they belong to is not known).
pub fn split_units_row(text: &str, cells: usize) -> Option<Vec<String>> {
    let words: Vec<&str> = text.split_whitespace().collect();
    let units = words.len() >= 2
        && words.len() + 1 == cells
        && words.iter().all(|w| Mark::from_word(w).is_some());
    units.then(|| {
        std::iter::once(String::new())
            .chain(words.iter().map(|w| (*w).to_string()))
            .collect()
    })
}

impl Search<'_> {
    fn is_label(&self, at: usize, len: usize) -> bool {
        self.tight
            .get(at)
            .and_then(|row| row.get(len.wrapping_sub(1)))
            .copied()
            .unwrap_or(false)
    }

    /// Exactly `n` labels covering the words from `at`, longest first labels preferred.
    fn labels(&mut self, at: usize, n: usize) -> Option<Vec<String>> {
        let left = self.words.len().saturating_sub(at);
        if n == 0 {
            return (left == 0).then(Vec::new);
        }
        if left < n || self.failed.contains(&(at, n)) {
            return None;
        }
        for len in (1..=MAX_WORDS.min(left)).rev() {
            if !self.is_label(at, len) {
                continue;
            }
            if let Some(mut rest) = self.labels(at + len, n - 1) {
                rest.insert(0, self.words.get(at..at + len)?.join(" "));
                return Some(rest);
            }
        }
        self.failed.insert((at, n));
        None
    }
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
        let long = "Head tube angle ".repeat(20);
        assert_eq!(split_header(&long, 30), None);
    }

    #[test]
    fn a_single_spaced_units_row_is_split_when_it_has_one_unit_per_column() {
        assert_eq!(
            split_units_row("cm cm deg mm", 5).unwrap(),
            ["", "cm", "cm", "deg", "mm"]
        );
        // One unit short: which column has none is not known.
        assert_eq!(split_units_row("cm cm deg", 5), None);
        assert_eq!(split_units_row("All values in mm", 5), None);
        assert_eq!(split_units_row("mm", 2), None);
    }
}
