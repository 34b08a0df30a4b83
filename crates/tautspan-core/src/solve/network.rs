//! The solver's own description of a rig: plain `f64` in SI base units, no ids
//! beyond display names, no file or library types. The model converts a
//! validated scenario into a [`Network`]; the static solver, the dynamic
//! cases and the time-domain integrator all work on it.
//!
//! Conventions: x to the right, y up, z towards the viewer; gravity acts along
//! −y; a member force is positive in tension.

/// How a member carries axial force.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum AxialLaw {
    /// Rope, cable, chain: force `EA/L0 · (L − L0)` when stretched, zero when slack.
    TensionOnly,
    /// Rod: the same linear law in tension and in compression.
    TensionAndCompression,
}

/// How a node is held.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum Fixity {
    /// A joint: all three coordinates free.
    Free,
    /// An anchor: all three coordinates held.
    Fixed,
    /// Resting on a floor slab: x and z held (friction or fixing assumed), y
    /// carried by a compression-only spring about the drawn height. When the
    /// rig would lift the node, contact opens and the spring force is zero.
    /// A node listed in one of [`Network::plates`] is carried by that
    /// plate's coupled flexibility instead, and its own stiffness here is
    /// only a rate for the time step (give `1 / C_ii`).
    Floor {
        /// Spring stiffness of the slab at the node (from plate bending), N/m.
        stiffness_n_per_m: f64,
    },
}

/// A node of the network.
#[derive(Debug, Clone, PartialEq)]
pub struct NetNode {
    /// Name for messages (the scenario's node id).
    pub name: String,
    /// Drawn position, m.
    pub position_m: [f64; 3],
    /// How it is held.
    pub fixity: Fixity,
    /// External load applied at the node (weights are `[0, −m g, 0]`), N.
    pub load_n: [f64; 3],
    /// Lumped mass at the node for the time-domain integrator, kg.
    pub mass_kg: f64,
}

/// A member of the network: an axial spring between two nodes, or one
/// continuous rope running from `ends[0]` over the sheave nodes `via` to
/// `ends[1]`.
///
/// A rope is one spring: its length is the sum of its segments, its rate
/// `EA / L0` over the whole unstretched length, and it carries one tension
/// `T` along it; segment `i` pulls with `T · segment_factors[i]` (1 over
/// frictionless sheaves; below 1 on the side a bearing's friction relieves).
/// With factors `w_i` the rope's energy is `½ κ (Λ − Λ0)²` over the weighted
/// length `Λ = Σ w_i L_i`, whose gradient pulls each segment with `T w_i`,
/// `T = κ (Λ − Λ0)`; `κ = EA / Σ w_i² L0_i` makes the stretch of each
/// segment `T w_i L0_i / EA` (and `EA / L0` when every factor is 1).
#[derive(Debug, Clone, PartialEq)]
pub struct NetMember {
    /// Name for messages (the scenario's member id).
    pub name: String,
    /// Indices into [`Network::nodes`].
    pub ends: [usize; 2],
    /// Axial stiffness `E·A`, N. The spring rate is `EA / rest_length_m`.
    pub axial_stiffness_n: f64,
    /// Unstretched length, m (drawn length + slack; less than drawn = pretension).
    pub rest_length_m: f64,
    /// Tension only or tension and compression.
    pub law: AxialLaw,
    /// Sheave nodes a rope passes over between its ends, in order (a block
    /// of several sheaves may be passed more than once); empty for a plain
    /// member.
    pub via: Vec<usize>,
    /// Per segment (`via.len() + 1` of them), its tension ÷ the member's
    /// force, each in (0, 1]; empty means 1 for every segment.
    pub segment_factors: Vec<f64>,
}

impl NetMember {
    /// A plain member between two nodes.
    pub fn straight(
        name: impl Into<String>,
        ends: [usize; 2],
        axial_stiffness_n: f64,
        rest_length_m: f64,
        law: AxialLaw,
    ) -> Self {
        Self {
            name: name.into(),
            ends,
            axial_stiffness_n,
            rest_length_m,
            law,
            via: Vec::new(),
            segment_factors: Vec::new(),
        }
    }

    /// The nodes along the member: its first end, the sheaves, its last end.
    pub fn path(&self) -> impl Iterator<Item = usize> + '_ {
        std::iter::once(self.ends[0]).chain(self.via.iter().copied()).chain(std::iter::once(self.ends[1]))
    }

    /// The segments `(from, to, factor)` in order; one for a plain member.
    pub fn segments(&self) -> impl Iterator<Item = (usize, usize, f64)> + '_ {
        let nodes: Vec<usize> = self.path().collect();
        (0..nodes.len() - 1).map(move |i| (nodes[i], nodes[i + 1], self.segment_factors.get(i).copied().unwrap_or(1.0)))
    }

    /// True for a rope over sheaves.
    pub fn is_run(&self) -> bool {
        !self.via.is_empty()
    }
}

/// A floor panel carrying several floor nodes (its feet) through plate
/// bending: the deflection under foot i is `w_i = Σ_j C_ij P_j`, each foot
/// compression-only (a lifted foot carries nothing; the plate under it
/// still deflects from the others).
#[derive(Debug, Clone, PartialEq)]
pub struct NetPlate {
    /// Name for messages (the scenario's floor id).
    pub name: String,
    /// The feet: indices into [`Network::nodes`], each with [`Fixity::Floor`].
    pub nodes: Vec<usize>,
    /// Flexibility at the feet, row-major n × n, m/N (symmetric positive definite).
    pub flexibility_m_per_n: Vec<f64>,
}

/// A whole rig as the solver sees it.
#[derive(Debug, Clone, PartialEq, Default)]
pub struct Network {
    /// Nodes; members refer to them by index.
    pub nodes: Vec<NetNode>,
    /// Members.
    pub members: Vec<NetMember>,
    /// Floor panels coupling their feet. Floor nodes in none of them are
    /// independent springs.
    pub plates: Vec<NetPlate>,
}
