//! The cone audit report: what [`super::audit`] found, as plain data that serializes to the
//! documented JSON schema (`equicone.cone/1`, see docs/cone.md) and prints as text
//! (the `Display` implementation lives in the text module).

use super::bits::Bits;
use super::structural::GraphSource;
use super::support::{DependsBy, IndependentBy, SupportStats};
use crate::sat::StopReason;
use serde::Serialize;

/// The result of a cone audit.
#[derive(Clone, Debug, PartialEq, Serialize)]
pub struct AuditReport {
    /// Schema name and version of the JSON form.
    pub schema: &'static str,
    /// The design's name.
    pub design: String,
    /// Whether structural cones come from the netlist as written or from the AIG.
    pub graph: GraphSource,
    /// Whether every output was audited (unused-input flags need all of them).
    pub all_outputs: bool,
    /// Every design input, with how many audited cones and supports hold it.
    pub inputs: Vec<InputSummary>,
    /// One entry per audited output bit, in the order audited.
    pub outputs: Vec<OutputAudit>,
    /// Everything a designer should look at.
    pub flags: Vec<Flag>,
    /// Findings that are not proofs and so not flags: on a clocked design, an input that does
    /// not change an output in the cycles unrolled from reset, later cycles not covered.
    #[serde(skip_serializing_if = "Vec::is_empty")]
    pub notes: Vec<String>,
    /// How the claims were decided.
    pub stats: SupportStats,
    /// Whether the text form lists every claim with its evidence.
    #[serde(skip)]
    pub text_evidence: bool,
    /// For a partial audit (`cone --shard K/N`): which output bits of the run it covers.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub shard: Option<crate::shard::cone::ConeStamp>,
    /// For a clocked design (not a shard): the structural cones across clock cycles, which
    /// also decide the `unused input` flags (see [`super::audit`]).
    #[serde(skip_serializing_if = "Option::is_none")]
    pub across_cycles: Option<crate::seq::CycleCones>,
}

impl AuditReport {
    /// The schema tag of the JSON form.
    pub const SCHEMA: &'static str = "equicone.cone/1";

    /// Whether anything is flagged (exit code 1 in the CLI).
    pub fn flagged(&self) -> bool {
        !self.flags.is_empty()
    }

    /// Whether any claim is undecided (exit code 3 in the CLI when nothing is flagged).
    pub fn undecided(&self) -> bool {
        self.stats.undecided > 0
    }

    /// The output to draw with `--dot` when the user named none: the first audited output
    /// with a redundant input, else the first audited output.
    pub fn dot_default_output(&self) -> Option<&str> {
        self.outputs
            .iter()
            .find(|o| !o.redundant.is_empty())
            .or_else(|| self.outputs.first())
            .map(|o| o.name.as_str())
    }

    /// The report as pretty-printed JSON.
    pub fn to_json(&self) -> String {
        serde_json::to_string_pretty(self).expect("the report serializes")
    }
}

/// One design input.
#[derive(Clone, Debug, PartialEq, Eq, Serialize)]
pub struct InputSummary {
    /// Bit name.
    pub name: String,
    /// `port`, or `unknown` for an unknown-value source modelled as an input.
    pub kind: &'static str,
    /// For an unknown source: what produces it.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub what: Option<String>,
    /// Where it is declared or arises.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub pos: Option<String>,
    /// Audited outputs whose structural cone holds it.
    pub in_cones: usize,
    /// Audited outputs whose support holds it.
    pub in_supports: usize,
}

/// The audit of one output bit.
#[derive(Clone, Debug, PartialEq, Eq, Serialize)]
pub struct OutputAudit {
    /// Bit name.
    pub name: String,
    /// Port (bus) name.
    pub port: String,
    /// Bit index within the bus.
    pub index: Option<i64>,
    /// Gates in the structural cone (netlist cells or AND nodes, see `graph`).
    pub cone_gates: usize,
    /// Inputs in the structural cone, in design order; evidence vectors use this order.
    pub cone: Vec<String>,
    /// Inputs the output depends on.
    pub support: Vec<String>,
    /// Cone inputs it does not depend on.
    pub redundant: Vec<String>,
    /// Cone inputs whose claim a limit left open.
    pub undecided: Vec<String>,
    /// The constant value, when the output depends on nothing.
    pub constant: Option<bool>,
    /// The inputs an `--expect` file asks for, if it names this output.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub expected: Option<Vec<String>>,
    /// One claim per cone input, in `cone` order.
    pub claims: Vec<ClaimReport>,
    /// The support written compactly with bus ranges (text report only).
    #[serde(skip)]
    pub support_text: String,
    /// The cone written compactly with bus ranges (text report only).
    #[serde(skip)]
    pub cone_text: String,
}

