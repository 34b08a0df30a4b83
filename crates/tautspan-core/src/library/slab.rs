//! Floor slab as a support spring: central point load on a rectangular
//! plate, `w = α P a² / D`, `D = E t³ / 12(1 − ν²)`, a the shorter span.
//!
//! Coefficients α (Timoshenko & Woinowsky-Krieger, *Theory of Plates and
//! Shells*, central concentrated load; ν = 0.3):
//! simply supported, b/a = 1.0 0.01160, 1.1 0.01265, 1.2 0.01353,
//! 1.4 0.01484, 1.6 0.01570, 1.8 0.01620, 2.0 0.01651, 3.0 0.01690,
//! ∞ 0.01695 (1.0 also Roark 8th ed. Table 11.4; the rest from memory);
//! clamped, b/a = 1.0 0.00560, 1.2 0.00647, 1.4 0.00691, 1.6 0.00712,
//! 1.8 0.00720, 2.0 0.00722, ∞ 0.00725 (from memory (?)).
//! Between table points α is interpolated linearly; past the last finite
//! ratio it goes to the strip value.
//!
//! The node is taken at the slab centre, where a point load deflects the
//! plate most, so the spring is the softest the slab offers (said in the
//! report's assumptions). Cracking and continuity are not modelled.

use serde::{Deserialize, Serialize};

/// Edge support of a slab panel.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize, Deserialize)]
pub enum Edges {
    /// All four edges simply supported.
    SimplySupported,
    /// All four edges clamped.
    Clamped,
}

const SS: [(f64, f64); 9] = [
    (1.0, 0.01160),
    (1.1, 0.01265),
    (1.2, 0.01353),
    (1.4, 0.01484),
    (1.6, 0.01570),
    (1.8, 0.01620),
    (2.0, 0.01651),
    (3.0, 0.01690),
    (1e9, 0.01695),
];
const CLAMPED: [(f64, f64); 7] =
    [(1.0, 0.00560), (1.2, 0.00647), (1.4, 0.00691), (1.6, 0.00712), (1.8, 0.00720), (2.0, 0.00722), (1e9, 0.00725)];

/// Flexural rigidity `D = E t³ / 12(1 − ν²)`, N·m.
pub fn flexural_rigidity(modulus_pa: f64, thickness_m: f64, poisson: f64) -> f64 {
    modulus_pa * thickness_m.powi(3) / (12.0 * (1.0 - poisson * poisson))
}

/// Deflection coefficient α for a central point load.
pub fn point_load_coefficient(edges: Edges, span_a_m: f64, span_b_m: f64) -> f64 {
    let (a, b) = if span_a_m <= span_b_m { (span_a_m, span_b_m) } else { (span_b_m, span_a_m) };
    let ratio = b / a;
    let table: &[(f64, f64)] = match edges {
        Edges::SimplySupported => &SS,
        Edges::Clamped => &CLAMPED,
    };
    for w in table.windows(2) {
        let (r0, a0) = w[0];
        let (r1, a1) = w[1];
        if ratio <= r1 {
            if r1 > 1e8 {
                // beyond the last finite ratio: approach the strip value
                let t = 1.0 - r0 / ratio;
                return a0 + (a1 - a0) * t;
            }
            return a0 + (a1 - a0) * (ratio - r0) / (r1 - r0);
        }
    }
    table[table.len() - 1].1
}

/// Spring stiffness of the slab at its centre under a point load, N/m.
pub fn point_stiffness_n_per_m(
    edges: Edges,
    span_x_m: f64,
    span_z_m: f64,
    thickness_m: f64,
    modulus_pa: f64,
    poisson: f64,
) -> f64 {
    let a = span_x_m.min(span_z_m);
    let alpha = point_load_coefficient(edges, span_x_m, span_z_m);
    flexural_rigidity(modulus_pa, thickness_m, poisson) / (alpha * a * a)
}

#[cfg(test)]
mod tests {
    use super::*;

    // Timoshenko & Woinowsky-Krieger, central point load, SS square plate:
    // w = 0.01160 P a² / D. 4 m × 4 m, 150 mm, E 30 GPa, ν 0.2, P 10 kN.
    // The stiffness is exactly D / (0.0116 a²); tolerance is rounding only.
    #[test]
    fn square_simply_supported() {
        let d = flexural_rigidity(30e9, 0.15, 0.2);
        let k = point_stiffness_n_per_m(Edges::SimplySupported, 4.0, 4.0, 0.15, 30e9, 0.2);
        let w = 10e3 / k;
        let expected = 0.01160 * 10e3 * 16.0 / d;
        assert!(((w - expected) / expected).abs() < 1e-12);
        // table points are returned exactly, in either orientation
        assert!((point_load_coefficient(Edges::SimplySupported, 2.0, 4.0) - 0.01651).abs() < 1e-12);
        assert!((point_load_coefficient(Edges::SimplySupported, 2.4, 2.0) - 0.01353).abs() < 1e-12);
        assert!((point_load_coefficient(Edges::Clamped, 3.0, 3.0) - 0.00560).abs() < 1e-12);
        // very long panels approach the strip value
        assert!((point_load_coefficient(Edges::SimplySupported, 1.0, 100.0) - 0.01695).abs() < 1e-4);
    }
}
