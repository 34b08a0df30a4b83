//! Validating rated parts: each fitting's working load limit (a force, or a
//! mass read as its weight at standard gravity), an eye bolt's axis, a
//! hoist's side-pull limit, and an anchor's rated load. Problems name their
//! field path (`members[2].fittings[0].wll`).

use super::build::Ctx;
use super::fitting::{Fitting, FittingKind};
use super::scenario::Support;
use crate::file::{Direction, FittingDto, Qty};
use crate::units::{Dimension, Sign, format_number, parse_rated_load};
use uom::si::angle::radian;
use uom::si::f64::{Angle, Force};
use uom::si::force::newton;

/// Where a fitting list is: on a member or at a node.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub(super) enum Host {
    /// In series with a member.
    Member,
    /// At a node.
    Node,
}

fn rated_load(ctx: &mut Ctx, q: &Qty, path: &str) -> Option<(Force, String)> {
    match parse_rated_load(&q.0, Sign::Positive) {
        Ok((n, mass)) => {
            if let Some(why) = super::plausible::implausible_magnitude(n, &q.0) {
                ctx.err(path, why);
                return None;
            }
            let note = if mass {
                format!(
                    "{} given as a mass: its weight at standard gravity 9.80665 m/s^2 (ISO 80000-3) = {} kN",
                    q.0.trim(),
                    format_number(n / 1e3, 5)
                )
            } else {
                format!("{} given", q.0.trim())
            };
            Some((Force::new::<newton>(n), note))
        }
        Err(e) => {
            ctx.err(path, format!("{e}; a rated load is a force (\"10 kN\") or a mass as on the tag (\"1 t\")"));
            None
        }
    }
}

fn unit_axis(ctx: &mut Ctx, d: Direction, path: &str) -> Option<[f64; 3]> {
    let v = [d.0, d.1, d.2];
    let len = (v[0] * v[0] + v[1] * v[1] + v[2] * v[2]).sqrt();
    if !len.is_finite() || len < 1e-12 {
        ctx.err(
            path,
            "an eye bolt's axis is a direction (x, y, z) that is not zero, e.g. (0, 1, 0) for a vertical bolt",
        );
        return None;
    }
    Some(v.map(|c| c / len))
}

/// The fittings of one member or node, validated; `section`/`index` locate
/// the host (`members`, 3).
pub(super) fn build_fittings(
    ctx: &mut Ctx,
    section: &str,
    index: usize,
    host: Host,
    list: &[FittingDto],
) -> Vec<Fitting> {
    let mut out: Vec<Fitting> = Vec::with_capacity(list.len());
    for (k, f) in list.iter().enumerate() {
        let at = format!("{section}[{index}].fittings[{k}]");
        let (kind, wll, name) = match f {
            FittingDto::Shackle { wll, name } => (Some(FittingKind::Shackle), wll, name.clone()),
            FittingDto::Hook { wll, name } => (Some(FittingKind::Hook), wll, name.clone()),
            FittingDto::MasterLink { wll, name } => (Some(FittingKind::MasterLink), wll, name.clone()),
            FittingDto::EyeBolt { wll, axis, shoulder, name } => (
                unit_axis(ctx, *axis, &format!("{at}.axis"))
                    .map(|axis| FittingKind::EyeBolt { axis, shoulder: *shoulder }),
                wll,
                name.clone(),
            ),
            FittingDto::Hoist { wll, max_off_plumb, name } => {
                if host == Host::Node {
                    ctx.err(
                        &at,
                        "a hoist is part of a member (the line it hangs in); move it to that member's `fittings`",
                    );
                }
                let limit = match max_off_plumb {
                    Some(q) => {
                        match ctx.qty(q, format!("{at}.max_off_plumb").as_str(), Dimension::Angle, Sign::NonNegative) {
                            Some(v) if v < std::f64::consts::FRAC_PI_2 => Some(Some(Angle::new::<radian>(v))),
                            Some(_) => {
                                ctx.err(format!("{at}.max_off_plumb"), "a side-pull limit is an angle below 90 deg");
                                None
                            }
                            None => None,
                        }
                    }
                    None => Some(None),
                };
                (limit.map(|max_off_plumb| FittingKind::Hoist { max_off_plumb }), wll, name.clone())
            }
            FittingDto::Fitting { name, wll } => {
                if name.trim().is_empty() {
                    ctx.err(format!("{at}.name"), "a fitting needs a name saying what it is, e.g. \"beam clamp\"");
                }
                (Some(FittingKind::Other), wll, Some(name.clone()))
            }
        };
        let rated = rated_load(ctx, wll, &format!("{at}.wll"));
        let (Some(kind), Some((wll, wll_note))) = (kind, rated) else { continue };
        let base = name.unwrap_or_else(|| kind.word().replace('_', " "));
        let same = out.iter().filter(|o| o.name == base || o.name.starts_with(&format!("{base}-"))).count();
        let name = if same == 0 { base } else { format!("{base}-{}", same + 1) };
        out.push(Fitting { kind, name, wll, wll_note });
    }
    out
}

/// An anchor's rated load, validated: only an anchor takes one.
pub(super) fn build_rated(ctx: &mut Ctx, index: usize, rated: &Option<Qty>, support: Support) -> Option<Fitting> {
    let q = rated.as_ref()?;
    let path = format!("nodes[{index}].rated");
    if support != Support::Anchor {
        ctx.err(&path, "`rated` is an anchor's rated load; this node is not an anchor (set `support: Anchor`)");
        return None;
    }
    let (wll, wll_note) = rated_load(ctx, q, &path)?;
    Some(Fitting { kind: FittingKind::Other, name: "anchor".to_string(), wll, wll_note })
}

/// An anchor's rated direction and side rating, validated: both need
/// `rated`, and a side rating needs the direction it is across.
pub(super) fn build_rated_direction(
    ctx: &mut Ctx,
    index: usize,
    node: &crate::file::NodeDto,
) -> (Option<[f64; 3]>, Option<Fitting>) {
    let dir_path = format!("nodes[{index}].rated_direction");
    let direction = node.rated_direction.and_then(|(x, y, z)| {
        let l = (x * x + y * y + z * z).sqrt();
        if node.rated.is_none() {
            ctx.err(&dir_path, "`rated_direction` says in which direction `rated` holds; give `rated` too");
            None
        } else if !(l.is_finite() && l > 0.0) {
            ctx.err(&dir_path, "the rated direction must be a finite, non-zero vector (x, y, z), e.g. (0, -1, 0) for a pull straight down");
            None
        } else {
            Some([x / l, y / l, z / l])
        }
    });
    let across = node.rated_across.as_ref().and_then(|q| {
        let path = format!("nodes[{index}].rated_across");
        if node.rated_direction.is_none() {
            ctx.err(&path, "`rated_across` is the rating across `rated_direction`; give the direction it is across");
            return None;
        }
        let (wll, wll_note) = rated_load(ctx, q, &path)?;
        Some(Fitting { kind: FittingKind::Other, name: "anchor side rating".to_string(), wll, wll_note })
    });
    (direction, across)
}
