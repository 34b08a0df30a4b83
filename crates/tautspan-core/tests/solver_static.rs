//! Static solver against closed-form statics: bridles, sling angle
//! factors, springs in series and parallel, an indeterminate hang, the flat
//! line with no pretension, floor contact, slack ropes, props in
//! compression, load paths and the error cases.

use tautspan_core::solve::{
    AxialLaw, Fixity, NetMember, NetNode, Network, SolveError, SolveOptions, StaticSolver, load_paths, solve_static,
};

fn node(name: &str, p: [f64; 3], fixity: Fixity, load: [f64; 3]) -> NetNode {
    NetNode { name: name.to_owned(), position_m: p, fixity, load_n: load, mass_kg: 0.0 }
}
fn anchor(name: &str, p: [f64; 3]) -> NetNode {
    node(name, p, Fixity::Fixed, [0.0; 3])
}
fn joint(name: &str, p: [f64; 3], load: [f64; 3]) -> NetNode {
    node(name, p, Fixity::Free, load)
}
fn dist(a: [f64; 3], b: [f64; 3]) -> f64 {
    ((a[0] - b[0]).powi(2) + (a[1] - b[1]).powi(2) + (a[2] - b[2]).powi(2)).sqrt()
}
/// A member whose rest length is its drawn length plus `slack_m`.
fn member(net: &Network, name: &str, a: usize, b: usize, ea: f64, slack_m: f64, law: AxialLaw) -> NetMember {
    NetMember {
        name: name.to_owned(),
        ends: [a, b],
        axial_stiffness_n: ea,
        rest_length_m: dist(net.nodes[a].position_m, net.nodes[b].position_m) + slack_m,
        law,
        via: Vec::new(),
        segment_factors: Vec::new(),
    }
}
fn rope(net: &Network, name: &str, a: usize, b: usize, ea: f64) -> NetMember {
    member(net, name, a, b, ea, 0.0, AxialLaw::TensionOnly)
}
fn rel(a: f64, b: f64) -> f64 {
    (a - b).abs() / b.abs()
}
fn opts() -> SolveOptions {
    SolveOptions::default()
}

#[test]
fn two_leg_bridle_unequal_legs() {
    // Source: statics (REFERENCES.md, sling and bridle angles):
    // T1 = W sin α2 / sin(α1 + α2), α from vertical.
    // Tolerance 1e-5 relative: EA = 1e10 N lets the joint move ≈ 4e-6 m,
    // which turns the legs by ≈ 3e-6 rad from the drawn angles; the leg
    // forces change by that times dT/dα (up to ≈ 2 T here).
    for (a1_deg, a2_deg, l1, l2) in [(30.0_f64, 50.0_f64, 2.0, 3.0), (10.0, 65.0, 4.0, 1.5), (45.0, 45.0, 1.0, 2.5)] {
        let (a1, a2) = (a1_deg.to_radians(), a2_deg.to_radians());
        let w = 10_000.0;
        let mut net = Network::default();
        net.nodes.push(joint("J", [0.0; 3], [0.0, -w, 0.0]));
        net.nodes.push(anchor("A1", [-l1 * a1.sin(), l1 * a1.cos(), 0.0]));
        net.nodes.push(anchor("A2", [l2 * a2.sin(), l2 * a2.cos(), 0.0]));
        let m1 = rope(&net, "leg1", 0, 1, 1e10);
        let m2 = rope(&net, "leg2", 0, 2, 1e10);
        net.members = vec![m1, m2];
        let eq = solve_static(&net, &opts()).unwrap();
        let t1 = w * a2.sin() / (a1 + a2).sin();
        let t2 = w * a1.sin() / (a1 + a2).sin();
        assert!(rel(eq.member_force_n[0], t1) < 1e-5, "{a1_deg} {a2_deg}: {} vs {t1}", eq.member_force_n[0]);
        assert!(rel(eq.member_force_n[1], t2) < 1e-5, "{a1_deg} {a2_deg}: {} vs {t2}", eq.member_force_n[1]);
    }
}

