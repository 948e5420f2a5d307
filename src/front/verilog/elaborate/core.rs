//! What every stage of the elaborator reads and writes ([`Core`]): the graph under
//! construction, whose leaf `k` is a bit of a net or an unknown-value source; the nets, each
//! leaf's owner and driver; the name scopes; and the diagnostics. The stages' own state is in
//! [`super::Flattening`], [`super::Lowering`] and [`super::Expressions`].

use super::super::ast::{Dir, NetType};
use super::super::pos::Pos;
use super::super::symbols::{Interner, Sym};
use super::Value;
use crate::aig::{Aig, Lit};
use crate::diag::{Diagnostic, SourcePos};
use std::sync::Arc;

/// Marks an entry of [`Core::owner`] as an unknown-value source (the rest of the bits index
/// [`Core::unknowns`]).
pub(super) const UNKNOWN_BIT: u32 = 1 << 31;

/// A net or variable of the flattened design.
#[derive(Clone, Debug)]
pub(super) struct Net {
    pub(super) name: Sym,
    pub(super) scope: u32,
    pub(super) first: u32,
    pub(super) width: u32,
    pub(super) msb: i64,
    pub(super) lsb: i64,
    pub(super) signed: bool,
    pub(super) vector: bool,
    pub(super) ty: NetType,
    pub(super) dir: Option<Dir>,
    pub(super) pos: Pos,
}

impl Net {
    /// Offset (0 = least significant) of declared index `i`, if in range.
    pub(super) fn offset(&self, i: i64) -> Option<u32> {
        let off = if self.msb >= self.lsb {
            i.saturating_sub(self.lsb)
        } else {
            self.lsb.saturating_sub(i)
        };
        (0..self.width as i64).contains(&off).then_some(off as u32)
    }

    /// Declared index of offset `off`.
    pub(super) fn index(&self, off: u32) -> i64 {
        if self.msb >= self.lsb {
            self.lsb + off as i64
        } else {
            self.lsb - off as i64
        }
    }
}

/// What a name means in a scope.
#[derive(Clone, Debug)]
pub(super) enum Symbol {
    /// A net or variable: its index in `Core::nets`.
    Net(u32),
    /// A parameter: its value and declared range (left index, right index).
    Param(Box<(Value, i64, i64)>),
    /// A genvar: its value while a generate loop runs, `None` outside one.
    Genvar(Option<Box<Value>>),
    /// A function: its index in `Lowering::funcs`.
    Func(u32),
}

/// A name scope: a module instance or a generate block.
#[derive(Debug)]
pub(super) struct Scope {
    pub(super) parent: Option<u32>,
    pub(super) prefix: String,
    pub(super) syms: crate::hash::FastMap<Sym, Symbol>,
    pub(super) module: u32,
}

/// One unknown-value source bit.
#[derive(Clone, Debug)]
pub(super) struct Unknown {
    pub(super) pos: Pos,
    pub(super) what: String,
    pub(super) scope: u32,
    pub(super) bit: u32,
}

/// A net bit's driver.
#[derive(Copy, Clone, Debug)]
pub(super) struct Driver {
    pub(super) lit: Lit,
    pub(super) pos: Pos,
}

/// The state every stage shares.
pub(super) struct Core<'a> {
    /// Interned names.
    pub(super) names: &'a Interner,
    /// File names, for positions in messages.
    pub(super) files: &'a [Arc<str>],
    /// The intermediate graph: one leaf per net bit and unknown-value source.
    pub(super) aig: Aig,
    /// Per leaf: the net it is a bit of, or [`UNKNOWN_BIT`] with the unknown's index.
    pub(super) owner: Vec<u32>,
    /// Unknown-value sources.
    pub(super) unknowns: Vec<Unknown>,
    /// Nets and variables of the flattened design.
    pub(super) nets: Vec<Net>,
    /// Per leaf: its driver, once one is recorded.
    pub(super) drivers: Vec<Option<Driver>>,
    /// Name scopes: module instances and generate blocks.
    pub(super) scopes: Vec<Scope>,
    /// Errors found so far.
    pub(super) errors: Vec<Diagnostic>,
    /// Warnings found so far.
    pub(super) warnings: Vec<Diagnostic>,
    /// Above 0 while a width is computed without recording diagnostics.
    pub(super) quiet: u32,
}

impl<'a> Core<'a> {
    pub(super) fn new(names: &'a Interner, files: &'a [Arc<str>]) -> Self {
        Core {
            names,
            files,
            aig: Aig::new(),
            owner: Vec::new(),
            unknowns: Vec::new(),
            nets: Vec::new(),
            drivers: Vec::new(),
            scopes: Vec::new(),
            errors: Vec::new(),
            warnings: Vec::new(),
            quiet: 0,
        }
    }

    /// The same state with names and files of another lifetime.
    pub(super) fn rebind<'n>(self, names: &'n Interner, files: &'n [Arc<str>]) -> Core<'n> {
        Core {
            names,
            files,
            aig: self.aig,
            owner: self.owner,
            unknowns: self.unknowns,
            nets: self.nets,
            drivers: self.drivers,
            scopes: self.scopes,
            errors: self.errors,
            warnings: self.warnings,
            quiet: self.quiet,
        }
    }

    pub(super) fn source_pos(&self, p: Pos) -> SourcePos {
        let f = self
            .files
            .get(p.file as usize)
            .cloned()
            .unwrap_or_else(|| Arc::from("?"));
        SourcePos::new(&f, p.line, p.col)
    }

