//! All cases of a 200-member scenario with both limit searches (static,
//! swing, drop, sudden, the critical load factor and the per-member limits):
//! the figure the GUI's live re-solve depends on (target < 2 ms median).

#![allow(clippy::expect_used, clippy::unwrap_used, missing_docs, reason = "benchmark harness")]

use criterion::{Criterion, criterion_group, criterion_main};
use std::fmt::Write;
use std::hint::black_box;
use tautspan_core::analysis::analyse;
use tautspan_core::model::load_scenario;

/// A net of wire rope hung in the x–y plane from a top row of anchors,
/// `cols` × `rows` nodes, a mass at the middle of the bottom row. The cross
/// members are drawn at their unstretched length plus `cross_slack` (a
/// negative value pretensions them; zero leaves them switching between slack
/// and taut at the solution, the hardest case for the solver).
fn hung_net(cols: usize, rows: usize, cross_slack: &str) -> String {
    let mut s = String::from("Scenario(format: 1, title: \"bench net\", nodes: [");
    for r in 0..rows {
        for c in 0..cols {
            let support = if r == 0 { ", support: Anchor" } else { "" };
            let _ = write!(
                s,
                "Node(id: \"n{r}_{c}\", at: (\"{} m\", \"{} m\"){support}),",
                c as f64 * 0.5,
                10.0 - r as f64 * 0.5
            );
        }
    }
    s.push_str("], members: [");
    let rope = "kind: WireRope, diameter: \"10 mm\", construction: \"6x19 IWRC\", grade: \"1770\"";
    for r in 0..rows {
        for c in 0..cols {
            if c + 1 < cols && r > 0 {
                let _ = write!(
                    s,
                    "Member(id: \"h{r}_{c}\", ends: (\"n{r}_{c}\", \"n{r}_{}\"), {rope}, may_go_slack: true, slack: \"{cross_slack}\"),",
                    c + 1
                );
            }
            if r + 1 < rows {
                let _ = write!(s, "Member(id: \"v{r}_{c}\", ends: (\"n{r}_{c}\", \"n{}_{c}\"), {rope}),", r + 1);
            }
        }
    }
    let _ = write!(
        s,
        "], masses: [Mass(id: \"load\", at: \"n{}_{}\", mass: \"500 kg\")], cases: [Static(id: \"s\"), Swing(id: \"sw\", mass: \"load\", release: \"30 deg\"), Drop(id: \"d\", mass: \"load\", height: \"5 mm\"), Sudden(id: \"su\", mass: \"load\")])",
        rows - 1,
        cols / 2
    );
    s
}

fn bench(c: &mut Criterion) {
    let mut g = c.benchmark_group("dynamic_cases");
    for (name, slack) in [("pretensioned cross members", "-1 mm"), ("cross members at rest length", "0 m")] {
        let text = hung_net(11, 11, slack);
        let l = load_scenario(&text).expect("generated scenario");
        let n = l.scenario.members.len();
        assert!((195..=225).contains(&n), "{n} members");
        let a = analyse(&l.scenario);
        assert!(a.cases.iter().all(|c| c.converged), "{:?}", a.cases.iter().map(|c| &c.error).collect::<Vec<_>>());
        g.bench_function(format!("all cases and limits, {n} members, {name}"), |b| {
            b.iter(|| black_box(analyse(black_box(&l.scenario))))
        });
        if slack == "0 m" {
            g.bench_function("parse and validate the 210-member file", |b| {
                b.iter(|| black_box(load_scenario(black_box(&text))))
            });
        }
    }
    g.finish();
}

criterion_group!(benches, bench);
criterion_main!(benches);
