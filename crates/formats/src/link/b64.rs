//! base64url without padding (RFC 4648 §5, "Base 64 Encoding with URL and Filename Safe
//! Alphabet"), for the link's bytes. Written here rather than taken from a crate: the general
//! engine was about 6 kB of the page's wasm for two dozen lines of work. The tests check it
//! against the `base64` crate (an independent implementation of the same RFC).
//!
//! Decoding is strict, as the RFC allows: only the 64 characters, no padding (the caller trims
//! it), no length of 1 more than a multiple of 4, and the bits past the last whole byte zero
//! (one text per byte string).

/// The alphabet of RFC 4648 §5, table 2.
const ALPHABET: &[u8; 64] = b"ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789-_";

/// Why a text is not base64url.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum DecodeError {
    /// A character outside the alphabet: its index (from 0) and byte.
    Character(usize, u8),
    /// A length no byte string has (4k + 1 characters).
    Length,
    /// The last character carries bits past the last whole byte: its index and byte.
    LastCharacter(usize, u8),
}

/// The 6-bit value of an alphabet character.
fn sextet(c: u8) -> Option<u32> {
    let v = match c {
        b'A'..=b'Z' => c - b'A',
        b'a'..=b'z' => c - b'a' + 26,
        b'0'..=b'9' => c - b'0' + 52,
        b'-' => 62,
        b'_' => 63,
        _ => return None,
    };
    Some(u32::from(v))
}

/// `bytes` as base64url without padding: each 3 bytes as 4 characters, a last 1 or 2 bytes as
/// 2 or 3.
pub fn encode(bytes: &[u8]) -> String {
    let mut out = String::with_capacity(bytes.len().div_ceil(3) * 4);
    for chunk in bytes.chunks(3) {
        let byte = |k: usize| u32::from(chunk.get(k).copied().unwrap_or(0));
        let n = (byte(0) << 16) | (byte(1) << 8) | byte(2);
        for k in 0..=chunk.len() {
            let six = (n >> (18 - 6 * k)) & 63;
            if let Some(&c) = ALPHABET.get(six as usize) {
                out.push(char::from(c));
            }
        }
    }
    out
}

/// The bytes of a base64url text without padding.
///
/// # Errors
/// The first character outside the alphabet, a length of 4k + 1, or a last character with bits
/// set past the last whole byte.
pub fn decode(text: &str) -> Result<Vec<u8>, DecodeError> {
    let t = text.as_bytes();
    if let Some((at, &c)) = t.iter().enumerate().find(|(_, &c)| sextet(c).is_none()) {
        return Err(DecodeError::Character(at, c));
    }
    if t.len() % 4 == 1 {
        return Err(DecodeError::Length);
    }
    let mut out = Vec::with_capacity(t.len() / 4 * 3 + 2);
    for (i, chunk) in t.chunks(4).enumerate() {
        let n = chunk.iter().enumerate().fold(0u32, |n, (k, &c)| {
            n | (sextet(c).unwrap_or(0) << (18 - 6 * k))
        });
        let whole = chunk.len() - 1; // 2, 3 or 4 characters → 1, 2 or 3 bytes
                                     // The 24-bit group's bits below its whole bytes must be zero.
        if n & (0xFF_FFFF >> (8 * whole)) != 0 {
            let at = i * 4 + chunk.len() - 1;
            return Err(DecodeError::LastCharacter(
                at,
                chunk.last().copied().unwrap_or(0),
            ));
        }
        out.extend((0..whole).map(|k| (n >> (16 - 8 * k)) as u8));
    }
    Ok(out)
}

#[cfg(test)]
mod tests {
    use super::*;
    use base64::engine::general_purpose::URL_SAFE_NO_PAD;
    use base64::Engine;
    use proptest::prelude::*;

    /// RFC 4648 §10 test vectors (the base64 column, here without padding).
    #[test]
    fn rfc_4648_vectors() {
        for (plain, coded) in [
            ("", ""),
            ("f", "Zg"),
            ("fo", "Zm8"),
            ("foo", "Zm9v"),
            ("foob", "Zm9vYg"),
            ("fooba", "Zm9vYmE"),
            ("foobar", "Zm9vYmFy"),
        ] {
            assert_eq!(encode(plain.as_bytes()), coded);
            assert_eq!(decode(coded).unwrap(), plain.as_bytes());
        }
        // The two characters that differ from standard base64.
        assert_eq!(encode(&[0xFB, 0xFF]), "-_8");
    }

    #[test]
    fn bad_texts_say_why() {
        assert_eq!(decode("AB$D"), Err(DecodeError::Character(2, b'$')));
        assert_eq!(decode("ABCDE"), Err(DecodeError::Length));
        // "Zh": 12 bits, of which the last 4 are not zero.
        assert_eq!(decode("Zh"), Err(DecodeError::LastCharacter(1, b'h')));
        assert_eq!(decode("Zm9vYh"), Err(DecodeError::LastCharacter(5, b'h')));
    }

    proptest! {
        /// Source: the `base64` crate's URL_SAFE_NO_PAD engine, another implementation of RFC 4648.
        #[test]
        fn agrees_with_the_base64_crate(bytes in proptest::collection::vec(any::<u8>(), 0..64)) {
            let ours = encode(&bytes);
            prop_assert_eq!(&ours, &URL_SAFE_NO_PAD.encode(&bytes));
            prop_assert_eq!(decode(&ours).unwrap(), bytes);
        }

        #[test]
        fn accepts_and_refuses_what_the_base64_crate_does(text in "[A-Za-z0-9_$=-]{0,12}") {
            let ours = decode(&text);
            let theirs = URL_SAFE_NO_PAD.decode(&text);
            prop_assert_eq!(ours.is_ok(), theirs.is_ok(), "{:?} {:?}", ours, theirs);
            if let (Ok(a), Ok(b)) = (ours, theirs) {
                prop_assert_eq!(a, b);
            }
        }
    }
}
