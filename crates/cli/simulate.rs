//! `tautspan simulate`: one case in the time domain; the history streamed
//! as CSV a step at a time, or a JSON summary that keeps only the peaks;
//! progress on stderr; Ctrl+C stops, prints what was run and exits 130.

use crate::read::read_scenario;
use crate::{EXIT_INPUT, SimulateFormat};
use serde_json::json;
use std::io::{BufWriter, Write};
use std::path::Path;
use std::process::ExitCode;
use std::sync::Arc;
use std::sync::atomic::{AtomicBool, Ordering};
use tautspan_core::CAUTION;
use tautspan_core::analysis::{PlanError, Sample, SimulateRequest, analyse, check_step_cap, plan_simulation};
use tautspan_core::output::csv_field;
use tautspan_core::units::{Dimension, Sign, parse_quantity};

/// Exit code of a run stopped by Ctrl+C (128 + SIGINT, as shells report it).
pub const EXIT_CANCELLED: u8 = 130;

/// A time given on the command line, in seconds, or the message refusing it.
fn seconds(flag: &str, text: &str) -> Result<f64, String> {
    match parse_quantity(text, Dimension::Time, Sign::Any) {
        Ok(v) if v > 0.0 && v.is_finite() => Ok(v),
        Ok(v) => Err(format!("{flag} \"{text}\": must be positive, a time such as \"1 ms\" (got {v} s)")),
        Err(e) => Err(format!("{flag} \"{text}\": {e}")),
    }
}

