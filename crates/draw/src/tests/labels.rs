//! Where the labels go: on the demo bike and the road bike of the browser tests (the kernel's
//! outlines of tests/scenarios/demo.json and tests/links/v1-drop-bar-pair.json) and on the
//! synthetic outline of tests.rs, in each posture, with the dimensions shown, in every type size
//! the page uses: no label's ink, its halo included, lies on a frame tube, the fork, a tyre, the
//! cockpit, the seatpost or saddle, the cranks or the rider; no label's text box on another's;
//! every box inside the view box; and each label near what it measures.
//!
//! The geometry here is the test's own: the parts as the page draws them (their stroke widths in
//! web/style.css), and distances found by a search along each segment, so that a part
//! [`crate::layout`] forgot, or a wrong distance there, shows.

use super::*;
use crate::place::{width_em, ASCENT_EM, BOX_ASCENT_EM, BOX_DESCENT_EM, DESCENT_EM, HALO_MM};
use framewise_kernel::{evaluate, BikeReport, Scenario};

/// The type sizes the page sets the labels in: the desk's, the largest (a phone held
/// sideways), and one between. A label's box in smaller type lies inside its box in larger type
/// (the same anchor), so the ends cover the range; the middle is a check of that.
const EMS: [f64; 3] = [
    LABEL_EM_MM,
    (LABEL_EM_MM + LABEL_EM_MAX_MM) / 2.0,
    LABEL_EM_MAX_MM,
];

/// A label in kernel axes (y up): its key, its ink `[x0, y0, x1, y1]` (0.75 em above the
/// baseline, 0.25 em below), its text box (the font's ascent and descent, as the browser gives
/// it) and its words, in type of `em` mm, estimated from its words' widths.
#[derive(Debug, Clone)]
struct Label {
    key: String,
    ink: [f64; 4],
    text_box: [f64; 4],
}

fn label_of(node: &Node, em: f64) -> Option<Label> {
    let Node::Text {
        key,
        anchor,
        x,
        y,
        words,
        ..
    } = node
    else {
        return None;
    };
    let (x, y): (f64, f64) = (x.parse().ok()?, y.parse().ok()?);
    let y = -y;
    let w = width_em(words) * em;
    let x0 = match *anchor {
        "middle" => x - w / 2.0,
        "end" => x - w,
        _ => x,
    };
    Some(Label {
        key: key.clone(),
        ink: [x0, y - DESCENT_EM * em, x0 + w, y + ASCENT_EM * em],
        text_box: [x0, y - BOX_DESCENT_EM * em, x0 + w, y + BOX_ASCENT_EM * em],
    })
}

/// The labels seen with one posture (its limits and the dimensions), in type of `em` mm.
fn labels_seen(d: &Drawing, posture: &str, em: f64) -> Vec<Label> {
    texts(&d.nodes)
        .into_iter()
        .filter_map(|t| label_of(t, em))
        .filter(|l| l.key.starts_with("dim-") || l.key.starts_with(posture))
        .collect()
}

/// Distance from a point to a rectangle (0 inside).
fn point_rect(p: Xy, r: [f64; 4]) -> f64 {
    let dx = (r[0] - p[0]).max(p[0] - r[2]).max(0.0);
    let dy = (r[1] - p[1]).max(p[1] - r[3]).max(0.0);
    dx.hypot(dy)
}

/// Distance from the segment `a`–`b` to a rectangle: the distance from a point moving along
/// the segment is convex, so a ternary search finds its least (to well under 0.1 mm).
fn seg_rect(a: Xy, b: Xy, r: [f64; 4]) -> f64 {
    let at = |t: f64| point_rect([a[0] + (b[0] - a[0]) * t, a[1] + (b[1] - a[1]) * t], r);
    let (mut lo, mut hi) = (0.0_f64, 1.0_f64);
    for _ in 0..100 {
        let (m1, m2) = (lo + (hi - lo) / 3.0, hi - (hi - lo) / 3.0);
        if at(m1) <= at(m2) {
            hi = m2;
        } else {
            lo = m1;
        }
    }
    at(lo).min(at(0.0)).min(at(1.0))
}

