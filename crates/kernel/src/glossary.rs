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
pub static TERMS: &[Term] = &[
    t!("mechanical_trail_mm", "Mechanical trail", "Trail measured square to the steering axis: ground trail times the sine of the head angle."),
    t!("wheel_flop_mm", "Wheel flop", "How far the front of the bike drops as the bar turns: trail times the sine and cosine of the head angle."),
    t!("steer_axis_height_at_axle_mm", "Steering axis height at the axle", "Height of the steering axis above the ground on the vertical through the front axle."),
    t!("iso_window_min_mm", "Axis height at the axle, ISO lowest", "0.15 times the front tyre radius: the lowest steering axis height at the axle in the ISO 4210-2 Annex A steering guide."),
    t!("iso_window_max_mm", "Axis height at the axle, ISO highest", "0.60 times the front tyre radius: the highest steering axis height at the axle in the ISO 4210-2 Annex A steering guide."),
    t!("grip_x_mm", "Grip reach", "Horizontal distance from the BB centre forward to the grip centre, as ridden."),
    t!("grip_y_mm", "Grip height", "Vertical distance from the BB centre up to the grip centre, as ridden."),
    t!("bb_to_grip_mm", "BB-to-grip distance", "Straight distance from the BB centre to the grip centre, as ridden."),
    t!("bb_to_grip_angle_deg", "BB-to-grip angle", "Angle above horizontal of the line from the BB centre to the grip centre."),
    t!("bar_clamp_x_mm", "Bar clamp, ahead of BB", "Horizontal distance from the BB centre to the stem's bar clamp centre, as ridden."),
    t!("bar_clamp_y_mm", "Bar clamp, above BB", "Vertical distance from the BB centre to the stem's bar clamp centre, as ridden."),
    t!("stem_clamp_x_mm", "Stem clamp, ahead of BB", "Horizontal distance from the BB centre to the middle of the stem's steerer clamp, as ridden."),
    t!("stem_clamp_y_mm", "Stem clamp, above BB", "Vertical distance from the BB centre to the middle of the stem's steerer clamp, as ridden."),
    t!("bar_rise_mm", "Bar rise", "Height of the grip centre above the bar clamp centre, as set up."),
    t!("bar_pullback_mm", "Bar pullback", "How far the grip centre sits behind the bar clamp centre, as set up."),
    t!("saddle_height_mm", "Saddle height", "From the BB centre to the top of the saddle, along the seat tube axis."),
    t!("saddle_setback_mm", "Saddle setback", "How far the saddle's sit point sits behind the seat tube axis, horizontally; a setback measured from the BB is the results' Sit point from BB, horizontal."),
    t!("saddle_to_grip_mm", "Saddle-to-grip distance", "Straight distance from the saddle's sit point to the grip centre."),
    t!("saddle_to_grip_drop_mm", "Saddle-to-grip drop", "How far the grip centre sits below the saddle's sit point (negative: above)."),
    t!("saddle_x_mm", "Sit point from BB, horizontal", "Horizontal distance from the BB centre to the saddle's sit point, as ridden (negative is behind): a fitter's setback from the BB, to the sit point."),
    t!("saddle_y_mm", "Sit point above BB", "Vertical distance from the BB centre up to the saddle's sit point."),
    t!("saddle_to_pedal_mm", "Saddle to pedal", "From the saddle top to the pedal spindle with the crank in line with the seat tube."),
    t!("seat_angle_at_saddle_deg", "Seat angle at the saddle", "Angle to the ground of the line from the BB centre to the saddle's sit point."),
    t!("post_exposed_mm", "Seatpost showing", "Length of seatpost above the top of the seat tube."),
    t!("dropper_max_travel_mm", "Longest dropper that fits", "The longest dropper travel that fits this frame and saddle height."),
    t!("toe_clearance_mm", "Toe clearance", "Gap between the toe and the front tyre with the wheel straight and the crank forward; negative means they overlap."),
    t!("toe_overlap_mm", "Toe overlap", "How far the toe reaches into the front tyre's path with the wheel straight and the crank forward; 0 when they clear."),
    t!("saddle_height_lowest_mm", "Lowest saddle height", "The lowest saddle height: the seatpost as deep as the frame and the post allow."),
    t!("saddle_height_highest_mm", "Highest saddle height", "The highest saddle height with the seatpost at its minimum insertion."),
    t!("pedal_strike_lean_deg", "Lean at pedal strike", "How far the bike can lean, crank down, before the pedal touches the ground."),
    t!("com_x_mm", "Centre of mass, ahead of BB", "Horizontal distance from the BB centre to the rider-plus-bike centre of mass."),
    t!("com_y_mm", "Centre of mass, above BB", "Vertical distance from the BB centre up to the rider-plus-bike centre of mass."),
    t!("com_height_mm", "Centre of mass height", "Height of the rider-plus-bike centre of mass above the ground."),
    t!("front_load_pct", "Front load share", "Share of the total weight carried by the front wheel, standing still on level ground."),
    t!("front_load_braking_pct", "Front load share, braking", "Share of the total weight on the front wheel while braking at the chosen rate."),
    t!("braking_g", "Braking", "The braking rate used for the braking checks, as a multiple of gravity."),
    t!("slope_deg", "Slope", "The slope used for the braking check; positive uphill."),
    t!("total_mass_kg", "Total mass", "Rider plus bike."),
    t!("pitch_over_decel_g", "Braking limit", "Braking on level ground at which the rear wheel lifts: horizontal distance from the centre of mass to the front contact over its height, in g."),
    t!("pitch_over_decel_slope_g", "Braking limit on the slope", "Braking at which the rear wheel lifts on the chosen slope, in g."),
    t!("front_tip_slope_deg", "Steepest static descent", "Steepest downhill slope, standing still, before the rider and bike tip over the front wheel."),
    t!("rear_tip_slope_deg", "Steepest static climb", "Steepest uphill slope, standing still, before the front wheel lifts."),
    t!("knee_flexion_bdc_deg", "Knee bend at the bottom", "Knee bend from straight with the pedal at the bottom of the stroke."),
    t!("knee_angle_tdc_deg", "Knee angle at the top", "Inside knee angle with the pedal at the top of the stroke."),
    t!("hip_angle_tdc_deg", "Hip angle at the top", "Inside angle between torso and thigh with the pedal at the top of the stroke."),
    t!("torso_angle_deg", "Torso angle", "Angle of the line from hip to shoulder above horizontal."),
    t!("shoulder_angle_deg", "Shoulder angle", "Angle between the torso and the upper arm."),
    t!("elbow_angle_deg", "Elbow angle", "Inside angle of the elbow: 180° is a straight arm."),
    t!("hip_x_mm", "Hip, ahead of BB", "Horizontal distance from the BB centre to the hip joint (negative is behind)."),
    t!("hip_y_mm", "Hip, above BB", "Vertical distance from the BB centre up to the hip joint."),
    t!("hip_height_mm", "Hip height", "Height of the hip joint above the ground, standing on the pedals."),
    t!("shoulder_x_mm", "Shoulder, ahead of BB", "Horizontal distance from the BB centre to the shoulder joint."),
    t!("shoulder_y_mm", "Shoulder, above BB", "Vertical distance from the BB centre up to the shoulder joint."),
    t!("arm_extension_room_mm", "Room to push the bike forward", "How far the hands can move forward, standing, before the arms are straight."),
    t!("arm_fold_room_mm", "Room to pull the bike back", "How far the hands can move back, standing, before the arms fold fully."),
    t!("knee_angle_front_deg", "Front knee angle", "Inside angle of the front knee, standing on level pedals."),
    t!("knee_angle_rear_deg", "Rear knee angle", "Inside angle of the rear knee, standing on level pedals."),
    t!("knee_bend_max_deg", "Knee bend, standing", "The larger knee bend from straight, standing on level pedals."),
];

