//! The flexibility of a simply supported rectangular plate at many feet at
//! once, with the Navier double series (`plate_navier.rs`) summed in closed
//! form along one direction, so each pair of feet costs one series of
//! `terms` instead of `terms²`.
//!
//! With the panel a × b taken so that b ≥ a (the axes are swapped
//! otherwise; the double series is symmetric in them), `c = m b / a` and
//! `u = z / b`, the inner sum of the Navier series is
//! `Σ_n sin(nπu) sin(nπv) / (n² + c²)²`, and with
//! `sin sin = ½ [cos(n θ₁) − cos(n θ₂)]`, `θ₁ = π |u − v|`, `θ₂ = π (u + v)`,
//! each part is `G(c, θ) = Σ_n cos(nθ) / (n² + c²)² = −(1/2c) ∂F/∂c` of
//! `F(c, θ) = Σ_n cos(nθ) / (n² + c²) = π cosh(c(π − θ)) / (2c sinh(cπ)) − 1/(2c²)`
//! for 0 ≤ θ ≤ 2π (Gradshteyn & Ryzhik, *Table of Integrals, Series, and
//! Products*, 1.445.2). The `−1/(2c²)` term is the same for θ₁ and θ₂ and
//! cancels in the difference, and the hyperbolic ratios are written with
//! decaying exponentials only, so nothing overflows for large c; with
//! b ≥ a, c ≥ 1 and the difference loses no significant digits.
//!
//! The exponentials `e^{−c x}` for c = m b/a are the m-th powers of
//! `e^{−(b/a) x}`, so each pair of feet needs six `exp` calls in all.

use std::f64::consts::PI;

/// `Σ_{n≥1} sin(nπu) sin(nπv) / (n² + c²)²` for u, v in [0, 1] and
/// c ≥ 1, in closed form (the module's formula).
#[cfg(test)]
fn inner_sum(c: f64, u: f64, v: f64) -> f64 {
    let h = |theta: f64| {
        let s = (PI - theta).abs();
        let e = |x: f64| (-c * x).exp();
        let g = PI / (2.0 * c) * (e(PI - s) + e(PI + s)) / (1.0 - e(2.0 * PI));
        let t = s * (1.0 - e(2.0 * s)) / (1.0 + e(2.0 * s));
        let k = 1.0 / c + PI * (1.0 + e(2.0 * PI)) / (1.0 - e(2.0 * PI));
        g * (t - k)
    };
    -(h(PI * (u - v).abs()) - h(PI * (u + v))) / (4.0 * c)
}

/// `sin(k π t)` for k = 1..=n.
fn sines(t: f64, n: usize) -> Vec<f64> {
    (1..=n).map(|k| (PI * k as f64 * t).sin()).collect()
}

