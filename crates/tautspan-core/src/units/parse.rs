//! Parsing a quantity string such as `"12 mm"`, `"0.375 in"` or `"50 psf"`
//! into an SI value of a required dimension, with a message that says what
//! is wrong and what would be right.

use super::dimension::{Dimension, unit};
use thiserror::Error;

/// Why a quantity string was refused.
#[derive(Debug, Clone, PartialEq, Error)]
pub enum QuantityError {
    /// The text was empty. Remedy: write a number and a unit.
    #[error("empty; expected {dimension} such as \"{example}\"")]
    Empty {
        /// The dimension that was expected.
        dimension: Dimension,
        /// An example of a valid value.
        example: &'static str,
    },
    /// A number without a unit. Remedy: add the unit.
    #[error(
        "\"{text}\" has no unit; write {dimension} with its unit, e.g. \"{text} {example_unit}\" (accepted: {accepted})"
    )]
    NoUnit {
        /// The text given.
        text: String,
        /// The dimension that was expected.
        dimension: Dimension,
        /// A unit of that dimension.
        example_unit: &'static str,
        /// All units of that dimension.
        accepted: String,
    },
    /// The number part could not be read. Remedy: write a decimal number.
    #[error("\"{text}\" does not start with a number; expected {dimension} such as \"{example}\"")]
    BadNumber {
        /// The text given.
        text: String,
        /// The dimension that was expected.
        dimension: Dimension,
        /// An example.
        example: &'static str,
    },
    /// A fraction such as "3/4". Remedy: a decimal number and a unit.
    #[error("\"{text}\" is a fraction; write {dimension} as a decimal with its unit, e.g. \"{example}\"")]
    Fraction {
        /// The text given.
        text: String,
        /// The dimension that was expected.
        dimension: Dimension,
        /// An example.
        example: &'static str,
    },
    /// NaN or infinite. Remedy: a finite number.
    #[error("\"{text}\" is not a finite number")]
    NotFinite {
        /// The text given.
        text: String,
    },
    /// The unit is not known at all.
    #[error("unknown unit \"{unit}\" in \"{text}\"; {dimension} takes {accepted}")]
    UnknownUnit {
        /// The unit as written.
        unit: String,
        /// The whole text.
        text: String,
        /// The dimension that was expected.
        dimension: Dimension,
        /// All units of that dimension.
        accepted: String,
    },
    /// A known unit of the wrong dimension ("12 kg" for a length).
    #[error("\"{text}\" is {found}, but {expected} belongs here ({accepted})")]
    WrongDimension {
        /// The whole text.
        text: String,
        /// What the unit measures.
        found: Dimension,
        /// What was expected.
        expected: Dimension,
        /// All units of the expected dimension.
        accepted: String,
    },
    /// Negative or zero where the field must be positive.
    #[error("\"{text}\" must be greater than zero")]
    NotPositive {
        /// The whole text.
        text: String,
    },
    /// Negative where the field must not be.
    #[error("\"{text}\" must not be negative")]
    Negative {
        /// The whole text.
        text: String,
    },
}

/// What sign a quantity may have.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Sign {
    /// Any finite value (coordinates, slack).
    Any,
    /// Zero or more (heights, angles).
    NonNegative,
    /// Strictly more than zero (areas, masses, moduli).
    Positive,
}

fn example(dimension: Dimension) -> &'static str {
    match dimension {
        Dimension::Length => "12 mm",
        Dimension::Area => "64.7 mm^2",
        Dimension::Mass => "250 kg",
        Dimension::Force => "18 kN",
        Dimension::Pressure => "200 GPa",
        Dimension::Angle => "40 deg",
        Dimension::Acceleration => "9.80665 m/s^2",
        Dimension::Time => "10 s",
        Dimension::LinearDensity => "0.4 kg/m",
    }
}

fn example_unit(dimension: Dimension) -> &'static str {
    match dimension {
        Dimension::Length => "mm",
        Dimension::Area => "mm^2",
        Dimension::Mass => "kg",
        Dimension::Force => "kN",
        Dimension::Pressure => "MPa",
        Dimension::Angle => "deg",
        Dimension::Acceleration => "m/s^2",
        Dimension::Time => "s",
        Dimension::LinearDensity => "kg/m",
    }
}

