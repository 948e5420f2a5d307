//! Typed results of a proof run: verdicts per output pair and overall, counterexamples, figures.

use crate::engine::pairing::PairBy;
pub use crate::engine::pairing::Side;
use crate::sat::{SatStats, StopReason};
use serde::Serialize;

/// The answer for one output pair or for the whole run.
#[derive(Copy, Clone, Debug, PartialEq, Eq, Serialize)]
#[serde(rename_all = "lowercase")]
pub enum Verdict {
    /// Equal for every input vector (that satisfies the assumptions).
    Equivalent,
    /// A re-simulated counterexample exists.
    Different,
    /// A resource limit was hit before an answer.
    Undecided,
}

impl Verdict {
    /// Lower-case word used in reports.
    pub fn word(self) -> &'static str {
        match self {
            Verdict::Equivalent => "equivalent",
            Verdict::Different => "different",
            Verdict::Undecided => "undecided",
        }
    }
}

/// What decided an output pair.
#[derive(Copy, Clone, Debug, PartialEq, Eq, Serialize)]
#[serde(rename_all = "snake_case")]
pub enum Method {
    /// Both outputs became the same AIG literal (structural hashing or sweeping).
    Structure,
    /// SAT sweeping merged both outputs into the same literal.
    Sweep,
    /// Random simulation found a distinguishing vector.
    Simulation,
    /// A SAT query on the XOR miter (UNSAT: equivalent; a model: different).
    Sat,
    /// Case splitting on inputs, each cofactor decided by SAT or structural hashing.
    Split,
    /// Exhaustive simulation of every assignment of the pair's support.
    Exhaustive,
    /// Equal canonical BDDs, or a path of their difference.
    Bdd,
    /// Equal word polynomials over Z / 2^n, or a vector read off their non-zero difference.
    Algebra,
}

impl Method {
    /// Word used in reports.
    pub fn word(self) -> &'static str {
        match self {
            Method::Structure => "structure",
            Method::Sweep => "sweep",
            Method::Simulation => "simulation",
            Method::Sat => "sat",
            Method::Split => "split",
            Method::Exhaustive => "exhaustive",
            Method::Bdd => "bdd",
            Method::Algebra => "algebra",
        }
    }
}

/// The verdict of one output pair with its evidence: how an equivalence was shown, which
/// counterexample separates a difference, or why no answer came.
#[derive(Copy, Clone, Debug, PartialEq, Eq)]
pub enum PairVerdict {
    /// Equal on every input vector (that satisfies the assumptions), shown by this method.
    Equivalent(Method),
    /// Different: `counterexample` indexes [`ProveReport::counterexamples`]; `found_by` is the
    /// method that found a vector separating this pair.
    Different {
        /// What found the separating vector.
        found_by: Method,
        /// Index of a re-simulated vector on which this pair differs.
        counterexample: usize,
    },
    /// No answer: a limit stopped the engine first.
    Undecided(StopReason),
}

impl PairVerdict {
    /// The verdict word without its evidence.
    pub fn verdict(self) -> Verdict {
        match self {
            PairVerdict::Equivalent(_) => Verdict::Equivalent,
            PairVerdict::Different { .. } => Verdict::Different,
            PairVerdict::Undecided(_) => Verdict::Undecided,
        }
    }

    /// What decided the pair (`None` when undecided).
    pub fn method(self) -> Option<Method> {
        match self {
            PairVerdict::Equivalent(m) | PairVerdict::Different { found_by: m, .. } => Some(m),
            PairVerdict::Undecided(_) => None,
        }
    }

    /// The counterexample index of a different pair.
    pub fn counterexample(self) -> Option<usize> {
        match self {
            PairVerdict::Different { counterexample, .. } => Some(counterexample),
            _ => None,
        }
    }

    /// Why an undecided pair stopped.
    pub fn stopped(self) -> Option<StopReason> {
        match self {
            PairVerdict::Undecided(s) => Some(s),
            _ => None,
        }
    }
}

