//! Elaboration: parsed modules to one flat graph. Every net bit is a placeholder input
//! ("leaf") of an intermediate AIG; assignments, gates, port connections and `always`
//! blocks record each leaf's driver; [`resolve`] then builds the design's AIG from the
//! outputs back through the drivers (iteratively, finding combinational loops).
//!
//! Stages: [`flatten`] walks the instance hierarchy from the top module, declaring nets and
//! parameters scope by scope; it hands expressions to [`expr`] (typing and evaluation to
//! literals) and `always` blocks to [`stmt`] (statement lowering), which uses [`expr`] in
//! turn; what they share is in [`context`] and the state below ([`Elaborator`]).
//!
//! **Invariant:** leaf `k` of the intermediate AIG is either a bit of a net (`owner[k]`) or
//! an unknown-value source; each net bit has at most one driver.

mod bits;
mod case_eq;
mod context;
mod expr;
mod flatten;
mod resolve;
mod stmt;

use super::ast::{Dir, Module, NetType};
use super::pos::Pos;
use super::symbols::{Interner, Sym};
use crate::aig::{Aig, Lit};
use crate::design::{CellKind, Design};
use crate::diag::{Diagnostic, InputError, SourcePos};
use std::collections::HashMap;
use std::sync::Arc;

/// Deepest instance hierarchy accepted.
const MAX_HIER: usize = 64;
/// Most iterations of one `for` loop.
const MAX_LOOP: usize = 1 << 16;
/// Widest expression accepted, in bits.
const MAX_WIDTH: usize = 1 << 16;

/// Widest multiplication built (an array multiplier of w bits has about w * w / 2 gates).
const MAX_MUL_WIDTH: usize = 4096;

/// Widest `/` or `%` of non-constant operands (the array divider of w bits has about
/// 3 * w * w gates).
const MAX_DIV_WIDTH: usize = 256;

/// The number of bits from index `m` to index `l` inclusive, computed without overflow;
/// `None` when it is more than [`MAX_WIDTH`].
fn span(m: i64, l: i64) -> Option<usize> {
    let d = (i128::from(m) - i128::from(l)).unsigned_abs();
    (d < MAX_WIDTH as u128).then(|| d as usize + 1)
}

/// A constant or symbolic value: bits LSB first, and signedness.
#[derive(Clone, Debug)]
pub struct Value {
    /// Bits, least significant first.
    pub bits: Vec<Lit>,
    /// Signed?
    pub signed: bool,
}

/// A net or variable of the flattened design.
#[derive(Clone, Debug)]
pub struct Net {
    name: Sym,
    scope: u32,
    first: u32,
    width: u32,
    msb: i64,
    lsb: i64,
    signed: bool,
    vector: bool,
    ty: NetType,
    dir: Option<Dir>,
    pos: Pos,
}

impl Net {
    /// Offset (0 = least significant) of declared index `i`, if in range.
    fn offset(&self, i: i64) -> Option<u32> {
        let off = if self.msb >= self.lsb {
            i.saturating_sub(self.lsb)
        } else {
            self.lsb.saturating_sub(i)
        };
        (0..self.width as i64).contains(&off).then_some(off as u32)
    }

    /// Declared index of offset `off`.
    fn index(&self, off: u32) -> i64 {
        if self.msb >= self.lsb {
            self.lsb + off as i64
        } else {
            self.lsb - off as i64
        }
    }
}

/// What a name means in a scope.
#[derive(Clone, Debug)]
enum Symbol {
    /// A net or variable: its index in `Elaborator::nets`.
    Net(u32),
    /// A parameter: its value and declared range (left index, right index).
    Param(Box<(Value, i64, i64)>),
    /// A genvar: its value while a generate loop runs, `None` outside one.
    Genvar(Option<Box<Value>>),
}

/// A name scope: a module instance or a generate block.
#[derive(Debug)]
struct Scope {
    parent: Option<u32>,
    prefix: String,
    syms: crate::hash::FastMap<Sym, Symbol>,
    module: u32,
}

/// One unknown-value source bit.
#[derive(Clone, Debug)]
struct Unknown {
    pos: Pos,
    what: String,
    scope: u32,
    bit: u32,
}

/// A net bit's driver.
#[derive(Copy, Clone, Debug)]
struct Driver {
    lit: Lit,
    pos: Pos,
}

/// A gate primitive as written (for the netlist); its inputs are
/// `Elaborator::gate_ins[first..first + count]`.
#[derive(Clone, Debug)]
struct GateRecord {
    kind: CellKind,
    count: u32,
    first: u32,
    out: u32,
    pos: Pos,
}

