//! Invariance of the static solution under rigid motions of the whole
//! network, and property tests on random stable networks: equilibrium at
//! every free node, tension-only forces ≥ 0, floor forces ≥ 0 and
//! Σ reactions = −Σ loads.
// Axis loops index several per-axis arrays at once; iterators obscure that.
#![allow(clippy::needless_range_loop)]

use proptest::prelude::*;
use tautspan_core::solve::{AxialLaw, Equilibrium, Fixity, NetMember, NetNode, Network, SolveOptions, solve_static};

fn dist(a: [f64; 3], b: [f64; 3]) -> f64 {
    ((a[0] - b[0]).powi(2) + (a[1] - b[1]).powi(2) + (a[2] - b[2]).powi(2)).sqrt()
}

fn tight() -> SolveOptions {
    SolveOptions { relative_tolerance: 1e-13, ..SolveOptions::default() }
}

/// Members (end, end, EA, slack, law) between the nodes of `net`, each at
/// its drawn length plus its slack, named `prefix` and a number.
fn connect(net: &mut Network, members: &[(usize, usize, f64, f64, AxialLaw)], prefix: &str) {
    for (i, &(a, b, ea, slack, law)) in members.iter().enumerate() {
        let rest = dist(net.nodes[a].position_m, net.nodes[b].position_m) + slack;
        net.members.push(NetMember {
            name: format!("{prefix}{i}"),
            ends: [a, b],
            axial_stiffness_n: ea,
            rest_length_m: rest,
            law,
            via: Vec::new(),
            segment_factors: Vec::new(),
        });
    }
}

/// A 3-D rig: three anchors, two joints with loads, a rod strut, a slack
/// rope and a floor node tied to a joint.
fn rig() -> Network {
    let mut net = Network::default();
    let mut add = |name: &str, p: [f64; 3], fixity: Fixity, load: [f64; 3]| {
        net.nodes.push(NetNode { name: name.into(), position_m: p, fixity, load_n: load, mass_kg: 0.0 })
    };
    add("A1", [0.0, 5.0, 0.0], Fixity::Fixed, [0.0; 3]);
    add("A2", [4.0, 5.5, 1.0], Fixity::Fixed, [0.0; 3]);
    add("A3", [1.0, 4.5, 3.5], Fixity::Fixed, [0.0; 3]);
    add("J1", [1.5, 2.0, 1.0], Fixity::Free, [200.0, -3000.0, 100.0]);
    add("J2", [2.5, 1.5, 2.0], Fixity::Free, [0.0, -1500.0, 0.0]);
    let members = [
        (0, 3, 5e6, 0.0, AxialLaw::TensionOnly),
        (1, 3, 4e6, 0.01, AxialLaw::TensionOnly),
        (2, 3, 6e6, 0.0, AxialLaw::TensionOnly),
        (3, 4, 2e7, 0.0, AxialLaw::TensionAndCompression),
        (1, 4, 5e6, 0.0, AxialLaw::TensionOnly),
        (2, 4, 5e6, -0.005, AxialLaw::TensionOnly),
        (0, 4, 5e6, 0.8, AxialLaw::TensionOnly),
    ];
    connect(&mut net, &members, "m");
    net
}

fn rotation(axis: [f64; 3], angle: f64) -> [[f64; 3]; 3] {
    let n = dist(axis, [0.0; 3]);
    let [x, y, z] = axis.map(|c| c / n);
    let (s, c) = angle.sin_cos();
    let t = 1.0 - c;
    [
        [t * x * x + c, t * x * y - s * z, t * x * z + s * y],
        [t * x * y + s * z, t * y * y + c, t * y * z - s * x],
        [t * x * z - s * y, t * y * z + s * x, t * z * z + c],
    ]
}

fn apply(r: &[[f64; 3]; 3], v: [f64; 3]) -> [f64; 3] {
    [0, 1, 2].map(|i| r[i][0] * v[0] + r[i][1] * v[1] + r[i][2] * v[2])
}

