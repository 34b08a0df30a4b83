//! Helpers on quantity strings as the user wrote them: keep the unit a
//! field was written in when the app rewrites its number (a node dragged on
//! the canvas keeps "ft" if it was in feet).

use crate::fields::units_display::{Shown, UnitSystem};
use tautspan_core::file::Qty;
use tautspan_core::units::{Dimension, format_number, unit_of};

/// The unit part of a quantity string (`"0.75 in"` → `"in"`), if the
/// string has one the core knows for `dimension`.
pub fn unit_part(text: &str, dimension: Dimension) -> Option<&'static str> {
    let t = text.trim();
    let start = t.find(|c: char| !(c.is_ascii_digit() || matches!(c, '.' | '+' | '-' | 'e' | 'E' | ' ')))?;
    // an exponent's 'e' followed by letters is part of the unit, not the number
    let unit = t[start..].trim();
    unit_of(dimension, unit).map(|u| u.symbol)
}

/// A quantity of `si_value` written in the unit of `old` when it has one,
/// else in the display unit of `shown`.
pub fn requantify(old: Option<&Qty>, si_value: f64, shown: Shown, units: UnitSystem) -> Qty {
    let dimension = shown.dimension();
    let symbol = old.and_then(|q| unit_part(&q.0, dimension)).unwrap_or_else(|| units.unit(shown));
    let factor = unit_of(dimension, symbol).map_or(1.0, |u| u.to_si);
    Qty(format!("{} {}", format_number(si_value / factor, 6), symbol))
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn keeps_the_unit_written() {
        let old = Qty::from("3 ft");
        let q = requantify(Some(&old), 1.2192, Shown::Length, UnitSystem::Si);
        assert_eq!(q.0, "4 ft");
    }

    #[test]
    fn falls_back_to_display_unit() {
        let q = requantify(None, 2.5, Shown::Length, UnitSystem::Si);
        assert_eq!(q.0, "2.5 m");
    }

    #[test]
    fn finds_units() {
        assert_eq!(unit_part("0.75 in", Dimension::Length), Some("in"));
        assert_eq!(unit_part("12mm", Dimension::Length), Some("mm"));
        assert_eq!(unit_part("12 kg", Dimension::Length), None);
    }
}
