//! A scale bar for the drawing: a round length (1, 2 or 5 × 10ⁿ in the
//! report's length unit) about a sixth of the drawing wide, in alternating
//! black and white halves.

use super::unit_system::UnitSystem;
use crate::units::format_number;

/// The round length, in display units, nearest below `target`.
pub fn round_length(target: f64) -> f64 {
    if !(target.is_finite() && target > 0.0) {
        return 1.0;
    }
    let decade = 10f64.powf(target.log10().floor());
    [5.0, 2.0, 1.0].into_iter().map(|k| k * decade).find(|&l| l <= target).unwrap_or(decade)
}

/// The scale bar with its left end at `at` (drawing units), for a drawing of
/// `scale` drawing units per metre.
pub fn scale_bar(at: [f64; 2], scale: f64, units: UnitSystem) -> String {
    let (symbol, unit_m) = units.length_unit();
    let length = round_length(DRAWING_SHARE / (scale * unit_m));
    let w = length * unit_m * scale;
    let (x, y) = (at[0], at[1]);
    format!(
        "<g class=\"scale-bar\">\
         <rect x=\"{x:.2}\" y=\"{:.2}\" width=\"{:.2}\" height=\"6\" fill=\"#1b1f24\"/>\
         <rect x=\"{:.2}\" y=\"{:.2}\" width=\"{:.2}\" height=\"6\" fill=\"#fff\" stroke=\"#1b1f24\"/>\
         <rect x=\"{x:.2}\" y=\"{:.2}\" width=\"{w:.2}\" height=\"6\" fill=\"none\" stroke=\"#1b1f24\"/>\
         <text x=\"{x:.2}\" y=\"{:.2}\" class=\"lbl\">0</text>\
         <text x=\"{:.2}\" y=\"{:.2}\" class=\"lbl\" text-anchor=\"end\">{} {symbol}</text></g>",
        y - 3.0,
        w / 2.0,
        x + w / 2.0,
        y - 3.0,
        w / 2.0,
        y - 3.0,
        y - 8.0,
        x + w,
        y - 8.0,
        format_number(length, 3)
    )
}

/// How wide the bar aims to be, drawing units.
const DRAWING_SHARE: f64 = 130.0;

#[cfg(test)]
mod tests {
    use super::round_length;

    #[test]
    fn picks_round_lengths() {
        for (target, want) in [(1.3, 1.0), (2.7, 2.0), (7.0, 5.0), (0.34, 0.2), (12.0, 10.0)] {
            assert!((round_length(target) - want).abs() < 1e-12, "{target}");
        }
    }
}
