//! Interned identifiers: every name of a Verilog source becomes a [`Sym`]; keywords are the
//! first symbols, so a keyword test is an integer comparison.

/// An interned identifier or keyword.
#[derive(Copy, Clone, Debug, PartialEq, Eq, Hash, PartialOrd, Ord)]
pub struct Sym(pub u32);

macro_rules! keywords {
    ($($name:ident = $text:expr,)*) => {
        /// Keyword symbols (pre-interned, in this order).
        pub mod kw {
            use super::Sym;
            keywords!(@consts 0u32, $($name,)*);
        }
        const KEYWORDS: &[&str] = &[$($text,)*];
    };
    (@consts $n:expr, $first:ident, $($rest:ident,)*) => {
        #[allow(missing_docs)]
        pub const $first: Sym = Sym($n);
        keywords!(@consts $n + 1u32, $($rest,)*);
    };
    (@consts $n:expr,) => {
        /// Number of keywords.
        pub const COUNT: u32 = $n;
    };
}

keywords! {
    MODULE = "module", ENDMODULE = "endmodule", MACROMODULE = "macromodule",
    INPUT = "input", OUTPUT = "output", INOUT = "inout",
    WIRE = "wire", REG = "reg", INTEGER = "integer", SIGNED = "signed",
    PARAMETER = "parameter", LOCALPARAM = "localparam", DEFPARAM = "defparam",
    ASSIGN = "assign", ALWAYS = "always", BEGIN = "begin", END = "end",
    IF = "if", ELSE = "else", CASE = "case", CASEZ = "casez", CASEX = "casex",
    ENDCASE = "endcase", DEFAULT = "default", FOR = "for",
    GENERATE = "generate", ENDGENERATE = "endgenerate", GENVAR = "genvar",
    AND = "and", NAND = "nand", OR = "or", NOR = "nor", XOR = "xor", XNOR = "xnor",
    NOT = "not", BUF = "buf",
    POSEDGE = "posedge", NEGEDGE = "negedge", INITIAL = "initial",
    FUNCTION = "function", ENDFUNCTION = "endfunction", TASK = "task", ENDTASK = "endtask",
    SUPPLY0 = "supply0", SUPPLY1 = "supply1", TRI = "tri", WAND = "wand", WOR = "wor",
    TRI0 = "tri0", TRI1 = "tri1", TRIAND = "triand", TRIOR = "trior", TRIREG = "trireg",
    REAL = "real", REALTIME = "realtime", TIME = "time", EVENT = "event",
    WHILE = "while", REPEAT = "repeat", FOREVER = "forever", FORK = "fork", JOIN = "join",
    SPECIFY = "specify", ENDSPECIFY = "endspecify", PRIMITIVE = "primitive",
    ENDPRIMITIVE = "endprimitive", TABLE = "table", ENDTABLE = "endtable",
    BUFIF0 = "bufif0", BUFIF1 = "bufif1", NOTIF0 = "notif0", NOTIF1 = "notif1",
    PULLUP = "pullup", PULLDOWN = "pulldown", WAIT = "wait", DISABLE = "disable",
    DEASSIGN = "deassign", FORCE = "force", RELEASE = "release", AUTOMATIC = "automatic",
    SPECPARAM = "specparam", NMOS = "nmos", PMOS = "pmos", CMOS = "cmos",
    TRAN = "tran", RTRAN = "rtran",
}

/// The interner: names to symbols and back.
///
/// A million-gate netlist has a million names, so the table is compact: the texts of all
/// names one after another in one string, the end offset of each, and an open-addressing
/// table of symbol numbers with the low hash bits beside them (a probe compares texts only
/// when those bits agree). About 20 bytes per name besides its text.
#[derive(Debug)]
pub struct Interner {
    text: String,
    ends: Vec<usize>,
    /// Slots: 0 for empty, else symbol number + 1 and 32 bits of the name's hash.
    table: Vec<(u32, u32)>,
}

impl Default for Interner {
    fn default() -> Self {
        Interner::new()
    }
}

fn hash(name: &str) -> u64 {
    use std::hash::Hasher;
    let mut h = crate::hash::Fx::default();
    h.write(name.as_bytes());
    h.write_usize(name.len());
    h.finish()
}