#[test]
fn symmetric_sling_load_angle_factors() {
    // Source: ASME B30.9 sling-angle tables (REFERENCES.md): load-angle
    // factor 1/sin β, β from horizontal, here 2 T / W for a two-leg sling.
    // Tolerance 6e-4 absolute: the table is rounded to three decimals.
    for (beta_deg, table) in [(90.0_f64, 1.000), (60.0, 1.155), (45.0, 1.414), (30.0, 2.000)] {
        let b = beta_deg.to_radians();
        let (w, leg) = (5_000.0, 2.0);
        let mut net = Network::default();
        net.nodes.push(joint("hook", [0.0; 3], [0.0, -w, 0.0]));
        net.nodes.push(anchor("L", [-leg * b.cos(), leg * b.sin(), 0.0]));
        net.nodes.push(anchor("R", [leg * b.cos(), leg * b.sin(), 0.0]));
        let m1 = rope(&net, "left", 0, 1, 1e10);
        let m2 = rope(&net, "right", 0, 2, 1e10);
        net.members = vec![m1, m2];
        let eq = solve_static(&net, &opts()).unwrap();
        for t in &eq.member_force_n {
            let factor = 2.0 * t / w;
            assert!((factor - table).abs() < 6e-4, "β {beta_deg}: {factor} vs {table}");
        }
    }
}

#[test]
fn springs_in_series_and_parallel() {
    // Source: springs in series 1/k = Σ 1/k_i, in parallel k = Σ k_i, and
    // parallel members share load in proportion to k_i (elementary
    // mechanics). Tolerance 1e-9 relative: collinear vertical members, so
    // the large-displacement answer equals the linear one exactly; only
    // the convergence tolerance (1e-9 of the load) remains.
    let p = 2_000.0;
    let (ea1, ea2) = (3e6, 7e6);
    // Series: anchor — 1 m — J1 — 2 m — J2 (loaded).
    let mut net = Network::default();
    net.nodes.push(anchor("A", [0.0, 3.0, 0.0]));
    net.nodes.push(joint("J1", [0.0, 2.0, 0.0], [0.0; 3]));
    net.nodes.push(joint("J2", [0.0, 0.0, 0.0], [0.0, -p, 0.0]));
    let m1 = rope(&net, "upper", 0, 1, ea1);
    let m2 = rope(&net, "lower", 1, 2, ea2);
    net.members = vec![m1, m2];
    let (k1, k2) = (ea1 / 1.0, ea2 / 2.0);
    let k_series = 1.0 / (1.0 / k1 + 1.0 / k2);
    let mut solver = StaticSolver::new(&net).unwrap();
    let loads: Vec<[f64; 3]> = net.nodes.iter().map(|n| n.load_n).collect();
    let eq = solver.solve(&loads, None, &opts()).unwrap();
    let drop = -eq.positions_m[2][1];
    assert!(rel(drop, p / k_series) < 1e-9, "{drop} vs {}", p / k_series);
    assert!(rel(eq.member_force_n[0], p) < 1e-9 && rel(eq.member_force_n[1], p) < 1e-9);
    // The tangent at equilibrium gives the same series stiffness.
    let k_eff = solver.effective_stiffness(&eq, 2, [0.0, -1.0, 0.0]).unwrap();
    assert!(rel(k_eff, k_series) < 1e-9, "{k_eff} vs {k_series}");

    // Parallel: two anchors at the same point, two ropes to one node.
    let mut net = Network::default();
    net.nodes.push(anchor("A1", [0.0, 2.0, 0.0]));
    net.nodes.push(anchor("A2", [0.0, 2.0, 0.0]));
    net.nodes.push(joint("J", [0.0, 0.0, 0.0], [0.0, -p, 0.0]));
    let m1 = rope(&net, "a", 0, 2, ea1);
    let m2 = rope(&net, "b", 1, 2, ea2);
    net.members = vec![m1, m2];
    let eq = solve_static(&net, &opts()).unwrap();
    let (k1, k2) = (ea1 / 2.0, ea2 / 2.0);
    assert!(rel(-eq.positions_m[2][1], p / (k1 + k2)) < 1e-9);
    assert!(rel(eq.member_force_n[0], p * k1 / (k1 + k2)) < 1e-9);
    assert!(rel(eq.member_force_n[1], p * k2 / (k1 + k2)) < 1e-9);
}

