//! `equicone prove` and `equicone cnf`: read two designs, pair them, prove or export the miter.

use super::common::{
    check_writable, print, report_input_error, report_internal, report_stopped_reading, timeout_of,
    write_atomic, FormatArg, LimitArgs,
};
use super::files::FileSystem;
use super::Exit;
use crate::certify::{Certificate, NoCertificate, ProofFormat};
use crate::check::{self, CheckError, CheckRequest, DiagnosisRequest};
use crate::design::Design;
use crate::design::Format;
use crate::diag::InputError;
use crate::engine::{EngineKind, PairBy, ProveOptions, Verdict};
use crate::front::{self, ReadError, Source};
use crate::report;
use clap::Args;
use std::io::IsTerminal;
use std::path::{Path, PathBuf};

cli_enum! {
    /// How to match input and output bits (`--pair-by`).
    PairByArg => PairBy {
        /// Bits with the same name.
        Name,
        /// Bits in the same position (same counts and order on both sides).
        Position,
    }
}

cli_enum! {
    /// The proof engine (`--engine`).
    EngineArg => EngineKind {
        /// The portfolio: word polynomials for arithmetic output buses, exhaustive simulation for
        /// output groups with small supports, BDDs within a node limit, BDD sweeping with cut
        /// points, then SAT sweeping for the rest (on the BDD sweep's merged graph when that
        /// decided some pair; the method of each pair is reported).
        Portfolio,
        /// Simulation, SAT sweeping of internal nodes (merging proved pairs), then per output pair
        /// the same literal or an XOR query; independent output cones on several threads.
        Sweep,
        /// The single-call miter: all output XORs ORed in one SAT query (repeated only to separate
        /// more pairs after a counterexample). No simulation, no sweeping: the baseline.
        Plain,
        /// Simulation, then one incremental SAT query per output pair on its XOR, no sweeping.
        Pairs,
        /// Exhaustive simulation alone (pairs whose support is too large stay undecided).
        Exhaustive,
        /// BDDs alone (pairs past the node limit stay undecided).
        Bdd,
        /// BDD sweeping alone: internal nodes with equal BDDs merged, cut points where a BDD
        /// grows too large (pairs it cannot settle stay undecided).
        BddSweep,
        /// Word polynomials alone, on output buses of at least 4 bits (other pairs, and bits past
        /// the term budget, stay undecided).
        Algebra,
    }
}

cli_enum! {
    /// Proof formats (`--proof-format`).
    ProofFormatArg => ProofFormat {
        /// DRAT in text form, checkable by any DRAT checker.
        Drat,
        /// varisat's native format, checkable by the varisat-checker crate.
        Varisat,
    }
}

/// Reading the reference and the candidate.
#[derive(Args, Debug, Clone)]
pub struct PairArgs {
    /// The reference (trusted) netlist.
    #[arg(value_name = "REF")]
    pub reference: PathBuf,
    /// The candidate (rewritten) netlist.
    #[arg(value_name = "CAND")]
    pub candidate: PathBuf,
    /// More Verilog files of the reference.
    #[arg(long = "ref-also", value_name = "FILE")]
    pub ref_also: Vec<PathBuf>,
    /// More Verilog files of the candidate.
    #[arg(long = "cand-also", value_name = "FILE")]
    pub cand_also: Vec<PathBuf>,
    /// Input format of both files (default: from each file name).
    #[arg(long, value_enum)]
    pub format: Option<FormatArg>,
    /// Input format of the reference.
    #[arg(long, value_enum)]
    pub ref_format: Option<FormatArg>,
    /// Input format of the candidate.
    #[arg(long, value_enum)]
    pub cand_format: Option<FormatArg>,
    /// Top module of the reference (Verilog).
    #[arg(long)]
    pub ref_top: Option<String>,
    /// Top module of the candidate (Verilog).
    #[arg(long)]
    pub cand_top: Option<String>,
    /// How to match input and output bits.
    #[arg(long, value_enum, default_value_t = PairByArg::Name)]
    pub pair_by: PairByArg,
    /// A port map file pairing renamed ports or bits (`REFERENCE_NAME CANDIDATE_NAME` per
    /// line, see the README); the bits it does not name pair by name.
    #[arg(long, value_name = "FILE")]
    pub port_map: Option<PathBuf>,
    /// Leave input bits that exist on one side only free (the verdict then covers all their values).
    #[arg(long)]
    pub free_extra_inputs: bool,
    /// Require the candidate to match an `x` of the reference for every value it takes (by
    /// default, where a reference output is `x` the candidate may do anything).
    #[arg(long)]
    pub strict_unknowns: bool,
    /// Include directories and macros for the Verilog preprocessor (both designs).
    #[command(flatten)]
    pub pre: super::common::PreprocArgs,
}

