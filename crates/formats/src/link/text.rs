//! Text in a link: labels as trimmed UTF-8 in a 6-bit alphabet with an escape, and wheels as
//! short codes for common designations with fallbacks.

use super::bits::{BitReader, BitWriter};
use super::table::DIAMETER;
use super::LinkError;
use framewise_kernel::WheelSpec;

/// Longest text kept, in characters (the page's label field keeps 80 too).
pub const MAX_TEXT_CHARS: usize = 80;

/// 63 common characters at 6 bits each; code 63 escapes to the character's UTF-8 bytes.
/// Capitals Q, Y and Z are left out for lack of room; they escape like any other character.
const ALPHABET: &str = "abcdefghijklmnopqrstuvwxyz0123456789 .,-ABCDEFGHIJKLMNOPRSTUVWX";
const ESCAPE: u64 = 63;

/// Trims the text and keeps its first [`MAX_TEXT_CHARS`] characters: what a link keeps.
pub fn link_text(text: &str) -> String {
    text.trim().chars().take(MAX_TEXT_CHARS).collect()
}

/// Writes [`link_text`] of `text`: its character count, then each character.
pub(crate) fn write_text(w: &mut BitWriter, text: &str) {
    let kept = link_text(text);
    w.golomb(kept.chars().count() as u64, 3);
    for c in kept.chars() {
        match ALPHABET.chars().position(|a| a == c) {
            Some(i) => w.bits(i as u64, 6),
            None => {
                w.bits(ESCAPE, 6);
                let mut buf = [0u8; 4];
                for b in c.encode_utf8(&mut buf).bytes() {
                    w.bits(u64::from(b), 8);
                }
            }
        }
    }
}

/// Reads text written by [`write_text`].
pub(crate) fn read_text(r: &mut BitReader) -> Result<String, LinkError> {
    let count = r.golomb(3)?;
    if count > MAX_TEXT_CHARS as u64 {
        return Err(LinkError::Garbled(format!(
            "a text of {count} characters (at most {MAX_TEXT_CHARS})"
        )));
    }
    let mut out = String::new();
    for _ in 0..count {
        let code = r.bits(6)?;
        if code == ESCAPE {
            out.push(read_utf8_char(r)?);
        } else {
            let c = ALPHABET.chars().nth(code as usize).ok_or_else(|| {
                LinkError::Garbled(format!("character code {code} is not in the alphabet"))
            })?;
            out.push(c);
        }
    }
    Ok(out)
}

fn read_utf8_char(r: &mut BitReader) -> Result<char, LinkError> {
    let lead = r.bits(8)? as u8;
    let len = match lead {
        0x00..=0x7f => 1,
        0xc0..=0xdf => 2,
        0xe0..=0xef => 3,
        0xf0..=0xf7 => 4,
        _ => return Err(LinkError::Garbled("a text character is not UTF-8".into())),
    };
    let mut buf = [lead, 0, 0, 0];
    for slot in buf.iter_mut().take(len).skip(1) {
        *slot = r.bits(8)? as u8;
    }
    let bytes = buf.get(..len).unwrap_or_default();
    std::str::from_utf8(bytes)
        .ok()
        .and_then(|s| s.chars().next())
        .ok_or_else(|| LinkError::Garbled("a text character is not UTF-8".into()))
}

/// Common wheel designations, exactly as people type them; a link stores the index (5 bits).
/// Frozen at version 1: append only in a later version.
const COMMON_WHEELS: [&str; 32] = [
    "29x2.4",
    "29x2.5",
    "29x2.6",
    "29x2.3",
    "29x2.2",
    "29x2.1",
    "29x2.35",
    "29x2.25",
    "27.5x2.5",
    "27.5x2.4",
    "27.5x2.6",
    "27.5x2.3",
    "27.5x2.8",
    "27.5x2.35",
    "26x2.3",
    "26x2.5",
    "26x2.1",
    "700x23c",
    "700x25c",
    "700x28c",
    "700x30c",
    "700x32c",
    "700x35c",
    "700x38c",
    "700x40c",
    "700x45c",
    "650bx47",
    "650bx42",
    "24x2.2",
    "20x1.75",
    "29x3.0",
    "27.5x3.0",
];

/// Wheel kinds (2 bits): common code, ETRTO `W-BSD` in whole millimetres, diameter, text.
const W_COMMON: u64 = 0;
const W_ETRTO: u64 = 1;
const W_DIAMETER: u64 = 2;
const W_TEXT: u64 = 3;

