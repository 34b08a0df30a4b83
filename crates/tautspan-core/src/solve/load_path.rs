//! Load paths: for each loaded node, the members that carry its load to the
//! supports and the supports reached.
//!
//! Definition used: a member carries force when |T| exceeds
//! `threshold_fraction` × the largest |T| in the equilibrium. The load path
//! of a loaded node is the set of force-carrying members reachable from the
//! node by walking along force-carrying members without passing through a
//! support (an anchor or a floor node); the supports are the ones where such
//! walks end, plus the node itself when it rests on a floor carrying a
//! normal force. Because every free node of a force-carrying member is in
//! equilibrium, such a walk can only end at supports or at other loaded
//! nodes, so this set is the union of the force-carrying paths from the node
//! to the supports (loads that share members share their paths).

use std::collections::VecDeque;

use super::equilibrium::Equilibrium;
use super::network::{Fixity, Network};

/// The load path of one loaded node.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct LoadPath {
    /// The loaded node (index into the network's nodes).
    pub node: usize,
    /// Members on the path, ascending indices.
    pub members: Vec<usize>,
    /// Supports reached (anchors and floor nodes), ascending indices.
    pub supports: Vec<usize>,
}

/// Load paths of every loaded node that is not an anchor, with loads
/// `loads_n` (one per node) at the equilibrium `eq` of `net`.
/// `threshold_fraction` (e.g. 1e-6) decides which members carry force.
pub fn load_paths(net: &Network, eq: &Equilibrium, loads_n: &[[f64; 3]], threshold_fraction: f64) -> Vec<LoadPath> {
    let starts: Vec<usize> = loads_n
        .iter()
        .enumerate()
        .take(net.nodes.len())
        .filter(|(_, l)| l.iter().any(|c| *c != 0.0))
        .map(|(i, _)| i)
        .collect();
    load_paths_from(net, eq, &starts, threshold_fraction)
}

/// Load paths from the nodes `starts` (ascending, no anchors: those are
/// skipped), as [`load_paths`] defines them. The walk from each node is
/// linear in the network size, so asking only for the nodes that matter
/// (the masses, not every node carrying a member's own weight) keeps the
/// cost linear too.
pub fn load_paths_from(net: &Network, eq: &Equilibrium, starts: &[usize], threshold_fraction: f64) -> Vec<LoadPath> {
    let n = net.nodes.len();
    let max_force = eq.member_force_n.iter().fold(0.0_f64, |a, f| a.max(f.abs()));
    let threshold = threshold_fraction.max(0.0) * max_force;
    let mut adjacent: Vec<Vec<(usize, usize)>> = vec![Vec::new(); n];
    for (i, m) in net.members.iter().enumerate() {
        let carries = eq.member_force_n.get(i).is_some_and(|f| f.abs() > threshold && *f != 0.0);
        if carries {
            for (a, b, _) in m.segments() {
                adjacent[a].push((i, b));
                adjacent[b].push((i, a));
            }
        }
    }
    let is_support = |i: usize| !matches!(net.nodes[i].fixity, Fixity::Free);
    let mut paths = Vec::new();
    let mut seen_node = vec![false; n];
    let mut seen_member = vec![false; net.members.len()];
    let mut queue = VecDeque::new();
    for &start in starts {
        if start >= n || matches!(net.nodes[start].fixity, Fixity::Fixed) {
            continue;
        }
        seen_node.fill(false);
        seen_member.fill(false);
        let mut supports = Vec::new();
        let mut members = Vec::new();
        if eq.floor_force_n.get(start).is_some_and(|f| *f > 0.0) {
            supports.push(start);
        }
        queue.clear();
        queue.push_back(start);
        seen_node[start] = true;
        while let Some(i) = queue.pop_front() {
            for &(member, other) in &adjacent[i] {
                if !seen_member[member] {
                    seen_member[member] = true;
                    members.push(member);
                }
                if !seen_node[other] {
                    seen_node[other] = true;
                    if is_support(other) {
                        supports.push(other);
                    } else {
                        queue.push_back(other);
                    }
                }
            }
        }
        members.sort_unstable();
        supports.sort_unstable();
        paths.push(LoadPath { node: start, members, supports });
    }
    paths
}
