//! Fibre rope stiffness from elastic elongation: a rope that stretches by a
//! strain ε at a fraction φ of its breaking strength F has `EA = φ F / ε`.
//!
//! Default elongations at 20 % of break for new rope (Handbook of Fibre Rope
//! Technology, 2004, from memory (?); mid-range of each band): nylon 3-strand
//! 14 % (12–16), nylon braid 8 % (6–10), polyester 3-strand 5 % (4–6),
//! polyester braid 3 % (2–4), HMPE 1.0 % (0.7–1.2), aramid 0.75 % (0.5–1).

use super::material::Material;

/// Axial stiffness EA, N, from breaking strength and elastic elongation.
pub fn fibre_axial_stiffness_n(breaking_n: f64, fraction_of_break: f64, elongation: f64) -> f64 {
    fraction_of_break * breaking_n / elongation
}

/// Default elastic elongation (strain) at 20 % of break for a fibre and
/// whether the rope is braided (else laid 3-strand).
pub fn default_elongation_at_20pct(fibre: Material, braided: bool) -> Option<f64> {
    Some(match (fibre, braided) {
        (Material::Nylon, false) => 0.14,
        (Material::Nylon, true) => 0.08,
        (Material::Polyester, false) => 0.05,
        (Material::Polyester, true) => 0.03,
        (Material::Hmpe, _) => 0.010,
        (Material::Aramid, _) => 0.0075,
        _ => return None,
    })
}

/// Fibre rope mass per metre: fibre density × nominal circle area × 0.6
/// packing (an estimate; practice).
pub fn fibre_linear_mass_kg_m(fibre: Material, d_m: f64) -> f64 {
    fibre.data().density_kg_m3 * std::f64::consts::FRAC_PI_4 * d_m * d_m * 0.6
}

#[cfg(test)]
mod tests {
    use super::*;

    // EN 892 dynamic rope test, derived in REFERENCES.md: 80 kg, fall factor
    // 1.77, peak 12 kN implies EA ≈ 45 kN via F = mg + √((mg)² + 2 mg EA f).
    // Solving that for EA: EA = ((F − mg)² − (mg)²) / (2 mg f).
    #[test]
    fn en892_implied_ea() {
        let mg: f64 = 80.0 * 9.80665;
        let f: f64 = 12_000.0;
        let ea = ((f - mg) * (f - mg) - mg * mg) / (2.0 * mg * 1.77);
        assert!(((ea - 45_000.0) / 45_000.0).abs() < 0.02, "{ea}");
        // a rope of 20 kN break stretching 10 % at 20 % of break has EA = 40 kN
        let k = fibre_axial_stiffness_n(20_000.0, 0.2, 0.1);
        assert!((k - 40_000.0).abs() < 1e-9);
    }
}
