//! The whole analysis of a scenario: the static equilibrium, each dynamic
//! case as a quasi-static solve under its peak load, the limits, the
//! warnings, and the inspector's comparison table.

use super::evaluate::{Allowables, Evaluated, evaluate};
use super::formulas::{arrest_time_s, drop_factor, height_for_factor, swing_factor};
use super::limits::{LimitSearch, predict_start, search_limits};
use super::load_paths::load_path_results;
use super::results::{Analysis, ArcSummary, CaseResult, ComparisonRow, DynamicLoad, Limits, Warning};
use super::scope::scope;
use super::swing_arc::{Arc, ReleaseLimits, SwingSetup, arc_loads, release_limits, sweep};
use super::warning_kind::WarningKind;
use super::warnings::case_warnings;
use crate::CAUTION;
use crate::library::MemberKind;
use crate::model::{Case, NetworkLoads, Scenario, to_network};
use crate::solve::{Equilibrium, Network, SolveOptions, StaticSolver};
use crate::units::format_number;

/// Arrest shorter than this many wave transits: the spring picture does not
/// hold (practice: the member must reach a uniform strain many times over
/// during the arrest for a quasi-static spring to describe it).
pub const WAVE_TRANSITS_NEEDED: f64 = 10.0;

/// Limits of one mass: the critical factor and the path stiffness.
#[derive(Debug, Clone, Copy)]
struct MassLimits {
    factor: Option<f64>,
    stiffness_n_per_m: Option<f64>,
}

/// The drop-height limit of a mass (its release-angle limit comes from the
/// swing's own sweep over the arc, never from the vertical load factor).
fn limits_from(m: &MassLimits, weight_n: f64) -> Limits {
    Limits {
        release_deg: None,
        drop_height_m: match (m.factor, m.stiffness_n_per_m) {
            (Some(f), Some(k)) => Some(height_for_factor(weight_n, k, f).unwrap_or(0.0)),
            _ => None,
        },
    }
}

/// A case that could not be solved, with its reason: the message names
/// the case once (`case drop: …`), here and nowhere else.
fn failed_case(case: &Case, reason: String) -> CaseResult {
    let message = format!("case {}: {reason}", case.id());
    CaseResult {
        id: case.id().to_string(),
        kind: case.kind_name().to_string(),
        error: Some(message.clone()),
        warnings: vec![message.clone()],
        warning_items: vec![Warning { kind: WarningKind::CaseFailed, subject: None, message }],
        ..empty_case()
    }
}

/// A slot filled in later (the static case's place, before the base solve
/// is moved into it).
fn empty_case() -> CaseResult {
    CaseResult {
        id: String::new(),
        kind: String::new(),
        converged: false,
        iterations: 0,
        residual_n: 0.0,
        error: None,
        dynamic: None,
        arc: None,
        members: Vec::new(),
        floors: Vec::new(),
        nodes: Vec::new(),
        supports: Vec::new(),
        load_path: Vec::new(),
        combined_load_path: None,
        limits: Limits::default(),
        warnings: Vec::new(),
        warning_items: Vec::new(),
    }
}

struct Solved {
    result: CaseResult,
    eq: Equilibrium,
}

#[expect(
    clippy::too_many_arguments,
    reason = "the scenario, its network, allowables and solver travel together through one call"
)]
fn solve_case(
    s: &Scenario,
    net: &Network,
    a: &Allowables,
    solver: &mut StaticSolver,
    case: &Case,
    loads: &[[f64; 3]],
    start: Option<&[[f64; 3]]>,
    dynamic: Option<DynamicLoad>,
) -> Result<Solved, String> {
    let eq = solver.solve(loads, start, &SolveOptions::default()).map_err(|e| e.to_string())?;
    Ok(solved_case(s, net, a, case, loads, eq, dynamic))
}

/// The results of a case from its solved equilibrium.
fn solved_case(
    s: &Scenario,
    net: &Network,
    a: &Allowables,
    case: &Case,
    loads: &[[f64; 3]],
    eq: Equilibrium,
    dynamic: Option<DynamicLoad>,
) -> Solved {
    let ev = evaluate(s, net, a, loads, &eq);
    let (load_path, combined_load_path) = load_path_results(s, net, &eq, dynamic.as_ref());
    Solved {
        result: CaseResult {
            id: case.id().to_string(),
            kind: case.kind_name().to_string(),
            converged: true,
            iterations: eq.iterations,
            residual_n: eq.residual_n,
            error: None,
            dynamic,
            arc: None,
            members: ev.members,
            floors: ev.floors,
            nodes: ev.nodes,
            supports: ev.supports,
            load_path,
            combined_load_path,
            limits: Limits::default(),
            warnings: Vec::new(),
            warning_items: Vec::new(),
        },
        eq,
    }
}

