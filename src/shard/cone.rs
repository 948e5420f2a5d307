//! Split cone audits: the stamp of a partial `cone --shard K/N` report (output bit i of the
//! run's selection belongs to shard `i mod N + 1`) and the merge of N partial audit reports
//! into the report of one run.
//!
//! A partial report holds the audits of its own output bits, the flags about them, its input
//! counts and its claim statistics. The flags that need every audited output (inputs in no
//! support, supports nested unlike the expectation) are left out of the parts and worked out
//! by the merge from the merged outputs, with the same rules as [`crate::cone::audit`].
//! **Invariant:** the merge checks the parts as the `prove` merge does (same inputs, options,
//! split and schema, every shard once, every output bit covered exactly once).

use super::{check_parts, err, PartKind, Shard};
use crate::diag::InputError;
use serde::Serialize;
use serde_json::{Map, Value};
use std::collections::{BTreeMap, BTreeSet};

/// The stamp of a partial cone audit (its `shard` field).
#[derive(Clone, Debug, PartialEq, Eq, Serialize)]
pub struct ConeStamp {
    /// Which shard, 1..=count.
    pub index: usize,
    /// How many shards.
    pub count: usize,
    /// Output bits the whole run audits.
    pub total_outputs: usize,
    /// The whole run's positions of this shard's output bits, in the order of its `outputs`.
    pub outputs: Vec<usize>,
    /// Fingerprint of the input files' contents (filled by the command line).
    pub inputs: String,
    /// Fingerprint of the options that can change the report (filled by the command line).
    pub options: String,
}

const CONE: PartKind = PartKind {
    command: "cone",
    total_key: "total_outputs",
    items_key: "outputs",
    items: "outputs",
};

/// Keep the output bits of `shard` in `outputs` (the whole run's selection, in order).
pub fn restrict_outputs(outputs: &mut Vec<usize>, shard: Shard) -> ConeStamp {
    let total = outputs.len();
    let keep: Vec<usize> = (0..total).filter(|&i| shard.owns(i)).collect();
    *outputs = keep.iter().map(|&i| outputs[i]).collect();
    ConeStamp {
        index: shard.index,
        count: shard.count,
        total_outputs: total,
        outputs: keep,
        inputs: String::new(),
        options: String::new(),
    }
}

/// Whether `v` is a cone audit report (by its schema tag).
pub fn is_cone_report(v: &Value) -> bool {
    v.get("schema")
        .and_then(Value::as_str)
        .is_some_and(|s| s.starts_with("equicone.cone/"))
}

fn names(v: &Value) -> Vec<&str> {
    v.as_array()
        .into_iter()
        .flatten()
        .filter_map(Value::as_str)
        .collect()
}

/// Add every number of `add` into `acc`, recursively (statistics of the parts).
fn add_numbers(acc: &mut Value, add: &Value) {
    match (acc, add) {
        (Value::Object(a), Value::Object(b)) => {
            for (k, x) in b {
                match a.get_mut(k) {
                    Some(y) => add_numbers(y, x),
                    None => {
                        a.insert(k.clone(), x.clone());
                    }
                }
            }
        }
        (acc @ Value::Number(_), Value::Number(b)) => {
            *acc = match (acc.as_u64(), b.as_u64()) {
                (Some(x), Some(y)) => Value::from(x.saturating_add(y)),
                _ => Value::from(acc.as_f64().unwrap_or(0.0) + b.as_f64().unwrap_or(0.0)),
            };
        }
        _ => {}
    }
}

/// Merge partial cone audit reports `(file name, JSON)` into the report of one run.
pub fn merge_cone(parts: &[(String, Value)]) -> Result<Value, InputError> {
    let (stamps, order) = check_parts(parts, &CONE)?;
    let s0 = &stamps[0];
    let first = &parts[0].1;
    let mut outputs: Vec<Option<Value>> = vec![None; s0.total];
    let mut flags_of: BTreeMap<usize, Vec<Value>> = BTreeMap::new();
    let mut inputs: Vec<Value> = first
        .get("inputs")
        .and_then(Value::as_array)
        .cloned()
        .unwrap_or_default();
    for i in inputs.iter_mut() {
        i["in_cones"] = Value::from(0);
        i["in_supports"] = Value::from(0);
    }
    let mut stats = Value::Object(Map::new());
    for &i in &order {
        let (f, v) = &parts[i];
        let s = &stamps[i];
        let list = super::part_items(f, v, "outputs", s)?;
        let mut position: BTreeMap<String, usize> = BTreeMap::new();
        for (o, &g) in list.into_iter().zip(&s.items) {
            if g >= s0.total || outputs[g].is_some() {
                return Err(err(
                    f,
                    format!("output {g} is out of range or covered twice"),
                    "give each shard's file once",
                ));
            }
            if let Some(n) = o.get("name").and_then(Value::as_str) {
                position.insert(n.to_string(), g);
            }
            outputs[g] = Some(o);
        }
        for flag in v
            .get("flags")
            .and_then(Value::as_array)
            .into_iter()
            .flatten()
        {
            let at = flag
                .get("output")
                .and_then(Value::as_str)
                .and_then(|n| position.get(n));
            match at {
                Some(&g) => flags_of.entry(g).or_default().push(flag.clone()),
                None => {
                    return Err(err(
                        f,
                        format!("holds a flag about no output of its shard: {flag}"),
                        "give the files as written",
                    ))
                }
            }
        }
        let theirs = v
            .get("inputs")
            .and_then(Value::as_array)
            .cloned()
            .unwrap_or_default();
        if theirs.len() != inputs.len() {
            return Err(err(
                f,
                "lists another number of inputs",
                "give the files as written",
            ));
        }
        for (mine, t) in inputs.iter_mut().zip(&theirs) {
            for k in ["in_cones", "in_supports"] {
                let sum = mine[k].as_u64().unwrap_or(0) + t[k].as_u64().unwrap_or(0);
                mine[k] = Value::from(sum);
            }
        }
        if let Some(st) = v.get("stats") {
            add_numbers(&mut stats, st);
        }
    }
    let outputs: Vec<Value> = outputs
        .into_iter()
        .enumerate()
        .map(|(g, o)| {
            o.ok_or_else(|| {
                InputError::plain(
                    format!("output {g} is in no part"),
                    "the parts do not cover the run; rerun the shards",
                )
            })
        })
        .collect::<Result<_, _>>()?;
    let mut flags: Vec<Value> = flags_of.into_values().flatten().collect();
    subset_flags(&outputs, &mut flags);
    if first.get("all_outputs").and_then(Value::as_bool) == Some(true) {
        unused_flags(&inputs, &outputs, &mut flags);
    }
    let mut out = first.as_object().cloned().unwrap_or_default();
    out.remove("shard");
    out.insert("inputs".to_string(), Value::from(inputs));
    out.insert("outputs".to_string(), Value::from(outputs));
    out.insert("flags".to_string(), Value::from(flags));
    out.insert("stats".to_string(), stats);
    out.insert("merged_shards".to_string(), Value::from(s0.count));
    Ok(Value::Object(out))
}

