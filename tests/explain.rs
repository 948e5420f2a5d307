//! Integration tests of explaining and replaying differences (one binary, themed modules):
//! VCD files read back by an independent reader, testbenches run by Icarus Verilog, and
//! difference cubes checked by exhaustive simulation written without equicone's code.

#[path = "explain/clocked.rs"]
mod clocked;
#[path = "explain/common.rs"]
mod common;
#[path = "explain/cubes.rs"]
mod cubes;
#[path = "oracle/mod.rs"]
mod oracle;
#[path = "explain/replay.rs"]
mod replay;
#[allow(dead_code)]
#[path = "seq/oracle.rs"]
mod seq_oracle;
#[path = "explain/vcd_reader.rs"]
mod vcd_reader;
#[allow(dead_code)]
#[path = "verilog/common.rs"]
mod vcommon;
