//! Structural cones: the design as a petgraph graph (the netlist as written where the design
//! has a complete one, the AIG otherwise) and the transitive fan-in of each output bit.

use crate::aig::Node;
use crate::design::{CellKind, Design};
use petgraph::graph::{DiGraph, NodeIndex};
use petgraph::visit::{Dfs, Reversed};
use petgraph::Direction;
use serde::Serialize;
use std::collections::HashMap;

/// Which description of the design the structural graph shows.
#[derive(Copy, Clone, Debug, PartialEq, Eq, Serialize)]
#[serde(rename_all = "snake_case")]
pub enum GraphSource {
    /// The gate-level netlist as written.
    Netlist,
    /// The and-inverter graph (the front-end kept no complete netlist).
    Aig,
    /// The and-inverter graph of the expressions as written, nothing folded away (Verilog
    /// RTL: see [`crate::aig::Aig::as_written`]).
    Written,
}

/// One vertex of the structural graph.
#[derive(Clone, Debug, PartialEq, Eq)]
pub enum Vertex {
    /// Design input `k`.
    Input(usize),
    /// A netlist gate: its type, its index in [`crate::design::Netlist::cells`] and the
    /// signal it drives.
    Cell {
        /// Gate type.
        kind: CellKind,
        /// Index of the cell.
        cell: usize,
        /// Name of the driven signal.
        name: String,
    },
    /// A netlist signal that no gate drives and that is no design input.
    Undriven(String),
    /// An AND node of the AIG.
    And(u32),
    /// The constant node of the AIG.
    Const,
}

/// The transitive fan-in of one output bit.
#[derive(Clone, Debug, PartialEq, Eq)]
pub struct Cone {
    /// Design input indices in the cone, ascending.
    pub inputs: Vec<usize>,
    /// Gates (netlist cells or AND nodes) in the cone.
    pub gates: usize,
    /// Every vertex of the cone, in ascending vertex order.
    pub vertices: Vec<NodeIndex>,
}

/// A design as a directed graph from fan-in to fan-out.
#[derive(Clone, Debug)]
pub struct StructuralGraph {
    /// The graph; an edge's weight says whether it is complemented (AIG edges only).
    pub graph: DiGraph<Vertex, bool>,
    /// The vertex of each design input, if it has one.
    pub input_vertex: Vec<Option<NodeIndex>>,
    /// The vertex each design output reads.
    pub output_vertex: Vec<NodeIndex>,
    /// Whether each design output is complemented with respect to its vertex (AIG only).
    pub output_complemented: Vec<bool>,
    /// What the graph shows.
    pub source: GraphSource,
}

impl StructuralGraph {
    /// The structural graph of `design`: its netlist when that is complete and names every
    /// output, its AIG otherwise.
    pub fn build(design: &Design) -> StructuralGraph {
        match &design.netlist {
            Some(n) if n.complete && n.outputs.len() == design.outputs.len() => {
                Self::from_netlist(design, n)
            }
            _ => Self::from_aig(design),
        }
    }

    fn from_netlist(design: &Design, n: &crate::design::Netlist) -> StructuralGraph {
        let mut graph = DiGraph::with_capacity(n.signals.len(), n.cells.len() * 2);
        let by_name: HashMap<&str, usize> = design
            .inputs
            .iter()
            .enumerate()
            .map(|(k, b)| (b.name.as_str(), k))
            .collect();
        let mut driver = vec![None; n.signals.len()];
        for (c, cell) in n.cells.iter().enumerate() {
            if let Some(d) = driver.get_mut(cell.output as usize) {
                *d = Some(c);
            }
        }
        let mut is_input = vec![None; n.signals.len()];
        for &s in &n.inputs {
            if let Some(&k) = n
                .signals
                .get(s as usize)
                .and_then(|name| by_name.get(name.as_str()))
            {
                is_input[s as usize] = Some(k);
            }
        }
        let mut input_vertex = vec![None; design.inputs.len()];
        for (s, name) in n.signals.iter().enumerate() {
            let v = match (is_input[s], driver[s]) {
                (Some(k), _) => Vertex::Input(k),
                (None, Some(c)) => Vertex::Cell {
                    kind: n.cells[c].kind,
                    cell: c,
                    name: name.clone(),
                },
                (None, None) => Vertex::Undriven(name.clone()),
            };
            let id = graph.add_node(v);
            if let Some(k) = is_input[s] {
                input_vertex[k] = Some(id);
            }
        }
        for cell in &n.cells {
            for &i in &cell.inputs {
                graph.add_edge(
                    NodeIndex::new(i as usize),
                    NodeIndex::new(cell.output as usize),
                    false,
                );
            }
        }
        StructuralGraph {
            graph,
            input_vertex,
            output_vertex: n
                .outputs
                .iter()
                .map(|&s| NodeIndex::new(s as usize))
                .collect(),
            output_complemented: vec![false; design.outputs.len()],
            source: GraphSource::Netlist,
        }
    }

