//! A small reduced ordered BDD package with complement edges, and the BDD check of output
//! pairs built on it. One manager per output group: a shared unique table (so equal functions
//! are the same edge), a lossy computed table for AND, and a node limit after which every
//! operation gives up (the group goes to the next method, undecided here, never wrong).
//!
//! Canonical form: the terminal is node 0 (`ONE` is its regular edge, `ZERO` its complement);
//! a node's high edge is never complemented. Two functions are equal exactly when their edges
//! are equal, which is the evidence of an `equal` answer. A difference gives one path to `ONE`
//! of `(a XOR b) AND constraint`: a counterexample the caller re-simulates.
//!
//! Recursion depth of the operations is bounded by the number of variables (each call goes one
//! variable down), not by the depth of the netlist; the graph itself is walked iteratively.
//!
//! Garbage collection ([`Manager::collect`]) keeps the nodes reachable from the edges the
//! caller still needs and renumbers them in their old order (children stay below parents); the
//! graph check frees a node's BDD once its last reader is built, so the node limit bounds the
//! nodes alive at a time rather than every node ever made.

use crate::aig::{Aig, Lit, Node};
use crate::hash::FastMap;
use crate::sat::Limits;

/// A BDD edge: node index times two, plus one when complemented.
pub(crate) type Edge = u32;
/// The constant-true function.
pub(crate) const ONE: Edge = 0;
/// The constant-false function.
pub(crate) const ZERO: Edge = 1;
/// Level of the terminal (below every variable).
const TERMINAL: u32 = u32::MAX;
/// Entries of the computed table (a power of two) at least and at most: about a quarter of
/// the node limit in between.
const CACHE_MIN: usize = 1 << 16;
const CACHE_MAX: usize = 1 << 22;

/// The node limit was reached (or the time ran out) before the operation finished.
#[derive(Copy, Clone, Debug, PartialEq, Eq)]
pub(crate) struct Exceeded;

/// A BDD manager: nodes `(level, low, high)` with `high` regular.
pub(crate) struct Manager<'l> {
    nodes: Vec<(u32, Edge, Edge)>,
    unique: FastMap<(u32, Edge, Edge), u32>,
    cache: Vec<(Edge, Edge, Edge)>,
    /// `cache.len() - 1` (the table's length is a power of two).
    mask: usize,
    limit: usize,
    limits: &'l Limits,
    ops: u64,
    /// Steps after which [`Manager::and`] gives up (set by [`Manager::and_bounded`]).
    op_ceiling: u64,
    /// Nodes made so far (garbage collection does not lower it).
    made: u64,
    /// Nodes made after which every operation fails (see [`Manager::bound_work`]).
    made_limit: u64,
}

