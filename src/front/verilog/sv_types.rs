//! The SystemVerilog user types and packages in force while parsing (the data; the parsing
//! is in `parse_types.rs`): packed types, struct members, packages and the scope that holds
//! them across the files of one design. Kept apart so that the parser can own a scope without
//! the two parsing files importing each other.

use super::ast::*;
use super::symbols::Sym;
use std::collections::BTreeMap;
use std::rc::Rc;

/// A packed type: what a declaration of it becomes.
#[derive(Clone, Debug)]
pub struct TypeDef {
    /// Signed?
    pub signed: bool,
    /// `int`/`integer` (32 bits, signed, no range).
    pub integer: bool,
    /// Packed range; `None` for one bit (or `integer`).
    pub range: Option<Range>,
    /// Members of a packed struct, first (most significant) first.
    pub fields: Option<Rc<Vec<Field>>>,
}

/// One member of a packed struct.
#[derive(Clone, Debug)]
pub struct Field {
    /// Its name.
    pub name: Sym,
    /// Its type.
    pub ty: TypeDef,
    /// Offset of its least significant bit in the struct.
    pub off: Expr,
}

/// A package: its parameters (all local, clause 26.2) and types.
#[derive(Clone, Debug, Default)]
pub struct Package {
    pub(super) params: Vec<ParamDecl>,
    pub(super) types: BTreeMap<Sym, TypeDef>,
}

/// The names of types and packages in force.
#[derive(Default)]
pub struct SvScope {
    pub(super) unit_types: BTreeMap<Sym, TypeDef>,
    pub(super) unit_params: Vec<ParamDecl>,
    pub(super) unit_imports: Vec<Sym>,
    pub(super) packages: BTreeMap<Sym, Package>,
    pub(super) mod_types: BTreeMap<Sym, TypeDef>,
    pub(super) imports: Vec<Sym>,
    pub(super) used: Vec<Sym>,
    pub(super) structs: BTreeMap<Sym, TypeDef>,
    /// Enum members declared by the type just read, to be placed by the caller.
    pub(super) pending: Vec<ParamDecl>,
    /// The struct type of the declaration being read, if any.
    pub(super) decl_struct: Option<TypeDef>,
    /// The arrays of the module being read (see `parse_array.rs`).
    pub(super) arrays: BTreeMap<Sym, ArrayShape>,
    /// The packed dimensions of the declaration being read, when it has more than one.
    pub(super) decl_packed: Option<Vec<Range>>,
}

/// The shape of an array declared in the module: what its selects are lowered against.
#[derive(Clone, Debug)]
pub struct ArrayShape {
    /// Every dimension in select order: the unpacked ones first, then the packed ones.
    pub dims: Vec<Range>,
    /// How many of them are unpacked (0 for a packed multidimensional vector).
    pub unpacked: usize,
    /// Declared `signed` (a whole word of an unpacked array reads signed).
    pub signed: bool,
}
