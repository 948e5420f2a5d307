//! Instance stage: module instances flattened into one set of scopes. Picks the top module,
//! declares each instance's nets and parameters in a fresh scope, runs generate blocks
//! (`module.rs`), and connects instance ports to the parent's nets (`instance.rs`, arrays of
//! instances too); `defparam`s wait for their instance in `defparam.rs`.
//!
//! State it needs: from [`super::core::Core`] the scope and net tables it fills, and its own
//! [`super::Flattening`]: the parsed modules (read), the instance path (for loops in the
//! hierarchy), the waiting `defparam`s, and the gate records of the netlist view.

mod defparam;
mod instance;
mod module;

pub(super) use defparam::PendingDefparam;
pub(super) use module::{elab_instance, pick_top};
