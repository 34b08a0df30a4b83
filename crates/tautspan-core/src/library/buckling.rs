//! Flexural buckling of a strut: its section (tube or solid round), the
//! Euler load and the buckling curve that reduces the squash load to the
//! buckling resistance.
//!
//! - Section: tube `A = π (D² − d²) / 4`, `I = π (D⁴ − d⁴) / 64`
//!   (`d = D − 2 t`); solid round the same with `d = 0`.
//! - Euler load `N_cr = π² E I / (K L)²` (Timoshenko & Gere, Theory of
//!   Elastic Stability, ch. 2).
//! - Reduction factor, one form for all three standards:
//!   `λ̄ = √(A f / N_cr)`, `Φ = 0.5 [1 + α (λ̄ − λ̄0) + λ̄²]`,
//!   `χ = 1 / (Φ + √(Φ² − λ̄²)) ≤ 1`, resistance `N_b = χ A f` (γ_M1 = 1).
//!   - carbon steel: EN 1993-1-1:2005 §6.3.1.2, λ̄0 = 0.2, α from Table 6.1
//!     by curve (a0 0.13, a 0.21, b 0.34, c 0.49, d 0.76); the curve from
//!     Table 6.2 (hollow sections hot finished a, cold formed c; solid
//!     sections c).
//!   - aluminium alloy: EN 1999-1-1 §6.3.1.2 by buckling class (A: α 0.20,
//!     λ̄0 0.10; B: α 0.32, λ̄0 0.00), f = f_o, unwelded (κ = 1) — from
//!     memory, not re-read.
//!   - stainless steel: EN 1993-1-4 §5.4.2 Table 5.3, hollow sections
//!     α 0.49, λ̄0 0.40 — from memory; the table names no curve for solid
//!     bars, so a solid stainless strut is not checked.
//!
//! The section class (local buckling of thin walls) is checked for carbon
//! steel tubes only: EN 1993-1-1 Table 5.2 (sheet 3), a tube in compression
//! is class 1 to 3 while `D / t ≤ 90 ε²`, `ε = √(235 / f_y)`; beyond that
//! (class 4) the effective area is needed and the strut is not checked.

use super::Material;
use std::f64::consts::PI;

/// A strut's cross-section.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum Section {
    /// Circular hollow section: outside diameter and wall thickness, m.
    Tube {
        /// Outside diameter D, m.
        outer_m: f64,
        /// Wall thickness t, m.
        wall_m: f64,
    },
    /// Solid round bar, diameter m.
    SolidRound {
        /// Diameter, m.
        diameter_m: f64,
    },
}

impl Section {
    /// Outside and inside diameters, m.
    fn diameters_m(self) -> (f64, f64) {
        match self {
            Section::Tube { outer_m, wall_m } => (outer_m, outer_m - 2.0 * wall_m),
            Section::SolidRound { diameter_m } => (diameter_m, 0.0),
        }
    }

    /// Area `π (D² − d²) / 4`, m².
    pub fn area_m2(self) -> f64 {
        let (o, i) = self.diameters_m();
        PI * (o * o - i * i) / 4.0
    }

    /// Second moment of area `π (D⁴ − d⁴) / 64`, m⁴.
    pub fn second_moment_m4(self) -> f64 {
        let (o, i) = self.diameters_m();
        PI * (o.powi(4) - i.powi(4)) / 64.0
    }

    /// True for a tube.
    pub fn is_hollow(self) -> bool {
        matches!(self, Section::Tube { .. })
    }

    /// In words, mm: "tube 48.3 x 3.2 mm", "solid round 30 mm".
    pub fn describe(self) -> String {
        let mm = |v: f64| crate::units::format_number(v * 1e3, 4);
        match self {
            Section::Tube { outer_m, wall_m } => format!("tube {} x {} mm", mm(outer_m), mm(wall_m)),
            Section::SolidRound { diameter_m } => format!("solid round {} mm", mm(diameter_m)),
        }
    }
}

/// A buckling curve: imperfection factor, plateau slenderness and where
/// both come from.
#[derive(Debug, Clone, PartialEq)]
pub struct Curve {
    /// Imperfection factor α.
    pub alpha: f64,
    /// Slenderness up to which χ = 1, λ̄0.
    pub plateau: f64,
    /// Name: "curve c", "class B".
    pub name: String,
    /// Standard and clause, and how the curve was chosen.
    pub source: String,
}

