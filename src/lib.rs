//! equicone: combinational equivalence checking and cone audits for hand-optimized logic.
//!
//! The pipeline: netlist text ([`front`]) -> [`design::Design`] with an and-inverter graph
//! ([`aig`]) -> random simulation and Tseitin CNF solved by varisat in the proof engine
//! ([`engine`]) -> reports (text and JSON).
//!
//! The library's front door is the list of re-exports below: read a design
//! ([`load_texts`], [`read_bench`], [`read_verilog`], or [`load`] from a [`Files`] store such
//! as [`MemoryFiles`]: the library opens no file itself), compare two with one check session
//! ([`check()`]), audit the cones of one ([`audit`]), generate circuits ([`generate`]). The
//! public modules stay reachable for tests, examples and benchmarks that look inside one step;
//! the Verilog lexer, parser and syntax tree, the CNF encoder, the report printers, the
//! certificate checker and the diagnosis are internal. `cli` is the command line of the
//! `equicone` binary, public only so that the binary can call it.

pub mod aig;
pub mod algebra;
pub mod assume;
pub(crate) mod bitrun;
pub(crate) mod certify;
pub mod check;
#[doc(hidden)]
pub mod cli;
pub(crate) mod cnf;
pub mod cone;
pub mod cost;
pub mod demo;
pub mod design;
pub mod diag;
pub(crate) mod diagnose;
pub mod engine;
pub mod explain;
pub mod front;
pub mod gen;
pub(crate) mod hash;
pub mod host;
pub mod portmap;
pub(crate) mod report;
pub mod rng;
pub mod routes;
pub mod sat;
pub mod seq;
pub(crate) mod shard;

pub use aig::{Aig, Lit};
pub use check::{check, miter_cnf, CheckError, CheckOutcome, CheckRequest, DiagnosisRequest};
pub use cone::{audit, AuditOptions, AuditReport};
pub use design::{Design, Format, InputBit, OutputBit};
pub use diag::{Diagnostic, InputError, SourcePos};
pub use engine::{
    prove, EngineKind, PairBy, PairVerdict, ProveOptions, ProveReport, Side, Verdict,
};
pub use front::bench::read_bench;
pub use front::verilog::read_verilog;
pub use front::{load, load_texts, Files, MemoryFiles, Source};
pub use gen::{generate, GenFormat, GenSpec, Kind, Style};
pub use sat::Limits;
