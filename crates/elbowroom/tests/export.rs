//! Figure writers: PNG files decode at the requested size and show each pipe
//! in its label colour, with text drawn by the bundled font; SVG files parse
//! and hold one path per pipe; TikZ files hold one `\draw` per pipe and
//! compile with pdflatex where it is installed. Without pdflatex (or its
//! `standalone.cls`) that check says it is skipped, unless
//! `ELBOWROOM_REQUIRE_PDFLATEX=1` is set, as `.ci/run` does where it installs
//! pdflatex: there a missing pdflatex fails the test.

#![allow(clippy::unwrap_used)]

use elbowroom::figure::export::{self, ExportOptions, Format};
use elbowroom::figure::palette::{self, label_color};
use elbowroom::figure::{Anchor, Color, ItemKind, PathCmd, Pt, Scene, Stroke, Tag};
use resvg::tiny_skia::Pixmap;
use std::path::{Path, PathBuf};

fn scratch(name: &str) -> PathBuf {
    let dir = Path::new(env!("CARGO_TARGET_TMPDIR")).join(format!("export-{name}"));
    let _ = std::fs::remove_dir_all(&dir);
    std::fs::create_dir_all(&dir).unwrap();
    dir
}

/// n pipes drawn as thick wavy strokes (a line, then a cubic) in their label
/// colours, a frame, a filled circle and a caption: every item kind.
fn pipes_scene(n: usize) -> Scene {
    let w = 40.0 + 30.0 * n as f32;
    let mut scene = Scene::new(w, 120.0, palette::PAPER);
    scene.push(
        ItemKind::Path {
            cmds: vec![
                PathCmd::MoveTo(Pt::new(4.0, 4.0)),
                PathCmd::LineTo(Pt::new(w - 4.0, 4.0)),
                PathCmd::LineTo(Pt::new(w - 4.0, 116.0)),
                PathCmd::LineTo(Pt::new(4.0, 116.0)),
                PathCmd::Close,
            ],
            stroke: Some(Stroke {
                width: 1.0,
                color: palette::GRID,
            }),
            fill: None,
        },
        Tag::None,
    );
    for k in 1..=n {
        let x = 20.0 + 30.0 * (k - 1) as f32;
        scene.push(
            ItemKind::Path {
                cmds: vec![
                    PathCmd::MoveTo(Pt::new(x, 15.0)),
                    PathCmd::LineTo(Pt::new(x, 45.0)),
                    PathCmd::CubicTo(
                        Pt::new(x, 60.0),
                        Pt::new(x + 10.0, 60.0),
                        Pt::new(x + 10.0, 75.0),
                    ),
                ],
                stroke: Some(Stroke {
                    width: 6.0,
                    color: label_color(k, n),
                }),
                fill: None,
            },
            Tag::Pipe(k),
        );
    }
    scene.push(
        ItemKind::Circle {
            center: Pt::new(w - 15.0, 100.0),
            radius: 4.0,
            stroke: None,
            fill: Some(palette::INK),
        },
        Tag::Vertex(0),
    );
    scene.push(
        ItemKind::Text {
            pos: Pt::new(w / 2.0, 100.0),
            text: "σ_w & λ <1>".into(),
            size: 10.0,
            color: palette::INK,
            anchor: Anchor::Center,
        },
        Tag::Label,
    );
    scene
}

fn pixels(png: &[u8]) -> Pixmap {
    Pixmap::decode_png(png).unwrap()
}

fn count_exact(p: &Pixmap, c: Color) -> usize {
    p.pixels()
        .iter()
        .filter(|px| px.red() == c.r && px.green() == c.g && px.blue() == c.b && px.alpha() == 255)
        .count()
}

#[test]
fn png_has_the_requested_size_and_every_pipe_colour() {
    for (n, scale) in [(3usize, 1.0f32), (5, 2.0), (8, 3.5)] {
        let scene = pipes_scene(n);
        let png = export::to_png(
            &scene,
            &ExportOptions {
                scale,
                transparent: false,
            },
        )
        .unwrap();
        let p = pixels(&png);
        assert_eq!(p.width(), (scene.width * scale).ceil() as u32);
        assert_eq!(p.height(), (scene.height * scale).ceil() as u32);
        let present = (1..=n)
            .filter(|&k| count_exact(&p, label_color(k, n)) > 0)
            .count();
        assert_eq!(present, n, "n = {n}, scale = {scale}");
        // the colour of a label no pipe has (label k keeps its colour for every
        // count of labels, so the next label's colour is a stranger) is absent
        let stranger = label_color(n + 1, n + 1);
        assert_eq!(count_exact(&p, stranger), 0);
        assert!(count_exact(&p, palette::PAPER) > p.width() as usize * 10);
    }
}

