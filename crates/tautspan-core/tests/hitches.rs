//! Sling hitches and wire rope bent over a pin, through the whole chain
//! (file → model → solver → checks): the mode factor on the allowable by
//! rule set, the D/d efficiency, the sling-angle warning for hitched
//! members, and the located errors. Each expected value is worked by hand
//! beside the check with its source.

#![allow(clippy::expect_used, clippy::unwrap_used, reason = "test helpers fail loudly on broken fixtures")]

use tautspan_core::analysis::{Analysis, analyse, member_allowable};
use tautspan_core::model::load_scenario;

const G: f64 = 9.80665;

fn rel(a: f64, b: f64) -> f64 {
    ((a - b) / b).abs()
}

/// One plumb line of `member` from an anchor holding 100 kg, with the
/// scenario-level `head` (e.g. `rules: ASME,`).
fn line(member: &str, head: &str) -> String {
    format!(
        r#"Scenario(format: 1, title: "line", {head}
        nodes: [ Node(id: "A", at: ("0 m", "5 m"), support: Anchor), Node(id: "M", at: ("0 m", "1 m")) ],
        members: [ Member(id: "line", ends: ("A", "M"), {member}) ],
        masses: [ Mass(id: "load", at: "M", mass: "100 kg") ],
        cases: [ Static(id: "s") ])"#
    )
}

fn analysed(text: &str) -> Analysis {
    let l = load_scenario(text).unwrap_or_else(|e| panic!("{e}"));
    analyse(&l.scenario)
}

const WIRE: &str = r#"kind: WireRope, area: "100 mm^2", modulus: "100 GPa", rating: BreakingStrength("100 kN"), termination: FerruleSecured"#;

