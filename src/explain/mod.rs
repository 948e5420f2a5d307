//! Explaining a difference and replaying it where designers look: difference cubes
//! ([`cubes`]), Value Change Dumps ([`vcd`]) and self-checking Verilog testbenches
//! ([`testbench`]).

pub mod cubes;
pub mod explanation;
pub mod notation;
pub mod ternary;

pub use explanation::{explain, explanation_text, Explanation};
pub mod nets;
pub mod testbench;
pub mod trace_bench;
pub mod trace_cubes;
pub mod trace_run;
pub mod trace_vcd;
pub mod vcd;
pub mod verilog_out;
pub mod waves;

/// Differing output pairs explained by default (the rest are counted as skipped).
pub const MAX_PAIRS: usize = 32;
