//! Statement stage: `always` blocks lowered to net drivers. Combinational blocks are run
//! symbolically (`always.rs`), their event lists checked against what they read
//! (`sensitivity.rs`), and a variable left unassigned on some path is a latch error unless
//! the paths that assign it cover every value (`coverage.rs`); edge-triggered blocks go to
//! `clocked.rs`. The checks of `unique`/`unique0`/`priority` are in `qualified.rs`. Calls
//! of the design's functions run the function's body the same way (`call.rs`).
//!
//! State it needs: an [`super::context::Env`] per block (its own), the expression stage to
//! evaluate right-hand sides and conditions, from [`super::core::Core`] the nets' drivers it
//! writes, and its own [`super::Lowering`]: the decided coverage conditions it memoizes, the
//! registers of clocked blocks ([`Clocked`], which the design build reads), the functions
//! declared and the calls in progress.

mod always;
mod call;
mod clocked;
mod coverage;
mod gated_clock;
mod initial;
mod qualified;
mod sensitivity;
mod sync_reset;
mod window;
pub(super) use clocked::Clocked;
pub(super) use coverage::Coverage;