/// The result for one output pair. Its JSON form keeps the flat fields `status`, `method`
/// (`none` when undecided), `stopped` and `counterexample`, then `seconds` and `conflicts`.
#[derive(Clone, Debug, PartialEq)]
pub struct PairResult {
    /// Reference output bit name.
    pub reference: String,
    /// Candidate output bit name.
    pub candidate: String,
    /// The verdict for this pair and its evidence.
    pub verdict: PairVerdict,
    /// What deciding it cost ([`crate::engine::pair_cost`]).
    pub cost: crate::engine::PairCost,
}

impl PairResult {
    /// The verdict word of this pair.
    pub fn status(&self) -> Verdict {
        self.verdict.verdict()
    }
}

impl Serialize for PairResult {
    fn serialize<S: serde::Serializer>(&self, s: S) -> Result<S::Ok, S::Error> {
        use serde::ser::SerializeStruct;
        let v = self.verdict;
        let extra = usize::from(v.stopped().is_some()) + usize::from(v.counterexample().is_some());
        let mut st = s.serialize_struct("PairResult", 6 + extra)?;
        st.serialize_field("reference", &self.reference)?;
        st.serialize_field("candidate", &self.candidate)?;
        st.serialize_field("status", &v.verdict())?;
        match v.method() {
            Some(m) => st.serialize_field("method", &m)?,
            None => st.serialize_field("method", "none")?,
        }
        if let Some(r) = v.stopped() {
            st.serialize_field("stopped", &r)?;
        }
        if let Some(k) = v.counterexample() {
            st.serialize_field("counterexample", &k)?;
        }
        st.serialize_field("seconds", &self.cost.seconds)?;
        st.serialize_field("conflicts", &self.cost.conflicts)?;
        st.end()
    }
}

/// What a verdict covers.
#[derive(Copy, Clone, Debug, PartialEq, Eq, Default)]
pub enum Scope {
    /// Zero-delay Boolean logic of the netlists as modeled.
    #[default]
    ZeroDelayLogic,
    /// Zero-delay Boolean logic with one step per clock cycle, from reset.
    ClockedFromReset,
}

impl Scope {
    /// The sentence printed in every report.
    pub fn text(self) -> &'static str {
        match self {
            Scope::ZeroDelayLogic => SCOPE,
            Scope::ClockedFromReset => CLOCKED_SCOPE,
        }
    }
}

impl std::fmt::Display for Scope {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        f.write_str(self.text())
    }
}

impl Serialize for Scope {
    fn serialize<S: serde::Serializer>(&self, s: S) -> Result<S::Ok, S::Error> {
        s.serialize_str(self.text())
    }
}

/// Ports declared `[0:7]` (lowest index most significant) in each design.
#[derive(Clone, Debug, Default, PartialEq, Eq, Serialize)]
pub struct AscendingPorts {
    /// The reference's.
    pub reference: std::collections::BTreeSet<String>,
    /// The candidate's.
    pub candidate: std::collections::BTreeSet<String>,
}

impl AscendingPorts {
    /// Neither design has any.
    pub fn is_empty(&self) -> bool {
        self.reference.is_empty() && self.candidate.is_empty()
    }
}

/// One input bit's value in a counterexample.
#[derive(Clone, Debug, PartialEq, Eq, Serialize)]
pub struct InputValue {
    /// Bit name (the reference's, for a paired bit).
    pub name: String,
    /// The candidate's name of a paired bit, when it differs from the reference's.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub candidate_name: Option<String>,
    /// A paired port bit of both designs, or a free input of one side.
    pub side: Side,
    /// Whether this bit stands for an unknown (`x`) value in the source.
    pub unknown: bool,
    /// The value.
    pub value: bool,
    /// An unknown of the reference that decides none of the differing outputs (each one is
    /// compared only where the reference is defined, which does not read the unknowns): kept
    /// in the JSON for replay, left out of the text.
    #[serde(skip)]
    pub moot: bool,
}

/// One output pair's values under a counterexample.
#[derive(Clone, Debug, PartialEq, Eq, Serialize)]
pub struct OutputDiff {
    /// Reference output bit name.
    pub reference: String,
    /// Candidate output bit name.
    pub candidate: String,
    /// Reference value.
    pub reference_value: bool,
    /// Candidate value.
    pub candidate_value: bool,
}

