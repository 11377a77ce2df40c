//! framewise formats: everything that turns text into a scenario and back.
//!
//! **Invariant:** no geometry here; parsing only. Errors name the field, the value and what is
//! allowed.
#![deny(missing_docs)]

pub mod chart;
pub mod fields;
pub mod form;
pub mod json;
pub mod units;

pub use chart::{
    chart_to_json, import_chart, import_chart_with, Answers, ChartError, ChartImport, ChartSize,
};
pub use fields::{page_words, PageWords};
pub use form::scenario_from_form;
pub use json::{report_to_json, scenario_from_json};
pub use units::{parse_quantity, Quantity, UnitError};
