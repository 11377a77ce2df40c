//! framewise geometry kernel.
//!
//! Pure Rust on nalgebra: no wasm, DOM, JSON text or I/O. Side view, BB centre at the origin,
//! x forward, y up; millimetres and degrees at every boundary (the key says the unit), radians
//! inside. Every public function is deterministic and total: bad input returns a typed error.
#![deny(missing_docs)]

pub mod catalogue;
pub mod error;
pub mod evaluate;
pub mod geometry;
pub mod pose;
pub mod report;
pub mod scenario;
pub mod solve;
pub mod validate;
pub mod wheel;

pub use catalogue::{lookup, Measurement, Unit, CATALOGUE};
pub use error::{FieldError, Warning};
pub use evaluate::evaluate;
pub use geometry::{FrameParams, Geometry, Radii};
pub use pose::{pose, ChangeSet, Posed};
pub use report::{BikeReport, Outline, Report};
pub use scenario::{
    BikeInput, Changes, Load, Published, RiderInput, Scenario, Setup, View, WheelsInput,
};
pub use solve::{solve, Given, Residual, Solution, SolveInput};
pub use wheel::{Wheel, WheelSpec};
