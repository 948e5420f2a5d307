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

mod candidates;
mod cut_match;
mod merge;
mod refine;
mod tally;

use super::pair_cost::{share_rest, PairCost};
use super::pairs::{decide_pairs, PairQuery, Queries};
use super::progress::Progress;
use super::split;
use super::window::Window;
use super::Finding;
use crate::aig::{Aig, Lit, Marks, Node};
use crate::cnf::Tseitin;
use crate::hash::FastMap;
use crate::rng::SplitMix64;
use crate::sat::{Limits, Sat, SatStats, StopReason};
pub use tally::SweepStats;

/// Refutations after which a sweep that merges almost nothing gives up (the output queries
/// then run on the graph as merged so far).
const GIVE_UP_AFTER: usize = 2_000;
/// "Almost nothing": fewer than one merge per this many refutations.
const GIVE_UP_RATIO: usize = 50;
/// A node whose class has at most this many members is queried with the larger windows even
/// when cut matching found no partner over its anchors: its one partner is likely its equal
/// (a remapped lookup function whose leaves are not yet anchors). Without this, a 12x12 Dadda
/// multiplier against its K=6 remap kept 82 equal nodes apart as cut points: 89 instead of 135
/// merges by hashing, 359 SAT calls with 4,463 conflicts instead of 198 with 2,308 (one run).
/// Near-constant nodes (an arbiter's) sit in large classes and stay cut points.
const PAIR_CLASS: usize = 2;
/// No fanout edge.
const NO_EDGE: u32 = u32::MAX;
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

