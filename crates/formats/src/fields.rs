//! The page's words in one place: every input field (group, label, unit, demo value, one-sentence
//! definition) and the definitions of the report's numbers that are not frame measurements.
//!
//! Frame measurements take their label and definition from the kernel's catalogue
//! ([`framewise_kernel::CATALOGUE`]); everything else is defined here. The page builds its form and
//! its explanations from [`page_words`] and adds no wording of its own to numbers.

use framewise_kernel::error::in_sentence;
use framewise_kernel::glossary::{Term, TERMS};
use framewise_kernel::lookup;
use serde::Serialize;
use std::collections::BTreeMap;

/// What a field holds, which decides the unit shown beside it and how its text is read.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "snake_case")]
pub enum Kind {
    /// A length in millimetres (cm and inches accepted).
    Mm,
    /// An angle in degrees.
    Deg,
    /// A percentage.
    Pct,
    /// A mass in kilograms.
    Kg,
    /// A multiple of the acceleration of gravity.
    G,
    /// A wheel size such as `29x2.4` or `62-622`.
    Wheel,
    /// Plain text.
    Text,
    /// One of a few words (see [`Field::choices`]).
    Choice,
}

impl Kind {
    /// The unit mark shown beside the field.
    pub fn unit(self) -> &'static str {
        match self {
            Kind::Mm => "mm",
            Kind::Deg => "°",
            Kind::Pct => "%",
            Kind::Kg => "kg",
            Kind::G => "g",
            Kind::Wheel => "size",
            Kind::Text | Kind::Choice => "",
        }
    }
}

/// One input of the page.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct Field {
    /// Form field name: the scenario path below the bike (`frame.reach_mm`, `rider.height_mm`).
    pub name: &'static str,
    /// Group id (see [`GROUPS`]).
    pub group: &'static str,
    /// Shown without opening the group's "more" disclosure.
    pub common: bool,
    /// Short label.
    pub label: &'static str,
    /// One sentence: what it is and how it is measured.
    pub definition: &'static str,
    /// What the field holds.
    pub kind: Kind,
    /// The unit mark shown beside the field.
    pub unit: &'static str,
    /// The invented demo bike's and rider's value ("" = blank).
    pub demo: &'static str,
    /// The allowed words of a [`Kind::Choice`] field (the first is the default).
    pub choices: &'static [&'static str],
}

/// One group of inputs: what a person has in hand.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct Group {
    /// Id used by [`Field::group`].
    pub id: &'static str,
    /// Heading.
    pub title: &'static str,
    /// One line under the heading.
    pub hint: &'static str,
}

/// The input groups in page order.
pub static GROUPS: &[Group] = &[
    Group {
        id: "frame",
        title: "Frame numbers from the listing",
        hint: "Type what the geometry table gives: mm, cm or inches; a number without its unit is read as mm, or as cm or inches when only they fit. Leave the rest blank.",
    },
    Group {
        id: "wheels",
        title: "Wheels and fork",
        hint: "Stock wheels and the fork the frame was measured with.",
    },
    Group {
        id: "cockpit",
        title: "Cockpit",
        hint: "Headset, spacers, stem and bar as fitted.",
    },
    Group {
        id: "seat",
        title: "Saddle, seatpost and cranks",
        hint: "Measured on the bike.",
    },
    Group {
        id: "rider",
        title: "Rider",
        hint: "Body measurements; estimates from height fill the gaps.",
    },
    Group {
        id: "changes",
        title: "Changes from stock",
        hint: "A different fork, angle cups, other wheels, sag.",
    },
];

macro_rules! frame {
    ($name:literal, $group:literal, $common:expr, $demo:literal) => {
        Field {
            name: $name,
            group: $group,
            common: $common,
            label: "",
            definition: "",
            kind: Kind::Mm,
            unit: "",
            demo: $demo,
            choices: &[],
        }
    };
}

macro_rules! f {
    ($name:literal, $group:literal, $common:expr, $kind:ident, $demo:literal, $label:literal, $def:literal) => {
        Field {
            name: $name,
            group: $group,
            common: $common,
            label: $label,
            definition: $def,
            kind: Kind::$kind,
            unit: "",
            demo: $demo,
            choices: &[],
        }
    };
}

