//! Warnings of one case, each naming the member, floor or mass concerned,
//! the limit, and by how much.

use super::results::{CaseResult, State, Warning};
use super::warning_kind::WarningKind;
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

/// For a member held at both ends by anchors, why it is slack: it carries
/// none of the rig's load, only its own pretension.
fn between_anchors(s: &Scenario, m: &crate::model::Member) -> String {
    let anchor = |k: usize| s.nodes[k].support == crate::model::Support::Anchor;
    if m.run.is_none() && anchor(m.ends[0]) && anchor(m.ends[1]) {
        format!(
            "; it runs between anchors {} and {}, so it carries none of the rig's load, only a pretension given as negative `slack`",
            s.nodes[m.ends[0]].id, s.nodes[m.ends[1]].id
        )
    } else {
        String::new()
    }
}

/// Warnings for a solved case.
pub fn case_warnings(s: &Scenario, case: &Case, r: &CaseResult, static_r: Option<&CaseResult>) -> Vec<Warning> {
    let mut w = Vec::new();
    let legs = sling_legs(s, r);
    let mut push = |kind: WarningKind, subject: &str, message: String| {
        w.push(Warning { kind, subject: Some(subject.to_string()), message })
    };
    for (i, m) in r.members.iter().enumerate() {
        let member = &s.members[i];
        match m.state {
            State::Over => push(
                WarningKind::MemberOver,
                &m.id,
                msg(format_args!(
                    "member {}: {} is over its {} {} by {} (utilisation {})",
                    m.id,
                    Kn(m.force_n.abs()),
                    if m.force_n < 0.0 && m.buckling_resistance_n.is_some() {
                        "buckling allowable (compression)"
                    } else {
                        "allowable"
                    },
                    Kn(m.allowable_n),
                    Pct(m.utilisation - 1.0),
                    Sig(m.utilisation, 3)
                )),
            ),
            State::Near => push(
                WarningKind::MemberNear,
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
                WarningKind::MemberSlack,
                &m.id,
                msg(format_args!(
                    "member {}: slack in case {}, where it was meant to carry (set may_go_slack if that is intended){}",
                    m.id,
                    r.id,
                    between_anchors(s, member)
                )),
            ),
            State::Unchecked => push(
                WarningKind::MemberUnchecked,
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
        if legs[i] && m.sling_angle_deg < 30.0 {
            if m.sling_angle_deg < HORIZONTAL_DEG {
                // 1 / sin β grows without bound: a level member takes no
                // share of the weight, so it is a tie, not a sling leg
                push(
                    WarningKind::LevelLeg,
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
                    WarningKind::LowSlingAngle,
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
        let strain = if m.length_m > 0.0 { m.stretch_m / (m.length_m - m.stretch_m) } else { 0.0 };
        let steel =
            matches!(member.kind, MemberKind::WireRope | MemberKind::Chain | MemberKind::Rod | MemberKind::Cable);
        // a slack tension member's negative stretch is its slack, not a strain
        if steel && strain.abs() > STEEL_STRAIN_LIMIT && m.state != State::Slack {
            push(
                WarningKind::SteelStrain,
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
                    WarningKind::SagRatio,
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
                    WarningKind::DynamicRatio,
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
                // the foot itself is the subject: a group names the feet,
                // and a click selects the foot
                (Some(why), _) => {
                    push(WarningKind::FootOver, &foot.node, msg(format_args!("floor {}, case {}: {}", f.id, r.id, why)))
                }
                (None, Some(u)) => push(
                    WarningKind::FootOver,
                    &foot.node,
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
                    WarningKind::FootLifts,
                    &foot.node,
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
            State::Slack => push(
                WarningKind::FloorLifts,
                &f.id,
                msg(format_args!("floor {}: contact lifts off in case {}; normal force 0", f.id, r.id)),
            ),
            State::Over => push(
                WarningKind::FloorOver,
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
                WarningKind::FloorNear,
                &f.id,
                msg(format_args!(
                    "floor {}: at {} of its allowable (near-limit threshold {})",
                    f.id,
                    Pct(f.utilisation),
                    Pct(s.near_limit)
                )),
            ),
            State::Unchecked => push(
                WarningKind::FloorUnchecked,
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
    w.extend(part_warnings(s, r));
    w.extend(super::multi_leg::multi_leg_warnings(s, r, &legs));
    w.extend(super::drawn_shape::drawn_shape_warnings(s, case, r, static_r));
    w
}

// --- sling legs: which tension members the sling-angle warning is for ---

/// Below this vertical component of a member's unit vector it is level
/// (1e-6: far below a drawing's precision).
const LEVEL: f64 = 1e-6;

/// Which members are sling legs in this solved case: a member carrying
/// tension (rope, chain, cable) that takes hung load upward (its lower end
/// hangs a load: a mass there or below it through taut members) and meets
/// other legs at a gathering point: either its lower end, where another
/// taut member also rises and at most one line continues down (a bridle's
/// ring), or its upper end, where another taut member also comes up from a
/// hung load and at most one line continues up (a two-leg sling's master
/// link). A gathering point has no level member at it. So guys (whose lower
/// end hangs nothing), level ties and spreaders, and the inner members of a
/// net (joints with several lines up and down or level ones) are not legs.
/// A taut tension member with a `hitch` is a sling leg wherever it is.
pub fn sling_legs(s: &Scenario, r: &CaseResult) -> Vec<bool> {
    let n = s.nodes.len();
    let pos = |k: usize| r.nodes.get(k).map_or_else(|| s.position_m(k), |x| x.position_m);
    // each taut tension member as (lower, upper, rises), rises false when level
    let taut: Vec<Option<(usize, usize, bool)>> = s
        .members
        .iter()
        .zip(&r.members)
        .map(|(m, mr)| {
            // a rope over sheaves is no sling leg (its spans are not counted)
            if m.kind.carries() != Carries::TensionOnly || mr.force_n <= 0.0 || m.run.is_some() {
                return None;
            }
            let [a, b] = m.ends;
            let (pa, pb) = (pos(a), pos(b));
            let d = [pb[0] - pa[0], pb[1] - pa[1], pb[2] - pa[2]];
            let l = (d[0] * d[0] + d[1] * d[1] + d[2] * d[2]).sqrt();
            let uy = if l > 0.0 { d[1] / l } else { 0.0 };
            Some(if uy >= 0.0 { (a, b, uy > LEVEL) } else { (b, a, -uy > LEVEL) })
        })
        .collect();
    // nodes that hang a load: masses, then upward through taut members
    let mut hangs = vec![false; n];
    for m in &s.masses {
        hangs[m.node] = true;
    }
    for _ in 0..n {
        let mut changed = false;
        for &(lo, up, rises) in taut.iter().flatten() {
            if rises && hangs[lo] && !hangs[up] {
                hangs[up] = true;
                changed = true;
            }
        }
        if !changed {
            break;
        }
    }
    // per node: lines up, lines down, level lines; all members at it, any kind
    let mut up = vec![0usize; n];
    let mut down = vec![0usize; n];
    let mut level = vec![0usize; n];
    let mut legs_up = vec![0usize; n];
    let mut legs_down = vec![0usize; n];
    for (m, t) in s.members.iter().zip(&taut) {
        match t {
            Some((lo, hi, true)) => {
                up[*lo] += 1;
                down[*hi] += 1;
                if hangs[*lo] {
                    legs_up[*lo] += 1;
                    legs_down[*hi] += 1;
                }
            }
            Some((lo, hi, false)) => {
                level[*lo] += 1;
                level[*hi] += 1;
            }
            None if m.run.is_some() => {}
            None => {
                // a rod or slack line still makes a node a net joint or a spreader end
                let [a, b] = m.ends;
                let (pa, pb) = (pos(a), pos(b));
                let dy = pb[1] - pa[1];
                let l = ((pb[0] - pa[0]).powi(2) + dy * dy + (pb[2] - pa[2]).powi(2)).sqrt();
                if l > 0.0 && (dy / l).abs() <= LEVEL {
                    level[a] += 1;
                    level[b] += 1;
                }
            }
        }
    }
    taut.iter()
        .zip(&s.members)
        .map(|(t, m)| match *t {
            Some(_) if m.hitch.is_some() => true,
            Some((lo, hi, true)) if hangs[lo] => {
                let at_lower = legs_up[lo] >= 2 && down[lo] <= 1 && level[lo] == 0;
                let at_upper = legs_down[hi] >= 2 && up[hi] <= 1 && level[hi] == 0;
                at_lower || at_upper
            }
            _ => false,
        })
        .collect()
}

// --- rated parts: fittings on members and at nodes, anchor ratings ---

/// Warnings of the rated parts of a case: over, near, unchecked, side pull.
fn part_warnings(s: &Scenario, r: &CaseResult) -> Vec<Warning> {
    let mut w = Vec::new();
    let ids = r.part_ids();
    for (id, p) in ids.iter().zip(r.parts()) {
        let what = if p.kind == "anchor" { "rated anchor" } else { p.kind.as_str() };
        let what = what.replace('_', " ");
        let kind = match p.state {
            State::Near => WarningKind::PartNear,
            State::Unchecked => WarningKind::PartUnchecked,
            _ => WarningKind::PartOver,
        };
        let message = match p.state {
            State::Over => match &p.reason {
                Some(reason) => msg(format_args!("{what} {id}: OVER in case {}: {reason}", r.id)),
                None => msg(format_args!(
                    "{what} {id}: {} is over its WLL {} by {} (utilisation {})",
                    Kn(p.force_n.abs()),
                    Kn(p.wll_n),
                    Pct(p.utilisation - 1.0),
                    Sig(p.utilisation, 3)
                )),
            },
            State::Near => match &p.reason {
                // an anchor rated along and across: its interaction
                Some(reason) => msg(format_args!(
                    "{what} {id}: near its limit in case {}: {reason} (near-limit threshold {})",
                    r.id,
                    Pct(s.near_limit)
                )),
                None => msg(format_args!(
                    "{what} {id}: at {} of its WLL {} (near-limit threshold {})",
                    Pct(p.utilisation),
                    Kn(p.wll_n),
                    Pct(s.near_limit)
                )),
            },
            State::Unchecked => msg(format_args!(
                "{what} {id}: UNCHECKED in case {}: {}",
                r.id,
                p.reason.as_deref().unwrap_or("the inputs cannot support the check")
            )),
            _ => String::new(),
        };
        if !message.is_empty() {
            w.push(Warning { kind, subject: Some(id.clone()), message });
        }
    }
    // hoists without the maker's side-pull limit: the angle, and a request for it
    for (m, mr) in s.members.iter().zip(&r.members) {
        for (f, fr) in m.fittings.iter().zip(&mr.fittings) {
            if let (crate::model::FittingKind::Hoist { max_off_plumb: None }, Some(off)) = (&f.kind, fr.angle_deg)
                && off >= HORIZONTAL_DEG
                && fr.force_n > 0.0
            {
                w.push(Warning {
                    kind: WarningKind::HoistSidePull,
                    subject: Some(format!("{}/{}", m.id, f.name)),
                    message: msg(format_args!(
                        "hoist {}/{}: pulled {} deg off plumb in case {}; no side-pull limit entered: give the maker's limit as `max_off_plumb` (a hoist is made for a plumb pull; its maker states any side-pull allowance)",
                        m.id,
                        f.name,
                        Sig(off, 3),
                        r.id
                    )),
                });
            }
        }
    }
    w
}
