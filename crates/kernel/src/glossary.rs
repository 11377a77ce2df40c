//! Words for the report's numbers that are not frame measurements (those are in
//! [`crate::catalogue`]): derived steering numbers, cockpit, fit and handling. One label and one
//! sentence per key; the page and the drawing take their words from here and the catalogue.

use serde::Serialize;

/// One number of the report that is not a frame measurement.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct Term {
    /// Report key, e.g. `bb_to_grip_mm`.
    pub key: &'static str,
    /// Short label.
    pub label: &'static str,
    /// One sentence: what it is and how it is measured.
    pub definition: &'static str,
}

macro_rules! t {
    ($key:literal, $label:literal, $def:literal) => {
        Term {
            key: $key,
            label: $label,
            definition: $def,
        }
    };
}

/// Definitions of the report's other numbers (derived, cockpit, fit, handling).
#[rustfmt::skip]
pub const TERMS: &[Term] = &[
    t!("mechanical_trail_mm", "Mechanical trail", "Trail measured square to the steering axis: ground trail times the sine of the head angle."),
    t!("wheel_flop_mm", "Wheel flop", "How far the front of the bike drops as the bar turns: trail times the sine and cosine of the head angle."),
    t!("steer_axis_height_at_axle_mm", "Steering axis height at the axle", "Height of the steering axis above the ground on the vertical through the front axle."),
    t!("iso_window_min_mm", "Trail window, low end", "0.15 times the front tyre radius: the low end of the ISO 4210-2 Annex A steering window."),
    t!("iso_window_max_mm", "Trail window, high end", "0.60 times the front tyre radius: the high end of the ISO 4210-2 Annex A steering window."),
    t!("grip_x_mm", "Grip reach", "Horizontal distance from the BB centre forward to the grip centre, as ridden."),
    t!("grip_y_mm", "Grip height", "Vertical distance from the BB centre up to the grip centre, as ridden."),
    t!("bb_to_grip_mm", "BB-to-grip distance", "Straight distance from the BB centre to the grip centre, as ridden."),
    t!("bb_to_grip_angle_deg", "BB-to-grip angle", "Angle above horizontal of the line from the BB centre to the grip centre."),
    t!("saddle_to_grip_mm", "Saddle-to-grip distance", "Straight distance from the saddle's sit point to the grip centre."),
    t!("saddle_x_mm", "Saddle position", "Horizontal distance from the BB centre to the saddle's sit point (negative is behind)."),
    t!("saddle_y_mm", "Saddle height above BB", "Vertical distance from the BB centre up to the saddle's sit point."),
    t!("seat_angle_at_saddle_deg", "Seat angle at the saddle", "Angle to the ground of the line from the BB centre to the saddle's sit point."),
    t!("spacer_stack_mm", "Spacer stack", "Spacers under the stem, compared with the fork maker's limit."),
    t!("post_exposed_mm", "Seatpost showing", "Length of seatpost above the top of the seat tube."),
    t!("post_insertion_mm", "Seatpost inserted", "Length of seatpost inside the frame."),
    t!("dropper_max_travel_mm", "Longest dropper that fits", "The longest dropper travel that fits this frame and saddle height."),
    t!("toe_overlap_mm", "Toe overlap", "How far the toe reaches past the front tyre with the wheel straight and the crank forward; positive means they can touch."),
    t!("com_x_mm", "Centre of mass, ahead of BB", "Horizontal distance from the BB centre to the rider-plus-bike centre of mass."),
    t!("com_y_mm", "Centre of mass, above BB", "Vertical distance from the BB centre up to the rider-plus-bike centre of mass."),
    t!("com_height_mm", "Centre of mass height", "Height of the rider-plus-bike centre of mass above the ground."),
    t!("front_load_pct", "Front load share", "Share of the total weight carried by the front wheel, standing still on level ground."),
    t!("front_load_braking_pct", "Front load share, braking", "Share of the total weight on the front wheel while braking at the chosen rate."),
    t!("pitch_over_decel_g", "Braking limit", "Braking on level ground at which the rear wheel lifts: horizontal distance from the centre of mass to the front contact over the centre of mass height, in g."),
    t!("front_tip_slope_deg", "Steepest static descent", "Steepest downhill slope, standing still, before the rider and bike tip over the front wheel."),
    t!("rear_tip_slope_deg", "Steepest static climb", "Steepest uphill slope, standing still, before the front wheel lifts."),
    t!("pitch_over_decel_slope_g", "Braking limit on the slope", "Braking limit on the chosen slope, in g."),
    t!("knee_angle_bdc_deg", "Knee angle at the bottom", "Knee bend from straight with the pedal at the bottom of the stroke."),
    t!("hip_angle_tdc_deg", "Hip angle at the top", "Inside angle between torso and thigh with the pedal at the top of the stroke."),
    t!("torso_angle_deg", "Torso angle", "Angle of the line from hip to shoulder above horizontal."),
    t!("shoulder_angle_deg", "Shoulder angle", "Angle between the torso and the upper arm."),
    t!("elbow_angle_deg", "Elbow angle", "Elbow bend from a straight arm."),
    t!("reach_ratio_pct", "Reach comfort", "How much of the arm's length the grip asks for, standing."),
];

/// The short label of any report key: a catalogue label, else a term label.
pub fn label(key: &str) -> Option<&'static str> {
    crate::catalogue::lookup(key)
        .map(|m| m.label)
        .or_else(|| term(key).map(|t| t.label))
}

/// The term with this key.
pub fn term(key: &str) -> Option<&'static Term> {
    TERMS.iter().find(|t| t.key == key)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn terms_are_unique_defined_and_not_frame_keys() {
        for (i, t) in TERMS.iter().enumerate() {
            assert!(
                TERMS.iter().skip(i + 1).all(|o| o.key != t.key),
                "dup {}",
                t.key
            );
            assert!(crate::catalogue::lookup(t.key).is_none(), "{}", t.key);
            assert!(
                t.definition.ends_with('.') && !t.label.is_empty(),
                "{}",
                t.key
            );
        }
        assert_eq!(label("reach_mm"), Some("Reach"));
        assert_eq!(label("bb_to_grip_mm"), Some("BB-to-grip distance"));
        assert_eq!(label("nonsense"), None);
    }
}
