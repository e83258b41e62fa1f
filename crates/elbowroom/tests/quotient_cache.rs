//! The basis of J_n kept on disk: the bytes round trip, every damaged, truncated or foreign
//! file is refused, an unwritable directory costs nothing, concurrent writers leave one
//! whole file, a basis read back equals a fresh one, and the commands print the same with
//! and without the cache. The mathematics is checked from outside: the Catalan numbers
//! (OEIS A000108) and the graded dimensions (n − k)/(n + k)·C(n + k, k) (OEIS A009766,
//! Aval–Bergeron–Bergeron, Adv. Math. 2004) on the basis read back, and every generator
//! M_α of J_n reducing to zero exactly (not only the probabilistic certificate).
#![allow(clippy::unwrap_used)]

use elbowroom::basis_cache::{ENV_DIR, ENV_OFF, Loaded, file_for, load, store};
use elbowroom::math::Progress;
use elbowroom::math::quotient::basis_bytes::{FORMAT_VERSION, from_bytes, header, to_bytes};
use elbowroom::math::quotient::groebner::QuasiGroebner;
use elbowroom::math::quotient::normal_form::hilbert_series;
use std::path::Path;
use std::process::Command;

fn binomial(n: u64, k: u64) -> u64 {
    (0..k).fold(1u64, |acc, i| acc * (n - i) / (i + 1))
}

fn fresh(n: usize) -> QuasiGroebner {
    QuasiGroebner::compute(n, None).unwrap()
}

fn found(dir: &Path, n: usize) -> QuasiGroebner {
    match load(dir, n, &Progress::new(0)).unwrap() {
        Loaded::Found(q) => q,
        other => panic!("n = {n}: {other:?}"),
    }
}

fn rejected(dir: &Path, n: usize) -> String {
    match load(dir, n, &Progress::new(0)).unwrap() {
        Loaded::Rejected(why) => why,
        other => panic!("n = {n}: expected a refusal, got {other:?}"),
    }
}

#[test]
fn bytes_round_trip_and_equal_a_fresh_basis() {
    for n in 1..=8 {
        let g = fresh(n);
        let bytes = to_bytes(&g);
        let back = from_bytes(&bytes).unwrap();
        assert_eq!(back, g, "n = {n}");
        assert_eq!(header(&bytes).unwrap().n, n);
    }
}

#[test]
fn the_basis_read_back_has_the_published_dimensions_and_kills_every_generator() {
    let dir = tempfile::tempdir().unwrap();
    for n in 1..=8usize {
        store(dir.path(), &fresh(n)).unwrap();
        let q = found(dir.path(), n);
        // OEIS A000108: Catalan(n) = C(2n, n)/(n + 1)
        let nn = n as u64;
        assert_eq!(q.basis().len() as u64, binomial(2 * nn, nn) / (nn + 1));
        // OEIS A009766: the degree-k dimension (n − k)/(n + k)·C(n + k, k)
        for (k, &h) in hilbert_series(&q).iter().enumerate() {
            let k = k as u64;
            assert_eq!(
                h as u64,
                (nn - k) * binomial(nn + k, k) / (nn + k),
                "n = {n}"
            );
        }
        // the exact check of all 2^n − 1 generators, beside the certificate load ran
        q.check_every_generator(&Progress::new(0)).unwrap();
    }
}

#[test]
fn every_changed_byte_is_refused() {
    let g = fresh(5);
    let bytes = to_bytes(&g);
    for i in 0..bytes.len() {
        for flip in [0x01u8, 0x80] {
            let mut bad = bytes.clone();
            bad[i] ^= flip;
            assert!(
                from_bytes(&bad).is_err(),
                "byte {i} ^ {flip:#x} was accepted"
            );
        }
    }
}

#[test]
fn every_truncation_and_extension_is_refused() {
    let bytes = to_bytes(&fresh(5));
    for len in 0..bytes.len() {
        assert!(from_bytes(&bytes[..len]).is_err(), "{len} bytes accepted");
    }
    let mut longer = bytes.clone();
    longer.push(0);
    assert!(from_bytes(&longer).is_err());
}

#[test]
fn foreign_files_are_refused_and_then_replaced() {
    let dir = tempfile::tempdir().unwrap();
    let g = fresh(5);
    let path = file_for(dir.path(), 5);
    // another layout version
    let mut bytes = to_bytes(&g);
    bytes[8..12].copy_from_slice(&(FORMAT_VERSION + 1).to_le_bytes());
    std::fs::write(&path, &bytes).unwrap();
    assert!(rejected(dir.path(), 5).contains("layout version"));
    // another crate version (same length, one digit changed)
    let mut bytes = to_bytes(&g);
    let at = 13;
    bytes[at] = if bytes[at] == b'9' { b'8' } else { b'9' };
    std::fs::write(&path, &bytes).unwrap();
    assert!(rejected(dir.path(), 5).contains("written by version"));
    // the basis of J_4 under the name of J_5
    std::fs::write(&path, to_bytes(&fresh(4))).unwrap();
    assert!(rejected(dir.path(), 5).contains("n = 4"));
    // not a basis at all
    std::fs::write(&path, b"hello").unwrap();
    rejected(dir.path(), 5);
    // a missing file is not a refusal
    assert!(matches!(
        load(dir.path(), 6, &Progress::new(0)).unwrap(),
        Loaded::Missing
    ));
    // the command rebuilds it and replaces the file by a good one
    let out = cli(dir.path(), &["quotient", "--n", "5", "--json"]);
    assert!(out.status.success());
    assert_eq!(found(dir.path(), 5), g);
}

