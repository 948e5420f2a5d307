//! The readers' fuzz harness, shared by the test suite's smoke run (`tests/fuzz.rs`) and the
//! long campaigns of `examples/fuzz_readers.rs` (`scripts/fuzz`): grammar-aware generators for
//! each reader (bench, Verilog, `--expect`, cost model, `--assume`), byte-level mutation of
//! generated and seed inputs, and one call that runs a reader on an input and judges the
//! outcome (a panic, a hang or an error without a position is a failure).
//!
//! Input number `i` of a campaign with seed `s` is a pure function of `(s, i)`, so any failure
//! is replayed from those two numbers alone.

#![allow(dead_code)]

use equicone::diag::InputError;
use equicone::rng::{SplitMix64, GOLDEN};
use equicone::Design;
use std::sync::atomic::{AtomicBool, Ordering};
use std::sync::{Arc, Mutex, Once};
use std::time::{Duration, Instant};

/// The crate's SplitMix64, with the choices the fuzz generators make.
pub struct Rng(SplitMix64);

impl Rng {
    /// The generator for input `index` of the campaign with `seed`.
    pub fn for_input(seed: u64, index: u64) -> Rng {
        let a = SplitMix64::from_state(seed ^ GOLDEN).next_u64();
        Rng(SplitMix64::from_state(
            a ^ index.wrapping_mul(0xd1b5_4a32_d192_ed03),
        ))
    }

    pub fn next(&mut self) -> u64 {
        self.0.next_u64()
    }

    /// A number in `0..n` (`n > 0`).
    pub fn below(&mut self, n: usize) -> usize {
        (self.next() % n as u64) as usize
    }

    /// True with probability `1/n`.
    pub fn one_in(&mut self, n: usize) -> bool {
        self.below(n) == 0
    }

    pub fn pick<'a, T: ?Sized>(&mut self, items: &[&'a T]) -> &'a T {
        items[self.below(items.len())]
    }
}

/// The readers under test.
#[derive(Copy, Clone, Debug, PartialEq, Eq)]
pub enum Reader {
    Bench,
    Verilog,
    Expect,
    Cost,
    Assume,
}

impl Reader {
    pub const ALL: [Reader; 5] = [
        Reader::Bench,
        Reader::Verilog,
        Reader::Expect,
        Reader::Cost,
        Reader::Assume,
    ];

    pub fn name(self) -> &'static str {
        match self {
            Reader::Bench => "bench",
            Reader::Verilog => "verilog",
            Reader::Expect => "expect",
            Reader::Cost => "cost",
            Reader::Assume => "assume",
        }
    }

    pub fn from_name(s: &str) -> Option<Reader> {
        Reader::ALL.iter().copied().find(|r| r.name() == s)
    }
}

/// Numbers chosen to hit edges: zero, one, powers of two, word limits, signs.
const NUMBERS: &[&str] = &[
    "0",
    "1",
    "2",
    "3",
    "7",
    "8",
    "31",
    "32",
    "63",
    "64",
    "65",
    "255",
    "1000",
    "65536",
    "2147483647",
    "2147483648",
    "4294967295",
    "4294967296",
    "9223372036854775807",
    "9223372036854775808",
    "18446744073709551616",
    "99999999999999999999999",
    "-1",
    "-2147483648",
    "-9223372036854775808",
    "1e400",
    "0.5",
    "-0.0",
];

/// Fragments worth splicing into any text: delimiters, keywords, odd characters.
const TOKENS: &[&str] = &[
    "(",
    ")",
    "[",
    "]",
    "{",
    "}",
    ",",
    ";",
    ":",
    "=",
    "#",
    "//",
    "/*",
    "*/",
    "\"",
    "'",
    "\\",
    "`",
    "\n",
    "\r\n",
    "\t",
    " ",
    "\u{0}",
    "\u{feff}",
    "é",
    "𝔵",
    "..",
    "->",
    "?",
    "@",
    "$",
    "'b",
    "'hx",
    "'sd",
    "'z",
    "*",
    "+:",
    "-:",
    "<<<",
    ">>>",
    "**",
    "===",
    "endmodule",
    "module",
    "begin",
    "end",
    "INPUT(",
    "OUTPUT(",
    "AND(",
    "DFF(",
];

