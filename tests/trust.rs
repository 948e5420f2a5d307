//! Trust in what is printed (issue "every printed claim true"): assumptions over a pin of one
//! design, the `cnf` formula under assumptions, values of buses declared `[0:7]` checked in
//! Icarus Verilog, pairing by position, replay by the candidate's names.

#[path = "trust/assume.rs"]
mod assume;
#[path = "trust/bounded.rs"]
mod bounded;
#[path = "trust/common.rs"]
mod common;
#[path = "trust/display.rs"]
mod display;
#[cfg(unix)]
#[path = "trust/filenames.rs"]
mod filenames;
#[path = "oracle/mod.rs"]
mod oracle;
#[path = "trust/portmap.rs"]
mod portmap;
#[path = "trust/ranges.rs"]
mod ranges;
#[path = "runner/mod.rs"]
mod runner;
#[path = "trust/schema.rs"]
mod schema;
#[allow(dead_code)]
#[path = "verilog/common.rs"]
mod vcommon;
