//! Where a rig is drawn changes nothing: the solver works in displacements
//! from the drawing and sets its tolerance from forces and stiffnesses, so
//! the same rig drawn in site coordinates 10 km from zero gives the same
//! forces, utilisations and displacements, and converges as fast.
//!
//! Tolerance of the comparisons: 1e-9 relative to the largest value of that
//! quantity in the case (the issue's bound). What remains after a shift is
//! the rounding of the shifted input coordinates (ulp(10 km) ≈ 1.8e-12 m on
//! members of 0.1 m or more: ≈ 2e-11 relative) and the solver's convergence
//! (1e-9 of the load on the out-of-balance force, in practice far below it
//! after the last Newton step). The limit searches close their brackets to
//! 1e-7 on the factor (`analysis::limits`), so limits are compared to 1e-6.

#![allow(clippy::expect_used, clippy::unwrap_used, reason = "test helpers fail loudly on broken fixtures")]

use proptest::prelude::*;
use tautspan_core::analysis::{Analysis, analyse};
use tautspan_core::file::Qty;
use tautspan_core::model::{Scenario, build, load_scenario, to_network};
use tautspan_core::solve::{SolveOptions, solve_static};

fn example(name: &str) -> String {
    std::fs::read_to_string(format!("{}/../../scenarios/{name}", env!("CARGO_MANIFEST_DIR"))).expect("example")
}

/// Every example scenario's file name.
fn examples() -> Vec<String> {
    let dir = format!("{}/../../scenarios", env!("CARGO_MANIFEST_DIR"));
    let mut names: Vec<String> = std::fs::read_dir(dir)
        .expect("scenarios")
        .filter_map(|e| e.ok())
        .map(|e| e.file_name().to_string_lossy().into_owned())
        .filter(|n| n.ends_with(".ron"))
        .collect();
    names.sort();
    names
}

/// The scenario of `text` as drawn, and with every node (and every floor's
/// plan corner) moved by `shift`, m.
fn shifted(text: &str, shift: [f64; 3]) -> (Scenario, Scenario) {
    let loaded = load_scenario(text).unwrap_or_else(|e| panic!("{e}"));
    let mut dto = loaded.dto.clone();
    let q = |v: f64| Qty::new(format!("{v:e} m"));
    for (n, m) in dto.nodes.iter_mut().zip(&loaded.scenario.nodes) {
        n.at.x = q(m.position[0].value + shift[0]);
        n.at.y = q(m.position[1].value + shift[1]);
        n.at.z = Some(q(m.position[2].value + shift[2]));
    }
    for (f, m) in dto.floors.iter_mut().zip(&loaded.scenario.floors) {
        if f.origin.is_some() {
            f.origin = Some((q(m.origin[0].value + shift[0]), q(m.origin[1].value + shift[2])));
        }
    }
    let moved = build(&dto).unwrap_or_else(|e| panic!("{e:?}"));
    (loaded.scenario, moved)
}

/// The analyses of `text` as drawn and moved by `shift`.
fn analyse_shifted(text: &str, shift: [f64; 3]) -> (Analysis, Analysis) {
    let (a, b) = shifted(text, shift);
    (analyse(&a), analyse(&b))
}

/// `a` and `b` agree to `rel` of the largest magnitude among `scale`.
fn close(a: f64, b: f64, scale: f64, rel: f64) -> bool {
    (a - b).abs() <= rel * scale.max(f64::MIN_POSITIVE) || a == b
}

fn largest(v: impl Iterator<Item = f64>) -> f64 {
    v.fold(0.0, |m, x| m.max(x.abs()))
}