/// Scenario-wide warnings: design factors below the kind's default.
fn input_warnings(s: &Scenario) -> Vec<Warning> {
    let mut w = Vec::new();
    let whole_kinds = kinds_without_weight(s);
    for m in &s.members {
        let df = &m.design_factor;
        if df.from_file && df.value < df.default.value - 1e-12 {
            w.push(Warning {
                kind: WarningKind::DesignFactorLow,
                subject: Some(m.id.clone()),
                message: format!(
                    "member {}: design factor {} is below the {} default of {} ({})",
                    m.id,
                    format_number(df.value, 3),
                    m.kind.label(),
                    format_number(df.default.value, 3),
                    df.default.source
                ),
            });
        }
        // said once in the assumptions where it holds for every member of the kind
        if m.linear_mass.value == 0.0 && !whole_kinds.contains(&m.kind) {
            w.push(Warning {
                kind: WarningKind::OwnWeightUnknown,
                subject: Some(m.id.clone()),
                message: format!("member {}: own weight not known and left out (give `linear_mass`)", m.id),
            });
        }
    }
    w
}

/// The member kinds none of whose members has a known own weight, in the
/// order they first occur (one pass over the members).
fn kinds_without_weight(s: &Scenario) -> Vec<MemberKind> {
    // (kind, every member of it without own weight so far)
    let mut kinds: Vec<(MemberKind, bool)> = Vec::new();
    for m in &s.members {
        let unknown = m.linear_mass.value == 0.0;
        match kinds.iter_mut().find(|k| k.0 == m.kind) {
            Some(k) => k.1 &= unknown,
            None => kinds.push((m.kind, unknown)),
        }
    }
    kinds.into_iter().filter(|k| k.1).map(|k| k.0).collect()
}

/// The assumption for each member kind none of whose members has a known
/// own weight (instead of a warning on every member).
fn own_weight_assumptions(s: &Scenario) -> Vec<String> {
    kinds_without_weight(s)
        .into_iter()
        .map(|k| {
            let n = s.members.iter().filter(|m| m.kind == k).count();
            format!(
                "Own weight of the {} member{} ({}) not known and left out: no construction, material or `linear_mass` given; give `linear_mass` to include it.",
                n,
                if n == 1 { "" } else { "s" },
                k.label()
            )
        })
        .collect()
}

