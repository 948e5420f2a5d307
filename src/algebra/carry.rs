//! Carry chains found through any carry network: functional cuts that turn a carry-lookahead or
//! parallel-prefix adder into the ripple-carry adder it computes, so that backward rewriting
//! stays linear.
//!
//! Bit k of an adder is a position with a propagate literal p_k and a generate literal g_k
//! (FALSE where the column has one bit). The group generate over positions l..=m is
//! G(m, l) = g_m | p_m & G(m-1, l), the group propagate P(m, l) = p_m & ... & p_l. Every node
//! of a lookahead or prefix network computes one of P(h, l) or P(h, m+1) & G(m, l) (for
//! m = h simply G(h, l)); the AND and OR rules below derive these values bottom-up from the
//! positions' literals, and each rule is a Boolean identity of the definitions (the OR of two
//! adjacent ranges under the same propagate prefix is their union; a FALSE generate lets a
//! range grow over its position), so a derived value is the node's function whatever the
//! network. Nothing is assumed about how g_k and p_k relate: the rules hold for any literals.
//!
//! The output word is scanned from its least significant bit: a chain starts at a bit that is
//! its own propagate; bit k continues it when it is p_k XOR (a literal whose value is
//! G(k-1, start)); a bit whose value is G(k-1, start) is the carry out. For such a chain the
//! carry literal c_k of each bit gets the functional cut g_(k-1) | p_(k-1) & c_(k-1) and the
//! sum bit the cut p_k ^ c_k, both over the leaves of p and g (the two operands of the column,
//! when p is their XOR and g their AND) and the previous carry: a full adder per bit, which
//! the units take like the cells of a ripple-carry adder. A value of a sum-of-products shape
//! the rules do not know is simply not derived: the word is rewritten as before.

use crate::aig::{Aig, Lit, Node};
use crate::hash::FastMap;

/// A functional cut: `node` computes truth table `tt` over `leaves` (increasing node ids,
/// leaf j is bit j of the minterm).
#[derive(Clone, Debug, PartialEq, Eq)]
pub struct FunctionalCut {
    /// The node.
    pub node: u32,
    /// Leaf nodes, increasing, at most three.
    pub leaves: Vec<u32>,
    /// Truth table over the leaves.
    pub tt: u8,
}

/// The value of a node of a carry network over the positions' literals.
#[derive(Copy, Clone, Debug, PartialEq, Eq)]
enum Term {
    /// P(hi, lo).
    P { hi: u32, lo: u32 },
    /// P(ph, pl) & G(gh, gl) with pl > gh (no propagate part: `p` None).
    Pg {
        p: Option<(u32, u32)>,
        gh: u32,
        gl: u32,
    },
}

/// A position: propagate and generate literal (FALSE for none).
#[derive(Copy, Clone, Debug)]
struct Pos {
    p: Lit,
    g: Lit,
    /// Whether this position put p (g) into the base values.
    own_p: bool,
    own_g: bool,
}

struct Scan<'a> {
    aig: &'a Aig,
    /// Positions by bit.
    pos: Vec<Option<Pos>>,
    /// Literals of the positions and their values.
    base: FastMap<Lit, Term>,
    /// Node values computed (None: no value).
    memo: FastMap<u32, Option<(bool, Term)>>,
}

/// `lit` as an XOR of two literals, if its node is the three-AND XOR pattern.
pub(super) fn xor_pair(aig: &Aig, lit: Lit) -> Option<(Lit, Lit)> {
    let Node::And(l1, l2) = aig.node(lit.node()) else {
        return None;
    };
    if !l1.is_complemented() || !l2.is_complemented() {
        return None;
    }
    let (Node::And(a0, a1), Node::And(b0, b1)) = (aig.node(l1.node()), aig.node(l2.node())) else {
        return None;
    };
    if (b0 == !a0 && b1 == !a1) || (b0 == !a1 && b1 == !a0) {
        // node = !(a0 & a1) & !(!a0 & !a1) = a0 ^ a1
        Some((a0, a1.xor_complement(lit.is_complemented())))
    } else {
        None
    }
}

fn touching(a: (u32, u32), b: (u32, u32)) -> Option<(u32, u32)> {
    (a.1 <= b.0 + 1 && b.1 <= a.0 + 1).then(|| (a.0.max(b.0), a.1.min(b.1)))
}

