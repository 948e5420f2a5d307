//! Bit vectors packed 64 to a word: the input vectors that are the evidence of "depends"
//! claims. They print and serialize as strings of `0` and `1`, first bit first.

use serde::{Serialize, Serializer};
use std::fmt;

/// A fixed-length vector of bits.
#[derive(Clone, Default, PartialEq, Eq, Hash)]
pub struct Bits {
    words: Vec<u64>,
    len: usize,
}

impl Bits {
    /// `len` zero bits.
    pub fn new(len: usize) -> Bits {
        Bits {
            words: vec![0; len.div_ceil(64)],
            len,
        }
    }

    /// The bits of `v`, in order.
    pub fn from_bools(v: &[bool]) -> Bits {
        let mut b = Bits::new(v.len());
        for (i, &x) in v.iter().enumerate() {
            b.set(i, x);
        }
        b
    }

    /// Number of bits.
    pub fn len(&self) -> usize {
        self.len
    }

    /// Whether there are no bits.
    pub fn is_empty(&self) -> bool {
        self.len == 0
    }

    /// Bit `i` (panics when out of range, an internal bug).
    #[inline]
    pub fn get(&self, i: usize) -> bool {
        assert!(i < self.len, "bit {i} of a {}-bit vector", self.len);
        (self.words[i / 64] >> (i % 64)) & 1 == 1
    }

    /// Set bit `i` to `v`.
    #[inline]
    pub fn set(&mut self, i: usize, v: bool) {
        assert!(i < self.len, "bit {i} of a {}-bit vector", self.len);
        let m = 1u64 << (i % 64);
        if v {
            self.words[i / 64] |= m;
        } else {
            self.words[i / 64] &= !m;
        }
    }

    /// The bits as booleans.
    pub fn to_bools(&self) -> Vec<bool> {
        (0..self.len).map(|i| self.get(i)).collect()
    }

    /// The bits as `'0'`/`'1'` characters.
    pub fn chars(&self) -> impl Iterator<Item = char> + '_ {
        (0..self.len).map(|i| if self.get(i) { '1' } else { '0' })
    }
}

impl fmt::Display for Bits {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        for c in self.chars() {
            fmt::Write::write_char(f, c)?;
        }
        Ok(())
    }
}

impl fmt::Debug for Bits {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        write!(f, "\"{self}\"")
    }
}

impl Serialize for Bits {
    fn serialize<S: Serializer>(&self, s: S) -> Result<S::Ok, S::Error> {
        s.collect_str(self)
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn round_trips_and_prints() {
        let v: Vec<bool> = (0..130).map(|i| i % 3 == 0).collect();
        let b = Bits::from_bools(&v);
        assert_eq!(b.to_bools(), v);
        assert_eq!(b.len(), 130);
        assert!(b.to_string().starts_with("1001001"));
        assert_eq!(
            serde_json::to_string(&Bits::from_bools(&[false, true])).unwrap(),
            "\"01\""
        );
    }
}
