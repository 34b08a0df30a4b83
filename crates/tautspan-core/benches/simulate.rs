//! Simulation benchmark: 10 s of swing of a 190-member network (a 10 × 10
//! joint hung net of ropes, turned out of its plane about its anchors and
//! released), automatic time step off: a fixed 5 ms step as a swing study
//! would use.
// criterion's macros generate undocumented public functions.
#![allow(missing_docs)]

use criterion::{Criterion, criterion_group, criterion_main};
use tautspan_core::solve::{
    AxialLaw, Fixity, NetMember, NetNode, Network, SimulateOptions, SimulationStart, SolveOptions, simulate,
    solve_static,
};

const G: f64 = 9.80665;

/// A 10 × 10 net of joints (1 m pitch) in the vertical x–y plane hanging
/// from a top row of 10 anchors, 190 ropes (EA 200 kN, a fibre rope's
/// order), 20 kg per joint.
fn hung_net() -> Network {
    let n = 10;
    let mut net = Network::default();
    for i in 0..n {
        net.nodes.push(NetNode {
            name: format!("a{i}"),
            position_m: [i as f64, 0.0, 0.0],
            fixity: Fixity::Fixed,
            load_n: [0.0; 3],
            mass_kg: 0.0,
        });
    }
    for row in 1..=n {
        for i in 0..n {
            net.nodes.push(NetNode {
                name: format!("j{row}_{i}"),
                position_m: [i as f64, -(row as f64), 0.0],
                fixity: Fixity::Free,
                load_n: [0.0, -20.0 * G, 0.0],
                mass_kg: 20.0,
            });
        }
    }
    let id = |row: usize, i: usize| row * n + i;
    let add = |net: &mut Network, a: usize, b: usize| {
        net.members.push(NetMember {
            name: format!("m{}", net.members.len()),
            ends: [a, b],
            axial_stiffness_n: 2e5,
            rest_length_m: 1.0,
            law: AxialLaw::TensionOnly,
            via: Vec::new(),
            segment_factors: Vec::new(),
        });
    };
    for row in 1..=n {
        for i in 0..n {
            add(&mut net, id(row - 1, i), id(row, i));
            if i + 1 < n {
                add(&mut net, id(row, i), id(row, i + 1));
            }
        }
    }
    net
}

fn bench_simulate(c: &mut Criterion) {
    let net = hung_net();
    assert_eq!(net.members.len(), 190);
    // Release: the hanging equilibrium turned 17° about the line of anchors
    // (a rigid rotation out of its plane, every rope keeping its static
    // stretch), then let go.
    let eq = solve_static(&net, &SolveOptions::default()).unwrap_or_else(|e| panic!("{e}"));
    let (sn, cs) = 0.3_f64.sin_cos();
    let start: Vec<[f64; 3]> = eq.positions_m.iter().map(|p| [p[0], p[1] * cs, p[1] * sn]).collect();
    let start = SimulationStart { positions_m: Some(start), velocities_m_per_s: None };
    let opts = SimulateOptions {
        duration_s: 10.0,
        time_step_s: Some(5e-3),
        output_interval_s: Some(0.05),
        ..SimulateOptions::default()
    };
    let sim = simulate(&net, &start, &opts, &mut |_| true).unwrap_or_else(|e| panic!("{e}"));
    println!(
        "{} members, {} steps, energy drift {:.2e}, peak {:.1} N",
        net.members.len(),
        sim.steps,
        sim.energy_drift,
        sim.peak_member_force_n.iter().fold(0.0_f64, |a, b| a.max(*b))
    );
    let mut group = c.benchmark_group("simulate");
    group.sample_size(10);
    group.bench_function("10 s swing, 190-member net", |b| {
        b.iter(|| simulate(&net, &start, &opts, &mut |_| true).unwrap_or_else(|e| panic!("{e}")))
    });
    group.finish();
}

criterion_group!(benches, bench_simulate);
criterion_main!(benches);
