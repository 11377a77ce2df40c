//! Unit tests and the SVG golden file (refresh with `UPDATE_GOLDEN=1 cargo test -p framewise-draw`).

use super::*;
use framewise_kernel::report::{CockpitOutline, CrankOutline, Leg, RiderFigure, SeatOutline};

mod labels;

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
    .map(|(k, v)| (k.into(), v))
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
    assert_eq!(svg.matches("class=\"tyre ").count(), 4, "ridden and ghost");
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
        "tip-line",
        "dim dim-reach_mm",
        "dim dim-bb_to_grip_mm",
        "posture standing",
    ] {
        assert!(svg.contains(&format!("class=\"{part}\"")), "{part}");
    }
    assert!(svg.contains("braking limit 0.63 g") && svg.contains("climb 32°"));
    assert!(svg.contains(">Reach 470<"), "a length without its unit");
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

/// The element with `data-k="key"` in an SVG string: (start of its tag, end of its start tag).
fn element_at(svg: &str, key: &str) -> (usize, usize) {
    let at = svg
        .find(&format!("data-k=\"{key}\""))
        .unwrap_or_else(|| panic!("no element {key}"));
    let start = svg[..at].rfind('<').unwrap();
    let end = at + svg[at..].find('>').unwrap();
    (start, end)
}

/// The SVG's markup for a text (`&`, `<`, `>` escaped) or, with `attr`, an attribute value
/// (quotes escaped too), as the `svg` crate writes them.
fn esc(v: &str, attr: bool) -> String {
    let v = v
        .replace('&', "&amp;")
        .replace('<', "&lt;")
        .replace('>', "&gt;");
    if attr {
        v.replace('"', "&quot;").replace('\'', "&#39;")
    } else {
        v
    }
}

/// Applies a patch list to an SVG string as the page applies it to the DOM: each attribute or
/// text of the keyed element set to the new value.
fn apply(svg: &str, patch: &[Patch]) -> String {
    let mut out = svg.to_string();
    for (key, attr, value) in patch {
        let (start, end) = if *key == model::ROOT_KEY {
            (0, out.find('>').unwrap())
        } else {
            element_at(&out, key)
        };
        if *attr == "text" {
            let close = end + out[end..].find("</").unwrap();
            out.replace_range(end + 1..close, &esc(value, false));
        } else {
            let tag = &out[start..end];
            let name = format!(" {attr}=\"");
            let a = start + tag.find(&name).unwrap() + name.len();
            let b = a + out[a..].find('"').unwrap();
            out.replace_range(a..b, &esc(value, true));
        }
    }
    out
}

/// The full outline with every number moved (the same parts present).
fn moved() -> Outline {
    let mut o = full();
    let shift = |p: &mut Xy, dx: f64, dy: f64| {
        p[0] += dx;
        p[1] += dy;
    };
    shift(&mut o.head_top, 12.3, -4.0);
    shift(&mut o.front_axle, 30.0, 0.0);
    o.front_rim_radius = 0.0; // a rim that is not drawn still leaves its ring (radius 0)
    if let Some(c) = o.cockpit.as_mut() {
        shift(&mut c.grip, -20.0, 15.0);
    }
    if let Some(r) = o.rider_seated.as_mut() {
        shift(&mut r.hip, 5.0, 5.0);
    }
    o.com_seated = Some([-60.0, 720.0]);
    o
}

#[test]
fn the_structure_is_stable_across_numeric_edits() {
    let (n, mut n2) = (numbers(), numbers());
    n2.insert("reach_mm".into(), 482.5);
    let (a, b) = (full(), moved());
    let (da, db) = (drawing(&scene(&a, &n)), drawing(&scene(&b, &n2)));
    assert_eq!(da.structure(), db.structure());
    assert_ne!(da.svg(), db.svg());
    let (pa, pb) = (da.patch(), db.patch());
    assert_eq!(pa.len(), pb.len());
    let changed: Vec<_> = pa.iter().zip(&pb).filter(|(x, y)| x != y).collect();
    assert!(
        changed
            .iter()
            .any(|(x, _)| x.0 == "ridden-fork-leg" && x.1 == "points"),
        "{changed:?}"
    );
    assert!(changed
        .iter()
        .any(|(x, _)| x.0 == "dim-reach_mm" && x.1 == "text"));
    for ((ka, aa, _), (kb, ab, _)) in pa.iter().zip(&pb) {
        assert_eq!((ka, aa), (kb, ab), "same keys in the same order");
    }
}

