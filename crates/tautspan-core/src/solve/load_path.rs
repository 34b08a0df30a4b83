//! Load paths with shares: for a loaded node, which members carry how much
//! of its weight to which supports.
//!
//! Method (tracing the solved vertical forces). At the equilibrium every
//! member that carries force holds one of its end nodes up and pulls the
//! other one down by the vertical component of its force, `V = |T Δy| / L`
//! (a rope holds its lower end up, a strut its upper end). So weight flows
//! along each member from the node it holds up to the node it pulls down,
//! and at every free node the flows leaving it (members holding it up) add
//! up to the flows arriving (members pulling it down) plus the node's own
//! load: that is the node's vertical equilibrium. A node's weight is traced
//! by splitting whatever arrives at a node among the members leaving it in
//! proportion to their vertical forces (proportional sharing), until it
//! reaches an anchor, or a floor node's contact (which takes its part of the
//! arriving weight in proportion to its normal force).
//!
//! A member's **share** of a load is the fraction of that load's weight it
//! carries, vertical component, between 0 and 1. A level member carrying
//! force (a spreader, a tie between two legs) holds no weight up itself but
//! is part of the path: it is listed with the share of the weight that
//! passes through both its ends (the smaller of the two). Where the path is
//! statically determinate this is the only possible split; for members in
//! parallel between the same two nodes it is their force ratio, which for
//! members of equal stretch is the stiffness ratio `k1 / (k1 + k2)`: the
//! same as the tangent influence `∂T/∂W` there. In an indeterminate net it
//! is an attribution of the solved forces, not a marginal influence: the
//! shares of all loads add up to each member's vertical force exactly, so
//! the paths of every mass together are the solved load flow itself.
//!
//! Cost: one trace touches only the nodes the load reaches; flows smaller
//! than [`CUT_RATIO`] × the listing threshold are not followed further and
//! their sum is reported as `untraced` (a bound on how much any share may
//! be low). Nodes are visited in the flow's topological order, so each node
//! of a path without cycles is split once; a cycle's nodes are split again
//! as more arrives, up to [`SPLITS_PER_NODE`] splits a node in all.

use super::equilibrium::Equilibrium;
use super::network::{Fixity, Network};

/// Flows below this fraction of the listing threshold are not followed
/// (1e-3: a share within 0.1 % of the threshold may be misclassified, and
/// `untraced` says by how much at most).
pub const CUT_RATIO: f64 = 1e-3;

/// Node splits one trace may make, per node of the network: a path
/// without cycles splits each node once; a cycle splits its nodes again
/// each time more arrives, and past this the rest is left untraced.
pub const SPLITS_PER_NODE: usize = 64;

/// The load path of one load: its members and supports with their shares.
#[derive(Debug, Clone, PartialEq)]
pub struct LoadPath {
    /// The loaded node (index into the network's nodes).
    pub node: usize,
    /// Members carrying at least the threshold share, ascending indices,
    /// with their shares (fractions of the load's weight).
    pub members: Vec<(usize, f64)>,
    /// Members that carry some of the load, below the threshold.
    pub members_below_threshold: usize,
    /// Members at or above the threshold left out of `members` because
    /// only the largest `max_listed` are listed.
    pub members_not_listed: usize,
    /// Supports (anchors, floor nodes) taking at least the threshold share,
    /// ascending indices, with their shares.
    pub supports: Vec<(usize, f64)>,
    /// Supports reached that take less than the threshold.
    pub supports_below_threshold: usize,
    /// Fraction of the weight not followed to a support: flows smaller than
    /// the cut, and weight at a node nothing holds up (a load with no
    /// vertical path, which an equilibrium does not have).
    pub untraced: f64,
}

/// The solved vertical load flow of one equilibrium, ready to trace loads.
#[derive(Debug, Clone)]
pub struct LoadFlow {
    /// Per node: (member, node it flows to, vertical force N) leaving it.
    out: Vec<Vec<(usize, usize, f64)>>,
    /// Per node: level members carrying force, (member, other end), listed
    /// from a free end.
    level: Vec<Vec<(usize, usize)>>,
    /// Per node: total vertical force holding it up (members and floor), N.
    held_n: Vec<f64>,
    /// Per node: the floor's normal force there, N.
    floor_n: Vec<f64>,
    /// Per node: anchors absorb everything that arrives.
    anchor: Vec<bool>,
    /// Per node: position in the flow's topological order.
    rank: Vec<usize>,
    /// The node at each rank.
    by_rank: Vec<usize>,
    n_members: usize,
}

