//! Floors under several feet, against hand solutions: feet coupled through
//! the plate (flexibility from the Navier series, T&W §28), contact and
//! lift-off, the shares of a symmetric frame, the friction a leaning leg
//! needs (statics), the point-rating and friction checks, and the located
//! errors of a foot off its panel.

#![allow(clippy::expect_used, clippy::unwrap_used, reason = "test helpers fail loudly on broken fixtures")]

use tautspan_core::analysis::{State, analyse};
use tautspan_core::library::{Edges, PlatePanel, flexural_rigidity, navier_flexibility, point_load_coefficient};
use tautspan_core::model::load_scenario;
use tautspan_core::solve::{
    AxialLaw, Fixity, NetMember, NetNode, NetPlate, Network, SimulateOptions, SimulationStart, SolveOptions, simulate,
    solve_static,
};

const G: f64 = 9.80665;

fn rel(a: f64, b: f64) -> f64 {
    ((a - b) / b).abs()
}

fn node(name: &str, p: [f64; 3], fixity: Fixity, load: [f64; 3]) -> NetNode {
    NetNode { name: name.to_owned(), position_m: p, fixity, load_n: load, mass_kg: 0.0 }
}

/// Two feet on one panel: A loaded with W directly; B hangs from a stiff
/// vertical rod to an anchor and carries a load Q. The plate under B sags
/// by C_BA W from A's load. While Q < k_r C_BA W the rod holds B above the
/// sagged plate: B lifts off (P_B = 0) and the rod carries Q. Above it,
/// contact: B's balance k_r δ + P_B = Q with δ = C_BA W + C_BB P_B gives
/// P_B = (Q − k_r C_BA W) / (1 + k_r C_BB). Small displacements along the
/// rod's axis keep the geometry linear, so the forms are exact to the
/// solver tolerance (1e-9 of the load): 1e-6 claimed.
#[test]
fn coupled_feet_contact_and_lift_off() {
    let d = flexural_rigidity(30e9, 0.15, 0.2);
    let panel = PlatePanel::new(Edges::SimplySupported, [4.0, 4.0], d, &[[1.5, 2.0], [2.8, 2.4]]).unwrap();
    let c = panel.flexibility_m_per_n().to_vec();
    let (caa, cab, cbb) = (c[0], c[1], c[3]);
    let w = 20e3;
    let k_rod = 2e8 / 1.0; // EA / L, L = 1 m
    for q in [0.2 * k_rod * cab * w, 3.0 * k_rod * cab * w] {
        let mut net = Network::default();
        net.nodes.push(node("A", [1.5, 0.0, 2.0], Fixity::Floor { stiffness_n_per_m: 1.0 / caa }, [0.0, -w, 0.0]));
        net.nodes.push(node("B", [2.8, 0.0, 2.4], Fixity::Floor { stiffness_n_per_m: 1.0 / cbb }, [0.0, -q, 0.0]));
        net.nodes.push(node("R", [2.8, 1.0, 2.4], Fixity::Fixed, [0.0; 3]));
        net.members.push(NetMember {
            name: "rod".into(),
            ends: [1, 2],
            axial_stiffness_n: 2e8,
            rest_length_m: 1.0,
            law: AxialLaw::TensionAndCompression,
            via: Vec::new(),
            segment_factors: Vec::new(),
        });
        net.plates.push(NetPlate { name: "slab".into(), nodes: vec![0, 1], flexibility_m_per_n: c.clone() });
        let eq = solve_static(&net, &SolveOptions::default()).unwrap();
        let lifted = q < k_rod * cab * w;
        let pb = if lifted { 0.0 } else { (q - k_rod * cab * w) / (1.0 + k_rod * cbb) };
        assert!(rel(eq.floor_force_n[0], w) < 1e-6, "A {}", eq.floor_force_n[0]);
        if lifted {
            assert_eq!(eq.floor_force_n[1], 0.0);
            // the rod carries Q; B sits above the plate, which has sagged under it
            assert!(rel(eq.member_force_n[0], q) < 1e-6);
            let drop_b = -eq.positions_m[1][1];
            assert!(drop_b < cab * w, "B {drop_b} above the plate {}", cab * w);
        } else {
            assert!(rel(eq.floor_force_n[1], pb) < 1e-6, "B {} vs {pb}", eq.floor_force_n[1]);
        }
        // deflection of A: w_A = C_AA W + C_AB P_B
        assert!(rel(-eq.positions_m[0][1], caa * w + cab * pb) < 1e-6);
    }
}

