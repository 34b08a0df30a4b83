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

/// A member of the network: an axial spring between two nodes.
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