impl Scan<'_> {
    fn g_false(&self, t: u32) -> bool {
        matches!(self.pos.get(t as usize), Some(Some(p)) if p.g == Lit::FALSE)
    }

    fn all_g_false(&self, lo: u32, hi: u32) -> bool {
        (lo..=hi).all(|t| self.g_false(t))
    }

    /// Canonical form: the generate range extended down over FALSE generates, a propagate
    /// part directly above it absorbed when its generates are all FALSE.
    fn canon(&self, t: Term) -> Term {
        match t {
            Term::P { .. } => t,
            Term::Pg { mut p, gh, mut gl } => {
                while gl > 0 && self.g_false(gl - 1) {
                    gl -= 1;
                }
                let mut gh = gh;
                if let Some((ph, pl)) = p {
                    if pl == gh + 1 && self.all_g_false(pl, ph) {
                        gh = ph;
                        p = None;
                    }
                }
                Term::Pg { p, gh, gl }
            }
        }
    }

    fn and_rule(&self, a: Term, b: Term) -> Option<Term> {
        match (a, b) {
            (Term::P { hi, lo }, Term::P { hi: h2, lo: l2 }) => {
                touching((hi, lo), (h2, l2)).map(|(hi, lo)| Term::P { hi, lo })
            }
            (Term::P { hi, lo }, Term::Pg { p, gh, gl })
            | (Term::Pg { p, gh, gl }, Term::P { hi, lo }) => {
                let merged = match p {
                    None => (hi, lo),
                    Some(q) => touching((hi, lo), q)?,
                };
                (merged.1 > gh).then(|| {
                    self.canon(Term::Pg {
                        p: Some(merged),
                        gh,
                        gl,
                    })
                })
            }
            _ => None,
        }
    }

    fn or_rule(&self, a: Term, b: Term) -> Option<Term> {
        let (Term::Pg { p: pa, gh: ga, .. }, Term::Pg { p: pb, gh: gb, .. }) = (a, b) else {
            return None;
        };
        // Both adjacent (no gap under the propagate part), under the same top.
        let top = |p: Option<(u32, u32)>, gh: u32| match p {
            None => Some(gh),
            Some((ph, pl)) => (pl == gh + 1).then_some(ph),
        };
        let (ta, tb) = (top(pa, ga)?, top(pb, gb)?);
        if ta != tb || ga == gb {
            return None;
        }
        let (up, low) = if ga > gb { (a, b) } else { (b, a) };
        let (Term::Pg { p, gh, gl: ul }, Term::Pg { gh: lg, gl: ll, .. }) = (up, low) else {
            return None;
        };
        // G(gh, ul) = G(gh, lg + 1) when the generates of ul..=lg are FALSE.
        if ul > lg + 1 || (ul <= lg && !self.all_g_false(ul, lg)) {
            return None;
        }
        Some(self.canon(Term::Pg { p, gh, gl: ll }))
    }

    /// Value of a literal: (complemented, term).
    fn eval(&mut self, root: Lit) -> Option<(bool, Term)> {
        if let Some(v) = self.lit_value(root) {
            return v;
        }
        // Post-order over the AND nodes without a value yet.
        let mut stack = vec![(root.node(), false)];
        while let Some((n, expanded)) = stack.pop() {
            if self.memo.contains_key(&n) {
                continue;
            }
            let Node::And(a, b) = self.aig.node(n) else {
                self.memo.insert(n, None);
                continue;
            };
            let (va, vb) = (self.lit_value(a), self.lit_value(b));
            match (va, vb) {
                (Some(va), Some(vb)) => {
                    let v = match (va, vb) {
                        (Some((false, x)), Some((false, y))) => {
                            self.and_rule(x, y).map(|t| (false, t))
                        }
                        (Some((true, x)), Some((true, y))) => self.or_rule(x, y).map(|t| (true, t)),
                        _ => None,
                    };
                    self.memo.insert(n, v);
                }
                _ => {
                    assert!(!expanded, "fan-ins evaluated before their node");
                    stack.push((n, true));
                    if va.is_none() {
                        stack.push((a.node(), false));
                    }
                    if vb.is_none() {
                        stack.push((b.node(), false));
                    }
                }
            }
        }
        self.lit_value(root).flatten()
    }

    /// The value of `l` if known (`Some(None)`: known to have none), `None` if its node is
    /// not evaluated yet.
    #[allow(clippy::option_option)]
    fn lit_value(&self, l: Lit) -> Option<Option<(bool, Term)>> {
        if let Some(&t) = self.base.get(&l) {
            return Some(Some((false, t)));
        }
        if let Some(&t) = self.base.get(&!l) {
            return Some(Some((true, t)));
        }
        if l.is_const() || !matches!(self.aig.node(l.node()), Node::And(..)) {
            return Some(None);
        }
        self.memo
            .get(&l.node())
            .map(|v| v.map(|(neg, t)| (neg ^ l.is_complemented(), t)))
    }

    /// The generate beside propagate `p`: the AND of the operands of its XOR, if the graph
    /// has it (FALSE otherwise).
    fn generate_of(&self, p: Lit) -> Lit {
        xor_pair(self.aig, p)
            .and_then(|(x, y)| {
                self.aig
                    .find_and(x, y)
                    .or_else(|| self.aig.find_and(!x, !y))
            })
            .unwrap_or(Lit::FALSE)
    }

    /// A chain start with a carry-in of 1 (a subtractor's a + ~b + 1): the bit is NOT p, and
    /// the carry out of the position, g | p, is in the graph; it takes the place of g.
    fn carry_in_start(&self, bit: Lit) -> Option<(Lit, Lit)> {
        let p = !bit;
        let (x, y) = xor_pair(self.aig, p)?;
        [self.aig.find_and(x, y), self.aig.find_and(!x, !y)]
            .into_iter()
            .flatten()
            .find_map(|g| self.aig.find_and(!g, !p).map(|n| !n))
            .filter(|c| !c.is_const())
            .map(|c| (p, c))
    }

    /// Define position k with propagate `p` and generate `g`.
    fn define(&mut self, k: u32, p: Lit, g: Lit) {
        while self.pos.len() <= k as usize {
            self.pos.push(None);
        }
        let own_p = !self.base.contains_key(&p);
        if own_p {
            self.base.insert(p, Term::P { hi: k, lo: k });
        }
        let mut own_g = false;
        if g != Lit::FALSE && !g.is_const() && !self.base.contains_key(&g) {
            let t = Term::Pg {
                p: None,
                gh: k,
                gl: k,
            };
            // Canonical with the positions below (set first so that `canon` sees them).
            self.pos[k as usize] = Some(Pos { p, g, own_p, own_g });
            let t = self.canon(t);
            self.base.insert(g, t);
            own_g = true;
        }
        self.pos[k as usize] = Some(Pos { p, g, own_p, own_g });
    }

    /// Forget position k (its base literals and every value computed since).
    fn undefine(&mut self, k: u32) {
        if let Some(Some(pos)) = self.pos.get(k as usize).copied() {
            if pos.own_p {
                self.base.remove(&pos.p);
            }
            if pos.own_g {
                self.base.remove(&pos.g);
            }
        }
        if let Some(slot) = self.pos.get_mut(k as usize) {
            *slot = None;
        }
        self.memo.clear();
    }

    /// Bit k continuing the chain after all, with position k - 1 taken as a column of one bit
    /// (generate FALSE): its propagate may be an XOR whose operands' AND is in the graph without
    /// being the column's generate (a tree's half- or full-adder sum left alone in its column,
    /// as in the final rows of a Wallace squarer). Position k - 1 is restored when that does
    /// not help either.
    fn retry_without_generate(&mut self, k: u32, start: u32, bit: Lit) -> Option<Ext> {
        let prev = self.pos[(k - 1) as usize]?;
        if prev.g == Lit::FALSE {
            return None;
        }
        self.undefine(k - 1);
        self.define(k - 1, prev.p, Lit::FALSE);
        let ext = self.extend(k, start, bit);
        if ext.is_none() {
            self.undefine(k - 1);
            self.define(k - 1, prev.p, prev.g);
        }
        ext
    }

    /// Bit k continuing the chain started at `start`: `Sum(carry, p)` when the bit is
    /// p ^ carry with carry = G(k-1, start), `Out(carry)` when the bit itself is that carry.
    fn extend(&mut self, k: u32, start: u32, bit: Lit) -> Option<Ext> {
        let want = self.canon(Term::Pg {
            p: None,
            gh: k - 1,
            gl: start,
        });
        if let Some((x, y)) = xor_pair(self.aig, bit) {
            for (c, p) in [(x, y), (y, x)] {
                if let Some((neg, t)) = self.eval(c) {
                    if t == want {
                        return Some(Ext::Sum(c.xor_complement(neg), p.xor_complement(neg)));
                    }
                }
            }
        }
        match self.eval(bit) {
            Some((neg, t)) if t == want => Some(Ext::Out(bit.xor_complement(neg))),
            _ => None,
        }
    }
}