fn assert_same_forces(a: &Equilibrium, b: &Equilibrium, what: &str) {
    // Tolerance 1e-9 relative to the largest force: the solves converge to
    // 1e-13 of the load, so only the roundoff of the transformed
    // coordinates remains (≈ 1e-15 relative, amplified by the stiffness
    // ratio EA·L / T ≈ 1e4).
    let scale = a.member_force_n.iter().fold(0.0_f64, |m, f| m.max(f.abs()));
    for (i, (fa, fb)) in a.member_force_n.iter().zip(&b.member_force_n).enumerate() {
        assert!((fa - fb).abs() <= 1e-9 * scale, "{what}: member {i}: {fa} vs {fb}");
    }
}

#[test]
fn translation_and_rotation_leave_forces_unchanged() {
    let net = rig();
    let base = solve_static(&net, &tight()).unwrap();
    assert!(base.member_force_n[3].abs() > 0.0);

    let mut moved = net.clone();
    for n in &mut moved.nodes {
        for (c, d) in n.position_m.iter_mut().zip([12.5, -3.0, 7.25]) {
            *c += d;
        }
    }
    assert_same_forces(&base, &solve_static(&moved, &tight()).unwrap(), "translation");

    // About a vertical axis: gravity loads stay as they are only if they are
    // vertical; rotate the loads too (the horizontal ones turn with the rig).
    for (axis, angle) in [([0.0, 1.0, 0.0], 0.7), ([0.3, -0.5, 0.8], 2.1), ([1.0, 0.0, 0.0], -1.2)] {
        let r = rotation(axis, angle);
        let mut turned = net.clone();
        for n in &mut turned.nodes {
            n.position_m = apply(&r, n.position_m);
            n.load_n = apply(&r, n.load_n);
        }
        assert_same_forces(&base, &solve_static(&turned, &tight()).unwrap(), "rotation");
    }
}

#[test]
fn rotation_about_vertical_keeps_floor_results() {
    // A floor node tied to a hanging joint: the floor axis is y, so only
    // rotations about y are symmetries.
    let mut net = rig();
    net.nodes.push(NetNode {
        name: "F".into(),
        position_m: [2.0, 0.0, 1.5],
        fixity: Fixity::Floor { stiffness_n_per_m: 1e6 },
        load_n: [0.0, -800.0, 0.0],
        mass_kg: 0.0,
    });
    let rest = dist(net.nodes[4].position_m, [2.0, 0.0, 1.5]) - 0.01;
    net.members.push(NetMember {
        name: "tie".into(),
        ends: [4, 5],
        axial_stiffness_n: 1e5,
        rest_length_m: rest,
        law: AxialLaw::TensionOnly,
        via: Vec::new(),
        segment_factors: Vec::new(),
    });
    let base = solve_static(&net, &tight()).unwrap();
    let r = rotation([0.0, 1.0, 0.0], 1.1);
    let mut turned = net.clone();
    for n in &mut turned.nodes {
        n.position_m = apply(&r, n.position_m);
        n.load_n = apply(&r, n.load_n);
    }
    let eq = solve_static(&turned, &tight()).unwrap();
    assert_same_forces(&base, &eq, "rotation about y");
    assert!((base.floor_force_n[5] - eq.floor_force_n[5]).abs() <= 1e-9 * 800.0);
}

