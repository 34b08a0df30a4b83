//! The streamed time-domain run: the same run as the one kept in memory
//! across its chunk boundaries, memory bounded by the chunk, the step cap,
//! the coarse-step note against the closed-form period, cancellation.

#![allow(clippy::unwrap_used, clippy::expect_used, reason = "tests fail loudly")]

use tautspan_core::analysis::{
    COARSE_STEP_FRACTION, MAX_SIMULATE_STEPS, SimulateRequest, check_step_cap, plan_simulation, simulate_case,
};
use tautspan_core::model::load_scenario;

fn rel(a: f64, b: f64) -> f64 {
    (a - b).abs() / b.abs().max(1e-300)
}

fn gantry() -> tautspan_core::model::Scenario {
    let text =
        std::fs::read_to_string(concat!(env!("CARGO_MANIFEST_DIR"), "/../../scenarios/gantry-swing.ron")).unwrap();
    load_scenario(&text).unwrap().scenario
}

// One long run kept in memory against the streamed run in chunks of at
// most 4,096 steps (8,000 steps here: two chunks). Each chunk starts from
// the last one's positions and trapezoidal velocities, and its starting
// acceleration from the equation of motion, which the long run satisfies
// to the Newton tolerance at every step; so the two agree far inside the
// 1e-6 relative tolerance used for the peaks and the period.
#[test]
fn streamed_run_matches_the_run_kept_in_memory_across_chunks() {
    let s = gantry();
    let req = SimulateRequest { duration_s: 8.0, time_step_s: Some(1e-3), damping_per_s: 0.0 };
    let whole = simulate_case(&s, "swing-25", &req, &mut |_| true).unwrap();
    let plan = plan_simulation(&s, "swing-25", &req).unwrap();
    assert_eq!(plan.steps, 8000);
    let mut times = Vec::new();
    let mut last_forces = Vec::new();
    let sum = plan
        .run(
            &mut |x| {
                times.push(x.time_s);
                last_forces = x.member_force_n.to_vec();
                true
            },
            &mut |_| true,
        )
        .unwrap();
    assert_eq!(sum.steps, whole.run.steps);
    // every step once, in order, none repeated at a chunk boundary
    assert_eq!(times.len(), 8001);
    assert!(times.windows(2).all(|w| (w[1] - w[0] - 1e-3).abs() < 1e-12));
    for (k, id) in plan.member_ids.iter().enumerate() {
        let (a, b) = (sum.peak_member_force_n[k], whole.run.peak_member_force_n[k]);
        assert!(rel(a, b) < 1e-6, "{id}: streamed peak {a} against {b}");
        let (fa, fb) = (last_forces[k], *whole.run.member_force_n.last().unwrap().get(k).unwrap());
        assert!((fa - fb).abs() < 1e-6 * b, "{id}: last force {fa} against {fb}");
    }
    let (pa, pb) = (sum.period_s.unwrap(), whole.period_s.unwrap());
    assert!(rel(pa, pb) < 1e-6, "period {pa} against {pb}");
    // the drift is measured over the whole run in both (energy to the
    // integrator's own accuracy: both far below 1e-4)
    assert!(sum.energy_drift < 1e-4 && whole.run.energy_drift < 1e-4);
    assert!(rel(sum.energy_drift.max(1e-12), whole.run.energy_drift.max(1e-12)) < 0.05);
}

const ONE_ROD: &str = r#"Scenario(format: 1, title: "one rod",
    nodes: [ Node(id: "A", at: ("0 m", "2 m"), support: Anchor), Node(id: "B", at: ("0 m", "0 m")) ],
    members: [ Member(id: "rod", ends: ("A", "B"), kind: Rod, area: "100 mm^2", modulus: "200 GPa",
                      rating: Yield("235 MPa"), design_factor: 2.0) ],
    masses: [ Mass(id: "m", at: "B", mass: "250 kg") ],
    cases: [ Static(id: "s"), Sudden(id: "sudden", mass: "m") ],
)"#;

