//! Open the app on a file or the demo, for looking at the real window
//! before the binary is wired: `cargo run -p tautspan-gui --example open [FILE]`.

fn main() -> std::process::ExitCode {
    match tautspan_gui::run(std::env::args_os().nth(1).map(std::path::PathBuf::from)) {
        Ok(()) => std::process::ExitCode::SUCCESS,
        Err(e) => {
            eprintln!("tautspan: {e}");
            std::process::ExitCode::from(2)
        }
    }
}