/// A drawn part: a stroked segment (half its width) or a stroked circle (a tyre).
enum Part {
    Seg(Xy, Xy, f64),
    Ring(Xy, f64, f64),
    Disc(Xy, f64),
}

impl Part {
    /// Whether the rectangle, grown by `m`, reaches the part's paint.
    fn meets(&self, r: [f64; 4], m: f64) -> bool {
        match *self {
            Part::Seg(a, b, half) => seg_rect(a, b, r) < half + m,
            Part::Disc(c, rad) => point_rect(c, r) < rad + m,
            Part::Ring(c, rad, half) => {
                let near = point_rect(c, r);
                let far = [[r[0], r[1]], [r[2], r[1]], [r[2], r[3]], [r[0], r[3]]]
                    .iter()
                    .map(|p| (p[0] - c[0]).hypot(p[1] - c[1]))
                    .fold(0.0, f64::max);
                near < rad + half + m && far > rad - half - m
            }
        }
    }
}

/// The parts no label may lie on, named, with half their stroke widths (web/style.css): the
/// frame's tubes, the fork and the tyres; the cockpit, seatpost, saddle and cranks; and, with
/// `posture`, the rider in that posture.
fn parts(o: &Outline, posture: Option<&str>) -> Vec<(String, Part)> {
    let bb = [0.0, 0.0];
    let mut v: Vec<(String, Part)> = [
        ("chainstay", bb, o.rear_axle, 13.0),
        ("seatstay", o.rear_axle, o.seat_top, 13.0),
        ("top tube", o.seat_top, o.head_top, 13.0),
        ("down tube", o.head_bottom, bb, 13.0),
        ("seat tube", bb, o.seat_top, 13.0),
        ("head tube", o.head_top, o.head_bottom, 20.0),
        ("headset", o.head_bottom, o.crown, 17.0),
        ("fork crown", o.crown, o.fork_leg_top, 13.0),
        ("fork leg", o.fork_leg_top, o.front_axle, 10.0),
    ]
    .into_iter()
    .map(|(n, a, b, h)| (n.to_string(), Part::Seg(a, b, h)))
    .collect();
    v.push((
        "rear tyre".into(),
        Part::Ring(o.rear_axle, o.rear_radius, 15.0),
    ));
    v.push((
        "front tyre".into(),
        Part::Ring(o.front_axle, o.front_radius, 15.0),
    ));
    if let Some(c) = &o.cockpit {
        for (n, a, b, h) in [
            ("spacers", c.headset_top, c.spacers_top, 15.0),
            ("stem clamp", c.spacers_top, c.steerer_top, 17.0),
            ("stem", c.stem_clamp, c.bar_clamp, 13.0),
            ("bar", c.bar_clamp, c.grip, 9.0),
        ] {
            v.push((n.into(), Part::Seg(a, b, h)));
        }
        v.push(("grip".into(), Part::Disc(c.grip, 16.0)));
    }
    if let Some(s) = &o.seat {
        v.push(("seatpost".into(), Part::Seg(s.post_exit, s.post_top, 11.0)));
        v.push((
            "saddle".into(),
            Part::Seg(s.saddle_tail, s.saddle_nose, 13.0),
        ));
    }
    if let Some(c) = &o.cranks {
        for p in [c.pedal_near, c.pedal_far] {
            v.push(("crank".into(), Part::Seg(bb, p, 9.0)));
        }
    }
    let rider = match posture {
        Some("seated") => o.rider_seated.as_ref(),
        Some(_) => o.rider_standing.as_ref(),
        None => None,
    };
    if let (Some(f), Some(posture)) = (rider, posture) {
        for (n, a, b, h) in [
            ("torso", f.hip, f.shoulder, 30.0),
            ("neck", f.shoulder, f.head, 19.0),
            ("upper arm", f.shoulder, f.elbow, 19.0),
            ("forearm", f.elbow, f.hand, 19.0),
        ] {
            v.push((format!("{posture} {n}"), Part::Seg(a, b, h)));
        }
        v.push((format!("{posture} head"), Part::Disc(f.head, f.head_radius)));
        for l in &f.legs {
            v.push((format!("{posture} thigh"), Part::Seg(f.hip, l.knee, 19.0)));
            v.push((format!("{posture} shank"), Part::Seg(l.knee, l.ankle, 19.0)));
        }
    }
    v
}

