//! The command line: flags (defined once, with their help), dispatch to the commands, and exit
//! codes. Only this layer and the report layer touch files and standard streams.
//!
//! Exit codes: 0 equivalent / nothing flagged, 1 different / something flagged, 2 bad input or
//! usage, 3 undecided (a limit was hit), 4 internal error (no claim is made).

#[macro_use]
mod enums;
mod clocked;
mod common;
mod cone;
mod demo;
mod eval;
mod eval_trace;
mod files;
mod gen;
mod gen_enums;
mod host;
mod merge;
mod prove;
mod remap;
mod replay;
mod routes;

use clap::{Parser, Subcommand};

/// Exit codes, part of the interface.
#[derive(Copy, Clone, Debug, PartialEq, Eq)]
pub enum Exit {
    /// Equivalent, or nothing flagged.
    Ok = 0,
    /// Different, or something flagged.
    Flagged = 1,
    /// Bad input or usage.
    BadInput = 2,
    /// Undecided: a resource limit was hit.
    Undecided = 3,
    /// An internal check failed; no claim is made.
    Internal = 4,
}

/// equicone: prove a rewritten combinational block equal to its reference, or show where it differs.
#[derive(Parser, Debug)]
#[command(name = "equicone", version, about, long_about = None)]
#[command(
    after_help = "Exit codes: 0 equivalent / nothing flagged, 1 different / flagged, 2 bad input or usage, 3 undecided, 4 internal error.\nLogs: RUST_LOG=debug.\nA proof covers zero-delay Boolean logic as modeled, not timing, power or layout."
)]
pub struct Cli {
    /// The command.
    #[command(subcommand)]
    pub command: Command,
}

/// The commands.
#[derive(Subcommand, Debug)]
pub enum Command {
    /// Run the built-in demo: the Tidewater 7 buoy's sensor selector, proved, broken and audited.
    Demo(demo::DemoArgs),
    /// Prove CAND equivalent to REF for every input, or give a checked counterexample.
    Prove(Box<prove::ProveArgs>),
    /// Evaluate a design's outputs for one input vector.
    Eval(eval::EvalArgs),
    /// Write the miter of REF and CAND as DIMACS CNF for an external solver.
    Cnf(prove::CnfArgs),
    /// For each value of a select bus, show which data input each output follows (by constant folding or SAT).
    Routes(routes::RoutesArgs),
    /// Write a generated circuit (selectors, decoders, priority encoders, shifters, adders,
    /// multipliers, popcounts, majorities, comparators, dividers, square roots, arbiters, random
    /// circuits; optionally with a planted bug), or `gen remap DESIGN --k K`: a design rewritten
    /// into K-input lookup functions.
    Gen(gen::GenArgs),
    /// Audit each output's structural cone against its exact support; flag redundant inputs.
    Cone(cone::ConeArgs),
    /// Gate counts, cost, delay and depth, with the lower bounds each output's support implies.
    Stats(cone::StatsArgs),
    /// Merge the partial reports of `prove --shard K/N` (or `cone --shard K/N`) runs into the whole report.
    Merge(merge::MergeArgs),
}

/// Run a parsed command line and return its exit code.
pub fn run(cli: Cli) -> Exit {
    host::install();
    match cli.command {
        Command::Demo(a) => demo::run(&a),
        Command::Prove(a) => prove::run(&a),
        Command::Eval(a) => eval::run(&a),
        Command::Cnf(a) => prove::run_cnf(&a),
        Command::Routes(a) => routes::run(&a),
        Command::Gen(a) => gen::run(&a),
        Command::Cone(a) => cone::run_cone(&a),
        Command::Stats(a) => cone::run_stats(&a),
        Command::Merge(a) => merge::run(&a),
    }
}
