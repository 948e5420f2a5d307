//! `prove` on clocked designs: the register pairing, the proof across it, or a trace from reset
//! (`crate::seq`), printed as text or JSON.

use super::common::{print, report_input_error, report_internal, write_atomic};
use super::Exit;
use crate::check::{self, CheckError, CheckRequest, ClockedSettings};
use crate::seq::InitUnset;

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

/// Check clocked designs through the check session and print the report.
pub fn run(
    req: &CheckRequest<'_>,
    settings: &ClockedSettings,
    json: bool,
    report: Option<&str>,
) -> Exit {
    let rep = match check::check_clocked(req, settings) {
        Ok(rep) => rep,
        Err(CheckError::Input(e)) => return report_input_error(&e),
        Err(CheckError::Internal(m)) => return report_internal(&m),
    };
    let text = serde_json::to_string_pretty(&rep).expect("report serializes") + "\n";
    if let Some(path) = report {
        if let Err(e) = write_atomic(path, text.as_bytes()) {
            return report_input_error(&e);
        }
    }
    print(&if json { text } else { rep.to_string() });
    match rep.verdict {
        "equivalent" => Exit::Ok,
        "different" => Exit::Flagged,
        _ => Exit::Undecided,
    }
}
