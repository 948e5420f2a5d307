//! SAT merging: each candidate node of the merged graph is proved equal to a twin (a class
//! member found near it by structure) or to its class representative, by window queries of
//! growing size; a proof merges it, a counterexample is queued for refinement
//! (`refine.rs`). Also the bookkeeping of the merged graph (origin and fanout of each node).

use super::super::classes::Classes;
use super::super::window::{Window, WindowAnswer};
use super::candidates::BOTH;
use super::tally::{
    slot, EQUAL, LARGE, LIFTS, PARTIAL, REFUTED, SMALL, TINY, TWIN_PROOFS, UNKNOWN,
};
use super::{Outcome, Sweeper, NO_EDGE};
use crate::aig::{Aig, Lit, Marks, Node};
use crate::cnf::Tseitin;
use crate::hash::FastMap;
use crate::rng::{SplitMix64, GOLDEN};
use crate::sat::{Limits, Sat};

/// AND nodes of the first window: enough for a local rewrite whose fan-ins are merged.
const TINY_WINDOW_BUDGET: usize = 24;
/// AND nodes a window query may encode.
const WINDOW_BUDGET: usize = 300;
/// AND nodes the second, larger window may encode.
const LARGE_WINDOW_BUDGET: usize = 20_000;
/// Conflicts allowed to a window query.
const WINDOW_CONFLICTS: u64 = 300;
/// Large-window queries always allowed before [`Sweeper::large_pays`] judges them.
const LARGE_GRACE: usize = 64;
/// The large window is kept while at least one query in this many decides something.
const LARGE_USEFUL_RATIO: usize = 4;
/// Levels searched below and then above a node for its twin in the merged graph.
const TWIN_DEPTH: u32 = 3;
/// Nodes collected below a node in the twin search.
const TWIN_BELOW: usize = 16;
/// Nodes visited above them.
const TWIN_VISITS: usize = 256;
/// Twins tried per node.
const TWINS_MAX: usize = 4;
/// Conflicts allowed to a whole-cone candidate query during the sweep.
const SWEEP_CONFLICTS: u64 = 200;

impl<'a> Sweeper<'a> {
    /// A sweeper of `g` with an empty merged graph; `ins` are the first simulation's input
    /// words (kept in debug builds for the merge check).
    pub(super) fn new(g: &'a Aig, limits: &Limits, seed: u64, ins: Vec<Vec<u64>>) -> Sweeper<'a> {
        Sweeper {
            g,
            f: Aig::new(),
            map: vec![Lit::FALSE; g.len()],
            window: Window::new(limits),
            global: Sat::new(limits),
            gts: Tseitin::new(),
            pending: Vec::new(),
            near: Vec::new(),
            whole_cone: 0,
            tally: [0; super::tally::SLOTS],
            times: [0.0; 4],
            rev: vec![0],
            fo_head: vec![NO_EDGE],
            fo_next: vec![NO_EDGE; 2],
            fside: vec![0],
            cut: super::cut_match::CutScratch::default(),
            marks: Marks::new(),
            value: FastMap::default(),
            rng: SplitMix64::from_state(seed.wrapping_mul(GOLDEN) | 1),
            stored: if cfg!(debug_assertions) {
                ins
            } else {
                Vec::new()
            },
        }
    }
}

impl Sweeper<'_> {
    /// Whether `a` equals one of `twins` or the representative's literal `rep` (literals of
    /// the merged graph): `Proved(lit)` with the literal it was proved equal to, `Refuted`
    /// (the counterexample is queued) or `Open`; without `deep`, only the tiny window is tried
    /// against the representative (`Partial` when it does not decide).
    pub(super) fn prove_equal(
        &mut self,
        a: Lit,
        rep: Option<Lit>,
        twins: &[Lit],
        deep: bool,
    ) -> Outcome {
        // The small window against the twins first: found by structure, they are the likely
        // partners (a rewritten node's original), whereas in a class of near-constant nodes
        // the representative is often unrelated. Then the representative: the small window,
        // and larger ones while its models do not extend to counterexamples.
        for &twin in twins {
            let t0 = std::time::Instant::now();
            let ans =
                self.window
                    .query_fresh(&self.f, a, twin, TINY_WINDOW_BUDGET, WINDOW_CONFLICTS);
            self.times[3] += t0.elapsed().as_secs_f64();
            match ans {
                WindowAnswer::Equal => {
                    self.tally[TWIN_PROOFS] += 1;
                    return Outcome::Proved(twin);
                }
                WindowAnswer::Differ(vals) => self.queue(&vals, None),
                _ => {}
            }
        }
        let Some(b) = rep else {
            return Outcome::Open;
        };
        for stage in [TINY, SMALL, LARGE] {
            if stage != TINY && !deep {
                return Outcome::Partial;
            }
            if stage == LARGE && !self.large_pays() {
                break;
            }
            match self.stage(stage, a, b) {
                Outcome::Partial => {}
                other => return other,
            }
        }
        // Cones beyond the large window stay unmerged: a whole-cone query on a big graph
        // costs more than the merge saves (the output queries still see the whole cone).
        self.whole_cone += 1;
        Outcome::Open
    }

