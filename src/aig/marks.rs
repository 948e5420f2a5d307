//! Visit marks that clear in constant time: one stamp per node and a current epoch; starting a
//! new visit advances the epoch instead of clearing every stamp (they are cleared only when the
//! 32-bit epoch wraps). Used by graph walks that run many times over one large graph.

/// Visit marks over nodes `0..len`.
#[derive(Clone, Debug)]
pub struct Marks {
    stamp: Vec<u32>,
    epoch: u32,
}

impl Default for Marks {
    fn default() -> Self {
        Marks::new()
    }
}

impl Marks {
    /// No node marked, no slots yet.
    pub fn new() -> Marks {
        Marks {
            stamp: Vec::new(),
            epoch: 1,
        }
    }

    /// Start a new visit over at least `len` nodes: every mark is cleared.
    pub fn start(&mut self, len: usize) {
        if self.stamp.len() < len {
            self.stamp.resize(len, 0);
        }
        self.epoch = self.epoch.wrapping_add(1);
        if self.epoch == 0 {
            self.stamp.iter_mut().for_each(|s| *s = 0);
            self.epoch = 1;
        }
    }

    /// Mark `n`; true when it was not marked yet in this visit.
    #[inline]
    pub fn mark(&mut self, n: usize) -> bool {
        let fresh = self.stamp[n] != self.epoch;
        self.stamp[n] = self.epoch;
        fresh
    }

    /// Whether `n` is marked in this visit.
    #[inline]
    pub fn is_marked(&self, n: usize) -> bool {
        self.stamp.get(n) == Some(&self.epoch)
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn a_new_visit_clears_every_mark() {
        let mut m = Marks::new();
        m.start(4);
        assert!(!m.is_marked(2));
        assert!(m.mark(2));
        assert!(!m.mark(2));
        assert!(m.is_marked(2));
        m.start(4);
        assert!(!m.is_marked(2));
        assert!(!m.is_marked(9), "outside the slots: not marked");
    }

    #[test]
    fn the_epoch_wraps_without_stale_marks() {
        let mut m = Marks::new();
        m.start(3);
        m.mark(1);
        m.epoch = u32::MAX;
        m.stamp[0] = u32::MAX;
        m.start(3);
        assert!(!m.is_marked(0) && !m.is_marked(1));
        assert!(m.mark(0));
    }
}