#[test]
fn indeterminate_three_member_hang() {
    // Source: small-displacement compatibility (stiffness method by hand):
    // K u = P with K = Σ k_i e_i e_iᵀ, T_i = −k_i e_i · u (e_i from the node
    // to anchor i). Tolerance 1e-4 relative: the strains are ≈ 1e-6, and the
    // large-displacement answer departs from the linear one at that order
    // times the geometry factors.
    let p = 20_000.0;
    let anchors = [[-1.5, 3.0, 0.0], [0.2, 3.5, 0.0], [2.0, 2.5, 0.0]];
    let eas = [2e10, 5e10, 1e10];
    let mut net = Network::default();
    net.nodes.push(joint("J", [0.0; 3], [0.0, -p, 0.0]));
    for (i, a) in anchors.iter().enumerate() {
        net.nodes.push(anchor(&format!("A{i}"), *a));
    }
    for (i, ea) in eas.iter().enumerate() {
        let m = member(&net, &format!("rod{i}"), 0, i + 1, *ea, 0.0, AxialLaw::TensionAndCompression);
        net.members.push(m);
    }
    let eq = solve_static(&net, &opts()).unwrap();
    // Hand solution in the x–y plane.
    let mut k = [[0.0; 2]; 2];
    let mut es = Vec::new();
    for (a, ea) in anchors.iter().zip(eas) {
        let l = dist(*a, [0.0; 3]);
        let e = [a[0] / l, a[1] / l];
        let ki = ea / l;
        for (row, er) in k.iter_mut().zip(e) {
            for (v, ec) in row.iter_mut().zip(e) {
                *v += ki * er * ec;
            }
        }
        es.push((e, ki));
    }
    let det = k[0][0] * k[1][1] - k[0][1] * k[1][0];
    let f = [0.0, -p];
    let u = [(k[1][1] * f[0] - k[0][1] * f[1]) / det, (-k[1][0] * f[0] + k[0][0] * f[1]) / det];
    for (i, (e, ki)) in es.iter().enumerate() {
        let t = -ki * (e[0] * u[0] + e[1] * u[1]);
        assert!(rel(eq.member_force_n[i], t) < 1e-4, "rod{i}: {} vs {t}", eq.member_force_n[i]);
    }
}

/// Bisection on a continuous function with a sign change on [lo, hi].
fn bisect(f: impl Fn(f64) -> f64, mut lo: f64, mut hi: f64) -> f64 {
    let flo = f(lo);
    for _ in 0..200 {
        let mid = 0.5 * (lo + hi);
        if (f(mid) > 0.0) == (flo > 0.0) {
            lo = mid;
        } else {
            hi = mid;
        }
    }
    0.5 * (lo + hi)
}

#[test]
fn flat_line_without_pretension_large_displacement() {
    // Source: statics, large displacement (REFERENCES.md, cables):
    // 2 T sin φ = P, T = EA (√(L² + d²) − L) / L, half-span L; solved for d
    // by bisection. Tolerance 1e-8 relative: the solver's answer is exact
    // for this law up to its convergence tolerance (1e-9 of the load).
    let (half, ea, p) = (1.5, 2e5, 300.0);
    let mut net = Network::default();
    net.nodes.push(anchor("L", [-half, 0.0, 0.0]));
    net.nodes.push(anchor("R", [half, 0.0, 0.0]));
    net.nodes.push(joint("mid", [0.0; 3], [0.0, -p, 0.0]));
    let m1 = rope(&net, "left", 0, 2, ea);
    let m2 = rope(&net, "right", 1, 2, ea);
    net.members = vec![m1, m2];
    let eq = solve_static(&net, &opts()).unwrap();
    let residual = |d: f64| {
        let l = (half * half + d * d).sqrt();
        let t = ea * (l - half) / half;
        2.0 * t * d / l - p
    };
    let d_ref = bisect(residual, 1e-9, half);
    let l = (half * half + d_ref * d_ref).sqrt();
    let t_ref = ea * (l - half) / half;
    let d = -eq.positions_m[2][1];
    assert!(rel(d, d_ref) < 1e-8, "{d} vs {d_ref}");
    assert!(rel(eq.member_force_n[0], t_ref) < 1e-8);
    assert!(eq.positions_m[2][0].abs() < 1e-9 * half && eq.positions_m[2][2].abs() < 1e-9 * half);
}

#[test]
fn node_on_a_floor_spring() {
    // Source: a linear spring, F = k δ. Tolerance 1e-12 relative: one
    // linear dof, the answer is exact to roundoff.
    let (p, k) = (8_000.0, 4e6);
    let mut net = Network::default();
    net.nodes.push(node("pad", [1.0, 0.0, 2.0], Fixity::Floor { stiffness_n_per_m: k }, [300.0, -p, 0.0]));
    let eq = solve_static(&net, &opts()).unwrap();
    assert!(rel(eq.floor_force_n[0], p) < 1e-12);
    assert!(rel(-eq.positions_m[0][1], p / k) < 1e-12);
    // The floor node is held sideways: the held x force is the reaction.
    assert!(rel(eq.reaction_n[0][1], p) < 1e-12 && rel(-eq.reaction_n[0][0], 300.0) < 1e-12);
    assert_eq!(eq.positions_m[0][0], 1.0);
}

