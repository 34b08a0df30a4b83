//! One continuous rope over sheaves against closed forms of statics: the
//! running block between unequal anchors, the snatch block's anchor load,
//! the reeved block with and without bearing friction (Wire Rope Users
//! Manual lead-line factors), and the located errors of a badly routed rope.

#![allow(clippy::expect_used, clippy::unwrap_used, reason = "test helpers fail loudly on broken fixtures")]

use tautspan_core::analysis::{Analysis, analyse};
use tautspan_core::model::load_scenario;
use tautspan_core::output::check_json;

/// Standard gravity, m/s² (CGPM 1901, ISO 80000-3).
const G: f64 = 9.80665;

fn rel(a: f64, b: f64) -> f64 {
    ((a - b) / b).abs()
}

fn analysed(text: &str) -> Analysis {
    let l = load_scenario(text).unwrap_or_else(|e| panic!("{e}"));
    analyse(&l.scenario)
}

fn norm(v: [f64; 3]) -> f64 {
    (v[0] * v[0] + v[1] * v[1] + v[2] * v[2]).sqrt()
}

/// A mass on a free running block K between anchors A (0, 5 m) and B
/// (4 m, 6 m) at unequal heights, one rope A → K → B of unstretched
/// length 6 m.
fn running_block(bearing: &str, ea_note: &str) -> String {
    format!(
        r#"Scenario(format: 1, title: "running block",
        nodes: [ Node(id: "A", at: ("0 m", "5 m"), support: Anchor),
                 Node(id: "B", at: ("4 m", "6 m"), support: Anchor),
                 Node(id: "K", at: ("1.8 m", "3.3 m"), sheave: Sheave(diameter: "300 mm"{bearing})) ],
        ropes: [ Rope(id: "fall", path: ["A", "K", "B"], kind: WireRope, diameter: "12 mm", area: "100 mm^2",
                      modulus: "{ea_note}", rating: BreakingStrength("100 kN"), termination: PouredSocket,
                      linear_mass: "0 kg/m", length: "6 m") ],
        masses: [ Mass(id: "load", at: "K", mass: "500 kg") ],
        cases: [ Static(id: "hanging") ])"#
    )
}

// Statics of a frictionless pulley on a rope (equal tension on both sides):
// the two spans make equal angles φ with the vertical, sin φ = span / L
// with L the rope's stretched length, and T = W / (2 cos φ). The stretch
// L = L0 (1 + T / EA) is closed by fixed-point iteration here; tolerance
// 1e-8: the solver balances to 1e-9 of the load.
#[test]
fn running_block_between_unequal_anchors() {
    let ea = 100e-6 * 200e9; // 100 mm^2 x 200 GPa
    let w = 500.0 * G;
    let (span, l0) = (4.0_f64, 6.0_f64);
    let mut t = w;
    for _ in 0..100 {
        let l = l0 * (1.0 + t / ea);
        let phi = (span / l).asin();
        t = w / (2.0 * phi.cos());
    }
    let a = analysed(&running_block("", "200 GPa"));
    let c = &a.cases[0];
    let rope = c.members.iter().find(|m| m.id == "fall").unwrap();
    assert!(rel(rope.force_n, t) < 1e-8, "{} vs {t}", rope.force_n);
    assert_eq!(rope.segments.len(), 2);
    for g in &rope.segments {
        assert!(rel(g.force_n, t) < 1e-8, "span {}-{}: {}", g.from, g.to, g.force_n);
    }
    // equal angles: the horizontal parts of the spans are in the ratio of
    // their lengths' horizontal projections, i.e. sin φ is the same
    let k = c.nodes.iter().find(|n| n.id == "K").unwrap().position_m;
    let sin_a = (k[0] - 0.0) / rope.segments[0].length_m;
    let sin_b = (4.0 - k[0]) / rope.segments[1].length_m;
    assert!((sin_a - sin_b).abs() < 1e-8, "{sin_a} {sin_b}");
    // Hooke over the whole rope: stretch = T L0 / EA
    assert!(rel(rope.stretch_m, t * l0 / ea) < 1e-6, "{}", rope.stretch_m);
    // each anchor holds the span's tension
    for s in &c.supports {
        assert!(rel(norm(s.reaction_n), t) < 1e-8, "{}: {:?}", s.node, s.reaction_n);
    }
    // JSON: the rope is in members[] with its segments
    let j = check_json("f.ron", &a);
    let m = j["cases"][0]["members"].as_array().unwrap().iter().find(|m| m["id"] == "fall").unwrap();
    assert_eq!(m["segments"].as_array().unwrap().len(), 2);
    assert_eq!(m["segments"][0]["from"], "A");
    assert_eq!(m["segments"][1]["to"], "B");
}

