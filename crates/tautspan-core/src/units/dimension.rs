//! The physical dimensions a scenario file can carry, and the units each
//! accepts. Every quantity in a file is written as a number and a unit
//! (`"12 mm"`, `"2.4 kPa"`); the unit fixes the dimension, and the field the
//! quantity stands in says which dimension it must have.

use std::fmt;

/// A physical dimension of a quantity in a scenario file.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
pub enum Dimension {
    /// Length (m).
    Length,
    /// Area (m²).
    Area,
    /// Mass (kg).
    Mass,
    /// Force (N).
    Force,
    /// Pressure, stress or modulus (Pa).
    Pressure,
    /// Plane angle (rad).
    Angle,
    /// Acceleration (m/s²).
    Acceleration,
    /// Time (s).
    Time,
    /// Mass per length (kg/m), for a member's own weight.
    LinearDensity,
}

/// One accepted unit: its spelling, its dimension and its factor to SI base.
#[derive(Debug, Clone, Copy)]
pub struct UnitDef {
    /// How the unit is written in a file.
    pub symbol: &'static str,
    /// What it measures.
    pub dimension: Dimension,
    /// Multiply a value in this unit by this factor to get SI base units.
    pub to_si: f64,
}

// Exact conversion factors: inch 0.0254 m and pound 0.45359237 kg are exact by
// the 1959 international yard and pound agreement; standard gravity
// 9.80665 m/s² (CGPM 1901) defines lbf and kgf-based tonne-force.
const INCH_M: f64 = 0.0254;
const FOOT_M: f64 = 0.3048;
const POUND_KG: f64 = 0.453_592_37;
const STANDARD_GRAVITY: f64 = 9.806_65;
const LBF_N: f64 = POUND_KG * STANDARD_GRAVITY;