impl PairArgs {
    /// Read both designs at once, on two threads, each looking at `stop` while it reads.
    fn read_pair(
        &self,
        stop: &(dyn Fn() -> bool + Sync),
    ) -> (Result<Design, ReadError>, Result<Design, ReadError>) {
        let mut rp = vec![self.reference.clone()];
        rp.extend(self.ref_also.iter().cloned());
        let mut cp = vec![self.candidate.clone()];
        cp.extend(self.cand_also.iter().cloned());
        let source = |paths: Vec<PathBuf>, format: Option<FormatArg>, top: Option<String>| Source {
            paths,
            format: format.map(Format::from),
            top,
            preprocess: self.pre.options(),
        };
        let rs = source(rp, self.ref_format.or(self.format), self.ref_top.clone());
        let cs = source(cp, self.cand_format.or(self.format), self.cand_top.clone());
        let (r, c) = std::thread::scope(|s| {
            let h = s.spawn(|| front::load_until(&rs, &FileSystem, stop));
            let c = front::load_until(&cs, &FileSystem, stop);
            (h.join(), c)
        });
        let r = r.unwrap_or_else(|_| {
            Err(ReadError::Input(InputError::plain(
                "internal error while reading the reference",
                "please report this with the files that caused it",
            )))
        });
        (r, c)
    }

    /// Read both designs, printing their errors (reference first) on failure.
    fn load(&self) -> Result<(Design, Design), Exit> {
        self.load_within(&crate::sat::Limits::none())
    }

    /// [`PairArgs::load`] under `limits`: bad input on either side gives its errors and
    /// [`Exit::BadInput`]; otherwise a deadline passing while either side is read gives the
    /// undecided message (naming the reference when both stopped) and [`Exit::Undecided`].
    fn load_within(&self, limits: &crate::sat::Limits) -> Result<(Design, Design), Exit> {
        let (r, c) = self.read_pair(&|| limits.expired());
        let mut bad = false;
        let mut stopped = None;
        for (k, side) in [&r, &c].into_iter().enumerate() {
            match side {
                // The same file read twice with the same error: say it once.
                Err(ReadError::Input(e))
                    if k == 1
                        && matches!(&r, Err(ReadError::Input(f)) if f.to_string() == e.to_string()) =>
                    {}
                Err(ReadError::Input(e)) => {
                    report_input_error(e);
                    bad = true;
                }
                Err(ReadError::Stopped(f)) => {
                    stopped.get_or_insert(f.clone());
                }
                Ok(_) => {}
            }
        }
        if bad {
            return Err(Exit::BadInput);
        }
        if let Some(f) = stopped {
            return Err(report_stopped_reading(&f));
        }
        match (r, c) {
            (Ok(r), Ok(c)) => Ok((r, c)),
            _ => unreachable!("every failure is handled above"),
        }
    }

    /// The port map (`--port-map`) resolved against both designs, if one was given.
    fn port_map(
        &self,
        r: &Design,
        c: &Design,
    ) -> Result<Option<std::sync::Arc<crate::portmap::BitMap>>, Exit> {
        let Some(path) = &self.port_map else {
            return Ok(None);
        };
        let name = path.display().to_string();
        super::files::read_text(path)
            .and_then(|text| crate::portmap::PortMap::parse(&name.as_str().into(), &text))
            .and_then(|m| m.resolve(&name, r, c))
            .map(|m| Some(std::sync::Arc::new(m)))
            .map_err(|e| report_input_error(&e))
    }
}

