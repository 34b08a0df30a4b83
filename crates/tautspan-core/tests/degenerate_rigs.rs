//! Degenerate rigs give reasons, not numbers: each is refused as a located
//! input error (the field, what is wrong, the ids or the value as typed) or
//! analysed to a verdict that is not `within` with a reason naming the node
//! or member. Where a degenerate rig has an answer (stiffnesses a million
//! times apart, a drop of 0 or 100 m), the number is checked against its
//! closed form.

#![allow(clippy::expect_used, clippy::unwrap_used, reason = "test helpers fail loudly on broken fixtures")]

use tautspan_core::analysis::{Analysis, Verdict, analyse};
use tautspan_core::model::{Case, load_scenario, to_network};
use tautspan_core::output::{check_json, check_text};
use tautspan_core::solve::{SolveOptions, StaticSolver, solve_static};
use uom::si::f64::Length;
use uom::si::length::meter;

const G: f64 = 9.80665;

const ROPE: &str = r#"kind: WireRope, area: "100 mm^2", modulus: "100 GPa", rating: BreakingStrength("100 kN")"#;
const ROD: &str = r#"kind: Rod, modulus: "200 GPa", rating: Yield("235 MPa"), section: SolidRound(diameter: "30 mm")"#;
const SLAB: &str = r#"Floor(id: "slab", span: ("4 m", "4 m"), thickness: "150 mm", modulus: "30 GPa", poisson: 0.2, edges: SimplySupported, rated_uniform: "2.4 kPa", rated_point: "8.9 kN")"#;

fn scenario(nodes: &str, members: &str, floors: &str, masses: &str, cases: &str) -> String {
    format!(
        r#"Scenario(format: 1, title: "degenerate",
        nodes: [{nodes}],
        members: [{members}],
        floors: [{floors}],
        masses: [{masses}],
        cases: [{cases}])"#
    )
}

