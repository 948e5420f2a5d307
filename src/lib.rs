//! equicone: combinational equivalence checking and cone audits for hand-optimized logic.
//!
//! The pipeline: netlist text ([`front`]) -> [`design::Design`] with an and-inverter graph
//! ([`aig`]) -> random simulation and Tseitin CNF ([`cnf`]) solved by varisat ([`sat`]) in the
//! proof engine ([`engine`]) -> reports ([`report`]).

pub mod aig;
pub mod design;
pub mod diag;
pub mod front;

pub use aig::{Aig, Lit};
pub use design::{Design, Format, InputBit, OutputBit};
pub use diag::{Diagnostic, InputError, SourcePos};
