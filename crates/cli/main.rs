//! The `tautspan` binary: argument parsing and dispatch only. The GUI opens
//! by default; `check`, `simulate` and `report` are the command line.

mod atomic_write;
mod check;
mod read;
mod report;
mod simulate;

use clap::{Parser, Subcommand, ValueEnum};
use std::path::PathBuf;
use std::process::ExitCode;

/// Exit code for input errors (the message names file, line, column, field).
pub const EXIT_INPUT: u8 = 2;

#[derive(Parser)]
#[command(
    name = "tautspan",
    version,
    about = "Load-path checker for hanging and supporting members: static and dynamic member forces against allowables.",
    long_about = "Tautspan solves a rig of anchors, joints, members (wire rope, fibre rope, chain, rod, cable) and floor slabs \
under its masses, for the static case and each dynamic case (swing, drop, sudden), and checks every member's force against \
its allowable.\n\nWith no command it opens the desktop app on the built-in demo, or on FILE.\n\n\
Planning aid only: the manufacturer's ratings, the local codes and standards, and a competent person's judgement govern.",
    args_conflicts_with_subcommands = true
)]
struct Cli {
    /// Scenario file to open in the desktop app.
    file: Option<PathBuf>,
    #[command(subcommand)]
    command: Option<Command>,
}

/// Output formats of `check`.
#[derive(Clone, Copy, ValueEnum)]
pub enum CheckFormat {
    /// Aligned tables for a terminal.
    Text,
    /// The contract's JSON: one object per file (an array for several files).
    Json,
    /// One row per case and member or floor.
    Csv,
}

/// The units `check` (text, CSV) and `report` print in; files keep their own.
#[derive(Clone, Copy, ValueEnum)]
pub enum Units {
    /// SI: kN, mm, m, kPa, kg.
    Si,
    /// US customary: kip (text) or lbf (CSV, report), in, ft, psf, lb and short tons.
    Us,
}

impl Units {
    /// The core's unit system.
    pub fn system(self) -> tautspan_core::report::UnitSystem {
        match self {
            Units::Si => tautspan_core::report::UnitSystem::Si,
            Units::Us => tautspan_core::report::UnitSystem::UsCustomary,
        }
    }
}

/// Output formats of `simulate`.
#[derive(Clone, Copy, ValueEnum)]
pub enum SimulateFormat {
    /// Time histories: time, member forces, node positions.
    Csv,
    /// Summary: peak force per member, measured period, energy drift.
    Json,
}

#[derive(Subcommand)]
enum Command {
    /// Solve every case of every file and check each member and floor against its allowable.
    ///
    /// Exit code 0: everything within allowable; 1: something over allowable, slack where it
    /// must carry, or a case that could not be solved; 2: an input error (the message names the
    /// file, line, column and field).
    Check {
        /// Scenario files (RON, format 1).
        #[arg(required = true)]
        files: Vec<PathBuf>,
        /// Output format.
        #[arg(long, value_enum, default_value = "text")]
        format: CheckFormat,
        /// Only this case (by id).
        #[arg(long = "case")]
        case: Option<String>,
        /// Units of the text and CSV output. JSON stays SI: its field names carry the unit (`force_n`).
        #[arg(long, value_enum, default_value = "si")]
        units: Units,
    },
    /// Run one case in the time domain and print its histories (csv) or summary (json).
    ///
    /// Lumped masses at the nodes (the masses plus half of each member's own weight), the same
    /// member laws, implicit Newmark average-acceleration integration. The CSV history is written
    /// as it is computed; the JSON summary keeps only the peaks. A step coarser than a tenth of
    /// the shortest member-mass period is warned. Progress goes to stderr; Ctrl+C stops the run,
    /// prints what was computed and exits 130.
    Simulate {
        /// Scenario file.
        file: PathBuf,
        /// Case id to run.
        #[arg(long = "case")]
        case: String,
        /// Simulated time, with its unit (e.g. 10s, 2500 ms).
        #[arg(long, default_value = "10 s", allow_hyphen_values = true)]
        duration: String,
        /// Time step with its unit (e.g. 1ms); automatic when omitted. At most 10,000,000 steps
        /// (duration / step) a run.
        #[arg(long, allow_hyphen_values = true)]
        step: Option<String>,
        /// Mass-proportional damping coefficient, 1/s (0: none).
        #[arg(long, default_value_t = 0.0)]
        damping: f64,
        /// Output format.
        #[arg(long, value_enum, default_value = "json")]
        format: SimulateFormat,
    },
    /// Write a self-contained HTML report (prints to paper or PDF from a browser).
    Report {
        /// Scenario file.
        file: PathBuf,
        /// Output HTML file.
        #[arg(long)]
        out: PathBuf,
        /// Units the report is written in.
        #[arg(long, value_enum, default_value = "si")]
        units: Units,
    },
}

fn main() -> ExitCode {
    let cli = Cli::parse();
    match cli.command {
        None => match tautspan_gui::run(cli.file) {
            Ok(()) => ExitCode::SUCCESS,
            Err(e) => {
                eprintln!("tautspan: {e}");
                ExitCode::from(EXIT_INPUT)
            }
        },
        Some(Command::Check { files, format, case, units }) => {
            check::run(&files, format, case.as_deref(), units.system())
        }
        Some(Command::Simulate { file, case, duration, step, damping, format }) => {
            simulate::run(&file, &case, &duration, step.as_deref(), damping, format)
        }
        Some(Command::Report { file, out, units }) => report::run(&file, &out, units.system()),
    }
}
