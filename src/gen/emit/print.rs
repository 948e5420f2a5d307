//! Printing a [`Circuit`] as Verilog (gate primitives, `?:` for 2:1 cells, or the behavioural
//! body of the spec style) and as bench text (2:1 cells and constants spelled as gates, as the
//! parent module's documentation says).

use super::{Circuit, Net, NetName, Op};
use std::collections::HashMap;
use std::fmt::Write;

impl Circuit {
    /// The circuit as Verilog (IEEE 1364-2005 subset).
    pub fn to_verilog(&self) -> String {
        let mut s = String::new();
        for l in &self.notes {
            let _ = writeln!(s, "// {l}");
        }
        let ports: Vec<&str> = self
            .inputs
            .iter()
            .chain(&self.outputs)
            .map(|p| p.name.as_str())
            .collect();
        let _ = writeln!(s, "module {} ({});", self.module, ports.join(", "));
        for (dir, list) in [("input", &self.inputs), ("output", &self.outputs)] {
            for p in list {
                if p.scalar {
                    let _ = writeln!(s, "  {dir} {};", p.name);
                } else {
                    let _ = writeln!(s, "  {dir} [{}:0] {};", p.width - 1, p.name);
                }
            }
        }
        if !self.behaviour.is_empty() {
            for l in &self.behaviour {
                let _ = writeln!(s, "  {l}");
            }
            s.push_str("endmodule\n");
            return s;
        }
        let wires: Vec<String> = self
            .gates
            .iter()
            .filter(|g| matches!(self.names[g.out.index()], NetName::Wire(_)))
            .map(|g| self.name(g.out))
            .collect();
        let mut line = String::new();
        for w in wires {
            if !line.is_empty() && line.len() + w.len() > 96 {
                let _ = writeln!(s, "  wire {line};");
                line.clear();
            }
            if !line.is_empty() {
                line.push_str(", ");
            }
            line.push_str(&w);
        }
        if !line.is_empty() {
            let _ = writeln!(s, "  wire {line};");
        }
        for g in &self.gates {
            let out = self.name(g.out);
            let ins: Vec<String> = g.ins.iter().map(|&i| self.name(i)).collect();
            match g.op {
                Op::Mux2 => {
                    let _ = writeln!(s, "  assign {out} = {} ? {} : {};", ins[0], ins[1], ins[2]);
                }
                Op::Const0 => {
                    let _ = writeln!(s, "  assign {out} = 1'b0;");
                }
                Op::Const1 => {
                    let _ = writeln!(s, "  assign {out} = 1'b1;");
                }
                op => {
                    let _ = writeln!(s, "  {} ({out}, {});", op.name(), ins.join(", "));
                }
            }
        }
        s.push_str("endmodule\n");
        s
    }

    /// The circuit as bench text (always the gate form; see the module documentation).
    pub fn to_bench(&self) -> String {
        let mut s = String::new();
        for l in &self.notes {
            let _ = writeln!(s, "# {l}");
        }
        for n in self.input_nets.iter().flatten() {
            let _ = writeln!(s, "INPUT({})", self.name(*n));
        }
        for n in self.output_nets.iter().flatten() {
            let _ = writeln!(s, "OUTPUT({})", self.name(*n));
        }
        s.push('\n');
        let mut inv: HashMap<Net, String> = HashMap::new();
        let mut const_inv: Option<(String, String)> = None;
        for g in &self.gates {
            let out = self.name(g.out);
            match g.op {
                Op::Mux2 => {
                    let sel = self.name(g.ins[0]);
                    let sn = match inv.get(&g.ins[0]) {
                        Some(n) => n.clone(),
                        None => {
                            let n = format!("{}__n", plain(&sel));
                            let _ = writeln!(s, "{n} = NOT({sel})");
                            inv.insert(g.ins[0], n.clone());
                            n
                        }
                    };
                    let o = plain(&out);
                    let (t, e) = (self.name(g.ins[1]), self.name(g.ins[2]));
                    let _ = writeln!(s, "{o}__t = AND({sel}, {t})");
                    let _ = writeln!(s, "{o}__e = AND({sn}, {e})");
                    let _ = writeln!(s, "{out} = OR({o}__t, {o}__e)");
                }
                Op::Const0 | Op::Const1 => {
                    let (x, xn) = const_inv.get_or_insert_with(|| {
                        let x = self.name(
                            self.input_nets
                                .iter()
                                .flatten()
                                .next()
                                .copied()
                                .unwrap_or(g.out),
                        );
                        let _ = writeln!(s, "const__n = NOT({x})");
                        (x, "const__n".to_string())
                    });
                    let op = if g.op == Op::Const0 { "AND" } else { "OR" };
                    let _ = writeln!(s, "{out} = {op}({x}, {xn})");
                }
                op => {
                    let ins: Vec<String> = g.ins.iter().map(|&i| self.name(i)).collect();
                    let _ = writeln!(s, "{out} = {}({})", op.bench(), ins.join(", "));
                }
            }
        }
        s
    }
}

/// `d[3]` -> `d_3`: a name usable as a prefix of a plain identifier.
fn plain(name: &str) -> String {
    name.replace('[', "_").replace(']', "")
}
