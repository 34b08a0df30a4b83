//! Clamped rectangular plate under point loads by the Rayleigh–Ritz energy
//! method (Timoshenko & Woinowsky-Krieger, *Theory of Plates and Shells*,
//! §80, energy method): `w = Σ c_mn X_m(x/a) Z_n(z/b)` with the trial
//! functions `X_m(ξ) = sin(πξ) sin(mπξ)`, m = 1..M (each vanishes with its
//! slope at ξ = 0 and 1, so w = w' = 0 on every edge), and the strain
//! energy of a plate with clamped edges `U = D/2 ∫∫ (∇²w)² dA` (the
//! Gaussian-curvature term integrates to zero when w = ∂w/∂n = 0 on the
//! boundary). Stationary potential gives `K c = Φ(load) P`; the flexibility
//! between two points is `Φ(p)ᵀ K⁻¹ Φ(q)`, symmetric by construction.
//!
//! Ritz converges from the stiff side: the point-load deflection rises
//! towards the exact value as M grows. With M = 18 the centre coefficient
//! of the square is 0.2 % under the tabulated 0.00560, and 1 % under up
//! to b/a = 2 (tests below).

use super::dense::{cholesky, solve_in_place};
use std::f64::consts::PI;

/// Trial functions each way.
pub const RITZ_TERMS: usize = 18;

/// Gauss–Legendre nodes and weights on [0, 1] (Newton on the Legendre
/// recurrence).
fn gauss_legendre(n: usize) -> Vec<(f64, f64)> {
    let mut out = Vec::with_capacity(n);
    for i in 1..=n {
        let mut x = (PI * (i as f64 - 0.25) / (n as f64 + 0.5)).cos();
        let mut dp = 1.0;
        for _ in 0..100 {
            let (mut p0, mut p1) = (1.0, x);
            for k in 2..=n {
                let k = k as f64;
                let p2 = ((2.0 * k - 1.0) * x * p1 - (k - 1.0) * p0) / k;
                p0 = p1;
                p1 = p2;
            }
            dp = n as f64 * (x * p1 - p0) / (x * x - 1.0);
            let dx = p1 / dp;
            x -= dx;
            if dx.abs() < 1e-15 {
                break;
            }
        }
        out.push((0.5 * (x + 1.0), 1.0 / ((1.0 - x * x) * dp * dp)));
    }
    out
}

/// `X_m(ξ)` and `X_m''(ξ)` (derivative in ξ) for m = 1..=terms.
fn trial(xi: f64, terms: usize) -> (Vec<f64>, Vec<f64>) {
    let (s1, c1) = (PI * xi).sin_cos();
    let mut v = Vec::with_capacity(terms);
    let mut d2 = Vec::with_capacity(terms);
    for m in 1..=terms {
        let mf = m as f64;
        let (sm, cm) = (mf * PI * xi).sin_cos();
        v.push(s1 * sm);
        d2.push(PI * PI * (-(1.0 + mf * mf) * s1 * sm + 2.0 * mf * c1 * cm));
    }
    (v, d2)
}

/// A clamped panel's Ritz system, factored once.
#[derive(Debug, Clone, PartialEq)]
pub struct ClampedPlate {
    span: [f64; 2],
    terms: usize,
    /// Cholesky factor of the Ritz stiffness (terms² × terms²).
    factor: Vec<f64>,
}

impl ClampedPlate {
    /// Builds and factors the Ritz system of a panel `span` (m) of flexural
    /// rigidity `rigidity` (N·m). `None` if it cannot be factored (a
    /// degenerate panel).
    pub fn new(span: [f64; 2], rigidity: f64, terms: usize) -> Option<Self> {
        let [a, b] = span;
        let gl = gauss_legendre(4 * terms + 24);
        let mut a0 = vec![0.0; terms * terms];
        let mut a1 = vec![0.0; terms * terms];
        let mut a2 = vec![0.0; terms * terms];
        for &(xi, wq) in &gl {
            let (v, d2) = trial(xi, terms);
            for m in 0..terms {
                for p in 0..terms {
                    a0[m * terms + p] += wq * v[m] * v[p];
                    a1[m * terms + p] += wq * d2[m] * v[p];
                    a2[m * terms + p] += wq * d2[m] * d2[p];
                }
            }
        }
        let n = terms * terms;
        let mut k = vec![0.0; n * n];
        for m in 0..terms {
            for nn in 0..terms {
                let r = m * terms + nn;
                for p in 0..terms {
                    for q in 0..terms {
                        let c = p * terms + q;
                        let (i0, i1, i2) = (a0[m * terms + p], a1[m * terms + p], a2[m * terms + p]);
                        let (j0, j1, j2) = (a0[nn * terms + q], a1[nn * terms + q], a2[nn * terms + q]);
                        k[r * n + c] =
                            rigidity * (i2 * j0 * b / a.powi(3) + 2.0 * i1 * j1 / (a * b) + i0 * j2 * a / b.powi(3));
                    }
                }
            }
        }
        let factor = cholesky(&k, n)?;
        Some(Self { span, terms, factor })
    }

