//! The utilisation colour ramp, one for every picture the tool makes (the
//! app's canvas and the report's drawing), so a screen and a printed page
//! read alike: pale blue-grey at zero, sea green, ochre at the near limit,
//! brick at the allowable, deep maroon beyond. Its lightness falls steadily
//! along the ramp, so a page printed in grey still reads darker for
//! harder-worked members; the line style carries the state without colour.

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

/// The ramp's sRGB colour for a utilisation. Negative or NaN values take the
/// first colour.
pub fn rgb(utilisation: f64) -> [u8; 3] {
    let u = if utilisation.is_finite() { utilisation.clamp(0.0, RAMP_MAX) } else { 0.0 };
    for pair in STOPS.windows(2) {
        let ((u0, c0), (u1, c1)) = (pair[0], pair[1]);
        if u >= u0 && u <= u1 {
            let t = (u - u0) / (u1 - u0);
            return [lerp(c0[0], c1[0], t), lerp(c0[1], c1[1], t), lerp(c0[2], c1[2], t)];
        }
    }
    STOPS[0].1
}

fn lerp(a: u8, b: u8, t: f64) -> u8 {
    (f64::from(a) + (f64::from(b) - f64::from(a)) * t).round().clamp(0.0, 255.0) as u8
}

#[cfg(test)]
mod tests {
    use super::*;

    /// WCAG 2.x relative luminance of an sRGB colour.
    fn luminance(c: [u8; 3]) -> f64 {
        let lin = |v: u8| {
            let v = f64::from(v) / 255.0;
            if v <= 0.04045 { v / 12.92 } else { ((v + 0.055) / 1.055).powf(2.4) }
        };
        0.2126 * lin(c[0]) + 0.7152 * lin(c[1]) + 0.0722 * lin(c[2])
    }

    #[test]
    fn ends_and_middle() {
        assert_eq!(rgb(0.0), [0xdd, 0xe9, 0xef]);
        assert_eq!(rgb(1.0), [0xb0, 0x3a, 0x2e]);
        assert_eq!(rgb(9.0), [0x4a, 0x0d, 0x1c]);
        assert_eq!(rgb(f64::NAN), rgb(0.0));
        assert_eq!(rgb(-1.0), rgb(0.0));
    }

    // The ramp must darken monotonically so that a grey print keeps the order.
    #[test]
    fn darkens_monotonically() {
        let mut last = f64::INFINITY;
        for i in 0..=140 {
            let l = luminance(rgb(f64::from(i) / 100.0));
            assert!(l <= last + 1e-9, "luminance rises at u = {}", f64::from(i) / 100.0);
            last = l;
        }
    }
}
