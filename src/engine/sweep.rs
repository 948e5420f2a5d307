//! SAT sweeping of one cone (Kuehlmann et al. 2002; Mishchenko et al. 2006): random simulation
//! splits nodes into candidate classes, a topological pass proves each candidate against its
//! class representative (bounded window first, then the whole cone under a small conflict
//! limit), merges the proved ones while rebuilding the graph with structural hashing, and feeds
//! every counterexample back as a simulation pattern. The output pairs are then decided on the
//! merged graph: the same literal means equivalent, otherwise an XOR query.
//!
//! **Invariant:** a node is merged only after an UNSAT answer (or when hashing already made the
//! two literals equal), so the merged graph computes the same function at every mapped node;
//! debug builds re-simulate every stored pattern on both graphs to check it.

use super::classes::{Classes, Signatures};
use super::pairs::{decide_pairs, PairQuery};
use super::progress::Progress;
use super::split;
use super::window::{Window, WindowAnswer};
use super::Finding;
use crate::aig::{random_words, simulate, simulate_into, Aig, Lit, Marks, Node, SimTable};
use crate::cnf::Tseitin;
use crate::hash::FastMap;
use crate::rng::{SplitMix64, GOLDEN};
use crate::sat::{Limits, Sat, SatStats, StopReason};
use serde::Serialize;

/// AND nodes of the first window: enough for a local rewrite whose fan-ins are merged.
const TINY_WINDOW_BUDGET: usize = 24;
/// AND nodes a window query may encode.
const WINDOW_BUDGET: usize = 300;
/// AND nodes the second, larger window may encode.
const LARGE_WINDOW_BUDGET: usize = 20_000;
/// Conflicts allowed to a window query.
const WINDOW_CONFLICTS: u64 = 300;
/// Refutations after which a sweep that merges almost nothing gives up (the output queries
/// then run on the graph as merged so far).
const GIVE_UP_AFTER: usize = 2_000;
/// "Almost nothing": fewer than one merge per this many refutations.
const GIVE_UP_RATIO: usize = 50;
/// Largest cone (nodes) simulated to extend a truncated window's model.
const LIFT_MAX_CONE: usize = 20_000;
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
/// No fanout edge.
const NO_EDGE: u32 = u32::MAX;
/// Stages of a candidate query (fresh tiny window, small and large persistent windows) and
/// answer kinds: the tally holds four counts per stage, then the lifts and the twin proofs.
const TINY: usize = 0;
const SMALL: usize = 1;
const LARGE: usize = 2;
const EQUAL: usize = 0;
const REFUTED: usize = 1;
const PARTIAL: usize = 2;
const UNKNOWN: usize = 3;
const LIFTS: usize = 12;
const TWIN_PROOFS: usize = 13;
/// Conflicts allowed to a whole-cone candidate query during the sweep.
const SWEEP_CONFLICTS: u64 = 200;

/// Figures of sweeping (summed over the groups).
#[derive(Clone, Debug, Default, PartialEq, Serialize)]
pub struct SweepStats {
    /// Output groups swept independently.
    pub groups: usize,
    /// Candidate classes after the first simulation.
    pub classes: usize,
    /// Nodes in those classes.
    pub candidates: usize,
    /// Candidate pairs that hashing made equal without a query.
    pub merged_by_hashing: usize,
    /// Candidate pairs proved equal by SAT and merged.
    pub merged_by_sat: usize,
    /// Candidate pairs separated by a counterexample.
    pub refuted: usize,
    /// Candidate pairs left open by the conflict limit.
    pub unresolved: usize,
    /// Counterexample patterns fed back into simulation.
    pub patterns_fed_back: usize,
    /// Candidate pairs that needed a whole-cone query (the window did not decide them).
    pub whole_cone_queries: usize,
    /// AND nodes before sweeping.
    pub ands_before: usize,
    /// AND nodes of the merged graph.
    pub ands_after: usize,
}

