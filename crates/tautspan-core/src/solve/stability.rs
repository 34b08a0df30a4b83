//! Whether an equilibrium is stable: a minimum of the total potential has a
//! positive semi-definite tangent stiffness; a rig balanced like an
//! inverted pendulum (a strut standing on a pin, a line drawn straight up
//! from its anchor with the load exactly above) is an equilibrium too, but a
//! maximum along some direction, and the least push topples it. The solver
//! can land on one exactly when the drawing is exactly symmetric, since the
//! out-of-balance force there is zero; this test tells them apart.
//!
//! Method: the tangent at the equilibrium, shifted by 1e-10 × the largest
//! spring rate at a node, is factorised by Cholesky; the factorisation
//! exists exactly when no eigenvalue lies below minus that shift. A
//! semi-definite tangent (slack parts, a node free along a direction that
//! carries nothing) passes; a negative geometric stiffness `T/L` of a
//! member in compression not held by the rest of the rig fails. The node
//! named is the one with the most negative diagonal entry, where one is
//! negative (the toppling node itself in the cases above).

use super::equilibrium::Equilibrium;
use super::error::SolveError;
use super::static_solver::StaticSolver;

/// The shift as a fraction of the largest spring rate at a node (as in the
/// path stiffness: below it, the tangent's roundoff).
const SHIFT: f64 = 1e-10;

/// Why an equilibrium is not stable.
#[derive(Debug, Clone, PartialEq)]
pub struct Unstable {
    /// The node where the tangent is most negative, when one is.
    pub node: Option<String>,
}

impl StaticSolver {
    /// `Ok(None)` when `eq` (an equilibrium of this solver's network) is
    /// stable, `Ok(Some(..))` when it is an unstable balance.
    ///
    /// # Errors
    /// [`SolveError::InvalidInput`] when `eq` belongs to another network.
    pub fn instability(&mut self, eq: &Equilibrium) -> Result<Option<Unstable>, SolveError> {
        if eq.displacements_m.len() != self.model.node_dofs.len() {
            return Err(SolveError::InvalidInput {
                item: "stability".to_owned(),
                reason: "equilibrium belongs to another network".to_owned(),
            });
        }
        let Some(factor) = self.factor.as_mut() else { return Ok(None) };
        let mut k_values = vec![0.0; self.model.matrix.val().len()];
        self.model.tangent(&eq.displacements_m, None, &mut k_values);
        let shift = SHIFT * self.model.stiffness_scale_n_per_m;
        let values = self.model.matrix.val_mut();
        values.copy_from_slice(&k_values);
        for &slot in &self.model.diag_slots {
            values[slot] += shift;
        }
        if factor.factorize(self.model.matrix.as_ref()) {
            return Ok(None);
        }
        let worst = self
            .model
            .diag_slots
            .iter()
            .enumerate()
            .map(|(dof, &slot)| (dof, k_values[slot]))
            .filter(|(_, k)| *k < -shift)
            .min_by(|a, b| a.1.total_cmp(&b.1))
            .map(|(dof, _)| self.model.node_name(self.model.dof_node[dof]));
        Ok(Some(Unstable { node: worst }))
    }
}
