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
/// A value whose conversion overflows (a mass of 1e308 kg in lb) or that
/// is not finite prints as a dash, as in the text output, never `inf`.
fn write(value_si: f64, symbol: &str, shown: &str, digits: usize) -> String {
    format!("{}\u{a0}{shown}", fmt(value_si / factor(symbol), digits))
}

/// `format_number`, or an en dash where the value is not finite.
fn fmt(v: f64, digits: usize) -> String {
    if v.is_finite() { format_number(v, digits) } else { "\u{2013}".to_string() }
}

/// One short ton, 2000 lb = 907.184 74 kg exactly (NIST SP 811, 2008,
/// Appendix B.8: ton, short (2000 lb)).
pub const SHORT_TON_KG: f64 = 907.184_74;

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
        format!("{}\u{a0}{f}/{l}", fmt(n_per_m / per, INPUT_DIGITS))
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

    /// A mass (kg; US: lb below one short ton, short tons from one up).
    pub fn mass(self, kg: f64) -> String {
        match self {
            UnitSystem::UsCustomary if kg.abs() >= SHORT_TON_KG => {
                format!("{}\u{a0}short\u{a0}ton", fmt(kg / SHORT_TON_KG, INPUT_DIGITS))
            }
            _ => {
                let s = self.pick("kg", "lb");
                write(kg, s, s, INPUT_DIGITS)
            }
        }
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

    /// The units of the command line's text and CSV columns: (symbol, SI
    /// value of one unit) for forces (kN | kip), small lengths (mm | in),
    /// layout lengths (m | ft) and bearing pressures (kPa | psf). The
    /// factors are the file table's, exact by definition (NIST SP 811, 2008,
    /// Appendix B.8: 1 in = 0.0254 m, 1 ft = 0.3048 m, 1 lbf =
    /// 4.448 221 615 260 5 N, 1 kip = 1000 lbf, 1 psf = 47.880 26 Pa).
    pub fn columns(self) -> Columns {
        let c = |s: &'static str| (s, factor(s));
        match self {
            UnitSystem::Si => Columns { force: c("kN"), small: c("mm"), length: c("m"), pressure: c("kPa") },
            UnitSystem::UsCustomary => Columns { force: c("kip"), small: c("in"), length: c("ft"), pressure: c("psf") },
        }
    }

    /// The name shown in the report header.
    pub fn name(self) -> &'static str {
        self.pick("SI", "US customary")
    }
}

/// The units of text and CSV columns, each as (symbol, SI value of one unit).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Columns {
    /// Forces: kN or kip.
    pub force: (&'static str, f64),
    /// Stretch, sag, deflection: mm or in.
    pub small: (&'static str, f64),
    /// Positions and heights: m or ft.
    pub length: (&'static str, f64),
    /// Bearing pressure: kPa or psf.
    pub pressure: (&'static str, f64),
}

/// A plain number from the results (ratio, factor), three significant digits.
pub fn number(value: f64) -> String {
    fmt(value, RESULT_DIGITS)
}

/// A utilisation as a percentage, three significant digits.
pub fn percent(utilisation: f64) -> String {
    format!("{}\u{a0}%", fmt(utilisation * 100.0, RESULT_DIGITS))
}

/// An angle in degrees, three significant digits.
pub fn degrees(deg: f64) -> String {
    format!("{}°", fmt(deg, RESULT_DIGITS))
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
        // 1 short ton = 2000 lb = 907.184 74 kg (NIST SP 811 B.8); below it, pounds
        assert_eq!(UnitSystem::UsCustomary.mass(907.184_74), "1\u{a0}short\u{a0}ton");
        assert_eq!(UnitSystem::UsCustomary.mass(2.0 * 907.184_74 + 0.453_592_37 * 500.0), "2.25\u{a0}short\u{a0}ton");
        assert_eq!(UnitSystem::UsCustomary.mass(0.453_592_37 * 250.0), "250\u{a0}lb");
    }

    /// A mass of 1e308 kg overflows in pounds; it prints a dash, never `inf`.
    #[test]
    fn overflow_prints_a_dash_not_inf() {
        assert_eq!(UnitSystem::Si.length(f64::INFINITY), "\u{2013}\u{a0}m");
        assert_eq!(UnitSystem::UsCustomary.small_length(f64::MAX), "\u{2013}\u{a0}in");
        assert_eq!(percent(f64::NAN), "\u{2013}\u{a0}%");
    }
}
