//! The check session: the library's one entry point for comparing two designs. A
//! [`CheckRequest`] (the designs, how to pair them, the assumptions, the engine settings, which
//! diagnosis and certificate to produce) goes in, a [`CheckOutcome`] (the engine's report, the
//! diagnosis of a difference, the certificate of the equivalent pairs) comes out.
//!
//! The session owns the path "pair, assume, prove, diagnose, certify"; the engine knows nothing
//! of diagnosis and the command line only parses flags, calls [`check`] and prints. Reading the
//! files and writing the results stay with the caller. [`miter_cnf`] builds the formula of
//! `equicone cnf` from the same pairing.

mod clocked;
mod miter;

pub use clocked::{check_clocked, is_clocked, ClockedSettings};
pub use miter::{miter_cnf, miter_cnf_mapped, MiterCnf};

use crate::certify::{certify, Certificate, NoCertificate, ProofFormat};
use crate::design::Design;
use crate::diag::InputError;
use crate::diagnose::{self, Diagnosis};
use crate::engine::{self, ProveOptions, ProveReport, Shared, Verdict};
use crate::explain::{cubes::CubeLimits, Explanation};
use crate::sat::Limits;
use crate::shard::{Shard, ShardStamp};
use serde::Serialize;

/// What to diagnose when output pairs differ.
#[derive(Clone, Debug, PartialEq, Eq, Default)]
pub enum DiagnosisRequest {
    /// No diagnosis.
    Off,
    /// Supports side by side, and route tables over the named select bus, or when none is
    /// named over a usual select name (`sel`, `s`, `select`, `addr`) that both designs have.
    #[default]
    Auto,
    /// As [`DiagnosisRequest::Auto`], with route tables over this bus.
    Select(String),
}

/// The diagnosis's default time share (`prove --diagnosis-time`).
pub const DIAGNOSIS_TIME: std::time::Duration = std::time::Duration::from_secs(10);

/// One comparison to run.
#[derive(Clone, Debug)]
pub struct CheckRequest<'a> {
    /// The trusted design.
    pub reference: &'a Design,
    /// The design being checked.
    pub candidate: &'a Design,
    /// Verilog expressions over the input ports that every compared vector satisfies.
    pub assumptions: Vec<String>,
    /// Pairing, engine and limits; `options.timeout` covers the whole session (diagnosis and
    /// certificate included).
    pub options: ProveOptions,
    /// What to diagnose when pairs differ.
    pub diagnosis: DiagnosisRequest,
    /// Certify the equivalent output pairs in this proof format.
    pub certificate: Option<ProofFormat>,
    /// Explain the differing output pairs by difference cubes, within these limits.
    pub explain: Option<CubeLimits>,
    /// Keep the paired graph in the outcome, to replay counterexamples (VCD, testbench).
    pub keep_pairing: bool,
    /// The diagnosis's own time share (it also stops at the session's deadline); `None`:
    /// the deadline alone.
    pub diagnosis_time: Option<std::time::Duration>,
}

impl<'a> CheckRequest<'a> {
    /// A request with default settings: pairing by name, the default engine, no assumptions,
    /// automatic diagnosis, no certificate.
    pub fn new(reference: &'a Design, candidate: &'a Design) -> Self {
        CheckRequest {
            reference,
            candidate,
            assumptions: Vec::new(),
            options: ProveOptions::default(),
            diagnosis: DiagnosisRequest::Auto,
            certificate: None,
            explain: None,
            keep_pairing: false,
            diagnosis_time: Some(DIAGNOSIS_TIME),
        }
    }
}

/// The result of a session. Its JSON form is the report's, with the diagnosis as a last
/// `diagnosis` field when there is one.
#[derive(Clone, Debug, Serialize)]
pub struct CheckOutcome {
    /// The engine's report: verdicts with their evidence, counterexamples, figures.
    #[serde(flatten)]
    pub report: ProveReport,
    /// Supports and route tables of differing pairs.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub diagnosis: Option<Diagnosis>,
    /// The certificate of the equivalent pairs, or why there is none (when one was asked for).
    #[serde(skip)]
    pub certificate: Option<Result<Certificate, NoCertificate>>,
    /// A select bus named in the request that is not an input bus of both designs (no route
    /// tables were built).
    #[serde(skip)]
    pub select_missing: Option<String>,
    /// Difference cubes of the differing output pairs (when asked for).
    #[serde(skip_serializing_if = "Option::is_none")]
    pub explanation: Option<Explanation>,
    /// The paired graph the proof ran on, assumptions built in (when asked for).
    #[serde(skip)]
    pub pairing: Option<Shared>,
    /// For a shard of a split run ([`check_shard`]): which output pairs it decided.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub shard: Option<ShardStamp>,
}

impl CheckOutcome {
    /// The overall verdict.
    pub fn verdict(&self) -> Verdict {
        self.report.verdict
    }
}

/// Why a session gave no outcome.
#[derive(Debug)]
pub enum CheckError {
    /// The designs cannot be paired or the assumptions are malformed or unsatisfiable
    /// (exit code 2).
    Input(InputError),
    /// An internal check failed; no claim is made.
    Internal(String),
}