/// A simple name, sometimes an odd one.
fn ident(r: &mut Rng, pool: &[&str]) -> String {
    match r.below(20) {
        0 => format!("n{}", r.next() % 1000),
        1 => r
            .pick(&["\\esc[0] ", "_", "a$b", "wire", "x", "1a", "a.b", "é"])
            .to_string(),
        _ => r.pick(pool).to_string(),
    }
}

fn number(r: &mut Rng) -> String {
    if r.one_in(3) {
        r.pick(NUMBERS).to_string()
    } else {
        (r.next() % 20).to_string()
    }
}

// ---------------------------------------------------------------- bench

const BENCH_NAMES: &[&str] = &[
    "a", "b", "c", "d[0]", "d[1]", "d[2]", "s", "y", "z", "w", "v", "t1", "t2", "G1gat",
];
const BENCH_GATES: &[&str] = &[
    "AND", "NAND", "OR", "NOR", "XOR", "XNOR", "NOT", "BUF", "BUFF", "and", "Nand", "DFF", "MAJ",
    "",
];

/// A well-formed bench netlist: inputs, gates over earlier signals, some outputs.
pub fn gen_bench_valid(r: &mut Rng) -> String {
    let mut s = String::new();
    let mut sigs: Vec<String> = Vec::new();
    for i in 0..1 + r.below(6) {
        let n = if r.one_in(2) {
            format!("d[{i}]")
        } else {
            format!("i{i}")
        };
        s.push_str(&format!("INPUT({n})\n"));
        sigs.push(n);
    }
    let gates = 1 + r.below(30);
    let mut body = String::new();
    for g in 0..gates {
        let kind = r.pick(&[
            "AND", "NAND", "OR", "NOR", "XOR", "XNOR", "NOT", "BUFF", "buf",
        ]);
        let n = if matches!(kind, "NOT" | "BUFF" | "buf") {
            1
        } else {
            1 + r.below(4)
        };
        let args: Vec<String> = (0..n).map(|_| sigs[r.below(sigs.len())].clone()).collect();
        let name = format!("g{g}");
        body.push_str(&format!("{name} = {kind}({})\n", args.join(", ")));
        sigs.push(name);
    }
    for _ in 0..1 + r.below(4) {
        s.push_str(&format!("OUTPUT({})\n", sigs[r.below(sigs.len())]));
    }
    s.push_str(&body);
    s
}

/// A bench file: declarations and gates over a small name pool, so that undefined, twice
/// defined and cyclic signals come up often, with occasional syntax damage.
pub fn gen_bench(r: &mut Rng) -> String {
    let mut s = String::new();
    let lines = 1 + r.below(24);
    for _ in 0..lines {
        match r.below(10) {
            0 => s.push_str(&format!("# {}\n", ident(r, BENCH_NAMES))),
            1 | 2 => s.push_str(&format!("INPUT({})\n", ident(r, BENCH_NAMES))),
            3 => s.push_str(&format!("OUTPUT({})\n", ident(r, BENCH_NAMES))),
            4 => s.push('\n'),
            _ => {
                let n = match r.below(8) {
                    0 => 0,
                    1 => 1 + r.below(200),
                    _ => 1 + r.below(4),
                };
                let args: Vec<String> = (0..n).map(|_| ident(r, BENCH_NAMES)).collect();
                let sep = if r.one_in(10) { " " } else { ", " };
                s.push_str(&format!(
                    "{} = {}({})\n",
                    ident(r, BENCH_NAMES),
                    r.pick(BENCH_GATES),
                    args.join(sep)
                ));
            }
        }
        if r.one_in(15) {
            s.push_str(r.pick(TOKENS));
        }
    }
    if r.one_in(20) {
        // A long chain: depth without recursion.
        let n = 1 + r.below(5000);
        s.push_str("INPUT(q0)\n");
        for i in 1..=n {
            s.push_str(&format!("q{i} = NOT(q{})\n", i - 1));
        }
        s.push_str(&format!("OUTPUT(q{n})\n"));
    }
    s
}

// ---------------------------------------------------------------- Verilog

