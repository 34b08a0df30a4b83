//! Eye bolts loaded at an angle to their axis: the fraction of the
//! vertical (in-line) working load limit that remains, as a table with its
//! source, read by one small function.
//!
//! The angle is the one between the bolt's axis and the line of pull (0° =
//! in line with the shank). The table is the one manufacturers publish for
//! shoulder eye bolts under ASME B30.26 practice: 0–5° 100 %, 15° 80 %,
//! 30° 65 %, 45° 30 %, 90° 25 % (confirmed against a published
//! manufacturer's angular-loading table; ASME B30.26 itself from memory).
//! Between two rows the table gives no value, so the row at the next larger
//! angle applies (a step down, never an interpolation upward): at 20° the
//! 30° row's 65 % applies. Plain (shoulderless) eye bolts are for in-line
//! loading only (ASME B30.26; DIN 580 permits no transverse load on them).

/// One row: up to this angle from the axis, this fraction of the WLL.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct EyeBoltRow {
    /// Largest angle between axis and pull for this row, degrees.
    pub up_to_deg: f64,
    /// Fraction of the in-line working load limit.
    pub fraction: f64,
}

/// Where the shoulder eye bolt table comes from.
pub const EYE_BOLT_SOURCE: &str = "shoulder eye bolt angular loading, ASME B30.26 practice as published by manufacturers: 0-5 deg 100 %, 15 deg 80 %, 30 deg 65 %, 45 deg 30 %, 90 deg 25 %; between rows the next larger angle's value";

/// Shoulder eye bolts: fraction of the in-line WLL by angle from the axis.
pub const SHOULDER_EYE_BOLT: &[EyeBoltRow] = &[
    EyeBoltRow { up_to_deg: 5.0, fraction: 1.0 },
    EyeBoltRow { up_to_deg: 15.0, fraction: 0.80 },
    EyeBoltRow { up_to_deg: 30.0, fraction: 0.65 },
    EyeBoltRow { up_to_deg: 45.0, fraction: 0.30 },
    EyeBoltRow { up_to_deg: 90.0, fraction: 0.25 },
];

/// Plain eye bolts: in line only (the first row's 5° is taken as "in line",
/// the tolerance the shoulder table gives for full rating).
pub const PLAIN_EYE_BOLT: &[EyeBoltRow] = &[EyeBoltRow { up_to_deg: 5.0, fraction: 1.0 }];

/// Fraction of the in-line WLL at `angle_deg` from the axis (0–90), or
/// `None` where the table has no row: the bolt is not rated at that angle.
pub fn eye_bolt_fraction(table: &[EyeBoltRow], angle_deg: f64) -> Option<f64> {
    // a hair of rounding at a row's edge belongs to that row
    table.iter().find(|r| angle_deg <= r.up_to_deg + 1e-9).map(|r| r.fraction)
}

#[cfg(test)]
mod tests {
    use super::*;

    // Published shoulder eye bolt table (manufacturer's angular loading,
    // ASME B30.26 practice): exact table values, tolerance 1e-12.
    #[test]
    fn shoulder_rows_and_steps() {
        for (deg, want) in [
            (0.0, Some(1.0)),
            (5.0, Some(1.0)),
            (10.0, Some(0.80)),
            (15.0, Some(0.80)),
            (20.0, Some(0.65)),
            (30.0, Some(0.65)),
            (45.0, Some(0.30)),
            (60.0, Some(0.25)),
            (90.0, Some(0.25)),
        ] {
            let got = eye_bolt_fraction(SHOULDER_EYE_BOLT, deg);
            match (got, want) {
                (Some(g), Some(w)) => assert!((g - w).abs() < 1e-12, "{deg} deg: {g}"),
                _ => assert_eq!(got, want, "{deg} deg"),
            }
        }
    }

    // ASME B30.26: plain eye bolts in line only.
    #[test]
    fn plain_is_in_line_only() {
        assert_eq!(eye_bolt_fraction(PLAIN_EYE_BOLT, 3.0), Some(1.0));
        assert_eq!(eye_bolt_fraction(PLAIN_EYE_BOLT, 10.0), None);
    }
}
