//! Display units: the SI / US customary switch and the formatting of every
//! number the app shows. Values arrive from the core in SI base units; this
//! file only chooses a unit and a number of digits (it converts, it does not
//! compute anything of its own).

use serde::{Deserialize, Serialize};
use tautspan_core::units::{Dimension, format_number, unit_of};

/// Significant digits shown in tables and labels.
pub const DIGITS: usize = 4;

/// Below this, in the unit shown, a value is roundoff of a zero and shown as 0
/// (the solver's balance is 1e-9 of the load; nothing the tool prints is
/// meaningful below a billionth of its unit).
const ROUNDOFF: f64 = 1e-9;

/// The international foot and inch, m (exact, 1959 agreement).
const FOOT_M: f64 = 0.3048;
const INCH_M: f64 = 0.0254;

/// The short ton, kg: 2000 × 0.45359237 (exact).
const SHORT_TON_KG: f64 = 907.184_74;

/// Which system the displayed numbers are in.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default, Serialize, Deserialize)]
pub enum UnitSystem {
    /// Metres, kilonewtons, kilograms.
    #[default]
    Si,
    /// Feet and inches, pounds-force, pounds.
    UsCustomary,
}

/// What a displayed number measures; picks the unit in each system.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Shown {
    /// Positions, spans, lengths of members (m / ft).
    Length,
    /// Stretch, deflection, diameters (mm / in).
    SmallLength,
    /// Forces (kN / lbf).
    Force,
    /// Masses (kg / lb).
    Mass,
    /// Stresses, moduli (MPa / psi).
    Stress,
    /// Cross-section areas (mm² / in²).
    Area,
    /// Angles (deg in both).
    Angle,
}

impl Shown {
    /// The core's dimension of this quantity.
    pub fn dimension(self) -> Dimension {
        match self {
            Shown::Length | Shown::SmallLength => Dimension::Length,
            Shown::Force => Dimension::Force,
            Shown::Mass => Dimension::Mass,
            Shown::Stress => Dimension::Pressure,
            Shown::Area => Dimension::Area,
            Shown::Angle => Dimension::Angle,
        }
    }
}

impl UnitSystem {
    /// The label on the switch.
    pub fn label(self) -> &'static str {
        match self {
            UnitSystem::Si => "SI",
            UnitSystem::UsCustomary => "US customary",
        }
    }

    /// The unit symbol used for a quantity.
    pub fn unit(self, shown: Shown) -> &'static str {
        match (self, shown) {
            (UnitSystem::Si, Shown::Length) => "m",
            (UnitSystem::Si, Shown::SmallLength) => "mm",
            (UnitSystem::Si, Shown::Force) => "kN",
            (UnitSystem::Si, Shown::Mass) => "kg",
            (UnitSystem::Si, Shown::Stress) => "MPa",
            (UnitSystem::Si, Shown::Area) => "mm^2",
            (UnitSystem::UsCustomary, Shown::Length) => "ft",
            (UnitSystem::UsCustomary, Shown::SmallLength) => "in",
            (UnitSystem::UsCustomary, Shown::Force) => "lbf",
            (UnitSystem::UsCustomary, Shown::Mass) => "lb",
            (UnitSystem::UsCustomary, Shown::Stress) => "psi",
            (UnitSystem::UsCustomary, Shown::Area) => "in^2",
            (_, Shown::Angle) => "deg",
        }
    }

    /// Factor from the display unit to SI base.
    pub fn to_si(self, shown: Shown) -> f64 {
        unit_of(shown.dimension(), self.unit(shown)).map_or(1.0, |u| u.to_si)
    }

    /// An SI value written in this system for people, e.g. `"3.599 kN"`:
    /// a length under a metre (a foot) in mm (in), a mass from a tonne (a
    /// short ton) up in t (sh tn), and a value below roundoff as 0 rather
    /// than `9.2e-20 kN`.
    pub fn fmt(self, si_value: f64, shown: Shown) -> String {
        if !si_value.is_finite() {
            return "–".to_string();
        }
        let (symbol, to_si) = self.unit_for(si_value, shown);
        let v = si_value / to_si;
        let v = if v.abs() < ROUNDOFF { 0.0 } else { v };
        format!("{} {symbol}", format_number(v, DIGITS))
    }

    /// The unit a value is written in, with its factor to SI.
    fn unit_for(self, si_value: f64, shown: Shown) -> (&'static str, f64) {
        // below roundoff a value is 0, written in the base unit ("0 m", not "0 mm")
        let a = if si_value.abs() < ROUNDOFF * self.to_si(shown) { 1.0 } else { si_value.abs() };
        let (symbol, to_si) = match (self, shown) {
            (UnitSystem::Si, Shown::Length) if a < 1.0 => ("mm", 1e-3),
            (UnitSystem::Si, Shown::Mass) if a >= 1000.0 => ("t", 1000.0),
            (UnitSystem::UsCustomary, Shown::Length) if a < FOOT_M => ("in", INCH_M),
            // the short ton: 2000 lb (NIST HB 44 appendix C; lb = 0.45359237 kg exactly)
            (UnitSystem::UsCustomary, Shown::Mass) if a >= SHORT_TON_KG => return ("sh tn", SHORT_TON_KG),
            _ => (self.unit(shown), 0.0),
        };
        if to_si > 0.0 { (symbol, to_si) } else { (symbol, self.to_si(shown)) }
    }

    /// An SI value in this system's unit as a bare number (for plots).
    pub fn value(self, si_value: f64, shown: Shown) -> f64 {
        si_value / self.to_si(shown)
    }
}

/// A utilisation as a percentage, e.g. `"19.8 %"`.
pub fn fmt_utilisation(u: f64) -> String {
    if u.is_finite() { format!("{:.1} %", u * 100.0) } else { "–".to_string() }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn forces_switch_units() {
        // 4448.2216 N = 1000 lbf (lbf = 0.45359237 kg × 9.80665 m/s², exact).
        assert_eq!(UnitSystem::Si.fmt(4448.2216, Shown::Force), "4.448 kN");
        assert_eq!(UnitSystem::UsCustomary.fmt(4448.2216, Shown::Force), "1000 lbf");
    }

    #[test]
    fn numbers_are_written_for_people() {
        let si = UnitSystem::Si;
        let us = UnitSystem::UsCustomary;
        // (value in SI, shown, expected) — conversions exact by definition
        let cases: [(f64, Shown, &str); 10] = [
            (9.2e-20, Shown::Force, "0 kN"),
            (-3e-15, Shown::Length, "0 m"),
            (0.35, Shown::Length, "350 mm"),
            (2.5, Shown::Length, "2.5 m"),
            (400.0, Shown::Mass, "400 kg"),
            (2500.0, Shown::Mass, "2.5 t"),
            (0.1524, Shown::Length, "6 in"),
            (1814.36948, Shown::Mass, "2 sh tn"),
            (453.59237, Shown::Mass, "1000 lb"),
            (4448.2216, Shown::Force, "4.448 kN"),
        ];
        for (v, shown, want) in cases {
            let sys = if want.ends_with(" in") || want.ends_with(" lb") || want.ends_with(" sh tn") { us } else { si };
            assert_eq!(sys.fmt(v, shown), want, "{v} {shown:?}");
        }
    }

    #[test]
    fn lengths_switch_units() {
        assert_eq!(UnitSystem::UsCustomary.fmt(0.3048, Shown::Length), "1 ft");
        assert_eq!(UnitSystem::Si.fmt(0.0254, Shown::SmallLength), "25.4 mm");
    }
}