impl<'l> Manager<'l> {
    /// A manager that fails once it holds `limit` nodes or the time of `limits` runs out.
    pub(crate) fn new(limit: usize, limits: &'l Limits) -> Manager<'l> {
        let size = (limit / 4).next_power_of_two().clamp(CACHE_MIN, CACHE_MAX);
        Manager {
            nodes: vec![(TERMINAL, ONE, ONE)],
            unique: FastMap::default(),
            cache: vec![(u32::MAX, u32::MAX, 0); size],
            mask: size - 1,
            limit,
            limits,
            ops: 0,
            op_ceiling: u64::MAX,
            made: 0,
            made_limit: u64::MAX,
        }
    }

    /// Fail every operation once `nodes` nodes have been made in all (collected ones
    /// included): with garbage collection the node limit bounds the memory, this the time.
    pub(crate) fn bound_work(&mut self, nodes: u64) {
        self.made_limit = nodes;
    }

    /// Like [`Manager::and`], but gives up (with `Exceeded`) once this one operation has
    /// created `nodes` nodes or taken 16 steps per such node; the nodes it made stay (unused).
    pub(crate) fn and_bounded(&mut self, f: Edge, g: Edge, nodes: usize) -> Result<Edge, Exceeded> {
        let (limit, ceiling) = (self.limit, self.op_ceiling);
        self.limit = limit.min(self.nodes.len().saturating_add(nodes));
        self.op_ceiling = self.ops.saturating_add(16 * nodes as u64);
        let r = self.and(f, g);
        self.limit = limit;
        self.op_ceiling = ceiling;
        r
    }

    /// Whether the node limit is reached or the time has run out (every operation fails).
    pub(crate) fn is_spent(&self) -> bool {
        self.nodes.len() >= self.limit || self.limits.expired()
    }

    /// Nodes held (the terminal included).
    pub(crate) fn len(&self) -> usize {
        self.nodes.len()
    }

    /// Keep only the nodes reachable from `roots` and rewrite each root to its node's new
    /// index; every other edge of this manager becomes meaningless. The kept nodes keep their
    /// relative order, so a node's children stay below it; the computed table is emptied.
    pub(crate) fn collect(&mut self, roots: &mut [Edge]) {
        let n = self.nodes.len();
        let mut live = vec![false; n];
        live[0] = true;
        for &r in roots.iter() {
            live[(r >> 1) as usize] = true;
        }
        // Children have smaller indices: one pass from the top marks everything reachable.
        for i in (1..n).rev() {
            if live[i] {
                let (_, lo, hi) = self.nodes[i];
                live[(lo >> 1) as usize] = true;
                live[(hi >> 1) as usize] = true;
            }
        }
        let mut index = vec![u32::MAX; n];
        let at = |index: &[u32], e: Edge| (index[(e >> 1) as usize] << 1) | (e & 1);
        let mut kept = 0usize;
        self.unique.clear();
        for i in 0..n {
            if !live[i] {
                continue;
            }
            let (level, lo, hi) = self.nodes[i];
            let node = if i == 0 {
                (level, lo, hi)
            } else {
                (level, at(&index, lo), at(&index, hi))
            };
            index[i] = kept as u32;
            self.nodes[kept] = node;
            if i != 0 {
                self.unique.insert(node, kept as u32);
            }
            kept += 1;
        }
        self.nodes.truncate(kept);
        for r in roots.iter_mut() {
            *r = at(&index, *r);
        }
        self.cache.fill((u32::MAX, u32::MAX, 0));
    }

    /// The function of variable `level` (level 0 is the top of the order).
    pub(crate) fn var(&mut self, level: u32) -> Result<Edge, Exceeded> {
        self.mk(level, ZERO, ONE)
    }

    fn level(&self, e: Edge) -> u32 {
        self.nodes[(e >> 1) as usize].0
    }

    /// Low and high cofactors of `e` with respect to `level` (itself when `e` does not test it).
    fn cofactors(&self, e: Edge, level: u32) -> (Edge, Edge) {
        let (l, lo, hi) = self.nodes[(e >> 1) as usize];
        if l != level {
            return (e, e);
        }
        let c = e & 1;
        (lo ^ c, hi ^ c)
    }

    fn mk(&mut self, level: u32, lo: Edge, hi: Edge) -> Result<Edge, Exceeded> {
        if lo == hi {
            return Ok(lo);
        }
        if hi & 1 == 1 {
            return Ok(self.mk(level, lo ^ 1, hi ^ 1)? ^ 1);
        }
        if let Some(&n) = self.unique.get(&(level, lo, hi)) {
            return Ok(n << 1);
        }
        if self.nodes.len() >= self.limit || self.made >= self.made_limit {
            return Err(Exceeded);
        }
        self.made += 1;
        let n = self.nodes.len() as u32;
        self.nodes.push((level, lo, hi));
        self.unique.insert((level, lo, hi), n);
        Ok(n << 1)
    }

    /// The conjunction of two functions.
    pub(crate) fn and(&mut self, f: Edge, g: Edge) -> Result<Edge, Exceeded> {
        if f == ZERO || g == ZERO || f == g ^ 1 {
            return Ok(ZERO);
        }
        if f == ONE || f == g {
            return Ok(g);
        }
        if g == ONE {
            return Ok(f);
        }
        let (f, g) = if f < g { (f, g) } else { (g, f) };
        let slot = (((f as u64).wrapping_mul(0x9E37_79B9) ^ (g as u64).wrapping_mul(0x85EB_CA6B))
            >> 7) as usize
            & self.mask;
        let (cf, cg, cr) = self.cache[slot];
        if cf == f && cg == g {
            return Ok(cr);
        }
        self.ops += 1;
        if self.ops > self.op_ceiling || (self.ops & 0xFFFF == 0 && self.limits.expired()) {
            return Err(Exceeded);
        }
        let top = self.level(f).min(self.level(g));
        let (f0, f1) = self.cofactors(f, top);
        let (g0, g1) = self.cofactors(g, top);
        let lo = self.and(f0, g0)?;
        let hi = self.and(f1, g1)?;
        let r = self.mk(top, lo, hi)?;
        self.cache[slot] = (f, g, r);
        Ok(r)
    }

    /// The exclusive or of two functions.
    pub(crate) fn xor(&mut self, f: Edge, g: Edge) -> Result<Edge, Exceeded> {
        let a = self.and(f, g ^ 1)?;
        let b = self.and(f ^ 1, g)?;
        Ok(self.and(a ^ 1, b ^ 1)? ^ 1)
    }

    /// One assignment (by level) under which `e` is true, unset levels false; `None` for `ZERO`.
    pub(crate) fn witness(&self, e: Edge, levels: usize) -> Option<Vec<bool>> {
        let mut v = vec![false; levels];
        for (level, b) in self.path(e)? {
            v[level as usize] = b;
        }
        Some(v)
    }

    /// One path from `e` to `ONE`: the levels it tests with their values (`e` is true for every
    /// value of the levels it does not test); `None` for `ZERO`.
    pub(crate) fn path(&self, mut e: Edge) -> Option<Vec<(u32, bool)>> {
        if e == ZERO {
            return None;
        }
        let mut p = Vec::new();
        while e >> 1 != 0 {
            let (level, lo, hi) = self.nodes[(e >> 1) as usize];
            let c = e & 1;
            // Every edge other than ZERO reaches ONE: take the low branch unless it is ZERO.
            if lo ^ c != ZERO {
                p.push((level, false));
                e = lo ^ c;
            } else {
                p.push((level, true));
                e = hi ^ c;
            }
        }
        debug_assert_eq!(e, ONE);
        Some(p)
    }
}

/// The answer for one output pair.
#[derive(Clone, Debug, PartialEq, Eq)]
pub(crate) enum Decision {
    /// The two BDDs (under the constraint) are the same edge.
    Equal,
    /// Different under these values of all inputs of the graph.
    Differ(Vec<bool>),
}

/// Figures of one BDD check.
#[derive(Clone, Debug, Default, PartialEq, Eq)]
pub(crate) struct BddFigures {
    /// Nodes the manager held at the end (or when it gave up).
    pub nodes: usize,
    /// The most nodes it held at once.
    pub peak: usize,
    /// Garbage collections.
    pub collections: usize,
    /// Nodes made in all (collected ones included).
    pub made: u64,
}

/// A variable order for the inputs of the cones of `roots`: inputs by first appearance in a
/// depth-first walk of the cones taken root by root, the whole list reversed (for an adder
/// with its low bits first this puts the high bits on top, where the carries share their
/// sub-functions), except that inputs of a much higher fan-out than the median (control
/// inputs such as select bits) come first. Inputs outside the cones come last.
pub(crate) fn order(aig: &Aig, roots: &[Lit]) -> Vec<usize> {
    let mut seen = vec![false; aig.len()];
    let mut found: Vec<usize> = Vec::new();
    let mut stack: Vec<u32> = Vec::new();
    for r in roots {
        stack.push(r.node());
        while let Some(n) = stack.pop() {
            if seen[n as usize] {
                continue;
            }
            seen[n as usize] = true;
            match aig.node(n) {
                Node::Const => {}
                Node::Input(k) => found.push(k as usize),
                Node::And(a, b) => {
                    stack.push(b.node());
                    stack.push(a.node());
                }
            }
        }
    }
    found.reverse();
    // Control inputs first: those that drive many more AND nodes than is typical (the select
    // bits of a selector or shifter), in the order found.
    let mut fanout = vec![0u32; aig.num_inputs()];
    for (i, node) in aig.nodes().iter().enumerate() {
        if let (true, Node::And(a, b)) = (seen[i], *node) {
            for l in [a, b] {
                if let Node::Input(k) = aig.node(l.node()) {
                    fanout[k as usize] += 1;
                }
            }
        }
    }
    let mut sorted: Vec<u32> = found.iter().map(|&k| fanout[k]).collect();
    sorted.sort_unstable();
    if let Some(&median) = sorted.get(sorted.len() / 2) {
        let high = |k: usize| fanout[k] >= 3 * median.max(1);
        let (mut control, data): (Vec<usize>, Vec<usize>) = found.iter().partition(|&&k| high(k));
        control.extend(data);
        found = control;
    }
    let mut used = vec![false; aig.num_inputs()];
    for &k in &found {
        used[k] = true;
    }
    found.extend((0..aig.num_inputs()).filter(|&k| !used[k]));
    found
}

/// Decide the pairs of `pairs` with BDDs in one manager of at most `limit` nodes. The graph is
/// built in topological order and each pair is decided as soon as both of its sides are built,
/// so the pairs decided before the limit was reached keep their answers (`None`: not decided).
pub(crate) fn decide(
    aig: &Aig,
    pairs: &[(Lit, Lit)],
    constraint: Lit,
    limit: usize,
    limits: &Limits,
) -> (Vec<Option<Decision>>, BddFigures) {
    let mut roots: Vec<Lit> = pairs.iter().flat_map(|&(a, b)| [a, b]).collect();
    roots.push(constraint);
    let ord = order(aig, &roots);
    let mut m = Manager::new(limit, limits);
    m.bound_work(WORK_PER_LIMIT.saturating_mul(limit as u64));
    let mut out = vec![None; pairs.len()];
    let mut figures = BddFigures::default();
    let _ = build_and_compare(aig, pairs, constraint, &ord, &mut m, &mut out, &mut figures);
    figures.nodes = m.len();
    figures.peak = figures.peak.max(m.len());
    figures.made = m.made;
    (out, figures)
}

fn build_and_compare(
    aig: &Aig,
    pairs: &[(Lit, Lit)],
    constraint: Lit,
    ord: &[usize],
    m: &mut Manager<'_>,
    out: &mut [Option<Decision>],
    figures: &mut BddFigures,
) -> Result<(), Exceeded> {
    let mut level_of = vec![0u32; aig.num_inputs()];
    for (l, &k) in ord.iter().enumerate() {
        level_of[k] = l as u32;
    }
    let mut roots: Vec<Lit> = pairs.iter().flat_map(|&(a, b)| [a, b]).collect();
    roots.push(constraint);
    let mask = aig.cone_mask(&roots);
    // Pairs by the later of their two sides (the constraint must be built before any).
    let ready = |&(a, b): &(Lit, Lit)| a.index().max(b.index()).max(constraint.index());
    let mut by_ready: Vec<usize> = (0..pairs.len()).collect();
    by_ready.sort_by_key(|&p| ready(&pairs[p]));
    let last = last_use(aig, &mask, pairs, constraint);
    let mut next = 0;
    let mut f = vec![ZERO; aig.len()];
    let lit = |f: &[Edge], l: Lit| {
        debug_assert!(
            f[l.index()] < DEAD,
            "the BDD of node {} was freed",
            l.index()
        );
        f[l.index()] ^ u32::from(l.is_complemented())
    };
    // Collect garbage once the manager holds this many nodes (see `next_collection`).
    let mut collect_at = next_collection(0, m.limit);
    for (i, node) in aig.nodes().iter().enumerate() {
        if mask[i] {
            f[i] = match *node {
                Node::Const => ZERO,
                Node::Input(k) => m.var(level_of[k as usize])?,
                Node::And(a, b) => {
                    let (x, y) = (lit(&f, a), lit(&f, b));
                    m.and(x, y)?
                }
            };
        }
        while next < by_ready.len() && ready(&pairs[by_ready[next]]) <= i {
            let p = by_ready[next];
            next += 1;
            let (x, y) = (lit(&f, pairs[p].0), lit(&f, pairs[p].1));
            if x == y {
                out[p] = Some(Decision::Equal);
                continue;
            }
            let c = lit(&f, constraint);
            let d = m.xor(x, y)?;
            let d = m.and(d, c)?;
            out[p] = Some(match m.witness(d, ord.len()) {
                None => Decision::Equal,
                Some(by_level) => {
                    let mut values = vec![false; aig.num_inputs()];
                    for (l, &k) in ord.iter().enumerate() {
                        values[k] = by_level[l];
                    }
                    Decision::Differ(values)
                }
            });
        }
        if m.len() >= collect_at {
            // The nodes still read later: built (index up to i) with a last use after i.
            let keep: Vec<usize> = (0..=i).filter(|&n| mask[n] && last[n] > i).collect();
            let mut edges: Vec<Edge> = keep.iter().map(|&n| f[n]).collect();
            figures.peak = figures.peak.max(m.len());
            figures.collections += 1;
            let before = m.len();
            m.collect(&mut edges);
            log::trace!(
                "bdd: garbage collection at graph node {i} of {}: {before} -> {} BDD nodes",
                aig.len(),
                m.len()
            );
            for (&n, e) in keep.iter().zip(edges) {
                f[n] = e;
            }
            // The others' edges mean nothing now: an index past any node, so a use of one
            // (a mistake in `last_use`) stops with an index error instead of a wrong answer.
            for n in (0..=i).filter(|&n| mask[n] && last[n] <= i) {
                f[n] = DEAD;
            }
            // Give up rather than collect again and again when the live nodes fill the limit.
            if m.len() > m.limit - m.limit / 4 {
                return Err(Exceeded);
            }
            collect_at = next_collection(m.len(), m.limit);
        }
    }
    Ok(())
}

/// Nodes [`decide`] may make in all, per node of its limit: garbage collection lets it go on
/// while the nodes alive fit the limit, this bounds the time it spends (on a 1,001-input
/// majority, sorting network against adder tree, the manager made 7,000,000 nodes alive at a
/// time in 80 s and needed more: the network's merge wires are functions of the counts of two
/// input blocks, each with a node per level and count).
const WORK_PER_LIMIT: u64 = 4;

/// An edge no node has (see the garbage collection of [`build_and_compare`]).
const DEAD: Edge = u32::MAX - 1;

/// The manager size at which to collect garbage when `live` nodes survived the last
/// collection: once the nodes made since then are as many as the live ones, and at least an
/// eighth of the limit (so collections cost time in proportion to the nodes made), but before
/// the limit itself while there is room.
fn next_collection(live: usize, limit: usize) -> usize {
    let room = live + live.max(limit / 8).max(64);
    room.min((limit - limit / 8).max(live + 64))
}

/// Per node of the graph: the last node index at which its BDD is read (by an AND of the
/// cones, or by a pair decided there); `usize::MAX` for the constraint, which every pair reads.
fn last_use(aig: &Aig, mask: &[bool], pairs: &[(Lit, Lit)], constraint: Lit) -> Vec<usize> {
    let mut last = vec![0usize; aig.len()];
    for (i, node) in aig.nodes().iter().enumerate() {
        if let (true, Node::And(a, b)) = (mask[i], *node) {
            last[a.index()] = last[a.index()].max(i);
            last[b.index()] = last[b.index()].max(i);
        }
    }
    for &(a, b) in pairs {
        let r = a.index().max(b.index()).max(constraint.index());
        last[a.index()] = last[a.index()].max(r);
        last[b.index()] = last[b.index()].max(r);
    }
    last[constraint.index()] = usize::MAX;
    last
}

#[cfg(test)]
pub(crate) mod tests {
    use super::*;
    use crate::aig::eval;