#[test]
fn the_structure_changes_when_a_part_appears() {
    let n = numbers();
    let (bare, full) = (bare(), full());
    let base = drawing(&scene(&bare, &n)).structure();
    assert_ne!(base, drawing(&scene(&full, &n)).structure());
    let with_cockpit = Outline {
        cockpit: full.cockpit,
        ..bare
    };
    assert_ne!(base, drawing(&scene(&with_cockpit, &n)).structure());
    let mut no_limits = scene(&full, &n);
    no_limits.seated = Limits::default();
    assert_ne!(
        drawing(&scene(&full, &n)).structure(),
        drawing(&no_limits).structure(),
        "the limit labels are elements"
    );
    let mut fewer = n.clone();
    fewer.remove("trail_mm");
    assert_ne!(base, drawing(&scene(&bare, &fewer)).structure());
}

/// The hash of a list of names (`model::NameHash`, as `Drawing::structure` hashes them).
fn name_hash(names: &[&str]) -> u64 {
    let mut h = crate::model::NameHash::new();
    for n in names {
        h.eat(n);
    }
    h.finish()
}

/// Source: the structure's contract (two different element sets get different names but for a
/// 64-bit hash collision). Names that differ in a few bytes at the same length, the case a
/// weaker word-at-a-time mix got wrong (a review found 15 084 collisions in these 24 389 lists,
/// and this pair), all hash apart; so do names split differently across the list.
#[test]
fn the_structure_hash_tells_near_names_apart() {
    let pair = |name: &str| name_hash(&["g", "bike", "polyline", name, "x"]);
    assert_ne!(pair("rider-lag--nper"), pair("rider-lcg-maper"));
    let mut seen = std::collections::HashSet::new();
    let letters: Vec<u8> = (b'a'..=b'z').chain(*b"-._").collect();
    for &a in &letters {
        for &b in &letters {
            for &c in &letters {
                let mut name = *b"rider-lag--nper";
                let [.., x7, _, _, x10, x11, _, _, _] = &mut name;
                (*x7, *x10, *x11) = (a, b, c);
                let name = String::from_utf8_lossy(&name).into_owned();
                seen.insert(name_hash(&["g", "bike", "polyline", &name, "x"]));
            }
        }
    }
    assert_eq!(seen.len(), letters.len().pow(3));
    assert_ne!(name_hash(&["ab", "c"]), name_hash(&["a", "bc"]));
    assert_ne!(name_hash(&["abcdefgh"]), name_hash(&["abcdefgh", ""]));
}

#[test]
fn the_patch_list_turns_one_drawing_into_another() {
    let (n, mut n2) = (numbers(), numbers());
    n2.insert("stack_mm".into(), 641.0);
    let (a, b) = (full(), moved());
    let mut sb = scene(&b, &n2);
    sb.label = "Other <bike> & \"rider\"";
    let (da, db) = (drawing(&scene(&a, &n)), drawing(&sb));
    // Every patch value is in the SVG at its element.
    for d in [&da, &db] {
        assert_eq!(apply(&d.svg(), &d.patch()), d.svg());
    }
    assert_eq!(apply(&da.svg(), &db.patch()), db.svg());
    assert!(db.svg().contains("Other &lt;bike&gt;"));
}

#[test]
fn every_path_and_text_has_a_unique_key() {
    let n = numbers();
    let o = full();
    let d = drawing(&scene(&o, &n));
    let svg = d.svg();
    let keys: Vec<&str> = svg
        .split("data-k=\"")
        .skip(1)
        .map(|s| &s[..s.find('"').unwrap()])
        .collect();
    let unique: std::collections::BTreeSet<_> = keys.iter().collect();
    assert_eq!(unique.len(), keys.len(), "{keys:?}");
    assert_eq!(
        svg.matches("<polyline").count()
            + svg.matches("<circle").count()
            + svg.matches("<text").count()
            + 1,
        keys.len()
    );
    assert!(
        !svg.contains("<path"),
        "every line is a polyline, every circle a ring"
    );
    // Every marker id is unique and every anchor's `marker-start` names one of them.
    let values = |attr: &str| -> Vec<String> {
        svg.split(&format!(" {attr}=\""))
            .skip(1)
            .map(|s| s[..s.find('"').unwrap()].to_string())
            .collect()
    };
    let ids = values("id");
    let unique: std::collections::BTreeSet<_> = ids.iter().collect();
    assert_eq!(unique.len(), ids.len(), "{ids:?}");
    let refs = values("marker-start");
    assert_eq!(refs.len(), ids.len(), "one anchor per marker");
    for r in &refs {
        let id = r.strip_prefix("url(#").and_then(|r| r.strip_suffix(')'));
        assert!(id.is_some_and(|id| unique.contains(&id.to_string())), "{r}");
    }
    assert!(
        refs.contains(&"url(#ring-ridden-rim.1)".to_string()),
        "{refs:?}"
    );
}

