//! The solver's internal form of a [`Network`]: the numbering of the free
//! degrees of freedom, the member and floor data in the form the kernels use,
//! and the FIXED sparsity pattern of the tangent stiffness (lower triangle),
//! with, for every member, the value slots its 6 × 6 block scatters into.
//!
//! The pattern holds every member's block whether the member is slack or
//! not, and every diagonal entry, so one symbolic Cholesky factorisation
//! serves every Newton iteration, every repeated solve and every time step.

use faer::sparse::{SparseColMat, Triplet};

use super::error::SolveError;
use super::network::{AxialLaw, Fixity, Network};

/// Marks "no degree of freedom" / "no slot".
pub(crate) const NONE: usize = usize::MAX;

/// A member as the kernels see it.
#[derive(Debug, Clone)]
pub(crate) struct MemberData {
    pub ends: [usize; 2],
    /// The drawn chord from end 0 to end 1, m: the kernels work in
    /// displacements from the drawing, and a member's vector is this plus
    /// the difference of its ends' displacements, so its length keeps its
    /// digits however far from zero the rig is drawn.
    pub d0_m: [f64; 3],
    /// Spring rate `EA / L0`, N/m.
    pub k_n_per_m: f64,
    pub rest_m: f64,
    pub tension_only: bool,
    /// A rope over sheaves: `rest_m` is then the weighted rest length `Λ0`
    /// and `k_n_per_m` the rate `κ` on it (see [`NetMember`](super::network::NetMember)).
    pub run: Option<Box<RunData>>,
}

/// A rope's path as the kernels see it.
#[derive(Debug, Clone)]
pub(crate) struct RunData {
    /// The distinct nodes of the path.
    pub nodes: Vec<usize>,
    /// Per segment: local indices (into `nodes`) of its two ends and its factor.
    pub segments: Vec<(usize, usize, f64)>,
    /// Per segment, its drawn chord, m (see [`MemberData::d0_m`]).
    pub chords: Vec<[f64; 3]>,
    /// Value slot of each entry (p, q) of the run's 3u × 3u block (local
    /// order node-major, x y z), or [`NONE`].
    pub slots: Vec<usize>,
}

impl MemberData {
    /// The kernel form of a network member; `drawn` are the drawn positions.
    fn from_net(m: &super::network::NetMember, drawn: &[[f64; 3]]) -> Self {
        let tension_only = matches!(m.law, AxialLaw::TensionOnly);
        let chord = |a: usize, b: usize| [0, 1, 2].map(|ax| drawn[b][ax] - drawn[a][ax]);
        if !m.is_run() {
            return Self {
                ends: m.ends,
                d0_m: chord(m.ends[0], m.ends[1]),
                k_n_per_m: m.axial_stiffness_n / m.rest_length_m,
                rest_m: m.rest_length_m,
                tension_only,
                run: None,
            };
        }
        let mut nodes: Vec<usize> = Vec::new();
        let mut local = |n: usize| match nodes.iter().position(|&x| x == n) {
            Some(p) => p,
            None => {
                nodes.push(n);
                nodes.len() - 1
            }
        };
        let segs: Vec<(usize, usize, f64, f64)> = m
            .segments()
            .map(|(a, b, w)| {
                let (pa, pb) = (drawn[a], drawn[b]);
                let l = ((pb[0] - pa[0]).powi(2) + (pb[1] - pa[1]).powi(2) + (pb[2] - pa[2]).powi(2)).sqrt();
                (local(a), local(b), w, l)
            })
            .collect();
        // the unstretched length shared out over the segments as drawn
        let drawn_total: f64 = segs.iter().map(|s| s.3).sum();
        let scale = if drawn_total > 0.0 { m.rest_length_m / drawn_total } else { 1.0 };
        let lambda0: f64 = segs.iter().map(|s| s.2 * s.3 * scale).sum();
        let compliance: f64 = segs.iter().map(|s| s.2 * s.2 * s.3 * scale).sum::<f64>() / m.axial_stiffness_n;
        Self {
            ends: m.ends,
            d0_m: chord(m.ends[0], m.ends[1]),
            k_n_per_m: 1.0 / compliance,
            rest_m: lambda0,
            tension_only,
            run: Some(Box::new(RunData {
                nodes,
                segments: segs.iter().map(|s| (s.0, s.1, s.2)).collect(),
                chords: m.segments().map(|(a, b, _)| chord(a, b)).collect(),
                slots: Vec::new(),
            })),
        }
    }
}