/// Options of `prove`.
#[derive(Args, Debug)]
pub struct ProveArgs {
    #[command(flatten)]
    pair: PairArgs,
    /// The proof engine: `portfolio` (the default) chooses a method per output group; the
    /// others run one method alone (baselines, and a second opinion).
    #[arg(long, value_enum, default_value_t = EngineArg::Portfolio)]
    engine: EngineArg,
    /// Worker threads for independent output cones (default: one per core). The verdicts do
    /// not depend on it.
    #[arg(long, short = 'j', value_name = "N")]
    jobs: Option<usize>,
    #[command(flatten)]
    limits: LimitArgs,
    /// Print the report as JSON (schema in the README).
    #[arg(long)]
    json: bool,
    /// Also write the JSON report to this file (written atomically).
    #[arg(long, value_name = "FILE")]
    report: Option<PathBuf>,
    /// Ask only for input vectors where this Verilog expression over the input ports holds,
    /// e.g. `sel < 12` (repeatable: all must hold).
    #[arg(long, value_name = "EXPR")]
    assume: Vec<String>,
    /// Write a proof of the equivalent output pairs: a DRAT refutation (FILE) of a miter that
    /// encodes both designs separately (FILE.cnf), checkable by any DRAT checker.
    #[arg(long, value_name = "FILE")]
    proof: Option<PathBuf>,
    /// Format of the --proof file.
    #[arg(long, value_enum, default_value_t = ProofFormatArg::Drat)]
    proof_format: ProofFormatArg,
    /// The select bus for route tables of differing outputs (default: `sel`, `s`, `select` or
    /// `addr` when both designs have it).
    #[arg(long, value_name = "BUS")]
    select: Option<String>,
    /// Seconds the diagnosis of a difference (supports, route tables) may take at most, within
    /// the run's --timeout; 0 turns it off. A diagnosis cut short is reported as partial.
    #[arg(
        long,
        value_name = "SECONDS",
        default_value_t = 10.0,
        allow_negative_numbers = true
    )]
    diagnosis_time: f64,
    /// Once an output pair is proved different (by simulation, or by a word polynomial's
    /// remainder; the verdict is then settled), the output pairs still open get at most this
    /// many more seconds, all together; those still open are listed as undecided. 0 stops at
    /// once.
    #[arg(
        long,
        value_name = "SECONDS",
        default_value_t = 2.0,
        allow_negative_numbers = true
    )]
    after_difference: f64,
    /// Decide every output pair after a difference too, however long it takes (within
    /// --timeout).
    #[arg(long, conflicts_with = "after_difference")]
    decide_all: bool,
    #[command(flatten)]
    replay: super::replay::ReplayArgs,
    /// Clocked designs: cycles from reset searched for a difference when the register pairing
    /// does not prove every output pair.
    #[arg(long, value_name = "K", default_value_t = 20)]
    cycles: usize,
    /// Clocked designs: the deepest k-induction step tried on output pairs the register pairing
    /// leaves open (0: none; default: 8 when both designs have at most 4,096 register bits
    /// together; at most --cycles, the unrolling being its base case).
    #[arg(long, value_name = "K")]
    k_induction: Option<usize>,
    /// Clocked designs: how registers without a reset start (`0` is the usual convention for
    /// the ISCAS-89 circuits).
    #[arg(long, value_enum, default_value_t = super::clocked::InitUnsetArg::Free)]
    init_unset: super::clocked::InitUnsetArg,
    /// Decide only shard K of N (output pairs i with i mod N = K-1) and write a partial report;
    /// `equicone merge` joins the N partial reports into the whole.
    #[arg(long, value_name = "K/N")]
    shard: Option<String>,
}

