#!/bin/sh
# What CI runs: formatting, lints (warnings are errors), then the whole test suite.
set -eu
cd "$(dirname "$0")/.."
cargo fmt --all -- --check
cargo clippy --all-targets -- -D warnings
cargo test --all-targets
cargo test --doc
