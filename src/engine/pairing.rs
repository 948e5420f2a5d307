//! Output pairs and input matching: how two designs meet in one shared AIG.
//!
//! Port inputs are matched by name (default) or by position; each design's unknown-value
//! sources, and with `--free-extra-inputs` its unmatched port inputs, stay free inputs of that
//! design alone, so a proof holds for every value they can take.

use crate::aig::{Aig, Lit};
use crate::design::{Design, InputKind};
use crate::diag::InputError;
use crate::portmap::BitMap;
use serde::Serialize;

/// Which design an input bit belongs to.
#[derive(Copy, Clone, Debug, PartialEq, Eq, PartialOrd, Ord, Serialize, serde::Deserialize)]
#[serde(rename_all = "lowercase")]
pub enum Side {
    /// A paired port bit of both designs.
    Both,
    /// A free input of the reference only.
    Reference,
    /// A free input of the candidate only.
    Candidate,
}

impl Side {
    /// Word used in reports.
    pub fn word(self) -> &'static str {
        match self {
            Side::Both => "both",
            Side::Reference => "reference",
            Side::Candidate => "candidate",
        }
    }

    /// ` (reference only)` or ` (candidate only)` for a one-sided input, empty for both.
    pub fn only_note(self) -> String {
        match self {
            Side::Both => String::new(),
            s => format!(" ({} only)", s.word()),
        }
    }
}

/// How output and input bits of the two designs are matched.
#[derive(Copy, Clone, Debug, PartialEq, Eq, Serialize, Default)]
#[serde(rename_all = "lowercase")]
pub enum PairBy {
    /// Bits with the same name.
    #[default]
    Name,
    /// Bits in the same position (same counts and order on both sides).
    Position,
}

/// Where an input of the shared AIG comes from.
#[derive(Clone, Debug, PartialEq, Eq, Serialize)]
#[serde(rename_all = "snake_case", tag = "side")]
pub enum SharedInput {
    /// A port input of both designs (reference index, candidate index).
    Both {
        /// Index in the reference's inputs.
        reference: usize,
        /// Index in the candidate's inputs.
        candidate: usize,
    },
    /// An input of the reference only (unknown source or unmatched port).
    Reference(usize),
    /// An input of the candidate only (unknown source or unmatched port).
    Candidate(usize),
}

/// Both designs in one AIG, with their output pairs.
#[derive(Clone, Debug)]
pub struct Shared {
    /// The shared graph.
    pub aig: Aig,
    /// Origin of each shared input.
    pub inputs: Vec<SharedInput>,
    /// Shared-input index of each reference input.
    pub ref_input: Vec<usize>,
    /// Shared-input index of each candidate input.
    pub cand_input: Vec<usize>,
    /// Output pairs: (reference output index, candidate output index).
    pub pairs: Vec<(usize, usize)>,
    /// Reference output literal of each pair, in the shared AIG.
    pub ref_lits: Vec<Lit>,
    /// Candidate output literal of each pair, in the shared AIG.
    pub cand_lits: Vec<Lit>,
    /// Conjunction of the assumptions (true when there are none).
    pub constraint: Lit,
    /// AND nodes of the reference alone, of the candidate alone.
    pub ands: (usize, usize),
    /// Port inputs left free because they have no partner.
    pub unmatched: Vec<String>,
    /// Per output pair: the reference output may be `x`, and the pair compares only where it
    /// is defined (set by `dont_care::apply`; all false under the strict reading).
    pub dont_care: Vec<bool>,
}

impl Shared {
    /// Name of a shared input for reports.
    pub fn input_name<'a>(&self, k: usize, r: &'a Design, c: &'a Design) -> (&'a str, Side) {
        match self.inputs[k] {
            SharedInput::Both { reference, .. } => (&r.inputs[reference].name, Side::Both),
            SharedInput::Reference(i) => (&r.inputs[i].name, Side::Reference),
            SharedInput::Candidate(i) => (&c.inputs[i].name, Side::Candidate),
        }
    }
}

/// Pair the designs and build the shared AIG. `free_extra` leaves unmatched port inputs free
/// instead of failing.
pub fn pair(r: &Design, c: &Design, by: PairBy, free_extra: bool) -> Result<Shared, InputError> {
    pair_mapped(r, c, by, free_extra, None)
}