/// A floor panel's feet: compression-only contacts on the feet's y
/// coordinates, coupled through the plate's flexibility (see
/// [`contact`](super::contact)). A floor node on no panel is a panel of one
/// foot with its own spring rate.
#[derive(Debug, Clone)]
pub(crate) struct FloorData {
    pub nodes: Vec<usize>,
    /// Index of each foot's y dof.
    pub dofs: Vec<usize>,
    /// Flexibility at the feet, row-major n × n, m/N.
    pub flex: Vec<f64>,
    /// A lone foot's spring rate, N/m: the law `F = k max(0, p)` exactly.
    pub single_k: Option<f64>,
    /// Per foot, a rate for the damping scale and the time step (1 / C_ii), N/m.
    pub rate_n_per_m: Vec<f64>,
    /// Value slot of each (i, j) of the coupling block, row-major n × n
    /// (the lower-triangle entry of the pair).
    pub slots: Vec<usize>,
}

/// Dof numbering, member data and sparsity pattern of one network.
#[derive(Debug, Clone)]
pub(crate) struct Model {
    /// Per node, the dof index of x, y, z or [`NONE`] where held.
    pub node_dofs: Vec<[usize; 3]>,
    /// Per dof, its node.
    pub dof_node: Vec<usize>,
    /// Per dof, its axis (0 x, 1 y, 2 z).
    pub dof_axis: Vec<usize>,
    pub members: Vec<MemberData>,
    pub floors: Vec<FloorData>,
    /// Node names for messages.
    pub names: Vec<String>,
    /// Drawn positions (held coordinates never move from them). The
    /// kernels' state is each node's displacement from here (zero for held
    /// coordinates), never its position: see [`MemberData::d0_m`].
    pub drawn_m: Vec<[f64; 3]>,
    /// Lumped mass per dof, kg.
    pub mass_per_dof_kg: Vec<f64>,
    /// Lower triangle of the tangent; values are rewritten in place.
    pub matrix: SparseColMat<usize, f64>,
    /// Per member, the value slot of each entry (p, q) of its 6 × 6 block
    /// (local order a.x a.y a.z b.x b.y b.z), or [`NONE`] for held dofs and
    /// entries above the diagonal.
    pub member_slots: Vec<[usize; 36]>,
    /// Per dof, the slot of its diagonal entry.
    pub diag_slots: Vec<usize>,
    /// A stiffness scale (largest sum of spring rates at one dof), N/m; sets
    /// the size of the Levenberg–Marquardt damping.
    pub stiffness_scale_n_per_m: f64,
    /// Bounding-box diagonal of the drawn geometry (at least 1 m), m.
    pub model_size_m: f64,
}

impl Model {
    /// Numbers the dofs and builds the pattern. The network must be validated.
    pub(crate) fn new(net: &Network) -> Result<Self, SolveError> {
        Self::with_plane(net, false)
    }

