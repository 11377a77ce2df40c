//! Links that cannot be read get a typed error with a message that says what is wrong; nothing
//! panics, whatever the text.
// Test helpers outside #[test] functions may unwrap, index and panic too (clippy.toml).
#![allow(
    clippy::unwrap_used,
    clippy::expect_used,
    clippy::panic,
    clippy::indexing_slicing
)]

mod link_common;

use base64::engine::general_purpose::URL_SAFE_NO_PAD;
use base64::Engine;
use framewise_formats::link::{crc8, MAX_FRAGMENT_CHARS};
use framewise_formats::{decode_link, encode_link, LinkError, LINK_VERSION};
use link_common::*;
use proptest::prelude::*;

fn good() -> String {
    encode_link(&one_bike()).unwrap()
}

/// Bytes with a correct check byte appended, as base64url.
fn with_check(mut bytes: Vec<u8>) -> String {
    bytes.push(crc8(&bytes));
    URL_SAFE_NO_PAD.encode(bytes)
}

#[test]
fn links_are_accepted_with_or_without_hash_and_as_whole_urls() {
    let frag = good();
    let want = one_bike();
    for text in [
        frag.clone(),
        format!("#{frag}"),
        format!("http://127.0.0.1:8080/#{frag}"),
        format!("  https://example.org/framewise/index.html#{frag}\n"),
        format!("{frag}=="),
    ] {
        assert_eq!(decode_link(&text).unwrap(), want, "{text}");
    }
}

#[test]
fn truncated_links_say_they_are_cut_short_or_damaged() {
    let frag = good();
    for cut in [1, 2, 5, 20, frag.len() - 1] {
        let e = decode_link(&frag[..frag.len() - cut]).unwrap_err();
        assert!(
            matches!(
                e,
                LinkError::Truncated | LinkError::Checksum | LinkError::NotBase64(_)
            ),
            "cut {cut}: {e:?}"
        );
        assert!(e.to_string().contains("copy the whole link again"), "{e}");
    }
    assert_eq!(decode_link("AQ"), Err(LinkError::Truncated));
}

#[test]
fn a_changed_character_is_caught_by_the_check_byte() {
    let frag = good();
    let mut caught = 0;
    for i in 1..frag.len() - 2 {
        let mut chars: Vec<char> = frag.chars().collect();
        chars[i] = if chars[i] == 'A' { 'B' } else { 'A' };
        let text: String = chars.into_iter().collect();
        if let Err(e) = decode_link(&text) {
            assert!(!e.to_string().is_empty());
            caught += 1;
        }
    }
    // CRC-8 catches every single-byte error (Source: a CRC with a polynomial of more than one
    // term detects all single-bit and, for x⁸+x²+x+1, all single-byte bursts of ≤ 8 bits;
    // Koopman & Chakravarty 2004, "Cyclic redundancy code (CRC) polynomial selection").
    assert_eq!(caught, frag.len() - 3);
}

#[test]
fn characters_outside_base64url_are_named_with_their_position() {
    let e = decode_link("#AdwC$InU").unwrap_err();
    assert_eq!(e.code(), "link_not_base64");
    assert!(e.to_string().contains("'$' at position 5"), "{e}");
    let e = decode_link("#AdwC+/").unwrap_err();
    assert_eq!(e.code(), "link_not_base64");
}

#[test]
fn oversized_links_are_refused_before_decoding() {
    let long = "A".repeat(MAX_FRAGMENT_CHARS + 1);
    assert_eq!(
        decode_link(&long),
        Err(LinkError::TooLong {
            chars: MAX_FRAGMENT_CHARS + 1,
            max: MAX_FRAGMENT_CHARS
        })
    );
    assert!(decode_link(&long)
        .unwrap_err()
        .to_string()
        .contains("at most 4096"));
}

#[test]
fn future_and_unknown_versions_say_so() {
    let future = with_check(vec![LINK_VERSION + 1, 0xAB, 0xCD]);
    let e = decode_link(&future).unwrap_err();
    assert_eq!(
        e,
        LinkError::FutureVersion {
            found: LINK_VERSION + 1,
            newest: LINK_VERSION
        }
    );
    assert!(e.to_string().contains("newer version"), "{e}");
    assert!(e.to_string().contains("reload the page"), "{e}");
    assert_eq!(
        decode_link(&with_check(vec![0, 1])),
        Err(LinkError::UnknownVersion(0))
    );
}

#[test]
fn empty_links_and_urls_without_a_fragment_are_explained() {
    assert_eq!(decode_link(""), Err(LinkError::Empty));
    assert_eq!(decode_link("#"), Err(LinkError::Empty));
    assert_eq!(
        decode_link("https://example.org/"),
        Err(LinkError::NoFragment)
    );
}

#[test]
fn data_after_the_scenario_is_garbled_even_with_a_good_check_byte() {
    let mut bytes = URL_SAFE_NO_PAD.decode(good()).unwrap();
    bytes.pop();
    bytes.extend([0xFF, 0xFF]);
    let e = decode_link(&with_check(bytes)).unwrap_err();
    assert_eq!(e.code(), "link_garbled");
    assert!(e.to_string().contains("after the end"), "{e}");
}

#[test]
fn too_many_bikes_are_refused_when_writing() {
    let bikes: Vec<_> = (0..17).map(|_| trail_bike("x", 470.0)).collect();
    let s = scenario(serde_json::json!({ "bikes": bikes }));
    assert_eq!(
        encode_link(&s),
        Err(LinkError::TooManyBikes { count: 17, max: 16 })
    );
}

proptest! {
    #[test]
    fn any_text_gives_a_scenario_or_an_error_never_a_panic(text in ".{0,200}") {
        let _ = decode_link(&text);
    }

    #[test]
    fn any_bytes_with_a_good_check_byte_never_panic(
        body in proptest::collection::vec(any::<u8>(), 0..120)
    ) {
        let mut bytes = vec![1u8];
        bytes.extend(body);
        if let Err(e) = decode_link(&with_check(bytes)) {
            prop_assert!(!e.to_string().is_empty());
        }
    }
}