/// What each label belongs to: its dimension line, or the centre of mass and its tip lines.
fn target(d: &Drawing, o: &Outline, key: &str) -> Vec<(Xy, Xy)> {
    let com = |posture: &str| {
        if posture == "seated" {
            o.com_seated
        } else {
            o.com_standing
        }
    };
    if let Some((posture, what)) = key.split_once('-').filter(|(p, _)| *p != "dim") {
        let Some(c) = com(posture) else {
            return Vec::new();
        };
        return match what {
            "braking" => vec![(c, c)],
            "climb" => vec![(c, o.rear_contact)],
            _ => vec![(c, o.front_contact)],
        };
    }
    // The dimension lines, in the order dims.rs draws them.
    let keys = [
        "reach_mm",
        "stack_mm",
        "wheelbase_mm",
        "bb_height_mm",
        "trail_mm",
        "bb_to_grip_mm",
    ];
    let lines = d
        .nodes
        .iter()
        .flat_map(|n| match n {
            Node::Group { children, .. } => children.iter().collect(),
            _ => Vec::new(),
        })
        .find_map(|n| match n {
            Node::Lines { class, lines } if class == "dim-line" => Some(lines),
            _ => None,
        })
        .unwrap_or_else(|| panic!("no dimension lines"));
    let i = keys
        .iter()
        .position(|k| key == format!("dim-{k}"))
        .unwrap_or_else(|| panic!("{key}"));
    let pts: Vec<Xy> = lines[i]
        .points
        .split(' ')
        .map(|p| {
            let (x, y) = p.split_once(',').unwrap();
            [x.parse().unwrap(), -y.parse::<f64>().unwrap()]
        })
        .collect();
    vec![(pts[0], pts[1])]
}

/// How far a label may lie from what it belongs to, mm (about 45 px on a phone): a dimension
/// label from its line (the farthest now is the road bike's reach, past its long stem and bar:
/// about 220 mm), a slope limit from its tip line.
const NEAR_ENOUGH_MM: f64 = 300.0;

/// How far the braking limit may lie from the centre of mass, mm (about 60 px on a phone): the
/// mark is in the middle of the rider, and the label goes past the rider's arm, above the
/// forearm, rather than across it (about 320 mm on the demo bike, 360 on the road bike in the
/// desk's type).
const BRAKING_NEAR_ENOUGH_MM: f64 = 400.0;

/// Checks one drawing, with both postures' labels seen in turn; `want` is how many labels each
/// posture shows with the dimensions. With `rider`, no label may lie on the rider either.
fn check_labels(name: &str, d: &Drawing, o: &Outline, want: [usize; 2], rider: bool) {
    let vb = view_box(d);
    // The view box in kernel axes.
    let view = [vb[0], -(vb[1] + vb[3]), vb[0] + vb[2], -vb[1]];
    for (posture, want) in ["seated", "standing"].into_iter().zip(want) {
        let parts = parts(o, rider.then_some(posture));
        for em in EMS {
            let labels = labels_seen(d, posture, em);
            assert_eq!(labels.len(), want, "{name} {posture}: {labels:?}");
            for (i, l) in labels.iter().enumerate() {
                let at = format!("{name}, {posture}, {em} mm: {} {:?}", l.key, l.ink);
                for (part, p) in &parts {
                    assert!(!p.meets(l.ink, HALO_MM), "{at} lies on the {part}");
                }
                for other in &labels[i + 1..] {
                    let (a, b) = (l.text_box, other.text_box);
                    let apart = a[2] <= b[0] || b[2] <= a[0] || a[3] <= b[1] || b[3] <= a[1];
                    assert!(apart, "{at} overlaps {} {:?}", other.key, other.ink);
                }
                let b = l.text_box;
                let inside =
                    b[0] >= view[0] && b[1] >= view[1] && b[2] <= view[2] && b[3] <= view[3];
                assert!(inside, "{at} outside the view box {view:?}");
                let far = target(d, o, &l.key)
                    .iter()
                    .map(|(a, b)| seg_rect(*a, *b, l.ink))
                    .fold(f64::MAX, f64::min);
                let near = if l.key.ends_with("braking") {
                    BRAKING_NEAR_ENOUGH_MM
                } else {
                    NEAR_ENOUGH_MM
                };
                assert!(far <= near, "{at}: {far:.0} mm from what it measures");
            }
        }
    }
}