/// The assumptions printed beside every result.
pub fn assumptions(s: &Scenario) -> Vec<String> {
    let mut v = vec![
        format!("Gravity {} m/s^2 acting along -y.", format_number(s.gravity_m_s2(), 6)),
        "Members are axial springs k = E A / L0; rope, chain and cable carry tension only, rods carry both; large-displacement equilibrium by damped Newton on the tangent stiffness.".to_string(),
        "Members' own weight is lumped half at each end node.".to_string(),
        "Floors: each foot rests on its panel (a plate of D = E t^3 / 12(1 - nu^2)) and the feet are coupled through it: w_i = sum_j C_ij P_j, C from the Navier series (simply supported, T&W section 28) or a Rayleigh-Ritz solution (clamped), normalised so a load at the panel centre gives T&W's tabulated alpha; each foot is compression-only (a foot the rig would lift carries nothing; the plate under it still deflects from the others).".to_string(),
        "Floor feet are held sideways; each foot's friction_required = |horizontal reaction| / normal force is checked against the floor's friction_limit (default 0.20: EN 1993-1-8 section 6.2.2(6), base plate on sand-cement mortar). Each foot is checked against rated_point (without it, unchecked); the feet's total against rated_uniform x panel area (necessary, not sufficient); the largest deflection over the panel (grid and refinement; series accuracy about 1e-4 simply supported, 1 % clamped) against span / limit.".to_string(),
        format!("Swing: at every angle theta of the arc the line pulls with T = m g (3 cos theta - 2 cos theta0) along its direction (rigid line, energy and centripetal balance; e.g. Meriam & Kraige, Dynamics, normal-tangential coordinates); the network is solved quasi-statically for theta from -theta0 to +theta0 in the swing's plane (azimuth about y from +x; 90 deg swings towards +z), on a grid of at most {} deg refined until each item's peak is found to 0.1 %; each item is reported at its own peak and the angle where it occurs. Releases above 90 deg are refused: the line goes slack and the mass falls, which is a drop.", format_number(super::swing_arc::GRID_STEP_DEG, 2)),
        "Drop: F = W (1 + sqrt(1 + 2 k h / W)) with k the static path stiffness at the mass (Timoshenko & Gere, impact); sudden load: factor 2. Member mass, damping and hysteresis ignored (fibre ropes peak lower).".to_string(),
        "Allowable = rated strength x efficiency / design factor, or a working load limit (given, or for grade 80 chain the EN 818-2 table's); rods in tension on yield x area; rods in compression on their buckling resistance chi A f_y / design factor (EN 1993-1-1 6.3.1, EN 1999-1-1 6.3.1, EN 1993-1-4 5.4.2; gamma_M1 = 1), buckling length K L with K = 1 (pinned both ends) unless given.".to_string(),
        "Wire rope whose termination is not stated: termination efficiency 0.80, the lowest of the common terminations (EN 13414-1 / practice, from memory). Textile slings (EN 1492-1/-2/-4): design factor 7.".to_string(),
        "Sling angle: measured from the horizontal (90 deg = plumb) in the solved geometry; the below-30-deg warning is given for sling legs only (taut members that take hung load up to a gathering point where legs meet: a ring, master link or hook), not for guys, level ties or net members.".to_string(),
        "Rated parts: each fitting on a member carries the member's force; a fitting at a joint carries the resultant of the members above the joint (the load hung from it), at a support the reaction; an anchor's rating is checked on the reaction's magnitude. A WLL given as a mass (\"1 t\") is its weight at standard gravity 9.80665 m/s^2 (ISO 80000-3). Eye bolts: the angle between the bolt's axis and the pull, shoulder eye bolts derated by the published table (next larger angle's row between rows), plain eye bolts in line (5 deg) only.".to_string(),
        "Limits: the largest drop height comes from a root search on the full network to 1e-7 on the load factor; the largest release angle (at most 90 deg) from a root search on the release angle, each step a full sweep of the arc, to 1e-6 rad; each item's own limit is interpolated between the solved load factors or release angles, or extrapolated linearly beyond them (an estimate for items far from their allowable).".to_string(),
        format!("Near limit from utilisation {}; dynamic/static ratio warning above {}.", format_number(s.near_limit, 3), format_number(s.dynamic_ratio_warning, 3)),
    ]
    .into_iter()
    .chain(s.floors.iter().filter(|f| !f.origin_given && !f.feet.is_empty()).map(|f| {
        format!(
            "Floor {}: no origin given, so the panel is centred under its feet's centroid, corner at (x, z) = ({} m, {} m); give `origin` for the panel's real place (feet near an edge carry more).",
            f.id,
            format_number(f.origin[0].value, 4),
            format_number(f.origin[1].value, 4)
        )
    }))
    .collect::<Vec<String>>();
    v.extend(own_weight_assumptions(s));
    v.push(format!(
        "Load path: each mass's weight is traced through the solved vertical member forces to the supports, split at every joint among the members holding it up in proportion to their vertical forces; a member's share is the fraction of the mass's weight it carries. Members and supports carrying at least {} % of a mass's weight are listed with their shares, the rest counted; the combined path traces all masses together.",
        format_number(super::load_paths::LOAD_PATH_THRESHOLD * 100.0, 3)
    ));
    let (multiplier, why) = s.duty.multiplier();
    v.push(if multiplier == 1.0 {
        "Duty: standard (nobody under the load, no persons lifted); give `duty: OverPeople` or `duty: LiftingPersons` for higher design factors.".to_string()
    } else {
        format!("Duty: {}: default design factors x {} and working load limits / {} ({why}).", s.duty.label(), format_number(multiplier, 3), format_number(multiplier, 3))
    });
    let hitched = s.members.iter().any(|m| m.hitch.is_some());
    v.push(format!(
        "Rules for sling mode factors: {}{}: a member's `hitch` multiplies its allowable by the mode factor (straight 1.0, choker 0.8, basket with parallel legs 2.0, basket 0-45 deg from vertical 1.4; EN 13414-1 / EN 1492-1 / EN 818-4, from memory){}; a basket modelled as one member is the whole basket's pull (both parts together).",
        s.rules.label(),
        if s.rules == crate::library::Rules::En { " (the default; give `rules: ASME` for the B30.9 choke-angle reduction)" } else { "" },
        if s.rules == crate::library::Rules::Asme { ", a choker's also by the ASME B30.9 choke-angle reduction (over 120 deg 1.00, 90-120 0.87, 60-89 0.74, 30-59 0.62; from memory; a choker needs its choke_angle)" } else { "" },
    ));
    if !hitched && let Some(last) = v.last_mut() {
        last.push_str(" No member in this scenario has a hitch.");
    }
    if s.members.iter().any(|m| m.bend.is_some()) {
        v.push(format!("Wire rope bent over a pin or sheave (bent_over D, nominal diameter d): efficiency from D/d on the curve {:?}, linear between points, 0.95 held above D/d 40, D/d below 1 refused ({}); it multiplies the termination efficiency (and a working load limit).", crate::library::BEND_CURVE, crate::library::BEND_SOURCE));
    }
    v
}

/// A previous answer to start from: the scenario it was for and its analysis.
#[derive(Debug, Clone, Copy)]
pub struct Prior<'a> {
    /// The scenario analysed before (same nodes, some moved or changed).
    pub scenario: &'a Scenario,
    /// Its analysis.
    pub analysis: &'a Analysis,
}

/// Start positions from a prior answer: each node's drawn position now plus
/// the displacement it had at the prior static equilibrium. `None` when the
/// nodes are not the same ones in the same order, the members not the same
/// ones joining the same nodes, or there is no converged static case to
/// start from. (After a member is added or removed the prior shape may be a
/// mechanism's, a joint on two legs swung below its feet, which the new rig
/// would keep as a second, inverted equilibrium instead of the drawn one.)
fn warm_start(s: &Scenario, prior: Option<Prior<'_>>) -> Option<Vec<[f64; 3]>> {
    let p = prior?;
    if p.scenario.nodes.len() != s.nodes.len() || p.scenario.nodes.iter().zip(&s.nodes).any(|(a, b)| a.id != b.id) {
        return None;
    }
    // node indices are the same (same ids in the same order), so ends compare as indices
    if p.scenario.members.len() != s.members.len()
        || p.scenario.members.iter().zip(&s.members).any(|(a, b)| a.id != b.id || a.ends != b.ends)
    {
        return None;
    }
    let st = p.analysis.cases.iter().find(|c| c.kind == "static" && c.converged && c.nodes.len() == s.nodes.len())?;
    Some(
        s.nodes
            .iter()
            .zip(&p.scenario.nodes)
            .zip(&st.nodes)
            .map(|((now, before), solved)| {
                [0, 1, 2].map(|ax| now.position[ax].value + (solved.position_m[ax] - before.position[ax].value))
            })
            .collect(),
    )
}

