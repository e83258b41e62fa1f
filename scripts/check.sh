#!/bin/sh
# What CI runs, and the README's test command: formatting, lints with warnings
# as errors (this also type-checks the benchmarks), the unit, integration,
# CLI and headless GUI tests of every crate of the workspace, then the
# documentation examples.
set -eu
cd "$(dirname "$0")/.."
cargo fmt --all -- --check
cargo clippy --workspace --all-targets -- -D warnings
cargo test --workspace --lib --bins --tests
cargo test --workspace --doc