    /// Majority of `ins` as a sum of its inputs (a ripple of half adders) compared to a threshold.
    pub(crate) fn majority_by_count(g: &mut Aig, ins: &[Lit]) -> Lit {
        // Counter bits, least significant first.
        let mut count: Vec<Lit> = Vec::new();
        for &x in ins {
            let mut carry = x;
            for bit in count.iter_mut() {
                let s = g.xor(*bit, carry);
                carry = g.and(*bit, carry);
                *bit = s;
            }
            if carry != Lit::FALSE {
                count.push(carry);
            }
        }
        // count > n/2, compared from the top bit down.
        let t = ins.len() / 2;
        let mut gt = Lit::FALSE;
        let mut eq = Lit::TRUE;
        for (i, &c) in count.iter().enumerate().rev() {
            let tb = i < 64 && (t >> i) & 1 == 1;
            if tb {
                eq = g.and(eq, c);
            } else {
                let here = g.and(eq, c);
                gt = g.or(gt, here);
                eq = g.and(eq, !c);
            }
        }
        gt
    }

    /// Majority by the recursive "at least k of the rest" expansion (a different structure).
    pub(crate) fn majority_by_threshold(g: &mut Aig, ins: &[Lit]) -> Lit {
        let n = ins.len();
        let need = n / 2 + 1;
        // at[k]: at least k of the inputs seen so far (k = 0..=need).
        let mut at: Vec<Lit> = vec![Lit::FALSE; need + 1];
        at[0] = Lit::TRUE;
        for &x in ins {
            for k in (1..=need).rev() {
                let with = g.and(x, at[k - 1]);
                at[k] = g.or(at[k], with);
            }
        }
        at[need]
    }

