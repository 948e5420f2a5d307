//! Shared helpers: generate a spec's bench text, draw random port vectors (inside a selector's
//! select range), and evaluate vectors on bench text with the test's own evaluator.

use super::oracle::{parse, sim::Evaluator};
use equicone::gen::{build, generate, GenFormat, GenSpec};
use rand::rngs::StdRng;
use rand::{Rng, SeedableRng};
use std::collections::HashMap;

/// One input vector: per input port, its bits (bit 0 first).
pub type Vector = Vec<Vec<bool>>;

/// Port names and widths, inputs and outputs, of a spec's circuit.
pub struct Ports {
    pub inputs: Vec<(String, usize, bool)>,
    pub outputs: Vec<(String, usize, bool)>,
    /// (input port, limit): values of that port stay below the limit.
    pub care: Option<(usize, u64)>,
}

pub fn ports(spec: &GenSpec) -> Ports {
    let c =
        build(spec).unwrap_or_else(|e| panic!("{}: {e}", spec.command_line(GenFormat::Verilog)));
    let list = |ps: &[equicone::gen::emit::Port]| {
        ps.iter()
            .map(|p| (p.name.clone(), p.width, p.scalar))
            .collect()
    };
    Ports {
        inputs: list(c.inputs()),
        outputs: list(c.outputs()),
        care: c.care.as_ref().map(|k| (k.port, k.limit)),
    }
}

pub fn bench_text(spec: &GenSpec) -> String {
    generate(spec, GenFormat::Bench)
        .unwrap_or_else(|e| panic!("{}: {e}", spec.command_line(GenFormat::Bench)))
        .text
}

pub fn bench(spec: &GenSpec) -> Evaluator {
    parse(&bench_text(spec)).evaluator()
}

pub fn random_vectors(p: &Ports, count: usize, seed: u64) -> Vec<Vector> {
    let mut rng = StdRng::seed_from_u64(seed);
    (0..count)
        .map(|_| {
            p.inputs
                .iter()
                .enumerate()
                .map(|(k, (_, w, _))| match p.care {
                    Some((port, limit)) if port == k => {
                        let v = rng.gen_range(0..limit);
                        (0..*w).map(|b| (v >> b) & 1 == 1).collect()
                    }
                    _ => (0..*w).map(|_| rng.gen::<bool>()).collect(),
                })
                .collect()
        })
        .collect()
}

/// Evaluate `vectors` on `b`; per vector, per output port (in `p.outputs` order), its bits.
pub fn eval(b: &Evaluator, p: &Ports, vectors: &[Vector]) -> Vec<Vec<Vec<bool>>> {
    let in_port: HashMap<&str, usize> = p
        .inputs
        .iter()
        .enumerate()
        .map(|(k, x)| (x.0.as_str(), k))
        .collect();
    let out_port: HashMap<&str, usize> = p
        .outputs
        .iter()
        .enumerate()
        .map(|(k, x)| (x.0.as_str(), k))
        .collect();
    let mut result = Vec::with_capacity(vectors.len());
    for chunk in vectors.chunks(64) {
        let words: Vec<u64> = b
            .inputs
            .iter()
            .map(|name| {
                let (bus, bit) = split_bit(name);
                let k = in_port[bus];
                chunk
                    .iter()
                    .enumerate()
                    .fold(0u64, |w, (i, v)| w | ((v[k][bit as usize] as u64) << i))
            })
            .collect();
        let outs = b.eval(&words);
        for i in 0..chunk.len() {
            let mut ports: Vec<Vec<bool>> = p.outputs.iter().map(|o| vec![false; o.1]).collect();
            for (name, w) in b.outputs.iter().zip(&outs) {
                let (bus, bit) = split_bit(name);
                ports[out_port[bus]][bit as usize] = (w >> i) & 1 == 1;
            }
            result.push(ports);
        }
    }
    result
}

/// Bits (bit 0 first) as a number.
pub fn value(bits: &[bool]) -> u128 {
    bits.iter().rev().fold(0u128, |v, &b| (v << 1) | b as u128)
}

/// A number as `w` bits, bit 0 first.
pub fn bits(v: u128, w: usize) -> Vec<bool> {
    (0..w).map(|b| (v >> b) & 1 == 1).collect()
}

/// `d[3]` -> (`d`, 3); `v` -> (`v`, 0).
pub fn split_bit(name: &str) -> (&str, u32) {
    match name.find('[') {
        Some(i) => (
            &name[..i],
            name[i + 1..name.len() - 1].parse().expect("bit index"),
        ),
        None => (name, 0),
    }
}
