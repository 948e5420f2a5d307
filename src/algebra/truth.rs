//! Truth tables of functions of up to three leaves, shared by the cut enumeration of
//! `units.rs` and the functional cuts of `carry.rs`.

/// Truth tables of the three leaf projections (leaf j is bit j of the minterm).
pub(super) const PROJ: [u8; 3] = [0xAA, 0xCC, 0xF0];

/// Truth table `tt` over `from` re-expressed over `to` (a superset, both increasing).
pub(super) fn expand(tt: u8, from: &[u32], to: &[u32]) -> u8 {
    let pos: Vec<usize> = from
        .iter()
        .map(|l| to.iter().position(|x| x == l).expect("leaf in superset"))
        .collect();
    let mut out = 0u8;
    for m in 0..8u8 {
        let mut idx = 0u8;
        for (j, &p) in pos.iter().enumerate() {
            if (m >> p) & 1 == 1 {
                idx |= 1 << j;
            }
        }
        if (tt >> idx) & 1 == 1 {
            out |= 1 << m;
        }
    }
    out
}
