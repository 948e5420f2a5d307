//! `equicone gen`: write a generated reference or implementation circuit (or a mutant).

use super::common::{print, report_input_error, write_atomic};
use super::gen_enums::{BugArg, FormatArg, KindArg, StyleArg};
use super::Exit;
use crate::gen::{self, GenFormat, GenSpec, Kind};
use clap::Args;
use std::path::PathBuf;

/// Options of `gen`.
#[derive(Args, Debug)]
pub struct GenArgs {
    /// What to generate.
    #[arg(value_enum)]
    kind: KindArg,
    /// `remap` only: the design file to rewrite (bench or Verilog).
    #[arg(value_name = "DESIGN")]
    design: Option<PathBuf>,
    /// Size: channels of a selector, select bits of a decoder, requests of a priority encoder,
    /// bits of a shifter, adder or multiplier operand, gates of a random circuit, inputs of a
    /// popcount or majority, operand bits of a comparator or divider, root bits of a square
    /// root, requesters of an arbiter.
    #[arg(long)]
    n: Option<usize>,
    /// `remap` only: inputs per lookup function (2 to 6).
    #[arg(long, default_value_t = 6)]
    k: usize,
    /// `remap` only: the Verilog preprocessor's options for reading DESIGN.
    #[command(flatten)]
    pre: super::common::PreprocArgs,
    /// How to build it (default: the kind's first style, the one-line spec where there is one).
    #[arg(long, value_enum)]
    style: Option<StyleArg>,
    /// Selector channel width.
    #[arg(long, default_value_t = 1)]
    width: usize,
    /// Random circuits: number of inputs.
    #[arg(long, default_value_t = 64)]
    inputs: usize,
    /// Seed for every choice the generator makes.
    #[arg(long, default_value_t = 1)]
    seed: u64,
    /// Plant a bug (described in a comment at the top of the file).
    #[arg(long, value_enum)]
    bug: Option<BugArg>,
    /// Where to plant the bug: a net name as printed (default: chosen by the seed).
    #[arg(long, value_name = "NET")]
    at: Option<String>,
    /// Verilog module name.
    #[arg(long)]
    module: Option<String>,
    /// Multipliers, mac and squarers: two's complement signed operands.
    #[arg(long)]
    signed: bool,
    /// Multipliers, mac and squarers of style wallace, dadda or booth: the final adder
    /// (ripple, cla, kogge-stone, brent-kung; default ripple).
    #[arg(long, value_enum, value_name = "STYLE")]
    final_adder: Option<StyleArg>,
    /// Pipelined adder: register stages.
    #[arg(long, default_value_t = 2)]
    stages: usize,
    /// Clocked families: give every register a new name and store a fraction of them
    /// inverted (`--invert`; which ones follows `--seed`).
    #[arg(long)]
    rename: bool,
    /// With --rename: the fraction of registers stored inverted (0 to 1; at least one when
    /// above 0).
    #[arg(long, default_value_t = 0.1, value_name = "F")]
    invert: f64,
    /// Output format (default: bench when the output file ends in `.bench`, else Verilog).
    #[arg(long, value_enum)]
    format: Option<FormatArg>,
    /// Write to this file (atomically) instead of standard output.
    #[arg(short = 'o', long = "output", value_name = "FILE")]
    output: Option<PathBuf>,
}

/// Run `gen`.
pub fn run(a: &GenArgs) -> Exit {
    let kind = Kind::from(a.kind);
    let format = a.format.map(GenFormat::from).unwrap_or(match &a.output {
        Some(path) if path.as_os_str().as_encoded_bytes().ends_with(b".bench") => GenFormat::Bench,
        _ => GenFormat::Verilog,
    });
    if kind == Kind::Remap {
        return super::remap::run(
            a.design.as_deref(),
            a.k,
            &a.pre,
            (a.module.as_deref(), format, a.output.as_deref()),
        );
    }
    let Some(n) = a.n else {
        return report_input_error(&crate::diag::InputError::plain(
            format!("gen {} needs a size", kind.name()),
            "give --n (see `equicone gen --help` for what it counts)",
        ));
    };
    if a.design.is_some() {
        return report_input_error(&crate::diag::InputError::plain(
            format!("gen {} takes no design file", kind.name()),
            "only `gen remap DESIGN` reads a design; leave the file name out",
        ));
    }
    if a.rename && !(0.0..=1.0).contains(&a.invert) {
        return report_input_error(&crate::diag::InputError::plain(
            format!("--invert {}: not a fraction from 0 to 1", a.invert),
            "give --invert 0.1 for a tenth of the registers",
        ));
    }
    if a.rename && !gen::clocked::is_clocked(kind) {
        return report_input_error(&crate::diag::InputError::plain(
            format!(
                "--rename applies to the clocked families, not to {}",
                kind.name()
            ),
            "use it with reg-selector, pipe-adder, counter, shift-register, fsm or reg-random",
        ));
    }
    let spec = GenSpec {
        kind,
        style: a.style.map_or(kind.styles()[0], Into::into),
        n,
        width: a.width,
        inputs: a.inputs,
        seed: a.seed,
        bug: a.bug.map(Into::into),
        at: a.at.clone(),
        module: a.module.clone(),
        signed: a.signed,
        final_adder: a.final_adder.map(Into::into),
        stages: a.stages,
        rename: a.rename.then_some((a.invert * 1000.0).round() as u32),
    };
    // A phase line on a terminal: large circuits take a while to build and write.
    let bar = crate::host::spinner(true, &format!("generating {}", kind.name()));
    let g = gen::generate(&spec, format);
    let g = match g {
        Ok(g) => g,
        Err(e) => {
            bar.finish_and_clear();
            return report_input_error(&e.into());
        }
    };
    match &a.output {
        None => {
            bar.finish_and_clear();
            print(&g.text)
        }
        Some(path) => {
            bar.set_message(format!("writing {}", path.display()));
            let written = write_atomic(path, g.text.as_bytes());
            bar.finish_and_clear();
            if let Err(e) = written {
                return report_input_error(&e);
            }
            eprintln!(
                "wrote {}: {} ({} gates)",
                path.display(),
                g.description,
                g.gates
            );
            if let Some(m) = &g.mutation {
                eprintln!("planted bug: {m}");
            }
        }
    }
    Exit::Ok
}