/// Analyse every case of a scenario.
pub fn analyse(s: &Scenario) -> Analysis {
    analyse_from(s, None)
}

/// As [`analyse`], with the static solve started from a prior answer's
/// displacements (the app re-solving while a node is dragged): the same
/// answer to the solver's tolerance in fewer Newton steps.
pub fn analyse_from(s: &Scenario, prior: Option<Prior<'_>>) -> Analysis {
    let (net, loads) = to_network(s);
    let allow = Allowables::of(s);
    let mut warnings = input_warnings(s);
    let mut solver = match StaticSolver::new(&net) {
        Ok(sv) => sv,
        Err(e) => {
            let cases = s.cases.iter().map(|c| failed_case(c, e.to_string())).collect();
            return Analysis {
                title: s.title.clone(),
                caution: CAUTION.to_string(),
                cases,
                comparison: Vec::new(),
                warnings,
                assumptions: assumptions(s),
                scope: scope(s),
            };
        }
    };
    let static_case = Case::Static { id: "static".to_string() };
    let start = warm_start(s, prior);
    let mut base = solve_case(s, &net, &allow, &mut solver, &static_case, &loads.total_n, start.as_deref(), None);
    if base.is_err() && start.is_some() {
        // a prior state that no longer fits (a member made much shorter, say): from the drawing
        base = solve_case(s, &net, &allow, &mut solver, &static_case, &loads.total_n, None, None);
    }
    let base = base.and_then(|b| match solver.instability(&b.eq) {
        Ok(Some(u)) => Err(format!(
            "the rig as drawn balances unstably{}: a strut or line standing upright on a pin, with the load exactly above, topples at the least push, so it is a mechanism and no force is reported; brace it or hang the load below its support",
            u.node.map(|n| format!(" at node {n}")).unwrap_or_default()
        )),
        _ => Ok(b),
    });
    let base = match base {
        Ok(b) => b,
        Err(e) => {
            let cases = s.cases.iter().map(|c| failed_case(c, e.clone())).collect();
            return Analysis {
                title: s.title.clone(),
                caution: CAUTION.to_string(),
                cases,
                comparison: Vec::new(),
                warnings,
                assumptions: assumptions(s),
                scope: scope(s),
            };
        }
    };

    // per mass with a dynamic case: path stiffness and critical factor
    let mut mass_limits: Vec<Option<MassLimits>> = vec![None; s.masses.len()];
    let mut searches: Vec<Option<LimitSearch>> = vec![None; s.masses.len()];
    for c in &s.cases {
        if let Case::Drop { mass: m, .. } | Case::Sudden { mass: m, .. } = c
            && mass_limits[*m].is_none()
        {
            let m = *m;
            let node = s.masses[m].node;
            let k =
                solver.effective_stiffness(&base.eq, node, [0.0, -1.0, 0.0]).ok().filter(|k| k.is_finite() && *k > 0.0);
            let search = search_limits(&mut solver, s, &allow, &loads, m, &base.eq);
            mass_limits[m] = Some(MassLimits { factor: search.critical, stiffness_n_per_m: k });
            searches[m] = Some(search);
        }
    }

    // the first static case takes the base solve itself (no copy of a
    // large rig's results); any further static case is a copy of it
    let static_at = s.cases.iter().position(|c| matches!(c, Case::Static { .. }));
    let mut results: Vec<CaseResult> = Vec::with_capacity(s.cases.len());
    let mut swing_limits: Vec<(usize, f64, f64, Option<ReleaseLimits>)> = Vec::new();
    let mut extra: Vec<Vec<Warning>> = vec![Vec::new(); s.cases.len()];
    for (i, c) in s.cases.iter().enumerate() {
        let r = if Some(i) == static_at {
            empty_case()
        } else if let Case::Swing { .. } = c {
            let (r, w) = run_swing(s, &net, &allow, &mut solver, &loads, c, &base, &mut swing_limits);
            extra[i] = w;
            r
        } else {
            run_case(s, &net, &allow, &mut solver, &loads, c, &base, &mass_limits, &searches)
        };
        results.push(r);
    }
    let fallback_static = match static_at {
        Some(i) => {
            let mut r = base.result;
            r.id = s.cases[i].id().to_string();
            results[i] = r;
            None
        }
        None => Some(base.result),
    };
    let items: Vec<Option<Vec<Warning>>> = {
        let static_result = static_at.map(|i| &results[i]).or(fallback_static.as_ref());
        s.cases
            .iter()
            .zip(&results)
            .zip(extra)
            .map(|((c, r), more)| {
                r.error.is_none().then(|| {
                    let mut items = case_warnings(s, c, r, static_result);
                    items.extend(dynamic_warnings(s, c, r, &mass_limits, &loads));
                    items.extend(more);
                    items
                })
            })
            .collect()
    };
    for (r, items) in results.iter_mut().zip(items) {
        if let Some(items) = items {
            r.warning_items = items;
            r.warnings = r.warning_groups().into_iter().map(|g| g.message).collect();
        }
    }
    let comparison = match static_at.map(|i| &results[i]).or(fallback_static.as_ref()) {
        Some(st) => comparison(s, &allow, &results, st, &searches, &mass_limits, &swing_limits),
        None => Vec::new(),
    };
    // a failed case's error already names it (`failed_case`)
    warnings.extend(results.iter().filter_map(|r| {
        r.error.as_ref().map(|e| Warning { kind: WarningKind::CaseFailed, subject: None, message: e.clone() })
    }));
    Analysis {
        title: s.title.clone(),
        caution: CAUTION.to_string(),
        cases: results,
        comparison,
        warnings,
        assumptions: assumptions(s),
        scope: scope(s),
    }
}

