//! The scenario-level pass around the bikes: the rider is checked once for every bike, and a
//! cockpit search whose target is another bike's grip point runs after all bikes are evaluated.

use crate::assembly::{parts_search, rider_and_handling, SearchContext};
use crate::error::Warning;
use crate::fitting::{RiderValues, SetupValues};
use crate::geometry::Geometry;
use crate::report::BikeReport;
use nalgebra::Point2;

/// The scenario's rider, checked once, with the warnings that go to every bike.
#[derive(Debug, Clone, PartialEq, Default)]
pub struct ScenarioRider {
    /// The resolved rider, when there is a usable one.
    pub values: Option<RiderValues>,
    /// Assumptions made about the rider.
    pub warnings: Vec<Warning>,
}

/// Checks the scenario's rider; errors go to `errors`.
pub fn scenario_rider(
    rider: Option<&crate::scenario::RiderInput>,
    errors: &mut Vec<crate::error::FieldError>,
) -> ScenarioRider {
    let mut out = ScenarioRider::default();
    if let Some(r) = rider {
        out.values = crate::fitting::check_rider(r, errors, &mut out.warnings);
    }
    out
}

/// A bike's cockpit search still to run against another bike's grip point.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Pending {
    /// The bike's index in the scenario.
    pub bike: usize,
    /// Its search context.
    pub ctx: SearchContext,
    /// The bike whose grip point is the target.
    pub target_bike: Option<usize>,
}

/// Everything [`rider_and_handling`] does, plus the rider's warnings and a search for a target
/// point given directly. Returns the search context for a target taken from another bike.
pub fn attach(
    s: &SetupValues,
    rider: &ScenarioRider,
    g: &Geometry,
    theta: f64,
    report: &mut BikeReport,
) -> Option<(SearchContext, Option<usize>)> {
    if s.load.is_none() {
        report.warnings.extend(rider.warnings.iter().cloned());
    }
    let ctx = rider_and_handling(s, rider.values.as_ref(), g, theta, report)?;
    match s.target {
        Some(t) => {
            report.cockpit_parts = Some(parts_search(&ctx, t, "given"));
            None
        }
        None => Some((ctx, s.target_bike)),
    }
}

/// Second pass: cockpit searches whose target is another bike's grip point. `done[i]` is the
/// report index of scenario bike `i`, if it was evaluated.
pub fn targets_from_bikes(
    pending: &[Pending],
    done: &[Option<usize>],
    report: &mut crate::report::Report,
) {
    for p in pending {
        let Some(j) = p.target_bike else { continue };
        let field = format!("bikes[{}].setup.target_grip_bike", p.bike);
        let target = done
            .get(j)
            .copied()
            .flatten()
            .filter(|_| j != p.bike)
            .and_then(|k| report.bikes.get(k))
            .and_then(|b| {
                Some(Point2::new(
                    *b.ridden.get("grip_x_mm")?,
                    *b.ridden.get("grip_y_mm")?,
                ))
            });
        let Some(target) = target else {
            report.errors.push(crate::error::FieldError::new(
                "bad_target",
                field,
                format!("target_grip_bike must name another bike of the scenario that has a grip point (0 to {}), got {j}", done.len().saturating_sub(1)),
            ));
            continue;
        };
        let found = parts_search(&p.ctx, target, &format!("bikes[{j}]"));
        if let Some(b) = done
            .get(p.bike)
            .copied()
            .flatten()
            .and_then(|k| report.bikes.get_mut(k))
        {
            b.cockpit_parts = Some(found);
        }
    }
}