/// The Newmark integrator with coupled feet: a mass lowered onto two feet
/// from rest with heavy damping settles to the static contact forces, and
/// without damping its energy is kept (drift under 1e-3, the integrator's
/// own bound for the trapezoidal rule on this step).
#[test]
fn coupled_feet_in_the_time_domain() {
    let d = flexural_rigidity(30e9, 0.15, 0.2);
    let panel = PlatePanel::new(Edges::SimplySupported, [4.0, 4.0], d, &[[1.0, 2.0], [3.0, 2.0]]).unwrap();
    let c = panel.flexibility_m_per_n().to_vec();
    let mut net = Network::default();
    let mut a = node("A", [1.0, 0.0, 2.0], Fixity::Floor { stiffness_n_per_m: 1.0 / c[0] }, [0.0, -5e3, 0.0]);
    let mut b = node("B", [3.0, 0.0, 2.0], Fixity::Floor { stiffness_n_per_m: 1.0 / c[3] }, [0.0, -5e3, 0.0]);
    a.mass_kg = 5e3 / G;
    b.mass_kg = 5e3 / G;
    net.nodes = vec![a, b];
    net.plates.push(NetPlate { name: "slab".into(), nodes: vec![0, 1], flexibility_m_per_n: c.clone() });
    let stat = solve_static(&net, &SolveOptions::default()).unwrap();
    let sim = simulate(
        &net,
        &SimulationStart::default(),
        &SimulateOptions { duration_s: 0.05, ..SimulateOptions::default() },
        &mut |_| true,
    )
    .unwrap();
    assert!(sim.energy_drift < 1e-3, "drift {}", sim.energy_drift);
    // undamped from rest under a suddenly applied load: the peak deflection
    // is twice the static one (dynamic factor 2), within 2 % (time step)
    let peak = sim.positions_m.iter().map(|p| -p[0][1]).fold(0.0, f64::max);
    assert!(rel(peak, -2.0 * stat.positions_m[0][1]) < 2e-2, "peak {peak} static {}", -stat.positions_m[0][1]);
}

