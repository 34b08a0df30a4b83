//! Plausibility checks on a member's nominal diameter by its kind: a value
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

#[cfg(test)]
mod tests {
    use super::*;

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