const V_NAMES: &[&str] = &["a", "b", "c", "s", "y", "z", "w", "d", "k", "N", "i", "sub"];
const V_BINOPS: &[&str] = &[
    "&", "|", "^", "~^", "^~", "&&", "||", "==", "!=", "<", "<=", ">", ">=", "+", "-", "*", "<<",
    ">>", "<<<", ">>>", "/", "%", "**", "===",
];
const V_UNOPS: &[&str] = &["~", "!", "-", "+", "&", "|", "^", "~&", "~|", "~^"];

fn v_literal(r: &mut Rng) -> String {
    let digits = |r: &mut Rng, base: char| -> String {
        let set: &[u8] = match base {
            'b' => b"01xz?_",
            'o' => b"01234567xz_",
            'd' => b"0123456789_",
            _ => b"0123456789abcdefABCDEFxXzZ_",
        };
        let max = if r.one_in(30) { 200 } else { 8 };
        let n = 1 + r.below(max);
        (0..n).map(|_| set[r.below(set.len())] as char).collect()
    };
    match r.below(6) {
        0 => number(r),
        1 => {
            let base = *r.pick(&[&'b', &'o', &'d', &'h']);
            format!("'{base}{}", digits(r, base))
        }
        _ => {
            let base = *r.pick(&[&'b', &'o', &'d', &'h']);
            let signed = if r.one_in(4) { "s" } else { "" };
            format!("{}'{signed}{base}{}", number(r), digits(r, base))
        }
    }
}

fn v_range(r: &mut Rng) -> String {
    match r.below(6) {
        0 => String::new(),
        1 => format!("[{}:{}] ", number(r), number(r)),
        2 => "[N-1:0] ".into(),
        _ => format!("[{}:0] ", r.below(9)),
    }
}

/// An expression of nesting at most `depth` (the generator's own recursion is bounded).
pub fn v_expr(r: &mut Rng, depth: u32) -> String {
    if depth == 0 || r.one_in(4) {
        return match r.below(3) {
            0 => v_literal(r),
            _ => ident(r, V_NAMES),
        };
    }
    let d = depth - 1;
    match r.below(14) {
        0 | 1 => format!("({} {} {})", v_expr(r, d), r.pick(V_BINOPS), v_expr(r, d)),
        2 => format!("{}{}", r.pick(V_UNOPS), v_expr(r, d)),
        3 => format!("({} ? {} : {})", v_expr(r, d), v_expr(r, d), v_expr(r, d)),
        4 => format!("{{{}, {}}}", v_expr(r, d), v_expr(r, d)),
        5 => format!("{{{}{{{}}}}}", v_literal(r), v_expr(r, d)),
        6 => format!("{}[{}]", ident(r, V_NAMES), v_expr(r, d)),
        7 => format!("{}[{}:{}]", ident(r, V_NAMES), number(r), number(r)),
        8 => format!(
            "{}[{} {} {}]",
            ident(r, V_NAMES),
            v_expr(r, d),
            r.pick(&["+:", "-:"]),
            number(r)
        ),
        9 => format!(
            "{}({})",
            r.pick(&["$signed", "$unsigned", "$clog2", "f", "$display"]),
            v_expr(r, d)
        ),
        10 => {
            // A long flat chain (read with loops) or deep nesting (limited by the parser).
            let n = 1 + r.below(3000);
            if r.one_in(2) {
                let mut s = ident(r, V_NAMES);
                for _ in 0..n {
                    s.push_str(" ^ ");
                    s.push_str(&ident(r, V_NAMES));
                }
                s
            } else {
                format!("{}a{}", "(".repeat(n), ")".repeat(n))
            }
        }
        _ => format!("{} {} {}", v_expr(r, d), r.pick(V_BINOPS), v_expr(r, d)),
    }
}

