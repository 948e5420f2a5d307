//! The algebraic method of the portfolio: output pairs grouped into words (the bits of one
//! output bus, least significant first), each word pair that looks like arithmetic checked as
//! polynomials over Z / 2^n ([`crate::algebra`]).
//!
//! A word is tried when it has at least [`MIN_BITS`] bits, its cone is at most
//! [`MAX_CONE`] AND nodes, at least one AND node in [`MIN_XOR_SHARE`] roots an XOR (a cheap
//! structural count), and its rewriting units are rich in adder cells and XORs
//! ([`Prepared::looks_arithmetic`]). `--engine algebra` alone tries every word of any width.
//! Budgets ([`word_budget`]): a word that looks arithmetic may hold [`TERMS_PER_UNIT`] terms
//! per rewriting unit (plus [`TERMS_BASE`]); with `--engine algebra` alone, a word that does
//! not gets [`OTHER_TERMS`] terms and [`OTHER_SECONDS`], so random logic is given back
//! undecided at once.
//! Equal polynomials decide every open bit of the word; a bit the remainder tells apart is
//! different under a vector already re-simulated on the graph (and confirmed on both designs
//! afterwards, like every counterexample); the rest stays open for the next method.

use super::pairing::Shared;
use super::stage::{Context, GroupRecord, Stage, StageOutput};
use super::{Finding, Method};
use crate::aig::{eval, Aig, Lit, Node};
use crate::algebra::{BitVerdict, Limits, Prepared, Stop};
use crate::design::Design;
use std::collections::BTreeMap;
use std::time::{Duration, Instant};

/// Fewest bits of a word the portfolio tries.
pub const MIN_BITS: usize = 4;
/// Largest cone (AND nodes of both sides) the portfolio tries.
pub const MAX_CONE: usize = 4_000_000;
/// One AND node in this many must root an XOR for the portfolio to build units.
pub const MIN_XOR_SHARE: usize = 16;
/// One XOR in this many must have a carry partner (the AND of its operands, see
/// [`xor_count`]) for the portfolio to build units: arithmetic has one for most of its XORs,
/// random logic with XOR gates almost none (the cost of building units there anyway is in
/// docs/engine.md).
pub const MIN_PAIRED_SHARE: usize = 8;
/// Live terms allowed in the word polynomial in the portfolio (a blow-up shows early; the
/// other methods get the word back).
pub const MAX_TERMS: usize = 200_000;
/// Live terms allowed with `--engine algebra` alone.
pub const MAX_TERMS_ALONE: usize = 2_000_000;
/// Wall-clock time one word may take in the portfolio (the run's own deadline still applies).
pub const WORD_SECONDS: u64 = 10;
/// Live terms per rewriting unit (plus [`TERMS_BASE`]) before a word is given back: the
/// polynomial of a multiplier or adder stays below one term per unit while it is rewritten
/// (the figures are in docs/engine.md, "Word polynomials"), random logic passes this bound
/// within a few steps.
pub const TERMS_PER_UNIT: usize = 8;
/// Terms allowed on top of [`TERMS_PER_UNIT`] per unit.
pub const TERMS_BASE: usize = 20_000;
/// With `--engine algebra` alone, terms and seconds allowed for a word that does not look
/// arithmetic ([`Prepared::looks_arithmetic`]): given back undecided quickly.
pub const OTHER_TERMS: usize = 20_000;
/// Seconds for such a word.
pub const OTHER_SECONDS: f64 = 0.5;
/// With `--engine algebra` alone, terms allowed when a word the joint rewriting gave back is
/// rewritten again side by side with lookup units ([`Prepared::check_by_sides`]).
pub const LOOKUP_TERMS: usize = 2_000_000;
/// Seconds for that second attempt.
pub const LOOKUP_SECONDS: u64 = 60;
/// The term budget and the time cap of one word.
fn word_budget(prepared: &Prepared<'_>, arithmetic_only: bool) -> (usize, Option<Duration>) {
    let scaled = TERMS_BASE + TERMS_PER_UNIT * prepared.units();
    if arithmetic_only {
        (
            scaled.min(MAX_TERMS),
            Some(Duration::from_secs(WORD_SECONDS)),
        )
    } else if prepared.looks_arithmetic() {
        (scaled.min(MAX_TERMS_ALONE), None)
    } else {
        (OTHER_TERMS, Some(Duration::from_secs_f64(OTHER_SECONDS)))
    }
}

