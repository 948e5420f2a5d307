//! The exact cone across registers (`seq::exact_cones`, `cone --cycles K`) against outside
//! references: a brute-force cycle simulator written from the gate lines (`seq/oracle.rs`'s
//! reader, evaluated here 64 input sequences per word) that tries every input sequence from
//! reset (and every initial state when registers start free) and flips each input in each
//! cycle, on random clocked bench circuits and the ISCAS-89 circuits s27 and s298 (shared
//! data); and Icarus Verilog, which runs both sequences of every "depends" claim of a clocked
//! Verilog design and must show the output differ in the reported cycle.

use super::common;
use super::seq_oracle::{gate_word, parse, SeqNet};
use equicone::design::Design;
use equicone::front::bench::read_bench;
use equicone::front::verilog::read_verilog;
use equicone::sat::Limits;
use equicone::seq::{self, ExactCones, ExactOptions, Influence, InitUnset};
use rand::rngs::StdRng;
use rand::{Rng, SeedableRng};
use std::collections::BTreeMap;
use std::sync::Arc;

/// A bench netlist compiled to signal indices in evaluation order.
struct Compiled {
    n_in: usize,
    /// (kind, fan-in indices) per gate; signal of gate g = n_in + ffs + g.
    gates: Vec<(String, Vec<usize>)>,
    /// Per flip-flop, the signal of its data input.
    d: Vec<usize>,
    outputs: Vec<usize>,
}

fn compile(n: &SeqNet) -> Compiled {
    let mut idx: BTreeMap<String, usize> = BTreeMap::new();
    for (k, i) in n.inputs.iter().enumerate() {
        idx.insert(i.clone(), k);
    }
    for (k, (q, _)) in n.dffs.iter().enumerate() {
        idx.insert(q.clone(), n.inputs.len() + k);
    }
    let mut order = Vec::new();
    let mut left: Vec<&(String, String, Vec<String>)> = n.gates.iter().collect();
    while !left.is_empty() {
        let before = left.len();
        left.retain(|(o, kind, a)| {
            if !a.iter().all(|x| idx.contains_key(x)) {
                return true;
            }
            let f = a.iter().map(|x| idx[x]).collect();
            idx.insert(o.clone(), n.inputs.len() + n.dffs.len() + order.len());
            order.push((kind.clone(), f));
            false
        });
        assert!(left.len() < before, "combinational cycle");
    }
    Compiled {
        n_in: n.inputs.len(),
        d: n.dffs.iter().map(|(_, d)| idx[d]).collect(),
        outputs: n.outputs.iter().map(|o| idx[o]).collect(),
        gates: order,
    }
}

impl Compiled {
    /// One cycle on 64 lanes: output words and next state words.
    fn step(&self, ins: &[u64], state: &[u64]) -> (Vec<u64>, Vec<u64>) {
        let mut v: Vec<u64> = ins.iter().chain(state).copied().collect();
        for (kind, f) in &self.gates {
            let xs: Vec<u64> = f.iter().map(|&k| v[k]).collect();
            v.push(gate_word(kind, &xs));
        }
        (
            self.outputs.iter().map(|&o| v[o]).collect(),
            self.d.iter().map(|&d| v[d]).collect(),
        )
    }
}

/// The word of lanes `64 * block ..` for bit `j` of the sequence number.
fn lane_word(j: usize, block: usize) -> u64 {
    super::oracle::sim::lane_word(j, block as u64)
}

/// Brute force: per (output name, input name), the least `k - t` over `k < cycles` such that
/// flipping the input in cycle `t` alone changes the output in cycle `k`, over every input
/// sequence from the all-zero state (`free_init`: from every initial state).
fn brute_force(net: &SeqNet, cycles: usize, free_init: bool) -> BTreeMap<(String, String), usize> {
    let c = compile(net);
    let n = c.n_in;
    let ffs = c.d.len();
    let bits = n * cycles + if free_init { ffs } else { 0 };
    assert!(bits <= 22, "too many sequences for brute force: 2^{bits}");
    let blocks = (1usize << bits).div_ceil(64);
    let lanes: u64 = if bits >= 6 {
        !0
    } else {
        (1u64 << (1 << bits)) - 1
    };
    // table[k][y][block]: output y in cycle k on sequence number 64 * block + lane.
    let mut table = vec![vec![vec![0u64; blocks]; c.outputs.len()]; cycles];
    for b in 0..blocks {
        let mut state: Vec<u64> = (0..ffs)
            .map(|f| {
                if free_init {
                    lane_word(n * cycles + f, b)
                } else {
                    0
                }
            })
            .collect();
        for (k, row) in table.iter_mut().enumerate() {
            let ins: Vec<u64> = (0..n).map(|i| lane_word(k * n + i, b)).collect();
            let (outs, next) = c.step(&ins, &state);
            for (y, w) in outs.into_iter().enumerate() {
                row[y][b] = w & lanes;
            }
            state = next;
        }
    }
    let mut out = BTreeMap::new();
    for (k, row) in table.iter().enumerate() {
        for (y, words) in row.iter().enumerate() {
            for t in 0..=k {
                for x in 0..n {
                    let j = t * n + x;
                    let differs = if j < 6 {
                        let sh = 1 << j;
                        words
                            .iter()
                            .any(|&w| (w ^ (w >> sh)) & !lane_word(j, 0) & lanes != 0)
                    } else {
                        let step = 1 << (j - 6);
                        (0..blocks).any(|b| b & step == 0 && words[b] != words[b + step])
                    };
                    if differs {
                        let key = (net.outputs[y].clone(), net.inputs[x].clone());
                        let l = k - t;
                        out.entry(key)
                            .and_modify(|v: &mut usize| *v = (*v).min(l))
                            .or_insert(l);
                    }
                }
            }
        }
    }
    out
}

