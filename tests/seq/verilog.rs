//! Clocked Verilog against Icarus Verilog: hand-written RTL pairs (a registered selector, a
//! pipelined adder, counters, a state machine with an asynchronous reset, enables, negedge
//! clocks, `always_ff`) proved or found different as expected. Every trace the tool gives is
//! driven into both designs from reset by a generated testbench that Icarus Verilog runs: the
//! first differing cycle and outputs must be the ones reported. Every equivalent pair runs
//! 1,000 random cycles from reset in Icarus Verilog without a difference.

use super::common;
use equicone::design::{Design, InputKind};
use equicone::front::verilog::read_verilog;
use equicone::seq::{self, SeqOptions, Trace};
use std::collections::BTreeMap;
use std::sync::Arc;

/// One hand-written pair: Verilog with `MOD` where the module name goes.
pub(super) struct Pair {
    pub(super) name: &'static str,
    pub(super) reference: &'static str,
    pub(super) candidate: &'static str,
    pub(super) expect: &'static str,
}

impl Pair {
    pub(super) fn new(
        name: &'static str,
        reference: &'static str,
        candidate: &'static str,
        expect: &'static str,
    ) -> Pair {
        Pair {
            name,
            reference,
            candidate,
            expect,
        }
    }
}

pub(super) fn read(src: &str, module: &str) -> Design {
    let text = src.replace("MOD", module);
    read_verilog(&[(Arc::from(format!("{module}.v")), text)], None)
        .unwrap_or_else(|e| panic!("{module}: {e}"))
}

/// Port bits of a design grouped by port: name to (lowest, highest index), `None` for a scalar.
fn ports(
    bits: impl Iterator<Item = (String, Option<i64>)>,
) -> BTreeMap<String, Option<(i64, i64)>> {
    let mut m: BTreeMap<String, Option<(i64, i64)>> = BTreeMap::new();
    for (p, i) in bits {
        let e = m.entry(p).or_insert(i.map(|i| (i, i)));
        if let (Some((lo, hi)), Some(i)) = (e.as_mut(), i) {
            *lo = (*lo).min(i);
            *hi = (*hi).max(i);
        }
    }
    m
}

fn decl(kind: &str, name: &str, range: Option<(i64, i64)>) -> String {
    match range {
        Some((lo, hi)) => format!("  {kind} [{hi}:{lo}] {name};\n"),
        None => format!("  {kind} {name};\n"),
    }
}

