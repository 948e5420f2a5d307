//! Planted bugs: swap, stuck-at-0/1, invert and misroute at a seed-chosen or named place.
//! Every mutant is simulated against the clean circuit (inside its care condition) and kept
//! only if some output differs, so a planted bug is always a real difference.

use super::emit::{Circuit, Gate, Net, Op};
use super::{Bug, GenError};
use crate::rng::SplitMix64 as Rng;

/// Places tried before giving up on a seed-chosen place (or choices tried at a named place).
const ATTEMPTS: usize = 64;

/// The mutant of `c` with `bug` at the net named `at` (or a seed-chosen place), and a
/// description of what changed.
pub fn apply(
    c: &Circuit,
    bug: Bug,
    at: Option<&str>,
    seed: u64,
) -> Result<(Circuit, String), GenError> {
    let named = match at {
        Some(name) => Some(c.find(name).ok_or_else(|| {
            GenError::new(
                format!("no net named `{name}` in this circuit"),
                "pick a name from the generated file (a wire, or a port bit such as `d[3]`), or \
                 leave out --at to let the seed choose",
            )
        })?),
        None => None,
    };
    let driver = drivers(c);
    if let Some(net) = named {
        let need_gate = bug != Bug::Stuck0 && bug != Bug::Stuck1;
        if need_gate && driver[net.index()].is_none() {
            return Err(GenError::new(
                format!(
                    "`{}` is a primary input; --bug {} needs a gate output",
                    c.name(net),
                    bug.name()
                ),
                "name the output net of a gate, or use --bug stuck0/stuck1 on an input",
            ));
        }
    }
    // Reference responses.
    let words = (2_000_000 / (c.gates().len() + 1)).clamp(4, 64);
    let mut sim_rng = Rng::new(seed, 7);
    let patterns: Vec<Vec<u64>> = (0..words)
        .map(|_| c.random_patterns(&mut sim_rng))
        .collect();
    let reference: Vec<Vec<u64>> = patterns.iter().map(|p| c.simulate(p)).collect();
    let differs = |m: &Circuit| {
        patterns
            .iter()
            .zip(&reference)
            .any(|(p, r)| m.simulate(p) != *r)
    };

    let mut rng = Rng::new(seed, 5);
    let mut applicable = false;
    for _ in 0..ATTEMPTS {
        let place = match named {
            Some(n) => n,
            None => match pick_place(c, bug, &mut rng) {
                Some(n) => n,
                None => break,
            },
        };
        let mut m = c.clone();
        let Some(what) = plant(&mut m, bug, place, &driver, &mut rng) else {
            continue;
        };
        applicable = true;
        if differs(&m) {
            return Ok((m, what));
        }
    }
    let vectors = words * 64;
    Err(match (at, applicable) {
        (Some(name), false) => GenError::new(
            format!("--bug {} does not apply at `{name}`", bug.name()),
            match bug {
                Bug::Swap => "swap needs a 2:1 cell or a gate of two or more inputs with a partner of the same type",
                _ => "misroute needs a gate with another net defined before it to read instead",
            },
        ),
        (Some(name), true) => GenError::new(
            format!("--bug {} at `{name}` changes no output on {vectors} random input vectors", bug.name()),
            "choose another place, or leave out --at to let the seed choose",
        ),
        (None, _) => GenError::new(
            format!("found no place where --bug {} changes an output ({ATTEMPTS} places tried)", bug.name()),
            "try another --seed or another --bug",
        ),
    })
}

/// For each net, the index of the gate driving it.
fn drivers(c: &Circuit) -> Vec<Option<usize>> {
    let mut d = vec![None; c.num_nets()];
    for (i, g) in c.gates().iter().enumerate() {
        d[g.out.index()] = Some(i);
    }
    d
}

fn pick_place(c: &Circuit, bug: Bug, rng: &mut Rng) -> Option<Net> {
    let gates = c.gates();
    let inputs = c.input_order();
    match bug {
        Bug::Stuck0 | Bug::Stuck1 if gates.is_empty() || rng.chance(1, 4) => {
            Some(inputs[rng.below(inputs.len())])
        }
        Bug::Swap => {
            let multi: Vec<&Gate> = gates.iter().filter(|g| g.ins.len() >= 2).collect();
            (!multi.is_empty()).then(|| multi[rng.below(multi.len())].out)
        }
        _ => (!gates.is_empty()).then(|| gates[rng.below(gates.len())].out),
    }
}

