//! The utilisation shading in the report's SVG: the one colour ramp of
//! `crate::colour_ramp`, written as `#rrggbb` and as gradient stops.

pub use crate::colour_ramp::RAMP_MAX;
use crate::colour_ramp::rgb;

/// The ramp's colour for a utilisation, as `#rrggbb`. Negative or NaN
/// values take the first colour.
pub fn colour(utilisation: f64) -> String {
    let [r, g, b] = rgb(utilisation);
    format!("#{r:02x}{g:02x}{b:02x}")
}

/// The ramp's stops as SVG gradient `<stop>` elements across `0..=RAMP_MAX`.
pub fn gradient_stops() -> String {
    (0..=13)
        .map(|i| {
            let u = f64::from(i) * RAMP_MAX / 13.0;
            format!("<stop offset=\"{:.4}\" stop-color=\"{}\"/>", u / RAMP_MAX, colour(u))
        })
        .collect()
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn ends_and_out_of_range() {
        assert_eq!(colour(0.0), "#dde9ef");
        assert_eq!(colour(1.0), "#b03a2e");
        assert_eq!(colour(5.0), "#4a0d1c");
        assert_eq!(colour(f64::NAN), "#dde9ef");
    }
}