/// Flexibility at `points` (local, m, inside the panel) of a simply
/// supported panel `span` (m) of rigidity `rigidity` (N·m): row-major
/// n × n, m/N, symmetric; `terms` terms of the outer series (the inner one
/// is exact). Equal to `navier_flexibility(span, rigidity, pᵢ, pⱼ, ·)` as
/// its terms grow.
pub fn navier_flexibility_matrix(span: [f64; 2], rigidity: f64, points: &[[f64; 2]], terms: usize) -> Vec<f64> {
    // outer direction: the shorter span, so c = m b/a ≥ 1
    let swap = span[1] < span[0];
    let (a, b) = if swap { (span[1], span[0]) } else { (span[0], span[1]) };
    let outer = |p: &[f64; 2]| if swap { p[1] } else { p[0] };
    let inner = |p: &[f64; 2]| if swap { p[0] } else { p[1] };
    let r = b / a;
    let n = points.len();
    let sx: Vec<Vec<f64>> = points.iter().map(|p| sines(outer(p) / a, terms)).collect();
    let u: Vec<f64> = points.iter().map(|p| inner(p) / b).collect();
    // per m: 1/c and the parts of g and K that do not depend on the feet
    let per_m: Vec<[f64; 3]> = (1..=terms)
        .map(|m| {
            let c = m as f64 * r;
            let e2pi = (-2.0 * PI * c).exp();
            let k = 1.0 / c + PI * (1.0 + e2pi) / (1.0 - e2pi);
            [1.0 / c, 1.0 / (1.0 - e2pi), k]
        })
        .collect();
    let scale = 4.0 * b.powi(4) / (PI.powi(4) * rigidity * a * b);
    let mut out = vec![0.0; n * n];
    for i in 0..n {
        for j in 0..=i {
            // per angle: s = |π − θ|, and the bases e^{−r(π−s)}, e^{−r(π+s)}, e^{−2rs}
            let mut state = [(PI * (u[i] - u[j]).abs()), (PI * (u[i] + u[j]))].map(|theta| {
                let s = (PI - theta).abs();
                let base = [(-r * (PI - s)).exp(), (-r * (PI + s)).exp(), (-2.0 * r * s).exp()];
                (s, base, base)
            });
            let mut sum = 0.0;
            for (m, &[inv_c, inv_den, k]) in per_m.iter().enumerate() {
                let mut h = [0.0; 2];
                for (slot, (s, base, pow)) in h.iter_mut().zip(state.iter_mut()) {
                    let g = 0.5 * PI * inv_c * (pow[0] + pow[1]) * inv_den;
                    let t = *s * (1.0 - pow[2]) / (1.0 + pow[2]);
                    *slot = g * (t - k);
                    for (p, q) in pow.iter_mut().zip(base.iter()) {
                        // the next power; flushed to zero well before subnormals
                        *p = if *p < 1e-290 { 0.0 } else { *p * q };
                    }
                }
                let inner_sum = -(h[0] - h[1]) * 0.25 * inv_c;
                sum += sx[i][m] * sx[j][m] * inner_sum;
            }
            let c = scale * sum;
            out[i * n + j] = c;
            out[j * n + i] = c;
        }
    }
    out
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::library::plate_navier::navier_flexibility;

    // The closed form against the series summed directly to 200,000 terms
    // (tail below 1/(3N³) ≈ 4e-17 of the leading term's order): agreement to
    // 1e-10 relative, roundoff of the direct sum and of the closed form.
    #[test]
    fn inner_sum_matches_the_direct_sum() {
        for (c, u, v) in
            [(1.0, 0.5, 0.5), (1.0, 0.1, 0.9), (2.5, 0.3, 0.31), (7.0, 0.02, 0.98), (40.0, 0.5, 0.5), (3.0, 0.7, 0.2)]
        {
            let direct: f64 = (1..=200_000)
                .rev()
                .map(|n| {
                    let nf = n as f64;
                    (nf * PI * u).sin() * (nf * PI * v).sin() / (nf * nf + c * c).powi(2)
                })
                .sum();
            let closed = inner_sum(c, u, v);
            // relative to the sum's scale 1/(1 + c²)², since a pair far
            // apart sums to far less than its terms (cancellation)
            let scale = direct.abs().max((1.0 + c * c).powi(-2));
            assert!((closed - direct).abs() < 1e-10 * scale, "c {c} u {u} v {v}: {closed} vs {direct}");
        }
    }

    // The matrix against the double series (`plate_navier.rs`, T&W §28) at
    // 1,000 terms each way, for panels of both orientations and feet at the
    // centre, near an edge and apart, with the outer series also cut at
    // 1,000: 5e-5 relative. The two cut their series differently, and for a
    // foot 0.1 m from an edge the outer series converges slowly (its tail
    // is of order (a / (π N x))² ≈ 1e-5 of the value at N = 1,000); apart
    // from the edges they agree to about 1e-7.
    #[test]
    fn matches_the_double_series() {
        for span in [[4.0, 4.0], [3.0, 5.0], [6.0, 2.0]] {
            let pts = [
                [0.5 * span[0], 0.5 * span[1]],
                [0.1, 0.3 * span[1]],
                [0.8 * span[0], 0.95 * span[1]],
                [0.5 * span[0], 0.52 * span[1]],
            ];
            let m = navier_flexibility_matrix(span, 2.0e6, &pts, 1000);
            for i in 0..pts.len() {
                for j in 0..pts.len() {
                    let want = navier_flexibility(span, 2.0e6, pts[i], pts[j], 1000);
                    let got = m[i * pts.len() + j];
                    assert!(((got - want) / want).abs() < 5e-5, "span {span:?} ({i}, {j}): {got} vs {want}");
                }
            }
        }
    }
}