/// Random rig: anchors above, joints below, each joint hung by tension-only
/// ropes from 2–3 distinct anchors, optional ropes between joints, optional
/// floor node tied to the first joint.
fn random_network() -> impl Strategy<Value = Network> {
    let anchors = prop::collection::vec((-5.0..5.0_f64, 5.0..8.0_f64, -5.0..5.0_f64), 3..6);
    let joints = prop::collection::vec(
        (
            (-4.0..4.0_f64, 0.0..3.0_f64, -4.0..4.0_f64),
            1.0..1000.0_f64,
            prop::collection::vec(0usize..100, 2..4),
            -0.02..0.1_f64,
        ),
        1..5,
    );
    (anchors, joints, any::<bool>(), any::<bool>()).prop_map(|(anchors, joints, link, floor)| {
        let mut net = Network::default();
        for (i, (x, y, z)) in anchors.iter().enumerate() {
            net.nodes.push(NetNode {
                name: format!("A{i}"),
                position_m: [*x, *y, *z],
                fixity: Fixity::Fixed,
                load_n: [0.0; 3],
                mass_kg: 0.0,
            });
        }
        let na = anchors.len();
        for (j, ((x, y, z), mass, picks, slack)) in joints.iter().enumerate() {
            let idx = net.nodes.len();
            net.nodes.push(NetNode {
                name: format!("J{j}"),
                position_m: [*x, *y, *z],
                fixity: Fixity::Free,
                load_n: [0.0, -mass * 9.80665, 0.0],
                mass_kg: *mass,
            });
            let mut used = Vec::new();
            for p in picks {
                let a = p % na;
                if !used.contains(&a) {
                    used.push(a);
                }
            }
            if used.len() < 2 {
                used.push((used[0] + 1) % na);
            }
            for a in used {
                let rest = dist(net.nodes[a].position_m, [*x, *y, *z]) * (1.0 + slack);
                net.members.push(NetMember {
                    name: format!("r{}", net.members.len()),
                    ends: [a, idx],
                    axial_stiffness_n: 1e6,
                    rest_length_m: rest,
                    law: AxialLaw::TensionOnly,
                    via: Vec::new(),
                    segment_factors: Vec::new(),
                });
            }
            if link && j > 0 {
                let rest = dist(net.nodes[idx - 1].position_m, [*x, *y, *z]);
                net.members.push(NetMember {
                    name: format!("l{}", net.members.len()),
                    ends: [idx - 1, idx],
                    axial_stiffness_n: 5e5,
                    rest_length_m: rest,
                    law: AxialLaw::TensionOnly,
                    via: Vec::new(),
                    segment_factors: Vec::new(),
                });
            }
        }
        if floor {
            let j0 = na;
            let p = net.nodes[j0].position_m;
            let fp = [p[0], -1.0, p[2] + 0.5];
            net.nodes.push(NetNode {
                name: "F".into(),
                position_m: fp,
                fixity: Fixity::Floor { stiffness_n_per_m: 1e6 },
                load_n: [0.0, -200.0, 0.0],
                mass_kg: 0.0,
            });
            let idx = net.nodes.len() - 1;
            net.members.push(NetMember {
                name: "tie".into(),
                ends: [j0, idx],
                axial_stiffness_n: 1e5,
                rest_length_m: dist(p, fp) * 0.99,
                law: AxialLaw::TensionOnly,
                via: Vec::new(),
                segment_factors: Vec::new(),
            });
        }
        net
    })
}

proptest! {
    #![proptest_config(ProptestConfig::with_cases(48))]
    #[test]
    fn random_stable_networks_are_in_equilibrium(net in random_network()) {
        let eq = solve_static(&net, &SolveOptions::default()).unwrap();
        let total_load: f64 = net.nodes.iter().map(|n| dist(n.load_n, [0.0; 3])).sum();
        // Tolerance: the solver's own convergence test (1e-9 of Σ|load| per
        // component) plus the roundoff of re-summing member forces here.
        let tol = 1e-9 * total_load + 1e-9;
        let mut net_force = vec![[0.0; 3]; net.nodes.len()];
        for (m, t) in net.members.iter().zip(&eq.member_force_n) {
            let [a, b] = m.ends;
            let l = dist(eq.positions_m[a], eq.positions_m[b]);
            for ax in 0..3 {
                let e = (eq.positions_m[b][ax] - eq.positions_m[a][ax]) / l;
                net_force[a][ax] += t * e;
                net_force[b][ax] -= t * e;
            }
            prop_assert!(*t >= 0.0, "tension-only member in compression: {t}");
        }
        for (i, n) in net.nodes.iter().enumerate() {
            prop_assert!(eq.floor_force_n[i] >= 0.0);
            if matches!(n.fixity, Fixity::Free) {
                for ax in 0..3 {
                    let r = net_force[i][ax] + n.load_n[ax];
                    prop_assert!(r.abs() <= 10.0 * tol, "node {} axis {ax}: out of balance {r}", n.name);
                }
            }
        }
        for ax in 0..3 {
            let reactions: f64 = eq.reaction_n.iter().map(|r| r[ax]).sum();
            let loads: f64 = net.nodes.iter().map(|n| n.load_n[ax]).sum();
            prop_assert!((reactions + loads).abs() <= 10.0 * tol * net.nodes.len() as f64,
                "axis {ax}: Σ reactions {reactions} vs Σ loads {loads}");
        }
        prop_assert!(eq.positions_m.iter().flatten().all(|c| c.is_finite()));
    }
}