pub(super) fn exact(d: &Design, cycles: usize, init_unset: InitUnset) -> ExactCones {
    let c = seq::cycle_cones(d);
    equicone::cone::exact_across_cycles(
        d,
        &c,
        &ExactOptions { cycles, init_unset },
        1,
        &Limits::none(),
    )
    .expect("built")
}

/// Compare the exact cones with brute force, and replay every evidence on the oracle; returns
/// the count of each verdict (depends, never, not within the bound, proved first).
fn compare(name: &str, text: &str, cycles: usize, free_init: bool) -> [usize; 4] {
    let mut counts = [0; 4];
    let net = parse(text);
    let d = read_bench(&Arc::from(name), text).expect("reads");
    let init = if free_init {
        InitUnset::Free
    } else {
        InitUnset::Value(false)
    };
    let e = exact(&d, cycles, init);
    let truth = brute_force(&net, cycles, free_init);
    let comp = compile(&net);
    for o in &e.outputs {
        for i in &o.inputs {
            let key = (o.output.clone(), i.input.clone());
            let want = truth.get(&key).copied();
            match i.influence {
                Influence::Depends => {
                    counts[0] += 1;
                    counts[3] += usize::from(i.proved_first);
                    assert_eq!(i.first_latency, want, "{name}: {key:?} {i:?}");
                    let ev = i.evidence.as_ref().expect("evidence");
                    let y = net.outputs.iter().position(|n| *n == o.output).unwrap();
                    for flip in [false, true] {
                        // The oracle's own run of the sequence (lane 0 only).
                        let mut state: Vec<u64> = net
                            .dffs
                            .iter()
                            .map(|(q, _)| {
                                if ev.initial.get(q).copied().unwrap_or(false) {
                                    1
                                } else {
                                    0
                                }
                            })
                            .collect();
                        let mut seen = None;
                        for (c, ins) in ev.cycles.iter().enumerate() {
                            let words: Vec<u64> = net
                                .inputs
                                .iter()
                                .map(|n| {
                                    let v = if c == ev.applied && *n == i.input {
                                        flip
                                    } else {
                                        ins[n]
                                    };
                                    u64::from(v)
                                })
                                .collect();
                            let (outs, next) = comp.step(&words, &state);
                            seen = Some(outs[y] & 1 == 1);
                            state = next;
                        }
                        assert_eq!(
                            seen,
                            Some(ev.output_value ^ flip),
                            "{name}: {key:?} evidence"
                        );
                    }
                }
                Influence::Never | Influence::NotWithinBound => {
                    counts[if i.influence == Influence::Never {
                        1
                    } else {
                        2
                    }] += 1;
                    assert_eq!(want, None, "{name}: {key:?} {i:?}")
                }
                Influence::Undecided => panic!("{name}: undecided without limits: {key:?}"),
            }
        }
        // Inputs outside the structural cone across cycles never matter either.
        for x in &net.inputs {
            if !o.inputs.iter().any(|i| &i.input == x) {
                assert_eq!(truth.get(&(o.output.clone(), x.clone())), None, "{name}");
            }
        }
    }
    counts
}

/// A random clocked bench circuit: `n` inputs, `ffs` flip-flops, `gates` gates, 2 outputs.
fn random_circuit(seed: u64, n: usize, ffs: usize, gates: usize) -> String {
    let mut rng = StdRng::seed_from_u64(seed);
    let c = super::oracle::random::Gates::random(&mut rng, n + ffs, gates);
    let name = |s: usize| {
        if s < n {
            format!("i{s}")
        } else if s < n + ffs {
            format!("q{}", s - n)
        } else {
            format!("g{}", s - n - ffs)
        }
    };
    let mut s = String::new();
    for i in 0..n {
        s += &format!("INPUT(i{i})\n");
    }
    s += "OUTPUT(y0)\nOUTPUT(y1)\n";
    for k in 0..ffs {
        let g = rng.gen_range(0..gates);
        s += &format!("q{k} = DFF(g{g})\n");
    }
    s += &c.lines(None, &name);
    s += &format!(
        "y0 = BUFF(g{})\ny1 = BUFF(g{})\n",
        rng.gen_range(gates / 2..gates),
        rng.gen_range(0..gates)
    );
    s
}

