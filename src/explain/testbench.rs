//! A self-checking Verilog testbench (IEEE 1364-2005) for two designs: it instantiates both by
//! module name, applies each vector, compares every output pair with `!==` and prints one line
//! per vector (`vector N: pass` or `vector N: FAIL, K of P output pairs differ`), then a
//! summary line. A Verilog design is instantiated from its own files (named in the header);
//! when both sides define a module of the same name, the candidate's files are copied into the
//! testbench with their modules renamed (`NAME__candidate`). A bench design becomes a
//! gate-primitive module written into the testbench.

use super::verilog_out::{
    clocked_module, defined_modules, design_module, group_ports, ident, rename, PortBits,
};
use super::waves::scope_names;
use crate::design::{Design, Format};
use crate::engine::pairing::SharedInput;
use crate::engine::Shared;
use std::collections::BTreeSet;
use std::fmt::Write;

/// One design and the source files it was read from: (path, text).
pub struct TbDesign<'a> {
    /// The design.
    pub design: &'a Design,
    /// Its source files, for Verilog designs.
    pub files: Vec<(String, String)>,
}

/// A written testbench.
pub struct Testbench {
    /// The testbench text (top module `equicone_tb`).
    pub text: String,
    /// The files to compile with it, besides the testbench itself.
    pub compile_with: Vec<String>,
    /// The language flag for Icarus Verilog: `-g2012` when a design was read from a
    /// SystemVerilog file (`.sv`, `.svh`), else `-g2005`.
    pub generation: &'static str,
}

/// The Icarus Verilog language flag for designs read from these files (path, text).
pub(super) fn generation(files: &[&(String, String)]) -> &'static str {
    let sv = files.iter().any(|(p, _)| {
        std::path::Path::new(p)
            .extension()
            .is_some_and(|e| e.eq_ignore_ascii_case("sv") || e.eq_ignore_ascii_case("svh"))
    });
    if sv {
        "-g2012"
    } else {
        "-g2005"
    }
}

/// How one side appears in the testbench.
pub(super) struct Side {
    /// The module instantiated.
    pub(super) module: String,
    /// Text written into the testbench (generated or renamed modules).
    pub(super) embedded: String,
    /// Files to compile with the testbench.
    pub(super) files: Vec<String>,
    /// Renaming applied to the side's identifiers.
    pub(super) renamed: BTreeSet<String>,
}

const SUFFIX: &str = "__candidate";

/// One side of a testbench: a Verilog design from its files (renamed on a clash of module
/// names), any other design written as a module (with its registers when it is clocked).
pub(super) fn side(t: &TbDesign, scope: &str, clash: &BTreeSet<String>) -> Result<Side, String> {
    let d = t.design;
    if d.format == Format::Verilog && !t.files.is_empty() {
        if clash.is_empty() {
            return Ok(Side {
                module: d.name.clone(),
                embedded: String::new(),
                files: t.files.iter().map(|f| f.0.clone()).collect(),
                renamed: BTreeSet::new(),
            });
        }
        let mut embedded = String::new();
        let mut defined = BTreeSet::new();
        for (_, text) in &t.files {
            defined.extend(defined_modules(text));
        }
        for (path, text) in &t.files {
            let _ = writeln!(
                embedded,
                "// {path}, its modules renamed with the suffix {SUFFIX} (the reference defines modules of the same names)"
            );
            embedded.push_str(&rename(text, &defined, SUFFIX));
            if !embedded.ends_with('\n') {
                embedded.push('\n');
            }
        }
        return Ok(Side {
            module: format!("{}{SUFFIX}", d.name),
            embedded,
            files: Vec::new(),
            renamed: defined,
        });
    }
    let module = format!("eqc_{scope}");
    let mut embedded = format!("// {} written as a Verilog module by equicone\n", d.name);
    if d.is_clocked() {
        embedded.push_str(&clocked_module(d, &module)?);
    } else {
        embedded.push_str(&design_module(d, &module)?);
    }
    Ok(Side {
        module,
        embedded,
        files: Vec::new(),
        renamed: BTreeSet::new(),
    })
}