/// Split `text` into its leading number and the rest.
fn split_number(text: &str) -> (&str, &str) {
    let bytes = text.as_bytes();
    let mut end = 0;
    let mut seen_digit = false;
    let mut seen_e = false;
    while end < bytes.len() {
        let c = bytes[end];
        let ok = match c {
            b'0'..=b'9' => {
                seen_digit = true;
                true
            }
            b'+' | b'-' => end == 0 || matches!(bytes[end - 1], b'e' | b'E'),
            b'.' => !seen_e,
            b'e' | b'E' if seen_digit && !seen_e => {
                // only an exponent if a digit (or sign and digit) follows
                let next = bytes.get(end + 1).copied();
                let next2 = bytes.get(end + 2).copied();
                let digit_follows = matches!(next, Some(b'0'..=b'9'))
                    || (matches!(next, Some(b'+' | b'-')) && matches!(next2, Some(b'0'..=b'9')));
                if digit_follows {
                    seen_e = true;
                }
                digit_follows
            }
            _ => false,
        };
        if !ok {
            break;
        }
        end += 1;
    }
    (&text[..end], text[end..].trim())
}

/// Parse `text` as a quantity of `dimension`, returning its SI value.
///
/// The number may carry a sign, decimals and an exponent (`"2.1e11 Pa"`);
/// a space between number and unit is optional. Units are case sensitive
/// (`"mm"` is a millimetre, `"Mm"` is refused), as on a drawing.
pub fn parse_quantity(text: &str, dimension: Dimension, sign: Sign) -> Result<f64, QuantityError> {
    let trimmed = text.trim();
    if trimmed.is_empty() {
        return Err(QuantityError::Empty { dimension, example: example(dimension) });
    }
    let lower = trimmed.to_ascii_lowercase();
    if lower.contains("nan") || lower.contains("inf") {
        return Err(QuantityError::NotFinite { text: trimmed.to_string() });
    }
    let (number, unit_text) = split_number(trimmed);
    let value: f64 = match number.parse() {
        Ok(v) => v,
        Err(_) => {
            return Err(QuantityError::BadNumber { text: trimmed.to_string(), dimension, example: example(dimension) });
        }
    };
    if !value.is_finite() {
        return Err(QuantityError::NotFinite { text: trimmed.to_string() });
    }
    if unit_text.is_empty() {
        return Err(QuantityError::NoUnit {
            text: trimmed.to_string(),
            dimension,
            example_unit: example_unit(dimension),
            accepted: dimension.accepted(),
        });
    }
    if unit_text.starts_with('/') {
        return Err(QuantityError::Fraction { text: trimmed.to_string(), dimension, example: example(dimension) });
    }
    // accept the common typographic spellings of squared units
    let normalised = unit_text.replace('²', "^2").replace("**2", "^2");
    let Some(def) = unit(&normalised) else {
        return Err(QuantityError::UnknownUnit {
            unit: unit_text.to_string(),
            text: trimmed.to_string(),
            dimension,
            accepted: dimension.accepted(),
        });
    };
    if def.dimension != dimension {
        return Err(QuantityError::WrongDimension {
            text: trimmed.to_string(),
            found: def.dimension,
            expected: dimension,
            accepted: dimension.accepted(),
        });
    }
    let si = value * def.to_si;
    if !si.is_finite() {
        return Err(QuantityError::NotFinite { text: trimmed.to_string() });
    }
    match sign {
        Sign::Positive if si <= 0.0 => Err(QuantityError::NotPositive { text: trimmed.to_string() }),
        Sign::NonNegative if si < 0.0 => Err(QuantityError::Negative { text: trimmed.to_string() }),
        _ => Ok(si),
    }
}

