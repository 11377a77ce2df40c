//! The rider's body: a planar linked-segment model scaled from standing height and mass
//! (DESIGN.md §6.6).
//!
//! Segment lengths are fractions of standing height H from Drillis & Contini (1966) as
//! reproduced in Winter, *Biomechanics and Motor Control of Human Movement*, 4th ed., 2009,
//! Fig. 4.1; segment masses and centre-of-mass positions from Dempster via Winter Table 4.1.
//! Source: /work/shared/REFERENCES.md "Human body segments". Measured inseam, arm length and
//! torso length override the ratios for their chain.

/// Joint heights as fractions of standing height (Drillis & Contini via Winter Fig. 4.1).
pub mod height_ratio {
    /// Shoulder joint height.
    pub const SHOULDER: f64 = 0.818;
    /// Elbow height.
    pub const ELBOW: f64 = 0.630;
    /// Wrist height.
    pub const WRIST: f64 = 0.485;
    /// Hip (greater trochanter) height.
    pub const HIP: f64 = 0.530;
    /// Knee height.
    pub const KNEE: f64 = 0.285;
    /// Ankle height.
    pub const ANKLE: f64 = 0.039;
    /// Upper arm length.
    pub const UPPER_ARM: f64 = 0.186;
    /// Forearm length.
    pub const FOREARM: f64 = 0.146;
    /// Hand length.
    pub const HAND: f64 = 0.108;
    /// Foot length.
    pub const FOOT: f64 = 0.152;
    /// Shoulder width.
    pub const SHOULDER_WIDTH: f64 = 0.259;
}

/// Segment mass fraction of body mass and centre-of-mass position from the proximal end
/// (Dempster via Winter Table 4.1).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct SegmentTable {
    /// Segment name.
    pub name: &'static str,
    /// Mass fraction of body mass.
    pub mass: f64,
    /// Centre of mass from the proximal end, fraction of the segment length.
    pub com: f64,
    /// How many of this segment the body has.
    pub count: u8,
}

/// The segments of the model with their Dempster/Winter fractions. The head-neck's centre of
/// mass is placed at the head centre in this model (its fraction is given as 1.0).
pub const SEGMENTS: [SegmentTable; 8] = [
    SegmentTable {
        name: "hand",
        mass: 0.006,
        com: 0.506,
        count: 2,
    },
    SegmentTable {
        name: "forearm",
        mass: 0.016,
        com: 0.430,
        count: 2,
    },
    SegmentTable {
        name: "upper_arm",
        mass: 0.028,
        com: 0.436,
        count: 2,
    },
    SegmentTable {
        name: "foot",
        mass: 0.0145,
        com: 0.50,
        count: 2,
    },
    SegmentTable {
        name: "shank",
        mass: 0.0465,
        com: 0.433,
        count: 2,
    },
    SegmentTable {
        name: "thigh",
        mass: 0.100,
        com: 0.433,
        count: 2,
    },
    SegmentTable {
        name: "head_neck",
        mass: 0.081,
        com: 1.0,
        count: 1,
    },
    SegmentTable {
        name: "trunk",
        mass: 0.497,
        com: 0.50,
        count: 1,
    },
];

/// The table entry of a segment by name.
pub fn segment(name: &str) -> Option<SegmentTable> {
    SEGMENTS.iter().copied().find(|s| s.name == name)
}

/// Seated, the hip joint sits this share of standing height straight above the saddle's sit
/// point [practice: the hip joint centre lies roughly 60–70 mm above the ischial tuberosities,
/// which rest on the saddle, in a 1.75–1.85 m adult; a stated model value].
pub const HIP_ABOVE_SADDLE: f64 = 0.035;
/// Crotch (inseam) height as a share of standing height when no inseam is given [practice:
/// adults' inseam is commonly 0.45–0.48 of height]. A measured inseam scales the leg chain (thigh,
/// shank, ankle height) by `k = inseam / (INSEAM_RATIO·H)`.
pub const INSEAM_RATIO: f64 = 0.47;
/// The ball of the foot lies this share of foot length ahead of the heel [practice].
pub const BALL_FROM_HEEL: f64 = 0.73;
/// The ankle joint lies this share of foot length ahead of the heel [practice].
pub const ANKLE_FROM_HEEL: f64 = 0.25;
/// Shoe sole (ball of the foot above the pedal spindle) when no shoe stack is given, mm
/// [practice].
pub const DEFAULT_SHOE_STACK_MM: f64 = 15.0;

