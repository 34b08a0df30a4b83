//! Checking rated parts in one solved equilibrium: fittings in series on a
//! member against the member's force, fittings at a node against the
//! resultant of the members above it, and an anchor's rating against the
//! reaction. Eye bolts are derated by the angle between their axis and the
//! pull (library table, its source named); a hoist pulled further off plumb
//! than its maker's limit is over.
//!
//! The node rule: a part at a joint (a master link, a ring) carries the load
//! hung from it, which is the vector sum of the pulls of the members whose
//! other end is above the joint (for a two-leg bridle, the hung weight);
//! level members and members below are what it carries, not what carries
//! it. At a support the part carries the reaction.

use super::results::{FittingResult, State};
use crate::library::{Carries, EYE_BOLT_SOURCE, PLAIN_EYE_BOLT, SHOULDER_EYE_BOLT, eye_bolt_fraction};
use crate::model::{Fitting, FittingKind, Scenario, Support};
use crate::solve::Equilibrium;
use crate::units::format_number;

/// Below this vertical component of its unit vector a member counts as
/// level at a node (neither above nor below it): 1e-6 rad, far below any
/// drawing's precision.
const LEVEL_TOLERANCE: f64 = 1e-6;

pub(super) fn state_of(utilisation: f64, near: f64) -> State {
    if utilisation > 1.0 + 1e-9 {
        State::Over
    } else if utilisation >= near {
        State::Near
    } else {
        State::Ok
    }
}

fn kn(v: f64) -> String {
    format!("{} kN", format_number(v / 1e3, 4))
}

fn unit(a: [f64; 3], b: [f64; 3]) -> Option<[f64; 3]> {
    let d = [b[0] - a[0], b[1] - a[1], b[2] - a[2]];
    let l = (d[0] * d[0] + d[1] * d[1] + d[2] * d[2]).sqrt();
    (l > 0.0).then(|| d.map(|c| c / l))
}

fn result(f: &Fitting, force_n: f64, near: f64) -> FittingResult {
    let utilisation = force_n.abs() / f.wll.value;
    FittingResult {
        kind: f.kind.word().to_string(),
        name: f.name.clone(),
        wll_n: f.wll.value,
        rated_wll_n: f.wll.value,
        force_n,
        utilisation,
        state: state_of(utilisation, near),
        angle_deg: None,
        source: format!("WLL {}", f.wll_note),
        reason: None,
    }
}

/// Derate an eye bolt's result by the angle (degrees, 0–90) between its axis and the pull.
fn derate_eye_bolt(r: &mut FittingResult, shoulder: bool, angle_deg: f64, near: f64) {
    r.angle_deg = Some(angle_deg);
    let table = if shoulder { SHOULDER_EYE_BOLT } else { PLAIN_EYE_BOLT };
    match eye_bolt_fraction(table, angle_deg) {
        Some(fr) => {
            r.wll_n = r.rated_wll_n * fr;
            r.utilisation = r.force_n.abs() / r.wll_n;
            r.state = state_of(r.utilisation, near);
            r.source = format!(
                "{}; {} eye bolt pulled {} deg from its axis: {} % of the in-line WLL ({})",
                r.source,
                if shoulder { "shoulder" } else { "plain" },
                format_number(angle_deg, 3),
                format_number(fr * 100.0, 3),
                EYE_BOLT_SOURCE
            );
        }
        None => {
            r.wll_n = 0.0;
            r.utilisation = f64::INFINITY;
            r.state = State::Over;
            r.reason = Some(format!(
                "plain (shoulderless) eye bolt pulled {} deg from its axis: rated for in-line pull only (ASME B30.26); use a shoulder eye bolt or a swivel hoist ring, or align the bolt with the pull",
                format_number(angle_deg, 3)
            ));
        }
    }
}

/// Angle between a bolt's axis and a line, degrees (0–90; the sense of either does not count).
fn line_angle_deg(axis: [f64; 3], u: [f64; 3]) -> f64 {
    let c = (axis[0] * u[0] + axis[1] * u[1] + axis[2] * u[2]).abs().clamp(0.0, 1.0);
    c.acos().to_degrees()
}