#[expect(
    clippy::too_many_arguments,
    reason = "the scenario, its network, allowables and solver travel together through one call"
)]
fn run_case(
    s: &Scenario,
    net: &Network,
    allow: &Allowables,
    solver: &mut StaticSolver,
    loads: &NetworkLoads,
    c: &Case,
    base: &Solved,
    mass_limits: &[Option<MassLimits>],
    searches: &[Option<LimitSearch>],
) -> CaseResult {
    let g = s.gravity_m_s2();
    let (factor, formula, k) = match c {
        Case::Static { .. } => {
            let mut r = base.result.clone();
            r.id = c.id().to_string();
            return r;
        }
        Case::Swing { .. } => {
            let mut cache = Vec::new();
            return run_swing(s, net, allow, solver, loads, c, base, &mut cache).0;
        }
        Case::Drop { mass, height, .. } => {
            let w = s.masses[*mass].mass.value * g;
            match mass_limits[*mass].and_then(|l| l.stiffness_n_per_m) {
                Some(k) => (
                    drop_factor(w, k, height.value),
                    format!(
                        "W (1 + sqrt(1 + 2 k h / W)), k = {} kN/m, h = {} m (Timoshenko & Gere, impact)",
                        format_number(k / 1e3, 4),
                        format_number(height.value, 4)
                    ),
                    Some(k),
                ),
                None => {
                    return failed_case(
                        c,
                        format!("the path stiffness at mass {} could not be found", s.masses[*mass].id),
                    );
                }
            }
        }
        Case::Sudden { mass, .. } => (
            2.0,
            "2 W, suddenly applied (drop height 0)".to_string(),
            mass_limits[*mass].and_then(|l| l.stiffness_n_per_m),
        ),
    };
    let Some(m) = c.mass() else { return base.result.clone() };
    let w = s.masses[m].mass.value * g;
    if !(factor.is_finite() && (factor * w).is_finite()) {
        // a drop beyond what double precision holds (`1e300 km`): no load,
        // no forces, a reason
        return failed_case(
            c,
            format!(
                "the load on mass {} overflows: {formula} is not a finite number; check the case's inputs for a slip of units or exponent",
                s.masses[m].id
            ),
        );
    }
    let l = loads.with_mass_factor(s, m, factor);
    let dynamic =
        DynamicLoad { mass: s.masses[m].id.clone(), factor, load_n: factor * w, formula, path_stiffness_n_per_m: k };
    // the limit search solved this mass at several factors already: the
    // case is one of them (the sudden case is its factor-2 solve) or starts
    // from the straight line through the two nearest
    let samples: Vec<(f64, &Equilibrium)> = searches[m]
        .as_ref()
        .map(|x| x.samples.iter().map(|(f, eq)| (*f, eq)).collect())
        .unwrap_or_else(|| vec![(1.0, &base.eq)]);
    let same = samples.iter().find(|(f, _)| (f - factor).abs() <= 1e-12 * factor.abs().max(1.0));
    let outcome = match same {
        Some((_, eq)) => Ok(solved_case(s, net, allow, c, &l, (*eq).clone(), Some(dynamic))),
        None => {
            let start = predict_start(&samples, factor);
            solve_case(s, net, allow, solver, c, &l, Some(&start), Some(dynamic))
        }
    };
    match outcome {
        Ok(mut solved) => {
            if let Some(ml) = &mass_limits[m] {
                solved.result.limits = limits_from(ml, w);
            }
            solved.result
        }
        Err(e) => failed_case(c, e),
    }
}

