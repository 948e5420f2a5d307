//! `equicone merge PART...`: check that partial reports of `prove --shard K/N` (or of
//! `cone --shard K/N`) belong to the same run and cover every output pair (output bit) once, then
//! write the whole report.

use super::common::{print, report_input_error, write_atomic};
use super::files::read_text;
use super::Exit;
use crate::diag::InputError;
use clap::Args;
use std::path::PathBuf;

/// Options of `merge`.
#[derive(Args, Debug)]
pub struct MergeArgs {
    /// The partial reports (JSON files written by `prove --shard K/N --report FILE` or by
    /// `cone --shard K/N --report FILE`), any order.
    #[arg(value_name = "PART", required = true)]
    parts: Vec<PathBuf>,
    /// Write the whole JSON report to this file (atomically).
    #[arg(long = "report", value_name = "FILE")]
    report: Option<PathBuf>,
    /// Print the whole JSON report on standard output.
    #[arg(long)]
    json: bool,
}

/// Run `merge`.
pub fn run(a: &MergeArgs) -> Exit {
    let mut parts = Vec::with_capacity(a.parts.len());
    for p in &a.parts {
        let text = match read_text(p) {
            Ok(t) => t,
            Err(e) => return report_input_error(&e),
        };
        let v: serde_json::Value =
            match serde_json::from_str(&text) {
                Ok(v) => v,
                Err(e) => return report_input_error(&InputError::plain(
                    format!("{}:{}:{}: not JSON: {e}", p.display(), e.line(), e.column()),
                    "give the JSON partial reports that `prove` or `cone --shard K/N --report FILE` wrote",
                )),
            };
        parts.push((p.display().to_string(), v));
    }
    let cone = parts
        .first()
        .is_some_and(|(_, v)| crate::shard::cone::is_cone_report(v));
    let whole = match cone {
        true => crate::shard::cone::merge_cone(&parts),
        false => crate::shard::merge_prove(&parts),
    };
    let whole = match whole {
        Ok(w) => w,
        Err(e) => return report_input_error(&e),
    };
    let text = serde_json::to_string_pretty(&whole).expect("JSON serializes") + "\n";
    if let Some(path) = &a.report {
        if let Err(e) = write_atomic(path, text.as_bytes()) {
            return report_input_error(&e);
        }
    }
    if cone {
        return cone_summary(a, &whole, &text);
    }
    let verdict = whole["verdict"].as_str().unwrap_or("undecided");
    if a.json {
        print(&text);
    } else {
        let count = |w: &str| {
            whole["pairs"]
                .as_array()
                .map_or(0, |ps| ps.iter().filter(|p| p["status"] == w).count())
        };
        print(&format!(
            "verdict     {} (merged {} shards: {} equivalent, {} different, {} undecided output pairs)\n",
            verdict.to_uppercase(),
            a.parts.len(),
            count("equivalent"),
            count("different"),
            count("undecided")
        ));
    }
    match verdict {
        "equivalent" => Exit::Ok,
        "different" => Exit::Flagged,
        _ => Exit::Undecided,
    }
}

/// Print a merged cone audit (JSON, or one summary line) and give its exit code.
fn cone_summary(a: &MergeArgs, whole: &serde_json::Value, text: &str) -> Exit {
    let len = |k: &str| whole[k].as_array().map_or(0, Vec::len);
    let undecided = whole["stats"]["undecided"].as_u64().unwrap_or(0);
    if a.json {
        print(text);
    } else {
        print(&format!(
            "cone audit  merged {} shards: {} output bits, {} claims, {} flags, {} undecided claims\n",
            a.parts.len(),
            len("outputs"),
            whole["stats"]["claims"].as_u64().unwrap_or(0),
            len("flags"),
            undecided
        ));
    }
    if len("flags") > 0 {
        Exit::Flagged
    } else if undecided > 0 {
        Exit::Undecided
    } else {
        Exit::Ok
    }
}