    #[test]
    fn majorities_of_two_structures_are_equal() {
        let mut g = Aig::new();
        let ins: Vec<Lit> = (0..41).map(|_| g.add_input()).collect();
        let a = majority_by_count(&mut g, &ins);
        let b = majority_by_threshold(&mut g, &ins);
        let (r, fig) = decide(&g, &[(a, b)], Lit::TRUE, 1 << 20, &Limits::none());
        assert_eq!(r, vec![Some(Decision::Equal)]);
        assert!(fig.nodes > 41);
    }

    #[test]
    fn a_wrong_threshold_gives_a_separating_vector() {
        let mut g = Aig::new();
        let ins: Vec<Lit> = (0..21).map(|_| g.add_input()).collect();
        let a = majority_by_count(&mut g, &ins);
        let b = majority_by_threshold(&mut g, &ins[..20]);
        let (r, _) = decide(&g, &[(a, b)], Lit::TRUE, 1 << 20, &Limits::none());
        let Some(Decision::Differ(v)) = &r[0] else {
            panic!("the pair differs")
        };
        let vals = eval(&g, v, &[a, b]);
        assert_ne!(vals[0], vals[1]);
    }

    #[test]
    fn collection_lets_a_small_limit_finish() {
        let mut g = Aig::new();
        let ins: Vec<Lit> = (0..41).map(|_| g.add_input()).collect();
        let a = majority_by_count(&mut g, &ins);
        let b = majority_by_threshold(&mut g, &ins);
        // A limit above every node ever made: no collection is needed.
        let (r, whole) = decide(&g, &[(a, b)], Lit::TRUE, 1 << 22, &Limits::none());
        assert_eq!(r, vec![Some(Decision::Equal)]);
        assert_eq!(whole.collections, 0);
        // A third of that: the freed nodes make room, the answer stays.
        // Smaller limits: the freed nodes make room (each run may make at most four times its
        // limit, so the smallest ones give up); whatever is decided stays right.
        let mut finished = 0;
        for limit in [
            whole.peak * 3 / 4,
            whole.peak * 2 / 3,
            whole.peak / 2,
            whole.peak / 8,
        ] {
            let (r, fig) = decide(&g, &[(a, b)], Lit::TRUE, limit, &Limits::none());
            assert!(fig.peak <= limit, "{fig:?} {limit}");
            if r == vec![Some(Decision::Equal)] {
                assert!(fig.collections > 0);
                finished += 1;
            } else {
                assert_eq!(r, vec![None]);
            }
        }
        assert!(finished >= 2, "{finished} of 4 limits finished");
    }

