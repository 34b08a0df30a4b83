//! Anchors rated in a direction: the pull's component along the rated
//! direction against the rating, the component across it against the side
//! rating by the linear interaction, and `unchecked` where the inputs
//! cannot support the check. Hand statics of a symmetric bridle.

#![allow(clippy::expect_used, clippy::unwrap_used, reason = "test helpers fail loudly on broken fixtures")]

use tautspan_core::analysis::{Analysis, State, Verdict, analyse};
use tautspan_core::model::load_scenario;

/// Standard gravity, m/s² (ISO 80000-3): a rating in tonnes is that weight.
const G: f64 = 9.80665;

fn analysed(text: &str) -> Analysis {
    let l = load_scenario(text).unwrap_or_else(|e| panic!("{e}"));
    analyse(&l.scenario)
}

/// A two-leg bridle at 45 deg: anchors A (−2 m, 5 m) and B (2 m, 5 m), the
/// ring R (0, 3 m), 1000 kg at R; stiff weightless legs (EA 1e9 N, so the
/// angle moves by under 1e-5). `a` is extra fields for anchor A.
fn bridle(a: &str) -> String {
    format!(
        r#"Scenario(format: 1, title: "bridle",
        nodes: [ Node(id: "A", at: ("-2 m", "5 m"), support: Anchor{a}), Node(id: "B", at: ("2 m", "5 m"), support: Anchor),
                 Node(id: "R", at: ("0 m", "3 m")) ],
        members: [ Member(id: "west", ends: ("A", "R"), kind: WireRope, area: "1000 mm^2", modulus: "1000 GPa", rating: BreakingStrength("500 kN"), termination: PouredSocket, linear_mass: "0 kg/m"),
                   Member(id: "east", ends: ("B", "R"), kind: WireRope, area: "1000 mm^2", modulus: "1000 GPa", rating: BreakingStrength("500 kN"), termination: PouredSocket, linear_mass: "0 kg/m") ],
        masses: [ Mass(id: "load", at: "R", mass: "1000 kg") ],
        cases: [ Static(id: "s") ])"#
    )
}

fn anchor_a(a: &Analysis) -> tautspan_core::analysis::FittingResult {
    a.cases[0].supports.iter().find(|s| s.node == "A").unwrap().rated.clone().unwrap()
}

