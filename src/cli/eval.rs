//! `equicone eval`: the outputs of one design for one input vector given by `--set` or by a
//! `--vector` file (a JSON counterexample from `prove --json`, or an object of name/value pairs).

use super::common::{print, report_input_error, DesignArgs};
use super::Exit;
use crate::design::Design;
use crate::diag::InputError;
use crate::report::{self, values};
use clap::Args;
use serde::Serialize;
use std::path::PathBuf;

/// Options of `eval`.
#[derive(Args, Debug)]
pub struct EvalArgs {
    #[command(flatten)]
    design: DesignArgs,
    /// Set an input: a bit (`d[3]=1`) or a whole port (`s=5`, `s=4'b0101`, `d=0xff`); repeatable.
    #[arg(long = "set", value_name = "NAME=VALUE")]
    set: Vec<String>,
    /// Read input values from a JSON file (a `prove --json` report: its first counterexample; or {"name": value}).
    #[arg(long, value_name = "FILE")]
    vector: Option<PathBuf>,
    /// Value of every input not set otherwise (default: all inputs must be set).
    #[arg(long, value_name = "0|1")]
    rest: Option<u8>,
    /// Print the result as JSON.
    #[arg(long)]
    json: bool,
    /// Also write the vector (with --trace: every cycle of the trace) as a Value Change Dump
    /// (IEEE 1364-2005 clause 18) to FILE.
    #[arg(long, value_name = "FILE")]
    vcd: Option<PathBuf>,
    /// With --vcd: also every internal net of the design's netlist.
    #[arg(long)]
    vcd_nets: bool,
    /// Step a clocked design through a trace from reset (a `prove --json` report or its `trace`).
    #[arg(long, value_name = "FILE", conflicts_with_all = ["set", "vector", "rest"])]
    trace: Option<PathBuf>,
    /// Which design of the report's trace or counterexample this is (its own unknown inputs,
    /// initial values and, for a pairing by position, names). Default for a trace: reference;
    /// for a --vector report: the side whose names the design has.
    #[arg(long, value_enum)]
    side: Option<TraceSide>,
}

/// `--side` of `eval --trace`.
#[derive(Copy, Clone, Debug, PartialEq, Eq, clap::ValueEnum)]
pub enum TraceSide {
    /// The trace's reference.
    Reference,
    /// The trace's candidate.
    Candidate,
}

#[derive(Serialize)]
struct EvalReport {
    schema: u32,
    design: String,
    inputs: serde_json::Map<String, serde_json::Value>,
    outputs: serde_json::Map<String, serde_json::Value>,
}

/// Run `eval`.
pub fn run(a: &EvalArgs) -> Exit {
    let d = match a.design.load() {
        Ok(d) => d,
        Err(e) => return e,
    };
    if let Some(path) = &a.trace {
        let side = match a.side.unwrap_or(TraceSide::Reference) {
            TraceSide::Reference => crate::seq::Side::Reference,
            TraceSide::Candidate => crate::seq::Side::Candidate,
        };
        return super::eval_trace::run(&d, path, side, a.json, a.vcd.as_deref());
    }
    match evaluate(&d, a) {
        Ok(text) => {
            print(&text);
            Exit::Ok
        }
        Err(e) => report_input_error(&e),
    }
}

fn evaluate(d: &Design, a: &EvalArgs) -> Result<String, InputError> {
    let mut vals: Vec<Option<bool>> = vec![None; d.inputs.len()];
    if let Some(path) = &a.vector {
        let bits = read_vector(path)?;
        for (k, v) in resolve_vector(d, &path.display().to_string(), &bits, a.side)? {
            vals[k] = Some(v);
        }
    }
    for s in &a.set {
        apply_set(d, s, &mut vals)?;
    }
    let rest = match a.rest {
        None => None,
        Some(0) => Some(false),
        Some(1) => Some(true),
        Some(x) => {
            return Err(InputError::plain(
                format!("--rest {x} is not 0 or 1"),
                "use `--rest 0` or `--rest 1`",
            ))
        }
    };
    let missing: Vec<&str> = d
        .inputs
        .iter()
        .zip(&vals)
        .filter(|(_, v)| v.is_none())
        .map(|(b, _)| b.name.as_str())
        .collect();
    if !missing.is_empty() && rest.is_none() {
        let shown: Vec<&str> = missing.iter().take(12).copied().collect();
        return Err(InputError::plain(
            format!(
                "{} input bit{} not set: {}{}",
                missing.len(),
                if missing.len() == 1 { " is" } else { "s are" },
                shown.join(", "),
                if missing.len() > 12 { ", ..." } else { "" }
            ),
            "set them with `--set NAME=VALUE`, or give `--rest 0` to set the others to 0",
        ));
    }
    let inputs: Vec<bool> = vals.iter().map(|v| v.or(rest).unwrap_or(false)).collect();
    let outs = d.eval(&inputs);
    if let Some(path) = &a.vcd {
        let text = crate::explain::waves::design_vcd(d, &inputs, a.vcd_nets);
        super::common::write_atomic(path, text.as_bytes())?;
        eprintln!("vcd: {}", path.display());
    }
    if a.json {
        let mut im = serde_json::Map::new();
        for (b, v) in d.inputs.iter().zip(&inputs) {
            im.insert(b.name.clone(), (*v as u8).into());
        }
        let mut om = serde_json::Map::new();
        for (o, v) in d.outputs.iter().zip(&outs) {
            om.insert(o.name.clone(), (*v as u8).into());
        }
        return Ok(report::to_json(&EvalReport {
            schema: 1,
            design: d.name.clone(),
            inputs: im,
            outputs: om,
        }));
    }
    let asc = d.ascending_ports();
    let mut s = format!("design   {}\ninputs\n", d.name);
    s += &values::wrap(
        &values::group_declared(
            d.inputs
                .iter()
                .zip(&inputs)
                .map(|(b, v)| (b.name.as_str(), *v)),
            &asc,
        ),
        "  ",
        100,
    );
    s += "outputs\n";
    s += &values::wrap(
        &values::group_declared(
            d.outputs
                .iter()
                .zip(&outs)
                .map(|(o, v)| (o.name.as_str(), *v)),
            &asc,
        ),
        "  ",
        100,
    );
    Ok(s)
}

