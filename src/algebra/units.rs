//! Rewriting units: which AIG nodes become variables of the word polynomial, and the exact
//! polynomial of each over its leaves.
//!
//! Every AND node in the cone of the words gets up to [`MAX_CUTS`] cuts of at most three leaves
//! with their truth tables (local enumeration, no search). Walking back from the outputs, each
//! needed node takes one cut: a three-leaf cut computing XOR3 or a majority (the sum and carry
//! of a full adder, in any input and output polarity), else a two-leaf XOR (half adder sum),
//! else its two fan-ins. The leaves become needed in turn. The unit's polynomial is the unique
//! multilinear polynomial of its truth table (Moebius transform over the integers), so a unit
//! is exact whatever cut is chosen: detection only decides how fast rewriting goes, never
//! whether the result is right.
//!
//! Ranks order the variables for rewriting: inputs first (rank = input number), then units in
//! topological order, with units over the same leaves (a full adder's sum and carry, a half
//! adder's XOR and AND) next to each other so they are substituted together. Pairs of units
//! whose product is identically zero over a common leaf set (a half adder's XOR and AND, the
//! one-hot selects of a Booth recoder) are recorded; products holding both vanish.

use crate::aig::{Aig, Lit, Node};
use crate::hash::FastMap;
use std::cmp::Reverse;
use std::collections::BinaryHeap;

use super::carry::{self, FunctionalCut};
use super::poly::UnitPoly;
use super::truth::{expand, PROJ};

/// Cuts kept per node (the fan-in cut is always among them).
pub const MAX_CUTS: usize = 48;

#[derive(Clone, Debug, PartialEq, Eq)]
struct Cut {
    leaves: Leaves,
    tt: u8,
}

/// Up to three leaf nodes, increasing, in a fixed array (`len` used).
#[derive(Copy, Clone, Debug, PartialEq, Eq, Hash)]
struct Leaves {
    ids: [u32; 3],
    len: u8,
}

impl Leaves {
    fn of(ids: &[u32]) -> Leaves {
        let mut a = [0; 3];
        a[..ids.len()].copy_from_slice(ids);
        Leaves {
            ids: a,
            len: ids.len() as u8,
        }
    }

    fn get(&self) -> &[u32] {
        &self.ids[..self.len as usize]
    }
}

/// How a variable relates to a partner variable.
#[derive(Copy, Clone, Debug, PartialEq, Eq)]
pub enum Rel {
    /// The product of the two is identically zero.
    Exclusive,
    /// The partner implies this variable: their product is the partner.
    ImpliedBy,
}

/// One rewriting unit.
#[derive(Clone, Debug)]
pub struct Unit {
    /// Its AIG node.
    pub node: u32,
    /// Leaf nodes, increasing.
    pub leaves: Vec<u32>,
    /// Truth table over the leaves (leaf j is bit j of the minterm).
    pub tt: u64,
}

/// All units of a set of roots, ranked.
#[derive(Clone, Debug)]
pub struct Units {
    /// Number of AIG inputs (ranks below are inputs).
    pub num_inputs: u32,
    /// Rank of each AIG node used as a variable (`u32::MAX` otherwise).
    pub rank: Vec<u32>,
    /// Unit polynomial of each unit rank (index rank - num_inputs).
    pub polys: Vec<UnitPoly>,
    /// The units, by rank - num_inputs.
    pub units: Vec<Unit>,
    /// Known products with other ranks: (partner rank, relation of this rank to it).
    pub partners: Vec<Vec<(u32, Rel)>>,
    /// Units taken as a full-adder sum or carry (XOR3 or majority over three leaves).
    pub adder_cells: usize,
    /// Units taken as a two-leaf XOR.
    pub xors: usize,
}

fn merge_leaves(a: &Leaves, b: &Leaves) -> Option<Leaves> {
    let (a, b) = (a.get(), b.get());
    let mut out = [0u32; 3];
    let (mut i, mut j, mut k) = (0, 0, 0);
    while i < a.len() || j < b.len() {
        let x = if j >= b.len() || (i < a.len() && a[i] < b[j]) {
            i += 1;
            a[i - 1]
        } else if i >= a.len() || b[j] < a[i] {
            j += 1;
            b[j - 1]
        } else {
            i += 1;
            j += 1;
            a[i - 1]
        };
        if k == 3 {
            return None;
        }
        out[k] = x;
        k += 1;
    }
    Some(Leaves {
        ids: out,
        len: k as u8,
    })
}

