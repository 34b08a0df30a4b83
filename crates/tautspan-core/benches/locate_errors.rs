//! Locating many errors: a file of 100,000 members whose ends name nodes
//! that do not exist (100,000 located errors), read and validated; and a
//! parse error after 3 MB of open brackets. Both were quadratic or ran out
//! of memory before the position index walked its paths through a map and
//! stopped at the nesting cap.
// criterion's macros generate undocumented public functions.
#![allow(missing_docs)]

use criterion::{Criterion, criterion_group, criterion_main};
use tautspan_core::model::load_scenario;

fn bad_references(n: usize) -> String {
    let mut t = String::from(
        "Scenario(format: 1, title: \"bad references\",\nnodes: [Node(id: \"A\", at: (\"0 m\", \"1 m\"), support: Anchor)],\nmembers: [\n",
    );
    for i in 0..n {
        t.push_str(&format!(
            "  Member(id: \"m{i}\", ends: (\"A\", \"x{i}\"), kind: Rod, area: \"100 mm^2\", modulus: \"200 GPa\", rating: Yield(\"235 MPa\")),\n"
        ));
    }
    t.push_str("],\ncases: [Static(id: \"s\")],\n)\n");
    t
}

fn bench_locate(c: &mut Criterion) {
    let text = bad_references(100_000);
    let errors = load_scenario(&text).err().map_or(0, |e| e.0.len());
    eprintln!("{errors} located errors in a {:.1} MB file", text.len() as f64 / 1e6);
    let deep = format!("Scenario(format: 1, title: \"deep\", notes: {}", "[".repeat(3_000_000));
    let mut group = c.benchmark_group("locate_errors");
    group.sample_size(10);
    group.bench_function("100,000 bad references", |b| b.iter(|| load_scenario(&text).err().map(|e| e.0.len())));
    group.bench_function("3 MB of open brackets", |b| b.iter(|| load_scenario(&deep).err().map(|e| e.0.len())));
    group.finish();
}

criterion_group!(benches, bench_locate);
criterion_main!(benches);