/// Options of `cnf`.
#[derive(Args, Debug)]
pub struct CnfArgs {
    #[command(flatten)]
    pair: PairArgs,
    /// Where to write the DIMACS file.
    #[arg(short = 'o', long = "output", value_name = "FILE")]
    output: PathBuf,
    /// Only input vectors where this Verilog expression over the input ports holds (asserted
    /// by a unit clause, recorded in the comments; repeatable: all must hold).
    #[arg(long, value_name = "EXPR")]
    assume: Vec<String>,
}

/// Run `prove`: read both designs, hand them to the check session, print its outcome.
pub fn run(a: &ProveArgs) -> Exit {
    // The clock starts before reading: --timeout covers the whole run.
    let timeout = match timeout_of(a.limits.budget.timeout) {
        Ok(t) => t,
        Err(e) => return e,
    };
    let deadline = crate::sat::Limits::new(timeout, None);
    let diagnosis_time = match super::common::seconds_of("--diagnosis-time", a.diagnosis_time) {
        Ok(t) => t,
        Err(e) => return e,
    };
    let after_difference = match super::common::seconds_of("--after-difference", a.after_difference)
    {
        Ok(_) if a.decide_all => None,
        Ok(t) => Some(t),
        Err(e) => return e,
    };
    // Output paths are checked before any work, so that a long run is not lost to a typo.
    let proof_cnf = a.proof.as_deref().map(cnf_path_of);
    if let Err(e) = check_writable([
        a.report.as_deref(),
        a.proof.as_deref(),
        proof_cnf.as_deref(),
        a.replay.vcd.as_deref(),
        a.replay.testbench.as_deref(),
    ]) {
        return e;
    }
    let (r, c) = match a.pair.load_within(&deadline) {
        Ok(x) => x,
        Err(e) => return e,
    };
    if r.is_clocked() || c.is_clocked() {
        if a.shard.is_some() {
            return report_input_error(&crate::diag::InputError::plain(
                "--shard splits the output pairs of combinational designs; these have registers",
                "leave out --shard for clocked designs",
            ));
        }
        return run_clocked(a, &r, &c, &deadline);
    }
    let port_map = match a.pair.port_map(&r, &c) {
        Ok(m) => m,
        Err(e) => return e,
    };
    let req = CheckRequest {
        reference: &r,
        candidate: &c,
        assumptions: a.assume.clone(),
        options: ProveOptions {
            pair_by: a.pair.pair_by.into(),
            free_extra_inputs: a.pair.free_extra_inputs,
            engine: a.engine.into(),
            timeout: deadline.remaining(),
            conflict_limit: a.limits.budget.conflict_limit,
            seed: a.limits.seed,
            sim_words: None,
            jobs: a.jobs.unwrap_or(0),
            progress: !a.json && std::io::stderr().is_terminal(),
            strict_unknowns: a.pair.strict_unknowns,
            after_difference,
            port_map,
        },
        diagnosis: match &a.select {
            _ if a.diagnosis_time == 0.0 => DiagnosisRequest::Off,
            Some(b) => DiagnosisRequest::Select(b.clone()),
            None => DiagnosisRequest::Auto,
        },
        certificate: a.proof.as_ref().map(|_| a.proof_format.into()),
        explain: a.replay.cube_limits(),
        keep_pairing: a.replay.wanted(),
        diagnosis_time: Some(diagnosis_time),
    };
    let shard = match a
        .shard
        .as_deref()
        .map(crate::shard::Shard::parse)
        .transpose()
    {
        Ok(s) => s,
        Err(e) => return report_input_error(&e),
    };
    let out = match check::check_shard(&req, shard) {
        Ok(mut out) => {
            if let Some(stamp) = &mut out.shard {
                stamp_run(stamp, a);
            }
            out
        }
        Err(CheckError::Input(e)) => return report_input_error(&e),
        Err(CheckError::Internal(m)) => return report_internal(&m),
    };
    if let Some(b) = &out.select_missing {
        eprintln!(
            "warning: no route tables: `{b}` is not an input bus of both designs (up to 16 bits)"
        );
    }
    // A write that fails at the end anyway (disk full, folder removed) still lets the
    // verdict be printed; the exit code then says that an output is missing.
    let mut failed = None;
    if let (Some(path), Some(cert)) = (&a.proof, &out.certificate) {
        if let Err(code) = write_proof(cert, path) {
            failed = Some(code);
        }
    }
    let mut rf = vec![a.pair.reference.clone()];
    rf.extend(a.pair.ref_also.iter().cloned());
    let mut cf = vec![a.pair.candidate.clone()];
    cf.extend(a.pair.cand_also.iter().cloned());
    // A write that fails now still lets the verdict be printed (then its exit code 2).
    if let Err(code) =
        super::replay::write_files(&a.replay, &r, &c, (&rf, &cf), &out, a.limits.seed)
    {
        failed = Some(code);
    }
    let json = report::to_json(&out);
    if let Some(path) = &a.report {
        if let Err(e) = write_atomic(path, json.as_bytes()) {
            failed = Some(report_input_error(&e));
        }
    }
    print(&if a.json {
        json
    } else {
        report::check_text(&out)
    });
    let verdict = out.verdict();
    // The process ends right after this: freeing the two netlists as written (a string per
    // signal and a list per gate) cost about 4 % of a 1,000,000-gate run; the operating
    // system takes the memory back at once.
    std::mem::forget((r, c, out));
    if let Some(code) = failed {
        return code;
    }
    match verdict {
        Verdict::Equivalent => Exit::Ok,
        Verdict::Different => Exit::Flagged,
        Verdict::Undecided => Exit::Undecided,
    }
}

