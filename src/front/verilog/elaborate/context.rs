//! What an expression is evaluated in ([`EvalContext`]): the name scope, whether only
//! constants may be read, and, inside an `always` block, the current values of the
//! variables the block has assigned so far ([`Env`], written by statement lowering and read
//! by expression evaluation). Shared by the three stages, owned by none of them.

use super::super::pos::Pos;
use crate::aig::Lit;
use std::collections::BTreeMap;

/// The state of one variable bit during symbolic execution.
#[derive(Copy, Clone, Debug, PartialEq, Eq)]
pub enum BitState {
    /// Assigned on every path so far, with this value.
    Set(Lit),
    /// Not assigned on any path so far; the statement that has such a path, if any.
    Unset(Option<Pos>),
    /// Assigned, with `value`, on the paths where `assigned` holds; `gap` is the statement
    /// with a path that does not assign it (a latch unless `assigned` covers every value).
    Partial {
        /// The value where assigned.
        value: Lit,
        /// Where it is assigned.
        assigned: Lit,
        /// The statement with an unassigning path.
        gap: Pos,
    },
}

/// Current values of the variables an always block has assigned.
#[derive(Clone, Debug, Default)]
pub struct Env {
    /// Bit states by net, for the nets assigned so far.
    pub(super) vars: BTreeMap<u32, Vec<BitState>>,
}

impl Env {
    /// The current value of bit `off` of net `n`, if assigned.
    pub fn bit(&self, n: u32, off: usize) -> Option<Lit> {
        match self.vars.get(&n)?.get(off)? {
            BitState::Set(l) => Some(*l),
            BitState::Unset(_) | BitState::Partial { .. } => None,
        }
    }

    /// Replace the bits of net `n` by their current values where assigned.
    pub fn overlay(&self, n: u32, bits: &mut [Lit]) {
        if let Some(v) = self.vars.get(&n) {
            for (b, s) in bits.iter_mut().zip(v) {
                if let BitState::Set(l) = s {
                    *b = *l;
                }
            }
        }
    }
}

/// Evaluation context: the scope, the current values of an always block's variables, and
/// whether only constants (parameters, genvars) may be read.
#[derive(Clone, Copy)]
pub struct EvalContext<'e> {
    /// Scope for name lookup.
    pub scope: u32,
    /// Variables of the enclosing always block.
    pub env: Option<&'e Env>,
    /// Constant expression (ranges, parameters, generate conditions).
    pub constant: bool,
}

impl<'e> EvalContext<'e> {
    /// Plain context in scope `scope`.
    pub fn new(scope: u32) -> EvalContext<'static> {
        EvalContext {
            scope,
            env: None,
            constant: false,
        }
    }

    /// Constant context in scope `scope`.
    pub fn constant(scope: u32) -> EvalContext<'static> {
        EvalContext {
            scope,
            env: None,
            constant: true,
        }
    }
}