/// The fittings in series with member `i` under its solved force.
pub fn member_fittings(s: &Scenario, i: usize, eq: &Equilibrium) -> Vec<FittingResult> {
    let m = &s.members[i];
    if m.fittings.is_empty() {
        return Vec::new();
    }
    let force = eq.member_force_n[i];
    // a rope over sheaves: its first span, where the dead end's parts sit
    let [a, b] = m.first_span();
    let u = unit(eq.positions_m[a], eq.positions_m[b]).unwrap_or([0.0, 1.0, 0.0]);
    m.fittings
        .iter()
        .map(|f| {
            let mut r = result(f, force, s.near_limit);
            match &f.kind {
                FittingKind::EyeBolt { axis, shoulder } => {
                    derate_eye_bolt(&mut r, *shoulder, line_angle_deg(*axis, u), s.near_limit)
                }
                FittingKind::Hoist { max_off_plumb } => {
                    let off = line_angle_deg([0.0, 1.0, 0.0], u);
                    r.angle_deg = Some(off);
                    if let Some(max) = max_off_plumb
                        && off > max.value.to_degrees() + 1e-9
                    {
                        r.state = State::Over;
                        r.reason = Some(format!(
                            "hoist pulled {} deg off plumb, beyond the maker's side-pull limit of {} deg",
                            format_number(off, 3),
                            format_number(max.value.to_degrees(), 3)
                        ));
                    }
                }
                _ => {}
            }
            if m.kind.carries() == Carries::TensionOnly && force <= 0.0 {
                // the member is slack and the part carries nothing
                r.state = State::Slack;
                r.utilisation = 0.0;
            } else if force < 0.0 && r.state != State::Over {
                r.state = State::Unchecked;
                r.reason = Some(format!(
                    "member {} is in compression ({}): a {} is rated in tension; its use in compression cannot be checked",
                    m.id,
                    kn(-force),
                    f.kind.word().replace('_', " ")
                ));
            }
            r
        })
        .collect()
}

/// The force a part at node `n` carries: the reaction at a support, else the
/// resultant of the pulls of the members whose other end is above it.
/// `None` at a joint with no member above.
pub fn node_load_n(s: &Scenario, n: usize, eq: &Equilibrium) -> Option<[f64; 3]> {
    if s.nodes[n].support != Support::Joint {
        return Some(eq.reaction_n[n]);
    }
    let p = eq.positions_m[n];
    let mut sum = [0.0; 3];
    let mut any = false;
    for (i, m) in s.members.iter().enumerate() {
        // a rope's spans at a sheave count one by one, each with its own tension
        let spans = if m.run.is_some() {
            m.segments()
        } else if m.ends.contains(&n) {
            vec![(m.ends[0], m.ends[1], 1.0)]
        } else {
            continue;
        };
        for (a, b, w) in spans {
            let other = match (a, b) {
                (a, b) if a == n => b,
                (a, b) if b == n => a,
                _ => continue,
            };
            let Some(u) = unit(p, eq.positions_m[other]) else { continue };
            if u[1] > LEVEL_TOLERANCE {
                any = true;
                for k in 0..3 {
                    sum[k] += eq.member_force_n[i] * w * u[k];
                }
            }
        }
    }
    any.then_some(sum)
}

/// The fittings at node `n`.
pub fn node_fittings(s: &Scenario, n: usize, eq: &Equilibrium) -> Vec<FittingResult> {
    let node = &s.nodes[n];
    if node.fittings.is_empty() {
        return Vec::new();
    }
    let load = node_load_n(s, n, eq);
    node.fittings
        .iter()
        .map(|f| {
            let Some(v) = load else {
                let mut r = result(f, 0.0, s.near_limit);
                r.state = State::Unchecked;
                r.utilisation = 0.0;
                r.reason = Some(format!(
                    "no member rises from node {} and it is not a support, so the load on the {} is not defined; put the part on the member it is in",
                    node.id, f.name
                ));
                return r;
            };
            let mag = (v[0] * v[0] + v[1] * v[1] + v[2] * v[2]).sqrt();
            let mut r = result(f, mag, s.near_limit);
            r.source = format!(
                "{}; carries {} at node {}",
                r.source,
                if node.support == Support::Joint {
                    "the resultant of the members above it"
                } else {
                    "the support reaction"
                },
                node.id
            );
            if let FittingKind::EyeBolt { axis, shoulder } = &f.kind
                && mag > 0.0
            {
                let angle = line_angle_deg(*axis, v.map(|c| c / mag));
                derate_eye_bolt(&mut r, *shoulder, angle, s.near_limit);
            }
            r
        })
        .collect()
}

/// An across component below this share of the pull (0.006 deg) counts as
/// in line: what the solve's roundoff and the elastic turning of stiff
/// members leave of a pull drawn in line, not an allowance of any rating
/// (a maker's side rating is `rated_across`).
const ACROSS_ROUNDOFF: f64 = 1e-4;