/// Every input of the page, in page order. Frame fields take label and definition from the
/// catalogue (see [`fields`]).
#[rustfmt::skip]
const RAW: &[Field] = &[
    f!("label", "frame", true, Text, "Demo trail bike, size 3", "Bike name", "A short name for this bike, shown on the drawing."),
    frame!("frame.reach_mm", "frame", true, "470"),
    frame!("frame.stack_mm", "frame", true, "635"),
    frame!("frame.head_angle_deg", "frame", true, "65"),
    frame!("frame.seat_angle_effective_deg", "frame", true, ""),
    frame!("frame.head_tube_mm", "frame", true, "110"),
    frame!("frame.chainstay_mm", "frame", true, "435"),
    frame!("frame.wheelbase_mm", "frame", true, ""),
    frame!("frame.bb_drop_mm", "frame", true, ""),
    frame!("frame.seat_tube_mm", "frame", true, "430"),
    frame!("frame.seat_angle_actual_deg", "frame", false, "76.5"),
    frame!("frame.headset_lower_mm", "frame", false, "12"),
    frame!("frame.top_tube_effective_mm", "frame", false, ""),
    frame!("frame.rear_centre_mm", "frame", false, ""),
    frame!("frame.front_centre_mm", "frame", false, ""),
    frame!("frame.bb_height_mm", "frame", false, ""),
    frame!("frame.seat_axis_offset_mm", "frame", false, ""),
    frame!("frame.trail_mm", "frame", false, ""),
    frame!("frame.standover_mm", "frame", false, ""),
    f!("wheels.front", "wheels", true, Wheel, "29x2.4", "Front wheel", "Rim and tyre as a common size with tyre width (29x2.4, 27.5x2.5, 700x32c) or ETRTO width-BSD (62-622)."),
    f!("wheels.rear", "wheels", true, Wheel, "29x2.4", "Rear wheel", "Rim and tyre as a common size with tyre width (29x2.4, 27.5x2.5, 700x32c) or ETRTO width-BSD (62-622)."),
    frame!("frame.fork_a2c_mm", "wheels", true, "561"),
    frame!("frame.fork_offset_mm", "wheels", true, "44"),
    f!("setup.headset_upper_mm", "cockpit", true, Mm, "8", "Upper headset stack", "From the top of the head tube to the top of the upper headset cover, along the steerer."),
    f!("setup.spacers_mm", "cockpit", true, Mm, "10", "Spacers", "Total height of the spacers between the headset and the stem."),
    f!("setup.stem_mm", "cockpit", true, Mm, "45", "Stem length", "From the steerer axis to the bar clamp centre, along the stem."),
    f!("setup.stem_angle_deg", "cockpit", true, Deg, "0", "Stem angle", "Angle of the stem to a line square to the steerer; positive points up."),
    f!("setup.bar_rise_mm", "cockpit", true, Mm, "25", "Bar rise", "Height of the grip centre above the bar clamp centre."),
    f!("setup.bar_pullback_mm", "cockpit", true, Mm, "30", "Bar pullback", "How far the grip centre sits behind the bar clamp centre."),
    f!("setup.stem_stack_mm", "cockpit", false, Mm, "40", "Stem clamp height", "Height of the stem's steerer clamp."),
    f!("setup.bar_width_mm", "cockpit", false, Mm, "", "Bar width", "Bar width from end to end."),
    f!("setup.bar_backsweep_deg", "cockpit", false, Deg, "", "Bar backsweep", "Angle the bar ends sweep back from a straight line across the clamp."),
    f!("setup.bar_upsweep_deg", "cockpit", false, Deg, "", "Bar upsweep", "Angle the bar ends sweep up from level."),
    f!("setup.bar_roll_deg", "cockpit", false, Deg, "", "Bar roll", "How far the bar is rotated in the clamp; positive rolls it back and up."),
    f!("setup.spacer_limit_mm", "cockpit", false, Mm, "", "Spacer limit", "The fork maker's largest spacer stack under the stem (40 mm if blank)."),
    Field { name: "setup.bar_type", group: "cockpit", common: false, label: "Bar type", definition: "A flat or riser bar, or a drop bar with hoods and drops.", kind: Kind::Choice, unit: "", demo: "flat", choices: &["flat", "drop"] },
    f!("setup.bar_reach_mm", "cockpit", false, Mm, "", "Drop bar reach", "From the bar clamp centre forward to the furthest point of the bend."),
    f!("setup.bar_drop_mm", "cockpit", false, Mm, "", "Drop bar drop", "From the bar clamp centre down to the centre of the drops."),
    f!("setup.hood_reach_mm", "cockpit", false, Mm, "", "Hood reach", "From the bar clamp centre forward to where the hand holds the hoods."),
    f!("setup.hood_drop_mm", "cockpit", false, Mm, "", "Hood drop", "How far the hand on the hoods sits below the bar clamp centre."),
    Field { name: "setup.hand_position", group: "cockpit", common: false, label: "Hands on", definition: "Where the hands hold a drop bar for the fit numbers.", kind: Kind::Choice, unit: "", demo: "hoods", choices: &["hoods", "drops", "tops"] },
    f!("setup.saddle_height_mm", "seat", true, Mm, "735", "Saddle height", "From the BB centre to the top of the saddle, along the seat tube axis."),
    f!("setup.crank_mm", "seat", true, Mm, "170", "Crank length", "From the BB axle centre to the pedal spindle centre."),
    f!("setup.saddle_setback_mm", "seat", true, Mm, "", "Saddle setback", "How far the saddle's sit point sits behind the seat tube axis, horizontally; a setback measured from the BB is the results' Sit point from BB, horizontal."),
    f!("setup.dropper_travel_mm", "seat", true, Mm, "", "Dropper travel", "How far the dropper post goes down; blank for a rigid post."),
    f!("setup.post_offset_mm", "seat", false, Mm, "", "Seatpost offset", "How far the seatpost clamp sits behind the post's axis."),
    f!("setup.saddle_stack_mm", "seat", false, Mm, "", "Saddle stack", "Height of the saddle top above the seatpost clamp."),
    f!("setup.max_insertion_mm", "seat", false, Mm, "", "Frame insertion depth", "The deepest a seatpost can go below the top of the seat tube."),
    f!("setup.post_length_mm", "seat", false, Mm, "", "Seatpost length", "Total length of the seatpost."),
    f!("setup.post_min_insertion_mm", "seat", false, Mm, "", "Seatpost minimum insertion", "The post's minimum insertion mark, measured from its bottom."),
    f!("rider.height_mm", "rider", true, Mm, "1780", "Height", "Standing height, barefoot."),
    f!("rider.mass_kg", "rider", true, Kg, "74", "Body mass", "Body mass with riding kit."),
    f!("rider.inseam_mm", "rider", true, Mm, "840", "Inseam", "From the floor to the crotch, barefoot, standing straight."),
    f!("rider.arm_mm", "rider", false, Mm, "", "Arm length", "From the shoulder joint to the centre of a closed fist."),
    f!("rider.torso_mm", "rider", false, Mm, "", "Torso length", "From the hip joint to the shoulder joint."),
    f!("rider.shoe_stack_mm", "rider", false, Mm, "", "Shoe and pedal stack", "From the pedal spindle to the ball of the foot, through the sole."),
    f!("rider.foot_position_mm", "rider", false, Mm, "", "Foot position", "Ball of the foot ahead of the pedal spindle; negative is behind."),
    f!("rider.elbow_bend_deg", "rider", false, Deg, "", "Elbow bend, seated", "Elbow bend assumed when seated, in degrees from a straight arm."),
    f!("rider.standing_knee_bend_deg", "rider", false, Deg, "", "Knee bend, standing", "Knee bend when standing on level pedals, in degrees from a straight leg."),
    f!("rider.braking_g", "rider", false, G, "", "Braking", "Braking deceleration for the front-load check, as a multiple of gravity."),
    f!("rider.slope_deg", "rider", false, Deg, "", "Slope", "Slope for the braking check; positive uphill, negative downhill."),
    f!("setup.bike_mass_kg", "rider", false, Kg, "", "Bike mass", "Mass of the bike as ridden."),
    f!("changes.fork_a2c_delta_mm", "changes", true, Mm, "", "Fork longer by", "How much longer the new fork's axle-to-crown is than stock; negative is shorter."),
    f!("changes.fork_offset_mm", "changes", true, Mm, "", "New fork offset", "The new fork's offset; blank keeps the stock offset."),
    f!("changes.headset_angle_deg", "changes", true, Deg, "", "Angle headset", "Angle-adjusting headset cups; negative makes the head angle slacker."),
    f!("changes.wheels.front", "changes", true, Wheel, "", "New front wheel", "A different front wheel or tyre; blank keeps the stock one."),
    f!("changes.wheels.rear", "changes", true, Wheel, "", "New rear wheel", "A different rear wheel or tyre; blank keeps the stock one."),
    f!("changes.fork_travel_mm", "changes", true, Mm, "", "Fork travel", "The fork's travel."),
    f!("changes.front_sag_pct", "changes", true, Pct, "", "Front sag", "Share of the fork travel used with the rider on board."),
    f!("changes.rear_travel_mm", "changes", true, Mm, "", "Rear travel", "Rear wheel travel."),
    f!("changes.rear_sag_pct", "changes", true, Pct, "", "Rear sag", "Share of the rear wheel travel used with the rider on board."),
    f!("changes.pivot_x_mm", "changes", false, Mm, "", "Main pivot, ahead of BB", "Main pivot position ahead of the BB centre, in frame axes (negative is behind)."),
    f!("changes.pivot_y_mm", "changes", false, Mm, "", "Main pivot, above BB", "Main pivot height above the BB centre, in frame axes."),
];