fn majority_tables() -> Vec<u8> {
    let mut v = Vec::new();
    for ph in 0..8u8 {
        let x = PROJ[0] ^ if ph & 1 == 1 { 0xFF } else { 0 };
        let y = PROJ[1] ^ if ph & 2 == 2 { 0xFF } else { 0 };
        let z = PROJ[2] ^ if ph & 4 == 4 { 0xFF } else { 0 };
        v.push((x & y) | (x & z) | (y & z));
    }
    v
}

/// The multilinear polynomial of truth table `tt` over leaves of ranks `ranks` (leaf j has
/// rank `ranks[j]`, at most six leaves): c_S = sum over T subset of S of (-1)^(|S|-|T|) f(T),
/// computed by the in-place transform (one pass per leaf).
pub fn moebius(tt: u64, ranks: &[u32]) -> UnitPoly {
    let k = ranks.len();
    debug_assert!(k <= 6, "a unit has at most six leaves");
    let mut c: Vec<i64> = (0..1usize << k).map(|m| (tt >> m & 1) as i64).collect();
    for j in 0..k {
        for s in 0..c.len() {
            if s >> j & 1 == 1 {
                c[s] -= c[s ^ (1 << j)];
            }
        }
    }
    let mut out = Vec::new();
    for (s, &cs) in c.iter().enumerate() {
        if cs != 0 {
            let mut mono: Vec<u32> = (0..k)
                .filter(|j| s >> j & 1 == 1)
                .map(|j| ranks[j])
                .collect();
            mono.sort_unstable_by(|a, b| b.cmp(a));
            out.push((mono, cs));
        }
    }
    out
}

impl Units {
    /// Units for the cones of the output words `words` (each least significant bit first):
    /// with the functional cuts of their carry chains ([`carry`]) when those leave the units
    /// acyclic, else with structural cuts only.
    pub fn build(aig: &Aig, words: &[&[Lit]]) -> Units {
        let forced: Vec<FunctionalCut> = words
            .iter()
            .flat_map(|w| carry::functional_cuts(aig, w))
            .collect();
        if !forced.is_empty() {
            if let Some(u) = Units::build_with(aig, words, &forced) {
                return u;
            }
        }
        Units::build_with(aig, words, &[]).expect("structural cuts are acyclic")
    }

