//! Warnings of one case, each naming the member, floor or mass concerned,
//! the limit, and by how much.

use super::results::{CaseResult, State, Warning};
use crate::library::{Carries, MemberKind};
use crate::model::{Case, Scenario};
use crate::units::Sig;

/// A force in kN, 4 significant digits, written in place.
struct Kn(f64);

impl std::fmt::Display for Kn {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        write!(f, "{} kN", Sig(self.0 / 1e3, 4))
    }
}

/// A fraction as a percentage, 3 significant digits, written in place.
struct Pct(f64);

impl std::fmt::Display for Pct {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        write!(f, "{} %", Sig(self.0 * 100.0, 3))
    }
}

/// A message written into one string sized for it at the start (the
/// hundreds of warnings of a large rig are written on every re-solve).
fn msg(args: std::fmt::Arguments<'_>) -> String {
    use std::fmt::Write as _;
    let mut s = String::with_capacity(192);
    let _ = s.write_fmt(args);
    s
}

/// Strain beyond which a steel member leaves the linear elastic range the
/// model assumes (practice: steel yields near 0.1–0.2 %, wire rope and chain
/// are proof-loaded near 2 % elongation; 2 % is the point past which the
/// spring picture is plainly wrong).
pub const STEEL_STRAIN_LIMIT: f64 = 0.02;