    #[test]
    fn node_limit_gives_up() {
        let mut g = Aig::new();
        let ins: Vec<Lit> = (0..31).map(|_| g.add_input()).collect();
        let a = majority_by_count(&mut g, &ins);
        let b = majority_by_threshold(&mut g, &ins);
        let (r, fig) = decide(&g, &[(a, b)], Lit::TRUE, 50, &Limits::none());
        assert_eq!(r, vec![None]);
        assert!(fig.nodes <= 50);
    }

    #[test]
    fn constraint_and_canonical_edges() {
        let limits = Limits::none();
        let mut m = Manager::new(1000, &limits);
        let x = m.var(0).unwrap();
        let y = m.var(1).unwrap();
        let xy = m.and(x, y).unwrap();
        let yx = m.and(y, x).unwrap();
        assert_eq!(xy, yx);
        // De Morgan: NOT(NOT x AND NOT y) AND (x OR y) are the same edge.
        let or1 = m.and(x ^ 1, y ^ 1).unwrap() ^ 1;
        let t = m.xor(x, y).unwrap();
        let u = m.xor(t, xy).unwrap();
        assert_eq!(u, or1, "x ^ y ^ xy = x | y");
        assert_eq!(m.witness(ZERO, 2), None);
        let w = m.witness(xy, 2).unwrap();
        assert_eq!(w, vec![true, true]);
    }
}

/// Against biodivine-lib-bdd (a BDD library from crates.io, used as an independent oracle):
/// the same functions must be equal or different in both packages, and the speed comparison
/// behind the choice of our own package (`cargo test --release --lib bdd_speed -- --ignored
/// --nocapture`; figures in docs/engine.md).
#[cfg(test)]
pub(crate) mod oracle {
    use super::*;
    use crate::aig::random_graph;
    use biodivine_lib_bdd::{Bdd, BddVariableSet};

