//! `defparam` (IEEE 1364-2005 clause 12.2.1, from memory): `defparam u1.W = 8;` and paths
//! down the hierarchy (`defparam u1.u2.W = 8;`) set a parameter of an instance of the module
//! where they are written, or of an instance inside one. A module's `defparam`s are
//! evaluated (as constants of that module) before its instances are elaborated and wait,
//! keyed by the full name of the instance they name, until that instance is elaborated; they
//! take precedence over the instance's `#(...)` values (the same clause). One naming no
//! instance of the module is an error at the `defparam`.

use super::super::{Core, Elaborator, Flattening, Value};
use super::module::OverrideTarget;
use crate::front::verilog::ast::Item;
use crate::front::verilog::pos::Pos;
use crate::front::verilog::symbols::Sym;

/// A `defparam` waiting for its instance.
#[derive(Clone, Debug)]
pub struct PendingDefparam {
    /// The full name prefix of the instance (`u1.u2.`).
    prefix: String,
    /// The parameter.
    param: Sym,
    /// Its new value.
    value: Value,
    /// Where the `defparam` is written.
    pos: Pos,
    /// The scope it is written in.
    origin: u32,
    /// The path as written (`u1.u2.W`).
    text: String,
}

impl<'a> Elaborator<'a> {
    /// Record the `defparam`s among `items` (of scope `scope`).
    pub(super) fn collect_defparams(&mut self, scope: u32, items: &'a [Item]) {
        for it in items {
            let Item::Defparam(d) = it else { continue };
            let Some(value) = self.const_val(scope, &d.value) else {
                continue;
            };
            let Some(((param, _), insts)) = d.path.split_last() else {
                continue;
            };
            let mut prefix = self.core.scopes[scope as usize].prefix.clone();
            let mut text = String::new();
            for (s, _) in insts {
                prefix.push_str(self.core.name(*s));
                prefix.push('.');
                text.push_str(self.core.name(*s));
                text.push('.');
            }
            text.push_str(self.core.name(*param));
            self.flattening.defparams.push(PendingDefparam {
                prefix,
                param: *param,
                value,
                pos: d.pos,
                origin: scope,
                text,
            });
        }
    }
}

impl Flattening<'_> {
    /// The `defparam`s that name the instance with full name prefix `prefix`, as overrides.
    pub(super) fn take_defparams(&mut self, prefix: &str) -> Vec<(OverrideTarget, Value, Pos)> {
        if self.defparams.is_empty() {
            return Vec::new();
        }
        let (mine, rest): (Vec<_>, Vec<_>) = std::mem::take(&mut self.defparams)
            .into_iter()
            .partition(|d| d.prefix == prefix);
        self.defparams = rest;
        mine.into_iter()
            .map(|d| (OverrideTarget::Defparam(d.param), d.value, d.pos))
            .collect()
    }

    /// Errors for the `defparam`s written in `scope` that named no instance.
    pub(super) fn unresolved_defparams(&mut self, core: &mut Core, scope: u32) {
        if self.defparams.is_empty() {
            return;
        }
        let (mine, rest): (Vec<_>, Vec<_>) = std::mem::take(&mut self.defparams)
            .into_iter()
            .partition(|d| d.origin == scope);
        self.defparams = rest;
        for d in mine {
            let inst = d.text.rsplit_once('.').map_or("", |x| x.0).to_string();
            core.error(
                d.pos,
                format!("`defparam {}`: there is no instance `{inst}` here", d.text),
                "name an instance of this module (`u1.W`) or an instance inside one (`u1.u2.W`) by its instance names; paths through generate blocks, arrays of instances or from the top module's name are not read",
            );
        }
    }
}
