//! Random gate-level circuits for scale tests, and a locally rewritten copy of the same circuit
//! (De Morgan, XOR expansion, re-association, commutation) that is equivalent by construction.
//!
//! Drawing: gate g reads one net that nothing reads yet (while more than I/2 such nets wait)
//! and one net from the last 2048 nets (3 times in 4) or from anywhere; the nets nobody reads
//! at the end are the outputs `y`, so every gate is in the cone of some output.

use super::emit::{Circuit, Net, Op};
use super::Style;
use crate::rng::SplitMix64 as Rng;

const WINDOW: usize = 2048;

struct Plan {
    /// Per gate: operation and fan-ins (plan net indices: inputs first, then gates).
    gates: Vec<(Op, u32, u32)>,
    /// Plan net indices of the outputs, ascending.
    outputs: Vec<u32>,
}

fn draw(gates: usize, inputs: usize, seed: u64) -> Plan {
    let mut rng = Rng::new(seed, 2);
    let none = u32::MAX;
    let mut pool: Vec<u32> = (0..inputs as u32).collect();
    let mut at: Vec<u32> = (0..inputs as u32).collect();
    at.reserve(gates);
    let target = (inputs / 2).max(1);
    let remove = |pool: &mut Vec<u32>, at: &mut Vec<u32>, x: u32| {
        let i = at[x as usize];
        if i != none {
            pool.swap_remove(i as usize);
            if let Some(&moved) = pool.get(i as usize) {
                at[moved as usize] = i;
            }
            at[x as usize] = none;
        }
    };
    let mut plan = Vec::with_capacity(gates);
    for gi in 0..gates {
        let total = inputs + gi;
        let any = |rng: &mut Rng| -> u32 {
            if total > WINDOW && rng.chance(3, 4) {
                (total - 1 - rng.below(WINDOW)) as u32
            } else {
                rng.below(total) as u32
            }
        };
        let op = match rng.below(100) {
            0..=19 => Op::And,
            20..=39 => Op::Or,
            40..=54 => Op::Nand,
            55..=69 => Op::Nor,
            70..=81 => Op::Xor,
            82..=89 => Op::Xnor,
            _ => Op::Not,
        };
        let first = if pool.len() > target {
            pool[rng.below(pool.len())]
        } else {
            any(&mut rng)
        };
        let mut second = any(&mut rng);
        while second == first {
            second = rng.below(total) as u32;
        }
        remove(&mut pool, &mut at, first);
        if op != Op::Not {
            remove(&mut pool, &mut at, second);
        }
        let me = total as u32;
        at.push(pool.len() as u32);
        pool.push(me);
        plan.push((op, first, second));
    }
    pool.sort_unstable();
    Plan {
        gates: plan,
        outputs: pool,
    }
}

/// Random circuit of `gates` gates over `x[inputs-1:0]`, plain or rewritten.
pub(super) fn build(
    c: &mut Circuit,
    gates: usize,
    inputs: usize,
    style: Style,
    seed: u64,
) -> Vec<String> {
    let plan = draw(gates, inputs, seed);
    let x = c.input("x", inputs);
    let mut map: Vec<Net> = x;
    map.reserve(gates);
    let mut rng = Rng::new(seed, 3);
    let mut rewritten = 0usize;
    for (gi, &(op, f, s)) in plan.gates.iter().enumerate() {
        let (a, b) = (map[f as usize], map[s as usize]);
        let name = format!("n{gi}");
        let net = if style == Style::Rewritten && rng.chance(1, 2) {
            rewritten += 1;
            let inner = |k: u32| -> Option<(Op, Net, Net)> {
                let k = k as usize;
                (k >= inputs).then(|| {
                    let (o, p, q) = plan.gates[k - inputs];
                    (o, map[p as usize], map[q as usize])
                })
            };
            rewrite(c, op, a, b, inner(f), &name, &mut rng)
        } else if op == Op::Not {
            c.gate(Op::Not, vec![a], name)
        } else {
            c.gate(op, vec![a, b], name)
        };
        map.push(net);
    }
    let outs: Vec<Net> = plan.outputs.iter().map(|&k| map[k as usize]).collect();
    c.output("y", &outs);
    let mut notes = vec![format!(
        "random circuit of {gates} gates over x[{}:0] (seed {seed}); y[{}:0] are the {} nets \
         nothing else reads",
        inputs - 1,
        outs.len() - 1,
        outs.len()
    )];
    if style == Style::Rewritten {
        notes.push(format!(
            "style rewritten: the same circuit with {rewritten} gates locally rewritten (De Morgan, \
             XOR expansion, re-association, commutation); equivalent by construction"
        ));
    } else {
        notes.push("style plain: the circuit as drawn".to_string());
    }
    notes
}