/// The patch changes only values that are not CSS properties in Chromium (a path's `d`, a
/// circle's `cx`, `cy`, `r` and `transform` are, and restyle their element when changed): the
/// polylines' `points`, the texts' `x`, `y` and words, the root's `viewBox` and label — and a
/// ring's `r`, which changes only with a radius: moving the points ([`moved`], its rim kept)
/// changes no `r`; and a text's `text-anchor`, which changes only when its label moves to a spot
/// of another kind (crates/draw layout.rs; one text restyled, where an anchor in the structure
/// would replace the whole drawing).
#[test]
fn the_patch_sets_no_styled_geometry_but_ring_radii() {
    let n = numbers();
    let o = full();
    let mut m = moved();
    m.front_rim_radius = o.front_rim_radius; // every point moved, no radius changed
    let (d, dm) = (drawing(&scene(&o, &n)), drawing(&scene(&m, &n)));
    let attrs: std::collections::BTreeSet<&str> = d.patch().iter().map(|p| p.1).collect();
    let want: std::collections::BTreeSet<&str> = [
        "aria-label",
        "points",
        "r",
        "text",
        "text-anchor",
        "viewBox",
        "x",
        "y",
    ]
    .into();
    assert_eq!(attrs, want);
    let radii = |d: &Drawing| -> Vec<(String, String)> {
        d.patch()
            .iter()
            .filter(|p| p.1 == "r")
            .map(|p| (p.0.to_string(), p.2.to_string()))
            .collect()
    };
    assert_eq!(radii(&d), radii(&dm));
    assert_ne!(d.patch(), dm.patch(), "the points moved");
}

/// A circle is a `<circle>` of radius `r` (0.1 mm) at the origin of a marker in the anchor's
/// user units, drawn at the anchor's first point, which is the circle's centre (SVG 2, 11.6.2
/// "the marker element": with `markerUnits="userSpaceOnUse"` and no viewBox or refX/refY, the
/// marker's origin is placed on the vertex in the referencing element's user space), and the
/// marker does not clip it (`overflow="visible"`). Checked on the ridden rear tyre.
#[test]
fn circles_are_rings_at_their_centres() {
    let n = numbers();
    let o = full();
    let svg = draw(&scene(&o, &n));
    let attr = |tag: &str, name: &str| -> String {
        let a = tag
            .find(&format!(" {name}=\""))
            .unwrap_or_else(|| panic!("{name} in {tag}"))
            + name.len()
            + 3;
        tag[a..a + tag[a..].find('"').unwrap()].to_string()
    };
    let (start, end) = element_at(&svg, "ridden-tyre-rear");
    let anchor = &svg[start..end];
    let centre = format!("{},{}", num::mm(o.rear_axle[0]), num::mm(-o.rear_axle[1]));
    assert_eq!(attr(anchor, "points"), format!("{centre} {centre}"));
    assert_eq!(attr(anchor, "class"), "at");
    assert_eq!(attr(anchor, "marker-start"), "url(#ring-ridden-tyre-rear)");
    let marker_at = svg.find("<marker id=\"ring-ridden-tyre-rear\"").unwrap();
    let marker = &svg[marker_at..marker_at + svg[marker_at..].find('>').unwrap()];
    assert_eq!(attr(marker, "markerUnits"), "userSpaceOnUse");
    assert_eq!(attr(marker, "overflow"), "visible");
    assert!(!marker.contains("refX") && !marker.contains("viewBox"));
    assert!(marker_at < start, "the marker comes before its anchor");
    assert!(
        !svg[marker_at..start].contains("<g") && !svg[marker_at..start].contains("</g>"),
        "marker and anchor in the same group (the group's CSS styles the circle)"
    );
    let (cs, ce) = element_at(&svg, "ridden-tyre-rear.r");
    let circle = &svg[cs..ce];
    assert!(circle.starts_with("<circle") && cs > marker_at && cs < start);
    assert_eq!(attr(circle, "r"), num::mm(o.rear_radius));
    assert_eq!(attr(circle, "class"), "tyre rear");
    assert!(!circle.contains("cx") && !circle.contains("cy"));
}