    fn from_aig(design: &Design) -> StructuralGraph {
        let aig = &design.aig;
        let mut graph = DiGraph::with_capacity(aig.len(), aig.num_ands() * 2);
        let mut input_vertex = vec![None; design.inputs.len()];
        for (i, node) in aig.nodes().iter().enumerate() {
            let v = match *node {
                Node::Const => Vertex::Const,
                Node::Input(k) => Vertex::Input(k as usize),
                Node::And(..) => Vertex::And(i as u32),
            };
            let id = graph.add_node(v);
            if let Node::Input(k) = *node {
                input_vertex[k as usize] = Some(id);
            }
        }
        for (i, node) in aig.nodes().iter().enumerate() {
            if let Node::And(a, b) = *node {
                for l in [a, b] {
                    graph.add_edge(
                        NodeIndex::new(l.index()),
                        NodeIndex::new(i),
                        l.is_complemented(),
                    );
                }
            }
        }
        StructuralGraph {
            graph,
            input_vertex,
            output_vertex: design
                .outputs
                .iter()
                .map(|o| NodeIndex::new(o.lit.index()))
                .collect(),
            output_complemented: design
                .outputs
                .iter()
                .map(|o| o.lit.is_complemented())
                .collect(),
            source: GraphSource::Aig,
        }
    }

    /// The structural cone of output `output` (a depth-first search on the reversed graph).
    pub fn cone(&self, output: usize) -> Cone {
        let start = self.output_vertex[output];
        let rev = Reversed(&self.graph);
        let mut dfs = Dfs::new(rev, start);
        let mut vertices = Vec::new();
        while let Some(v) = dfs.next(rev) {
            vertices.push(v);
        }
        vertices.sort_unstable();
        let mut inputs = Vec::new();
        let mut gates = 0;
        for &v in &vertices {
            match self.graph[v] {
                Vertex::Input(k) => inputs.push(k),
                Vertex::Cell { .. } | Vertex::And(_) => gates += 1,
                Vertex::Undriven(_) | Vertex::Const => {}
            }
        }
        inputs.sort_unstable();
        Cone {
            inputs,
            gates,
            vertices,
        }
    }

    /// Vertices reachable from `starts` (forward), restricted to `within` (a sorted list).
    pub fn reach_within(&self, starts: &[NodeIndex], within: &[NodeIndex]) -> Vec<bool> {
        let mut seen = vec![false; self.graph.node_count()];
        let mut stack: Vec<NodeIndex> = Vec::new();
        for &s in starts {
            if within.binary_search(&s).is_ok() && !seen[s.index()] {
                seen[s.index()] = true;
                stack.push(s);
            }
        }
        while let Some(v) = stack.pop() {
            for w in self.graph.neighbors_directed(v, Direction::Outgoing) {
                if !seen[w.index()] && within.binary_search(&w).is_ok() {
                    seen[w.index()] = true;
                    stack.push(w);
                }
            }
        }
        seen
    }

    /// Inputs that are in no output's cone (reach no output), ascending.
    pub fn unconnected_inputs(&self, cones: &[Cone], num_inputs: usize) -> Vec<usize> {
        let mut used = vec![false; num_inputs];
        for c in cones {
            for &k in &c.inputs {
                used[k] = true;
            }
        }
        (0..num_inputs).filter(|&k| !used[k]).collect()
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::front::bench::read_bench;
    use std::sync::Arc;

    #[test]
    fn netlist_cone_keeps_what_the_aig_folds_away() {
        // y = AND(a, NOT(a)) is constant in the AIG, but `a` is wired to y as written.
        let d = read_bench(
            &Arc::from("t.bench"),
            "INPUT(a)\nINPUT(b)\nOUTPUT(y)\nOUTPUT(z)\nn = NOT(a)\ny = AND(a, n)\nz = BUF(b)\n",
        )
        .unwrap();
        let g = StructuralGraph::build(&d);
        assert_eq!(g.source, GraphSource::Netlist);
        let c = g.cone(0);
        assert_eq!(c.inputs, vec![0]);
        assert_eq!(c.gates, 2);
        assert_eq!(g.cone(1).inputs, vec![1]);
        assert!(d.aig.cone_inputs(&[d.outputs[0].lit]).is_empty());
    }
}