    /// Every node's function in biodivine-lib-bdd (the independent package), input k as
    /// its variable k.
    pub(crate) fn reference_bdds(g: &Aig) -> Vec<Bdd> {
        let vars = BddVariableSet::new_anonymous(g.num_inputs() as u16);
        let vs = vars.variables();
        let mut t: Vec<Bdd> = Vec::with_capacity(g.len());
        for node in g.nodes() {
            let lit = |t: &[Bdd], l: Lit| {
                if l.is_complemented() {
                    t[l.index()].not()
                } else {
                    t[l.index()].clone()
                }
            };
            let f = match *node {
                Node::Const => vars.mk_false(),
                Node::Input(k) => vars.mk_var(vs[k as usize]),
                Node::And(x, y) => lit(&t, x).and(&lit(&t, y)),
            };
            t.push(f);
        }
        t
    }

    /// The tests' random graph: fan-ins from any earlier literal, AND nodes only.
    fn random_aig(seed: u64, inputs: usize, ands: usize) -> Aig {
        random_graph::random_aig(seed, inputs, ands, random_graph::Shape::UNIFORM).0
    }

    /// Both packages over the same order: ours as edges, biodivine's as `Bdd`s.
    fn both(g: &Aig) -> (Vec<Edge>, Vec<Bdd>) {
        let limits = Limits::none();
        let mut m = Manager::new(1 << 22, &limits);
        let vars = BddVariableSet::new_anonymous(g.num_inputs() as u16);
        let vs = vars.variables();
        let mut ours = vec![ZERO; g.len()];
        let mut theirs: Vec<Bdd> = Vec::with_capacity(g.len());
        for (i, node) in g.nodes().iter().enumerate() {
            let lit_b = |t: &[Bdd], l: Lit| {
                if l.is_complemented() {
                    t[l.index()].not()
                } else {
                    t[l.index()].clone()
                }
            };
            let lit_o = |o: &[Edge], l: Lit| o[l.index()] ^ u32::from(l.is_complemented());
            let (o, t) = match *node {
                Node::Const => (ZERO, vars.mk_false()),
                Node::Input(k) => (m.var(k).unwrap(), vars.mk_var(vs[k as usize])),
                Node::And(a, b) => (
                    m.and(lit_o(&ours, a), lit_o(&ours, b)).unwrap(),
                    lit_b(&theirs, a).and(&lit_b(&theirs, b)),
                ),
            };
            ours[i] = o;
            theirs.push(t);
        }
        (ours, theirs)
    }

