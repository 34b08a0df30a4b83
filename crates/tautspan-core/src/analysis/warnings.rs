//! Warnings of one case, each naming the member, floor or mass concerned,
//! the limit, and by how much.

use super::results::{CaseResult, State, Warning};
use crate::library::{Carries, MemberKind};
use crate::model::{Case, Scenario};
use crate::units::format_number;

fn kn(v: f64) -> String {
    format!("{} kN", format_number(v / 1e3, 4))
}

fn pct(v: f64) -> String {
    format!("{} %", format_number(v * 100.0, 3))
}

/// Strain beyond which a steel member leaves the linear elastic range the
/// model assumes (practice: steel yields near 0.1–0.2 %, wire rope and chain
/// are proof-loaded near 2 % elongation; 2 % is the point past which the
/// spring picture is plainly wrong).
pub const STEEL_STRAIN_LIMIT: f64 = 0.02;

/// Parabolic sag is good to sag/span ≈ 1/8 (Irvine, Cable Structures, 1981).
pub const SAG_RATIO_LIMIT: f64 = 0.125;

/// Warnings for a solved case.
pub fn case_warnings(s: &Scenario, case: &Case, r: &CaseResult, static_r: Option<&CaseResult>) -> Vec<Warning> {
    let mut w = Vec::new();
    let mut push = |subject: &str, message: String| w.push(Warning { subject: Some(subject.to_string()), message });
    for (i, m) in r.members.iter().enumerate() {
        let member = &s.members[i];
        match m.state {
            State::Over => push(
                &m.id,
                format!(
                    "member {}: {} is over its allowable {} by {} (utilisation {})",
                    m.id,
                    kn(m.force_n.abs()),
                    kn(m.allowable_n),
                    pct(m.utilisation - 1.0),
                    format_number(m.utilisation, 3)
                ),
            ),
            State::Near => push(
                &m.id,
                format!(
                    "member {}: at {} of its allowable {} (near-limit threshold {})",
                    m.id,
                    pct(m.utilisation),
                    kn(m.allowable_n),
                    pct(s.near_limit)
                ),
            ),
            State::Slack if !member.may_go_slack => push(
                &m.id,
                format!(
                    "member {}: slack in case {}, where it was meant to carry (set may_go_slack if that is intended)",
                    m.id, r.id
                ),
            ),
            _ => {}
        }
        if member.kind.carries() == Carries::TensionOnly && m.force_n > 0.0 && m.sling_angle_deg < 30.0 {
            let factor = 1.0 / m.sling_angle_deg.to_radians().sin().max(1e-9);
            push(
                &m.id,
                format!(
                    "member {}: sling angle {} deg from horizontal is below 30 deg (load-angle factor {}); ASME B30.9 allows it only with a qualified person's approval",
                    m.id,
                    format_number(m.sling_angle_deg, 3),
                    format_number(factor, 3)
                ),
            );
        }
        if member.kind == MemberKind::Rod && m.force_n < 0.0 {
            push(
                &m.id,
                format!(
                    "member {}: rod in compression ({}); buckling is not checked by this tool",
                    m.id,
                    kn(-m.force_n)
                ),
            );
        }
        let strain = if m.length_m > 0.0 { m.stretch_m / (m.length_m - m.stretch_m) } else { 0.0 };
        let steel =
            matches!(member.kind, MemberKind::WireRope | MemberKind::Chain | MemberKind::Rod | MemberKind::Cable);
        if steel && strain.abs() > STEEL_STRAIN_LIMIT {
            push(
                &m.id,
                format!(
                    "member {}: strain {} is beyond the {} the linear spring model holds for steel; the result is outside the model's validity",
                    m.id,
                    pct(strain),
                    pct(STEEL_STRAIN_LIMIT)
                ),
            );
        }
        {
            let (sag, span) = (m.sag_m, m.length_m);
            if span > 0.0 && sag / span > SAG_RATIO_LIMIT {
                push(
                    &m.id,
                    format!(
                        "member {}: own-weight sag/span {} exceeds 1/8; the parabolic sag view (Irvine) does not hold",
                        m.id,
                        format_number(sag / span, 3)
                    ),
                );
            }
        }
        if let Some(st) = static_r
            && case.mass().is_some()
        {
            let f0 = st.members[i].force_n;
            if f0 > 0.0 && m.force_n > s.dynamic_ratio_warning * f0 {
                push(
                    &m.id,
                    format!(
                        "member {}: {} case force {} is {} x its static {} (warning set at {} x)",
                        m.id,
                        r.kind,
                        kn(m.force_n),
                        format_number(m.force_n / f0, 3),
                        kn(f0),
                        format_number(s.dynamic_ratio_warning, 3)
                    ),
                );
            }
        }
    }
    for f in &r.floors {
        match f.state {
            State::Slack => push(&f.id, format!("floor {}: contact lifts off in case {}; normal force 0", f.id, r.id)),
            State::Over => push(
                &f.id,
                format!(
                    "floor {}: normal force {} against allowable {}, deflection {} mm against limit {} mm: utilisation {} (over by {})",
                    f.id,
                    kn(f.normal_force_n),
                    kn(f.allowable_n),
                    format_number(f.deflection_m * 1e3, 3),
                    format_number(f.deflection_limit_m * 1e3, 3),
                    format_number(f.utilisation, 3),
                    pct(f.utilisation - 1.0)
                ),
            ),
            State::Near => push(
                &f.id,
                format!(
                    "floor {}: at {} of its allowable (near-limit threshold {})",
                    f.id,
                    pct(f.utilisation),
                    pct(s.near_limit)
                ),
            ),
            State::Ok => {}
        }
    }
    if let Case::Swing { release, mass, .. } = case
        && release.value > std::f64::consts::FRAC_PI_2 + 1e-9
    {
        push(
            &s.masses[*mass].id,
            format!(
                "case {}: release {} deg is beyond 90 deg: a rope goes slack on release, the mass falls and then snatches the line; check it as a drop case",
                r.id,
                format_number(release.value.to_degrees(), 3)
            ),
        );
    }
    w
}
