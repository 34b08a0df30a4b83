//! The optional top-level `revision` of a scenario file: read into the
//! model, written back by the writer, absent when not given.

#![allow(clippy::expect_used, clippy::unwrap_used, reason = "tests fail loudly")]

use tautspan_core::file::write_scenario_text;
use tautspan_core::model::load_scenario;

const FILE: &str = r#"Scenario(
    format: 1,
    title: "Revision round trip",
    revision: "B",
    nodes: [
        Node(id: "A", at: ("0 m", "3 m"), support: Anchor),
        Node(id: "J", at: ("0 m", "1 m")),
    ],
    members: [ Member(id: "m", ends: ("A", "J"), kind: Rod, area: "100 mm^2", modulus: "200 GPa",
                      rating: BreakingStrength("50 kN")) ],
    masses: [ Mass(id: "w", at: "J", mass: "100 kg") ],
    cases: [ Static(id: "hanging") ],
)"#;

#[test]
fn revision_is_read_written_and_read_again() {
    let first = load_scenario(FILE).expect("valid");
    assert_eq!(first.scenario.revision.as_deref(), Some("B"));
    let written = write_scenario_text(&first.dto).expect("write");
    assert!(written.contains("revision: \"B\""), "{written}");
    let again = load_scenario(&written).expect("written file reads");
    assert_eq!(again.dto, first.dto);
    assert_eq!(again.scenario.revision.as_deref(), Some("B"));
}

#[test]
fn no_revision_stays_absent_and_is_not_written() {
    let text = FILE.replace("    revision: \"B\",\n", "");
    let l = load_scenario(&text).expect("valid");
    assert_eq!(l.scenario.revision, None);
    assert!(!write_scenario_text(&l.dto).expect("write").contains("revision"));
    // a blank revision is no revision
    let blank = FILE.replace("\"B\"", "\"  \"");
    assert_eq!(load_scenario(&blank).expect("valid").scenario.revision, None);
}

#[test]
fn a_revision_that_is_not_a_string_is_a_located_error() {
    let bad = FILE.replace("revision: \"B\"", "revision: 2");
    let e = load_scenario(&bad).expect_err("refused").to_string();
    assert!(e.contains("4:") && e.contains("revision"), "{e}");
}