/// An expression inside the subset over the ports of [`gen_verilog_valid`]'s module.
fn v_tame(r: &mut Rng, depth: u32) -> String {
    const OPS: &[&str] = &[
        "&", "|", "^", "~^", "&&", "||", "==", "!=", "<", "<=", ">", ">=", "+", "-", "*", "<<",
        ">>", "<<<", ">>>",
    ];
    if depth == 0 || r.one_in(4) {
        return match r.below(7) {
            0 => format!(
                "{}'{}{}",
                1 + r.below(8),
                r.pick(&["b", "d", "h", "sd"]),
                r.below(2)
            ),
            1 => format!("a[{}]", r.below(6)),
            2 => format!("b[{}:{}]", r.below(3), r.below(2)),
            3 => "1'bx".into(),
            _ => r.pick(&["a", "b", "s", "w"]).to_string(),
        };
    }
    let d = depth - 1;
    match r.below(9) {
        0..=2 => format!("({} {} {})", v_tame(r, d), r.pick(OPS), v_tame(r, d)),
        3 => format!("{}({})", r.pick(V_UNOPS), v_tame(r, d)),
        4 => format!("({} ? {} : {})", v_tame(r, d), v_tame(r, d), v_tame(r, d)),
        5 => format!("{{{}, {}}}", v_tame(r, d), v_tame(r, d)),
        6 => format!("{{{}{{{}}}}}", 1 + r.below(3), v_tame(r, d)),
        7 => format!("a[s {} {}]", r.pick(&["+:", "-:"]), 1 + r.below(3)),
        _ => format!("{}({})", r.pick(&["$signed", "$unsigned"]), v_tame(r, d)),
    }
}

fn v_stmt(r: &mut Rng, depth: u32) -> String {
    let d = depth.saturating_sub(1);
    match if depth == 0 { 0 } else { r.below(8) } {
        0 | 1 => format!("{} = {};", v_lhs(r), v_expr(r, 3)),
        2 => format!(
            "if ({}) {} else {}",
            v_expr(r, 2),
            v_stmt(r, d),
            v_stmt(r, d)
        ),
        3 => format!("begin {} {} end", v_stmt(r, d), v_stmt(r, d)),
        4 => format!(
            "{} ({}) {}: {} default: {} endcase",
            r.pick(&["case", "casez", "casex"]),
            v_expr(r, 1),
            v_literal(r),
            v_stmt(r, d),
            v_stmt(r, d)
        ),
        5 => format!(
            "for (k = {}; k < {}; k = k + {}) {}",
            number(r),
            number(r),
            number(r),
            v_stmt(r, d)
        ),
        6 => format!("{} <= {};", v_lhs(r), v_expr(r, 2)),
        _ => format!("if ({}) {}", v_expr(r, 2), v_stmt(r, d)),
    }
}

fn v_lhs(r: &mut Rng) -> String {
    match r.below(5) {
        0 => format!("{}[{}]", ident(r, V_NAMES), v_expr(r, 1)),
        1 => format!("{{{}, {}}}", ident(r, V_NAMES), ident(r, V_NAMES)),
        2 => format!("{}[{}:{}]", ident(r, V_NAMES), number(r), number(r)),
        _ => ident(r, V_NAMES),
    }
}

fn v_item(r: &mut Rng) -> String {
    match r.below(16) {
        0 | 1 => format!(
            "{} {}{};",
            r.pick(&["wire", "reg", "wire signed", "integer", "genvar", "tri"]),
            v_range(r),
            ident(r, V_NAMES)
        ),
        2..=4 => format!("assign {} = {};", v_lhs(r), v_expr(r, 4)),
        5 | 6 => format!(
            "always {} {}",
            r.pick(&["@*", "@(*)", "@(posedge a)", "@(a or b)", ""]),
            v_stmt(r, 3)
        ),
        7 => format!(
            "{} {} = {};",
            r.pick(&["parameter", "localparam"]),
            ident(r, V_NAMES),
            v_expr(r, 2)
        ),
        8 => format!(
            "{} {}{}({});",
            ident(r, V_NAMES),
            if r.one_in(2) {
                format!("#(.N({})) ", v_expr(r, 1))
            } else {
                String::new()
            },
            ident(r, V_NAMES),
            (0..r.below(4))
                .map(|_| {
                    if r.one_in(2) {
                        format!(".{}({})", ident(r, V_NAMES), v_expr(r, 1))
                    } else {
                        v_expr(r, 1)
                    }
                })
                .collect::<Vec<_>>()
                .join(", ")
        ),
        9 => format!(
            "{} g{}({});",
            r.pick(&["and", "nand", "or", "nor", "xor", "xnor", "not", "buf", "bufif0"]),
            r.below(9),
            (0..r.below(5))
                .map(|_| v_expr(r, 1))
                .collect::<Vec<_>>()
                .join(", ")
        ),
        10 => format!(
            "{}for (i = {}; i < {}; i = i + 1) begin : blk {} end{}",
            if r.one_in(2) { "generate " } else { "" },
            number(r),
            number(r),
            v_item(r),
            if r.one_in(2) { " endgenerate" } else { "" }
        ),
        11 => format!("if ({}) begin {} end", v_expr(r, 1), v_item(r)),
        12 => r
            .pick(&[
                "initial y = 0;",
                "function f; input a; f = a; endfunction",
                "task t; endtask",
                "reg [3:0] mem [0:3];",
                "specify endspecify",
                "`define X 1",
                "`include \"other.v\"",
            ])
            .to_string(),
        _ => format!(
            "{} {}{};",
            r.pick(&["input", "output", "inout"]),
            v_range(r),
            ident(r, V_NAMES)
        ),
    }
}