impl From<InputError> for CheckError {
    fn from(e: InputError) -> Self {
        CheckError::Input(e)
    }
}

impl From<engine::ProveError> for CheckError {
    fn from(e: engine::ProveError) -> Self {
        match e {
            engine::ProveError::Input(e) => CheckError::Input(e),
            engine::ProveError::Internal(m) => CheckError::Internal(m),
        }
    }
}

impl std::fmt::Display for CheckError {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        match self {
            CheckError::Input(e) => write!(f, "{e}"),
            CheckError::Internal(m) => f.write_str(m),
        }
    }
}

/// Run one comparison: pair, build the assumptions in, prove, then diagnose a difference and
/// certify the equivalent pairs as the request asks.
pub fn check(req: &CheckRequest<'_>) -> Result<CheckOutcome, CheckError> {
    check_shard(req, None)
}

/// As [`check`], deciding only the output pairs of `shard` (all when `None`); the outcome's
/// stamp lists them (its fingerprints are left empty for the caller, who has the files).
pub fn check_shard(
    req: &CheckRequest<'_>,
    shard: Option<Shard>,
) -> Result<CheckOutcome, CheckError> {
    let (r, c) = (req.reference, req.candidate);
    if is_clocked(req) {
        return Err(CheckError::Input(InputError::plain(
            "the designs have registers; this session compares combinational logic",
            "use `check_clocked` (the `prove` command does so by itself)",
        )));
    }
    let opts = &req.options;
    // The session's clock: the engine, the diagnosis and the certificate share the budget.
    let deadline = Limits::new(opts.timeout, None);
    let mut shared = engine::pairing::pair_mapped(
        r,
        c,
        opts.pair_by,
        opts.free_extra_inputs,
        opts.port_map.as_deref(),
    )?;
    if !opts.strict_unknowns {
        engine::dont_care::apply(&mut shared, r);
    }
    crate::assume::apply_to_shared(&mut shared, r, c, &req.assumptions)?;
    let stamp = shard.map(|s| crate::shard::restrict(&mut shared, s));
    let kept = (req.certificate.is_some() || req.explain.is_some() || req.keep_pairing)
        .then(|| shared.clone());
    let report = engine::prove_shared(r, c, shared, &req.assumptions, opts)?;
    let (select, select_missing) = match &req.diagnosis {
        DiagnosisRequest::Off => (None, None),
        DiagnosisRequest::Auto => (diagnose::pick_select(r, c, None), None),
        DiagnosisRequest::Select(b) => match diagnose::pick_select(r, c, Some(b)) {
            Some(s) => (Some(s), None),
            None => (None, Some(b.clone())),
        },
    };
    let mut diagnosis = None;
    if report.verdict == Verdict::Different && req.diagnosis != DiagnosisRequest::Off {
        let share = match (deadline.remaining(), req.diagnosis_time) {
            (Some(a), Some(b)) => Some(a.min(b)),
            (a, b) => a.or(b),
        };
        let limits = Limits::new(share, opts.conflict_limit);
        if let (Ok((r2, rc)), Ok((c2, cc))) = (
            crate::assume::on_design(r, &req.assumptions),
            crate::assume::on_design(c, &req.assumptions),
        ) {
            diagnosis = diagnose::diagnose(&r2, &c2, &report, select.as_deref(), (rc, cc), &limits);
        }
    }
    let certificate = match (req.certificate, &kept) {
        (Some(format), Some(shared)) => {
            let pairs: Vec<usize> = (0..report.pairs.len())
                .filter(|&p| report.pairs[p].status() == Verdict::Equivalent)
                .collect();
            let limits = Limits::new(deadline.remaining(), None);
            match certify(r, c, shared, &req.assumptions, &pairs, format, &limits) {
                Err(NoCertificate::Satisfiable) => {
                    return Err(CheckError::Internal(
                        "the separately encoded miter is satisfiable although the engine proved the pairs equal; no claim is made".to_string(),
                    ))
                }
                other => Some(other),
            }
        }
        _ => None,
    };
    let explanation = match (&req.explain, &kept) {
        (Some(cl), Some(shared)) if !report.counterexamples.is_empty() => {
            let limits = Limits::new(deadline.remaining(), opts.conflict_limit);
            Some(crate::explain::explain(
                shared,
                r,
                c,
                &report,
                cl,
                crate::explain::MAX_PAIRS,
                &limits,
            ))
        }
        _ => None,
    };
    Ok(CheckOutcome {
        report,
        diagnosis,
        certificate,
        select_missing,
        explanation,
        pairing: if req.keep_pairing { kept } else { None },
        shard: stamp,
    })
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::engine::{EngineKind, Method, PairVerdict};
    use crate::front::bench::read_bench;
    use std::sync::Arc;

    fn bench(name: &str, text: &str) -> Design {
        read_bench(&Arc::from(name), text).expect("reads")
    }

    /// A 2:1 selector `y = s ? b : a` and one with its data inputs crossed.
    fn selectors() -> (Design, Design) {
        let head = "INPUT(s)\nINPUT(a)\nINPUT(b)\nOUTPUT(y)\nOUTPUT(z)\nns = NOT(s)\n";
        let good =
            format!("{head}t0 = AND(a, ns)\nt1 = AND(b, s)\ny = OR(t0, t1)\nz = AND(a, b)\n");
        let bad = format!("{head}t0 = AND(b, ns)\nt1 = AND(a, s)\ny = OR(t0, t1)\nz = AND(b, a)\n");
        (bench("good.bench", &good), bench("bad.bench", &bad))
    }

    #[test]
    fn a_difference_carries_its_counterexample_and_diagnosis() {
        let (r, c) = selectors();
        let out = check(&CheckRequest::new(&r, &c)).expect("checks");
        assert_eq!(out.verdict(), Verdict::Different);
        let y = &out.report.pairs[0];
        let k = y.verdict.counterexample().expect("a counterexample index");
        assert!(out.report.counterexamples[k]
            .differing
            .iter()
            .any(|d| d.reference == "y"));
        // z = a & b on both sides: equal, with the method that showed it.
        assert!(matches!(
            out.report.pairs[1].verdict,
            PairVerdict::Equivalent(_)
        ));
        let d = out.diagnosis.expect("diagnosed");
        assert_eq!(d.select.as_deref(), Some("s"));
        assert_eq!(d.routes.len(), 1);
        // Without a diagnosis request there is none.
        let off = CheckRequest {
            diagnosis: DiagnosisRequest::Off,
            ..CheckRequest::new(&r, &c)
        };
        assert!(check(&off).expect("checks").diagnosis.is_none());
    }

    #[test]
    fn assumptions_restrict_the_comparison() {
        let (r, c) = selectors();
        // With s = a = b both selectors output the same value.
        let req = CheckRequest {
            assumptions: vec!["s == a && a == b".to_string()],
            ..CheckRequest::new(&r, &c)
        };
        let out = check(&req).expect("checks");
        assert_eq!(out.verdict(), Verdict::Equivalent, "{:?}", out.report.pairs);
        assert!(out.diagnosis.is_none());
    }

    #[test]
    fn a_named_select_bus_that_is_missing_is_reported() {
        let (r, c) = selectors();
        let req = CheckRequest {
            diagnosis: DiagnosisRequest::Select("nope".to_string()),
            ..CheckRequest::new(&r, &c)
        };
        let out = check(&req).expect("checks");
        assert_eq!(out.select_missing.as_deref(), Some("nope"));
        assert!(out
            .diagnosis
            .expect("supports still compared")
            .select
            .is_none());
    }

    #[test]
    fn a_certificate_covers_the_equivalent_pairs() {
        let (r, c) = selectors();
        let req = CheckRequest {
            certificate: Some(ProofFormat::Drat),
            ..CheckRequest::new(&r, &c)
        };
        let out = check(&req).expect("checks");
        let cert = out.certificate.expect("asked for").expect("made");
        assert_eq!(cert.pairs, 1);
        let none = check(&CheckRequest::new(&r, &c)).expect("checks");
        assert!(none.certificate.is_none());
    }

    #[test]
    fn undecided_pairs_say_why_and_serialize_as_before() {
        let (r, c) = selectors();
        let mut req = CheckRequest::new(&r, &c);
        req.options.engine = EngineKind::Exhaustive;
        let out = check(&req).expect("checks");
        assert_ne!(out.verdict(), Verdict::Undecided);
        let json = crate::report::to_json(&out);
        let v: serde_json::Value = serde_json::from_str(&json).expect("json");
        assert_eq!(v["engine"], "exhaustive");
        assert_eq!(v["pairs"][0]["status"], "different");
        assert!(v["pairs"][0]["counterexample"].is_u64());
        assert!(v["pairs"][1].get("stopped").is_none());
        assert!(v.get("diagnosis").is_some());
        // An undecided pair: method `none` and its stop reason, no counterexample.
        let p = crate::engine::PairResult {
            reference: "y".into(),
            candidate: "y".into(),
            verdict: PairVerdict::Undecided(crate::sat::StopReason::Timeout),
            cost: Default::default(),
        };
        let j = serde_json::to_value(&p).expect("json");
        assert_eq!(j["status"], "undecided");
        assert_eq!(j["method"], "none");
        assert_eq!(j["stopped"], "timeout");
        assert!(j.get("counterexample").is_none());
        assert_eq!(
            PairVerdict::Equivalent(Method::Sat).method(),
            Some(Method::Sat)
        );
    }

    #[test]
    fn the_miter_formula_names_inputs_and_pairs() {
        let (r, c) = selectors();
        let m = miter_cnf(&r, &c, crate::engine::PairBy::Name, false, false, &[]).expect("pairs");
        let text = String::from_utf8(m.to_dimacs()).expect("utf-8");
        assert!(text.contains("c input "), "{text}");
        assert_eq!(text.matches("c pair ").count(), 2, "{text}");
    }
}
