//! A small, fast, non-cryptographic hasher (the multiply-rotate scheme popularised by the
//! Rust compiler's "Fx" hasher, with a final avalanche step) for the tables that see millions
//! of lookups on large netlists: the Verilog reader's names, the AIG's structural hashing and
//! the sweep's candidate classes. Not resistant to adversarial keys; only used for names and
//! node ids.

use std::collections::HashMap;
use std::hash::{BuildHasherDefault, Hasher};

/// The hasher state.
#[derive(Default, Clone, Copy)]
pub struct Fx(u64);

const K: u64 = 0x51_7c_c1_b7_27_22_0a_95;

impl Fx {
    #[inline]
    fn add(&mut self, w: u64) {
        self.0 = (self.0.rotate_left(5) ^ w).wrapping_mul(K);
    }
}

impl Hasher for Fx {
    #[inline]
    fn write(&mut self, bytes: &[u8]) {
        let mut chunks = bytes.chunks_exact(8);
        for c in &mut chunks {
            self.add(u64::from_le_bytes(c.try_into().expect("8 bytes")));
        }
        let rest = chunks.remainder();
        if !rest.is_empty() {
            let mut b = [0u8; 8];
            b[..rest.len()].copy_from_slice(rest);
            self.add(u64::from_le_bytes(b));
        }
    }

    #[inline]
    fn write_u8(&mut self, i: u8) {
        self.add(i as u64);
    }

    #[inline]
    fn write_u32(&mut self, i: u32) {
        self.add(i as u64);
    }

    #[inline]
    fn write_u64(&mut self, i: u64) {
        self.add(i);
    }

    #[inline]
    fn write_usize(&mut self, i: usize) {
        self.add(i as u64);
    }

    #[inline]
    fn finish(&self) -> u64 {
        // Final avalanche (the 64-bit finalizer of MurmurHash3): the multiply-rotate steps
        // alone leave the low bits, which pick the bucket, depending on few input bits.
        let mut h = self.0;
        h ^= h >> 33;
        h = h.wrapping_mul(0xff51_afd7_ed55_8ccd);
        h ^= h >> 33;
        h = h.wrapping_mul(0xc4ce_b9fe_1a85_ec53);
        h ^ (h >> 33)
    }
}

/// A hash map with the fast hasher.
pub type FastMap<K, V> = HashMap<K, V, BuildHasherDefault<Fx>>;

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn map_works_with_strings_and_ids() {
        let mut m: FastMap<Box<str>, u32> = FastMap::default();
        for i in 0..1000u32 {
            m.insert(format!("n{i}").into(), i);
        }
        assert_eq!(m.get("n977"), Some(&977));
        assert_eq!(m.len(), 1000);
    }
}