#[test]
fn exact_latencies_of_random_circuits_match_brute_force() {
    let mut counts = [0; 4];
    for seed in 0..40u64 {
        let (n, ffs, gates) = (
            2 + (seed % 2) as usize,
            2 + (seed % 3) as usize,
            14 + (seed % 11) as usize,
        );
        let text = random_circuit(seed, n, ffs, gates);
        for free in [false, true] {
            let c = compare(&format!("random{seed} free {free}"), &text, 4, free);
            for k in 0..4 {
                counts[k] += c[k];
            }
        }
    }
    // Every kind of answer occurs, so the comparison covers each.
    assert!(counts.iter().all(|&c| c > 0), "{counts:?}");
    eprintln!(
        "random circuits: depends {}, never {}, not within 4 cycles {}, proved first {}",
        counts[0], counts[1], counts[2], counts[3]
    );
}

#[test]
fn exact_latencies_of_iscas89_match_brute_force() {
    let Some(dir) = super::iscas89() else { return };
    let s27 = std::fs::read_to_string(dir.join("s27.bench")).unwrap();
    compare("s27", &s27, 4, false);
    compare("s27 (free start)", &s27, 3, true);
    let s298 = std::fs::read_to_string(dir.join("s298.bench")).unwrap();
    compare("s298", &s298, 6, false);
}

/// Verilog designs with constant, equal and free registers, an enable, an asynchronous reset.
const ICARUS_DESIGNS: [(&str, &str); 2] = [
    (
        "pipe",
        "module pipe(input clk, rst, a, b, c, e, output y, z);
  reg r1, r2, r3, r4, r5, k;
  always @(posedge clk) begin
    if (rst) begin r1 <= 0; r2 <= 0; r3 <= 0; r4 <= 0; r5 <= 1; k <= 0; end
    else begin r1 <= a; r2 <= r1; r3 <= c; r4 <= a; r5 <= r5 & ~k; k <= k & e; end
  end
  assign y = r2 ^ b ^ (r1 & ~r4);
  assign z = (r5 & e) | (k & c);
endmodule
",
    ),
    (
        "mix",
        "module mix(input clk, rst_n, en, input [1:0] d, output [1:0] q, output p);
  reg [1:0] s;
  reg t, u;
  always @(posedge clk or negedge rst_n)
    if (!rst_n) s <= 2'b01; else if (en) s <= d ^ {s[0], s[1]};
  always @(posedge clk) begin t <= s[1] & d[0]; u <= u ^ en; end
  assign q = s;
  assign p = t ^ u;
endmodule
",
    ),
];

