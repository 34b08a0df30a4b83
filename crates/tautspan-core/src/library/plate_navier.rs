//! Simply supported rectangular plate under point loads: the Navier double
//! series (Timoshenko & Woinowsky-Krieger, *Theory of Plates and Shells*,
//! §28). For a load P at (ξ, η) on a panel a × b (local coordinates from
//! one corner),
//! `w(x, z) = 4 P / (π⁴ D a b) Σ_m Σ_n sin(mπξ/a) sin(nπη/b) sin(mπx/a)
//! sin(nπz/b) / ((m/a)² + (n/b)²)²`; loads add.
//!
//! The series for the deflection converges like `Σ 1/(m² + n²)²`: cut at
//! N terms each way, the tail is about `π / (8 N²)` of the leading sum's
//! order, so N = 200 leaves ~1e-5 (relative) at the panel centre (see the
//! convergence test) and N = 120 ~1e-4.

use std::f64::consts::PI;

/// Terms each way for the flexibility at the feet.
pub const FLEXIBILITY_TERMS: usize = 200;
/// Terms each way for the deflection field over the panel.
pub const FIELD_TERMS: usize = 120;

/// `sin(k π t)` for k = 1..=n by the Chebyshev recurrence, restarted from
/// two exact sines every 32 terms. (Restarting one of the two alone leaves
/// the other's error in the recurrence, which grows by up to `1/sin(πt)`
/// per block and compounds from block to block: near an edge that wiped
/// out the series past a few hundred terms.)
fn sines(t: f64, n: usize) -> Vec<f64> {
    let th = PI * t;
    let c2 = 2.0 * th.cos();
    let mut out = Vec::with_capacity(n);
    let (mut prev, mut cur) = (0.0, th.sin());
    for k in 1..=n {
        if k % 32 == 0 {
            prev = (th * (k - 1) as f64).sin();
            cur = (th * k as f64).sin();
        }
        out.push(cur);
        let next = c2 * cur - prev;
        prev = cur;
        cur = next;
    }
    out
}

/// Deflection at `at` from a unit load at `load` (both local, m), m/N:
/// the flexibility coefficient C(at, load). Symmetric in its two points.
pub fn navier_flexibility(span: [f64; 2], rigidity: f64, at: [f64; 2], load: [f64; 2], terms: usize) -> f64 {
    let [a, b] = span;
    let (sx1, sx2) = (sines(at[0] / a, terms), sines(load[0] / a, terms));
    let (sz1, sz2) = (sines(at[1] / b, terms), sines(load[1] / b, terms));
    let mut sum = 0.0;
    for m in 1..=terms {
        let xm = sx1[m - 1] * sx2[m - 1];
        if xm == 0.0 {
            continue;
        }
        let am = (m as f64 / a).powi(2);
        let mut row = 0.0;
        for n in 1..=terms {
            let d = am + (n as f64 / b).powi(2);
            row += sz1[n - 1] * sz2[n - 1] / (d * d);
        }
        sum += xm * row;
    }
    4.0 * sum / (PI.powi(4) * rigidity * a * b)
}

/// The deflection field of a set of point loads, summed into the series
/// coefficients once so each point costs `terms²` products.
#[derive(Debug, Clone, PartialEq)]
pub struct NavierField {
    span: [f64; 2],
    terms: usize,
    /// `A_mn` already divided by `π⁴ D a b / 4`, row-major m then n.
    coeffs: Vec<f64>,
}

impl NavierField {
    /// Field of loads `forces[j]` (N, downward positive) at `points[j]` (local, m).
    pub fn new(span: [f64; 2], rigidity: f64, points: &[[f64; 2]], forces: &[f64], terms: usize) -> Self {
        let [a, b] = span;
        let scale = 4.0 / (PI.powi(4) * rigidity * a * b);
        let mut coeffs = vec![0.0; terms * terms];
        for (p, &f) in points.iter().zip(forces) {
            if f == 0.0 {
                continue;
            }
            let (sx, sz) = (sines(p[0] / a, terms), sines(p[1] / b, terms));
            for m in 1..=terms {
                let am = (m as f64 / a).powi(2);
                for n in 1..=terms {
                    let d = am + (n as f64 / b).powi(2);
                    coeffs[(m - 1) * terms + n - 1] += scale * f * sx[m - 1] * sz[n - 1] / (d * d);
                }
            }
        }
        Self { span, terms, coeffs }
    }

