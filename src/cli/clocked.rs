//! `prove` on clocked designs: the register pairing, the proof across it, or a trace from reset
//! (`crate::seq`), printed as text or JSON.

use super::common::{print, report_input_error, report_internal, write_atomic};
use super::Exit;
use crate::design::Design;
use crate::seq::{self, InitUnset, SeqError, SeqOptions};

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

/// What the clocked check takes from `prove`'s options.
pub struct ClockedRun<'a> {
    /// `--cycles`.
    pub cycles: usize,
    /// `--init-unset`.
    pub init_unset: InitUnsetArg,
    /// `--free-extra-inputs`.
    pub free_extra_inputs: bool,
    /// Limits.
    pub limits: crate::sat::Limits,
    /// `--json`.
    pub json: bool,
    /// `--report`.
    pub report: Option<&'a str>,
    /// Options that have no meaning for clocked designs and were given.
    pub refused: Vec<&'static str>,
}

/// Check clocked designs `r` and `c`.
pub fn run(r: &Design, c: &Design, a: ClockedRun<'_>) -> Exit {
    if let Some(opt) = a.refused.first() {
        eprintln!(
            "error: {opt} is not available for clocked designs ({} has registers)\n  help: leave {opt} out; clocked designs pair ports and registers by name and behaviour",
            if r.is_clocked() { &r.name } else { &c.name }
        );
        return Exit::BadInput;
    }
    let opts = SeqOptions {
        cycles: a.cycles,
        init_unset: a.init_unset.into(),
        free_extra_inputs: a.free_extra_inputs,
        limits: a.limits,
        ..SeqOptions::default()
    };
    let rep = match seq::check(r, c, &opts) {
        Ok(rep) => rep,
        Err(SeqError::Input(e)) => return report_input_error(&e),
        Err(SeqError::Internal(m)) => return report_internal(&m),
    };
    let json = serde_json::to_string_pretty(&rep).expect("report serializes") + "\n";
    if let Some(path) = a.report {
        if let Err(e) = write_atomic(path, json.as_bytes()) {
            return report_input_error(&e);
        }
    }
    print(&if a.json { json } else { rep.to_string() });
    match rep.verdict {
        "equivalent" => Exit::Ok,
        "different" => Exit::Flagged,
        _ => Exit::Undecided,
    }
}
