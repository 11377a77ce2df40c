//! Round trips: every field of the scenario types has a slot in the link (a field added to
//! `Setup`, `RiderInput`, `Changes`, … without one fails here), and random scenarios come back
//! exactly at the link's resolution.
// Test helpers outside #[test] functions may unwrap, index and panic too (clippy.toml).
#![allow(
    clippy::unwrap_used,
    clippy::expect_used,
    clippy::panic,
    clippy::indexing_slicing
)]

mod link_common;

use framewise_formats::{decode_link, encode_link, LinkError};
use framewise_kernel::{
    BikeInput, Changes, Load, RiderInput, Scenario, Setup, View, WheelsInput, CATALOGUE,
};
use link_common::*;
use proptest::prelude::*;
use serde_json::{json, Map, Value};

/// Steps per unit the link keeps, by key suffix (docs/LINKS.md).
fn denom(key: &str) -> Option<f64> {
    [
        ("_mm", 2.0),
        ("_deg", 20.0),
        ("_kg", 10.0),
        ("_pct", 10.0),
        ("_g", 100.0),
    ]
    .iter()
    .find(|(s, _)| key.ends_with(s))
    .map(|(_, d)| *d)
}

/// Text fields and their usual words.
fn words(key: &str) -> Option<&'static [&'static str]> {
    Some(match key {
        "bar_type" => &["flat", "drop"],
        "hand_position" => &["hoods", "drops", "tops"],
        "align" => &["bb", "rear_axle", "front_axle", "grip"],
        "units" => &["mm", "in"],
        "posture" => &["seated", "standing"],
        _ => return None,
    })
}

/// A value for every field of a flat group; `i` varies the numbers. Panics on a field whose
/// kind this test does not know, so a new kind of field is noticed.
fn fill(keys: &[String], i: i64) -> Map<String, Value> {
    keys.iter()
        .map(|k| {
            let v = if let Some(d) = denom(k) {
                json!((300 + 7 * i) as f64 / d)
            } else if let Some(w) = words(k) {
                json!(w[(i as usize) % w.len()])
            } else {
                match k.as_str() {
                    "dimensions" | "ghost" => json!(i % 2 == 0),
                    "selected" | "target_grip_bike" => json!(i),
                    other => {
                        panic!("field {other}: unknown kind, add it to the link table and here")
                    }
                }
            };
            (k.clone(), v)
        })
        .collect()
}

fn without(keys: Vec<String>, skip: &[&str]) -> Vec<String> {
    keys.into_iter()
        .filter(|k| !skip.contains(&k.as_str()))
        .collect()
}

/// A scenario with every field of every type set.
fn everything() -> Value {
    let wheels = |f: &str, r: &str| json!({ "front": f, "rear": r });
    assert_eq!(field_names::<WheelsInput>(), ["front", "rear"]);
    assert_eq!(
        field_names::<Scenario>(),
        ["version", "rider", "bikes", "view"]
    );
    let bike_keys = field_names::<BikeInput>();
    let known = [
        "label",
        "frame",
        "seat_angle_ref_mm",
        "wheels",
        "setup",
        "changes",
        "load",
    ];
    assert!(
        bike_keys.iter().all(|k| known.contains(&k.as_str())),
        "new bike field: {bike_keys:?}"
    );
    let mut changes = fill(&without(field_names::<Changes>(), &["wheels"]), 3);
    changes.insert("wheels".into(), wheels("27.5x2.5", "62-584"));
    let frame: Map<String, Value> = CATALOGUE
        .iter()
        .enumerate()
        .map(|(i, m)| {
            let v = (200 + i) as f64 / 2.0;
            let p = if i % 3 == 0 {
                json!({ "value": v, "tolerance": 0.5 })
            } else {
                json!(v)
            };
            (m.key.to_string(), p)
        })
        .collect();
    json!({
        "version": 1,
        "rider": fill(&field_names::<RiderInput>(), 1),
        "bikes": [{
            "label": "Everything <b>set</b> & \"quoted\" é",
            "frame": frame,
            "seat_angle_ref_mm": 612.5,
            "wheels": { "front": "29x2.35", "rear": { "diameter_mm": 741.5 } },
            "setup": fill(&field_names::<Setup>(), 2),
            "changes": changes,
            "load": fill(&field_names::<Load>(), 4),
        }],
        "view": fill(&field_names::<View>(), 1),
    })
}

