//! Writing designs as Verilog modules for testbenches: identifiers (escaped where a name is
//! not a simple identifier), a design read from bench text as a gate-primitive module (from its
//! netlist as written, or from its AIG when there is no complete netlist), and the scanner
//! that finds and renames the modules of Verilog source text.

use crate::aig::Node;
use crate::design::{split_bit, Design};
use std::collections::{BTreeMap, BTreeSet};
use std::fmt::Write;

const KEYWORDS: &[&str] = &[
    "always",
    "and",
    "assign",
    "automatic",
    "begin",
    "buf",
    "bufif0",
    "bufif1",
    "case",
    "casex",
    "casez",
    "cell",
    "cmos",
    "config",
    "deassign",
    "default",
    "defparam",
    "design",
    "disable",
    "edge",
    "else",
    "end",
    "endcase",
    "endconfig",
    "endfunction",
    "endgenerate",
    "endmodule",
    "endprimitive",
    "endspecify",
    "endtable",
    "endtask",
    "event",
    "for",
    "force",
    "forever",
    "fork",
    "function",
    "generate",
    "genvar",
    "highz0",
    "highz1",
    "if",
    "ifnone",
    "incdir",
    "include",
    "initial",
    "inout",
    "input",
    "instance",
    "integer",
    "join",
    "large",
    "liblist",
    "library",
    "localparam",
    "macromodule",
    "medium",
    "module",
    "nand",
    "negedge",
    "nmos",
    "nor",
    "noshowcancelled",
    "not",
    "notif0",
    "notif1",
    "or",
    "output",
    "parameter",
    "pmos",
    "posedge",
    "primitive",
    "pull0",
    "pull1",
    "pulldown",
    "pullup",
    "pulsestyle_onevent",
    "pulsestyle_ondetect",
    "rcmos",
    "real",
    "realtime",
    "reg",
    "release",
    "repeat",
    "rnmos",
    "rpmos",
    "rtran",
    "rtranif0",
    "rtranif1",
    "scalared",
    "showcancelled",
    "signed",
    "small",
    "specify",
    "specparam",
    "strong0",
    "strong1",
    "supply0",
    "supply1",
    "table",
    "task",
    "time",
    "tran",
    "tranif0",
    "tranif1",
    "tri",
    "tri0",
    "tri1",
    "triand",
    "trior",
    "trireg",
    "unsigned",
    "use",
    "uwire",
    "vectored",
    "wait",
    "wand",
    "weak0",
    "weak1",
    "while",
    "wire",
    "wor",
    "xnor",
    "xor",
];

/// Whether `s` is a simple identifier (IEEE 1364-2005 clause 3.7.1) and not a keyword.
pub fn is_simple(s: &str) -> bool {
    let mut ch = s.chars();
    matches!(ch.next(), Some(c) if c.is_ascii_alphabetic() || c == '_')
        && ch.all(|c| c.is_ascii_alphanumeric() || c == '_' || c == '$')
        && !KEYWORDS.contains(&s)
}

/// `s` as an identifier: itself when simple, else escaped (`\s` and a space).
pub fn ident(s: &str) -> String {
    if is_simple(s) {
        s.to_string()
    } else {
        format!("\\{s} ")
    }
}

/// One port of a design: its name, whether it is a bus, and its bits in the design's order
/// (least significant first) as (bit position in the design's list, index).
pub struct PortBits {
    /// Port name.
    pub name: String,
    /// Bits: (position in the design's input or output list, declared index).
    pub bits: Vec<(usize, Option<i64>)>,
}

impl PortBits {
    /// Smallest and largest index of a bus.
    pub fn range(&self) -> Option<(i64, i64)> {
        let idx: Vec<i64> = self.bits.iter().filter_map(|b| b.1).collect();
        Some((*idx.iter().min()?, *idx.iter().max()?))
    }

    /// The declaration range text `[max:min] ` of a bus (empty for a scalar).
    pub fn decl(&self) -> String {
        match self.range() {
            Some((lo, hi)) => format!("[{hi}:{lo}] "),
            None => String::new(),
        }
    }
}

