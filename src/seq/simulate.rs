//! Random simulation of the product machine from the reset state: 64 runs per machine word,
//! many cycles. It gives each state bit its value sequence (the signature the register pairing
//! groups by) and the first output difference it meets, as a run that can become a trace.

use super::product::{Init, Product};
use crate::aig::{random_words, simulate_into, Lit, SimTable};

/// What the simulation saw.
pub struct SimRun {
    /// Per state bit: its value in every cycle and run (`cycles * words` words, cycle-major).
    pub signatures: Vec<Vec<u64>>,
    /// The first (cycle, run) where an output pair differs, if any.
    pub first_difference: Option<(usize, usize)>,
    /// Per cycle, the per-cycle input words (`free.len()` vectors of `words` words).
    pub inputs: Vec<Vec<Vec<u64>>>,
    /// The initial words of each free initial value, by its number.
    pub init: Vec<Vec<u64>>,
    /// Words per cycle.
    pub words: usize,
}

impl SimRun {
    /// The value of bit `run` of a word vector.
    pub fn bit(words: &[u64], run: usize) -> bool {
        words[run / 64] >> (run % 64) & 1 == 1
    }
}

/// Simulate `cycles` cycles of `words * 64` random runs with seed `seed`.
pub fn simulate(p: &Product, cycles: usize, words: usize, seed: u64) -> SimRun {
    let nf = p.free.len();
    let n_free_init = p.free_init_count(p.state.len());
    let init = random_words(n_free_init, words, seed ^ 0x5EED_0001);
    let mut state: Vec<Vec<u64>> = p
        .state
        .iter()
        .map(|s| match s.init {
            Init::Const(v) => vec![if v { !0 } else { 0 }; words],
            Init::Free(k, inv) => init[k as usize]
                .iter()
                .map(|&w| if inv { !w } else { w })
                .collect(),
        })
        .collect();
    let mut signatures = vec![Vec::with_capacity(cycles * words); p.state.len()];
    let mut first_difference = None;
    let mut inputs = Vec::with_capacity(cycles);
    let mut table = SimTable::default();
    for cycle in 0..cycles {
        let free = random_words(nf, words, seed.wrapping_add(cycle as u64 * 0x9E37));
        let mut all = free.clone();
        all.extend(state.iter().cloned());
        simulate_into(&p.aig, &all, words, &mut table);
        for (k, s) in state.iter().enumerate() {
            signatures[k].extend_from_slice(s);
        }
        if first_difference.is_none() {
            'find: for w in 0..words {
                let mut diff = 0u64;
                for o in &p.outputs {
                    diff |= table.lit_word(o.lit_r, w) ^ table.lit_word(o.lit_c, w);
                }
                if diff != 0 {
                    first_difference = Some((cycle, w * 64 + diff.trailing_zeros() as usize));
                    break 'find;
                }
            }
        }
        inputs.push(free);
        state = p
            .state
            .iter()
            .map(|s| (0..words).map(|w| word(&table, s.next, w)).collect())
            .collect();
    }
    SimRun {
        signatures,
        first_difference,
        inputs,
        init,
        words,
    }
}

fn word(t: &SimTable, l: Lit, w: usize) -> u64 {
    t.lit_word(l, w)
}