/// `prove` on designs with registers: the same request, the clocked session.
fn run_clocked(a: &ProveArgs, r: &Design, c: &Design, deadline: &crate::sat::Limits) -> Exit {
    let port_map = match a.pair.port_map(r, c) {
        Ok(m) => m,
        Err(e) => return e,
    };
    let req = CheckRequest {
        reference: r,
        candidate: c,
        assumptions: a.assume.clone(),
        options: ProveOptions {
            pair_by: a.pair.pair_by.into(),
            free_extra_inputs: a.pair.free_extra_inputs,
            engine: a.engine.into(),
            timeout: deadline.remaining(),
            conflict_limit: a.limits.budget.conflict_limit,
            seed: a.limits.seed,
            sim_words: None,
            jobs: a.jobs.unwrap_or(0),
            progress: false,
            strict_unknowns: a.pair.strict_unknowns,
            after_difference: None,
            port_map,
        },
        diagnosis: DiagnosisRequest::Off,
        certificate: a.proof.as_ref().map(|_| a.proof_format.into()),
        explain: None,
        keep_pairing: false,
        diagnosis_time: None,
    };
    let settings = check::ClockedSettings {
        cycles: a.cycles,
        init_unset: a.init_unset.into(),
        k_induction: a.k_induction,
    };
    let mut rf = vec![a.pair.reference.clone()];
    rf.extend(a.pair.ref_also.iter().cloned());
    let mut cf = vec![a.pair.candidate.clone()];
    cf.extend(a.pair.cand_also.iter().cloned());
    let replay = super::clocked::ClockedReplay {
        args: &a.replay,
        files: (&rf, &cf),
        seed: a.limits.seed,
    };
    super::clocked::run(&req, &settings, a.json, a.report.as_deref(), &replay)
}