    /// Record an error and what to do about it (unless inside a quiet width computation).
    pub(super) fn error(&mut self, p: Pos, msg: impl Into<String>, help: impl Into<String>) {
        if self.quiet == 0 {
            let d = Diagnostic::error(Some(self.source_pos(p)), msg).with_help(help);
            self.errors.push(d);
        }
    }

    /// The error for a use of `name`, which no scope up to the module declares.
    pub(super) fn error_undeclared(&mut self, p: Pos, name: &str) {
        if self.quiet == 0 {
            let d = Diagnostic::error(Some(self.source_pos(p)), format!("undeclared name `{name}`"))
                .with_help("declare it (`wire`, `reg`, `input`, `output`, `parameter`) before this use, or check the spelling")
                .of_kind(crate::diag::Kind::UndeclaredName);
            self.errors.push(d);
        }
    }

    pub(super) fn warn(&mut self, p: Pos, msg: impl Into<String>) {
        if self.quiet == 0 {
            let d = Diagnostic::warning(Some(self.source_pos(p)), msg);
            self.warnings.push(d);
        }
    }

    pub(super) fn name(&self, s: Sym) -> &'a str {
        let names: &'a Interner = self.names;
        names.name(s)
    }

    /// Full hierarchical name of a net.
    pub(super) fn net_name(&self, n: u32) -> String {
        let net = &self.nets[n as usize];
        format!(
            "{}{}",
            self.scopes[net.scope as usize].prefix,
            self.name(net.name)
        )
    }

    /// Name of one bit of a net (`w` or `w[3]`).
    pub(super) fn bit_name(&self, n: u32, off: u32) -> String {
        let net = &self.nets[n as usize];
        let idx = net.vector.then(|| net.index(off));
        crate::design::bit_name(&self.net_name(n), idx)
    }

    /// Name of a leaf for messages.
    pub(super) fn leaf_name(&self, leaf: u32) -> String {
        let o = self.owner[leaf as usize];
        if o & UNKNOWN_BIT != 0 {
            return "an unknown value".into();
        }
        let off = leaf - self.nets[o as usize].first;
        self.bit_name(o, off)
    }

    pub(super) fn new_scope(&mut self, parent: Option<u32>, prefix: String, module: u32) -> u32 {
        self.scopes.push(Scope {
            parent,
            prefix,
            syms: Default::default(),
            module,
        });
        (self.scopes.len() - 1) as u32
    }

    /// Look a name up through the enclosing scopes of one module instance.
    pub(super) fn lookup(&self, mut scope: u32, s: Sym) -> Option<&Symbol> {
        loop {
            let entry = &self.scopes[scope as usize];
            if let Some(sym) = entry.syms.get(&s) {
                return Some(sym);
            }
            scope = entry.parent?;
        }
    }

    /// Room for `nets` more one-bit nets in scope `scope`.
    pub(super) fn reserve(&mut self, scope: u32, nets: usize) {
        self.nets.reserve(nets);
        self.owner.reserve(nets);
        self.drivers.reserve(nets);
        self.scopes[scope as usize].syms.reserve(nets);
    }

    /// Create a net with fresh leaves.
    #[allow(clippy::too_many_arguments)]
    pub(super) fn add_net(
        &mut self,
        scope: u32,
        name: Sym,
        msb: i64,
        lsb: i64,
        vector: bool,
        signed: bool,
        ty: NetType,
        dir: Option<Dir>,
        pos: Pos,
    ) -> u32 {
        let width = (msb - lsb).unsigned_abs() as u32 + 1;
        let id = self.nets.len() as u32;
        let first = self.aig.num_inputs() as u32;
        for _ in 0..width {
            self.aig.add_input();
            self.owner.push(id);
            self.drivers.push(None);
        }
        self.nets.push(Net {
            name,
            scope,
            first,
            width,
            msb,
            lsb,
            signed,
            vector,
            ty,
            dir,
            pos,
        });
        self.scopes[scope as usize]
            .syms
            .insert(name, Symbol::Net(id));
        id
    }

    /// Literals of a net's bits (its leaves).
    pub(super) fn net_bits(&self, n: u32) -> Vec<Lit> {
        let net = &self.nets[n as usize];
        (0..net.width)
            .map(|k| self.aig.input_lit((net.first + k) as usize))
            .collect()
    }

    /// Fresh unknown-value bits.
    pub(super) fn unknown_bits(&mut self, n: usize, pos: Pos, what: &str, scope: u32) -> Vec<Lit> {
        (0..n)
            .map(|k| {
                let l = self.aig.add_input();
                self.owner.push(UNKNOWN_BIT | self.unknowns.len() as u32);
                self.drivers.push(None);
                self.unknowns.push(Unknown {
                    pos,
                    what: what.to_string(),
                    scope,
                    bit: k as u32,
                });
                l
            })
            .collect()
    }

    /// Drive bit `off` of net `n` with `lit`.
    pub(super) fn drive(&mut self, n: u32, off: u32, lit: Lit, pos: Pos) {
        let leaf = (self.nets[n as usize].first + off) as usize;
        if let Some(d) = self.drivers[leaf] {
            let first = self.source_pos(d.pos);
            let bn = self.bit_name(n, off);
            self.error(
                pos,
                format!("multiple drivers: `{bn}` is already driven at {first}"),
                "drive each net bit from exactly one assignment, gate, port or always block",
            );
            return;
        }
        self.drivers[leaf] = Some(Driver { lit, pos });
    }
}