/// The bike of a scenario file as the page draws it: the kernel's report, its limits on the
/// centre-of-mass lines.
fn real(json: &str) -> BikeReport {
    let s: Scenario = serde_json::from_str(json).unwrap();
    let mut r = evaluate(&s);
    assert!(r.errors.is_empty(), "{:?}", r.errors);
    r.bikes.remove(0)
}

fn real_drawing(b: &BikeReport) -> Drawing {
    drawing(&Scene::of_bike(b, true))
}

/// Source: the review of the demo bike at 360×740 (reach lay on the top tube, descent on the
/// fork and the front tyre, braking against the bar) and the page's first view
/// (tests/scenarios/demo.json: a 29er trail bike, a seated and a standing rider).
#[test]
fn the_demo_bike_s_labels_keep_off_the_bike_the_rider_and_each_other() {
    let b = real(include_str!("../../../../tests/scenarios/demo.json"));
    let d = real_drawing(&b);
    check_labels("demo", &d, &b.outline, [9, 9], true);
}

/// Source: tests/links/v1-drop-bar-pair.json, its first bike (a road bike on its hoods: the grip
/// far forward, 700c wheels 1000 mm apart; standing, its grips are out of reach, so only the
/// dimensions show). BB height's label does not fit between its tyres in the largest type: it
/// goes under the ground, in a row above the wheelbase line's.
#[test]
fn the_road_bike_s_labels_keep_off_the_bike_the_rider_and_each_other() {
    let b = real(include_str!(
        "../../../../tests/links/v1-drop-bar-pair.json"
    ));
    let d = real_drawing(&b);
    check_labels("road", &d, &b.outline, [9, 6], true);
    let below = crate::dims::Below::of(&b.outline, &b.ridden);
    assert!(below.bb_height, "BB height's label under the ground");
    let y = |key: &str| {
        texts(&d.nodes)
            .into_iter()
            .find_map(|t| match t {
                Node::Text { key: k, y, .. } if k == key => y.parse::<f64>().ok(),
                _ => None,
            })
            .map(|y| -y)
    };
    let ground = b.outline.ground_y;
    let (bb, wheelbase) = (y("dim-bb_height_mm"), y("dim-wheelbase_mm"));
    assert!(
        bb.zip(wheelbase)
            .is_some_and(|(bb, w)| bb < ground && w < bb - 80.0),
        "BB height {bb:?} under the ground ({ground}), the wheelbase {wheelbase:?} a row lower"
    );
    let demo = real(include_str!("../../../../tests/scenarios/demo.json"));
    assert!(
        !crate::dims::Below::of(&demo.outline, &demo.ridden).bb_height,
        "the demo's BB height fits between its tyres"
    );
}

/// The synthetic outline of tests.rs: the seated posture's limits and the dimensions. Its rider
/// holds an arm out far ahead and high, so the braking limit crosses it (no spot right of the
/// arm is inside the view box): the bike alone is checked.
#[test]
fn the_synthetic_bike_s_labels_keep_off_the_bike_and_each_other() {
    let n = numbers();
    let o = full();
    let d = drawing(&scene(&o, &n));
    check_labels("synthetic", &d, &o, [9, 6], false);
}

/// The labels of the placement before this one, on the demo bike (its reach label 25 mm above
/// the reach line, centred; descent at the middle of its tip line): the checks find what the
/// review saw, so they can fail.
#[test]
fn the_checks_find_the_old_placement_s_faults() {
    let b = real(include_str!("../../../../tests/scenarios/demo.json"));
    let o = &b.outline;
    let t = o.head_top;
    let c = o.com_seated.unwrap();
    let em = LABEL_EM_MAX_MM;
    let reach = label_of(
        &shapes::text(
            "dim-reach_mm".into(),
            [t[0] / 2.0, t[1] + 25.0],
            "Reach 470".into(),
            "middle",
            "",
        ),
        em,
    )
    .unwrap();
    let mid = [
        (c[0] + o.front_contact[0]) / 2.0,
        (c[1] + o.front_contact[1]) / 2.0,
    ];
    let descent = label_of(
        &shapes::text(
            "seated-descent".into(),
            mid,
            "descent 35°".into(),
            "start",
            "",
        ),
        em,
    )
    .unwrap();
    let on = |l: &Label| -> Vec<String> {
        parts(o, Some("seated"))
            .into_iter()
            .filter(|(_, p)| p.meets(l.ink, HALO_MM))
            .map(|(n, _)| n)
            .collect()
    };
    assert!(
        on(&reach).contains(&"top tube".to_string()),
        "{:?}",
        on(&reach)
    );
    let d = on(&descent);
    assert!(
        d.contains(&"fork leg".to_string()) && d.contains(&"front tyre".to_string()),
        "{d:?}"
    );
}