/// A testbench over both designs: the clock and reset ports found in the reference's
/// registers, the data inputs, and per output bit a comparison before each clock edge that
/// prints `cycle C output O R C` for the first differing cycle. `body` drives the cycles.
fn testbench(r: &Design, body: &str) -> String {
    let mut held: BTreeMap<String, (bool, bool)> = BTreeMap::new(); // name -> (active, is_reset)
    for g in &r.registers {
        if let Some(c) = &g.clock {
            held.insert(c.clone(), (true, false));
        }
        if let Some(rs) = &g.reset {
            held.insert(r.inputs[rs.input].name.clone(), (rs.active, true));
        }
    }
    let ins = ports(
        r.inputs
            .iter()
            .filter(|b| matches!(b.kind, InputKind::Port) && !held.contains_key(&b.name))
            .map(|b| (b.port.clone(), b.index)),
    );
    let outs = ports(r.outputs.iter().map(|b| (b.port.clone(), b.index)));
    let mut tb = String::from("module tb;\n");
    for (name, &(active, _)) in &held {
        // Clocks idle at 0, resets start inactive.
        tb += &format!("  reg {name} = {};\n", u8::from(!active && held[name].1));
    }
    for (p, range) in &ins {
        tb += &decl("reg", p, *range);
    }
    for (p, range) in &outs {
        tb += &decl("wire", &format!("r_{p}"), *range);
        tb += &decl("wire", &format!("c_{p}"), *range);
    }
    let conn = |side: &str| {
        let mut v: Vec<String> = held.keys().map(|h| format!(".{h}({h})")).collect();
        v.extend(ins.keys().map(|p| format!(".{p}({p})")));
        v.extend(outs.keys().map(|p| format!(".{p}({side}_{p})")));
        v.join(", ")
    };
    tb += &format!("  ref_m r({});\n  cand_m c({});\n", conn("r"), conn("c"));
    tb += "  integer found = 0;\n  integer cyc;\n";
    // The comparison of one cycle.
    let mut compare = String::from("  task compare;\n  begin\n");
    let mut any = Vec::new();
    for o in &r.outputs {
        let sel = o.index.map(|i| format!("[{i}]")).unwrap_or_default();
        let (a, b) = (format!("r_{}{sel}", o.port), format!("c_{}{sel}", o.port));
        compare += &format!(
            "    if (found == 0 && {a} !== {b}) $display(\"cycle %0d output {} %b %b\", cyc, {a}, {b});\n",
            o.name
        );
        any.push(format!("{a} !== {b}"));
    }
    compare += &format!(
        "    if (found == 0 && ({})) found = 1;\n  end\n  endtask\n",
        any.join(" || ")
    );
    tb += &compare;
    let clocks: Vec<&String> = held.iter().filter(|(_, v)| !v.1).map(|(k, _)| k).collect();
    let resets: Vec<(&String, bool)> = held
        .iter()
        .filter(|(_, v)| v.1)
        .map(|(k, v)| (k, v.0))
        .collect();
    let pulse: String = clocks
        .iter()
        .map(|c| format!("{c} = 1; "))
        .collect::<String>()
        + "#1; "
        + &clocks
            .iter()
            .map(|c| format!("{c} = 0; "))
            .collect::<String>()
        + "#1;";
    tb += "  initial begin\n";
    for p in ins.keys() {
        tb += &format!("    {p} = 0;\n");
    }
    // Reset: asserted over one clock edge (a synchronous reset acts on it), then released.
    // A design without a reset starts from its initial values: no edge before cycle 0.
    tb += "    #1;\n";
    if !resets.is_empty() {
        for (rs, active) in &resets {
            tb += &format!("    {rs} = {};\n", u8::from(*active));
        }
        tb += &format!("    #1; {pulse}\n");
        for (rs, active) in &resets {
            tb += &format!("    {rs} = {};\n", u8::from(!*active));
        }
        tb += "    #1;\n";
    }
    tb += body;
    tb += "  end\nendmodule\n";
    tb
}

/// The cycles of a trace as testbench statements (inputs, compare, clock edge). With several
/// clocks, only the clocks the cycle lists as ticked get an edge.
fn trace_body(r: &Design, t: &Trace) -> String {
    let mut pulse_clocks: Vec<String> =
        r.registers.iter().filter_map(|g| g.clock.clone()).collect();
    pulse_clocks.sort();
    pulse_clocks.dedup();
    let mut s = String::new();
    for cyc in &t.cycles {
        s += &format!("    cyc = {};\n", cyc.cycle);
        for i in &cyc.inputs {
            s += &format!("    {} = {};\n", i.name, u8::from(i.value));
        }
        s += "    #1; compare;\n";
        let ticking: Vec<&String> = pulse_clocks
            .iter()
            .filter(|c| cyc.ticked.as_ref().is_none_or(|k| k.contains(c)))
            .collect();
        for c in &ticking {
            s += &format!("    {c} = 1;\n");
        }
        s += "    #1;\n";
        for c in &ticking {
            s += &format!("    {c} = 0;\n");
        }
        s += "    #1;\n";
    }
    s
}

