//! Turning one solved equilibrium into member, floor, node, support and
//! load-path results against the allowables, with the state of each.

use super::allowable::{floor_allowable, member_allowable_n};
use super::fittings::{anchor_rating, member_fittings, node_fittings, part_utilisations};
use super::floor_check::floor_results;
use super::results::{FloorResult, MemberResult, NodeResult, SegmentResult, State, SupportResult};
use super::strut::{Compression, compression};
use crate::library::Carries;
use crate::model::{Scenario, Support};
use crate::solve::{Equilibrium, Network};

/// The allowables of a scenario, computed once.
#[derive(Debug, Clone)]
pub struct Allowables {
    /// Per member, N: the tension allowable (and a rod's yield allowable).
    pub member_n: Vec<f64>,
    /// Per member: how it is checked in compression (a rod's buckling).
    pub member_compression: Vec<Compression>,
    /// Per floor, N.
    pub floor_n: Vec<f64>,
    /// Per floor, deflection limit, m.
    pub floor_deflection_m: Vec<f64>,
}

impl Allowables {
    /// Compute every allowable of a scenario (the numbers; their
    /// derivations in words come from [`member_allowable`](super::allowable::member_allowable)
    /// and [`floor_allowable`] where they are shown).
    pub fn of(s: &Scenario) -> Allowables {
        let member_n = s.members.iter().map(member_allowable_n).collect();
        let member_compression = (0..s.members.len()).map(|i| compression(s, i)).collect();
        let mut floor_n = Vec::new();
        let mut floor_deflection_m = Vec::new();
        for f in &s.floors {
            let (a, d) = floor_allowable(f);
            floor_n.push(a.force_n);
            floor_deflection_m.push(d);
        }
        Allowables { member_n, member_compression, floor_n, floor_deflection_m }
    }
}

impl Allowables {
    /// The allowable of member `i` under axial force `force_n` (tension
    /// positive): in compression a strut's buckling allowable; `None` when
    /// its compression cannot be checked.
    pub fn member_for(&self, i: usize, force_n: f64) -> Option<f64> {
        match (&self.member_compression[i], force_n < 0.0) {
            (Compression::Buckling { allowable_n, .. }, true) => Some(*allowable_n),
            (Compression::Unchecked(_), true) => None,
            _ => Some(self.member_n[i]),
        }
    }

    /// The allowable of member `i` for the limit searches: as
    /// [`member_for`](Self::member_for), and a strut whose buckling is
    /// unchecked at its yield allowable (an upper bound: N_b ≤ A f_y; such a
    /// strut is `unchecked` in every case it is in compression).
    pub fn member_for_limits(&self, i: usize, force_n: f64) -> f64 {
        self.member_for(i, force_n).unwrap_or(self.member_n[i])
    }
}

use super::fittings::state_of;

/// Utilisation of each member then each floor.
pub fn utilisations(s: &Scenario, a: &Allowables, eq: &Equilibrium) -> Vec<f64> {
    let mut u: Vec<f64> =
        eq.member_force_n.iter().enumerate().map(|(i, f)| f.abs() / a.member_for_limits(i, *f)).collect();
    u.extend(floor_results(s, a, eq, 0.0).iter().map(|f| f.utilisation));
    // rated parts after the floors, in the order of `CaseResult::parts`
    u.extend(part_utilisations(s, eq));
    u
}

/// Everything per item of one equilibrium.
pub struct Evaluated {
    /// Members.
    pub members: Vec<MemberResult>,
    /// Floors.
    pub floors: Vec<FloorResult>,
    /// Nodes.
    pub nodes: Vec<NodeResult>,
    /// Supports.
    pub supports: Vec<SupportResult>,
}

