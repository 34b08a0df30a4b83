//! Small dense symmetric positive definite systems (Cholesky, row-major
//! storage): the plate kernels' Ritz systems and the floor contact sets.

/// Lower Cholesky factor `L` (row-major n × n, `A = L Lᵀ`) of a symmetric
/// matrix, or `None` when it is not positive definite.
pub(crate) fn cholesky(a: &[f64], n: usize) -> Option<Vec<f64>> {
    let mut l = vec![0.0; n * n];
    for i in 0..n {
        for j in 0..=i {
            let mut s = a[i * n + j];
            for k in 0..j {
                s -= l[i * n + k] * l[j * n + k];
            }
            if i == j {
                if !(s > 0.0 && s.is_finite()) {
                    return None;
                }
                l[i * n + i] = s.sqrt();
            } else {
                l[i * n + j] = s / l[j * n + j];
            }
        }
    }
    Some(l)
}

/// Solves `L Lᵀ x = b` in place with a factor from [`cholesky`].
pub(crate) fn solve_in_place(l: &[f64], n: usize, b: &mut [f64]) {
    for i in 0..n {
        let mut s = b[i];
        for k in 0..i {
            s -= l[i * n + k] * b[k];
        }
        b[i] = s / l[i * n + i];
    }
    for i in (0..n).rev() {
        let mut s = b[i];
        for k in i + 1..n {
            s -= l[k * n + i] * b[k];
        }
        b[i] = s / l[i * n + i];
    }
}

/// Inverse of a symmetric positive definite matrix (row-major), or `None`.
pub(crate) fn inverse(a: &[f64], n: usize) -> Option<Vec<f64>> {
    let l = cholesky(a, n)?;
    let mut inv = vec![0.0; n * n];
    let mut col = vec![0.0; n];
    for j in 0..n {
        col.fill(0.0);
        col[j] = 1.0;
        solve_in_place(&l, n, &mut col);
        for i in 0..n {
            inv[i * n + j] = col[i];
        }
    }
    Some(inv)
}

#[cfg(test)]
mod tests {
    use super::*;

    // A 3 × 3 SPD matrix and its inverse checked by A·A⁻¹ = I (exact
    // arithmetic identity; tolerance is roundoff).
    #[test]
    fn inverse_times_matrix_is_identity() {
        let a = [4.0, 1.0, 0.5, 1.0, 3.0, 0.2, 0.5, 0.2, 2.0];
        let inv = inverse(&a, 3).expect("SPD");
        for i in 0..3 {
            for j in 0..3 {
                let s: f64 = (0..3).map(|k| a[i * 3 + k] * inv[k * 3 + j]).sum();
                assert!((s - if i == j { 1.0 } else { 0.0 }).abs() < 1e-14);
            }
        }
        assert!(cholesky(&[1.0, 2.0, 2.0, 1.0], 2).is_none());
    }
}
