//! Elaboration: parsed modules to one flat graph. Every net bit is a placeholder input
//! ("leaf") of an intermediate AIG; assignments, gates, port connections and `always`
//! blocks record each leaf's driver; [`resolve`] then builds the design's AIG from the
//! outputs back through the drivers (iteratively, finding combinational loops).
//!
//! Stages: [`flatten`] walks the instance hierarchy from the top module, declaring nets and
//! parameters scope by scope; it hands expressions to [`expr`] (typing and evaluation to
//! literals) and `always` blocks to [`stmt`] (statement lowering), which uses [`expr`] in
//! turn. The state is split the same way: [`core::Core`] is what every stage reads and
//! writes (the graph, nets, drivers, scopes, diagnostics); [`Flattening`], [`Lowering`] and
//! [`Expressions`] are each stage's own, and a method that needs only its stage's state and
//! the core is written on that state with the core passed in (`Lowering::coverage`,
//! `Clocked::check_blocks`, `Flattening::take_defparams`, `Expressions::check_case_eq`).
//! What an expression is evaluated in is [`context`].
//!
//! **Invariant:** leaf `k` of the intermediate AIG is either a bit of a net (`owner[k]`) or
//! an unknown-value source; each net bit has at most one driver.

mod bits;
mod context;
mod core;
mod expr;
mod flatten;
mod resolve;
mod stmt;

use super::ast::Module;
use super::pos::Pos;
use super::symbols::{Interner, Sym};
use crate::aig::{Aig, Lit};
use crate::design::{CellKind, Design};
use crate::diag::InputError;
use core::{Core, Symbol, UNKNOWN_BIT};
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

/// Instance flattening's own state (`flatten/`): the parsed modules, the instance path, the
/// `defparam`s waiting for their instance, and the gate primitives as written (read once more
/// by [`resolve`] for the netlist view).
struct Flattening<'a> {
    /// Modules by name (the first of a name defined twice).
    modules: HashMap<Sym, &'a Module>,
    /// Modules in the order written.
    module_list: Vec<&'a Module>,
    /// The module names from the top to the instance being flattened (for loops).
    path: Vec<Sym>,
    /// Gate primitives as written.
    gates: Vec<GateRecord>,
    /// Their input literals.
    gate_ins: Vec<Lit>,
    /// `defparam`s waiting for the instance they name (`flatten/defparam.rs`).
    defparams: Vec<flatten::PendingDefparam>,
}

/// Statement lowering's own state (`stmt/`).
#[derive(Default)]
struct Lowering<'a> {
    /// Decided coverage conditions of `always` blocks, by literal.
    coverage_memo: crate::hash::FastMap<u32, stmt::Coverage>,
    /// Registers of clocked `always` blocks (`stmt/clocked.rs`).
    clocked: stmt::Clocked,
    /// Functions declared, with the scope they are declared in (`stmt/call.rs`).
    funcs: Vec<(&'a super::ast::Function, u32)>,
    /// The functions being called, innermost last (recursion is refused).
    calls: Vec<u32>,
}

/// The expression stage's own state (`expr/`).
#[derive(Default)]
struct Expressions {
    /// Each `===`/`!==`: where, the operator, and its operand bits (see `expr/case_eq.rs`).
    case_eq: Vec<(Pos, &'static str, Vec<Lit>)>,
}

/// The elaborator's state: what the stages share, and each stage's own.
pub struct Elaborator<'a> {
    core: Core<'a>,
    flattening: Flattening<'a>,
    lowering: Lowering<'a>,
    expressions: Expressions,
}

impl<'a> Elaborator<'a> {
    fn new(names: &'a Interner, files: &'a [Arc<str>], mods: &'a [Module]) -> Self {
        let mut modules = HashMap::new();
        for m in mods {
            modules.entry(m.name).or_insert(m);
        }
        Elaborator {
            core: Core::new(names, files),
            flattening: Flattening {
                modules,
                module_list: mods.iter().collect(),
                path: Vec::new(),
                gates: Vec::new(),
                gate_ins: Vec::new(),
                defparams: Vec::new(),
            },
            lowering: Lowering::default(),
            expressions: Expressions::default(),
        }
    }

    /// The same state without the borrowed syntax tree, so that the tree can be freed
    /// before the design is built.
    fn detach<'n>(self, names: &'n Interner, files: &'n [Arc<str>]) -> Elaborator<'n> {
        Elaborator {
            core: self.core.rebind(names, files),
            flattening: Flattening {
                modules: HashMap::new(),
                module_list: Vec::new(),
                path: self.flattening.path,
                gates: self.flattening.gates,
                gate_ins: self.flattening.gate_ins,
                defparams: self.flattening.defparams,
            },
            lowering: Lowering {
                coverage_memo: self.lowering.coverage_memo,
                clocked: self.lowering.clocked,
                funcs: Vec::new(),
                calls: Vec::new(),
            },
            expressions: self.expressions,
        }
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
        e.core.aig = Aig::as_written();
    }
    // Duplicate module names.
    let mut seen: HashMap<Sym, Pos> = HashMap::new();
    for m in &mods {
        if let Some(&p) = seen.get(&m.name) {
            let sp = e.core.source_pos(p);
            let n = e.core.name(m.name).to_string();
            e.core.error(
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
                diagnostics: e.core.errors,
            })
        }
    };
    let scope = flatten::elab_instance(&mut e, top_mod, String::new(), Vec::new(), top_mod.pos);
    e.lowering.clocked.check_blocks(&mut e.core);
    e.lowering.clocked.apply_initial(&mut e.core);
    log::debug!(
        "verilog: flattened: {} nets, {} net bits, {} AND nodes; memory {}",
        e.core.nets.len(),
        e.core.owner.len(),
        e.core.aig.num_ands(),
        crate::host::now_note()
    );
    // The syntax tree is no longer needed: free it before the design is built.
    let (top_name, top_ports, top_pos) = (top_mod.name, top_mod.ports.clone(), top_mod.pos);
    let mut e = e.detach(names, files);
    drop(mods);
    e.expressions.check_case_eq(&mut e.core);
    let design = resolve::build(&mut e, top_name, &top_ports, scope);
    if e.core.errors.is_empty() && design.outputs.is_empty() {
        let n = e.core.name(top_name);
        e.core.error(
            top_pos,
            format!("top module `{n}` has no output ports: nothing to check"),
            "give the top module at least one `output` port (equicone compares outputs), or choose another top module",
        );
    }
    if !e.core.errors.is_empty() {
        return Err(InputError {
            diagnostics: e.core.errors,
        });
    }
    Ok(design)
}