/// Sweep `cone` and decide its pairs; findings and costs are in the order of `cone.pairs`
/// (each pair's own query, and an even share of the sweep and of the solver figures no pair
/// owns).
pub(crate) fn sweep(
    cone: &Cone<'_>,
    limits: &Limits,
    progress: &Progress,
) -> (Vec<Finding>, SatStats, SweepStats, Vec<PairCost>) {
    let started = std::time::Instant::now();
    let all: Vec<usize> = (0..cone.pairs.len()).collect();
    let mut costs = vec![PairCost::default(); cone.pairs.len()];
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
        let q = Queries {
            aig: g,
            pairs: &cone.pairs,
            constraint: cone.constraint,
            limits,
            progress,
        };
        let split = decide_pairs(&q, &mut sat, &mut ts, &mut findings, &mut costs);
        let findings = findings
            .into_iter()
            .map(|f| f.unwrap_or(Finding::Stopped(StopReason::Timeout)))
            .collect();
        st.ands_after = st.ands_before;
        let mut stats = sat.stats();
        stats.add(&split);
        share_rest(
            &mut costs,
            &all,
            started.elapsed().as_secs_f64(),
            stats.conflicts,
        );
        return (findings, stats, st, costs);
    }
    let words = cone.words.unwrap_or_else(|| sweep_words(g.len()));
    let (mut classes, ins) = candidates::initial_classes(g, words, cone.seed);
    st.classes = classes.count();
    st.candidates = classes.members();
    log::debug!(
        "sweep: {} nodes, {} words, {} candidate classes over {} nodes; memory {}",
        g.len(),
        words,
        st.classes,
        st.candidates,
        crate::host::now_note()
    );
    progress.add_classes(st.classes as i64);
    let side = candidates::sides(g, &cone.pairs);
    let mut sw = Sweeper::new(g, limits, cone.seed, ins);
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
        sw.fside[l.index()] |= side[i];
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
        let t = (side[i] | side[r] == candidates::BOTH).then(|| sw.map[r].xor_complement(compl));
        let cut = sw.match_cut(l, side[i], t);
        if let cut_match::Cut::Equal(u) = cut {
            sw.map[i] = u;
            sw.fside[u.index()] |= side[i];
            st.merged_by_cut += 1;
            progress.proved(1);
            continue;
        }
        // A node that no node of the other design matches over its cut of anchors is a cut
        // point when the tiny window does not decide it: kept apart (no costly window query;
        // the nodes above it are matched over the cut in turn). Not in a class of two
        // ([`PAIR_CLASS`]): its one partner is likely its equal.
        let deep = cut != cut_match::Cut::Apart || classes.class_size(i) <= PAIR_CLASS;
        // The representative, unless both nodes belong to one design alone (merging them is
        // not needed to relate the designs), and members near the node in the merged graph.
        let twins = sw.twins(&classes, &side, i, l, t);
        if t.is_none() && twins.is_empty() {
            continue;
        }
        match sw.prove_equal(l, t, &twins, deep) {
            Outcome::Proved(u) => {
                sw.map[i] = u;
                sw.fside[u.index()] |= side[i];
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
            Outcome::Open | Outcome::Partial if !deep => st.cut_points += 1,
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
        "sweep: {:.3} s, seconds per stage {:.2?}, window answers {:?} ({} by truth tables), window stats {:?}, whole-cone queries {} with stats {:?}",
        started.elapsed().as_secs_f64(),
        sw.times,
        sw.tally,
        sw.window.truth_answers(),
        sw.window.stats(),
        sw.whole_cone,
        sw.global.stats()
    );
    log::debug!(
        "sweep: merged {} by hashing, {} by cut matching and {} by SAT, {} refuted, {} unresolved, {} patterns fed back; {} -> {} AND nodes; memory {}",
        st.merged_by_hashing,
        st.merged_by_cut,
        st.merged_by_sat,
        st.refuted,
        st.unresolved,
        st.patterns_fed_back,
        st.ands_before,
        st.ands_after,
        crate::host::now_note()
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
    let q = Queries {
        aig: &sw.f,
        pairs: &mapped,
        constraint,
        limits,
        progress,
    };
    let split = decide_pairs(&q, &mut sw.global, &mut sw.gts, &mut findings, &mut costs);
    let mut sat = sw.global.stats();
    sat.add(&sw.window.stats());
    sat.add(&split);
    let findings = findings
        .into_iter()
        .map(|f| f.unwrap_or(Finding::Stopped(StopReason::Timeout)))
        .collect();
    share_rest(
        &mut costs,
        &all,
        started.elapsed().as_secs_f64(),
        sat.conflicts,
    );
    (findings, sat, st, costs)
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
    /// For each node of the merged graph, the designs that reach it (side marks of the nodes
    /// of `g` mapped onto it): the anchors of [`Sweeper::match_cut`] are reached by both.
    fside: Vec<u8>,
    /// Scratch space of the cut matching.
    cut: cut_match::CutScratch,
    /// Every simulated pattern word per input (debug builds only, for the merge check).
    stored: Vec<Vec<u64>>,
}

/// Small hand-built graphs for the unit tests of the steps.
#[cfg(test)]
pub(super) mod fixture {
    use super::*;

    /// Inputs `a`, `b`; `x1` = a XOR b as (a & !b) | (!a & b), `x2` = a XOR b as
    /// (a | b) & !(a & b), `y` = a & b.
    pub struct Xors {
        pub aig: Aig,
        pub x1: Lit,
        pub x2: Lit,
        pub y: Lit,
    }

    pub fn xors() -> Xors {
        let mut aig = Aig::new();
        let a = aig.add_input();
        let b = aig.add_input();
        let x1 = aig.xor(a, b);
        let y = aig.and(a, b);
        let any = aig.or(a, b);
        let x2 = aig.and(any, !y);
        Xors { aig, x1, x2, y }
    }

    /// The merged graph built as the sweep builds it, without merging anything.
    pub(super) fn copied<'a>(g: &'a Aig, limits: &Limits) -> Sweeper<'a> {
        let mut sw = Sweeper::new(g, limits, 7, vec![vec![0]; g.num_inputs()]);
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
            if sw.f.len() > before {
                sw.note_built(i, l);
            }
        }
        sw
    }

    /// The image of `l` in the merged graph.
    pub(super) fn image(sw: &Sweeper<'_>, l: Lit) -> Lit {
        sw.map[l.index()].xor_complement(l.is_complemented())
    }

    /// The value of `l` under one input pattern.
    pub fn value(g: &Aig, l: Lit, pattern: &[bool]) -> bool {
        let rows: Vec<Vec<u64>> = pattern.iter().map(|&v| vec![u64::from(v)]).collect();
        crate::aig::simulate(g, &rows, 1).lit_word(l, 0) & 1 == 1
    }
}
