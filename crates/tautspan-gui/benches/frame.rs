//! The app driven headless on a generated 1,000-member net: one frame of UI
//! logic plus the re-solve after a node is moved (target: median < 8 ms),
//! and opening the app to its first frame (target: < 1 s). Run with
//! `cargo bench -p tautspan-gui --bench frame`.

#![allow(missing_docs, reason = "criterion's macros generate undocumented items")]

use criterion::{Criterion, criterion_group, criterion_main};
use egui_kittest::Harness;
use std::time::{Duration, Instant};
use tautspan_core::file::{CaseDto, MassDto, MemberDto, NodeDto, Position, Qty, ScenarioDto, SupportDto};
use tautspan_core::library::MemberKind;
use tautspan_gui::{Command, Document, Prefs, TautspanApp};

/// A curtain net: a row of anchors, `layers` rows of joints below, each
/// joint hung from the one above and the two diagonally above; a mass at
/// each joint of the bottom row. 34 columns × 10 layers gives 1,000 members.
fn net(columns: usize, layers: usize) -> ScenarioDto {
    let q = |v: f64, u: &str| Qty(format!("{v} {u}"));
    let id = |c: usize, l: usize| if l == 0 { format!("A{c}") } else { format!("J{c}-{l}") };
    let mut nodes = Vec::new();
    for l in 0..=layers {
        for c in 0..columns {
            nodes.push(NodeDto {
                id: id(c, l),
                at: Position { x: q(c as f64 * 0.5, "m"), y: q(10.0 - l as f64 * 0.6, "m"), z: None },
                support: if l == 0 { SupportDto::Anchor } else { SupportDto::Joint },
            });
        }
    }
    let mut members = Vec::new();
    let mut add = |a: String, b: String| {
        let n = members.len();
        members.push(MemberDto {
            id: format!("M{n}"),
            ends: (a, b),
            kind: MemberKind::WireRope,
            diameter: Some(Qty::from("10 mm")),
            construction: Some("6x19 IWRC".to_string()),
            grade: Some("1770".to_string()),
            may_go_slack: true,
            ..MemberDto::default()
        });
    };
    for l in 1..=layers {
        for c in 0..columns {
            add(id(c, l - 1), id(c, l));
            if c > 0 {
                add(id(c - 1, l - 1), id(c, l));
            }
            if c + 1 < columns {
                add(id(c + 1, l - 1), id(c, l));
            }
        }
    }
    let masses =
        (0..columns).map(|c| MassDto { id: format!("m{c}"), at: id(c, layers), mass: Qty::from("50 kg") }).collect();
    ScenarioDto {
        format: 1,
        title: "Generated 1,000-member net".to_string(),
        nodes,
        members,
        masses,
        cases: vec![CaseDto::Static { id: "hanging".to_string() }],
        ..ScenarioDto::default()
    }
}

fn harness(dto: ScenarioDto) -> Harness<'static, TautspanApp> {
    let mut app = TautspanApp::with_document(Document::new(dto, None), Prefs::default());
    app.files.native = false;
    Harness::builder().with_size([1400.0, 900.0]).build_ui_state(|ui, app: &mut TautspanApp| app.frame(ui), app)
}

fn bench(c: &mut Criterion) {
    let dto = net(34, 10);
    assert_eq!(dto.members.len(), 1000);

    let start = Instant::now();
    let h = harness(dto.clone());
    let first = start.elapsed();
    let solved = h.state().derived.solved.as_ref().map(|s| s.analysis.cases[0].converged);
    println!(
        "first frame of the 1,000-member net: {:.1} ms (target < 1000 ms); converged: {solved:?}",
        first.as_secs_f64() * 1e3
    );
    drop(h);

    c.bench_function("open to first frame, 1,000 members", |b| b.iter(|| harness(dto.clone())));

    let mut h = harness(dto);
    let ctx = egui::Context::default();
    let mut k = 0u32;
    c.bench_function("frame with a node moved and re-solved, 1,000 members", |b| {
        b.iter(|| {
            k += 1;
            let x = 8.5 + 0.05 * f64::from(k % 7);
            h.state_mut().apply(
                &ctx,
                vec![Command::edit_merged("drag", move |d| {
                    if let Some(n) = d.nodes.iter_mut().find(|n| n.id == "J17-10") {
                        n.at.x = Qty(format!("{x} m"));
                    }
                })],
            );
            h.step();
        });
    });
    println!("core re-solve alone in the last frame: {:.1} ms", h.state().derived.solve_ms);
    c.bench_function("frame with nothing changed, 1,000 members", |b| b.iter(|| h.step()));
}

criterion_group! {
    name = benches;
    config = Criterion::default().sample_size(20).measurement_time(Duration::from_secs(8));
    targets = bench
}
criterion_main!(benches);