/// 1,000 random cycles: `$random` on every data input before each clock edge. With several
/// clocks each one ticks at random (`$random`), so the runs interleave their edges.
fn random_body(r: &Design, tb_ins: &[String]) -> String {
    let mut clocks: Vec<String> = r.registers.iter().filter_map(|g| g.clock.clone()).collect();
    clocks.sort();
    clocks.dedup();
    let several = clocks.len() > 1;
    let mut s = String::from("    for (cyc = 0; cyc < 1000; cyc = cyc + 1) begin\n");
    for p in tb_ins {
        s += &format!("      {p} = $random;\n");
    }
    s += "      #1; compare;\n";
    s += &clocks
        .iter()
        .map(|c| {
            if several {
                format!("      {c} = $random;\n")
            } else {
                format!("      {c} = 1;\n")
            }
        })
        .collect::<String>();
    s += "      #1;\n";
    s += &clocks
        .iter()
        .map(|c| format!("      {c} = 0;\n"))
        .collect::<String>();
    s += "      #1;\n    end\n    $display(\"ran %0d cycles\", cyc);\n";
    s
}

fn data_inputs(r: &Design) -> Vec<String> {
    let mut held: Vec<String> = r.registers.iter().filter_map(|g| g.clock.clone()).collect();
    held.extend(
        r.registers
            .iter()
            .filter_map(|g| g.reset.as_ref().map(|rs| r.inputs[rs.input].name.clone())),
    );
    ports(
        r.inputs
            .iter()
            .filter(|b| matches!(b.kind, InputKind::Port) && !held.contains(&b.name))
            .map(|b| (b.port.clone(), b.index)),
    )
    .into_keys()
    .collect()
}

/// Prove the pair and check the answer with Icarus Verilog; returns the verdict.
pub(super) fn check(p: &Pair, icarus: bool) {
    let r = read(p.reference, "ref_m");
    let c = read(p.candidate, "cand_m");
    let rep = seq::check(&r, &c, &SeqOptions::default()).unwrap();
    assert_eq!(rep.verdict, p.expect, "{}: {rep:#?}", p.name);
    if !icarus {
        return;
    }
    let sources = p.reference.replace("MOD", "ref_m") + &p.candidate.replace("MOD", "cand_m");
    match &rep.trace {
        Some(t) => {
            let fd = t.first_difference.as_ref().expect("a confirmed trace");
            let tb = sources + &testbench(&r, &trace_body(&r, t));
            let out = common::run_iverilog_as(&tb, "tb", "-g2012");
            let want: Vec<String> = fd
                .outputs
                .iter()
                .map(|o| {
                    format!(
                        "cycle {} output {} {} {}",
                        fd.cycle,
                        o.reference,
                        u8::from(o.reference_value),
                        u8::from(o.candidate_value)
                    )
                })
                .collect();
            let got: Vec<String> = out
                .lines()
                .map(|l| l.trim().to_string())
                .filter(|l| !l.is_empty())
                .collect();
            assert_eq!(
                got, want,
                "{}: Icarus Verilog disagrees with the trace:\n{tb}",
                p.name
            );
        }
        None => {
            // Equivalent, or undecided where the answer is known to be equivalent.
            let tb = sources + &testbench(&r, &random_body(&r, &data_inputs(&r)));
            let out = common::run_iverilog_as(&tb, "tb", "-g2012");
            assert_eq!(
                out.trim(),
                "ran 1000 cycles",
                "{}: Icarus Verilog found a difference in 1,000 random cycles:\n{tb}",
                p.name
            );
        }
    }
}

const SELECTOR: &str =
    "module MOD(input clk, input rst_n, input [1:0] s, input [3:0] d, output reg y);
  always @(posedge clk or negedge rst_n)
    if (!rst_n) y <= 1'b0;
    else y <= d[s];
endmodule
";

/// The selector registered on the chip, its flip-flop renamed and storing the complement,
/// the selection written as a tree of conditions.
const SELECTOR_INVERTED: &str =
    "module MOD(input clk, input rst_n, input [1:0] s, input [3:0] d, output y);
  reg y_n_reg;
  always @(posedge clk or negedge rst_n) begin
    if (!rst_n) y_n_reg <= 1'b1;
    else y_n_reg <= ~(s[1] ? (s[0] ? d[3] : d[2]) : (s[0] ? d[1] : d[0]));
  end
  assign y = ~y_n_reg;
endmodule
";