/// The testbench applying `vectors` (one value per shared input each) to `r` and `c`.
pub fn testbench(
    r: &TbDesign,
    c: &TbDesign,
    shared: &Shared,
    vectors: &[Vec<bool>],
) -> Result<Testbench, String> {
    let (rd, cd) = (r.design, c.design);
    let modules = |t: &TbDesign| -> BTreeSet<String> {
        t.files.iter().flat_map(|f| defined_modules(&f.1)).collect()
    };
    let both_verilog = rd.format == Format::Verilog && cd.format == Format::Verilog;
    let clash: BTreeSet<String> = if both_verilog {
        modules(r).intersection(&modules(c)).cloned().collect()
    } else {
        BTreeSet::new()
    };
    let (rn, cn) = scope_names(rd, cd);
    let rs = side(r, &rn, &BTreeSet::new())?;
    let cs = side(c, &cn, &clash)?;
    // Testbench registers: one per port; paired bits take the reference's names.
    let mut tb_name: Vec<String> = vec![String::new(); shared.inputs.len()];
    let mut regs: Vec<PortBits> = Vec::new();
    {
        let mut bits: Vec<(usize, String, Option<i64>)> = Vec::new();
        let ref_ports: BTreeSet<&str> = rd.inputs.iter().map(|b| b.port.as_str()).collect();
        for (k, origin) in shared.inputs.iter().enumerate() {
            let (b, cand_only) = match *origin {
                SharedInput::Both { reference, .. } | SharedInput::Reference(reference) => {
                    (&rd.inputs[reference], false)
                }
                SharedInput::Candidate(i) => (&cd.inputs[i], true),
            };
            if b.is_unknown() {
                continue;
            }
            let port = if cand_only && ref_ports.contains(b.port.as_str()) {
                format!("cand_{}", b.port)
            } else {
                b.port.clone()
            };
            bits.push((k, port, b.index));
        }
        for p in group_ports(bits.iter().map(|(k, p, i)| (*k, p.as_str(), *i))) {
            for &(k, idx) in &p.bits {
                tb_name[k] = match idx {
                    Some(i) => format!("{}[{i}]", ident(&p.name)),
                    None => ident(&p.name),
                };
            }
            regs.push(p);
        }
    }
    let mut s = String::new();
    let run: Vec<String> = rs.files.iter().chain(&cs.files).cloned().collect();
    let gen = generation(&r.files.iter().chain(&c.files).collect::<Vec<_>>());
    let _ = writeln!(
        s,
        "// Self-checking testbench written by equicone: reference {} against candidate {}.",
        rd.name, cd.name
    );
    let _ = writeln!(
        s,
        "// Run: iverilog {gen} -o tb.vvp THIS_FILE{}{} && vvp tb.vvp",
        if run.is_empty() { "" } else { " " },
        run.join(" ")
    );
    s.push_str(
        "// One line per vector: `pass` when every output pair is equal (!==), else FAIL.\n",
    );
    if rd.inputs.iter().chain(&cd.inputs).any(|b| b.is_unknown()) {
        s.push_str("// Unknown values (x) in the designs stay x here; compare them with care.\n");
    }
    s.push('\n');
    s.push_str(&rs.embedded);
    s.push_str(&cs.embedded);
    s.push_str("module equicone_tb;\n");
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
    for (d, sd, map, wires, inst) in [
        (rd, &rs, &shared.ref_input, &ro, "eqc_ref"),
        (cd, &cs, &shared.cand_input, &co, "eqc_cand"),
    ] {
        let mut conns = Vec::new();
        let ports = group_ports(
            d.inputs
                .iter()
                .enumerate()
                .filter(|(_, b)| !b.is_unknown())
                .map(|(k, b)| (k, b.port.as_str(), b.index)),
        );
        let port_name = |n: &str| {
            if sd.renamed.contains(n) {
                ident(&format!("{n}{SUFFIX}"))
            } else {
                ident(n)
            }
        };
        for p in &ports {
            let e: Vec<String> = p
                .bits
                .iter()
                .rev()
                .map(|&(k, _)| tb_name[map[k]].clone())
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
    let np = shared.pairs.len();
    s.push_str("  integer eqc_fails, eqc_n;\n");
    s.push_str("  task eqc_check;\n    input integer v;\n    begin\n      eqc_n = 0;\n");
    for &(a, b) in &shared.pairs {
        let _ = writeln!(
            s,
            "      if ({} !== {}) eqc_n = eqc_n + 1;",
            out_bit(&ro, a),
            out_bit(&co, b)
        );
    }
    let _ = writeln!(
        s,
        "      if (eqc_n == 0) $display(\"vector %0d: pass\", v);\n      else begin\n        eqc_fails = eqc_fails + 1;\n        $display(\"vector %0d: FAIL, %0d of {np} output pairs differ\", v, eqc_n);\n      end\n    end\n  endtask"
    );
    s.push_str("  initial begin\n    eqc_fails = 0;\n");
    for (t, v) in vectors.iter().enumerate() {
        for p in &regs {
            let text = match p.range() {
                Some((lo, hi)) => {
                    let width = (hi - lo + 1) as usize;
                    let mut bits = vec!['0'; width];
                    for &(k, idx) in &p.bits {
                        let i = idx.unwrap_or(lo);
                        bits[(hi - i) as usize] = if v[k] { '1' } else { '0' };
                    }
                    format!("{width}'b{}", bits.into_iter().collect::<String>())
                }
                None => format!("1'b{}", v[p.bits[0].0] as u8),
            };
            let _ = writeln!(s, "    {} = {text};", ident(&p.name));
        }
        let _ = writeln!(s, "    #1 eqc_check({});", t + 1);
    }
    let _ = writeln!(
        s,
        "    $display(\"equicone testbench: %0d of {} vectors FAIL\", eqc_fails);\n    $finish;\n  end\nendmodule",
        vectors.len()
    );
    Ok(Testbench {
        text: s,
        compile_with: run,
        generation: gen,
    })
}

#[cfg(test)]
mod tests {
    use super::generation;

    #[test]
    fn systemverilog_files_ask_icarus_for_ieee_1800() {
        // Icarus Verilog reads `typedef enum`, `always_ff` and `logic` only with -g2012 (its
        // manual page lists the -g generations; common practice).
        let f = |p: &str| (p.to_string(), String::new());
        let (v, sv, svh) = (f("a/ref.v"), f("cand.SV"), f("defs.svh"));
        assert_eq!(generation(&[&v]), "-g2005");
        assert_eq!(generation(&[&v, &sv]), "-g2012");
        assert_eq!(generation(&[&svh]), "-g2012");
        assert_eq!(generation(&[]), "-g2005");
    }
}