/// Below this angle from horizontal a tension member is reported as a
/// level tie rather than with a load-angle factor (1 / sin 0.5° ≈ 115, past
/// any sling rating table; practice).
pub const HORIZONTAL_DEG: f64 = 0.5;

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
                msg(format_args!(
                    "member {}: {} is over its allowable {} by {} (utilisation {})",
                    m.id,
                    Kn(m.force_n.abs()),
                    Kn(m.allowable_n),
                    Pct(m.utilisation - 1.0),
                    Sig(m.utilisation, 3)
                )),
            ),
            State::Near => push(
                &m.id,
                msg(format_args!(
                    "member {}: at {} of its allowable {} (near-limit threshold {})",
                    m.id,
                    Pct(m.utilisation),
                    Kn(m.allowable_n),
                    Pct(s.near_limit)
                )),
            ),
            State::Slack if !member.may_go_slack => push(
                &m.id,
                msg(format_args!(
                    "member {}: slack in case {}, where it was meant to carry (set may_go_slack if that is intended)",
                    m.id, r.id
                )),
            ),
            State::Unchecked => push(
                &m.id,
                msg(format_args!(
                    "member {}: UNCHECKED in case {}: {}",
                    m.id,
                    r.id,
                    m.reason.as_deref().unwrap_or("the inputs cannot support the check")
                )),
            ),
            _ => {}
        }
        if member.kind.carries() == Carries::TensionOnly && m.force_n > 0.0 && m.sling_angle_deg < 30.0 {
            if m.sling_angle_deg < HORIZONTAL_DEG {
                // 1 / sin β grows without bound: a level member takes no
                // share of the weight, so it is a tie, not a sling leg
                push(
                    &m.id,
                    msg(format_args!(
                        "member {}: runs level (sling angle {} deg) and carries {} as a tie; a sling leg this flat takes no share of the weight, so if it is meant as one the rig geometry is wrong (ASME B30.9 wants 30 deg or more)",
                        m.id,
                        Sig(m.sling_angle_deg, 2),
                        Kn(m.force_n)
                    )),
                );
            } else {
                let factor = 1.0 / m.sling_angle_deg.to_radians().sin();
                push(
                    &m.id,
                    msg(format_args!(
                        "member {}: sling angle {} deg from horizontal is below 30 deg (load-angle factor {}); ASME B30.9 allows it only with a qualified person's approval",
                        m.id,
                        Sig(m.sling_angle_deg, 3),
                        Sig(factor, 3)
                    )),
                );
            }
        }
        if member.kind == MemberKind::Rod && m.force_n < 0.0 {
            push(
                &m.id,
                msg(format_args!(
                    "member {}: rod in compression ({}); buckling is not checked by this tool",
                    m.id,
                    Kn(-m.force_n)
                )),
            );
        }
        let strain = if m.length_m > 0.0 { m.stretch_m / (m.length_m - m.stretch_m) } else { 0.0 };
        let steel =
            matches!(member.kind, MemberKind::WireRope | MemberKind::Chain | MemberKind::Rod | MemberKind::Cable);
        if steel && strain.abs() > STEEL_STRAIN_LIMIT {
            push(
                &m.id,
                msg(format_args!(
                    "member {}: strain {} is beyond the {} the linear spring model holds for steel; the result is outside the model's validity",
                    m.id,
                    Pct(strain),
                    Pct(STEEL_STRAIN_LIMIT)
                )),
            );
        }
        {
            let (sag, span) = (m.sag_m, m.length_m);
            if span > 0.0 && sag / span > SAG_RATIO_LIMIT {
                push(
                    &m.id,
                    msg(format_args!(
                        "member {}: own-weight sag/span {} exceeds 1/8; the parabolic sag view (Irvine) does not hold",
                        m.id,
                        Sig(sag / span, 3)
                    )),
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
                    msg(format_args!(
                        "member {}: {} case force {} is {} x its static {} (warning set at {} x)",
                        m.id,
                        r.kind,
                        Kn(m.force_n),
                        Sig(m.force_n / f0, 3),
                        Kn(f0),
                        Sig(s.dynamic_ratio_warning, 3)
                    )),
                );
            }
        }
    }
    for f in &r.floors {
        for foot in f.feet.iter().filter(|x| x.state == State::Over) {
            match (&foot.reason, foot.utilisation) {
                (Some(why), _) => push(&f.id, msg(format_args!("floor {}, case {}: {}", f.id, r.id, why))),
                (None, Some(u)) => push(
                    &f.id,
                    msg(format_args!(
                        "floor {}, foot {}: normal force {} against the rated concentrated load {}: utilisation {} (over by {})",
                        f.id,
                        foot.node,
                        Kn(foot.normal_force_n),
                        Kn(f.allowable_n),
                        Sig(u, 3),
                        Pct(u - 1.0)
                    )),
                ),
                (None, None) => {}
            }
        }
        if f.state != State::Slack {
            for foot in f.feet.iter().filter(|x| x.state == State::Slack) {
                push(
                    &f.id,
                    msg(format_args!("floor {}: foot {} lifts off in case {}; normal force 0", f.id, foot.node, r.id)),
                );
            }
        }
        // the panel's own checks: the total against the uniform rating, the deflection
        let panel_util =
            f64::max(f.total_allowable_n.map_or(0.0, |t| f.normal_force_n / t), f.deflection_m / f.deflection_limit_m);
        if f.state == State::Over && panel_util <= 1.0 + 1e-9 {
            continue;
        }
        match f.state {
            State::Slack => {
                push(&f.id, msg(format_args!("floor {}: contact lifts off in case {}; normal force 0", f.id, r.id)))
            }
            State::Over => push(
                &f.id,
                msg(format_args!(
                    "floor {}: total normal force {} against rated uniform x area {}, largest deflection {} mm against limit {} mm: utilisation {} (over by {})",
                    f.id,
                    Kn(f.normal_force_n),
                    f.total_allowable_n.map_or_else(|| "none given".to_string(), |t| Kn(t).to_string()),
                    Sig(f.deflection_m * 1e3, 3),
                    Sig(f.deflection_limit_m * 1e3, 3),
                    Sig(panel_util, 3),
                    Pct(panel_util - 1.0)
                )),
            ),
            State::Near => push(
                &f.id,
                msg(format_args!(
                    "floor {}: at {} of its allowable (near-limit threshold {})",
                    f.id,
                    Pct(f.utilisation),
                    Pct(s.near_limit)
                )),
            ),
            State::Unchecked => push(
                &f.id,
                msg(format_args!(
                    "floor {}: UNCHECKED in case {}: {}",
                    f.id,
                    r.id,
                    f.reason.as_deref().unwrap_or("the inputs cannot support the check")
                )),
            ),
            State::Ok => {}
        }
    }
    if let Case::Swing { release, mass, .. } = case
        && release.value > std::f64::consts::FRAC_PI_2 + 1e-9
    {
        push(
            &s.masses[*mass].id,
            msg(format_args!(
                "case {}: release {} deg is beyond 90 deg: a rope goes slack on release, the mass falls and then snatches the line; check it as a drop case",
                r.id,
                Sig(release.value.to_degrees(), 3)
            )),
        );
    }
    w
}