#[test]
fn pretensioned_rope_lifts_a_floor_node() {
    // Source: statics; once the contact opens the node hangs on the rope,
    // L = L0 + W/k. Tolerance 1e-9 relative on the height (convergence).
    let (w, ea, l0) = (50.0, 1e5, 1.9);
    let mut net = Network::default();
    net.nodes.push(anchor("A", [0.0, 2.0, 0.0]));
    net.nodes.push(node("F", [0.0; 3], Fixity::Floor { stiffness_n_per_m: 1e7 }, [0.0, -w, 0.0]));
    net.members.push(member(&net, "tie", 0, 1, ea, l0 - 2.0, AxialLaw::TensionOnly));
    let eq = solve_static(&net, &opts()).unwrap();
    let k = ea / l0;
    assert_eq!(eq.floor_force_n[1], 0.0, "contact must open");
    assert!(rel(eq.positions_m[1][1], 2.0 - l0 - w / k) < 1e-9);
    assert!(rel(eq.member_force_n[0], w) < 1e-9);
}

#[test]
fn mass_on_a_slack_rope_falls_until_taut() {
    // Source: statics; the mass ends directly below the anchor at
    // L0 + W/k. Tolerance 1e-9 relative (convergence tolerance).
    let (w, ea, l0) = (900.0, 2e6, 1.0);
    for start in [[0.0, 1.5, 0.0], [0.3, 1.6, -0.2]] {
        let mut net = Network::default();
        net.nodes.push(anchor("A", [0.0, 2.0, 0.0]));
        net.nodes.push(joint("load", start, [0.0, -w, 0.0]));
        let slack = l0 - dist(net.nodes[0].position_m, start);
        net.members.push(member(&net, "rope", 0, 1, ea, slack, AxialLaw::TensionOnly));
        let eq = solve_static(&net, &opts()).unwrap();
        let k = ea / l0;
        assert!(rel(2.0 - eq.positions_m[1][1], l0 + w / k) < 1e-9);
        assert!(eq.positions_m[1][0].abs() < 1e-9 && eq.positions_m[1][2].abs() < 1e-9);
        assert!(rel(eq.member_force_n[0], w) < 1e-9);
        assert!(rel(eq.reaction_n[0][1], w) < 1e-9);
    }
}

#[test]
fn tripod_of_rods_in_compression() {
    // Source: statics, each of three symmetric legs carries
    // −W / (3 sin β) (β the leg's elevation). Tolerance 1e-5 relative:
    // EA = 1e9 N, strain ≈ 1e-6, geometry change of that order.
    let (w, r, h) = (30_000.0, 1.2, 2.0);
    let mut net = Network::default();
    net.nodes.push(joint("apex", [0.0, h, 0.0], [0.0, -w, 0.0]));
    for i in 0..3 {
        let a = f64::from(i) * 2.0 * std::f64::consts::PI / 3.0;
        net.nodes.push(anchor(&format!("foot{i}"), [r * a.cos(), 0.0, r * a.sin()]));
    }
    for i in 1..4 {
        let m = member(&net, &format!("leg{i}"), 0, i, 1e9, 0.0, AxialLaw::TensionAndCompression);
        net.members.push(m);
    }
    let eq = solve_static(&net, &opts()).unwrap();
    let sin_beta = h / (h * h + r * r).sqrt();
    for t in &eq.member_force_n {
        assert!(rel(*t, -w / (3.0 * sin_beta)) < 1e-5, "{t}");
    }
}

#[test]
fn load_paths_follow_force_carrying_members() {
    // Two rigs in one network; a slack rope on the first is not on its path.
    let mut net = Network::default();
    net.nodes.push(anchor("A1", [-1.0, 3.0, 0.0])); // 0
    net.nodes.push(anchor("A2", [1.0, 3.0, 0.0])); // 1
    net.nodes.push(anchor("A3", [5.0, 3.0, 0.0])); // 2
    net.nodes.push(anchor("A4", [0.0, -2.0, 0.0])); // 3 (below: its rope stays slack)
    net.nodes.push(joint("J1", [0.0, 1.0, 0.0], [0.0, -1000.0, 0.0])); // 4
    net.nodes.push(joint("J2", [5.0, 1.0, 0.0], [0.0, -500.0, 0.0])); // 5
    let ms = vec![
        rope(&net, "l1", 4, 0, 1e8),
        rope(&net, "l2", 4, 1, 1e8),
        member(&net, "slack", 4, 3, 1e8, 0.5, AxialLaw::TensionOnly),
        rope(&net, "l3", 5, 2, 1e8),
    ];
    net.members = ms;
    let loads: Vec<[f64; 3]> = net.nodes.iter().map(|n| n.load_n).collect();
    let eq = solve_static(&net, &opts()).unwrap();
    let paths = load_paths(&net, &eq, &loads, 1e-9);
    assert_eq!(paths.len(), 2);
    let ids = |v: &[(usize, f64)]| v.iter().map(|x| x.0).collect::<Vec<_>>();
    assert_eq!((paths[0].node, ids(&paths[0].members), ids(&paths[0].supports)), (4, vec![0, 1], vec![0, 1]));
    assert_eq!((paths[1].node, ids(&paths[1].members), ids(&paths[1].supports)), (5, vec![3], vec![2]));
    // symmetric legs: half the weight each (statics); the single line all of it
    for (_, share) in paths[0].members.iter().chain(&paths[0].supports) {
        assert!(rel(*share, 0.5) < 1e-9, "{share}");
    }
    assert!(rel(paths[1].members[0].1, 1.0) < 1e-12);
}

