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

use super::classes::Classes;
use super::pairs::{decide_pairs, PairQuery};
use super::progress::Progress;
use super::split;
use super::window::{Window, WindowAnswer};
use super::Finding;
use crate::aig::{random_words, simulate, simulate_into, Aig, Lit, Node, SimTable};
use crate::cnf::Tseitin;
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
/// nodes means more chance coincidences), within about 128 MiB of simulation values.
pub(crate) fn sweep_words(nodes: usize) -> usize {
    let by_size = (usize::BITS - nodes.max(2).leading_zeros()) as usize;
    by_size.clamp(4, 32).min((16 << 20) / nodes.max(1)).max(1)
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
    // Classes from the first word, then split by each further word: the same partition as
    // from all words at once, with one word of simulation values per node alive at a time.
    let mut table = SimTable::default();
    let mut row: Vec<Vec<u64>> = vec![vec![0]; ins.len()];
    let mut classes = None;
    for w in 0..words {
        for (r, i) in row.iter_mut().zip(&ins) {
            r[0] = i[w];
        }
        simulate_into(g, &row, 1, &mut table);
        match &mut classes {
            None => classes = Some(Classes::from_table(&table, g.len())),
            Some(c) => c.refine(&table.values, 0),
        }
    }
    let mut classes = classes.unwrap_or_else(|| Classes::from_table(&table, g.len()));
    st.classes = classes.count();
    st.candidates = classes.members();
    log::debug!(
        "sweep: {} nodes, {} words, {} candidate classes over {} nodes",
        g.len(),
        words,
        st.classes,
        st.candidates
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
        tally: [0; 13],
        stamp: Vec::new(),
        value: Vec::new(),
        epoch: 0,
        rng: cone.seed.wrapping_mul(0x9E37_79B9_7F4A_7C15) | 1,
        stored: if cfg!(debug_assertions) {
            ins
        } else {
            Vec::new()
        },
    };
    sw.f.reserve(g.len());
    let side = sides(g, &cone.pairs);
    // Counterexamples wait for a batch before they are simulated on the whole graph: one
    // at a time for small graphs, up to 64 (one word) for large ones.
    let batch = (g.len() / 16_384).clamp(1, 64);
    let mut querying = true;
    let mut last_classes = st.classes;
    for i in 0..g.len() {
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
        if !querying {
            continue;
        }
        let Some((r, compl)) = classes.candidate(i) else {
            continue;
        };
        if side[i] | side[r] != BOTH {
            // Both in the reference alone, or both in the candidate alone: merging them is
            // not needed to relate the designs.
            continue;
        }
        let t = sw.map[r].xor_complement(compl);
        if l == t {
            st.merged_by_hashing += 1;
            continue;
        }
        if l == !t {
            continue; // cannot happen with sound simulation; never merge
        }
        match sw.prove_equal(l, t) {
            Some(true) => {
                sw.map[i] = t;
                st.merged_by_sat += 1;
                progress.proved(1);
            }
            Some(false) => {
                st.refuted += 1;
                if st.refuted >= GIVE_UP_AFTER && st.merged_by_sat * GIVE_UP_RATIO < st.refuted {
                    log::debug!(
                        "sweep: {} candidates refuted for {} merged; stopping the sweep",
                        st.refuted,
                        st.merged_by_sat
                    );
                    querying = false;
                }
                if sw.pending.len() >= batch {
                    st.patterns_fed_back += sw.pending.len();
                    sw.refine(&mut classes, i + 1);
                    let now = classes.count();
                    progress.add_classes(now as i64 - last_classes as i64);
                    last_classes = now;
                }
            }
            None => {
                st.unresolved += 1;
                if limits.expired() {
                    querying = false;
                }
            }
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
        "sweep: {:.3} s, window answers {:?}, window stats {:?}, whole-cone queries {} with stats {:?}",
        started.elapsed().as_secs_f64(),
        sw.tally,
        sw.window.stats(),
        sw.whole_cone,
        sw.global.stats()
    );
    log::debug!(
        "sweep: merged {} by hashing and {} by SAT, {} refuted, {} unresolved, {} patterns fed back; {} -> {} AND nodes",
        st.merged_by_hashing,
        st.merged_by_sat,
        st.refuted,
        st.unresolved,
        st.patterns_fed_back,
        st.ands_before,
        st.ands_after
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
    rng: u64,
    whole_cone: usize,
    /// Window answers per stage (fresh tiny, small, large: equal, differ, partial, unknown),
    /// then lifts.
    tally: [usize; 13],
    /// Scratch for [`Sweeper::lift`]: visit stamps and simulation words per merged-graph node.
    stamp: Vec<u32>,
    value: Vec<u64>,
    epoch: u32,
    /// Every simulated pattern word per input (debug builds only, for the merge check).
    stored: Vec<Vec<u64>>,
}

impl Sweeper<'_> {
    /// Whether `a` and `b` (literals of the merged graph) are equal: `Some(true)` proved,
    /// `Some(false)` refuted (the pattern is queued), `None` unresolved.
    fn prove_equal(&mut self, a: Lit, b: Lit) -> Option<bool> {
        // A small window first, then (when its model does not extend to a real
        // counterexample) a large one in a fresh solver, then the whole cone.
        for (stage, (budget, conflicts, fresh)) in [
            (TINY_WINDOW_BUDGET, WINDOW_CONFLICTS, true),
            (WINDOW_BUDGET, WINDOW_CONFLICTS, false),
            (LARGE_WINDOW_BUDGET, SWEEP_CONFLICTS, false),
        ]
        .into_iter()
        .enumerate()
        {
            let ans = if fresh {
                self.window.query_fresh(&self.f, a, b, budget, conflicts)
            } else {
                self.window.query(&self.f, a, b, budget, conflicts)
            };
            let kind = match &ans {
                WindowAnswer::Equal => 0,
                WindowAnswer::Differ(_) => 1,
                WindowAnswer::Partial(_) => 2,
                WindowAnswer::Unknown => 3,
            };
            self.tally[stage * 4 + kind] += 1;
            match ans {
                WindowAnswer::Equal => return Some(true),
                WindowAnswer::Differ(vals) => {
                    let mut p = self.random_pattern();
                    for &(k, v) in &vals {
                        p[k as usize] = v;
                    }
                    self.pending.push(p);
                    self.near.push(vals.iter().map(|&(k, _)| k).collect());
                    return Some(false);
                }
                WindowAnswer::Partial(vals) => {
                    if let Some(p) = self.lift(a, b, &vals) {
                        self.tally[12] += 1;
                        self.pending.push(p);
                        self.near.push(vals.iter().map(|&(k, _)| k).collect());
                        return Some(false);
                    }
                }
                WindowAnswer::Unknown => return None,
            }
        }
        // Cones beyond the large window stay unmerged: a whole-cone query on a big graph
        // costs more than the merge saves (the output queries still see the whole cone).
        self.whole_cone += 1;
        None
    }

    /// Try to extend a truncated window's model to a real counterexample: 64 patterns that
    /// keep `fixed` and draw the other inputs at random, simulated on the cones of `a` and `b`.
    fn lift(&mut self, a: Lit, b: Lit, fixed: &[(u32, bool)]) -> Option<Vec<bool>> {
        let f = &self.f;
        if self.stamp.len() < f.len() {
            self.stamp.resize(f.len(), 0);
            self.value.resize(f.len(), 0);
        }
        self.epoch += 1;
        let epoch = self.epoch;
        let mut cone = Vec::new();
        let mut stack = vec![a.node(), b.node()];
        while let Some(n) = stack.pop() {
            if self.stamp[n as usize] == epoch {
                continue;
            }
            self.stamp[n as usize] = epoch;
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
        let mut fixed_word = vec![None; 0];
        fixed_word.resize(f.num_inputs(), None);
        for &(k, v) in fixed {
            fixed_word[k as usize] = Some(if v { u64::MAX } else { 0 });
        }
        let mut rng = self.rng;
        for &n in &cone {
            let v = match f.node(n) {
                Node::Const => 0,
                Node::Input(k) => fixed_word[k as usize].unwrap_or_else(|| {
                    rng = rng.wrapping_add(0x9E37_79B9_7F4A_7C15);
                    mix(rng)
                }),
                Node::And(x, y) => {
                    let vx = self.value[x.index()] ^ if x.is_complemented() { u64::MAX } else { 0 };
                    let vy = self.value[y.index()] ^ if y.is_complemented() { u64::MAX } else { 0 };
                    vx & vy
                }
            };
            self.value[n as usize] = v;
        }
        self.rng = rng;
        let word = |l: Lit| self.value[l.index()] ^ if l.is_complemented() { u64::MAX } else { 0 };
        let d = word(a) ^ word(b);
        if d == 0 {
            return None;
        }
        let bit = d.trailing_zeros();
        let mut p = self.random_pattern();
        for &n in &cone {
            if let Node::Input(k) = self.f.node(n) {
                p[k as usize] = (self.value[n as usize] >> bit) & 1 == 1;
            }
        }
        Some(p)
    }

    fn random_word(&mut self) -> u64 {
        self.rng = self.rng.wrapping_add(0x9E37_79B9_7F4A_7C15);
        mix(self.rng)
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

    /// Simulate the queued patterns (one word) and split the classes. The word's other bits
    /// are neighbours of the queued patterns at distance one, each with one input of the
    /// refuted window flipped (Mishchenko et al. 2006): a rare distinguishing pattern, such as
    /// a long carry-propagate run in an adder, usually has rare neighbours that distinguish
    /// other candidates too, which random patterns would not find.
    fn refine(&mut self, classes: &mut Classes, done: usize) {
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

/// SplitMix64 output function.
#[inline]
fn mix(mut z: u64) -> u64 {
    z = (z ^ (z >> 30)).wrapping_mul(0xBF58_476D_1CE4_E5B9);
    z = (z ^ (z >> 27)).wrapping_mul(0x94D0_49BB_1331_11EB);
    z ^ (z >> 31)
}