#[test]
fn png_dpi_and_transparency() {
    let scene = pipes_scene(2);
    let opts = ExportOptions::with_dpi(144.0, true);
    let p = pixels(&export::to_png(&scene, &opts).unwrap());
    assert_eq!(p.width(), (scene.width * 2.0).ceil() as u32);
    let transparent = p.pixels().iter().filter(|px| px.alpha() == 0).count();
    assert!(transparent > p.pixels().len() / 2, "{transparent}");
    assert_eq!(count_exact(&p, palette::PAPER), 0, "no background painted");
}

/// The first and last rows of a PNG of `text` (size 40) holding ink.
fn ink_rows(text: &str) -> (u32, u32) {
    let mut scene = Scene::new(200.0, 100.0, palette::PAPER);
    scene.label(
        Pt::new(20.0, 50.0),
        text.into(),
        40.0,
        palette::INK,
        Anchor::Left,
    );
    let p = pixels(&export::to_png(&scene, &ExportOptions::default()).unwrap());
    let inked: Vec<u32> = (0..p.height())
        .filter(|&y| {
            (0..p.width()).any(|x| {
                p.pixel(x, y)
                    .is_some_and(|px| px.red() < 0x80 && px.green() < 0x80)
            })
        })
        .collect();
    (inked[0], inked[inked.len() - 1])
}

#[test]
fn png_indices_are_lowered_and_exponents_raised() {
    // the PNG is the SVG rasterized: "a_2" has its 2 below the baseline of
    // "a2" (which has nothing to lower), "a^2" its 2 above
    let (plain_top, plain_bottom) = ink_rows("a2");
    let (_, sub_bottom) = ink_rows("a_2");
    let (sup_top, _) = ink_rows("a^2");
    assert!(
        sub_bottom >= plain_bottom + 4,
        "index bottom {sub_bottom}, baseline {plain_bottom}"
    );
    assert!(
        sup_top + 4 <= plain_top,
        "exponent top {sup_top}, digit top {plain_top}"
    );
}

#[test]
fn png_text_is_drawn_with_the_bundled_font() {
    // a scene holding only text: every non-background pixel comes from glyphs
    let mut scene = Scene::new(120.0, 30.0, palette::PAPER);
    scene.push(
        ItemKind::Text {
            pos: Pt::new(60.0, 15.0),
            text: "ℓ(w) = 3".into(),
            size: 14.0,
            color: palette::INK,
            anchor: Anchor::Center,
        },
        Tag::Label,
    );
    let p = pixels(&export::to_png(&scene, &ExportOptions::default()).unwrap());
    let inked = p
        .pixels()
        .iter()
        .filter(|px| px.red() < 0x80 && px.green() < 0x80)
        .count();
    assert!(inked > 200, "only {inked} dark pixels: was the text drawn?");
}

#[test]
fn png_refuses_impossible_sizes() {
    let scene = pipes_scene(2);
    for scale in [0.0, -1.0, f32::NAN, 1.0e6] {
        let e = export::to_png(
            &scene,
            &ExportOptions {
                scale,
                transparent: false,
            },
        );
        assert!(e.is_err(), "scale {scale}");
    }
}

#[test]
fn svg_parses_with_one_path_per_pipe() {
    let n = 6;
    let svg = export::to_svg(&pipes_scene(n));
    let doc = roxmltree::Document::parse(&svg).unwrap();
    let paths: Vec<_> = doc
        .descendants()
        .filter(|e| e.has_tag_name("path"))
        .collect();
    assert_eq!(paths.len(), n + 1, "n pipes and a frame");
    for k in 1..=n {
        let of_k: Vec<_> = paths
            .iter()
            .filter(|e| e.attribute("data-pipe") == Some(k.to_string().as_str()))
            .collect();
        assert_eq!(of_k.len(), 1, "pipe {k}");
        let e = of_k[0];
        assert_eq!(
            e.attribute("class"),
            Some(format!("pipe pipe-{k}").as_str())
        );
        assert_eq!(
            e.attribute("stroke"),
            Some(label_color(k, n).hex().as_str())
        );
        assert_eq!(e.attribute("fill"), Some("none"));
        assert!(e.attribute("d").unwrap().contains('C'));
    }
    let text = doc.descendants().find(|e| e.has_tag_name("text")).unwrap();
    // σ_w is set with its index lowered: σ, then w in a tspan shifted down
    // by 0.3 of the font size (10)
    let read: String = text
        .descendants()
        .filter(|n| n.is_text())
        .filter_map(|n| n.text())
        .collect();
    assert_eq!(read, "σw & λ <1>");
    let index = text
        .descendants()
        .find(|e| e.has_tag_name("tspan"))
        .unwrap();
    assert_eq!(index.attribute("baseline-shift"), Some("-3"));
    assert_eq!(index.text(), Some("w"));
    assert_eq!(doc.root_element().attribute("viewBox"), Some("0 0 220 120"));
}