fn v_module(r: &mut Rng, name: &str) -> String {
    let ports: Vec<String> = (0..r.below(5))
        .map(|_| {
            if r.one_in(3) {
                ident(r, V_NAMES)
            } else {
                format!(
                    "{} {}{}{}",
                    r.pick(&["input", "output", "output reg", "inout", "input signed"]),
                    if r.one_in(3) { "wire " } else { "" },
                    v_range(r),
                    ident(r, V_NAMES)
                )
            }
        })
        .collect();
    let params = if r.one_in(4) {
        format!("#(parameter N = {}) ", number(r))
    } else {
        String::new()
    };
    let items: Vec<String> = (0..r.below(8)).map(|_| v_item(r)).collect();
    format!(
        "module {name} {params}({});\n  {}\n{}\n",
        ports.join(", "),
        items.join("\n  "),
        if r.one_in(20) { "" } else { "endmodule" }
    )
}

/// A module inside the subset: declared ports and nets, assignments of expressions over them,
/// an `always @*` block with a default, and sometimes an instance of a second module.
pub fn gen_verilog_valid(r: &mut Rng) -> String {
    const NAMES: &[&str] = &["a", "b", "s", "w"];
    let mut e = || v_tame(r, 3);
    let e1 = e();
    let e2 = e();
    let e3 = e();
    let e4 = e();
    let sub = r.one_in(3);
    let mut s = String::new();
    if sub {
        s.push_str("module sub #(parameter N = 2) (input [N-1:0] p, output q);\n  assign q = ^p;\nendmodule\n");
    }
    s.push_str(&format!(
        "module m(input [3:0] a, input signed [{}:0] b, input [1:0] s, output [3:0] y, output reg z);\n",
        r.below(6)
    ));
    s.push_str(&format!(
        "  wire [{}:0] w;\n  assign w = {e1};\n  assign y = {e2};\n",
        r.below(8)
    ));
    s.push_str(&format!(
        "  always @* begin\n    z = 1'b0;\n    if ({e3}) z = {e4};\n  end\n"
    ));
    if sub {
        s.push_str(&format!(
            "  wire t;\n  sub #(.N({})) u (.p({}), .q(t));\n",
            1 + r.below(4),
            r.pick(NAMES)
        ));
    }
    s.push_str("endmodule\n");
    s
}

/// One or two modules (the second instantiable as `sub`), in the reader's subset and around it.
pub fn gen_verilog(r: &mut Rng) -> String {
    let mut s = String::new();
    if r.one_in(3) {
        s.push_str(&v_module(r, "sub"));
    }
    let name = ident(r, &["m", "top", "sub"]);
    s.push_str(&v_module(r, &name));
    if r.one_in(10) {
        s.push_str(r.pick(TOKENS));
    }
    s
}

// ---------------------------------------------------------------- assumptions

