//! The measurement catalogue: every frame key of DESIGN.md §5 with its definition, unit,
//! plausible range (outside: a warning) and hard range (outside: an error).
//!
//! Ranges are the designers' judgement of what bicycles (kids' bikes to long-travel downhill
//! bikes) publish [practice]; the hard ranges only reject values no bicycle frame can have.
//!
//! The definitions are in [`CATALOGUE`] (one sentence each, shown by the page; `framewise
//! catalogue` prints the table as JSON). Ranges:
//!
//! | key | label | unit | plausible (warning outside) | hard (error outside) |
//! | --- | --- | --- | --- | --- |
//! | `reach_mm` | Reach | mm | 250 … 560 | 100 … 800 |
//! | `stack_mm` | Stack | mm | 450 … 700 | 250 … 900 |
//! | `head_angle_deg` | Head tube angle | ° | 60 … 76 | 45 … 85 |
//! | `head_tube_mm` | Head tube length | mm | 60 … 250 | 30 … 400 |
//! | `headset_lower_mm` | Lower headset stack | mm | 0 … 25 | 0 … 60 |
//! | `fork_a2c_mm` | Fork axle-to-crown | mm | 340 … 600 | 250 … 700 |
//! | `fork_offset_mm` | Fork offset | mm | 25 … 60 | -20 … 100 |
//! | `chainstay_mm` | Chainstay | mm | 380 … 470 | 250 … 600 |
//! | `rear_centre_mm` | Rear centre | mm | 370 … 470 | 200 … 600 |
//! | `front_centre_mm` | Front centre | mm | 550 … 900 | 350 … 1200 |
//! | `wheelbase_mm` | Wheelbase | mm | 950 … 1350 | 600 … 1700 |
//! | `bb_drop_mm` | BB drop | mm | -30 … 85 | -150 … 150 |
//! | `bb_height_mm` | BB height | mm | 240 … 380 | 100 … 500 |
//! | `seat_angle_actual_deg` | Seat tube angle (actual) | ° | 65 … 80 | 45 … 90 |
//! | `seat_axis_offset_mm` | Seat axis offset | mm | -60 … 60 | -200 … 200 |
//! | `seat_angle_effective_deg` | Seat tube angle (effective) | ° | 68 … 82 | 45 … 100 |
//! | `top_tube_effective_mm` | Effective top tube | mm | 450 … 720 | 250 … 1000 |
//! | `seat_tube_mm` | Seat tube length | mm | 300 … 560 | 150 … 800 |
//! | `trail_mm` | Trail | mm | 50 … 160 | -50 … 300 |
//! | `standover_mm` | Standover | mm | 600 … 900 | 300 … 1200 |

use serde::Serialize;

/// The unit of a measurement.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
pub enum Unit {
    /// Millimetres.
    #[serde(rename = "mm")]
    Mm,
    /// Degrees.
    #[serde(rename = "deg")]
    Deg,
}

impl Unit {
    /// The symbol shown after a value.
    pub fn symbol(self) -> &'static str {
        match self {
            Unit::Mm => "mm",
            Unit::Deg => "°",
        }
    }
    /// Default rounding of published values: 1 mm, 0.1°.
    pub fn default_tolerance(self) -> f64 {
        match self {
            Unit::Mm => 1.0,
            Unit::Deg => 0.1,
        }
    }
}

/// One measurement of the catalogue.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct Measurement {
    /// JSON key, e.g. `reach_mm`.
    pub key: &'static str,
    /// Short label for the page, e.g. "Reach".
    pub label: &'static str,
    /// One sentence: what it is and how it is measured.
    pub definition: &'static str,
    /// Unit.
    pub unit: Unit,
    /// Plausible range `[min, max]`: outside is a warning.
    pub plausible: (f64, f64),
    /// Hard range `[min, max]`: outside is an error.
    pub hard: (f64, f64),
}

impl Measurement {
    /// Default tolerance (rounding) of a published value of this measurement.
    pub fn default_tolerance(&self) -> f64 {
        self.unit.default_tolerance()
    }
    /// Its plausible range in words: "most bikes: −30 to 85 mm".
    pub fn most_bikes(&self) -> String {
        use crate::error::fmt_num;
        let (lo, hi) = self.plausible;
        format!(
            "most bikes: {} to {} {}",
            fmt_num(lo),
            fmt_num(hi),
            self.unit.symbol()
        )
    }
}

macro_rules! m {
    ($key:literal, $label:literal, $unit:ident, $p0:expr, $p1:expr, $h0:expr, $h1:expr, $def:literal) => {
        Measurement {
            key: $key,
            label: $label,
            definition: $def,
            unit: Unit::$unit,
            plausible: ($p0, $p1),
            hard: ($h0, $h1),
        }
    };
}