fn dynamic_warnings(
    s: &Scenario,
    c: &Case,
    r: &CaseResult,
    mass_limits: &[Option<MassLimits>],
    _loads: &NetworkLoads,
) -> Vec<Warning> {
    let mut w = Vec::new();
    let Some(m) = c.mass() else { return w };
    let g = s.gravity_m_s2();
    let mass_kg = s.masses[m].mass.value;
    let index: std::collections::HashMap<&str, usize> =
        s.members.iter().enumerate().map(|(i, x)| (x.id.as_str(), i)).collect();
    let path: Vec<usize> = r
        .load_path
        .iter()
        .filter(|p| p.mass == s.masses[m].id)
        .flat_map(|p| p.members.iter().filter_map(|id| index.get(id.as_str()).copied()))
        .collect();
    if let Case::Swing { .. } = c {
        {
            for &i in &path {
                let mr = &r.members[i];
                let strain = mr.stretch_m / (mr.length_m - mr.stretch_m).max(1e-12);
                if s.members[i].kind == MemberKind::FibreRope && strain > 0.01 {
                    w.push(Warning {
                        kind: WarningKind::SoftLine,
                        subject: Some(mr.id.clone()),
                        message: format!(
                            "member {}: soft line (stretch {} % at the swing peak); as a spring pendulum the peak can exceed the rigid-line value: run `tautspan simulate` on this case",
                            mr.id,
                            format_number(strain * 100.0, 3)
                        ),
                    });
                }
            }
        }
    }
    if let (Case::Drop { .. } | Case::Sudden { .. }, Some(k)) = (c, mass_limits[m].and_then(|l| l.stiffness_n_per_m)) {
        let h = if let Case::Drop { height, .. } = c { height.value } else { 0.0 };
        let t_arrest = arrest_time_s(mass_kg, k, h, g);
        for &i in &path {
            let mem = &s.members[i];
            if let Some(c_wave) = mem.wave_speed_m_s {
                let transit = r.members[i].length_m / c_wave;
                if t_arrest < WAVE_TRANSITS_NEEDED * transit {
                    w.push(Warning {
                        kind: WarningKind::WaveTransit,
                        subject: Some(mem.id.clone()),
                        message: format!(
                            "member {}: arrest in {} ms is under {} stress-wave transits ({} ms each at {} m/s); the spring picture no longer holds, expect higher local forces",
                            mem.id,
                            format_number(t_arrest * 1e3, 3),
                            WAVE_TRANSITS_NEEDED,
                            format_number(transit * 1e3, 3),
                            format_number(c_wave, 4)
                        ),
                    });
                }
            }
        }
    }
    w
}

fn comparison(
    s: &Scenario,
    allow: &Allowables,
    results: &[CaseResult],
    static_result: &CaseResult,
    searches: &[Option<LimitSearch>],
    mass_limits: &[Option<MassLimits>],
    swing_limits: &[(usize, f64, f64, Option<ReleaseLimits>)],
) -> Vec<ComparisonRow> {
    let g = s.gravity_m_s2();
    // per-item limits for the first swing and the first drop/sudden mass
    let drop_mass = s.cases.iter().find_map(|c| match c {
        Case::Drop { mass, .. } | Case::Sudden { mass, .. } => Some(*mass),
        _ => None,
    });
    let swing_items: Option<&Vec<Option<f64>>> = s.cases.iter().find_map(|c| match c {
        Case::Swing { mass, release, azimuth, .. } => swing_limits
            .iter()
            .find(|x| x.0 == *mass && x.1 == azimuth.value && x.2 == release.value)
            .and_then(|x| x.3.as_ref())
            .map(|l| &l.items_deg),
        _ => None,
    });
    let drop_items = drop_mass.and_then(|m| searches[m].as_ref()).map(|x| x.items.clone());

    let item_limits = |k: usize| {
        let mut limits = Limits::default();
        if let Some(items) = swing_items {
            limits.release_deg = items.get(k).copied().flatten();
        }
        if let (Some(m), Some(items)) = (drop_mass, &drop_items) {
            let w = s.masses[m].mass.value * g;
            let ml = MassLimits {
                factor: items.get(k).copied().flatten(),
                stiffness_n_per_m: mass_limits[m].and_then(|l| l.stiffness_n_per_m),
            };
            limits.drop_height_m = limits_from(&ml, w).drop_height_m;
        }
        limits
    };

    let n_members = s.members.len();
    let mut rows = Vec::new();
    for k in 0..n_members + s.floors.len() {
        let is_member = k < n_members;
        let fi = k.wrapping_sub(n_members);
        let id = if is_member { s.members[k].id.clone() } else { s.floors[fi].id.clone() };
        let force_of = |r: &CaseResult| -> Option<f64> {
            if is_member { r.members.get(k).map(|m| m.force_n) } else { r.floors.get(fi).map(|f| f.normal_force_n) }
        };
        let util_of = |r: &CaseResult| -> Option<f64> {
            if is_member { r.members.get(k).map(|m| m.utilisation) } else { r.floors.get(fi).map(|f| f.utilisation) }
        };
        let static_force = force_of(static_result);
        let force_n: Vec<Option<f64>> = results.iter().map(force_of).collect();
        let ratio_to_static = force_n
            .iter()
            .map(|f| match (f, static_force) {
                (Some(f), Some(s0)) if s0.abs() > 1e-9 => Some(f / s0),
                _ => None,
            })
            .collect();
        let utilisation: Vec<Option<f64>> = results.iter().map(util_of).collect();
        let governing_case = utilisation
            .iter()
            .enumerate()
            .filter_map(|(i, u)| u.map(|u| (i, u)))
            .max_by(|a, b| a.1.total_cmp(&b.1))
            .map(|(i, _)| results[i].id.clone());
        let limits = item_limits(k);
        // a member's allowable in its governing case: a strut's buckling allowable when that case compresses it
        let governing =
            utilisation.iter().enumerate().filter_map(|(i, u)| u.map(|u| (i, u))).max_by(|a, b| a.1.total_cmp(&b.1));
        let allowable_n = match governing.and_then(|(i, _)| results[i].members.get(k)) {
            Some(m) if is_member => m.allowable_n,
            _ if is_member => allow.member_n[k],
            _ => allow.floor_n[fi],
        };
        rows.push(ComparisonRow {
            id,
            static_force_n: static_force,
            force_n,
            ratio_to_static,
            allowable_n,
            utilisation,
            governing_case,
            limits,
        });
    }
    // rated parts after the floors, as in the limit search's items
    let parts_of: Vec<Vec<(f64, f64)>> =
        results.iter().map(|r| r.parts().map(|p| (p.force_n, p.utilisation)).collect()).collect();
    let static_parts: Vec<&super::results::FittingResult> = static_result.parts().collect();
    for (j, id) in static_result.part_ids().into_iter().enumerate() {
        let static_force = static_parts.get(j).map(|p| p.force_n);
        let force_n: Vec<Option<f64>> = parts_of.iter().map(|r| r.get(j).map(|p| p.0)).collect();
        let ratio_to_static = force_n
            .iter()
            .map(|f| match (f, static_force) {
                (Some(f), Some(s0)) if s0.abs() > 1e-9 => Some(f / s0),
                _ => None,
            })
            .collect();
        let utilisation: Vec<Option<f64>> = parts_of.iter().map(|r| r.get(j).map(|p| p.1)).collect();
        let governing_case = utilisation
            .iter()
            .enumerate()
            .filter_map(|(i, u)| u.map(|u| (i, u)))
            .max_by(|a, b| a.1.total_cmp(&b.1))
            .map(|(i, _)| results[i].id.clone());
        rows.push(ComparisonRow {
            id,
            static_force_n: static_force,
            force_n,
            ratio_to_static,
            allowable_n: static_parts.get(j).map_or(f64::NAN, |p| p.wll_n),
            utilisation,
            governing_case,
            limits: item_limits(n_members + s.floors.len() + j),
        });
    }
    rows
}

