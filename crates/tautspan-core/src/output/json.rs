//! `check --format json`: one object per file, field names as in the
//! command-line contract (DESIGN.md). Non-finite numbers (an allowable of a
//! floor without ratings) are written as `null`, never as NaN.

use crate::analysis::{Analysis, CaseResult, FittingResult};
use serde_json::{Map, Value, json};

fn num(v: f64) -> Value {
    if v.is_finite() { json!(v) } else { Value::Null }
}

/// A rated part: the contract's `kind`, `wll_n`, `force_n`, `utilisation`,
/// `state`, and the name, in-line rating, governing angle, source and reason.
fn part_json(f: &FittingResult) -> Value {
    json!({ "kind": f.kind, "name": f.name, "wll_n": num(f.wll_n), "rated_wll_n": num(f.rated_wll_n),
            "force_n": num(f.force_n), "utilisation": num(f.utilisation), "state": f.state.as_str(),
            "angle_deg": f.angle_deg.map(num), "source": f.source, "reason": f.reason })
}

fn case_json(c: &CaseResult) -> Value {
    let mut o = Map::new();
    o.insert("id".into(), json!(c.id));
    o.insert("kind".into(), json!(c.kind));
    o.insert("converged".into(), json!(c.converged));
    o.insert("iterations".into(), json!(c.iterations));
    o.insert("residual_n".into(), num(c.residual_n));
    if let Some(e) = &c.error {
        o.insert("error".into(), json!(e));
    }
    if let Some(d) = &c.dynamic {
        let mut dj = json!({ "mass": d.mass, "factor": num(d.factor), "load_n": num(d.load_n), "formula": d.formula });
        if let Some(k) = d.path_stiffness_n_per_m {
            dj["path_stiffness_n_per_m"] = num(k);
        }
        o.insert("dynamic".into(), dj);
    }
    if let Some(a) = &c.arc {
        o.insert(
            "arc".into(),
            json!({ "release_deg": num(a.release_deg), "azimuth_deg": num(a.azimuth_deg),
                    "governing_deg": num(a.governing_deg), "angles_deg": a.angles_deg.iter().map(|x| num(*x)).collect::<Vec<_>>() }),
        );
    }
    o.insert(
        "members".into(),
        c.members
            .iter()
            .map(|m| {
                let mut o = json!({ "id": m.id, "force_n": num(m.force_n), "allowable_n": num(m.allowable_n),
                        "utilisation": num(m.utilisation), "state": m.state.as_str(), "stretch_m": num(m.stretch_m),
                        "length_m": num(m.length_m), "sling_angle_deg": num(m.sling_angle_deg),
                        "sag_m": num(m.sag_m), "wave_transit_s": m.wave_transit_s.map(num), "reason": m.reason,
                        "peak_at_deg": m.peak_at_deg.map(num),
                        "mode_factor": m.mode_factor.map(num), "bend_efficiency": m.bend_efficiency.map(num),
                        "euler_n": m.euler_n.map(num), "buckling_resistance_n": m.buckling_resistance_n.map(num),
                        "fittings": m.fittings.iter().map(part_json).collect::<Vec<_>>() });
                if !m.segments.is_empty() {
                    o["segments"] = m
                        .segments
                        .iter()
                        .map(|g| json!({ "from": g.from, "to": g.to, "force_n": num(g.force_n), "length_m": num(g.length_m) }))
                        .collect();
                }
                o
            })
            .collect(),
    );
    o.insert(
        "floors".into(),
        c.floors
            .iter()
            .map(|f| {
                let feet: Vec<Value> = f
                    .feet
                    .iter()
                    .map(|x| {
                        json!({ "node": x.node, "normal_force_n": num(x.normal_force_n), "horizontal_n": num(x.horizontal_n),
                                "friction_required": x.friction_required.map(num),
                                "bearing_pressure_pa": x.bearing_pressure_pa.map(num),
                                "utilisation": x.utilisation.map(num), "state": x.state.as_str(), "reason": x.reason })
                    })
                    .collect();
                json!({ "id": f.id, "normal_force_n": num(f.normal_force_n), "deflection_m": num(f.deflection_m),
                        "allowable_n": num(f.allowable_n), "utilisation": num(f.utilisation), "state": f.state.as_str(), "reason": f.reason,
                        "deflection_at_m": f.deflection_at_m.map(num), "total_allowable_n": f.total_allowable_n.map(num),
                        "friction_limit": num(f.friction_limit), "feet": feet, "peak_at_deg": f.peak_at_deg.map(num) })
            })
            .collect(),
    );
    o.insert(
        "nodes".into(),
        c.nodes
            .iter()
            .map(|n| {
                let mut o = json!({ "id": n.id, "position_m": n.position_m.map(num) });
                if !n.fittings.is_empty() {
                    o["fittings"] = n.fittings.iter().map(part_json).collect();
                }
                o
            })
            .collect(),
    );
    o.insert(
        "supports".into(),
        c.supports
            .iter()
            .map(|s| {
                let r = s.rated.as_ref();
                json!({ "node": s.node, "reaction_n": s.reaction_n.map(num),
                        "rated_n": r.map(|r| num(r.wll_n)), "utilisation": r.map(|r| num(r.utilisation)),
                        "state": r.map(|r| r.state.as_str()), "peak_at_deg": s.peak_at_deg.map(num) })
            })
            .collect(),
    );
    o.insert(
        "load_path".into(),
        c.load_path.iter().map(|p| json!({ "mass": p.mass, "members": p.members, "supports": p.supports })).collect(),
    );
    let mut limits = Map::new();
    if let Some(r) = c.limits.release_deg {
        limits.insert("release_deg".into(), num(r));
    }
    if let Some(h) = c.limits.drop_height_m {
        limits.insert("drop_height_m".into(), num(h));
    }
    o.insert("limits".into(), Value::Object(limits));
    o.insert("warnings".into(), json!(c.warnings));
    Value::Object(o)
}

/// The contract's JSON object for one file's analysis.
pub fn check_json(file: &str, a: &Analysis) -> Value {
    let comparison: Vec<Value> = a
        .comparison
        .iter()
        .map(|r| {
            json!({ "id": r.id, "static_force_n": r.static_force_n.map(num), "force_n": r.force_n.iter().map(|f| f.map(num)).collect::<Vec<_>>(),
                    "ratio_to_static": r.ratio_to_static.iter().map(|f| f.map(num)).collect::<Vec<_>>(),
                    "allowable_n": num(r.allowable_n), "utilisation": r.utilisation.iter().map(|f| f.map(num)).collect::<Vec<_>>(),
                    "governing_case": r.governing_case,
                    "limits": { "release_deg": r.limits.release_deg.map(num), "drop_height_m": r.limits.drop_height_m.map(num) } })
        })
        .collect();
    json!({
        "file": file,
        "title": a.title,
        "caution": a.caution,
        "verdict": a.verdict().as_str(),
        "scope": { "checked": a.scope.checked, "not_checked": a.scope.not_checked },
        "cases": a.cases.iter().map(case_json).collect::<Vec<_>>(),
        "comparison": comparison,
        "warnings": a.warnings.iter().map(|w| w.message.clone()).collect::<Vec<_>>(),
        "assumptions": a.assumptions,
    })
}
