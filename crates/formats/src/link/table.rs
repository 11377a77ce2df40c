//! The link's field tables, version 1. Each group lists its fields in a fixed order; a field is
//! written as one presence bit in the group's mask, then, if present, its value.
//!
//! **Invariant: the tables only grow at the end.** A field is never removed, reordered or given
//! another resolution; a new field is appended with `since` = the new link version, and the
//! version byte says which fields an old link has (so old links keep decoding; see docs/LINKS.md).
//!
//! Numbers are stored as whole multiples of `1/denom` of their unit, as the difference from a
//! typical value `centre`, in an order-k exp-Golomb code: within about ±2^(k−1) steps of the
//! centre a value costs k + 1 bits. `range` is the span of values people use [practice]; it only
//! feeds the information bound in the tests and docs, never limits what a link can hold.

/// A quantised number: resolution `1/denom`, typical value, code order, usual range.
#[derive(Debug, Clone, Copy)]
pub(crate) struct Num {
    /// Steps per unit: 2 for 0.5 mm, 20 for 0.05°, 10 for 0.1 kg or 0.1 %, 100 for 0.01 g.
    pub denom: u32,
    /// The typical value, in the unit of the key.
    pub centre: f64,
    /// Exp-Golomb order.
    pub k: u32,
    /// Usual range of values, for the information bound only.
    pub range: (f64, f64),
}

/// How a field's value is written.
#[derive(Debug, Clone, Copy)]
pub(crate) enum Kind {
    /// A quantised number.
    Num(Num),
    /// A whole number ≥ 0 (order-k exp-Golomb).
    Count {
        /// Exp-Golomb order.
        k: u32,
        /// Usual largest value, for the information bound.
        max: u32,
    },
    /// One bit.
    Bool,
    /// One of a few words, or any text after an escape index.
    Choice(&'static [&'static str]),
    /// Trimmed text, at most [`super::text::MAX_TEXT_CHARS`] characters.
    Text,
    /// A wheel: a common designation's code, ETRTO numbers, a diameter or text.
    Wheel,
    /// A published frame number, optionally with its own tolerance (`tol` resolution).
    Published(Num, Num),
    /// A nested group.
    Group(&'static Group),
    /// A list of groups (the bikes).
    List(&'static Group),
}

/// One field of a group.
#[derive(Debug, Clone, Copy)]
pub(crate) struct Field {
    /// The JSON key.
    pub key: &'static str,
    /// How its value is written.
    pub kind: Kind,
    /// An empty value (`""`, `{}`, `[]`) counts as absent: for fields serde always writes.
    pub empty_is_absent: bool,
    /// The link version that added the field.
    pub since: u8,
}

/// A group of fields: a JSON object.
#[derive(Debug)]
pub(crate) struct Group {
    /// The group's name (for tests and debugging).
    #[allow(dead_code)]
    pub name: &'static str,
    /// The fields in link order.
    pub fields: &'static [Field],
}

impl Group {
    /// The fields a link of `version` carries.
    pub(crate) fn fields_in(&self, version: u8) -> impl Iterator<Item = &'static Field> {
        self.fields.iter().filter(move |f| f.since <= version)
    }
    /// True when a field of the group is a published frame value (the group has a tolerance flag).
    pub(crate) fn has_published(&self) -> bool {
        self.fields
            .iter()
            .any(|f| matches!(f.kind, Kind::Published(..)))
    }
}

const fn n(denom: u32, centre: f64, k: u32, lo: f64, hi: f64) -> Num {
    Num {
        denom,
        centre,
        k,
        range: (lo, hi),
    }
}
/// Length, 0.5 mm.
const fn mm(centre: f64, k: u32, lo: f64, hi: f64) -> Kind {
    Kind::Num(n(2, centre, k, lo, hi))
}
/// Angle, 0.05°.
const fn deg(centre: f64, k: u32, lo: f64, hi: f64) -> Kind {
    Kind::Num(n(20, centre, k, lo, hi))
}
/// Mass, 0.1 kg.
const fn kg(centre: f64, k: u32, lo: f64, hi: f64) -> Kind {
    Kind::Num(n(10, centre, k, lo, hi))
}
/// Percent, 0.1 %.
const fn pct(centre: f64, k: u32, lo: f64, hi: f64) -> Kind {
    Kind::Num(n(10, centre, k, lo, hi))
}
/// Deceleration, 0.01 g.
const fn g(centre: f64, k: u32, lo: f64, hi: f64) -> Kind {
    Kind::Num(n(100, centre, k, lo, hi))
}
/// Published length: value at 0.5 mm, tolerance at 0.5 mm.
const fn pmm(centre: f64, k: u32, lo: f64, hi: f64) -> Kind {
    Kind::Published(n(2, centre, k, lo, hi), n(2, 0.0, 3, 0.0, 5.0))
}
/// Published angle: value at 0.05°, tolerance at 0.05°.
const fn pdeg(centre: f64, k: u32, lo: f64, hi: f64) -> Kind {
    Kind::Published(n(20, centre, k, lo, hi), n(20, 0.0, 4, 0.0, 1.0))
}

