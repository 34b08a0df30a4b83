//! Wire rope bent over a pin or sheave: the efficiency the rope keeps at a
//! ratio D/d of pin diameter to rope diameter, from the common practice
//! curve widely published in wire rope users' manuals (REFERENCES
//! "Hitches, terminations"; from memory, not re-read). Between the curve's
//! points the efficiency is interpolated linearly; below D/d 1 the curve
//! says nothing and the ratio is refused; above D/d 40 the last point, 0.95,
//! is held (conservative: the curve is not extended to 1.0).

/// The curve's points (D/d, efficiency), ascending.
pub const BEND_CURVE: [(f64, f64); 8] =
    [(1.0, 0.50), (2.0, 0.65), (4.0, 0.75), (6.0, 0.79), (8.0, 0.83), (10.0, 0.86), (20.0, 0.91), (40.0, 0.95)];

/// Where the curve comes from.
pub const BEND_SOURCE: &str =
    "D/d efficiency curve of wire rope users' manuals (common practice, from memory), linear between points";

/// Efficiency of a wire rope bent at `ratio` = D/d; `Err` below the curve.
pub fn bend_efficiency(ratio: f64) -> Result<f64, String> {
    if !ratio.is_finite() || ratio < BEND_CURVE[0].0 {
        return Err(format!(
            "D/d {ratio:.3} is below 1, where the bending efficiency curve ends; the rope is bent sharper than any rating"
        ));
    }
    for w in BEND_CURVE.windows(2) {
        let ((x0, y0), (x1, y1)) = (w[0], w[1]);
        if ratio <= x1 {
            return Ok(y0 + (y1 - y0) * (ratio - x0) / (x1 - x0));
        }
    }
    Ok(BEND_CURVE[BEND_CURVE.len() - 1].1)
}

#[cfg(test)]
mod tests {
    use super::*;

    // REFERENCES "Hitches, terminations" D/d curve (from memory): the
    // points themselves, exact to 1e-12.
    #[test]
    fn curve_points() {
        let pts =
            [(1.0, 0.50), (2.0, 0.65), (4.0, 0.75), (6.0, 0.79), (8.0, 0.83), (10.0, 0.86), (20.0, 0.91), (40.0, 0.95)];
        for (r, e) in pts {
            assert!((bend_efficiency(r).unwrap() - e).abs() < 1e-12, "D/d {r}");
        }
    }

    // Linear interpolation by hand: D/d 15 halfway between 10 (0.86) and
    // 20 (0.91) = 0.885; D/d 3 halfway between 0.65 and 0.75 = 0.70.
    // Beyond 40 the last point 0.95 is held; below 1 refused.
    #[test]
    fn interpolated_held_and_refused() {
        assert!((bend_efficiency(15.0).unwrap() - 0.885).abs() < 1e-12);
        assert!((bend_efficiency(3.0).unwrap() - 0.70).abs() < 1e-12);
        assert!((bend_efficiency(100.0).unwrap() - 0.95).abs() < 1e-12);
        assert!(bend_efficiency(0.99).is_err());
    }
}