/// An equivalent small window for `op(a, b)`; `inner` is the gate driving `a`, if any.
fn rewrite(
    c: &mut Circuit,
    op: Op,
    a: Net,
    b: Net,
    inner: Option<(Op, Net, Net)>,
    name: &str,
    rng: &mut Rng,
) -> Net {
    let not =
        |c: &mut Circuit, x: Net, tag: &str| c.gate(Op::Not, vec![x], format!("{name}_{tag}"));
    // Re-association: (p . q) . b = p . (q . b) for an associative op whose first fan-in is the
    // same op (the inner gate stays for its other readers).
    if let Some((iop, p, q)) = inner {
        if iop == op && matches!(op, Op::And | Op::Or | Op::Xor) && rng.chance(1, 2) {
            let qb = c.gate(op, vec![q, b], format!("{name}_ra"));
            return c.gate(op, vec![p, qb], name.to_string());
        }
    }
    match (op, rng.below(2)) {
        (Op::And, 0) | (Op::Or, 0) | (Op::Nand, 0) | (Op::Nor, 0) => {
            // De Morgan: and = nor of inverses, or = nand of inverses, nand = or, nor = and.
            let (na, nb) = (not(c, a, "na"), not(c, b, "nb"));
            let dual = match op {
                Op::And => Op::Nor,
                Op::Or => Op::Nand,
                Op::Nand => Op::Or,
                _ => Op::And,
            };
            c.gate(dual, vec![na, nb], name.to_string())
        }
        (Op::Nand, _) | (Op::Nor, _) => {
            let base = if op == Op::Nand { Op::And } else { Op::Or };
            let inner = c.gate(base, vec![a, b], format!("{name}_pos"));
            c.gate(Op::Not, vec![inner], name.to_string())
        }
        (Op::Xor, 0) => {
            // a ^ b = (a & !b) | (!a & b)
            let (na, nb) = (not(c, a, "na"), not(c, b, "nb"));
            let l = c.gate(Op::And, vec![a, nb], format!("{name}_l"));
            let r = c.gate(Op::And, vec![na, b], format!("{name}_r"));
            c.gate(Op::Or, vec![l, r], name.to_string())
        }
        (Op::Xnor, 0) => {
            // a ~^ b = (a & b) | !(a | b)
            let l = c.gate(Op::And, vec![a, b], format!("{name}_l"));
            let r = c.gate(Op::Nor, vec![a, b], format!("{name}_r"));
            c.gate(Op::Or, vec![l, r], name.to_string())
        }
        (Op::Xor, _) | (Op::Xnor, _) => {
            // a ^ b = !a ~^ b, and back.
            let na = not(c, a, "na");
            let dual = if op == Op::Xor { Op::Xnor } else { Op::Xor };
            c.gate(dual, vec![na, b], name.to_string())
        }
        (Op::Not, 0) => c.gate(Op::Nand, vec![a, a], name.to_string()),
        (Op::Not, _) => c.gate(Op::Nor, vec![a, a], name.to_string()),
        // Commutation.
        _ => c.gate(op, vec![b, a], name.to_string()),
    }
}