// The coarse-step rule against the closed form of a spring and mass,
// T = 2π √(m / k), k = EA / L (any dynamics text): 200 GPa × 100 mm² over
// 2 m is 1e7 N/m; 250 kg on it rings at 2π √(2.5e-5) = 31.4159 ms. A step
// just over a tenth of that is noted, naming the member and the mass; just
// under is not. Tolerance 1e-12 on T: the same closed form, floating point.
#[test]
fn coarse_step_is_noted_against_the_closed_form_period() {
    let s = load_scenario(ONE_ROD).unwrap().scenario;
    let t = 2.0 * std::f64::consts::PI * (250.0_f64 / (200e9 * 100e-6 / 2.0)).sqrt();
    let at = |dt: f64| {
        let req = SimulateRequest { duration_s: 1.0, time_step_s: Some(dt), damping_per_s: 0.0 };
        plan_simulation(&s, "sudden", &req).unwrap()
    };
    let coarse = at(1.01 * COARSE_STEP_FRACTION * t);
    let p = coarse.shortest.as_ref().unwrap();
    assert_eq!((p.member.as_str(), p.node.as_str()), ("rod", "B"));
    assert!(rel(p.mass_kg, 250.0) < 1e-12, "no own weight on a rod without material: {}", p.mass_kg);
    assert!(rel(p.period_s, t) < 1e-12, "{} against {t}", p.period_s);
    assert_eq!(coarse.warnings.len(), 1);
    assert!(
        coarse.warnings[0].contains("member rod") && coarse.warnings[0].contains("0.03142 s"),
        "{:?}",
        coarse.warnings
    );
    assert!(at(0.99 * COARSE_STEP_FRACTION * t).warnings.is_empty());
    // the automatic step is never coarser than the rule
    let auto = plan_simulation(&s, "sudden", &SimulateRequest::default()).unwrap();
    assert!(auto.time_step_s <= COARSE_STEP_FRACTION * t && auto.warnings.is_empty());
    // a 0.5 s step on it: about 16 steps a period too coarse, and said so
    assert!(at(0.5).warnings[0].contains("0.5 s is coarser"));
}

#[test]
fn a_billion_steps_are_refused_before_the_run_is_prepared() {
    let e = check_step_cap(1.0, 1e-9).unwrap_err();
    assert!(e.contains("1,000,000,000 steps") && e.contains("cap is 10,000,000 steps"), "{e}");
    assert_eq!(check_step_cap(10.0, 1e-6).unwrap(), MAX_SIMULATE_STEPS);
    assert!(check_step_cap(1.0, -1e-3).unwrap_err().contains("positive"));
    let s = load_scenario(ONE_ROD).unwrap().scenario;
    let req = SimulateRequest { duration_s: 1.0, time_step_s: Some(1e-9), damping_per_s: 0.0 };
    let e = plan_simulation(&s, "sudden", &req).err().unwrap().to_string();
    assert!(e.contains("cap is 10,000,000 steps"), "{e}");
}

#[test]
fn cancelled_run_stops_and_says_so() {
    let s = gantry();
    let req = SimulateRequest { duration_s: 8.0, time_step_s: Some(1e-3), damping_per_s: 0.0 };
    let plan = plan_simulation(&s, "swing-25", &req).unwrap();
    let mut samples = 0usize;
    let sum = plan
        .run(
            &mut |_| {
                samples += 1;
                true
            },
            &mut |f| f < 0.3,
        )
        .unwrap();
    assert!(sum.cancelled);
    assert!(sum.steps > 0 && sum.steps < plan.steps, "{} of {}", sum.steps, plan.steps);
    assert_eq!(samples, sum.steps + 1, "each step run reached the sink");
    // a failing sink stops the run too
    let sum = plan.run(&mut |x| x.time_s < 0.5, &mut |_| true).unwrap();
    assert!(sum.sink_failed && !sum.cancelled && sum.steps < plan.steps);
}