/// The braking limit's label never lies on the BB-to-grip dimension label, wherever the grip is
/// around the centre of mass (the two share a line on most bikes when placed alone: seen on the
/// demo bike at phone size).
#[test]
fn the_braking_label_keeps_off_the_bb_to_grip_label() {
    let n = numbers();
    for dx in (-200..=700).step_by(100) {
        for dy in (-200..=150).step_by(50) {
            let mut o = full();
            let c = o.com_seated.unwrap();
            o.cockpit.as_mut().unwrap().grip = [c[0] + f64::from(dx), c[1] + f64::from(dy)];
            let d = drawing(&scene(&o, &n));
            for em in EMS {
                let boxes: std::collections::BTreeMap<String, [f64; 4]> = texts(&d.nodes)
                    .into_iter()
                    .filter_map(|t| label_of(t, em))
                    .map(|l| (l.key, l.text_box))
                    .collect();
                let (b, g) = (boxes["seated-braking"], boxes["dim-bb_to_grip_mm"]);
                let apart = b[2] <= g[0] || g[2] <= b[0] || b[3] <= g[1] || g[3] <= b[1];
                assert!(
                    apart,
                    "{em} mm, grip at COM + ({dx}, {dy}): braking {b:?}, BB to grip {g:?}"
                );
            }
        }
    }
}

/// With nothing in its way (no rider, no cockpit) the braking label's first choice: 40 mm ahead
/// of the centre of mass and 30 mm above it, on the labels' 10 mm grid.
#[test]
fn the_braking_label_sits_just_ahead_of_and_above_the_centre_of_mass() {
    let n = numbers();
    let mut o = full();
    (o.cockpit, o.rider_seated, o.rider_standing) = (None, None, None);
    let d = drawing(&scene(&o, &n));
    let at = texts(&d.nodes).into_iter().find_map(|t| match t {
        Node::Text { key, x, y, .. } if key == "seated-braking" => {
            Some((x.parse::<f64>().ok()?, y.parse::<f64>().ok()?))
        }
        _ => None,
    });
    assert_eq!(
        at,
        Some((20.0, -730.0)),
        "COM at (-20, 700) mm: 40 ahead, 30 above (SVG y down)"
    );
}

/// The view box reaches past the BB-to-grip label's end, estimated for the largest type
/// (its words' width, 40 mm ahead of the grip, and 30 mm for its halo): a road bike's hoods put
/// the grip far forward, and its label ran off a phone's drawing. Where the label ends inside
/// the usual padding (the demo's flat bar), the box is as before.
#[test]
fn the_view_box_holds_the_grip_label_of_a_grip_far_forward() {
    let n = numbers();
    let o = full();
    // Tyre-based: the front tyre's front at 1172 mm, 80 mm of padding, up to a 50 mm step.
    assert_eq!(crate::view::fit(&scene(&o, &n)).max_x(), 1300.0);
    let mut forward = full();
    if let Some(c) = forward.cockpit.as_mut() {
        c.grip = [700.0, 705.0];
    }
    let end = 700.0 + 40.0 + width_em("BB to grip 848") * LABEL_EM_MAX_MM + 30.0;
    let fit = crate::view::fit(&scene(&forward, &n));
    assert!(fit.max_x() >= end && fit.max_x() < end + 50.0, "{fit:?}");
}

