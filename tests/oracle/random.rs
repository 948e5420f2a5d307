//! The tests' one random-circuit generator: gates of fan-in one to three over earlier
//! signals, drawn from a seeded `StdRng` (the `rand` crate), kept as signal indices so that
//! each test names, edits and prints them its own way. Signals `0..sources` are the
//! circuit's sources (inputs, then registers for clocked circuits); gate `g` is signal
//! `sources + g`.

use rand::rngs::StdRng;
use rand::Rng;

/// The gate kinds drawn, with the bench file's names (NOT and BUFF read one signal).
pub const KINDS: [&str; 8] = ["AND", "OR", "NAND", "NOR", "XOR", "XNOR", "NOT", "BUFF"];

/// A random gate list over `sources` source signals.
#[derive(Clone, Debug)]
pub struct Gates {
    /// Source signals (indices `0..sources`).
    pub sources: usize,
    /// (kind, fan-in signals) per gate; gate `g` reads only signals below `sources + g`.
    pub gates: Vec<(&'static str, Vec<usize>)>,
}

impl Gates {
    /// `count` gates, each of a kind drawn uniformly from [`KINDS`] (NOT and BUFF read one
    /// signal, the others two or three), each fan-in drawn uniformly from the signals
    /// before the gate.
    pub fn random(rng: &mut StdRng, sources: usize, count: usize) -> Gates {
        let mut gates = Vec::with_capacity(count);
        for g in 0..count {
            let kind = KINDS[rng.gen_range(0..KINDS.len())];
            let arity = if is_unary(kind) {
                1
            } else {
                rng.gen_range(2..=3)
            };
            let fanin = (0..arity).map(|_| rng.gen_range(0..sources + g)).collect();
            gates.push((kind, fanin));
        }
        Gates { sources, gates }
    }

    /// Signals in all.
    pub fn signals(&self) -> usize {
        self.sources + self.gates.len()
    }

    /// Per signal, whether one of `roots` reads it through any path (the roots included).
    pub fn live(&self, roots: &[usize]) -> Vec<bool> {
        let mut live = vec![false; self.signals()];
        for &r in roots {
            live[r] = true;
        }
        for s in (self.sources..self.signals()).rev() {
            if live[s] {
                for &f in &self.gates[s - self.sources].1 {
                    live[f] = true;
                }
            }
        }
        live
    }

    /// The bench lines of the gates (`NAME = KIND(a, b)`, each signal named by `name`), gate
    /// `mutated` (when given) with its kind changed by [`mutated_kind`].
    pub fn lines(&self, mutated: Option<usize>, name: &dyn Fn(usize) -> String) -> String {
        let mut s = String::new();
        for (g, (kind, fanin)) in self.gates.iter().enumerate() {
            let kind = if mutated == Some(g) {
                mutated_kind(kind)
            } else {
                kind
            };
            let args: Vec<String> = fanin.iter().map(|&f| name(f)).collect();
            s += &format!("{} = {kind}({})\n", name(self.sources + g), args.join(", "));
        }
        s
    }
}

/// Whether a kind reads one signal.
pub fn is_unary(kind: &str) -> bool {
    matches!(kind, "NOT" | "BUFF")
}

/// Another kind of the same arity whose function differs on some input (a planted bug):
/// AND and NAND, OR and NOR, XOR and XNOR trade places with a neighbour, NOT and BUFF swap.
pub fn mutated_kind(kind: &str) -> &'static str {
    match kind {
        "AND" => "OR",
        "OR" => "AND",
        "NAND" => "NOR",
        "NOR" => "NAND",
        "XOR" => "XNOR",
        "XNOR" => "XOR",
        "NOT" => "BUFF",
        "BUFF" => "NOT",
        k => panic!("no mutation for gate kind {k}"),
    }
}
