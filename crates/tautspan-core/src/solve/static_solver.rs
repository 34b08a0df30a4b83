//! Large-displacement static equilibrium of a [`Network`]: the solver
//! object that keeps the dof numbering, the sparsity pattern and the
//! symbolic Cholesky factorisation of one network, so the dynamic cases can
//! re-solve many times (scaled loads, warm starts) at the cost of the numeric
//! work only.

use super::equilibrium::Equilibrium;
use super::error::SolveError;
use super::factor::Factor;
use super::model::Model;
use super::network::Network;
use super::newton::{SolveOptions, Workspace, minimise};
use super::validate::{Components, validate_network, validate_per_node};

/// A static solver bound to one network.
#[derive(Debug)]
pub struct StaticSolver {
    pub(crate) net: Network,
    pub(crate) model: Model,
    pub(crate) factor: Option<Factor>,
    components: Components,
    ws: Workspace,
    loads_dof: Vec<f64>,
}

/// The force tolerance for loads `loads_n`: the relative tolerance times
/// Σ |load| over nodes, at least the absolute floor.
pub(crate) fn force_tolerance(loads_n: &[[f64; 3]], opts: &SolveOptions) -> f64 {
    let total: f64 = loads_n.iter().map(|l| (l[0] * l[0] + l[1] * l[1] + l[2] * l[2]).sqrt()).sum();
    (opts.relative_tolerance * total).max(opts.absolute_tolerance_n)
}

impl StaticSolver {
    /// Validates the network and does the symbolic analysis once.
    ///
    /// # Errors
    /// [`SolveError::InvalidInput`] for a non-finite number, a non-positive
    /// stiffness or rest length, or a bad member end;
    /// [`SolveError::Factorisation`] if the pattern cannot be analysed.
    pub fn new(net: &Network) -> Result<Self, SolveError> {
        validate_network(net)?;
        let model = Model::new(net)?;
        let factor = if model.n_dofs() > 0 { Some(Factor::new(model.matrix.symbolic())?) } else { None };
        Ok(Self {
            net: net.clone(),
            components: Components::new(net),
            ws: Workspace::default(),
            loads_dof: vec![0.0; model.n_dofs()],
            model,
            factor,
        })
    }

    /// The network this solver was built for.
    pub fn network(&self) -> &Network {
        &self.net
    }

    /// Solves for equilibrium under `loads_n` (one entry per node, N),
    /// starting from `start_m` (one position per node; only the free
    /// coordinates are used) or from the drawn geometry.
    ///
    /// # Errors
    /// [`SolveError::InvalidInput`] for arrays of the wrong length or
    /// non-finite entries; [`SolveError::NoLoadPath`] for a loaded node with
    /// no members to a support; [`SolveError::RunAway`] when a node moves
    /// beyond the model size; [`SolveError::NotConverged`] at the iteration
    /// limit.
    pub fn solve(
        &mut self,
        loads_n: &[[f64; 3]],
        start_m: Option<&[[f64; 3]]>,
        opts: &SolveOptions,
    ) -> Result<Equilibrium, SolveError> {
        validate_per_node(&self.net, "loads", loads_n)?;
        if let Some(start) = start_m {
            validate_per_node(&self.net, "start positions", start)?;
        }
        self.components.check_loads(&self.net, loads_n)?;
        self.model.gather(loads_n, &mut self.loads_dof);
        let mut pos = self.model.start_positions(start_m);
        let tol_n = force_tolerance(loads_n, opts);
        let out = minimise(
            &mut self.model,
            self.factor.as_mut(),
            &mut self.ws,
            &mut pos,
            &self.loads_dof,
            None,
            opts,
            tol_n,
        )?;
        Ok(Equilibrium::from_positions(&self.model, loads_n, pos, out.iterations, out.residual_n))
    }
}

/// Solves the network under its own node loads from the drawn geometry.
///
/// # Errors
/// As [`StaticSolver::new`] and [`StaticSolver::solve`].
pub fn solve_static(net: &Network, opts: &SolveOptions) -> Result<Equilibrium, SolveError> {
    let loads: Vec<[f64; 3]> = net.nodes.iter().map(|n| n.load_n).collect();
    StaticSolver::new(net)?.solve(&loads, None, opts)
}