/// [`pair`], with a port map (`--port-map`) that pairs renamed bits by name first; bits it
/// does not name pair by name as usual. Only with pairing by name.
pub fn pair_mapped(
    r: &Design,
    c: &Design,
    by: PairBy,
    free_extra: bool,
    map: Option<&BitMap>,
) -> Result<Shared, InputError> {
    if map.is_some() && by == PairBy::Position {
        return Err(InputError::plain(
            "a port map pairs bits by name; it cannot be used with `--pair-by position`",
            "leave out `--pair-by position` (bits the map does not name pair by name), or leave out `--port-map`",
        ));
    }
    let partner = |n: &'_ str| -> Option<String> {
        match map {
            Some(m) => m.partner(n).map(str::to_string),
            None => Some(n.to_string()),
        }
    };
    let r_ports: Vec<usize> = port_inputs(r);
    let c_ports: Vec<usize> = port_inputs(c);
    let mut inputs = Vec::new();
    let mut ref_input = vec![usize::MAX; r.inputs.len()];
    let mut cand_input = vec![usize::MAX; c.inputs.len()];
    let mut unmatched_r = Vec::new();
    let mut unmatched_c = Vec::new();
    match by {
        PairBy::Position => {
            if r_ports.len() != c_ports.len() || r.outputs.len() != c.outputs.len() {
                return Err(InputError::plain(
                    format!(
                        "positional pairing needs the same numbers of bits: the reference has {} input and {} output bits, the candidate {} and {}",
                        r_ports.len(), r.outputs.len(), c_ports.len(), c.outputs.len()
                    ),
                    "pair by name (the default), or make the port lists agree",
                ));
            }
            for (&ri, &ci) in r_ports.iter().zip(&c_ports) {
                ref_input[ri] = inputs.len();
                cand_input[ci] = inputs.len();
                inputs.push(SharedInput::Both {
                    reference: ri,
                    candidate: ci,
                });
            }
        }
        PairBy::Name => {
            let by_name: std::collections::HashMap<&str, usize> = c_ports
                .iter()
                .map(|&ci| (c.inputs[ci].name.as_str(), ci))
                .collect();
            for &ri in &r_ports {
                let found = partner(&r.inputs[ri].name)
                    .and_then(|n| by_name.get(n.as_str()).copied())
                    .filter(|&ci| cand_input[ci] == usize::MAX);
                match found {
                    Some(ci) => {
                        ref_input[ri] = inputs.len();
                        cand_input[ci] = inputs.len();
                        inputs.push(SharedInput::Both {
                            reference: ri,
                            candidate: ci,
                        });
                    }
                    None => unmatched_r.push(ri),
                }
            }
            unmatched_c.extend(
                c_ports
                    .iter()
                    .copied()
                    .filter(|&ci| cand_input[ci] == usize::MAX),
            );
        }
    }
    let pairs = pair_outputs(r, c, by, &partner).map_err(|mut e| {
        if let (Some(m), Some(d)) = (map, e.diagnostics.first_mut()) {
            d.help = Some(map_help(m));
        }
        e
    })?;
    if !free_extra && (!unmatched_r.is_empty() || !unmatched_c.is_empty()) {
        let list = |d: &Design, v: &[usize]| {
            v.iter()
                .map(|&i| d.inputs[i].name.as_str())
                .take(20)
                .collect::<Vec<_>>()
                .join(", ")
        };
        let mut msg = String::from("input bits do not match by name:");
        if !unmatched_r.is_empty() {
            msg += &format!(" only in the reference: {};", list(r, &unmatched_r));
        }
        if !unmatched_c.is_empty() {
            msg += &format!(" only in the candidate: {};", list(c, &unmatched_c));
        }
        msg.pop();
        let help = if let Some(m) = map {
            map_help(m)
        } else if r_ports.len() == c_ports.len() && r.outputs.len() == c.outputs.len() {
            "the bit counts agree: if the ports are in the same order, try `--pair-by position`; to leave the extra inputs free (the proof then covers all their values), use `--free-extra-inputs`".to_string()
        } else {
            "rename the ports to agree, or use `--free-extra-inputs` to leave the extra inputs free (the proof then covers all their values)".to_string()
        };
        return Err(InputError::plain(msg, help));
    }
    let unmatched: Vec<String> = unmatched_r
        .iter()
        .map(|&i| format!("{} (reference)", r.inputs[i].name))
        .chain(
            unmatched_c
                .iter()
                .map(|&i| format!("{} (candidate)", c.inputs[i].name)),
        )
        .collect();
    for (i, b) in r.inputs.iter().enumerate() {
        if ref_input[i] == usize::MAX && (b.is_unknown() || free_extra) {
            ref_input[i] = inputs.len();
            inputs.push(SharedInput::Reference(i));
        }
    }
    for (i, b) in c.inputs.iter().enumerate() {
        if cand_input[i] == usize::MAX && (b.is_unknown() || free_extra) {
            cand_input[i] = inputs.len();
            inputs.push(SharedInput::Candidate(i));
        }
    }
    let mut aig = Aig::new();
    aig.reserve(r.aig.len() + c.aig.len());
    let lits: Vec<Lit> = (0..inputs.len()).map(|_| aig.add_input()).collect();
    let rmap: Vec<Lit> = ref_input.iter().map(|&k| lits[k]).collect();
    let cmap: Vec<Lit> = cand_input.iter().map(|&k| lits[k]).collect();
    let rroots: Vec<Lit> = pairs.iter().map(|&(ro, _)| r.outputs[ro].lit).collect();
    let croots: Vec<Lit> = pairs.iter().map(|&(_, co)| c.outputs[co].lit).collect();
    let ref_lits = aig.import(&r.aig, &rmap, &rroots);
    let cand_lits = aig.import(&c.aig, &cmap, &croots);
    aig.debug_check();
    Ok(Shared {
        aig,
        inputs,
        ref_input,
        cand_input,
        ref_lits,
        cand_lits,
        constraint: Lit::TRUE,
        ands: (r.aig.num_ands(), c.aig.num_ands()),
        unmatched,
        dont_care: vec![false; pairs.len()],
        pairs,
    })
}