/// Evaluate an equilibrium of scenario `s` under `loads`.
pub fn evaluate(s: &Scenario, net: &Network, a: &Allowables, loads: &[[f64; 3]], eq: &Equilibrium) -> Evaluated {
    let members = s
        .members
        .iter()
        .enumerate()
        .map(|(i, m)| {
            let force = eq.member_force_n[i];
            let length = eq.member_length_m[i];
            // a rope over sheaves: the angle of its first span (from the dead end)
            let [a0, b0] = m.first_span();
            let [pa, pb] = [eq.positions_m[a0], eq.positions_m[b0]];
            let span0 = ((pb[0] - pa[0]).powi(2) + (pb[1] - pa[1]).powi(2) + (pb[2] - pa[2]).powi(2)).sqrt();
            let dy = (pb[1] - pa[1]).abs();
            let angle = if span0 > 0.0 { (dy / span0).clamp(0.0, 1.0).asin().to_degrees() } else { 0.0 };
            // per span: (its sling angle, its result)
            let spans: Vec<(f64, SegmentResult)> = match &m.run {
                None => Vec::new(),
                Some(_) => m
                    .segments()
                    .iter()
                    .map(|&(a, b, w)| {
                        let (pa, pb) = (eq.positions_m[a], eq.positions_m[b]);
                        let l = ((pb[0] - pa[0]).powi(2) + (pb[1] - pa[1]).powi(2) + (pb[2] - pa[2]).powi(2)).sqrt();
                        let ang = if l > 0.0 { ((pb[1] - pa[1]).abs() / l).clamp(0.0, 1.0).asin().to_degrees() } else { 0.0 };
                        let r = SegmentResult {
                            from: s.nodes[a].id.clone(),
                            to: s.nodes[b].id.clone(),
                            force_n: force * w,
                            length_m: l,
                        };
                        (ang, r)
                    })
                    .collect(),
            };
            let allowable = a.member_for(i, force);
            let allowable_n = allowable.unwrap_or(a.member_n[i]);
            let utilisation = force.abs() / allowable_n;
            let slack = m.kind.carries() == Carries::TensionOnly && force <= 0.0;
            let reason = match (&a.member_compression[i], allowable) {
                (Compression::Unchecked(why), None) => Some(format!(
                    "{} {} in compression {} kN: {why}; allowable and utilisation shown are on yield only, an upper bound",
                    m.kind.label(),
                    m.id,
                    crate::units::format_number(-force / 1e3, 4)
                )),
                _ => None,
            };
            // d = w⊥ L² / (8 T), w⊥ = μ g cos α (Irvine, Cable Structures, parabolic sag)
            let sag_of = |len: f64, angle_deg: f64, t: f64| {
                let w_across = m.linear_mass.value * s.gravity_m_s2() * angle_deg.to_radians().cos();
                if t > 0.0 && w_across > 0.0 { w_across * len * len / (8.0 * t) } else { 0.0 }
            };
            // a rope over sheaves: the largest of its spans' sags
            let sag_m = if spans.is_empty() {
                sag_of(length, angle, force)
            } else {
                spans.iter().map(|(ang, g)| sag_of(g.length_m, *ang, g.force_n)).fold(0.0, f64::max)
            };
            let segments: Vec<SegmentResult> = spans.into_iter().map(|(_, g)| g).collect();
            // a plumb member has none; cos 90° is not exactly 0 in floating point
            let sag_m = if sag_m < 1e-9 { 0.0 } else { sag_m };
            MemberResult {
                id: m.id.clone(),
                force_n: force,
                allowable_n,
                utilisation,
                state: if slack {
                    State::Slack
                } else if reason.is_some() {
                    State::Unchecked
                } else {
                    state_of(utilisation, s.near_limit)
                },
                stretch_m: length - net.members[i].rest_length_m,
                length_m: length,
                sling_angle_deg: angle,
                sag_m,
                wave_transit_s: m.wave_speed_m_s.map(|c| length / c),
                reason,
                mode_factor: m.hitch.as_ref().map(|h| h.factor),
                bend_efficiency: m.bend.as_ref().map(|b| b.efficiency),
                euler_n: a.member_compression[i].euler_n(),
                buckling_resistance_n: a.member_compression[i].resistance_n(),
                peak_at_deg: None,
                fittings: member_fittings(s, i, eq),
                segments,
            }
        })
        .collect();
    let load_scale_n: f64 = loads.iter().flatten().map(|v| v.abs()).sum();
    let floors = floor_results(s, a, eq, load_scale_n);
    let nodes = s
        .nodes
        .iter()
        .enumerate()
        .map(|(i, n)| NodeResult { id: n.id.clone(), position_m: eq.positions_m[i], fittings: node_fittings(s, i, eq) })
        .collect();
    let supports = s
        .nodes
        .iter()
        .enumerate()
        .filter(|(_, n)| n.support != Support::Joint)
        .map(|(i, n)| SupportResult {
            node: n.id.clone(),
            reaction_n: eq.reaction_n[i],
            rated: anchor_rating(s, i, eq),
            peak_at_deg: None,
        })
        .collect();
    Evaluated { members, floors, nodes, supports }
}