// Statics of the bridle: each leg pulls W / (2 sin 45°) along itself, so the
// pull on A has W/2 straight down and W/2 sideways. Tolerance 1e-4: the
// legs' stretch turns them by under 1e-5.
#[test]
fn side_pull_without_a_side_rating_is_unchecked() {
    let a = analysed(&bridle(r#", rated: "2 t", rated_direction: (0, -1, 0)"#));
    let r = anchor_a(&a);
    assert_eq!(r.state, State::Unchecked);
    assert!((r.angle_deg.unwrap() - 45.0).abs() < 1e-3, "{:?}", r.angle_deg);
    assert!(r.reason.as_deref().unwrap().contains("rated_across"), "{:?}", r.reason);
    // along: (W/2) / 2 t = 0.25, shown though unchecked
    assert!((r.utilisation - 0.25).abs() < 1e-4, "{}", r.utilisation);
    assert_eq!(a.verdict(), Verdict::Unchecked);
}

// Linear interaction: (W/2)/2 t + (W/2)/1 t = 0.25 + 0.5 = 0.75.
#[test]
fn side_rating_by_linear_interaction() {
    let a = analysed(&bridle(r#", rated: "2 t", rated_direction: (0, -1, 0), rated_across: "1 t""#));
    let r = anchor_a(&a);
    assert!((r.utilisation - 0.75).abs() < 1e-4, "{}", r.utilisation);
    assert_eq!(r.state, State::Ok);
    // a side rating of 0.4 t: 0.25 + 500/400 = 1.5, over
    let a = analysed(&bridle(r#", rated: "2 t", rated_direction: (0, -1, 0), rated_across: "400 kg""#));
    let r = anchor_a(&a);
    assert!((r.utilisation - 1.5).abs() < 1e-4, "{}", r.utilisation);
    assert_eq!(r.state, State::Over);
    assert_eq!(a.verdict(), Verdict::NotWithin);
}

// In line with the leg (its direction (1, −1, 0) normalised): the whole
// pull W / √2 against the rating; no side rating needed.
#[test]
fn in_line_pull_needs_no_side_rating() {
    let a = analysed(&bridle(r#", rated: "1 t", rated_direction: (1, -1, 0)"#));
    let r = anchor_a(&a);
    assert_eq!(r.state, State::Ok, "{:?}", r.reason);
    let expect = (1000.0 * G / 2.0_f64.sqrt()) / (1000.0 * G);
    assert!((r.utilisation - expect).abs() < 1e-4, "{} vs {expect}", r.utilisation);
}

#[test]
fn pulled_against_its_rated_sense_is_unchecked() {
    let a = analysed(&bridle(r#", rated: "2 t", rated_direction: (0, 1, 0), rated_across: "1 t""#));
    let r = anchor_a(&a);
    assert_eq!(r.state, State::Unchecked);
    assert!(r.reason.as_deref().unwrap().contains("against its rated direction"), "{:?}", r.reason);
}

#[test]
fn located_errors() {
    let err = |extra: &str| match load_scenario(&bridle(extra)) {
        Ok(_) => panic!("accepted: {extra}"),
        Err(e) => e.to_string(),
    };
    let e = err(r#", rated_direction: (0, -1, 0)"#);
    assert!(e.contains("nodes[0].rated_direction") && e.contains("give `rated`"), "{e}");
    let e = err(r#", rated: "1 t", rated_across: "1 t""#);
    assert!(e.contains("nodes[0].rated_across"), "{e}");
    let e = err(r#", rated: "1 t", rated_direction: (0, 0, 0)"#);
    assert!(e.contains("nodes[0].rated_direction") && e.contains("non-zero"), "{e}");
}

// The worst item over all cases is named, parts included: with a side
// rating of 0.4 t the anchor A (1.5 by the interaction above) is worse than
// any leg, and `check`'s JSON and text carry it.
#[test]
fn the_worst_part_is_named() {
    let a = analysed(&bridle(r#", rated: "2 t", rated_direction: (0, -1, 0), rated_across: "400 kg""#));
    let w = tautspan_core::analysis::worst(&a).unwrap();
    assert_eq!(w.id, "A/anchor");
    assert_eq!(w.host, "A");
    assert_eq!(w.kind, tautspan_core::analysis::ItemKind::Part);
    assert!(w.line().contains("rated part A/anchor in case s"), "{}", w.line());
    let j = tautspan_core::output::check_json("f.ron", &a);
    assert_eq!(j["worst"]["id"], "A/anchor");
    assert_eq!(j["worst"]["kind"], "part");
    assert!(tautspan_core::output::check_text("f.ron", &a).contains("worst: rated part A/anchor"));
}

// The rated-part warnings of the kinds `part_unchecked` and `part_near`,
// each once with its text: the side pull without a side rating above, and
// an anchor rated 750 kg in line with the west leg, whose pull W / √2 gives
// (1000 kg / √2) / 750 kg = 94.3 %, above the default near-limit
// threshold 80 % (statics of the bridle, tolerance 1e-4 as above).
#[test]
fn rated_part_warning_kinds() {
    use tautspan_core::analysis::WarningKind;
    let a = analysed(&bridle(r#", rated: "2 t", rated_direction: (0, -1, 0)"#));
    let w = a.cases[0].warning_items.iter().find(|w| w.kind == WarningKind::PartUnchecked).expect("unchecked part");
    assert!(
        w.message.starts_with("rated anchor A/anchor: UNCHECKED in case s: anchor A is pulled 45"),
        "{}",
        w.message
    );
    assert!(w.message.contains("give `rated_across`"), "{}", w.message);

    let a = analysed(&bridle(r#", rated: "750 kg", rated_direction: (1, -1, 0)"#));
    let w = a.cases[0].warning_items.iter().find(|w| w.kind == WarningKind::PartNear).expect("near part");
    let u = 1.0 / 2.0_f64.sqrt() / 0.75;
    assert!((anchor_a(&a).utilisation - u).abs() < 1e-4);
    assert!(w.message.starts_with("rated anchor A/anchor: at 94.3 % of its WLL"), "{}", w.message);
}

// Near the limit by the interaction, the warning says the interaction, not
// a share of one WLL: a side rating of 0.7 t gives 0.25 + 500/700 = 0.964,
// near (threshold 80 %); the bridle's statics as above, tolerance 1e-4.
#[test]
fn interaction_near_the_limit_is_said_as_such() {
    use tautspan_core::analysis::WarningKind;
    let a = analysed(&bridle(r#", rated: "2 t", rated_direction: (0, -1, 0), rated_across: "700 kg""#));
    let r = anchor_a(&a);
    assert!((r.utilisation - (0.25 + 500.0 / 700.0)).abs() < 1e-4, "{}", r.utilisation);
    assert_eq!(r.state, State::Near);
    let w = a.cases[0].warning_items.iter().find(|w| w.kind == WarningKind::PartNear).expect("near part");
    assert!(w.message.starts_with("rated anchor A/anchor: near its limit in case s: along "), "{}", w.message);
    assert!(w.message.contains("(linear interaction)"), "{}", w.message);
}
