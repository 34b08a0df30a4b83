//! The closed forms of the dynamic cases, each with its source.

/// Peak line tension ÷ weight at the lowest point of a swing released from
/// rest at `release_rad` from the vertical: `3 − 2 cos θ0` (rigid line;
/// energy balance plus centripetal force, any classical mechanics text).
pub fn swing_factor(release_rad: f64) -> f64 {
    3.0 - 2.0 * release_rad.cos()
}

/// Tension ÷ weight at angle `theta_rad` during a swing released at
/// `release_rad`: `3 cos θ − 2 cos θ0` (same source).
pub fn swing_tension_factor(theta_rad: f64, release_rad: f64) -> f64 {
    3.0 * theta_rad.cos() - 2.0 * release_rad.cos()
}

/// The release angle whose lowest-point factor is `factor` (inverse of
/// [`swing_factor`]), radians; `None` when the factor is below 1 (even the
/// hanging load is too much) and π when it is 5 or more.
pub fn release_for_factor(factor: f64) -> Option<f64> {
    if factor < 1.0 {
        return None;
    }
    let c = ((3.0 - factor) / 2.0).clamp(-1.0, 1.0);
    Some(c.acos())
}

/// Peak force ÷ weight when a weight `w_n` falls `h_m` onto a path of
/// stiffness `k_n_per_m`: `1 + √(1 + 2 k h / W)` (Timoshenko & Gere,
/// impact loading; Roark ch. 16). `h = 0` gives 2, the suddenly applied load.
pub fn drop_factor(w_n: f64, k_n_per_m: f64, h_m: f64) -> f64 {
    1.0 + (1.0 + 2.0 * k_n_per_m * h_m / w_n).sqrt()
}

/// The free-fall height whose peak factor is `factor` (inverse of
/// [`drop_factor`]); `None` below 2 (even a sudden application is too much).
pub fn height_for_factor(w_n: f64, k_n_per_m: f64, factor: f64) -> Option<f64> {
    if factor < 2.0 {
        return None;
    }
    Some(((factor - 1.0).powi(2) - 1.0) * w_n / (2.0 * k_n_per_m))
}

/// Time from first contact to the peak of a mass `m_kg` arrested by a spring
/// `k` after falling `h_m` under `g` (undamped mass–spring), s.
pub fn arrest_time_s(m_kg: f64, k_n_per_m: f64, h_m: f64, g: f64) -> f64 {
    let omega = (k_n_per_m / m_kg).sqrt();
    let d_st = m_kg * g / k_n_per_m;
    let v0 = (2.0 * g * h_m).sqrt();
    let amp = (d_st * d_st + (v0 / omega).powi(2)).sqrt();
    (std::f64::consts::FRAC_PI_2 + (d_st / amp).asin()) / omega
}

/// Complete elliptic integral of the first kind K(k), modulus `k` (< 1), by
/// the arithmetic–geometric mean: `K = π / (2 AGM(1, √(1 − k²)))`
/// (Abramowitz & Stegun 17.6).
pub fn elliptic_k(k: f64) -> f64 {
    let (mut a, mut b) = (1.0_f64, (1.0 - k * k).max(0.0).sqrt());
    for _ in 0..64 {
        let (an, bn) = (0.5 * (a + b), (a * b).sqrt());
        a = an;
        b = bn;
        if (a - b).abs() <= 1e-16 * a {
            break;
        }
    }
    std::f64::consts::PI / (2.0 * a)
}

/// Period of a rigid pendulum of length `l_m` released at `release_rad`:
/// `4 √(L/g) K(sin(θ0/2))`.
pub fn pendulum_period_s(l_m: f64, g: f64, release_rad: f64) -> f64 {
    4.0 * (l_m / g).sqrt() * elliptic_k((release_rad / 2.0).sin())
}

#[cfg(test)]
mod tests {
    use super::*;

    fn close(a: f64, b: f64, rel: f64) -> bool {
        ((a - b) / b).abs() < rel
    }

    // Peak/weight 30° 1.268, 45° 1.586, 60° 2.000, 90° 3.000 (rigid pendulum,
    // REFERENCES.md "derived"; rounded to 4 figures, so 5e-4 tolerance).
    #[test]
    fn swing_factors() {
        for (deg, f) in [(30.0, 1.268), (45.0, 1.586), (60.0, 2.0), (90.0, 3.0)] {
            let r: f64 = f64::to_radians(deg);
            assert!(close(swing_factor(r), f, 5e-4), "{deg}");
            assert!(close(release_for_factor(f).expect("f ≥ 1").to_degrees(), deg, 1e-3));
            // the lowest point is θ = 0; the turning point gives cos θ0
            assert!((swing_tension_factor(r, r) - r.cos()).abs() < 1e-12);
        }
        assert_eq!(release_for_factor(0.9), None);
    }

    // Abramowitz & Stegun Table 17.1 via T/T0 (REFERENCES.md): 10° 1.00191,
    // 30° 1.01741, 45° 1.03997, 60° 1.07318, 90° 1.18034, 120° 1.37288,
    // 150° 1.76220; five decimals given, so 1e-5 relative.
    #[test]
    fn pendulum_period_ratios() {
        let t0 = 2.0 * std::f64::consts::PI * (1.0_f64 / 9.80665).sqrt();
        for (deg, ratio) in [
            (10.0, 1.00191),
            (30.0, 1.01741),
            (45.0, 1.03997),
            (60.0, 1.07318),
            (90.0, 1.18034),
            (120.0, 1.37288),
            (150.0, 1.76220),
        ] {
            let t = pendulum_period_s(1.0, 9.80665, f64::to_radians(deg));
            assert!(close(t / t0, ratio, 1e-5), "{deg}: {}", t / t0);
        }
    }

    // Gere, Mechanics of Materials, impact: bar 3 m, A 1962.5 mm², E 200 GPa,
    // 2.5 kN dropped 120 mm → peak stress ≈ 144 MPa against 1.27 MPa static
    // (REFERENCES.md "derived"; 3 figures given → 0.5 %).
    #[test]
    fn drop_bar_example() {
        let (w, a) = (2500.0, 1962.5e-6);
        let k = 200e9 * a / 3.0;
        let f = w * drop_factor(w, k, 0.120);
        assert!(close(f / a / 1e6, 144.0, 5e-3), "{}", f / a / 1e6);
        assert!(close(w / a / 1e6, 1.274, 1e-3));
        assert!((drop_factor(w, k, 0.0) - 2.0).abs() < 1e-12);
        let h = height_for_factor(w, k, drop_factor(w, k, 0.3)).expect("≥ 2");
        assert!(close(h, 0.3, 1e-9));
    }

    // Wexler 1950: F = mg + √((mg)² + 2 mg EA f) — the length cancels at equal fall factor.
    #[test]
    fn fall_factor_form_is_length_free() {
        let (mg, ea, ff): (f64, f64, f64) = (80.0 * 9.80665, 45_000.0, 1.77);
        let wexler = mg + (mg * mg + 2.0 * mg * ea * ff).sqrt();
        for l in [1.0, 5.0, 30.0] {
            let f = mg * drop_factor(mg, ea / l, ff * l);
            assert!(close(f, wexler, 1e-12), "{l}");
        }
        // EN 892: 80 kg, fall factor 1.77, peak ≤ 12 kN implies EA ≈ 45 kN
        assert!(close(wexler, 12_000.0, 0.02), "{wexler}");
    }
}
