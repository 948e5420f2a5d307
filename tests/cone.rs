//! Integration tests of the cone audit and the stats report (one binary, themed modules).

#[path = "cone/cli.rs"]
mod cli;
#[path = "cone/common.rs"]
mod common;
#[path = "cone/evidence.rs"]
mod evidence;
#[path = "cone/flags.rs"]
mod flags;
#[path = "cone/iscas.rs"]
mod iscas;
#[path = "oracle/mod.rs"]
mod oracle;
#[path = "runner/mod.rs"]
mod runner;
#[path = "cone/selectors.rs"]
mod selectors;