/// A flat rig in the plane z = 0.4: a three-leg bridle of ropes to two
/// joints joined by a rod, one leg
/// drawn short that the others unload.
fn flat_rig() -> Network {
    let mut net = Network::default();
    let z = 0.4;
    let mut add = |name: &str, p: [f64; 2], fixity: Fixity, load: f64| {
        net.nodes.push(NetNode {
            name: name.into(),
            position_m: [p[0], p[1], z],
            fixity,
            load_n: [0.0, load, 0.0],
            mass_kg: 0.0,
        })
    };
    add("A1", [0.0, 6.0], Fixity::Fixed, 0.0);
    add("A2", [5.0, 6.5], Fixity::Fixed, 0.0);
    add("A3", [2.0, 7.0], Fixity::Fixed, 0.0);
    add("J1", [1.5, 3.0], Fixity::Free, -4000.0);
    add("J2", [3.5, 2.5], Fixity::Free, -2500.0);
    let members = [
        (0, 3, 5e6, 0.0, AxialLaw::TensionOnly),
        (2, 3, 4e6, 0.02, AxialLaw::TensionOnly),
        (1, 4, 6e6, 0.0, AxialLaw::TensionOnly),
        (3, 4, 2e7, 0.0, AxialLaw::TensionAndCompression),
        (2, 4, 5e6, -0.003, AxialLaw::TensionOnly),
    ];
    connect(&mut net, &members, "f");
    net
}

#[test]
fn flat_network_solved_without_z_matches_the_three_dimensional_solve() {
    use tautspan_core::solve::StaticSolver;
    // The flat form drops the z dofs; turning the same rig about the
    // vertical axis takes it out of any z = const plane, so that solve runs
    // with every dof. Same forces to 1e-9 (as above), the flat positions
    // stay exactly in the plane, and a load out of the plane switches the
    // flat solver to three dimensions and gives the tilted answer.
    let net = flat_rig();
    let loads: Vec<[f64; 3]> = net.nodes.iter().map(|n| n.load_n).collect();
    let mut flat = StaticSolver::new(&net).unwrap();
    assert!(flat.is_flat());
    let base = flat.solve(&loads, None, &tight()).unwrap();
    assert!(base.positions_m.iter().all(|p| p[2] == 0.4), "{:?}", base.positions_m);
    // a slack leg and loaded ones: both branches of the rope law are in play
    assert!(base.member_force_n[4] == 0.0 && base.member_force_n[0] > 0.0, "{:?}", base.member_force_n);

    let r = rotation([0.0, 1.0, 0.0], 0.9);
    let mut turned = net.clone();
    for n in &mut turned.nodes {
        n.position_m = apply(&r, n.position_m);
    }
    let mut full = StaticSolver::new(&turned).unwrap();
    assert!(!full.is_flat());
    let turned_loads: Vec<[f64; 3]> = turned.nodes.iter().map(|n| n.load_n).collect();
    assert_same_forces(&base, &full.solve(&turned_loads, None, &tight()).unwrap(), "flat vs turned");

    let sideways: Vec<[f64; 3]> = loads.iter().map(|l| if l[1] != 0.0 { [0.0, l[1], 300.0] } else { *l }).collect();
    let off = flat.solve(&sideways, None, &tight()).unwrap();
    assert!(!flat.is_flat());
    assert!(off.positions_m[3][2] > 0.4, "{:?}", off.positions_m[3]);
    let fresh = solve_static(
        &Network {
            nodes: net.nodes.iter().zip(&sideways).map(|(n, l)| NetNode { load_n: *l, ..n.clone() }).collect(),
            ..net.clone()
        },
        &tight(),
    )
    .unwrap();
    assert_same_forces(&fresh, &off, "out-of-plane load");
}
