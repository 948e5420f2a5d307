//! The algebraic engine: output words proved equal as polynomials over Z / 2^n.
//!
//! A word pair is the reference's and the candidate's n output bits, least significant first.
//! Its difference sum 2^i (r_i - c_i) is rewritten backward through the AIG, one unit at a time
//! in decreasing rank ([`units`]), until only primary inputs remain ([`poly`], with x^2 = x and
//! vanishing products removed). Signed and unsigned words are the same modulo 2^n
//! (-2^(n-1) = 2^(n-1)), so one check serves both.
//!
//! - Remainder zero: the n bit pairs are equal (equal polynomials, a complete method).
//! - Every coefficient divisible by 2^t but not all by 2^(t+1): bits below t are equal; a
//!   monomial with t trailing zeros and fewest variables, its variables set to 1 and every other
//!   input 0, makes the remainder equal to that coefficient, so bit t differs there
//!   ([`remainder`]). The vector is re-simulated on the AIG before it is returned; bits above t
//!   that differ under it are different too, the others are given back undecided.
//! - More live terms than the budget, or the deadline: no polynomial verdict; 1024 random
//!   patterns are simulated, bits they tell apart are different (the vector re-simulated),
//!   the rest undecided.

mod carry;
pub mod coef;
pub mod lookup;
pub mod poly;
mod remainder;
mod truth;
pub mod units;

use crate::aig::{Aig, Lit};
use coef::{Coef, Wide};
use poly::Poly;
use std::time::Instant;
use units::Units;

/// Limits of one word check.
#[derive(Clone, Debug)]
pub struct Limits {
    /// Live terms allowed in the polynomial; past it the word is given back undecided.
    pub max_terms: usize,
    /// Wall-clock deadline.
    pub deadline: Option<Instant>,
}

impl Default for Limits {
    fn default() -> Self {
        Limits {
            max_terms: 1_000_000,
            deadline: None,
        }
    }
}

/// Why a bit was left undecided.
#[derive(Clone, Debug, PartialEq, Eq)]
pub enum Stop {
    /// The polynomial grew past this many terms.
    TermBudget(usize),
    /// The deadline passed.
    Timeout,
    /// The remainder only decides bits up to the first difference (this bit); the vector
    /// found there does not tell this one apart.
    AboveDifference(u32),
    /// The remainder's vector did not re-simulate as predicted (an internal inconsistency;
    /// nothing is claimed).
    Inconsistent,
}

/// The verdict on one bit pair of a word.
#[derive(Clone, Debug, PartialEq, Eq)]
pub enum BitVerdict {
    /// Equal: the word polynomials agree modulo 2^(i+1).
    Equal,
    /// Different under these input values (one per AIG input), re-simulated on the AIG.
    Differ(Vec<bool>),
    /// Not decided here.
    Undecided(Stop),
}

/// Figures of one word check.
#[derive(Clone, Debug, Default, PartialEq, Eq)]
pub struct Stats {
    /// Units (variables above the inputs).
    pub units: usize,
    /// Of them full-adder sums and carries.
    pub adder_cells: usize,
    /// Of them two-leaf XORs.
    pub xors: usize,
    /// Substitution steps done.
    pub steps: usize,
    /// Largest number of live terms.
    pub peak_terms: usize,
    /// Terms of the remainder (0 when equal).
    pub remainder_terms: usize,
    /// Lookup units used when the sides were rewritten apart ([`Prepared::check_by_sides`]).
    pub lookup_units: usize,
}

/// The outcome of one word check.
#[derive(Clone, Debug)]
pub struct WordCheck {
    /// One verdict per bit, least significant first.
    pub bits: Vec<BitVerdict>,
    /// Figures.
    pub stats: Stats,
}

/// Check the word pair `reference[i]` / `candidate[i]` (least significant first, equal
/// lengths) in `aig`.
pub fn check_word(aig: &Aig, reference: &[Lit], candidate: &[Lit], limits: &Limits) -> WordCheck {
    Prepared::new(aig, reference, candidate).check(limits)
}

