//! The load paths of a case: per mass, the members and supports that carry
//! at least [`LOAD_PATH_THRESHOLD`] of its weight with their shares (at most
//! [`MAX_LISTED`] members, the largest), and the path of all masses
//! together, every member that carries any of their weight listed
//! (`solve::LoadFlow` says how shares are found).
//! The work and the output grow with the members that carry a real share of
//! each mass, not with members × masses.

use std::collections::HashMap;

use super::results::{DynamicLoad, LoadPathResult};
use crate::model::{Scenario, Support};
use crate::solve::{Equilibrium, LoadFlow, LoadPath, Network, TraceScratch};

/// Members and supports are listed on a mass's path when they carry at
/// least this fraction of its weight (1 %); the rest are counted.
pub const LOAD_PATH_THRESHOLD: f64 = 0.01;

/// At most this many members are listed on one mass's path, the largest
/// shares (a mass in a wide net spreads over hundreds of members above the
/// threshold; the output stays linear in the masses): `not_listed` counts
/// the rest above the threshold.
pub const MAX_LISTED: usize = 50;

/// Id of the combined path.
pub const ALL_MASSES: &str = "all masses";

/// The per-mass paths (in mass order) and the combined path of the
/// equilibrium `eq`, the case's mass loaded by `dynamic`'s factor.
pub fn load_path_results(
    s: &Scenario,
    net: &Network,
    eq: &Equilibrium,
    dynamic: Option<&DynamicLoad>,
) -> (Vec<LoadPathResult>, Option<LoadPathResult>) {
    if s.masses.is_empty() {
        return (Vec::new(), None);
    }
    let flow = LoadFlow::new(net, eq);
    let g = s.gravity_m_s2();
    // masses at the same node share one trace: the first mass at each node
    let mut by_node: HashMap<usize, usize> = HashMap::new();
    let first: Vec<usize> = (0..s.masses.len()).map(|i| *by_node.entry(s.masses[i].node).or_insert(i)).collect();
    let to_trace: Vec<usize> = (0..s.masses.len()).filter(|&i| first[i] == i).collect();
    // the traces are independent: a few threads share them (same answers
    // in the same order whatever the number of threads)
    let trace_one = |i: usize, scratch: &mut TraceScratch| {
        let node = s.masses[i].node;
        if s.nodes[node].support == Support::Anchor {
            // a mass hung directly at an anchor is its own path
            own_support(s, node)
        } else {
            to_result(s, flow.trace(&[(node, 1.0)], LOAD_PATH_THRESHOLD, MAX_LISTED, scratch), "")
        }
    };
    let threads = super::threads::threads_for(MAX_THREADS);
    let traced: Vec<LoadPathResult> = if threads > 1 && to_trace.len() >= PARALLEL_FROM {
        let chunk = to_trace.len().div_ceil(threads);
        std::thread::scope(|scope| {
            let handles: Vec<_> = to_trace
                .chunks(chunk)
                .map(|part| {
                    scope.spawn(move || {
                        let mut scratch = TraceScratch::default();
                        part.iter().map(|&i| trace_one(i, &mut scratch)).collect::<Vec<_>>()
                    })
                })
                .collect();
            let mut all = Vec::with_capacity(to_trace.len());
            for (h, part) in handles.into_iter().zip(to_trace.chunks(chunk)) {
                match h.join() {
                    Ok(v) => all.extend(v),
                    // a thread that failed: trace its part here
                    Err(_) => {
                        let mut scratch = TraceScratch::default();
                        all.extend(part.iter().map(|&i| trace_one(i, &mut scratch)));
                    }
                }
            }
            all
        })
    } else {
        let mut scratch = TraceScratch::default();
        to_trace.iter().map(|&i| trace_one(i, &mut scratch)).collect()
    };
    let mut traced = traced.into_iter();
    let mut paths: Vec<LoadPathResult> = Vec::with_capacity(s.masses.len());
    for (i, (m, &f)) in s.masses.iter().zip(&first).enumerate() {
        // the first mass at a node takes its trace (in order); others copy it
        let mut r =
            if f == i { traced.next() } else { paths.get(f).cloned() }.unwrap_or_else(|| own_support(s, m.node));
        r.mass = m.id.clone();
        paths.push(r);
    }
    let sources: Vec<(usize, f64)> = s
        .masses
        .iter()
        .map(|m| {
            let factor = dynamic.filter(|d| d.mass == m.id).map_or(1.0, |d| d.factor);
            (m.node, m.mass.value * g * factor)
        })
        .collect();
    // every member carrying any of the weight: linear in the members
    let combined = to_result(s, flow.trace(&sources, 0.0, usize::MAX, &mut TraceScratch::default()), ALL_MASSES);
    (paths, Some(combined))
}

/// Threads the traces are shared among, at most.
const MAX_THREADS: usize = 4;

/// Fewer traces than this run on the calling thread.
const PARALLEL_FROM: usize = 256;

fn own_support(s: &Scenario, node: usize) -> LoadPathResult {
    LoadPathResult {
        mass: String::new(),
        members: Vec::new(),
        shares: Vec::new(),
        below_threshold: 0,
        not_listed: 0,
        supports: vec![s.nodes[node].id.clone()],
        support_shares: vec![1.0],
        supports_below_threshold: 0,
        untraced: 0.0,
    }
}

fn to_result(s: &Scenario, p: LoadPath, mass: &str) -> LoadPathResult {
    LoadPathResult {
        mass: mass.to_string(),
        members: p.members.iter().map(|&(k, _)| s.members[k].id.clone()).collect(),
        shares: p.members.iter().map(|&(_, f)| f).collect(),
        below_threshold: p.members_below_threshold,
        not_listed: p.members_not_listed,
        supports: p.supports.iter().map(|&(k, _)| s.nodes[k].id.clone()).collect(),
        support_shares: p.supports.iter().map(|&(_, f)| f).collect(),
        supports_below_threshold: p.supports_below_threshold,
        untraced: p.untraced,
    }
}