#[test]
fn tikz_has_one_draw_per_pipe_and_declares_its_colours() {
    let n = 5;
    let tex = export::to_tikz(&pipes_scene(n));
    assert!(tex.starts_with("\\documentclass[tikz]{standalone}\n"));
    for k in 1..=n {
        let lines: Vec<&str> = tex
            .lines()
            .filter(|l| l.ends_with(&format!("% pipe {k}")))
            .collect();
        assert_eq!(lines.len(), 1, "pipe {k}");
        assert!(lines[0].starts_with("\\draw["), "{}", lines[0]);
        let c = label_color(k, n);
        let decl = format!(
            "\\definecolor{{er{:02X}{:02X}{:02X}}}{{HTML}}{{{:02X}{:02X}{:02X}}}",
            c.r, c.g, c.b, c.r, c.g, c.b
        );
        assert!(tex.contains(&decl), "{decl}");
    }
    assert_eq!(
        tex.matches("\\draw[").count(),
        n + 2,
        "pipes, frame, circle"
    );
    // σ_w with its index lowered, as one formula
    assert!(
        tex.contains("{$\\sigma _{w}\\ \\&\\ \\lambda \\ <1>$}"),
        "{tex}"
    );
}

#[test]
fn files_take_their_format_from_the_extension() {
    let dir = scratch("files");
    let scene = pipes_scene(3);
    for (name, check) in [
        ("f.png", b"\x89PNG".as_slice()),
        ("f.svg", b"<svg".as_slice()),
        ("f.tex", b"\\documentclass".as_slice()),
        ("F.TIKZ", b"\\documentclass".as_slice()),
    ] {
        let path = dir.join(name);
        export::write(&scene, &path, &ExportOptions::default()).unwrap();
        let bytes = std::fs::read(&path).unwrap();
        assert!(bytes.starts_with(check), "{name}");
    }
    let e = export::write(&scene, &dir.join("f.pdf"), &ExportOptions::default()).unwrap_err();
    assert!(e.to_string().contains("use .png, .svg or .tex"), "{e}");
    assert_eq!(Format::from_path(Path::new("a.Svg")).unwrap(), Format::Svg);
    let e = export::write(
        &scene,
        &dir.join("no-dir").join("f.svg"),
        &ExportOptions::default(),
    )
    .unwrap_err();
    assert!(e.to_string().starts_with("cannot write"), "{e}");
}

#[test]
fn tikz_compiles_with_pdflatex() {
    let required = std::env::var("ELBOWROOM_REQUIRE_PDFLATEX").is_ok_and(|v| v == "1");
    let skip = |why: &str| {
        assert!(!required, "ELBOWROOM_REQUIRE_PDFLATEX=1 but {why}");
        eprintln!("skipped: {why}");
    };
    let Some(pdflatex) = which("pdflatex") else {
        skip("pdflatex is not on PATH (install texlive-latex-base and texlive-pictures to run it)");
        return;
    };
    let has_standalone = std::process::Command::new("kpsewhich")
        .arg("standalone.cls")
        .output()
        .is_ok_and(|o| o.status.success() && !o.stdout.is_empty());
    if !has_standalone {
        skip("pdflatex is installed but standalone.cls is not (Debian: texlive-latex-extra)");
        return;
    }
    let dir = scratch("pdflatex");
    let tex = dir.join("pipes.tex");
    std::fs::write(&tex, export::to_tikz(&pipes_scene(4))).unwrap();
    let out = std::process::Command::new(pdflatex)
        .args(["-interaction=nonstopmode", "-halt-on-error", "pipes.tex"])
        .current_dir(&dir)
        .output()
        .unwrap();
    assert!(
        out.status.success(),
        "pdflatex failed:\n{}",
        String::from_utf8_lossy(&out.stdout)
    );
    assert!(dir.join("pipes.pdf").is_file());
}

fn which(program: &str) -> Option<PathBuf> {
    let path = std::env::var_os("PATH")?;
    std::env::split_paths(&path)
        .map(|d| d.join(program))
        .find(|p| p.is_file())
}