/// The output pairs grouped by the reference side's bus, each least significant bit first;
/// scalar outputs are words of one bit. In order of each word's first pair.
pub(crate) fn output_buses(r: &Design, _c: &Design, shared: &Shared) -> Vec<Vec<usize>> {
    let mut by_port: BTreeMap<&str, Vec<(i64, usize)>> = BTreeMap::new();
    let mut scalars = Vec::new();
    for (p, &(ri, _)) in shared.pairs.iter().enumerate() {
        let o = &r.outputs[ri];
        match o.index {
            Some(i) => by_port.entry(o.port.as_str()).or_default().push((i, p)),
            None => scalars.push(vec![p]),
        }
    }
    let mut words: Vec<Vec<usize>> = by_port
        .into_values()
        .map(|mut bits| {
            bits.sort_unstable();
            bits.into_iter().map(|(_, p)| p).collect()
        })
        .chain(scalars)
        .collect();
    words.sort_by_key(|w| w.iter().min().copied());
    words
}

/// Structural counts of the cone of `roots`: its AND nodes, how many of them root an XOR or
/// XNOR of two literals, and how many of those XORs have a *carry partner*: another use of the
/// AND of the same two operands in some polarity. A half adder or a full adder's first half is
/// such a pair (sum and carry of the same operands), and so is an adder's propagate and
/// generate; the XOR gates of random logic almost never have one.
fn xor_count(aig: &Aig, roots: &[Lit]) -> (usize, usize, usize) {
    let mask = aig.cone_mask(roots);
    let mut fanout = vec![0u8; aig.len()];
    for (i, &m) in mask.iter().enumerate() {
        if let (true, Node::And(a, b)) = (m, aig.node(i as u32)) {
            for l in [a, b] {
                let f = &mut fanout[l.index()];
                *f = f.saturating_add(1);
            }
        }
    }
    let (mut ands, mut xors, mut paired) = (0, 0, 0);
    for (i, &m) in mask.iter().enumerate() {
        if !m {
            continue;
        }
        if let Node::And(a, b) = aig.node(i as u32) {
            ands += 1;
            if a.is_complemented() && b.is_complemented() {
                if let (Node::And(x, y), Node::And(u, v)) = (aig.node(a.node()), aig.node(b.node()))
                {
                    if (x == !u && y == !v) || (x == !v && y == !u) {
                        xors += 1;
                        // The node is x XOR y over the minterm nodes x & y and !x & !y; the
                        // other two ANDs of the operands are x & !y and !x & y. A partner is
                        // one of those two, or a minterm node used outside this XOR.
                        let other = [(x, !y), (!x, y)]
                            .iter()
                            .any(|&(s, t)| aig.find_and(s, t).is_some_and(|l| !l.is_const()));
                        if other || fanout[a.index()] > 1 || fanout[b.index()] > 1 {
                            paired += 1;
                        }
                    }
                }
            }
        }
    }
    (ands, xors, paired)
}

