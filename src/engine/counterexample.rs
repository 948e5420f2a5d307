//! Counterexamples: from a shared-input assignment to a vector re-simulated on both original
//! designs. A vector that does not reproduce the difference is an internal error, never a claim.

use crate::design::Design;
use crate::engine::pairing::{Shared, SharedInput};
use crate::engine::result::{Counterexample, InputValue, Method, OutputDiff, Side};

/// Re-simulate `values` (one per shared input) on both designs. Returns the counterexample
/// with every differing output pair, or an error message when `must_differ` (a pair index)
/// does not differ.
pub fn confirm(
    shared: &Shared,
    r: &Design,
    c: &Design,
    values: &[bool],
    must_differ: usize,
    found_by: Method,
) -> Result<Counterexample, String> {
    let rv: Vec<bool> = shared.ref_input.iter().map(|&k| values[k]).collect();
    let cv: Vec<bool> = shared.cand_input.iter().map(|&k| values[k]).collect();
    let ro = r.eval(&rv);
    let co = c.eval(&cv);
    // A pair with a don't-care region differs only where the reference's output is defined
    // (0 or 1 by three-valued simulation with its unknowns at x) and the candidate's is not
    // that value.
    let dc_roots: Vec<_> = shared
        .pairs
        .iter()
        .zip(&shared.dont_care)
        .filter(|(_, &dc)| dc)
        .map(|(&(ri, _), _)| r.outputs[ri].lit)
        .collect();
    let mut defined = crate::engine::dont_care::eval_ternary(r, &rv, &dc_roots).into_iter();
    let mut differing = Vec::new();
    let mut hit = false;
    // Whether every differing pair is read where the reference is defined (its unknowns then
    // decide none of them).
    let mut all_dont_care = true;
    for (p, &(ri, ci)) in shared.pairs.iter().enumerate() {
        let rvalue = match shared.dont_care.get(p) {
            Some(true) => defined.next().flatten(),
            _ => Some(ro[ri]),
        };
        if let Some(rvalue) = rvalue.filter(|&v| v != co[ci]) {
            hit |= p == must_differ;
            all_dont_care &= shared.dont_care.get(p) == Some(&true);
            differing.push(OutputDiff {
                reference: r.outputs[ri].name.clone(),
                candidate: c.outputs[ci].name.clone(),
                reference_value: rvalue,
                candidate_value: co[ci],
            });
        }
    }
    if !hit {
        return Err(format!(
            "internal error: a vector found by {} for output pair {} did not reproduce on re-simulation; no claim is made (please report this with both netlists)",
            found_by.word(),
            r.outputs[shared.pairs[must_differ].0].name
        ));
    }
    let inputs = shared
        .inputs
        .iter()
        .enumerate()
        .map(|(k, origin)| {
            let (bit, side, cand) = match *origin {
                SharedInput::Both {
                    reference,
                    candidate,
                } => (
                    &r.inputs[reference],
                    Side::Both,
                    Some(&c.inputs[candidate].name).filter(|n| **n != r.inputs[reference].name),
                ),
                SharedInput::Reference(i) => (&r.inputs[i], Side::Reference, None),
                SharedInput::Candidate(i) => (&c.inputs[i], Side::Candidate, None),
            };
            InputValue {
                name: bit.name.clone(),
                candidate_name: cand.cloned(),
                side,
                unknown: bit.is_unknown(),
                value: values[k],
                moot: all_dont_care && bit.is_unknown() && side == Side::Reference,
            }
        })
        .collect();
    Ok(Counterexample {
        inputs,
        differing,
        found_by,
    })
}