impl SweepStats {
    /// Add another group's figures.
    pub fn add(&mut self, o: &SweepStats) {
        self.groups += o.groups;
        self.classes += o.classes;
        self.candidates += o.candidates;
        self.merged_by_hashing += o.merged_by_hashing;
        self.merged_by_sat += o.merged_by_sat;
        self.refuted += o.refuted;
        self.unresolved += o.unresolved;
        self.patterns_fed_back += o.patterns_fed_back;
        self.whole_cone_queries += o.whole_cone_queries;
        self.ands_before += o.ands_before;
        self.ands_after += o.ands_after;
    }
}

/// One cone to sweep: a graph and the output pairs to decide in it.
pub(crate) struct Cone<'a> {
    pub aig: &'a Aig,
    pub pairs: Vec<PairQuery>,
    pub constraint: Lit,
    pub seed: u64,
    pub words: Option<usize>,
}

/// Words of 64 random patterns for a graph of `nodes` nodes: more as the graph grows (more
/// nodes means more chance coincidences). Classes are built one word at a time, so the count
/// costs time (one simulation per word), not memory.
pub(crate) fn sweep_words(nodes: usize) -> usize {
    let by_size = (usize::BITS - nodes.max(2).leading_zeros()) as usize;
    by_size.clamp(4, 32)
}

