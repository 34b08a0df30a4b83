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

use super::envelope::Envelope;
use super::error::SolveError;

/// A reusable Cholesky factorisation for one sparsity pattern.
pub(crate) struct Factor {
    symbolic: SymbolicCholesky<usize>,
    l_values: Vec<f64>,
    mem: MemBuffer,
    /// The envelope method, when it is the cheaper one.
    envelope: Option<Envelope>,
    /// Whether `l_values` (or the envelope) holds a valid factor.
    valid: bool,
}

/// Instructions per multiply-add of each method, measured on this
/// project's benchmarks (general sparse: index-driven scatter and gather;
/// envelope: contiguous dot products). Only their ratio matters.
const SPARSE_COST: f64 = 3.0;
const ENVELOPE_COST: f64 = 1.0;

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
        f.debug_struct("Factor")
            .field("n", &self.symbolic.nrows())
            .field("factor_values", &self.l_values.len())
            .field("valid", &self.valid)
            .finish()
    }
}

impl Factor {
    /// Symbolic analysis of the lower-triangle pattern `pattern`.
    pub(crate) fn new(pattern: SymbolicSparseColMatRef<'_, usize>) -> Result<Self, SolveError> {
        let fail = |e: &dyn std::fmt::Debug| SolveError::Factorisation { reason: format!("{e:?}") };
        let symbolic = factorize_symbolic_cholesky(
            pattern,
            Side::Lower,
            SymmetricOrdering::Amd,
            CholeskySymbolicParams::default(),
        )
        .map_err(|e| fail(&e))?;
        let req = StackReq::any_of(&[
            symbolic.factorize_numeric_llt_scratch::<f64>(Par::Seq, Default::default()),
            symbolic.solve_in_place_scratch::<f64>(1, Par::Seq),
        ]);
        let mem = MemBuffer::try_new(req).map_err(|e| fail(&e))?;
        let l_values = vec![0.0; symbolic.len_val()];
        let n = pattern.nrows();
        let envelope = Envelope::new(n, pattern.col_ptr(), pattern.row_idx());
        // a supernodal choice means a large, wide pattern: keep faer's
        let use_envelope = sparse_operation_count(&symbolic)
            .is_some_and(|sparse| ENVELOPE_COST * envelope.operation_count() < SPARSE_COST * sparse);
        Ok(Self { symbolic, l_values, mem, envelope: use_envelope.then_some(envelope), valid: false })
    }

    /// Numeric factorisation of `a` (lower triangle, same pattern as given
    /// to [`Factor::new`]). Returns false when `a` is not numerically
    /// positive definite.
    pub(crate) fn factorize(&mut self, a: SparseColMatRef<'_, usize, f64>) -> bool {
        if let Some(env) = self.envelope.as_mut() {
            self.valid = env.factorize(a.val());
            return self.valid;
        }
        let stack = MemStack::new(&mut self.mem);
        let ok = self
            .symbolic
            .factorize_numeric_llt(
                &mut self.l_values,
                a,
                Side::Lower,
                LltRegularization::default(),
                Par::Seq,
                stack,
                Default::default(),
            )
            .is_ok();
        let finite = ok && self.l_values.iter().all(|v| v.is_finite());
        self.valid = finite;
        finite
    }

    /// Solves `A x = rhs` in place with the last successful factorisation.
    /// Does nothing when there is none (the caller checks [`Factor::factorize`]).
    pub(crate) fn solve_in_place(&mut self, rhs: &mut [f64]) {
        if !self.valid || rhs.is_empty() {
            return;
        }
        if let Some(env) = self.envelope.as_mut() {
            env.solve_in_place(rhs);
            return;
        }
        let n = rhs.len();
        let llt = LltRef::<'_, usize, f64>::new(&self.symbolic, &self.l_values);
        let stack = MemStack::new(&mut self.mem);
        llt.solve_in_place_with_conj(Conj::No, MatMut::from_column_major_slice_mut(rhs, n, 1), Par::Seq, stack);
    }
}