/// The shared evaluation of arc samples, each evaluated once.
struct ArcEvaluations<'a> {
    s: &'a Scenario,
    net: &'a Network,
    allow: &'a Allowables,
    loads: &'a NetworkLoads,
    setup: SwingSetup,
    arc: &'a Arc,
    done: Vec<Option<Evaluated>>,
}

impl ArcEvaluations<'_> {
    fn at(&mut self, j: usize) -> &Evaluated {
        let (s, net, allow, loads, setup, arc) = (self.s, self.net, self.allow, self.loads, self.setup, self.arc);
        self.done[j].get_or_insert_with(|| {
            let x = &arc.samples[j];
            let l = arc_loads(s, loads, setup.mass, setup.release_rad, setup.azimuth_rad, x.theta_rad);
            evaluate(s, net, allow, &l, &x.eq)
        })
    }
}

/// A swing case: the arc swept, every item at its own peak, the rig's shape
/// at the governing angle, and the release-angle limits from the same sweep.
#[expect(
    clippy::too_many_arguments,
    reason = "the scenario, its network, allowables and solver travel together through one call"
)]
fn run_swing(
    s: &Scenario,
    net: &Network,
    allow: &Allowables,
    solver: &mut StaticSolver,
    loads: &NetworkLoads,
    c: &Case,
    base: &Solved,
    limits_cache: &mut Vec<(usize, f64, f64, Option<ReleaseLimits>)>,
) -> (CaseResult, Vec<Warning>) {
    let Case::Swing { mass, release, azimuth, .. } = c else {
        return (failed_case(c, "not a swing".to_string()), Vec::new());
    };
    let setup = SwingSetup { mass: *mass, release_rad: release.value, azimuth_rad: azimuth.value };
    let arc = match sweep(solver, s, allow, loads, setup, &base.eq) {
        Ok(a) => a,
        Err(e) => return (failed_case(c, e.to_string()), Vec::new()),
    };
    let limits = match limits_cache.iter().find(|x| x.0 == *mass && x.1 == azimuth.value && x.2 == release.value) {
        Some(x) => x.3.clone(),
        None => {
            let l = release_limits(solver, s, allow, loads, setup, &base.eq, &arc).ok();
            limits_cache.push((*mass, azimuth.value, release.value, l.clone()));
            l
        }
    };
    let w = s.masses[*mass].mass.value * s.gravity_m_s2();
    let factor = swing_factor(release.value);
    let deg = |r: f64| r.to_degrees();
    let dynamic = DynamicLoad {
        mass: s.masses[*mass].id.clone(),
        factor,
        load_n: factor * w,
        formula: format!(
            "T = m g (3 cos theta - 2 cos theta0) along the line (rigid line), theta0 = {} deg, swept from -{} to +{} deg in the plane at azimuth {} deg over {} angles; {} x weight at the lowest point",
            format_number(deg(release.value), 4),
            format_number(deg(release.value), 4),
            format_number(deg(release.value), 4),
            format_number(deg(azimuth.value), 4),
            arc.samples.len(),
            format_number(factor, 4)
        ),
        path_stiffness_n_per_m: None,
    };
    let gov = arc.governing();
    let mut ev =
        ArcEvaluations { s, net, allow, loads, setup, arc: &arc, done: (0..arc.samples.len()).map(|_| None).collect() };
    let g = ev.at(gov);
    let mut r = CaseResult {
        id: c.id().to_string(),
        kind: c.kind_name().to_string(),
        converged: true,
        iterations: arc.samples.iter().map(|x| x.eq.iterations).sum(),
        residual_n: arc.samples.iter().map(|x| x.eq.residual_n).fold(0.0, f64::max),
        error: None,
        dynamic: Some(dynamic),
        arc: Some(ArcSummary {
            release_deg: deg(release.value),
            azimuth_deg: deg(azimuth.value),
            angles_deg: arc.samples.iter().map(|x| deg(x.theta_rad)).collect(),
            governing_deg: deg(arc.samples[gov].theta_rad),
        }),
        members: g.members.clone(),
        floors: g.floors.clone(),
        nodes: g.nodes.clone(),
        supports: g.supports.clone(),
        load_path: Vec::new(),
        combined_load_path: None,
        limits: Limits::default(),
        warnings: Vec::new(),
        warning_items: Vec::new(),
    };
    let n_members = s.members.len();
    for k in 0..n_members {
        let j = arc.peak_of(s, k);
        let mut m = ev.at(j).members[k].clone();
        m.peak_at_deg = Some(deg(arc.samples[j].theta_rad));
        r.members[k] = m;
    }
    for k in 0..s.floors.len() {
        let j = arc.peak_of(s, n_members + k);
        let mut f = ev.at(j).floors[k].clone();
        f.peak_at_deg = Some(deg(arc.samples[j].theta_rad));
        r.floors[k] = f;
    }
    for (i, sup) in r.supports.iter_mut().enumerate() {
        let node = s.nodes.iter().position(|n| n.id == sup.node);
        let Some(node) = node else { continue };
        let size = |x: &super::swing_arc::ArcSample| {
            let v = x.eq.reaction_n[node];
            (v[0] * v[0] + v[1] * v[1] + v[2] * v[2]).sqrt()
        };
        let mut j = 0;
        for (q, x) in arc.samples.iter().enumerate() {
            if size(x) > size(&arc.samples[j]) {
                j = q;
            }
        }
        let mut best = ev.at(j).supports[i].clone();
        best.peak_at_deg = Some(deg(arc.samples[j].theta_rad));
        *sup = best;
    }
    // rated parts, each at its own peak: the items after the floors, in the
    // order of `CaseResult::parts` (member fittings, node fittings; anchor
    // ratings went with their supports above)
    let mut item = n_members + s.floors.len();
    for k in 0..n_members {
        for q in 0..r.members[k].fittings.len() {
            let j = arc.peak_of(s, item);
            if let Some(f) = ev.at(j).members[k].fittings.get(q).cloned() {
                r.members[k].fittings[q] = f;
            }
            item += 1;
        }
    }
    for i in 0..r.nodes.len() {
        for q in 0..r.nodes[i].fittings.len() {
            let j = arc.peak_of(s, item);
            if let Some(f) = ev.at(j).nodes[i].fittings.get(q).cloned() {
                r.nodes[i].fittings[q] = f;
            }
            item += 1;
        }
    }
    let low = arc.lowest();
    (r.load_path, r.combined_load_path) = load_path_results(s, net, &arc.samples[low].eq, r.dynamic.as_ref());
    if let Some(l) = &limits {
        r.limits.release_deg = l.critical_deg;
    }
    (r, slack_over_arc(s, c, &arc))
}