    /// Record a node just built in the merged graph for `g`'s node `i`: its origin and its
    /// fanout edges.
    pub(super) fn note_built(&mut self, i: usize, l: Lit) {
        let u = l.node();
        debug_assert_eq!(u as usize, self.rev.len());
        self.rev.push(i as u32);
        self.fside.push(0);
        self.fo_head.push(NO_EDGE);
        self.fo_next.extend([NO_EDGE; 2]);
        if let Node::And(x, y) = self.f.node(u) {
            for (k, v) in [x.node(), y.node()].into_iter().enumerate() {
                let e = 2 * u + k as u32;
                self.fo_next[e as usize] = self.fo_head[v as usize];
                self.fo_head[v as usize] = e;
            }
        }
    }

    /// Members of `i`'s class found near `l` (its image) in the merged graph: nodes within
    /// [`TWIN_DEPTH`] levels above the nodes within [`TWIN_DEPTH`] levels below `l`. A locally
    /// rewritten node and its original share such a neighbourhood, however large their
    /// class. `rep`, when given, is left out (it is tried anyway).
    pub(super) fn twins(
        &mut self,
        classes: &Classes,
        side: &[u8],
        i: usize,
        l: Lit,
        rep: Option<Lit>,
    ) -> Vec<Lit> {
        self.marks.start(self.f.len());
        let f = &self.f;
        // Downwards, breadth first.
        let mut down: Vec<(u32, u32)> = vec![(l.node(), 0)];
        self.marks.mark(l.node() as usize);
        let mut head = 0;
        while head < down.len() && down.len() < TWIN_BELOW {
            let (n, d) = down[head];
            head += 1;
            if d == TWIN_DEPTH {
                continue;
            }
            if let Node::And(x, y) = f.node(n) {
                for c in [x.node(), y.node()] {
                    if self.marks.mark(c as usize) {
                        down.push((c, d + 1));
                    }
                }
            }
        }
        // Upwards from each, breadth first, through the fanout lists.
        let mut up: Vec<(u32, u32)> = down.iter().skip(1).map(|&(n, _)| (n, 0)).collect();
        let mut out = Vec::new();
        let mut head = 0;
        while head < up.len() && up.len() < TWIN_VISITS {
            let (n, d) = up[head];
            head += 1;
            let g0 = self.rev[n as usize] as usize;
            if g0 != i && side[i] | side[g0] == BOTH {
                if let Some(c) = classes.same_class(i, g0) {
                    let t = self.map[g0].xor_complement(c);
                    if t != l && Some(t) != rep && !out.contains(&t) {
                        out.push(t);
                        if out.len() == TWINS_MAX {
                            break;
                        }
                    }
                }
            }
            if d == TWIN_DEPTH {
                continue;
            }
            let mut e = self.fo_head[n as usize];
            while e != NO_EDGE && up.len() < TWIN_VISITS {
                let p = e / 2;
                if self.marks.mark(p as usize) {
                    up.push((p, d + 1));
                }
                e = self.fo_next[e as usize];
            }
        }
        out
    }

    /// Whether the large window is still worth its cost: it is dropped once it has mostly
    /// returned models that do not extend to counterexamples (in random logic these are
    /// near-constant nodes paired by chance, each a hard query, and nothing is merged).
    fn large_pays(&self) -> bool {
        let decided = self.tally[slot(LARGE, EQUAL)] + self.tally[slot(LARGE, REFUTED)];
        let partial = self.tally[slot(LARGE, PARTIAL)];
        partial < LARGE_GRACE || decided * LARGE_USEFUL_RATIO >= partial
    }

