//! BDD sweeping of internal nodes (the method of Kuehlmann and Krohm, DAC 1997: structural
//! hashing, BDDs and SAT combined). Every node of the cones gets a BDD in one manager
//! ([`super::bdd`]); a node whose BDD is the edge of an earlier node is that node (canonical
//! form: equal edges are equal functions), so it is merged. A node whose own AND would create
//! more than a bounded number of BDD nodes becomes a *cut point*: a fresh variable (below the
//! inputs in the order) stands for it, so BDDs above it stay small.
//!
//! Soundness: a BDD over inputs and cut variables describes the node for every value of the
//! cut variables, the real ones among them, so equal edges are equal functions of the inputs
//! (a merge, or an `equal` output pair). A difference is only a candidate when cut variables
//! are involved: a path of the difference BDD gives input values that are simulated on the
//! graph and kept only when the two sides really differ there. What stays open goes to the
//! next method on the reduced graph ([`reduce`]): the same inputs, every merge applied, so the
//! SAT sweep starts from the merged structure and settles what the cut points hid.

use super::bdd::{self, Decision, Edge, Manager, ONE, ZERO};
use crate::aig::{eval, Aig, Lit, Node};
use crate::hash::FastMap;
use crate::sat::Limits;
use std::collections::hash_map::Entry;

/// BDD nodes one AND may create before its node becomes a cut point: fewer give more cut
/// points, more let given-up operations fill the manager (the nodes they made stay); the
/// measurements behind the choice are in docs/engine.md (BDD sweeping).
pub(crate) const NODES_PER_AND: usize = 100;

/// The manager's node limit for a graph of `ands` AND nodes: 64 per AND node, at least
/// 200,000 and at most 4,000,000 (its memory: docs/engine.md).
pub(crate) fn limit(ands: usize) -> usize {
    ands.saturating_mul(64).clamp(200_000, 4_000_000)
}
/// Counterexample candidates (paths through cut variables) simulated at most.
const MAX_SIMULATED: usize = 64;

/// The result of one BDD sweep.
#[derive(Clone, Debug)]
pub(crate) struct Swept {
    /// Per pair: decided or not.
    pub decisions: Vec<Option<Decision>>,
    /// Per node of the graph: a literal of an earlier node with the same function, or the
    /// node itself (positive) when none was found.
    pub image: Vec<Lit>,
    /// Nodes merged into an earlier node.
    pub merged: usize,
    /// Cut points introduced.
    pub cuts: usize,
    /// BDD nodes the manager held at the end.
    pub nodes: usize,
    /// Whether every node of the cones got a BDD (else the node limit or the time stopped it).
    pub complete: bool,
}

