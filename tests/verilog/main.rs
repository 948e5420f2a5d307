//! Integration tests of the Verilog front-end (one test binary, themed modules).

mod arrays;
mod case_inside;
mod casts;
mod common;
mod corpus;
mod engine_checks;
mod fixtures;
mod functions;
mod hierarchy;
mod iverilog_diff;
mod large;
mod late_constructs;
mod memories;
mod netlists;
#[path = "../oracle/mod.rs"]
mod oracle;
mod preprocess;
mod primitives;
mod regress;
mod rtl_styles;
#[path = "../runner/mod.rs"]
mod runner;
mod semantics;
mod systemverilog;
mod top_choice;
