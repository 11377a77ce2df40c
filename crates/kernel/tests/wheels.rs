//! Wheel designations: ETRTO, common names with inch or mm widths, diameter override, errors.
#![allow(clippy::unwrap_used, clippy::indexing_slicing, clippy::panic)]

use framewise_kernel::WheelSpec;

fn wheel(s: &str) -> (f64, f64, f64) {
    let w = WheelSpec::Designation(s.into()).resolve("w").unwrap();
    (w.bsd_mm, w.width_mm, w.radius_mm)
}

fn close(a: (f64, f64, f64), b: (f64, f64, f64)) -> bool {
    (a.0 - b.0).abs() < 1e-9 && (a.1 - b.1).abs() < 1e-9 && (a.2 - b.2).abs() < 1e-9
}

/// Source: ISO 5775 bead seat diameters, REFERENCES.md [read: 622, 584, 559, 507, 406, 305;
/// memory: 571 (650C), 630 (27 in), 590 (650A)]; height = width (+2.5 mm under 28 mm) [read].
#[test]
fn designations_in_every_accepted_form() {
    let cases = [
        ("62-622", (622.0, 62.0, 311.0 + 62.0)),
        ("25-622", (622.0, 25.0, 311.0 + 27.5)),
        ("29x2.4", (622.0, 60.96, 311.0 + 60.96)),
        ("29 x 2.4in", (622.0, 60.96, 311.0 + 60.96)),
        ("29\"x2.4\"", (622.0, 60.96, 311.0 + 60.96)),
        ("28x1.5", (622.0, 38.1, 311.0 + 38.1)),
        ("700x32c", (622.0, 32.0, 311.0 + 32.0)),
        ("700x25", (622.0, 25.0, 311.0 + 27.5)),
        ("700C x 28", (622.0, 28.0, 311.0 + 28.0)),
        ("27.5x2.6", (584.0, 66.04, 292.0 + 66.04)),
        ("650bx47", (584.0, 47.0, 292.0 + 47.0)),
        ("26x1.95", (559.0, 49.53, 279.5 + 49.53)),
        ("24x2.0", (507.0, 50.8, 253.5 + 50.8)),
        ("20x1.75", (406.0, 44.45, 203.0 + 44.45)),
        ("16x2.0", (305.0, 50.8, 152.5 + 50.8)),
        ("650cx23", (571.0, 23.0, 285.5 + 25.5)),
        ("27x1.25", (630.0, 31.75, 315.0 + 31.75)),
        ("29×2,4", (622.0, 60.96, 311.0 + 60.96)),
    ];
    for (s, want) in cases {
        let got = wheel(s);
        assert!(close(got, want), "{s}: {got:?} vs {want:?}");
    }
}

#[test]
fn diameter_override_per_wheel() {
    let w = WheelSpec::Diameter { diameter_mm: 738.0 }
        .resolve("w")
        .unwrap();
    assert_eq!(w.radius_mm, 369.0);
    for bad in [f64::NAN, f64::INFINITY, -740.0, 0.0, 2000.0] {
        let e = WheelSpec::Diameter { diameter_mm: bad }.resolve("bikes[0].wheels.rear");
        let e = e.unwrap_err();
        assert_eq!(e.field, "bikes[0].wheels.rear");
        assert!(
            e.message.contains("250") && e.message.contains("900"),
            "{}",
            e.message
        );
    }
}

#[test]
fn unknown_designations_list_the_accepted_forms() {
    for bad in [
        "", "29", "29x", "x2.4", "31x2.4", "29x0.2", "29x200", "62-9999", "big", "62-",
    ] {
        let e = WheelSpec::Designation(bad.into())
            .resolve("bikes[0].wheels.front")
            .unwrap_err();
        assert_eq!(e.code, "unknown_wheel", "{bad}");
        assert!(
            e.message.contains("62-622") && e.message.contains("29x2.4, 27.5x2.5"),
            "{bad}"
        );
    }
}
