//! Request errors, determinism, option spellings, and the project's bench reader accepting the
//! generated bench text with the same bit names as the Verilog ports.

use super::support::{bench_text, ports, random_vectors};
use equicone::front::load_texts;
use equicone::gen::{generate, Bug, GenFormat, GenSpec, Kind, Style};
use equicone::Format;
use std::sync::Arc;

#[test]
fn bad_requests_are_refused_with_help() {
    let cases: Vec<(GenSpec, &str)> = vec![
        (
            GenSpec::new(Kind::Selector, Style::Tree, 1),
            "at least 2 channels",
        ),
        (
            GenSpec::new(Kind::Selector, Style::Tree, 8).width(0),
            "--width must be at least 1",
        ),
        (
            GenSpec::new(Kind::Adder, Style::Ripple, 8).width(4),
            "selectors only",
        ),
        (
            GenSpec::new(Kind::Multiplier, Style::Ripple, 8),
            "does not apply to kind multiplier",
        ),
        (
            GenSpec::new(Kind::Multiplier, Style::Array, 1),
            "at least 2 bits",
        ),
        (
            GenSpec::new(Kind::Decoder, Style::Flat, 0),
            "1 to 20 select bits",
        ),
        (
            GenSpec::new(Kind::Selector, Style::Spec, 8).bug(Bug::Invert),
            "gate-level style",
        ),
    ];
    for (spec, want) in cases {
        let e = generate(&spec, GenFormat::Verilog).unwrap_err();
        assert!(e.message.contains(want), "{e}");
        assert!(!e.help.is_empty());
        let ie: equicone::InputError = e.into();
        assert_eq!(ie.diagnostics.len(), 1);
    }
}

#[test]
fn output_is_deterministic_and_the_seed_matters_for_mixed() {
    let spec = GenSpec::new(Kind::Selector, Style::Mixed, 64).width(2);
    let a = generate(&spec, GenFormat::Verilog).unwrap().text;
    assert_eq!(a, generate(&spec, GenFormat::Verilog).unwrap().text);
    let shapes: std::collections::HashSet<String> = (1..=8)
        .map(|s| {
            let t = generate(&spec.clone().seed(s), GenFormat::Verilog)
                .unwrap()
                .text;
            t.lines()
                .find(|l| l.starts_with("// style"))
                .unwrap()
                .to_string()
        })
        .collect();
    assert!(
        shapes.len() >= 3,
        "seeds give different mixed shapes: {shapes:?}"
    );
}

#[test]
fn the_project_readers_read_generated_bench_and_verilog() {
    // The project's own bench and Verilog readers accept every kind and style, name the bits as
    // the ports say, and their AIGs agree with the test's bench evaluator (selects in range).
    let mut specs = Vec::new();
    for kind in [
        Kind::Selector,
        Kind::Decoder,
        Kind::Priority,
        Kind::Shifter,
        Kind::Adder,
        Kind::Multiplier,
    ] {
        for &style in kind.styles() {
            specs.push(GenSpec::new(kind, style, 6));
        }
    }
    specs.push(GenSpec::new(Kind::Selector, Style::Spec, 12).width(3));
    specs.push(GenSpec::new(Kind::Selector, Style::Mixed, 12).width(3));
    specs.push(GenSpec::new(Kind::Adder, Style::Ripple, 6).bug(Bug::Stuck1));
    specs.push(GenSpec::new(Kind::Selector, Style::Tree, 6).bug(Bug::Invert));
    let mut rnd = GenSpec::new(Kind::Random, Style::Rewritten, 300);
    rnd.inputs = 16;
    specs.push(rnd);
    for spec in specs {
        let p = ports(&spec);
        let ours = super::oracle::parse(&bench_text(&spec)).evaluator();
        let expect_in: Vec<String> = p
            .inputs
            .iter()
            .flat_map(|(n, w, sc)| {
                (0..*w).map(move |b| if *sc { n.clone() } else { format!("{n}[{b}]") })
            })
            .collect();
        assert_eq!(
            ours.inputs, expect_in,
            "bench bits named like Verilog port bits"
        );
        for format in [GenFormat::Bench, GenFormat::Verilog] {
            let line = spec.command_line(format);
            let text = generate(&spec, format).unwrap().text;
            let file: Arc<str> = Arc::from("gen.txt");
            let fmt = if format == GenFormat::Bench {
                Format::Bench
            } else {
                Format::Verilog
            };
            let d =
                load_texts(fmt, &[(file, text)], None).unwrap_or_else(|e| panic!("{line}: {e}"));
            let ports_only: Vec<&str> = d
                .inputs
                .iter()
                .filter(|b| !b.is_unknown())
                .map(|b| b.name.as_str())
                .collect();
            assert_eq!(ports_only, expect_in, "{line}: input bits");
            let outs: Vec<&str> = d.outputs.iter().map(|b| b.name.as_str()).collect();
            assert_eq!(
                outs,
                ours.outputs.iter().map(String::as_str).collect::<Vec<_>>(),
                "{line}: output bits"
            );
            for v in random_vectors(&p, 20, 3) {
                let flat: Vec<bool> = v.iter().flatten().copied().collect();
                let words: Vec<u64> = flat.iter().map(|&b| b as u64).collect();
                let want: Vec<bool> = ours.eval(&words).iter().map(|w| w & 1 == 1).collect();
                // Unknown-value sources (out-of-range selects) do not matter in range: 0.
                let mut bits = flat.iter();
                let all: Vec<bool> = d
                    .inputs
                    .iter()
                    .map(|b| !b.is_unknown() && *bits.next().unwrap())
                    .collect();
                assert_eq!(d.eval(&all), want, "{line}");
            }
        }
    }
}