#[test]
fn loaded_node_without_support_names_it() {
    let mut net = Network::default();
    net.nodes.push(anchor("A", [0.0, 2.0, 0.0]));
    net.nodes.push(joint("J", [0.0, 1.0, 0.0], [0.0, -10.0, 0.0]));
    net.nodes.push(joint("lost", [3.0, 1.0, 0.0], [0.0, -10.0, 0.0]));
    net.nodes.push(joint("lost-mate", [4.0, 1.0, 0.0], [0.0; 3]));
    let m1 = rope(&net, "r", 0, 1, 1e6);
    let m2 = rope(&net, "floating", 2, 3, 1e6);
    net.members = vec![m1, m2];
    match solve_static(&net, &opts()) {
        Err(SolveError::NoLoadPath { node }) => assert_eq!(node, "lost"),
        other => panic!("expected NoLoadPath, got {other:?}"),
    }
}

#[test]
fn floor_node_pulled_up_with_nothing_holding_it_runs_away() {
    let mut net = Network::default();
    net.nodes.push(node("F", [0.0; 3], Fixity::Floor { stiffness_n_per_m: 1e6 }, [0.0, 100.0, 0.0]));
    match solve_static(&net, &opts()) {
        Err(SolveError::RunAway { node, .. }) => assert_eq!(node, "F"),
        other => panic!("expected RunAway, got {other:?}"),
    }
}

#[test]
fn invalid_input_is_reported() {
    let mut net = Network::default();
    net.nodes.push(anchor("A", [0.0, 2.0, 0.0]));
    net.nodes.push(joint("J", [0.0, 1.0, 0.0], [0.0, -10.0, 0.0]));
    net.members.push(rope(&net, "r", 0, 1, 1e6));
    let mut bad = net.clone();
    bad.members[0].axial_stiffness_n = 0.0;
    assert!(matches!(solve_static(&bad, &opts()), Err(SolveError::InvalidInput { .. })));
    let mut bad = net.clone();
    bad.members[0].ends = [0, 7];
    assert!(matches!(solve_static(&bad, &opts()), Err(SolveError::InvalidInput { .. })));
    let mut bad = net.clone();
    bad.nodes[1].position_m[0] = f64::NAN;
    assert!(matches!(solve_static(&bad, &opts()), Err(SolveError::InvalidInput { .. })));
    let mut bad = net.clone();
    bad.members[0].rest_length_m = -1.0;
    assert!(matches!(solve_static(&bad, &opts()), Err(SolveError::InvalidInput { .. })));
    let mut solver = StaticSolver::new(&net).unwrap();
    assert!(matches!(solver.solve(&[[0.0; 3]], None, &opts()), Err(SolveError::InvalidInput { .. })));
}

#[test]
fn repeated_solves_reuse_the_solver_and_scale() {
    // Source: linear law along a vertical line, T = W for any W.
    // Tolerance 1e-9 relative (convergence).
    let mut net = Network::default();
    net.nodes.push(anchor("A", [0.0, 2.0, 0.0]));
    net.nodes.push(joint("J", [0.0, 1.0, 0.0], [0.0; 3]));
    net.members.push(rope(&net, "r", 0, 1, 1e6));
    let mut solver = StaticSolver::new(&net).unwrap();
    let mut start: Option<Vec<[f64; 3]>> = None;
    for w in [10.0, 100.0, 1000.0, 5000.0] {
        let loads = vec![[0.0; 3], [0.0, -w, 0.0]];
        let eq = solver.solve(&loads, start.as_deref(), &opts()).unwrap();
        assert!(rel(eq.member_force_n[0], w) < 1e-9);
        start = Some(eq.positions_m);
    }
}