/// Run the command.
pub fn run(
    file: &Path,
    case: &str,
    duration: &str,
    step: Option<&str>,
    damping: f64,
    format: SimulateFormat,
) -> ExitCode {
    let input = |msg: String| {
        eprintln!("{msg}");
        ExitCode::from(EXIT_INPUT)
    };
    let duration_s = match seconds("--duration", duration) {
        Ok(v) => v,
        Err(e) => return input(e),
    };
    let time_step_s = match step.map(|s| seconds("--step", s)).transpose() {
        Ok(v) => v,
        Err(e) => return input(e),
    };
    // a run over the step cap is refused before the file is even read
    if let Some(dt) = time_step_s
        && let Err(e) = check_step_cap(duration_s, dt)
    {
        return input(format!("--step: {e}"));
    }
    if !(damping.is_finite() && damping >= 0.0) {
        return input(format!("--damping: {damping} must be a finite number ≥ 0 (1/s)"));
    }
    let loaded = match read_scenario(file) {
        Ok(l) => l,
        Err(e) => {
            crate::read::print_errors(&e);
            return ExitCode::from(EXIT_INPUT);
        }
    };
    let req = SimulateRequest { duration_s, time_step_s, damping_per_s: damping };
    let plan = match plan_simulation(&loaded.scenario, case, &req) {
        Ok(p) => p,
        Err(PlanError::Input(e)) => return input(format!("{}: {e}", file.display())),
        Err(e @ PlanError::Rig(_)) => {
            eprintln!("{}: {e}", file.display());
            return ExitCode::from(1);
        }
    };
    for w in &plan.warnings {
        eprintln!("warning: {w}");
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
    let scope = tautspan_core::analysis::scope(&loaded.scenario);
    let stdout = std::io::stdout();
    let mut out = BufWriter::with_capacity(1 << 16, stdout.lock());
    let mut write_error: Option<std::io::Error> = None;
    let summary = match format {
        SimulateFormat::Csv => {
            let mut head = format!(
                "# {CAUTION}\n# a time history of one case, not a verdict: `tautspan check` checks the allowables\n"
            );
            for c in &scope.not_checked {
                head.push_str(&format!("# not checked: {c}\n"));
            }
            for w in &plan.warnings {
                head.push_str(&format!("# warning: {w}\n"));
            }
            let mut header = vec!["time_s".to_string()];
            header.extend(plan.member_ids.iter().map(|m| csv_field(&format!("{m}_force_n"))));
            for n in &plan.node_ids {
                for ax in ["x", "y", "z"] {
                    header.push(csv_field(&format!("{n}_{ax}_m")));
                }
            }
            header.push("energy_j".into());
            head.push_str(&header.join(","));
            head.push('\n');
            if let Err(e) = out.write_all(head.as_bytes()) {
                write_error = Some(e);
            }
            let mut row = String::new();
            let mut sink = |s: &Sample<'_>| {
                if write_error.is_some() {
                    return false;
                }
                row.clear();
                row.push_str(&format!("{}", s.time_s));
                for f in s.member_force_n {
                    row.push_str(&format!(",{f}"));
                }
                for p in s.positions_m {
                    row.push_str(&format!(",{},{},{}", p[0], p[1], p[2]));
                }
                row.push_str(&format!(",{}\n", s.energy_j));
                match out.write_all(row.as_bytes()) {
                    Ok(()) => true,
                    Err(e) => {
                        write_error = Some(e);
                        false
                    }
                }
            };
            plan.run(&mut sink, &mut progress)
        }
        SimulateFormat::Json => plan.run(&mut |_| true, &mut progress),
    };
    let sim = match summary {
        Ok(s) => s,
        Err(e) => {
            let _ = out.flush();
            eprintln!("\n{}: {e}", file.display());
            return ExitCode::from(1);
        }
    };
    eprintln!(
        "{}",
        if sim.cancelled {
            "\rinterrupted: the output holds the run so far"
        } else {
            "\rsimulated                      "
        }
    );
    if let SimulateFormat::Json = format {
        // the quasi-static answer of the same case, for comparison
        let mut one = loaded.scenario.clone();
        if let Some(i) = one.case_index(case) {
            one.cases = vec![one.cases[i].clone()];
        }
        let qs = analyse(&one);
        let qs_case = qs.cases.first();
        let mut notes = Vec::new();
        let members: Vec<serde_json::Value> = plan
            .member_ids
            .iter()
            .enumerate()
            .map(|(i, id)| {
                let q = qs_case.and_then(|c| c.members.get(i)).map(|m| m.force_n);
                let peak = sim.peak_member_force_n[i];
                if let Some(q) = q
                    && q > 0.0
                    && peak > 1.01 * q
                {
                    notes.push(format!(
                        "member {id}: simulated peak {peak:.0} N exceeds the quasi-static {q:.0} N by {:.1} % (stretch makes a spring pendulum, or a stiff path rings)",
                        (peak / q - 1.0) * 100.0
                    ));
                }
                json!({ "id": id, "peak_force_n": peak, "peak_time_s": sim.peak_time_s[i], "quasi_static_force_n": q })
            })
            .collect();
        let v = json!({
            "file": file.display().to_string(),
            "case": plan.case_id(),
            "caution": CAUTION,
            "scope": { "checked": ["the time history of one case: member forces, positions and energy; not a verdict (run `tautspan check`)"],
                       "not_checked": scope.not_checked },
            "duration_s": sim.duration_s,
            "time_step_s": plan.time_step_s,
            "steps": sim.steps,
            "cancelled": sim.cancelled,
            "shortest_period_s": plan.shortest.as_ref().map(|p| p.period_s),
            "warnings": plan.warnings,
            "members": members,
            "period_s": sim.period_s,
            "energy_drift": sim.energy_drift,
            "notes": notes,
        });
        match serde_json::to_string_pretty(&v) {
            Ok(s) => {
                if let Err(e) = writeln!(out, "{s}") {
                    write_error.get_or_insert(e);
                }
            }
            Err(e) => {
                eprintln!("cannot write JSON: {e}");
                return ExitCode::from(1);
            }
        }
    }
    if let Err(e) = out.flush() {
        write_error.get_or_insert(e);
    }
    if let Some(e) = write_error {
        eprintln!("tautspan: cannot write the output: {e}");
        return ExitCode::from(1);
    }
    if sim.cancelled {
        return ExitCode::from(EXIT_CANCELLED);
    }
    ExitCode::SUCCESS
}