/// Parse a rated load written as a force (`"10 kN"`, `"2 tf"`) or as a
/// mass (`"1 t"`, `"500 kg"`, as on a lifting-gear tag). A mass is taken as
/// its weight at standard gravity, 9.80665 m/s² (CGPM 1901, ISO 80000-3),
/// whatever gravity the scenario uses: a working load limit marked in tonnes
/// means that weight. Returns the force in N and whether a mass was given.
pub fn parse_rated_load(text: &str, sign: Sign) -> Result<(f64, bool), QuantityError> {
    match parse_quantity(text, Dimension::Force, sign) {
        Ok(v) => Ok((v, false)),
        Err(QuantityError::WrongDimension { found: Dimension::Mass, .. }) => {
            parse_quantity(text, Dimension::Mass, sign).map(|kg| (kg * STANDARD_GRAVITY_M_S2, true))
        }
        Err(e) => Err(e),
    }
}

/// Standard gravity, m/s² (CGPM 1901; ISO 80000-3).
const STANDARD_GRAVITY_M_S2: f64 = 9.806_65;

/// Write an SI value in a chosen unit of its dimension, with up to
/// `significant` significant digits and no trailing zeros (`"12.5 mm"`).
pub fn format_quantity(si_value: f64, dimension: Dimension, unit_symbol: &str, significant: usize) -> String {
    let factor = super::dimension::unit_of(dimension, unit_symbol).map_or(1.0, |u| u.to_si);
    let symbol =
        if super::dimension::unit_of(dimension, unit_symbol).is_some() { unit_symbol } else { dimension.si_symbol() };
    format!("{} {}", format_number(si_value / factor, significant), symbol)
}

/// A number with up to `significant` significant digits, no exponent for
/// everyday magnitudes, trailing zeros removed.
pub fn format_number(value: f64, significant: usize) -> String {
    Sig(value, significant).to_string()
}

/// [`format_number`] as a `Display` value, to write a number straight into
/// a message without a string of its own.
#[derive(Debug, Clone, Copy)]
pub struct Sig(pub f64, pub usize);

/// A small stack buffer for one formatted number.
struct NumBuf {
    bytes: [u8; 64],
    len: usize,
}

impl std::fmt::Write for NumBuf {
    fn write_str(&mut self, s: &str) -> std::fmt::Result {
        let end = self.len + s.len();
        let slot = self.bytes.get_mut(self.len..end).ok_or(std::fmt::Error)?;
        slot.copy_from_slice(s.as_bytes());
        self.len = end;
        Ok(())
    }
}

impl std::fmt::Display for Sig {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        use std::fmt::Write as _;
        let Sig(value, significant) = *self;
        if value == 0.0 || !value.is_finite() {
            return if value.is_finite() { f.write_str("0") } else { write!(f, "{value}") };
        }
        let magnitude = value.abs().log10().floor() as i32;
        if !(-5..=12).contains(&magnitude) {
            return write!(f, "{:.*e}", significant.saturating_sub(1), value);
        }
        let decimals = (significant as i32 - 1 - magnitude).max(0) as usize;
        let mut buf = NumBuf { bytes: [0; 64], len: 0 };
        if write!(buf, "{value:.decimals$}").is_err() {
            // longer than the buffer (many significant digits asked for)
            let s = format!("{value:.decimals$}");
            let t = if s.contains('.') { s.trim_end_matches('0').trim_end_matches('.') } else { &s };
            return f.write_str(t);
        }
        let text = std::str::from_utf8(&buf.bytes[..buf.len]).map_err(|_| std::fmt::Error)?;
        let t = if text.contains('.') { text.trim_end_matches('0').trim_end_matches('.') } else { text };
        f.write_str(t)
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    // Conversion factors: inch and pound exact by the 1959 international
    // agreement; lbf = 0.45359237 kg × 9.80665 m/s² = 4.4482216152605 N
    // (NIST SP 811, Appendix B). Tolerance 1e-12 relative: exact definitions,
    // only floating-point rounding remains.
    #[test]
    fn parses_si_and_us_customary() {
        let table: &[(&str, Dimension, f64)] = &[
            ("12 mm", Dimension::Length, 0.012),
            ("0.375 in", Dimension::Length, 0.009_525),
            ("6ft", Dimension::Length, 1.8288),
            ("1.5 km", Dimension::Length, 1500.0),
            ("64.7 mm^2", Dimension::Area, 64.7e-6),
            ("1 in^2", Dimension::Area, 6.4516e-4),
            ("2 t", Dimension::Mass, 2000.0),
            ("100 lb", Dimension::Mass, 45.359_237),
            ("1 lbf", Dimension::Force, 4.448_221_615_260_5),
            ("2 kip", Dimension::Force, 8_896.443_230_521),
            ("1 tf", Dimension::Force, 9806.65),
            ("18 kN", Dimension::Force, 18_000.0),
            ("1770 N/mm^2", Dimension::Pressure, 1.77e9),
            ("50 psf", Dimension::Pressure, 2_394.011_7),
            ("1 psi", Dimension::Pressure, 6_894.757_293),
            ("29000 ksi", Dimension::Pressure, 1.999_479_615e11),
            ("2.1e11 Pa", Dimension::Pressure, 2.1e11),
            ("180 deg", Dimension::Angle, std::f64::consts::PI),
            ("32.174 ft/s^2", Dimension::Acceleration, 9.806_635),
            ("250 ms", Dimension::Time, 0.25),
            ("-3 m", Dimension::Length, -3.0),
        ];
        for (text, dim, expected) in table {
            let got = parse_quantity(text, *dim, Sign::Any).expect(text);
            let rel = ((got - expected) / expected).abs();
            assert!(rel < 1e-6, "{text}: got {got}, expected {expected}");
        }
    }

