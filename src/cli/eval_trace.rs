//! `equicone eval DESIGN --trace FILE`: step a clocked design through a trace (a `prove --json`
//! report of clocked designs, or its `trace` object) from the reset state and print each cycle's
//! outputs.

use super::common::{print, report_input_error};
use super::Exit;
use crate::design::Design;
use crate::diag::InputError;
use crate::report::values;
use crate::seq::{self, Side, Trace};
use serde::Serialize;
use std::path::Path;

#[derive(Serialize)]
struct Cycle {
    cycle: usize,
    outputs: serde_json::Map<String, serde_json::Value>,
}

#[derive(Serialize)]
struct TraceEval {
    schema: u32,
    design: String,
    side: Side,
    cycles: Vec<Cycle>,
}

fn read_trace(file: &Path) -> Result<Trace, InputError> {
    // The file's name in messages (lossy when it is not UTF-8).
    let path = file.display();
    let text = std::fs::read_to_string(file).map_err(|e| {
        InputError::plain(
            format!("{path}: cannot read the trace: {e}"),
            "give the JSON report of `prove --json` on clocked designs, or its `trace` object",
        )
    })?;
    let bad = |what: String| {
        InputError::plain(
            format!("{path}: {what}"),
            "give the JSON report of `prove --json` on clocked designs, or its `trace` object",
        )
    };
    let v: serde_json::Value =
        serde_json::from_str(&text).map_err(|e| bad(format!("not JSON: {e}")))?;
    let t = match v.get("trace") {
        Some(serde_json::Value::Null) => {
            return Err(bad(
                "the report has no trace (its verdict is not `different`)".into(),
            ))
        }
        Some(t) => t.clone(),
        None => v,
    };
    serde_json::from_value(t).map_err(|e| bad(format!("not a trace: {e}")))
}

/// Run `eval --trace` on `d`, as the trace's `side` design; `vcd`: also dump the run there.
pub fn run(d: &Design, file: &Path, side: Side, json: bool, vcd: Option<&Path>) -> Exit {
    let t = match read_trace(file) {
        Ok(t) => t,
        Err(e) => return report_input_error(&e),
    };
    // The file's name in messages (lossy when it is not UTF-8).
    let path = file.display();
    let rep = match seq::replay(d, side, &t) {
        Ok(r) => r,
        Err(m) => {
            return report_input_error(&InputError::plain(
                format!("{path}: {m}"),
                "use the trace with the design it was found for (--side reference|candidate)",
            ))
        }
    };
    if let Some(v) = vcd {
        match crate::explain::trace_vcd::design_trace_vcd(d, side, &t) {
            Ok(text) => {
                if let Err(e) = super::common::write_atomic(v, text.as_bytes()) {
                    return report_input_error(&e);
                }
                eprintln!(
                    "vcd: {} ({} cycles from reset)",
                    v.display(),
                    t.cycles.len()
                );
            }
            Err(m) => {
                return report_input_error(&InputError::plain(
                    format!("{path}: {m}"),
                    "use the trace with the design it was found for (--side reference|candidate)",
                ))
            }
        }
    }
    if json {
        let cycles = rep
            .outputs
            .iter()
            .enumerate()
            .map(|(cycle, vals)| Cycle {
                cycle,
                outputs: d
                    .outputs
                    .iter()
                    .zip(vals)
                    .map(|(o, &v)| (o.name.clone(), serde_json::Value::Bool(v)))
                    .collect(),
            })
            .collect();
        let r = TraceEval {
            schema: 1,
            design: d.name.clone(),
            side,
            cycles,
        };
        print(&(serde_json::to_string_pretty(&r).expect("serializes") + "\n"));
        return Exit::Ok;
    }
    let mut s = format!(
        "{}: {} cycles from reset ({})\n",
        d.name,
        rep.outputs.len(),
        t.reset.description
    );
    for (cycle, vals) in rep.outputs.iter().enumerate() {
        let groups = values::group(
            d.outputs
                .iter()
                .zip(vals)
                .map(|(o, &v)| (o.name.as_str(), v)),
        );
        let items: Vec<String> = groups.iter().map(|g| g.render()).collect();
        s += &format!("cycle {cycle}: {}\n", items.join(" "));
    }
    print(&s);
    Exit::Ok
}