/// EN 1993-1-1:2005 Table 6.1: imperfection factor by buckling curve.
pub const STEEL_CURVES: [(&str, f64); 5] = [("a0", 0.13), ("a", 0.21), ("b", 0.34), ("c", 0.49), ("d", 0.76)];

/// EN 1999-1-1 §6.3.1.2 (from memory): (class, α, λ̄0).
pub const ALUMINIUM_CLASSES: [(&str, f64, f64); 2] = [("A", 0.20, 0.10), ("B", 0.32, 0.00)];

/// EN 1993-1-4 Table 5.3, hollow sections (from memory): α, λ̄0.
pub const STAINLESS_HOLLOW: (f64, f64) = (0.49, 0.40);

/// Why a strut's buckling curve cannot be found.
#[derive(Debug, Clone, PartialEq)]
pub enum CurveError {
    /// The named curve or class is not one the standard has.
    Unknown(String),
    /// The material has no curve in this tool (the check is `unchecked`).
    NoCurve(String),
}

/// The buckling curve of a strut of `material` with `section`, from the
/// file's `given` name or by default, with its source.
pub fn curve_for(material: Option<Material>, section: Section, given: Option<&str>) -> Result<Curve, CurveError> {
    let given = given.map(|g| g.trim().trim_start_matches("curve").trim_start_matches("class").trim().to_string());
    match material {
        Some(Material::Steel) => steel_curve(section, given),
        None if given.is_some() => steel_curve(section, given),
        Some(Material::Aluminium) => {
            let defaulted = given.is_none();
            let name = given.map(|g| g.to_ascii_uppercase()).unwrap_or_else(|| "B".to_string());
            match ALUMINIUM_CLASSES.iter().find(|(n, _, _)| *n == name) {
                Some(&(n, alpha, plateau)) => Ok(Curve {
                    alpha,
                    plateau,
                    name: format!("class {n}"),
                    source: format!(
                        "EN 1999-1-1 6.3.1.2, buckling class {n}: alpha {alpha}, lambda0 {plateau} (from memory){}",
                        if defaulted {
                            "; class B (the lower curve) taken as the alloy's class was not given: give buckling_curve: \"A\" for a heat-treated alloy of class A"
                        } else {
                            ""
                        }
                    ),
                }),
                None => Err(CurveError::Unknown(format!(
                    "aluminium buckling class \"{name}\" is not A or B (EN 1999-1-1 6.3.1.2)"
                ))),
            }
        }
        Some(Material::StainlessSteel) => {
            if given.is_some() {
                return Err(CurveError::Unknown(
                    "stainless steel takes its curve from EN 1993-1-4 Table 5.3 by section type; leave buckling_curve out"
                        .to_string(),
                ));
            }
            if section.is_hollow() {
                let (alpha, plateau) = STAINLESS_HOLLOW;
                Ok(Curve {
                    alpha,
                    plateau,
                    name: "stainless hollow".to_string(),
                    source: format!(
                        "EN 1993-1-4 5.4.2 Table 5.3, hollow sections: alpha {alpha}, lambda0 {plateau} (from memory)"
                    ),
                })
            } else {
                Err(CurveError::NoCurve(
                    "EN 1993-1-4 Table 5.3 gives no buckling curve for solid stainless bars".to_string(),
                ))
            }
        }
        Some(m) => Err(CurveError::NoCurve(format!(
            "no buckling curve for {} in this tool (EN 1993-1-1 covers carbon steel, EN 1993-1-4 stainless, EN 1999-1-1 aluminium)",
            m.name()
        ))),
        None => Err(CurveError::NoCurve(
            "material not given: give `material` (steel, stainless steel, aluminium alloy) or a steel `buckling_curve`"
                .to_string(),
        )),
    }
}

