//! The syntax tree of the Verilog subset, as parsed (before parameters are known).
//!
//! **Invariant:** left-associative operator chains are flat ([`Expr::Chain`]) and nesting
//! depth is bounded by the parser, so walking an expression recursively cannot overflow.

use super::lexer::NumLit;
use super::pos::Pos;
use super::symbols::Sym;

/// Unary operators.
#[derive(Copy, Clone, Debug, PartialEq, Eq)]
#[allow(missing_docs)]
pub enum UnOp {
    Plus,
    Neg,
    Not,     // ~
    LogNot,  // !
    RedAnd,  // &
    RedNand, // ~&
    RedOr,   // |
    RedNor,  // ~|
    RedXor,  // ^
    RedXnor, // ~^ ^~
}

/// Binary operators (left-associative; `Chain` groups those of one precedence level).
#[derive(Copy, Clone, Debug, PartialEq, Eq)]
#[allow(missing_docs)]
pub enum BinOp {
    Mul,
    Div,
    Mod,
    Add,
    Sub,
    Shl,
    Shr,
    AShl,
    AShr,
    Lt,
    Le,
    Gt,
    Ge,
    Eq,
    Ne,
    CaseEq,
    CaseNe,
    And,
    Xor,
    Xnor,
    Or,
    LogAnd,
    LogOr,
    /// `**` (level 10: parsed apart, it binds tighter than `*`).
    Pow,
}

impl BinOp {
    /// Precedence level, 0 = binds tightest (IEEE 1364-2005 clause 5.1.2, Table 5-4).
    pub fn level(self) -> usize {
        use BinOp::*;
        match self {
            Mul | Div | Mod => 0,
            Add | Sub => 1,
            Shl | Shr | AShl | AShr => 2,
            Lt | Le | Gt | Ge => 3,
            Eq | Ne | CaseEq | CaseNe => 4,
            And => 5,
            Xor | Xnor => 6,
            Or => 7,
            LogAnd => 8,
            LogOr => 9,
            Pow => 10,
        }
    }

    /// The operator as written.
    pub fn text(self) -> &'static str {
        use BinOp::*;
        match self {
            Mul => "*",
            Div => "/",
            Mod => "%",
            Add => "+",
            Sub => "-",
            Shl => "<<",
            Shr => ">>",
            AShl => "<<<",
            AShr => ">>>",
            Lt => "<",
            Le => "<=",
            Gt => ">",
            Ge => ">=",
            Eq => "==",
            Ne => "!=",
            CaseEq => "===",
            CaseNe => "!==",
            And => "&",
            Xor => "^",
            Xnor => "~^",
            Or => "|",
            LogAnd => "&&",
            LogOr => "||",
            Pow => "**",
        }
    }
}

/// Number of binary precedence levels.
pub const LEVELS: usize = 10;

/// Kinds of selects.
#[derive(Clone, Debug)]
pub enum Select {
    /// `[i]`
    Bit(Expr),
    /// `[m:l]`
    Part(Expr, Expr),
    /// `[b+:w]`
    Up(Expr, Expr),
    /// `[b-:w]`
    Down(Expr, Expr),
}

/// An expression.
#[derive(Clone, Debug)]
pub enum Expr {
    /// A name.
    Ident(Sym, Pos),
    /// A number.
    Num(Box<NumLit>, Pos),
    /// A select of a name: `a[i]`, `a[m:l]`, `a[b+:w]`.
    Index(Sym, Pos, Box<Select>),
    /// Unary operator.
    Unary(UnOp, Pos, Box<Expr>),
    /// `first op1 e1 op2 e2 ...`, all operators of one precedence level, left-associative.
    Chain(Box<Expr>, Vec<(BinOp, Pos, Expr)>),
    /// `c ? t : f`
    Cond(Box<[Expr; 3]>, Pos),
    /// `{a, b, ...}`
    Concat(Vec<Expr>, Pos),
    /// `{n{a, b}}`
    Repl(Box<Expr>, Vec<Expr>, Pos),
    /// `$signed(e)` / `$unsigned(e)` / `$clog2(e)` / `$bits(e)`, or a call of a function
    /// declared in the design (a name without `$`).
    Call(Sym, Pos, Vec<Expr>),
    /// A cast `W'(e)`, `T'(e)`, `signed'(e)`, `unsigned'(e)` (IEEE 1800-2017 clause 6.24).
    Cast(Box<Cast>, Pos),
}