/// A bug: the selection reads the previous cycle's select value.
const SELECTOR_LATE: &str =
    "module MOD(input clk, input rst_n, input [1:0] s, input [3:0] d, output reg y);
  reg [1:0] s_q;
  always @(posedge clk or negedge rst_n)
    if (!rst_n) begin y <= 1'b0; s_q <= 2'd0; end
    else begin y <= d[s_q]; s_q <= s; end
endmodule
";

const ADDER: &str =
    "module MOD(input clk, input rst, input [7:0] a, input [7:0] b, output reg [8:0] sum);
  reg [7:0] a_q, b_q;
  always @(posedge clk) begin
    if (rst) begin a_q <= 0; b_q <= 0; sum <= 0; end
    else begin a_q <= a; b_q <= b; sum <= a_q + b_q; end
  end
endmodule
";

/// The same two stages, the adder a ripple chain in a `for` loop, registers in a submodule
/// and named as a netlist names them.
const ADDER_RIPPLE: &str =
    "module MOD(input clk, input rst, input [7:0] a, input [7:0] b, output [8:0] sum);
  reg [7:0] a_q_reg, b_q_reg;
  reg [8:0] s;
  integer i;
  reg [8:0] c;
  reg [7:0] x;
  always_ff @(posedge clk) begin
    if (rst) begin a_q_reg <= 0; b_q_reg <= 0; end
    else begin a_q_reg <= a; b_q_reg <= b; end
  end
  always @* begin
    c = 0;
    for (i = 0; i < 8; i = i + 1) begin
      x[i] = a_q_reg[i] ^ b_q_reg[i];
      c[i + 1] = (a_q_reg[i] & b_q_reg[i]) | (x[i] & c[i]);
    end
  end
  always_ff @(posedge clk)
    if (rst) s <= 0;
    else s <= {c[8], x ^ c[7:0]};
  assign sum = s;
endmodule
";

