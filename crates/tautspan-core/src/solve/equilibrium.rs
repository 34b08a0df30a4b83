//! The result of a static solve: positions, member forces and lengths,
//! floor normal forces and support reactions at equilibrium.
//!
//! Sign conventions: member force positive in tension; floor force is the
//! normal force the slab carries (≥ 0); a reaction is the force the support
//! exerts ON the rig, so at equilibrium Σ reactions = −Σ loads.

use super::assemble::{member_state, run_segments};
use super::model::Model;

/// A static equilibrium of a [`Network`](super::Network).
#[derive(Debug, Clone, PartialEq)]
pub struct Equilibrium {
    /// Position of every node (held ones at their drawn positions), m.
    pub positions_m: Vec<[f64; 3]>,
    /// Displacement of every node from its drawn position, m: the solver's
    /// own state, so it keeps its digits wherever the rig is drawn
    /// (`positions_m − drawn` loses them far from zero).
    pub displacements_m: Vec<[f64; 3]>,
    /// Axial force per member, tension positive, N (0 for a slack rope); a
    /// rope over sheaves: its largest segment tension (see `NetMember`).
    pub member_force_n: Vec<f64>,
    /// Current length per member, m (a rope over sheaves: the sum of its segments).
    pub member_length_m: Vec<f64>,
    /// Normal force per node carried by its floor, N (≥ 0; 0 for nodes not
    /// on a floor and for floor nodes whose contact has opened).
    pub floor_force_n: Vec<f64>,
    /// Force each support exerts on the rig, N: non-zero only at anchors and
    /// floor nodes. A floor node's y component is its normal force; its x and
    /// z components are what the assumed friction or fixing carries.
    pub reaction_n: Vec<[f64; 3]>,
    /// Damped Newton trial steps used.
    pub iterations: usize,
    /// Largest out-of-balance force component left at a free dof, N.
    pub residual_n: f64,
    /// The force tolerance the solve met, N: the largest over the free dofs
    /// of each dof's own tolerance (see [`SolveOptions`](super::SolveOptions)).
    pub tolerance_n: f64,
}

impl Equilibrium {
    /// True when every number is finite and the out-of-balance force is
    /// within the tolerance the solve met: the check on any equilibrium
    /// before its forces are reported.
    pub fn is_sound(&self) -> bool {
        let finite3 = |v: &[[f64; 3]]| v.iter().all(|p| p.iter().all(|x| x.is_finite()));
        self.residual_n.is_finite()
            && self.tolerance_n.is_finite()
            && self.residual_n <= self.tolerance_n
            && finite3(&self.positions_m)
            && finite3(&self.displacements_m)
            && finite3(&self.reaction_n)
            && self.member_force_n.iter().chain(&self.member_length_m).chain(&self.floor_force_n).all(|x| x.is_finite())
    }
}

impl Equilibrium {
    /// Evaluates forces and reactions at converged displacements `positions_m`
    /// (the kernels' state). `loads_n` per node.
    pub(crate) fn from_positions(
        model: &Model,
        loads_n: &[[f64; 3]],
        positions_m: Vec<[f64; 3]>,
        iterations: usize,
        residual_n: f64,
        tolerance_n: f64,
    ) -> Self {
        let n_nodes = positions_m.len();
        let mut member_force_n = Vec::with_capacity(model.members.len());
        let mut member_length_m = Vec::with_capacity(model.members.len());
        // Force the members exert on each node.
        let mut on_node = vec![[0.0; 3]; n_nodes];
        for m in &model.members {
            let s = member_state(m, &positions_m);
            if let Some(run) = &m.run {
                let mut length = 0.0;
                for ((e, l, w), &(a, b, _)) in run_segments(run, &positions_m).zip(&run.segments) {
                    for ax in 0..3 {
                        on_node[run.nodes[a]][ax] += s.force_n * w * e[ax];
                        on_node[run.nodes[b]][ax] -= s.force_n * w * e[ax];
                    }
                    length += l;
                }
                member_force_n.push(s.force_n);
                member_length_m.push(length);
                continue;
            }
            for (ax, e) in s.e.iter().enumerate() {
                on_node[m.ends[0]][ax] += s.force_n * e;
                on_node[m.ends[1]][ax] -= s.force_n * e;
            }
            member_force_n.push(s.force_n);
            member_length_m.push(s.length_m);
        }
        let mut floor_force_n = vec![0.0; n_nodes];
        for f in &model.floors {
            for (&node, force) in f.nodes.iter().zip(f.forces_at(&positions_m)) {
                floor_force_n[node] = force;
            }
        }
        let mut reaction_n = vec![[0.0; 3]; n_nodes];
        for (i, dofs) in model.node_dofs.iter().enumerate() {
            for ax in 0..3 {
                if dofs[ax] == super::model::NONE {
                    reaction_n[i][ax] = -loads_n[i][ax] - on_node[i][ax];
                }
            }
        }
        for f in &model.floors {
            for &node in &f.nodes {
                reaction_n[node][1] = floor_force_n[node];
            }
        }
        Self {
            positions_m: model.to_world(&positions_m),
            displacements_m: positions_m,
            member_force_n,
            member_length_m,
            floor_force_n,
            reaction_n,
            iterations,
            residual_n,
            tolerance_n,
        }
    }
}