    #[test]
    fn equalities_agree_with_biodivine() {
        let mut checked = 0;
        for seed in 1..40 {
            let g = random_aig(seed, 8, 60);
            let (ours, theirs) = both(&g);
            for i in 0..g.len() {
                for j in i + 1..g.len() {
                    let eq_theirs = theirs[i].xor(&theirs[j]).is_false();
                    let co_theirs = theirs[i].xor(&theirs[j].not()).is_false();
                    assert_eq!(ours[i] == ours[j], eq_theirs, "seed {seed}: {i} {j}");
                    assert_eq!(ours[i] == ours[j] ^ 1, co_theirs, "seed {seed}: {i} {j}");
                    checked += 1;
                }
            }
        }
        assert!(checked > 50_000);
    }

    /// Pairs of random graphs decided under a limit small enough for many garbage collections:
    /// every `Equal` must be equal in biodivine-lib-bdd and every `Differ` vector must separate
    /// the two nodes there.
    #[test]
    fn decisions_under_collection_agree_with_biodivine() {
        let (mut decided, mut collections, mut differ) = (0, 0, 0);
        for seed in 1..30 {
            let g = random_aig(seed, 10, 300);
            let theirs = reference_bdds(&g);
            let mut rng = crate::rng::SplitMix64::new(seed, 7);
            let n = g.len() as u64;
            let pairs: Vec<(Lit, Lit)> = (0..40)
                .map(|_| {
                    let a = Lit::from_node((rng.next_u64() % n) as u32, false);
                    let b = Lit::from_node((rng.next_u64() % n) as u32, rng.next_u64() & 1 == 1);
                    (a, b)
                })
                .collect();
            let (ds, fig) = decide(&g, &pairs, Lit::TRUE, 600, &Limits::none());
            collections += fig.collections;
            for (&(a, b), d) in pairs.iter().zip(&ds) {
                let side = |l: Lit| {
                    let t = &theirs[l.index()];
                    if l.is_complemented() {
                        t.not()
                    } else {
                        t.clone()
                    }
                };
                let same = side(a).xor(&side(b)).is_false();
                match d {
                    None => continue,
                    Some(Decision::Equal) => assert!(same, "seed {seed}: {a:?} {b:?}"),
                    Some(Decision::Differ(v)) => {
                        assert!(!same, "seed {seed}: {a:?} {b:?}");
                        let vals = crate::aig::eval(&g, v, &[a, b]);
                        assert_ne!(vals[0], vals[1], "seed {seed}: the vector separates");
                        differ += 1;
                    }
                }
                decided += 1;
            }
        }
        assert!(collections > 100, "{collections} collections");
        assert!(
            decided > 500 && differ > 100,
            "{decided} decided, {differ} different"
        );
    }

