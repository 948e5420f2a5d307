//! Cone audit: for every output bit, its structural cone (transitive fan-in) against its
//! exact functional support, each claim with its evidence, and the flags a designer acts on
//! (redundant inputs, inputs that reach no output, constant outputs, unknown values in a
//! support, and differences from an `--expect` file).
//!
//! Entry points: [`audit`] for the `cone` command, [`support()`] for one output bit and
//! [`compare_supports`] for prove's side-by-side hint on a differing output pair.

mod across;
mod audit;
pub mod bits;
mod cofactor;
mod compare;
pub mod dot;
pub mod expect;
mod flip;
pub mod names;
mod pattern;
pub mod report;
pub mod structural;
pub mod support;
mod text;

pub use across::exact_across_cycles;
pub use audit::{audit, select_outputs, AuditOptions};
pub use bits::Bits;
pub use compare::{compare_supports, compare_supports_many, SupportComparison};
pub use expect::{parse_expect, ExpectEntry, Expectation};
pub use report::{AuditReport, ClaimReport, ClaimVerdict, Flag, InputSummary, OutputAudit};
pub use structural::{Cone, GraphSource, StructuralGraph};
pub use support::{
    support, supports, DependsBy, IndependentBy, Membership, SupportOptions, SupportResult,
    SupportStats,
};

use indicatif::ProgressBar;

/// A progress bar of claims where the host draws progress (`crate::host`) when `enabled`; a
/// hidden one otherwise.
pub(crate) fn progress_bar(enabled: bool, what: &str) -> ProgressBar {
    crate::host::counted_bar(enabled, what, "claims", 0)
}