/// Source: the demo scenario with its frame, wheels and rider varied about it (reach 400 to 540
/// mm, stack 580 to 690, 29, 27.5 and 700c wheels, riders 1.60 to 1.95 m): 135 bikes, each in
/// both postures, in the largest type. No label lies on another or outside the view box, none on
/// a frame tube, the fork, the headset, a tyre, the cockpit, the seatpost, the saddle or a crank
/// in any of them. The rider's limbs only where the rider fills the room by the centre of mass:
/// the braking limit on the tallest rider's forearm, standing on the shortest, lowest frame
/// (reach 400, stack 580), whose view box is 2100 mm wide and the label 973: right of the
/// upright upper arm it would run 15 mm out of the view box (3 of the 270 views). Before the
/// braking limit's spots flush with the view box's edges and the slope limits' spots 30 mm
/// higher (layout.rs), the climb lay on the rear tyre in 5 views and on the seatpost in 4, and a
/// limit on the rider in 17.
#[test]
fn labels_keep_off_the_frame_and_each_other_across_bikes_and_riders() {
    let demo: serde_json::Value =
        serde_json::from_str(include_str!("../../../../tests/scenarios/demo.json")).unwrap();
    let (mut views, mut on_tyres, mut on_riders, mut on_parts) =
        (0, Vec::new(), Vec::new(), Vec::new());
    for reach in [400, 430, 470, 510, 540] {
        for stack in [580, 635, 690] {
            for wheel in ["29x2.4", "27.5x2.5", "700x32c"] {
                for height in [1600, 1780, 1950] {
                    let mut v = demo.clone();
                    let bike = &mut v["bikes"][0];
                    bike["frame"]["reach_mm"] = reach.into();
                    bike["frame"]["stack_mm"] = stack.into();
                    bike["wheels"] = serde_json::json!({ "front": wheel, "rear": wheel });
                    v["rider"]["height_mm"] = height.into();
                    v["rider"]["inseam_mm"] = (f64::from(height) * 0.47).round().into();
                    let b = real(&v.to_string());
                    let d = real_drawing(&b);
                    let vb = view_box(&d);
                    let view = [vb[0], -(vb[1] + vb[3]), vb[0] + vb[2], -vb[1]];
                    let name = format!("reach {reach}, stack {stack}, {wheel}, rider {height}");
                    for posture in ["seated", "standing"] {
                        views += 1;
                        let labels = labels_seen(&d, posture, LABEL_EM_MAX_MM);
                        for (i, l) in labels.iter().enumerate() {
                            let at = format!("{name}, {posture}: {}", l.key);
                            for other in &labels[i + 1..] {
                                let (a, b) = (l.text_box, other.text_box);
                                let apart =
                                    a[2] <= b[0] || b[2] <= a[0] || a[3] <= b[1] || b[3] <= a[1];
                                assert!(apart, "{at} overlaps {}", other.key);
                            }
                            let tb = l.text_box;
                            let inside = tb[0] >= view[0]
                                && tb[1] >= view[1]
                                && tb[2] <= view[2]
                                && tb[3] <= view[3];
                            assert!(inside, "{at} outside the view box");
                            for (part, p) in parts(&b.outline, Some(posture)) {
                                if !p.meets(l.ink, HALO_MM) {
                                    continue;
                                }
                                if part.ends_with("tyre") {
                                    on_tyres.push(format!("{at} on the {part}"));
                                } else if part.starts_with(posture) {
                                    on_riders.push(format!("{at} on the {part}"));
                                } else {
                                    let frame = [
                                        "chainstay",
                                        "seatstay",
                                        "top tube",
                                        "down tube",
                                        "seat tube",
                                        "head tube",
                                        "headset",
                                        "fork crown",
                                        "fork leg",
                                    ];
                                    assert!(!frame.contains(&part.as_str()), "{at} on the {part}");
                                    on_parts.push(format!("{at} on the {part}"));
                                }
                            }
                        }
                    }
                }
            }
        }
    }
    assert_eq!(views, 270);
    assert!(on_tyres.is_empty(), "{on_tyres:#?}");
    assert!(on_parts.is_empty(), "{on_parts:#?}");
    assert!(
        on_riders.len() <= 3
            && on_riders.iter().all(|t| {
                t.starts_with("reach 400, stack 580, ")
                    && t.contains("rider 1950, standing: standing-braking on the standing forearm")
            }),
        "{on_riders:#?}"
    );
}
