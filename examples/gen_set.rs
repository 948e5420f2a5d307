//! Writes the benchmark set of `bench-circuits/` through the generator library, with a
//! `MANIFEST.tsv` (path, gates, bytes, command line) beside it. Run by
//! `scripts/gen-bench-circuits`.
//!
//! Usage: `cargo run --release --example gen_set -- [--out DIR] [--big] [--random-gates N]
//! [--commands]` (`--big` also writes the large circuits into `DIR/generated/`, which git
//! ignores; `--commands` writes nothing and prints, per file, its path relative to DIR and the
//! `equicone gen` command line that makes it).

use equicone::gen::generate;
use equicone::gen::set::{self, SetEntry, BIG_DIR};
use std::collections::BTreeSet;
use std::fmt::Write as _;
use std::path::{Path, PathBuf};
use std::process::ExitCode;

fn main() -> ExitCode {
    let mut out = PathBuf::from("bench-circuits");
    let mut big = false;
    let mut random_gates = 1_000_000;
    let mut commands = false;
    let mut args = std::env::args().skip(1);
    while let Some(a) = args.next() {
        match a.as_str() {
            "--out" => match args.next() {
                Some(d) => out = PathBuf::from(d),
                None => return usage("--out needs a folder"),
            },
            "--big" => big = true,
            "--commands" => commands = true,
            "--random-gates" => match args.next().and_then(|n| n.parse().ok()) {
                Some(n) => random_gates = n,
                None => return usage("--random-gates needs a number"),
            },
            other => return usage(&format!("unknown argument `{other}`")),
        }
    }
    if commands {
        let mut entries = set::committed();
        if big {
            entries.extend(set::big(random_gates));
        }
        for e in entries {
            println!(
                "{}\t{} -o {}",
                e.path,
                e.spec.command_line(e.format),
                e.path
            );
        }
        return ExitCode::SUCCESS;
    }
    if let Err(e) = write_set(&out, &set::committed(), "MANIFEST.tsv") {
        eprintln!("error: {e}");
        return ExitCode::FAILURE;
    }
    if big {
        if let Err(e) = write_set(
            &out,
            &set::big(random_gates),
            &format!("{BIG_DIR}/MANIFEST.tsv"),
        ) {
            eprintln!("error: {e}");
            return ExitCode::FAILURE;
        }
    }
    ExitCode::SUCCESS
}

fn usage(msg: &str) -> ExitCode {
    eprintln!("error: {msg}\nusage: gen_set [--out DIR] [--big] [--random-gates N] [--commands]");
    ExitCode::from(2)
}

/// Write `entries` under `out` (replacing the folders they live in) and a manifest.
fn write_set(out: &Path, entries: &[SetEntry], manifest: &str) -> Result<(), String> {
    let folders: BTreeSet<PathBuf> = entries
        .iter()
        .filter_map(|e| Path::new(&e.path).parent().map(|p| out.join(p)))
        .collect();
    for f in &folders {
        if f.exists() {
            std::fs::remove_dir_all(f).map_err(|e| format!("cannot clear {}: {e}", f.display()))?;
        }
        std::fs::create_dir_all(f).map_err(|e| format!("cannot create {}: {e}", f.display()))?;
    }
    let mut tsv = String::from("path\tgates\tbytes\tcommand\n");
    let mut total = 0usize;
    for e in entries {
        let g = generate(&e.spec, e.format).map_err(|err| format!("{}: {err}", e.path))?;
        let path = out.join(&e.path);
        std::fs::write(&path, &g.text)
            .map_err(|err| format!("cannot write {}: {err}", path.display()))?;
        total += g.text.len();
        let rel = e
            .path
            .strip_prefix(&format!("{BIG_DIR}/"))
            .unwrap_or(&e.path);
        let _ = writeln!(
            tsv,
            "{rel}\t{}\t{}\t{} -o {rel}",
            g.gates,
            g.text.len(),
            e.spec.command_line(e.format)
        );
    }
    let mpath = out.join(manifest);
    std::fs::write(&mpath, tsv)
        .map_err(|err| format!("cannot write {}: {err}", mpath.display()))?;
    eprintln!(
        "wrote {} files, {} bytes, and {}",
        entries.len(),
        total,
        mpath.display()
    );
    Ok(())
}