// A wire rope sling MBS 100 kN, ferrule secured 0.90 (EN 13414-1, from
// memory), design factor 5 (ASME B30.9): straight 100 x 0.9 / 5 = 18 kN.
// Mode factors (REFERENCES "Hitches, terminations", EN 13414-1 / EN 1492-1 /
// EN 818-4, from memory): choke 0.8 → 14.4 kN; basket parallel legs 2.0 →
// 36 kN; basket 30 deg from vertical 1.4 → 25.2 kN.
// ASME B30.9 choke-angle reduction (from memory) on the choke 0.8:
// 150 deg x 1.00 → 14.4; 90 deg x 0.87 → 12.528; 75 deg x 0.74 → 10.656;
// 45 deg x 0.62 → 8.928 kN.
// Chain grade 80, 8 mm: EN 818-2 WLL 2.0 t (from memory), choked x 0.8 →
// 1.6 t = 15.69 kN.
// D/d (wire rope users' manuals curve, from memory): d 16 mm over D 160 mm,
// D/d 10 → 0.86: 100 x 0.9 x 0.86 / 5 = 15.48 kN; over 240 mm, D/d 15,
// linear between 10 (0.86) and 20 (0.91) → 0.885: 15.93 kN; choked as well
// → 15.48 x 0.8 = 12.384 kN.
// Exact arithmetic on table values: 1e-9.
#[test]
fn mode_factor_and_bend_efficiency_on_the_allowable() {
    let d16 = r#"diameter: "16 mm""#;
    let table: Vec<(String, &str, f64, &str)> = vec![
        (WIRE.to_string(), "", 18e3, "ferrule"),
        (format!("{WIRE}, hitch: Straight"), "", 18e3, "straight 1"),
        (format!("{WIRE}, hitch: Choker"), "", 14.4e3, "EN 13414-1"),
        (format!("{WIRE}, hitch: Basket"), "", 36e3, "whole basket"),
        (format!("{WIRE}, hitch: Basket, basket_angle: \"30 deg\""), "", 25.2e3, "0-45 deg"),
        (format!("{WIRE}, hitch: Choker, choke_angle: \"150 deg\""), "rules: ASME,", 14.4e3, "over 120"),
        (format!("{WIRE}, hitch: Choker, choke_angle: \"90 deg\""), "rules: ASME,", 12.528e3, "90-120"),
        (format!("{WIRE}, hitch: Choker, choke_angle: \"75 deg\""), "rules: ASME,", 10.656e3, "60-89"),
        (format!("{WIRE}, hitch: Choker, choke_angle: \"45 deg\""), "rules: ASME,", 8.928e3, "30-59"),
        (format!("{WIRE}, hitch: Choker"), "rules: EN,", 14.4e3, "EN 13414-1"),
        (r#"kind: Chain, diameter: "8 mm", grade: "80", hitch: Choker"#.to_string(), "", 1600.0 * G, "EN 818-4"),
        (format!("{WIRE}, {d16}, bent_over: \"160 mm\""), "", 15.48e3, "D/d 10"),
        (format!("{WIRE}, {d16}, bent_over: \"240 mm\""), "", 15.93e3, "D/d 15"),
        (format!("{WIRE}, {d16}, bent_over: \"160 mm\", hitch: Choker"), "", 12.384e3, "mode factor 0.8"),
    ];
    for (member, head, allowable, source) in &table {
        let text = line(member, head);
        let a = analysed(&text);
        let got = a.cases[0].members[0].allowable_n;
        assert!(rel(got, *allowable) < 1e-9, "{member} {head}: {got} vs {allowable}");
        let l = load_scenario(&text).unwrap();
        let words = member_allowable(&l.scenario.members[0]).explanation;
        assert!(words.contains(source), "{member} {head}: {words}");
    }
}

#[test]
fn results_carry_the_mode_factor_and_bend_efficiency() {
    let a = analysed(&line(&format!("{WIRE}, diameter: \"16 mm\", bent_over: \"160 mm\", hitch: Choker"), ""));
    let m = &a.cases[0].members[0];
    assert_eq!(m.mode_factor, Some(0.8));
    assert!((m.bend_efficiency.unwrap() - 0.86).abs() < 1e-12);
    let plain = analysed(&line(WIRE, ""));
    assert_eq!(plain.cases[0].members[0].mode_factor, None);
    assert!(plain.scope.checked.iter().all(|c| !c.contains("hitches entered")));
    assert!(a.scope.checked.iter().any(|c| c.contains("sling hitches entered, rules EN")), "{:?}", a.scope.checked);
    assert!(a.assumptions.iter().any(|s| s.contains("Rules for sling mode factors: EN")), "{:?}", a.assumptions);
}

fn refused(text: &str, field: &str, needle: &str) {
    let errs = load_scenario(text).expect_err("must be refused");
    assert!(
        errs.0.iter().any(|e| e.field.as_deref() == Some(field) && e.message.contains(needle) && e.location.is_some()),
        "{field} / {needle}: {errs:?}"
    );
}

#[test]
fn bad_hitches_and_bends_are_located_errors() {
    let rod = r#"kind: Rod, area: "100 mm^2", modulus: "200 GPa", rating: Yield("235 MPa")"#;
    let table: Vec<(String, &str, &str)> = vec![
        (line(&format!("{rod}, hitch: Choker"), ""), "members[0].hitch", "a rod is no sling"),
        (line(&format!("{WIRE}, bent_over: \"100 mm\""), ""), "members[0].bent_over", "give `diameter`"),
        (line(&format!("{WIRE}, diameter: \"16 mm\", bent_over: \"10 mm\""), ""), "members[0].bent_over", "below 1"),
        (line(&format!("{rod}, diameter: \"16 mm\", bent_over: \"100 mm\""), ""), "members[0].bent_over", "wire rope"),
        (line(WIRE, "rules: ISO,"), "rules", "ISO"),
        (line(&format!("{WIRE}, hitch: Choker"), "rules: ASME,"), "members[0].choke_angle", "needs its `choke_angle`"),
        (
            line(&format!("{WIRE}, hitch: Choker, choke_angle: \"20 deg\""), "rules: ASME,"),
            "members[0].choke_angle",
            "below the ASME B30.9 table",
        ),
        (line(&format!("{WIRE}, hitch: Choker, choke_angle: \"90 deg\""), ""), "members[0].choke_angle", "rules: ASME"),
        (line(&format!("{WIRE}, choke_angle: \"90 deg\""), ""), "members[0].choke_angle", "needs a `hitch`"),
        (
            line(&format!("{WIRE}, hitch: Basket, basket_angle: \"60 deg\""), ""),
            "members[0].basket_angle",
            "outside the table",
        ),
    ];
    for (text, field, needle) in &table {
        refused(text, field, needle);
    }
}

// The guy of the rated-parts test (atan(3/10) = 16.7 deg from horizontal,
// its lower end hangs nothing) is no sling leg; given a hitch it is one and
// gets the below-30-deg warning (ASME B30.9 sling angle).
#[test]
fn a_hitched_member_is_a_sling_leg() {
    let guy = |hitch: &str| {
        format!(
            r#"Scenario(format: 1, title: "guy",
        nodes: [ Node(id: "A", at: ("1 m", "10 m"), support: Anchor), Node(id: "G", at: ("-10 m", "2 m"), support: Anchor),
                 Node(id: "T", at: ("0 m", "5 m")) ],
        members: [ Member(id: "main", ends: ("A", "T"), kind: WireRope, area: "100 mm^2", modulus: "100 GPa", rating: BreakingStrength("100 kN")),
                   Member(id: "guy", ends: ("G", "T"), kind: WireRope, area: "100 mm^2", modulus: "100 GPa", rating: BreakingStrength("100 kN"){hitch}) ],
        masses: [ Mass(id: "load", at: "T", mass: "500 kg") ],
        cases: [ Static(id: "s") ])"#
        )
    };
    let plain = analysed(&guy(""));
    assert!(!plain.cases[0].warnings.iter().any(|w| w.contains("sling angle")), "{:?}", plain.cases[0].warnings);
    let hitched = analysed(&guy(", hitch: Straight"));
    assert!(
        hitched.cases[0].warnings.iter().any(|w| w.contains("member guy: sling angle") && w.contains("below 30 deg")),
        "{:?}",
        hitched.cases[0].warnings
    );
}

// The report's member strength table gets a hitch column where a member has
// a hitch, with the factor and its source (EN 13414-1, from memory); the
// efficiency cell carries the D/d note (0.9 x 0.86 = 0.774).
#[test]
fn report_inputs_show_the_hitch_and_the_bend() {
    let text = line(&format!("{WIRE}, diameter: \"16 mm\", bent_over: \"160 mm\", hitch: Choker"), "");
    let l = load_scenario(&text).unwrap();
    let doc = tautspan_core::report::html(&l.scenario, &analyse(&l.scenario), "2025-03-14");
    assert!(doc.contains("Hitch (mode factor)"));
    assert!(doc.contains("EN 13414-1 / EN 1492-1 / EN 818-4 mode factor, choked (from memory)"));
    assert!(doc.contains("D/d 10"), "the bend's note is in the efficiency cell");
    assert!(doc.contains("0.774"));
    let plain = load_scenario(&line(WIRE, "")).unwrap();
    let doc = tautspan_core::report::html(&plain.scenario, &analyse(&plain.scenario), "2025-03-14");
    assert!(!doc.contains("Hitch (mode factor)"));
}
