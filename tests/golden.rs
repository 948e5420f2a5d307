//! Golden outputs: `prove`, `cone`, `stats` (text and `--json`) and `demo` on the committed
//! examples (`bench-circuits/examples`, the demo's netlists in `src/demo/files`) must stay
//! byte-identical to the files committed in `tests/golden/`, apart from the figures that
//! depend on the run (seconds and memory, masked on both sides). A refactoring that changes
//! any report fails here; a change made on purpose rewrites the files with
//! `EQUICONE_BLESS=1 cargo test --test golden` and shows up in review as their diff.
//!
//! `EQUICONE_GOLDEN_BIN=PATH` compares another build of the executable (for example one
//! built from an older commit) against the same files instead.

mod runner;

use std::path::{Path, PathBuf};
use std::process::Command;

const EXAMPLES: &str = "bench-circuits/examples";
const DEMO: &str = "src/demo/files";

/// Every case: a file name under `tests/golden/` and the command line.
fn cases() -> Vec<(String, Vec<String>)> {
    let mut out: Vec<(String, Vec<String>)> = Vec::new();
    let mut add = |name: String, args: Vec<String>| out.push((name, args));
    let example = |f: &str| format!("{EXAMPLES}/{f}");
    let demo = |f: &str| format!("{DEMO}/{f}");
    let proofs = [
        (
            "mux4-tree",
            example("mux4_spec.bench"),
            example("mux4_tree.bench"),
        ),
        (
            "mux4-swapped",
            example("mux4_spec.bench"),
            example("mux4_swapped.bench"),
        ),
        (
            "t7-sel-r2",
            demo("t7_sensor_sel_spec.v"),
            demo("t7_sensor_sel_r2.v"),
        ),
        (
            "t7-sel-r3",
            demo("t7_sensor_sel_spec.v"),
            demo("t7_sensor_sel_r3.v"),
        ),
        (
            "t7-reg-r4",
            demo("t7_sensor_reg_spec.v"),
            demo("t7_sensor_reg_r4.v"),
        ),
        (
            "t7-reg-r5",
            demo("t7_sensor_reg_spec.v"),
            demo("t7_sensor_reg_r5.v"),
        ),
    ];
    for (name, reference, candidate) in proofs {
        let args = vec!["prove".to_string(), reference, candidate];
        let mut json = args.clone();
        json.push("--json".into());
        add(format!("prove-{name}.txt"), args);
        add(format!("prove-{name}.json"), json);
    }
    let designs = [
        ("mux4-spec", example("mux4_spec.bench")),
        ("mux4-tree", example("mux4_tree.bench")),
        ("mux4-swapped", example("mux4_swapped.bench")),
        ("t7-sel-spec", demo("t7_sensor_sel_spec.v")),
        ("t7-sel-r2", demo("t7_sensor_sel_r2.v")),
        ("t7-sel-r3", demo("t7_sensor_sel_r3.v")),
        ("t7-reg-spec", demo("t7_sensor_reg_spec.v")),
        ("t7-reg-r4", demo("t7_sensor_reg_r4.v")),
        ("t7-reg-r5", demo("t7_sensor_reg_r5.v")),
    ];
    for command in ["cone", "stats"] {
        for (name, file) in &designs {
            let args = vec![command.to_string(), file.clone()];
            let mut json = args.clone();
            json.push("--json".into());
            add(format!("{command}-{name}.txt"), args);
            // The cone JSON of the register designs holds per-cycle evidence (about 1 MB
            // each); their text form stands for them.
            if !(command == "cone" && name.starts_with("t7-reg")) {
                add(format!("{command}-{name}.json"), json);
            }
        }
    }
    add("demo.txt".into(), vec!["demo".into()]);
    out
}

/// Whether a JSON key names a figure that depends on the run.
fn run_dependent_key(key: &str) -> bool {
    key.contains("seconds") || key.contains("memory")
}

/// `"key": number` lines of pretty JSON with a run-dependent key get `"<masked>"`.
fn mask_json_line(line: &str) -> String {
    let trimmed = line.trim_start();
    let Some(rest) = trimmed.strip_prefix('"') else {
        return line.to_string();
    };
    let Some((key, value)) = rest.split_once("\": ") else {
        return line.to_string();
    };
    let number = value.trim_end_matches(',');
    let numeric = !number.is_empty()
        && number
            .chars()
            .all(|c| c.is_ascii_digit() || matches!(c, '.' | 'e' | 'E' | '-' | '+'));
    if !run_dependent_key(key) || !numeric {
        return line.to_string();
    }
    let indent = &line[..line.len() - trimmed.len()];
    let comma = if value.ends_with(',') { "," } else { "" };
    format!("{indent}\"{key}\": \"<masked>\"{comma}")
}

