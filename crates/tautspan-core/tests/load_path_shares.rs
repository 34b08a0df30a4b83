//! Load paths with shares: the fraction of a mass's weight each member and
//! support carries, checked against hand-worked statics, and the invariants
//! of the trace (every mass's weight reaches the supports; the shares of all
//! loads add up to each member's solved vertical force).

#![allow(clippy::expect_used, clippy::unwrap_used, reason = "test helpers fail loudly on broken fixtures")]

use tautspan_core::analysis::{ALL_MASSES, LOAD_PATH_THRESHOLD, MAX_LISTED, analyse};
use tautspan_core::model::{load_scenario, to_network};
use tautspan_core::solve::{LoadFlow, SolveOptions, StaticSolver, TraceScratch, load_paths};

#[path = "common/grid_net.rs"]
mod common;
use common::grid_net;

fn rel(a: f64, b: f64) -> f64 {
    (a - b).abs() / b.abs()
}

/// A mass hung from one anchor by two parallel vertical wire ropes of equal
/// length and different areas (EA/L = k1, k2). Hand-worked: both stretch by
/// the same δ, so T_i = k_i δ and T1 + T2 = W, hence the shares
/// k1 / (k1 + k2) = 10 / 40 and k2 / (k1 + k2) = 30 / 40; the anchor takes
/// the whole weight. Tolerance 1e-9 relative: the solver closes the
/// out-of-balance force to 1e-9 of the load and the ropes' own weight is not
/// given (left out), so nothing else enters.
#[test]
fn two_parallel_paths_share_by_stiffness() {
    let text = r#"Scenario(format: 1, title: "two paths",
        nodes: [Node(id: "A", at: ("0 m", "3 m"), support: Anchor), Node(id: "J", at: ("0 m", "1 m"))],
        members: [
            Member(id: "thin", ends: ("A", "J"), kind: WireRope, area: "10 mm^2", modulus: "100 GPa", rating: BreakingStrength("50 kN")),
            Member(id: "thick", ends: ("A", "J"), kind: WireRope, area: "30 mm^2", modulus: "100 GPa", rating: BreakingStrength("50 kN")),
        ],
        masses: [Mass(id: "load", at: "J", mass: "400 kg")],
        cases: [Static(id: "s")])"#;
    let a = analyse(&load_scenario(text).unwrap().scenario);
    let p = &a.cases[0].load_path[0];
    assert_eq!(p.mass, "load");
    assert_eq!(p.members, ["thin", "thick"]);
    for (share, expected) in p.shares.iter().zip([0.25, 0.75]) {
        assert!(rel(*share, expected) < 1e-9, "{share} vs {expected}");
    }
    assert_eq!(p.supports, ["A"]);
    assert!(rel(p.support_shares[0], 1.0) < 1e-9);
    assert_eq!((p.below_threshold, p.supports_below_threshold), (0, 0));
    let all = a.cases[0].combined_load_path.as_ref().unwrap();
    assert_eq!(all.mass, ALL_MASSES);
    assert_eq!(all.shares.len(), 2);
}

/// A two-leg bridle with legs at α1 = 30° and α2 = 60° from vertical.
/// Statics (Lami's theorem): T1 = W sin α2 / sin(α1 + α2), so leg 1 carries
/// the vertical part T1 cos α1 = W sin 60° cos 30° = 0.75 W and leg 2
/// 0.25 W. Tolerance 1e-5 relative: EA = 1 GN (1e4 mm² × 100 GPa) lets the
/// joint move about 1e-6 m under 1 t, which turns the legs by about 1e-6 rad.
#[test]
fn bridle_shares_follow_statics() {
    // leg 1 at 30° from vertical: A1 = (-1, √3); leg 2 at 60°: A2 = (√3, 1)
    let text = r#"Scenario(format: 1, title: "bridle",
        nodes: [Node(id: "A1", at: ("-1 m", "1.7320508075688772 m"), support: Anchor),
                Node(id: "A2", at: ("1.7320508075688772 m", "1 m"), support: Anchor),
                Node(id: "J", at: ("0 m", "0 m"))],
        members: [
            Member(id: "leg1", ends: ("A1", "J"), kind: WireRope, area: "10000 mm^2", modulus: "100 GPa", rating: BreakingStrength("5000 kN")),
            Member(id: "leg2", ends: ("A2", "J"), kind: WireRope, area: "10000 mm^2", modulus: "100 GPa", rating: BreakingStrength("5000 kN")),
        ],
        masses: [Mass(id: "load", at: "J", mass: "1000 kg")],
        cases: [Static(id: "s")])"#;
    let a = analyse(&load_scenario(text).unwrap().scenario);
    let p = &a.cases[0].load_path[0];
    assert_eq!(p.members, ["leg1", "leg2"]);
    assert!(rel(p.shares[0], 0.75) < 1e-5, "{:?}", p.shares);
    assert!(rel(p.shares[1], 0.25) < 1e-5, "{:?}", p.shares);
    assert_eq!(p.supports, ["A1", "A2"]);
    assert!(rel(p.support_shares[0], 0.75) < 1e-5 && rel(p.support_shares[1], 0.25) < 1e-5);
}