/// Scratch space for [`LoadFlow::trace`], reused between traces so a trace
/// costs only what it touches.
#[derive(Debug, Clone, Default)]
pub struct TraceScratch {
    member_flow: Vec<f64>,
    support_flow: Vec<f64>,
    pending: Vec<f64>,
    queued: Vec<bool>,
    touched_members: Vec<usize>,
    touched_supports: Vec<usize>,
    /// Weight passing through each node (fraction), and the nodes touched.
    through: Vec<f64>,
    touched_nodes: Vec<usize>,
    /// The nodes waiting, by their rank: a bit per rank. Ranks only grow
    /// along a path without cycles, so the next node is the next bit set
    /// after the last one taken (a monotone queue, no heap needed).
    waiting: Vec<u64>,
    /// The rank the next search starts from.
    cursor: usize,
}

impl LoadFlow {
    /// The flow of the equilibrium `eq` of `net`.
    pub fn new(net: &Network, eq: &Equilibrium) -> LoadFlow {
        let n = net.nodes.len();
        let mut out: Vec<Vec<(usize, usize, f64)>> = vec![Vec::new(); n];
        let mut level: Vec<Vec<(usize, usize)>> = vec![Vec::new(); n];
        let largest = eq.member_force_n.iter().fold(0.0_f64, |a, f| a.max(f.abs()));
        // vertical forces below this are rounding, not a path
        let tiny = 1e-12 * largest;
        // a rope over sheaves counts span by span, each with its own tension;
        // its share is what its spans carry together
        let spans = net.members.iter().enumerate().flat_map(|(i, m)| {
            let run = m.is_run();
            m.segments().map(move |(a, b, w)| (i, a, b, w, run))
        });
        for (i, a, b, w, run) in spans {
            let Some(&t) = eq.member_force_n.get(i) else { continue };
            if a >= n || b >= n || !t.is_finite() {
                continue;
            }
            let t = t * w;
            let l = if run {
                let (pa, pb) = (eq.positions_m[a], eq.positions_m[b]);
                ((pb[0] - pa[0]).powi(2) + (pb[1] - pa[1]).powi(2) + (pb[2] - pa[2]).powi(2)).sqrt()
            } else {
                eq.member_length_m.get(i).copied().unwrap_or(0.0)
            };
            if l <= 0.0 {
                continue;
            }
            // vertical force of the member on end a: T (y_b - y_a) / L
            let on_a = t * (eq.positions_m[b][1] - eq.positions_m[a][1]) / l;
            if on_a > tiny {
                out[a].push((i, b, on_a));
            } else if -on_a > tiny {
                out[b].push((i, a, -on_a));
            } else if t.abs() > tiny {
                let free = |j: usize| matches!(net.nodes[j].fixity, Fixity::Free);
                if free(a) {
                    level[a].push((i, b));
                } else if free(b) {
                    level[b].push((i, a));
                }
            }
        }
        let floor_n: Vec<f64> = (0..n)
            .map(|j| match net.nodes[j].fixity {
                Fixity::Floor { .. } => eq.floor_force_n.get(j).copied().unwrap_or(0.0).max(0.0),
                _ => 0.0,
            })
            .collect();
        let held_n = (0..n).map(|j| floor_n[j] + out[j].iter().map(|x| x.2).sum::<f64>()).collect();
        let anchor = net.nodes.iter().map(|x| matches!(x.fixity, Fixity::Fixed)).collect();
        let rank = topological_rank(&out, eq);
        let mut by_rank = vec![0; n];
        for (j, &r) in rank.iter().enumerate() {
            by_rank[r] = j;
        }
        LoadFlow { out, level, held_n, floor_n, anchor, rank, by_rank, n_members: net.members.len() }
    }

