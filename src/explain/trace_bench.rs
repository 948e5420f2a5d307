//! A self-checking Verilog testbench (IEEE 1364-2005) that replays a trace of clocked designs:
//! it instantiates both designs (Verilog designs by their module names from their own files; a
//! bench design written as a module with its registers by `verilog_out::clocked_module`),
//! drives reset for one clock edge, sets the initial values of registers without a reset
//! through hierarchical names, then applies the trace cycle by cycle: inputs, a compare of
//! every output pair with `!==` before the clock edge (`cycle K: pass` or `cycle K: FAIL, N of
//! P output pairs differ`), the clock edge; a summary line closes the run.

use super::testbench::{generation, side, TbDesign, Testbench};
use super::verilog_out::{group_ports, ident, register_net, PortBits, CLOCK_PORT};
use super::waves::scope_names;
use crate::design::{Design, Format, InputKind};
use crate::seq::{Side, Trace};
use std::collections::{BTreeMap, BTreeSet};
use std::fmt::Write;

/// Whether the trace entry of side `of` applies to side `side`.
fn applies(of: Side, side: Side) -> bool {
    of == Side::Both || of == side
}

/// A testbench register bit: (position, port, index, the design bits it drives).
type TbBit = (usize, String, Option<i64>, Vec<(Side, String)>);

/// Port bit expression in the testbench for (side, bit name).
type BitMap = BTreeMap<(Side, String), String>;

/// A hierarchical reference to register `k` of `d` inside instance `inst`.
fn register_ref(d: &Design, k: usize, inst: &str, generated: bool) -> String {
    if generated {
        return format!("{inst}.{}", register_net(k));
    }
    let r = &d.registers[k];
    let mut path: Vec<String> = r.port.split('.').map(ident).collect();
    if let Some(i) = r.index {
        let last = path.pop().unwrap_or_default();
        path.push(format!("{last}[{i}]"));
    }
    format!("{inst}.{}", path.join("."))
}

