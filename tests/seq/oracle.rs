//! An independent cycle simulator for bench text with `q = DFF(d)` lines, written from the gate
//! lines with plain string operations (no equicone code): the oracle the clocked checks are
//! compared against, and the Verilog writer that lets Icarus Verilog replay the same netlists.

use std::collections::BTreeMap;

/// A bench netlist with flip-flops, as plain data.
#[derive(Clone, Debug)]
pub struct SeqNet {
    pub inputs: Vec<String>,
    pub outputs: Vec<String>,
    /// (q, d)
    pub dffs: Vec<(String, String)>,
    /// (output, gate, fan-ins), in file order.
    pub gates: Vec<(String, String, Vec<String>)>,
}

pub fn parse(text: &str) -> SeqNet {
    let mut n = SeqNet {
        inputs: vec![],
        outputs: vec![],
        dffs: vec![],
        gates: vec![],
    };
    for raw in text.lines() {
        let line = raw.split('#').next().unwrap().trim();
        if line.is_empty() {
            continue;
        }
        let inner = |s: &str| {
            let a = s.find('(').unwrap();
            let b = s.rfind(')').unwrap();
            s[a + 1..b].to_string()
        };
        if let Some(rest) = line.strip_prefix("INPUT") {
            n.inputs.push(inner(rest).trim().to_string());
        } else if let Some(rest) = line.strip_prefix("OUTPUT") {
            n.outputs.push(inner(rest).trim().to_string());
        } else {
            let (lhs, rhs) = line.split_once('=').unwrap();
            let kind = rhs[..rhs.find('(').unwrap()].trim().to_ascii_uppercase();
            let args: Vec<String> = inner(rhs)
                .split(',')
                .map(|s| s.trim().to_string())
                .collect();
            if kind == "DFF" {
                n.dffs.push((lhs.trim().to_string(), args[0].clone()));
            } else {
                n.gates.push((lhs.trim().to_string(), kind, args));
            }
        }
    }
    n
}

/// One gate of bench text on 64 lanes at once.
pub fn gate_word(kind: &str, xs: &[u64]) -> u64 {
    let and = xs.iter().fold(!0, |a, &b| a & b);
    let or = xs.iter().fold(0, |a, &b| a | b);
    let xor = xs.iter().fold(0, |a, &b| a ^ b);
    match kind {
        "AND" => and,
        "NAND" => !and,
        "OR" => or,
        "NOR" => !or,
        "XOR" => xor,
        "XNOR" => !xor,
        "NOT" => !xs[0],
        "BUF" | "BUFF" => xs[0],
        other => panic!("gate {other}"),
    }
}

impl SeqNet {
    /// One cycle: outputs and next state, from inputs and state (by name).
    pub fn step(
        &self,
        inputs: &BTreeMap<String, bool>,
        state: &BTreeMap<String, bool>,
    ) -> (Vec<bool>, BTreeMap<String, bool>) {
        let mut v: BTreeMap<String, bool> = inputs.clone();
        v.extend(state.iter().map(|(k, b)| (k.clone(), *b)));
        // Repeat until every gate is evaluated (gates may come in any order).
        let mut left: Vec<&(String, String, Vec<String>)> = self.gates.iter().collect();
        while !left.is_empty() {
            let before = left.len();
            left.retain(|(o, k, a)| {
                if !a.iter().all(|x| v.contains_key(x)) {
                    return true;
                }
                let xs: Vec<u64> = a.iter().map(|x| if v[x] { !0 } else { 0 }).collect();
                let r = gate_word(k, &xs) & 1 == 1;
                v.insert(o.clone(), r);
                false
            });
            assert!(left.len() < before, "combinational cycle");
        }
        let outs = self.outputs.iter().map(|o| v[o]).collect();
        let next = self.dffs.iter().map(|(q, d)| (q.clone(), v[d])).collect();
        (outs, next)
    }

    /// Outputs of every cycle from the all-zero state.
    pub fn run(&self, cycles: &[BTreeMap<String, bool>]) -> Vec<Vec<bool>> {
        let mut state: BTreeMap<String, bool> =
            self.dffs.iter().map(|(q, _)| (q.clone(), false)).collect();
        cycles
            .iter()
            .map(|ins| {
                let (o, next) = self.step(ins, &state);
                state = next;
                o
            })
            .collect()
    }

    /// A Verilog module: gates as continuous assignments, each flip-flop a register starting at 0.
    pub fn verilog(&self, module: &str) -> String {
        let id = |s: &str| format!("\\{s} ");
        let mut s = format!("module {module}(input clk");
        for i in &self.inputs {
            s += &format!(", input {}", id(i));
        }
        for o in &self.outputs {
            s += &format!(", output {}", id(o));
        }
        s += ");\n";
        let declared: Vec<&String> = self.inputs.iter().chain(&self.outputs).collect();
        for (q, d) in &self.dffs {
            let r = id(&format!("{q}$ff"));
            s += &format!(
                "  reg {r} = 1'b0;\n  always @(posedge clk) {r} <= {};\n",
                id(d)
            );
            if !declared.contains(&q) {
                s += &format!("  wire {};\n", id(q));
            }
            s += &format!("  assign {} = {r};\n", id(q));
        }
        for (o, k, a) in &self.gates {
            if !declared.contains(&o) {
                s += &format!("  wire {};\n", id(o));
            }
            let args: Vec<String> = a.iter().map(|x| id(x)).collect();
            let e = match k.as_str() {
                "AND" => args.join(" & "),
                "NAND" => format!("~({})", args.join(" & ")),
                "OR" => args.join(" | "),
                "NOR" => format!("~({})", args.join(" | ")),
                "XOR" => args.join(" ^ "),
                "XNOR" => format!("~({})", args.join(" ^ ")),
                "NOT" => format!("~{}", args[0]),
                _ => args[0].clone(),
            };
            s += &format!("  assign {} = {e};\n", id(o));
        }
        s + "endmodule\n"
    }
}
