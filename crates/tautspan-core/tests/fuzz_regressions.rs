//! Findings of the fuzzer (`tests/fuzz_scenarios.rs`) that belong to the
//! validation's range checks and the solver, minimized by hand to one rig
//! of an anchor, a rope, a strut and a mass with one value changed; the
//! inputs are in `tests/fuzz_regressions/`. Each must pass as it is: the
//! file is refused with a located error (the plausible ranges of
//! coordinates and section dimensions, the nesting cap), or every output is
//! free of `NaN` and `inf`.

#![allow(clippy::expect_used, clippy::unwrap_used, reason = "tests fail loudly")]

use tautspan_core::analysis::analyse;
use tautspan_core::model::load_scenario;
use tautspan_core::output::check_text;
use tautspan_core::report::{UnitSystem, html_with_units};

fn input(name: &str) -> String {
    let p = std::path::Path::new(env!("CARGO_MANIFEST_DIR")).join("tests/fuzz_regressions").join(name);
    std::fs::read_to_string(p).expect("regression input")
}

/// Refused with a located error, or analysed with no non-finite word in
/// the text output or the report in either system.
fn refused_or_finite(name: &str) {
    let text = input(name);
    let Ok(loaded) = load_scenario(&text) else { return };
    let a = analyse(&loaded.scenario);
    let mut outs = vec![("text", check_text(name, &a))];
    for u in [UnitSystem::Si, UnitSystem::UsCustomary] {
        outs.push(("report", html_with_units(&loaded.scenario, &a, "2026-01-01", u)));
    }
    for (what, out) in outs {
        let bad = out
            .split(|c: char| !(c.is_ascii_alphanumeric() || c == '.'))
            .find(|w| matches!(*w, "NaN" | "inf" | "Minf" | "Linf"));
        assert!(bad.is_none(), "{name}: `{}` in the {what}", bad.unwrap_or(""));
    }
}

/// An anchor at y = 1e38 m is accepted; the warning says "strain inf %".
#[test]
fn anchor_at_1e38_m() {
    refused_or_finite("coord1e38.ron");
}

/// An anchor at y = 1.8e308 m is accepted; the report's drawing gets
/// `inf` and `NaN` coordinates.
#[test]
fn anchor_at_1e308_m() {
    refused_or_finite("coord1e308.ron");
}

/// A strut's foot at x = −1e300 m: the buckling explanation says K L = inf m.
#[test]
fn strut_foot_at_minus_1e300_m() {
    refused_or_finite("strut1e300.ron");
}

/// An aluminium tube's wall of 1e-300 mm: area 0, the buckling
/// explanation prints NaN (E, N_cr, λ).
#[test]
fn tube_wall_1e_minus_300_mm() {
    refused_or_finite("wall1e-300.ron");
}

/// An aluminium tube's outer diameter of 1.8e308 mm: A = NaN in the report.
#[test]
fn tube_outer_1e308_mm() {
    refused_or_finite("outer1e308.ron");
}

/// A quantity nested 7000 brackets deep (the fuzzer's slow finding: a
/// 1.6 MB file of nested brackets took 4.8 s, the location index storing a
/// path for every token past depth 256). Wanted: refused at a stated depth
/// cap with a located error that says so.
#[test]
fn deep_nesting_is_refused_at_the_cap() {
    let depth = 7000;
    let deep = format!("{}\"100 kg\"{}", "[".repeat(depth), "]".repeat(depth));
    let text = input("strut1e300.ron").replace("\"-1e300 m\"", "\"2 m\"").replace("\"100 kg\"", &deep);
    let e = load_scenario(&text).expect_err("refused").to_string();
    assert!(e.to_lowercase().contains("nest") || e.to_lowercase().contains("depth"), "{e}");
    assert!(e.contains(':'), "located: {e}");
}

/// The unchanged rig passes: the check above is not blind to good files.
#[test]
fn the_rig_unchanged_is_finite() {
    let base = input("strut1e300.ron").replace("\"-1e300 m\"", "\"2 m\"");
    let loaded = load_scenario(&base).expect("the base rig is valid");
    let a = analyse(&loaded.scenario);
    assert!(a.cases.iter().all(|c| c.error.is_none()));
    let txt = check_text("base.ron", &a);
    assert!(!txt.split_whitespace().any(|w| w == "inf" || w == "NaN"), "{txt}");
}

/// A floor's friction limit of 2.2e-308 (found by the big run on
/// 2026-12-05): the feet's check printed "over by inf %". Refused now: a
/// friction coefficient below 0.01 is no grip to rely on.
#[test]
fn friction_limit_of_2e_minus_308() {
    refused_or_finite("friction2e-308.ron");
    let e = load_scenario(&input("friction2e-308.ron")).expect_err("refused").to_string();
    assert!(e.contains("friction_limit") && e.contains("between 0.01 and 2"), "{e}");
}

/// A foot node repeated hundreds of times at the same place (the big run of
/// 2026-12-05 found 835 copies: 20,101 problems, 2.5 s in release, since
/// every pair of copies was reported). Wanted: each copy reported once, as
/// a duplicate id and as at the same place as the first, so the problems
/// grow with the copies, not with their pairs.
#[test]
fn a_node_repeated_many_times_is_reported_once_per_copy() {
    let copies = 1500;
    let base = input("strut1e300.ron").replace("\"-1e300 m\"", "\"2 m\"");
    let line = "        Node(id: \"J\", at: (\"1 m\", \"1 m\")),\n";
    let text = base.replacen(line, &line.repeat(copies + 1), 1);
    assert_ne!(text, base, "the rig has the node line to repeat");
    let errors = load_scenario(&text).expect_err("refused").0;
    let same_place = errors.iter().filter(|e| e.to_string().contains("same place as node \"J\" (nodes[2])")).count();
    let duplicate = errors.iter().filter(|e| e.to_string().contains("duplicate node id \"J\"")).count();
    assert_eq!(same_place, copies, "one per copy, against the first");
    assert_eq!(duplicate, copies);
    assert!(errors.len() <= 2 * copies + 4, "{} problems", errors.len());
}

/// A plain eye bolt pulled 27° off its axis (the big run of 2026-12-05):
/// rated for in-line pull only (ASME B30.26), so it has no allowable there.
/// The comparison said "over" with a dash, but the verdict's worst line
/// said "inf % of its allowable". Wanted: every output finite, and the
/// worst line says it is over where it has no rating.
#[test]
fn plain_eye_bolt_pulled_at_an_angle() {
    refused_or_finite("plain-eye-bolt-at-angle.ron");
    let loaded = load_scenario(&input("plain-eye-bolt-at-angle.ron")).expect("valid");
    let a = analyse(&loaded.scenario);
    let text = check_text("f.ron", &a);
    assert!(
        text.contains("worst: rated part hoist/eye bolt in case hanging, over: loaded where it has no rating"),
        "{text}"
    );
}