/// A load L hung under an anchored snatch block S at (0, 5 m), its rope
/// led off to a winch W at (4 m, 0): path L → S → W.
fn snatch(bearing: &str) -> String {
    format!(
        r#"Scenario(format: 1, title: "snatch block",
        nodes: [ Node(id: "S", at: ("0 m", "5 m"), support: Anchor, sheave: Sheave(diameter: "400 mm"{bearing})),
                 Node(id: "W", at: ("4 m", "0 m"), support: Anchor),
                 Node(id: "L", at: ("0 m", "2 m")) ],
        ropes: [ Rope(id: "line", path: ["L", "S", "W"], kind: WireRope, diameter: "12 mm", area: "100 mm^2",
                      modulus: "200 GPa", rating: BreakingStrength("100 kN"), termination: PouredSocket, linear_mass: "0 kg/m") ],
        masses: [ Mass(id: "load", at: "L", mass: "300 kg") ],
        cases: [ Static(id: "hanging") ])"#
    )
}

// A snatch block's anchor load is 2 T cos(θ/2), θ the angle between the two
// spans (statics of the block; any rigging handbook). Here the load hangs
// plumb under S, so T = W exactly and cos θ = 5 / √41.
#[test]
fn snatch_block_anchor_load() {
    let w = 300.0 * G;
    let a = analysed(&snatch(""));
    let c = &a.cases[0];
    let rope = c.members.iter().find(|m| m.id == "line").unwrap();
    assert!(rel(rope.force_n, w) < 1e-9, "{}", rope.force_n);
    let theta = (5.0 / 41.0_f64.sqrt()).acos();
    let s = c.supports.iter().find(|s| s.node == "S").unwrap();
    assert!(rel(norm(s.reaction_n), 2.0 * w * (theta / 2.0).cos()) < 1e-9, "{:?}", s.reaction_n);
    // the winch holds the lead line's tension
    let wn = c.supports.iter().find(|s| s.node == "W").unwrap();
    assert!(rel(norm(wn.reaction_n), w) < 1e-9);

    // with a bronze-bushed sheave, hoisting: the lead pulls K = 1.09 times the
    // load's span (Wire Rope Users Manual), and the anchor carries the vector
    // sum W (0, −1) + 1.09 W (4, −5)/√41 (by hand)
    let a = analysed(&snatch(", bearing: Bronze"));
    let c = &a.cases[0];
    let rope = c.members.iter().find(|m| m.id == "line").unwrap();
    assert!(rel(rope.segments[0].force_n, w) < 1e-9, "{}", rope.segments[0].force_n);
    assert!(rel(rope.segments[1].force_n, 1.09 * w) < 1e-9, "{}", rope.segments[1].force_n);
    assert!(rel(rope.force_n, 1.09 * w) < 1e-9, "the rope is checked on its largest span");
    let r41 = 41.0_f64.sqrt();
    let expect = norm([1.09 * w * 4.0 / r41, w + 1.09 * w * 5.0 / r41, 0.0]);
    let s = c.supports.iter().find(|s| s.node == "S").unwrap();
    assert!(rel(norm(s.reaction_n), expect) < 1e-9, "{:?} vs {expect}", s.reaction_n);
}

/// A reeved pair of blocks: the head H (anchor, sheaves) at (0, 10 m), the
/// lower block B (free, sheaves) at (0, 5 m) carrying the load, 4 parts of
/// line from a dead end at H, the lead off H's last sheave to a winch at
/// (3 m, 0).
fn reeved(bearing: &str, motion: &str) -> String {
    format!(
        r#"Scenario(format: 1, title: "reeved blocks",
        nodes: [ Node(id: "H", at: ("0 m", "10 m"), support: Anchor, sheave: Sheave(diameter: "400 mm"{bearing})),
                 Node(id: "B", at: ("0 m", "5 m"), sheave: Sheave(diameter: "400 mm"{bearing})),
                 Node(id: "W", at: ("3 m", "0 m"), support: Anchor) ],
        ropes: [ Rope(id: "fall", path: ["H", "B", "H", "B", "H", "W"], kind: WireRope, diameter: "16 mm", area: "120 mm^2",
                      modulus: "100 GPa", rating: BreakingStrength("160 kN"), termination: PouredSocket, linear_mass: "0 kg/m"{motion}) ],
        masses: [ Mass(id: "load", at: "B", mass: "2000 kg") ],
        cases: [ Static(id: "hanging") ])"#
    )
}

