//! Static solve benchmarks: a 200-member hung net, a ≈ 10,000-member grid
//! net (71 × 71 nodes, 9,660 members) hung at its edges and loaded at every
//! node, and a scaling group from about 100 to 40,000 members. The peak
//! resident memory after the first solves (before criterion's own work) is
//! printed.
// criterion's macros generate undocumented public functions.
#![allow(missing_docs)]

use criterion::{BenchmarkId, Criterion, criterion_group, criterion_main};
use tautspan_core::solve::{AxialLaw, Fixity, NetMember, NetNode, Network, SolveOptions, StaticSolver};

/// Peak resident set size of this process so far (VmHWM), MB, on Linux.
/// (A counting global allocator would need `unsafe`, which the workspace
/// forbids; the high-water mark of the whole process bounds the solve's.)
fn peak_rss_mb() -> Option<f64> {
    let status = std::fs::read_to_string("/proc/self/status").ok()?;
    let line = status.lines().find(|l| l.starts_with("VmHWM:"))?;
    let kb: f64 = line.split_whitespace().nth(1)?.parse().ok()?;
    Some(kb / 1024.0)
}

/// An n × n grid of joints in the horizontal x–z plane, 1 m pitch, edge
/// nodes anchored, every interior joint loaded with 100 N; ropes 2 % short
/// of the drawn pitch (a pretensioned net), EA = 1 MN.
fn grid(n: usize) -> Network {
    let mut net = Network::default();
    for i in 0..n {
        for j in 0..n {
            let edge = i == 0 || j == 0 || i == n - 1 || j == n - 1;
            net.nodes.push(NetNode {
                name: format!("n{i}_{j}"),
                position_m: [i as f64, 0.0, j as f64],
                fixity: if edge { Fixity::Fixed } else { Fixity::Free },
                load_n: if edge { [0.0; 3] } else { [0.0, -100.0, 0.0] },
                mass_kg: if edge { 0.0 } else { 100.0 / 9.80665 },
            });
        }
    }
    let id = |i: usize, j: usize| i * n + j;
    for i in 0..n {
        for j in 0..n {
            for (di, dj) in [(1, 0), (0, 1)] {
                let (a, b) = (i + di, j + dj);
                if a < n && b < n {
                    let edge_pair = |p: usize, q: usize| p == 0 || q == 0 || p == n - 1 || q == n - 1;
                    if edge_pair(i, j) && edge_pair(a, b) {
                        continue; // both ends anchored: carries nothing the solve sees
                    }
                    net.members.push(NetMember {
                        name: format!("m{}", net.members.len()),
                        ends: [id(i, j), id(a, b)],
                        axial_stiffness_n: 1e6,
                        rest_length_m: 0.98,
                        law: AxialLaw::TensionOnly,
                        via: Vec::new(),
                        segment_factors: Vec::new(),
                    });
                }
            }
        }
    }
    net
}

fn loads(net: &Network) -> Vec<[f64; 3]> {
    net.nodes.iter().map(|n| n.load_n).collect()
}

fn bench_static(c: &mut Criterion) {
    let opts = SolveOptions::default();
    let small = grid(12); // 12 × 12 nodes: 220 members
    let big = grid(71); // 71 × 71 nodes: 9,660 members
    for (label, net) in [("220-member net", &small), ("10k-member grid", &big)] {
        let mut solver = StaticSolver::new(net).unwrap_or_else(|e| panic!("{e}"));
        let eq = solver.solve(&loads(net), None, &opts).unwrap_or_else(|e| panic!("{e}"));
        println!(
            "{label}: {} members, {} iterations, residual {:.2e} N, process peak RSS so far {:.1} MB",
            net.members.len(),
            eq.iterations,
            eq.residual_n,
            peak_rss_mb().unwrap_or(f64::NAN)
        );
    }
    let mut group = c.benchmark_group("static_solve");
    group.sample_size(10);
    group.bench_function("220-member net (new + solve)", |b| {
        let l = loads(&small);
        b.iter(|| {
            StaticSolver::new(&small)
                .unwrap_or_else(|e| panic!("{e}"))
                .solve(&l, None, &opts)
                .unwrap_or_else(|e| panic!("{e}"))
        })
    });
    group.bench_function("10k-member grid (new + solve)", |b| {
        let l = loads(&big);
        b.iter(|| {
            StaticSolver::new(&big)
                .unwrap_or_else(|e| panic!("{e}"))
                .solve(&l, None, &opts)
                .unwrap_or_else(|e| panic!("{e}"))
        })
    });
    group.finish();

    let mut scaling = c.benchmark_group("static_solve_scaling");
    scaling.sample_size(10);
    for n in [8_usize, 16, 32, 71, 142] {
        let net = grid(n);
        let l = loads(&net);
        scaling.bench_with_input(BenchmarkId::from_parameter(net.members.len()), &net, |b, net| {
            b.iter(|| {
                StaticSolver::new(net)
                    .unwrap_or_else(|e| panic!("{e}"))
                    .solve(&l, None, &opts)
                    .unwrap_or_else(|e| panic!("{e}"))
            })
        });
    }
    scaling.finish();
}

criterion_group!(benches, bench_static);
criterion_main!(benches);
