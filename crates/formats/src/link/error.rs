//! Why a link could not be made or read: one enum, messages a person can act on.

use std::fmt;

/// A link that cannot be written or read.
#[derive(Debug, Clone, PartialEq)]
pub enum LinkError {
    /// Nothing after the `#`.
    Empty,
    /// A whole URL without a `#` part.
    NoFragment,
    /// Longer than any link this page makes.
    TooLong {
        /// Characters given.
        chars: usize,
        /// Most accepted.
        max: usize,
    },
    /// A character that base64url does not use, or a length it cannot have.
    NotBase64(String),
    /// The data ends in the middle of the scenario.
    Truncated,
    /// The check byte does not match the contents.
    Checksum,
    /// The contents do not make a scenario.
    Garbled(String),
    /// Made by a newer version of the page.
    FutureVersion {
        /// The link's format version.
        found: u8,
        /// The newest this code reads.
        newest: u8,
    },
    /// A version number no page ever wrote.
    UnknownVersion(u8),
    /// Encoding: a scenario field without a slot in the link table.
    NotCovered {
        /// The field path.
        path: String,
    },
    /// Encoding: a number that is NaN or infinite.
    NotFinite {
        /// The field path.
        path: String,
    },
    /// Encoding: a number far outside anything a bicycle has.
    OutOfRange {
        /// The field path.
        path: String,
        /// The value.
        value: f64,
    },
    /// More bikes than a link carries.
    TooManyBikes {
        /// Bikes given.
        count: usize,
        /// Most carried.
        max: usize,
    },
}

impl LinkError {
    /// A short stable code for the page and tests, e.g. `link_truncated`.
    pub fn code(&self) -> &'static str {
        match self {
            LinkError::Empty => "link_empty",
            LinkError::NoFragment => "link_no_fragment",
            LinkError::TooLong { .. } => "link_too_long",
            LinkError::NotBase64(_) => "link_not_base64",
            LinkError::Truncated => "link_truncated",
            LinkError::Checksum => "link_checksum",
            LinkError::Garbled(_) => "link_garbled",
            LinkError::FutureVersion { .. } => "link_future_version",
            LinkError::UnknownVersion(_) => "link_unknown_version",
            LinkError::NotCovered { .. } => "link_not_covered",
            LinkError::NotFinite { .. } => "link_not_finite",
            LinkError::OutOfRange { .. } => "link_out_of_range",
            LinkError::TooManyBikes { .. } => "link_too_many_bikes",
        }
    }
}

const AGAIN: &str = "copy the whole link again";

impl fmt::Display for LinkError {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self {
            LinkError::Empty => write!(f, "the link holds no scenario: nothing follows the #"),
            LinkError::NoFragment => write!(
                f,
                "the address has no # part, so it holds no scenario; {AGAIN}"
            ),
            LinkError::TooLong { chars, max } => write!(
                f,
                "the link is {chars} characters long; links of this page are at most {max}"
            ),
            LinkError::NotBase64(detail) => write!(f, "the link is damaged: {detail}; {AGAIN}"),
            LinkError::Truncated => write!(f, "the link is cut short: its end is missing; {AGAIN}"),
            LinkError::Checksum => write!(
                f,
                "the link is damaged: its check byte does not match its contents; {AGAIN}"
            ),
            LinkError::Garbled(detail) => write!(f, "the link is damaged: {detail}; {AGAIN}"),
            LinkError::FutureVersion { found, newest } => write!(
                f,
                "the link was made by a newer version of this page (link format {found}; this \
                 page reads formats 1 to {newest}); reload the page to update it"
            ),
            LinkError::UnknownVersion(v) => {
                write!(
                    f,
                    "the link has format {v}, which no version of this page wrote"
                )
            }
            LinkError::NotCovered { path } => write!(
                f,
                "{path} cannot be put in a link: the link table has no slot for it"
            ),
            LinkError::NotFinite { path } => {
                write!(
                    f,
                    "{path} is not a finite number, so it cannot go in a link"
                )
            }
            LinkError::OutOfRange { path, value } => write!(
                f,
                "{path} = {value} is too large for a link (no bicycle measurement is that large)"
            ),
            LinkError::TooManyBikes { count, max } => {
                write!(f, "a link holds at most {max} bikes, this one has {count}")
            }
        }
    }
}

impl std::error::Error for LinkError {}

/// A plain sentence for a base64url decoding error.
pub(crate) fn base64_detail(e: &super::b64::DecodeError) -> String {
    use super::b64::DecodeError;
    match *e {
        DecodeError::Character(at, byte) => format!(
            "the character {:?} at position {} is not one a link uses",
            char::from(byte),
            at + 1
        ),
        DecodeError::Length => "its length is impossible (a character is missing or extra)".into(),
        DecodeError::LastCharacter(at, symbol) => format!(
            "its last character {:?} at position {} is impossible",
            char::from(symbol),
            at + 1
        ),
    }
}