/// Writes a wheel as one of the four kinds. Designations are kept as typed (trimmed).
pub(crate) fn write_wheel(
    w: &mut BitWriter,
    spec: &WheelSpec,
    path: &str,
) -> Result<(), LinkError> {
    match spec {
        WheelSpec::Diameter { diameter_mm } => {
            w.bits(W_DIAMETER, 2);
            let q = super::codec::quantise(*diameter_mm, &DIAMETER, path)?;
            w.signed(q, DIAMETER.k);
        }
        WheelSpec::Designation(text) => {
            let text = link_text(text);
            if let Some(i) = COMMON_WHEELS.iter().position(|c| *c == text) {
                w.bits(W_COMMON, 2);
                w.bits(i as u64, 5);
            } else if let Some((width, bsd)) = etrto(&text) {
                w.bits(W_ETRTO, 2);
                w.golomb(width, 5);
                w.golomb(bsd, 9);
            } else {
                w.bits(W_TEXT, 2);
                write_text(w, &text);
            }
        }
    }
    Ok(())
}

/// Reads a wheel written by [`write_wheel`].
pub(crate) fn read_wheel(r: &mut BitReader) -> Result<WheelSpec, LinkError> {
    Ok(match r.bits(2)? {
        W_COMMON => {
            let i = r.bits(5)? as usize;
            let name = COMMON_WHEELS
                .get(i)
                .ok_or_else(|| LinkError::Garbled(format!("wheel code {i} is unknown")))?;
            WheelSpec::Designation((*name).to_string())
        }
        W_ETRTO => {
            let width = r.golomb(5)?;
            let bsd = r.golomb(9)?;
            WheelSpec::Designation(format!("{width}-{bsd}"))
        }
        W_DIAMETER => {
            let q = r.signed(DIAMETER.k)?;
            WheelSpec::Diameter {
                diameter_mm: super::codec::unquantise(q, &DIAMETER),
            }
        }
        _ => WheelSpec::Designation(read_text(r)?),
    })
}

/// `"62-622"` → (62, 622) when the text is exactly two whole numbers without leading zeros.
fn etrto(text: &str) -> Option<(u64, u64)> {
    let (a, b) = text.split_once('-')?;
    let width: u64 = a.parse().ok()?;
    let bsd: u64 = b.parse().ok()?;
    (format!("{width}-{bsd}") == text && width < 1000 && bsd < 10_000).then_some((width, bsd))
}

#[cfg(test)]
mod tests {
    use super::*;

    fn round_trip_text(s: &str) -> (String, usize) {
        let mut w = BitWriter::default();
        write_text(&mut w, s);
        let bytes = w.into_bytes();
        let mut r = BitReader::new(&bytes);
        (read_text(&mut r).unwrap(), bytes.len())
    }

    #[test]
    fn alphabet_has_63_distinct_characters() {
        let mut chars: Vec<char> = ALPHABET.chars().collect();
        assert_eq!(chars.len(), 63);
        chars.sort_unstable();
        chars.dedup();
        assert_eq!(chars.len(), 63);
    }

    #[test]
    fn text_round_trips_including_escapes_and_is_trimmed_and_capped() {
        for s in ["Trail M", "Zé's \"bike\" <b>", "日本語 🚲", "", "QYZ qyz"] {
            assert_eq!(round_trip_text(s).0, s);
        }
        assert_eq!(round_trip_text("  padded  ").0, "padded");
        let long = "x".repeat(200);
        assert_eq!(round_trip_text(&long).0.chars().count(), MAX_TEXT_CHARS);
        // 7 characters of the alphabet: 5 bits of count + 42 bits → 6 bytes.
        assert_eq!(round_trip_text("Trail M").1, 6);
    }

    #[test]
    fn wheels_round_trip_by_every_kind() {
        let specs = [
            WheelSpec::Designation("29x2.4".into()),
            WheelSpec::Designation("62-622".into()),
            WheelSpec::Designation("700x31c".into()),
            WheelSpec::Designation("062-622".into()),
            WheelSpec::Diameter { diameter_mm: 741.5 },
        ];
        for spec in &specs {
            let mut w = BitWriter::default();
            write_wheel(&mut w, spec, "wheels.front").unwrap();
            let bytes = w.into_bytes();
            let mut r = BitReader::new(&bytes);
            assert_eq!(&read_wheel(&mut r).unwrap(), spec);
        }
    }
}
