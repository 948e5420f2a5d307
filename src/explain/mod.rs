//! Explaining a difference and replaying it where designers look: difference cubes
//! ([`cubes`]), Value Change Dumps ([`vcd`]) and self-checking Verilog testbenches
//! ([`testbench`]).

pub mod cubes;
pub mod ternary;
pub mod explanation;
pub mod notation;

pub use explanation::{explain, explanation_text, Explanation};
pub mod nets;
pub mod vcd;
pub mod waves;
pub mod testbench;
pub mod verilog_out;

/// Differing output pairs explained by default (the rest are counted as skipped).
pub const MAX_PAIRS: usize = 32;