/// The short label of any report key: a catalogue label, else a term label.
pub fn label(key: &str) -> Option<&'static str> {
    crate::catalogue::lookup(key)
        .map(|m| m.label)
        .or_else(|| term(key).map(|t| t.label))
}

/// Shorter names for narrow places (the drawing's dimension labels, the phone's strip of key
/// numbers), where the label would not fit; the label stays the full name (a title or a table).
#[rustfmt::skip]
pub static SHORT_LABELS: &[(&str, &str)] = &[
    ("head_angle_deg", "Head angle"),
    ("bb_to_grip_mm", "BB to grip"),
];

/// The name of a report key for a narrow place: its short name, else its label.
pub fn short_label(key: &str) -> Option<&'static str> {
    SHORT_LABELS
        .iter()
        .find(|(k, _)| *k == key)
        .map(|(_, short)| *short)
        .or_else(|| label(key))
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

    #[test]
    fn short_labels_are_shorter_names_of_known_keys() {
        for (key, short) in SHORT_LABELS {
            let full = label(key).unwrap_or_default();
            assert!(
                !full.is_empty() && short.len() < full.len(),
                "{key}: {short} / {full}"
            );
        }
        assert_eq!(short_label("bb_to_grip_mm"), Some("BB to grip"));
        assert_eq!(short_label("head_angle_deg"), Some("Head angle"));
        assert_eq!(short_label("reach_mm"), Some("Reach"));
        assert_eq!(short_label("nonsense"), None);
    }
}