/// Group named bits into ports in order of first appearance.
pub fn group_ports<'a>(
    names: impl IntoIterator<Item = (usize, &'a str, Option<i64>)>,
) -> Vec<PortBits> {
    let mut out: Vec<PortBits> = Vec::new();
    let mut at: BTreeMap<String, usize> = BTreeMap::new();
    for (k, port, idx) in names {
        let i = *at.entry(port.to_string()).or_insert_with(|| {
            out.push(PortBits {
                name: port.to_string(),
                bits: Vec::new(),
            });
            out.len() - 1
        });
        out[i].bits.push((k, idx));
    }
    out
}

/// A design read from bench text (or any design with its AIG) as a Verilog module named
/// `module`: bus ports from bit names `d[3]`, gate primitives from the netlist as written when
/// it is complete, else one `assign` per AND node of the AIG.
pub fn design_module(d: &Design, module: &str) -> Result<String, String> {
    let ins = group_ports(
        d.inputs
            .iter()
            .enumerate()
            .filter(|(_, b)| !b.is_unknown())
            .map(|(k, b)| (k, b.port.as_str(), b.index)),
    );
    if ins.len() != d.inputs.len() && d.inputs.iter().any(|b| b.is_unknown()) {
        return Err(format!(
            "{} reads unknown values, which a testbench cannot drive",
            d.name
        ));
    }
    let outs = group_ports(
        d.outputs
            .iter()
            .enumerate()
            .map(|(k, b)| (k, b.port.as_str(), b.index)),
    );
    let port_names: BTreeSet<&str> = ins.iter().chain(&outs).map(|p| p.name.as_str()).collect();
    if port_names.len() != ins.len() + outs.len() {
        return Err(format!(
            "{} has a port that is both an input and an output, which a Verilog module cannot have",
            d.name
        ));
    }
    let bit = |name: &str| -> String {
        let (p, i) = split_bit(name);
        match i {
            Some(i) if port_names.contains(p) => format!("{}[{i}]", ident(p)),
            _ => ident(name),
        }
    };
    let mut s = String::new();
    let list: Vec<String> = ins.iter().chain(&outs).map(|p| ident(&p.name)).collect();
    let _ = writeln!(s, "module {} ({});", ident(module), list.join(", "));
    for p in &ins {
        let _ = writeln!(s, "  input {}{};", p.decl(), ident(&p.name));
    }
    for p in &outs {
        let _ = writeln!(s, "  output {}{};", p.decl(), ident(&p.name));
    }
    match &d.netlist {
        Some(nl) if nl.complete => {
            let is_port = |n: &str| d.input_index(n).is_some() || d.output_index(n).is_some();
            // Internal nets: their own name unless it is a port's name.
            let net = |n: &str| -> String {
                if is_port(n) {
                    bit(n)
                } else if port_names.contains(n) {
                    ident(&format!("{n}$net"))
                } else {
                    ident(n)
                }
            };
            for c in &nl.cells {
                let n = &nl.signals[c.output as usize];
                if !is_port(n) {
                    let _ = writeln!(s, "  wire {};", net(n));
                }
            }
            for c in &nl.cells {
                let out = net(&nl.signals[c.output as usize]);
                let ins: Vec<String> = c
                    .inputs
                    .iter()
                    .map(|&i| net(&nl.signals[i as usize]))
                    .collect();
                if c.kind == crate::design::CellKind::Mux2 {
                    let _ = writeln!(s, "  assign {out} = {} ? {} : {};", ins[0], ins[1], ins[2]);
                } else {
                    let _ = writeln!(s, "  {} ({out}, {});", c.kind.name(), ins.join(", "));
                }
            }
            // Outputs driven by no gate: an output that is another signal by a plain connection.
            for (k, o) in d.outputs.iter().enumerate() {
                if let Some(&sig) = nl.outputs.get(k) {
                    let sn = &nl.signals[sig as usize];
                    if sn != &o.name {
                        let _ = writeln!(s, "  assign {} = {};", bit(&o.name), net(sn));
                    }
                }
            }
        }
        _ => {
            // One wire per AND node; inputs by name; outputs assigned from their literals.
            let lit = |l: crate::aig::Lit| -> String {
                let base = match d.aig.node(l.node()) {
                    Node::Const => "1'b0".to_string(),
                    Node::Input(k) => bit(&d.inputs[k as usize].name),
                    Node::And(..) => format!("eqc_n{}", l.node()),
                };
                if l.is_complemented() {
                    format!("~{base}")
                } else {
                    base
                }
            };
            for (i, n) in d.aig.nodes().iter().enumerate() {
                if let Node::And(a, b) = *n {
                    let _ = writeln!(s, "  wire eqc_n{i} = {} & {};", lit(a), lit(b));
                }
            }
            for o in &d.outputs {
                let _ = writeln!(s, "  assign {} = {};", bit(&o.name), lit(o.lit));
            }
        }
    }
    s.push_str("endmodule\n");
    Ok(s)
}

