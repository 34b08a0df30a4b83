//! Sparse Cholesky factorisation of the (damped) tangent: the symbolic
//! analysis is done once per [`Model`](super::model::Model) pattern; each
//! Newton iteration only redoes the numeric factorisation into the same
//! buffers, and the solve works in place.
//!
//! Two methods, chosen once per pattern by their operation counts: faer's
//! general sparse Cholesky after a fill-reducing AMD ordering, and an
//! envelope factorisation after reverse Cuthill–McKee ([`Envelope`]), which
//! wins for the narrow networks most rigs are (fewer instructions per
//! multiply-add) and loses for wide two-dimensional ones (more fill).

use faer::dyn_stack::{MemBuffer, MemStack, StackReq};
use faer::linalg::cholesky::llt::factor::LltRegularization;
use faer::sparse::SparseColMatRef;
use faer::sparse::SymbolicSparseColMatRef;
use faer::sparse::linalg::cholesky::{
    CholeskySymbolicParams, LltRef, SymbolicCholesky, SymbolicCholeskyRaw, SymmetricOrdering,
    factorize_symbolic_cholesky,
};
use faer::{Conj, MatMut, Par, Side};

use super::envelope::{Envelope, EnvelopePlan};
use super::error::SolveError;

/// A reusable Cholesky factorisation for one sparsity pattern.
pub(crate) struct Factor {
    method: Method,
    /// Whether the method holds a valid factor.
    valid: bool,
}

/// The two ways of factorising, each with its reusable buffers.
enum Method {
    /// faer's sparse Cholesky after AMD.
    Sparse { symbolic: SymbolicCholesky<usize>, l_values: Vec<f64>, mem: MemBuffer },
    /// The envelope method after reverse Cuthill–McKee.
    Envelope(Envelope),
}

/// Instructions per multiply-add of each method, measured on this
/// project's benchmarks (general sparse: index-driven scatter and gather;
/// envelope: contiguous dot products). Only their ratio matters.
const SPARSE_COST: f64 = 3.0;
const ENVELOPE_COST: f64 = 1.0;

/// Envelope multiply-adds per dof up to which the envelope is taken
/// without analysing the sparse alternative (a band of about twenty: there
/// the general method's per-entry overhead outweighs any fill it saves;
/// measured on this project's benchmarks).
const NARROW_OPS_PER_DOF: f64 = 256.0;

/// Multiply-adds of a simplicial factorisation with these column counts.
fn sparse_operation_count(symbolic: &SymbolicCholesky<usize>) -> Option<f64> {
    match symbolic.raw() {
        SymbolicCholeskyRaw::Simplicial(s) => {
            Some(s.col_ptr().windows(2).map(|w| ((w[1] - w[0]) as f64).powi(2) / 2.0).sum())
        }
        SymbolicCholeskyRaw::Supernodal(_) => None,
    }
}

impl std::fmt::Debug for Factor {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        let method = match &self.method {
            Method::Sparse { symbolic, .. } => format!("sparse, {} dofs", symbolic.nrows()),
            Method::Envelope(_) => "envelope".to_string(),
        };
        f.debug_struct("Factor").field("method", &method).field("valid", &self.valid).finish()
    }
}

impl Factor {
    /// Symbolic analysis of the lower-triangle pattern `pattern`.
    pub(crate) fn new(pattern: SymbolicSparseColMatRef<'_, usize>) -> Result<Self, SolveError> {
        let fail = |e: &dyn std::fmt::Debug| SolveError::Factorisation { reason: format!("{e:?}") };
        let n = pattern.nrows();
        // the envelope's storage is made only once it is chosen (on a wide
        // net it would be far larger than the sparse factor)
        let plan = EnvelopePlan::new(n, pattern.col_ptr(), pattern.row_idx());
        let envelope_ops = plan.operation_count();
        let envelope = |plan| Method::Envelope(Envelope::from_plan(plan, pattern.col_ptr(), pattern.row_idx()));
        if envelope_ops <= NARROW_OPS_PER_DOF * n as f64 {
            return Ok(Self { method: envelope(plan), valid: false });
        }
        let symbolic = factorize_symbolic_cholesky(
            pattern,
            Side::Lower,
            SymmetricOrdering::Amd,
            CholeskySymbolicParams::default(),
        )
        .map_err(|e| fail(&e))?;
        // a supernodal choice means a large, wide pattern: keep faer's
        if sparse_operation_count(&symbolic).is_some_and(|sparse| ENVELOPE_COST * envelope_ops < SPARSE_COST * sparse) {
            return Ok(Self { method: envelope(plan), valid: false });
        }
        let req = StackReq::any_of(&[
            symbolic.factorize_numeric_llt_scratch::<f64>(Par::Seq, Default::default()),
            symbolic.solve_in_place_scratch::<f64>(1, Par::Seq),
        ]);
        let mem = MemBuffer::try_new(req).map_err(|e| fail(&e))?;
        let l_values = vec![0.0; symbolic.len_val()];
        Ok(Self { method: Method::Sparse { symbolic, l_values, mem }, valid: false })
    }

