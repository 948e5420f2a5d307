//! `stats`: gate counts by type as written and in the AIG, total cost and critical-path delay
//! under a cost model, the depth of each output, and per output the lower bounds implied by
//! its support (see [`bounds`]) with the design's gap to them.

pub mod bounds;
mod cut;
pub mod model;
mod report;

pub use bounds::{depth_bound, gate_bound};
pub use cut::{register_input_name, state_cut};
pub use model::{CostModel, GateCost, GateSpec};
pub use report::{AigStats, OutputStats, StatsReport, TypeCount, WrittenStats};

use crate::cone::structural::{GraphSource, StructuralGraph, Vertex};
use crate::cone::support::{run, SupportOptions};
use crate::design::{Design, Netlist};
use crate::sat::Limits;
use std::collections::BTreeMap;

/// Statistics of `design` under `model` (supports decided within `limits`).
pub fn stats(design: &Design, model: &CostModel, limits: &Limits) -> StatsReport {
    stats_with(design, model, &SupportOptions::default(), limits)
}

/// [`stats`] with explicit support options (seed, rounds, progress bar). A clocked design is
/// measured under the state cut ([`state_cut`]): register outputs are inputs, and each
/// register's input is a row `next(REG)` after the outputs.
pub fn stats_with(
    design: &Design,
    model: &CostModel,
    opts: &SupportOptions,
    limits: &Limits,
) -> StatsReport {
    if !design.is_clocked() {
        return stats_of(design, model, opts, limits);
    }
    let (cut, n) = state_cut(design);
    let mut rep = stats_of(&cut, model, opts, limits);
    let first = design.outputs.len();
    for (o, r) in rep.per_output[first..].iter_mut().zip(&design.registers) {
        o.register = Some(r.name.clone());
    }
    rep.outputs = first;
    rep.registers = n;
    rep.notes.insert(
        0,
        format!(
            "state cut: the logic of one clock cycle, with the {n} register outputs read as inputs and the {n} register inputs as outputs (rows next(REG), after the outputs); an input that reaches an output only through registers counts in the register inputs' supports, not the output's"
        ),
    );
    rep
}

