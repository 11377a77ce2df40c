//! framewise geometry kernel.
//!
//! Pure Rust on nalgebra: no wasm, DOM, JSON text or I/O. Side view, BB centre at the origin,
//! x forward, y up; millimetres and degrees at every boundary (the key says the unit), radians
//! inside. Every public function is deterministic and total: bad input returns a typed error.
#![deny(missing_docs)]

pub mod assembly;
pub mod catalogue;
pub mod cockpit;
pub mod error;
pub mod evaluate;
pub mod fit;
pub mod fitting;
pub mod geometry;
pub mod glossary;
pub mod handling;
pub mod memo;
pub mod parts;
pub mod pose;
pub mod posture;
pub mod report;
pub mod rider;
pub mod scenario;
pub mod scene;
pub mod seat;
pub mod seated;
pub mod solve;
pub mod standing;
pub mod validate;
pub mod wheel;

pub use catalogue::{lookup, Measurement, Unit, CATALOGUE};
pub use cockpit::{bb_to_grip, Bar, Cockpit, CockpitPoints, HandPosition};
pub use error::{FieldError, Warning};
pub use evaluate::{evaluate, evaluate_with};
pub use fit::Check;
pub use geometry::{FrameParams, Geometry, Radii};
pub use handling::{combine, pedal_strike_lean, statics, toe_clearance, Support};
pub use memo::SolveMemo;
pub use parts::{search, PartsChoice, PartsSearch};
pub use pose::{pose, ChangeSet, Posed};
pub use posture::{two_link, Figure, Reach};
pub use report::{BikeReport, Fit, Handling, Outline, Report};
pub use rider::{Body, Overrides, SEGMENTS};
pub use scenario::{
    BikeInput, Changes, Load, Published, RiderInput, Scenario, Setup, View, WheelsInput,
};
pub use seat::{PostFit, Seat};
pub use seated::{seated, Contacts, Posture};
pub use solve::{solve, Given, Residual, Solution, SolveInput};
pub use standing::{standing, Stance};
pub use wheel::{Wheel, WheelSpec};