/// An anchor's rating checked on its reaction: on the magnitude where it
/// holds in any direction; where it holds in a direction, the pull's
/// component along it against the rating and the component across it
/// against `rated_across` by the linear interaction
/// `along / rated + across / rated_across` (common practice for combined
/// loads on a rated point, conservative against any convex interaction);
/// an across pull without a side rating, or a pull against the rated
/// sense, is `unchecked`.
pub fn anchor_rating(s: &Scenario, n: usize, eq: &Equilibrium) -> Option<FittingResult> {
    let node = &s.nodes[n];
    let f = node.rated.as_ref()?;
    let v = eq.reaction_n[n];
    let mag = (v[0] * v[0] + v[1] * v[1] + v[2] * v[2]).sqrt();
    let mut r = result(f, mag, s.near_limit);
    r.kind = "anchor".to_string();
    let Some(d) = node.rated_direction else {
        r.source = format!("rated load {}; checked on the magnitude of the reaction, in any direction", f.wll_note);
        return Some(r);
    };
    // the rig's pull on the anchor is minus the reaction
    let pull = v.map(|c| -c);
    let along = pull[0] * d[0] + pull[1] * d[1] + pull[2] * d[2];
    let across_v = [pull[0] - along * d[0], pull[1] - along * d[1], pull[2] - along * d[2]];
    let across = (across_v[0] * across_v[0] + across_v[1] * across_v[1] + across_v[2] * across_v[2]).sqrt();
    let angle = if mag > 0.0 { across.atan2(along).to_degrees() } else { 0.0 };
    r.angle_deg = Some(angle);
    let dir = format!("({}, {}, {})", format_number(d[0], 3), format_number(d[1], 3), format_number(d[2], 3));
    let tiny = ACROSS_ROUNDOFF * mag;
    if along < -tiny {
        r.state = State::Unchecked;
        r.utilisation = 0.0;
        r.reason = Some(format!(
            "anchor {} is pulled against its rated direction {dir} ({} the other way); its rating does not cover that",
            node.id,
            kn(-along)
        ));
        return Some(r);
    }
    let u_along = along.max(0.0) / f.wll.value;
    match &node.rated_across {
        Some(side) => {
            r.utilisation = u_along + across / side.wll.value;
            r.state = state_of(r.utilisation, s.near_limit);
            // the warnings say the interaction, not a share of one WLL
            let sum = format!(
                "along {} / rated {} + across {} / rated across {} = {} (linear interaction)",
                kn(along.max(0.0)),
                kn(f.wll.value),
                kn(across),
                kn(side.wll.value),
                format_number(r.utilisation, 3)
            );
            match r.state {
                State::Over => {
                    r.reason = Some(format!("{sum}, over by {} %", format_number((r.utilisation - 1.0) * 100.0, 3)));
                }
                State::Near => r.reason = Some(sum),
                _ => {}
            }
            r.source = format!(
                "rated load {} along {dir}, {} across it ({}); along {} / rated + across {} / rated across (linear interaction, common practice, conservative)",
                f.wll_note,
                kn(side.wll.value),
                side.wll_note,
                kn(along.max(0.0)),
                kn(across)
            );
        }
        None if across > tiny => {
            r.utilisation = u_along;
            r.state = State::Unchecked;
            r.reason = Some(format!(
                "anchor {} is pulled {} deg off its rated direction {dir} ({} across it) and has no rating across it: give `rated_across` (the maker's side rating)",
                node.id,
                format_number(angle, 3),
                kn(across)
            ));
        }
        None => {
            r.utilisation = u_along;
            r.state = state_of(u_along, s.near_limit);
            r.source = format!("rated load {} along {dir}; the pull is in line with it", f.wll_note);
        }
    }
    Some(r)
}

/// Utilisation of every rated part, in the order of
/// [`CaseResult::parts`](super::results::CaseResult::parts), for the limit search.
pub fn part_utilisations(s: &Scenario, eq: &Equilibrium) -> Vec<f64> {
    let mut u: Vec<f64> = (0..s.members.len()).flat_map(|i| member_fittings(s, i, eq)).map(|r| r.utilisation).collect();
    u.extend((0..s.nodes.len()).flat_map(|n| node_fittings(s, n, eq)).map(|r| r.utilisation));
    u.extend(
        (0..s.nodes.len())
            .filter(|&n| s.nodes[n].support != Support::Joint)
            .filter_map(|n| anchor_rating(s, n, eq))
            .map(|r| r.utilisation),
    );
    u
}