#[test]
fn every_field_of_every_scenario_type_survives_a_link() {
    let want = everything();
    let s = scenario(want.clone());
    let frag = encode_link(&s).unwrap_or_else(|e| panic!("{e}"));
    let back = serde_json::to_value(decode_link(&frag).unwrap()).unwrap();
    assert_eq!(back, want, "every key and value comes back");
    // Every type's fields are set in the JSON (none skipped as absent).
    let bike = &back["bikes"][0];
    for (name, obj, keys) in [
        ("rider", &back["rider"], field_names::<RiderInput>()),
        ("setup", &bike["setup"], field_names::<Setup>()),
        ("changes", &bike["changes"], field_names::<Changes>()),
        ("view", &back["view"], field_names::<View>()),
        ("load", &bike["load"], field_names::<Load>()),
        ("bike", bike, field_names::<BikeInput>()),
    ] {
        for k in keys {
            assert!(obj.get(&k).is_some(), "{name}.{k} lost in the link");
        }
    }
    for m in CATALOGUE {
        assert!(bike["frame"].get(m.key).is_some(), "frame.{} lost", m.key);
    }
}

#[test]
fn a_frame_key_outside_the_table_is_refused_by_name() {
    let s = scenario(json!({ "bikes": [{ "frame": { "reach_mm": 470, "mystery_mm": 1 } }] }));
    assert_eq!(
        encode_link(&s),
        Err(LinkError::NotCovered {
            path: "bikes[0].frame.mystery_mm".into()
        })
    );
}

#[test]
fn values_between_steps_round_to_the_nearest_step() {
    let s = scenario(json!({ "rider": { "height_mm": 1780.3, "mass_kg": 74.04 },
        "bikes": [{ "frame": { "head_angle_deg": 64.53, "reach_mm": 470.26 },
                    "changes": { "front_sag_pct": 22.46 } }] }));
    let back = decode_link(&encode_link(&s).unwrap()).unwrap();
    let r = back.rider.unwrap();
    assert_eq!(r.height_mm, Some(1780.5));
    assert_eq!(r.mass_kg, Some(74.0));
    let b = &back.bikes[0];
    assert_eq!(b.frame["head_angle_deg"].value(), 64.55);
    assert_eq!(b.frame["reach_mm"].value(), 470.5);
    assert_eq!(b.changes.front_sag_pct, Some(22.5));
}

// ---- random scenarios -------------------------------------------------------------------------

fn on_grid(key: &str) -> BoxedStrategy<Value> {
    let d = denom(key).unwrap_or(1.0);
    (-200_000i64..200_000)
        .prop_map(move |q| json!(q as f64 / d))
        .boxed()
}

fn random_group(keys: Vec<String>) -> BoxedStrategy<Value> {
    let parts: Vec<BoxedStrategy<Option<(String, Value)>>> = keys
        .into_iter()
        .map(|k| {
            let value: BoxedStrategy<Value> = if denom(&k).is_some() {
                on_grid(&k)
            } else if let Some(w) = words(&k) {
                prop_oneof![
                    proptest::sample::select(w).prop_map(|s| json!(s)),
                    "[a-z_]{0,12}".prop_map(|s| json!(s)),
                ]
                .boxed()
            } else if k == "selected" || k == "target_grip_bike" {
                (0u32..20).prop_map(|n| json!(n)).boxed()
            } else {
                any::<bool>().prop_map(|b| json!(b)).boxed()
            };
            proptest::option::of(value.prop_map(move |v| (k.clone(), v))).boxed()
        })
        .collect();
    parts
        .prop_map(|kv| Value::Object(kv.into_iter().flatten().collect()))
        .boxed()
}

fn random_wheel() -> BoxedStrategy<Value> {
    prop_oneof![
        proptest::sample::select(&["29x2.4", "27.5x2.6", "700x32c", "650bx47", "26x2.3"][..])
            .prop_map(|s| json!(s)),
        (15u32..130, 150u32..700).prop_map(|(w, b)| json!(format!("{w}-{b}"))),
        "[0-9a-zé.x ]{1,10}".prop_map(|s| json!(s.trim())),
        (500i64..1800).prop_map(|q| json!({ "diameter_mm": q as f64 / 2.0 })),
    ]
    .boxed()
}