/// What a cast changes: the width (the value `e` would have after an assignment to a
/// variable of that width), the signedness, or both (a cast to a type).
#[derive(Clone, Debug)]
pub struct Cast {
    /// The new width, a constant expression; `None` keeps the operand's width.
    pub width: Option<Expr>,
    /// The new signedness; `None` keeps the operand's.
    pub signed: Option<bool>,
    /// The operand.
    pub expr: Expr,
}

impl Expr {
    /// Where the expression starts.
    pub fn pos(&self) -> Pos {
        match self {
            Expr::Ident(_, p) | Expr::Num(_, p) | Expr::Index(_, p, _) => *p,
            Expr::Unary(_, p, _) | Expr::Cond(_, p) | Expr::Concat(_, p) => *p,
            Expr::Repl(_, _, p) | Expr::Call(_, p, _) | Expr::Cast(_, p) => *p,
            Expr::Chain(first, _) => first.pos(),
        }
    }
}

/// A range `[msb:lsb]`.
#[derive(Clone, Debug)]
pub struct Range {
    /// Left bound.
    pub msb: Expr,
    /// Right bound.
    pub lsb: Expr,
}

/// Port directions.
#[derive(Copy, Clone, Debug, PartialEq, Eq)]
pub enum Dir {
    /// `input`
    Input,
    /// `output`
    Output,
}

/// Net and variable types.
#[derive(Copy, Clone, Debug, PartialEq, Eq)]
pub enum NetType {
    /// `wire` (or none given).
    Wire,
    /// `reg`
    Reg,
    /// `integer`
    Integer,
    /// SystemVerilog `logic` or `bit` (IEEE 1800-2017 clause 6.11, from memory): driven by
    /// one continuous assignment or assigned in always blocks.
    Logic,
}

/// A declaration of nets, variables or ports.
#[derive(Clone, Debug)]
pub struct Decl {
    /// Port direction, if a port declaration.
    pub dir: Option<Dir>,
    /// Net type, if written.
    pub ty: Option<NetType>,
    /// `signed`
    pub signed: bool,
    /// The range, if a vector (boxed: most declarations of a netlist have none).
    pub range: Option<Box<Range>>,
    /// Declared names, with an optional `= expr` (net declaration assignment).
    /// (Boxed: most names have none, and a netlist declares a million names.)
    pub names: Vec<(Sym, Pos, Option<Box<Expr>>)>,
    /// Where the declaration starts.
    pub pos: Pos,
}

/// A parameter declaration.
#[derive(Clone, Debug)]
pub struct ParamDecl {
    /// `localparam` (not overridable).
    pub local: bool,
    /// `signed`
    pub signed: bool,
    /// `integer` type given.
    pub integer: bool,
    /// Range, if given.
    pub range: Option<Range>,
    /// Names and values.
    pub assigns: Vec<(Sym, Pos, Expr)>,
}

/// Gate primitive kinds.
#[derive(Copy, Clone, Debug, PartialEq, Eq)]
#[allow(missing_docs)]
pub enum GateKind {
    And,
    Nand,
    Or,
    Nor,
    Xor,
    Xnor,
    Not,
    Buf,
}

/// Connections of an instance: by name or by position.
#[derive(Clone, Debug)]
pub enum Conns {
    /// `.a(x), .b()`
    Named(Vec<(Sym, Pos, Option<Expr>)>),
    /// `x, y`
    Ordered(Vec<Option<Expr>>),
}