    /// The trial functions' values at a local point (m).
    pub fn basis(&self, at: [f64; 2]) -> Vec<f64> {
        let (x, _) = trial(at[0] / self.span[0], self.terms);
        let (z, _) = trial(at[1] / self.span[1], self.terms);
        let mut out = Vec::with_capacity(self.terms * self.terms);
        for xm in &x {
            for zn in &z {
                out.push(xm * zn);
            }
        }
        out
    }

    /// Ritz coefficients of the deflection under a unit load at `at`, m/N.
    pub fn unit_load(&self, at: [f64; 2]) -> Vec<f64> {
        let mut c = self.basis(at);
        solve_in_place(&self.factor, self.terms * self.terms, &mut c);
        c
    }

    /// Deflection at `at` of the field with coefficients `c`, m.
    pub fn deflection(&self, c: &[f64], at: [f64; 2]) -> f64 {
        self.basis(at).iter().zip(c).map(|(p, c)| p * c).sum()
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    // T&W Table 55 (clamped plate, central load, ν = 0.3 does not enter w):
    // w = α P a² / D with α(b/a) = 1.0 0.00560, 1.2 0.00647, 1.4 0.00691,
    // 2.0 0.00722 (as tabulated in slab.rs). Ritz approaches from below;
    // with 18 × 18 trial functions it is within 0.2 % for the square and
    // 1 % up to b/a = 2 (the stated accuracy; the long panels converge
    // slowest).
    #[test]
    fn centre_coefficients_match_the_table() {
        for (ratio, alpha) in [(1.0, 0.00560), (1.2, 0.00647), (1.4, 0.00691), (2.0, 0.00722)] {
            let (a, b) = (2.0, 2.0 * ratio);
            let plate = ClampedPlate::new([a, b], 1.0, RITZ_TERMS).expect("factors");
            let c = plate.unit_load([a / 2.0, b / 2.0]);
            let got = plate.deflection(&c, [a / 2.0, b / 2.0]) / (a * a);
            assert!(
                ((got - alpha) / alpha).abs() < 1e-2 && got < alpha * 1.001,
                "b/a {ratio}: Ritz {got} table {alpha}"
            );
        }
    }

    // Reciprocity (Φ(p)ᵀ K⁻¹ Φ(q) is symmetric; tolerance roundoff) and
    // zero deflection and slope on the clamped edges.
    #[test]
    fn reciprocity_and_edges() {
        let plate = ClampedPlate::new([3.0, 4.0], 2.0e6, 10).expect("factors");
        let (p, q) = ([0.8, 1.1], [2.1, 3.0]);
        let cpq = plate.deflection(&plate.unit_load(q), p);
        let cqp = plate.deflection(&plate.unit_load(p), q);
        assert!(((cpq - cqp) / cpq).abs() < 1e-10 && cpq > 0.0);
        let c = plate.unit_load([1.5, 2.0]);
        assert!(plate.deflection(&c, [0.0, 2.0]).abs() < 1e-15);
        let near = plate.deflection(&c, [1e-4, 2.0]) / plate.deflection(&c, [1.5, 2.0]);
        assert!(near < 1e-6, "slope at the edge: {near}");
    }

    // Gauss–Legendre: exact for polynomials up to degree 2n − 1.
    #[test]
    fn quadrature_is_exact_for_polynomials() {
        let gl = gauss_legendre(8);
        let s: f64 = gl.iter().map(|(x, w)| w * x.powi(15)).sum();
        assert!((s - 1.0 / 16.0).abs() < 1e-14);
    }
}
