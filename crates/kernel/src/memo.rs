//! A memo of the last frame solves, for callers that evaluate one scenario after another (the
//! page evaluates on every keystroke). Most edits change the setup, the rider or the changes, not
//! the published frame numbers or the stock wheels, so the solve, the largest part of an
//! evaluation, can be reused. The kernel holds no state: the caller owns the memo and passes it
//! to [`evaluate_with`](crate::evaluate::evaluate_with).
//!
//! **Invariant:** a memo changes only the time an evaluation takes, never its report: the solve
//! is a pure function of the published values, their tolerances, the stock tyre radii, the front tyre's width, the seat
//! angle reference height and the field path, and the key holds all of them compared bit for bit.

use crate::error::FieldError;
use crate::solve::{solve, Given, Solution, SolveInput};
use std::collections::BTreeMap;

/// How many solves a memo keeps (one per bike of a small scenario).
pub const MEMO_SOLVES: usize = 4;

/// Everything the solve reads, as exact bits.
#[derive(Debug, Clone, PartialEq, Eq)]
struct Key {
    given: Vec<(String, u64, u64)>,
    radii: (u64, u64),
    front_width: Option<u64>,
    seat_ref: Option<u64>,
    prefix: String,
}

impl Key {
    fn new(given: &BTreeMap<String, Given>, input: &SolveInput<'_>) -> Key {
        Key {
            given: given
                .iter()
                .map(|(k, g)| (k.clone(), g.value.to_bits(), g.tolerance.to_bits()))
                .collect(),
            radii: (input.radii.front.to_bits(), input.radii.rear.to_bits()),
            front_width: input.front_tyre_width_mm.map(f64::to_bits),
            seat_ref: input.seat_ref.map(f64::to_bits),
            prefix: input.field_prefix.to_string(),
        }
    }
}

/// The last few solves, newest last.
#[derive(Debug, Clone, Default)]
pub struct SolveMemo {
    solves: Vec<(Key, Result<Solution, FieldError>)>,
}

impl SolveMemo {
    /// [`solve`], or the remembered result of the same inputs.
    ///
    /// # Errors
    /// As [`solve`].
    pub fn solve(
        &mut self,
        given: &BTreeMap<String, Given>,
        input: SolveInput<'_>,
    ) -> Result<Solution, FieldError> {
        let key = Key::new(given, &input);
        if let Some((_, found)) = self.solves.iter().find(|(k, _)| *k == key) {
            return found.clone();
        }
        let found = solve(given, input);
        if self.solves.len() >= MEMO_SOLVES {
            let _oldest = self.solves.remove(0);
        }
        self.solves.push((key, found.clone()));
        found
    }

    /// How many solves are remembered.
    pub fn len(&self) -> usize {
        self.solves.len()
    }

    /// Whether no solve is remembered.
    pub fn is_empty(&self) -> bool {
        self.solves.is_empty()
    }
}