fn steel_curve(section: Section, given: Option<String>) -> Result<Curve, CurveError> {
    let defaulted = given.is_none();
    let name = given.map(|g| g.to_ascii_lowercase()).unwrap_or_else(|| "c".to_string());
    let Some(&(n, alpha)) = STEEL_CURVES.iter().find(|(n, _)| *n == name) else {
        return Err(CurveError::Unknown(format!(
            "steel buckling curve \"{name}\" is not one of a0, a, b, c, d (EN 1993-1-1 Table 6.1)"
        )));
    };
    let why = match (defaulted, section.is_hollow()) {
        (false, _) => "given in the file".to_string(),
        (true, true) => "default for a hollow section whose finish is not known (cold formed: curve c, EN 1993-1-1 Table 6.2); give buckling_curve: \"a\" for hot-finished hollow sections".to_string(),
        (true, false) => "solid section, EN 1993-1-1 Table 6.2".to_string(),
    };
    Ok(Curve {
        alpha,
        plateau: 0.2,
        name: format!("curve {n}"),
        source: format!("EN 1993-1-1 6.3.1.2, curve {n}, alpha {alpha} (Table 6.1); {why}"),
    })
}

/// Euler load `π² E I / (K L)²`, N (Timoshenko & Gere).
pub fn euler_load_n(modulus_pa: f64, second_moment_m4: f64, k: f64, length_m: f64) -> f64 {
    let l = k * length_m;
    PI * PI * modulus_pa * second_moment_m4 / (l * l)
}

/// Reduction factor χ for slenderness `lambda` on `curve` (≤ 1).
pub fn reduction_factor(lambda: f64, curve: &Curve) -> f64 {
    if lambda <= curve.plateau {
        return 1.0;
    }
    let phi = 0.5 * (1.0 + curve.alpha * (lambda - curve.plateau) + lambda * lambda);
    (1.0 / (phi + (phi * phi - lambda * lambda).max(0.0).sqrt())).min(1.0)
}

/// A strut's buckling check, every step kept for the explanation.
#[derive(Debug, Clone, PartialEq)]
pub struct Buckling {
    /// Euler load, N.
    pub euler_n: f64,
    /// Non-dimensional slenderness λ̄.
    pub slenderness: f64,
    /// Reduction factor χ.
    pub chi: f64,
    /// Buckling resistance `χ A f` (γ_M1 = 1), N.
    pub resistance_n: f64,
    /// The curve used.
    pub curve: Curve,
}

/// Buckling resistance of a strut of `section`, modulus `e_pa`, strength
/// (yield or 0.2 % proof) `f_pa`, effective length factor `k`, length
/// `length_m`, on `curve`.
pub fn buckling(section: Section, e_pa: f64, f_pa: f64, k: f64, length_m: f64, curve: Curve) -> Buckling {
    let a = section.area_m2();
    let euler_n = euler_load_n(e_pa, section.second_moment_m4(), k, length_m);
    let slenderness = (a * f_pa / euler_n).sqrt();
    let chi = reduction_factor(slenderness, &curve);
    Buckling { euler_n, slenderness, chi, resistance_n: chi * a * f_pa, curve }
}

/// EN 1993-1-1 Table 5.2 (sheet 3): a carbon steel tube in compression is
/// class 4 (local buckling before yield) when `D / t > 90 ε²`,
/// `ε² = 235 / f_y` (f_y in N/mm²). `Some(reason)` when it is.
pub fn steel_tube_class_4(section: Section, fy_pa: f64) -> Option<String> {
    let Section::Tube { outer_m, wall_m } = section else { return None };
    let limit = 90.0 * 235e6 / fy_pa;
    let ratio = outer_m / wall_m;
    (ratio > limit).then(|| {
        format!(
            "tube D/t = {} exceeds 90 eps^2 = {} (class 4, EN 1993-1-1 Table 5.2): local buckling needs the effective area",
            crate::units::format_number(ratio, 3),
            crate::units::format_number(limit, 3)
        )
    })
}

#[cfg(test)]
mod tests {
    use super::*;

    fn rel(a: f64, b: f64) -> f64 {
        ((a - b) / b).abs()
    }

    // Section properties against hand calculation.
    // CHS 48.3 x 3.2: d = 41.9 mm; A = pi (48.3^2 - 41.9^2)/4 = pi x 577.28 / 4
    // = 453.4 mm^2; I = pi (48.3^4 - 41.9^4)/64 = pi (5 442 488 - 3 082 157)/64
    // = 115 860 mm^4 (steel tables list 4.53 cm^2 and 11.6 cm^4 for this
    // tube, EN 10210-2, from memory). Tolerance 0.1 %: hand rounding.
    #[test]
    fn tube_and_solid_section_properties() {
        let t = Section::Tube { outer_m: 48.3e-3, wall_m: 3.2e-3 };
        assert!(rel(t.area_m2(), 453.4e-6) < 1e-3, "{}", t.area_m2());
        assert!(rel(t.second_moment_m4(), 115_860e-12) < 1e-3, "{}", t.second_moment_m4());
        // solid 30 mm: A = 706.86 mm^2, I = pi 30^4 / 64 = 39 761 mm^4 (closed form)
        let s = Section::SolidRound { diameter_m: 30e-3 };
        assert!(rel(s.area_m2(), 706.86e-6) < 1e-4);
        assert!(rel(s.second_moment_m4(), 39_761e-12) < 1e-4);
    }

