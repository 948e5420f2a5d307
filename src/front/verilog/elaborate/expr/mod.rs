//! Expression stage: the self-determined type of an expression (`types.rs`, IEEE 1364-2005
//! clauses 5.4.1 and 5.5.1), its evaluation to AIG literals at a given width (`eval.rs`),
//! casts (`cast.rs`), bit and part selects (`select.rs`), the array divider and constant powers
//! (`divide.rs`), and the check of `===`/`!==` operands once every net has its driver
//! (`case_eq.rs`).
//!
//! State it needs: from [`super::core::Core`] the scopes and nets to look names up (read),
//! the AIG it adds gates to, and the unknown-value sources and diagnostics it records; an
//! [`super::context::Env`] for the values of an `always` block's variables (read); its own
//! [`super::Expressions`] (the `===` sites). Function calls go to the statement stage.

mod case_eq;
mod cast;
mod divide;
mod eval;
mod select;
mod types;
pub(super) use types::ExprType;