/// On a 9 × 9 net with a mass at every interior joint, traced without a
/// threshold: each mass's weight reaches the supports in full (the trace
/// splits a node's arriving weight among the members holding it up, which
/// by the node's vertical equilibrium takes all of it), and the shares of
/// all masses, each times its weight, add up to each member's solved
/// vertical force (the paths of every mass together are the solved flow).
/// Tolerance 1e-9: the solver's out-of-balance closes to 1e-9 of the load.
#[test]
fn traces_conserve_weight_and_add_up_to_the_solved_forces() {
    let l = load_scenario(&grid_net(9, "2 kg")).unwrap();
    let s = &l.scenario;
    let (net, loads) = to_network(s);
    let mut solver = StaticSolver::new(&net).unwrap();
    let eq = solver.solve(&loads.total_n, None, &SolveOptions::default()).unwrap();
    let paths = load_paths(&net, &eq, &loads.total_n, 0.0);
    assert_eq!(paths.len(), s.masses.len());
    let mut vertical = vec![0.0; net.members.len()];
    for p in &paths {
        let reached: f64 = p.supports.iter().map(|x| x.1).sum();
        assert!((reached - 1.0).abs() < 1e-9, "mass at {}: {reached}", p.node);
        assert!(p.untraced.abs() < 1e-12);
        let w = -loads.total_n[p.node][1];
        for &(i, share) in &p.members {
            vertical[i] += w * share;
        }
    }
    let total: f64 = loads.mass_weight_n.iter().sum();
    for (i, m) in net.members.iter().enumerate() {
        let [a, b] = m.ends;
        let dy = eq.positions_m[b][1] - eq.positions_m[a][1];
        let v = (eq.member_force_n[i] * dy / eq.member_length_m[i]).abs();
        assert!((vertical[i] - v).abs() < 1e-9 * total, "member {i}: traced {} vs solved {v}", vertical[i]);
    }
    // the combined trace of all masses is the same flow
    let flow = LoadFlow::new(&net, &eq);
    let sources: Vec<(usize, f64)> = s.masses.iter().zip(&loads.mass_weight_n).map(|(m, w)| (m.node, *w)).collect();
    let all = flow.trace(&sources, 0.0, usize::MAX, &mut TraceScratch::default());
    for &(i, share) in &all.members {
        assert!((share * total - vertical[i]).abs() < 1e-9 * total);
    }
}