/// The statistics of a combinational design (or of a state cut).
fn stats_of(
    design: &Design,
    model: &CostModel,
    opts: &SupportOptions,
    limits: &Limits,
) -> StatsReport {
    let graph = StructuralGraph::build(design);
    let outputs: Vec<usize> = (0..design.outputs.len()).collect();
    let cones: Vec<_> = outputs.iter().map(|&o| graph.cone(o)).collect();
    let bar = crate::cone::progress_bar(opts.progress, "supports");
    let (supports, support_stats) = run(
        design,
        &outputs,
        cones.iter().map(|c| c.inputs.clone()).collect(),
        opts,
        limits,
        &bar,
    );
    bar.finish_and_clear();
    let mut notes = Vec::new();
    let written = match &design.netlist {
        Some(n) if n.complete && graph.source == GraphSource::Netlist => {
            Some(written_stats(n, model, &mut notes))
        }
        Some(_) => {
            notes.push("the design is written partly as expressions rather than gates, so gate counts, cost and delay as written are not shown (columns marked -); the AIG columns (ands, levels) are given instead".to_string());
            None
        }
        None => {
            notes.push("the front-end kept no netlist, so gate counts, cost and delay as written are not shown (columns marked -); the AIG columns (ands, levels) are given instead".to_string());
            None
        }
    };
    let k = match (model.bound_fanin, &written) {
        (Some(k), Some(w)) => {
            if k < w.max_fanin {
                notes.push(format!("bound_fanin {k} is below this design's largest fan-in {}: the gate and depth gaps compare the design with circuits of fan-in <= {k}", w.max_fanin));
            }
            k
        }
        (Some(k), None) => k,
        (None, Some(w)) => w.max_fanin.max(2),
        (None, None) => 2,
    };
    if support_stats.undecided > 0 {
        notes.push(format!("{} support claims are undecided: bounds use the inputs proved in each support, so they stay valid but may be low", support_stats.undecided));
    }

    let aig = &design.aig;
    let levels = aig.levels();
    let all_roots: Vec<_> = design.outputs.iter().map(|o| o.lit).collect();
    let count_ands = |mask: &[bool]| {
        mask.iter()
            .enumerate()
            .filter(|&(i, &m)| m && matches!(aig.node(i as u32), crate::aig::Node::And(..)))
            .count()
    };
    let aig_stats = AigStats {
        inputs: aig.num_inputs(),
        ands: aig.num_ands(),
        ands_in_cones: count_ands(&aig.cone_mask(&all_roots)),
        depth: all_roots
            .iter()
            .map(|l| levels[l.index()])
            .max()
            .unwrap_or(0),
    };

    let mut per_output = Vec::with_capacity(outputs.len());
    for ((&o, cone), sup) in outputs.iter().zip(&cones).zip(&supports) {
        let out = &design.outputs[o];
        let n = sup.support().len() as u64;
        let root = out.lit;
        let aig_ands = count_ands(&aig.cone_mask(&[root])) as u64;
        let aig_depth = levels[root.index()];
        let (gates, cost, depth, delay) = match (&written, &design.netlist) {
            (Some(w), Some(net)) => {
                let s = net.outputs[o] as usize;
                let cost: f64 = cone
                    .vertices
                    .iter()
                    .filter_map(|&v| match &graph.graph[v] {
                        Vertex::Cell { cell, .. } => {
                            let c = &net.cells[*cell];
                            Some(model.gate(c.kind, c.inputs.len()).cost)
                        }
                        _ => None,
                    })
                    .sum();
                (
                    Some(cone.gates as u64),
                    Some(cost),
                    Some(w.signal_depth[s]),
                    Some(w.signal_delay[s]),
                )
            }
            _ => (None, None, None, None),
        };
        let gb = gate_bound(n, k);
        let db = depth_bound(n, k);
        per_output.push(OutputStats {
            name: out.name.clone(),
            register: None,
            support: n,
            undecided: sup.undecided().len() as u64,
            gates,
            cost,
            depth,
            delay,
            gate_bound: gb,
            depth_bound: db,
            gate_gap: gates.map(|g| g as i64 - gb as i64),
            depth_gap: depth.map(|d| i64::from(d) - i64::from(db)),
            aig_ands,
            aig_depth,
            aig_gate_bound: gate_bound(n, 2),
            aig_depth_bound: depth_bound(n, 2),
            aig_gate_gap: aig_ands as i64 - gate_bound(n, 2) as i64,
            aig_depth_gap: i64::from(aig_depth) - i64::from(depth_bound(n, 2)),
        });
    }
    StatsReport {
        schema: StatsReport::SCHEMA,
        design: design.name.clone(),
        cost_model: model.name.clone(),
        inputs: design.inputs.len(),
        outputs: design.outputs.len(),
        registers: 0,
        written,
        aig: aig_stats,
        bound_fanin: k,
        per_output,
        support_stats,
        notes,
    }
}