    #[test]
    #[ignore = "a measurement, run by hand in release mode"]
    fn bdd_speed() {
        let mut g = Aig::new();
        let ins: Vec<Lit> = (0..101).map(|_| g.add_input()).collect();
        let a = super::tests::majority_by_count(&mut g, &ins);
        let b = super::tests::majority_by_threshold(&mut g, &ins);
        let t = std::time::Instant::now();
        let (ours, _) = {
            let limits = Limits::none();
            let mut m = Manager::new(1 << 24, &limits);
            let mut e = vec![ZERO; g.len()];
            for (i, node) in g.nodes().iter().enumerate() {
                let lit = |e: &[Edge], l: Lit| e[l.index()] ^ u32::from(l.is_complemented());
                e[i] = match *node {
                    Node::Const => ZERO,
                    Node::Input(k) => m.var(k).unwrap(),
                    Node::And(x, y) => m.and(lit(&e, x), lit(&e, y)).unwrap(),
                };
            }
            (e, m.len())
        };
        let t_ours = t.elapsed();
        assert_eq!(
            ours[a.index()] ^ u32::from(a.is_complemented()),
            ours[b.index()] ^ u32::from(b.is_complemented())
        );
        let t = std::time::Instant::now();
        let _theirs = reference_bdds(&g);
        let t_theirs = t.elapsed();
        eprintln!(
            "majority of 101 inputs, two structures, {} AND nodes: ours {:.3} s, biodivine-lib-bdd {:.3} s",
            g.num_ands(),
            t_ours.as_secs_f64(),
            t_theirs.as_secs_f64()
        );
    }
}