    /// Numeric factorisation of `a` (lower triangle, same pattern as given
    /// to [`Factor::new`]). Returns false when `a` is not numerically
    /// positive definite.
    pub(crate) fn factorize(&mut self, a: SparseColMatRef<'_, usize, f64>) -> bool {
        self.valid = match &mut self.method {
            Method::Envelope(env) => env.factorize(a.val()),
            Method::Sparse { symbolic, l_values, mem } => {
                let stack = MemStack::new(mem);
                let ok = symbolic
                    .factorize_numeric_llt(
                        l_values,
                        a,
                        Side::Lower,
                        LltRegularization::default(),
                        Par::Seq,
                        stack,
                        Default::default(),
                    )
                    .is_ok();
                ok && l_values.iter().all(|v| v.is_finite())
            }
        };
        self.valid
    }

    /// Solves `A x = rhs` in place with the last successful factorisation.
    /// Does nothing when there is none (the caller checks [`Factor::factorize`]).
    pub(crate) fn solve_in_place(&mut self, rhs: &mut [f64]) {
        if !self.valid || rhs.is_empty() {
            return;
        }
        match &mut self.method {
            Method::Envelope(env) => env.solve_in_place(rhs),
            Method::Sparse { symbolic, l_values, mem } => {
                let n = rhs.len();
                let llt = LltRef::<'_, usize, f64>::new(symbolic, l_values);
                let stack = MemStack::new(mem);
                llt.solve_in_place_with_conj(Conj::No, MatMut::from_column_major_slice_mut(rhs, n, 1), Par::Seq, stack);
            }
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use faer::sparse::{SparseColMat, Triplet};

    /// The five-point Laplacian of a `side` × `side` grid plus a unit
    /// diagonal shift (symmetric positive definite), lower triangle.
    fn grid(side: usize) -> SparseColMat<usize, f64> {
        let id = |r: usize, c: usize| r * side + c;
        let mut t = Vec::new();
        for r in 0..side {
            for c in 0..side {
                t.push(Triplet::new(id(r, c), id(r, c), 5.0));
                if c + 1 < side {
                    t.push(Triplet::new(id(r, c + 1), id(r, c), -1.0));
                }
                if r + 1 < side {
                    t.push(Triplet::new(id(r + 1, c), id(r, c), -1.0));
                }
            }
        }
        SparseColMat::try_new_from_triplets(side * side, side * side, &t).unwrap_or_else(|_| unreachable!())
    }

    /// A x for the symmetric matrix stored as its lower triangle.
    fn apply(a: &SparseColMat<usize, f64>, x: &[f64]) -> Vec<f64> {
        let mut y = vec![0.0; x.len()];
        let (cp, ri, v) = (a.symbolic().col_ptr(), a.symbolic().row_idx(), a.val());
        for c in 0..x.len() {
            for k in cp[c]..cp[c + 1] {
                let r = ri[k];
                y[r] += v[k] * x[c];
                if r != c {
                    y[c] += v[k] * x[r];
                }
            }
        }
        y
    }

    #[test]
    fn both_methods_solve_and_the_cheaper_is_chosen() {
        // A narrow grid goes to the envelope, a wide one to the sparse
        // method; each reproduces a known solution. Tolerance 1e-10
        // relative: the matrix is well conditioned (eigenvalues in 1..9),
        // so only roundoff of order n ε remains.
        for (side, envelope) in [(6, true), (90, false)] {
            let a = grid(side);
            let mut f = Factor::new(a.symbolic()).unwrap_or_else(|e| panic!("{e}"));
            assert_eq!(matches!(f.method, Method::Envelope(_)), envelope, "side {side}: {f:?}");
            assert!(f.factorize(a.as_ref()));
            let x: Vec<f64> = (0..side * side).map(|i| (i as f64 * 0.013).cos()).collect();
            let mut b = apply(&a, &x);
            f.solve_in_place(&mut b);
            for (got, want) in b.iter().zip(&x) {
                assert!((got - want).abs() <= 1e-10, "side {side}: {got} vs {want}");
            }
        }
    }
}
