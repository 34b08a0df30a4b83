//! The report renders in headless Chromium to a PDF. Skipped (with a note)
//! when `chromium` is not on PATH, unless `TAUTSPAN_REQUIRE_CHROMIUM=1`,
//! which CI sets after installing Debian's `chromium` package.
//!
//! Set `TAUTSPAN_REPORT_KEEP=DIR` to keep the HTML and PDF in DIR for a look.

#[path = "report_support.rs"]
mod report_support;

use report_support::{BRIDLE, SINGLE, load};
use std::path::{Path, PathBuf};
use std::process::{Command, Stdio};
use std::time::{Duration, Instant};
use tautspan_core::analysis::analyse;
use tautspan_core::report::html;

const TIMEOUT: Duration = Duration::from_secs(60);

fn chromium() -> Option<PathBuf> {
    let path = std::env::var_os("PATH")?;
    std::env::split_paths(&path).map(|d| d.join("chromium")).find(|p| p.is_file())
}

/// A fresh directory under the system temp dir, unique to this run and name.
fn temp_dir(name: &str) -> PathBuf {
    let nanos = std::time::SystemTime::now().duration_since(std::time::UNIX_EPOCH).map_or(0, |d| d.as_nanos());
    let dir = std::env::temp_dir().join(format!("tautspan-report-{name}-{}-{nanos}", std::process::id()));
    std::fs::create_dir_all(&dir).unwrap_or_else(|e| panic!("cannot create {}: {e}", dir.display()));
    dir
}

/// Print `html_path` to `pdf_path`; Err with what went wrong.
fn print_to_pdf(exe: &Path, html_path: &Path, pdf_path: &Path, profile: &Path) -> Result<(), String> {
    let mut child = Command::new(exe)
        .args([
            "--headless",
            "--no-sandbox",
            "--disable-gpu",
            "--disable-quic",
            "--no-first-run",
            "--disable-background-networking",
            "--disable-component-update",
            "--disable-sync",
            "--no-pdf-header-footer",
        ])
        .arg(format!("--user-data-dir={}", profile.display()))
        .arg(format!("--print-to-pdf={}", pdf_path.display()))
        .arg(format!("file://{}", html_path.display()))
        .stdout(Stdio::null())
        .stderr(Stdio::piped())
        .spawn()
        .map_err(|e| format!("cannot start chromium: {e}"))?;
    let start = Instant::now();
    loop {
        if let Some(status) = child.try_wait().map_err(|e| e.to_string())? {
            let mut err = String::new();
            if let Some(mut s) = child.stderr.take() {
                use std::io::Read;
                let _ = s.read_to_string(&mut err);
            }
            return if status.success() { Ok(()) } else { Err(format!("chromium exited with {status}: {err}")) };
        }
        if start.elapsed() > TIMEOUT {
            let _ = child.kill();
            let _ = child.wait();
            return Err(format!("chromium did not finish within {TIMEOUT:?}"));
        }
        std::thread::sleep(Duration::from_millis(100));
    }
}

/// Write `bytes` to `path`, or create the directory `path` when `None`.
fn write(path: &Path, bytes: Option<&[u8]>) {
    let r = match bytes {
        Some(b) => std::fs::write(path, b),
        None => std::fs::create_dir_all(path),
    };
    r.unwrap_or_else(|e| panic!("cannot write {}: {e}", path.display()));
}

fn render(name: &str, text: &str) {
    let Some(exe) = chromium() else {
        if std::env::var("TAUTSPAN_REQUIRE_CHROMIUM").is_ok_and(|v| v == "1") {
            panic!("TAUTSPAN_REQUIRE_CHROMIUM=1 but chromium is not on PATH");
        }
        eprintln!("note: chromium not on PATH; skipping the headless render of the report");
        return;
    };
    let scenario = load(text);
    let doc = html(&scenario, &analyse(&scenario), "2025-03-14");
    let dir = temp_dir(name);
    let (html_path, pdf_path, profile) = (dir.join("r.html"), dir.join("r.pdf"), dir.join("profile"));
    write(&profile, None);
    write(&html_path, Some(doc.as_bytes()));
    let result = print_to_pdf(&exe, &html_path, &pdf_path, &profile);
    let pdf = std::fs::read(&pdf_path).unwrap_or_default();
    if let Some(keep) = std::env::var_os("TAUTSPAN_REPORT_KEEP") {
        let keep = PathBuf::from(keep);
        write(&keep, None);
        write(&keep.join(format!("{name}.html")), Some(doc.as_bytes()));
        write(&keep.join(format!("{name}.pdf")), Some(&pdf));
    }
    let _ = std::fs::remove_dir_all(&dir);
    if let Err(e) = result {
        panic!("{e}");
    }
    assert!(pdf.len() > 1000, "PDF of {} bytes", pdf.len());
    assert!(pdf.starts_with(b"%PDF"), "not a PDF");
}

#[test]
fn single_sling_renders_to_pdf() {
    render("single", SINGLE);
}

#[test]
fn bridle_with_floor_renders_to_pdf() {
    render("bridle", BRIDLE);
}
