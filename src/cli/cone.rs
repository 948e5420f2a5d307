//! `equicone cone` (structural cone against exact support, per output bit) and
//! `equicone stats` (gate counts, cost, delay, bounds).

use super::common::{
    check_writable, print, report_input_error, write_atomic, DesignArgs, LimitArgs,
};
use super::Exit;
use crate::cone::{self, AuditOptions, SupportOptions};
use crate::cost::{self, CostModel};
use crate::diag::InputError;
use crate::sat::Limits;
use clap::Args;
use std::path::PathBuf;

impl LimitArgs {
    fn support(&self, progress: bool) -> SupportOptions {
        SupportOptions {
            seed: self.seed,
            progress,
            ..SupportOptions::default()
        }
    }
}

/// Options of `cone`.
#[derive(Args, Debug)]
pub struct ConeArgs {
    #[command(flatten)]
    design: DesignArgs,
    /// Only these output bits, buses or ranges such as `d[0..3]` (repeatable; default: all).
    #[arg(long = "output", value_name = "NAME")]
    outputs: Vec<String>,
    /// The inputs each output must depend on (text `y: a, b[0..3]` lines or JSON); missing
    /// and unexpected inputs are flagged.
    #[arg(long, value_name = "FILE")]
    expect: Option<PathBuf>,
    /// Write a Graphviz picture of one output's cone (the one named with --output, else the
    /// first with a redundant input).
    #[arg(long, value_name = "FILE")]
    dot: Option<PathBuf>,
    /// List every claim with its evidence in the text report (JSON always has it).
    #[arg(long)]
    evidence: bool,
    /// Print the report as JSON (schema in docs/cone.md).
    #[arg(long)]
    json: bool,
    /// Write the JSON report to this file (atomically).
    #[arg(long = "report", value_name = "FILE")]
    report: Option<PathBuf>,
    /// Audit only shard K of N (output bits i of the selection with i mod N = K-1) and write a
    /// partial report (needs --report or --json); `equicone merge` joins the N parts.
    #[arg(long, value_name = "K/N")]
    shard: Option<String>,
    /// Clocked designs: cycles from reset unrolled for the exact cone across cycles (which
    /// inputs really change each output, and their first latency; 0: only the structural cone;
    /// default: 8 for designs of at most 32 register bits and 2,000 AIG nodes, else none).
    #[arg(long, value_name = "K")]
    cycles: Option<usize>,
    /// Clocked designs: how registers without a reset start (`0` is the usual convention for
    /// the ISCAS-89 circuits).
    #[arg(long, value_enum, default_value_t = super::clocked::InitUnsetArg::Free)]
    init_unset: super::clocked::InitUnsetArg,
    #[command(flatten)]
    limits: LimitArgs,
}

/// Run `cone`.
pub fn run_cone(a: &ConeArgs) -> Exit {
    // The clock starts before reading: --timeout covers the whole run.
    let limits = match a.limits.budget.limits() {
        Ok(l) => l,
        Err(e) => return e,
    };
    if let Err(e) = check_writable([a.dot.as_deref(), a.report.as_deref()]) {
        return e;
    }
    let shard = match a
        .shard
        .as_deref()
        .map(crate::shard::Shard::parse)
        .transpose()
    {
        Ok(s) => s,
        Err(e) => return report_input_error(&e),
    };
    if shard.is_some() && a.report.is_none() && !a.json {
        return report_input_error(&InputError::plain(
            "--shard writes a partial JSON report, and neither --report FILE nor --json is given",
            "add `--report part-K.json` (then `equicone merge part-*.json`)",
        ));
    }
    if shard.is_some() && a.dot.is_some() {
        return report_input_error(&InputError::plain(
            "--dot draws one output of a whole audit; it does not go with --shard",
            "draw the picture in a run without --shard (for example with --output NAME)",
        ));
    }
    let d = match a.design.load_within(&limits) {
        Ok(d) => d,
        Err(e) => return e,
    };
    if shard.is_some() && d.is_clocked() {
        return report_input_error(&InputError::plain(
            "--shard splits the output bits of combinational designs; this one has registers",
            "leave out --shard for clocked designs",
        ));
    }
    if d.is_clocked() {
        eprintln!(
            "warning: {} has {} register bits: the audit covers the logic of one clock cycle, with register outputs read as inputs; the sections `across clock cycles` follow inputs through the registers, structurally and exactly from reset (--cycles) (an input that reaches an output only that way, a clock or a reset, is not flagged unused)",
            d.name,
            d.registers.len()
        );
    }
    let outputs = match cone::select_outputs(&d, &a.outputs) {
        Ok(o) => o,
        Err(e) => return report_input_error(&e),
    };
    let expect = match &a.expect {
        Some(p) => match super::files::read_text(p)
            .and_then(|t| cone::parse_expect(&p.display().to_string().into(), &t, &d))
        {
            Ok(e) => Some(e),
            Err(e) => return report_input_error(&e),
        },
        None => None,
    };
    let opts = AuditOptions {
        outputs: outputs.clone(),
        expect,
        support: a.limits.support(!a.json),
        text_evidence: a.evidence,
        shard,
        structure: a.design.load_written(&d).map(std::sync::Arc::new),
        exact_cycles: a.cycles,
        init_unset: a.init_unset.into(),
    };
    let mut rep = cone::audit(&d, &opts, &limits);
    if let Some(stamp) = &mut rep.shard {
        stamp_run(stamp, a);
    }
    if let Some(path) = &a.dot {
        let which = match outputs.as_slice() {
            [one] => Some(d.outputs[*one].name.clone()),
            _ => rep.dot_default_output().map(str::to_string),
        };
        if let Some(name) = which {
            // The picture shows the cone the audit used: for RTL, the expressions as written.
            let drawn = opts.structure.as_deref().unwrap_or(&d);
            let text = match cone::dot::dot(drawn, &rep, &name) {
                Ok(t) => t,
                Err(e) => return report_input_error(&e),
            };
            if let Err(e) = write_atomic(path, text.as_bytes()) {
                return report_input_error(&e);
            }
            eprintln!("wrote {} (cone of {name})", path.display());
        }
    }
    let json = rep.to_json() + "\n";
    if let Some(path) = &a.report {
        if let Err(e) = write_atomic(path, json.as_bytes()) {
            return report_input_error(&e);
        }
    }
    print(&match (a.json, &rep.shard) {
        (true, _) => json,
        (false, Some(s)) => format!(
            "shard {}/{}: audited {} of {} output bits ({} claims, {} flags, {} undecided); wrote {}\n",
            s.index,
            s.count,
            s.outputs.len(),
            s.total_outputs,
            rep.stats.claims,
            rep.flags.len(),
            rep.stats.undecided,
            a.report
                .as_deref()
                .map_or("-".into(), |p| p.display().to_string())
        ),
        (false, None) => rep.to_string(),
    });
    if rep.flagged() {
        Exit::Flagged
    } else if rep.undecided() {
        Exit::Undecided
    } else {
        Exit::Ok
    }
}

