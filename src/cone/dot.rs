//! Graphviz (DOT) picture of one output's structural cone: redundant inputs and the gates
//! only they feed filled red, gates that also read a redundant input outlined orange, so a
//! designer can look rather than read.

use super::report::AuditReport;
use super::structural::{StructuralGraph, Vertex};
use crate::design::Design;
use crate::diag::InputError;
use petgraph::visit::EdgeRef;
use std::fmt::Write;

/// The DOT text for output `output` (a bit name) of `design`, marked from `report`.
pub fn dot(design: &Design, report: &AuditReport, output: &str) -> Result<String, InputError> {
    let Some(o) = design.output_index(output) else {
        return Err(InputError::plain(
            format!("--dot: no output is named `{output}`"),
            "name one output bit, e.g. `--output d[3] --dot cone.dot`",
        ));
    };
    let Some(audit) = report.outputs.iter().find(|a| a.name == output) else {
        return Err(InputError::plain(
            format!("--dot: output `{output}` was not audited"),
            "include it with --output, or drop --output to audit every output",
        ));
    };
    let graph = StructuralGraph::build(design);
    let cone = graph.cone(o);
    let index_of = |n: &String| design.input_index(n);
    let redundant: Vec<usize> = audit.redundant.iter().filter_map(index_of).collect();
    let needed: Vec<usize> = audit
        .support
        .iter()
        .chain(&audit.undecided)
        .filter_map(index_of)
        .collect();
    let vertices_of = |ks: &[usize]| -> Vec<_> {
        ks.iter()
            .filter_map(|&k| graph.input_vertex.get(k).copied().flatten())
            .collect()
    };
    let from_needed = graph.reach_within(&vertices_of(&needed), &cone.vertices);
    let from_redundant = graph.reach_within(&vertices_of(&redundant), &cone.vertices);

    let mut s = String::new();
    let _ = writeln!(s, "digraph cone {{");
    let _ = writeln!(s, "  rankdir=LR;");
    let _ = writeln!(s, "  node [fontname=\"Helvetica\", fontsize=10];");
    let _ = writeln!(
        s,
        "  label=\"cone of {} in {}: {} of {} inputs in the support; red: redundant inputs and the gates only they feed; orange outline: gates that also read a redundant input\";",
        esc(output),
        esc(&design.name),
        audit.support.len(),
        audit.cone.len()
    );
    for &v in &cone.vertices {
        let only_redundant = from_redundant[v.index()] && !from_needed[v.index()];
        let touched = from_redundant[v.index()] && from_needed[v.index()];
        let (label, shape) = match &graph.graph[v] {
            Vertex::Input(k) => (design.inputs[*k].name.clone(), "box"),
            Vertex::Cell { kind, name, .. } => (
                format!("{}\\n{}", kind.name().to_uppercase(), esc(name)),
                "ellipse",
            ),
            Vertex::Undriven(n) => (format!("{} (undriven)", esc(n)), "plaintext"),
            Vertex::And(n) => match design.net_names.get(n) {
                Some(names) => (format!("{}\\nand n{n}", esc(&names.join(", "))), "ellipse"),
                None => (format!("and n{n}"), "ellipse"),
            },
            Vertex::Const => ("0".to_string(), "plaintext"),
        };
        let style = if only_redundant {
            ", style=filled, fillcolor=\"#f4a6a6\", color=\"#b00000\""
        } else if touched && !matches!(graph.graph[v], Vertex::Input(_)) {
            ", color=\"#e07000\", penwidth=2"
        } else {
            ""
        };
        let label = if matches!(graph.graph[v], Vertex::Input(_)) {
            esc(&label)
        } else {
            label
        };
        let _ = writeln!(
            s,
            "  v{} [label=\"{label}\", shape={shape}{style}];",
            v.index()
        );
    }
    for &v in &cone.vertices {
        for e in graph.graph.edges_directed(v, petgraph::Direction::Incoming) {
            let from = e.source();
            let mut attrs = Vec::new();
            if *e.weight() {
                attrs.push("arrowhead=odot");
            }
            if from_redundant[from.index()] && !from_needed[from.index()] {
                attrs.push("color=\"#b00000\"");
            }
            let a = if attrs.is_empty() {
                String::new()
            } else {
                format!(" [{}]", attrs.join(", "))
            };
            let _ = writeln!(s, "  v{} -> v{}{a};", from.index(), v.index());
        }
    }
    let _ = writeln!(s, "  out [label=\"{}\", shape=doubleoctagon];", esc(output));
    let inv = if graph.output_complemented[o] {
        " [arrowhead=odot]"
    } else {
        ""
    };
    let _ = writeln!(s, "  v{} -> out{inv};", graph.output_vertex[o].index());
    let _ = writeln!(s, "}}");
    Ok(s)
}

fn esc(s: &str) -> String {
    s.replace('\\', "\\\\").replace('"', "\\\"")
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::cone::{audit, AuditOptions};
    use crate::front::bench::read_bench;
    use crate::sat::Limits;
    use std::sync::Arc;

    #[test]
    fn masked_input_and_its_inverter_are_red() {
        let d = read_bench(
            &Arc::from("t.bench"),
            "INPUT(a)\nINPUT(t)\nOUTPUT(y)\nn = NOT(t)\np = AND(a, t)\nq = AND(a, n)\ny = OR(p, q)\n",
        )
        .unwrap();
        let r = audit(&d, &AuditOptions::default(), &Limits::none());
        let text = dot(&d, &r, "y").unwrap();
        let red = "style=filled, fillcolor=\"#f4a6a6\"";
        assert!(
            text.contains(&format!("[label=\"t\", shape=box, {red}")),
            "{text}"
        );
        assert!(
            text.contains(&format!("[label=\"NOT\\nn\", shape=ellipse, {red}")),
            "{text}"
        );
        assert!(
            text.contains("[label=\"AND\\np\", shape=ellipse, color=\"#e07000\""),
            "{text}"
        );
        assert!(text.contains("[label=\"a\", shape=box];"), "{text}");
        assert!(dot(&d, &r, "nope").is_err());
    }
}