/// Plant `bug` at `place` in `m`; `None` when it does not apply there (with this draw).
fn plant(
    m: &mut Circuit,
    bug: Bug,
    place: Net,
    driver: &[Option<usize>],
    rng: &mut Rng,
) -> Option<String> {
    let name = m.name(place);
    match bug {
        Bug::Stuck0 | Bug::Stuck1 => {
            let op = if bug == Bug::Stuck0 {
                Op::Const0
            } else {
                Op::Const1
            };
            let v = (bug == Bug::Stuck1) as u8;
            match driver[place.index()] {
                Some(gi) => {
                    let g = &mut m.gates_mut()[gi];
                    if g.op == op {
                        return None;
                    }
                    g.op = op;
                    g.ins.clear();
                }
                None => {
                    let k = m.fresh_wire(format!(
                        "{}_stuck{v}",
                        name.replace('[', "_").replace(']', "")
                    ));
                    for g in m.gates_mut().iter_mut() {
                        for i in g.ins.iter_mut() {
                            if *i == place {
                                *i = k;
                            }
                        }
                    }
                    m.insert_gate(
                        0,
                        Gate {
                            op,
                            ins: vec![],
                            out: k,
                        },
                    );
                }
            }
            Some(format!("stuck{v}: net `{name}` is stuck at {v}"))
        }
        Bug::Invert => {
            let gi = driver[place.index()]?;
            let old = m.gates()[gi].op;
            let flipped = match old {
                Op::And => Op::Nand,
                Op::Nand => Op::And,
                Op::Or => Op::Nor,
                Op::Nor => Op::Or,
                Op::Xor => Op::Xnor,
                Op::Xnor => Op::Xor,
                Op::Not => Op::Buf,
                Op::Buf => Op::Not,
                Op::Const0 => Op::Const1,
                Op::Const1 => Op::Const0,
                Op::Mux2 => {
                    let pre =
                        m.fresh_wire(format!("{}_pre", name.replace('[', "_").replace(']', "")));
                    m.gates_mut()[gi].out = pre;
                    m.insert_gate(
                        gi + 1,
                        Gate {
                            op: Op::Not,
                            ins: vec![pre],
                            out: place,
                        },
                    );
                    return Some(format!(
                        "invert: the output of 2:1 cell `{name}` is inverted"
                    ));
                }
            };
            m.gates_mut()[gi].op = flipped;
            Some(format!(
                "invert: gate `{name}` computes {} instead of {}",
                flipped.name(),
                old.name()
            ))
        }
        Bug::Swap => {
            let gi = driver[place.index()]?;
            let g = m.gates()[gi].clone();
            if g.op == Op::Mux2 {
                if g.ins[1] == g.ins[2] {
                    return None;
                }
                m.gates_mut()[gi].ins.swap(1, 2);
                let (s, t, e) = (m.name(g.ins[0]), m.name(g.ins[1]), m.name(g.ins[2]));
                return Some(format!(
                    "swap: the data inputs of 2:1 cell `{name}` are exchanged: it gives `{t}` when \
                     `{s}` is 0 and `{e}` when it is 1"
                ));
            }
            if g.ins.len() < 2 {
                return None;
            }
            let partners: Vec<usize> = m
                .gates()
                .iter()
                .enumerate()
                .filter(|(j, h)| *j != gi && h.op == g.op && h.ins.len() >= 2)
                .map(|(j, _)| j)
                .collect();
            for _ in 0..16 {
                if partners.is_empty() {
                    return None;
                }
                let j = partners[rng.below(partners.len())];
                let h = m.gates()[j].clone();
                let (x, y) = (rng.below(g.ins.len()), rng.below(h.ins.len()));
                let (na, nb) = (g.ins[x], h.ins[y]);
                let before = |n: Net, pos: usize| driver[n.index()].is_none_or(|d| d < pos);
                if na == nb
                    || g.ins.contains(&nb)
                    || h.ins.contains(&na)
                    || !before(nb, gi)
                    || !before(na, j)
                {
                    continue;
                }
                m.gates_mut()[gi].ins[x] = nb;
                m.gates_mut()[j].ins[y] = na;
                let (sa, sb, hn) = (m.name(na), m.name(nb), m.name(h.out));
                return Some(format!(
                    "swap: `{sa}` and `{sb}` are exchanged between gates `{name}` and `{hn}`: \
                     `{name}` reads `{sb}`, `{hn}` reads `{sa}`"
                ));
            }
            None
        }
        // Planted by the multiplier builder (src/gen/mult.rs), never here.
        Bug::PpBit | Bug::SwapCarry | Bug::BoothSign => None,
        Bug::Misroute => {
            let gi = driver[place.index()]?;
            let g = m.gates()[gi].clone();
            if g.ins.is_empty() {
                return None;
            }
            let x = if g.op == Op::Mux2 {
                1 + rng.below(2)
            } else {
                rng.below(g.ins.len())
            };
            let old = g.ins[x];
            for _ in 0..16 {
                let new = match m.input_port_of(old) {
                    Some(p) if rng.chance(3, 4) => {
                        let bits = m.input_bits(p);
                        bits[rng.below(bits.len())]
                    }
                    _ if gi == 0 || rng.chance(1, 3) => {
                        let ins = m.input_order();
                        ins[rng.below(ins.len())]
                    }
                    _ => m.gates()[gi - 1 - rng.below(gi.min(256))].out,
                };
                if new == old {
                    continue;
                }
                m.gates_mut()[gi].ins[x] = new;
                let (so, sn) = (m.name(old), m.name(new));
                return Some(format!(
                    "misroute: gate `{name}` reads `{sn}` instead of `{so}`"
                ));
            }
            None
        }
    }
}