/// The design every `--expect` and `--assume` input is read against: ports `s[1:0]`,
/// `d[3:0]` and `m` in, `y`, `z[1:0]` out.
pub const CONTEXT_BENCH: &str = "INPUT(s[0])\nINPUT(s[1])\nINPUT(d[0])\nINPUT(d[1])\nINPUT(d[2])\nINPUT(d[3])\nINPUT(m)\nOUTPUT(y)\nOUTPUT(z[0])\nOUTPUT(z[1])\nt0 = AND(d[0], s[0])\nt1 = AND(d[1], s[1])\ny = OR(t0, t1)\nz[0] = XOR(d[2], m)\nz[1] = NOT(d[3])\n";

const A_NAMES: &[&str] = &["s", "d", "m", "s[0]", "d[3]", "y", "q"];

/// An assumption: a Verilog expression over the context design's input ports.
pub fn gen_assume(r: &mut Rng) -> String {
    let mut e = v_expr(r, 4);
    for (from, to) in [("a", "s"), ("b", "d"), ("c", "m")] {
        if r.one_in(2) {
            e = e.replace(from, to);
        }
    }
    if r.one_in(8) {
        e = format!("{} {} {}", r.pick(A_NAMES), r.pick(V_BINOPS), number(r));
    }
    e
}

// ---------------------------------------------------------------- --expect

const E_OUT: &[&str] = &[
    "y", "z", "z[0]", "z[1]", "z[0..1]", "z[1:0]", "*", "w", "z[2]",
];
const E_IN: &[&str] = &[
    "s", "d", "m", "s[0..1]", "d[3:0]", "d[0]", "-", "*", "q", "d[4]", "d[", "d[]", "d[a..b]",
];

fn e_item(r: &mut Rng, pool: &[&str]) -> String {
    match r.below(12) {
        0 => format!("d[{}..{}]", number(r), number(r)),
        1 => format!("{}[{}]", r.pick(pool), number(r)),
        _ => r.pick(pool).to_string(),
    }
}

/// An expectation in the text form (`OUTPUTS: INPUTS`) or the JSON form.
pub fn gen_expect(r: &mut Rng) -> String {
    let n = r.below(6);
    if r.one_in(3) {
        let entries: Vec<String> = (0..n)
            .map(|_| {
                let ins: Vec<String> = (0..r.below(4))
                    .map(|_| format!("\"{}\"", e_item(r, E_IN)))
                    .collect();
                match r.below(8) {
                    0 => format!("\"{}\": {}", e_item(r, E_OUT), number(r)),
                    1 => format!("\"{}\": \"{}\"", e_item(r, E_OUT), e_item(r, E_IN)),
                    _ => format!("\"{}\": [{}]", e_item(r, E_OUT), ins.join(", ")),
                }
            })
            .collect();
        return format!("{{{}}}", entries.join(", "));
    }
    let mut s = String::new();
    for _ in 0..n {
        let outs: Vec<String> = (0..r.below(3)).map(|_| e_item(r, E_OUT)).collect();
        let ins: Vec<String> = (0..r.below(4)).map(|_| e_item(r, E_IN)).collect();
        let sep = if r.one_in(10) { " " } else { ": " };
        s.push_str(&format!("{}{sep}{}", outs.join(", "), ins.join(", ")));
        if r.one_in(5) {
            s.push_str(" # note");
        }
        s.push('\n');
    }
    s
}

// ---------------------------------------------------------------- cost model

const C_KEYS: &[&str] = &["name", "default", "gates", "bound_fanin", "extra"];
const C_GATES: &[&str] = &[
    "and", "nand", "or", "nor", "xor", "xnor", "not", "buf", "mux2", "AND", "dff",
];

fn c_value(r: &mut Rng, depth: u32) -> String {
    match if depth == 0 { r.below(4) } else { r.below(7) } {
        0 => number(r),
        1 => format!("\"{}\"", ident(r, C_GATES)),
        2 => r.pick(&["true", "null", "[]", "{}"]).to_string(),
        3 => format!("{}.{}", r.below(10), r.below(100)),
        4 => c_cost(r, depth - 1),
        5 => format!(
            "{{\"{}\": {}}}",
            r.pick(&["1", "2", "3", "0", "x", "-1", "99999999999"]),
            c_cost(r, depth - 1)
        ),
        _ => format!("[{}]", c_value(r, depth - 1)),
    }
}