impl Interner {
    /// An interner holding the keywords.
    pub fn new() -> Interner {
        let mut i = Interner {
            text: String::new(),
            ends: Vec::new(),
            table: vec![(0, 0); 256],
        };
        for k in KEYWORDS {
            i.intern(k);
        }
        i
    }

    /// The slot holding `name`, or the empty slot where it would go.
    fn slot(&self, name: &str, h: u64) -> usize {
        let mask = self.table.len() - 1;
        let tag = h as u32;
        let mut k = (h >> 32) as usize & mask;
        loop {
            let (s, t) = self.table[k];
            if s == 0 || (t == tag && self.name(Sym(s - 1)) == name) {
                return k;
            }
            k = (k + 1) & mask;
        }
    }

    /// The symbol of `name`, creating it on first use.
    pub fn intern(&mut self, name: &str) -> Sym {
        let h = hash(name);
        let k = self.slot(name, h);
        if self.table[k].0 != 0 {
            return Sym(self.table[k].0 - 1);
        }
        let s = Sym(self.ends.len() as u32);
        self.text.push_str(name);
        self.ends.push(self.text.len());
        self.table[k] = (s.0 + 1, h as u32);
        if self.ends.len() * 2 > self.table.len() {
            self.grow();
        }
        s
    }

    fn grow(&mut self) {
        let bigger = vec![(0, 0); self.table.len() * 2];
        let old = std::mem::replace(&mut self.table, bigger);
        let mask = self.table.len() - 1;
        for (s, t) in old.into_iter().filter(|e| e.0 != 0) {
            let h = hash(self.name(Sym(s - 1)));
            let mut k = (h >> 32) as usize & mask;
            while self.table[k].0 != 0 {
                k = (k + 1) & mask;
            }
            self.table[k] = (s, t);
        }
    }

    /// How many names (keywords included) are interned.
    pub fn len(&self) -> usize {
        self.ends.len()
    }

    /// Whether no name is interned (never, once the keywords are in).
    pub fn is_empty(&self) -> bool {
        self.ends.is_empty()
    }

    /// The symbol of `name` if it was ever interned.
    pub fn get(&self, name: &str) -> Option<Sym> {
        let k = self.slot(name, hash(name));
        let s = self.table[k].0;
        (s != 0).then(|| Sym(s - 1))
    }

    /// The text of a symbol.
    pub fn name(&self, s: Sym) -> &str {
        let k = s.0 as usize;
        let start = if k == 0 { 0 } else { self.ends[k - 1] };
        &self.text[start..self.ends[k]]
    }
}

/// Whether the text `name` is a keyword (a small table that stays in cache, unlike the
/// table of all names).
pub fn is_keyword_text(name: &str) -> bool {
    static TABLE: std::sync::OnceLock<crate::hash::FastMap<&'static str, ()>> =
        std::sync::OnceLock::new();
    TABLE
        .get_or_init(|| KEYWORDS.iter().map(|k| (*k, ())).collect())
        .contains_key(name)
}

/// Whether `s` is a keyword.
pub fn is_keyword(s: Sym) -> bool {
    s.0 < kw::COUNT
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn keywords_come_first() {
        let mut i = Interner::new();
        assert_eq!(i.intern("module"), kw::MODULE);
        assert_eq!(i.intern("rtran"), kw::RTRAN);
        let a = i.intern("a");
        assert!(!is_keyword(a) && is_keyword(kw::ENDCASE));
        assert!(is_keyword_text("endcase") && is_keyword_text("rtran"));
        assert!(!is_keyword_text("a") && !is_keyword_text("Module"));
        assert_eq!(i.name(a), "a");
    }

    #[test]
    fn many_names_round_trip() {
        let mut i = Interner::new();
        let syms: Vec<Sym> = (0..100_000).map(|k| i.intern(&format!("n{k}"))).collect();
        for (k, &s) in syms.iter().enumerate() {
            let n = format!("n{k}");
            assert_eq!(i.name(s), n);
            assert_eq!(i.intern(&n), s);
            assert_eq!(i.get(&n), Some(s));
        }
        assert_eq!(i.get("n100000"), None);
        assert_eq!(i.get(""), None);
        let e = i.intern("");
        assert_eq!(i.name(e), "");
        assert_eq!(i.get(""), Some(e));
        assert_eq!(i.get("module"), Some(kw::MODULE));
    }
}