    // Euler load against the closed form: pinned-pinned pi^2 EI/L^2;
    // K = 2 (cantilever) gives a quarter of it, K = 0.5 four times
    // (Timoshenko & Gere, ch. 2). Exact up to rounding: 1e-12.
    #[test]
    fn euler_load_closed_form() {
        let (e, i, l) = (210e9, 115_860e-12, 2.6);
        let base = PI * PI * e * i / (l * l);
        for (k, factor) in [(1.0, 1.0), (2.0, 0.25), (0.5, 4.0), (0.7, 1.0 / 0.49)] {
            let n = euler_load_n(e, i, k, l);
            assert!(rel(n, base * factor) < 1e-12, "K {k}: {n}");
        }
    }

    // Table-driven EN 1993-1-1 §6.3.1.2 checks, worked by hand.
    //
    // CHS 48.3 x 3.2, S235, L = 2.6 m, K = 1, E = 210 GPa:
    //   A = 453.4 mm^2, I = 115 860 mm^4,
    //   N_cr = pi^2 x 210 000 x 115 860 / 2600^2 = 35.52 kN,
    //   A f_y = 453.4 x 235 = 106.55 kN, lambda = sqrt(106.55/35.52) = 1.732,
    //   curve c: Phi = 0.5 (1 + 0.49 (1.732 - 0.2) + 1.732^2) = 2.375,
    //   chi = 1 / (2.375 + sqrt(2.375^2 - 3.000)) = 1/(2.375 + 1.625) = 0.2500,
    //   N_b = 26.6 kN;
    //   curve a: Phi = 0.5 (1 + 0.21 x 1.532 + 3.000) = 2.161,
    //   chi = 1/(2.161 + sqrt(4.670 - 3.000)) = 1/(2.161 + 1.292) = 0.2896.
    // Same tube, L = 1.0 m: N_cr = 240.1 kN, lambda = 0.6662,
    //   curve c: Phi = 0.5 (1 + 0.49 x 0.4662 + 0.4438) = 0.8361,
    //   chi = 1/(0.8361 + sqrt(0.6991 - 0.4438)) = 1/(0.8361 + 0.5053) = 0.7455.
    // Cross-check with the EN 1993-1-1 Figure 6.4 curves read at these
    // slendernesses (curve c, 1.73: about 0.25; 0.67: about 0.75).
    // Tolerance 0.5 %: four-figure hand arithmetic.
    #[test]
    fn en_1993_hand_calculations() {
        let tube = Section::Tube { outer_m: 48.3e-3, wall_m: 3.2e-3 };
        let c = steel_curve(tube, None).unwrap();
        let a = steel_curve(tube, Some("a".into())).unwrap();
        let cases = [
            (2.6, c.clone(), 35.52e3, 1.732, 0.2500),
            (2.6, a, 35.52e3, 1.732, 0.2896),
            (1.0, c, 240.1e3, 0.6662, 0.7455),
        ];
        for (l, curve, ncr, lam, chi) in cases {
            let name = curve.name.clone();
            let b = buckling(tube, 210e9, 235e6, 1.0, l, curve);
            assert!(rel(b.euler_n, ncr) < 5e-3, "{name} L {l}: N_cr {}", b.euler_n);
            assert!(rel(b.slenderness, lam) < 5e-3, "{name} L {l}: lambda {}", b.slenderness);
            assert!(rel(b.chi, chi) < 5e-3, "{name} L {l}: chi {}", b.chi);
            assert!(rel(b.resistance_n, chi * 453.4e-6 * 235e6) < 5e-3);
        }
    }

