//! Proof certificates (`prove --proof FILE`): a refutation, written by the SAT solver, of a miter
//! that encodes the two designs' graphs separately (no shared structure, no merged nodes), so
//! that checking it needs to trust neither structural hashing nor the engine, only the readers.
//!
//! The formula: each design's output cones in Tseitin form over common input variables, the
//! assumptions, and one clause saying that some certified output pair differs. It is
//! unsatisfiable exactly when every certified pair is equal; the proof (DRAT, or varisat's own
//! format) shows it, and any DRAT checker can verify it against the formula.

use crate::aig::Lit;
use crate::cnf::{dimacs, Tseitin};
use crate::design::Design;
use crate::engine::Shared;
use crate::sat::{ClauseSink, Limits, StopReason};

/// Proof formats.
#[derive(Copy, Clone, Debug, PartialEq, Eq, Default)]
pub enum ProofFormat {
    /// DRAT in text form, checkable by any DRAT checker.
    #[default]
    Drat,
    /// varisat's native format, checkable by the varisat-checker crate.
    Varisat,
}

/// A refutation and the formula it refutes.
#[derive(Clone, Debug)]
pub struct Certificate {
    /// The formula in DIMACS CNF (comments name the variables of inputs and output pairs).
    pub cnf: Vec<u8>,
    /// The proof.
    pub proof: Vec<u8>,
    /// Output pairs the certificate covers.
    pub pairs: usize,
}

/// Why no certificate was made.
#[derive(Clone, Debug, PartialEq, Eq)]
pub enum NoCertificate {
    /// No output pair was found equivalent, so there is nothing to certify.
    Nothing,
    /// A limit stopped the solver.
    Stopped(StopReason),
    /// The solver found the formula satisfiable: an internal error (the engine said equivalent).
    Satisfiable,
}

/// Build the certificate for the output pairs `pairs` (indices into `shared.pairs`);
/// `assumptions` are the texts of the constraint built into `shared`, recorded as comments.
pub fn certify(
    r: &Design,
    c: &Design,
    shared: &Shared,
    assumptions: &[String],
    pairs: &[usize],
    format: ProofFormat,
    limits: &Limits,
) -> Result<Certificate, NoCertificate> {
    if pairs.is_empty() {
        return Err(NoCertificate::Nothing);
    }
    let mut f = varisat::CnfFormula::new();
    let mut comments = vec![
        format!(
            "equicone certificate: reference {} vs candidate {}",
            r.name, c.name
        ),
        "unsatisfiable exactly when every listed output pair is equal (under the assumptions)"
            .to_string(),
    ];
    // Common input variables, one per shared input.
    let vars: Vec<_> = (0..shared.aig.num_inputs()).map(|_| f.fresh()).collect();
    for (k, v) in vars.iter().enumerate() {
        let (name, side) = shared.input_name(k, r, c);
        let side = side.only_note();
        comments.push(format!("input {} {name}{side}", dimacs::dimacs_number(*v)));
    }
    let mut tr = Tseitin::new();
    for (i, &k) in shared.ref_input.iter().enumerate() {
        tr.bind(r.aig.inputs()[i], vars[k]);
    }
    let mut tc = Tseitin::new();
    for (i, &k) in shared.cand_input.iter().enumerate() {
        tc.bind(c.aig.inputs()[i], vars[k]);
    }
    if shared.constraint != Lit::TRUE {
        let mut ta = Tseitin::new();
        for (k, v) in vars.iter().enumerate() {
            ta.bind(shared.aig.inputs()[k], *v);
        }
        let a = ta.lit(&shared.aig, &mut f, shared.constraint);
        f.clause(&[a]);
        comments.extend(crate::cnf::dimacs::assumption_comments(assumptions, a));
    }
    // Pairs with a don't-care region: the reference's three-valued rails (its unknowns at x),
    // in a graph of their own over the reference's inputs; such a pair differs only where
    // the reference is defined.
    let dc: Vec<usize> = pairs
        .iter()
        .copied()
        .filter(|&p| shared.dont_care.get(p) == Some(&true))
        .collect();
    let mut rails = crate::aig::Aig::new();
    let rail_inputs: Vec<Lit> = (0..r.aig.num_inputs()).map(|_| rails.add_input()).collect();
    let unknown: Vec<bool> = r.inputs.iter().map(|b| b.is_unknown()).collect();
    let dc_roots: Vec<Lit> = dc
        .iter()
        .map(|&p| r.outputs[shared.pairs[p].0].lit)
        .collect();
    let dc_lits = crate::engine::dont_care::import_ternary(
        &mut rails,
        &r.aig,
        &rail_inputs,
        &unknown,
        &dc_roots,
    );
    let mut tt = Tseitin::new();
    for (i, &k) in shared.ref_input.iter().enumerate() {
        tt.bind(rails.inputs()[i], vars[k]);
    }
    let mut any = Vec::with_capacity(pairs.len());
    for &p in pairs {
        let (ri, ci) = shared.pairs[p];
        let y = tc.lit(&c.aig, &mut f, c.outputs[ci].lit);
        let d = f.fresh();
        let x = match dc.iter().position(|&q| q == p) {
            Some(k) => {
                let (value, defined) = dc_lits[k];
                let def = tt.lit(&rails, &mut f, defined);
                f.clause(&[!d, def]);
                tt.lit(&rails, &mut f, value)
            }
            None => tr.lit(&r.aig, &mut f, r.outputs[ri].lit),
        };
        crate::cnf::xor_if(&mut f, d, x, y);
        comments.push(format!(
            "pair {} reference {} candidate {} (differs when true)",
            dimacs::dimacs_number(d),
            r.outputs[ri].name,
            c.outputs[ci].name
        ));
        any.push(d);
    }
    f.clause(&any);
    let mut cnf = Vec::new();
    dimacs::write_dimacs(&mut cnf, &f, &comments).expect("writing to memory");
    let mut proof = Vec::new();
    {
        let mut solver = varisat::Solver::new();
        solver.set_interrupt_flag(Some(limits.flag()));
        solver.write_proof(
            &mut proof,
            match format {
                ProofFormat::Drat => varisat::ProofFormat::Drat,
                ProofFormat::Varisat => varisat::ProofFormat::Varisat,
            },
        );
        solver.add_formula(&f);
        match solver.solve() {
            Ok(false) => {}
            Ok(true) => return Err(NoCertificate::Satisfiable),
            Err(_) => {
                return Err(NoCertificate::Stopped(if limits.expired() {
                    StopReason::Timeout
                } else {
                    StopReason::ConflictLimit
                }))
            }
        }
        solver
            .close_proof()
            .map_err(|_| NoCertificate::Satisfiable)?;
    }
    Ok(Certificate {
        cnf,
        proof,
        pairs: pairs.len(),
    })
}
