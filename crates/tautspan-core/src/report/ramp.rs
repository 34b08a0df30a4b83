//! The utilisation shading: a continuous ramp from a pale blue-grey at zero,
//! through sea green and ochre, to brick at the allowable and a deep maroon
//! beyond it. Its lightness falls steadily along the ramp, so a report
//! printed in grey still reads darker for harder-worked members.

/// Ramp stops: utilisation and sRGB colour. Relative luminance falls at every
/// step (about 0.85, 0.55, 0.33, 0.12, 0.02), which is what keeps the ramp
/// readable in grey.
const STOPS: [(f64, [u8; 3]); 5] = [
    (0.0, [0xdd, 0xe9, 0xef]),
    (0.4, [0x8c, 0xc4, 0xb8]),
    (0.8, [0xd1, 0x93, 0x2a]),
    (1.0, [0xb0, 0x3a, 0x2e]),
    (1.3, [0x4a, 0x0d, 0x1c]),
];

/// Where the ramp ends: utilisations above this take the last colour.
pub const RAMP_MAX: f64 = 1.3;

/// The ramp's colour for a utilisation, as `#rrggbb`. Negative or NaN
/// values take the first colour.
pub fn colour(utilisation: f64) -> String {
    let u = if utilisation.is_finite() { utilisation.clamp(0.0, RAMP_MAX) } else { 0.0 };
    let mut rgb = STOPS[0].1;
    for pair in STOPS.windows(2) {
        let ((u0, c0), (u1, c1)) = (pair[0], pair[1]);
        if u >= u0 && u <= u1 {
            let t = (u - u0) / (u1 - u0);
            rgb = [lerp(c0[0], c1[0], t), lerp(c0[1], c1[1], t), lerp(c0[2], c1[2], t)];
            break;
        }
    }
    format!("#{:02x}{:02x}{:02x}", rgb[0], rgb[1], rgb[2])
}

fn lerp(a: u8, b: u8, t: f64) -> u8 {
    (f64::from(a) + (f64::from(b) - f64::from(a)) * t).round().clamp(0.0, 255.0) as u8
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

    fn luminance(hex: &str) -> f64 {
        let c = |i: usize| -> f64 {
            let v = f64::from(u8::from_str_radix(&hex[i..i + 2], 16).unwrap()) / 255.0;
            if v <= 0.04045 { v / 12.92 } else { ((v + 0.055) / 1.055).powf(2.4) }
        };
        0.2126 * c(1) + 0.7152 * c(3) + 0.0722 * c(5)
    }

    // WCAG 2.x relative luminance; the ramp must darken monotonically so
    // that a grey print keeps the order.
    #[test]
    fn darkens_monotonically() {
        let mut last = f64::INFINITY;
        for i in 0..=130 {
            let l = luminance(&colour(f64::from(i) / 100.0));
            assert!(l <= last + 1e-9, "luminance rises at u = {}", f64::from(i) / 100.0);
            last = l;
        }
    }

    #[test]
    fn ends_and_out_of_range() {
        assert_eq!(colour(0.0), "#dde9ef");
        assert_eq!(colour(5.0), "#4a0d1c");
        assert_eq!(colour(f64::NAN), "#dde9ef");
    }
}
