//! Ropes over sheaves and the sheaves themselves, validated from the file.
//!
//! A rope is checked as a member (its kind, area, rating, design factor,
//! termination and fittings are read by the member builder, with error paths
//! under `ropes[i]`) and routed over the sheave nodes of its path. A wire
//! rope's strength is reduced by the D/d efficiency of its smallest sheave
//! (library/bend.rs); the bearings' friction sets the tension of each span
//! (library/sheave.rs).

use super::build::{Ctx, build_member};
use super::scenario::{Bend, Member, Node, RopeRun, Sheave};
use crate::file::{RopeDto, SheaveDto};
use crate::library::{
    BEND_SOURCE, Duty, MemberKind, RopeMotion, Rules, SHEAVE_SOURCE, bend_efficiency, segment_factors,
};
use crate::units::{Dimension, Sign, format_number};
use std::collections::HashMap;
use uom::si::f64::Length;
use uom::si::length::meter;

/// A node's sheave.
pub(super) fn build_sheave(ctx: &mut Ctx, i: usize, s: &SheaveDto) -> Option<Sheave> {
    let d = ctx.qty(&s.diameter, &format!("nodes[{i}].sheave.diameter"), Dimension::Length, Sign::Positive)?;
    Some(Sheave { diameter: Length::new::<meter>(d), bearing: s.bearing.unwrap_or_default() })
}

/// The file's ropes as members with their routes, in file order.
pub(super) fn build_ropes(
    ctx: &mut Ctx,
    ropes: &[RopeDto],
    nodes: &[Node],
    node_ids: &HashMap<String, usize>,
    duty: Duty,
    rules: Rules,
) -> Vec<Member> {
    ropes.iter().enumerate().filter_map(|(i, r)| build_rope(ctx, i, r, nodes, node_ids, duty, rules)).collect()
}

fn build_rope(
    ctx: &mut Ctx,
    i: usize,
    r: &RopeDto,
    nodes: &[Node],
    node_ids: &HashMap<String, usize>,
    duty: Duty,
    rules: Rules,
) -> Option<Member> {
    if !matches!(r.kind, MemberKind::WireRope | MemberKind::FibreRope | MemberKind::Cable) {
        ctx.err(
            format!("ropes[{i}].kind"),
            format!(
                "a rope over sheaves is wire rope, fibre rope or cable, not {}; a chain hoist is a member with a `Hoist` fitting",
                r.kind.label()
            ),
        );
        return None;
    }
    if r.path.len() < 3 {
        ctx.err(
            format!("ropes[{i}].path"),
            format!(
                "the path names {} node(s); a rope runs from one end over at least one sheave to the other, so give three or more (a straight line between two nodes is a member)",
                r.path.len()
            ),
        );
        return None;
    }
    let mut path = Vec::with_capacity(r.path.len());
    for (k, id) in r.path.iter().enumerate() {
        match node_ids.get(id) {
            Some(&n) => path.push(n),
            None => {
                ctx.err(format!("ropes[{i}].path[{k}]"), format!("rope path names node \"{id}\", which does not exist"))
            }
        }
    }
    if path.len() != r.path.len() {
        return None;
    }
    let mut ok = true;
    for k in 1..path.len() {
        let (a, b) = (&nodes[path[k - 1]], &nodes[path[k]]);
        let d = (0..3).map(|c| (b.position[c].value - a.position[c].value).powi(2)).sum::<f64>().sqrt();
        if path[k] == path[k - 1] || d < 1e-9 {
            ctx.err(
                format!("ropes[{i}].path[{k}]"),
                format!(
                    "\"{}\" and \"{}\" follow each other in the path but {}; a span joins two nodes apart",
                    a.id,
                    b.id,
                    if path[k] == path[k - 1] { "are the same node" } else { "coincide" }
                ),
            );
            ok = false;
        }
    }
    let via = path[1..path.len() - 1].to_vec();
    let mut bearing_k = Vec::with_capacity(via.len());
    for (k, &n) in via.iter().enumerate() {
        match &nodes[n].sheave {
            Some(s) => bearing_k.push(s.bearing.factor()),
            None => {
                ctx.err(
                    format!("ropes[{i}].path[{}]", k + 1),
                    format!(
                        "node \"{}\" has no sheave, and a rope runs only over sheaves between its ends; give the node `sheave: Sheave(diameter: \"...\", bearing: Roller)` or end the rope there",
                        nodes[n].id
                    ),
                );
                ok = false;
            }
        }
    }
    let mut member = build_member(ctx, "ropes", i, &r.as_member(), duty, rules)?;
    if !ok {
        return None;
    }
    member.ends = [path[0], path[path.len() - 1]];
    let drawn: f64 = path
        .windows(2)
        .map(|w| {
            (0..3).map(|c| (nodes[w[1]].position[c].value - nodes[w[0]].position[c].value).powi(2)).sum::<f64>().sqrt()
        })
        .sum();
    if let Some(q) = &r.length {
        let l = ctx.qty(q, &format!("ropes[{i}].length"), Dimension::Length, Sign::Positive)?;
        member.slack = Length::new::<meter>(l - drawn);
    }

    // D/d over the smallest sheave, for wire rope and cable
    if matches!(r.kind, MemberKind::WireRope | MemberKind::Cable) {
        let smallest = via
            .iter()
            .filter_map(|&n| nodes[n].sheave.map(|s| (n, s.diameter.value)))
            .min_by(|a, b| a.1.total_cmp(&b.1));
        if let Some((n, pin)) = smallest {
            let Some(d) = member.diameter.map(|d| d.value) else {
                ctx.err(
                    format!("ropes[{i}].diameter"),
                    format!(
                        "a wire rope over sheaves needs its nominal diameter d for the D/d efficiency over the smallest sheave (node \"{}\", D {} mm): give `diameter`",
                        nodes[n].id,
                        format_number(pin * 1e3, 4)
                    ),
                );
                return None;
            };
            let ratio = pin / d;
            match bend_efficiency(ratio) {
                Ok(e) => {
                    let note = format!(
                        "over the sheave at {} D {} mm, D/d {} -> {} ({BEND_SOURCE})",
                        nodes[n].id,
                        format_number(pin * 1e3, 4),
                        format_number(ratio, 3),
                        format_number(e, 3)
                    );
                    member.efficiency *= e;
                    member.efficiency_note = if member.efficiency_note == "none applied" {
                        note.clone()
                    } else {
                        format!("{} x {note}", member.efficiency_note)
                    };
                    member.bend = Some(Bend { pin: Length::new::<meter>(pin), ratio, efficiency: e, note });
                }
                Err(why) => {
                    ctx.err(format!("nodes[{n}].sheave.diameter"), format!("for rope \"{}\": {why}", r.id));
                    return None;
                }
            }
        }
    }

    let motion = r.motion.unwrap_or_default();
    let segment_factors = segment_factors(&bearing_k, motion);
    let frictionless = bearing_k.iter().all(|&k| k == 1.0);
    let note = if frictionless {
        format!("one continuous rope over {} sheave(s), all frictionless: the same tension in every span", via.len())
    } else {
        format!(
            "one continuous rope over {} sheave(s); each bearing's friction raises the tension by its factor K per sheave towards the hauled end ({SHEAVE_SOURCE}); friction taken {}{}; the force shown is the largest span's",
            via.len(),
            motion.label(),
            if motion == RopeMotion::Hoisting { "" } else { " (the dead end pulls hardest)" }
        )
    };
    member.run = Some(RopeRun { via, segment_factors, motion, note });
    Some(member)
}
