//! Display units: the SI / US customary switch and the formatting of every
//! number the app shows. Values arrive from the core in SI base units; this
//! file only chooses a unit and a number of digits (it converts, it does not
//! compute anything of its own).

use serde::{Deserialize, Serialize};
use tautspan_core::units::{Dimension, format_quantity, unit_of};

/// Significant digits shown in tables and labels.
pub const DIGITS: usize = 4;

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

    /// An SI value written in this system, e.g. `"3.599 kN"`.
    pub fn fmt(self, si_value: f64, shown: Shown) -> String {
        if !si_value.is_finite() {
            return "–".to_string();
        }
        format_quantity(si_value, shown.dimension(), self.unit(shown), DIGITS)
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
    fn lengths_switch_units() {
        assert_eq!(UnitSystem::UsCustomary.fmt(0.3048, Shown::Length), "1 ft");
        assert_eq!(UnitSystem::Si.fmt(0.0254, Shown::SmallLength), "25.4 mm");
    }
}