#[test]
fn an_unwritable_directory_is_no_error() {
    let dir = tempfile::tempdir().unwrap();
    let file = dir.path().join("plain-file");
    std::fs::write(&file, b"x").unwrap();
    // a directory below a plain file can never be created, even by root
    let below = file.join("cache");
    assert!(store(&below, &fresh(3)).is_err());
    let with = cli(&below, &["quotient", "--n", "5", "--json"]);
    let without = Command::new(env!("CARGO_BIN_EXE_elbowroom"))
        .args(["quotient", "--n", "5", "--json"])
        .env(ENV_OFF, "1")
        .output()
        .unwrap();
    assert!(with.status.success() && without.status.success());
    assert_eq!(with.stdout, without.stdout);
    assert!(
        with.stderr.is_empty(),
        "{}",
        String::from_utf8_lossy(&with.stderr)
    );
}

#[test]
fn concurrent_writers_leave_one_whole_file() {
    let dir = tempfile::tempdir().unwrap();
    let g = fresh(7);
    std::thread::scope(|s| {
        for _ in 0..4 {
            s.spawn(|| {
                for _ in 0..10 {
                    store(dir.path(), &g).unwrap();
                }
            });
        }
    });
    assert_eq!(found(dir.path(), 7), g);
    let names: Vec<String> = std::fs::read_dir(dir.path())
        .unwrap()
        .map(|e| e.unwrap().file_name().to_string_lossy().into_owned())
        .collect();
    assert_eq!(
        names,
        ["quotient-basis-n7.bin"],
        "no temporary file is left"
    );
}

#[test]
fn concurrent_commands_share_one_cache() {
    let dir = tempfile::tempdir().unwrap();
    let runs: Vec<_> = (0..3)
        .map(|_| {
            Command::new(env!("CARGO_BIN_EXE_elbowroom"))
                .args(["quotient", "--n", "7", "--json"])
                .env(ENV_DIR, dir.path())
                .stdout(std::process::Stdio::piped())
                .spawn()
                .unwrap()
        })
        .collect();
    let outs: Vec<_> = runs
        .into_iter()
        .map(|c| c.wait_with_output().unwrap())
        .collect();
    assert!(outs.iter().all(|o| o.status.success()));
    assert!(outs.iter().all(|o| o.stdout == outs[0].stdout));
    assert_eq!(found(dir.path(), 7), fresh(7));
}

fn cli(dir: &Path, args: &[&str]) -> std::process::Output {
    Command::new(env!("CARGO_BIN_EXE_elbowroom"))
        .args(args)
        .env(ENV_DIR, dir)
        .env_remove(ENV_OFF)
        .output()
        .unwrap()
}

#[test]
fn commands_print_the_same_cold_warm_and_after_damage() {
    let dir = tempfile::tempdir().unwrap();
    let path = file_for(dir.path(), 6);
    let svg = dir.path().join("paths.svg");
    let svg_text = svg.to_str().unwrap();
    let figure = [
        "figure",
        "paths",
        "--poly",
        "x1^3 x2 - x2 x5^2",
        "--n",
        "6",
        "--out",
        svg_text,
    ];
    let printed = |out: &std::process::Output| {
        let mut all = out.stdout.clone();
        all.extend(std::fs::read(&svg).unwrap_or_default());
        all
    };
    for args in [
        &["quotient", "--n", "6"][..],
        &["reduce", "x1^2 x2 x3 - x4^3", "--n", "6", "--json"],
        &["survey", "--n", "6", "--summary"],
        &figure[..],
    ] {
        let _ = std::fs::remove_file(&path);
        let _ = std::fs::remove_file(&svg);
        let cold = cli(dir.path(), args);
        let cold_printed = printed(&cold);
        assert!(
            cold.status.success(),
            "{args:?}: {}",
            String::from_utf8_lossy(&cold.stderr)
        );
        assert!(path.exists(), "{args:?} stored the basis");
        let warm = cli(dir.path(), args);
        assert_eq!(cold_printed, printed(&warm), "{args:?}");
        // one byte of the payload changed: refused, rebuilt, replaced
        let mut bytes = std::fs::read(&path).unwrap();
        let last = bytes.len() - 1;
        bytes[last] ^= 0x55;
        std::fs::write(&path, &bytes).unwrap();
        let damaged = cli(dir.path(), args);
        assert_eq!(cold_printed, printed(&damaged), "{args:?}");
        assert_eq!(found(dir.path(), 6), fresh(6));
    }
}

#[test]
fn no_cache_neither_reads_nor_writes() {
    let dir = tempfile::tempdir().unwrap();
    let path = file_for(dir.path(), 5);
    let without = cli(dir.path(), &["reduce", "x1 x3^2", "--n", "5", "--no-cache"]);
    assert!(without.status.success());
    assert!(!path.exists(), "--no-cache wrote the cache");
    // a file that would be refused is not even read: same output, file left alone
    std::fs::write(&path, b"not a basis").unwrap();
    let again = cli(dir.path(), &["reduce", "x1 x3^2", "--n", "5", "--no-cache"]);
    assert_eq!(without.stdout, again.stdout);
    assert_eq!(std::fs::read(&path).unwrap(), b"not a basis");
    let cached = cli(dir.path(), &["reduce", "x1 x3^2", "--n", "5"]);
    assert_eq!(without.stdout, cached.stdout);
    assert_eq!(found(dir.path(), 5), fresh(5));
}