    // EN 1993-1-1 Table 6.1/6.2 and §6.3.1.2(4): chi = 1 up to lambda 0.2
    // on every curve; at lambda = 1.0, worked by hand from Table 6.1's alpha
    // (e.g. curve c: Phi = 0.5 (1 + 0.49 x 0.8 + 1) = 1.196,
    // chi = 1/(1.196 + sqrt(1.4304 - 1)) = 0.5399), as design tables print
    // them (from memory): a0 0.7253, a 0.6656, b 0.5970, c 0.5399, d 0.4671.
    // Tolerance 1e-3 (four figures).
    #[test]
    fn reduction_factor_against_curve_table() {
        for (n, chi1) in [("a0", 0.7253), ("a", 0.6656), ("b", 0.5970), ("c", 0.5399), ("d", 0.4671)] {
            let curve = steel_curve(Section::SolidRound { diameter_m: 0.03 }, Some(n.into())).unwrap();
            assert!((reduction_factor(0.2, &curve) - 1.0).abs() < 1e-12);
            assert!((reduction_factor(0.1, &curve) - 1.0).abs() < 1e-12);
            let chi = reduction_factor(1.0, &curve);
            assert!((chi - chi1).abs() < 1e-3, "curve {n}: {chi}");
        }
    }

    // EN 1999-1-1 class B (from memory: alpha 0.32, lambda0 0): at lambda 1,
    // Phi = 0.5 (1 + 0.32 + 1) = 1.16, chi = 1/(1.16 + sqrt(1.3456 - 1))
    // = 1/(1.16 + 0.5879) = 0.5722; class A: Phi = 0.5 (1 + 0.2 x 0.9 + 1)
    // = 1.09, chi = 1/(1.09 + sqrt(1.1881 - 1)) = 1/(1.09 + 0.4337) = 0.6563.
    // Hand arithmetic, 1e-3.
    #[test]
    fn aluminium_classes() {
        let tube = Section::Tube { outer_m: 0.05, wall_m: 0.003 };
        let b = curve_for(Some(Material::Aluminium), tube, None).unwrap();
        assert_eq!(b.name, "class B");
        assert!(b.source.contains("not given"));
        assert!((reduction_factor(1.0, &b) - 0.5722).abs() < 1e-3);
        let a = curve_for(Some(Material::Aluminium), tube, Some("A")).unwrap();
        assert!((reduction_factor(1.0, &a) - 0.6563).abs() < 1e-3);
        assert!(matches!(curve_for(Some(Material::Aluminium), tube, Some("c")), Err(CurveError::Unknown(_))));
    }

    #[test]
    fn curve_defaults_and_refusals() {
        let tube = Section::Tube { outer_m: 0.05, wall_m: 0.003 };
        let solid = Section::SolidRound { diameter_m: 0.03 };
        let c = curve_for(Some(Material::Steel), tube, None).unwrap();
        assert_eq!(c.name, "curve c");
        assert!(c.source.contains("hot-finished"), "{}", c.source);
        assert_eq!(curve_for(Some(Material::Steel), solid, None).unwrap().name, "curve c");
        assert_eq!(curve_for(None, tube, Some("b")).unwrap().name, "curve b");
        assert!(matches!(curve_for(Some(Material::Titanium), tube, None), Err(CurveError::NoCurve(_))));
        assert!(matches!(curve_for(Some(Material::StainlessSteel), solid, None), Err(CurveError::NoCurve(_))));
        assert!(curve_for(Some(Material::StainlessSteel), tube, None).is_ok());
        assert!(matches!(curve_for(None, tube, None), Err(CurveError::NoCurve(_))));
        assert!(matches!(curve_for(Some(Material::Steel), tube, Some("e")), Err(CurveError::Unknown(_))));
    }

    // EN 1993-1-1 Table 5.2: class 3 limit for tubes 90 eps^2; S235 limit 90,
    // S355 limit 90 x 235/355 = 59.6.
    #[test]
    fn thin_steel_tubes_are_class_4() {
        let thin = Section::Tube { outer_m: 0.1, wall_m: 0.001 };
        assert!(steel_tube_class_4(thin, 235e6).is_some());
        let ok = Section::Tube { outer_m: 0.0483, wall_m: 0.0032 };
        assert!(steel_tube_class_4(ok, 355e6).is_none());
        let s355 = Section::Tube { outer_m: 0.060, wall_m: 0.001 };
        assert!(steel_tube_class_4(s355, 355e6).is_some());
        assert!(steel_tube_class_4(s355, 235e6).is_none());
    }
}
