//! Warnings grouped one per kind and case, with the count and every
//! subject; a warning that holds for every member of a kind said once in
//! the assumptions; the own-weight warning's wording said once.

#![allow(clippy::expect_used, clippy::unwrap_used, reason = "test helpers fail loudly on broken fixtures")]

use tautspan_core::analysis::{SUBJECTS_IN_TEXT, WarningKind, analyse};
use tautspan_core::model::load_scenario;
use tautspan_core::output::check_json;

#[path = "common/grid_net.rs"]
mod common;
use common::grid_net;

/// On a 9 × 9 net whose ropes are rated far below their pretension, every
/// member that carries force is over its allowable: one warning of that
/// kind for the case, its count, every id in `subjects`, the first five
/// named in the text "and N more", and the first member's own specific
/// text (force, allowable, by how much).
#[test]
fn repeated_warnings_are_one_group_per_kind_and_case() {
    let text = grid_net(9, "2 kg").replace("BreakingStrength(\"200 kN\")", "BreakingStrength(\"20 kN\")");
    let a = analyse(&load_scenario(&text).unwrap().scenario);
    let c = &a.cases[0];
    let over: Vec<&str> =
        c.warning_items.iter().filter(|w| w.kind == WarningKind::MemberOver).map(|w| w.message.as_str()).collect();
    assert!(over.len() > SUBJECTS_IN_TEXT, "{}", over.len());
    let groups = c.warning_groups();
    let g = groups.iter().find(|g| g.kind == WarningKind::MemberOver).unwrap();
    assert_eq!(groups.iter().filter(|g| g.kind == WarningKind::MemberOver).count(), 1);
    assert_eq!(g.count, over.len());
    assert_eq!(g.subjects.len(), over.len());
    let head = g.subjects[..SUBJECTS_IN_TEXT].join(", ");
    let expected = format!(
        "{} members over their allowable in case hanging: {head} and {} more; the first: {}",
        over.len(),
        over.len() - SUBJECTS_IN_TEXT,
        over[0]
    );
    assert_eq!(g.message, expected);
    // 20 kN x 0.80 (termination not stated) / 5 (wire rope) = 3.2 kN
    assert!(over[0].contains("is over its allowable 3.2 kN by"), "{}", over[0]);
    // the case's `warnings` are the groups' texts, one per kind
    assert_eq!(c.warnings.len(), groups.len());
    // JSON: every id in the group, the text as in `warnings`
    let j = check_json("net.ron", &a);
    let jg = j["cases"][0]["warning_groups"].as_array().unwrap();
    let jover = jg.iter().find(|x| x["kind"] == "member_over").unwrap();
    assert_eq!(jover["count"].as_u64(), Some(over.len() as u64));
    assert_eq!(jover["subjects"].as_array().unwrap().len(), over.len());
    assert_eq!(jover["message"].as_str(), Some(expected.as_str()));
}

/// A kind that occurs once keeps its own text unchanged.
#[test]
fn a_single_warning_keeps_its_own_text() {
    let text = r#"Scenario(format: 1, title: "one",
        nodes: [Node(id: "A", at: ("0 m", "3 m"), support: Anchor), Node(id: "J", at: ("0 m", "1 m"))],
        members: [Member(id: "line", ends: ("A", "J"), kind: WireRope, area: "10 mm^2", modulus: "100 GPa", rating: BreakingStrength("10 kN"), linear_mass: "0.1 kg/m")],
        masses: [Mass(id: "load", at: "J", mass: "500 kg")],
        cases: [Static(id: "s")])"#;
    let a = analyse(&load_scenario(text).unwrap().scenario);
    let g = a.cases[0].warning_groups();
    assert_eq!(g.len(), 1);
    assert_eq!(g[0].kind, WarningKind::MemberOver);
    assert_eq!(g[0].count, 1);
    assert_eq!(g[0].subjects, ["line"]);
    assert_eq!(g[0].message, a.cases[0].warning_items[0].message);
    // 10 kN x 0.80 (termination not stated) / 5 (wire rope) = 1.6 kN
    assert!(
        g[0].message.starts_with("member line: ") && g[0].message.contains("is over its allowable 1.6 kN by"),
        "{}",
        g[0].message
    );
}

/// Own weight not known for every member of a kind: one line in the
/// assumptions, no warning on each member; the wording says it once.
#[test]
fn own_weight_unknown_for_a_whole_kind_is_an_assumption() {
    let a = analyse(&load_scenario(&grid_net(9, "2 kg")).unwrap().scenario);
    assert!(a.warnings.iter().all(|w| w.kind != WarningKind::OwnWeightUnknown));
    let line = "Own weight of the 144 members (wire rope) not known and left out: no construction, material or `linear_mass` given; give `linear_mass` to include it.";
    assert!(a.assumptions.iter().any(|x| x == line), "{:?}", a.assumptions);
    let j = check_json("net.ron", &a).to_string();
    assert!(!j.contains("not known: own weight"), "the note is not said twice");
}

/// Own weight not known for some members of a kind only: one grouped
/// warning naming them.
#[test]
fn own_weight_unknown_for_some_members_is_one_grouped_warning() {
    let rope = r#"kind: WireRope, area: "10 mm^2", modulus: "100 GPa", rating: BreakingStrength("50 kN")"#;
    let text = format!(
        r#"Scenario(format: 1, title: "some",
        nodes: [Node(id: "A", at: ("0 m", "3 m"), support: Anchor), Node(id: "B", at: ("1 m", "3 m"), support: Anchor),
                Node(id: "C", at: ("2 m", "3 m"), support: Anchor), Node(id: "J", at: ("1 m", "1 m"))],
        members: [Member(id: "a", ends: ("A", "J"), {rope}), Member(id: "b", ends: ("B", "J"), {rope}),
                  Member(id: "c", ends: ("C", "J"), {rope}, linear_mass: "0.1 kg/m")],
        masses: [Mass(id: "load", at: "J", mass: "100 kg")],
        cases: [Static(id: "s")])"#
    );
    let a = analyse(&load_scenario(&text).unwrap().scenario);
    let g = a.warning_groups();
    let own: Vec<_> = g.iter().filter(|g| g.kind == WarningKind::OwnWeightUnknown).collect();
    assert_eq!(own.len(), 1);
    assert_eq!(own[0].subjects, ["a", "b"]);
    assert_eq!(
        own[0].message,
        "2 members whose own weight is not known and left out (give `linear_mass`): a, b; the first: member a: own weight not known and left out (give `linear_mass`)"
    );
}