/// The body's lengths (mm) and masses (kg) used by the postures.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Body {
    /// Standing height, mm.
    pub height: f64,
    /// Body mass, kg.
    pub mass: f64,
    /// Hip joint to knee, mm.
    pub thigh: f64,
    /// Knee to ankle, mm.
    pub shank: f64,
    /// Ankle joint height above the sole, mm.
    pub ankle_height: f64,
    /// Foot length, heel to toe, mm.
    pub foot: f64,
    /// Shoulder to elbow, mm.
    pub upper_arm: f64,
    /// Elbow to wrist, mm.
    pub forearm: f64,
    /// Wrist to the grip centre (half the hand), mm.
    pub hand_to_grip: f64,
    /// Hand length, mm.
    pub hand: f64,
    /// Hip joint to shoulder joint, mm.
    pub torso: f64,
    /// Shoulder joint to the top of the head, mm.
    pub head_neck: f64,
    /// Hip joint above the saddle top, mm.
    pub hip_above_saddle: f64,
    /// Shoe stack: pedal spindle to the ball of the foot, mm.
    pub shoe_stack: f64,
    /// Ball of the foot ahead of the spindle, mm.
    pub foot_position: f64,
    /// Inseam used (given or `INSEAM_RATIO·H`), mm.
    pub inseam: f64,
}

/// Measurements that override the ratios.
#[derive(Debug, Clone, Copy, PartialEq, Default)]
pub struct Overrides {
    /// Inseam, mm.
    pub inseam: Option<f64>,
    /// Shoulder joint to the grip centre of a closed fist, mm.
    pub arm: Option<f64>,
    /// Hip joint to shoulder joint, mm.
    pub torso: Option<f64>,
    /// Shoe stack, mm.
    pub shoe_stack: Option<f64>,
    /// Ball of the foot ahead of the spindle, mm.
    pub foot_position: Option<f64>,
}

impl Body {
    /// Scales the body from height (mm) and mass (kg), then applies the overrides.
    ///
    /// Legs: thigh `(0.530 − 0.285)·H`, shank `(0.285 − 0.039)·H`, ankle height `0.039·H`, each
    /// times `k = inseam / (INSEAM_RATIO·H)` when an inseam is given. Arm: upper arm `0.186·H`,
    /// forearm `0.146·H`, wrist to grip `0.108·H / 2`, scaled together to a given arm length.
    /// Torso `(0.818 − 0.530)·H` unless given; head-neck `(1 − 0.818)·H`.
    pub fn new(height: f64, mass: f64, o: Overrides) -> Body {
        use height_ratio as r;
        let inseam = o.inseam.unwrap_or(INSEAM_RATIO * height);
        let k = inseam / (INSEAM_RATIO * height);
        let upper_arm = r::UPPER_ARM * height;
        let forearm = r::FOREARM * height;
        let hand_to_grip = r::HAND * height / 2.0;
        let arm_model = upper_arm + forearm + hand_to_grip;
        let a = o.arm.map_or(1.0, |arm| arm / arm_model);
        Body {
            height,
            mass,
            thigh: (r::HIP - r::KNEE) * height * k,
            shank: (r::KNEE - r::ANKLE) * height * k,
            ankle_height: r::ANKLE * height * k,
            foot: r::FOOT * height,
            upper_arm: upper_arm * a,
            forearm: forearm * a,
            hand_to_grip: hand_to_grip * a,
            hand: r::HAND * height * a,
            torso: o.torso.unwrap_or((r::SHOULDER - r::HIP) * height),
            head_neck: (1.0 - r::SHOULDER) * height,
            hip_above_saddle: HIP_ABOVE_SADDLE * height,
            shoe_stack: o.shoe_stack.unwrap_or(DEFAULT_SHOE_STACK_MM),
            foot_position: o.foot_position.unwrap_or(0.0),
            inseam,
        }
    }

    /// Elbow to the grip centre, mm.
    pub fn forearm_to_grip(&self) -> f64 {
        self.forearm + self.hand_to_grip
    }

    /// Whole-arm reach, shoulder to the grip centre with a straight elbow, mm.
    pub fn arm_reach(&self) -> f64 {
        self.upper_arm + self.forearm_to_grip()
    }

    /// Hip-joint to ankle-joint distance for a knee bent `bend` radians from straight
    /// (law of cosines with the interior angle `π − bend`).
    pub fn leg_span(&self, bend: f64) -> f64 {
        law_of_cosines(self.thigh, self.shank, std::f64::consts::PI - bend)
    }

    /// Shoulder to grip distance for an elbow bent `bend` radians from straight.
    pub fn arm_span(&self, bend: f64) -> f64 {
        law_of_cosines(
            self.upper_arm,
            self.forearm_to_grip(),
            std::f64::consts::PI - bend,
        )
    }
}

/// The side opposite the angle `gamma` (radians) between sides `a` and `b`.
pub fn law_of_cosines(a: f64, b: f64, gamma: f64) -> f64 {
    (a * a + b * b - 2.0 * a * b * gamma.cos()).max(0.0).sqrt()
}
