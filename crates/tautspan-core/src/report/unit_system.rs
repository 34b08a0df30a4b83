//! The units a report is written in: SI with sensible prefixes (kN, mm, m,
//! GPa) or US customary (lbf, kip, in, ft, ksi, psf). Only conversion and
//! formatting live here; every value formatted comes from the core.

use crate::units::{format_number, unit};

/// The system of units a report is written in.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default)]
pub enum UnitSystem {
    /// SI with prefixes chosen per quantity: kN, m, mm, mm², GPa, MPa, kPa, kg.
    #[default]
    Si,
    /// US customary: lbf, kip, ft, in, in², ksi, psf, lb.
    UsCustomary,
}

/// Significant digits for results (forces, stretches, utilisations).
const RESULT_DIGITS: usize = 3;
/// Significant digits for inputs, so what was typed reads back unchanged.
const INPUT_DIGITS: usize = 4;

/// SI value of one unit given by its file spelling; 1 when the library
/// does not know it (then the value is shown in SI base units).
fn factor(symbol: &str) -> f64 {
    unit(symbol).map_or(1.0, |u| u.to_si)
}

/// `value` (SI) written in the unit `symbol` (file spelling), shown as
/// `shown`. Number and unit are joined by a no-break space, so a narrow
/// table column never splits `12.6 kN`.
fn write(value_si: f64, symbol: &str, shown: &str, digits: usize) -> String {
    format!("{}\u{a0}{shown}", format_number(value_si / factor(symbol), digits))
}

impl UnitSystem {
    fn pick<'a>(self, si: &'a str, us: &'a str) -> &'a str {
        match self {
            UnitSystem::Si => si,
            UnitSystem::UsCustomary => us,
        }
    }

    /// A force in a result (kN or lbf).
    pub fn force(self, force_n: f64) -> String {
        let s = self.pick("kN", "lbf");
        write(force_n, s, s, RESULT_DIGITS)
    }

    /// A force as given in the inputs (kN or lbf).
    pub fn force_input(self, force_n: f64) -> String {
        let s = self.pick("kN", "lbf");
        write(force_n, s, s, INPUT_DIGITS)
    }

    /// An axial stiffness E·A (MN or kip).
    pub fn axial_stiffness(self, force_n: f64) -> String {
        let s = self.pick("MN", "kip");
        write(force_n, s, s, INPUT_DIGITS)
    }

    /// A spring stiffness (kN/mm or kip/in).
    pub fn spring(self, n_per_m: f64) -> String {
        let (f, l) = (self.pick("kN", "kip"), self.pick("mm", "in"));
        let per = factor(f) / factor(l);
        format!("{}\u{a0}{f}/{l}", format_number(n_per_m / per, INPUT_DIGITS))
    }

    /// A layout length or position (m or ft).
    pub fn length(self, length_m: f64) -> String {
        let s = self.pick("m", "ft");
        write(length_m, s, s, INPUT_DIGITS)
    }

    /// The unit of [`UnitSystem::length`] and its SI value, for scale bars.
    pub fn length_unit(self) -> (&'static str, f64) {
        let s = match self {
            UnitSystem::Si => "m",
            UnitSystem::UsCustomary => "ft",
        };
        (s, factor(s))
    }

    /// A small length: diameter, thickness, stretch, deflection (mm or in).
    pub fn small_length(self, length_m: f64) -> String {
        let s = self.pick("mm", "in");
        write(length_m, s, s, INPUT_DIGITS)
    }

    /// An area (mm² or in²).
    pub fn area(self, area_m2: f64) -> String {
        let (s, shown) = match self {
            UnitSystem::Si => ("mm^2", "mm²"),
            UnitSystem::UsCustomary => ("in^2", "in²"),
        };
        write(area_m2, s, shown, INPUT_DIGITS)
    }

    /// A modulus (GPa or ksi).
    pub fn modulus(self, pa: f64) -> String {
        let s = self.pick("GPa", "ksi");
        write(pa, s, s, INPUT_DIGITS)
    }

    /// A stress such as a yield stress (MPa or ksi).
    pub fn stress(self, pa: f64) -> String {
        let s = self.pick("MPa", "ksi");
        write(pa, s, s, INPUT_DIGITS)
    }

    /// A floor load per area (kPa or psf).
    pub fn floor_pressure(self, pa: f64) -> String {
        let s = self.pick("kPa", "psf");
        write(pa, s, s, INPUT_DIGITS)
    }

    /// A mass (kg or lb).
    pub fn mass(self, kg: f64) -> String {
        let s = self.pick("kg", "lb");
        write(kg, s, s, INPUT_DIGITS)
    }

    /// A mass per length (kg/m or lb/ft).
    pub fn linear_mass(self, kg_per_m: f64) -> String {
        let s = self.pick("kg/m", "lb/ft");
        write(kg_per_m, s, s, INPUT_DIGITS)
    }

    /// An acceleration such as gravity (m/s² or ft/s²), to six digits.
    pub fn acceleration(self, m_s2: f64) -> String {
        let (s, shown) = match self {
            UnitSystem::Si => ("m/s^2", "m/s²"),
            UnitSystem::UsCustomary => ("ft/s^2", "ft/s²"),
        };
        write(m_s2, s, shown, 6)
    }

    /// The name shown in the report header.
    pub fn name(self) -> &'static str {
        self.pick("SI", "US customary")
    }
}

/// A plain number from the results (ratio, factor), three significant digits.
pub fn number(value: f64) -> String {
    format_number(value, RESULT_DIGITS)
}

/// A utilisation as a percentage, three significant digits.
pub fn percent(utilisation: f64) -> String {
    format!("{}\u{a0}%", format_number(utilisation * 100.0, RESULT_DIGITS))
}

/// An angle in degrees, three significant digits.
pub fn degrees(deg: f64) -> String {
    format!("{}°", format_number(deg, RESULT_DIGITS))
}

#[cfg(test)]
mod tests {
    use super::*;

    // Exact factors: 1 lbf = 4.4482216152605 N, 1 in = 25.4 mm (NIST SP 811).
    #[test]
    fn formats_both_systems() {
        assert_eq!(UnitSystem::Si.force(18_140.0), "18.1\u{a0}kN");
        assert_eq!(UnitSystem::UsCustomary.force(4.448_221_615_260_5), "1\u{a0}lbf");
        assert_eq!(UnitSystem::Si.area(64.7e-6), "64.7\u{a0}mm²");
        assert_eq!(UnitSystem::UsCustomary.small_length(0.0254), "1\u{a0}in");
        assert_eq!(UnitSystem::Si.spring(2.0e6), "2\u{a0}kN/mm");
        assert_eq!(percent(0.8766), "87.7\u{a0}%");
    }
}
