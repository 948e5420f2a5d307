//! The structural shortcut of route tables: with the select bits fixed to one value, constant
//! propagation through the cone (the exact identities x&0=0, x&1=x, x&x=x, x&!x=0) often leaves
//! an output a single input literal or a constant. That is a proof of the route (the output is
//! that literal for every value of the other inputs) with no SAT call: a 16384:1 selector's
//! table then costs one pass over the cone per select value instead of solver calls that
//! assign the whole design.

use crate::aig::{Aig, Lit, Node};

/// Marks a node whose folded value is neither a constant nor a single input literal.
const OTHER: u32 = u32::MAX;

/// The cone of some roots in topological order, with scratch space for folding it.
pub(super) struct Folder {
    /// AND nodes of the cone, ascending (so fan-ins come first).
    ands: Vec<u32>,
    /// Input nodes of the cone.
    inputs: Vec<u32>,
    /// Folded value of each node (raw literal or [`OTHER`]), indexed by node.
    vals: Vec<u32>,
    /// Select bit position of each input node that is a select bit.
    select_of: Vec<Option<usize>>,
}

impl Folder {
    /// Scratch space for the cone of `roots` in `aig`; `sel` are the select bits' input
    /// positions, least significant first.
    pub(super) fn new(aig: &Aig, roots: &[Lit], sel: &[usize]) -> Folder {
        let mut seen = vec![false; aig.len()];
        let mut stack: Vec<u32> = roots.iter().map(|r| r.node()).collect();
        let (mut ands, mut inputs) = (Vec::new(), Vec::new());
        while let Some(n) = stack.pop() {
            if std::mem::replace(&mut seen[n as usize], true) {
                continue;
            }
            match aig.node(n) {
                Node::Const => {}
                Node::Input(_) => inputs.push(n),
                Node::And(a, b) => {
                    ands.push(n);
                    stack.push(a.node());
                    stack.push(b.node());
                }
            }
        }
        ands.sort_unstable();
        let mut select_of = vec![None; aig.len()];
        for (j, &k) in sel.iter().enumerate() {
            select_of[aig.input_lit(k).node() as usize] = Some(j);
        }
        Folder {
            ands,
            inputs,
            vals: vec![OTHER; aig.len()],
            select_of,
        }
    }

    /// Fold the cone with the select bus at value `v`; afterwards [`Folder::value`] reads
    /// the roots.
    pub(super) fn fold(&mut self, aig: &Aig, v: usize) {
        self.vals[0] = Lit::FALSE.raw();
        for &n in &self.inputs {
            self.vals[n as usize] = match self.select_of[n as usize] {
                Some(j) => Lit::constant((v >> j) & 1 == 1).raw(),
                None => Lit::from_node(n, false).raw(),
            };
        }
        for &n in &self.ands {
            let Node::And(a, b) = aig.node(n) else {
                continue;
            };
            let (va, vb) = (self.lit_val(a), self.lit_val(b));
            let f = Lit::FALSE.raw();
            let t = Lit::TRUE.raw();
            self.vals[n as usize] = if va == f || vb == f {
                f
            } else if va == OTHER || vb == OTHER {
                OTHER
            } else if va == t {
                vb
            } else if vb == t || va == vb {
                va
            } else if va == vb ^ 1 {
                f
            } else {
                OTHER
            };
        }
    }

    /// The folded value of `l`: a constant or an input literal, or `None`.
    pub(super) fn value(&self, l: Lit) -> Option<Lit> {
        match self.lit_val(l) {
            OTHER => None,
            raw => Some(Lit::from_raw(raw)),
        }
    }

    fn lit_val(&self, l: Lit) -> u32 {
        match self.vals[l.node() as usize] {
            OTHER => OTHER,
            raw => raw ^ l.is_complemented() as u32,
        }
    }
}