    fn build_with(aig: &Aig, words: &[&[Lit]], forced: &[FunctionalCut]) -> Option<Units> {
        let roots: Vec<Lit> = words.iter().flat_map(|w| w.iter().copied()).collect();
        let roots = &roots[..];
        let mask = aig.cone_mask(roots);
        let nodes = aig.nodes();
        let mut cuts: Vec<Vec<Cut>> = vec![Vec::new(); nodes.len()];
        for (i, node) in nodes.iter().enumerate() {
            if !mask[i] {
                continue;
            }
            cuts[i] = match *node {
                Node::Const => vec![Cut {
                    leaves: Leaves::of(&[]),
                    tt: 0,
                }],
                Node::Input(_) => vec![Cut {
                    leaves: Leaves::of(&[i as u32]),
                    tt: PROJ[0],
                }],
                Node::And(a, b) => and_cuts(i as u32, a, b, &cuts),
            };
        }
        let maj = majority_tables();
        let is_adder_table =
            |c: &Cut| c.leaves.len == 3 && (c.tt == 0x96 || c.tt == 0x69 || maj.contains(&c.tt));
        let mut forced_cut: FastMap<u32, Cut> = FastMap::default();
        // A functional cut counts only inside the cone (its leaves get units of their own).
        for f in forced
            .iter()
            .filter(|f| f.leaves.iter().all(|&l| mask[l as usize]))
        {
            forced_cut.entry(f.node).or_insert(Cut {
                leaves: Leaves::of(&f.leaves),
                tt: f.tt,
            });
        }
        // Leaf sets over which some node computes XOR3 and some node a majority: full adders.
        let mut kinds: FastMap<Leaves, u8> = FastMap::default();
        for c in cuts.iter().flatten().chain(forced_cut.values()) {
            if !is_adder_table(c) {
                continue;
            }
            let bit = if c.tt == 0x96 || c.tt == 0x69 { 1 } else { 2 };
            *kinds.entry(c.leaves).or_default() |= bit;
        }
        let full_adder = |c: &Cut| is_adder_table(c) && kinds.get(&c.leaves) == Some(&3);
        // Choose a cut for every needed node, from the outputs back (largest node first; a
        // functional cut may need a larger node).
        let mut queued = vec![false; nodes.len()];
        let mut heap: BinaryHeap<u32> = BinaryHeap::new();
        for r in roots {
            if !queued[r.index()] {
                queued[r.index()] = true;
                heap.push(r.node());
            }
        }
        let mut chosen: Vec<Option<Cut>> = vec![None; nodes.len()];
        let (mut adder_cells, mut xors) = (0, 0);
        while let Some(i) = heap.pop() {
            let i = i as usize;
            if !matches!(nodes[i], Node::And(..)) {
                continue;
            }
            let cs = &cuts[i];
            let pick = if let Some(f) = forced_cut.get(&(i as u32)) {
                Some((f, if full_adder(f) { 3 } else { 0 }))
            } else {
                cs.iter()
                    .find(|c| full_adder(c))
                    .map(|c| (c, 3))
                    .or_else(|| {
                        cs.iter()
                            .find(|c| c.leaves.len == 2 && (c.tt == 0x66 || c.tt == 0x99))
                            .map(|c| (c, 2))
                    })
                    .or_else(|| cs.get(1).map(|c| (c, 0)))
            };
            let (cut, kind) = match pick {
                Some(p) => p,
                None => continue,
            };
            match kind {
                3 => adder_cells += 1,
                2 => xors += 1,
                _ => {}
            }
            for &l in cut.leaves.get() {
                if !queued[l as usize] {
                    queued[l as usize] = true;
                    heap.push(l);
                }
            }
            chosen[i] = Some(cut.clone());
        }
        // Ranks: inputs, then units in a topological order of their leaves (the node order
        // where the cuts allow it), units over the same leaves next to each other.
        let num_inputs = aig.num_inputs() as u32;
        let mut rank = vec![u32::MAX; nodes.len()];
        for (k, &n) in aig.inputs().iter().enumerate() {
            rank[n as usize] = k as u32;
        }
        let mut by_leaves: FastMap<Vec<u32>, Vec<u32>> = FastMap::default();
        for (i, c) in chosen.iter().enumerate() {
            if let Some(c) = c {
                by_leaves
                    .entry(c.leaves.get().to_vec())
                    .or_default()
                    .push(i as u32);
            }
        }
        let order = topological_groups(&chosen, &by_leaves)?;
        let mut units = Vec::new();
        let mut next = num_inputs;
        for j in order {
            rank[j as usize] = next;
            next += 1;
            let cj = chosen[j as usize].as_ref().expect("grouped unit chosen");
            units.push(Unit {
                node: j,
                leaves: cj.leaves.get().to_vec(),
                tt: u64::from(cj.tt),
            });
        }
        // Every leaf is an input or a unit (else no polynomial is exact: give up the cuts).
        if units
            .iter()
            .any(|u| u.leaves.iter().any(|&l| rank[l as usize] == u32::MAX))
        {
            return None;
        }
        let polys = units
            .iter()
            .map(|u| {
                let ranks: Vec<u32> = u.leaves.iter().map(|&l| rank[l as usize]).collect();
                moebius(u.tt, &ranks)
            })
            .collect();
        let partners = exclusive_pairs(&units, &by_leaves, &rank, num_inputs, next as usize);
        Some(Units {
            num_inputs,
            rank,
            polys,
            units,
            partners,
            adder_cells,
            xors,
        })
    }

    /// The polynomial of unit rank `r` (r >= num_inputs).
    pub fn poly(&self, r: u32) -> &UnitPoly {
        &self.polys[(r - self.num_inputs) as usize]
    }