/// Output bits whose supports nest strictly where the expectations do not (the rule of the
/// audit: only outputs with an expectation and no undecided claim, in output order).
fn subset_flags(outputs: &[Value], flags: &mut Vec<Value>) {
    let rows: Vec<(&str, BTreeSet<&str>, BTreeSet<&str>)> = outputs
        .iter()
        .filter(|o| names(&o["undecided"]).is_empty())
        .filter(|o| o.get("expected").is_some_and(|e| !e.is_null()))
        .map(|o| {
            (
                o["name"].as_str().unwrap_or(""),
                names(&o["support"]).into_iter().collect(),
                names(&o["expected"]).into_iter().collect(),
            )
        })
        .collect();
    let strict = |a: &BTreeSet<&str>, b: &BTreeSet<&str>| a.len() < b.len() && a.is_subset(b);
    for (o1, s1, e1) in &rows {
        for (o2, s2, e2) in &rows {
            if o1 != o2 && strict(s1, s2) && !strict(e1, e2) {
                let mut f = Map::new();
                f.insert("flag".into(), Value::from("subset_support"));
                f.insert("output".into(), Value::from(*o1));
                f.insert("of".into(), Value::from(*o2));
                flags.push(Value::Object(f));
            }
        }
    }
}

/// Inputs in no support and in no undecided claim (unknown-value sources aside), in input order.
fn unused_flags(inputs: &[Value], outputs: &[Value], flags: &mut Vec<Value>) {
    let undecided: BTreeSet<&str> = outputs
        .iter()
        .flat_map(|o| names(&o["undecided"]))
        .collect();
    for i in inputs {
        let name = i["name"].as_str().unwrap_or("");
        let unused = i["in_supports"].as_u64() == Some(0)
            && !undecided.contains(name)
            && i["kind"].as_str() != Some("unknown");
        if unused {
            let mut f = Map::new();
            f.insert("flag".into(), Value::from("unused_input"));
            f.insert("input".into(), Value::from(name));
            f.insert(
                "connected".into(),
                Value::from(i["in_cones"].as_u64().unwrap_or(0) > 0),
            );
            flags.push(Value::Object(f));
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use serde_json::json;

    fn part(k: usize, outs: Vec<usize>, audits: Vec<Value>, flags: Vec<Value>) -> (String, Value) {
        (
            format!("c{k}.json"),
            json!({"schema": "equicone.cone/1", "design": "d", "all_outputs": true,
                   "inputs": [{"name": "a", "kind": "port", "in_cones": 1, "in_supports": 1},
                              {"name": "b", "kind": "port", "in_cones": 1, "in_supports": 0}],
                   "outputs": audits, "flags": flags,
                   "stats": {"claims": 2, "sat": {"calls": 1}},
                   "shard": {"index": k, "count": 2, "total_outputs": 2, "outputs": outs,
                             "inputs": "x", "options": "y"}}),
        )
    }

    #[test]
    fn merge_sums_counts_orders_flags_and_finds_unused_inputs() {
        let y = json!({"name": "y", "support": ["a"], "undecided": []});
        let z = json!({"name": "z", "support": ["a"], "undecided": []});
        let fy = json!({"flag": "redundant_input", "output": "y", "input": "b"});
        let fz = json!({"flag": "redundant_input", "output": "z", "input": "b"});
        let a = part(1, vec![0], vec![y], vec![fy.clone()]);
        let b = part(2, vec![1], vec![z], vec![fz.clone()]);
        let m = merge_cone(&[b.clone(), a.clone()]).unwrap();
        assert_eq!(m["outputs"][0]["name"], "y");
        assert_eq!(m["inputs"][0]["in_supports"], 2);
        assert_eq!(m["stats"]["sat"]["calls"], 2);
        let unused = json!({"flag": "unused_input", "input": "b", "connected": true});
        assert_eq!(m["flags"], json!([fy, fz, unused]));
        assert!(m.get("shard").is_none());
        let e = merge_cone(std::slice::from_ref(&a)).unwrap_err();
        assert!(e.to_string().contains("cone --shard"), "{e}");
    }
}
