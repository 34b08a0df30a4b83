//! A generated square net for the end-to-end tests and benchmarks (one
//! generator for both): `n` × `n` joints in the horizontal x–z plane at
//! 1 m pitch, the edge joints anchored, wire rope between every pair of
//! neighbours (10 mm², 100 GPa: EA = 1 MN, drawn 1 % longer than its
//! unstretched length, so the net is pretensioned), a mass of `mass` at
//! every interior joint, and one static case. The rope's own weight is not
//! given (area and modulus only), so every member's own weight is left out:
//! the rig a new user draws first. 71 × 71 gives 9,940 members and 4,761
//! masses.

use std::fmt::Write;

pub fn grid_net(n: usize, mass: &str) -> String {
    let edge = |i: usize, j: usize| i == 0 || j == 0 || i + 1 == n || j + 1 == n;
    let mut s = String::with_capacity(n * n * 260);
    s.push_str("Scenario(format: 1, title: \"generated square net\", nodes: [\n");
    for i in 0..n {
        for j in 0..n {
            let support = if edge(i, j) { ", support: Anchor" } else { "" };
            let _ = writeln!(s, "Node(id: \"n{i}_{j}\", at: (\"{i} m\", \"0 m\", \"{j} m\"){support}),");
        }
    }
    s.push_str("], members: [\n");
    let rope = "kind: WireRope, area: \"10 mm^2\", modulus: \"100 GPa\", rating: BreakingStrength(\"200 kN\"), slack: \"-0.01 m\"";
    for i in 0..n {
        for j in 0..n {
            if i + 1 < n {
                let _ = writeln!(s, "Member(id: \"x{i}_{j}\", ends: (\"n{i}_{j}\", \"n{}_{j}\"), {rope}),", i + 1);
            }
            if j + 1 < n {
                let _ = writeln!(s, "Member(id: \"z{i}_{j}\", ends: (\"n{i}_{j}\", \"n{i}_{}\"), {rope}),", j + 1);
            }
        }
    }
    s.push_str("], masses: [\n");
    for i in 1..n.saturating_sub(1) {
        for j in 1..n.saturating_sub(1) {
            let _ = writeln!(s, "Mass(id: \"m{i}_{j}\", at: \"n{i}_{j}\", mass: \"{mass}\"),");
        }
    }
    s.push_str("], cases: [Static(id: \"hanging\")])\n");
    s
}