/// A part that is not drawn (a rim of unknown size) is a ring of radius 0, so the drawing's
/// elements stay the same; SVG draws no circle of radius 0.
#[test]
fn a_rim_not_drawn_is_a_ring_of_radius_zero() {
    let n = numbers();
    let mut o = full();
    let before = drawing(&scene(&o, &n));
    o.front_rim_radius = 0.0;
    let after = drawing(&scene(&o, &n));
    let svg = after.svg();
    let (start, end) = element_at(&svg, "ridden-rim.1.r");
    assert!(svg[start..end].contains(" r=\"0\""), "{}", &svg[start..end]);
    assert_eq!(before.structure(), after.structure());
    let (start, end) = element_at(&svg, "ridden-rim.r");
    assert!(
        !svg[start..end].contains(" r=\"0\""),
        "the rear rim is drawn"
    );
}

#[test]
fn numbers_are_tenths_never_nan_or_minus_zero() {
    let n = numbers();
    let mut o = full();
    o.head_top = [f64::NAN, 625.04];
    o.front_axle = [800.06, -0.04];
    let svg = draw(&scene(&o, &n));
    for bad in ["NaN", "inf"] {
        assert!(!svg.contains(bad), "{bad}");
    }
    let numbers_in = |s: &str| -> Vec<String> {
        s.split(|c: char| !(c.is_ascii_digit() || c == '.' || c == '-'))
            .filter(|t| t.chars().any(|c| c.is_ascii_digit()))
            .map(str::to_string)
            .collect()
    };
    for part in svg.split(" points=\"").skip(1) {
        let d = &part[..part.find('"').unwrap()];
        assert!(
            d.chars().all(|c| "0123456789.-, ".contains(c)),
            "only plain numbers (no exponent): {d}"
        );
        for t in numbers_in(d) {
            assert_ne!(t, "-0", "{d}");
            let decimals = t.split('.').nth(1).map_or(0, str::len);
            assert!(decimals <= 1, "{t} in {d}");
        }
    }
    assert!(
        svg.contains(" 800.1,0\""),
        "the front axle at 0.1 mm, -0.04 written as 0"
    );
}

/// Every text of a drawing, in order.
fn texts(nodes: &[Node]) -> Vec<&Node> {
    nodes
        .iter()
        .flat_map(|n| match n {
            Node::Group { children, .. } => texts(children),
            Node::Text { .. } => vec![n],
            Node::Lines { .. } => Vec::new(),
        })
        .collect()
}

/// The drawing's view box as its four numbers `[min-x, min-y, width, height]`.
fn view_box(d: &Drawing) -> Vec<f64> {
    let vb: Vec<f64> = d
        .view_box
        .split(' ')
        .filter_map(|v| v.parse().ok())
        .collect();
    assert_eq!(vb.len(), 4, "{}", d.view_box);
    vb
}

/// Small edits keep the view box and the handling labels where they were: the view box's edges
/// are whole 50 mm steps and the labels sit on a 10 mm grid, so moving the front wheel by 0 to
/// 5 mm (in 1 mm steps) gives at most two view boxes, not six.
#[test]
fn small_edits_keep_the_view_box_and_the_labels() {
    let n = numbers();
    let mut boxes = std::collections::BTreeSet::new();
    for mm in 0..6 {
        let mut o = full();
        o.front_axle[0] += f64::from(mm);
        o.front_contact[0] += f64::from(mm);
        o.steer_ground[0] += f64::from(mm);
        let d = drawing(&scene(&o, &n));
        let edges = view_box(&d);
        for e in [edges[0], edges[1], edges[0] + edges[2], edges[1] + edges[3]] {
            assert!(
                (e / VIEW_STEP_MM).fract().abs() < 1e-9,
                "{} not on a step",
                d.view_box
            );
        }
        boxes.insert(d.view_box.clone());
        let labels: Vec<(String, f64, f64)> = texts(&d.nodes)
            .into_iter()
            .filter_map(|n| match n {
                Node::Text { key, x, y, .. } => {
                    Some((key.clone(), x.parse().ok()?, y.parse().ok()?))
                }
                _ => None,
            })
            .collect();
        for (key, x, y) in labels.iter().filter(|(k, _, _)| !k.starts_with("dim-")) {
            assert!(
                (x / 10.0).fract().abs() < 1e-9 && (y / 10.0).fract().abs() < 1e-9,
                "{key} at {x}, {y}"
            );
        }
        assert!(
            labels.iter().any(|(k, _, _)| k == "seated-braking"),
            "{labels:?}"
        );
    }
    assert!(boxes.len() <= 2, "{boxes:?}");
}

