//! The warning kinds not pinned elsewhere, each triggered by a small rig and
//! checked for its kind, its subject and its words (numbers worked by hand
//! beside each): a foot lifting off, a floor over and near its allowable, a
//! member going slack over part of a swing, a case that could not be solved.

#![allow(clippy::expect_used, clippy::unwrap_used, reason = "test helpers fail loudly on broken fixtures")]

use tautspan_core::analysis::{Analysis, Warning, WarningKind, analyse};
use tautspan_core::model::load_scenario;

const G: f64 = 9.80665;

fn analysed(text: &str) -> Analysis {
    let l = load_scenario(text).unwrap_or_else(|e| panic!("{e}"));
    analyse(&l.scenario)
}

fn of_kind(a: &Analysis, case: &str, kind: WarningKind) -> Vec<Warning> {
    let c = a.cases.iter().find(|c| c.id == case).unwrap_or_else(|| panic!("case {case}"));
    c.warning_items.iter().filter(|w| w.kind == kind).cloned().collect()
}

/// A 4 m × 4 m simply supported slab rated 1 kPa uniform (16 kN over its
/// area) and 500 kN at a point, with a crate of `kg` on one foot at its
/// centre.
fn crate_on_slab(kg: f64) -> String {
    format!(
        r#"Scenario(format: 1, title: "slab",
        nodes: [ Node(id: "a", at: ("2 m", "0 m", "2 m"), support: Floor("slab")) ],
        floors: [ Floor(id: "slab", span: ("4 m", "4 m"), origin: ("0 m", "0 m"), thickness: "150 mm",
                        modulus: "30 GPa", poisson: 0.2, edges: SimplySupported, rated_uniform: "1 kPa",
                        rated_point: "500 kN") ],
        masses: [ Mass(id: "crate", at: "a", mass: "{kg} kg") ],
        cases: [ Static(id: "s") ])"#
    )
}

/// 2000 kg on the slab: 19.61 kN against 1 kPa × 16 m² = 16 kN, so the
/// panel is at 19.613 / 16 = 1.226 (hand arithmetic).
#[test]
fn floor_over_names_the_floor_the_totals_and_the_excess() {
    let a = analysed(&crate_on_slab(2000.0));
    let w = of_kind(&a, "s", WarningKind::FloorOver);
    assert_eq!(w.len(), 1, "{:?}", a.cases[0].warning_items);
    assert_eq!(w[0].subject.as_deref(), Some("slab"));
    let u = 2000.0 * G / 16e3;
    assert!((u - 1.2258).abs() < 1e-4);
    let m = &w[0].message;
    for part in ["floor slab: total normal force 19.61 kN", "against rated uniform x area 16 kN", "utilisation 1.23"] {
        assert!(m.contains(part), "{part:?} in {m}");
    }
    assert!(m.contains("over by 22.6"), "{m}");
}

/// 1468 kg: 14.396 kN of 16 kN is 90.0 %, above the default near-limit
/// threshold of 80 %.
#[test]
fn floor_near_names_the_share_and_the_threshold() {
    let a = analysed(&crate_on_slab(1468.0));
    let w = of_kind(&a, "s", WarningKind::FloorNear);
    assert_eq!(w.len(), 1, "{:?}", a.cases[0].warning_items);
    assert_eq!(w[0].subject.as_deref(), Some("slab"));
    assert!(of_kind(&a, "s", WarningKind::FloorOver).is_empty());
    let m = &w[0].message;
    assert!(m.starts_with("floor slab: at 90"), "{m}");
    assert!(m.contains("near-limit threshold 80"), "{m}");
}

/// Foot b hangs from a vertical steel rod to an anchor above it; a crate on
/// foot a sags the plate away from under b, and the rod holds b up: b lifts
/// off with no normal force while the floor itself still carries a.
#[test]
fn a_foot_lifting_off_is_named_with_its_floor_and_case() {
    let text = r#"Scenario(format: 1, title: "lift",
        nodes: [
            Node(id: "a", at: ("1.5 m", "0 m", "2 m"), support: Floor("slab")),
            Node(id: "b", at: ("2.8 m", "0 m", "2.4 m"), support: Floor("slab")),
            Node(id: "r", at: ("2.8 m", "1 m", "2.4 m"), support: Anchor),
        ],
        members: [ Member(id: "stay", ends: ("b", "r"), kind: Rod, area: "20 cm^2", material: "steel") ],
        floors: [ Floor(id: "slab", span: ("4 m", "4 m"), origin: ("0 m", "0 m"), thickness: "150 mm", modulus: "30 GPa",
                        poisson: 0.2, edges: SimplySupported, rated_point: "50 kN", rated_uniform: "5 kPa") ],
        masses: [ Mass(id: "crate", at: "a", mass: "2000 kg") ],
        cases: [ Static(id: "s") ])"#;
    let a = analysed(text);
    let f = &a.cases[0].floors[0];
    assert_eq!(f.feet[1].normal_force_n, 0.0);
    let w = of_kind(&a, "s", WarningKind::FootLifts);
    assert_eq!(w.len(), 1, "{:?}", a.cases[0].warning_items);
    // the foot is the subject (a click selects it; a group names the feet)
    assert_eq!(w[0].subject.as_deref(), Some("b"));
    assert_eq!(w[0].message, "floor slab: foot b lifts off in case s; normal force 0");
}