fn c_cost(r: &mut Rng, depth: u32) -> String {
    let mut parts = Vec::new();
    for _ in 0..r.below(4) {
        let key = r.pick(&["cost", "delay", "per_extra_input", "fanin", "area"]);
        let v = match key {
            "cost" | "delay" if !r.one_in(5) => number(r),
            _ => c_value(r, depth),
        };
        parts.push(format!("\"{key}\": {v}"));
    }
    format!("{{{}}}", parts.join(", "))
}

/// A cost model: a JSON object with the model's keys and odd values.
pub fn gen_cost(r: &mut Rng) -> String {
    let mut parts = Vec::new();
    for _ in 0..r.below(5) {
        let key = r.pick(C_KEYS);
        let v = match key {
            "gates" if !r.one_in(6) => {
                let g: Vec<String> = (0..r.below(5))
                    .map(|_| format!("\"{}\": {}", r.pick(C_GATES), c_cost(r, 2)))
                    .collect();
                format!("{{{}}}", g.join(",\n  "))
            }
            "default" => c_cost(r, 2),
            _ => c_value(r, 2),
        };
        parts.push(format!("\"{key}\": {v}"));
    }
    let s = format!("{{\n  {}\n}}", parts.join(",\n  "));
    if r.one_in(20) {
        format!(
            "{}{}{}",
            "[".repeat(r.below(300)),
            s,
            "]".repeat(r.below(300))
        )
    } else {
        s
    }
}

// ---------------------------------------------------------------- mutation

/// Byte-level damage: flips, insertions of tokens or random bytes, deletions, duplicated or
/// swapped ranges, truncation. One to eight edits.
pub fn mutate(r: &mut Rng, mut b: Vec<u8>) -> Vec<u8> {
    for _ in 0..1 + r.below(8) {
        let len = b.len();
        let at = if len == 0 { 0 } else { r.below(len + 1) };
        match r.below(8) {
            0 if len > 0 => {
                let i = r.below(len);
                b[i] ^= 1 << r.below(8);
            }
            1 if len > 0 => {
                let i = r.below(len);
                b[i] = r.next() as u8;
            }
            2 => {
                let t = r.pick(TOKENS).as_bytes().to_vec();
                b.splice(at..at, t);
            }
            3 if len > 0 => {
                let end = (at + 1 + r.below(16)).min(len);
                b.drain(at.min(len - 1)..end);
            }
            4 if len > 0 => {
                let from = r.below(len);
                let end = (from + 1 + r.below(64)).min(len);
                let piece = b[from..end].to_vec();
                b.splice(at..at, piece);
            }
            5 => b.truncate(at),
            6 => {
                let n = r.pick(NUMBERS).as_bytes().to_vec();
                b.splice(at..at, n);
            }
            _ => {
                let x = r.next() as u8;
                b.insert(at, x);
            }
        }
    }
    b
}

// ---------------------------------------------------------------- running

/// What one input did to a reader.
#[derive(Debug)]
pub enum Outcome {
    /// Read without error.
    Accepted,
    /// Rejected with diagnostics, every one with a message and a position.
    Rejected,
}

/// A reader misbehaving on an input.
#[derive(Debug)]
pub struct Failure {
    pub what: String,
}

static PANICKED: AtomicBool = AtomicBool::new(false);
static PANIC_MSG: Mutex<String> = Mutex::new(String::new());
static HOOK: Once = Once::new();

/// Record panics on any thread (the Verilog reader runs on its own thread and turns a panic
/// into an error, so catching the unwind here alone would miss them).
pub fn install_panic_hook() {
    HOOK.call_once(|| {
        std::panic::set_hook(Box::new(|info| {
            PANICKED.store(true, Ordering::SeqCst);
            if let Ok(mut m) = PANIC_MSG.lock() {
                *m = info.to_string();
            }
        }));
    });
}

/// The design `--expect` and `--assume` inputs are read against.
pub fn context_design() -> Design {
    equicone::front::bench::read_bench(&Arc::from("ctx.bench"), CONTEXT_BENCH).expect("context")
}