const fn f(key: &'static str, kind: Kind) -> Field {
    Field {
        key,
        kind,
        empty_is_absent: false,
        since: 1,
    }
}
const fn always(key: &'static str, kind: Kind) -> Field {
    Field {
        key,
        kind,
        empty_is_absent: true,
        since: 1,
    }
}

/// The whole scenario (its `version` key is implied by the link version).
pub(crate) static SCENARIO: Group = Group {
    name: "",
    fields: &[
        f("rider", Kind::Group(&RIDER)),
        always("bikes", Kind::List(&BIKE)),
        always("view", Kind::Group(&VIEW)),
    ],
};

/// `rider`.
pub(crate) static RIDER: Group = Group {
    name: "rider",
    fields: &[
        f("height_mm", mm(1750.0, 9, 1000.0, 2200.0)),
        f("mass_kg", kg(75.0, 8, 20.0, 150.0)),
        f("inseam_mm", mm(820.0, 8, 500.0, 1100.0)),
        f("arm_mm", mm(600.0, 8, 400.0, 800.0)),
        f("torso_mm", mm(550.0, 7, 400.0, 750.0)),
        f("shoe_stack_mm", mm(15.0, 5, 0.0, 40.0)),
        f("foot_position_mm", mm(0.0, 6, -40.0, 40.0)),
        f("elbow_bend_deg", deg(15.0, 8, 0.0, 45.0)),
        f("standing_knee_bend_deg", deg(20.0, 8, 0.0, 60.0)),
        f("braking_g", g(0.6, 5, 0.1, 1.2)),
        f("slope_deg", deg(0.0, 8, -30.0, 30.0)),
        // Added by the rider work (issue 4) before version 1 was published.
        f("standing_torso_deg", deg(40.0, 8, 0.0, 90.0)),
    ],
};

/// `bikes[i]`.
pub(crate) static BIKE: Group = Group {
    name: "bikes[]",
    fields: &[
        always("label", Kind::Text),
        always("frame", Kind::Group(&FRAME)),
        f("seat_angle_ref_mm", mm(620.0, 8, 300.0, 900.0)),
        always("wheels", Kind::Group(&WHEELS)),
        always("setup", Kind::Group(&SETUP)),
        always("changes", Kind::Group(&CHANGES)),
        f("load", Kind::Group(&LOAD)),
    ],
};

/// `bikes[i].frame`: the §5 keys in catalogue order at version 1.
pub(crate) static FRAME: Group = Group {
    name: "frame",
    fields: &[
        f("reach_mm", pmm(460.0, 8, 250.0, 560.0)),
        f("stack_mm", pmm(620.0, 8, 450.0, 700.0)),
        f("head_angle_deg", pdeg(67.0, 7, 60.0, 76.0)),
        f("head_tube_mm", pmm(120.0, 7, 60.0, 250.0)),
        f("headset_lower_mm", pmm(10.0, 5, 0.0, 25.0)),
        f("fork_a2c_mm", pmm(540.0, 8, 360.0, 600.0)),
        f("fork_offset_mm", pmm(45.0, 5, 25.0, 60.0)),
        f("chainstay_mm", pmm(430.0, 6, 380.0, 470.0)),
        f("rear_centre_mm", pmm(425.0, 6, 370.0, 470.0)),
        f("front_centre_mm", pmm(780.0, 8, 550.0, 900.0)),
        f("wheelbase_mm", pmm(1200.0, 8, 950.0, 1350.0)),
        f("bb_drop_mm", pmm(40.0, 7, -30.0, 85.0)),
        f("bb_height_mm", pmm(320.0, 7, 240.0, 380.0)),
        f("seat_angle_actual_deg", pdeg(74.0, 7, 65.0, 80.0)),
        f("seat_axis_offset_mm", pmm(0.0, 6, -60.0, 60.0)),
        f("seat_angle_effective_deg", pdeg(76.0, 7, 68.0, 82.0)),
        f("top_tube_effective_mm", pmm(600.0, 8, 450.0, 720.0)),
        f("seat_tube_mm", pmm(440.0, 8, 300.0, 560.0)),
        f("trail_mm", pmm(110.0, 7, 50.0, 160.0)),
        f("standover_mm", pmm(760.0, 8, 600.0, 900.0)),
    ],
};

/// `wheels` and `changes.wheels`.
pub(crate) static WHEELS: Group = Group {
    name: "wheels",
    fields: &[f("front", Kind::Wheel), f("rear", Kind::Wheel)],
};

