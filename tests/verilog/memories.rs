//! Memories written in clocked blocks (IEEE 1364-2005 clauses 4.9 and 9.2.2; `always_ff`,
//! IEEE 1800-2017 clause 9.2.2.4, from memory): register files with a variable write
//! address, a reset loop, a bit write into a word and registered reads. Each design runs
//! 400 random cycles after reset in Icarus Verilog and in the design equicone reads (stepped
//! here through its registers' next-state logic), and every output must agree each cycle.

use super::common;
use equicone::design::{Design, InputKind};
use std::collections::HashMap;

/// Ports driven by the testbench (name, width); `clk` and `rst` are added.
type Ports<'a> = [(&'a str, u32)];

/// One cycle of `d`: the outputs (by bit name) before the clock edge for port values
/// `ports`, and the registers' state after the edge.
fn step(d: &Design, state: &mut [bool], ports: &HashMap<String, u128>) -> HashMap<String, bool> {
    let mut rank: HashMap<&str, usize> = HashMap::new();
    let mut reg_of = HashMap::new();
    for (k, r) in d.registers.iter().enumerate() {
        reg_of.insert(r.input, k);
    }
    let mut ins = Vec::with_capacity(d.inputs.len());
    for (i, b) in d.inputs.iter().enumerate() {
        match b.kind {
            InputKind::Register => ins.push(state[reg_of[&i]]),
            InputKind::Unknown { .. } => ins.push(false),
            InputKind::Port => {
                let r = rank.entry(b.port.as_str()).or_insert(0);
                let v = ports.get(&b.port).copied().unwrap_or(0);
                ins.push((v >> *r) & 1 == 1);
                *r += 1;
            }
        }
    }
    let mut roots: Vec<_> = d.outputs.iter().map(|o| o.lit).collect();
    roots.extend(d.registers.iter().map(|r| r.next));
    let vals = equicone::aig::eval(&d.aig, &ins, &roots);
    let (outs, next) = vals.split_at(d.outputs.len());
    state.copy_from_slice(next);
    d.outputs
        .iter()
        .zip(outs)
        .map(|(o, &v)| (o.name.clone(), v))
        .collect()
}

/// Run `src` (top module `name`, a clock `clk` and a synchronous reset `rst`) for one reset
/// cycle and then `cycles` random ones in Icarus Verilog and in equicone's reading; compare
/// `outs` before every clock edge after reset. Returns the cycles compared (0 when iverilog
/// is absent and not required).
fn random_cycles_against_icarus(
    src: &str,
    name: &str,
    ins: &Ports,
    outs: &Ports,
    generation: &str,
    cycles: usize,
) -> usize {
    let d = common::read(src);
    if !common::iverilog_available() {
        return 0;
    }
    let mut tb = String::from("module tb;\n  reg clk = 0;\n  reg rst = 1;\n  integer c;\n");
    let mut conns = vec![".clk(clk)".to_string(), ".rst(rst)".to_string()];
    for (p, w) in ins {
        tb += &format!("  reg [{}:0] {p} = 0;\n", w - 1);
        conns.push(format!(".{p}({p})"));
    }
    for (p, w) in outs {
        tb += &format!("  wire [{}:0] {p};\n", w - 1);
        conns.push(format!(".{p}({p})"));
    }
    tb += &format!("  {name} u({});\n", conns.join(", "));
    let fmt = " %0d".repeat(ins.len() + outs.len());
    let args: String = ins
        .iter()
        .chain(outs.iter())
        .map(|(p, _)| format!(", {p}"))
        .collect();
    tb += &format!(
        "  initial begin\n    #1 clk = 1; #1 clk = 0; rst = 0;\n    for (c = 0; c < {cycles}; c = c + 1) begin\n{}      #1 $display(\"v{fmt}\"{args});\n      clk = 1; #1 clk = 0;\n    end\n  end\nendmodule\n",
        ins.iter()
            .map(|(p, _)| format!("      {p} = $random;\n"))
            .collect::<String>()
    );
    let sim = common::run_iverilog_as(&format!("{src}\n{tb}"), "tb", generation);
    let mut state = vec![false; d.registers.len()];
    // The reset cycle: every other input at 0.
    step(&d, &mut state, &HashMap::from([("rst".to_string(), 1)]));
    let mut n = 0;
    for line in sim.lines().filter(|l| l.starts_with("v ")) {
        let f: Vec<u128> = line[2..]
            .split(' ')
            .map(|x| {
                x.parse()
                    .unwrap_or_else(|_| panic!("{name}: Icarus gave `{line}`"))
            })
            .collect();
        let mut ports: HashMap<String, u128> = HashMap::new();
        for (k, (p, _)) in ins.iter().enumerate() {
            ports.insert(p.to_string(), f[k]);
        }
        let bits = step(&d, &mut state, &ports);
        for (k, (p, w)) in outs.iter().enumerate() {
            let ours = if *w == 1 && bits.contains_key(*p) {
                u128::from(bits[*p])
            } else {
                (0..*w).fold(0, |v, j| v | u128::from(bits[&format!("{p}[{j}]")]) << j)
            };
            assert_eq!(ours, f[ins.len() + k], "{name}: {p} in cycle {n}: {line}");
        }
        n += 1;
    }
    assert_eq!(n, cycles, "{name}: cycles simulated");
    n
}