/// Every input field of the page, with catalogue labels and definitions filled in and the unit
/// mark set.
pub fn fields() -> Vec<Field> {
    RAW.iter().map(filled).collect()
}

fn filled(f: &Field) -> Field {
    let mut f = *f;
    if let Some(m) = f.name.strip_prefix("frame.").and_then(lookup) {
        f.label = m.label;
        f.definition = m.definition;
        f.kind = if m.unit.symbol() == "mm" {
            Kind::Mm
        } else {
            Kind::Deg
        };
    }
    f.unit = f.kind.unit();
    f
}

/// The field with this form name.
pub fn field(name: &str) -> Option<Field> {
    RAW.iter().find(|f| f.name == name).map(filled)
}

/// Everything the page shows in words: groups, fields, the other numbers' definitions.
#[derive(Debug, Clone, Serialize)]
pub struct PageWords {
    /// Input groups in order.
    pub groups: &'static [Group],
    /// Inputs in order.
    pub fields: Vec<Field>,
    /// Definitions of non-frame report numbers.
    pub terms: &'static [Term],
    /// Shorter names for narrow places, `[key, name]` pairs
    /// ([`framewise_kernel::glossary::SHORT_LABELS`]).
    pub short_labels: &'static [(&'static str, &'static str)],
}

/// The page's words (see [`PageWords`]).
pub fn page_words() -> PageWords {
    PageWords {
        groups: GROUPS,
        fields: fields(),
        terms: TERMS,
        short_labels: framewise_kernel::glossary::SHORT_LABELS,
    }
}