fn random_wheels() -> BoxedStrategy<Value> {
    (
        proptest::option::of(random_wheel()),
        proptest::option::of(random_wheel()),
    )
        .prop_map(|(f, r)| {
            let mut m = Map::new();
            if let Some(f) = f {
                m.insert("front".into(), f);
            }
            if let Some(r) = r {
                m.insert("rear".into(), r);
            }
            Value::Object(m)
        })
        .boxed()
}

fn random_frame() -> BoxedStrategy<Value> {
    let parts: Vec<_> = CATALOGUE
        .iter()
        .map(|m| {
            let key = m.key;
            let d = denom(key).unwrap_or(1.0);
            proptest::option::of(
                (-20_000i64..20_000, proptest::option::of(0i64..40)).prop_map(move |(q, t)| {
                    let v = q as f64 / d;
                    let p = match t {
                        Some(t) => json!({ "value": v, "tolerance": t as f64 / d }),
                        None => json!(v),
                    };
                    (key.to_string(), p)
                }),
            )
        })
        .collect();
    parts
        .prop_map(|kv| Value::Object(kv.into_iter().flatten().collect()))
        .boxed()
}

fn random_bike() -> BoxedStrategy<Value> {
    (
        "[ a-zA-Z0-9,.<>\"'&é🚲QZ-]{0,30}",
        random_frame(),
        proptest::option::of(on_grid("_mm")),
        random_wheels(),
        random_group(field_names::<Setup>()),
        (
            random_group(without(field_names::<Changes>(), &["wheels"])),
            random_wheels(),
        ),
        proptest::option::of(random_group(field_names::<Load>())),
    )
        .prop_map(
            |(label, frame, sref, wheels, setup, (mut changes, cw), load)| {
                changes["wheels"] = cw;
                let mut b = json!({ "label": label.trim(), "frame": frame, "wheels": wheels,
                                "setup": setup, "changes": changes });
                if let Some(r) = sref {
                    b["seat_angle_ref_mm"] = r;
                }
                // A load needs all three numbers.
                if let Some(l) = load.filter(|l| l.as_object().is_some_and(|m| m.len() == 3)) {
                    b["load"] = l;
                }
                b
            },
        )
        .boxed()
}

fn random_scenario() -> impl Strategy<Value = Scenario> {
    (
        proptest::option::of(random_group(field_names::<RiderInput>())),
        proptest::collection::vec(random_bike(), 0..5),
        random_group(field_names::<View>()),
    )
        .prop_map(|(rider, bikes, view)| {
            let mut s = json!({ "version": 1, "bikes": bikes, "view": view });
            if let Some(r) = rider {
                s["rider"] = r;
            }
            scenario(s)
        })
}

proptest! {
    #![proptest_config(ProptestConfig::with_cases(300))]

    #[test]
    fn random_scenarios_come_back_exactly(s in random_scenario()) {
        let frag = encode_link(&s).unwrap();
        prop_assert!(frag.chars().all(|c| c.is_ascii_alphanumeric() || c == '-' || c == '_'));
        prop_assert_eq!(decode_link(&frag).unwrap(), s);
    }

    #[test]
    fn any_number_comes_back_within_half_a_step(h in 500.0f64..2500.0, a in 40.0f64..90.0,
                                                 m in 0.0f64..200.0) {
        let s = scenario(json!({ "rider": { "height_mm": h, "mass_kg": m },
                                 "bikes": [{ "frame": { "head_angle_deg": a } }] }));
        let back = decode_link(&encode_link(&s).unwrap()).unwrap();
        let r = back.rider.unwrap();
        prop_assert!((r.height_mm.unwrap() - h).abs() <= 0.25 + 1e-9);
        prop_assert!((r.mass_kg.unwrap() - m).abs() <= 0.05 + 1e-9);
        prop_assert!((back.bikes[0].frame["head_angle_deg"].value() - a).abs() <= 0.025 + 1e-9);
    }
}
