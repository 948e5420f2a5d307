//! Interned identifiers: every name of a Verilog source becomes a [`Sym`]; keywords are the
//! first symbols, so a keyword test is an integer comparison.

use super::fasthash::FastMap;

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
#[derive(Debug)]
pub struct Interner {
    map: FastMap<Box<str>, Sym>,
    names: Vec<Box<str>>,
}

impl Default for Interner {
    fn default() -> Self {
        Interner::new()
    }
}

impl Interner {
    /// An interner holding the keywords.
    pub fn new() -> Interner {
        let mut i = Interner {
            map: FastMap::default(),
            names: Vec::new(),
        };
        for k in KEYWORDS {
            i.intern(k);
        }
        i
    }

    /// The symbol of `name`, creating it on first use.
    pub fn intern(&mut self, name: &str) -> Sym {
        if let Some(&s) = self.map.get(name) {
            return s;
        }
        let s = Sym(self.names.len() as u32);
        self.names.push(name.into());
        self.map.insert(name.into(), s);
        s
    }

    /// The symbol of `name` if it was ever interned.
    pub fn get(&self, name: &str) -> Option<Sym> {
        self.map.get(name).copied()
    }

    /// The text of a symbol.
    pub fn name(&self, s: Sym) -> &str {
        &self.names[s.0 as usize]
    }
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
        assert_eq!(i.name(a), "a");
    }
}