// n parts of line: T = W / n without friction; with bearing factor K per
// sheave, hoisting, the falls carry W K^(i−1) (K − 1)/(Kⁿ − 1) and the lead
// line W Kⁿ (K − 1)/(Kⁿ − 1): 0.309 W for 4 parts on plain bearings (Wire
// Rope Technical Board, Wire Rope Users Manual, 4th ed., lead-line factor
// table). Tolerance 1e-8: solver balance.
#[test]
fn reeved_block_four_parts() {
    let w = 2000.0 * G;
    let a = analysed(&reeved("", ""));
    let rope = a.cases[0].members.iter().find(|m| m.id == "fall").unwrap();
    assert_eq!(rope.segments.len(), 5);
    for g in &rope.segments {
        assert!(rel(g.force_n, w / 4.0) < 1e-8, "{}-{} {}", g.from, g.to, g.force_n);
    }

    let k: f64 = 1.09;
    let a = analysed(&reeved(", bearing: Bronze", ""));
    let rope = a.cases[0].members.iter().find(|m| m.id == "fall").unwrap();
    let lead = rope.segments[4].force_n;
    assert!(rel(lead / w, k.powi(4) * (k - 1.0) / (k.powi(4) - 1.0)) < 1e-8, "{}", lead / w);
    assert!((lead / w - 0.309).abs() < 5e-4, "the published 0.309: {}", lead / w);
    for (i, g) in rope.segments[..4].iter().enumerate() {
        let expect = w * k.powi(i as i32) * (k - 1.0) / (k.powi(4) - 1.0);
        assert!(rel(g.force_n, expect) < 1e-8, "fall {i}: {} vs {expect}", g.force_n);
    }
    assert!(rel(rope.force_n, lead) < 1e-12);

    // lowering: the friction reverses, so the same statics hold with K
    // replaced by q = 1/K: the lead pulls W qⁿ (q − 1)/(qⁿ − 1) and the dead
    // end pulls hardest
    let a = analysed(&reeved(", bearing: Bronze", ", motion: Lowering"));
    let rope = a.cases[0].members.iter().find(|m| m.id == "fall").unwrap();
    let q = 1.0 / k;
    let lead = rope.segments[4].force_n;
    assert!(rel(lead / w, q.powi(4) * (q - 1.0) / (q.powi(4) - 1.0)) < 1e-8, "{}", lead / w);
    assert!(rope.segments[0].force_n > rope.segments[3].force_n);
}

// A wire rope over a sheave keeps the D/d efficiency of its smallest sheave
// (library/bend.rs curve): D 300 mm / d 12 mm = 25 → 0.91 + (0.95 − 0.91) ×
// 5/20 = 0.92, times the poured socket's 1.00; with the wire rope default
// design factor 5 (the member kind's): allowable 100 kN × 0.92 / 5.
#[test]
fn sheave_d_over_d_reduces_the_rope() {
    let a = analysed(&running_block("", "200 GPa"));
    let rope = a.cases[0].members.iter().find(|m| m.id == "fall").unwrap();
    assert_eq!(rope.bend_efficiency.map(|e| (e * 1e6).round() / 1e6), Some(0.92));
    assert!(rel(rope.allowable_n, 100e3 * 0.92 / 5.0) < 1e-12, "{}", rope.allowable_n);
}

fn error_of(text: &str) -> String {
    match load_scenario(text) {
        Ok(_) => panic!("accepted"),
        Err(e) => e.to_string(),
    }
}