/// A frame of rods from each foot to a head over the panel centre (2, 2.5, 2).
fn frame(floor_fields: &str, feet: &[(f64, f64)], mass_kg: f64) -> String {
    let names = ["a", "b", "c", "d"];
    let nodes: String = feet
        .iter()
        .zip(names)
        .map(|((x, z), n)| format!(r#"Node(id: "{n}", at: ("{x} m", "0 m", "{z} m"), support: Floor("slab")),"#))
        .collect();
    let legs: String = names[..feet.len()]
        .iter()
        .map(|n| {
            format!(r#"Member(id: "leg-{n}", ends: ("{n}", "head"), kind: Rod, area: "10 cm^2", material: "steel"),"#)
        })
        .collect();
    format!(
        r#"Scenario(format: 1, title: "frame",
        nodes: [ {nodes} Node(id: "head", at: ("2 m", "2.5 m", "2 m")) ],
        members: [ {legs} ],
        floors: [ Floor(id: "slab", span: ("4 m", "4 m"), thickness: "150 mm", modulus: "30 GPa", poisson: 0.2,
                        edges: SimplySupported, {floor_fields}) ],
        masses: [ Mass(id: "load", at: "head", mass: "{mass_kg} kg") ],
        cases: [ Static(id: "s") ])"#
    )
}

fn tripod(floor_fields: &str, feet: [(f64, f64); 3], mass_kg: f64) -> String {
    frame(floor_fields, &feet, mass_kg)
}

/// Four feet at the corners of a square centred on a square SS panel,
/// legs to a head above the centre: the frame and the plate share the
/// panel's symmetry, so each foot carries a quarter of the total (1e-9,
/// roundoff and solver tolerance). Each leg leans at θ from vertical with
/// tan θ = r / h; at a foot, statics gives H = T sin θ and N = T cos θ + half
/// the leg's weight, T the leg's compression: friction_required = H / N
/// (1e-6). Deflection under each foot: the double series Σ_j C_ij N_j
/// (T&W §28, 600 terms each way, normalised to the tabulated centre α as
/// the tool states; 1e-5: the tool sums one direction in closed form and
/// cuts the other at 200 terms, the reference cuts both at 600), and the
/// panel's largest deflection is at least that.
#[test]
fn symmetric_frame_shares_friction_and_deflection() {
    let h = 0.9;
    let feet = [(2.0 - h, 2.0 - h), (2.0 + h, 2.0 - h), (2.0 + h, 2.0 + h), (2.0 - h, 2.0 + h)];
    let text = frame(
        r#"origin: ("0 m", "0 m"), rated_point: "20 kN", rated_uniform: "5 kPa", pad: ("0.2 m", "0.2 m"), friction_limit: 0.9"#,
        &feet,
        900.0,
    );
    let l = load_scenario(&text).unwrap_or_else(|e| panic!("{e}"));
    let a = analyse(&l.scenario);
    let c0 = &a.cases[0];
    let f = &c0.floors[0];
    assert_eq!(f.feet.len(), 4);
    let total = f.normal_force_n;
    let leg = &l.scenario.members[0];
    let half_leg_n = 0.5 * leg.linear_mass.value * l.scenario.rest_length_m(0) * G;
    for (k, foot) in f.feet.iter().enumerate() {
        assert!(rel(foot.normal_force_n, total / 4.0) < 1e-9, "{} {} of {total}", foot.node, foot.normal_force_n);
        let t = -c0.members[k].force_n;
        let (p, q) = (c0.nodes[k].position_m, c0.nodes[4].position_m);
        let len = c0.members[k].length_m;
        let (sin, cos) = (((p[0] - q[0]).powi(2) + (p[2] - q[2]).powi(2)).sqrt() / len, (q[1] - p[1]) / len);
        let mu = (t * sin) / (t * cos + half_leg_n);
        assert!(rel(foot.friction_required.unwrap(), mu) < 1e-6, "{}: {:?} vs {mu}", foot.node, foot.friction_required);
        assert!(rel(foot.bearing_pressure_pa.unwrap(), foot.normal_force_n / 0.04) < 1e-12);
        assert_eq!(foot.state, State::Ok);
    }
    assert!(rel(total, 900.0 * G + 4.0 * 2.0 * half_leg_n) < 1e-9);
    let d = flexural_rigidity(30e9, 0.15, 0.2);
    let centre = navier_flexibility([4.0, 4.0], d, [2.0, 2.0], [2.0, 2.0], 600);
    let norm = point_load_coefficient(Edges::SimplySupported, 4.0, 4.0) * 16.0 / d / centre;
    let w0: f64 = feet
        .iter()
        .map(|&(x, z)| norm * navier_flexibility([4.0, 4.0], d, [feet[0].0, feet[0].1], [x, z], 600))
        .sum::<f64>()
        * total
        / 4.0;
    let node_drop = -c0.nodes[0].position_m[1];
    assert!(rel(node_drop, w0) < 1e-5, "foot drop {node_drop} vs series {w0}");
    assert!(f.deflection_m >= w0 * (1.0 - 1e-9));
    assert!(f.deflection_m < 1.6 * w0);
    assert_eq!(f.state, State::Ok);
}

/// Without a rated point load the feet are unchecked (never ok) and the
/// reason asks for it; a floor with no rating at all too; the total check
/// against the uniform rating stays.
#[test]
fn no_point_rating_is_unchecked() {
    let feet = [(1.0, 1.0), (3.0, 1.0), (2.0, 3.0)];
    for fields in [
        r#"origin: ("0 m", "0 m"), rated_uniform: "5 kPa", friction_limit: 1.0"#,
        r#"origin: ("0 m", "0 m"), friction_limit: 1.0"#,
    ] {
        let l = load_scenario(&tripod(fields, feet, 300.0)).unwrap_or_else(|e| panic!("{e}"));
        let a = analyse(&l.scenario);
        let f = &a.cases[0].floors[0];
        assert_eq!(f.state, State::Unchecked, "{fields}");
        assert!(f.feet.iter().all(|x| x.state == State::Unchecked));
        assert!(f.reason.as_deref().unwrap_or("").contains("rated_point"));
        assert!(!a.all_within());
        // its warning, of the kind floor_unchecked, asks for the rating
        let w = a.cases[0]
            .warning_items
            .iter()
            .find(|w| w.kind == tautspan_core::analysis::WarningKind::FloorUnchecked)
            .expect("a floor_unchecked warning");
        assert!(w.message.contains("UNCHECKED") && w.message.contains("rated_point"), "{}", w.message);
        if fields.contains("rated_uniform") {
            assert!(rel(f.total_allowable_n.unwrap(), 5e3 * 16.0) < 1e-12);
        } else {
            assert!(f.total_allowable_n.is_none());
        }
    }
}

/// A foot that needs more friction than the floor's limit is over: the
/// tripod's legs lean at r/h = 0.48 (less the legs' own weight at the
/// feet: about 0.46) against a limit of 0.2 (EN 1993-1-8 §6.2.2(6), the
/// default): over, a warning naming the foot, the needed μ and the limit,
/// and the verdict is not within.
#[test]
fn friction_over_the_limit_is_a_fault() {
    let r = 1.2;
    let feet = [(2.0, 2.0 + r), (2.0 - r * 0.866, 2.0 - r * 0.5), (2.0 + r * 0.866, 2.0 - r * 0.5)];
    let l = load_scenario(&tripod(r#"origin: ("0 m", "0 m"), rated_point: "20 kN""#, feet, 600.0))
        .unwrap_or_else(|e| panic!("{e}"));
    let a = analyse(&l.scenario);
    let f = &a.cases[0].floors[0];
    assert!(f.feet.iter().all(|x| x.state == State::Over));
    assert_eq!(f.state, State::Over);
    assert!(rel(f.friction_limit, 0.2) < 1e-12);
    let warn = a.cases[0].warnings.iter().find(|w| w.contains("foot a needs friction")).expect("friction warning");
    assert!(warn.contains("0.45") && warn.contains("limit 0.2") && warn.contains("over by"), "{warn}");
    assert!(!a.all_within());
}

/// A foot off its panel is a located error naming the node, its (x, z) and
/// the panel's extent; without an origin the panel is centred under the
/// feet and the assumptions say so.
#[test]
fn foot_off_the_panel_and_missing_origin() {
    let feet = [(1.0, 1.0), (3.0, 1.0), (2.0, 3.0)];
    let err = load_scenario(&tripod(r#"origin: ("2 m", "0 m"), rated_point: "20 kN""#, feet, 300.0)).unwrap_err();
    let msg = err.to_string();
    assert!(msg.contains("foot \"a\"") && msg.contains("(1 m, 1 m)") && msg.contains("x 2 to 6 m"), "{msg}");
    assert!(msg.contains("nodes[0].at"), "{msg}");
    let l = load_scenario(&tripod(r#"rated_point: "20 kN""#, feet, 300.0)).unwrap_or_else(|e| panic!("{e}"));
    let f = &l.scenario.floors[0];
    assert!(!f.origin_given);
    assert!(rel(f.origin[0].value, 0.0 + 1e-300) < 1e-9 || f.origin[0].value.abs() < 1e-12);
    assert!((f.origin[1].value - (5.0 / 3.0 - 2.0)).abs() < 1e-12);
    let a = analyse(&l.scenario);
    assert!(a.assumptions.iter().any(|s| s.contains("slab") && s.contains("no origin")), "{:?}", a.assumptions);
}

/// Every output shows the feet: JSON `feet[]` with the contract's fields
/// (DESIGN.md "Format 1 additions"), a CSV row per foot, the text table and
/// the report's feet table; the scope names the coupled feet and friction.
#[test]
fn outputs_show_the_feet() {
    let h = 0.9;
    let feet = [(2.0 - h, 2.0 - h), (2.0 + h, 2.0 - h), (2.0 + h, 2.0 + h), (2.0 - h, 2.0 + h)];
    let text = frame(r#"origin: ("0 m", "0 m"), rated_point: "20 kN", friction_limit: 0.9"#, &feet, 500.0);
    let l = load_scenario(&text).unwrap_or_else(|e| panic!("{e}"));
    let a = analyse(&l.scenario);
    let j = tautspan_core::output::check_json("f.ron", &a);
    let jf = &j["cases"][0]["floors"][0];
    let f = &a.cases[0].floors[0];
    assert_eq!(jf["feet"].as_array().map(Vec::len), Some(4));
    for (x, r) in jf["feet"].as_array().unwrap().iter().zip(&f.feet) {
        assert_eq!(x["node"], r.node.as_str());
        assert!(rel(x["normal_force_n"].as_f64().unwrap(), r.normal_force_n) < 1e-12);
        assert!(rel(x["friction_required"].as_f64().unwrap(), r.friction_required.unwrap()) < 1e-12);
        assert_eq!(x["state"], "ok");
    }
    assert!(rel(jf["normal_force_n"].as_f64().unwrap(), f.normal_force_n) < 1e-12);
    let csv = tautspan_core::output::check_csv_rows("f.ron", &a);
    assert_eq!(csv.lines().filter(|l| l.contains(",foot,")).count(), 4);
    assert!(csv.contains("slab/a,foot,"));
    let txt = tautspan_core::output::check_text("f.ron", &a);
    assert!(txt.contains("horizontal kN") && txt.contains("friction"));
    let html = tautspan_core::report::html(&l.scenario, &a, "2026-12-04");
    assert!(html.contains("case-feet"), "report has no feet table");
    assert!(a.scope.checked.iter().any(|c| c.contains("feet coupled") && c.contains("rated_point")));
    assert!(a.scope.checked.iter().any(|c| c.contains("friction")));
    assert!(a.scope.not_checked.iter().any(|c| c.contains("punching shear")));
}

/// A foot that has lifted off yet needs a horizontal reaction is a fault:
/// foot b hangs from an inclined stiff rod to an anchor, so its own share of
/// the rod's weight is carried by the rod (which also pulls it sideways),
/// while a crate on foot a sags the plate away from under b (coupling:
/// C_ba W ≫ b's settlement on the rod). b carries no normal force, its
/// state is over and the warning names it.
#[test]
fn lifted_foot_with_a_horizontal_reaction_is_reported() {
    let text = r#"Scenario(format: 1, title: "lifted",
        nodes: [
            Node(id: "a", at: ("1.8 m", "0 m", "2 m"), support: Floor("slab")),
            Node(id: "b", at: ("2.4 m", "0 m", "2 m"), support: Floor("slab")),
            Node(id: "r", at: ("3.0 m", "1 m", "2 m"), support: Anchor),
        ],
        members: [ Member(id: "stay", ends: ("b", "r"), kind: Rod, area: "20 cm^2", material: "steel") ],
        floors: [ Floor(id: "slab", span: ("4 m", "4 m"), origin: ("0 m", "0 m"), thickness: "150 mm", modulus: "30 GPa",
                        poisson: 0.2, edges: SimplySupported, rated_point: "50 kN", friction_limit: 0.9) ],
        masses: [ Mass(id: "crate", at: "a", mass: "2000 kg") ],
        cases: [ Static(id: "s") ])"#;
    let l = load_scenario(text).unwrap_or_else(|e| panic!("{e}"));
    let a = analyse(&l.scenario);
    let f = &a.cases[0].floors[0];
    let (fa, fb) = (&f.feet[0], &f.feet[1]);
    assert!(rel(fa.normal_force_n, 2000.0 * G) < 1e-6);
    assert_eq!(fb.normal_force_n, 0.0);
    assert!(fb.friction_required.is_none());
    assert!(fb.horizontal_n > 0.0);
    assert_eq!(fb.state, State::Over);
    assert_eq!(f.state, State::Over);
    assert!(a.cases[0].warnings.iter().any(|w| w.contains("foot b has lifted off yet needs a horizontal reaction")));
    // its kind: a foot over on friction
    assert!(a.cases[0].warning_items.iter().any(|w| w.kind == tautspan_core::analysis::WarningKind::FootOver
        && w.message.contains("foot b has lifted off yet needs a horizontal reaction")));
    // its subject is the foot (a group names the feet, not the floor once a foot)
    assert!(
        a.cases[0]
            .warning_items
            .iter()
            .any(|w| w.kind == tautspan_core::analysis::WarningKind::FootOver && w.subject.as_deref() == Some("b"))
    );
    // the plate under b still deflects from a's load
    let panel = l.scenario.floors[0].plate.as_ref().unwrap();
    assert!(panel.deflection_at(&[fa.normal_force_n, 0.0], [2.4, 2.0]) > 0.0);
}
