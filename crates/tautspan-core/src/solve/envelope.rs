//! Envelope (variable-band, "skyline") Cholesky factorisation after a
//! reverse Cuthill–McKee ordering (George & Liu, *Computer Solution of
//! Large Sparse Positive Definite Systems*, 1981, ch. 4).
//!
//! For the long, narrow and grid-like networks a rig is made of, the
//! reordered matrix has a narrow envelope, and factorising it row by row
//! with contiguous dot products does the work of the general sparse
//! factorisation in a fraction of the instructions (no per-entry index
//! chasing; the inner loops vectorise). [`Factor`](super::factor::Factor)
//! chooses between the two by their operation counts.
//!
//! Storage: row `i` of L (permuted order) holds columns `first[i] ..= i`
//! contiguously from `start[i]`; zeros inside the envelope are stored.

// Row and column indices run over several arrays of the envelope at once;
// iterators would obscure the algebra.
#![allow(clippy::needless_range_loop)]

/// Reverse Cuthill–McKee ordering of the graph of a symmetric pattern,
/// started in each connected component from a pseudo-peripheral node
/// (found by repeated breadth-first searches, Gibbs–Poole–Stockmeyer).
/// Returns `perm` with `perm[new] = old`.
pub(crate) fn reverse_cuthill_mckee(adjacency: &[Vec<usize>]) -> Vec<usize> {
    let n = adjacency.len();
    let degree = |i: usize| adjacency[i].len();
    let mut order = Vec::with_capacity(n);
    let mut placed = vec![false; n];
    let mut level = vec![usize::MAX; n];
    // a breadth-first search from `root` over unplaced nodes: the last
    // level's node of least degree and the depth
    let bfs = |root: usize, placed: &[bool], level: &mut [usize]| -> (usize, usize, Vec<usize>) {
        let mut seen = vec![root];
        level[root] = 0;
        let mut head = 0;
        while head < seen.len() {
            let i = seen[head];
            head += 1;
            for &j in &adjacency[i] {
                if !placed[j] && level[j] == usize::MAX {
                    level[j] = level[i] + 1;
                    seen.push(j);
                }
            }
        }
        let depth = seen.iter().map(|&i| level[i]).max().unwrap_or(0);
        let far = seen.iter().copied().filter(|&i| level[i] == depth).min_by_key(|&i| (degree(i), i)).unwrap_or(root);
        for &i in &seen {
            level[i] = usize::MAX;
        }
        (far, depth, seen)
    };
    for start in 0..n {
        if placed[start] {
            continue;
        }
        // pseudo-peripheral root: walk to the far end until the depth stops growing
        let mut root = start;
        let (mut far, mut depth, _) = bfs(root, &placed, &mut level);
        for _ in 0..8 {
            let (far2, depth2, _) = bfs(far, &placed, &mut level);
            if depth2 <= depth {
                break;
            }
            root = far;
            far = far2;
            depth = depth2;
        }
        // Cuthill–McKee from the root: neighbours in order of degree
        let first = order.len();
        order.push(root);
        placed[root] = true;
        let mut head = first;
        let mut next: Vec<usize> = Vec::new();
        while head < order.len() {
            let i = order[head];
            head += 1;
            next.clear();
            next.extend(adjacency[i].iter().copied().filter(|&j| !placed[j]));
            next.sort_unstable_by_key(|&j| (degree(j), j));
            next.dedup();
            for &j in &next {
                placed[j] = true;
                order.push(j);
            }
        }
        order[first..].reverse();
    }
    order
}

/// An envelope Cholesky factor `P A Pᵀ = L Lᵀ` for one sparsity pattern.
#[derive(Debug, Clone)]
pub(crate) struct Envelope {
    /// `perm[new] = old`.
    perm: Vec<usize>,
    /// First stored column of each (new) row.
    first: Vec<usize>,
    /// Offset of each row's first stored entry in `values`.
    start: Vec<usize>,
    /// The rows of L, or of the matrix before factorisation.
    values: Vec<f64>,
    /// Per slot of the lower-triangle CSC input, its place in `values`.
    slot_to_env: Vec<usize>,
    /// Scratch for the permuted right-hand side.
    work: Vec<f64>,
    /// 1 / L_jj per row (a multiply in the inner loop instead of a divide).
    inv_diag: Vec<f64>,
}

/// The ordering and the envelope's shape, without its storage: enough to
/// count the work and decide, before the (possibly large) arrays exist.
#[derive(Debug, Clone)]
pub(crate) struct EnvelopePlan {
    /// `perm[new] = old`.
    perm: Vec<usize>,
    /// `inv[old] = new`.
    inv: Vec<usize>,
    /// First stored column of each (new) row.
    first: Vec<usize>,
}