/// The algebraic stage: every word with an open bit that qualifies (see the module docs).
pub(crate) fn run_algebra(cx: &Context<'_>, open: &[usize]) -> Result<StageOutput, String> {
    let mut is_open = vec![false; cx.pairs.len()];
    for &p in open {
        is_open[p] = true;
    }
    let mut out = StageOutput::default();
    for word in cx.buses {
        if !word.iter().any(|&p| is_open[p]) {
            continue;
        }
        if cx.limits.expired() {
            break;
        }
        let t = Instant::now();
        let rl: Vec<Lit> = word.iter().map(|&p| cx.pairs[p].reference).collect();
        let cl: Vec<Lit> = word.iter().map(|&p| cx.pairs[p].candidate).collect();
        if cx.arithmetic_only {
            if word.len() < MIN_BITS {
                continue;
            }
            let roots: Vec<Lit> = rl.iter().chain(&cl).copied().collect();
            let (ands, xors, paired) = xor_count(cx.aig, &roots);
            if ands > MAX_CONE || xors * MIN_XOR_SHARE < ands || paired * MIN_PAIRED_SHARE < xors {
                log::debug!(
                    "algebra: {}-bit word (first pair {}) skipped: {ands} AND nodes, {xors} XORs, {paired} with a carry partner",
                    word.len(),
                    word[0]
                );
                continue;
            }
        }
        let prepared = Prepared::new(cx.aig, &rl, &cl);
        if cx.arithmetic_only && !prepared.looks_arithmetic() {
            continue;
        }
        let mut deadline = cx.limits.remaining().map(|r| Instant::now() + r);
        let (max_terms, cap) = word_budget(&prepared, cx.arithmetic_only);
        if let Some(cap) = cap {
            let cap = Instant::now() + cap;
            deadline = Some(deadline.map_or(cap, |d| d.min(cap)));
        }
        let limits = Limits {
            max_terms,
            deadline,
        };
        let mut check = prepared.check(&limits);
        let gave_up = |c: &crate::algebra::WordCheck| {
            c.bits.iter().any(|b| {
                matches!(
                    b,
                    BitVerdict::Undecided(Stop::TermBudget(_) | Stop::Timeout)
                )
            })
        };
        if !cx.arithmetic_only && gave_up(&check) && !cx.limits.expired() {
            let cap = Instant::now() + Duration::from_secs(LOOKUP_SECONDS);
            let deadline = cx.limits.remaining().map(|r| Instant::now() + r);
            let limits = Limits {
                max_terms: LOOKUP_TERMS,
                deadline: Some(deadline.map_or(cap, |d| d.min(cap))),
            };
            let sides = prepared.check_by_sides(&limits);
            log::debug!(
                "algebra: {}-bit word rewritten side by side: {:?}",
                word.len(),
                sides.stats
            );
            check = sides;
        }
        let mut decided = 0;
        let mut stop = None;
        for (&p, v) in word.iter().zip(&check.bits) {
            if !is_open[p] {
                continue;
            }
            let f = match v {
                BitVerdict::Equal => Finding::Equal(Method::Algebra),
                BitVerdict::Differ(values)
                    if cx.constraint == Lit::TRUE || eval(cx.aig, values, &[cx.constraint])[0] =>
                {
                    Finding::Differ(Method::Algebra, values.clone())
                }
                BitVerdict::Differ(_) => continue,
                BitVerdict::Undecided(s) => {
                    if matches!(s, Stop::AboveDifference(_)) {
                        out.deferred.push(p);
                    }
                    stop.get_or_insert_with(|| s.clone());
                    continue;
                }
            };
            decided += 1;
            out.findings.push((p, f));
        }
        cx.progress.outputs_done(decided);
        let s = &check.stats;
        let mut note = format!(
            "{}-bit word: {} units ({} adder cells, {} XORs), {} steps, peak {} terms",
            word.len(),
            s.units,
            s.adder_cells,
            s.xors,
            s.steps,
            s.peak_terms
        );
        if s.lookup_units > 0 {
            note += &format!(
                " (each side apart, {} lookup units of up to {} leaves)",
                s.lookup_units,
                crate::algebra::lookup::LEAVES
            );
        }
        if s.remainder_terms > 0 {
            note += &format!(", remainder of {} terms", s.remainder_terms);
        }
        match stop {
            Some(Stop::TermBudget(k)) => note += &format!("; stopped past {k} terms"),
            Some(Stop::Timeout) => note += "; stopped by the time limit",
            Some(Stop::AboveDifference(t)) => {
                note += &format!(
                    "; bits above the first difference (bit {t}) left to the other methods, last"
                )
            }
            Some(Stop::Inconsistent) => note += "; a vector did not re-simulate, nothing claimed",
            None => {}
        }
        let seconds = t.elapsed().as_secs_f64();
        out.share_seconds(word, seconds);
        out.groups.push(GroupRecord {
            method: Stage::Algebra,
            pairs: {
                let mut ps = word.clone();
                ps.sort_unstable();
                ps
            },
            decided,
            seconds,
            note,
        });
    }
    Ok(out)
}
