//! The load paths of a case: per mass, the members and supports that carry
//! at least [`LOAD_PATH_THRESHOLD`] of its weight with their shares, and the
//! path of all masses together (`solve::LoadFlow` says how shares are found).
//! The work and the output grow with the members that carry a real share of
//! each mass, not with members × masses.

use std::collections::HashMap;

use super::results::{DynamicLoad, LoadPathResult};
use crate::model::{Scenario, Support};
use crate::solve::{Equilibrium, LoadFlow, LoadPath, Network, TraceScratch};

/// Members and supports are listed on a mass's path when they carry at
/// least this fraction of its weight (1 %); the rest are counted.
pub const LOAD_PATH_THRESHOLD: f64 = 0.01;

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
    let mut scratch = TraceScratch::default();
    let g = s.gravity_m_s2();
    // masses at the same node share one trace
    let mut by_node: HashMap<usize, usize> = HashMap::new();
    let mut traced: Vec<LoadPathResult> = Vec::new();
    let mut paths = Vec::with_capacity(s.masses.len());
    for m in &s.masses {
        let k = *by_node.entry(m.node).or_insert_with(|| {
            let r = if s.nodes[m.node].support == Support::Anchor {
                // a mass hung directly at an anchor is its own path
                own_support(s, m.node)
            } else {
                to_result(s, flow.trace(&[(m.node, 1.0)], LOAD_PATH_THRESHOLD, &mut scratch), "")
            };
            traced.push(r);
            traced.len() - 1
        });
        let mut r = traced[k].clone();
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
    let combined = to_result(s, flow.trace(&sources, LOAD_PATH_THRESHOLD, &mut scratch), ALL_MASSES);
    (paths, Some(combined))
}

fn own_support(s: &Scenario, node: usize) -> LoadPathResult {
    LoadPathResult {
        mass: String::new(),
        members: Vec::new(),
        shares: Vec::new(),
        below_threshold: 0,
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
        supports: p.supports.iter().map(|&(k, _)| s.nodes[k].id.clone()).collect(),
        support_shares: p.supports.iter().map(|&(_, f)| f).collect(),
        supports_below_threshold: p.supports_below_threshold,
        untraced: p.untraced,
    }
}