    /// Trace the loads `sources` (node, weight N) together to the supports;
    /// shares are fractions of their total weight. Members and supports with
    /// a share of at least `threshold` are listed.
    /// At most `max_listed` members are listed (the largest shares).
    pub fn trace(
        &self,
        sources: &[(usize, f64)],
        threshold: f64,
        max_listed: usize,
        scratch: &mut TraceScratch,
    ) -> LoadPath {
        let n = self.out.len();
        let sc = scratch;
        if sc.pending.len() != n || sc.member_flow.len() != self.n_members {
            *sc = TraceScratch {
                member_flow: vec![0.0; self.n_members],
                support_flow: vec![0.0; n],
                pending: vec![0.0; n],
                queued: vec![false; n],
                through: vec![0.0; n],
                waiting: vec![0; n.div_ceil(64)],
                cursor: n,
                ..TraceScratch::default()
            };
        }
        let total: f64 = sources.iter().filter(|s| s.0 < n).map(|s| s.1.max(0.0)).sum();
        let node = sources.first().map_or(0, |s| s.0);
        if total <= 0.0 {
            return LoadPath {
                node,
                members: Vec::new(),
                members_below_threshold: 0,
                members_not_listed: 0,
                supports: Vec::new(),
                supports_below_threshold: 0,
                untraced: 0.0,
            };
        }
        let cut = threshold.max(0.0) * CUT_RATIO;
        let mut untraced = 0.0;
        for &(j, w) in sources {
            if j < n && w > 0.0 {
                sc.pending[j] += w / total;
                if !sc.queued[j] {
                    sc.queued[j] = true;
                    sc.push(self.rank[j]);
                }
            }
        }
        // a cycle that keeps nearly all of what goes round it (a loop of
        // members prestressed far above the load) would be split round and
        // round for as long as its flow stays above the cut: a budget of
        // node splits bounds the work, and what is still pending when it
        // runs out is reported untraced
        let mut budget = SPLITS_PER_NODE * n + 1_000;
        while let Some(r) = sc.pop() {
            let j = self.by_rank[r];
            if budget == 0 {
                sc.queued[j] = false;
                untraced += std::mem::take(&mut sc.pending[j]);
                continue;
            }
            budget -= 1;
            sc.queued[j] = false;
            let a = std::mem::take(&mut sc.pending[j]);
            if a <= 0.0 {
                continue;
            }
            if sc.through[j] == 0.0 {
                sc.touched_nodes.push(j);
            }
            sc.through[j] += a;
            let held = self.held_n[j];
            if self.anchor[j] {
                if sc.support_flow[j] == 0.0 {
                    sc.touched_supports.push(j);
                }
                sc.support_flow[j] += a;
                continue;
            }
            if a < cut || held <= 0.0 {
                untraced += a;
                continue;
            }
            if self.floor_n[j] > 0.0 {
                if sc.support_flow[j] == 0.0 {
                    sc.touched_supports.push(j);
                }
                sc.support_flow[j] += a * self.floor_n[j] / held;
            }
            for &(i, to, v) in &self.out[j] {
                let f = a * v / held;
                if sc.member_flow[i] == 0.0 {
                    sc.touched_members.push(i);
                }
                sc.member_flow[i] += f;
                sc.pending[to] += f;
                if !sc.queued[to] {
                    sc.queued[to] = true;
                    sc.push(self.rank[to]);
                }
            }
        }
        // level members between two nodes the weight passes through
        for &j in &sc.touched_nodes {
            for &(i, other) in &self.level[j] {
                let f = sc.through[j].min(sc.through[other]);
                if f > 0.0 {
                    if sc.member_flow[i] == 0.0 {
                        sc.touched_members.push(i);
                    }
                    sc.member_flow[i] = f;
                }
            }
        }
        for &j in &sc.touched_nodes {
            sc.through[j] = 0.0;
        }
        sc.touched_nodes.clear();
        let (mut members, members_below_threshold) = collect(&mut sc.touched_members, &mut sc.member_flow, threshold);
        // weight going round a loop passes its members again and again; no
        // member carries more than the whole weight
        for m in &mut members {
            m.1 = m.1.min(1.0);
        }
        let members_not_listed = members.len().saturating_sub(max_listed);
        if members_not_listed > 0 && max_listed > 0 {
            // the largest shares (ties: the lower index) first, the rest cut
            members.select_nth_unstable_by(max_listed - 1, |a, b| b.1.total_cmp(&a.1).then(a.0.cmp(&b.0)));
            members.truncate(max_listed);
            members.sort_unstable_by_key(|m| m.0);
        } else if members_not_listed > 0 {
            members.clear();
        }
        let (supports, supports_below_threshold) = collect(&mut sc.touched_supports, &mut sc.support_flow, threshold);
        LoadPath {
            node,
            members,
            members_below_threshold,
            members_not_listed,
            supports,
            supports_below_threshold,
            untraced,
        }
    }
}

impl TraceScratch {
    fn push(&mut self, rank: usize) {
        self.waiting[rank >> 6] |= 1 << (rank & 63);
        // a node on a cycle may come back below the cursor
        self.cursor = self.cursor.min(rank);
    }

    fn pop(&mut self) -> Option<usize> {
        let mut w = self.cursor >> 6;
        let mut word = self.waiting.get(w)? & (u64::MAX << (self.cursor & 63));
        loop {
            if word != 0 {
                let rank = (w << 6) + word.trailing_zeros() as usize;
                self.waiting[w] &= !(1 << (rank & 63));
                self.cursor = rank;
                return Some(rank);
            }
            w += 1;
            match self.waiting.get(w) {
                Some(&x) => word = x,
                None => {
                    self.cursor = w << 6;
                    return None;
                }
            }
        }
    }
}

