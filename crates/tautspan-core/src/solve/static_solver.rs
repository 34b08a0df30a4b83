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
    /// The drawn plane z of a flat network solved without z dofs (see
    /// [`Model::with_plane`]); `None` once solved in three dimensions.
    plane_z: Option<f64>,
}

/// The common z of every node, when the network is flat in z.
fn flat_plane(net: &Network) -> Option<f64> {
    let z0 = net.nodes.first()?.position_m[2];
    net.nodes.iter().all(|n| n.position_m[2] == z0).then_some(z0)
}

/// The force tolerance for loads `loads_n`: the relative tolerance times
/// Σ |load| over nodes, at least the absolute floor.
pub(crate) fn force_tolerance(loads_n: &[[f64; 3]], opts: &SolveOptions) -> f64 {
    // hypot: a load of 1e160 N must not square to infinity (and an
    // infinite tolerance pass anything)
    let total: f64 = loads_n.iter().map(|l| l[0].hypot(l[1]).hypot(l[2])).sum();
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
        let plane_z = flat_plane(net);
        let model = Model::with_plane(net, plane_z.is_some())?;
        let factor = if model.n_dofs() > 0 { Some(Factor::new(model.matrix.symbolic())?) } else { None };
        Ok(Self {
            net: net.clone(),
            components: Components::new(net),
            ws: Workspace::default(),
            loads_dof: vec![0.0; model.n_dofs()],
            model,
            factor,
            plane_z,
        })
    }

    /// Whether the solver works without z dofs (a flat network, flat loads).
    pub fn is_flat(&self) -> bool {
        self.plane_z.is_some()
    }

    /// Leaves the flat form for the full three-dimensional one (a load or a
    /// start position out of the plane needs the z dofs).
    pub(crate) fn go_three_d(&mut self) -> Result<(), SolveError> {
        if self.plane_z.take().is_some() {
            self.model = Model::new(&self.net)?;
            self.factor = if self.model.n_dofs() > 0 { Some(Factor::new(self.model.matrix.symbolic())?) } else { None };
            self.loads_dof = vec![0.0; self.model.n_dofs()];
            self.ws = Workspace::default();
        }
        Ok(())
    }

    /// Goes three-dimensional when loads or start positions leave the plane.
    fn fit_plane(&mut self, loads_n: &[[f64; 3]], start_m: Option<&[[f64; 3]]>) -> Result<(), SolveError> {
        if let Some(z0) = self.plane_z {
            let off_loads = loads_n.iter().any(|l| l[2] != 0.0);
            let free = |i: usize| matches!(self.net.nodes[i].fixity, super::network::Fixity::Free);
            let off_start = start_m.is_some_and(|s| s.iter().enumerate().any(|(i, p)| free(i) && p[2] != z0));
            if off_loads || off_start {
                self.go_three_d()?;
            }
        }
        Ok(())
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
        self.fit_plane(loads_n, start_m)?;
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
        let eq =
            Equilibrium::from_positions(&self.model, loads_n, pos, out.iterations, out.residual_n, out.tolerance_n);
        if !eq.is_sound() {
            return Err(SolveError::NotFinite {
                what: if eq.residual_n.is_finite() && eq.tolerance_n.is_finite() {
                    format!(
                        "the out-of-balance force {:.3e} N is above the tolerance {:.3e} N",
                        eq.residual_n, eq.tolerance_n
                    )
                } else {
                    "the out-of-balance force or its tolerance is not a finite number".to_string()
                },
            });
        }
        Ok(eq)
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
