//! Illinois false position: closes a bracket `[lo, hi]` with `g(lo) ≤ 0 <
//! g(hi)` on a root of `g`, superlinearly, never leaving the bracket (Dowell
//! & Jarratt, "A modified regula falsi method", BIT 11, 1971). Used by the
//! load-factor limit search and by the release-angle limit search.

/// A bracket and the values of `g` at its ends.
#[derive(Debug, Clone, Copy)]
pub struct Bracket {
    /// Lower end, `g(lo) ≤ 0`.
    pub lo: f64,
    /// `g(lo)`.
    pub g_lo: f64,
    /// Upper end, `g(hi) > 0`.
    pub hi: f64,
    /// `g(hi)`.
    pub g_hi: f64,
}

/// Close `b` until `closed(lo, hi)`, or until `|g| < exact` at a trial
/// point (then the bracket collapses onto it), at most 60 steps. `g` may
/// fail; the failure is passed on. Returns the final bracket.
pub fn illinois<E>(
    mut b: Bracket,
    closed: impl Fn(f64, f64) -> bool,
    exact: f64,
    mut g: impl FnMut(f64) -> Result<f64, E>,
) -> Result<Bracket, E> {
    let mut side = 0i8;
    for _ in 0..60 {
        if closed(b.lo, b.hi) {
            break;
        }
        let mut m = b.hi - b.g_hi * (b.hi - b.lo) / (b.g_hi - b.g_lo);
        if !(m > b.lo && m < b.hi) {
            m = 0.5 * (b.lo + b.hi);
        }
        let gm = g(m)?;
        if gm.abs() < exact {
            return Ok(Bracket { lo: m, g_lo: gm, hi: m, g_hi: gm });
        }
        if gm > 0.0 {
            b.hi = m;
            b.g_hi = gm;
            if side == 1 {
                b.g_lo *= 0.5;
            }
            side = 1;
        } else {
            b.lo = m;
            b.g_lo = gm;
            if side == -1 {
                b.g_hi *= 0.5;
            }
            side = -1;
        }
    }
    Ok(b)
}

#[cfg(test)]
mod tests {
    use super::*;

    // x³ − 2 on [1, 2]: the root is 2^(1/3) = 1.259921049894873 (closed form).
    #[test]
    fn closes_on_a_cube_root() {
        let b = Bracket { lo: 1.0, g_lo: -1.0, hi: 2.0, g_hi: 6.0 };
        let out = illinois::<()>(b, |lo, hi| hi - lo <= 1e-12, 0.0, |x| Ok(x * x * x - 2.0)).expect("no failure");
        let root = 2f64.cbrt();
        assert!((out.lo - root).abs() < 1e-11 && (out.hi - root).abs() < 1e-11, "{out:?}");
        assert!(out.lo <= root + 1e-15);
    }
}