/// The clock port of a module that [`clocked_module`] writes.
pub const CLOCK_PORT: &str = "eqc_clk";

/// The name of register `k` inside a module that [`clocked_module`] writes (its own name, which
/// may clash with a port or net, is given in a comment).
pub fn register_net(k: usize) -> String {
    format!("eqc_r{k}")
}

/// A clocked design (a bench netlist with `DFF` lines, or any design with registers) as a
/// Verilog module named `module`, from its AIG: the input ports plus the clock port
/// [`CLOCK_PORT`], one `wire` per AND node, register `k` as `reg eqc_rK` loaded on the rising
/// edge with its next value. Registers have no reset here: a testbench sets their initial
/// values through hierarchical names (`inst.eqc_rK`).
pub fn clocked_module(d: &Design, module: &str) -> Result<String, String> {
    if d.inputs.iter().any(|b| b.is_unknown()) {
        return Err(format!(
            "{} reads unknown values, which a testbench cannot drive",
            d.name
        ));
    }
    let ins = group_ports(
        d.inputs
            .iter()
            .enumerate()
            .filter(|(_, b)| matches!(b.kind, crate::design::InputKind::Port))
            .map(|(k, b)| (k, b.port.as_str(), b.index)),
    );
    let outs = group_ports(
        d.outputs
            .iter()
            .enumerate()
            .map(|(k, b)| (k, b.port.as_str(), b.index)),
    );
    let port_names: BTreeSet<&str> = ins.iter().chain(&outs).map(|p| p.name.as_str()).collect();
    if port_names.len() != ins.len() + outs.len() || port_names.contains(CLOCK_PORT) {
        return Err(format!(
            "{} has a port that is both an input and an output, or a port named {CLOCK_PORT}, which the written module cannot have",
            d.name
        ));
    }
    let bit = |p: &str, i: Option<i64>| -> String {
        match i {
            Some(i) => format!("{}[{i}]", ident(p)),
            None => ident(p),
        }
    };
    let mut reg_of = vec![usize::MAX; d.inputs.len()];
    for (k, r) in d.registers.iter().enumerate() {
        reg_of[r.input] = k;
    }
    let lit = |l: crate::aig::Lit| -> String {
        let base = match d.aig.node(l.node()) {
            Node::Const => "1'b0".to_string(),
            Node::Input(k) => {
                let k = k as usize;
                if reg_of[k] != usize::MAX {
                    register_net(reg_of[k])
                } else {
                    bit(&d.inputs[k].port, d.inputs[k].index)
                }
            }
            Node::And(..) => format!("eqc_n{}", l.node()),
        };
        if l.is_complemented() {
            format!("~{base}")
        } else {
            base
        }
    };
    let mut s = String::new();
    let mut list: Vec<String> = vec![CLOCK_PORT.to_string()];
    list.extend(ins.iter().chain(&outs).map(|p| ident(&p.name)));
    let _ = writeln!(s, "module {} ({});", ident(module), list.join(", "));
    let _ = writeln!(s, "  input {CLOCK_PORT};");
    for p in &ins {
        let _ = writeln!(s, "  input {}{};", p.decl(), ident(&p.name));
    }
    for p in &outs {
        let _ = writeln!(s, "  output {}{};", p.decl(), ident(&p.name));
    }
    for (k, r) in d.registers.iter().enumerate() {
        let _ = writeln!(s, "  reg {}; // register {}", register_net(k), r.name);
    }
    for (i, n) in d.aig.nodes().iter().enumerate() {
        if let Node::And(a, b) = *n {
            let _ = writeln!(s, "  wire eqc_n{i} = {} & {};", lit(a), lit(b));
        }
    }
    for o in &d.outputs {
        let _ = writeln!(s, "  assign {} = {};", bit(&o.port, o.index), lit(o.lit));
    }
    if !d.registers.is_empty() {
        let _ = writeln!(s, "  always @(posedge {CLOCK_PORT}) begin");
        for (k, r) in d.registers.iter().enumerate() {
            let _ = writeln!(s, "    {} <= {};", register_net(k), lit(r.next));
        }
        s.push_str("  end\n");
    }
    s.push_str("endmodule\n");
    Ok(s)
}

