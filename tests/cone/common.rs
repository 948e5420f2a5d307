//! Shared helpers: the ISCAS-85 data folder, designs built from cells (2:1 selector cells
//! included, which the bench format lacks), selector generators and evidence checks.

use equicone::cone::{AuditReport, ClaimVerdict};
use equicone::design::{Cell, CellKind, Design, Format, InputBit, Netlist, OutputBit};
use equicone::front::bench::{build_gate, read_bench};
use equicone::{Aig, Lit};
use std::path::PathBuf;
use std::sync::Arc;

/// The ISCAS-85 folder, or `None` (with a loud message) when it is absent. With
/// EQUICONE_REQUIRE_SHARED=1 an absent folder fails the test instead.
pub fn iscas_dir() -> Option<PathBuf> {
    super::oracle::iscas_dir()
}

/// Read one ISCAS-85 circuit.
pub fn iscas(dir: &std::path::Path, name: &str) -> Design {
    let path = dir.join(format!("{name}.bench"));
    let text = std::fs::read_to_string(&path).expect("readable benchmark file");
    read_bench(&Arc::from(format!("{name}.bench")), &text).expect("the benchmark reads")
}

/// A bench design from text.
pub fn bench(text: &str) -> Design {
    read_bench(&Arc::from("t.bench"), text).expect("test design reads")
}

/// A design from input bits `(port, index)`, cells `(kind, fan-in names, output name)` in
/// topological order, and output signal names (each becomes a scalar output port, or a bus
/// bit when written `port[i]`).
pub fn from_cells(
    inputs: &[(String, Option<i64>)],
    cells: &[(CellKind, Vec<String>, String)],
    outputs: &[String],
) -> Design {
    let mut aig = Aig::new();
    let mut signals: Vec<String> = Vec::new();
    let mut lits: Vec<Lit> = Vec::new();
    let mut bits = Vec::new();
    let mut id = std::collections::HashMap::new();
    for (port, index) in inputs {
        let b = InputBit::port(port, *index, None);
        id.insert(b.name.clone(), signals.len());
        signals.push(b.name.clone());
        lits.push(aig.add_input());
        bits.push(b);
    }
    let mut netlist_cells = Vec::new();
    for (kind, fanin, out) in cells {
        let ins: Vec<usize> = fanin.iter().map(|n| id[n.as_str()]).collect();
        let fl: Vec<Lit> = ins.iter().map(|&i| lits[i]).collect();
        let l = build_gate(&mut aig, *kind, &fl);
        id.insert(out.clone(), signals.len());
        netlist_cells.push(Cell {
            kind: *kind,
            inputs: ins.iter().map(|&i| i as u32).collect(),
            output: signals.len() as u32,
            pos: None,
        });
        signals.push(out.clone());
        lits.push(l);
    }
    let outs: Vec<OutputBit> = outputs
        .iter()
        .map(|n| {
            let (port, index) = split_bit(n);
            OutputBit::new(&port, index, lits[id[n.as_str()]], None)
        })
        .collect();
    let netlist = Netlist {
        signals,
        cells: netlist_cells,
        inputs: (0..inputs.len() as u32).collect(),
        outputs: outputs.iter().map(|n| id[n.as_str()] as u32).collect(),
        complete: true,
        register_inputs: Vec::new(),
    };
    let d = Design {
        name: "generated".to_string(),
        format: Format::Verilog,
        aig,
        inputs: bits,
        outputs: outs,
        netlist: Some(netlist),
        warnings: Vec::new(),
        registers: Vec::new(),
        net_names: Default::default(),
    };
    d.debug_check();
    d
}

fn split_bit(n: &str) -> (String, Option<i64>) {
    if let (Some(o), true) = (n.find('['), n.ends_with(']')) {
        if let Ok(i) = n[o + 1..n.len() - 1].parse() {
            return (n[..o].to_string(), Some(i));
        }
    }
    (n.to_string(), None)
}

fn sel_inputs(n: usize, k: usize) -> Vec<(String, Option<i64>)> {
    let mut v: Vec<(String, Option<i64>)> =
        (0..n).map(|i| ("d".to_string(), Some(i as i64))).collect();
    v.extend((0..k).map(|i| ("s".to_string(), Some(i as i64))));
    v
}

/// An N:1 selector (N = 2^k) as a tree of 2:1 selector cells: level i picks with s[i].
pub fn selector_tree(k: usize) -> Design {
    let n = 1usize << k;
    let mut cells = Vec::new();
    let mut layer: Vec<String> = (0..n).map(|i| format!("d[{i}]")).collect();
    for lvl in 0..k {
        let mut next = Vec::new();
        for (j, pair) in layer.chunks(2).enumerate() {
            let out = format!("m{lvl}_{j}");
            // mux2 inputs are [s, t, e]: s ? t : e.
            cells.push((
                CellKind::Mux2,
                vec![format!("s[{lvl}]"), pair[1].clone(), pair[0].clone()],
                out.clone(),
            ));
            next.push(out);
        }
        layer = next;
    }
    let out = layer.pop().unwrap_or_else(|| "d[0]".to_string());
    from_cells(&sel_inputs(n, k), &cells, &[out])
}

/// An N:1 selector (N = 2^k) as a decoder (k inverters, N k-input ANDs) and an AND-OR stage.
pub fn selector_decoder(k: usize) -> Design {
    let n = 1usize << k;
    let mut cells = Vec::new();
    for j in 0..k {
        cells.push((CellKind::Not, vec![format!("s[{j}]")], format!("ns{j}")));
    }
    let mut terms = Vec::new();
    for i in 0..n {
        let lits: Vec<String> = (0..k)
            .map(|j| {
                if i >> j & 1 == 1 {
                    format!("s[{j}]")
                } else {
                    format!("ns{j}")
                }
            })
            .collect();
        cells.push((CellKind::And, lits, format!("dec{i}")));
        cells.push((
            CellKind::And,
            vec![format!("dec{i}"), format!("d[{i}]")],
            format!("t{i}"),
        ));
        terms.push(format!("t{i}"));
    }
    cells.push((CellKind::Or, terms, "y".to_string()));
    from_cells(&sel_inputs(n, k), &cells, &["y".to_string()])
}

/// Check every "depends" claim of `report` against `design` by simulation: the first
/// vector gives `output_at_0`, the second (the input flipped) the opposite. Returns the
/// number of claims checked.
pub fn check_evidence(design: &Design, report: &AuditReport) -> usize {
    let mut checked = 0;
    for o in &report.outputs {
        let oi = design.output_index(&o.name).expect("audited output exists");
        for c in &o.claims {
            if let ClaimVerdict::Depends {
                vector,
                output_at_0,
                ..
            } = &c.verdict
            {
                assert_eq!(vector.len(), o.cone.len());
                let mut v = vec![false; design.inputs.len()];
                for (name, bit) in o.cone.iter().zip(vector.chars()) {
                    v[design.input_index(name).unwrap()] = bit == '1';
                }
                let x = design.input_index(&c.input).unwrap();
                assert!(!v[x], "the first vector has the claimed input at 0");
                assert_eq!(
                    design.eval(&v)[oi],
                    *output_at_0,
                    "{} / {}",
                    o.name,
                    c.input
                );
                v[x] = true;
                assert_eq!(
                    design.eval(&v)[oi],
                    !*output_at_0,
                    "{} / {}",
                    o.name,
                    c.input
                );
                checked += 1;
            }
        }
    }
    checked
}