/// The polynomial of one word (least significant bit first) over the AIG inputs, with
/// coefficients modulo 2^n (n <= 128): (input numbers decreasing, coefficient) in
/// increasing monomial order.
pub fn word_poly(aig: &Aig, word: &[Lit], limits: &Limits) -> Result<Vec<(Vec<u32>, u128)>, Stop> {
    assert!(
        word.len() <= 128,
        "word_poly takes words of at most 128 bits"
    );
    let units = Units::build(aig, &[word]);
    let mut stats = Stats::default();
    let p: Poly<u128> = rewrite(&units, word, &[], limits, &mut stats)?;
    Ok(p.terms().map(|(m, c)| (m.to_vec(), *c)).collect())
}

/// A word pair with its rewriting units built: look at the units (is it arithmetic?) before
/// paying for the rewriting.
pub struct Prepared<'a> {
    aig: &'a Aig,
    reference: Vec<Lit>,
    candidate: Vec<Lit>,
    units: Units,
}

impl<'a> Prepared<'a> {
    /// Build the units of the word pair `reference[i]` / `candidate[i]` (least significant
    /// first, equal lengths).
    pub fn new(aig: &'a Aig, reference: &[Lit], candidate: &[Lit]) -> Prepared<'a> {
        assert_eq!(
            reference.len(),
            candidate.len(),
            "word halves of equal width"
        );
        Prepared {
            aig,
            reference: reference.to_vec(),
            candidate: candidate.to_vec(),
            units: Units::build(aig, &[reference, candidate]),
        }
    }

    /// Units above the inputs.
    pub fn units(&self) -> usize {
        self.units.units.len()
    }

    /// Units taken as full-adder sums and carries or two-leaf XORs.
    pub fn adder_units(&self) -> usize {
        self.units.adder_cells + self.units.xors
    }

    /// Whether the word looks like arithmetic: at least 16 units, at least a quarter of them
    /// adder cells or XORs (a selector or decoder has none; an adder or a multiplier is mostly
    /// made of them).
    pub fn looks_arithmetic(&self) -> bool {
        self.units() >= 16 && self.adder_units() * 4 >= self.units()
    }

    /// Rewrite the word difference and give one verdict per bit.
    pub fn check(&self, limits: &Limits) -> WordCheck {
        if self.reference.len() <= 128 {
            self.check_in::<u128>(limits)
        } else {
            self.check_in::<Wide>(limits)
        }
    }

    /// Rewrite each side's word apart (reference minus candidate, both down to the inputs),
    /// each with three-leaf units or, past their budget, with lookup units ([`lookup`]), and
    /// give one verdict per bit as [`Prepared::check`] does. For words whose logic was
    /// rewritten into lookup functions, where the joint three-leaf rewriting blows up.
    pub fn check_by_sides(&self, limits: &Limits) -> WordCheck {
        if self.reference.len() <= 128 {
            self.check_sides_in::<u128>(limits)
        } else {
            self.check_sides_in::<Wide>(limits)
        }
    }

    fn check_sides_in<C: Coef>(&self, limits: &Limits) -> WordCheck {
        let (aig, reference, candidate) = (self.aig, &self.reference, &self.candidate);
        let n = reference.len();
        let mut stats = Stats::default();
        let sides = side_poly::<C>(aig, reference, false, limits, &mut stats)
            .and_then(|r| side_poly::<C>(aig, candidate, true, limits, &mut stats).map(|c| (r, c)));
        let bits = match sides {
            Err(stop) => remainder::simulated(aig, reference, candidate, stop),
            Ok((mut r, c)) => {
                r.add_poly(&c);
                if r.is_zero() {
                    vec![BitVerdict::Equal; n]
                } else {
                    stats.remainder_terms = r.len();
                    remainder::verdicts(aig, reference, candidate, &r)
                }
            }
        };
        WordCheck { bits, stats }
    }

    fn check_in<C: Coef>(&self, limits: &Limits) -> WordCheck {
        let (aig, reference, candidate, units) =
            (self.aig, &self.reference, &self.candidate, &self.units);
        let n = reference.len();
        let mut stats = Stats {
            units: units.units.len(),
            adder_cells: units.adder_cells,
            xors: units.xors,
            ..Stats::default()
        };
        let bits = match rewrite::<C>(units, reference, candidate, limits, &mut stats) {
            Err(stop) => remainder::simulated(aig, reference, candidate, stop),
            Ok(p) if p.is_zero() => vec![BitVerdict::Equal; n],
            Ok(p) => {
                stats.remainder_terms = p.len();
                remainder::verdicts(aig, reference, candidate, &p)
            }
        };
        WordCheck { bits, stats }
    }
}

/// Terms allowed in the three-leaf attempt on one side before its lookup units are tried: the
/// same scale as the portfolio's budget of an arithmetic word (a multiplier stays below one
/// term per unit, a remapped one passes this within a few dozen steps).
const SIDE_TERMS_BASE: usize = 20_000;
/// Terms per three-leaf unit on top of [`SIDE_TERMS_BASE`].
const SIDE_TERMS_PER_UNIT: usize = 8;
/// Terms per lookup unit on top of [`SIDE_TERMS_BASE`] (a remapped multiplier stays below 64
/// per unit while it is rewritten: 32x32 peaks at 136,886 terms over 2,340 lookup units;
/// random logic passes the bound within a few steps).
const LOOKUP_TERMS_PER_UNIT: usize = 128;

/// The polynomial of one side's word (negated when `negate`) over the inputs: with three-leaf
/// units first, with lookup units when those pass their budget (each attempt's budget scaled by
/// its units, at most `limits.max_terms`).
fn side_poly<C: Coef>(
    aig: &Aig,
    word: &[Lit],
    negate: bool,
    limits: &Limits,
    stats: &mut Stats,
) -> Result<Poly<C>, Stop> {
    let (plus, minus): (&[Lit], &[Lit]) = if negate { (&[], word) } else { (word, &[]) };
    let small = Units::build(aig, &[word]);
    let first = Limits {
        max_terms: limits
            .max_terms
            .min(SIDE_TERMS_BASE + SIDE_TERMS_PER_UNIT * small.units.len()),
        deadline: limits.deadline,
    };
    // The figures are those of the rewriting that gave the polynomial (or gave up last).
    let mut tried = Stats::default();
    match rewrite(&small, plus, minus, &first, &mut tried) {
        Err(Stop::TermBudget(_)) => {}
        done => {
            stats.units += small.units.len();
            stats.adder_cells += small.adder_cells;
            stats.xors += small.xors;
            stats.steps += tried.steps;
            stats.peak_terms = stats.peak_terms.max(tried.peak_terms);
            return done;
        }
    }
    // Ranked by distance to the outputs first, in node order when that passes its budget.
    let mut last = Err(Stop::TermBudget(limits.max_terms));
    for order in [lookup::Order::Distance, lookup::Order::Node] {
        let units = lookup::units(aig, &[word], order);
        let bounded = Limits {
            max_terms: limits
                .max_terms
                .min(SIDE_TERMS_BASE + LOOKUP_TERMS_PER_UNIT * units.units.len()),
            deadline: limits.deadline,
        };
        let mut tried = Stats::default();
        last = rewrite(&units, plus, minus, &bounded, &mut tried);
        if !matches!(last, Err(Stop::TermBudget(_))) || order == lookup::Order::Node {
            stats.units += units.units.len();
            stats.lookup_units += units.units.len();
            stats.steps += tried.steps;
            stats.peak_terms = stats.peak_terms.max(tried.peak_terms);
            break;
        }
    }
    last
}

/// Rewrite sum 2^i (plus_i - minus_i) down to the inputs.
fn rewrite<C: Coef>(
    units: &Units,
    plus: &[Lit],
    minus: &[Lit],
    limits: &Limits,
    stats: &mut Stats,
) -> Result<Poly<C>, Stop> {
    let n = plus.len().max(minus.len()) as u32;
    let mut p: Poly<C> = Poly::zero(n);
    for (side, sign) in [(plus, 1i64), (minus, -1i64)] {
        for (i, &l) in side.iter().enumerate() {
            let w = C::pow2(i as u32, n);
            for (mono, s) in units.lit_poly(l) {
                p.add_term(&mono, &w, s * sign);
            }
        }
    }
    let reduce = |m: &mut Vec<u32>| units.reduce(m);
    while let Some(v) = p.leading_var() {
        if v < units.num_inputs {
            break;
        }
        p.substitute(v, units.poly(v), &reduce);
        stats.steps += 1;
        stats.peak_terms = stats.peak_terms.max(p.len());
        if p.len() > limits.max_terms {
            return Err(Stop::TermBudget(limits.max_terms));
        }
        if limits.deadline.is_some_and(|d| Instant::now() >= d) {
            return Err(Stop::Timeout);
        }
    }
    Ok(p)
}