/// Generate input `index` of campaign `seed` for `reader`: a grammar-aware text, a mutation
/// of one, or a mutation of a seed file from `seeds`.
pub fn input(reader: Reader, seed: u64, index: u64, seeds: &[Vec<u8>]) -> Vec<u8> {
    let mut r = Rng::for_input(seed, index);
    let mode = r.below(10);
    let base = if mode < 2 && !seeds.is_empty() {
        seeds[r.below(seeds.len())].clone()
    } else {
        let valid = r.one_in(2);
        match reader {
            Reader::Bench if valid => gen_bench_valid(&mut r),
            Reader::Bench => gen_bench(&mut r),
            Reader::Verilog if valid => gen_verilog_valid(&mut r),
            Reader::Verilog => gen_verilog(&mut r),
            Reader::Expect => gen_expect(&mut r),
            Reader::Cost => gen_cost(&mut r),
            Reader::Assume => gen_assume(&mut r),
        }
        .into_bytes()
    };
    if mode < 6 {
        mutate(&mut r, base)
    } else {
        base
    }
}

fn judge(name: &str, res: Result<(), InputError>) -> Result<Outcome, Failure> {
    match res {
        Ok(()) => Ok(Outcome::Accepted),
        Err(e) => {
            if e.diagnostics.is_empty() {
                return Err(Failure {
                    what: format!("{name}: an error without a diagnostic"),
                });
            }
            for d in &e.diagnostics {
                if d.message.trim().is_empty() {
                    return Err(Failure {
                        what: format!("{name}: an empty message"),
                    });
                }
                // Only the unsatisfiable-assumption error concerns no one place.
                let placeless_ok = d.message.starts_with("no input vector satisfies");
                if (d.pos.is_none() && !placeless_ok) || d.message.contains("internal error") {
                    return Err(Failure {
                        what: format!("{name}: diagnostic without a position or internal: {d}"),
                    });
                }
            }
            Ok(Outcome::Rejected)
        }
    }
}

/// Run `reader` on `bytes` (decoded as a file would be) and judge it: a panic on any thread,
/// a run longer than `slow`, or an error without a position is a failure.
pub fn run(reader: Reader, bytes: &[u8], ctx: &Design, slow: Duration) -> Result<Outcome, Failure> {
    install_panic_hook();
    PANICKED.store(false, Ordering::SeqCst);
    let start = Instant::now();
    let caught = std::panic::catch_unwind(std::panic::AssertUnwindSafe(|| {
        run_inner(reader, bytes, ctx)
    }));
    let took = start.elapsed();
    if PANICKED.load(Ordering::SeqCst) || caught.is_err() {
        let msg = PANIC_MSG.lock().map(|m| m.clone()).unwrap_or_default();
        return Err(Failure {
            what: format!("panic: {msg}"),
        });
    }
    if took > slow {
        return Err(Failure {
            what: format!("slow: {:.3} s", took.as_secs_f64()),
        });
    }
    caught.unwrap_or_else(|_| unreachable!())
}

fn run_inner(reader: Reader, bytes: &[u8], ctx: &Design) -> Result<Outcome, Failure> {
    let file = match reader {
        Reader::Bench => "fuzz.bench",
        Reader::Verilog => "fuzz.v",
        Reader::Expect => "fuzz.expect",
        Reader::Cost => "fuzz.json",
        Reader::Assume => "--assume",
    };
    let text = match equicone::front::decode_text(file, bytes.to_vec()) {
        Ok(t) => t,
        Err(e) => return judge("decode", Err(e)),
    };
    let f: Arc<str> = Arc::from(file);
    match reader {
        Reader::Bench => {
            let r = equicone::front::bench::read_bench(&f, &text);
            if let Ok(d) = &r {
                d.aig.check();
            }
            judge("bench", r.map(|_| ()))
        }
        Reader::Verilog => {
            let r = equicone::front::verilog::read_verilog(&[(f, text)], None);
            if let Ok(d) = &r {
                d.aig.check();
            }
            judge("verilog", r.map(|_| ()))
        }
        Reader::Expect => judge(
            "expect",
            equicone::cone::expect::parse_expect(&f, &text, ctx).map(|_| ()),
        ),
        Reader::Cost => judge(
            "cost",
            equicone::cost::model::CostModel::parse(&f, &text).map(|_| ()),
        ),
        Reader::Assume => judge(
            "assume",
            equicone::assume::on_design(ctx, &[text]).map(|_| ()),
        ),
    }
}