    #[test]
    fn refuses_with_reasons() {
        let cases: &[(&str, Dimension, Sign, &str)] = &[
            ("12", Dimension::Length, Sign::Any, "no unit"),
            ("12 kg", Dimension::Length, Sign::Any, "a mass"),
            ("12 furlong", Dimension::Length, Sign::Any, "unknown unit"),
            ("NaN m", Dimension::Length, Sign::Any, "not a finite"),
            ("inf m", Dimension::Length, Sign::Any, "not a finite"),
            ("1e400 m", Dimension::Length, Sign::Any, "not a finite"),
            ("-2 kg", Dimension::Mass, Sign::Positive, "greater than zero"),
            ("0 mm^2", Dimension::Area, Sign::Positive, "greater than zero"),
            ("-1 m", Dimension::Length, Sign::NonNegative, "not be negative"),
            ("3/4", Dimension::Length, Sign::Any, "is a fraction"),
            ("abc", Dimension::Length, Sign::Any, "does not start with a number"),
            ("", Dimension::Length, Sign::Any, "empty"),
        ];
        for (text, dim, sign, needle) in cases {
            let err = parse_quantity(text, *dim, *sign).expect_err(text).to_string();
            assert!(err.contains(needle), "{text}: {err}");
        }
    }

    #[test]
    fn rated_loads_as_force_or_mass() {
        // a mass is its weight at standard gravity 9.80665 m/s^2 (CGPM 1901,
        // ISO 80000-3): 1 t -> 9806.65 N, exact to rounding (1e-12 relative)
        for (text, n, was_mass) in [
            ("1 t", 9_806.65, true),
            ("3.25 t", 31_871.612_5, true),
            ("500 kg", 4_903.325, true),
            ("10 kN", 10_000.0, false),
            ("2 tf", 19_613.3, false),
        ] {
            let (v, m) = parse_rated_load(text, Sign::Positive).unwrap();
            assert!((v - n).abs() <= 1e-12 * n, "{text}: {v}");
            assert_eq!(m, was_mass, "{text}");
        }
        assert!(parse_rated_load("2 m", Sign::Positive).is_err());
        assert!(parse_rated_load("-1 t", Sign::Positive).is_err());
    }

    #[test]
    fn formats_round_trip() {
        let s = format_quantity(0.009_525, Dimension::Length, "in", 6);
        assert_eq!(s, "0.375 in");
        let back = parse_quantity(&s, Dimension::Length, Sign::Any).expect("parse");
        assert!((back - 0.009_525).abs() < 1e-15);
        assert_eq!(format_number(12_000.0, 4), "12000");
        assert_eq!(format_number(0.001_234_5, 3), "0.00123");
    }
}