/// Anchor A above joint M, a rope between, 100 kg at M, plus `extra`.
fn hung(extra_nodes: &str, extra_members: &str, masses: &str, cases: &str) -> String {
    scenario(
        &format!(
            r#"Node(id: "A", at: ("0 m", "5 m"), support: Anchor), Node(id: "M", at: ("0 m", "1 m")){extra_nodes}"#
        ),
        &format!(r#"Member(id: "r", ends: ("A", "M"), {ROPE}){extra_members}"#),
        "",
        masses,
        cases,
    )
}

const LOAD: &str = r#"Mass(id: "load", at: "M", mass: "100 kg")"#;
const STATIC: &str = r#"Static(id: "s")"#;

enum Expect {
    /// Exit 2: a located error at this field whose message holds every needle.
    Input(&'static str, &'static [&'static str]),
    /// Exit 1: analysed, not within, a reason holding every needle.
    Reason(&'static [&'static str]),
}

struct Row {
    name: &'static str,
    text: String,
    expect: Expect,
}

/// Every case error and warning text of an analysis.
fn reasons(a: &Analysis) -> Vec<String> {
    a.cases
        .iter()
        .flat_map(|c| c.error.iter().cloned().chain(c.warning_items.iter().map(|w| w.message.clone())))
        .chain(a.warnings.iter().map(|w| w.message.clone()))
        .collect()
}

fn rows() -> Vec<Row> {
    vec![
        Row {
            name: "zero-length member",
            text: hung(
                r#", Node(id: "B", at: ("0 m", "1 m"))"#,
                &format!(r#", Member(id: "z", ends: ("M", "B"), {ROPE})"#),
                LOAD,
                STATIC,
            ),
            expect: Expect::Input("members[1].ends", &["\"M\"", "\"B\"", "coincide", "zero-length"]),
        },
        Row {
            name: "coincident nodes",
            text: hung(r#", Node(id: "Q", at: ("0 m", "1 m"))"#, "", LOAD, STATIC),
            expect: Expect::Input("nodes[2].at", &["node \"Q\"", "same place as node \"M\""]),
        },
        Row {
            name: "mass on an unconnected joint",
            text: hung(
                r#", Node(id: "Q", at: ("2 m", "1 m"))"#,
                "",
                r#"Mass(id: "load", at: "Q", mass: "100 kg")"#,
                STATIC,
            ),
            expect: Expect::Reason(&["case s: node Q", "no load path"]),
        },
        Row {
            // a rod standing on a floor foot with the load exactly above it
            name: "mechanism: an inverted pendulum",
            text: scenario(
                r#"Node(id: "F", at: ("0 m", "0 m"), support: Floor("slab")), Node(id: "M", at: ("0 m", "2 m"))"#,
                &format!(r#"Member(id: "r", ends: ("F", "M"), {ROD})"#),
                SLAB,
                LOAD,
                STATIC,
            ),
            expect: Expect::Reason(&["balances unstably at node M", "mechanism"]),
        },
        Row {
            // a rod drawn level from its anchor swings down to hang
            name: "mechanism: a level rod on a pin",
            text: scenario(
                r#"Node(id: "A", at: ("0 m", "5 m"), support: Anchor), Node(id: "M", at: ("2 m", "5 m"))"#,
                &format!(r#"Member(id: "r", ends: ("A", "M"), {ROD})"#),
                "",
                LOAD,
                STATIC,
            ),
            expect: Expect::Reason(&["node M: ends 2.828 m from where it is drawn", "limit 0.2 m"]),
        },
        Row {
            // the mass stands on the floor; both lines drawn with slack
            name: "everything slack",
            text: scenario(
                r#"Node(id: "A", at: ("0 m", "5 m"), support: Anchor), Node(id: "B", at: ("1 m", "5 m"), support: Anchor), Node(id: "M", at: ("0.5 m", "1 m"), support: Floor("slab"))"#,
                &format!(
                    r#"Member(id: "r1", ends: ("A", "M"), {ROPE}, slack: "0.1 m"), Member(id: "r2", ends: ("B", "M"), {ROPE}, slack: "0.1 m")"#
                ),
                SLAB,
                LOAD,
                STATIC,
            ),
            expect: Expect::Reason(&["member r1: slack in case s, where it was meant to carry"]),
        },
        Row {
            name: "member between two anchors",
            text: hung(
                r#", Node(id: "B", at: ("2 m", "5 m"), support: Anchor)"#,
                &format!(r#", Member(id: "tie", ends: ("A", "B"), {ROPE})"#),
                LOAD,
                STATIC,
            ),
            expect: Expect::Reason(&[
                "member tie: slack in case s",
                "between anchors A and B",
                "none of the rig's load",
            ]),
        },
        Row {
            name: "floor with no feet",
            text: scenario(
                r#"Node(id: "A", at: ("0 m", "5 m"), support: Anchor), Node(id: "M", at: ("0 m", "1 m"))"#,
                &format!(r#"Member(id: "r", ends: ("A", "M"), {ROPE})"#),
                SLAB,
                LOAD,
                STATIC,
            ),
            expect: Expect::Input("floors[0].id", &["no node stands on floor \"slab\""]),
        },
        Row {
            name: "mass at an anchor",
            text: hung(
                "",
                "",
                r#"Mass(id: "load", at: "A", mass: "100 kg")"#,
                r#"Static(id: "s"), Drop(id: "drop", mass: "load", height: "1 m")"#,
            ),
            expect: Expect::Input("masses[0].at", &["mass \"load\" is at anchor \"A\""]),
        },
        Row {
            name: "pivot at the mass itself",
            text: hung("", "", LOAD, r#"Static(id: "s"), Swing(id: "w", mass: "load", release: "20 deg", pivot: "M")"#),
            expect: Expect::Input("cases[1].pivot", &["the pivot \"M\" is the node mass \"load\" hangs at"]),
        },
        Row {
            name: "denormal mass",
            text: hung("", "", r#"Mass(id: "load", at: "M", mass: "1e-310 kg")"#, STATIC),
            expect: Expect::Input("masses[0].mass", &["\"1e-310 kg\"", "plausible range for a mass, 1 g to 10000 t"]),
        },
        Row {
            name: "tiny area",
            text: scenario(
                r#"Node(id: "A", at: ("0 m", "5 m"), support: Anchor), Node(id: "M", at: ("0 m", "1 m"))"#,
                r#"Member(id: "r", ends: ("A", "M"), kind: WireRope, area: "1e-300 mm^2", modulus: "100 GPa", rating: BreakingStrength("100 kN"))"#,
                "",
                LOAD,
                STATIC,
            ),
            expect: Expect::Input("members[0].area", &["\"1e-300 mm^2\"", "plausible range for a member's area"]),
        },
        Row {
            name: "huge modulus",
            text: scenario(
                r#"Node(id: "A", at: ("0 m", "5 m"), support: Anchor), Node(id: "M", at: ("0 m", "1 m"))"#,
                r#"Member(id: "r", ends: ("A", "M"), kind: WireRope, area: "100 mm^2", modulus: "1e290 GPa", rating: BreakingStrength("100 kN"))"#,
                "",
                LOAD,
                STATIC,
            ),
            expect: Expect::Input("members[0].modulus", &["\"1e290 GPa\"", "plausible range for an elastic modulus"]),
        },
        Row {
            name: "drop of 1e299 m",
            text: hung("", "", LOAD, r#"Static(id: "s"), Drop(id: "d", mass: "load", height: "1e299 m")"#),
            expect: Expect::Input("cases[1].height", &["\"1e299 m\"", "plausible range for a drop height"]),
        },
    ]
}

#[test]
fn each_degenerate_rig_gives_a_located_error_or_a_reason() {
    for row in rows() {
        match (&row.expect, load_scenario(&row.text)) {
            (Expect::Input(field, needles), Err(e)) => {
                let first = &e.0[0];
                assert_eq!(first.field.as_deref(), Some(*field), "{}: {e}", row.name);
                assert!(first.location.is_some(), "{}: not located: {e}", row.name);
                for n in *needles {
                    assert!(first.message.contains(n), "{}: {n:?} not in {}", row.name, first.message);
                }
                // one message per problem: a refused value is not also "missing"
                assert_eq!(e.0.len(), 1, "{}: {e}", row.name);
                assert!(!first.message.contains("inf"), "{}: {}", row.name, first.message);
            }
            (Expect::Input(..), Ok(_)) => panic!("{}: accepted", row.name),
            (Expect::Reason(needles), Ok(l)) => {
                let a = analyse(&l.scenario);
                assert_ne!(a.verdict(), Verdict::Within, "{}", row.name);
                let all = reasons(&a);
                assert!(
                    all.iter().any(|r| needles.iter().all(|n| r.contains(n))),
                    "{}: no reason holds {needles:?}: {all:#?}",
                    row.name
                );
                // no number that is not one, in any output
                let text = check_text("x.ron", &a);
                assert!(!text.contains("inf") && !text.contains("NaN"), "{}: {text}", row.name);
            }
            (Expect::Reason(_), Err(e)) => panic!("{}: refused: {e}", row.name),
        }
    }
}

// A failed case is named once: "case d: …", never "case d: case d: …".
#[test]
fn a_failed_case_is_named_once() {
    let text = hung(
        r#", Node(id: "Q", at: ("2 m", "1 m"))"#,
        "",
        r#"Mass(id: "load", at: "Q", mass: "100 kg")"#,
        r#"Static(id: "s"), Drop(id: "d", mass: "load", height: "1 m")"#,
    );
    let a = analyse(&load_scenario(&text).unwrap().scenario);
    let c = &a.cases[1];
    assert!(
        c.error.as_deref().is_some_and(|e| e.starts_with("case d: node Q is loaded but has no load path")),
        "{:?}",
        c.error
    );
    assert_eq!(c.warnings, [c.error.clone().unwrap()]);
    for w in a.cases.iter().flat_map(|c| c.warnings.iter()).chain(a.warnings.iter().map(|w| &w.message)) {
        assert!(!w.contains("case d: case d:") && !w.contains("case s: case s:"), "{w}");
    }
}

// Stiffnesses 10⁶ apart in one rig: two lines of equal length from one
// anchor to one joint, EA 2e8 N and 200 N. Springs in parallel (Hooke's
// law, equal stretch): each carries W k_i / (k1 + k2); to 1e-9 of W (the
// solver's tolerance), the soft line's 1e-6 W share included.
#[test]
fn stiffnesses_a_million_apart_share_by_stiffness() {
    let stiff = r#"kind: Rod, area: "1000 mm^2", modulus: "200 GPa", rating: Yield("235 MPa")"#;
    let soft =
        r#"kind: FibreRope, area: "100 mm^2", modulus: "2 MPa", rating: BreakingStrength("10 kN"), may_go_slack: true"#;
    let text = scenario(
        r#"Node(id: "A", at: ("0 m", "5 m"), support: Anchor), Node(id: "M", at: ("0 m", "3 m"))"#,
        &format!(r#"Member(id: "stiff", ends: ("A", "M"), {stiff}), Member(id: "soft", ends: ("A", "M"), {soft})"#),
        "",
        LOAD,
        STATIC,
    );
    let a = analyse(&load_scenario(&text).unwrap().scenario);
    let c = &a.cases[0];
    assert!(c.converged && c.error.is_none(), "{:?}", c.error);
    let w = 100.0 * G;
    let (k1, k2): (f64, f64) = (1e-3 * 200e9 / 2.0, 1e-4 * 2e6 / 2.0);
    assert!((k1 / k2 - 1e6).abs() < 1e-6);
    for (m, k) in c.members.iter().zip([k1, k2]) {
        let expected = w * k / (k1 + k2);
        assert!((m.force_n - expected).abs() <= 1e-9 * w, "{}: {} vs {expected}", m.id, m.force_n);
    }
}

// Drop heights of 0 and 100 m onto one wire rope, 4 m, EA = 1e7 N:
// path stiffness k = EA / L = 2.5e6 N/m; the peak force by the standard
// energy balance W (h + δ) = ½ k δ² is F = W (1 + sqrt(1 + 2 h k / W)):
// 2 W at h = 0, 716.3 W at h = 100 m. The line's force in the case is that
// load (statics of one line) to 1e-9; finite, and over its allowable at 100 m.
#[test]
fn drops_of_zero_and_a_hundred_metres_match_the_energy_balance() {
    let text = hung(
        "",
        "",
        LOAD,
        r#"Static(id: "s"), Drop(id: "h0", mass: "load", height: "0 m"), Drop(id: "h100", mass: "load", height: "100 m")"#,
    );
    let a = analyse(&load_scenario(&text).unwrap().scenario);
    let w = 100.0 * G;
    let k = 1e-4 * 100e9 / 4.0;
    for (c, h) in a.cases[1..].iter().zip([0.0, 100.0]) {
        assert!(c.converged && c.error.is_none(), "{}: {:?}", c.id, c.error);
        let f = w * (1.0 + (1.0 + 2.0 * h * k / w).sqrt());
        let d = c.dynamic.as_ref().unwrap();
        assert!((d.load_n - f).abs() <= 1e-9 * f, "{}: load {} vs {f}", c.id, d.load_n);
        let force = c.members[0].force_n;
        assert!(force.is_finite() && (force - f).abs() <= 1e-9 * f, "{}: force {force} vs {f}", c.id);
    }
    assert!((a.cases[1].members[0].force_n / w - 2.0).abs() < 1e-9);
    assert_ne!(a.verdict(), Verdict::Within);
}

// A drop beyond what double precision holds, set past the model's range
// check: the case fails with a reason, never a number; no inf or NaN in
// the text or the JSON, and the verdict is not within.
#[test]
fn a_drop_that_overflows_fails_its_case_with_a_reason() {
    let text = hung(
        "",
        "",
        LOAD,
        r#"Static(id: "s"), Drop(id: "big", mass: "load", height: "1 m"), Drop(id: "huge", mass: "load", height: "1 m")"#,
    );
    let mut s = load_scenario(&text).unwrap().scenario;
    for (c, h) in s.cases.iter_mut().skip(1).zip([1e299, 1e303]) {
        if let Case::Drop { height, .. } = c {
            *height = Length::new::<meter>(h);
        }
    }
    let a = analyse(&s);
    assert_eq!(a.verdict(), Verdict::NotWithin);
    assert!(a.cases[0].converged && a.cases[0].error.is_none());
    for c in &a.cases[1..] {
        assert!(c.error.is_some() && !c.converged, "{}: {:?}", c.id, c.members.first().map(|m| m.force_n));
        assert!(c.members.is_empty(), "{}: forces reported", c.id);
    }
    let huge = a.cases[2].error.as_deref().unwrap();
    assert!(huge.starts_with("case huge: the load on mass load overflows"), "{huge}");
    // the scenario's own list names each failed case once
    assert!(a.warnings.iter().any(|w| w.message == huge), "{:?}", a.warnings);
    assert!(
        a.warnings
            .iter()
            .all(|w| !w.message.contains("case huge: case huge") && !w.message.contains("case big: case big"))
    );
    let text = check_text("x.ron", &a);
    assert!(!text.contains("inf") && !text.contains("NaN"), "{text}");
    let json = check_json("x.ron", &a).to_string();
    assert!(!json.contains("inf") && !json.contains("NaN"), "{json}");
}

// The solver never calls an answer converged with its out-of-balance force
// above the tolerance: under loads of 1e160 N (whose squares overflow) it
// returns an error, and every answer it gives is sound.
#[test]
fn the_solver_never_passes_an_unsound_answer() {
    let text = hung("", "", LOAD, STATIC);
    let s = load_scenario(&text).unwrap().scenario;
    let (net, loads) = to_network(&s);
    let mut solver = StaticSolver::new(&net).unwrap();
    let ok = solver.solve(&loads.total_n, None, &SolveOptions::default()).unwrap();
    assert!(ok.is_sound() && ok.residual_n <= ok.tolerance_n);
    for scale in [1e150, 1e160, 1e300] {
        let big: Vec<[f64; 3]> = loads.total_n.iter().map(|l| l.map(|c| c * scale)).collect();
        match solver.solve(&big, None, &SolveOptions::default()) {
            Ok(eq) => panic!("x{scale:e}: passed with residual {} (tolerance {})", eq.residual_n, eq.tolerance_n),
            Err(e) => assert!(!e.to_string().contains("inf") && !e.to_string().contains("NaN"), "x{scale:e}: {e}"),
        }
    }
    let mut net2 = net.clone();
    for n in &mut net2.nodes {
        n.load_n = n.load_n.map(|c| c * 1e160);
    }
    assert!(solve_static(&net2, &SolveOptions::default()).is_err());
}