    /// As [`Model::new`]; with `in_plane` the free nodes get no z dof (they
    /// stay at their drawn z), for a network whose nodes all lie in one
    /// plane z = const and whose loads have no z part: there every member's
    /// direction has no z component, so the z rows of the gradient are zero
    /// and the z block of the tangent does not couple to x and y, and the
    /// full solution keeps every node in the plane exactly. Dropping those
    /// dofs leaves the answer as it is and the factorisation a third smaller.
    pub(crate) fn with_plane(net: &Network, in_plane: bool) -> Result<Self, SolveError> {
        let mut node_dofs = vec![[NONE; 3]; net.nodes.len()];
        let mut dof_node = Vec::new();
        let mut dof_axis = Vec::new();
        let mut mass_per_dof_kg = Vec::new();
        let mut floors: Vec<FloorData> = Vec::new();
        for (i, node) in net.nodes.iter().enumerate() {
            let axes: &[usize] = match node.fixity {
                Fixity::Free if in_plane => &[0, 1],
                Fixity::Free => &[0, 1, 2],
                Fixity::Floor { .. } => &[1],
                Fixity::Fixed => &[],
            };
            for &ax in axes {
                node_dofs[i][ax] = dof_node.len();
                dof_node.push(i);
                dof_axis.push(ax);
                mass_per_dof_kg.push(node.mass_kg);
            }
        }
        let mut on_plate = vec![false; net.nodes.len()];
        for plate in &net.plates {
            for &i in &plate.nodes {
                on_plate[i] = true;
            }
            let n = plate.nodes.len();
            floors.push(FloorData {
                nodes: plate.nodes.clone(),
                dofs: plate.nodes.iter().map(|&i| node_dofs[i][1]).collect(),
                flex: plate.flexibility_m_per_n.clone(),
                single_k: None,
                // the stiffest each foot can be with every foot in contact
                rate_n_per_m: match crate::library::dense::inverse(&plate.flexibility_m_per_n, n) {
                    Some(k) => (0..n).map(|i| k[i * n + i]).collect(),
                    None => (0..n).map(|i| 1.0 / plate.flexibility_m_per_n[i * n + i]).collect(),
                },
                slots: Vec::new(),
            });
        }
        for (i, node) in net.nodes.iter().enumerate() {
            if let Fixity::Floor { stiffness_n_per_m } = node.fixity
                && !on_plate[i]
            {
                floors.push(FloorData {
                    nodes: vec![i],
                    dofs: vec![node_dofs[i][1]],
                    flex: vec![1.0 / stiffness_n_per_m],
                    single_k: Some(stiffness_n_per_m),
                    rate_n_per_m: vec![stiffness_n_per_m],
                    slots: Vec::new(),
                });
            }
        }
        let n = dof_node.len();
        let drawn: Vec<[f64; 3]> = net.nodes.iter().map(|n| n.position_m).collect();
        let mut members: Vec<MemberData> = net.members.iter().map(|m| MemberData::from_net(m, &drawn)).collect();

        let local = |m: &MemberData| -> [usize; 6] {
            let a = node_dofs[m.ends[0]];
            let b = node_dofs[m.ends[1]];
            [a[0], a[1], a[2], b[0], b[1], b[2]]
        };
        let mut triplets: Vec<Triplet<usize, usize, f64>> = (0..n).map(|i| Triplet::new(i, i, 0.0)).collect();
        let run_dofs = |run: &RunData| -> Vec<usize> { run.nodes.iter().flat_map(|&n| node_dofs[n]).collect() };
        for m in &members {
            if let Some(run) = &m.run {
                let g = run_dofs(run);
                for &r in &g {
                    for &c in &g {
                        if r != NONE && c != NONE && r > c {
                            triplets.push(Triplet::new(r, c, 0.0));
                        }
                    }
                }
                continue;
            }
            let g = local(m);
            for &r in &g {
                for &c in &g {
                    if r != NONE && c != NONE && r > c {
                        triplets.push(Triplet::new(r, c, 0.0));
                    }
                }
            }
        }
        for f in &floors {
            for &r in &f.dofs {
                for &c in &f.dofs {
                    if r > c {
                        triplets.push(Triplet::new(r, c, 0.0));
                    }
                }
            }
        }
        let matrix = SparseColMat::<usize, f64>::try_new_from_triplets(n, n, &triplets)
            .map_err(|e| SolveError::Factorisation { reason: format!("{e:?}") })?;
        let slot = |r: usize, c: usize| -> usize {
            let sym = matrix.symbolic();
            let start = sym.col_ptr()[c];
            let end = sym.col_ptr()[c + 1];
            sym.row_idx()[start..end].iter().position(|&row| row == r).map_or(NONE, |p| start + p)
        };
        let diag_slots: Vec<usize> = (0..n).map(|i| slot(i, i)).collect();
        for m in &mut members {
            if let Some(run) = &mut m.run {
                let g = run_dofs(run);
                run.slots = g
                    .iter()
                    .flat_map(|&r| g.iter().map(move |&c| (r, c)))
                    .map(|(r, c)| if r != NONE && c != NONE && r >= c { slot(r, c) } else { NONE })
                    .collect();
            }
        }
        let member_slots: Vec<[usize; 36]> = members
            .iter()
            .map(|m| {
                if m.run.is_some() {
                    return [NONE; 36];
                }
                let g = local(m);
                let mut s = [NONE; 36];
                for p in 0..6 {
                    for q in 0..6 {
                        if g[p] != NONE && g[q] != NONE && g[p] >= g[q] {
                            s[p * 6 + q] = slot(g[p], g[q]);
                        }
                    }
                }
                s
            })
            .collect();
        for f in &mut floors {
            f.slots = f
                .dofs
                .iter()
                .flat_map(|&r| f.dofs.iter().map(move |&c| (r.max(c), r.min(c))))
                .map(|(r, c)| slot(r, c))
                .collect();
        }

        let mut rate_sum = vec![0.0; net.nodes.len()];
        for m in &members {
            for n in m.touched() {
                rate_sum[n] += m.k_n_per_m;
            }
        }
        for f in &floors {
            for (&node, k) in f.nodes.iter().zip(&f.rate_n_per_m) {
                rate_sum[node] += k;
            }
        }
        let stiffness_scale_n_per_m = rate_sum.iter().copied().fold(0.0, f64::max).max(f64::MIN_POSITIVE);

        let drawn_m = drawn;
        let mut lo = [f64::INFINITY; 3];
        let mut hi = [f64::NEG_INFINITY; 3];
        for p in &drawn_m {
            for ax in 0..3 {
                lo[ax] = lo[ax].min(p[ax]);
                hi[ax] = hi[ax].max(p[ax]);
            }
        }
        let diag2: f64 = (0..3).map(|ax| (hi[ax] - lo[ax]).powi(2)).sum();
        let model_size_m = if diag2.is_finite() { diag2.sqrt().max(1.0) } else { 1.0 };

        Ok(Self {
            node_dofs,
            dof_node,
            dof_axis,
            members,
            floors,
            names: net.nodes.iter().map(|n| n.name.clone()).collect(),
            drawn_m,
            mass_per_dof_kg,
            matrix,
            member_slots,
            diag_slots,
            stiffness_scale_n_per_m,
            model_size_m,
        })
    }

