//! equicone: combinational equivalence checking and cone audits for hand-optimized logic.
//!
//! The pipeline: netlist text ([`front`]) -> [`design::Design`] with an and-inverter graph
//! ([`aig`]) -> random simulation and Tseitin CNF ([`cnf`]) solved by varisat ([`sat`]) in the
//! proof engine ([`engine`]) -> reports ([`report`]).

pub mod aig;
pub mod algebra;
pub mod assume;
pub mod certify;
pub mod check;
pub mod cli;
pub mod cnf;
pub mod cone;
pub mod cost;
pub mod demo;
pub mod design;
pub mod diag;
pub mod diagnose;
pub mod engine;
pub mod explain;
pub mod front;
pub mod gen;
pub(crate) mod hash;
pub mod portmap;
pub mod report;
pub mod rng;
pub mod routes;
pub mod sat;
pub mod seq;
pub mod shard;

pub use aig::{Aig, Lit};
pub use design::{Design, Format, InputBit, OutputBit};
pub use diag::{Diagnostic, InputError, SourcePos};