/// Sweep `cone` and decide its pairs; findings are in the order of `cone.pairs`.
pub(crate) fn sweep(
    cone: &Cone<'_>,
    limits: &Limits,
    progress: &Progress,
) -> (Vec<Finding>, SatStats, SweepStats) {
    let started = std::time::Instant::now();
    let g = cone.aig;
    let mut st = SweepStats {
        groups: 1,
        ands_before: g.num_ands(),
        ..SweepStats::default()
    };
    if limits.conflicts_per_query.is_none()
        && !cone.pairs.is_empty()
        && cone.pairs.len() <= split::SPLIT_FIRST_MAX_PAIRS
        && cone
            .pairs
            .iter()
            .all(|p| split::split_first(g, &[p.reference, p.candidate, cone.constraint]))
    {
        // Wide selectors: nothing inside them to merge; case splitting decides them.
        log::debug!("sweep: every output pair is split at once; no sweep");
        let mut findings = vec![None; cone.pairs.len()];
        let mut sat = Sat::new(limits);
        let mut ts = Tseitin::new();
        decide_pairs(
            g,
            &cone.pairs,
            cone.constraint,
            &mut sat,
            &mut ts,
            &mut findings,
            limits,
            progress,
        );
        let findings = findings
            .into_iter()
            .map(|f| f.unwrap_or(Finding::Stopped(StopReason::Timeout)))
            .collect();
        st.ands_after = st.ands_before;
        return (findings, sat.stats(), st);
    }
    let words = cone.words.unwrap_or_else(|| sweep_words(g.len()));
    let ins = random_words(g.num_inputs(), words, cone.seed ^ 0x5EED_5EED);
    // Signatures accumulated a word at a time: the partition of all words at once, with one
    // word of simulation values per node alive at a time.
    let mut table = SimTable::default();
    let mut row: Vec<Vec<u64>> = vec![vec![0]; ins.len()];
    let mut sigs = Signatures::new(g.len());
    for w in 0..words {
        for (r, i) in row.iter_mut().zip(&ins) {
            r[0] = i[w];
        }
        simulate_into(g, &row, 1, &mut table);
        sigs.add(&table.values);
    }
    drop(table);
    let mut classes = Classes::from_signatures(sigs);
    st.classes = classes.count();
    st.candidates = classes.members();
    log::debug!(
        "sweep: {} nodes, {} words, {} candidate classes over {} nodes; memory {}",
        g.len(),
        words,
        st.classes,
        st.candidates,
        super::memory_now()
    );
    progress.add_classes(st.classes as i64);
    let mut sw = Sweeper {
        g,
        f: Aig::new(),
        map: vec![Lit::FALSE; g.len()],
        window: Window::new(limits),
        global: Sat::new(limits),
        gts: Tseitin::new(),
        pending: Vec::new(),
        near: Vec::new(),
        whole_cone: 0,
        tally: [0; 14],
        times: [0.0; 4],
        rev: vec![0],
        fo_head: vec![NO_EDGE],
        fo_next: vec![NO_EDGE; 2],
        marks: Marks::new(),
        value: FastMap::default(),
        rng: SplitMix64::from_state(cone.seed.wrapping_mul(GOLDEN) | 1),
        stored: if cfg!(debug_assertions) {
            ins
        } else {
            Vec::new()
        },
    };
    let side = sides(g, &cone.pairs);
    // Counterexamples wait for a batch before they are simulated on the whole graph: one
    // at a time below 131,072 nodes, one more per 65,536 nodes, at most 64 (one word). A
    // pattern simulated at once often splits the very next candidate (a 1024-bit prefix adder
    // against a ripple adder: 990 refutations instead of 1,172 with batches of two).
    let batch = (g.len() / 65_536).clamp(1, 64);
    let mut querying = true;
    let mut last_classes = st.classes;
    for i in 0..g.len() {
        let before = sw.f.len();
        let l = match g.node(i as u32) {
            Node::Const => Lit::FALSE,
            Node::Input(_) => sw.f.add_input(),
            Node::And(a, b) => {
                let fa = sw.map[a.index()].xor_complement(a.is_complemented());
                let fb = sw.map[b.index()].xor_complement(b.is_complemented());
                sw.f.and(fa, fb)
            }
        };
        sw.map[i] = l;
        let built = sw.f.len() > before;
        if built {
            sw.note_built(i, l);
        }
        if !querying {
            continue;
        }
        let Some((r, compl)) = classes.candidate(i) else {
            continue;
        };
        if !built {
            // Hashing found the node already built: it is merged with the earlier node of
            // the same function (with sound merges, a member of its class).
            st.merged_by_hashing += 1;
            continue;
        }
        // The representative, unless both nodes belong to one design alone (merging them is
        // not needed to relate the designs), and members near the node in the merged graph.
        let t = (side[i] | side[r] == BOTH).then(|| sw.map[r].xor_complement(compl));
        let twins = sw.twins(&classes, &side, i, l, t);
        if t.is_none() && twins.is_empty() {
            continue;
        }
        match sw.prove_equal(l, t, &twins) {
            Outcome::Proved(u) => {
                sw.map[i] = u;
                st.merged_by_sat += 1;
                progress.proved(1);
            }
            Outcome::Refuted => {
                st.refuted += 1;
                if st.refuted >= GIVE_UP_AFTER && st.merged_by_sat * GIVE_UP_RATIO < st.refuted {
                    log::debug!(
                        "sweep: {} candidates refuted for {} merged; stopping the sweep",
                        st.refuted,
                        st.merged_by_sat
                    );
                    querying = false;
                }
            }
            Outcome::Open | Outcome::Partial if t.is_none() => {}
            Outcome::Open | Outcome::Partial => {
                st.unresolved += 1;
                if limits.expired() {
                    querying = false;
                }
            }
        }
        if sw.pending.len() >= batch {
            st.patterns_fed_back += sw.pending.len();
            sw.refine(&mut classes, i + 1);
            let now = classes.count();
            progress.add_classes(now as i64 - last_classes as i64);
            last_classes = now;
        }
        if i.is_multiple_of(4096) && limits.expired() {
            querying = false;
        }
    }
    if !sw.pending.is_empty() {
        st.patterns_fed_back += sw.pending.len();
        sw.refine(&mut classes, g.len());
    }
    progress.add_classes(-(last_classes as i64));
    #[cfg(debug_assertions)]
    sw.check_merges();
    st.ands_after = sw.f.num_ands();
    st.whole_cone_queries = sw.whole_cone;
    log::debug!(
        "sweep: {:.3} s, seconds per stage {:.2?}, window answers {:?}, window stats {:?}, whole-cone queries {} with stats {:?}",
        started.elapsed().as_secs_f64(),
        sw.times,
        sw.tally,
        sw.window.stats(),
        sw.whole_cone,
        sw.global.stats()
    );
    log::debug!(
        "sweep: merged {} by hashing and {} by SAT, {} refuted, {} unresolved, {} patterns fed back; {} -> {} AND nodes; memory {}",
        st.merged_by_hashing,
        st.merged_by_sat,
        st.refuted,
        st.unresolved,
        st.patterns_fed_back,
        st.ands_before,
        st.ands_after,
        super::memory_now()
    );
    // Decide the output pairs on the merged graph.
    let mapped: Vec<PairQuery> = cone
        .pairs
        .iter()
        .map(|p| PairQuery {
            reference: sw.map[p.reference.index()].xor_complement(p.reference.is_complemented()),
            candidate: sw.map[p.candidate.index()].xor_complement(p.candidate.is_complemented()),
        })
        .collect();
    let constraint =
        sw.map[cone.constraint.index()].xor_complement(cone.constraint.is_complemented());
    let mut findings: Vec<Option<Finding>> = mapped
        .iter()
        .map(|p| (p.reference == p.candidate).then_some(Finding::Equal(super::Method::Sweep)))
        .collect();
    progress.outputs_done(findings.iter().flatten().count());
    decide_pairs(
        &sw.f,
        &mapped,
        constraint,
        &mut sw.global,
        &mut sw.gts,
        &mut findings,
        limits,
        progress,
    );
    let mut sat = sw.global.stats();
    sat.add(&sw.window.stats());
    let findings = findings
        .into_iter()
        .map(|f| f.unwrap_or(Finding::Stopped(StopReason::Timeout)))
        .collect();
    (findings, sat, st)
}