/// How a bit continues a chain.
enum Ext {
    Sum(Lit, Lit),
    Out(Lit),
}

/// The local function of a literal: its two-leaf XOR or AND over fan-in nodes, or itself.
fn local(aig: &Aig, l: Lit) -> (Vec<u32>, u8) {
    const X: u8 = 0xAA;
    const Y: u8 = 0xCC;
    if l.is_const() {
        return (Vec::new(), if l == Lit::TRUE { 0xFF } else { 0 });
    }
    let two = |a: Lit, b: Lit, op: fn(u8, u8) -> u8| -> Option<(Vec<u32>, u8)> {
        if a.is_const() || b.is_const() || a.node() == b.node() {
            return None;
        }
        let (a, b) = if a.node() < b.node() { (a, b) } else { (b, a) };
        let fa = if a.is_complemented() { !X } else { X };
        let fb = if b.is_complemented() { !Y } else { Y };
        Some((vec![a.node(), b.node()], op(fa, fb)))
    };
    if let Some((x, y)) = xor_pair(aig, l) {
        if let Some(v) = two(x, y, |a, b| a ^ b) {
            return v;
        }
    }
    if let Node::And(a, b) = aig.node(l.node()) {
        if let Some((ls, tt)) = two(a, b, |a, b| a & b) {
            return (ls, if l.is_complemented() { !tt } else { tt });
        }
    }
    (vec![l.node()], if l.is_complemented() { !X } else { X })
}