/// Parse `NAME=VALUE` and set the named bit or port.
fn apply_set(d: &Design, s: &str, vals: &mut [Option<bool>]) -> Result<(), InputError> {
    let Some((name, value)) = s.split_once('=') else {
        return Err(InputError::plain(
            format!("`--set {s}` has no `=`"),
            "write `--set NAME=VALUE`, e.g. `--set s=5` or `--set d[3]=1`",
        ));
    };
    let (name, value) = (name.trim(), value.trim());
    let bad = |why: &str| {
        InputError::plain(
            format!("`--set {s}`: {why}"),
            "values are 0/1 for a bit, or a number for a port: 5, -3 (two's complement), 0x1f, 0b101, 4'b0101, 8'hff",
        )
    };
    if let Some(k) = d.input_index(name) {
        vals[k] = Some(match value {
            "0" | "1'b0" => false,
            "1" | "1'b1" => true,
            _ => return Err(bad("a single bit takes 0 or 1")),
        });
        return Ok(());
    }
    let mut bits: Vec<(i64, usize)> = d
        .inputs
        .iter()
        .enumerate()
        .filter(|(_, b)| b.port == name && b.index.is_some())
        .map(|(k, b)| (b.index.unwrap_or(0), k))
        .collect();
    if bits.is_empty() {
        let mut names: Vec<&str> = Vec::new();
        for b in d.inputs.iter().filter(|b| !b.is_unknown()) {
            if !names.contains(&b.port.as_str()) && names.len() < 12 {
                names.push(b.port.as_str());
            }
        }
        return Err(InputError::plain(
            format!("`--set {s}`: the design has no input `{name}`"),
            format!("inputs of {} include: {}", d.name, names.join(", ")),
        ));
    }
    bits.sort();
    if d.ascending_ports().contains(name) {
        // Declared `[0:7]`: the lowest index is the most significant bit, as in Verilog.
        bits.reverse();
    }
    let n = bits.len();
    let v = match value.strip_prefix('-') {
        // A negative number: its two's complement over the port's width.
        Some(m) => {
            let m = parse_number(m).ok_or_else(|| bad("not a number"))?;
            if n < 128 && m > 1u128 << (n - 1) || n >= 128 && m > 1u128 << 127 {
                return Err(bad(&format!(
                    "the value does not fit in {n} bits as a two's complement number (at least -{})",
                    if n <= 128 { 1u128 << (n - 1) } else { 1u128 << 127 }
                )));
            }
            let v = m.wrapping_neg();
            if n < 128 {
                v & ((1u128 << n) - 1)
            } else {
                v
            }
        }
        None => parse_number(value).ok_or_else(|| bad("not a number"))?,
    };
    if n < 128 && v >> n != 0 {
        return Err(bad(&format!("the value does not fit in {n} bits")));
    }
    for (j, &(_, k)) in bits.iter().enumerate() {
        vals[k] = Some(j < 128 && (v >> j) & 1 == 1);
    }
    Ok(())
}

/// Parse 5, 0x1f, 0b101, 0o17, or a Verilog literal such as 4'b0101, 8'hff, 'd12.
pub fn parse_number(s: &str) -> Option<u128> {
    let s = s.replace('_', "");
    let s = s.trim();
    let (radix, digits) = if let Some(q) = s.find('\'') {
        let rest = s[q + 1..].trim_start_matches(['s', 'S']);
        let mut ch = rest.chars();
        let base = ch.next()?;
        let radix = match base.to_ascii_lowercase() {
            'b' => 2,
            'o' => 8,
            'd' => 10,
            'h' => 16,
            _ => return None,
        };
        (radix, ch.as_str().to_string())
    } else if let Some(h) = s.strip_prefix("0x").or_else(|| s.strip_prefix("0X")) {
        (16, h.to_string())
    } else if let Some(b) = s.strip_prefix("0b").or_else(|| s.strip_prefix("0B")) {
        (2, b.to_string())
    } else if let Some(o) = s.strip_prefix("0o") {
        (8, o.to_string())
    } else {
        (10, s.to_string())
    };
    if digits.is_empty() {
        return None;
    }
    u128::from_str_radix(&digits, radix).ok()
}