const UNKNOWN_BIT: u32 = 1 << 31;

/// The elaborator's state.
pub struct Elaborator<'a> {
    names: &'a Interner,
    files: &'a [Arc<str>],
    modules: HashMap<Sym, &'a Module>,
    module_list: Vec<&'a Module>,
    aig: Aig,
    owner: Vec<u32>,
    unknowns: Vec<Unknown>,
    nets: Vec<Net>,
    drivers: Vec<Option<Driver>>,
    scopes: Vec<Scope>,
    gates: Vec<GateRecord>,
    gate_ins: Vec<Lit>,
    errors: Vec<Diagnostic>,
    warnings: Vec<Diagnostic>,
    quiet: u32,
    hier: Vec<Sym>,
    /// Decided coverage conditions of `always` blocks, by literal.
    coverage_memo: crate::hash::FastMap<u32, stmt::Coverage>,
    /// Registers of clocked `always` blocks (`stmt/clocked.rs`).
    clocked: stmt::Clocked,
    /// Each `===`/`!==`: where, and its operand bits (see `case_eq.rs`).
    case_eq: Vec<(Pos, &'static str, Vec<Lit>)>,
    /// `defparam`s waiting for the instance they name (`flatten/defparam.rs`).
    defparams: Vec<flatten::PendingDefparam>,
}

impl<'a> Elaborator<'a> {
    fn new(names: &'a Interner, files: &'a [Arc<str>], mods: &'a [Module]) -> Self {
        let mut modules = HashMap::new();
        for m in mods {
            modules.entry(m.name).or_insert(m);
        }
        Elaborator {
            names,
            files,
            modules,
            module_list: mods.iter().collect(),
            aig: Aig::new(),
            owner: Vec::new(),
            unknowns: Vec::new(),
            nets: Vec::new(),
            drivers: Vec::new(),
            scopes: Vec::new(),
            gates: Vec::new(),
            gate_ins: Vec::new(),
            errors: Vec::new(),
            warnings: Vec::new(),
            quiet: 0,
            hier: Vec::new(),
            coverage_memo: Default::default(),
            clocked: Default::default(),
            case_eq: Vec::new(),
            defparams: Vec::new(),
        }
    }

    /// The same state without the borrowed syntax tree, so that the tree can be freed
    /// before the design is built.
    fn detach<'n>(self, names: &'n Interner, files: &'n [Arc<str>]) -> Elaborator<'n> {
        Elaborator {
            names,
            files,
            modules: HashMap::new(),
            module_list: Vec::new(),
            aig: self.aig,
            owner: self.owner,
            unknowns: self.unknowns,
            nets: self.nets,
            drivers: self.drivers,
            scopes: self.scopes,
            gates: self.gates,
            gate_ins: self.gate_ins,
            errors: self.errors,
            warnings: self.warnings,
            quiet: self.quiet,
            hier: self.hier,
            coverage_memo: self.coverage_memo,
            clocked: self.clocked,
            case_eq: self.case_eq,
            defparams: self.defparams,
        }
    }

    fn source_pos(&self, p: Pos) -> SourcePos {
        let f = self
            .files
            .get(p.file as usize)
            .cloned()
            .unwrap_or_else(|| Arc::from("?"));
        SourcePos::new(&f, p.line, p.col)
    }

    /// Record an error and what to do about it (unless inside a quiet width computation).
    fn error(&mut self, p: Pos, msg: impl Into<String>, help: impl Into<String>) {
        if self.quiet == 0 {
            let d = Diagnostic::error(Some(self.source_pos(p)), msg).with_help(help);
            self.errors.push(d);
        }
    }

    /// The error for a use of `name`, which no scope up to the module declares.
    fn error_undeclared(&mut self, p: Pos, name: &str) {
        if self.quiet == 0 {
            let d = Diagnostic::error(Some(self.source_pos(p)), format!("undeclared name `{name}`"))
                .with_help("declare it (`wire`, `reg`, `input`, `output`, `parameter`) before this use, or check the spelling")
                .of_kind(crate::diag::Kind::UndeclaredName);
            self.errors.push(d);
        }
    }

    fn warn(&mut self, p: Pos, msg: impl Into<String>) {
        if self.quiet == 0 {
            let d = Diagnostic::warning(Some(self.source_pos(p)), msg);
            self.warnings.push(d);
        }
    }

