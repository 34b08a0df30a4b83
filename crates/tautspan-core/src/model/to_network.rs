//! From the validated model to the solver's network: positions in metres,
//! spring laws by member kind, floor springs, node loads from the masses and
//! the members' own weight (half of each member at each end), lumped masses
//! for the time-domain integrator.

use super::scenario::{Scenario, Support};
use crate::library::Carries;
use crate::solve::{AxialLaw, Fixity, NetMember, NetNode, NetPlate, Network};

/// The loads of a scenario split so a dynamic case can scale one mass.
#[derive(Debug, Clone, PartialEq)]
pub struct NetworkLoads {
    /// Loads at each node from everything (masses and own weight), N.
    pub total_n: Vec<[f64; 3]>,
    /// Weight of each scenario mass, N (positive number; acts along −y).
    pub mass_weight_n: Vec<f64>,
}

impl NetworkLoads {
    /// Node loads with mass `mass` carrying `factor` times its weight
    /// (the rest unchanged).
    pub fn with_mass_factor(&self, scenario: &Scenario, mass: usize, factor: f64) -> Vec<[f64; 3]> {
        let mut loads = self.total_n.clone();
        let node = scenario.masses[mass].node;
        loads[node][1] -= (factor - 1.0) * self.mass_weight_n[mass];
        loads
    }
}

/// Build the network of a scenario with its static loads.
pub fn to_network(s: &Scenario) -> (Network, NetworkLoads) {
    let g = s.gravity_m_s2();
    let mut nodes: Vec<NetNode> = s
        .nodes
        .iter()
        .enumerate()
        .map(|(i, n)| NetNode {
            name: n.id.clone(),
            position_m: s.position_m(i),
            fixity: match n.support {
                Support::Joint => Fixity::Free,
                Support::Anchor => Fixity::Fixed,
                Support::Floor(f) => Fixity::Floor { stiffness_n_per_m: s.floors[f].foot_stiffness_n_per_m(i) },
            },
            load_n: [0.0; 3],
            mass_kg: 0.0,
        })
        .collect();
    let mut mass_weight_n = Vec::with_capacity(s.masses.len());
    for m in &s.masses {
        let w = m.mass.value * g;
        nodes[m.node].load_n[1] -= w;
        nodes[m.node].mass_kg += m.mass.value;
        mass_weight_n.push(w);
    }
    let members = s
        .members
        .iter()
        .enumerate()
        .map(|(i, m)| {
            let rest = s.rest_length_m(i);
            let own_kg = m.linear_mass.value * rest;
            if m.run.is_none() {
                for &e in &m.ends {
                    nodes[e].load_n[1] -= 0.5 * own_kg * g;
                    nodes[e].mass_kg += 0.5 * own_kg;
                }
            }
            // a rope: half of each span's share (by drawn length) at each of its ends
            let drawn = if m.run.is_some() { s.drawn_length_m(i) } else { 0.0 };
            for (a, b, _) in if m.run.is_some() { m.segments() } else { Vec::new() } {
                let (pa, pb) = (s.position_m(a), s.position_m(b));
                let span = ((pb[0] - pa[0]).powi(2) + (pb[1] - pa[1]).powi(2) + (pb[2] - pa[2]).powi(2)).sqrt();
                let share = if drawn > 0.0 { span / drawn } else { 1.0 };
                for e in [a, b] {
                    nodes[e].load_n[1] -= 0.5 * share * own_kg * g;
                    nodes[e].mass_kg += 0.5 * share * own_kg;
                }
            }
            NetMember {
                name: m.id.clone(),
                ends: m.ends,
                axial_stiffness_n: m.axial_stiffness.value,
                rest_length_m: rest,
                law: match m.kind.carries() {
                    Carries::TensionAndCompression => AxialLaw::TensionAndCompression,
                    _ => AxialLaw::TensionOnly,
                },
                via: m.run.as_ref().map(|r| r.via.clone()).unwrap_or_default(),
                segment_factors: m.run.as_ref().map(|r| r.segment_factors.clone()).unwrap_or_default(),
            }
        })
        .collect();
    let total_n = nodes.iter().map(|n| n.load_n).collect();
    // a panel of one foot is that foot's own spring; two or more are coupled
    let plates = s
        .floors
        .iter()
        .filter(|f| f.feet.len() > 1)
        .filter_map(|f| {
            Some(NetPlate {
                name: f.id.clone(),
                nodes: f.feet.clone(),
                flexibility_m_per_n: f.plate.as_ref()?.flexibility_m_per_n().to_vec(),
            })
        })
        .collect();
    (Network { nodes, members, plates }, NetworkLoads { total_n, mass_weight_n })
}