/// One bit of a vector file: its name (the reference's, in a report), the candidate's name
/// of a paired bit when it differs, which design it belongs to (a report's `side`), its value.
struct VectorBit {
    name: String,
    candidate_name: Option<String>,
    side: Option<String>,
    value: bool,
}

/// The input index and value of each bit of a vector for design `d`. Bits of a report that
/// belong to the other design alone are skipped; the side is `side`, or else the one whose
/// names `d` has (the reference first). A name `d` does not have is an error, as in `--set`.
fn resolve_vector(
    d: &Design,
    path: &str,
    bits: &[VectorBit],
    side: Option<TraceSide>,
) -> Result<Vec<(usize, bool)>, InputError> {
    let on = |side: TraceSide| -> Result<Vec<(usize, bool)>, &str> {
        let mine = match side {
            TraceSide::Reference => "reference",
            TraceSide::Candidate => "candidate",
        };
        let mut out = Vec::new();
        for b in bits {
            if b.side.as_deref().is_some_and(|s| s != "both" && s != mine) {
                continue;
            }
            let name = match side {
                TraceSide::Candidate => b.candidate_name.as_deref().unwrap_or(&b.name),
                TraceSide::Reference => &b.name,
            };
            match d.input_index(name) {
                Some(k) => out.push((k, b.value)),
                None => return Err(name),
            }
        }
        Ok(out)
    };
    let tried = match side {
        Some(s) => on(s),
        None => on(TraceSide::Reference).or_else(|e| on(TraceSide::Candidate).map_err(|_| e)),
    };
    tried.map_err(|name| {
        let mut names: Vec<&str> = Vec::new();
        for b in d.inputs.iter().filter(|b| !b.is_unknown()) {
            if !names.contains(&b.port.as_str()) && names.len() < 12 {
                names.push(b.port.as_str());
            }
        }
        InputError::plain(
            format!("`--vector {path}`: the design has no input `{name}`"),
            format!(
                "inputs of {} include: {}; give the design the vector was made for (`--side candidate` for a report's candidate)",
                d.name,
                names.join(", ")
            ),
        )
    })
}

/// The bits of a vector file.
fn read_vector(path: &std::path::Path) -> Result<Vec<VectorBit>, InputError> {
    let text = super::files::read_text(path)?;
    // The file's name in messages (lossy when it is not UTF-8).
    let path = path.display().to_string();
    let path = path.as_str();
    let v: serde_json::Value = serde_json::from_str(&text).map_err(|e| {
        InputError::one(
            crate::diag::Diagnostic::error(
                Some(crate::diag::SourcePos::new(&std::sync::Arc::from(path), e.line() as u32, e.column() as u32)),
                format!("not valid JSON: {e}"),
            )
            .with_help("give the file written by `prove --json` (or `--report`), or an object such as {\"a\": 1, \"b\": 0}"),
        )
    })?;
    let bit = |x: &serde_json::Value| match x {
        serde_json::Value::Bool(b) => Some(*b),
        serde_json::Value::Number(n) => match n.as_u64() {
            Some(0) => Some(false),
            Some(1) => Some(true),
            _ => None,
        },
        _ => None,
    };
    let mut out = Vec::new();
    if let Some(inputs) = v
        .pointer("/counterexamples/0/inputs")
        .and_then(|x| x.as_array())
    {
        for i in inputs {
            if let (Some(n), Some(b)) = (
                i.get("name").and_then(|n| n.as_str()),
                i.get("value").and_then(bit),
            ) {
                let text = |k: &str| i.get(k).and_then(|x| x.as_str()).map(str::to_string);
                out.push(VectorBit {
                    name: n.to_string(),
                    candidate_name: text("candidate_name"),
                    side: text("side"),
                    value: b,
                });
            }
        }
        return Ok(out);
    }
    if let Some(obj) = v.as_object() {
        if obj.contains_key("verdict") {
            return Err(InputError::plain(
                format!("`{path}` is a proof report without a counterexample"),
                "only a report whose verdict is `different` carries an input vector",
            ));
        }
        for (n, x) in obj {
            let b = bit(x).ok_or_else(|| {
                InputError::plain(
                    format!("`{path}`: the value of `{n}` is not 0, 1, true or false"),
                    "give one bit per name, e.g. {\"d[3]\": 1}",
                )
            })?;
            out.push(VectorBit {
                name: n.clone(),
                candidate_name: None,
                side: None,
                value: b,
            });
        }
        return Ok(out);
    }
    Err(InputError::plain(
        format!("`{path}` holds no input vector"),
        "give the file written by `prove --json`, or an object such as {\"a\": 1, \"b\": 0}",
    ))
}
