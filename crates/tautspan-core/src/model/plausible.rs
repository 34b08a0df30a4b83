//! Plausible ranges of the numbers a scenario gives: a value outside its
//! range is a slip of unit or exponent (`"1e-300 mm^2"`, a denormal mass),
//! refused as a located input error naming the field and the value as
//! typed, before it can reach the solver as an overflow or a `inf` in a
//! message. The ranges are wide on purpose (practice: from the smallest
//! rigging hardware to the largest lifts, with a margin of ten or more
//! either side); they catch nonsense, not unusual jobs.
//!
//! A member's nominal diameter is checked by its kind: a value
//! outside the range is almost surely a unit slip (`"10 m"` for `"10 mm"`)
//! and is refused as a located error, naming the range. The ranges are
//! common practice for the products each kind stands for, wide on purpose
//! (they are a check for slips, not a catalogue): general-purpose and crane
//! wire rope from thin cord to the largest mining and offshore ropes; fibre
//! rope from cord to mooring hawsers; lifting chain from the smallest
//! grade 80 sizes to heavy chain (EN 818-2 tabulates 6–45 mm); rods and
//! bars; spiral strand and stay cables. Give `area` instead to go outside
//! them.

use crate::library::MemberKind;

/// The plausible nominal diameters of a kind, m: (smallest, largest).
pub fn diameter_range_m(kind: MemberKind) -> (f64, f64) {
    match kind {
        MemberKind::WireRope => (0.0005, 0.2),
        MemberKind::FibreRope => (0.001, 0.25),
        MemberKind::Chain => (0.003, 0.2),
        MemberKind::Rod => (0.001, 1.0),
        MemberKind::Cable => (0.001, 0.3),
    }
}

/// Why `diameter_m` is not plausible for `kind`, or `None` when it is.
pub fn implausible_diameter(kind: MemberKind, diameter_m: f64) -> Option<String> {
    let (lo, hi) = diameter_range_m(kind);
    if (lo..=hi).contains(&diameter_m) {
        return None;
    }
    let mm = |v: f64| crate::units::format_number(v * 1000.0, 4);
    Some(format!(
        "a {} of {} mm diameter is outside the plausible {}–{} mm (a check for unit slips such as \"10 m\" for \"10 mm\"); give the nominal diameter in mm, or `area` instead",
        kind.label(),
        mm(diameter_m),
        mm(lo),
        mm(hi)
    ))
}

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

/// Any quantity at all, in SI base units, before its own range: a nonzero
/// magnitude below 1e-15 or above 1e15 (a denormal yield stress, a rating
/// of 1e300 N) is no value a rig has in any unit, and would reach the
/// checks as a zero divisor or an overflow. Zero passes (a drop of 0 m).
pub fn implausible_magnitude(value: f64, typed: &str) -> Option<String> {
    let m = value.abs();
    (value != 0.0 && !(1e-15..=1e15).contains(&m)).then(|| {
        format!(
            "\"{typed}\" is outside any plausible magnitude for a scenario (1e-15 to 1e15 in SI base units); check the unit and the exponent"
        )
    })
}

/// A rod's section dimension (a tube's outside diameter or wall, a bar's
/// diameter): 0.1 mm (thin-walled tube) to 5 m.
pub const SECTION_LENGTH: Plausible =
    Plausible { what: "a section dimension", lo: 1e-4, hi: 5.0, text: "0.1 mm to 5 m" };

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
        for r in [AREA, MODULUS, MASS, DROP_HEIGHT, COORDINATE, SECTION_LENGTH] {
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
        // any quantity: zero and ordinary values pass, denormal and huge ones do not
        assert!(implausible_magnitude(0.0, "0 m").is_none());
        assert!(implausible_magnitude(250e6, "250 MPa").is_none());
        assert!(implausible_magnitude(4.9e-318, "4.9e-324 MPa").is_some());
        assert!(implausible_magnitude(-1e300, "-1e300 N").is_some());
    }

    #[test]
    fn a_unit_slip_is_caught_and_real_sizes_pass() {
        // the sizes the library's tables hold pass: wire rope 8–40 mm, chain 6–45 mm (EN 818-2)
        for (kind, d) in [
            (MemberKind::WireRope, 0.008),
            (MemberKind::WireRope, 0.040),
            (MemberKind::Chain, 0.006),
            (MemberKind::Chain, 0.045),
            (MemberKind::FibreRope, 0.012),
            (MemberKind::Rod, 0.030),
            (MemberKind::Cable, 0.1),
        ] {
            assert_eq!(implausible_diameter(kind, d), None, "{kind:?} {d}");
        }
        let m = implausible_diameter(MemberKind::WireRope, 10.0).unwrap_or_default();
        assert!(m.contains("10000 mm") && m.contains("0.5–200 mm"), "{m}");
        assert!(implausible_diameter(MemberKind::Chain, 0.001).is_some());
    }
}
