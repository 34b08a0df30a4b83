//! `tautspan simulate`: one case in the time domain; histories as CSV or a
//! JSON summary; progress on stderr; Ctrl+C stops and keeps what was run.

use crate::read::read_scenario;
use crate::{EXIT_INPUT, SimulateFormat};
use serde_json::json;
use std::io::Write;
use std::path::Path;
use std::process::ExitCode;
use std::sync::Arc;
use std::sync::atomic::{AtomicBool, Ordering};
use tautspan_core::CAUTION;
use tautspan_core::analysis::{SimulateRequest, analyse, simulate_case};
use tautspan_core::output::csv_field;
use tautspan_core::units::{Dimension, Sign, parse_quantity};

/// Run the command.
pub fn run(
    file: &Path,
    case: &str,
    duration: &str,
    step: Option<&str>,
    damping: f64,
    format: SimulateFormat,
) -> ExitCode {
    let loaded = match read_scenario(file) {
        Ok(l) => l,
        Err(e) => {
            eprintln!("{e}");
            return ExitCode::from(EXIT_INPUT);
        }
    };
    let duration_s = match parse_quantity(duration, Dimension::Time, Sign::Positive) {
        Ok(v) => v,
        Err(e) => {
            eprintln!("--duration: {e}");
            return ExitCode::from(EXIT_INPUT);
        }
    };
    let time_step_s = match step.map(|s| parse_quantity(s, Dimension::Time, Sign::Positive)).transpose() {
        Ok(v) => v,
        Err(e) => {
            eprintln!("--step: {e}");
            return ExitCode::from(EXIT_INPUT);
        }
    };
    if !(damping.is_finite() && damping >= 0.0) {
        eprintln!("--damping: {damping} must be a finite number ≥ 0 (1/s)");
        return ExitCode::from(EXIT_INPUT);
    }
    let stop = Arc::new(AtomicBool::new(false));
    let flag = Arc::clone(&stop);
    // a second handler cannot be installed in one process; ignore that case
    let _ = ctrlc::set_handler(move || flag.store(true, Ordering::SeqCst));
    let mut last = -1i64;
    let mut progress = |f: f64| {
        let pct = (f * 100.0).floor() as i64;
        if pct / 5 != last / 5 {
            last = pct;
            eprint!("\rsimulating {case}: {pct:3} %");
            let _ = std::io::stderr().flush();
        }
        !stop.load(Ordering::SeqCst)
    };
    let req = SimulateRequest { duration_s, time_step_s, damping_per_s: damping };
    let sim = match simulate_case(&loaded.scenario, case, &req, &mut progress) {
        Ok(s) => s,
        Err(e) => {
            eprintln!("\n{}: {e}", file.display());
            return ExitCode::from(if e.contains("is not in the scenario") { EXIT_INPUT } else { 1 });
        }
    };
    eprintln!(
        "{}",
        if sim.run.cancelled {
            "\rinterrupted: output holds the run so far"
        } else {
            "\rsimulated                      "
        }
    );
    let run = &sim.run;
    let scope = tautspan_core::analysis::scope(&loaded.scenario);
    match format {
        SimulateFormat::Csv => {
            let mut out = String::new();
            out.push_str(&format!("# {CAUTION}\n"));
            out.push_str("# a time history of one case, not a verdict: `tautspan check` checks the allowables\n");
            for c in &scope.not_checked {
                out.push_str(&format!("# not checked: {c}\n"));
            }
            let mut header = vec!["time_s".to_string()];
            header.extend(sim.member_ids.iter().map(|m| csv_field(&format!("{m}_force_n"))));
            for n in &sim.node_ids {
                for ax in ["x", "y", "z"] {
                    header.push(csv_field(&format!("{n}_{ax}_m")));
                }
            }
            header.push("energy_j".into());
            out.push_str(&header.join(","));
            out.push('\n');
            for (i, t) in run.time_s.iter().enumerate() {
                let mut row = vec![format!("{t}")];
                row.extend(run.member_force_n[i].iter().map(|f| format!("{f}")));
                for p in &run.positions_m[i] {
                    row.extend(p.iter().map(|c| format!("{c}")));
                }
                row.push(format!("{}", run.energy_j[i]));
                out.push_str(&row.join(","));
                out.push('\n');
            }
            print!("{out}");
        }
        SimulateFormat::Json => {
            // the quasi-static answer of the same case, for comparison
            let mut one = loaded.scenario.clone();
            if let Some(i) = one.case_index(case) {
                one.cases = vec![one.cases[i].clone()];
            }
            let qs = analyse(&one);
            let qs_case = qs.cases.first();
            let mut notes = Vec::new();
            let members: Vec<serde_json::Value> = sim
                .member_ids
                .iter()
                .enumerate()
                .map(|(i, id)| {
                    let q = qs_case.and_then(|c| c.members.get(i)).map(|m| m.force_n);
                    if let Some(q) = q
                        && q > 0.0
                        && run.peak_member_force_n[i] > 1.01 * q
                    {
                        notes.push(format!(
                            "member {id}: simulated peak {:.0} N exceeds the quasi-static {:.0} N by {:.1} % (stretch makes a spring pendulum, or a stiff path rings)",
                            run.peak_member_force_n[i],
                            q,
                            (run.peak_member_force_n[i] / q - 1.0) * 100.0
                        ));
                    }
                    json!({ "id": id, "peak_force_n": run.peak_member_force_n[i], "peak_time_s": run.peak_time_s[i], "quasi_static_force_n": q })
                })
                .collect();
            let v = json!({
                "file": file.display().to_string(),
                "case": sim.case_id,
                "caution": CAUTION,
                "scope": { "checked": ["the time history of one case: member forces, positions and energy; not a verdict (run `tautspan check`)"],
                           "not_checked": scope.not_checked },
                "duration_s": run.time_s.last().copied().unwrap_or(0.0),
                "time_step_s": run.time_step_s,
                "steps": run.steps,
                "cancelled": run.cancelled,
                "members": members,
                "period_s": sim.period_s,
                "energy_drift": run.energy_drift,
                "notes": notes,
            });
            match serde_json::to_string_pretty(&v) {
                Ok(s) => println!("{s}"),
                Err(e) => {
                    eprintln!("cannot write JSON: {e}");
                    return ExitCode::from(EXIT_INPUT);
                }
            }
        }
    }
    ExitCode::SUCCESS
}