impl EnvelopePlan {
    /// Ordering and envelope of the lower-triangle CSC pattern
    /// (`col_ptr`, `row_idx`, every diagonal present).
    pub(crate) fn new(n: usize, col_ptr: &[usize], row_idx: &[usize]) -> Self {
        let mut adjacency = vec![Vec::new(); n];
        for c in 0..n {
            for &r in &row_idx[col_ptr[c]..col_ptr[c + 1]] {
                if r != c {
                    adjacency[r].push(c);
                    adjacency[c].push(r);
                }
            }
        }
        let perm = reverse_cuthill_mckee(&adjacency);
        let mut inv = vec![0; n];
        for (new, &old) in perm.iter().enumerate() {
            inv[old] = new;
        }
        let mut first: Vec<usize> = (0..n).collect();
        for c in 0..n {
            for &r in &row_idx[col_ptr[c]..col_ptr[c + 1]] {
                let (i, j) = (inv[r].max(inv[c]), inv[r].min(inv[c]));
                first[i] = first[i].min(j);
            }
        }
        Self { perm, inv, first }
    }

    /// Multiply-adds of one factorisation: Σ over rows of the dot products.
    pub(crate) fn operation_count(&self) -> f64 {
        let mut ops = 0.0;
        for i in 0..self.first.len() {
            for j in self.first[i]..=i {
                ops += (j - self.first[i].max(self.first[j])) as f64;
            }
        }
        ops
    }
}

impl Envelope {
    /// Ordering, envelope and storage for the lower-triangle CSC pattern
    /// (`col_ptr`, `row_idx`, every diagonal present).
    #[cfg(test)]
    pub(crate) fn new(n: usize, col_ptr: &[usize], row_idx: &[usize]) -> Self {
        Self::from_plan(EnvelopePlan::new(n, col_ptr, row_idx), col_ptr, row_idx)
    }

    /// The storage of a planned envelope for the pattern it was planned on.
    pub(crate) fn from_plan(plan: EnvelopePlan, col_ptr: &[usize], row_idx: &[usize]) -> Self {
        let EnvelopePlan { perm, inv, first } = plan;
        let n = first.len();
        let mut start = Vec::with_capacity(n + 1);
        let mut total = 0;
        for i in 0..n {
            start.push(total);
            total += i - first[i] + 1;
        }
        start.push(total);
        let mut slot_to_env = vec![0; row_idx.len()];
        for c in 0..n {
            for (k, &r) in row_idx[col_ptr[c]..col_ptr[c + 1]].iter().enumerate() {
                let (i, j) = (inv[r].max(inv[c]), inv[r].min(inv[c]));
                slot_to_env[col_ptr[c] + k] = start[i] + (j - first[i]);
            }
        }
        Self { perm, first, start, values: vec![0.0; total], slot_to_env, work: vec![0.0; n], inv_diag: vec![0.0; n] }
    }

    /// Factorises the matrix whose lower-triangle values are `a_values`
    /// (same pattern as planned). False when it is not
    /// numerically positive definite.
    pub(crate) fn factorize(&mut self, a_values: &[f64]) -> bool {
        self.values.fill(0.0);
        for (slot, &v) in a_values.iter().enumerate() {
            self.values[self.slot_to_env[slot]] += v;
        }
        let n = self.first.len();
        let (first, start, inv_diag) = (&self.first, &self.start, &mut self.inv_diag);
        for i in 0..n {
            let fi = first[i];
            let (done, rest) = self.values.split_at_mut(start[i]);
            let row_i = &mut rest[..=i - fi];
            for j in fi..i {
                let fj = first[j];
                let row_j = &done[start[j]..start[j + 1]];
                let lo = fi.max(fj);
                let (head_i, tail_i) = row_i.split_at_mut(j - fi);
                let s = dot(&head_i[lo - fi..], &row_j[lo - fj..j - fj]);
                tail_i[0] = (tail_i[0] - s) * inv_diag[j];
            }
            let (off, diag) = row_i.split_at_mut(i - fi);
            let d = diag[0] - dot(off, off);
            if !(d > 0.0 && d.is_finite()) {
                return false;
            }
            diag[0] = d.sqrt();
            inv_diag[i] = 1.0 / diag[0];
        }
        true
    }

    /// Solves `A x = rhs` in place with the last factorisation.
    pub(crate) fn solve_in_place(&mut self, rhs: &mut [f64]) {
        let n = self.first.len();
        let y = &mut self.work;
        for (new, &old) in self.perm.iter().enumerate() {
            y[new] = rhs[old];
        }
        for i in 0..n {
            let fi = self.first[i];
            let si = self.start[i];
            let len = i - fi;
            let s = dot(&self.values[si..si + len], &y[fi..i]);
            y[i] = (y[i] - s) * self.inv_diag[i];
        }
        for i in (0..n).rev() {
            let fi = self.first[i];
            let si = self.start[i];
            let len = i - fi;
            let xi = y[i] * self.inv_diag[i];
            y[i] = xi;
            for (yk, l) in y[fi..i].iter_mut().zip(&self.values[si..si + len]) {
                *yk -= l * xi;
            }
        }
        for (new, &old) in self.perm.iter().enumerate() {
            rhs[old] = y[new];
        }
    }
}