/// The testbench replaying `t` on `r` and `c`.
pub fn trace_testbench(r: &TbDesign, c: &TbDesign, t: &Trace) -> Result<Testbench, String> {
    let (rd, cd) = (r.design, c.design);
    let clash: BTreeSet<String> = if rd.format == Format::Verilog && cd.format == Format::Verilog {
        let m = |x: &TbDesign| -> BTreeSet<String> {
            x.files
                .iter()
                .flat_map(|f| super::verilog_out::defined_modules(&f.1))
                .collect()
        };
        m(r).intersection(&m(c)).cloned().collect()
    } else {
        BTreeSet::new()
    };
    let (rn, cn) = scope_names(rd, cd);
    let rs = side(r, &rn, &BTreeSet::new())?;
    let cs = side(c, &cn, &clash)?;
    let generated =
        |d: &Design, files: &[(String, String)]| d.format != Format::Verilog || files.is_empty();
    let (rg, cg) = (generated(rd, &r.files), generated(cd, &c.files));
    // Testbench registers for the port bits: paired bits (by name, or as the trace renames
    // them) by the reference's names.
    let renamed = t.renamed_inputs();
    let renamed_to: BTreeSet<&str> = renamed.values().map(String::as_str).collect();
    let partner = |n: &str| -> Option<String> {
        match renamed.get(n) {
            Some(cn) => Some(cn.clone()),
            None if renamed_to.contains(n) => None,
            None => Some(n.to_string()),
        }
    };
    let mut bits: BitMap = BTreeMap::new();
    let mut regs: Vec<PortBits> = Vec::new();
    {
        let ref_ports: BTreeSet<&str> = rd.inputs.iter().map(|b| b.port.as_str()).collect();
        let mut paired_c: BTreeSet<String> = BTreeSet::new();
        let mut list: Vec<TbBit> = Vec::new();
        for b in rd
            .inputs
            .iter()
            .filter(|b| matches!(b.kind, InputKind::Port))
        {
            let mut who = vec![(Side::Reference, b.name.clone())];
            if let Some(cn) = partner(&b.name).filter(|n| cd.input_index(n).is_some()) {
                paired_c.insert(cn.clone());
                who.push((Side::Candidate, cn));
            }
            list.push((list.len(), b.port.clone(), b.index, who));
        }
        for b in cd
            .inputs
            .iter()
            .filter(|b| matches!(b.kind, InputKind::Port))
        {
            if paired_c.contains(&b.name) {
                continue;
            }
            let port = if ref_ports.contains(b.port.as_str()) {
                format!("cand_{}", b.port)
            } else {
                b.port.clone()
            };
            list.push((
                list.len(),
                port,
                b.index,
                vec![(Side::Candidate, b.name.clone())],
            ));
        }
        for p in group_ports(list.iter().map(|(k, p, i, _)| (*k, p.as_str(), *i))) {
            for &(k, idx) in &p.bits {
                let e = match idx {
                    Some(i) => format!("{}[{i}]", ident(&p.name)),
                    None => ident(&p.name),
                };
                for w in &list[k].3 {
                    bits.insert(w.clone(), e.clone());
                }
            }
            regs.push(p);
        }
    }
    let bit_of =
        |side: Side, name: &str| -> Option<&String> { bits.get(&(side, name.to_string())) };
    // Clocks and resets from the trace's held inputs.
    let mut clocks: BTreeSet<String> = BTreeSet::new();
    // Clock name -> its testbench nets (several clocks tick one by one).
    let mut clock_nets: BTreeMap<&str, BTreeSet<String>> = BTreeMap::new();
    let mut resets: Vec<(String, bool)> = Vec::new();
    for h in &t.reset.held {
        for side in [Side::Reference, Side::Candidate] {
            let Some(name) = h.name_on(side) else {
                continue;
            };
            if let Some(e) = bit_of(side, name) {
                if h.role == "clock" {
                    clocks.insert(e.clone());
                    clock_nets
                        .entry(h.name.as_str())
                        .or_default()
                        .insert(e.clone());
                } else if !resets.iter().any(|(x, _)| x == e) {
                    resets.push((e.clone(), h.value));
                }
            }
        }
    }
    if rg || cg {
        clocks.insert(CLOCK_PORT.to_string());
    }
    let mut s = String::new();
    let run: Vec<String> = rs.files.iter().chain(&cs.files).cloned().collect();
    let gen = generation(&r.files.iter().chain(&c.files).collect::<Vec<_>>());
    let _ = writeln!(
        s,
        "// Self-checking testbench written by equicone: reference {} against candidate {}, a trace of {} clock cycles.",
        rd.name,
        cd.name,
        t.cycles.len()
    );
    let _ = writeln!(
        s,
        "// Run: iverilog {gen} -o tb.vvp THIS_FILE{}{} && vvp tb.vvp",
        if run.is_empty() { "" } else { " " },
        run.join(" ")
    );
    let _ = writeln!(
        s,
        "// Reset for one clock edge, then per cycle: inputs, compare of every output pair (!==) before the clock edge, the edge.\n// Start: {}",
        t.reset.description
    );
    if rd.inputs.iter().chain(&cd.inputs).any(|b| b.is_unknown()) {
        s.push_str("// Unknown values (x) in the designs stay x here; compare them with care.\n");
    }
    s.push('\n');
    s.push_str(&rs.embedded);
    s.push_str(&cs.embedded);
    s.push_str("module equicone_tb;\n");
    if rg || cg {
        let _ = writeln!(s, "  reg {CLOCK_PORT};");
    }
    for p in &regs {
        let _ = writeln!(s, "  reg {}{};", p.decl(), ident(&p.name));
    }
    let out_wires = |d: &Design, prefix: &str| -> Vec<PortBits> {
        let mut v = group_ports(
            d.outputs
                .iter()
                .enumerate()
                .map(|(k, b)| (k, b.port.as_str(), b.index)),
        );
        for p in &mut v {
            p.name = format!("{prefix}{}", p.name);
        }
        v
    };
    let (ro, co) = (out_wires(rd, "eqc_r_"), out_wires(cd, "eqc_c_"));
    for p in ro.iter().chain(&co) {
        let _ = writeln!(s, "  wire {}{};", p.decl(), ident(&p.name));
    }
    let out_bit = |wires: &[PortBits], k: usize| -> String {
        for p in wires {
            for &(j, idx) in &p.bits {
                if j == k {
                    return match idx {
                        Some(i) => format!("{}[{i}]", ident(&p.name)),
                        None => ident(&p.name),
                    };
                }
            }
        }
        unreachable!("every output bit is in a port")
    };
    for (d, sd, side, wires, inst, gen) in [
        (rd, &rs, Side::Reference, &ro, "eqc_ref", rg),
        (cd, &cs, Side::Candidate, &co, "eqc_cand", cg),
    ] {
        let port_name = |n: &str| {
            if sd.renamed.contains(n) {
                ident(&format!("{n}__candidate"))
            } else {
                ident(n)
            }
        };
        let mut conns = Vec::new();
        if gen && d.is_clocked() {
            conns.push(format!(".{CLOCK_PORT}({CLOCK_PORT})"));
        }
        let ports = group_ports(
            d.inputs
                .iter()
                .enumerate()
                .filter(|(_, b)| matches!(b.kind, InputKind::Port))
                .map(|(k, b)| (k, b.port.as_str(), b.index)),
        );
        for p in &ports {
            let e: Vec<String> = p
                .bits
                .iter()
                .rev()
                .map(|&(k, _)| bit_of(side, &d.inputs[k].name).cloned().unwrap_or_default())
                .collect();
            conns.push(format!(".{}({{{}}})", port_name(&p.name), e.join(", ")));
        }
        let outs = group_ports(
            d.outputs
                .iter()
                .enumerate()
                .map(|(k, b)| (k, b.port.as_str(), b.index)),
        );
        for p in &outs {
            let e: Vec<String> = p
                .bits
                .iter()
                .rev()
                .map(|&(k, _)| out_bit(wires, k))
                .collect();
            conns.push(format!(".{}({{{}}})", port_name(&p.name), e.join(", ")));
        }
        let _ = writeln!(
            s,
            "  {} {inst} (\n    {});",
            ident(&sd.module),
            conns.join(",\n    ")
        );
    }
    let pairs = t.output_pairs(rd, cd);
    let np = pairs.len();
    s.push_str("  integer eqc_fails, eqc_n;\n");
    s.push_str("  task eqc_check;\n    input integer k;\n    begin\n      eqc_n = 0;\n");
    for &(a, b) in &pairs {
        let _ = writeln!(
            s,
            "      if ({} !== {}) eqc_n = eqc_n + 1;",
            out_bit(&ro, a),
            out_bit(&co, b)
        );
    }
    let _ = writeln!(
        s,
        "      if (eqc_n == 0) $display(\"cycle %0d: pass\", k);\n      else begin\n        eqc_fails = eqc_fails + 1;\n        $display(\"cycle %0d: FAIL, %0d of {np} output pairs differ\", k, eqc_n);\n      end\n    end\n  endtask"
    );
    let edge_of = |s: &mut String, c: Vec<&String>| {
        let set = |v: u8| {
            c.iter()
                .map(|x| format!("{x} = 1'b{v};"))
                .collect::<Vec<_>>()
                .join(" ")
        };
        if c.is_empty() {
            // No clock ticks: the same time steps without an edge.
            let _ = writeln!(s, "    #1;\n    #1;");
        } else {
            let _ = writeln!(s, "    {}\n    #1 {}\n    #1;", set(1), set(0));
        }
    };
    let edge = |s: &mut String| edge_of(s, clocks.iter().collect());
    s.push_str("  initial begin\n    eqc_fails = 0;\n");
    // Reset: every input 0, clocks 0, resets active, one clock edge.
    for p in &regs {
        let w = p.bits.len();
        let _ = writeln!(s, "    {} = {w}'b0;", ident(&p.name));
    }
    if rg || cg {
        let _ = writeln!(s, "    {CLOCK_PORT} = 1'b0;");
    }
    s.push_str("    // reset\n");
    for (e, inactive) in &resets {
        let _ = writeln!(s, "    {e} = 1'b{};", (!inactive) as u8);
    }
    s.push_str("    #1;\n");
    edge(&mut s);
    for (e, inactive) in &resets {
        let _ = writeln!(s, "    {e} = 1'b{};", *inactive as u8);
    }
    s.push_str("    #1;\n");
    // Initial values of registers without a reset.
    for (d, side, inst, gen) in [
        (rd, Side::Reference, "eqc_ref", rg),
        (cd, Side::Candidate, "eqc_cand", cg),
    ] {
        for (k, reg) in d.registers.iter().enumerate() {
            let v = match reg.init {
                // Reset gave it its value; one without a reset (a power-on value) is set
                // again after the reset edge, which clocked it.
                Some(_) if !gen && reg.reset.is_some() => continue,
                Some(v) => v,
                None => t
                    .reset
                    .initial
                    .iter()
                    .find(|i| i.register == reg.name && applies(i.side, side))
                    .map(|i| i.value)
                    .ok_or_else(|| {
                        format!(
                            "the trace gives no initial value for register `{}` of {}",
                            reg.name, d.name
                        )
                    })?,
            };
            let _ = writeln!(
                s,
                "    {} = 1'b{}; // {} register {}",
                register_ref(d, k, inst, gen),
                v as u8,
                side.word(),
                reg.name
            );
        }
    }
    for cyc in &t.cycles {
        let _ = writeln!(s, "    // cycle {}", cyc.cycle);
        for i in &cyc.inputs {
            let e = if i.side == Side::Candidate {
                bit_of(Side::Candidate, &i.name)
            } else {
                bit_of(Side::Reference, &i.name)
            };
            if let Some(e) = e {
                let _ = writeln!(s, "    {e} = 1'b{};", i.value as u8);
            }
        }
        let _ = writeln!(s, "    #1 eqc_check({});", cyc.cycle);
        match (&cyc.ticked, t.reset.clocks.is_empty()) {
            // Several clocks: a pulse on the clocks that tick (none: no edge).
            (Some(ticked), false) => {
                let nets: BTreeSet<&String> = ticked
                    .iter()
                    .filter_map(|k| clock_nets.get(k.as_str()))
                    .flatten()
                    .collect();
                let _ = writeln!(
                    s,
                    "    // ticked: {}",
                    if ticked.is_empty() {
                        "-".to_string()
                    } else {
                        ticked.join(", ")
                    }
                );
                edge_of(&mut s, nets.into_iter().collect());
            }
            _ => edge(&mut s),
        }
    }
    let _ = writeln!(
        s,
        "    $display(\"equicone testbench: %0d of {} cycles FAIL\", eqc_fails);\n    $finish;\n  end\nendmodule",
        t.cycles.len()
    );
    Ok(Testbench {
        text: s,
        compile_with: run,
        generation: gen,
    })
}
