//! Every class of broken scenario file gives a located error that names the
//! right line and field, never a panic; example files round-trip; random
//! bytes and mutated files never panic or hang the parser.

#![allow(clippy::expect_used, clippy::unwrap_used, reason = "test helpers fail loudly on broken fixtures")]

use proptest::prelude::*;
use tautspan_core::file::{parse_scenario_text, write_scenario_text};
use tautspan_core::model::load_scenario;

const GOOD: &str = r#"Scenario(
    format: 1,
    title: "test rig",
    nodes: [
        Node(id: "A1", at: ("0 m", "6 m"), support: Anchor),
        Node(id: "J1", at: ("0 m", "2 m")),
    ],
    members: [
        Member(id: "sling", ends: ("A1", "J1"), kind: WireRope,
               area: "64.7 mm^2", modulus: "100 GPa",
               rating: BreakingStrength("90.7 kN")),
    ],
    masses: [ Mass(id: "load", at: "J1", mass: "250 kg") ],
    cases: [ Static(id: "hanging"), Sudden(id: "sudden", mass: "load") ],
)
"#;

/// Replace `from` (which must occur) in the good file.
fn broken(from: &str, to: &str) -> String {
    assert!(GOOD.contains(from), "{from}");
    GOOD.replacen(from, to, 1)
}

#[test]
fn good_file_loads() {
    let l = load_scenario(GOOD).expect("good file");
    assert_eq!(l.scenario.members.len(), 1);
}

struct Case {
    name: &'static str,
    text: String,
    line: usize,
    field: Option<&'static str>,
    needle: &'static str,
}

