//! A three-leg sling on a rigid load: the advisory at the master link puts
//! the EN 818-4 / EN 13414-2 two-leg rating beside the solved forces.

#![allow(clippy::expect_used, clippy::unwrap_used, reason = "test helpers fail loudly on broken fixtures")]

use tautspan_core::analysis::analyse;
use tautspan_core::model::load_scenario;

const G: f64 = 9.80665;

// Master link H at (0, 3 m); three legs down to a beam at y = 1 m, at
// x = -1, 0, 1 m (two level rods make it rigid), 100 kg at each point.
// Each leg MBS 100 kN x ferrule 0.90 (EN 13414-1, from memory) / 5 (ASME
// B30.9) = 18 kN. Outer legs atan(1/2) = 26.57 deg from vertical, so the
// two-leg rating (EN 818-4 / EN 13414-2, from memory) is 2 x 18 x cos 26.57
// deg = 32.20 kN vertical; the legs carry the whole weight, 300 x 9.80665 =
// 2.942 kN (statics; the rods are level and weightless). The message prints
// four significant figures.
#[test]
fn three_legs_on_a_rigid_load_are_set_beside_the_two_leg_rating() {
    let leg = |id: &str, at: &str| {
        format!(
            r#"Member(id: "{id}", ends: ("H", "{at}"), kind: WireRope, area: "100 mm^2", modulus: "100 GPa",
               rating: BreakingStrength("100 kN"), termination: FerruleSecured, linear_mass: "0 kg/m")"#
        )
    };
    let rod = |id: &str, a: &str, b: &str| {
        format!(
            r#"Member(id: "{id}", ends: ("{a}", "{b}"), kind: Rod, section: Tube(outer: "60.3 mm", wall: "4 mm"),
               material: "steel", rating: Yield("355 MPa"), linear_mass: "0 kg/m")"#
        )
    };
    let text = format!(
        r#"Scenario(format: 1, title: "three legs",
        nodes: [ Node(id: "H", at: ("0 m", "3 m"), support: Anchor), Node(id: "L", at: ("-1 m", "1 m")),
                 Node(id: "C", at: ("0 m", "1 m")), Node(id: "R", at: ("1 m", "1 m")) ],
        members: [ {}, {}, {}, {}, {} ],
        masses: [ Mass(id: "l", at: "L", mass: "100 kg"), Mass(id: "c", at: "C", mass: "100 kg"), Mass(id: "r", at: "R", mass: "100 kg") ],
        cases: [ Static(id: "s") ])"#,
        leg("west", "L"),
        leg("mid", "C"),
        leg("east", "R"),
        rod("beam-w", "L", "C"),
        rod("beam-e", "C", "R")
    );
    let l = load_scenario(&text).unwrap_or_else(|e| panic!("{e}"));
    let a = analyse(&l.scenario);
    let w = &a.cases[0].warnings;
    let advisory = w.iter().find(|m| m.contains("gathering point H")).unwrap_or_else(|| panic!("{w:?}"));
    assert!(advisory.contains("3 sling legs"), "{advisory}");
    assert!(advisory.contains("2 x weakest leg allowable 18 kN"), "{advisory}");
    assert!(advisory.contains("= 32.2 kN vertical"), "{advisory}");
    assert!(advisory.contains(&format!("against {} kN carried", format_4(300.0 * G / 1e3))), "{advisory}");
    assert!(advisory.contains("west ") && advisory.contains("mid ") && advisory.contains("east "), "{advisory}");
    assert!(!advisory.contains("OVER"), "{advisory}");
    // the advisory is of the kind multi_leg, once for the gathering point
    let items: Vec<_> =
        a.cases[0].warning_items.iter().filter(|w| w.kind == tautspan_core::analysis::WarningKind::MultiLeg).collect();
    assert_eq!(items.len(), 1);
    assert_eq!(&items[0].message, advisory);
    // every leg's own check is unchanged: 18 kN each
    for m in &a.cases[0].members[..3] {
        assert!(((m.allowable_n - 18e3) / 18e3).abs() < 1e-9);
    }
}

// 2.94199... to four significant figures, as the message prints it
fn format_4(v: f64) -> String {
    format!("{}", tautspan_core::units::Sig(v, 4))
}