    fn name(&self, s: Sym) -> &'a str {
        let names: &'a Interner = self.names;
        names.name(s)
    }

    /// Full hierarchical name of a net.
    fn net_name(&self, n: u32) -> String {
        let net = &self.nets[n as usize];
        format!(
            "{}{}",
            self.scopes[net.scope as usize].prefix,
            self.name(net.name)
        )
    }

    /// Name of one bit of a net (`w` or `w[3]`).
    fn bit_name(&self, n: u32, off: u32) -> String {
        let net = &self.nets[n as usize];
        let idx = net.vector.then(|| net.index(off));
        crate::design::bit_name(&self.net_name(n), idx)
    }

    /// Name of a leaf for messages.
    fn leaf_name(&self, leaf: u32) -> String {
        let o = self.owner[leaf as usize];
        if o & UNKNOWN_BIT != 0 {
            return "an unknown value".into();
        }
        let off = leaf - self.nets[o as usize].first;
        self.bit_name(o, off)
    }

    fn new_scope(&mut self, parent: Option<u32>, prefix: String, module: u32) -> u32 {
        self.scopes.push(Scope {
            parent,
            prefix,
            syms: Default::default(),
            module,
        });
        (self.scopes.len() - 1) as u32
    }

    /// Look a name up through the enclosing scopes of one module instance.
    fn lookup(&self, mut scope: u32, s: Sym) -> Option<&Symbol> {
        loop {
            let entry = &self.scopes[scope as usize];
            if let Some(sym) = entry.syms.get(&s) {
                return Some(sym);
            }
            scope = entry.parent?;
        }
    }

    /// Room for `nets` more one-bit nets in scope `scope` and `gates` more gate primitives.
    fn reserve(&mut self, scope: u32, nets: usize, gates: usize) {
        self.nets.reserve(nets);
        self.owner.reserve(nets);
        self.drivers.reserve(nets);
        self.scopes[scope as usize].syms.reserve(nets);
        self.gates.reserve(gates);
        self.gate_ins.reserve(2 * gates);
    }

    /// Create a net with fresh leaves.
    #[allow(clippy::too_many_arguments)]
    fn add_net(
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
    fn net_bits(&self, n: u32) -> Vec<Lit> {
        let net = &self.nets[n as usize];
        (0..net.width)
            .map(|k| self.aig.input_lit((net.first + k) as usize))
            .collect()
    }

    /// Fresh unknown-value bits.
    fn unknown_bits(&mut self, n: usize, pos: Pos, what: &str, scope: u32) -> Vec<Lit> {
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
    fn drive(&mut self, n: u32, off: u32, lit: Lit, pos: Pos) {
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

/// Elaborate `mods` (parsed from `files`) with top module `top` (or the one nobody
/// instantiates) into a design.
pub fn elaborate(
    names: &Interner,
    files: &[Arc<str>],
    mods: Vec<Module>,
    top: Option<&str>,
    keep_written: bool,
) -> Result<Design, InputError> {
    let mut e = Elaborator::new(names, files, &mods);
    if keep_written {
        e.aig = Aig::as_written();
    }
    // Duplicate module names.
    let mut seen: HashMap<Sym, Pos> = HashMap::new();
    for m in &mods {
        if let Some(&p) = seen.get(&m.name) {
            let sp = e.source_pos(p);
            let n = e.name(m.name).to_string();
            e.error(
                m.pos,
                format!("module `{n}` is defined twice (first at {sp})"),
                "rename one of the modules, or give the file that defines it only once",
            );
        } else {
            seen.insert(m.name, m.pos);
        }
    }
    let top_mod = match flatten::pick_top(&mut e, top) {
        Some(m) => m,
        None => {
            return Err(InputError {
                diagnostics: e.errors,
            })
        }
    };
    let scope = flatten::elab_instance(&mut e, top_mod, String::new(), Vec::new(), top_mod.pos);
    e.check_clocked_blocks();
    // The syntax tree is no longer needed: free it before the design is built.
    let (top_name, top_ports, top_pos) = (top_mod.name, top_mod.ports.clone(), top_mod.pos);
    let mut e = e.detach(names, files);
    drop(mods);
    e.check_case_eq();
    let design = resolve::build(&mut e, top_name, &top_ports, scope);
    if e.errors.is_empty() && design.outputs.is_empty() {
        let n = e.name(top_name);
        e.error(
            top_pos,
            format!("top module `{n}` has no output ports: nothing to check"),
            "give the top module at least one `output` port (equicone compares outputs), or choose another top module",
        );
    }
    if !e.errors.is_empty() {
        return Err(InputError {
            diagnostics: e.errors,
        });
    }
    Ok(design)
}
