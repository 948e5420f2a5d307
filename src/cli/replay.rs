//! The options of `prove` that explain and replay a result: `--explain` (difference cubes),
//! `--vcd` (a Value Change Dump of the counterexamples) and `--testbench` (a self-checking
//! Verilog testbench; random vectors that satisfy the assumptions when there is no
//! counterexample).

use super::common::{report_input_error, write_atomic};
use super::Exit;
use crate::check::CheckOutcome;
use crate::design::Design;
use crate::engine::Shared;
use crate::explain::{self, cubes::CubeLimits, testbench::TbDesign};
use clap::Args;
use std::path::PathBuf;

/// Explaining and replaying a result.
#[derive(Args, Debug, Clone, Default)]
pub struct ReplayArgs {
    /// Generalize each counterexample into difference cubes: the input values under which
    /// each differing output pair differs, enumerated until they cover every differing vector
    /// or a limit is reached.
    #[arg(long)]
    pub explain: bool,
    /// Cubes per differing output pair for --explain.
    #[arg(long, value_name = "N", default_value_t = 64)]
    pub explain_cubes: usize,
    /// Write the counterexamples as a Value Change Dump (IEEE 1364-2005 clause 18) to FILE:
    /// both designs' inputs and outputs, one time step per vector.
    #[arg(long, value_name = "FILE")]
    pub vcd: Option<PathBuf>,
    /// With --vcd: also the internal nets of the cones of the differing outputs.
    #[arg(long)]
    pub vcd_nets: bool,
    /// Write a self-checking Verilog testbench to FILE that applies each counterexample (or
    /// random vectors when there is none) to both designs and prints pass/FAIL per vector.
    #[arg(long, value_name = "FILE")]
    pub testbench: Option<PathBuf>,
}

impl ReplayArgs {
    /// Whether the files need the paired graph after the proof.
    pub fn wanted(&self) -> bool {
        self.vcd.is_some() || self.testbench.is_some()
    }

    /// The cube limits of `--explain`, when it is given.
    pub fn cube_limits(&self) -> Option<CubeLimits> {
        self.explain.then(|| CubeLimits {
            max_cubes: self.explain_cubes.max(1),
            ..CubeLimits::default()
        })
    }
}

/// Vectors for a testbench without counterexamples: `n` random vectors on which the
/// assumptions hold (fewer when few patterns satisfy them).
fn random_vectors(shared: &Shared, n: usize, seed: u64) -> Vec<Vec<bool>> {
    let words = 16;
    let ni = shared.aig.num_inputs();
    let pats = crate::aig::random_words(ni, words, seed ^ 0x7E57_BE4C);
    let t = crate::aig::simulate(&shared.aig, &pats, words);
    let mut out = Vec::new();
    for p in 0..words * 64 {
        if out.len() == n {
            break;
        }
        if t.lit_bit(shared.constraint, p) {
            out.push(
                (0..ni)
                    .map(|k| (pats[k][p / 64] >> (p % 64)) & 1 == 1)
                    .collect(),
            );
        }
    }
    out
}

/// The source files of a Verilog design (path, text), for its testbench; none for bench.
fn source_files(d: &Design, paths: &[PathBuf]) -> Result<Vec<(String, String)>, Exit> {
    if d.format != crate::design::Format::Verilog {
        return Ok(Vec::new());
    }
    paths
        .iter()
        .map(|p| {
            super::files::read_text(p)
                .map(|t| (p.display().to_string(), t))
                .map_err(|e| report_input_error(&e))
        })
        .collect()
}

/// Cycles of the random trace in a testbench of clocked designs without a difference.
pub const RANDOM_CYCLES: usize = 32;