#[test]
fn a_register_file_written_by_address_matches_icarus_cycle_by_cycle() {
    // Two write ports (the second wins on the same address, as the later statement does),
    // a bit write into a word, a combinational and a registered read, a reset loop.
    let src = "module rf(input clk, input rst, input we, input [2:0] wa, input [3:0] wd,
          input we2, input [2:0] wa2, input [3:0] wd2, input [2:0] ra, input [1:0] rb,
          output [3:0] rd, output reg [3:0] q, output bit_);
  reg [3:0] mem [0:7];
  integer i;
  always @(posedge clk) begin
    if (rst) begin
      for (i = 0; i < 8; i = i + 1) mem[i] <= 4'd0;
    end else begin
      if (we) mem[wa] <= wd;
      if (we2) mem[wa2] <= wd2;
      if (we & we2 & wd[0]) mem[ra][rb] <= wd2[3];
    end
  end
  always @(posedge clk)
    if (rst) q <= 4'd0;
    else q <= mem[ra] ^ mem[wa];
  assign rd = mem[ra];
  assign bit_ = mem[wa2][rb];
endmodule
";
    let ins = [
        ("we", 1),
        ("wa", 3),
        ("wd", 4),
        ("we2", 1),
        ("wa2", 3),
        ("wd2", 4),
        ("ra", 3),
        ("rb", 2),
    ];
    let outs = [("rd", 4), ("q", 4), ("bit_", 1)];
    let n = random_cycles_against_icarus(src, "rf", &ins, &outs, "-g2005", 400);
    assert!(n == 0 || n == 400);
}

#[test]
fn an_always_ff_memory_with_descending_words_and_a_signed_read_matches_icarus() {
    // SystemVerilog: `logic signed [3:0] m [6]` (six words, so addresses 6 and 7 write
    // nothing), `always_ff` with a blocking temporary, a registered signed sum.
    let src = "module ffm(input logic clk, input logic rst, input logic en, input logic [2:0] a,
           input logic [3:0] d, input logic [2:0] r1, input logic [2:0] r2,
           output logic [5:0] sum, output logic [3:0] last);
  logic signed [3:0] m [6];
  logic [3:0] stack [3:0];
  always_ff @(posedge clk) begin
    if (rst) begin
      for (int k = 0; k < 6; k++) m[k] <= '0;
      for (int k = 0; k < 4; k++) stack[k] <= k;
      sum <= '0;
    end else begin
      if (en && a < 6) m[a] <= d;
      stack[a[1:0]] <= stack[r1[1:0]] + 1'b1;
      sum <= m[r1 % 6] + m[r2 % 6];
    end
  end
  assign last = stack[r2[1:0]];
endmodule
";
    let ins = [("en", 1), ("a", 3), ("d", 4), ("r1", 3), ("r2", 3)];
    let outs = [("sum", 6), ("last", 4)];
    let n = random_cycles_against_icarus(src, "ffm", &ins, &outs, "-g2012", 400);
    assert!(n == 0 || n == 400);
}
