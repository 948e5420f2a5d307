//! Lookup units: rewriting units of up to six leaves, for logic rewritten into lookup functions
//! (`gen remap`, or any netlist of K-input functions written as sums of products).
//!
//! Such a netlist keeps no adder cell or XOR: each sum of a full adder is merged with the next
//! column's logic into one function of four to six inputs, so the three-leaf units of
//! [`super::units`] do not cancel and the word polynomial explodes. Taken whole, each lookup
//! function's exact polynomial (Moebius transform of its truth table, at most 64 terms) keeps
//! the rewriting small. The function boundaries are gone from the AIG (a function is a tree of
//! ANDs, products shared between functions by structural hashing), so they are found again as
//! a cover of the word's cone by cuts of at most [`LEAVES`] leaves chosen by area flow
//! (the cover `gen remap` writes its functions from, [`crate::gen::remap::cuts`]): the fewest,
//! largest functions, which on a remapped netlist are its own functions or merges of them.
//! Like every unit, a lookup unit is exact whatever cut is chosen; the cover only decides how
//! fast rewriting goes.
//!
//! Ranks: inputs first (rank = input number), then the cover's nodes by decreasing distance to
//! the word's bits, node order within one distance (a topological order; see
//! [`substitution_order`]). No vanishing pairs are recorded.

use crate::aig::{Aig, Lit, Node};
use crate::gen::remap::cuts;

use super::units::{moebius, Unit, Units};

/// Leaves of a lookup unit at most.
pub const LEAVES: usize = 6;

/// The order in which lookup units are ranked (and so substituted, highest rank first).
#[derive(Copy, Clone, Debug, PartialEq, Eq)]
pub enum Order {
    /// By decreasing distance to the word's bits ([`substitution_order`]): tried first.
    Distance,
    /// Node order: tried when the first order passes its budget (a few planted bugs in small
    /// remapped trees stay small only this way).
    Node,
}

/// Lookup units of the cones of `words` (each least significant bit first), ranked in `order`.
pub fn units(aig: &Aig, words: &[&[Lit]], order: Order) -> Units {
    let roots: Vec<Lit> = words.iter().flat_map(|w| w.iter().copied()).collect();
    let cover = cuts::cover(aig, &roots, LEAVES);
    let num_inputs = aig.num_inputs() as u32;
    let mut rank = vec![u32::MAX; aig.len()];
    for (k, &n) in aig.inputs().iter().enumerate() {
        rank[n as usize] = k as u32;
    }
    let mut scratch = vec![None; aig.len()];
    let mut units = Vec::with_capacity(cover.order.len());
    let mut polys = Vec::with_capacity(cover.order.len());
    let mut next = num_inputs;
    let order = match order {
        Order::Distance => substitution_order(&cover, aig.len()),
        Order::Node => cover.order.clone(),
    };
    for &x in &order {
        let leaves = cover.leaves[x as usize]
            .as_ref()
            .expect("cover node has leaves")
            .clone();
        debug_assert!(matches!(aig.node(x), Node::And(..)));
        let tt = cuts::table(aig, x, &leaves, &mut scratch);
        let ranks: Vec<u32> = leaves
            .iter()
            .map(|&l| {
                let r = rank[l as usize];
                debug_assert!(r != u32::MAX, "leaves come before their node");
                r
            })
            .collect();
        polys.push(moebius(tt, &ranks));
        rank[x as usize] = next;
        next += 1;
        units.push(Unit {
            node: x,
            leaves,
            tt,
        });
    }
    Units {
        num_inputs,
        rank,
        polys,
        units,
        partners: vec![Vec::new(); next as usize],
        adder_cells: 0,
        xors: 0,
    }
}

/// The cover's nodes in substitution order (ranks ascending): by decreasing distance to the
/// word's bits (the longest path of cover nodes from a node to a root), node order within one
/// distance (nodes of one distance never read each other, so any order among them is
/// topological). Rewriting takes the highest rank first, so the units next to the outputs go
/// first and then the tree one layer of functions after the other; in node order the units of
/// a Wallace tree's stages interleave and their terms wait for partners many steps later
/// (measured: 16x16 remapped Wallace peak 219,573 terms in node order, 1,257 in this order).
fn substitution_order(cover: &cuts::Cover, len: usize) -> Vec<u32> {
    let mut distance = vec![0u32; len];
    for &x in cover.order.iter().rev() {
        let leaves = cover.leaves[x as usize]
            .as_ref()
            .expect("cover node has leaves");
        for &y in leaves {
            distance[y as usize] = distance[y as usize].max(distance[x as usize] + 1);
        }
    }
    let mut order = cover.order.clone();
    order.sort_by_key(|&x| (std::cmp::Reverse(distance[x as usize]), x));
    order
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn a_six_input_function_is_one_unit() {
        // Two three-input products ORed: one function of six leaves (common practice: any
        // K-input function is one lookup cell).
        let mut g = Aig::new();
        let x: Vec<Lit> = (0..6).map(|_| g.add_input()).collect();
        let p = g.and(x[0], x[1]);
        let p = g.and(p, x[2]);
        let q = g.and(x[3], !x[4]);
        let q = g.and(q, x[5]);
        let o = g.or(p, q);
        let u = units(&g, &[&[o]], Order::Distance);
        assert_eq!(u.units.len(), 1);
        assert_eq!(u.units[0].leaves.len(), 6);
        // The node is !p & !q (the OR is its complement): 1 - p - q + p q, with
        // p = x0 x1 x2 and q = x3 (1 - x4) x5 = x3 x5 - x3 x4 x5 (inputs have ranks 0..6).
        let mut poly = u.poly(6).clone();
        poly.sort();
        let mut want: Vec<(Vec<u32>, i64)> = vec![
            (vec![], 1),
            (vec![2, 1, 0], -1),
            (vec![5, 3], -1),
            (vec![5, 4, 3], 1),
            (vec![5, 3, 2, 1, 0], 1),
            (vec![5, 4, 3, 2, 1, 0], -1),
        ];
        want.sort();
        assert_eq!(poly, want);
        assert_eq!(u.rank[o.index()], 6);
        assert!(o.is_complemented());
    }
}