/// After a check of clocked designs: write the VCD of the trace and the testbench replaying it
/// (random cycles from reset when there is no trace, paired as the port map `map` says).
/// `files` are the source paths of each side.
pub fn write_trace_files(
    a: &ReplayArgs,
    (r, c): (&Design, &Design),
    files: (&[PathBuf], &[PathBuf]),
    rep: &crate::seq::SeqReport,
    map: Option<&crate::portmap::BitMap>,
    init_unset: crate::seq::InitUnset,
    seed: u64,
) -> Result<(), Exit> {
    if let Some(path) = &a.vcd {
        match &rep.trace {
            None => eprintln!("vcd: not written, there is no trace"),
            Some(t) => match explain::trace_vcd::trace_vcd(r, c, t) {
                Ok(text) => {
                    write_atomic(path, text.as_bytes()).map_err(|e| report_input_error(&e))?;
                    eprintln!(
                        "vcd: {} ({} cycles from reset)",
                        path.display(),
                        t.cycles.len()
                    );
                }
                Err(m) => eprintln!("vcd: not written: {m}"),
            },
        }
    }
    if let Some(path) = &a.testbench {
        let random;
        let (t, what) = match &rep.trace {
            Some(t) => (t, "trace"),
            None => {
                random = explain::trace_run::random_trace_mapped(
                    r,
                    c,
                    &rep.held,
                    map,
                    init_unset,
                    RANDOM_CYCLES,
                    seed,
                );
                (&random, "random")
            }
        };
        let rt = TbDesign {
            design: r,
            files: source_files(r, files.0)?,
        };
        let ct = TbDesign {
            design: c,
            files: source_files(c, files.1)?,
        };
        match explain::trace_bench::trace_testbench(&rt, &ct, t) {
            Ok(tb) => {
                write_atomic(path, tb.text.as_bytes()).map_err(|e| report_input_error(&e))?;
                eprintln!(
                    "testbench: {path} ({} {what} cycles from reset); run: iverilog {} -o tb.vvp {path}{}{} && vvp tb.vvp",
                    t.cycles.len(),
                    tb.generation,
                    if tb.compile_with.is_empty() { "" } else { " " },
                    tb.compile_with.join(" "),
                    path = path.display(),
                );
            }
            Err(m) => eprintln!("testbench: not written: {m}"),
        }
    }
    Ok(())
}

/// After a check: write the VCD and testbench files the options ask for. `files` are the
/// source paths of each side (for the testbench).
pub fn write_files(
    a: &ReplayArgs,
    r: &Design,
    c: &Design,
    files: (&[PathBuf], &[PathBuf]),
    out: &CheckOutcome,
    seed: u64,
) -> Result<(), Exit> {
    let Some(shared) = &out.pairing else {
        return Ok(());
    };
    let rep = &out.report;
    if let Some(path) = &a.vcd {
        if rep.counterexamples.is_empty() {
            eprintln!("vcd: not written, there is no counterexample");
        } else {
            let text =
                explain::waves::counterexample_vcd(r, c, shared, &rep.counterexamples, a.vcd_nets);
            write_atomic(path, text.as_bytes()).map_err(|e| report_input_error(&e))?;
            eprintln!(
                "vcd: {} ({} vector{})",
                path.display(),
                rep.counterexamples.len(),
                if rep.counterexamples.len() == 1 {
                    ""
                } else {
                    "s"
                }
            );
        }
    }
    if let Some(path) = &a.testbench {
        let (vectors, what) = if rep.counterexamples.is_empty() {
            (random_vectors(shared, 16, seed), "random vector(s)")
        } else {
            (
                rep.counterexamples
                    .iter()
                    .map(|cx| cx.inputs.iter().map(|v| v.value).collect())
                    .collect(),
                "counterexample(s)",
            )
        };
        let rt = TbDesign {
            design: r,
            files: source_files(r, files.0)?,
        };
        let ct = TbDesign {
            design: c,
            files: source_files(c, files.1)?,
        };
        match explain::testbench::testbench(&rt, &ct, shared, &vectors) {
            Ok(tb) => {
                write_atomic(path, tb.text.as_bytes()).map_err(|e| report_input_error(&e))?;
                eprintln!(
                    "testbench: {path} ({} {what}); run: iverilog {} -o tb.vvp {path}{}{} && vvp tb.vvp",
                    vectors.len(),
                    tb.generation,
                    if tb.compile_with.is_empty() { "" } else { " " },
                    tb.compile_with.join(" "),
                    path = path.display(),
                );
            }
            Err(m) => eprintln!("testbench: not written: {m}"),
        }
    }
    Ok(())
}
