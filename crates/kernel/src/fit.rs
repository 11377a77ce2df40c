//! Fit and safety checks, shown as information with their sources (DESIGN.md §6.6, §10).
//!
//! Each check carries the value, the band or target it is compared with, whether it lies inside
//! (when the rule gives a band), and its source. Fit numbers are estimates from a body model,
//! not medical advice: [`CAUTION`] goes with them.

use serde::Serialize;

/// The caution shown with every fit number.
pub const CAUTION: &str = "Fit numbers are estimates from a body model scaled from height, not measurements or medical advice; a qualified bike fitter can check them on the rider.";

/// One check: a value against a band or target, with its source.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Check {
    /// Stable code, e.g. `knee_flexion_bdc`.
    pub code: String,
    /// The value, in `unit`.
    pub value: f64,
    /// Unit symbol.
    pub unit: String,
    /// Lower end of the band, if any.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub min: Option<f64>,
    /// Upper end of the band, if any.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub max: Option<f64>,
    /// A target value, if the rule gives one.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub target: Option<f64>,
    /// Inside the band (when there is one).
    #[serde(skip_serializing_if = "Option::is_none")]
    pub within: Option<bool>,
    /// One plain sentence.
    pub message: String,
    /// Where the rule comes from, with its tag.
    pub source: String,
}

fn band(code: &str, value: f64, unit: &str, min: Option<f64>, max: Option<f64>) -> Check {
    let within = (min.is_some() || max.is_some())
        .then(|| min.is_none_or(|m| value >= m) && max.is_none_or(|m| value <= m));
    Check {
        code: code.into(),
        value,
        unit: unit.into(),
        min,
        max,
        target: None,
        within,
        message: String::new(),
        source: String::new(),
    }
}

fn with(mut c: Check, message: String, source: &str) -> Check {
    c.message = message;
    c.source = source.into();
    c
}

/// Knee flexion at bottom dead centre against 25°–35°.
pub fn knee_flexion(deg: f64) -> Check {
    with(
        band("knee_flexion_bdc", deg, "°", Some(25.0), Some(35.0)),
        format!("Seated knee bend at bottom dead centre is {deg:.0}°; 25°–35° is recommended against overuse injury (a review suggests 25°–30°)."),
        "Peveler et al. 2005, J. Exercise Physiology online 8(1), tracing to Holmes, Pruitt & Whalen 1994; Bini, Hume & Croft 2011, Sports Med. 41 (abstract)",
    )
}

/// Saddle height (BB centre to saddle top) against 0.883 × inseam.
pub fn saddle_height_inseam(saddle_height: f64, inseam: f64) -> Check {
    let target = 0.883 * inseam;
    let mut c = band("saddle_height_0883_inseam", saddle_height, "mm", None, None);
    c.target = Some(target);
    with(
        c,
        format!("Saddle height {saddle_height:.0} mm; 0.883 × inseam gives {target:.0} mm."),
        "Peveler et al. 2005, J. Exercise Physiology online 8(1)",
    )
}

/// Saddle top to pedal spindle, crank in line with the seat tube, against 1.09 × inseam.
pub fn saddle_pedal_inseam(saddle_to_pedal: f64, inseam: f64) -> Check {
    let target = 1.09 * inseam;
    let mut c = band(
        "saddle_to_pedal_109_inseam",
        saddle_to_pedal,
        "mm",
        None,
        None,
    );
    c.target = Some(target);
    with(
        c,
        format!("Saddle top to pedal spindle {saddle_to_pedal:.0} mm; 1.09 × inseam gives {target:.0} mm."),
        "Hamley & Thomas 1967 (from memory); factor in Peveler et al. 2005",
    )
}

/// Seated torso angle against the usual bands: 35°–45° on a drop bar, 60°–90° upright.
pub fn torso_angle(deg: f64, drop_bar: bool) -> Check {
    let (min, max, what) = if drop_bar {
        (Some(35.0), Some(45.0), "on a drop bar 35°–45° is usual")
    } else {
        (Some(60.0), Some(90.0), "sitting upright 60°–90° is usual")
    };
    with(
        band("torso_angle", deg, "°", min, max),
        format!("Seated torso angle {deg:.0}° to horizontal; {what}."),
        "common practice",
    )
}

/// Front load share seated against ISO 4210-2 §4.7.5 (at least 25 %).
pub fn front_load(pct: f64) -> Check {
    with(
        band("iso_4210_front_load", pct, "%", Some(25.0), None),
        format!("Front wheel carries {pct:.0} % of the weight seated; ISO 4210-2 asks at least 25 % with the saddle fully rearward (here: at the given saddle position)."),
        "ISO 4210-2 §4.7.5",
    )
}

/// Toe clearance against 16 CFR 1512.17(d) (89 mm without foot-retaining devices).
pub fn toe_clearance(mm: f64) -> Check {
    with(
        band("toe_clearance", mm, "mm", Some(89.0), None),
        format!("Toe to front tyre at straight ahead: {mm:.0} mm (negative: the shoe overlaps the tyre). US rules ask 89 mm for pedals without foot retention; toe overlap needs care at low speed."),
        "16 CFR 1512.17(d)",
    )
}

/// Pedal strike lean angle against 16 CFR 1512.17(c) (25°).
pub fn pedal_strike(deg: f64) -> Check {
    with(
        band("pedal_strike_lean", deg, "°", Some(25.0), None),
        format!("With the crank down the pedal touches the ground at {deg:.0}° of lean; US rules ask 25°."),
        "16 CFR 1512.17(c)",
    )
}
