//! Materials selectable by name in a scenario file: Young's modulus,
//! density and, for metals, a nominal yield stress for rods.
//!
//! Values and sources (each a nominal figure for planning; a member may give
//! its own `modulus`):
//! - steel: E 210 GPa, ρ 7850 kg/m³ — EN 1993-1-1 §3.2.6 (pub); yield
//!   235 MPa for S235 — EN 10025-2 (pub).
//! - stainless steel: E 200 GPa, ρ 7900 kg/m³ — EN 1993-1-4 (mem); yield
//!   210 MPa for 1.4301 — EN 10088 (mem).
//! - aluminium alloy: E 70 GPa, ρ 2700 kg/m³ — EN 1999-1-1 §3.2.5 (mem);
//!   yield 240 MPa for 6082-T6 extrusions — EN 1999-1-1 Table 3.2b (mem).
//! - copper: E 120 GPa (110–130), ρ 8940 kg/m³ — handbook range (mem).
//! - titanium: E 116 GPa, ρ 4510 kg/m³ (handbook range 105–120 GPa, mem).
//! - concrete: E 31 GPa, ρ 2400 kg/m³ — EN 1992-1-1 Table 3.1 C25/30
//!   (mem); EN 1991-1-1 Table A.1 normal-weight 24 kN/m³ (mem).
//! - fibres (polyester 12 GPa / 1380, nylon 4 GPa / 1140, HMPE 100 GPa / 970,
//!   aramid 80 GPa / 1440): fibre values from memory (?), used only for wave
//!   speed and own weight; a fibre rope's stiffness comes from its elastic
//!   elongation, not from this modulus.

use serde::{Deserialize, Serialize};

/// A material known to the library.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Serialize, Deserialize)]
pub enum Material {
    /// Structural carbon steel (also rope wire).
    Steel,
    /// Austenitic stainless steel.
    StainlessSteel,
    /// Aluminium alloy.
    Aluminium,
    /// Copper.
    Copper,
    /// Titanium.
    Titanium,
    /// Normal-weight concrete.
    Concrete,
    /// Polyester fibre.
    Polyester,
    /// Nylon (polyamide) fibre.
    Nylon,
    /// High-modulus polyethylene fibre.
    Hmpe,
    /// Aramid fibre.
    Aramid,
}

/// The library's figures for one material.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct MaterialData {
    /// Young's modulus, Pa.
    pub modulus_pa: f64,
    /// Density, kg/m³.
    pub density_kg_m3: f64,
    /// Nominal yield stress, Pa (metals only).
    pub yield_pa: Option<f64>,
    /// Poisson's ratio.
    pub poisson: f64,
    /// Where the figures come from.
    pub source: &'static str,
}

impl Material {
    /// All materials, in the order pickers show them.
    pub const ALL: [Material; 10] = [
        Material::Steel,
        Material::StainlessSteel,
        Material::Aluminium,
        Material::Copper,
        Material::Titanium,
        Material::Concrete,
        Material::Polyester,
        Material::Nylon,
        Material::Hmpe,
        Material::Aramid,
    ];

    /// The name as written in a file (`material: "steel"`).
    pub fn name(self) -> &'static str {
        match self {
            Material::Steel => "steel",
            Material::StainlessSteel => "stainless steel",
            Material::Aluminium => "aluminium alloy",
            Material::Copper => "copper",
            Material::Titanium => "titanium",
            Material::Concrete => "concrete",
            Material::Polyester => "polyester",
            Material::Nylon => "nylon",
            Material::Hmpe => "HMPE",
            Material::Aramid => "aramid",
        }
    }

    /// Find a material by name, ignoring case and a few common spellings.
    pub fn from_name(name: &str) -> Option<Material> {
        let n = name.trim().to_ascii_lowercase().replace(['-', '_'], " ");
        let m = match n.as_str() {
            "steel" | "carbon steel" => Material::Steel,
            "stainless steel" | "stainless" => Material::StainlessSteel,
            "aluminium alloy" | "aluminium" | "aluminum" | "aluminum alloy" => Material::Aluminium,
            "copper" => Material::Copper,
            "titanium" => Material::Titanium,
            "concrete" => Material::Concrete,
            "polyester" => Material::Polyester,
            "nylon" | "polyamide" => Material::Nylon,
            "hmpe" | "uhmwpe" | "dyneema" => Material::Hmpe,
            "aramid" => Material::Aramid,
            _ => return None,
        };
        Some(m)
    }

    /// The names accepted, for messages.
    pub fn names() -> String {
        Material::ALL.iter().map(|m| m.name()).collect::<Vec<_>>().join(", ")
    }

    /// The library's figures.
    pub fn data(self) -> MaterialData {
        let (e_gpa, rho, fy_mpa, nu, source) = match self {
            Material::Steel => (210.0, 7850.0, Some(235.0), 0.3, "EN 1993-1-1 3.2.6; S235 yield EN 10025-2"),
            Material::StainlessSteel => (200.0, 7900.0, Some(210.0), 0.3, "EN 1993-1-4 (from memory)"),
            Material::Aluminium => (70.0, 2700.0, Some(240.0), 0.3, "EN 1999-1-1 (from memory)"),
            Material::Copper => (120.0, 8940.0, Some(70.0), 0.34, "handbook range 110-130 GPa (from memory)"),
            Material::Titanium => (
                116.0,
                4510.0,
                Some(275.0),
                0.32,
                "handbook 105-120 GPa; 116 GPa matches the CRC thin-rod speed (from memory)",
            ),
            Material::Concrete => (31.0, 2400.0, None, 0.2, "EN 1992-1-1 Table 3.1, C25/30 (from memory)"),
            Material::Polyester => (12.0, 1380.0, None, 0.35, "fibre value, from memory (?)"),
            Material::Nylon => (4.0, 1140.0, None, 0.4, "fibre value, from memory (?)"),
            Material::Hmpe => (100.0, 970.0, None, 0.35, "fibre value, from memory (?)"),
            Material::Aramid => (80.0, 1440.0, None, 0.35, "fibre value, from memory (?)"),
        };
        MaterialData {
            modulus_pa: e_gpa * 1e9,
            density_kg_m3: rho,
            yield_pa: fy_mpa.map(|f| f * 1e6),
            poisson: nu,
            source,
        }
    }

    /// Thin-rod longitudinal wave speed `√(E/ρ)`, m/s.
    pub fn rod_wave_speed_m_s(self) -> f64 {
        let d = self.data();
        (d.modulus_pa / d.density_kg_m3).sqrt()
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    // CRC Handbook of Chemistry and Physics, "speed of sound in solids",
    // thin-rod column: aluminium 5000 m/s, mild steel 5200, titanium 5080,
    // copper (annealed) 3810. Our nominal moduli are design values, not the
    // handbook's specimens, so agreement within 5 % is what is claimed.
    #[test]
    fn wave_speeds_match_handbook() {
        let table = [
            (Material::Aluminium, 5000.0),
            (Material::Steel, 5200.0),
            (Material::Titanium, 5080.0),
            (Material::Copper, 3810.0),
        ];
        for (m, c) in table {
            let got = m.rod_wave_speed_m_s();
            assert!(((got - c) / c).abs() < 0.05, "{}: {got} vs {c}", m.name());
        }
    }

    #[test]
    fn names_round_trip() {
        for m in Material::ALL {
            assert_eq!(Material::from_name(m.name()), Some(m));
        }
        assert_eq!(Material::from_name("Aluminum"), Some(Material::Aluminium));
        assert_eq!(Material::from_name("unobtainium"), None);
    }
}