/// Every unit the files accept, SI and US customary.
pub const UNITS: &[UnitDef] = &[
    // lengths
    UnitDef { symbol: "m", dimension: Dimension::Length, to_si: 1.0 },
    UnitDef { symbol: "cm", dimension: Dimension::Length, to_si: 0.01 },
    UnitDef { symbol: "mm", dimension: Dimension::Length, to_si: 0.001 },
    UnitDef { symbol: "km", dimension: Dimension::Length, to_si: 1000.0 },
    UnitDef { symbol: "in", dimension: Dimension::Length, to_si: INCH_M },
    UnitDef { symbol: "ft", dimension: Dimension::Length, to_si: FOOT_M },
    // areas
    UnitDef { symbol: "m^2", dimension: Dimension::Area, to_si: 1.0 },
    UnitDef { symbol: "cm^2", dimension: Dimension::Area, to_si: 1e-4 },
    UnitDef { symbol: "mm^2", dimension: Dimension::Area, to_si: 1e-6 },
    UnitDef { symbol: "in^2", dimension: Dimension::Area, to_si: INCH_M * INCH_M },
    UnitDef { symbol: "ft^2", dimension: Dimension::Area, to_si: FOOT_M * FOOT_M },
    // masses
    UnitDef { symbol: "kg", dimension: Dimension::Mass, to_si: 1.0 },
    UnitDef { symbol: "g", dimension: Dimension::Mass, to_si: 0.001 },
    UnitDef { symbol: "t", dimension: Dimension::Mass, to_si: 1000.0 },
    UnitDef { symbol: "lb", dimension: Dimension::Mass, to_si: POUND_KG },
    // forces
    UnitDef { symbol: "N", dimension: Dimension::Force, to_si: 1.0 },
    UnitDef { symbol: "kN", dimension: Dimension::Force, to_si: 1e3 },
    UnitDef { symbol: "MN", dimension: Dimension::Force, to_si: 1e6 },
    UnitDef { symbol: "lbf", dimension: Dimension::Force, to_si: LBF_N },
    UnitDef { symbol: "kip", dimension: Dimension::Force, to_si: 1000.0 * LBF_N },
    // metric tonne-force (1000 kgf), as on lifting-equipment rating plates
    UnitDef { symbol: "tf", dimension: Dimension::Force, to_si: 1000.0 * STANDARD_GRAVITY },
    // pressures, stresses, moduli
    UnitDef { symbol: "Pa", dimension: Dimension::Pressure, to_si: 1.0 },
    UnitDef { symbol: "kPa", dimension: Dimension::Pressure, to_si: 1e3 },
    UnitDef { symbol: "MPa", dimension: Dimension::Pressure, to_si: 1e6 },
    UnitDef { symbol: "GPa", dimension: Dimension::Pressure, to_si: 1e9 },
    UnitDef { symbol: "N/mm^2", dimension: Dimension::Pressure, to_si: 1e6 },
    UnitDef { symbol: "psi", dimension: Dimension::Pressure, to_si: LBF_N / (INCH_M * INCH_M) },
    UnitDef { symbol: "ksi", dimension: Dimension::Pressure, to_si: 1000.0 * LBF_N / (INCH_M * INCH_M) },
    UnitDef { symbol: "psf", dimension: Dimension::Pressure, to_si: LBF_N / (FOOT_M * FOOT_M) },
    // angles
    UnitDef { symbol: "deg", dimension: Dimension::Angle, to_si: std::f64::consts::PI / 180.0 },
    UnitDef { symbol: "rad", dimension: Dimension::Angle, to_si: 1.0 },
    // accelerations
    UnitDef { symbol: "m/s^2", dimension: Dimension::Acceleration, to_si: 1.0 },
    UnitDef { symbol: "ft/s^2", dimension: Dimension::Acceleration, to_si: FOOT_M },
    // times
    UnitDef { symbol: "s", dimension: Dimension::Time, to_si: 1.0 },
    UnitDef { symbol: "ms", dimension: Dimension::Time, to_si: 1e-3 },
    // mass per length
    UnitDef { symbol: "kg/m", dimension: Dimension::LinearDensity, to_si: 1.0 },
    UnitDef { symbol: "lb/ft", dimension: Dimension::LinearDensity, to_si: POUND_KG / FOOT_M },
];

impl Dimension {
    /// The word used in messages ("a length").
    pub fn noun(self) -> &'static str {
        match self {
            Dimension::Length => "a length",
            Dimension::Area => "an area",
            Dimension::Mass => "a mass",
            Dimension::Force => "a force",
            Dimension::Pressure => "a pressure or modulus",
            Dimension::Angle => "an angle",
            Dimension::Acceleration => "an acceleration",
            Dimension::Time => "a time",
            Dimension::LinearDensity => "a mass per length",
        }
    }

    /// The units accepted for this dimension, comma separated, for messages.
    pub fn accepted(self) -> String {
        UNITS.iter().filter(|u| u.dimension == self).map(|u| u.symbol).collect::<Vec<_>>().join(", ")
    }

    /// The SI base unit symbol.
    pub fn si_symbol(self) -> &'static str {
        match self {
            Dimension::Length => "m",
            Dimension::Area => "m^2",
            Dimension::Mass => "kg",
            Dimension::Force => "N",
            Dimension::Pressure => "Pa",
            Dimension::Angle => "rad",
            Dimension::Acceleration => "m/s^2",
            Dimension::Time => "s",
            Dimension::LinearDensity => "kg/m",
        }
    }
}

impl fmt::Display for Dimension {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str(self.noun())
    }
}

/// Look a unit up by its exact spelling.
pub fn unit(symbol: &str) -> Option<&'static UnitDef> {
    UNITS.iter().find(|u| u.symbol == symbol)
}

/// Look up a unit of the given dimension.
pub fn unit_of(dimension: Dimension, symbol: &str) -> Option<&'static UnitDef> {
    unit(symbol).filter(|u| u.dimension == dimension)
}
