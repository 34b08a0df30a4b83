//! Stranded wire rope constructions: metallic area and minimum breaking
//! force from nominal diameter and rope grade.
//!
//! `A = C d²`, `F_min = K d² R_r / 1000` (kN, d in mm, R_r in N/mm²), with
//! the factors of EN 12385-4 as tabulated in Feyrer, *Wire Ropes*, Table 1.9:
//! 6×19 fibre core C 0.384 K 0.330; 6×19 IWRC C 0.449 K 0.356; 6×36 fibre
//! core C 0.393 K 0.330; 6×36 IWRC C 0.460 K 0.356.
//!
//! Effective rope modulus on the metallic area (Feyrer, from memory (?)):
//! fibre core 90 GPa (range 80–100), steel core 105 GPa (range 100–110).

use serde::{Deserialize, Serialize};

/// A rope construction known to the library.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Serialize, Deserialize)]
pub enum Construction {
    /// 6×19 class, fibre core.
    SixBy19Fc,
    /// 6×19 class, independent wire rope core.
    SixBy19Iwrc,
    /// 6×36 class, fibre core.
    SixBy36Fc,
    /// 6×36 class, independent wire rope core.
    SixBy36Iwrc,
}

/// Rope grades (minimum tensile strength of the wire, N/mm²) the library knows.
pub const ROPE_GRADES: [f64; 4] = [1570.0, 1770.0, 1960.0, 2160.0];

impl Construction {
    /// All constructions, as pickers show them.
    pub const ALL: [Construction; 4] =
        [Construction::SixBy19Fc, Construction::SixBy19Iwrc, Construction::SixBy36Fc, Construction::SixBy36Iwrc];

    /// The name as written in a file.
    pub fn name(self) -> &'static str {
        match self {
            Construction::SixBy19Fc => "6x19 FC",
            Construction::SixBy19Iwrc => "6x19 IWRC",
            Construction::SixBy36Fc => "6x36 FC",
            Construction::SixBy36Iwrc => "6x36 IWRC",
        }
    }

    /// Read a construction name: `"6x19 IWRC"`, `"6×36 FC"`, case and spacing free.
    pub fn from_name(name: &str) -> Option<Construction> {
        let n: String =
            name.to_ascii_lowercase().replace('×', "x").chars().filter(|c| !c.is_whitespace() && *c != '-').collect();
        Some(match n.as_str() {
            "6x19fc" | "6x19" => Construction::SixBy19Fc,
            "6x19iwrc" | "6x19sc" => Construction::SixBy19Iwrc,
            "6x36fc" | "6x36" => Construction::SixBy36Fc,
            "6x36iwrc" | "6x36sc" => Construction::SixBy36Iwrc,
            _ => return None,
        })
    }

    /// Names accepted, for messages.
    pub fn names() -> String {
        Construction::ALL.iter().map(|c| c.name()).collect::<Vec<_>>().join(", ")
    }

    /// Fill factor C of `A = C d²`.
    pub fn area_factor(self) -> f64 {
        match self {
            Construction::SixBy19Fc => 0.384,
            Construction::SixBy19Iwrc => 0.449,
            Construction::SixBy36Fc => 0.393,
            Construction::SixBy36Iwrc => 0.460,
        }
    }

    /// Breaking force factor K of `F = K d² R_r`.
    pub fn breaking_factor(self) -> f64 {
        match self {
            Construction::SixBy19Fc | Construction::SixBy36Fc => 0.330,
            Construction::SixBy19Iwrc | Construction::SixBy36Iwrc => 0.356,
        }
    }

    /// Metallic area for nominal diameter `d_m`, m².
    pub fn metallic_area_m2(self, d_m: f64) -> f64 {
        self.area_factor() * d_m * d_m
    }

    /// Minimum breaking force for nominal diameter `d_m` and grade `grade_pa`, N.
    pub fn min_breaking_force_n(self, d_m: f64, grade_pa: f64) -> f64 {
        self.breaking_factor() * d_m * d_m * grade_pa
    }

    /// Effective rope modulus on the metallic area, Pa.
    pub fn effective_modulus_pa(self) -> f64 {
        match self {
            Construction::SixBy19Fc | Construction::SixBy36Fc => 90e9,
            Construction::SixBy19Iwrc | Construction::SixBy36Iwrc => 105e9,
        }
    }

    /// Source line for reports.
    pub fn source(self) -> &'static str {
        "EN 12385-4 factors (Feyrer, Wire Ropes, Table 1.9); modulus Feyrer (from memory)"
    }
}

/// Rope mass per metre from the metallic area: steel 7850 kg/m³ × metallic
/// area × 1.1 for lay and lubricant (an estimate, practice). Pure own
/// weight; small next to most loads.
pub fn rope_linear_mass_kg_m(metallic_area_m2: f64) -> f64 {
    7850.0 * metallic_area_m2 * 1.1
}

#[cfg(test)]
mod tests {
    use super::*;

    // Minimum breaking forces of 6×19 IWRC derived from the EN 12385-4 factor
    // K = 0.356 (REFERENCES.md, "derived"): grade 1770 10 mm 63.0 kN, 12 mm
    // 90.7 kN, 16 mm 161 kN; grade 1960 69.8, 100.5, 178.6 kN. The table is
    // rounded to 3–4 figures, so 0.2 % is the tolerance.
    #[test]
    fn breaking_forces_match_table() {
        let table = [
            (10.0, 1770.0, 63.0),
            (12.0, 1770.0, 90.7),
            (16.0, 1770.0, 161.0),
            (10.0, 1960.0, 69.8),
            (12.0, 1960.0, 100.5),
            (16.0, 1960.0, 178.6),
        ];
        for (d_mm, grade, kn) in table {
            let f = Construction::SixBy19Iwrc.min_breaking_force_n(d_mm * 1e-3, grade * 1e6) / 1e3;
            assert!(((f - kn) / kn).abs() < 2e-3, "{d_mm} mm {grade}: {f} kN vs {kn}");
        }
    }

    #[test]
    fn names_parse() {
        assert_eq!(Construction::from_name("6×19 IWRC"), Some(Construction::SixBy19Iwrc));
        assert_eq!(Construction::from_name("6x36 fc"), Some(Construction::SixBy36Fc));
        assert_eq!(Construction::from_name("7x7"), None);
        for c in Construction::ALL {
            assert_eq!(Construction::from_name(c.name()), Some(c));
        }
    }
}