/// Help for bits left without a partner when a port map is in use.
fn map_help(m: &BitMap) -> String {
    format!(
        "add a line `REFERENCE_NAME CANDIDATE_NAME` to the port map {} for each renamed port or bit",
        m.file
    )
}

fn port_inputs(d: &Design) -> Vec<usize> {
    d.inputs
        .iter()
        .enumerate()
        .filter(|(_, b)| matches!(b.kind, InputKind::Port))
        .map(|(i, _)| i)
        .collect()
}

fn pair_outputs(
    r: &Design,
    c: &Design,
    by: PairBy,
    partner: &dyn Fn(&str) -> Option<String>,
) -> Result<Vec<(usize, usize)>, InputError> {
    if by == PairBy::Position {
        return Ok((0..r.outputs.len()).map(|i| (i, i)).collect());
    }
    let mut pairs = Vec::with_capacity(r.outputs.len());
    let mut only_r = Vec::new();
    let mut used = vec![false; c.outputs.len()];
    let by_name: std::collections::HashMap<&str, usize> = c
        .outputs
        .iter()
        .enumerate()
        .rev()
        .map(|(k, o)| (o.name.as_str(), k))
        .collect();
    for (ri, o) in r.outputs.iter().enumerate() {
        match partner(&o.name).and_then(|n| by_name.get(n.as_str()).copied()) {
            Some(ci) => {
                used[ci] = true;
                pairs.push((ri, ci));
            }
            None => only_r.push(o.name.as_str()),
        }
    }
    let only_c: Vec<&str> = c
        .outputs
        .iter()
        .zip(&used)
        .filter(|(_, &u)| !u)
        .map(|(o, _)| o.name.as_str())
        .collect();
    if only_r.is_empty() && only_c.is_empty() {
        return Ok(pairs);
    }
    let show = |v: &[&str]| v.iter().take(20).copied().collect::<Vec<_>>().join(", ");
    let mut msg = String::from("output bits do not match by name:");
    if !only_r.is_empty() {
        msg += &format!(" only in the reference: {};", show(&only_r));
    }
    if !only_c.is_empty() {
        msg += &format!(" only in the candidate: {};", show(&only_c));
    }
    msg.pop();
    let help = if r.outputs.len() == c.outputs.len() && port_inputs(r).len() == port_inputs(c).len()
    {
        "the bit counts agree: if the ports are in the same order, try `--pair-by position`"
    } else {
        "rename the outputs so that each reference output has a candidate output of the same name"
    };
    Err(InputError::plain(msg, help))
}