/// Source: crates/draw `view` (the rule). A drawing in a looser view box that still holds the fit
/// differs from the fitted one only in the root's `viewBox` and the ground line drawn across it;
/// a view box too loose for the fit is not kept.
#[test]
fn a_kept_view_box_changes_only_the_view_box_and_the_ground() {
    let (o, n) = (full(), numbers());
    let fitted = drawing(&scene(&o, &n));
    let fit = fitted.view;
    let looser = ViewBox {
        min_x: fit.min_x - VIEW_STEP_MM,
        min_y: fit.min_y - VIEW_STEP_MM,
        width: fit.width + VIEW_SLACK_MM,
        height: fit.height + VIEW_SLACK_MM,
    };
    let kept = drawing_in(&scene(&o, &n), Some(looser));
    assert_eq!(kept.view, looser);
    assert_eq!(kept.structure(), fitted.structure());
    let (a, b) = (fitted.patch(), kept.patch());
    assert_eq!(a.len(), b.len());
    let differ: Vec<(&str, &str)> = a
        .iter()
        .zip(&b)
        .filter(|(x, y)| x != y)
        .map(|(x, _)| (x.0, x.1))
        .collect();
    assert_eq!(differ, [("svg", "viewBox"), ("ground", "points")]);
    let too_loose = ViewBox {
        width: looser.width + VIEW_STEP_MM,
        ..looser
    };
    assert_eq!(drawing_in(&scene(&o, &n), Some(too_loose)).view, fit);
}

/// Source: this crate's ghost rule (ghost.rs): a sagged bike's BB is nearer the ground, here by
/// 20 mm (ground at −320 against the stock −340); the ghost is moved up 20 mm so its tyres touch
/// the same ground: rear axle 32 + 20 = 52, contacts on −320, the BB at (0, 20).
#[test]
fn the_stock_ghost_stands_on_the_ridden_ground() {
    let stock = full();
    let (g, bb) = ghost::on_ground(&stock, -320.0);
    assert_eq!(bb, [0.0, 20.0]);
    assert_eq!(g.ground_y, -320.0);
    assert_eq!(g.rear_axle, [-435.0, 52.0]);
    assert_eq!(g.front_contact, [800.0, -320.0]);
    assert_eq!(
        g.rear_axle[1] - g.rear_radius,
        g.ground_y,
        "the tyre touches the ground"
    );
    assert_eq!(g.head_top, [470.0, 645.0]);
    assert!(
        g.cockpit.is_none() && g.seat.is_none() && g.rider_seated.is_none(),
        "the stock frame and wheels alone"
    );
    let frame = bare();
    assert_eq!(
        ghost::on_ground(&frame, frame.ground_y).0,
        frame,
        "no change when the grounds agree"
    );

    // Drawn: the ghost's BB ring 20 mm above the ridden one (SVG y is down).
    let mut ridden = bare();
    ridden.ground_y = -320.0;
    let n = numbers();
    let stock = bare();
    let sc = Scene {
        stock: &stock,
        ..scene(&ridden, &n)
    };
    let svg = draw(&sc);
    let ghost_start = svg.find("class=\"bike ghost\"").unwrap_or(0);
    let ghost_svg = &svg[ghost_start..svg.find("class=\"bike ridden\"").unwrap_or(svg.len())];
    assert!(
        !ghost_svg.contains(" 0,0 ") && !ghost_svg.contains("\"0,0 "),
        "no ghost line still runs to the ridden BB: {ghost_svg}"
    );
    assert!(
        ghost_svg.contains("0,-20 0,-20"),
        "the ghost's BB at y 20 mm: {ghost_svg}"
    );
}

