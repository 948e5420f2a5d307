//! The check session for clocked designs: the same [`CheckRequest`] in, the clocked report
//! ([`SeqReport`]: register pairs, output pairs, trace) out, by `crate::seq`. Assumptions,
//! certificates and pairing by position do not apply to clocked designs and are refused.

use super::{CheckError, CheckRequest};
use crate::diag::InputError;
use crate::engine::PairBy;
use crate::sat::Limits;
use crate::seq::{self, InitUnset, SeqError, SeqOptions, SeqReport};

/// Settings that only clocked checks have.
#[derive(Clone, Debug)]
pub struct ClockedSettings {
    /// Cycles from reset the bounded unrolling checks.
    pub cycles: usize,
    /// How registers without a reset start.
    pub init_unset: InitUnset,
    /// Deepest k-induction step (`None`: the default of [`SeqOptions`]).
    pub k_induction: Option<usize>,
}

impl Default for ClockedSettings {
    fn default() -> Self {
        ClockedSettings {
            cycles: SeqOptions::default().cycles,
            init_unset: InitUnset::Free,
            k_induction: None,
        }
    }
}

/// Whether a request compares clocked designs (either design has registers).
pub fn is_clocked(req: &CheckRequest<'_>) -> bool {
    req.reference.is_clocked() || req.candidate.is_clocked()
}

/// Run one comparison of clocked designs.
pub fn check_clocked(
    req: &CheckRequest<'_>,
    settings: &ClockedSettings,
) -> Result<SeqReport, CheckError> {
    let refuse = |what: &str| {
        CheckError::Input(InputError::plain(
            format!("{what} is not available for clocked designs (a design has registers)"),
            format!(
                "leave {what} out; clocked designs pair ports and registers by name and behaviour"
            ),
        ))
    };
    if !req.assumptions.is_empty() {
        return Err(refuse("--assume"));
    }
    if req.certificate.is_some() {
        return Err(refuse("--proof"));
    }
    if req.options.pair_by != PairBy::Name {
        return Err(refuse("--pair-by position"));
    }
    let o = SeqOptions {
        cycles: settings.cycles,
        init_unset: settings.init_unset,
        free_extra_inputs: req.options.free_extra_inputs,
        limits: Limits::new(req.options.timeout, req.options.conflict_limit),
        k_induction: settings.k_induction,
        port_map: req.options.port_map.clone(),
        ..SeqOptions::default()
    };
    seq::check(req.reference, req.candidate, &o).map_err(|e| match e {
        SeqError::Input(e) => CheckError::Input(e),
        SeqError::Internal(m) => CheckError::Internal(m),
    })
}