/// One sentence per published value that disagrees with the others (`consistent == false`):
/// for a suspect (a likely misprint, [`framewise_kernel::Residual::suspect`]), or any marked value
/// when there is none, what was published, what the *other* published numbers alone make it (the
/// report's `from_others`, not the best fit, which includes the value itself) and the gap, and
/// what that means. A value marked only because the fit spread the suspects' disagreement over it
/// says so and names them, in the order the kernel's `inconsistent` warning names them; a
/// prediction outside the plausible range is never quoted as what the number should be. A value
/// no other number checks says so.
pub fn residual_notes(bike: &framewise_kernel::BikeReport) -> BTreeMap<String, String> {
    // "wheelbase and reach": the names and the order of the kernel's warning
    // ([`framewise_kernel::BikeReport::suspects`]).
    let mut suspects = String::new();
    let mut last = "";
    for key in &bike.suspects {
        if !last.is_empty() {
            suspects.push_str(if suspects.is_empty() { "" } else { ", " });
            suspects.push_str(&in_sentence(last));
        }
        last = lookup(key).map_or(key.as_str(), |m| m.label);
    }
    if !last.is_empty() {
        suspects.push_str(if suspects.is_empty() { "" } else { " and " });
        suspects.push_str(&in_sentence(last));
    }
    bike.residuals
        .iter()
        .filter(|(_, r)| !r.consistent)
        .map(|(key, r)| (key.clone(), residual_note(key, r, &suspects)))
        .fold(BTreeMap::new(), crate::inserted)
}