/// One claim "output depends / does not depend on input", with its evidence.
#[derive(Clone, Debug, PartialEq, Eq, Serialize)]
pub struct ClaimReport {
    /// The input.
    pub input: String,
    /// The answer and its evidence.
    #[serde(flatten)]
    pub verdict: ClaimVerdict,
}

/// The answer to one claim and its evidence.
#[derive(Clone, Debug, PartialEq, Eq, Serialize)]
#[serde(tag = "verdict", rename_all = "snake_case")]
pub enum ClaimVerdict {
    /// The output depends on the input.
    Depends {
        /// How the pattern pair was found.
        by: DependsBy,
        /// The first vector: one character `0`/`1` per cone input (in `cone` order), the
        /// claimed input at `0`. The second vector is the same with the claimed input at `1`.
        vector: Bits,
        /// The output on the first vector; on the second it is the opposite.
        output_at_0: bool,
    },
    /// The output does not depend on the input.
    Independent {
        /// How it was proved.
        by: IndependentBy,
        /// `"unsat"` when a SAT query on the cofactor miter proved it.
        #[serde(skip_serializing_if = "Option::is_none")]
        sat: Option<&'static str>,
    },
    /// A limit stopped the query.
    Undecided {
        /// Which limit.
        reason: StopReason,
    },
}

/// Something a designer should look at.
#[derive(Clone, Debug, PartialEq, Eq, Serialize)]
#[serde(tag = "flag", rename_all = "snake_case")]
pub enum Flag {
    /// In the output's structural cone but not in its support: dead or masked logic.
    RedundantInput {
        /// The output.
        output: String,
        /// The input.
        input: String,
        /// The proof.
        by: IndependentBy,
    },
    /// In no audited output's support.
    UnusedInput {
        /// The input.
        input: String,
        /// Whether it is wired into some cone (so its logic is dead or masked).
        connected: bool,
    },
    /// The output depends on no input.
    ConstantOutput {
        /// The output.
        output: String,
        /// Its value.
        value: bool,
    },
    /// The output depends on an unknown value (an `x` of the source).
    UnknownInSupport {
        /// The output.
        output: String,
        /// The unknown source's name.
        source: String,
        /// What produces it.
        what: String,
        /// Where.
        pos: String,
    },
    /// An input the expectation asks for is not in the support.
    MissingInput {
        /// The output.
        output: String,
        /// The input.
        input: String,
        /// Where the expectation is written.
        expected_at: String,
    },
    /// The support holds an input the expectation does not list.
    UnexpectedInput {
        /// The output.
        output: String,
        /// The input.
        input: String,
        /// Where the expectation is written.
        expected_at: String,
    },
    /// The output's support is a strict subset of another's, which the expectation does
    /// not say.
    SubsetSupport {
        /// The output with the smaller support.
        output: String,
        /// The output whose support holds it.
        of: String,
    },
    /// Clocked designs: the input reaches the output (in the same cycle or through registers)
    /// and never changes it, in any cycle of any run from reset (the exact cone across
    /// cycles: no chain of exact one-cycle dependences leads from it to the output).
    RedundantAcrossCycles {
        /// The output.
        output: String,
        /// The input.
        input: String,
        /// Whether it is in the output's cone of the same cycle.
        direct: bool,
        /// The registers in the output's cone that it loads, in design order.
        registers: Vec<String>,
    },
    /// Clocked designs: a register bit that never influences an output (the exact cone across
    /// cycles: constant in every state reachable from reset, or no chain of exact one-cycle
    /// dependences to an output).
    DeadRegister {
        /// The register bit.
        register: String,
        /// `constant 0`, `constant 1` or `reaches no output`.
        why: String,
    },
}
