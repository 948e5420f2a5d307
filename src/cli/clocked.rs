//! `prove` on clocked designs: the register pairing, the proof across it, or a trace from reset
//! (`crate::seq`), printed as text or JSON.

use super::common::{print, report_input_error, report_internal, write_atomic};
use super::replay::ReplayArgs;
use super::Exit;
use crate::check::{self, CheckError, CheckRequest, ClockedSettings};
use crate::explain::trace_cubes::{trace_cubes, trace_cubes_text};
use crate::sat::Limits;
use crate::seq::InitUnset;
use std::path::{Path, PathBuf};

/// How registers without a reset start, on the command line.
#[derive(Copy, Clone, Debug, PartialEq, Eq, clap::ValueEnum)]
pub enum InitUnsetArg {
    /// Each at its own free value (the default; reported).
    Free,
    /// All at 0 (the usual convention for the ISCAS-89 circuits).
    #[value(name = "0")]
    Zero,
    /// All at 1.
    #[value(name = "1")]
    One,
}

impl From<InitUnsetArg> for InitUnset {
    fn from(a: InitUnsetArg) -> InitUnset {
        match a {
            InitUnsetArg::Free => InitUnset::Free,
            InitUnsetArg::Zero => InitUnset::Value(false),
            InitUnsetArg::One => InitUnset::Value(true),
        }
    }
}

/// The replay options of a clocked `prove` and the source files of each side.
pub struct ClockedReplay<'a> {
    /// `--explain`, `--vcd`, `--testbench`.
    pub args: &'a ReplayArgs,
    /// Source paths of the reference and the candidate.
    pub files: (&'a [PathBuf], &'a [PathBuf]),
    /// The seed of random cycles.
    pub seed: u64,
}

/// Check clocked designs through the check session and print the report.
pub fn run(
    req: &CheckRequest<'_>,
    settings: &ClockedSettings,
    json: bool,
    report: Option<&Path>,
    replay: &ClockedReplay<'_>,
) -> Exit {
    // The readers' warnings (a gated clock read as an enable, ignored delays, ...) go to
    // stderr: the clocked report has no place for them.
    for w in req.reference.warnings.iter().chain(&req.candidate.warnings) {
        eprintln!("{w}");
    }
    let rep = match check::check_clocked(req, settings) {
        Ok(rep) => rep,
        Err(CheckError::Input(e)) => return report_input_error(&e),
        Err(CheckError::Internal(m)) => return report_internal(&m),
    };
    let mut cubes = None;
    let mut failed = None;
    if let (Some(cl), Some(t)) = (replay.args.cube_limits(), &rep.trace) {
        let limits = Limits::new(req.options.timeout, req.options.conflict_limit);
        match trace_cubes(req.reference, req.candidate, t, &cl, &limits) {
            Ok(c) => cubes = Some(c),
            Err(m) => return report_internal(&m),
        }
    }
    if let Err(code) = super::replay::write_trace_files(
        replay.args,
        (req.reference, req.candidate),
        replay.files,
        &rep,
        req.options.port_map.as_deref(),
        settings.init_unset,
        replay.seed,
    ) {
        failed = Some(code);
    }
    let text = match &cubes {
        None => serde_json::to_string_pretty(&rep).expect("report serializes") + "\n",
        Some(e) => {
            let mut v = serde_json::to_value(&rep).expect("report serializes");
            if let serde_json::Value::Object(m) = &mut v {
                m.insert(
                    "explanation".into(),
                    serde_json::to_value(e).expect("cubes serialize"),
                );
            }
            serde_json::to_string_pretty(&v).expect("report serializes") + "\n"
        }
    };
    if let Some(path) = report {
        if let Err(e) = write_atomic(path, text.as_bytes()) {
            failed = Some(report_input_error(&e));
        }
    }
    print(&if json {
        text
    } else {
        match &cubes {
            None => rep.to_string(),
            Some(e) => rep.to_string() + &trace_cubes_text(e),
        }
    });
    if let Some(code) = failed {
        return code;
    }
    match rep.verdict {
        "equivalent" => Exit::Ok,
        "different" => Exit::Flagged,
        _ => Exit::Undecided,
    }
}
