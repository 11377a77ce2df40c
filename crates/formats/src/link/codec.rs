//! The table walk: a scenario's JSON value ↔ bits, group by group (see [`super::table`]).
//!
//! A group is written as its presence mask (one bit per field the link version carries), then a
//! tolerance flag if the group holds published frame values, then each present value in order.

use super::bits::{BitReader, BitWriter};
use super::table::{Field, Group, Kind, Num};
use super::text::{read_text, read_wheel, write_text, write_wheel};
use super::LinkError;
use framewise_kernel::WheelSpec;
use serde_json::{Map, Value};

/// Most bikes in one link.
pub const MAX_BIKES: usize = 16;
/// Largest distance from a field's typical value, in steps (keeps codes below 2^40).
const MAX_STEPS: f64 = (1u64 << 38) as f64;

/// `value` as whole steps from the field's centre: `round(value·denom) − round(centre·denom)`.
pub(crate) fn quantise(value: f64, num: &Num, path: &str) -> Result<i64, LinkError> {
    if !value.is_finite() {
        return Err(LinkError::NotFinite { path: path.into() });
    }
    let d = f64::from(num.denom);
    let steps = (value * d).round() - (num.centre * d).round();
    if steps.abs() > MAX_STEPS {
        return Err(LinkError::OutOfRange {
            path: path.into(),
            value,
        });
    }
    Ok(steps as i64)
}

/// The number `q` steps from the centre: `(round(centre·denom) + q) / denom`, which is the double
/// nearest the decimal value (one correctly rounded division).
pub(crate) fn unquantise(q: i64, num: &Num) -> f64 {
    let d = f64::from(num.denom);
    ((num.centre * d).round() + q as f64) / d
}

fn join(path: &str, key: &str) -> String {
    if path.is_empty() {
        key.to_string()
    } else {
        format!("{path}.{key}")
    }
}

fn is_empty(v: &Value) -> bool {
    match v {
        Value::String(s) => s.trim().is_empty(),
        Value::Object(m) => m.is_empty(),
        Value::Array(a) => a.is_empty(),
        _ => false,
    }
}

fn present<'v>(field: &Field, obj: &'v Map<String, Value>) -> Option<&'v Value> {
    obj.get(field.key)
        .filter(|v| !(field.empty_is_absent && is_empty(v)))
}

/// Writes one group. Every key of `obj` must be in the table: a key that is not is an error, so
/// a field added to the scenario without a link slot cannot be lost silently.
pub(crate) fn write_group(
    w: &mut BitWriter,
    group: &Group,
    obj: &Map<String, Value>,
    path: &str,
) -> Result<(), LinkError> {
    if let Some(key) = obj
        .keys()
        .find(|k| !group.fields.iter().any(|f| f.key == *k))
    {
        return Err(LinkError::NotCovered {
            path: join(path, key),
        });
    }
    for field in group.fields {
        w.bit(present(field, obj).is_some());
    }
    let tolerances = group.fields.iter().any(|f| {
        matches!(f.kind, Kind::Published(..))
            && present(f, obj).is_some_and(|v| v.get("tolerance").is_some())
    });
    if group.has_published() {
        w.bit(tolerances);
    }
    for field in group.fields {
        if let Some(v) = present(field, obj) {
            write_value(w, field, v, &join(path, field.key), tolerances)?;
        }
    }
    Ok(())
}

fn wrong(path: &str, v: &Value) -> LinkError {
    LinkError::NotCovered {
        path: format!("{path} (value {v})"),
    }
}

fn write_value(
    w: &mut BitWriter,
    field: &Field,
    v: &Value,
    path: &str,
    tolerances: bool,
) -> Result<(), LinkError> {
    let number = |v: &Value| v.as_f64().ok_or(LinkError::NotFinite { path: path.into() });
    match field.kind {
        Kind::Num(num) => w.signed(quantise(number(v)?, &num, path)?, num.k),
        Kind::Count { k, .. } => w.golomb(v.as_u64().ok_or_else(|| wrong(path, v))?, k),
        Kind::Bool => w.bit(v.as_bool().ok_or_else(|| wrong(path, v))?),
        Kind::Choice(words) => {
            let s = v.as_str().ok_or_else(|| wrong(path, v))?;
            let width = choice_bits(words);
            match words.iter().position(|c| *c == s) {
                Some(i) => w.bits(i as u64, width),
                None => {
                    w.bits(words.len() as u64, width);
                    write_text(w, s);
                }
            }
        }
        Kind::Text => write_text(w, v.as_str().ok_or_else(|| wrong(path, v))?),
        Kind::Wheel => {
            let spec = match (v.as_str(), v.get("diameter_mm").and_then(Value::as_f64)) {
                (Some(text), _) => WheelSpec::Designation(text.to_string()),
                (None, Some(diameter_mm)) => WheelSpec::Diameter { diameter_mm },
                _ => return Err(wrong(path, v)),
            };
            write_wheel(w, &spec, path)?;
        }
        Kind::Published(num, tol) => {
            let (value, tolerance) = match v {
                Value::Object(m) => (m.get("value").unwrap_or(&Value::Null), m.get("tolerance")),
                _ => (v, None),
            };
            w.signed(quantise(number(value)?, &num, path)?, num.k);
            if tolerances {
                w.bit(tolerance.is_some());
                if let Some(t) = tolerance {
                    w.signed(quantise(number(t)?, &tol, path)?, tol.k);
                }
            }
        }
        Kind::Group(g) => write_group(w, g, v.as_object().ok_or_else(|| wrong(path, v))?, path)?,
        Kind::List(g) => {
            let items = v.as_array().ok_or_else(|| wrong(path, v))?;
            if items.len() > MAX_BIKES {
                return Err(LinkError::TooManyBikes {
                    count: items.len(),
                    max: MAX_BIKES,
                });
            }
            w.golomb(items.len() as u64 - 1, 0);
            for (i, item) in items.iter().enumerate() {
                let item_path = format!("{path}[{i}]");
                let obj = item.as_object().ok_or_else(|| wrong(&item_path, item))?;
                write_group(w, g, obj, &item_path)?;
            }
        }
    }
    Ok(())
}

