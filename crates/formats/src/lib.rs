//! framewise formats: everything that turns text into a scenario and back.
//!
//! **Invariant:** no geometry here; parsing only. Errors name the field, the value and what is
//! allowed.
#![deny(missing_docs)]

pub mod chart;
pub mod fields;
pub mod form;
pub mod form_inverse;
pub mod form_units;
pub mod json;
pub mod link;
pub mod units;

pub use chart::{
    chart_to_json, import_chart, import_chart_with, Answers, ChartError, ChartImport, ChartSize,
};
pub use fields::{page_words, PageWords};
pub use form::scenario_from_form;
pub use form_inverse::{form_from_scenario, form_view, FormView};
pub use json::{report_to_json, scenario_from_json};
pub use link::{decode_link, encode_link, LinkError, LINK_VERSION};
pub use units::{parse_quantity, parse_quantity_step, Quantity, UnitError};
