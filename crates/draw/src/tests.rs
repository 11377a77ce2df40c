//! Unit tests and the SVG golden file (refresh with `UPDATE_GOLDEN=1 cargo test -p framewise-draw`).

use super::*;
use framewise_kernel::report::{CockpitOutline, CrankOutline, Leg, RiderFigure, SeatOutline};

fn bare() -> Outline {
    Outline {
        ground_y: -340.0,
        rear_axle: [-435.0, 32.0],
        front_axle: [800.0, 32.0],
        rear_radius: 372.0,
        front_radius: 372.0,
        rear_rim_radius: 311.0,
        front_rim_radius: 311.0,
        head_top: [470.0, 625.0],
        head_bottom: [516.0, 525.0],
        crown: [521.0, 514.0],
        fork_leg_top: [561.0, 532.0],
        seat_top: [-100.0, 420.0],
        steer_ground: [840.0, -340.0],
        rear_contact: [-435.0, -340.0],
        front_contact: [800.0, -340.0],
        cockpit: None,
        seat: None,
        cranks: None,
        rider_seated: None,
        rider_standing: None,
        com_seated: None,
        com_standing: None,
    }
}

fn leg(dx: f64) -> Leg {
    Leg {
        knee: [60.0 + dx, 380.0],
        ankle: [120.0 + dx, -60.0],
        ball: [160.0 + dx, -160.0],
        heel: [60.0 + dx, -150.0],
        toe: [200.0 + dx, -170.0],
    }
}

fn full() -> Outline {
    let figure = |lean: f64| RiderFigure {
        head: [230.0 + lean, 1320.0],
        head_radius: 110.0,
        shoulder: [200.0 + lean, 1160.0],
        elbow: [380.0, 980.0],
        hand: [420.0, 820.0],
        hip: [-150.0 + lean, 760.0],
        legs: [leg(0.0), leg(-120.0)],
    };
    Outline {
        cockpit: Some(CockpitOutline {
            headset_top: [467.0, 633.0],
            spacers_top: [463.0, 642.0],
            stem_clamp: [455.0, 660.0],
            steerer_top: [446.0, 679.0],
            bar_clamp: [495.0, 680.0],
            grip: [465.0, 705.0],
        }),
        seat: Some(SeatOutline {
            post_exit: [-100.0, 420.0],
            post_top: [-170.0, 690.0],
            saddle: [-172.0, 735.0],
            saddle_nose: [-40.0, 740.0],
            saddle_tail: [-250.0, 745.0],
        }),
        cranks: Some(CrankOutline {
            pedal_near: [170.0, 0.0],
            pedal_far: [-170.0, 0.0],
        }),
        rider_seated: Some(figure(0.0)),
        rider_standing: Some(figure(150.0)),
        com_seated: Some([-20.0, 700.0]),
        com_standing: Some([60.0, 600.0]),
        ..bare()
    }
}

fn numbers() -> Numbers {
    [
        ("reach_mm", 470.0),
        ("stack_mm", 625.0),
        ("wheelbase_mm", 1235.0),
        ("bb_height_mm", 340.0),
        ("trail_mm", 40.0),
        ("bb_to_grip_mm", 848.0),
    ]
    .into_iter()
    .map(|(k, v)| (k.to_string(), v))
    .collect()
}

fn scene<'a>(o: &'a Outline, n: &'a Numbers) -> Scene<'a> {
    let limits = Limits {
        braking_g: Some(0.634),
        descent_deg: Some(32.4),
        climb_deg: Some(31.9),
    };
    Scene {
        label: "Golden bike",
        ridden: o,
        stock: o,
        numbers: n,
        seated: limits,
        standing: Limits::default(),
    }
}

#[test]
fn kernel_y_up_becomes_svg_y_down() {
    assert_eq!(flip([3.0, 5.0]), (3.0, -5.0));
}

#[test]
fn extent_includes_tyres_ground_cockpit_and_rider() {
    assert_eq!(extent(&bare()), (-807.0, -340.0, 1172.0, 625.0));
    let (_, _, _, top) = extent(&full());
    assert_eq!(top, 1430.0, "the standing head's top");
}

#[test]
fn a_bare_outline_draws_frame_wheels_and_fork_only() {
    let n = numbers();
    let o = bare();
    let svg = draw(&scene(&o, &n));
    assert_eq!(svg.matches("class=\"tyre\"").count(), 4, "ridden and ghost");
    assert!(svg.contains("class=\"fork fork-leg\""));
    assert!(!svg.contains("class=\"rider\"") && !svg.contains("class=\"com\""));
    assert!(!svg.contains("NaN"));
}

#[test]
fn every_part_is_drawn_when_present() {
    let n = numbers();
    let o = full();
    let svg = draw(&scene(&o, &n));
    for part in [
        "stem",
        "bar",
        "spacers",
        "saddle",
        "post",
        "crank near",
        "pedal far",
        "rider",
        "com",
        "tip-line front",
        "dim dim-reach_mm",
        "dim dim-bb_to_grip_mm",
        "posture standing",
    ] {
        assert!(svg.contains(&format!("class=\"{part}\"")), "{part}");
    }
    assert!(svg.contains("braking limit 0.63 g") && svg.contains("climb 32°"));
    assert!(svg.contains("Reach 470 mm"));
    assert_eq!(svg.matches("class=\"rider\"").count(), 2);
}

#[test]
fn the_svg_matches_its_golden_file() {
    let n = numbers();
    let o = full();
    let svg = draw(&scene(&o, &n));
    let path = concat!(env!("CARGO_MANIFEST_DIR"), "/tests/golden/full.svg");
    if std::env::var_os("UPDATE_GOLDEN").is_some() {
        std::fs::write(path, &svg).unwrap();
    }
    let want = std::fs::read_to_string(path).unwrap();
    assert_eq!(
        svg, want,
        "run UPDATE_GOLDEN=1 cargo test -p framewise-draw to refresh"
    );
}
