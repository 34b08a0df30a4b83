//! Alloy lifting chain: minimum breaking force from nominal diameter and
//! grade, stiffness and own weight.
//!
//! EN 818-2 (grade 8) and EN 818-7 / grade 100 practice: minimum breaking
//! force `F = (π/2) d² R`, i.e. the stress R over both legs of a link, with
//! R = 800 N/mm² for grade 80 and 1000 N/mm² for grade 100. The grade 80
//! working load limit is not F/4 unrounded: EN 818-2 tabulates it (rounded
//! down, 10 mm: F/4 = 31.4 kN but WLL 3.15 t = 30.9 kN), so a grade 80
//! chain without a rating takes the table's WLL, and a diameter not in the
//! table is refused (no interpolation). Grade 100 has no table here: its
//! WLL must be given.

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

/// EN 818-2 grade 8, single leg: working load limit in tonnes by nominal
/// diameter in mm (from memory, not re-read; the grade 4 table of EN 818-3
/// found in a public copy, 7 mm 0.75 t … 45 mm 31.5 t, is half of it to
/// within the R20 rounding, as the grades' stresses 400 and 800 N/mm² imply).
pub const GRADE_80_WLL_T: [(f64, f64); 18] = [
    (6.0, 1.12),
    (7.0, 1.5),
    (8.0, 2.0),
    (10.0, 3.15),
    (13.0, 5.3),
    (16.0, 8.0),
    (18.0, 10.0),
    (19.0, 11.2),
    (20.0, 12.5),
    (22.0, 15.0),
    (23.0, 16.0),
    (25.0, 20.0),
    (26.0, 21.2),
    (28.0, 25.0),
    (32.0, 31.5),
    (36.0, 40.0),
    (40.0, 50.0),
    (45.0, 63.0),
];

impl ChainGrade {
    /// The tabulated single-leg working load limit for nominal diameter
    /// `d_m`, kg; `None` when the grade has no table here or the size is not
    /// in it.
    pub fn tabulated_wll_kg(self, d_m: f64) -> Option<f64> {
        match self {
            ChainGrade::Grade80 => {
                GRADE_80_WLL_T.iter().find(|(d, _)| (d - d_m * 1e3).abs() < 0.01).map(|(_, t)| t * 1e3)
            }
            ChainGrade::Grade100 => None,
        }
    }

    /// The tabulated sizes, for messages.
    pub fn tabulated_sizes(self) -> String {
        match self {
            ChainGrade::Grade80 => GRADE_80_WLL_T.iter().map(|(d, _)| format!("{d}")).collect::<Vec<_>>().join(", "),
            ChainGrade::Grade100 => String::new(),
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

    // EN 818-2 grade 8 single-leg WLL (from memory; REFERENCES "Chain slings
    // grade 8"): 6 mm 1.12 t, 7 mm 1.5, 8 mm 2.0, 10 mm 3.15, 13 mm 5.3,
    // 16 mm 8.0. Exact table values. 9 mm and 12 mm are not in the table.
    #[test]
    fn grade_80_tabulated_wll() {
        for (d_mm, t) in [(6.0, 1.12), (7.0, 1.5), (8.0, 2.0), (10.0, 3.15), (13.0, 5.3), (16.0, 8.0)] {
            let kg = ChainGrade::Grade80.tabulated_wll_kg(d_mm * 1e-3).unwrap();
            assert!((kg - t * 1e3).abs() < 1e-9, "{d_mm}: {kg}");
        }
        assert_eq!(ChainGrade::Grade80.tabulated_wll_kg(9e-3), None);
        assert_eq!(ChainGrade::Grade80.tabulated_wll_kg(12e-3), None);
        assert_eq!(ChainGrade::Grade100.tabulated_wll_kg(10e-3), None);
        // the table sits below MBF/4 (rounded down), never above it
        for (d_mm, t) in GRADE_80_WLL_T {
            let quarter_t = ChainGrade::Grade80.min_breaking_force_n(d_mm * 1e-3) / 4.0 / 9.806_65 / 1e3;
            assert!(t <= quarter_t * 1.001, "{d_mm} mm: {t} t over MBF/4 = {quarter_t} t");
        }
    }
}