/// Counts, cost, levels and arrival times of the netlist as written.
fn written_stats(n: &Netlist, model: &CostModel, notes: &mut Vec<String>) -> WrittenStats {
    let mut by_type: BTreeMap<String, TypeCount> = BTreeMap::new();
    let mut total_cost = 0.0;
    let mut max_fanin = 0u32;
    for c in &n.cells {
        let t = by_type.entry(c.kind.name().to_string()).or_default();
        t.total += 1;
        *t.by_fanin.entry(c.inputs.len() as u32).or_default() += 1;
        total_cost += model.gate(c.kind, c.inputs.len()).cost;
        max_fanin = max_fanin.max(c.inputs.len() as u32);
    }
    // Kahn's algorithm over cells: a cell is ready when every driven fan-in is done.
    let ns = n.signals.len();
    let mut driver: Vec<Option<usize>> = vec![None; ns];
    for (i, c) in n.cells.iter().enumerate() {
        if let Some(d) = driver.get_mut(c.output as usize) {
            *d = Some(i);
        }
    }
    let mut readers: Vec<Vec<usize>> = vec![Vec::new(); ns];
    let mut waiting: Vec<usize> = vec![0; n.cells.len()];
    for (i, c) in n.cells.iter().enumerate() {
        for &s in &c.inputs {
            if driver.get(s as usize).copied().flatten().is_some() {
                waiting[i] += 1;
                readers[s as usize].push(i);
            }
        }
    }
    let mut ready: Vec<usize> = (0..n.cells.len()).filter(|&i| waiting[i] == 0).collect();
    let mut depth = vec![0u32; ns];
    let mut delay = vec![0f64; ns];
    let mut from: Vec<Option<u32>> = vec![None; ns];
    let mut done = 0usize;
    while let Some(i) = ready.pop() {
        done += 1;
        let c = &n.cells[i];
        let g = model.gate(c.kind, c.inputs.len());
        let mut d = 0u32;
        let mut t = 0f64;
        let mut arg = None;
        for &s in &c.inputs {
            d = d.max(depth[s as usize]);
            if arg.is_none() || delay[s as usize] > t {
                t = delay[s as usize];
                arg = Some(s);
            }
        }
        let o = c.output as usize;
        depth[o] = d + 1;
        delay[o] = t + g.delay;
        from[o] = arg;
        for &r in &readers[o] {
            waiting[r] -= 1;
            if waiting[r] == 0 {
                ready.push(r);
            }
        }
    }
    if done < n.cells.len() {
        notes.push(format!(
            "the netlist has a combinational cycle through {} gates; depth and delay leave them out",
            n.cells.len() - done
        ));
    }
    let (crit_out, critical_delay) =
        n.outputs
            .iter()
            .map(|&s| (s, delay[s as usize]))
            .fold((None, 0f64), |(bo, bd), (s, d)| {
                if bo.is_none() || d > bd {
                    (Some(s), d)
                } else {
                    (bo, bd)
                }
            });
    let mut critical_path = Vec::new();
    let mut at = crit_out;
    while let Some(s) = at {
        critical_path.push(n.signals[s as usize].clone());
        at = from[s as usize];
        if critical_path.len() > ns {
            break;
        }
    }
    critical_path.reverse();
    WrittenStats {
        gates: n.cells.len(),
        by_type,
        max_fanin,
        total_cost,
        critical_delay,
        depth: n
            .outputs
            .iter()
            .map(|&s| depth[s as usize])
            .max()
            .unwrap_or(0),
        critical_path,
        signal_depth: depth,
        signal_delay: delay,
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::front::bench::read_bench;
    use std::sync::Arc;

    #[test]
    fn c17_by_hand() {
        // c17 as published (6 NAND gates, 5 inputs, 2 outputs; common practice).
        let d = read_bench(
            &Arc::from("c17.bench"),
            "INPUT(1)\nINPUT(2)\nINPUT(3)\nINPUT(6)\nINPUT(7)\nOUTPUT(22)\nOUTPUT(23)\n\
             10 = NAND(1, 3)\n11 = NAND(3, 6)\n16 = NAND(2, 11)\n19 = NAND(11, 7)\n\
             22 = NAND(10, 16)\n23 = NAND(16, 19)\n",
        )
        .unwrap();
        let s = stats(&d, &CostModel::unit(), &Limits::none());
        let w = s.written.as_ref().unwrap();
        assert_eq!((w.gates, w.depth, w.max_fanin), (6, 3, 2));
        assert_eq!(w.by_type["nand"].total, 6);
        assert_eq!(w.total_cost, 6.0);
        assert_eq!(w.critical_delay, 3.0);
        assert_eq!(w.critical_path.len(), 4);
        // Output 22 reads 1, 2, 3, 6: 4 inputs need 3 two-input gates and depth 2.
        let o = &s.per_output[0];
        assert_eq!(
            (o.support, o.gates, o.gate_bound, o.gate_gap),
            (4, Some(4), 3, Some(1))
        );
        assert_eq!((o.depth, o.depth_bound, o.depth_gap), (Some(3), 2, Some(1)));
    }
}
