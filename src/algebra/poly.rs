//! Multilinear polynomials over Z / 2^n in ranked variables, with x^2 = x built in: a
//! monomial is a set of variable ranks (stored in decreasing order), so a product of
//! monomials is the union of their sets.
//!
//! The terms live in a `BTreeMap` ordered by the monomials' rank lists, so the terms whose
//! largest variable is the largest of all are the last entries: backward rewriting always
//! substitutes that variable and pops exactly those entries.

use super::coef::Coef;
use std::collections::BTreeMap;

/// A monomial: variable ranks in strictly decreasing order (empty: the constant 1).
pub type Mono = Box<[u32]>;

/// A polynomial with coefficients modulo 2^bits.
#[derive(Clone, Debug)]
pub struct Poly<C: Coef> {
    bits: u32,
    terms: BTreeMap<Mono, C>,
}

/// The polynomial of one rewriting unit over its leaves: (leaf ranks decreasing, coefficient).
pub type UnitPoly = Vec<(Vec<u32>, i64)>;

/// Union of two decreasing rank lists (x * x = x).
pub fn union_desc(a: &[u32], b: &[u32], out: &mut Vec<u32>) {
    out.clear();
    let (mut i, mut j) = (0, 0);
    while i < a.len() && j < b.len() {
        match a[i].cmp(&b[j]) {
            std::cmp::Ordering::Greater => {
                out.push(a[i]);
                i += 1;
            }
            std::cmp::Ordering::Less => {
                out.push(b[j]);
                j += 1;
            }
            std::cmp::Ordering::Equal => {
                out.push(a[i]);
                i += 1;
                j += 1;
            }
        }
    }
    out.extend_from_slice(&a[i..]);
    out.extend_from_slice(&b[j..]);
}

impl<C: Coef> Poly<C> {
    /// The zero polynomial modulo 2^bits.
    pub fn zero(bits: u32) -> Poly<C> {
        Poly {
            bits,
            terms: BTreeMap::new(),
        }
    }

    /// Number of bits of the modulus.
    pub fn bits(&self) -> u32 {
        self.bits
    }

    /// Number of terms with a non-zero coefficient.
    pub fn len(&self) -> usize {
        self.terms.len()
    }

    /// Whether the polynomial is zero.
    pub fn is_zero(&self) -> bool {
        self.terms.is_empty()
    }

    /// Whether there are no terms (the zero polynomial).
    pub fn is_empty(&self) -> bool {
        self.terms.is_empty()
    }

    /// The terms in increasing monomial order.
    pub fn terms(&self) -> impl Iterator<Item = (&[u32], &C)> {
        self.terms.iter().map(|(m, c)| (&m[..], c))
    }

    /// `self += c * s * mono` (`mono` decreasing).
    pub fn add_term(&mut self, mono: &[u32], c: &C, s: i64) {
        debug_assert!(
            mono.windows(2).all(|w| w[0] > w[1]),
            "monomial not decreasing"
        );
        let bits = self.bits;
        if let Some(old) = self.terms.get_mut(mono) {
            old.add_scaled(c, s, bits);
            if old.is_zero() {
                self.terms.remove(mono);
            }
            return;
        }
        let mut fresh = C::zero(bits);
        fresh.add_scaled(c, s, bits);
        if !fresh.is_zero() {
            self.terms.insert(mono.into(), fresh);
        }
    }

    /// `self += other` (same modulus).
    pub fn add_poly(&mut self, other: &Poly<C>) {
        debug_assert_eq!(self.bits, other.bits, "same modulus");
        for (m, c) in other.terms() {
            self.add_term(m, c, 1);
        }
    }

    /// The largest variable of any term (`None` for a constant polynomial).
    pub fn leading_var(&self) -> Option<u32> {
        self.terms
            .last_key_value()
            .and_then(|(m, _)| m.first().copied())
    }

    /// Replace variable `v`, which must be the leading variable, by `unit` (a polynomial in
    /// smaller variables). Each product goes through `reduce` (known products of variables),
    /// which returns false for a product that is identically zero.
    pub fn substitute(&mut self, v: u32, unit: &UnitPoly, reduce: &dyn Fn(&mut Vec<u32>) -> bool) {
        let mut popped = Vec::new();
        while let Some(entry) = self.terms.last_entry() {
            if entry.key().first() != Some(&v) {
                break;
            }
            popped.push(entry.remove_entry());
        }
        let mut buf = Vec::new();
        for (mono, c) in popped {
            let rest = &mono[1..];
            for (q, s) in unit {
                union_desc(rest, q, &mut buf);
                if !reduce(&mut buf) {
                    continue;
                }
                self.add_term(&buf, &c, *s);
            }
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn never(_: &mut Vec<u32>) -> bool {
        true
    }

    #[test]
    fn union_is_idempotent_and_ordered() {
        let mut out = Vec::new();
        union_desc(&[7, 4, 1], &[5, 4, 0], &mut out);
        assert_eq!(out, vec![7, 5, 4, 1, 0]);
        union_desc(&[3], &[3], &mut out);
        assert_eq!(out, vec![3]);
    }

    #[test]
    fn half_adder_word_rewrites_to_a_plus_b() {
        // Variables 0 = a, 1 = b, 2 = s = a ^ b, 3 = c = a & b. Word 2c + s = a + b.
        let mut p: Poly<u128> = Poly::zero(2);
        p.add_term(&[3], &1, 2);
        p.add_term(&[2], &1, 1);
        let carry: UnitPoly = vec![(vec![1, 0], 1)];
        let sum: UnitPoly = vec![(vec![1], 1), (vec![0], 1), (vec![1, 0], -2)];
        assert_eq!(p.leading_var(), Some(3));
        p.substitute(3, &carry, &never);
        assert_eq!(p.leading_var(), Some(2));
        p.substitute(2, &sum, &never);
        let terms: Vec<(Vec<u32>, u128)> = p.terms().map(|(m, c)| (m.to_vec(), *c)).collect();
        assert_eq!(terms, vec![(vec![0], 1), (vec![1], 1)]);
    }

    #[test]
    fn coefficients_cancel_modulo_two_to_the_bits() {
        let mut p: Poly<u128> = Poly::zero(3);
        p.add_term(&[1, 0], &1, 4);
        p.add_term(&[1, 0], &1, 4); // 8 = 0 mod 8
        assert!(p.is_zero());
    }

    #[test]
    fn vanishing_products_are_dropped() {
        // 2 = g = a & b, 3 = p = a ^ b: g * p = 0 identically.
        let mut p: Poly<u128> = Poly::zero(8);
        p.add_term(&[4], &1, 1);
        let unit: UnitPoly = vec![(vec![3, 2], 1)];
        p.substitute(4, &unit, &|m: &mut Vec<u32>| {
            !(m.contains(&3) && m.contains(&2))
        });
        assert!(p.is_zero());
    }
}
