//! Errors of the load-path solvers. Each one names the node or member at
//! fault and says why, so the caller can show it to the user as is.

use thiserror::Error;

/// Why a solve or a simulation could not give an answer.
#[derive(Debug, Clone, PartialEq, Error)]
pub enum SolveError {
    /// The network description is unusable: a non-finite number, a
    /// non-positive stiffness or rest length, a member end out of range or a
    /// member joining a node to itself, or a load or start array of the wrong
    /// length.
    ///
    /// Remedy: fix the named item in the scenario (the model layer normally
    /// rejects these before the solver sees them).
    #[error("invalid input at {item}: {reason}")]
    InvalidInput {
        /// The node or member (by name) or the argument at fault.
        item: String,
        /// What is wrong with it.
        reason: String,
    },

    /// A node carries a load but no chain of members connects it to an anchor
    /// or a floor, so nothing can hold it.
    ///
    /// Remedy: connect the node to a support, or make it an anchor.
    #[error("node {node} is loaded but has no load path: no members connect it to an anchor or a floor")]
    NoLoadPath {
        /// Name of the loaded node.
        node: String,
    },

    /// During the solve a node moved far beyond the size of the model: it is
    /// connected, but nothing that carries force holds it in the direction of
    /// its load (for example a floor node pulled upwards with nothing else on
    /// it, or a mechanism).
    ///
    /// Remedy: add a member or a support that holds the node in that direction.
    #[error(
        "node {node} runs away (moved {distance_m:.3e} m, model size {model_size_m:.3e} m): nothing carrying force holds it"
    )]
    RunAway {
        /// Name of the node that ran away.
        node: String,
        /// How far it moved from its drawn position, m.
        distance_m: f64,
        /// The model size used for the test (bounding box diagonal), m.
        model_size_m: f64,
    },

    /// The damped Newton iteration reached its iteration limit before the
    /// out-of-balance force fell below the tolerance.
    ///
    /// Remedy: raise the iteration limit, check for nearly-mechanisms (very
    /// flat slack lines) or members whose stiffness differs by many orders of
    /// magnitude.
    #[error(
        "no convergence after {iterations} iterations: out-of-balance force {residual_n:.3e} N at node {worst_node} (tolerance {tolerance_n:.3e} N)"
    )]
    NotConverged {
        /// Iterations (trial steps) made.
        iterations: usize,
        /// Largest out-of-balance force component reached, N.
        residual_n: f64,
        /// Tolerance that was asked for, N.
        tolerance_n: f64,
        /// Name of the node with the largest out-of-balance force.
        worst_node: String,
    },

    /// The answer holds a number that is not finite, or an out-of-balance
    /// force above its tolerance: the loads or stiffnesses are beyond what
    /// double precision can solve (a load of 1e150 N, say), so no force is
    /// reported.
    ///
    /// Remedy: check the named input for a slip of units or exponent.
    #[error("no usable answer: {what} (the loads or stiffnesses are beyond what the solver can resolve)")]
    NotFinite {
        /// What was found.
        what: String,
    },

    /// The sparse Cholesky factorisation could not be set up (out of memory
    /// or an internal limit of the linear algebra library).
    ///
    /// Remedy: reduce the model size; report it if it happens on a small model.
    #[error("sparse factorisation failed: {reason}")]
    Factorisation {
        /// The library's message.
        reason: String,
    },
}