    /// One window query of `a` against `b` at `stage` (fresh tiny, small, large); a partial
    /// model that extends to a real counterexample counts as a refutation.
    fn stage(&mut self, stage: usize, a: Lit, b: Lit) -> Outcome {
        let t0 = std::time::Instant::now();
        let ans = match stage {
            TINY => self
                .window
                .query_fresh(&self.f, a, b, TINY_WINDOW_BUDGET, WINDOW_CONFLICTS),
            SMALL => self
                .window
                .query(&self.f, a, b, WINDOW_BUDGET, WINDOW_CONFLICTS),
            _ => self
                .window
                .query(&self.f, a, b, LARGE_WINDOW_BUDGET, SWEEP_CONFLICTS),
        };
        let (kind, out) = match ans {
            WindowAnswer::Equal => (EQUAL, Outcome::Proved(b)),
            WindowAnswer::Differ(vals) => {
                self.queue(&vals, None);
                (REFUTED, Outcome::Refuted)
            }
            WindowAnswer::Partial(vals) => match self.lift(a, b, &vals) {
                Some(p) => {
                    self.tally[LIFTS] += 1;
                    self.queue(&vals, Some(p));
                    (REFUTED, Outcome::Refuted)
                }
                None => (PARTIAL, Outcome::Partial),
            },
            WindowAnswer::Unknown => (UNKNOWN, Outcome::Open),
        };
        self.tally[slot(stage, kind)] += 1;
        self.times[stage] += t0.elapsed().as_secs_f64();
        out
    }
}

#[cfg(test)]
mod tests {
    use super::super::fixture::{copied, image, value, xors};
    use super::*;

    #[test]
    fn two_forms_of_one_function_are_proved_equal() {
        let x = xors();
        let limits = Limits::none();
        let mut sw = copied(&x.aig, &limits);
        let (a, b) = (image(&sw, x.x2), image(&sw, x.x1));
        assert_ne!(a, b, "hashing alone does not merge the two forms");
        assert_eq!(sw.prove_equal(a, Some(b), &[], true), Outcome::Proved(b));
        assert!(sw.pending.is_empty());
    }

    #[test]
    fn different_functions_are_refuted_with_a_real_counterexample() {
        let x = xors();
        let limits = Limits::none();
        let mut sw = copied(&x.aig, &limits);
        let (a, b) = (image(&sw, x.x1), image(&sw, x.y));
        assert_eq!(sw.prove_equal(a, Some(b), &[], true), Outcome::Refuted);
        let p = sw.pending[0].clone();
        assert_ne!(value(&x.aig, x.x1, &p), value(&x.aig, x.y, &p), "{p:?}");
    }

    #[test]
    fn a_twin_is_tried_first_and_no_representative_leaves_it_open() {
        let x = xors();
        let limits = Limits::none();
        let mut sw = copied(&x.aig, &limits);
        let (a, twin) = (image(&sw, x.x2), image(&sw, x.x1));
        assert_eq!(
            sw.prove_equal(a, None, &[twin], true),
            Outcome::Proved(twin)
        );
        assert_eq!(sw.tally[TWIN_PROOFS], 1);
        let y = image(&sw, x.y);
        assert_eq!(sw.prove_equal(a, None, &[y], true), Outcome::Open);
    }

    #[test]
    fn fanout_lists_record_each_and_node_under_its_fanins() {
        let x = xors();
        let limits = Limits::none();
        let sw = copied(&x.aig, &limits);
        // Walk the fanout list of input a (node 1): every fanout reads it.
        let mut e = sw.fo_head[1];
        let mut readers = 0;
        while e != NO_EDGE {
            let u = e / 2;
            match sw.f.node(u) {
                Node::And(p, q) => assert!(p.node() == 1 || q.node() == 1),
                _ => panic!("fanout of a non-AND node"),
            }
            readers += 1;
            e = sw.fo_next[e as usize];
        }
        assert_eq!(readers, 4, "a & !b, !a & b, a & b and !a & !b read a");
        assert_eq!(sw.rev.len(), sw.f.len());
    }
}