/// With the 1 % threshold, a mass in a larger net lists only the members
/// that carry at least 1 % of its weight and counts the rest; the listed
/// and counted members together are every member the weight passes through.
#[test]
fn threshold_lists_real_shares_and_counts_the_rest() {
    let a = analyse(&load_scenario(&grid_net(21, "2 kg")).unwrap().scenario);
    let c = &a.cases[0];
    assert_eq!(c.load_path.len(), 19 * 19);
    let middle = c.load_path.iter().find(|p| p.mass == "m10_10").unwrap();
    assert!(middle.shares.iter().all(|s| *s >= LOAD_PATH_THRESHOLD));
    // only the largest shares are listed; the rest above the threshold counted
    assert!(middle.members.len() <= MAX_LISTED);
    if middle.not_listed > 0 {
        assert_eq!(middle.members.len(), MAX_LISTED);
    }
    // the combined path lists every member carrying any weight, shares of the total
    let all = c.combined_load_path.as_ref().unwrap();
    assert_eq!(all.below_threshold, 0);
    assert!(all.members.len() > MAX_LISTED);
    assert!(middle.below_threshold > 0, "a net spreads a mass over many members");
    assert!(middle.untraced < 0.01 * LOAD_PATH_THRESHOLD);
    // the four members at the joint carry all of its weight between them
    let at_joint: f64 = middle
        .members
        .iter()
        .zip(&middle.shares)
        .filter(|(id, _)| ["x9_10", "x10_10", "z10_9", "z10_10"].contains(&id.as_str()))
        .map(|(_, s)| s)
        .sum();
    assert!((at_joint - 1.0).abs() < 1e-9, "{at_joint}");
}

/// A load on a spreader: hook line, two top legs, a level spreader bar, two
/// drop legs. Statically determinate and symmetric, so each leg carries
/// half the weight and the hook line all of it (statics); the level bar
/// holds no weight up itself but lies on the path, listed with the half
/// that passes through both its ends. Tolerance 1e-9 relative (solver
/// closure; symmetry keeps the split exact).
#[test]
fn spreader_is_on_the_path_with_the_weight_through_its_ends() {
    let rope = r#"kind: WireRope, area: "100 mm^2", modulus: "100 GPa", rating: BreakingStrength("100 kN")"#;
    let text = format!(
        r#"Scenario(format: 1, title: "spreader",
        nodes: [Node(id: "A", at: ("0 m", "6 m"), support: Anchor), Node(id: "H", at: ("0 m", "5 m")),
                Node(id: "S1", at: ("-1 m", "4 m")), Node(id: "S2", at: ("1 m", "4 m")), Node(id: "L", at: ("0 m", "2 m"))],
        members: [
            Member(id: "hook", ends: ("A", "H"), {rope}),
            Member(id: "top1", ends: ("H", "S1"), {rope}), Member(id: "top2", ends: ("H", "S2"), {rope}),
            Member(id: "bar", ends: ("S1", "S2"), kind: Rod, section: Tube(outer: "48.3 mm", wall: "3.2 mm"), material: "steel", rating: Yield("235 MPa")),
            Member(id: "drop1", ends: ("S1", "L"), {rope}), Member(id: "drop2", ends: ("S2", "L"), {rope}),
        ],
        masses: [Mass(id: "load", at: "L", mass: "500 kg")],
        cases: [Static(id: "s")])"#
    );
    let a = analyse(&load_scenario(&text).unwrap().scenario);
    let p = &a.cases[0].load_path[0];
    assert_eq!(p.members, ["hook", "top1", "top2", "bar", "drop1", "drop2"]);
    for (share, expected) in p.shares.iter().zip([1.0, 0.5, 0.5, 0.5, 0.5, 0.5]) {
        assert!(rel(*share, expected) < 1e-9, "{:?}", p.shares);
    }
    assert_eq!(p.supports, ["A"]);
}

/// Two masses at one joint of a 19 × 19 net (enough masses for the traces
/// to be shared among threads): both get the same path, each under its own
/// id, and every other mass keeps its own; the paths come out the same
/// whatever order or thread they were traced on (pure function of the
/// scenario: analysing twice gives identical results).
#[test]
fn masses_at_one_joint_share_a_path_and_results_repeat() {
    let text =
        grid_net(19, "2 kg").replace("], cases:", "Mass(id: \"extra\", at: \"n9_9\", mass: \"5 kg\"),\n], cases:");
    let s = load_scenario(&text).unwrap().scenario;
    let a = analyse(&s);
    let c = &a.cases[0];
    assert_eq!(c.load_path.len(), 17 * 17 + 1);
    let mid = c.load_path.iter().find(|p| p.mass == "m9_9").unwrap();
    let extra = c.load_path.iter().find(|p| p.mass == "extra").unwrap();
    assert_eq!((&mid.members, &mid.shares), (&extra.members, &extra.shares));
    for (p, m) in c.load_path.iter().zip(&s.masses) {
        assert_eq!(p.mass, m.id);
    }
    let corner = c.load_path.iter().find(|p| p.mass == "m1_1").unwrap();
    assert_ne!(corner.members, mid.members);
    assert_eq!(analyse(&s).cases[0].load_path, c.load_path);
}