/// BDD-sweep the cones of `pairs` and `constraint` with at most `limit` BDD nodes and
/// [`NODES_PER_AND`] per AND, and decide the pairs whose BDDs are equal (or differ by a path
/// that simulates as a real difference).
pub(crate) fn sweep(
    aig: &Aig,
    pairs: &[(Lit, Lit)],
    constraint: Lit,
    limit: usize,
    per_and: usize,
    limits: &Limits,
) -> Swept {
    let mut roots: Vec<Lit> = pairs.iter().flat_map(|&(a, b)| [a, b]).collect();
    roots.push(constraint);
    let ord = bdd::order(aig, &roots);
    let mut level_of = vec![0u32; aig.num_inputs()];
    for (l, &k) in ord.iter().enumerate() {
        level_of[k] = l as u32;
    }
    let mask = aig.cone_mask(&roots);
    let mut m = Manager::new(limit, limits);
    let mut f = vec![ZERO; aig.len()];
    let mut image: Vec<Lit> = (0..aig.len() as u32)
        .map(|i| Lit::from_node(i, false))
        .collect();
    // Regular edge -> a literal whose function it is (the first node found with it).
    let mut owner: FastMap<Edge, Lit> = FastMap::default();
    owner.insert(ONE, Lit::TRUE);
    let mut next_level = aig.num_inputs() as u32;
    let (mut merged, mut cuts) = (0, 0);
    let lit = |f: &[Edge], l: Lit| f[l.index()] ^ u32::from(l.is_complemented());
    let mut reached = aig.len();
    for (i, node) in aig.nodes().iter().enumerate() {
        if !mask[i] {
            continue;
        }
        let e = match *node {
            Node::Const => continue,
            Node::Input(k) => m.var(level_of[k as usize]),
            Node::And(a, b) => match m.and_bounded(lit(&f, a), lit(&f, b), per_and) {
                Err(_) if !m.is_spent() => {
                    cuts += 1;
                    next_level += 1;
                    m.var(next_level - 1)
                }
                r => r,
            },
        };
        let Ok(e) = e else {
            reached = i;
            break;
        };
        f[i] = e;
        match owner.entry(e & !1) {
            Entry::Occupied(o) => {
                image[i] = o.get().xor_complement(e & 1 == 1);
                merged += 1;
            }
            Entry::Vacant(v) => {
                v.insert(Lit::from_node(i as u32, e & 1 == 1));
            }
        }
    }
    let mut simulated = 0;
    let decisions = pairs
        .iter()
        .map(|&(a, b)| {
            if a.index().max(b.index()).max(constraint.index()) >= reached {
                return None;
            }
            let (x, y, c) = (lit(&f, a), lit(&f, b), lit(&f, constraint));
            if x == y {
                return Some(Decision::Equal);
            }
            let d = m.xor(x, y).and_then(|d| m.and(d, c)).ok()?;
            let path = m.path(d)?;
            let mut values = vec![false; aig.num_inputs()];
            let mut through_cut = false;
            for (level, v) in path {
                match ord.get(level as usize) {
                    Some(&k) => values[k] = v,
                    None => through_cut = true,
                }
            }
            if !through_cut {
                // The path tests inputs only: the difference holds for every value of the cut
                // variables, their real values among them.
                return Some(Decision::Differ(values));
            }
            if simulated >= MAX_SIMULATED {
                return None;
            }
            simulated += 1;
            let e = eval(aig, &values, &[a, b, constraint]);
            (e[0] != e[1] && e[2]).then_some(Decision::Differ(values))
        })
        .collect();
    Swept {
        decisions,
        image,
        merged,
        cuts,
        nodes: m.len(),
        complete: reached == aig.len(),
    }
}