/// A testbench running, for every "depends" claim, both input sequences of its evidence on
/// two instances of the design from reset, printing `E<n> <run 0> <run 1>` in the observed
/// cycle; returns it with the expected lines.
pub(super) fn icarus_bench(d: &Design, module: &str, e: &ExactCones) -> (String, Vec<String>) {
    let held: BTreeMap<&str, (bool, &str)> = e
        .held
        .iter()
        .map(|h| (h.name.as_str(), (h.value, h.role.as_str())))
        .collect();
    let mut widths: BTreeMap<&str, Option<i64>> = BTreeMap::new();
    for b in &d.inputs {
        if matches!(b.kind, equicone::design::InputKind::Port)
            && !held.contains_key(b.name.as_str())
        {
            let w = widths.entry(b.port.as_str()).or_insert(b.index);
            *w = (*w).max(b.index);
        }
    }
    let mut outs: BTreeMap<&str, Option<i64>> = BTreeMap::new();
    for o in &d.outputs {
        let w = outs.entry(o.port.as_str()).or_insert(o.index);
        *w = (*w).max(o.index);
    }
    let range = |w: &Option<i64>| w.map(|h| format!("[{h}:0] ")).unwrap_or_default();
    let mut tb = String::from("module tb;\n");
    for (h, (v, _)) in &held {
        tb += &format!("  reg {h} = {};\n", u8::from(*v));
    }
    for run in 0..2 {
        for (p, w) in &widths {
            tb += &format!("  reg {}{p}_{run};\n", range(w));
        }
        for (p, w) in &outs {
            tb += &format!("  wire {}{p}_{run};\n", range(w));
        }
        let mut conn: Vec<String> = held.keys().map(|h| format!(".{h}({h})")).collect();
        conn.extend(
            widths
                .keys()
                .chain(outs.keys())
                .map(|p| format!(".{p}({p}_{run})")),
        );
        tb += &format!("  {module} u{run}({});\n", conn.join(", "));
    }
    let pulse = |tb: &mut String| {
        for (h, (_, role)) in &held {
            if *role == "clock" {
                *tb += &format!("    {h} = 1; #1; {h} = 0; #1;\n");
            }
        }
    };
    // `x` or `x[3]` of run r.
    let bit = |name: &str, run: usize| match name.split_once('[') {
        Some((p, rest)) => format!("{p}_{run}[{rest}"),
        None => format!("{name}_{run}"),
    };
    tb += "  initial begin\n";
    let mut expect = Vec::new();
    let mut n = 0;
    for o in &e.outputs {
        for i in &o.inputs {
            let Some(ev) = &i.evidence else { continue };
            // Reset over one clock edge, then released.
            for (h, (v, role)) in &held {
                if *role == "reset" {
                    tb += &format!("    {h} = {};\n", u8::from(!*v));
                }
            }
            tb += "    #1;\n";
            pulse(&mut tb);
            for (h, (v, role)) in &held {
                if *role == "reset" {
                    tb += &format!("    {h} = {};\n", u8::from(*v));
                }
            }
            tb += "    #1;\n";
            for (r, v) in &ev.initial {
                for run in 0..2 {
                    tb += &format!("    u{run}.{r} = {};\n", u8::from(*v));
                }
            }
            for (c, ins) in ev.cycles.iter().enumerate() {
                for (name, v) in ins {
                    for run in 0..2 {
                        let v = if run == 1 && c == ev.applied && *name == i.input {
                            !v
                        } else {
                            *v
                        };
                        tb += &format!("    {} = {};\n", bit(name, run), u8::from(v));
                    }
                }
                tb += "    #1;\n";
                if c == ev.observed {
                    tb += &format!(
                        "    $display(\"E{n} %b %b\", {}, {});\n",
                        bit(&o.output, 0),
                        bit(&o.output, 1)
                    );
                }
                pulse(&mut tb);
            }
            expect.push(format!(
                "E{n} {} {}",
                u8::from(ev.output_value),
                u8::from(!ev.output_value)
            ));
            n += 1;
        }
    }
    tb += "  end\nendmodule\n";
    (tb, expect)
}

#[test]
fn icarus_runs_every_influence_evidence_to_the_reported_difference() {
    if !common::iverilog_available() {
        return;
    }
    for (module, src) in ICARUS_DESIGNS {
        let d = read_verilog(&[(Arc::from(format!("{module}.v")), src.to_string())], None)
            .unwrap_or_else(|e| panic!("{module}: {e}"));
        let e = exact(&d, 6, InitUnset::Free);
        let (tb, expect) = icarus_bench(&d, module, &e);
        assert!(expect.len() >= 3, "{module}: {e}");
        let out = common::run_iverilog(&format!("{src}\n{tb}"), "tb");
        let got: Vec<&str> = out.lines().filter(|l| l.starts_with('E')).collect();
        assert_eq!(got, expect, "{module}:\n{tb}");
    }
}

/// Known answers: `pipe` reads `a` through two registers (`r1 & ~r4` is 0 in every reachable
/// state, r1 and r4 being equal), `z` is `e` alone (r5 stays 1, k stays 0), and r3 is read
/// by nothing; `mix`'s `p` reads `en` through the free register `u` and `d[0]` through `t`.
#[test]
fn register_pairs_sharpen_the_exact_cone() {
    let (module, src) = ICARUS_DESIGNS[0];
    let d = read_verilog(&[(Arc::from(format!("{module}.v")), src.to_string())], None).unwrap();
    let e = exact(&d, 6, InitUnset::Free);
    let line = |o: usize| -> Vec<(String, Influence, Option<usize>, bool)> {
        e.outputs[o]
            .inputs
            .iter()
            .map(|i| {
                (
                    i.input.clone(),
                    i.influence,
                    i.first_latency,
                    i.proved_first,
                )
            })
            .collect()
    };
    assert_eq!(
        line(0),
        [
            ("a".to_string(), Influence::Depends, Some(2), true),
            ("b".to_string(), Influence::Depends, Some(0), true)
        ]
    );
    assert_eq!(
        line(1),
        [
            ("c".to_string(), Influence::Never, None, false),
            ("e".to_string(), Influence::Depends, Some(0), true)
        ]
    );
    let dead: Vec<(&str, &str)> = e
        .dead_registers
        .iter()
        .map(|d| (d.register.as_str(), d.why.as_str()))
        .collect();
    assert_eq!(
        dead,
        [
            ("r3", "reaches no output"),
            ("r5", "constant 1"),
            ("k", "constant 0")
        ]
    );
}
