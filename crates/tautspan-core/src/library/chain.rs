//! Alloy lifting chain: minimum breaking force from nominal diameter and
//! grade, stiffness and own weight.
//!
//! EN 818-2 (grade 8) and EN 818-7 / grade 100 practice: minimum breaking
//! force `F = (π/2) d² R`, i.e. the stress R over both legs of a link, with
//! R = 800 N/mm² for grade 80 and 1000 N/mm² for grade 100. The grade 80
//! working load limit is F/4 (10 mm: 126 kN → 31.4 kN, the familiar 3.15 t).

use serde::{Deserialize, Serialize};

/// A chain grade.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Serialize, Deserialize)]
pub enum ChainGrade {
    /// Grade 80 (EN 818-2, ASTM A391).
    Grade80,
    /// Grade 100.
    Grade100,
}

impl ChainGrade {
    /// Read "80", "G80", "grade 80", "100" …
    pub fn from_name(name: &str) -> Option<ChainGrade> {
        let digits: String = name.chars().filter(|c| c.is_ascii_digit()).collect();
        match digits.as_str() {
            "80" | "8" => Some(ChainGrade::Grade80),
            "100" | "10" => Some(ChainGrade::Grade100),
            _ => None,
        }
    }

    /// Name as written in a file.
    pub fn name(self) -> &'static str {
        match self {
            ChainGrade::Grade80 => "80",
            ChainGrade::Grade100 => "100",
        }
    }

    /// Mean stress at break over both legs, Pa.
    pub fn breaking_stress_pa(self) -> f64 {
        match self {
            ChainGrade::Grade80 => 800e6,
            ChainGrade::Grade100 => 1000e6,
        }
    }

    /// Minimum breaking force for nominal diameter `d_m`, N.
    pub fn min_breaking_force_n(self, d_m: f64) -> f64 {
        std::f64::consts::FRAC_PI_2 * d_m * d_m * self.breaking_stress_pa()
    }

    /// Source for reports.
    pub fn source(self) -> &'static str {
        match self {
            ChainGrade::Grade80 => "EN 818-2: F = (pi/2) d^2 x 800 N/mm^2",
            ChainGrade::Grade100 => "grade 100: F = (pi/2) d^2 x 1000 N/mm^2 (practice)",
        }
    }
}

/// Steel area of both legs of a link, m²; with E of steel this gives the
/// chain's axial stiffness. Link bending makes a real chain softer, so the
/// stiffness is an upper bound (which makes drop forces conservative).
pub fn chain_area_m2(d_m: f64) -> f64 {
    2.0 * std::f64::consts::FRAC_PI_4 * d_m * d_m
}

/// Chain mass per metre ≈ 0.0222 d² kg/m with d in mm (a short-link
/// catalogue rule of thumb: 10 mm ≈ 2.2 kg/m; practice, from memory).
pub fn chain_linear_mass_kg_m(d_m: f64) -> f64 {
    let d_mm = d_m * 1e3;
    0.0222 * d_mm * d_mm
}

#[cfg(test)]
mod tests {
    use super::*;

    // EN 818-2 grade 8 table (from memory): 10 mm → 126 kN MBF, WLL 3.15 t
    // (30.9 kN); 13 mm → 212 kN. The standard rounds, so 1 % tolerance.
    #[test]
    fn grade_80_breaking_force() {
        for (d_mm, kn) in [(10.0, 126.0), (13.0, 212.0)] {
            let f = ChainGrade::Grade80.min_breaking_force_n(d_mm * 1e-3) / 1e3;
            assert!(((f - kn) / kn).abs() < 0.01, "{d_mm}: {f}");
        }
        assert_eq!(ChainGrade::from_name("G100"), Some(ChainGrade::Grade100));
    }
}