/// Bits for a choice index: enough for every word plus the escape to text.
fn choice_bits(words: &[&str]) -> u32 {
    let n = words.len() as u64 + 1;
    64 - (n - 1).leading_zeros()
}

/// Reads a group written by [`write_group`] by a link of `version`.
pub(crate) fn read_group(
    r: &mut BitReader,
    group: &Group,
    version: u8,
) -> Result<Map<String, Value>, LinkError> {
    let fields: Vec<&Field> = group.fields_in(version).collect();
    let mut mask = Vec::with_capacity(fields.len());
    for _ in &fields {
        mask.push(r.bit()?);
    }
    let tolerances = group.has_published() && r.bit()?;
    let mut obj = Map::new();
    for (field, on) in fields.iter().zip(mask) {
        if on {
            obj.insert(
                field.key.to_string(),
                read_value(r, field, version, tolerances)?,
            );
        }
    }
    Ok(obj)
}

fn read_value(
    r: &mut BitReader,
    field: &Field,
    version: u8,
    tolerances: bool,
) -> Result<Value, LinkError> {
    Ok(match field.kind {
        Kind::Num(num) => Value::from(unquantise(r.signed(num.k)?, &num)),
        Kind::Count { k, .. } => Value::from(r.golomb(k)?),
        Kind::Bool => Value::Bool(r.bit()?),
        Kind::Choice(words) => {
            let i = r.bits(choice_bits(words))? as usize;
            match words.get(i) {
                Some(word) => Value::from(*word),
                None if i == words.len() => Value::from(read_text(r)?),
                None => return Err(LinkError::Garbled(format!("choice {i} of {}", field.key))),
            }
        }
        Kind::Text => Value::from(read_text(r)?),
        Kind::Wheel => match read_wheel(r)? {
            WheelSpec::Designation(text) => Value::from(text),
            WheelSpec::Diameter { diameter_mm } => {
                serde_json::json!({ "diameter_mm": diameter_mm })
            }
        },
        Kind::Published(num, tol) => {
            let value = Value::from(unquantise(r.signed(num.k)?, &num));
            if tolerances && r.bit()? {
                let t = unquantise(r.signed(tol.k)?, &tol);
                serde_json::json!({ "value": value, "tolerance": t })
            } else {
                value
            }
        }
        Kind::Group(g) => Value::Object(read_group(r, g, version)?),
        Kind::List(g) => {
            let count = r.golomb(0)?.saturating_add(1);
            if count > MAX_BIKES as u64 {
                return Err(LinkError::TooManyBikes {
                    count: usize::try_from(count).unwrap_or(usize::MAX),
                    max: MAX_BIKES,
                });
            }
            let mut items = Vec::new();
            for _ in 0..count {
                items.push(Value::Object(read_group(r, g, version)?));
            }
            Value::Array(items)
        }
    })
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn choice_widths_leave_room_for_the_escape() {
        assert_eq!(choice_bits(&["a", "b"]), 2);
        assert_eq!(choice_bits(&["a", "b", "c"]), 2);
        assert_eq!(choice_bits(&["a", "b", "c", "d"]), 3);
    }

    #[test]
    fn quantising_rounds_to_the_nearest_step_and_decodes_to_the_decimal() {
        let num = Num {
            denom: 20,
            centre: 67.0,
            k: 7,
            range: (60.0, 76.0),
        };
        // 64.53° → nearest 0.05° is 64.55°, which must come back as the double of "64.55".
        let q = quantise(64.53, &num, "x").unwrap();
        assert_eq!(q, 1291 - 1340);
        assert_eq!(unquantise(q, &num), "64.55".parse::<f64>().unwrap());
        assert_eq!(
            quantise(f64::NAN, &num, "frame.x"),
            Err(LinkError::NotFinite {
                path: "frame.x".into()
            })
        );
    }
}
