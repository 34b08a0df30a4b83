//! A rod in compression: its buckling resistance and the compression
//! allowable, or why it cannot be checked.
//!
//! Compression allowable `N_b / n = χ A f / n` (γ_M1 = 1, `n` the member's
//! design factor, the same factor as on yield in tension), with χ from the
//! buckling curve of its material (see [`crate::library::buckling`]) and
//! the buckling length `K L`, `L` the drawn length between its end nodes.
//! A rod without a section, without a yield (or 0.2 % proof) rating, of a
//! material with no curve, or a class 4 steel tube, cannot be checked in
//! compression: it is `unchecked`, never ok.

use crate::library::{Buckling, Material, MemberKind, buckling, steel_tube_class_4};
use crate::model::{Member, Rating, Scenario};
use crate::units::format_number;

/// How a member is checked in compression.
#[derive(Debug, Clone, PartialEq)]
pub enum Compression {
    /// Not a strut: a tension-only member (slack in compression).
    NotStrut,
    /// The buckling check applies.
    Buckling {
        /// Compression allowable `χ A f / n`, N.
        allowable_n: f64,
        /// The check's steps.
        check: Buckling,
        /// Buckling length `K L`, m.
        buckling_length_m: f64,
    },
    /// The inputs cannot support the check: why, in words.
    Unchecked(String),
}

impl Compression {
    /// Euler load, N, where found.
    pub fn euler_n(&self) -> Option<f64> {
        match self {
            Compression::Buckling { check, .. } => Some(check.euler_n),
            _ => None,
        }
    }

    /// Buckling resistance `χ A f`, N, where found.
    pub fn resistance_n(&self) -> Option<f64> {
        match self {
            Compression::Buckling { check, .. } => Some(check.resistance_n),
            _ => None,
        }
    }
}

/// How member `i` of `s` is checked in compression.
pub fn compression(s: &Scenario, i: usize) -> Compression {
    let m = &s.members[i];
    let Some(strut) = m.strut.as_ref().filter(|_| m.kind == MemberKind::Rod) else { return Compression::NotStrut };
    let Rating::Yield(fy) = m.rating else {
        return Compression::Unchecked(
            "its rating is not a yield stress: the buckling check needs rating: Yield(\"... MPa\") (EN 1993-1-1 6.3.1)"
                .to_string(),
        );
    };
    let curve = match &strut.curve {
        Ok(c) => c.clone(),
        Err(why) => return Compression::Unchecked(why.clone()),
    };
    let Some(section) = strut.section else {
        return Compression::Unchecked("section unknown".to_string());
    };
    if matches!(m.material, Some(Material::Steel) | None)
        && let Some(why) = steel_tube_class_4(section, fy.value)
    {
        return Compression::Unchecked(why);
    }
    let e_pa = m.axial_stiffness.value / m.area.value;
    let length_m = s.drawn_length_m(i);
    let check = buckling(section, e_pa, fy.value, strut.effective_length_factor, length_m, curve);
    Compression::Buckling {
        allowable_n: check.resistance_n / m.design_factor.value,
        buckling_length_m: strut.effective_length_factor * length_m,
        check,
    }
}

fn kn(v: f64) -> String {
    format!("{} kN", format_number(v / 1e3, 4))
}

/// The compression check in words: formula, inputs, each step and sources.
pub fn compression_explanation(m: &Member, c: &Compression) -> String {
    match c {
        Compression::NotStrut => format!("{} carries tension only", m.kind.label()),
        Compression::Unchecked(why) => format!("compression not checked for buckling: {why}"),
        Compression::Buckling { allowable_n, check, buckling_length_m } => {
            let k_note = match &m.strut {
                Some(s) if s.k_from_file => {
                    format!("K = {} given in the file", format_number(s.effective_length_factor, 3))
                }
                _ => {
                    "K = 1.0, pinned at both ends (the default; give effective_length_factor for other end conditions)"
                        .to_string()
                }
            };
            let section = m.strut.as_ref().and_then(|s| s.section).map(|s| s.describe()).unwrap_or_default();
            format!(
                "buckling: {section}, A = {} mm^2, I = {} mm^4; N_cr = pi^2 E I / (K L)^2 = {} with E = {} GPa, K L = {} m ({k_note}; Timoshenko & Gere); lambda = sqrt(A f / N_cr) = {}; {}: chi = {}; N_b = chi A f = {} (gamma_M1 = 1) / design factor {} = {} compression allowable; source: {}",
                format_number(m.area.value * 1e6, 4),
                format_number(m.strut.as_ref().and_then(|s| s.section).map_or(0.0, |s| s.second_moment_m4()) * 1e12, 4),
                kn(check.euler_n),
                format_number(m.axial_stiffness.value / m.area.value / 1e9, 4),
                format_number(*buckling_length_m, 4),
                format_number(check.slenderness, 4),
                check.curve.name,
                format_number(check.chi, 4),
                kn(check.resistance_n),
                format_number(m.design_factor.value, 3),
                kn(*allowable_n),
                check.curve.source
            )
        }
    }
}