/// A weight that goes round a loop (a strut holding a joint up over a rope
/// that hangs back up to it: flows B → C → B) is followed round until it
/// leaves, the loop's share summing as a geometric series. With vertical
/// forces V(B→A) = 100 N, V(B→C, strut) = 50 N and V(C→B, rope) = 50 N, a
/// unit weight at B splits 2/3 : 1/3 each time it passes B and all of C's
/// comes back, so (hand-worked) B passes 1 / (1 − 1/3) = 1.5, the strut and
/// the lower rope carry 0.5 each and the upper rope and anchor 1. The forces
/// are set by hand (the trace needs no equilibrium); tolerance 1e-4 covers
/// the flows under the cut (1e-5 of the weight) left unfollowed.
#[test]
fn a_loop_is_followed_round_until_the_weight_leaves() {
    let text = r#"Scenario(format: 1, title: "loop",
        nodes: [Node(id: "A", at: ("0 m", "2 m"), support: Anchor), Node(id: "B", at: ("0 m", "1 m")), Node(id: "C", at: ("0 m", "0 m"))],
        members: [
            Member(id: "upper", ends: ("A", "B"), kind: WireRope, area: "10 mm^2", modulus: "100 GPa", rating: BreakingStrength("50 kN")),
            Member(id: "strut", ends: ("B", "C"), kind: Rod, area: "100 mm^2", modulus: "200 GPa", rating: Yield("235 MPa")),
            Member(id: "lower", ends: ("C", "B"), kind: WireRope, area: "10 mm^2", modulus: "100 GPa", rating: BreakingStrength("50 kN")),
        ],
        masses: [Mass(id: "load", at: "B", mass: "10 kg")],
        cases: [Static(id: "s")])"#;
    let s = load_scenario(text).unwrap().scenario;
    let (net, _) = to_network(&s);
    let eq = tautspan_core::solve::Equilibrium {
        positions_m: net.nodes.iter().map(|n| n.position_m).collect(),
        displacements_m: vec![[0.0; 3]; 3],
        member_force_n: vec![100.0, -50.0, 50.0],
        member_length_m: vec![1.0, 1.0, 1.0],
        floor_force_n: vec![0.0; 3],
        reaction_n: vec![[0.0; 3]; 3],
        iterations: 0,
        residual_n: 0.0,
        tolerance_n: 1e-9,
    };
    let p = LoadFlow::new(&net, &eq).trace(&[(1, 1.0)], LOAD_PATH_THRESHOLD, usize::MAX, &mut TraceScratch::default());
    let share = |i: usize| p.members.iter().find(|m| m.0 == i).map_or(0.0, |m| m.1);
    for (i, expected) in [(0, 1.0), (1, 0.5), (2, 0.5)] {
        assert!((share(i) - expected).abs() < 1e-4, "member {i}: {} vs {expected}", share(i));
    }
    assert_eq!(p.supports.len(), 1);
    assert!((p.supports[0].1 - 1.0).abs() < 1e-4 && p.untraced < 1e-4);
}

/// The load paths of a net with more masses than are traced on one thread
/// (21 × 21: 361 masses, past the 256 that share the cores) are the same,
/// in the same order, whether the analysis may use the machine's cores or
/// only its own thread (as the app's solve worker does, leaving a core for
/// drawing): the traces are pure functions of the solved flow.
#[test]
fn one_thread_or_many_give_the_same_paths() {
    let s = load_scenario(&grid_net(21, "2 kg")).unwrap().scenario;
    let many = analyse(&s);
    let one = tautspan_core::analysis::with_thread_limit(1, || analyse(&s));
    assert_eq!(many.cases[0].load_path.len(), 361);
    assert_eq!(many.cases[0].load_path, one.cases[0].load_path);
    assert_eq!(many.cases[0].combined_load_path, one.cases[0].combined_load_path);
}
