//! Share links: the whole scenario in a URL fragment (DESIGN.md §9).
//!
//! Layout: one version byte, the scenario as bits (see [`table`] and [`codec`]), zero padding to
//! a whole byte, then a CRC-8 check byte; the bytes in base64url without padding. The fragment is
//! never sent to a server. Numbers keep the resolution people type: 0.5 mm, 0.05°, 0.1 kg,
//! 0.1 %, 0.01 g; labels are trimmed and kept to 80 characters. docs/LINKS.md has the details,
//! the measured lengths and the information bound.

mod b64;
mod bits;
mod codec;
mod error;
mod table;
mod text;

pub mod bound;

pub use codec::MAX_BIKES;
pub use error::LinkError;
pub use text::{link_text, MAX_TEXT_CHARS};

use bits::{BitReader, BitWriter};
use framewise_kernel::scenario::SCENARIO_VERSION;
use framewise_kernel::Scenario;
use serde_json::Value;

/// The link format this code writes. Every older version still decodes.
pub const LINK_VERSION: u8 = 1;
/// Longest fragment accepted, in characters (16 bikes with long labels stay well below).
pub const MAX_FRAGMENT_CHARS: usize = 4096;

/// Encodes a scenario as a fragment (base64url, without the leading `#`).
///
/// # Errors
/// A number that is not finite or is absurdly large, more than [`MAX_BIKES`] bikes, or a
/// scenario field the link table does not list (a programming error the tests catch).
pub fn encode_link(scenario: &Scenario) -> Result<String, LinkError> {
    let value = serde_json::to_value(scenario).map_err(|e| LinkError::NotCovered {
        path: format!("the scenario ({e})"),
    })?;
    let Value::Object(mut obj) = value else {
        return Err(LinkError::NotCovered {
            path: "the scenario".into(),
        });
    };
    obj.remove("version");
    let mut w = BitWriter::default();
    w.bits(u64::from(LINK_VERSION), 8);
    codec::write_group(&mut w, &table::SCENARIO, &obj, "")?;
    let mut bytes = w.into_bytes();
    bytes.push(crc8(&bytes));
    let text = b64::encode(&bytes);
    if text.len() > MAX_FRAGMENT_CHARS {
        return Err(LinkError::TooLong {
            chars: text.len(),
            max: MAX_FRAGMENT_CHARS,
        });
    }
    Ok(text)
}

/// The fragment part of a link as people paste it: a whole URL (the part after `#`), a fragment
/// with or without its `#`, surrounding white space removed.
pub fn fragment_of(link: &str) -> &str {
    let t = link.trim();
    match t.split_once('#') {
        Some((_, frag)) => frag.trim(),
        None => t,
    }
}

/// Decodes a link (see [`fragment_of`] for what is accepted) into a scenario.
///
/// # Errors
/// Empty, too long, not base64url, cut short, damaged (check byte or contents), or written by a
/// newer version: each a [`LinkError`] whose message says what is wrong.
pub fn decode_link(link: &str) -> Result<Scenario, LinkError> {
    if link.contains("://") && !link.contains('#') {
        return Err(LinkError::NoFragment);
    }
    let frag = fragment_of(link);
    if frag.is_empty() {
        return Err(LinkError::Empty);
    }
    if frag.len() > MAX_FRAGMENT_CHARS {
        return Err(LinkError::TooLong {
            chars: frag.len(),
            max: MAX_FRAGMENT_CHARS,
        });
    }
    let bytes = b64::decode(frag.trim_end_matches('='))
        .map_err(|e| LinkError::NotBase64(error::base64_detail(&e)))?;
    let (&version, rest) = bytes.split_first().ok_or(LinkError::Truncated)?;
    if version == 0 {
        return Err(LinkError::UnknownVersion(version));
    }
    if version > LINK_VERSION {
        return Err(LinkError::FutureVersion {
            found: version,
            newest: LINK_VERSION,
        });
    }
    let (&check, _) = rest.split_last().ok_or(LinkError::Truncated)?;
    let body = bytes.get(..bytes.len() - 1).unwrap_or_default();
    if crc8(body) != check {
        return Err(LinkError::Checksum);
    }
    let payload = body.get(1..).unwrap_or_default();
    let mut r = BitReader::new(payload);
    let mut obj = codec::read_group(&mut r, &table::SCENARIO, version)?;
    if !r.only_padding_left() {
        return Err(LinkError::Garbled(
            "there is data after the end of the scenario".into(),
        ));
    }
    obj.insert("version".into(), Value::from(SCENARIO_VERSION));
    crate::json::from_value_at(Value::Object(obj))
        .map_err(|(_, e)| LinkError::Garbled(e.to_string()))
}

/// CRC-8 with polynomial x⁸ + x² + x + 1 (0x07), initial value 0, no reflection.
/// Source: CRC-8/SMBUS in the catalogue of parametrised CRC algorithms (reveng.sourceforge.io,
/// "CRC-8/SMBUS": check value of "123456789" = 0xF4).
pub fn crc8(bytes: &[u8]) -> u8 {
    let mut crc = 0u8;
    for &b in bytes {
        crc ^= b;
        for _ in 0..8 {
            crc = if crc & 0x80 != 0 {
                (crc << 1) ^ 0x07
            } else {
                crc << 1
            };
        }
    }
    crc
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn crc8_matches_the_published_check_value() {
        // Source: reveng CRC catalogue, CRC-8/SMBUS, check = 0xF4.
        assert_eq!(crc8(b"123456789"), 0xF4);
    }

    #[test]
    fn fragment_is_found_in_urls_and_bare_text() {
        assert_eq!(fragment_of("https://example.org/x/#AbC"), "AbC");
        assert_eq!(fragment_of("  #AbC \n"), "AbC");
        assert_eq!(fragment_of("AbC"), "AbC");
    }

    #[test]
    fn every_group_name_is_unique_and_keys_are_unique_per_group() {
        let mut names: Vec<&str> = table::ALL.iter().map(|g| g.name).collect();
        names.sort_unstable();
        names.dedup();
        assert_eq!(names.len(), table::ALL.len());
        for g in table::ALL {
            let mut keys: Vec<&str> = g.fields.iter().map(|f| f.key).collect();
            keys.sort_unstable();
            keys.dedup();
            assert_eq!(keys.len(), g.fields.len(), "{}", g.name);
            assert!(g
                .fields
                .iter()
                .all(|f| f.since >= 1 && f.since <= LINK_VERSION));
        }
    }
}