#[test]
fn committed_bench_circuits_match_the_generators() {
    // The committed set must be what the generators write today (regenerate it with
    // scripts/gen-bench-circuits after a deliberate change).
    let root = std::path::Path::new(env!("CARGO_MANIFEST_DIR")).join("bench-circuits");
    let entries = equicone::gen::set::committed();
    for e in &entries {
        let on_disk = std::fs::read_to_string(root.join(&e.path)).unwrap_or_else(|err| {
            panic!(
                "bench-circuits/{}: {err}; run scripts/gen-bench-circuits",
                e.path
            )
        });
        let now = generate(&e.spec, e.format).unwrap().text;
        assert!(
            on_disk == now,
            "bench-circuits/{} is stale; run scripts/gen-bench-circuits",
            e.path
        );
    }
    eprintln!(
        "bench-circuits: {} committed files match the generators",
        entries.len()
    );
}

#[test]
fn the_cli_writes_the_same_files_from_the_manifest_command_lines() {
    // Every command line of the set (as listed in bench-circuits/MANIFEST.tsv), run through the
    // real `equicone gen`, writes exactly what the library writes.
    let dir = tempfile::tempdir().unwrap();
    let entries = equicone::gen::set::committed();
    for (i, e) in entries.iter().enumerate().filter(|(i, _)| i % 4 == 0) {
        let line = e.spec.command_line(e.format);
        let args: Vec<String> = line
            .split_whitespace()
            .skip(1)
            .map(|w| w.trim_matches('\'').to_string())
            .collect();
        let out = dir.path().join(format!("f{i}"));
        let run = std::process::Command::new(env!("CARGO_BIN_EXE_equicone"))
            .args(&args)
            .arg("-o")
            .arg(&out)
            .output()
            .unwrap();
        assert!(
            run.status.success(),
            "{line}: {}",
            String::from_utf8_lossy(&run.stderr)
        );
        let got = std::fs::read_to_string(&out).unwrap();
        assert!(
            got == generate(&e.spec, e.format).unwrap().text,
            "{line} differs through the CLI"
        );
    }
}

#[test]
fn the_output_file_name_picks_the_format_unless_one_is_given() {
    // `-o NAME.bench` writes bench, any other name Verilog; `--format` wins over the name.
    let dir = tempfile::tempdir().unwrap();
    let run = |args: &[&str], file: &str| {
        let path = dir.path().join(file);
        let o = std::process::Command::new(env!("CARGO_BIN_EXE_equicone"))
            .args(["gen", "adder", "--n", "4"])
            .args(args)
            .arg("-o")
            .arg(&path)
            .output()
            .unwrap();
        assert!(o.status.success(), "{}", String::from_utf8_lossy(&o.stderr));
        std::fs::read_to_string(&path).unwrap()
    };
    let bench = run(&[], "a.bench");
    assert!(
        bench.contains("INPUT(") && !bench.contains("module "),
        "{bench}"
    );
    let verilog = run(&[], "a.v");
    assert!(verilog.contains("module "), "{verilog}");
    let forced = run(&["--format", "verilog"], "b.bench");
    assert!(forced.contains("module "), "{forced}");
}