/// Durations in text (`0.002 s`, `12.5 s`) become `<s> s`.
fn mask_text_line(line: &str) -> String {
    let bytes = line.as_bytes();
    let mut out = String::with_capacity(line.len());
    let mut i = 0;
    while i < bytes.len() {
        let starts_number =
            bytes[i].is_ascii_digit() && (i == 0 || !bytes[i - 1].is_ascii_alphanumeric());
        if starts_number {
            let mut j = i;
            while j < bytes.len() && (bytes[j].is_ascii_digit() || bytes[j] == b'.') {
                j += 1;
            }
            let after = &line[j..];
            let is_seconds = line[i..j].contains('.')
                && after.starts_with(" s")
                && after[2..]
                    .chars()
                    .next()
                    .is_none_or(|c| !c.is_alphanumeric());
            if is_seconds {
                out.push_str("<s>");
            } else {
                out.push_str(&line[i..j]);
            }
            i = j;
        } else {
            let c = line[i..].chars().next().expect("a character");
            out.push(c);
            i += c.len_utf8();
        }
    }
    out
}

/// The output of one run as compared: exit code, masked standard output, standard error.
fn render(binary: &Path, args: &[String], json: bool) -> String {
    let o = Command::new(binary)
        .args(args)
        .current_dir(env!("CARGO_MANIFEST_DIR"))
        .output()
        .expect("the binary runs");
    let mask = if json { mask_json_line } else { mask_text_line };
    let mut text = format!("$ equicone {}\nexit {}\n", args.join(" "), runner::code(&o));
    for line in String::from_utf8_lossy(&o.stdout).lines() {
        text.push_str(&mask(line));
        text.push('\n');
    }
    let stderr = String::from_utf8_lossy(&o.stderr);
    if !stderr.is_empty() {
        text.push_str("--- stderr\n");
        for line in stderr.lines() {
            text.push_str(&mask_text_line(line));
            text.push('\n');
        }
    }
    text
}

#[test]
fn maskers_hide_only_run_dependent_figures() {
    assert_eq!(
        mask_text_line("0 conflicts; 0.002 s; diagnosis 12.50 s; 3 s1; v1.5 sx"),
        "0 conflicts; <s> s; diagnosis <s> s; 3 s1; v1.5 sx"
    );
    assert_eq!(
        mask_json_line("  \"seconds\": 1.9e-5,"),
        "  \"seconds\": \"<masked>\","
    );
    assert_eq!(
        mask_json_line("    \"engine_memory_bytes\": 266240"),
        "    \"engine_memory_bytes\": \"<masked>\""
    );
    assert_eq!(mask_json_line("  \"conflicts\": 3,"), "  \"conflicts\": 3,");
}

#[test]
fn reports_on_the_committed_examples_match_the_golden_files() {
    let root = Path::new(env!("CARGO_MANIFEST_DIR"));
    let folder = root.join("tests/golden");
    let binary = std::env::var_os("EQUICONE_GOLDEN_BIN")
        .map(PathBuf::from)
        .unwrap_or_else(|| PathBuf::from(env!("CARGO_BIN_EXE_equicone")));
    let bless = std::env::var_os("EQUICONE_BLESS").is_some();
    let mut differing = Vec::new();
    let cases = cases();
    for (name, args) in &cases {
        let got = render(&binary, args, name.ends_with(".json"));
        let path = folder.join(name);
        if bless {
            std::fs::create_dir_all(&folder).unwrap();
            std::fs::write(&path, &got).unwrap();
            continue;
        }
        let want = std::fs::read_to_string(&path)
            .unwrap_or_else(|e| panic!("{}: {e}; write it with EQUICONE_BLESS=1", path.display()));
        if got != want {
            let line = got
                .lines()
                .zip(want.lines())
                .position(|(a, b)| a != b)
                .unwrap_or_else(|| got.lines().count().min(want.lines().count()))
                + 1;
            eprintln!("--- {name} differs first at line {line}:\n{got}");
            differing.push(name.clone());
        }
    }
    // Every committed file belongs to a case (a removed case leaves no stale file behind).
    if !bless {
        for entry in std::fs::read_dir(&folder).unwrap() {
            let file = entry.unwrap().file_name().to_string_lossy().into_owned();
            assert!(
                cases.iter().any(|(name, _)| *name == file),
                "tests/golden/{file} belongs to no case"
            );
        }
    }
    assert!(
        differing.is_empty(),
        "outputs differ from tests/golden/ in {differing:?}; if the change is on purpose, rewrite them with EQUICONE_BLESS=1"
    );
}