/// Dot product with four partial sums: the factorisation is bound by the
/// latency of one long chain of additions, which four independent chains
/// shorten (the order of summation is fixed, so results are reproducible).
fn dot(a: &[f64], b: &[f64]) -> f64 {
    let n = a.len().min(b.len());
    let (a, b) = (&a[..n], &b[..n]);
    let mut s = [0.0; 4];
    let mut k = 0;
    while k + 4 <= n {
        s[0] += a[k] * b[k];
        s[1] += a[k + 1] * b[k + 1];
        s[2] += a[k + 2] * b[k + 2];
        s[3] += a[k + 3] * b[k + 3];
        k += 4;
    }
    while k < n {
        s[0] += a[k] * b[k];
        k += 1;
    }
    (s[0] + s[1]) + (s[2] + s[3])
}

#[cfg(test)]
mod tests {
    use super::*;

    /// A random symmetric positive definite matrix with a sparse pattern:
    /// a path plus random chords, diagonally dominant (Gershgorin).
    fn spd(n: usize, seed: u64) -> (Vec<usize>, Vec<usize>, Vec<f64>, Vec<Vec<f64>>) {
        let mut state = seed;
        let mut rnd = move || {
            state = state.wrapping_mul(6364136223846793005).wrapping_add(1442695040888963407);
            (state >> 11) as f64 / (1u64 << 53) as f64
        };
        let mut dense = vec![vec![0.0; n]; n];
        for i in 1..n {
            let v = rnd() - 0.5;
            dense[i][i - 1] = v;
            dense[i - 1][i] = v;
        }
        for _ in 0..n {
            let (i, j) = ((rnd() * n as f64) as usize % n, (rnd() * n as f64) as usize % n);
            if i != j {
                let v = rnd() - 0.5;
                dense[i][j] = v;
                dense[j][i] = v;
            }
        }
        for i in 0..n {
            let off: f64 = (0..n).filter(|&j| j != i).map(|j| dense[i][j].abs()).sum();
            dense[i][i] = off + 0.5 + rnd();
        }
        let mut col_ptr = vec![0];
        let mut row_idx = Vec::new();
        let mut vals = Vec::new();
        for c in 0..n {
            for r in c..n {
                if r == c || dense[r][c] != 0.0 {
                    row_idx.push(r);
                    vals.push(dense[r][c]);
                }
            }
            col_ptr.push(row_idx.len());
        }
        (col_ptr, row_idx, vals, dense)
    }

    #[test]
    fn solves_random_sparse_spd_systems() {
        // Residual of the solve against the dense matrix, relative to |b|:
        // a backward-stable Cholesky leaves about n ε κ, here ≪ 1e-12.
        for (n, seed) in [(1, 1), (2, 2), (7, 3), (40, 4), (150, 5)] {
            let (col_ptr, row_idx, vals, dense) = spd(n, seed);
            let mut env = Envelope::new(n, &col_ptr, &row_idx);
            assert!(env.factorize(&vals));
            let b: Vec<f64> = (0..n).map(|i| (i as f64 * 0.37).sin() + 1.0).collect();
            let mut x = b.clone();
            env.solve_in_place(&mut x);
            let norm_b = b.iter().map(|v| v * v).sum::<f64>().sqrt();
            for i in 0..n {
                let ax: f64 = (0..n).map(|j| dense[i][j] * x[j]).sum();
                assert!((ax - b[i]).abs() <= 1e-12 * norm_b, "n {n} row {i}: {ax} vs {}", b[i]);
            }
        }
    }

    #[test]
    fn rejects_an_indefinite_matrix() {
        // [[1, 2], [2, 1]] has eigenvalues 3 and −1.
        let mut env = Envelope::new(2, &[0, 2, 3], &[0, 1, 1]);
        assert!(!env.factorize(&[1.0, 2.0, 1.0]));
        assert!(env.factorize(&[2.0, 1.0, 2.0]));
    }

    #[test]
    fn ordering_narrows_a_scrambled_path() {
        // A path numbered 0, 9, 1, 8, 2, 7, …: RCM renumbers it along the
        // path, so every row holds one entry left of the diagonal.
        let n = 10;
        let labels = [0, 9, 1, 8, 2, 7, 3, 6, 4, 5];
        let mut adjacency = vec![Vec::new(); n];
        for w in labels.windows(2) {
            adjacency[w[0]].push(w[1]);
            adjacency[w[1]].push(w[0]);
        }
        let perm = reverse_cuthill_mckee(&adjacency);
        let mut inv = vec![0; n];
        for (new, &old) in perm.iter().enumerate() {
            inv[old] = new;
        }
        for w in labels.windows(2) {
            assert_eq!(inv[w[0]].abs_diff(inv[w[1]]), 1, "{perm:?}");
        }
    }
}
