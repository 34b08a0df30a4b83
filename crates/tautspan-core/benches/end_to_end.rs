//! End to end, as `tautspan check --format json` does it: parse and
//! validate the scenario text, analyse every case, write the JSON (to a
//! byte counter, not a file). On the 71 × 71 square net with a 2 kg mass
//! at every interior joint (9,940 members, 4,761 masses) and the 101 × 101
//! one (20,200 members, 9,801 masses). Before timing, each step is timed
//! once on its own (where the time goes), the output sizes of JSON, CSV and
//! text are printed, and the 71 × 71 file is written to
//! `target/tmp/square-net-71.ron` for measuring the release binary's peak
//! memory with `/usr/bin/time -v`.
// criterion's macros generate undocumented public functions.
#![allow(missing_docs)]

use std::io::{self, Write};
use std::time::Instant;

use criterion::{Criterion, criterion_group, criterion_main};
use tautspan_core::analysis::{MAX_LISTED, analyse};
use tautspan_core::file::parse_scenario_text;
use tautspan_core::model::{build, load_scenario, to_network};
use tautspan_core::output::{check_text, write_check_json, write_csv_rows};
use tautspan_core::solve::{LoadFlow, SolveOptions, StaticSolver, TraceScratch};

#[path = "../tests/common/grid_net.rs"]
mod common;
use common::grid_net;

/// Counts the bytes written to it.
#[derive(Default)]
struct Count(usize);

impl Write for Count {
    fn write(&mut self, buf: &[u8]) -> io::Result<usize> {
        self.0 += buf.len();
        Ok(buf.len())
    }
    fn flush(&mut self) -> io::Result<()> {
        Ok(())
    }
}

/// Peak resident set size of this process so far (VmHWM), MB, on Linux.
fn peak_rss_mb() -> Option<f64> {
    let status = std::fs::read_to_string("/proc/self/status").ok()?;
    let line = status.lines().find(|l| l.starts_with("VmHWM:"))?;
    let kb: f64 = line.split_whitespace().nth(1)?.parse().ok()?;
    Some(kb / 1024.0)
}

fn check_json(text: &str) -> usize {
    let l = load_scenario(text).unwrap_or_else(|e| panic!("{e:?}"));
    let a = analyse(&l.scenario);
    let mut out = Count::default();
    write_check_json(&mut out, "net.ron", &a).unwrap_or_else(|e| panic!("{e}"));
    out.0
}

/// Each step once, with its wall time: where the time goes.
fn profile(n: usize, text: &str) {
    let ms = |t: Instant| t.elapsed().as_secs_f64() * 1e3;
    let t = Instant::now();
    let (dto, _) = parse_scenario_text(text).unwrap_or_else(|e| panic!("{e:?}"));
    let parse_ms = ms(t);
    let t = Instant::now();
    let scenario = build(&dto).unwrap_or_else(|e| panic!("{e:?}"));
    let validate_ms = ms(t);
    let s = &scenario;
    let t = Instant::now();
    let (net, loads) = to_network(s);
    let mut solver = StaticSolver::new(&net).unwrap_or_else(|e| panic!("{e}"));
    let eq = solver.solve(&loads.total_n, None, &SolveOptions::default()).unwrap_or_else(|e| panic!("{e}"));
    let solve_ms = ms(t);
    let t = Instant::now();
    let flow = LoadFlow::new(&net, &eq);
    let mut scratch = TraceScratch::default();
    let mut listed = 0;
    let mut untraced_max: f64 = 0.0;
    for m in &s.masses {
        let p = flow.trace(&[(m.node, 1.0)], 0.01, MAX_LISTED, &mut scratch);
        listed += p.members.len();
        untraced_max = untraced_max.max(p.untraced);
    }
    let paths_ms = ms(t);
    let t = Instant::now();
    let a = analyse(s);
    let analyse_ms = ms(t);
    let t = Instant::now();
    let mut json = Count::default();
    write_check_json(&mut json, "net.ron", &a).unwrap_or_else(|e| panic!("{e}"));
    let json_ms = ms(t);
    let t = Instant::now();
    let mut csv = Count::default();
    write_csv_rows(&mut csv, "net.ron", &a).unwrap_or_else(|e| panic!("{e}"));
    let csv_ms = ms(t);
    let t = Instant::now();
    let text_len = check_text("net.ron", &a).len();
    let text_ms = ms(t);
    println!(
        "{n} x {n}: {} members, {} masses; parse {parse_ms:.0} ms, validate {validate_ms:.0} ms; network + static solve {solve_ms:.0} ms ({} Newton steps); \
         load paths of every mass {paths_ms:.0} ms ({listed} members listed, {:.1} a mass, untraced at most {untraced_max:.1e}); whole analysis {analyse_ms:.0} ms; \
         JSON {json_ms:.0} ms, {:.1} MB; CSV {csv_ms:.0} ms, {:.1} MB; text {text_ms:.0} ms, {:.1} MB; {} warning lines; peak RSS so far {:.0} MB",
        s.members.len(),
        s.masses.len(),
        eq.iterations,
        listed as f64 / s.masses.len().max(1) as f64,
        json.0 as f64 / 1e6,
        csv.0 as f64 / 1e6,
        text_len as f64 / 1e6,
        a.cases.iter().map(|c| c.warnings.len()).sum::<usize>() + a.warning_groups().len(),
        peak_rss_mb().unwrap_or(f64::NAN)
    );
}

fn bench(c: &mut Criterion) {
    let net71 = grid_net(71, "2 kg");
    let net101 = grid_net(101, "2 kg");
    let dir = std::path::Path::new(env!("CARGO_TARGET_TMPDIR"));
    if let Err(e) = std::fs::write(dir.join("square-net-71.ron"), &net71) {
        println!("could not write the 71 x 71 file: {e}");
    }
    if let Err(e) = std::fs::write(dir.join("square-net-101.ron"), &net101) {
        println!("could not write the 101 x 101 file: {e}");
    }
    profile(71, &net71);
    profile(101, &net101);
    let mut group = c.benchmark_group("end_to_end");
    group.sample_size(10);
    group.bench_function("check json, 71 x 71 net, mass at every joint", |b| b.iter(|| check_json(&net71)));
    group.bench_function("check json, 101 x 101 net, mass at every joint", |b| b.iter(|| check_json(&net101)));
    group.finish();
}

criterion_group!(benches, bench);
criterion_main!(benches);
