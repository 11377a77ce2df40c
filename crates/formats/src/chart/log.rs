//! What the importer tells the person: notes, questions (with answers given back by id) and
//! the labels of rows it does not read.

use super::{Answers, Note, Question};

/// Notes, questions and unrecognised rows, collected while reading.
pub struct Log<'a> {
    answers: &'a Answers,
    /// Notes so far.
    pub notes: Vec<Note>,
    /// Questions so far (one per id).
    pub questions: Vec<Question>,
    /// Labels of rows not read.
    pub unrecognised: Vec<String>,
    /// The topic of each note said once for several rows, with its index in `notes`.
    shared: Vec<(String, usize)>,
}

impl<'a> Log<'a> {
    /// An empty log that answers questions from `answers`.
    pub fn new(answers: &'a Answers) -> Self {
        Self {
            answers,
            notes: Vec::new(),
            questions: Vec::new(),
            unrecognised: Vec::new(),
            shared: Vec::new(),
        }
    }

    /// Records a note about `row` (empty for the whole chart).
    pub fn note(&mut self, row: &str, message: String) {
        self.notes.push(Note {
            row: row.to_string(),
            rows: Vec::new(),
            message,
        });
    }

    /// Records `row` in the one note said for every row of `topic`, so a chart of twelve rows
    /// read alike says it once. The note stands where its first row's note would have stood;
    /// its `row` is empty, its `rows` lists the rows in the order given, and its message is
    /// `message(rows)`, written again as each row joins.
    pub fn note_rows(&mut self, topic: &str, row: &str, message: impl FnOnce(&[String]) -> String) {
        let known = self
            .shared
            .iter()
            .find(|(t, _)| t == topic)
            .and_then(|(_, i)| self.notes.get_mut(*i));
        if let Some(note) = known {
            if !note.rows.iter().any(|r| r == row) {
                note.rows.push(row.to_string());
            }
            note.message = message(&note.rows);
            return;
        }
        let rows = vec![row.to_string()];
        self.shared.push((topic.to_string(), self.notes.len()));
        self.notes.push(Note {
            row: String::new(),
            message: message(&rows),
            rows,
        });
    }

    /// Asks a question; returns the answer given for its id, else `default`. `message` says
    /// what is unclear and what was done, given the option used (so an answered question says
    /// the answer, not the default).
    pub fn ask(
        &mut self,
        row: &str,
        topic: &str,
        message: impl FnOnce(&str) -> String,
        options: &[&str],
        default: &str,
    ) -> String {
        let id = format!("{row}#{topic}");
        let chosen = self
            .answers
            .get(&id)
            .filter(|a| options.contains(&a.as_str()))
            .cloned()
            .unwrap_or_else(|| default.to_string());
        if !self.questions.iter().any(|q| q.id == id) {
            self.questions.push(Question {
                id,
                row: row.to_string(),
                message: message(&chosen),
                options: options.iter().map(|o| (*o).to_string()).collect(),
                chosen: chosen.clone(),
            });
        }
        chosen
    }
}

/// Shortens text for a note.
pub fn shorten(text: &str) -> String {
    let mut s: String = text.chars().take(60).collect();
    if text.chars().count() > 60 {
        s.push('…');
    }
    s
}
