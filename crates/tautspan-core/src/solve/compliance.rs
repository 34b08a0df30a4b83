//! Effective stiffness of the load path at a node along a direction, from the
//! tangent stiffness at an equilibrium: `k_eff = 1 / (dᵀ K⁻¹ d)` with `d` the
//! unit direction placed at the node's free dofs. This is the spring rate a
//! mass at that node feels for a small extra displacement along `d`, with the
//! rest of the network free to follow; the drop / snatch case uses it.
//!
//! Where the tangent is singular (a slack part of the network, a mechanism),
//! a tiny diagonal shift of 1e-10 × the largest spring rate at a node is
//! added so the factorisation exists: directions the network does not resist
//! then come out with a correspondingly tiny stiffness (≈ 1e-10 × that rate),
//! and parts that do not couple to `d` do not change the answer.

use super::equilibrium::Equilibrium;
use super::error::SolveError;
use super::model::NONE;
use super::static_solver::StaticSolver;

impl StaticSolver {
    /// Effective stiffness at `node` along `direction` (need not be unit
    /// length), N/m, at the equilibrium `eq` of this solver's network.
    ///
    /// # Errors
    /// [`SolveError::InvalidInput`] when the node index is out of range, the
    /// direction is zero or not finite, `eq` does not belong to this network,
    /// or the node is held in every component of the direction (an anchor).
    pub fn effective_stiffness(
        &mut self,
        eq: &Equilibrium,
        node: usize,
        direction: [f64; 3],
    ) -> Result<f64, SolveError> {
        let invalid = |reason: &str| SolveError::InvalidInput {
            item: "effective stiffness".to_owned(),
            reason: reason.to_owned(),
        };
        if node >= self.model.node_dofs.len() {
            return Err(invalid("node index out of range"));
        }
        if eq.positions_m.len() != self.model.node_dofs.len() {
            return Err(invalid("equilibrium belongs to another network"));
        }
        let len = direction.iter().map(|c| c * c).sum::<f64>().sqrt();
        if !(len.is_finite() && len > 0.0) {
            return Err(invalid("direction must be finite and non-zero"));
        }
        let d = direction.map(|c| c / len);
        if d[2] != 0.0 {
            self.go_three_d()?;
        }
        let dofs = self.model.node_dofs[node];
        if (0..3).all(|ax| dofs[ax] == NONE || d[ax] == 0.0) {
            return Err(invalid("the node is held along that direction"));
        }
        let Some(factor) = self.factor.as_mut() else {
            return Err(invalid("the network has no free coordinates"));
        };
        let mut k_values = vec![0.0; self.model.matrix.val().len()];
        self.model.tangent(&eq.displacements_m, None, &mut k_values);
        let scale = self.model.stiffness_scale_n_per_m;
        let mut shift = 0.0;
        loop {
            let values = self.model.matrix.val_mut();
            values.copy_from_slice(&k_values);
            for &slot in &self.model.diag_slots {
                values[slot] += shift;
            }
            if factor.factorize(self.model.matrix.as_ref()) {
                break;
            }
            // Indefinite tangents (rods in compression past buckling) are
            // not a stable equilibrium; the growing shift still yields a
            // finite, documented answer rather than a NaN.
            shift = if shift == 0.0 { 1e-10 * scale } else { shift * 100.0 };
            if shift > scale {
                return Err(invalid("the tangent is not positive definite at this equilibrium"));
            }
        }
        let mut rhs = vec![0.0; self.model.n_dofs()];
        for ax in 0..3 {
            if dofs[ax] != NONE {
                rhs[dofs[ax]] = d[ax];
            }
        }
        let d_dof = rhs.clone();
        factor.solve_in_place(&mut rhs);
        let compliance: f64 = rhs.iter().zip(&d_dof).map(|(x, d)| x * d).sum();
        if compliance > 0.0 && compliance.is_finite() {
            Ok(1.0 / compliance)
        } else {
            Err(invalid("the compliance along that direction is not positive"))
        }
    }
}
