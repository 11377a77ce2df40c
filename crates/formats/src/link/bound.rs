//! The information bound: the fewest bits any code could use for the same fields at the same
//! resolution, if every value were equally likely within its usual range.
//!
//! Per group: `log2 C(n, k)` bits say which k of its n fields are present. Per number:
//! `log2((hi − lo)·denom + 1)`, the count of steps in the field's usual range (table `range`).
//! Per choice: `log2(words)`; per flag: 1; per wheel: `log2 32` for a common designation;
//! per text: `log2(81)` for its length plus `log2 63` per character of the alphabet or 8 per
//! UTF-8 byte otherwise; a published tolerance: 1 bit plus its steps. The version and check bytes
//! are not counted (they are overhead, reported apart in docs/LINKS.md).

use super::table::{Group, Kind, Num, SCENARIO};
use super::LinkError;
use framewise_kernel::Scenario;
use serde_json::{Map, Value};

/// Information bound, in bits, for the fields present in `scenario`.
///
/// # Errors
/// As [`super::encode_link`] for a field the table does not list.
pub fn information_bound_bits(scenario: &Scenario) -> Result<f64, LinkError> {
    let value = serde_json::to_value(scenario).map_err(|e| LinkError::NotCovered {
        path: e.to_string(),
    })?;
    let mut obj = value.as_object().cloned().unwrap_or_default();
    obj.remove("version");
    Ok(group_bits(&SCENARIO, &obj))
}

fn steps(num: &Num) -> f64 {
    ((num.range.1 - num.range.0) * f64::from(num.denom) + 1.0).log2()
}

fn log2_choose(n: usize, k: usize) -> f64 {
    (0..k)
        .map(|i| ((n - i) as f64 / (i + 1) as f64).log2())
        .sum()
}

fn text_bits(s: &str) -> f64 {
    let alphabet = "abcdefghijklmnopqrstuvwxyz0123456789 .,-ABCDEFGHIJKLMNOPRSTUVWX";
    let chars: f64 = super::link_text(s)
        .chars()
        .map(|c| {
            if alphabet.contains(c) {
                63f64.log2()
            } else {
                8.0 * c.len_utf8() as f64
            }
        })
        .sum();
    81f64.log2() + chars
}

fn group_bits(group: &Group, obj: &Map<String, Value>) -> f64 {
    let present: Vec<_> = group
        .fields
        .iter()
        .filter_map(|f| {
            obj.get(f.key)
                .filter(|v| !(f.empty_is_absent && is_empty(v)))
                .map(|v| (f, v))
        })
        .collect();
    let mask = log2_choose(group.fields.len(), present.len());
    mask + present
        .iter()
        .map(|(f, v)| value_bits(&f.kind, v))
        .sum::<f64>()
}

fn is_empty(v: &Value) -> bool {
    match v {
        Value::String(s) => s.trim().is_empty(),
        Value::Object(m) => m.is_empty(),
        Value::Array(a) => a.is_empty(),
        _ => false,
    }
}

fn value_bits(kind: &Kind, v: &Value) -> f64 {
    match kind {
        Kind::Num(num) => steps(num),
        Kind::Count { max, .. } => (f64::from(*max) + 1.0).log2(),
        Kind::Bool => 1.0,
        Kind::Choice(words) => (words.len() as f64).log2(),
        Kind::Text => text_bits(v.as_str().unwrap_or_default()),
        Kind::Wheel => match v.as_str() {
            Some(s) if s.contains('-') => 7.0 + 9.0,
            Some(_) => 32f64.log2(),
            None => steps(&super::table::DIAMETER),
        },
        Kind::Published(num, tol) => {
            steps(num) + v.get("tolerance").map_or(0.0, |_| 1.0 + steps(tol))
        }
        Kind::Group(g) => group_bits(g, v.as_object().unwrap_or(&Map::new())),
        Kind::List(g) => {
            let items = v.as_array().map(Vec::as_slice).unwrap_or_default();
            (super::MAX_BIKES as f64).log2()
                + items
                    .iter()
                    .map(|i| group_bits(g, i.as_object().unwrap_or(&Map::new())))
                    .sum::<f64>()
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn choose_is_exact_for_small_numbers() {
        // C(5, 2) = 10, C(30, 0) = 1.
        assert!((log2_choose(5, 2) - 10f64.log2()).abs() < 1e-12);
        assert_eq!(log2_choose(30, 0), 0.0);
    }
}
