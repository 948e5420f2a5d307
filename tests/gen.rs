//! Integration tests of the circuit generators (`equicone::gen`). Outside references: Rust's own
//! u128 arithmetic for adders and multipliers, a bench evaluator written here independently of
//! the generator's IR, and Icarus Verilog for the Verilog text.

#[path = "gen/iverilog.rs"]
mod iverilog;
#[path = "gen/support.rs"]
mod support;

#[path = "gen/arith.rs"]
mod arith;
#[path = "gen/clocked.rs"]
mod clocked;
#[path = "gen/families.rs"]
mod families;
#[path = "gen/kinds.rs"]
mod kinds;
#[path = "gen/misc.rs"]
mod misc;
#[path = "gen/mult_family.rs"]
mod mult_family;
#[path = "gen/mutants.rs"]
mod mutants;
#[path = "oracle/mod.rs"]
mod oracle;
#[path = "gen/random_circuits.rs"]
mod random_circuits;
#[path = "gen/remap.rs"]
mod remap;
#[path = "gen/selectors.rs"]
mod selectors;
#[allow(dead_code)]
#[path = "seq/oracle.rs"]
mod seq_oracle;
#[allow(dead_code)]
#[path = "verilog/common.rs"]
mod vcommon;
#[path = "gen/verilog.rs"]
mod verilog;