/// Tension members meant to carry that go slack over part of the swing
/// (a leg that unloads and snatches again).
fn slack_over_arc(s: &Scenario, c: &Case, arc: &Arc) -> Vec<Warning> {
    let mut out = Vec::new();
    for (k, m) in s.members.iter().enumerate() {
        if m.may_go_slack || m.kind.carries() != crate::library::Carries::TensionOnly {
            continue;
        }
        let slack: Vec<f64> =
            arc.samples.iter().filter(|x| x.eq.member_force_n[k] <= 0.0).map(|x| x.theta_rad.to_degrees()).collect();
        let carries = arc.samples.iter().any(|x| x.eq.member_force_n[k] > 0.0);
        if carries && !slack.is_empty() {
            let lo = slack.iter().copied().fold(f64::INFINITY, f64::min);
            let hi = slack.iter().copied().fold(f64::NEG_INFINITY, f64::max);
            out.push(Warning {
                kind: WarningKind::SlackOverArc,
                subject: Some(m.id.clone()),
                message: format!(
                    "member {}: goes slack over part of the swing in case {} (at {} of {} angles solved, between {} and {} deg), where it was meant to carry; it snatches when it takes up again (set may_go_slack if that is intended)",
                    m.id,
                    c.id(),
                    slack.len(),
                    arc.samples.len(),
                    format_number(lo, 3),
                    format_number(hi, 3)
                ),
            });
        }
    }
    out
}