/// Side marks: in the reference's cones, in the candidate's cones.
const REF: u8 = 1;
const CAND: u8 = 2;
const BOTH: u8 = 3;

/// For each node: which designs' output cones hold it (inputs count as both, the constant as
/// neither, so that a node is tried against a constant only when both designs share it).
fn sides(g: &Aig, pairs: &[PairQuery]) -> Vec<u8> {
    let r: Vec<Lit> = pairs.iter().map(|p| p.reference).collect();
    let c: Vec<Lit> = pairs.iter().map(|p| p.candidate).collect();
    let (mr, mc) = (g.cone_mask(&r), g.cone_mask(&c));
    (0..g.len())
        .map(|n| match g.node(n as u32) {
            Node::Const => 0,
            Node::Input(_) => BOTH,
            Node::And(..) => REF * u8::from(mr[n]) + CAND * u8::from(mc[n]),
        })
        .collect()
}

/// The answer of [`Sweeper::prove_equal`] and of one of its stages.
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
enum Outcome {
    /// Equal to this literal of the merged graph.
    Proved(Lit),
    /// A counterexample is queued.
    Refuted,
    /// A truncated window's model that did not extend (stages only: try a larger window).
    Partial,
    /// Not decided.
    Open,
}

struct Sweeper<'a> {
    g: &'a Aig,
    f: Aig,
    map: Vec<Lit>,
    window: Window,
    global: Sat<'static>,
    gts: Tseitin,
    /// Counterexample patterns (one value per input) not yet simulated.
    pending: Vec<Vec<bool>>,
    /// For each pending pattern, the inputs of the window that found it: the bits to flip for
    /// its neighbours.
    near: Vec<Vec<u32>>,
    rng: SplitMix64,
    whole_cone: usize,
    /// Window answers per stage (fresh tiny, small, large: equal, refuted (lifted partial
    /// models included), partial, unknown), then lifts, then proofs against a member other than the representative.
    tally: [usize; 14],
    /// Seconds spent per stage, then on the other members.
    times: [f64; 4],
    /// For each node of the merged graph, the node of `g` it was built for.
    rev: Vec<u32>,
    /// Fanout lists of the merged graph: the first edge of each node, and the next edge
    /// after each edge (edge `2u + k` is fan-in `k` of node `u`).
    fo_head: Vec<u32>,
    fo_next: Vec<u32>,
    /// Scratch for [`Sweeper::lift`] and [`Sweeper::twins`]: visit marks per merged-graph
    /// node, and the simulation words of the cone being lifted.
    marks: Marks,
    value: FastMap<u32, u64>,
    /// Every simulated pattern word per input (debug builds only, for the merge check).
    stored: Vec<Vec<u64>>,
}