/// The listed items (share ≥ threshold, ascending) and the count below it;
/// clears the scratch it read.
fn collect(touched: &mut Vec<usize>, flow: &mut [f64], threshold: f64) -> (Vec<(usize, f64)>, usize) {
    let mut listed = Vec::new();
    let mut below = 0;
    for &i in touched.iter() {
        let f = std::mem::take(&mut flow[i]);
        if f >= threshold {
            listed.push((i, f));
        } else if f > 0.0 {
            below += 1;
        }
    }
    touched.clear();
    // only the listed ones are put in order (a trace touches thousands)
    listed.sort_unstable_by_key(|x| x.0);
    (listed, below)
}

/// Each node's place in the flow's topological order (Kahn's algorithm);
/// nodes on a cycle (a tie and a strut carrying weight round a loop) come
/// after, lowest first. The trace stays right on a cycle (a node is split
/// again when more arrives), only slower.
fn topological_rank(out: &[Vec<(usize, usize, f64)>], eq: &Equilibrium) -> Vec<usize> {
    let n = out.len();
    let mut indegree = vec![0usize; n];
    for list in out {
        for &(_, to, _) in list {
            indegree[to] += 1;
        }
    }
    let mut rank = vec![usize::MAX; n];
    let mut ready: Vec<usize> = (0..n).filter(|&j| indegree[j] == 0).collect();
    let mut next = 0;
    while let Some(j) = ready.pop() {
        rank[j] = next;
        next += 1;
        for &(_, to, _) in &out[j] {
            indegree[to] -= 1;
            if indegree[to] == 0 {
                ready.push(to);
            }
        }
    }
    let mut rest: Vec<usize> = (0..n).filter(|&j| rank[j] == usize::MAX).collect();
    rest.sort_by(|&a, &b| eq.positions_m[a][1].total_cmp(&eq.positions_m[b][1]));
    for j in rest {
        rank[j] = next;
        next += 1;
    }
    rank
}

/// Load paths of every loaded node that is not an anchor, each load traced
/// alone, listing members and supports with a share of at least `threshold`
/// (a fraction of that node's weight, e.g. 0.01).
pub fn load_paths(net: &Network, eq: &Equilibrium, loads_n: &[[f64; 3]], threshold: f64) -> Vec<LoadPath> {
    let starts: Vec<usize> = loads_n
        .iter()
        .enumerate()
        .take(net.nodes.len())
        .filter(|(_, l)| l.iter().any(|c| *c != 0.0))
        .map(|(i, _)| i)
        .collect();
    load_paths_from(net, eq, &starts, threshold)
}

/// Load paths from the nodes `starts` (anchors are skipped), each traced
/// alone under a unit weight, as [`load_paths`].
pub fn load_paths_from(net: &Network, eq: &Equilibrium, starts: &[usize], threshold: f64) -> Vec<LoadPath> {
    let flow = LoadFlow::new(net, eq);
    let mut scratch = TraceScratch::default();
    starts
        .iter()
        .filter(|&&j| j < net.nodes.len() && !matches!(net.nodes[j].fixity, Fixity::Fixed))
        .map(|&j| flow.trace(&[(j, 1.0)], threshold, usize::MAX, &mut scratch))
        .collect()
}

#[cfg(test)]
mod tests {
    use super::*;

    // A loop of two nodes holding each other up with 1 MN while a 1 N
    // member leaks to the anchor: a unit weight at node 1 goes round the
    // loop about a million times before its flow falls below the cut. The
    // trace stops at its budget of splits: what reached the anchor and what
    // is left untraced add up to the weight (1e-12, roundoff), most is
    // untraced, and no member claims more than the whole weight.
    #[test]
    fn a_loop_that_keeps_its_flow_ends_within_the_budget() {
        let flow = LoadFlow {
            out: vec![Vec::new(), vec![(0, 2, 1.0e6)], vec![(1, 1, 1.0e6), (2, 0, 1.0)]],
            level: vec![Vec::new(); 3],
            held_n: vec![0.0, 1.0e6, 1.0e6 + 1.0],
            floor_n: vec![0.0; 3],
            anchor: vec![true, false, false],
            rank: vec![2, 0, 1],
            by_rank: vec![1, 2, 0],
            n_members: 3,
        };
        let mut scratch = TraceScratch::default();
        // a threshold of 1e-9 lists the anchor however little reaches it
        let path = flow.trace(&[(1, 1.0)], 1e-9, usize::MAX, &mut scratch);
        let supported: f64 = path.supports.iter().map(|s| s.1).sum();
        assert!((supported + path.untraced - 1.0).abs() < 1e-12, "{path:?}");
        assert!(path.untraced > 0.5, "most of the weight is still going round: {path:?}");
        // the loop's members are passed again and again: each carries at
        // most the whole weight
        assert!(path.members.iter().all(|m| m.1 <= 1.0), "{path:?}");
        // a second trace with the same scratch starts clean
        let again = flow.trace(&[(1, 1.0)], 1e-9, usize::MAX, &mut scratch);
        assert_eq!(again, path);
    }
}