/// The graph with every merge of `image` applied: the same inputs in the same positions, each
/// node rebuilt with structural hashing from its fan-ins' images (or replaced by the image of
/// the earlier node it equals). Returns the graph and, per old node, its literal there.
pub(crate) fn reduce(aig: &Aig, image: &[Lit]) -> (Aig, Vec<Lit>) {
    let mut g = Aig::new();
    g.reserve(aig.len());
    for _ in 0..aig.num_inputs() {
        g.add_input();
    }
    let mut map = vec![Lit::FALSE; aig.len()];
    let at = |map: &[Lit], l: Lit| map[l.index()].xor_complement(l.is_complemented());
    for (i, node) in aig.nodes().iter().enumerate() {
        let im = image[i];
        map[i] = if im.index() != i {
            at(&map, im)
        } else {
            match *node {
                Node::Const => Lit::FALSE,
                Node::Input(k) => g.input_lit(k as usize),
                Node::And(a, b) => {
                    let (x, y) = (at(&map, a), at(&map, b));
                    g.and(x, y)
                }
            }
        };
    }
    (g, map)
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::aig::random_graph::random_vector;

    /// A ripple-carry sum of `a` and `b` (low bit first), carry out last.
    fn ripple(g: &mut Aig, a: &[Lit], b: &[Lit]) -> Vec<Lit> {
        let mut c = Lit::FALSE;
        let mut out = Vec::new();
        for (&x, &y) in a.iter().zip(b) {
            let p = g.xor(x, y);
            out.push(g.xor(p, c));
            let gen = g.and(x, y);
            let pc = g.and(p, c);
            c = g.or(gen, pc);
        }
        out.push(c);
        out
    }

    /// The same sum with each carry as a majority written as a sum of products and each sum
    /// bit as XNOR of XNORs: no AND node in common with [`ripple`] beyond the operands.
    fn ripple_other(g: &mut Aig, a: &[Lit], b: &[Lit]) -> Vec<Lit> {
        let mut c = Lit::FALSE;
        let mut out = Vec::new();
        for (&x, &y) in a.iter().zip(b) {
            let q = g.xnor(y, x);
            out.push(g.xnor(q, c));
            let xc = g.and(x, c);
            let yc = g.and(c, y);
            let t = g.or(xc, yc);
            let xy = g.and(y, x);
            c = g.or(t, xy);
        }
        out.push(c);
        out
    }

    #[test]
    fn restructured_adders_merge_internally_and_are_equal() {
        let mut g = Aig::new();
        let a: Vec<Lit> = (0..16).map(|_| g.add_input()).collect();
        let b: Vec<Lit> = (0..16).map(|_| g.add_input()).collect();
        let r = ripple(&mut g, &a, &b);
        let c = ripple_other(&mut g, &a, &b);
        let pairs: Vec<(Lit, Lit)> = r.iter().copied().zip(c.iter().copied()).collect();
        let s = sweep(
            &g,
            &pairs,
            Lit::TRUE,
            1 << 20,
            NODES_PER_AND,
            &Limits::none(),
        );
        assert!(s.complete);
        assert_eq!(s.cuts, 0);
        assert!(s.decisions.iter().all(|d| d == &Some(Decision::Equal)));
        // Every carry of the second adder is merged into the first one's.
        assert!(s.merged >= 16, "merged {}", s.merged);
        let (h, map) = reduce(&g, &s.image);
        for &(x, y) in &pairs {
            let at = |l: Lit| map[l.index()].xor_complement(l.is_complemented());
            assert_eq!(at(x), at(y));
        }
        assert!(h.num_ands() < g.num_ands());
    }

    #[test]
    fn cut_points_keep_bdds_small_and_merges_sound() {
        // Two copies of a 41-input majority (by count and by threshold) feeding an XOR with a
        // shared input: with 8 nodes per AND most nodes become cut points.
        let mut g = Aig::new();
        let ins: Vec<Lit> = (0..41).map(|_| g.add_input()).collect();
        let a = bdd::tests::majority_by_count(&mut g, &ins);
        let b = bdd::tests::majority_by_threshold(&mut g, &ins);
        let s = sweep(&g, &[(a, b)], Lit::TRUE, 1 << 20, 8, &Limits::none());
        assert!(s.cuts > 0);
        assert!(s.complete);
        // The pair is not decided as equal through different cut points, and nothing is
        // claimed different without a real difference.
        assert_eq!(s.decisions, vec![None]);
        check_images(&g, &s.image, 7);
        check_reduced(&g, &s.image, 8);
    }

    /// The reduced graph computes every old node's function at its mapped literal, on 64
    /// random input vectors.
    fn check_reduced(g: &Aig, image: &[Lit], seed: u64) {
        let (h, map) = reduce(g, image);
        assert_eq!(h.num_inputs(), g.num_inputs());
        let mut rng = crate::rng::SplitMix64::new(seed, 0);
        let old: Vec<Lit> = (0..g.len() as u32)
            .map(|i| Lit::from_node(i, false))
            .collect();
        for _ in 0..64 {
            let v = random_vector(&mut rng, g.num_inputs());
            assert_eq!(eval(g, &v, &old), eval(&h, &v, &map));
        }
        assert!(h.num_ands() <= g.num_ands());
    }

    #[test]
    fn a_difference_gives_a_separating_vector_with_or_without_cut_points() {
        let mut g = Aig::new();
        let ins: Vec<Lit> = (0..21).map(|_| g.add_input()).collect();
        let a = bdd::tests::majority_by_count(&mut g, &ins);
        let b = bdd::tests::majority_by_threshold(&mut g, &ins[..20]);
        for per_and in [1 << 20, 8] {
            let s = sweep(&g, &[(a, b)], Lit::TRUE, 1 << 20, per_and, &Limits::none());
            match &s.decisions[0] {
                Some(Decision::Differ(v)) => {
                    let e = eval(&g, v, &[a, b]);
                    assert_ne!(e[0], e[1]);
                }
                // Through cut points the path may not be a real difference: left open.
                None if s.cuts > 0 => {}
                d => panic!("per_and {per_and}: the pair differs, got {d:?}"),
            }
        }
    }

    #[test]
    fn node_limit_stops_and_keeps_what_it_did() {
        let mut g = Aig::new();
        let ins: Vec<Lit> = (0..8).map(|_| g.add_input()).collect();
        let x = g.and(ins[0], ins[1]);
        let y = g.and(ins[1], ins[0]);
        let big = bdd::tests::majority_by_count(&mut g, &ins);
        let s = sweep(
            &g,
            &[(x, y), (big, x)],
            Lit::TRUE,
            12,
            1000,
            &Limits::none(),
        );
        assert!(!s.complete);
        assert_eq!(s.decisions[0], Some(Decision::Equal));
        assert_eq!(s.decisions[1], None);
    }

    /// Every image literal has the node's function on `words` random 64-bit patterns and
    /// points at an earlier node.
    pub(super) fn check_images(g: &Aig, image: &[Lit], seed: u64) {
        let mut rng = crate::rng::SplitMix64::new(seed, 0);
        for _ in 0..64 {
            let v = random_vector(&mut rng, g.num_inputs());
            let all: Vec<Lit> = (0..g.len() as u32)
                .map(|i| Lit::from_node(i, false))
                .collect();
            let vals = eval(g, &v, &all);
            for (i, &im) in image.iter().enumerate() {
                assert!(im.index() <= i);
                let w = vals[im.index()] ^ im.is_complemented();
                assert_eq!(vals[i], w, "node {i} and its image {im:?}");
            }
        }
    }
}

