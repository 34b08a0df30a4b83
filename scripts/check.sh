#!/usr/bin/env bash
# What CI runs, and what to run before pushing: format, lints, the README's
# test command, benchmarks compiled (not run), the real GUI under Xvfb.
set -euo pipefail
cd "$(dirname "$0")/.."

echo "== rustfmt"
cargo fmt --all -- --check

echo "== clippy (warnings denied)"
cargo clippy --workspace --all-targets --locked -- -D warnings

echo "== tests (the README's test command)"
cargo test --workspace --locked

echo "== the rendered snapshot (wgpu; lavapipe on a headless machine)"
cargo test -p tautspan-gui --features snapshot --test snapshot --locked

echo "== core has no GUI dependency"
if cargo tree -p tautspan-core --edges normal --prefix none --locked | grep -E '^(egui|eframe|winit|wgpu|rfd) ' ; then
  echo "tautspan-core must not depend on a GUI crate" >&2
  exit 1
fi

echo "== benchmarks compile"
cargo bench --workspace --no-run --locked

echo "== the real app under Xvfb"
shot_tool=../shared/tools/screenshot.sh
if [[ -f $shot_tool ]]; then
  mkdir -p target/screens
  bash "$shot_tool" target/screens/demo.png --wait 8 -- target/debug/tautspan
else
  echo "skipped: $shot_tool not found (CI always has it)" >&2
  [[ -z ${CI:-} ]] || exit 1
fi
echo "== all checks passed"