/// One module instance.
#[derive(Clone, Debug)]
pub struct Instance {
    /// Instantiated module.
    pub module: Sym,
    /// Parameter overrides.
    pub params: Option<Conns>,
    /// Instance name.
    pub name: Sym,
    /// Port connections.
    pub conns: Conns,
    /// Where the instance is written.
    pub pos: Pos,
    /// The range of an array of instances (`cell u[3:0] (...)`, IEEE 1364-2005 clause 12.1.2).
    pub array: Option<Range>,
}

/// `defparam a.b.P = expr;`: the instance path, the parameter, the value (IEEE 1364-2005
/// clause 12.2.1).
#[derive(Clone, Debug)]
pub struct Defparam {
    /// Instance names from this module down, then the parameter name.
    pub path: Vec<(Sym, Pos)>,
    /// The value, a constant expression of the module where the `defparam` is written.
    pub value: Expr,
    /// Where the `defparam` is written.
    pub pos: Pos,
}

/// A statement of an `always` block.
#[derive(Clone, Debug)]
pub enum Stmt {
    /// `begin ... end`
    Block(Vec<Stmt>),
    /// `lhs = rhs;`
    Assign(Expr, Expr, Pos),
    /// `lhs <= rhs;` (non-blocking, in clocked blocks only)
    NonBlocking(Expr, Expr, Pos),
    /// `if (c) t else e`
    If(Expr, Box<Stmt>, Option<Box<Stmt>>, Pos),
    /// `case`/`casez`
    Case(Box<CaseStmt>),
    /// `for (init; cond; step) body`
    For(Box<ForStmt>),
    /// `return expr;` in a function (rewritten into an assignment to the function's name
    /// when the function is parsed, see `parse_func.rs`).
    Return(Expr, Pos),
    /// `;`
    Null,
    /// `unique`, `unique0` or `priority` before a `case` or an `if` (IEEE 1800-2017 clauses
    /// 12.4.2 and 12.5.3, from memory): where the keyword is written and the statement.
    Qualified(Qualifier, Pos, Box<Stmt>),
}

/// The checks a `case` or `if` qualifier asks for.
#[derive(Copy, Clone, Debug, PartialEq, Eq)]
pub enum Qualifier {
    /// `unique`: at most one item matches, and some item matches (unless `default`/`else`).
    Unique,
    /// `unique0`: at most one item matches.
    Unique0,
    /// `priority`: some item matches (unless `default`/`else`).
    Priority,
}

impl Qualifier {
    /// The keyword.
    pub fn text(self) -> &'static str {
        match self {
            Qualifier::Unique => "unique",
            Qualifier::Unique0 => "unique0",
            Qualifier::Priority => "priority",
        }
    }
}

/// A clock edge in an event list.
#[derive(Copy, Clone, Debug, PartialEq, Eq)]
pub enum Edge {
    /// `posedge`
    Rising,
    /// `negedge`
    Falling,
}

/// One entry of an event list: `a`, `a[1]`, `posedge clk`.
#[derive(Clone, Debug)]
pub struct Event {
    /// The edge, if one is named.
    pub edge: Option<Edge>,
    /// The expression watched.
    pub expr: Expr,
}

/// What an `always` block waits for.
#[derive(Clone, Debug)]
pub enum Sensitivity {
    /// `@*`, `@(*)` or `always_comb`: every variable read (IEEE 1364-2005 clause 9.7.5).
    Implicit,
    /// `@(a or b)` / `@(a, b)` (IEEE 1364-2005 clauses 9.7.2 and 9.7.3); where it is.
    List(Vec<Event>, Pos),
}

/// An `always` block.
#[derive(Clone, Debug)]
pub struct Always {
    /// Its event control.
    pub sensitivity: Sensitivity,
    /// Its statement.
    pub body: Stmt,
}

/// A `case` statement.
#[derive(Clone, Debug)]
pub struct CaseStmt {
    /// `casez` rather than `case`.
    pub casez: bool,
    /// `case (e) inside` (IEEE 1800-2017 clause 12.5.4): x, z and `?` bits of a number label
    /// are don't-cares, and labels may be ranges.
    pub inside: bool,
    /// The selector.
    pub expr: Expr,
    /// Items: labels and statement.
    pub items: Vec<(Vec<Expr>, Stmt)>,
    /// Range labels `[lo:hi]` of a `case inside`: the item's index, the bounds (inclusive).
    pub ranges: Vec<(usize, Expr, Expr)>,
    /// `default:` statement.
    pub default: Option<Stmt>,
    /// Where it is written.
    pub pos: Pos,
}