/// The bridle of `swing_arc.rs`: legs at 45° from the vertical either side
/// of the ring. By the ring's statics a leg's tension goes as sin(α ∓ θ),
/// so released from 60° each leg is slack from 45° to 60° on its side of
/// the arc and carries on the other: both are named, each once, with the
/// angles between 45° and 60°.
#[test]
fn a_leg_going_slack_over_the_swing_is_named_with_its_angles() {
    let stiff = r#"kind: WireRope, area: "1000 mm^2", modulus: "100000 GPa", rating: BreakingStrength("1000 kN")"#;
    let text = format!(
        r#"Scenario(format: 1, title: "bridle",
        nodes: [ Node(id: "A1", at: ("-1.5 m", "4 m", "0 m"), support: Anchor), Node(id: "A2", at: ("1.5 m", "4 m", "0 m"), support: Anchor),
                 Node(id: "R", at: ("0 m", "2.5 m", "0 m")), Node(id: "M", at: ("0 m", "0.5 m", "0 m")) ],
        members: [ Member(id: "leg-1", ends: ("A1", "R"), {stiff}),
                   Member(id: "leg-2", ends: ("A2", "R"), {stiff}),
                   Member(id: "line", ends: ("R", "M"), {stiff}) ],
        masses: [ Mass(id: "load", at: "M", mass: "500 kg") ],
        cases: [ Static(id: "s"), Swing(id: "w", mass: "load", release: "60 deg", pivot: "R") ])"#
    );
    let a = analysed(&text);
    let w = of_kind(&a, "w", WarningKind::SlackOverArc);
    let subjects: Vec<_> = w.iter().map(|x| x.subject.clone().unwrap_or_default()).collect();
    assert!(subjects.contains(&"leg-1".to_string()) && subjects.contains(&"leg-2".to_string()), "{w:?}");
    assert_eq!(w.len(), 2, "{w:?}");
    assert!(!subjects.contains(&"line".to_string()));
    for x in &w {
        let m = &x.message;
        let id = x.subject.as_deref().unwrap_or_default();
        assert!(m.starts_with(&format!("member {id}: goes slack over part of the swing in case w (at ")), "{m}");
        assert!(m.contains("where it was meant to carry") && m.contains("set may_go_slack"), "{m}");
        // the angles named: between 45 and 60 degrees in size
        let between = m.split("between ").nth(1).unwrap();
        let nums: Vec<f64> = between
            .split(|c: char| !(c.is_ascii_digit() || c == '.' || c == '-'))
            .filter_map(|t| t.parse().ok())
            .take(2)
            .collect();
        assert_eq!(nums.len(), 2, "{m}");
        for n in nums {
            assert!((45.0..=60.0 + 1e-9).contains(&n.abs()), "{n} in {m}");
        }
    }
}

/// A mass on a joint no member reaches: every case fails with the reason,
/// as a case_failed warning with no subject.
#[test]
fn a_case_not_solved_is_a_case_failed_warning_with_its_reason() {
    let text = r#"Scenario(format: 1, title: "loose",
        nodes: [ Node(id: "top", at: ("0 m", "3 m", "0 m"), support: Anchor), Node(id: "j", at: ("0 m", "2 m", "0 m")),
                 Node(id: "lone", at: ("2 m", "1 m", "0 m")) ],
        members: [ Member(id: "r", ends: ("top", "j"), kind: Rod, area: "2 cm^2", material: "steel") ],
        masses: [ Mass(id: "m", at: "j", mass: "100 kg"), Mass(id: "x", at: "lone", mass: "50 kg") ],
        cases: [ Static(id: "s") ])"#;
    let a = analysed(text);
    let w = of_kind(&a, "s", WarningKind::CaseFailed);
    assert_eq!(w.len(), 1, "{:?}", a.cases[0].warning_items);
    assert_eq!(w[0].subject, None);
    assert!(w[0].message.contains("node lone"), "{}", w[0].message);
    assert!(w[0].message.contains("no load path"), "{}", w[0].message);
    assert!(a.cases[0].error.is_some());
}