    /// Deflection at `at` (local, m), m (downward positive).
    pub fn at(&self, at: [f64; 2]) -> f64 {
        let (sx, sz) = (sines(at[0] / self.span[0], self.terms), sines(at[1] / self.span[1], self.terms));
        let mut w = 0.0;
        for (m, x) in sx.iter().enumerate() {
            let row = &self.coeffs[m * self.terms..(m + 1) * self.terms];
            w += x * row.iter().zip(&sz).map(|(c, z)| c * z).sum::<f64>();
        }
        w
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    // T&W §28 / Table 23 (central load, SS): w = α P a² / D. The square's
    // 0.01160 is also Roark 8th ed. Table 11.4 and must agree to 1e-4 (the
    // table's rounding); the other ratios are the values slab.rs tabulates
    // from memory, to 4 figures, and agree to 0.25 % (the series itself is
    // converged to ~1e-5, see below).
    #[test]
    fn centre_coefficients_match_the_table() {
        let table = [
            (1.0, 0.01160, 1e-4),
            (1.1, 0.01265, 2.5e-3),
            (1.2, 0.01353, 2.5e-3),
            (1.4, 0.01484, 2.5e-3),
            (1.6, 0.01570, 2.5e-3),
            (1.8, 0.01620, 2.5e-3),
            (2.0, 0.01651, 2.5e-3),
            (3.0, 0.01690, 2.5e-3),
        ];
        for (ratio, alpha, tol) in table {
            let (a, b) = (2.0, 2.0 * ratio);
            let w = navier_flexibility([a, b], 1.0, [a / 2.0, b / 2.0], [a / 2.0, b / 2.0], FLEXIBILITY_TERMS);
            let got = w / (a * a);
            assert!(((got - alpha) / alpha).abs() < tol, "b/a {ratio}: series {got} table {alpha}");
        }
    }

    // Maxwell–Betti reciprocity: C(p, q) = C(q, p) (exact for the series:
    // the summand is symmetric; tolerance roundoff).
    #[test]
    fn reciprocity() {
        let (p, q) = ([0.7, 1.9], [2.6, 0.4]);
        let c1 = navier_flexibility([4.0, 3.0], 2.0e7, p, q, 150);
        let c2 = navier_flexibility([4.0, 3.0], 2.0e7, q, p, 150);
        assert!(((c1 - c2) / c1).abs() < 1e-12);
        assert!(c1 > 0.0);
    }

    // Convergence: doubling the terms from 200 to 400 changes the centre
    // flexibility by under 2e-5 (relative), and a point on an edge has none.
    #[test]
    fn converges_and_vanishes_on_edges() {
        let c = |n| navier_flexibility([3.0, 5.0], 1.0, [1.5, 2.5], [1.5, 2.5], n);
        let (c200, c400) = (c(200), c(400));
        assert!(((c200 - c400) / c400).abs() < 2e-5, "{c200} {c400}");
        let edge = navier_flexibility([3.0, 5.0], 1.0, [0.0, 2.5], [1.5, 2.5], 200);
        assert!(edge.abs() < 1e-12 * c400);
    }

    // The sines against `f64::sin` term by term, for a foot at the panel's
    // edge clearance (1 mm on a 4 m span), near the edge and in the middle,
    // to 1,000 terms: within 1e-11 (the recurrence's roundoff grows by at
    // most 1/sin(πt) ≈ 1,300 within a block of 32 from ~1e-16; the
    // reference's own argument k π t is rounded by about k π ε ≈ 3e-13).
    #[test]
    fn sines_stay_exact_near_the_edges() {
        for t in [0.00025, 0.025, 0.3, 0.5, 0.9997] {
            let s = sines(t, 1000);
            for (k, v) in s.iter().enumerate() {
                let exact = (PI * t * (k + 1) as f64).sin();
                assert!((v - exact).abs() < 1e-11, "t {t} k {}: {v} vs {exact}", k + 1);
            }
        }
    }

    // The field of several loads is the sum of the flexibilities
    // (superposition, same series; tolerance roundoff).
    #[test]
    fn field_is_superposition() {
        let pts = [[1.0, 1.0], [2.5, 2.0]];
        let f = [3.0e3, 1.2e3];
        let field = NavierField::new([4.0, 3.0], 5.0e6, &pts, &f, 80);
        let at = [1.7, 0.9];
        let direct: f64 = pts.iter().zip(&f).map(|(p, f)| f * navier_flexibility([4.0, 3.0], 5.0e6, at, *p, 80)).sum();
        assert!(((field.at(at) - direct) / direct).abs() < 1e-12);
    }
}