/// Every case of `a` and `b` agrees: solved or not alike; member forces,
/// utilisations, stretches and lengths; floor forces; reactions; the
/// dynamic load; limits.
fn assert_same(a: &Analysis, b: &Analysis, what: &str) {
    assert_eq!(a.cases.len(), b.cases.len());
    assert_eq!(a.verdict(), b.verdict(), "{what}: verdict");
    for (ca, cb) in a.cases.iter().zip(&b.cases) {
        let w = format!("{what}, case {}", ca.id);
        assert_eq!(ca.error, cb.error, "{w}: error");
        assert_eq!(ca.converged, cb.converged, "{w}: converged");
        let f = largest(ca.members.iter().map(|m| m.force_n));
        let u = largest(ca.members.iter().map(|m| m.utilisation));
        let s = largest(ca.members.iter().map(|m| m.stretch_m));
        for (ma, mb) in ca.members.iter().zip(&cb.members) {
            assert!(
                close(ma.force_n, mb.force_n, f, 1e-9),
                "{w}: member {} force {} vs {}",
                ma.id,
                ma.force_n,
                mb.force_n
            );
            assert!(
                close(ma.utilisation, mb.utilisation, u, 1e-9),
                "{w}: member {} utilisation {} vs {}",
                ma.id,
                ma.utilisation,
                mb.utilisation
            );
            assert!(
                close(ma.stretch_m, mb.stretch_m, s, 1e-9),
                "{w}: member {} stretch {} vs {}",
                ma.id,
                ma.stretch_m,
                mb.stretch_m
            );
            assert_eq!(ma.state, mb.state, "{w}: member {} state", ma.id);
        }
        let nf = largest(ca.floors.iter().map(|x| x.normal_force_n));
        let nd = largest(ca.floors.iter().map(|x| x.deflection_m));
        for (fa, fb) in ca.floors.iter().zip(&cb.floors) {
            assert!(close(fa.normal_force_n, fb.normal_force_n, nf, 1e-9), "{w}: floor {}", fa.id);
            assert!(close(fa.deflection_m, fb.deflection_m, nd, 1e-9), "{w}: floor {} deflection", fa.id);
        }
        let r = largest(ca.supports.iter().flat_map(|x| x.reaction_n));
        for (sa, sb) in ca.supports.iter().zip(&cb.supports) {
            for ax in 0..3 {
                assert!(close(sa.reaction_n[ax], sb.reaction_n[ax], r, 1e-9), "{w}: reaction at {}", sa.node);
            }
        }
        if let (Some(da), Some(db)) = (&ca.dynamic, &cb.dynamic) {
            assert!(close(da.factor, db.factor, da.factor, 1e-9), "{w}: dynamic factor {} vs {}", da.factor, db.factor);
        }
        // limits compared as the load factors they stand for: the height
        // of a drop factor f is W((f − 1)² − 1)/(2k), whose relative change is
        // 2(f − 1)/(f(f − 2)) times the factor's, unbounded near f = 2 (and
        // a release angle's likewise near factor 1), so the factor is the
        // well-conditioned quantity the search closes on
        let release = |d: Option<f64>| d.map(|d| 3.0 - 2.0 * d.to_radians().cos());
        let drop = |c: &tautspan_core::analysis::CaseResult| {
            let k = c.dynamic.as_ref().and_then(|d| d.path_stiffness_n_per_m);
            let wt = c.dynamic.as_ref().map(|d| d.load_n / d.factor);
            c.limits.drop_height_m.map(|h| match (k, wt) {
                (Some(k), Some(wt)) => 1.0 + (1.0 + 2.0 * k * h / wt).sqrt(),
                _ => h,
            })
        };
        for (la, lb) in [(release(ca.limits.release_deg), release(cb.limits.release_deg)), (drop(ca), drop(cb))] {
            match (la, lb) {
                (Some(x), Some(y)) => assert!(close(x, y, x, 1e-6), "{w}: limit {x} vs {y}"),
                (x, y) => assert_eq!(x, y, "{w}: limit"),
            }
        }
    }
}

// Every example moved 10 km along each axis and along all three at once.
#[test]
fn examples_moved_ten_km_give_the_same_answers() {
    for name in examples() {
        let text = example(&name);
        for shift in [[1e4, 0.0, 0.0], [0.0, 1e4, 0.0], [0.0, 0.0, -1e4], [-1e4, 1e4, 1e4]] {
            let (a, b) = analyse_shifted(&text, shift);
            assert!(a.cases.iter().all(|c| c.converged), "{name} as drawn: {:?}", a.warnings);
            assert_same(&a, &b, &format!("{name} moved {shift:?}"));
        }
    }
}

// One rod of 10 mm between site coordinates near 100 m: as quick as at the
// origin (it used to stall at 500 iterations), and its force the weight
// (statics of one vertical two-force member, to 1e-9: the solver's tolerance).
#[test]
fn short_rod_far_from_zero_converges_as_at_the_origin() {
    let rod = |x: f64, y: f64| {
        format!(
            r#"Scenario(format: 1, title: "rod",
            nodes: [ Node(id: "A", at: ("{x} m", "{} m"), support: Anchor), Node(id: "M", at: ("{x} m", "{y} m")) ],
            members: [ Member(id: "r", ends: ("A", "M"), kind: Rod, area: "100 mm^2", modulus: "200 GPa", rating: Yield("235 MPa")) ],
            masses: [ Mass(id: "load", at: "M", mass: "100 kg") ],
            cases: [ Static(id: "s") ])"#,
            y + 0.01
        )
    };
    let w = 100.0 * 9.80665;
    let mut iterations = Vec::new();
    for (x, y) in [(0.0, 0.0), (100.0, 100.0), (1e4, -1e4)] {
        let a = analyse(&load_scenario(&rod(x, y)).unwrap().scenario);
        let c = &a.cases[0];
        assert!(c.converged && c.error.is_none(), "at ({x}, {y}): {:?}", c.error);
        assert!(((c.members[0].force_n - w) / w).abs() < 1e-9, "at ({x}, {y}): {}", c.members[0].force_n);
        iterations.push(c.iterations);
    }
    assert!(iterations.iter().all(|&i| i <= iterations[0] + 2), "iterations {iterations:?}");
}