/// Fill a partial audit's fingerprints: the input files' contents (designs and the --expect
/// file), and the options that can change the report (not the time limit).
fn stamp_run(stamp: &mut crate::shard::cone::ConeStamp, a: &ConeArgs) {
    let d = &a.design;
    let contents: Vec<Vec<u8>> = std::iter::once(&d.path)
        .chain(&d.also)
        .chain(&a.expect)
        .map(|f| std::fs::read(f).unwrap_or_default())
        .collect();
    stamp.inputs = crate::shard::fingerprint(contents.iter().map(Vec::as_slice));
    let options = format!(
        "cone|{:?}|{:?}|{:?}|{:?}|{}|{:?}|{}|{}",
        d.format,
        d.top,
        d.pre.include_dirs,
        d.pre.defines,
        d.also.len(),
        a.outputs,
        a.expect.is_some(),
        a.limits.seed,
    );
    let options = match a.limits.budget.conflict_limit {
        Some(c) => format!("{options}|{c}"),
        None => options,
    };
    stamp.options = crate::shard::fingerprint([options.as_bytes()]);
}

/// Options of `stats`.
#[derive(Args, Debug)]
pub struct StatsArgs {
    #[command(flatten)]
    design: DesignArgs,
    /// Cost and delay per gate type and fan-in (JSON; default: unit cost and delay).
    #[arg(long, value_name = "FILE")]
    cost_model: Option<PathBuf>,
    /// Print the report as JSON (schema in docs/cone.md).
    #[arg(long)]
    json: bool,
    /// Seconds the exact supports (for the bounds) may take; claims still open then are
    /// undecided and the bounds use the inputs proved so far (still valid, maybe low).
    /// 0 skips the supports; gate counts, cost and depth never wait for them.
    #[arg(long, value_name = "SECONDS", default_value_t = STATS_SUPPORT_SECONDS)]
    support_time: f64,
    #[command(flatten)]
    limits: LimitArgs,
}

/// Default of `stats --support-time`.
const STATS_SUPPORT_SECONDS: f64 = 2.0;

/// Run `stats`.
pub fn run_stats(a: &StatsArgs) -> Exit {
    // The clock starts before reading: --timeout covers the whole run.
    let limits = match a.limits.budget.limits() {
        Ok(l) => l,
        Err(e) => return e,
    };
    let d = match a.design.load_within(&limits) {
        Ok(d) => d,
        Err(e) => return e,
    };
    // A clocked design is measured under the state cut; the report's first note says so.
    let model = match &a.cost_model {
        Some(p) => match super::files::read_text(p)
            .and_then(|t| CostModel::parse(&p.display().to_string().into(), &t))
        {
            Ok(m) => m,
            Err(e) => return report_input_error(&e),
        },
        None => CostModel::unit(),
    };
    if !(a.support_time.is_finite() && a.support_time >= 0.0) {
        eprintln!(
            "error: --support-time {} is not a number of seconds\n  help: for example `--support-time 10`, or 0 to skip the supports",
            a.support_time
        );
        return Exit::BadInput;
    }
    // The supports get their own share of the time; the rest of the figures need no SAT.
    let share = std::time::Duration::from_secs_f64(a.support_time.min(1e9));
    let share = limits.remaining().map_or(share, |r| r.min(share));
    let support_limits = Limits::new(Some(share), limits.conflicts_per_query);
    let rep = cost::stats_with(&d, &model, &a.limits.support(!a.json), &support_limits);
    print(&if a.json {
        rep.to_json() + "\n"
    } else {
        rep.to_string()
    });
    if rep.undecided() {
        Exit::Undecided
    } else {
        Exit::Ok
    }
}