/// Every §5 frame measurement, in the order the page lists them.
pub static CATALOGUE: &[Measurement] = &[
    m!("reach_mm", "Reach", Mm, 250.0, 560.0, 100.0, 800.0,
       "Horizontal distance from the bottom bracket centre to the centre of the top of the head tube."),
    m!("stack_mm", "Stack", Mm, 450.0, 700.0, 250.0, 900.0,
       "Vertical distance from the bottom bracket centre to the centre of the top of the head tube."),
    m!("head_angle_deg", "Head tube angle", Deg, 60.0, 76.0, 45.0, 85.0,
       "Angle between the steering axis and the ground."),
    m!("head_tube_mm", "Head tube length", Mm, 60.0, 250.0, 30.0, 400.0,
       "Length of the head tube along the steering axis, top centre to bottom."),
    m!("headset_lower_mm", "Lower headset stack", Mm, 0.0, 25.0, 0.0, 60.0,
       "From the bottom of the head tube to the fork crown race seat, along the axis (0 for internal cups)."),
    m!("fork_a2c_mm", "Fork axle-to-crown", Mm, 340.0, 600.0, 250.0, 700.0,
       "From the front axle centre to the crown race seat, measured parallel to the steering axis."),
    m!("fork_offset_mm", "Fork offset", Mm, 25.0, 60.0, -20.0, 100.0,
       "Perpendicular distance from the steering axis to the front axle centre."),
    m!("chainstay_mm", "Chainstay", Mm, 380.0, 470.0, 250.0, 600.0,
       "Straight distance from the bottom bracket centre to the rear axle centre."),
    m!("rear_centre_mm", "Rear centre", Mm, 370.0, 470.0, 200.0, 600.0,
       "Horizontal distance from the bottom bracket centre back to the rear axle."),
    m!("front_centre_mm", "Front centre", Mm, 550.0, 900.0, 350.0, 1200.0,
       "Horizontal distance from the bottom bracket centre forward to the front axle."),
    m!("wheelbase_mm", "Wheelbase", Mm, 950.0, 1350.0, 600.0, 1700.0,
       "Horizontal distance between the two axles."),
    m!("bb_drop_mm", "BB drop", Mm, -30.0, 85.0, -150.0, 150.0,
       "How far the bottom bracket centre sits below the rear axle centre (positive = below)."),
    m!("bb_height_mm", "BB height", Mm, 240.0, 380.0, 100.0, 500.0,
       "Height of the bottom bracket centre above the ground."),
    m!("seat_angle_actual_deg", "Seat tube angle (actual)", Deg, 65.0, 80.0, 45.0, 90.0,
       "Angle between the seat tube axis and the ground, on the rear side."),
    m!("seat_axis_offset_mm", "Seat axis offset", Mm, -60.0, 60.0, -200.0, 200.0,
       "At bottom bracket height, horizontal distance from the BB centre to the seat tube axis (positive = in front)."),
    m!("seat_angle_effective_deg", "Seat tube angle (effective)", Deg, 68.0, 82.0, 45.0, 100.0,
       "Angle to the ground of the line from the BB centre to the seat axis at stack height (or the stated reference height)."),
    m!("top_tube_effective_mm", "Effective top tube", Mm, 450.0, 720.0, 250.0, 1000.0,
       "Horizontal distance from the top of the head tube back to the seat axis, at stack height."),
    m!("seat_tube_mm", "Seat tube length", Mm, 300.0, 560.0, 150.0, 800.0,
       "Along the seat axis, from its point nearest the BB centre to the top of the seat tube."),
    m!("trail_mm", "Trail", Mm, 50.0, 160.0, -50.0, 300.0,
       "On the ground, horizontal distance from where the steering axis meets it back to the front tyre's contact point."),
    m!("standover_mm", "Standover", Mm, 600.0, 900.0, 300.0, 1200.0,
       "Height of the top tube above the ground where the rider stands over the bike; shown as published and not checked, as it depends on the top tube's shape."),
];

/// The catalogue entry for `key`, if it is a frame measurement.
pub fn lookup(key: &str) -> Option<&'static Measurement> {
    CATALOGUE.iter().find(|m| m.key == key)
}

/// All keys, comma-separated, for error messages.
pub fn all_keys() -> String {
    CATALOGUE
        .iter()
        .map(|m| m.key)
        .collect::<Vec<_>>()
        .join(", ")
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn keys_are_unique_units_match_names_and_ranges_nest() {
        for (i, m) in CATALOGUE.iter().enumerate() {
            assert!(
                CATALOGUE.iter().skip(i + 1).all(|o| o.key != m.key),
                "duplicate {}",
                m.key
            );
            let suffix = if m.unit == Unit::Mm { "_mm" } else { "_deg" };
            assert!(m.key.ends_with(suffix), "{} unit", m.key);
            assert!(
                m.hard.0 <= m.plausible.0
                    && m.plausible.0 < m.plausible.1
                    && m.plausible.1 <= m.hard.1,
                "{}",
                m.key
            );
            assert!(!m.definition.is_empty() && !m.label.is_empty());
        }
        assert_eq!(CATALOGUE.len(), 20);
        // The table in the module docs matches the catalogue, row for row.
        let src = include_str!("catalogue.rs");
        let num = |v: f64| format!("{v}");
        for m in CATALOGUE {
            let row = format!(
                "//! | `{}` | {} | {} | {} … {} | {} … {} |",
                m.key,
                m.label,
                m.unit.symbol(),
                num(m.plausible.0),
                num(m.plausible.1),
                num(m.hard.0),
                num(m.hard.1)
            );
            assert!(src.contains(&row), "doc row missing: {row}");
        }
        assert_eq!(lookup("trail_mm").map(|m| m.unit), Some(Unit::Mm));
        assert!(lookup("reach").is_none());
    }
}