/// `bikes[i].setup`.
pub(crate) static SETUP: Group = Group {
    name: "setup",
    fields: &[
        f("headset_upper_mm", mm(8.0, 5, 0.0, 40.0)),
        f("spacers_mm", mm(15.0, 6, 0.0, 60.0)),
        f("stem_stack_mm", mm(40.0, 5, 25.0, 60.0)),
        f("stem_mm", mm(60.0, 7, 0.0, 140.0)),
        f("stem_angle_deg", deg(0.0, 7, -30.0, 30.0)),
        f("bar_rise_mm", mm(20.0, 6, 0.0, 100.0)),
        f("bar_pullback_mm", mm(30.0, 6, 0.0, 120.0)),
        f("bar_type", Kind::Choice(&["flat", "drop"])),
        f("bar_backsweep_deg", deg(8.0, 7, 0.0, 20.0)),
        f("bar_upsweep_deg", deg(5.0, 6, 0.0, 10.0)),
        f("bar_width_mm", mm(700.0, 8, 380.0, 840.0)),
        f("bar_roll_deg", deg(0.0, 6, -15.0, 15.0)),
        f("bar_reach_mm", mm(80.0, 5, 60.0, 100.0)),
        f("bar_drop_mm", mm(125.0, 5, 100.0, 150.0)),
        f("hood_reach_mm", mm(110.0, 6, 60.0, 160.0)),
        f("hood_drop_mm", mm(20.0, 6, -30.0, 60.0)),
        f("hand_position", Kind::Choice(&["hoods", "drops", "tops"])),
        f("spacer_limit_mm", mm(40.0, 4, 0.0, 60.0)),
        f("saddle_setback_mm", mm(50.0, 7, 0.0, 150.0)),
        f("post_offset_mm", mm(15.0, 5, 0.0, 40.0)),
        f("saddle_stack_mm", mm(50.0, 5, 20.0, 100.0)),
        f("max_insertion_mm", mm(250.0, 8, 50.0, 500.0)),
        f("post_length_mm", mm(400.0, 8, 200.0, 600.0)),
        f("post_min_insertion_mm", mm(90.0, 6, 40.0, 200.0)),
        f("dropper_travel_mm", mm(150.0, 7, 0.0, 250.0)),
        f("bike_mass_kg", kg(13.0, 7, 5.0, 30.0)),
        f("bike_com_x_mm", mm(0.0, 7, -200.0, 300.0)),
        f("bike_com_y_mm", mm(300.0, 7, 0.0, 600.0)),
        f("crank_mm", mm(170.0, 4, 110.0, 185.0)),
        f("saddle_height_mm", mm(720.0, 8, 450.0, 950.0)),
        // Added by the rider and cockpit work (issue 4) before version 1 was published.
        f("pedal_outer_mm", mm(180.0, 6, 140.0, 220.0)),
        f("target_grip_x_mm", mm(450.0, 8, 200.0, 700.0)),
        f("target_grip_y_mm", mm(600.0, 8, 300.0, 900.0)),
        f("target_grip_bike", Kind::Count { k: 0, max: 15 }),
    ],
};

/// `bikes[i].changes`.
pub(crate) static CHANGES: Group = Group {
    name: "changes",
    fields: &[
        f("fork_a2c_delta_mm", mm(0.0, 6, -40.0, 40.0)),
        f("fork_offset_mm", mm(44.0, 5, 25.0, 60.0)),
        f("headset_angle_deg", deg(0.0, 6, -3.0, 3.0)),
        always("wheels", Kind::Group(&WHEELS)),
        f("fork_travel_mm", mm(140.0, 7, 0.0, 220.0)),
        f("front_sag_pct", pct(20.0, 7, 0.0, 50.0)),
        f("rear_travel_mm", mm(130.0, 7, 0.0, 220.0)),
        f("rear_sag_pct", pct(28.0, 7, 0.0, 50.0)),
        f("pivot_x_mm", mm(0.0, 7, -100.0, 100.0)),
        f("pivot_y_mm", mm(150.0, 7, 0.0, 300.0)),
    ],
};

/// `bikes[i].load`.
pub(crate) static LOAD: Group = Group {
    name: "load",
    fields: &[
        f("x_mm", mm(0.0, 8, -300.0, 500.0)),
        f("y_mm", mm(900.0, 8, 400.0, 1300.0)),
        f("mass_kg", kg(90.0, 8, 20.0, 200.0)),
    ],
};

/// `view`.
pub(crate) static VIEW: Group = Group {
    name: "view",
    fields: &[
        f(
            "align",
            Kind::Choice(&["bb", "rear_axle", "front_axle", "grip"]),
        ),
        f("units", Kind::Choice(&["mm", "in"])),
        f("posture", Kind::Choice(&["seated", "standing"])),
        f("dimensions", Kind::Bool),
        f("ghost", Kind::Bool),
        f("selected", Kind::Count { k: 0, max: 15 }),
    ],
};

/// Wheel outer diameter, 0.5 mm.
pub(crate) const DIAMETER: Num = n(2, 740.0, 8, 400.0, 800.0);

/// Every group, for tests that check coverage.
#[cfg(test)]
pub(crate) static ALL: &[&Group] = &[
    &SCENARIO, &RIDER, &BIKE, &FRAME, &WHEELS, &SETUP, &CHANGES, &LOAD, &VIEW,
];