/// A `for` statement (procedural or generate).
#[derive(Clone, Debug)]
pub struct ForStmt {
    /// Loop variable and initial value.
    pub init: (Sym, Pos, Expr),
    /// Continue condition.
    pub cond: Expr,
    /// Loop variable and step value.
    pub step: (Sym, Pos, Expr),
    /// The body.
    pub body: Stmt,
    /// Where it is written.
    pub pos: Pos,
}

/// A generate loop.
#[derive(Clone, Debug)]
pub struct GenFor {
    /// Loop variable and initial value.
    pub init: (Sym, Pos, Expr),
    /// Continue condition.
    pub cond: Expr,
    /// Loop variable and step value.
    pub step: (Sym, Pos, Expr),
    /// Block name.
    pub name: Option<Sym>,
    /// Items of the block.
    pub items: Vec<Item>,
    /// Where it is written.
    pub pos: Pos,
}

/// A module item.
#[derive(Clone, Debug)]
pub enum Item {
    /// Net, variable or port declaration.
    Decl(Box<Decl>),
    /// `parameter` / `localparam`.
    Param(Box<ParamDecl>),
    /// `genvar i;`
    Genvar(Vec<(Sym, Pos)>),
    /// `assign lhs = rhs;`
    Assign(Box<(Expr, Expr)>, Pos),
    /// Gate primitive instance: kind, terminals (output first), where it starts (the
    /// instance name is not kept).
    Gate(GateKind, Box<[Expr]>, Pos),
    /// Module instance.
    Inst(Box<Instance>),
    /// `defparam u1.P = 8;`
    Defparam(Box<Defparam>),
    /// `always @*`, `always @(a or b)`, `always_comb`, ...
    Always(Box<Always>, Pos),
    /// Generate loop.
    GenFor(Box<GenFor>),
    /// Generate `if`: condition, then-items, else-items.
    GenIf(Box<(Expr, Vec<Item>, Vec<Item>)>),
    /// `function ... endfunction`.
    Function(Box<Function>),
    /// `initial` block, or a variable's initial value in its declaration (`reg q = 0;` is
    /// `initial q = 0;`): constants given at time 0.
    Initial(Box<Stmt>, Pos),
}

/// A function declaration (IEEE 1364-2005 clause 10.4; the ANSI header and `return` of
/// IEEE 1800-2017 clause 13.4, from memory).
#[derive(Clone, Debug)]
pub struct Function {
    /// Its name (also the variable that holds the result).
    pub name: Sym,
    /// The result's type: `ty`, `signed` and `range` (no names).
    pub ret: Decl,
    /// Input and local variable declarations in order (inputs have `dir` set; their
    /// order is the order of the arguments).
    pub decls: Vec<Decl>,
    /// The body, `return`s already rewritten into assignments to the name.
    pub body: Stmt,
    /// Where it is written.
    pub pos: Pos,
}

/// A module.
#[derive(Clone, Debug)]
pub struct Module {
    /// Its name.
    pub name: Sym,
    /// Port names in order.
    pub ports: Vec<(Sym, Pos)>,
    /// Items (ANSI port declarations come first, as `Item::Decl`).
    pub items: Vec<Item>,
    /// Where it is written.
    pub pos: Pos,
    /// Whether `` `default_nettype none`` was in force.
    pub nettype_none: bool,
}

#[cfg(test)]
mod size_tests {
    /// A million-gate netlist holds a million items: keep them small.
    #[test]
    fn items_stay_small() {
        assert!(
            std::mem::size_of::<super::Item>() <= 56,
            "{}",
            std::mem::size_of::<super::Item>()
        );
        assert!(std::mem::size_of::<super::Expr>() <= 48);
    }
}
