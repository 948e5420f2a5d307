//! K-feasible cuts of an AIG and a cut cover chosen by area flow (priority cuts: a few best cuts
//! kept per node; Mishchenko, Cho, Chatterjee and Brayton, "Combinational and sequential mapping
//! with priority cuts", ICCAD 2007).

use crate::aig::{Aig, Lit, Node};

/// Cuts kept per node.
const KEEP: usize = 8;

/// The chosen cut of every node that the cover needs (`None` for the others), and the nodes of
/// the cover in topological order.
pub struct Cover {
    /// For each AND node of the cover, its leaves (node indices, ascending).
    pub leaves: Vec<Option<Vec<u32>>>,
    /// The AND nodes of the cover, ascending.
    pub order: Vec<u32>,
}

/// Choose a cover of the cones of `roots` by cuts of at most `k` leaves.
pub fn cover(aig: &Aig, roots: &[Lit], k: usize) -> Cover {
    let n = aig.len();
    let mut fanout = vec![0u32; n];
    for node in aig.nodes() {
        if let Node::And(a, b) = *node {
            fanout[a.index()] += 1;
            fanout[b.index()] += 1;
        }
    }
    for r in roots {
        fanout[r.index()] += 1;
    }
    let mut flow = vec![0f64; n];
    let mut cuts: Vec<Vec<Vec<u32>>> = vec![Vec::new(); n];
    for (i, node) in aig.nodes().iter().enumerate() {
        let Node::And(a, b) = *node else { continue };
        let (a, b) = (a.node(), b.node());
        let mut found: Vec<(f64, Vec<u32>)> = Vec::new();
        let trivial = |x: u32| std::iter::once(vec![x]);
        let left: Vec<Vec<u32>> = cuts[a as usize].iter().cloned().chain(trivial(a)).collect();
        let right: Vec<Vec<u32>> = cuts[b as usize].iter().cloned().chain(trivial(b)).collect();
        for ca in &left {
            for cb in &right {
                let Some(m) = merge(ca, cb, k) else { continue };
                if found.iter().any(|(_, f)| *f == m) {
                    continue;
                }
                let af = 1.0
                    + m.iter()
                        .map(|&l| flow[l as usize] / f64::from(fanout[l as usize].max(1)))
                        .sum::<f64>();
                found.push((af, m));
            }
        }
        found.sort_by(|x, y| {
            x.0.partial_cmp(&y.0)
                .unwrap_or(std::cmp::Ordering::Equal)
                .then(x.1.len().cmp(&y.1.len()))
                .then(x.1.cmp(&y.1))
        });
        found.truncate(KEEP);
        flow[i] = found.first().map_or(1.0, |f| f.0);
        cuts[i] = found.into_iter().map(|(_, c)| c).collect();
    }
    let mut leaves: Vec<Option<Vec<u32>>> = vec![None; n];
    let mut stack: Vec<u32> = roots.iter().map(|r| r.node()).collect();
    while let Some(x) = stack.pop() {
        if leaves[x as usize].is_some() || !matches!(aig.node(x), Node::And(..)) {
            continue;
        }
        let best = cuts[x as usize][0].clone();
        stack.extend(best.iter().copied());
        leaves[x as usize] = Some(best);
    }
    let order = (0..n as u32)
        .filter(|&x| leaves[x as usize].is_some())
        .collect();
    Cover { leaves, order }
}

/// The union of two sorted leaf sets, if it has at most `k` leaves.
fn merge(a: &[u32], b: &[u32], k: usize) -> Option<Vec<u32>> {
    let mut out = Vec::with_capacity(k);
    let (mut i, mut j) = (0, 0);
    while i < a.len() || j < b.len() {
        let next = match (a.get(i), b.get(j)) {
            (Some(&x), Some(&y)) if x == y => {
                i += 1;
                j += 1;
                x
            }
            (Some(&x), Some(&y)) if x < y => {
                i += 1;
                x
            }
            (Some(_), Some(&y)) => {
                j += 1;
                y
            }
            (Some(&x), None) => {
                i += 1;
                x
            }
            (None, Some(&y)) => {
                j += 1;
                y
            }
            (None, None) => unreachable!("loop condition"),
        };
        if out.len() == k {
            return None;
        }
        out.push(next);
    }
    Some(out)
}

/// The truth table of node `root` over `leaves` (leaf i is variable i), evaluated on the cone
/// between them; `scratch` is a per-node buffer of the graph's size.
pub fn table(aig: &Aig, root: u32, leaves: &[u32], scratch: &mut [Option<u64>]) -> u64 {
    use super::isop::VAR;
    let mut touched = Vec::new();
    for (i, &l) in leaves.iter().enumerate() {
        scratch[l as usize] = Some(VAR[i]);
        touched.push(l);
    }
    let mut stack = vec![root];
    while let Some(&x) = stack.last() {
        if scratch[x as usize].is_some() {
            stack.pop();
            continue;
        }
        let Node::And(a, b) = aig.node(x) else {
            unreachable!("a cut's cone ends at its leaves")
        };
        let (va, vb) = (scratch[a.index()], scratch[b.index()]);
        match (va, vb) {
            (Some(va), Some(vb)) => {
                let va = if a.is_complemented() { !va } else { va };
                let vb = if b.is_complemented() { !vb } else { vb };
                scratch[x as usize] = Some(va & vb);
                touched.push(x);
                stack.pop();
            }
            _ => {
                if va.is_none() {
                    stack.push(a.node());
                }
                if vb.is_none() {
                    stack.push(b.node());
                }
            }
        }
    }
    let t = scratch[root as usize].expect("root evaluated");
    for x in touched {
        scratch[x as usize] = None;
    }
    t
}