    /// Number of free dofs.
    pub(crate) fn n_dofs(&self) -> usize {
        self.dof_node.len()
    }

    /// Gathers the dof values of per-node vectors (loads, velocities, …).
    pub(crate) fn gather(&self, per_node: &[[f64; 3]], out: &mut [f64]) {
        for (node, dofs) in self.node_dofs.iter().enumerate() {
            for ax in 0..3 {
                if dofs[ax] != NONE {
                    out[dofs[ax]] = per_node[node][ax];
                }
            }
        }
    }

    /// The kernels' start state: displacements from the drawing, the free
    /// coordinates taken from the positions `start` and the held ones zero.
    pub(crate) fn start_positions(&self, start: Option<&[[f64; 3]]>) -> Vec<[f64; 3]> {
        let mut u = vec![[0.0; 3]; self.drawn_m.len()];
        if let Some(start) = start {
            for (node, dofs) in self.node_dofs.iter().enumerate() {
                for ax in 0..3 {
                    if dofs[ax] != NONE {
                        u[node][ax] = start[node][ax] - self.drawn_m[node][ax];
                    }
                }
            }
        }
        u
    }

    /// Positions from displacements.
    pub(crate) fn to_world(&self, u: &[[f64; 3]]) -> Vec<[f64; 3]> {
        u.iter().zip(&self.drawn_m).map(|(d, p)| [0, 1, 2].map(|ax| p[ax] + d[ax])).collect()
    }

    /// Adds a dof increment to positions.
    pub(crate) fn add_step(&self, pos: &[[f64; 3]], step: &[f64], out: &mut [[f64; 3]]) {
        out.copy_from_slice(pos);
        for (node, dofs) in self.node_dofs.iter().enumerate() {
            for ax in 0..3 {
                if dofs[ax] != NONE {
                    out[node][ax] += step[dofs[ax]];
                }
            }
        }
    }
}

impl MemberData {
    /// The distinct nodes the member acts on (its two ends, or a rope's whole path).
    pub(crate) fn touched(&self) -> Vec<usize> {
        match &self.run {
            Some(run) => run.nodes.clone(),
            None => self.ends.to_vec(),
        }
    }
}

impl Model {
    /// Name of a node for messages.
    pub(crate) fn node_name(&self, node: usize) -> String {
        self.names.get(node).cloned().unwrap_or_else(|| format!("#{node}"))
    }

    /// The node farthest from its drawn position (displacements `u`) and that distance, m.
    pub(crate) fn farthest(&self, u: &[[f64; 3]]) -> Option<(usize, f64)> {
        let mut best: Option<(usize, f64)> = None;
        for (i, p) in u.iter().enumerate() {
            let dist = p[0].hypot(p[1]).hypot(p[2]);
            if best.is_none_or(|(_, b)| dist > b) {
                best = Some((i, dist));
            }
        }
        best
    }
}
