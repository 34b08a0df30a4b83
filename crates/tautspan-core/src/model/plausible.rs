//! Plausible ranges of the numbers a scenario gives: a value outside its
//! range is a slip of unit or exponent (`"1e-300 mm^2"`, a denormal mass),
//! refused as a located input error naming the field and the value as
//! typed, before it can reach the solver as an overflow or a `inf` in a
//! message. The ranges are wide on purpose (practice: from the smallest
//! rigging hardware to the largest lifts, with a margin of ten or more
//! either side); they catch nonsense, not unusual jobs.

/// A closed range of a quantity in SI base units, with its bounds as
/// people write them.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Plausible {
    /// What the quantity is, for the message: "a member's area".
    pub what: &'static str,
    /// Lower bound, SI.
    pub lo: f64,
    /// Upper bound, SI.
    pub hi: f64,
    /// The bounds as written in the message.
    pub text: &'static str,
}

/// A member's cross-section area: 0.01 mm² (a 0.1 mm wire) to 1 m².
pub const AREA: Plausible = Plausible { what: "a member's area", lo: 1e-8, hi: 1.0, text: "0.01 mm^2 to 1 m^2" };

/// An elastic modulus: 1 MPa (soft elastomer) to 10⁶ GPa: far above any
/// material (diamond is about 1200 GPa), so that a line made near-rigid on
/// purpose, to compare with a rigid-line closed form, stays possible.
pub const MODULUS: Plausible =
    Plausible { what: "an elastic modulus", lo: 1e6, hi: 1e15, text: "1 MPa to 1000000 GPa" };

/// A mass: 1 g to 10,000 t.
pub const MASS: Plausible = Plausible { what: "a mass", lo: 1e-3, hi: 1e7, text: "1 g to 10000 t" };

/// A drop height: 0 to 1 km (a free fall of more is no rigging case).
pub const DROP_HEIGHT: Plausible = Plausible { what: "a drop height", lo: 0.0, hi: 1e3, text: "0 m to 1 km" };

/// A node coordinate: within 10,000 km of zero (site grids' northings reach
/// about 1e7 m).
pub const COORDINATE: Plausible =
    Plausible { what: "a node coordinate", lo: -1e7, hi: 1e7, text: "-10000 km to 10000 km" };

impl Plausible {
    /// `None` when `value` lies in the range; else the message for the
    /// field, quoting the value `typed`.
    pub fn outside(&self, value: f64, typed: &str) -> Option<String> {
        (!(value >= self.lo && value <= self.hi)).then(|| {
            format!(
                "\"{typed}\" is outside the plausible range for {}, {}; check the unit and the exponent",
                self.what, self.text
            )
        })
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn bounds_are_inside_and_slips_outside() {
        for r in [AREA, MODULUS, MASS, DROP_HEIGHT, COORDINATE] {
            assert!(r.outside(r.lo, "lo").is_none() && r.outside(r.hi, "hi").is_none(), "{}", r.what);
            assert!(r.outside(f64::NAN, "NaN").is_some(), "{}", r.what);
        }
        let m = MASS.outside(1e-310, "1e-310 kg").expect("denormal mass refused");
        assert_eq!(
            m,
            "\"1e-310 kg\" is outside the plausible range for a mass, 1 g to 10000 t; check the unit and the exponent"
        );
        assert!(AREA.outside(1e-306, "1e-300 mm^2").is_some());
        assert!(MODULUS.outside(1e300, "1e291 GPa").is_some());
        assert!(DROP_HEIGHT.outside(1e299, "1e299 m").is_some());
    }
}