/// Run `cnf`: the miter (OR of the XORs of all output pairs) asserted true, so that the
/// formula is unsatisfiable exactly when the designs are equivalent.
pub fn run_cnf(a: &CnfArgs) -> Exit {
    if let Err(e) = check_writable([Some(a.output.as_path())]) {
        return e;
    }
    let (r, c) = match a.pair.load() {
        Ok(x) => x,
        Err(e) => return e,
    };
    if r.is_clocked() || c.is_clocked() {
        eprintln!("error: cnf writes the miter of combinational designs, and {} has registers\n  help: use `prove` for clocked designs", if r.is_clocked() { &r.name } else { &c.name });
        return Exit::BadInput;
    }
    let port_map = match a.pair.port_map(&r, &c) {
        Ok(m) => m,
        Err(e) => return e,
    };
    let miter = match check::miter_cnf_mapped(
        &r,
        &c,
        a.pair.pair_by.into(),
        a.pair.free_extra_inputs,
        a.pair.strict_unknowns,
        &a.assume,
        port_map.as_deref(),
    ) {
        Ok(m) => m,
        Err(e) => return report_input_error(&e),
    };
    match write_atomic(&a.output, &miter.to_dimacs()) {
        Ok(()) => {
            eprintln!(
                "wrote {} ({} variables, {} clauses)",
                a.output.display(),
                miter.formula.var_count(),
                miter.formula.len()
            );
            Exit::Ok
        }
        Err(e) => report_input_error(&e),
    }
}

/// Write the certificate of the equivalent output pairs and its formula, or say why there is none.
/// The file beside the proof `path` that holds its formula: the name with `.cnf` appended.
fn cnf_path_of(path: &Path) -> PathBuf {
    let mut name = path.as_os_str().to_os_string();
    name.push(".cnf");
    PathBuf::from(name)
}

fn write_proof(cert: &Result<Certificate, NoCertificate>, path: &Path) -> Result<(), Exit> {
    match cert {
        Ok(cert) => {
            let cnf_path = cnf_path_of(path);
            if let Err(e) = write_atomic(&cnf_path, &cert.cnf).and_then(|_| write_atomic(path, &cert.proof)) {
                return Err(report_input_error(&e));
            }
            eprintln!(
                "proof: {} refutes {}: the {} equivalent output pair{} (both designs encoded separately)",
                path.display(),
                cnf_path.display(),
                cert.pairs,
                if cert.pairs == 1 { "" } else { "s" }
            );
            Ok(())
        }
        Err(NoCertificate::Nothing) => {
            eprintln!("proof: not written, no output pair is equivalent");
            Ok(())
        }
        Err(NoCertificate::Stopped(s)) => {
            eprintln!("proof: not written ({s}); the verdict stands on the engine's answers");
            Ok(())
        }
        Err(NoCertificate::Satisfiable) => Err(report_internal(
            "the separately encoded miter is satisfiable although the engine proved the pairs equal; no claim is made",
        )),
    }
}

/// Fill a partial report's fingerprints: the input files' contents, and the options that can
/// change a verdict (not the time limit or the thread count).
fn stamp_run(stamp: &mut crate::shard::ShardStamp, a: &ProveArgs) {
    let p = &a.pair;
    let files: Vec<PathBuf> = std::iter::once(&p.reference)
        .chain(&p.ref_also)
        .chain(std::iter::once(&p.candidate))
        .chain(&p.cand_also)
        .cloned()
        .collect();
    let contents: Vec<Vec<u8>> = files
        .iter()
        .map(|f| std::fs::read(f).unwrap_or_default())
        .collect();
    stamp.inputs = crate::shard::fingerprint(contents.iter().map(Vec::as_slice));
    let options = format!(
        "{:?}|{:?}|{:?}|{:?}|{:?}|{:?}|{}|{:?}|{}|{:?}|{:?}|{}",
        p.format,
        p.ref_format,
        p.cand_format,
        p.ref_top,
        p.cand_top,
        p.pair_by,
        p.free_extra_inputs,
        a.engine,
        a.limits.seed,
        a.limits.budget.conflict_limit,
        a.assume,
        p.ref_also.len()
    );
    // The strict reading changes verdicts; it joins the text only when set, so that the
    // fingerprints of runs without it stay as they were.
    let options = match p.strict_unknowns {
        true => options + "|strict-unknowns",
        false => options,
    };
    // Likewise the port map's contents, when one is given.
    let options = match &p.port_map {
        Some(f) => {
            let text = std::fs::read(f).unwrap_or_default();
            options + "|port-map:" + &crate::shard::fingerprint([text.as_slice()])
        }
        None => options,
    };
    stamp.options = crate::shard::fingerprint([options.as_bytes()]);
}
