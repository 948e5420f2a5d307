//! Counterexamples from a non-zero remainder of the word difference.
//!
//! Let t be the fewest trailing zero bits of any coefficient. Modulo 2^(t+1) the remainder's
//! non-zero terms are those with exactly t trailing zeros; one of them with the fewest
//! variables has no other such term inside it, so setting its variables to 1 and every other
//! input to 0 leaves only its coefficient: the difference of the words is non-zero modulo
//! 2^(t+1) but zero modulo 2^t, so bit t differs and every lower bit agrees (for all inputs).

use super::coef::Coef;
use super::poly::Poly;
use super::{BitVerdict, Stop};
use crate::aig::{eval, random_words, simulate, Aig, Lit};

/// Verdicts of the bits of a word whose difference rewrote to the non-zero `rem`.
pub(super) fn verdicts<C: Coef>(
    aig: &Aig,
    reference: &[Lit],
    candidate: &[Lit],
    rem: &Poly<C>,
) -> Vec<BitVerdict> {
    let n = reference.len();
    let bits = rem.bits();
    let t = rem
        .terms()
        .map(|(_, c)| c.trailing_zeros(bits))
        .min()
        .unwrap_or(bits);
    let mono = rem
        .terms()
        .filter(|(_, c)| c.trailing_zeros(bits) == t)
        .map(|(m, _)| m)
        .min_by_key(|m| m.len());
    let Some(mono) = mono else {
        return vec![BitVerdict::Equal; n];
    };
    let mut vector = vec![false; aig.num_inputs()];
    for &v in mono {
        vector[v as usize] = true;
    }
    let r = eval(aig, &vector, reference);
    let c = eval(aig, &vector, candidate);
    let t = t as usize;
    let consistent = t < n && r[t] != c[t] && (0..t).all(|i| r[i] == c[i]);
    if !consistent {
        return vec![BitVerdict::Undecided(Stop::Inconsistent); n];
    }
    (0..n)
        .map(|i| {
            if i < t {
                BitVerdict::Equal
            } else if r[i] != c[i] {
                BitVerdict::Differ(vector.clone())
            } else {
                BitVerdict::Undecided(Stop::AboveDifference(t as u32))
            }
        })
        .collect()
}

/// Verdicts of a word the rewriting gave up on (`stop`): random simulation, 1024 patterns.
pub(super) fn simulated(
    aig: &Aig,
    reference: &[Lit],
    candidate: &[Lit],
    stop: Stop,
) -> Vec<BitVerdict> {
    const WORDS: usize = 16;
    let pats = random_words(aig.num_inputs(), WORDS, 0x5eed_a17e);
    let table = simulate(aig, &pats, WORDS);
    reference
        .iter()
        .zip(candidate)
        .map(|(&r, &c)| {
            let hit = (0..WORDS).find_map(|w| {
                let d = table.lit_word(r, w) ^ table.lit_word(c, w);
                (d != 0).then(|| w * 64 + d.trailing_zeros() as usize)
            });
            let Some(p) = hit else {
                return BitVerdict::Undecided(stop.clone());
            };
            let v: Vec<bool> = pats
                .iter()
                .map(|row| (row[p / 64] >> (p % 64)) & 1 == 1)
                .collect();
            let e = eval(aig, &v, &[r, c]);
            if e[0] != e[1] {
                BitVerdict::Differ(v)
            } else {
                BitVerdict::Undecided(Stop::Inconsistent)
            }
        })
        .collect()
}