#[test]
fn badly_routed_ropes_are_located_errors() {
    let good = running_block("", "200 GPa");
    // a path node without a sheave
    let e = error_of(&good.replace(r#", sheave: Sheave(diameter: "300 mm")"#, ""));
    assert!(e.contains("ropes[0].path[1]") && e.contains("has no sheave"), "{e}");
    // a node that does not exist
    let e = error_of(&good.replace(r#"path: ["A", "K", "B"]"#, r#"path: ["A", "Q", "B"]"#));
    assert!(e.contains("ropes[0].path[1]") && e.contains("\"Q\""), "{e}");
    // two nodes only
    let e = error_of(&good.replace(r#"path: ["A", "K", "B"]"#, r#"path: ["A", "B"]"#));
    assert!(e.contains("ropes[0].path") && e.contains("three or more"), "{e}");
    // a chain is not a rope over sheaves
    let e = error_of(&good.replace("kind: WireRope", "kind: Chain"));
    assert!(e.contains("ropes[0].kind"), "{e}");
    // a wire rope over a sheave needs its diameter for D/d
    let e = error_of(&good.replace(r#"diameter: "12 mm", "#, ""));
    assert!(e.contains("ropes[0].diameter") && e.contains("D/d"), "{e}");
    // a rope id that is already a member's
    let e = error_of(&good.replace(
        "ropes: [",
        r#"members: [ Member(id: "fall", ends: ("A", "B"), kind: WireRope, area: "10 mm^2", modulus: "100 GPa", rating: BreakingStrength("10 kN")) ], ropes: ["#,
    ));
    assert!(e.contains("ropes[0].id") && e.contains("share one set of ids"), "{e}");
    // errors in the member fields are located under ropes[i]
    let e = error_of(&good.replace(r#"area: "100 mm^2""#, r#"area: "100 kg""#));
    assert!(e.contains("ropes[0].area"), "{e}");
}

// The same rope in the time domain: a suddenly applied load on the snatch
// rig's frictionless sheave peaks at twice its static tension (the
// suddenly-applied factor 2, any dynamics text: F = W (1 + √(1 + 2kh/W))
// at h = 0), through the rope's own kernel in the Newmark integrator.
// Tolerance 1 %: the step resolves the peak to about 0.1 % (period / 20
// steps, average acceleration), well inside it.
#[test]
fn sudden_load_on_a_rope_peaks_at_twice_static_in_the_time_domain() {
    use tautspan_core::analysis::{SimulateRequest, simulate_case};
    let text = snatch("").replace(
        "cases: [ Static(id: \"hanging\") ]",
        "cases: [ Static(id: \"hanging\"), Sudden(id: \"snap\", mass: \"load\") ]",
    );
    let l = load_scenario(&text).unwrap();
    let req = SimulateRequest { duration_s: 1.0, ..SimulateRequest::default() };
    let sim = simulate_case(&l.scenario, "snap", &req, &mut |_| true).unwrap();
    let k = sim.member_ids.iter().position(|id| id == "line").unwrap();
    let peak = sim.run.peak_member_force_n[k];
    assert!(rel(peak, 2.0 * 300.0 * G) < 1e-2, "{peak}");
    assert!(sim.run.energy_drift < 1e-3, "{}", sim.run.energy_drift);
}

// The load path runs through the rope's spans: on the running block the
// rope's two spans together hold the whole weight up (share 1), and the
// anchors share it by their spans' vertical pulls, T cos φ each over
// frictionless sheaves: half each (statics of the pulley, equal angles).
// Tolerance 1e-6: the trace's cut-off bound is 1e-5 of the threshold.
#[test]
fn load_path_runs_through_the_spans() {
    let a = analysed(&running_block("", "200 GPa"));
    let p = &a.cases[0].load_path[0];
    let k = p.members.iter().position(|m| m == "fall").expect("the rope is on the path");
    assert!((p.shares[k] - 1.0).abs() < 1e-6, "{}", p.shares[k]);
    for (s, share) in p.supports.iter().zip(&p.support_shares) {
        assert!((share - 0.5).abs() < 1e-6, "{s}: {share}");
    }
}

// A rope's printed sag is the largest of its spans' own-weight sags, each
// by the parabolic form d = μ g cos α L² / (8 T) (Irvine, Cable Structures,
// the member's own formula), and its sling angle is its first span's from
// the horizontal (asin |Δy| / L, the definition); recomputed here from the
// solved spans, tolerance 1e-9 (same arithmetic, rounding only).
#[test]
fn rope_sag_and_angle_from_its_spans() {
    let text = running_block("", "200 GPa").replace(r#"linear_mass: "0 kg/m""#, r#"linear_mass: "0.5 kg/m""#);
    let a = analysed(&text);
    let c = &a.cases[0];
    let rope = c.members.iter().find(|m| m.id == "fall").unwrap();
    let pos = |id: &str| c.nodes.iter().find(|n| n.id == id).unwrap().position_m;
    let sag_of = |g: &tautspan_core::analysis::SegmentResult| {
        let (p, q) = (pos(&g.from), pos(&g.to));
        let cos_a = ((q[0] - p[0]).powi(2) + (q[2] - p[2]).powi(2)).sqrt() / g.length_m;
        0.5 * G * cos_a * g.length_m * g.length_m / (8.0 * g.force_n)
    };
    let expect = rope.segments.iter().map(sag_of).fold(0.0, f64::max);
    assert!(expect > 1e-4 && rel(rope.sag_m, expect) < 1e-9, "{} vs {expect}", rope.sag_m);
    let (p, q) = (pos("A"), pos("K"));
    let angle = ((q[1] - p[1]).abs() / rope.segments[0].length_m).asin().to_degrees();
    assert!(rel(rope.sling_angle_deg, angle) < 1e-9, "{} vs {angle}", rope.sling_angle_deg);
}