/// A bug: the carry into bit 4 is dropped.
const ADDER_BUG: &str = "module MOD(input clk, input rst, input [7:0] a, input [7:0] b, output reg [8:0] sum);
  reg [7:0] a_q, b_q;
  always @(posedge clk) begin
    if (rst) begin a_q <= 0; b_q <= 0; sum <= 0; end
    else begin a_q <= a; b_q <= b; sum <= {{1'b0, a_q[7:4]} + {1'b0, b_q[7:4]}, 4'b0} | (a_q[3:0] + b_q[3:0]); end
  end
endmodule
";

/// A counter mod 10 with an enable and a synchronous reset.
const COUNTER: &str =
    "module MOD(input clk, input reset, input en, output reg [3:0] q, output wrap);
  assign wrap = en && q == 4'd9;
  always @(posedge clk)
    if (reset) q <= 4'd0;
    else if (en) q <= (q == 4'd9) ? 4'd0 : q + 4'd1;
endmodule
";

/// The same counter: `>=` where the reference has `==` (they differ only in the states
/// 10-15, which reset never reaches), the enable as a multiplexer, bits named apart.
const COUNTER_GE: &str =
    "module MOD(input clk, input reset, input en, output [3:0] q, output wrap);
  reg q_0_, q_1_, q_2_, q_3_;
  wire [3:0] cur = {q_3_, q_2_, q_1_, q_0_};
  wire [3:0] nxt = (cur >= 4'd9) ? 4'd0 : cur + 4'd1;
  assign q = cur;
  assign wrap = en & (cur >= 4'd9);
  always @(posedge clk) begin
    if (reset) {q_3_, q_2_, q_1_, q_0_} <= 4'b0;
    else {q_3_, q_2_, q_1_, q_0_} <= en ? nxt : cur;
  end
endmodule
";

/// A bug: wraps after 8.
const COUNTER_BUG: &str =
    "module MOD(input clk, input reset, input en, output reg [3:0] q, output wrap);
  assign wrap = en && q == 4'd8;
  always @(posedge clk)
    if (reset) q <= 4'd0;
    else if (en) q <= (q == 4'd8) ? 4'd0 : q + 4'd1;
endmodule
";

/// A detector of the input sequence 1, 0, 1 (overlapping), a state machine with an
/// asynchronous active-low reset; the state register in binary.
const FSM: &str = "module MOD(input clk, input rst_n, input x, output z);
  localparam IDLE = 2'd0, ONE = 2'd1, ONEZERO = 2'd2, HIT = 2'd3;
  reg [1:0] state;
  reg [1:0] next;
  always @* begin
    case (state)
      IDLE: next = x ? ONE : IDLE;
      ONE: next = x ? ONE : ONEZERO;
      ONEZERO: next = x ? HIT : IDLE;
      default: next = x ? ONE : ONEZERO;
    endcase
  end
  always @(posedge clk or negedge rst_n)
    if (!rst_n) state <= IDLE;
    else state <= next;
  assign z = state == HIT;
endmodule
";

/// The same machine with its state bits swapped, one of them stored inverted, and the next
/// state written as equations.
const FSM_RECODED: &str = "module MOD(input clk, input rst_n, input x, output z);
  reg st_a, st_b_n;
  wire s0 = ~st_b_n, s1 = st_a;
  always @(posedge clk or negedge rst_n) begin
    if (!rst_n) begin st_a <= 1'b0; st_b_n <= 1'b1; end
    else begin
      st_a <= (s0 & ~s1 & ~x) | (s1 & ~s0 & x) | (s1 & s0 & ~x);
      st_b_n <= ~x;
    end
  end
  assign z = s1 & s0;
endmodule
";

/// A bug: after a hit the machine starts over instead of overlapping.
const FSM_BUG: &str = "module MOD(input clk, input rst_n, input x, output z);
  reg [1:0] state;
  always @(posedge clk or negedge rst_n)
    if (!rst_n) state <= 2'd0;
    else case (state)
      2'd0: state <= x ? 2'd1 : 2'd0;
      2'd1: state <= x ? 2'd1 : 2'd2;
      2'd2: state <= x ? 2'd3 : 2'd0;
      default: state <= x ? 2'd1 : 2'd0;
    endcase
  assign z = state == 2'd3;
endmodule
";

/// The same machine in one-hot encoding (a register per state).
const FSM_ONEHOT: &str = "module MOD(input clk, input rst_n, input x, output z);
  reg idle, one, onezero, hit;
  always @(posedge clk or negedge rst_n)
    if (!rst_n) begin idle <= 1'b1; one <= 1'b0; onezero <= 1'b0; hit <= 1'b0; end
    else begin
      idle <= ~x & (idle | onezero);
      one <= x & (idle | one | hit);
      onezero <= ~x & (one | hit);
      hit <= x & onezero;
    end
  assign z = hit;
endmodule
";

/// A bug: from a hit, a 0 goes back to idle.
const FSM_ONEHOT_BUG: &str = "module MOD(input clk, input rst_n, input x, output z);
  reg idle, one, onezero, hit;
  always @(posedge clk or negedge rst_n)
    if (!rst_n) begin idle <= 1'b1; one <= 1'b0; onezero <= 1'b0; hit <= 1'b0; end
    else begin
      idle <= ~x & (idle | onezero | hit);
      one <= x & (idle | one | hit);
      onezero <= ~x & one;
      hit <= x & onezero;
    end
  assign z = hit;
endmodule
";

/// Two registers with write enables (a tiny register file, written by index) on the falling
/// clock edge.
const ENABLE: &str = "module MOD(input clk, input rst, input we, input wa, input [3:0] wd, input ra, output [3:0] rd);
  reg [3:0] r0, r1;
  always @(negedge clk or posedge rst)
    if (rst) begin r0 <= 4'd0; r1 <= 4'd0; end
    else if (we) begin
      if (wa) r1 <= wd; else r0 <= wd;
    end
  assign rd = ra ? r1 : r0;
endmodule
";

/// The same register file as one vector written by a variable index; the hold written out.
const ENABLE_VECTOR: &str = "module MOD(input clk, input rst, input we, input wa, input [3:0] wd, input ra, output [3:0] rd);
  reg [7:0] mem;
  integer i;
  always @(negedge clk or posedge rst) begin
    if (rst) mem <= 8'd0;
    else begin
      mem <= mem;
      if (we) for (i = 0; i < 4; i = i + 1) mem[wa * 4 + i] <= wd[i];
    end
  end
  assign rd = mem[ra * 4 +: 4];
endmodule
";

/// A bug: the write enable is ignored for register 1.
const ENABLE_BUG: &str = "module MOD(input clk, input rst, input we, input wa, input [3:0] wd, input ra, output [3:0] rd);
  reg [3:0] r0, r1;
  always @(negedge clk or posedge rst)
    if (rst) begin r0 <= 4'd0; r1 <= 4'd0; end
    else begin
      if (we && !wa) r0 <= wd;
      if (wa) r1 <= wd;
    end
  assign rd = ra ? r1 : r0;
endmodule
";

/// A registered sum whose every register has a synchronous reset written as a leading `if`.
const RESET_IF: &str =
    "module MOD(input clk, input rst, input [3:0] a, input [3:0] b, output reg [4:0] s);
  reg [3:0] ra, rb;
  always @(posedge clk)
    if (rst) begin ra <= 4'd0; rb <= 4'd0; s <= 5'd0; end
    else begin ra <= a; rb <= b; s <= ra + rb; end
endmodule
";

/// The same, the sum's reset written into the logic (`rst ? 0 : ...`): after a reset edge it
/// is 0 in a simulator, so it must not start at a free value (it did: a false difference).
const RESET_TERNARY: &str =
    "module MOD(input clk, input rst, input [3:0] a, input [3:0] b, output reg [4:0] s);
  reg [3:0] a_q, b_q;
  always @(posedge clk)
    if (rst) begin a_q <= 0; b_q <= 0; end else begin a_q <= a; b_q <= b; end
  always @(posedge clk) s <= rst ? 5'd0 : {1'b0, a_q} + {1'b0, b_q};
endmodule
";

/// A bug: the sum's reset in the logic gives 1, not 0.
const RESET_TERNARY_BUG: &str =
    "module MOD(input clk, input rst, input [3:0] a, input [3:0] b, output reg [4:0] s);
  reg [3:0] a_q, b_q;
  always @(posedge clk)
    if (rst) begin a_q <= 0; b_q <= 0; end else begin a_q <= a; b_q <= b; end
  always @(posedge clk) s <= rst ? 5'd1 : {1'b0, a_q} + {1'b0, b_q};
endmodule
";

fn pairs() -> Vec<Pair> {
    let (equivalent, different) = ("equivalent", "different");
    let p = Pair::new;
    vec![
        p(
            "selector, inverted",
            SELECTOR,
            SELECTOR_INVERTED,
            equivalent,
        ),
        p("selector, late select", SELECTOR, SELECTOR_LATE, different),
        p("pipelined adder, ripple", ADDER, ADDER_RIPPLE, equivalent),
        p(
            "pipelined adder, carry dropped",
            ADDER,
            ADDER_BUG,
            different,
        ),
        // The registers do not pair inductively (the states 10-15 break it): k-induction.
        p(
            "counter, >= in unreachable states",
            COUNTER,
            COUNTER_GE,
            equivalent,
        ),
        p("counter, wraps after 8", COUNTER, COUNTER_BUG, different),
        p("state machine, recoded", FSM, FSM_RECODED, equivalent),
        p("state machine, no overlap", FSM, FSM_BUG, different),
        // Different state encodings: no register pairs; k-induction.
        p("state machine, one-hot", FSM, FSM_ONEHOT, equivalent),
        p(
            "state machine, one-hot, no overlap",
            FSM,
            FSM_ONEHOT_BUG,
            different,
        ),
        p(
            "enables, vector by index",
            ENABLE,
            ENABLE_VECTOR,
            equivalent,
        ),
        p("enables, enable ignored", ENABLE, ENABLE_BUG, different),
        p(
            "synchronous reset in the logic",
            RESET_IF,
            RESET_TERNARY,
            equivalent,
        ),
        p(
            "synchronous reset in the logic, wrong value",
            RESET_IF,
            RESET_TERNARY_BUG,
            different,
        ),
    ]
}

#[test]
fn clocked_rtl_pairs_are_proved_or_different_as_icarus_verilog_runs_them() {
    let icarus = common::iverilog_available();
    let all = pairs();
    for p in &all {
        check(p, icarus);
    }
    if icarus {
        eprintln!("Icarus Verilog ran {} clocked pairs", all.len());
    }
}

/// A 5-bit counter whose rewrite differs first when the count reaches 25 (cycle 25 from
/// reset): with at most 20 cycles unrolled, k-induction (whose base case is those cycles) must
/// not prove it; with 30 the trace is found. Off, k-induction leaves the counter pair above
/// undecided.
#[test]
fn k_induction_never_proves_a_difference_deeper_than_its_base_case() {
    let counter = |bad: u32| {
        format!(
            "module MOD(input clk, input reset, output [4:0] q, output hi);
  reg [4:0] c;
  assign q = c;
  assign hi = c == 5'd{bad};
  always @(posedge clk) if (reset) c <= 0; else c <= c + 5'd1;
endmodule
"
        )
    };
    let (r_src, c_src) = (counter(31), counter(25));
    let r = read(&r_src, "ref_m");
    let c = read(&c_src, "cand_m");
    for cycles in [4, 10, 20] {
        let o = SeqOptions {
            cycles,
            k_induction: Some(cycles),
            ..SeqOptions::default()
        };
        let rep = seq::check(&r, &c, &o).unwrap();
        assert_eq!(rep.verdict, "undecided", "{cycles} cycles: {rep:#?}");
        assert_eq!(rep.k_induction.as_ref().and_then(|k| k.proved_at), None);
    }
    let o = SeqOptions {
        cycles: 30,
        ..SeqOptions::default()
    };
    let rep = seq::check(&r, &c, &o).unwrap();
    assert_eq!(rep.verdict, "different");
    let fd = rep
        .trace
        .as_ref()
        .unwrap()
        .first_difference
        .as_ref()
        .unwrap();
    assert_eq!(fd.cycle, 25);
    let (r, c) = (read(COUNTER, "ref_m"), read(COUNTER_GE, "cand_m"));
    let o = SeqOptions {
        k_induction: Some(0),
        ..SeqOptions::default()
    };
    let rep = seq::check(&r, &c, &o).unwrap();
    assert_eq!(rep.verdict, "undecided");
    assert!(rep.k_induction.is_none());
}

/// `cone` on a clocked design: the pipelined adder's inputs reach `sum` after two clock edges,
/// the reset after one (it clears the second stage), and a register read by nothing is dead.
#[test]
fn cone_follows_inputs_through_registers() {
    let dir = tempfile::tempdir().unwrap();
    let f = dir.path().join("add.v");
    let src = ADDER.replace("MOD", "add").replace(
        "  always @(posedge clk) begin",
        "  reg spare;\n  always @(posedge clk) spare <= a[0];\n  always @(posedge clk) begin",
    );
    std::fs::write(&f, src).unwrap();
    let out = std::process::Command::new(env!("CARGO_BIN_EXE_equicone"))
        .args(["cone", "--json"])
        .arg(&f)
        .output()
        .unwrap();
    let v: serde_json::Value = serde_json::from_slice(&out.stdout).unwrap();
    let across = &v["across_cycles"];
    let sum0 = &across["outputs"][0];
    assert_eq!(sum0["output"], "sum[0]");
    assert_eq!(sum0["inputs"]["a[0]"], 2);
    assert_eq!(sum0["inputs"]["b[0]"], 2);
    assert_eq!(sum0["inputs"]["rst"], 1);
    assert!(sum0["inputs"].get("a[1]").is_none(), "{sum0}");
    assert_eq!(across["dead_registers"], serde_json::json!(["spare"]));
}