impl Sweeper<'_> {
    /// Whether `a` equals one of `twins` or the representative's literal `rep` (literals of
    /// the merged graph): `Proved(lit)` with the literal it was proved equal to, `Refuted`
    /// (the counterexample is queued) or `Open`.
    fn prove_equal(&mut self, a: Lit, rep: Option<Lit>, twins: &[Lit]) -> Outcome {
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
    fn note_built(&mut self, i: usize, l: Lit) {
        let u = l.node();
        debug_assert_eq!(u as usize, self.rev.len());
        self.rev.push(i as u32);
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
    fn twins(
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
        let decided = self.tally[LARGE * 4 + EQUAL] + self.tally[LARGE * 4 + REFUTED];
        let partial = self.tally[LARGE * 4 + PARTIAL];
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
        self.tally[stage * 4 + kind] += 1;
        self.times[stage] += t0.elapsed().as_secs_f64();
        out
    }

    /// Queue a counterexample: `pattern` if given, else `vals` over a random pattern; the
    /// window's inputs are the bits its neighbours flip.
    fn queue(&mut self, vals: &[(u32, bool)], pattern: Option<Vec<bool>>) {
        let p = pattern.unwrap_or_else(|| {
            let mut p = self.random_pattern();
            for &(k, v) in vals {
                p[k as usize] = v;
            }
            p
        });
        self.pending.push(p);
        self.near.push(vals.iter().map(|&(k, _)| k).collect());
    }

    /// Try to extend a truncated window's model to a real counterexample: 64 patterns that
    /// keep `fixed` and draw the other inputs at random, simulated on the cones of `a` and `b`.
    fn lift(&mut self, a: Lit, b: Lit, fixed: &[(u32, bool)]) -> Option<Vec<bool>> {
        self.marks.start(self.f.len());
        let f = &self.f;
        let mut cone = Vec::new();
        let mut stack = vec![a.node(), b.node()];
        while let Some(n) = stack.pop() {
            if !self.marks.mark(n as usize) {
                continue;
            }
            cone.push(n);
            if cone.len() > LIFT_MAX_CONE {
                return None;
            }
            if let Node::And(x, y) = f.node(n) {
                stack.push(x.node());
                stack.push(y.node());
            }
        }
        cone.sort_unstable();
        self.value.clear();
        let mut fixed_word = vec![None; 0];
        fixed_word.resize(f.num_inputs(), None);
        for &(k, v) in fixed {
            fixed_word[k as usize] = Some(if v { u64::MAX } else { 0 });
        }
        let mut rng = self.rng;
        for &n in &cone {
            let v = match f.node(n) {
                Node::Const => 0,
                Node::Input(k) => fixed_word[k as usize].unwrap_or_else(|| rng.next_u64()),
                Node::And(x, y) => {
                    let vx = self.value[&x.node()] ^ if x.is_complemented() { u64::MAX } else { 0 };
                    let vy = self.value[&y.node()] ^ if y.is_complemented() { u64::MAX } else { 0 };
                    vx & vy
                }
            };
            self.value.insert(n, v);
        }
        self.rng = rng;
        let word = |l: Lit| self.value[&l.node()] ^ if l.is_complemented() { u64::MAX } else { 0 };
        let d = word(a) ^ word(b);
        if d == 0 {
            return None;
        }
        let bit = d.trailing_zeros();
        let mut p = self.random_pattern();
        for &n in &cone {
            if let Node::Input(k) = self.f.node(n) {
                p[k as usize] = (self.value[&n] >> bit) & 1 == 1;
            }
        }
        Some(p)
    }

    fn random_word(&mut self) -> u64 {
        self.rng.next_u64()
    }

    fn random_pattern(&mut self) -> Vec<bool> {
        let n = self.g.num_inputs();
        let mut out = Vec::with_capacity(n);
        let mut word = 0u64;
        for k in 0..n {
            if k % 64 == 0 {
                word = self.random_word();
            }
            out.push((word >> (k % 64)) & 1 == 1);
        }
        out
    }

    /// Simulate the queued patterns (a word per 64) and split the classes. The word's other bits
    /// are neighbours of the queued patterns at distance one, each with one input of the
    /// refuted window flipped (Mishchenko et al. 2006): a rare distinguishing pattern, such as
    /// a long carry-propagate run in an adder, usually has rare neighbours that distinguish
    /// other candidates too, which random patterns would not find.
    fn refine(&mut self, classes: &mut Classes, done: usize) {
        // One word per 64 queued patterns.
        while self.pending.len() > 64 {
            let rest = self.pending.split_off(64);
            let rest_near = self.near.split_off(64);
            self.refine_word(classes, done);
            self.pending = rest;
            self.near = rest_near;
        }
        self.refine_word(classes, done);
    }

    /// [`Sweeper::refine`] for at most 64 queued patterns.
    fn refine_word(&mut self, classes: &mut Classes, done: usize) {
        let n = self.g.num_inputs();
        let q = self.pending.len();
        let mut row: Vec<Vec<u64>> = vec![vec![0u64]; n];
        let set = |row: &mut Vec<Vec<u64>>, j: usize, p: &[bool]| {
            for k in 0..n {
                row[k][0] |= u64::from(p[k]) << j;
            }
        };
        for (j, p) in self.pending.iter().enumerate() {
            set(&mut row, j, p);
        }
        for j in q..64 {
            let src = j % q.max(1);
            let r = self.random_word();
            match (self.pending.get(src), self.near.get(src)) {
                (Some(p), Some(near)) if !near.is_empty() => {
                    let mut p = p.clone();
                    let k = near[(r % near.len() as u64) as usize] as usize;
                    p[k] = !p[k];
                    set(&mut row, j, &p);
                }
                _ => {
                    let p = self.random_pattern();
                    set(&mut row, j, &p);
                }
            }
        }
        self.pending.clear();
        self.near.clear();
        let table = simulate(self.g, &row, 1);
        classes.refine(&table.values, done);
        if cfg!(debug_assertions) {
            for (k, r) in row.into_iter().enumerate() {
                self.stored[k].push(r[0]);
            }
        }
    }

    /// Debug check: every node of the original graph and its image in the merged graph agree
    /// on every stored pattern, so no merge contradicts a counterexample.
    #[cfg(debug_assertions)]
    fn check_merges(&self) {
        let words = self.stored.first().map_or(0, |r| r.len());
        if words == 0 {
            return;
        }
        let tg = simulate(self.g, &self.stored, words);
        let tf = simulate(&self.f, &self.stored, words);
        for (i, &m) in self.map.iter().enumerate() {
            for w in 0..words {
                assert_eq!(
                    tg.node(i)[w],
                    tf.lit_word(m, w),
                    "sweep merged node {i} against a stored pattern"
                );
            }
        }
    }
}
