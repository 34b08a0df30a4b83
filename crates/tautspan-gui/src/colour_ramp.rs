//! The utilisation colour ramp, the same stops as the report's drawing so a
//! screen and a printed page read alike: pale blue-grey at zero, sea green,
//! ochre at the near limit, brick at the allowable, deep maroon beyond.
//! Lightness falls along the ramp, so it still reads in grey; the line style
//! (dashed slack, heavy and hatched over) carries the state without colour.

use egui::Color32;

const STOPS: [(f64, [u8; 3]); 5] = [
    (0.0, [0xdd, 0xe9, 0xef]),
    (0.4, [0x8c, 0xc4, 0xb8]),
    (0.8, [0xd1, 0x93, 0x2a]),
    (1.0, [0xb0, 0x3a, 0x2e]),
    (1.3, [0x4a, 0x0d, 0x1c]),
];

/// Where the ramp ends; higher utilisations take the last colour.
pub const RAMP_MAX: f64 = 1.3;

/// The colour of a utilisation.
pub fn colour(utilisation: f64) -> Color32 {
    let u = if utilisation.is_finite() { utilisation.clamp(0.0, RAMP_MAX) } else { 0.0 };
    for pair in STOPS.windows(2) {
        let ((u0, c0), (u1, c1)) = (pair[0], pair[1]);
        if u <= u1 {
            let t = ((u - u0) / (u1 - u0)).clamp(0.0, 1.0);
            let l = |a: u8, b: u8| (f64::from(a) + (f64::from(b) - f64::from(a)) * t).round() as u8;
            return Color32::from_rgb(l(c0[0], c1[0]), l(c0[1], c1[1]), l(c0[2], c1[2]));
        }
    }
    let [r, g, b] = STOPS[STOPS.len() - 1].1;
    Color32::from_rgb(r, g, b)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn ends_and_middle() {
        assert_eq!(colour(0.0), Color32::from_rgb(0xdd, 0xe9, 0xef));
        assert_eq!(colour(1.0), Color32::from_rgb(0xb0, 0x3a, 0x2e));
        assert_eq!(colour(9.0), Color32::from_rgb(0x4a, 0x0d, 0x1c));
        assert_eq!(colour(f64::NAN), colour(0.0));
    }
}
