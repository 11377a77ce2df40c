//! framewise's second wasm module, loaded by the page on demand (never on the first view): the
//! chart importer (first paste or "Read the chart") and the QR code of a share link (first
//! "Show QR code"). Keeping them here keeps their code out of the module every visit loads.
//! Like the main binding it only converts: the logic is in `framewise-formats` and `qrcode`.
#![deny(missing_docs)]

mod chart;
pub mod qr;

pub use chart::{import_chart, import_chart_with_answers};
pub use qr::qr_svg;
