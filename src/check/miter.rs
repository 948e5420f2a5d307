//! The miter formula of `equicone cnf`: the OR of the XORs of all output pairs asserted true
//! (Brand 1993), so that it is unsatisfiable exactly when the designs are equivalent, with
//! comments naming the variables of the inputs and of each output pair's XOR.

use crate::cnf::{dimacs, Tseitin};
use crate::design::Design;
use crate::diag::InputError;
use crate::engine::{self, PairBy};
use crate::sat::ClauseSink;

/// The miter formula and its comment lines.
#[derive(Debug)]
pub struct MiterCnf {
    /// The clauses.
    pub formula: varisat::CnfFormula,
    /// Comment lines (without the leading `c `), in order.
    pub comments: Vec<String>,
}

impl MiterCnf {
    /// The formula as DIMACS text with its comments.
    pub fn to_dimacs(&self) -> Vec<u8> {
        let mut buf = Vec::new();
        dimacs::write_dimacs(&mut buf, &self.formula, &self.comments).expect("writing to memory");
        buf
    }
}

/// Pair `r` and `c` and build their miter, asserting the conjunction of `assumptions` (Verilog
/// expressions over the input ports, as `--assume` takes them) by a unit clause that the
/// comments name.
pub fn miter_cnf(
    r: &Design,
    c: &Design,
    pair_by: PairBy,
    free_extra_inputs: bool,
    strict_unknowns: bool,
    assumptions: &[String],
) -> Result<MiterCnf, InputError> {
    miter_cnf_mapped(
        r,
        c,
        pair_by,
        free_extra_inputs,
        strict_unknowns,
        assumptions,
        None,
    )
}

/// [`miter_cnf`] with a port map that pairs renamed bits first (`cnf --port-map`).
pub fn miter_cnf_mapped(
    r: &Design,
    c: &Design,
    pair_by: PairBy,
    free_extra_inputs: bool,
    strict_unknowns: bool,
    assumptions: &[String],
    port_map: Option<&crate::portmap::BitMap>,
) -> Result<MiterCnf, InputError> {
    let mut shared = engine::pairing::pair_mapped(r, c, pair_by, free_extra_inputs, port_map)?;
    if !strict_unknowns {
        engine::dont_care::apply(&mut shared, r);
    }
    crate::assume::apply_to_shared(&mut shared, r, c, assumptions)?;
    let mut f = varisat::CnfFormula::new();
    let mut ts = Tseitin::new();
    let mut xors = Vec::new();
    let mut comments = vec![
        format!(
            "equicone miter: reference {} vs candidate {}",
            r.name, c.name
        ),
        "unsatisfiable exactly when every output pair is equal".to_string(),
    ];
    for k in 0..shared.aig.num_inputs() {
        let v = ts.lit(&shared.aig, &mut f, shared.aig.input_lit(k));
        let (name, side) = shared.input_name(k, r, c);
        comments.push(format!(
            "input {} {name}{}",
            dimacs::dimacs_number(v),
            side.only_note()
        ));
    }
    if shared.constraint != crate::aig::Lit::TRUE {
        let a = ts.lit(&shared.aig, &mut f, shared.constraint);
        f.clause(&[a]);
        comments.extend(dimacs::assumption_comments(assumptions, a));
    }
    for p in 0..shared.pairs.len() {
        let x = ts.lit(&shared.aig, &mut f, shared.ref_lits[p]);
        let y = ts.lit(&shared.aig, &mut f, shared.cand_lits[p]);
        let d = f.fresh();
        crate::cnf::xor_iff(&mut f, d, x, y);
        let (ri, ci) = shared.pairs[p];
        let dc = match shared.dont_care[p] {
            true => ", only where the reference is defined",
            false => "",
        };
        comments.push(format!(
            "pair {} reference {} candidate {} (differs when true{dc})",
            dimacs::dimacs_number(d),
            r.outputs[ri].name,
            c.outputs[ci].name
        ));
        xors.push(d);
    }
    f.clause(&xors);
    Ok(MiterCnf {
        formula: f,
        comments,
    })
}