/// The note of one row; `suspects` names the suspects ("" when none).
fn residual_note(key: &str, r: &framewise_kernel::Residual, suspects: &str) -> String {
    let (label, degrees, plausible) = match lookup(key) {
        Some(m) => (m.label, m.unit.symbol() == "°", m.plausible),
        None => (key, false, (f64::MIN, f64::MAX)),
    };
    let fmt = framewise_kernel::error::fmt_disagreement;
    let quote = r
        .from_others
        .filter(|p| (plausible.0..=plausible.1).contains(p) && (r.suspect || suspects.is_empty()));
    if let Some(other) = quote {
        let [given, other, away] = fmt(r.given, other, degrees);
        return format!(
            "{label} is published as {given} but the other published numbers make it {other}, {away} away, more than rounding explains: this value or one it is checked against is probably a misprint or measured another way."
        );
    }
    let [given, solved, _] = fmt(r.given, r.solved, degrees);
    if r.from_others.is_none() {
        return format!(
            "{label} is published as {given}, which no other published number checks, yet the fitted frame makes it {solved}: check it for a typing error."
        );
    }
    let of = if suspects.is_empty() {
        String::new()
    } else {
        format!(" only to spread the disagreement of {suspects}")
    };
    format!("{label} is published as {given}; the fit moved it to {solved}{of} (see the warnings).")
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn every_field_is_labelled_defined_grouped_and_unique() {
        let all = fields();
        for (i, f) in all.iter().enumerate() {
            assert!(
                !f.label.is_empty() && f.definition.ends_with('.'),
                "{}",
                f.name
            );
            assert!(GROUPS.iter().any(|g| g.id == f.group), "{}", f.name);
            assert!(
                all.iter().skip(i + 1).all(|o| o.name != f.name),
                "dup {}",
                f.name
            );
            let numeric = !matches!(f.kind, Kind::Text | Kind::Choice);
            assert_eq!(numeric, !f.unit.is_empty(), "{}", f.name);
        }
    }

    #[test]
    fn every_catalogue_key_is_an_input() {
        for m in framewise_kernel::CATALOGUE {
            let name = format!("frame.{}", m.key);
            let f = field(&name).unwrap();
            assert_eq!((f.label, f.definition), (m.label, m.definition));
        }
    }

    #[test]
    fn every_number_of_the_demo_report_has_words() {
        let form = fields()
            .into_iter()
            .map(|f| (f.name.to_string(), f.demo.to_string()))
            .collect();
        let (s, _) = crate::scenario_from_form(&form);
        let r = framewise_kernel::evaluate(&s);
        let b = &r.bikes[0];
        let keys = [
            &b.ridden,
            &b.derived,
            &b.fit.seated,
            &b.fit.standing,
            &b.handling.seated,
        ]
        .into_iter()
        .flat_map(|m| m.keys());
        for key in keys {
            let words = framewise_kernel::glossary::label(key);
            assert!(words.is_some(), "{key} has no label or definition");
        }
    }

    #[test]
    fn the_demo_values_read_without_errors() {
        let form = fields()
            .into_iter()
            .map(|f| (f.name.to_string(), f.demo.to_string()))
            .collect();
        let (s, e) = crate::scenario_from_form(&form);
        assert!(e.is_empty(), "{e:?}");
        let r = framewise_kernel::evaluate(&s);
        assert!(r.errors.is_empty(), "{:?}", r.errors);
        assert_eq!(r.bikes.len(), 1);
    }
}