/// Against biodivine-lib-bdd (crates.io; an independent BDD package as the oracle): with no
/// cut points the merges are exactly the classes of equal functions, and with cut points every
/// merge is still an equality there.
#[cfg(test)]
mod oracle {
    use super::*;
    use crate::aig::random_graph;
    use biodivine_lib_bdd::Bdd;

    /// The tests' random graph with fan-ins from the 12 most recent literals (deep, with
    /// redundant structure) and one node in three an XOR.
    fn random_aig(seed: u64, inputs: usize, steps: usize) -> Aig {
        let shape = random_graph::Shape {
            recent: Some(12),
            xor_one_in: Some(3),
        };
        random_graph::random_aig(seed, inputs, steps, shape).0
    }

    fn theirs(g: &Aig) -> Vec<Bdd> {
        super::super::bdd::oracle::reference_bdds(g)
    }

    #[test]
    fn merges_agree_with_biodivine() {
        let mut merges = 0;
        for seed in 1..30 {
            let g = random_aig(seed, 10, 150);
            let t = theirs(&g);
            let all: Vec<Lit> = (1..g.len() as u32)
                .map(|i| Lit::from_node(i, false))
                .collect();
            let pairs: Vec<(Lit, Lit)> = all.windows(2).map(|w| (w[0], w[1])).collect();
            for per_and in [1_000_000, 6] {
                let s = sweep(&g, &pairs, Lit::TRUE, 1 << 22, per_and, &Limits::none());
                assert!(s.complete);
                let same = |i: usize, l: Lit| {
                    let b = if l.is_complemented() {
                        t[l.index()].not()
                    } else {
                        t[l.index()].clone()
                    };
                    t[i].xor(&b).is_false()
                };
                for i in 1..g.len() {
                    let im = s.image[i];
                    if im.index() != i {
                        assert!(same(i, im), "seed {seed}: node {i} merged into {im:?}");
                        merges += 1;
                    } else if per_and == 1_000_000 {
                        // No cut point: no earlier node (in either phase) has its function.
                        for j in 0..i {
                            let l = Lit::from_node(j as u32, false);
                            assert!(!same(i, l) && !same(i, !l), "seed {seed}: {i} = {j}");
                        }
                    }
                }
                for (p, d) in pairs.iter().zip(&s.decisions) {
                    let eq = same(p.0.index(), p.1);
                    match d {
                        Some(Decision::Equal) => assert!(eq, "seed {seed}: {p:?}"),
                        Some(Decision::Differ(_)) => assert!(!eq, "seed {seed}: {p:?}"),
                        None => assert!(per_and < 1_000_000, "no cut point, yet undecided"),
                    }
                }
            }
        }
        assert!(merges > 100, "only {merges} merges");
    }
}