/// Identifier tokens of Verilog text outside comments, strings and escaped identifiers, as
/// byte ranges.
fn identifiers(text: &str) -> Vec<(usize, usize)> {
    let b = text.as_bytes();
    let mut out = Vec::new();
    let mut i = 0;
    while i < b.len() {
        let c = b[i];
        if c == b'/' && b.get(i + 1) == Some(&b'/') {
            while i < b.len() && b[i] != b'\n' {
                i += 1;
            }
        } else if c == b'/' && b.get(i + 1) == Some(&b'*') {
            i += 2;
            while i < b.len() && !(b[i] == b'*' && b.get(i + 1) == Some(&b'/')) {
                i += 1;
            }
            i += 2;
        } else if c == b'"' {
            i += 1;
            while i < b.len() && b[i] != b'"' && b[i] != b'\n' {
                i += if b[i] == b'\\' { 2 } else { 1 };
            }
            i += 1;
        } else if c == b'\\' {
            while i < b.len() && !b[i].is_ascii_whitespace() {
                i += 1;
            }
        } else if c == b'\'' {
            // A based number's base and digits (`4'hab`) are not identifiers.
            i += 1;
            while i < b.len() && (b[i].is_ascii_alphanumeric() || b[i] == b'_' || b[i] == b'?') {
                i += 1;
            }
        } else if c.is_ascii_alphabetic() || c == b'_' || c == b'`' || c == b'$' {
            let start = i;
            i += 1;
            while i < b.len() && (b[i].is_ascii_alphanumeric() || b[i] == b'_' || b[i] == b'$') {
                i += 1;
            }
            if c != b'`' && c != b'$' {
                out.push((start, i));
            }
        } else if c.is_ascii_digit() {
            while i < b.len() && (b[i].is_ascii_alphanumeric() || b[i] == b'_') {
                i += 1;
            }
        } else {
            i += 1;
        }
    }
    out
}

/// The names of the modules that `text` defines.
pub fn defined_modules(text: &str) -> Vec<String> {
    let ids = identifiers(text);
    ids.windows(2)
        .filter(|w| matches!(&text[w[0].0..w[0].1], "module" | "macromodule"))
        .map(|w| text[w[1].0..w[1].1].to_string())
        .collect()
}

/// `text` with every identifier in `names` given `suffix` (a consistent renaming, so the
/// meaning of the text is unchanged when the new names are fresh).
pub fn rename(text: &str, names: &BTreeSet<String>, suffix: &str) -> String {
    let mut s = String::with_capacity(text.len() + 64);
    let mut at = 0;
    for (a, b) in identifiers(text) {
        if names.contains(&text[a..b]) {
            s.push_str(&text[at..b]);
            s.push_str(suffix);
            at = b;
        }
    }
    s.push_str(&text[at..]);
    s
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn identifiers_escape_and_modules_rename() {
        assert_eq!(ident("a_1"), "a_1");
        assert_eq!(ident("1"), "\\1 ");
        assert_eq!(ident("and"), "\\and ");
        assert_eq!(ident("d[3]"), "\\d[3] ");
        let t = "// module fake\nmodule m(input a, output y); /* m */ sub u(.a(a), .y(y)); \
                 initial $display(\"m\"); endmodule\nmodule sub(input a, output y); assign y = 4'hab == 8'd0; endmodule\n";
        assert_eq!(defined_modules(t), vec!["m", "sub"]);
        let names: BTreeSet<String> = ["m", "sub"].iter().map(|s| s.to_string()).collect();
        let r = rename(t, &names, "__c");
        assert!(r.contains("module m__c(input a"), "{r}");
        assert!(r.contains("sub__c u(.a(a)"), "{r}");
        assert!(r.contains("// module fake") && r.contains("/* m */") && r.contains("\"m\""));
        assert!(r.contains("4'hab"));
    }
}