/// An input vector on which output pairs differ, re-simulated on both designs.
#[derive(Clone, Debug, PartialEq, Eq, Serialize)]
pub struct Counterexample {
    /// Every input bit, in shared-input order.
    pub inputs: Vec<InputValue>,
    /// Every output pair that differs under this vector (re-simulated values).
    pub differing: Vec<OutputDiff>,
    /// What found the vector.
    pub found_by: Method,
}

/// Figures of one run.
#[derive(Clone, Debug, Default, PartialEq, Serialize)]
pub struct Stats {
    /// AND nodes of the reference's AIG.
    pub reference_ands: usize,
    /// AND nodes of the candidate's AIG.
    pub candidate_ands: usize,
    /// Nodes of the shared AIG (constant and inputs included).
    pub shared_nodes: usize,
    /// Random patterns simulated.
    pub sim_patterns: usize,
    /// SAT figures over all solvers.
    pub sat: SatStats,
    /// Sweeping figures (the `sweep` engine only).
    #[serde(skip_serializing_if = "Option::is_none")]
    pub sweep: Option<crate::engine::SweepStats>,
    /// What each method of the portfolio did with each group (the portfolio engines only).
    #[serde(skip_serializing_if = "Option::is_none")]
    pub portfolio: Option<Vec<crate::engine::portfolio::GroupRecord>>,
    /// Memory the proof added at its peak, in bytes: peak resident memory at the end minus
    /// resident memory when it began, with both designs and the shared AIG already built
    /// (absent where the system does not report it).
    #[serde(skip_serializing_if = "Option::is_none")]
    pub engine_memory_bytes: Option<u64>,
    /// Wall-clock seconds for the whole run.
    pub seconds: f64,
}

/// The full result of `prove`.
#[derive(Clone, Debug, PartialEq, Serialize)]
pub struct ProveReport {
    /// Schema version of the JSON form.
    pub schema: u32,
    /// Overall verdict.
    pub verdict: Verdict,
    /// Reference design name.
    pub reference: String,
    /// Candidate design name.
    pub candidate: String,
    /// How bits were paired.
    pub pair_by: PairBy,
    /// The engine used.
    pub engine: crate::engine::EngineKind,
    /// The assumptions in force (source text).
    pub assumptions: Vec<String>,
    /// Port inputs of one side only, left free.
    pub free_inputs: Vec<String>,
    /// Ports declared with an ascending range (`[0:7]`) on each side, for printing values.
    #[serde(skip_serializing_if = "AscendingPorts::is_empty")]
    pub ascending_ports: AscendingPorts,
    /// The paired bits as runs by bus, when they are not paired by name.
    #[serde(skip_serializing_if = "Vec::is_empty")]
    pub paired: Vec<crate::engine::pair_runs::PairedRun>,
    /// The port map file that paired renamed bits (`--port-map`), when one was given.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub port_map: Option<String>,
    /// Per output pair.
    pub pairs: Vec<PairResult>,
    /// Distinct counterexamples found.
    pub counterexamples: Vec<Counterexample>,
    /// Figures.
    pub stats: Stats,
    /// Warnings from reading the designs.
    pub warnings: Vec<String>,
    /// What the verdict covers.
    pub scope: Scope,
    /// Where either design reads unknown values (`side: file:line:col: what`).
    pub unknowns: Vec<String>,
    /// Output pairs whose reference output may be `x` and that were compared only where it is
    /// defined (0 under `--strict-unknowns`; omitted from JSON when 0).
    #[serde(skip_serializing_if = "is_zero")]
    pub dont_care_pairs: usize,
}

fn is_zero(n: &usize) -> bool {
    *n == 0
}

/// What a proof of combinational logic covers, for every report.
const SCOPE: &str =
    "zero-delay Boolean logic of the netlists as modeled; timing, power and layout are not covered";

/// What a proof of clocked logic covers.
const CLOCKED_SCOPE: &str = "zero-delay Boolean logic of the netlists as modeled, one step per clock cycle from reset; timing, power and layout are not covered";

impl ProveReport {
    /// Count of pairs with the given status.
    pub fn count(&self, v: Verdict) -> usize {
        self.pairs.iter().filter(|p| p.status() == v).count()
    }
}