    /// Apply the known products to a monomial (decreasing ranks): drop a variable implied by
    /// another one present (x * y = y when y implies x); false when two variables present
    /// exclude each other (the monomial vanishes).
    pub fn reduce(&self, mono: &mut Vec<u32>) -> bool {
        let mut i = 0;
        while i < mono.len() {
            let x = mono[i];
            let mut drop = false;
            for &(p, rel) in &self.partners[x as usize] {
                if mono.binary_search_by(|y| p.cmp(y)).is_ok() {
                    match rel {
                        Rel::Exclusive => return false,
                        Rel::ImpliedBy => drop = true,
                    }
                }
            }
            if drop {
                mono.remove(i);
            } else {
                i += 1;
            }
        }
        true
    }

    /// The rank-0 polynomial of a literal: v, 1 - v or a constant.
    pub fn lit_poly(&self, l: Lit) -> UnitPoly {
        if l.is_const() {
            return if l == Lit::TRUE {
                vec![(vec![], 1)]
            } else {
                vec![]
            };
        }
        let r = self.rank[l.index()];
        if l.is_complemented() {
            vec![(vec![], 1), (vec![r], -1)]
        } else {
            vec![(vec![r], 1)]
        }
    }
}

/// The chosen units in an order where every unit comes after the units among its leaves,
/// smallest node first where free, each group of units over the same leaves together; `None`
/// when the cuts form a cycle.
fn topological_groups(
    chosen: &[Option<Cut>],
    by_leaves: &FastMap<Vec<u32>, Vec<u32>>,
) -> Option<Vec<u32>> {
    // Group of each unit node: its leaf set's first member.
    let n = chosen.len();
    let head = |i: usize| -> u32 {
        let c = chosen[i].as_ref().expect("unit");
        by_leaves[c.leaves.get()][0]
    };
    let mut waiting = vec![0u32; n];
    let mut users: FastMap<u32, Vec<u32>> = FastMap::default();
    let mut groups = 0usize;
    for (i, c) in chosen.iter().enumerate() {
        let Some(c) = c else { continue };
        if head(i) != i as u32 {
            continue;
        }
        groups += 1;
        let mut deps: Vec<u32> = c
            .leaves
            .get()
            .iter()
            .filter(|&&l| chosen[l as usize].is_some())
            .map(|&l| head(l as usize))
            .collect();
        deps.sort_unstable();
        deps.dedup();
        waiting[i] = deps.len() as u32;
        for d in deps {
            users.entry(d).or_default().push(i as u32);
        }
    }
    let mut ready: BinaryHeap<Reverse<u32>> = (0..n)
        .filter(|&i| chosen[i].is_some() && head(i) == i as u32 && waiting[i] == 0)
        .map(|i| Reverse(i as u32))
        .collect();
    let mut order = Vec::new();
    let mut done = 0usize;
    while let Some(Reverse(g)) = ready.pop() {
        done += 1;
        let c = chosen[g as usize].as_ref().expect("unit");
        order.extend_from_slice(&by_leaves[c.leaves.get()]);
        if let Some(us) = users.get(&g) {
            for &u in us {
                waiting[u as usize] -= 1;
                if waiting[u as usize] == 0 {
                    ready.push(Reverse(u));
                }
            }
        }
    }
    (done == groups).then_some(order)
}

fn and_cuts(i: u32, a: Lit, b: Lit, cuts: &[Vec<Cut>]) -> Vec<Cut> {
    let mut out = vec![Cut {
        leaves: Leaves::of(&[i]),
        tt: PROJ[0],
    }];
    let flip = |l: Lit| if l.is_complemented() { 0xFFu8 } else { 0 };
    'outer: for ca in &cuts[a.index()] {
        for cb in &cuts[b.index()] {
            if out.len() >= MAX_CUTS {
                break 'outer;
            }
            let Some(leaves) = merge_leaves(&ca.leaves, &cb.leaves) else {
                continue;
            };
            if out.iter().any(|c| c.leaves == leaves) {
                continue;
            }
            let ta = expand(ca.tt, ca.leaves.get(), leaves.get()) ^ flip(a);
            let tb = expand(cb.tt, cb.leaves.get(), leaves.get()) ^ flip(b);
            out.push(Cut {
                leaves,
                tt: ta & tb,
            });
        }
    }
    out
}