#[test]
fn each_error_class_is_located() {
    let floor_ref = broken(
        r#"Node(id: "J1", at: ("0 m", "2 m")),"#,
        r#"Node(id: "J1", at: ("0 m", "2 m"), support: Floor("slab-9")),"#,
    );
    let cases = vec![
        Case {
            name: "malformed RON",
            text: broken(r#"title: "test rig","#, r#"title: "test rig"  nodes_oops"#),
            line: 3,
            field: None,
            needle: "",
        },
        Case {
            name: "unknown field",
            text: broken(r#"kind: WireRope,"#, r#"kind: WireRope, colour: "red","#),
            line: 9,
            field: Some("members[0].colour"),
            needle: "unknown field `colour`",
        },
        Case {
            name: "missing field",
            text: broken(r#"Mass(id: "load", at: "J1", mass: "250 kg")"#, r#"Mass(id: "load", at: "J1")"#),
            line: 13,
            field: None,
            needle: "missing field `mass`",
        },
        Case {
            name: "duplicate id",
            text: broken(r#"Node(id: "J1","#, r#"Node(id: "A1","#),
            line: 6,
            field: Some("nodes[1].id"),
            needle: "duplicate node id \"A1\"",
        },
        Case {
            name: "dangling member end",
            text: broken(r#"ends: ("A1", "J1")"#, r#"ends: ("A1", "J7")"#),
            line: 9,
            field: Some("members[0].ends.1"),
            needle: "node \"J7\", which does not exist",
        },
        Case {
            name: "dangling mass node",
            text: broken(r#"at: "J1", mass"#, r#"at: "Q", mass"#),
            line: 13,
            field: Some("masses[0].at"),
            needle: "node \"Q\"",
        },
        Case {
            name: "coincident ends",
            text: broken(r#"("0 m", "2 m")"#, r#"("0 m", "6000 mm")"#),
            line: 9,
            field: Some("members[0].ends"),
            needle: "coincide",
        },
        Case {
            name: "same node twice",
            text: broken(r#"ends: ("A1", "J1")"#, r#"ends: ("J1", "J1")"#),
            line: 9,
            field: Some("members[0].ends"),
            needle: "both ends",
        },
        Case {
            name: "floor not defined",
            text: floor_ref,
            line: 6,
            field: Some("nodes[1].support"),
            needle: "floor \"slab-9\" is not defined",
        },
        Case {
            name: "case names missing mass",
            text: broken(r#"Sudden(id: "sudden", mass: "load")"#, r#"Sudden(id: "sudden", mass: "crate")"#),
            line: 14,
            field: Some("cases[1].mass"),
            needle: "mass \"crate\", which does not exist",
        },
        Case {
            name: "unknown format",
            text: broken("format: 1,", "format: 7,"),
            line: 2,
            field: Some("format"),
            needle: "reads format 1",
        },
        Case {
            name: "bare number",
            text: broken(r#"mass: "250 kg""#, "mass: 250"),
            line: 13,
            field: Some("masses[0].mass"),
            needle: "bare number 250",
        },
        Case {
            name: "wrong dimension",
            text: broken(r#"area: "64.7 mm^2""#, r#"area: "12 kg""#),
            line: 10,
            field: Some("members[0].area"),
            needle: "is a mass, but an area belongs here",
        },
        Case {
            name: "unknown unit",
            text: broken(r#"modulus: "100 GPa""#, r#"modulus: "100 gigapascal""#),
            line: 10,
            field: Some("members[0].modulus"),
            needle: "unknown unit",
        },
        Case {
            name: "NaN",
            text: broken(r#"("0 m", "6 m")"#, r#"("NaN m", "6 m")"#),
            line: 5,
            field: Some("nodes[0].at.0"),
            needle: "not a finite number",
        },
        Case {
            name: "infinite",
            text: broken(r#"("0 m", "6 m")"#, r#"("0 m", "inf m")"#),
            line: 5,
            field: Some("nodes[0].at.1"),
            needle: "not a finite number",
        },
        Case {
            name: "negative mass",
            text: broken(r#""250 kg""#, r#""-250 kg""#),
            line: 13,
            field: Some("masses[0].mass"),
            needle: "greater than zero",
        },
        Case {
            name: "unknown kind",
            text: broken("kind: WireRope", "kind: Bungee"),
            line: 9,
            field: Some("members[0].kind"),
            needle: "Bungee",
        },
        Case {
            name: "no cases",
            text: broken(r#"cases: [ Static(id: "hanging"), Sudden(id: "sudden", mass: "load") ],"#, "cases: [],"),
            line: 14,
            field: Some("cases"),
            needle: "no load cases",
        },
        Case {
            name: "missing rating",
            text: broken(r#"rating: BreakingStrength("90.7 kN")"#, r#"slack: "0 m""#),
            line: 9,
            field: Some("members[0].rating"),
            needle: "missing",
        },
    ];
    for c in cases {
        let err = match load_scenario(&c.text) {
            Ok(_) => panic!("{}: accepted a broken file", c.name),
            Err(e) => e,
        };
        let first = &err.0[0];
        let at = first.location.unwrap_or_else(|| panic!("{}: no location in {first}", c.name));
        assert_eq!(at.line, c.line, "{}: {first}", c.name);
        if let Some(f) = c.field {
            assert_eq!(first.field.as_deref(), Some(f), "{}: {first}", c.name);
        }
        assert!(first.message.contains(c.needle), "{}: {first}", c.name);
        // the printed form carries line:column and the field
        let shown = err.in_file("x.ron").to_string();
        assert!(shown.starts_with(&format!("x.ron:{}:{}:", at.line, at.column)), "{}: {shown}", c.name);
    }
}

#[test]
fn oversize_file_names_the_cap() {
    let mut big = GOOD.to_string();
    big.push_str(&format!("// {}\n", "x".repeat(17 * 1024 * 1024)));
    let e = load_scenario(&big).expect_err("too big").to_string();
    assert!(e.contains("the cap is 16 MiB"), "{e}");
}

#[test]
fn example_files_round_trip() {
    let dir = concat!(env!("CARGO_MANIFEST_DIR"), "/../../scenarios");
    let mut n = 0;
    for entry in std::fs::read_dir(dir).expect("scenarios/") {
        let path = entry.expect("entry").path();
        if path.extension().and_then(|e| e.to_str()) != Some("ron") {
            continue;
        }
        let text = std::fs::read_to_string(&path).expect("read");
        let first = load_scenario(&text).unwrap_or_else(|e| panic!("{}: {e}", path.display()));
        let written = write_scenario_text(&first.dto).expect("write");
        let second = load_scenario(&written).unwrap_or_else(|e| panic!("{} rewritten: {e}\n{written}", path.display()));
        assert_eq!(first.dto, second.dto, "{}", path.display());
        assert_eq!(first.scenario, second.scenario, "{}", path.display());
        n += 1;
    }
    assert!(n >= 3, "expected at least three example scenarios, found {n}");
}

proptest! {
    #![proptest_config(ProptestConfig { cases: 200, .. ProptestConfig::default() })]

    #[test]
    fn random_bytes_never_panic(bytes in proptest::collection::vec(any::<u8>(), 0..2000)) {
        let text = String::from_utf8_lossy(&bytes);
        let _ = load_scenario(&text);
        let _ = parse_scenario_text(&text);
    }

    #[test]
    fn mutated_files_never_panic(pos in 0usize..GOOD.len(), len in 0usize..12, insert in "[ -~]{0,12}") {
        let mut s = GOOD.to_string();
        let start = (0..=pos).rev().find(|&i| s.is_char_boundary(i)).unwrap_or(0);
        let end = (start + len).min(s.len());
        let end = (end..=s.len()).find(|&i| s.is_char_boundary(i)).unwrap_or(s.len());
        s.replace_range(start..end, &insert);
        if let Ok(l) = load_scenario(&s) {
            // whatever is accepted also analyses without a panic
            let _ = tautspan_core::analysis::analyse(&l.scenario);
        }
    }

    #[test]
    fn deep_nesting_never_overflows(depth in 1usize..5000) {
        let text = format!("Scenario(format: 1, title: {}{})", "(".repeat(depth), ")".repeat(depth));
        let _ = load_scenario(&text);
    }
}
