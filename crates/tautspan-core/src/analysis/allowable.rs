//! Allowable force of a member or a floor, and how it was found.
//!
//! Members: allowable = rated strength × efficiency ÷ design factor, where
//! the rated strength is the minimum breaking strength (rope, chain, cable),
//! or yield stress × area (rods); a working load limit given directly is the
//! allowable as is (divided by the duty's multiplier over people or
//! lifting persons). This is the tension allowable; a rod in compression is
//! checked against its buckling resistance (`strut.rs`). Floors: each foot
//! against the rated concentrated load (without one a loaded foot is
//! unchecked: the uniform rating × area says nothing about a point load),
//! the feet's total against the rated uniform load × panel area where given
//! (necessary, not sufficient), and the deflection against span / limit.

use crate::model::{Floor, Member, Rating};
use crate::units::format_number;

/// An allowable and its derivation in words.
#[derive(Debug, Clone, PartialEq)]
pub struct Allowable {
    /// Allowable force, N.
    pub force_n: f64,
    /// How it was found: formula, inputs and sources.
    pub explanation: String,
}

fn kn(v: f64) -> String {
    format!("{} kN", format_number(v / 1e3, 4))
}

/// Allowable axial force of a member, N (the number of [`member_allowable`]
/// without its derivation, for the solves that need only the number).
pub fn member_allowable_n(m: &Member) -> f64 {
    let mode = mode_factor(m);
    match m.rating {
        Rating::BreakingStrength(f) => f.value * m.efficiency / m.design_factor.value * mode,
        Rating::WorkingLoadLimit(f) => f.value * bend_efficiency(m) / m.design_factor.duty_multiplier * mode,
        Rating::Yield(fy) => fy.value * m.area.value / m.design_factor.value * mode,
    }
}

/// The hitch's mode factor on the allowable (1 without a hitch).
pub fn mode_factor(m: &Member) -> f64 {
    m.hitch.as_ref().map_or(1.0, |h| h.factor)
}

/// The D/d bending efficiency (1 when not bent over a pin). With a
/// breaking strength it is part of `efficiency`; a working load limit,
/// which holds the termination but not a tight bend, is multiplied by it.
pub fn bend_efficiency(m: &Member) -> f64 {
    m.bend.as_ref().map_or(1.0, |b| b.efficiency)
}

/// The words for the hitch and, on a working load limit, the bend.
fn extra(m: &Member, wll: bool) -> String {
    let mut s = String::new();
    if wll && let Some(b) = &m.bend {
        s.push_str(&format!("; x D/d efficiency {}: {}", format_number(b.efficiency, 3), b.note));
    }
    if let Some(h) = &m.hitch {
        s.push_str(&format!("; x mode factor {}: {}", format_number(h.factor, 3), h.note));
    }
    s
}

/// Allowable axial force of a member.
pub fn member_allowable(m: &Member) -> Allowable {
    let df = &m.design_factor;
    let df_src = if df.from_file {
        format!(
            "design factor {} given in the file (default {} from {})",
            df.value, df.default.value, df.default.source
        )
    } else {
        format!("design factor {} ({})", df.value, df.default.source)
    };
    match m.rating {
        Rating::BreakingStrength(f) => {
            let a = member_allowable_n(m);
            Allowable {
                force_n: a,
                explanation: format!(
                    "minimum breaking strength {} x efficiency {} / {}{} = {}; strength: {}; efficiency: {}",
                    kn(f.value),
                    format_number(m.efficiency, 3),
                    df_src,
                    if m.hitch.is_some() {
                        format!(" x mode factor {}", format_number(mode_factor(m), 3))
                    } else {
                        String::new()
                    },
                    kn(a),
                    m.rating_note,
                    m.efficiency_note
                ) + &extra(m, false).replace("; x D/d", "; D/d"),
            }
        }
        Rating::WorkingLoadLimit(f) if df.duty_multiplier != 1.0 => Allowable {
            force_n: member_allowable_n(m),
            explanation: format!(
                "working load limit {} / {} for the duty ({}){} = {} ({})",
                kn(f.value),
                format_number(df.duty_multiplier, 3),
                df.default.source,
                extra(m, true),
                kn(member_allowable_n(m)),
                m.rating_note
            ),
        },
        Rating::WorkingLoadLimit(f) if m.hitch.is_some() || m.bend.is_some() => Allowable {
            force_n: member_allowable_n(m),
            explanation: format!(
                "working load limit {}{} = {} ({})",
                kn(f.value),
                extra(m, true),
                kn(member_allowable_n(m)),
                m.rating_note
            ),
        },
        Rating::WorkingLoadLimit(f) => Allowable {
            force_n: f.value,
            explanation: format!("working load limit {} used as the allowable ({})", kn(f.value), m.rating_note),
        },
        Rating::Yield(fy) => {
            let a = member_allowable_n(m);
            Allowable {
                force_n: a,
                explanation: format!(
                    "yield {} MPa x area {} mm^2 / {} = {}; {}",
                    format_number(fy.value / 1e6, 4),
                    format_number(m.area.value * 1e6, 4),
                    df_src,
                    kn(a),
                    m.rating_note
                ),
            }
        }
    }
}

/// What a loaded foot without a point rating asks for.
pub const NEEDS_RATED_POINT: &str = "give rated_point: the panel's rated concentrated load (EN 1991-1-1 Table 6.2 Qk or ASCE 7 Table 4.3-1), from the floor's owner; the uniform rating x area is no point capacity";

/// Allowable normal force of a floor (per foot: the rated concentrated
/// load; without one, the total: rated uniform load × area; neither:
/// infinite, and the floor is unchecked) and its deflection limit, m.
pub fn floor_allowable(f: &Floor) -> (Allowable, f64) {
    let area_m2 = f.area_m2();
    let uniform = f.rated_uniform.map(|q| q.value * area_m2);
    let point = f.rated_point.map(|p| p.value);
    let total = |u: f64| {
        format!(
            "total normal force against rated uniform load x panel area {} m^2 = {} (a necessary, not sufficient, check)",
            format_number(area_m2, 4),
            kn(u)
        )
    };
    let (force_n, explanation) = match (uniform, point) {
        (Some(u), Some(p)) => (p, format!("each foot against the rated concentrated load {}; {}", kn(p), total(u))),
        (None, Some(p)) => (p, format!("each foot against the rated concentrated load {}; no uniform rating", kn(p))),
        (Some(u), None) => {
            (u, format!("feet UNCHECKED without a rated concentrated load ({NEEDS_RATED_POINT}); {}", total(u)))
        }
        (None, None) => (f64::INFINITY, format!("no rating given: UNCHECKED ({NEEDS_RATED_POINT})")),
    };
    let short = f.span[0].value.min(f.span[1].value);
    (Allowable { force_n, explanation }, short / f.deflection_limit)
}