/// The SVG as the `svg` crate wrote it before the drawing had its own writer (the element tree
/// of `model.rs` until 2026-12): the reference the writer must match byte for byte.
mod svg_crate {
    use crate::model::{ring_id, Drawing, Node, TITLE_KEY};
    use svg::node::element::{Circle, Element, Group, Marker, Polyline, Text, Title};
    use svg::Document;

    /// The document as the `svg` crate writes it.
    pub fn svg(d: &Drawing) -> String {
        let mut doc = Document::new()
            .set("viewBox", d.view_box())
            .set("class", "bike-drawing")
            .set("role", "img")
            .set("aria-label", d.title.as_str())
            .add(Title::new(d.title.as_str()).set("data-k", TITLE_KEY));
        for n in &d.nodes {
            for e in elements(n) {
                doc = doc.add(e);
            }
        }
        doc.to_string()
    }

    /// One node's elements.
    fn elements(n: &Node) -> Vec<Element> {
        match n {
            Node::Group { class, children } => {
                let mut g = Group::new().set("class", class.as_str());
                for e in children.iter().flat_map(elements) {
                    g = g.add(e);
                }
                vec![g.into()]
            }
            Node::Lines { class, lines } => {
                let mut out = Vec::new();
                for l in lines {
                    let line = Polyline::new().set("data-k", l.key.as_str());
                    let Some(ring) = &l.ring else {
                        out.push(
                            line.set("class", class.as_str())
                                .set("points", l.points.as_str())
                                .into(),
                        );
                        continue;
                    };
                    let id = ring_id(&l.key);
                    let circle = Circle::new()
                        .set("data-k", ring.key.as_str())
                        .set("class", class.as_str())
                        .set("r", ring.r.as_str());
                    out.push(
                        Marker::new()
                            .set("id", id.as_str())
                            .set("markerUnits", "userSpaceOnUse")
                            .set("overflow", "visible")
                            .add(circle)
                            .into(),
                    );
                    out.push(
                        line.set("class", "at")
                            .set("points", l.points.as_str())
                            .set("marker-start", format!("url(#{id})"))
                            .into(),
                    );
                }
                out
            }
            Node::Text {
                key,
                class,
                anchor,
                x,
                y,
                words,
            } => vec![Text::new(words.as_str())
                .set("data-k", key.as_str())
                .set("class", class.as_str())
                .set("text-anchor", *anchor)
                .set("x", x.as_str())
                .set("y", y.as_str())
                .into()],
        }
    }
}

#[test]
fn the_svg_writer_writes_what_the_svg_crate_wrote() {
    let (n, mut n2) = (numbers(), numbers());
    n2.insert("stack_mm".into(), 641.0);
    let (a, b, c) = (full(), moved(), bare());
    let mut odd = scene(&b, &n2);
    // Every character either writer escapes, in the title and the label's text.
    odd.label = "Other <bike> & \"rider\" 'n' > é";
    let mut drawings = vec![
        drawing(&scene(&a, &n)),
        drawing(&odd),
        drawing(&scene(&c, &n)),
    ];
    // A group with nothing in it, an empty text and words to escape in a text and a class.
    let mut d = drawing(&scene(&a, &n));
    d.nodes.push(Node::Group {
        class: "empty".into(),
        children: vec![],
    });
    d.nodes.push(Node::Group {
        class: "a&b".into(),
        children: vec![
            Node::Text {
                key: "t1".into(),
                class: "dim".into(),
                anchor: "middle",
                x: "1".into(),
                y: "-2.5".into(),
                words: String::new(),
            },
            Node::Text {
                key: "t2".into(),
                class: "dim".into(),
                anchor: "end",
                x: "0".into(),
                y: "0".into(),
                words: "a < b & 'c' \"d\"".into(),
            },
            Node::Group {
                class: "inner".into(),
                children: vec![],
            },
        ],
    });
    drawings.push(d);
    for d in &drawings {
        assert_eq!(d.svg(), svg_crate::svg(d));
    }
    assert!(drawings[1]
        .svg()
        .contains("aria-label=\"Side view of Other &lt;bike&gt; &amp; &quot;rider&quot; &apos;n&apos; &gt; é\""));
    assert!(drawings[3].svg().contains("<g class=\"empty\"/>"));
}