/// Known products of pairs of units, one unit's leaves within the other's: disjoint truth
/// tables over the larger leaf set (the product vanishes) or one implying the other (the
/// product is the implying one).
fn exclusive_pairs(
    units: &[Unit],
    by_leaves: &FastMap<Vec<u32>, Vec<u32>>,
    rank: &[u32],
    num_inputs: u32,
    num_ranks: usize,
) -> Vec<Vec<(u32, Rel)>> {
    let mut partners: Vec<Vec<(u32, Rel)>> = vec![Vec::new(); num_ranks];
    for u in units {
        let k = u.leaves.len();
        let ru = rank[u.node as usize];
        for sub in 1..(1u32 << k) {
            let t: Vec<u32> = (0..k)
                .filter(|j| sub >> j & 1 == 1)
                .map(|j| u.leaves[j])
                .collect();
            let Some(ws) = by_leaves.get(&t) else {
                continue;
            };
            for &w in ws {
                let rw = rank[w as usize];
                if w == u.node || rw == u32::MAX || partners[ru as usize].iter().any(|p| p.0 == rw)
                {
                    continue;
                }
                let tw = expand(units[(rw - num_inputs) as usize].tt as u8, &t, &u.leaves);
                let tu = u.tt as u8;
                if tw & tu == 0 {
                    partners[ru as usize].push((rw, Rel::Exclusive));
                    partners[rw as usize].push((ru, Rel::Exclusive));
                } else if tw & !tu == 0 && tw != tu {
                    // w implies u: u * w = w.
                    partners[ru as usize].push((rw, Rel::ImpliedBy));
                } else if tu & !tw == 0 && tw != tu {
                    partners[rw as usize].push((ru, Rel::ImpliedBy));
                }
            }
        }
    }
    partners
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn moebius_of_xor_and_majority() {
        // XOR(x, y) = x + y - 2xy (common practice); leaf ranks 5 and 9.
        let mut x = moebius(0x66, &[5, 9]);
        x.sort();
        assert_eq!(x, vec![(vec![5], 1), (vec![9], 1), (vec![9, 5], -2)]);
        // MAJ(x, y, z) = xy + xz + yz - 2xyz.
        let mut m = moebius(0xE8, &[0, 1, 2]);
        m.sort();
        assert_eq!(
            m,
            vec![
                (vec![1, 0], 1),
                (vec![2, 0], 1),
                (vec![2, 1], 1),
                (vec![2, 1, 0], -2)
            ]
        );
        // NOT x = 1 - x.
        assert_eq!(moebius(0x55, &[3]), vec![(vec![], 1), (vec![3], -1)]);
    }

    #[test]
    fn full_adder_is_found_as_one_unit_pair() {
        let mut g = Aig::new();
        let x = g.add_input();
        let y = g.add_input();
        let z = g.add_input();
        let p = g.xor(x, y);
        let s = g.xor(p, z);
        let gg = g.and(x, y);
        let t = g.and(p, z);
        let c = g.or(gg, t);
        let u = Units::build(&g, &[&[s, c]]);
        assert_eq!(u.adder_cells, 2);
        assert_eq!(u.units.len(), 2);
        assert_eq!(u.units[0].leaves, u.units[1].leaves);
    }

    #[test]
    fn half_adder_parts_vanish_together() {
        let mut g = Aig::new();
        let x = g.add_input();
        let y = g.add_input();
        let s = g.xor(x, y);
        let c = g.and(x, y);
        let u = Units::build(&g, &[&[s, c]]);
        // The XOR literal is the complement of an XNOR node n: c implies n, so c * n = c.
        assert!(s.is_complemented());
        let (rn, rc) = (u.rank[s.index()], u.rank[c.index()]);
        let mut m = vec![rn.max(rc), rn.min(rc)];
        assert!(u.reduce(&mut m));
        assert_eq!(m, vec![rc]);
        // AND(x, !y) and AND(x, y) exclude each other.
        let d = g.and(x, !y);
        let u = Units::build(&g, &[&[c, d]]);
        let (rc, rd) = (u.rank[c.index()], u.rank[d.index()]);
        let mut m = vec![rc.max(rd), rc.min(rd)];
        assert!(!u.reduce(&mut m));
    }
}