/// A cut for the literal `out` = f(g, p, c) (f over truth tables), over the union of the
/// local leaves when at most three, else over the three literals' nodes.
fn cut_of(aig: &Aig, out: Lit, g: Lit, p: Lit, c: Lit, f: fn(u8, u8, u8) -> u8) -> FunctionalCut {
    // A literal as its own leaf (a constant as a constant table).
    let own = |l: Lit| {
        if l.is_const() {
            local(aig, l)
        } else {
            (vec![l.node()], 0)
        }
    };
    let mut parts = [local(aig, g), local(aig, p), own(c)];
    let union = |parts: &[(Vec<u32>, u8); 3]| {
        let mut ls: Vec<u32> = parts.iter().flat_map(|x| x.0.clone()).collect();
        ls.sort_unstable();
        ls.dedup();
        ls
    };
    let mut leaves = union(&parts);
    if leaves.len() > 3 {
        parts = [own(g), own(p), own(c)];
        leaves = union(&parts);
    }
    let lits = [g, p, c];
    let tts: Vec<u8> = parts
        .iter()
        .zip(lits)
        .map(|((ls, tt), l)| {
            if ls.is_empty() {
                *tt
            } else if ls.len() == 1 && ls[0] == l.node() {
                let proj =
                    super::truth::PROJ[leaves.iter().position(|&x| x == ls[0]).expect("leaf")];
                if l.is_complemented() {
                    !proj
                } else {
                    proj
                }
            } else {
                super::truth::expand(*tt, ls, &leaves)
            }
        })
        .collect();
    let tt = f(tts[0], tts[1], tts[2]);
    FunctionalCut {
        node: out.node(),
        leaves,
        tt: if out.is_complemented() { !tt } else { tt },
    }
}

/// Functional cuts of the carry chains of `word` (least significant bit first).
pub fn functional_cuts(aig: &Aig, word: &[Lit]) -> Vec<FunctionalCut> {
    let mut s = Scan {
        aig,
        pos: Vec::new(),
        base: FastMap::default(),
        memo: FastMap::default(),
    };
    let mut out = Vec::new();
    // The open chain: its first bit and the carry literal into the next bit's predecessor.
    let mut chain: Option<(u32, Option<Lit>)> = None;
    for (k, &bit) in word.iter().enumerate() {
        let k = k as u32;
        if let Some((start, prev_carry)) = chain.take() {
            let mut ext = s.extend(k, start, bit);
            if ext.is_none() && k == start + 1 {
                // Try the chain's first bit with a carry-in of 1.
                let first = word[start as usize];
                if let Some((p, g)) = s.carry_in_start(first) {
                    s.undefine(start);
                    s.define(start, p, g);
                    ext = s.extend(k, start, bit);
                    if ext.is_none() {
                        s.undefine(start);
                        let g = s.generate_of(first);
                        s.define(start, first, g);
                    }
                }
            }
            if ext.is_none() && k > start {
                ext = s.retry_without_generate(k, start, bit);
            }
            let prev = s.pos[(k - 1) as usize].expect("chain position defined");
            match ext {
                Some(Ext::Sum(carry, p)) => {
                    // carry = G(k-1, start); bit = p ^ carry.
                    if let Some(pc) = prev_carry {
                        out.push(cut_of(aig, carry, prev.g, prev.p, pc, carry_cut));
                    }
                    let g = s.generate_of(p);
                    s.define(k, p, g);
                    out.push(cut_of(aig, bit, g, p, carry, sum_cut));
                    chain = Some((start, Some(carry)));
                    continue;
                }
                Some(Ext::Out(carry)) => {
                    if let Some(pc) = prev_carry {
                        out.push(cut_of(aig, carry, prev.g, prev.p, pc, carry_cut));
                    }
                    continue;
                }
                None => {}
            }
        }
        if !bit.is_const() {
            let g = s.generate_of(bit);
            s.define(k, bit, g);
            chain = Some((k, None));
        }
    }
    out.retain(|c| !c.leaves.contains(&c.node));
    out
}

fn carry_cut(g: u8, p: u8, c: u8) -> u8 {
    g | (p & c)
}

fn sum_cut(_g: u8, p: u8, c: u8) -> u8 {
    p ^ c
}