// A chain of 1,000 rods of 0.1 m hung from (0, 100 m) with 100 kg at its
// foot. Statics: every link carries the weight W below it (massless
// links: `area`/`modulus` given, no own weight); Hooke's law: the foot
// drops W·L/(EA) per link, 1000·W·0.1/(EA) in all. Forces to 1e-6: each
// of the 1000 joints may keep the solver's 1e-9 W of out-of-balance
// force, and the top link carries the sum of them; the drop to 1e-6 for
// the same reason.
#[test]
fn thousand_link_rod_chain_converges() {
    let n = 1000;
    let nodes: Vec<String> = (0..=n)
        .map(|i| {
            let y = 100.0 - 0.1 * i as f64;
            if i == 0 {
                format!(r#"Node(id: "N0", at: ("0 m", "{y} m"), support: Anchor)"#)
            } else {
                format!(r#"Node(id: "N{i}", at: ("0 m", "{y} m"))"#)
            }
        })
        .collect();
    let members: Vec<String> = (0..n)
        .map(|i| {
            format!(
                r#"Member(id: "L{i}", ends: ("N{i}", "N{}"), kind: Rod, area: "100 mm^2", modulus: "200 GPa", rating: Yield("235 MPa"))"#,
                i + 1
            )
        })
        .collect();
    let text = format!(
        r#"Scenario(format: 1, title: "chain", nodes: [{}], members: [{}],
        masses: [ Mass(id: "load", at: "N{n}", mass: "100 kg") ], cases: [ Static(id: "s") ])"#,
        nodes.join(", "),
        members.join(", ")
    );
    let s = load_scenario(&text).unwrap().scenario;
    let (net, _) = to_network(&s);
    let eq = solve_static(&net, &SolveOptions::default()).unwrap_or_else(|e| panic!("{e}"));
    let w = 100.0 * 9.80665;
    for (i, f) in eq.member_force_n.iter().enumerate() {
        assert!(((f - w) / w).abs() < 1e-6, "link {i}: {f} vs {w}");
    }
    let ea = 100e-6 * 200e9;
    let expected = -(n as f64) * w * 0.1 / ea;
    let got = eq.displacements_m[n][1];
    assert!(((got - expected) / expected).abs() < 1e-6, "foot drop {got} vs {expected}");
    let a = analyse(&s);
    assert!(a.cases[0].converged && a.cases[0].error.is_none(), "{:?}", a.cases[0].error);
}

/// A small rig as scenario text: three or four anchors at the top, one or
/// two joints held from every anchor by a rod (so each joint has one
/// equilibrium: a rig free to turn, such as a triangle hung from one point,
/// has many, and the solver may find any of them), a wire rope between
/// the joints, a mass on each joint; drawn at `origin`.
fn small_rig(origin: [f64; 3], anchors: &[(f64, f64, f64)], joints: &[(f64, f64, f64, f64)], rod: bool) -> String {
    let p = |x: f64, y: f64, z: f64| {
        format!(r#"("{:e} m", "{:e} m", "{:e} m")"#, origin[0] + x, origin[1] + y, origin[2] + z)
    };
    let mut nodes = Vec::new();
    for (i, &(x, y, z)) in anchors.iter().enumerate() {
        nodes.push(format!(r#"Node(id: "A{i}", at: {}, support: Anchor)"#, p(x, y, z)));
    }
    let mut members = Vec::new();
    let mut masses = Vec::new();
    for (j, &(x, y, z, kg)) in joints.iter().enumerate() {
        nodes.push(format!(r#"Node(id: "J{j}", at: {})"#, p(x, y, z)));
        for i in 0..anchors.len() {
            members.push(format!(
                r#"Member(id: "r{j}{i}", ends: ("A{i}", "J{j}"), kind: Rod, area: "50 mm^2", modulus: "200 GPa", rating: Yield("235 MPa"))"#
            ));
        }
        masses.push(format!(r#"Mass(id: "m{j}", at: "J{j}", mass: "{kg} kg")"#));
    }
    if rod && joints.len() > 1 {
        members.push(
            r#"Member(id: "tie", ends: ("J0", "J1"), kind: WireRope, area: "50 mm^2", modulus: "100 GPa", rating: BreakingStrength("80 kN"), may_go_slack: true)"#
                .to_string(),
        );
    }
    format!(
        r#"Scenario(format: 1, title: "small", nodes: [{}], members: [{}], masses: [{}], cases: [ Static(id: "s"), Sudden(id: "sudden", mass: "m0") ])"#,
        nodes.join(", "),
        members.join(", "),
        masses.join(", ")
    )
}

proptest! {
    #![proptest_config(ProptestConfig::with_cases(24))]
    // Generated small rigs, moved by up to 10 km in x, y and z.
    #[test]
    fn small_rigs_moved_up_to_ten_km_give_the_same_answers(
        anchors in prop::collection::vec((-3.0..3.0_f64, 4.0..6.0_f64, -3.0..3.0_f64), 3..5),
        joints in prop::collection::vec((-1.5..1.5_f64, 0.5..3.0_f64, -1.5..1.5_f64, 10.0..500.0_f64), 1..3),
        rod in any::<bool>(),
        shift in (-1e4..1e4_f64, -1e4..1e4_f64, -1e4..1e4_f64),
    ) {
        let at = small_rig([0.0; 3], &anchors, &joints, rod);
        let moved = small_rig([shift.0, shift.1, shift.2], &anchors, &joints, rod);
        let a = analyse(&load_scenario(&at).unwrap().scenario);
        let b = analyse(&load_scenario(&moved).unwrap().scenario);
        prop_assume!(a.cases.iter().all(|c| c.converged && c.error.is_none()));
        assert_same(&a, &b, "small rig");
    }
}

// The displacements themselves, from the solver, for every example: the
// same to 1e-9 of the largest, 10 km away (positions − drawn would keep
// only ~1e-12 m of them there).
#[test]
fn displacements_are_kept_far_from_zero() {
    for name in examples() {
        let (near, far) = shifted(&example(&name), [1e4, -1e4, 1e4]);
        let solve = |s: &Scenario| {
            let (net, loads) = to_network(s);
            tautspan_core::solve::StaticSolver::new(&net)
                .and_then(|mut sv| sv.solve(&loads.total_n, None, &SolveOptions::default()))
                .unwrap_or_else(|e| panic!("{name}: {e}"))
        };
        let (a, b) = (solve(&near), solve(&far));
        let scale = largest(a.displacements_m.iter().flatten().copied());
        assert!(scale > 0.0, "{name}");
        for (i, (da, db)) in a.displacements_m.iter().zip(&b.displacements_m).enumerate() {
            for ax in 0..3 {
                assert!(close(da[ax], db[ax], scale, 1e-9), "{name}: node {i} axis {ax}: {} vs {}", da[ax], db[ax]);
            }
        }
    }
}

// The time-domain run works in the same displacements: the gantry's swing,
// 1 s of it, moved 10 km, gives the same peak member forces. Tolerance
// 1e-6 of the largest peak: each of the run's steps closes its Newton
// iteration to 1e-9 of the load, and those differences add up over the
// steps.
#[test]
fn a_swing_simulated_far_from_zero_peaks_alike() {
    use tautspan_core::analysis::{SimulateRequest, simulate_case};
    let (near, far) = shifted(&example("gantry-swing.ron"), [1e4, 1e4, -1e4]);
    let req = SimulateRequest { duration_s: 1.0, ..SimulateRequest::default() };
    let run = |s: &Scenario| simulate_case(s, "swing-25", &req, &mut |_| true).unwrap_or_else(|e| panic!("{e}"));
    let (a, b) = (run(&near), run(&far));
    let peak = largest(a.run.peak_member_force_n.iter().copied());
    assert!(peak > 0.0);
    for (i, (pa, pb)) in a.run.peak_member_force_n.iter().zip(&b.run.peak_member_force_n).enumerate() {
        assert!(close(*pa, *pb, peak, 1e-6), "member {i}: peak {pa} vs {pb}");
    }
    // its positions are in the file's coordinates, the shift and all
    let (pa, pb) = (a.run.positions_m.last().unwrap(), b.run.positions_m.last().unwrap());
    for (p, q) in pa.iter().zip(pb) {
        for (ax, d) in [1e4, 1e4, -1e4].iter().enumerate() {
            assert!((q[ax] - p[ax] - d).abs() < 1e-6, "{p:?} vs {q:?}");
        }
    }
}
