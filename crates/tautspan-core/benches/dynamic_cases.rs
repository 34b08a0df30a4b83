//! All cases of a 200-member scenario with both limit searches (static,
//! swing, drop, sudden, the critical load factor and the per-member limits):
//! the figure the GUI's live re-solve depends on (target < 2 ms median).

#![allow(clippy::expect_used, clippy::unwrap_used, missing_docs, reason = "benchmark harness")]

use criterion::{Criterion, criterion_group, criterion_main};
use std::hint::black_box;
use tautspan_core::analysis::analyse;
use tautspan_core::model::load_scenario;

#[path = "../tests/common/hung_net.rs"]
mod common;
use common::hung_net;

fn bench(c: &mut Criterion) {
    let mut g = c.benchmark_group("dynamic_cases");
    // a net held on three sides with pretensioned cross members (the
    // representative rig), and one hung from the top only with its cross
    // members at rest length, ninety of which sit exactly between slack and
    // taut at the solution (the hardest case for the solver)
    for (name, cols, slack, sides) in [
        ("net held on three sides", 12, "-1 mm", true),
        ("net hung from the top, cross members at rest length", 11, "0 m", false),
    ] {
        let text = hung_net(cols, 11, slack, sides);
        let l = load_scenario(&text).expect("generated scenario");
        let n = l.scenario.members.len();
        assert!((195..=225).contains(&n), "{n} members");
        let a = analyse(&l.scenario);
        assert!(a.cases.iter().all(|c| c.converged), "{:?}", a.cases.iter().map(|c| &c.error).collect::<Vec<_>>());
        g.bench_function(format!("all cases and limits, {n} members, {name}"), |b| {
            b.iter(|| black_box(analyse(black_box(&l.scenario))))
        });
        if !sides {
            g.bench_function("parse and validate the 210-member file", |b| {
                b.iter(|| black_box(load_scenario(black_box(&text))))
            });
        }
    }
    g.finish();
}

criterion_group!(benches, bench);
criterion_main!(benches);
