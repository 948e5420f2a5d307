//! SystemVerilog packages and the `$unit` scope (IEEE 1800-2017 clauses 26.2-26.4 and 3.12.1,
//! from memory): `package ... endpackage`, `import p::*`, `p::NAME`, and `typedef` and
//! parameters outside modules. A package's parameters are copied into each module that
//! imports or names it; its types resolve while parsing (see `parse_types`).

use super::ast::*;
use super::lexer::{Punct, TokenKind};
use super::parse_types::Package;
use super::parser::{ParseResult, Parser};
use super::pos::Pos;
use super::symbols::Sym;

impl Parser<'_, '_> {
    /// Start a module: forget the previous module's types and imports.
    pub(super) fn types_enter_module(&mut self) {
        let sv = &mut self.sv;
        sv.mod_types.clear();
        sv.structs.clear();
        sv.arrays.clear();
        sv.used.clear();
        sv.imports = sv.unit_imports.clone();
    }

    /// End a module: copy the parameters of `$unit` and of the packages it imports or names
    /// to the front of its items, except names the module declares itself (a local
    /// declaration wins over a wildcard import, clause 26.3).
    pub(super) fn types_leave_module(&mut self, items: &mut Vec<Item>) {
        let mut local: Vec<Sym> = Vec::new();
        for it in items.iter() {
            match it {
                Item::Param(pd) => local.extend(pd.assigns.iter().map(|a| a.0)),
                Item::Decl(d) => local.extend(d.names.iter().map(|a| a.0)),
                _ => {}
            }
        }
        let mut srcs: Vec<Sym> = Vec::new();
        for &p in self.sv.imports.iter().chain(self.sv.used.iter()) {
            if !srcs.contains(&p) {
                srcs.push(p);
            }
        }
        let mut front = Vec::new();
        let mut seen: Vec<Sym> = Vec::new();
        let mut add = |pd: &ParamDecl, front: &mut Vec<Item>| {
            let mut pd = pd.clone();
            pd.assigns
                .retain(|a| !local.contains(&a.0) && !seen.contains(&a.0));
            seen.extend(pd.assigns.iter().map(|a| a.0));
            if !pd.assigns.is_empty() {
                front.push(Item::Param(Box::new(pd)));
            }
        };
        for pd in &self.sv.unit_params {
            add(pd, &mut front);
        }
        for p in srcs {
            if let Some(pkg) = self.sv.packages.get(&p) {
                for pd in &pkg.params {
                    add(pd, &mut front);
                }
            }
        }
        if !front.is_empty() {
            front.append(items);
            *items = front;
        }
    }

    /// `import p::*;` or `import p::name;` (read as the whole package).
    pub(super) fn import(&mut self, unit: bool) -> ParseResult<()> {
        self.bump();
        loop {
            let (p, pos) = self.ident("a package name")?;
            self.expect_p(Punct::Colon, "`::` after the package name")?;
            self.expect_p(Punct::Colon, "`::` after the package name")?;
            if !self.is_package(p) {
                let n = self.names.name(p).to_string();
                return Err(self.error(pos, format!("unknown package `{n}` (declare it with `package {n}; ... endpackage` before it is imported)")));
            }
            if !self.eat_p(Punct::Star) {
                self.ident("a name or `*` after `::`")?;
            }
            let list = if unit {
                &mut self.sv.unit_imports
            } else {
                &mut self.sv.imports
            };
            if !list.contains(&p) {
                list.push(p);
            }
            if !self.eat_p(Punct::Comma) {
                break;
            }
        }
        self.expect_p(Punct::Semi, "`;` after the import")
    }

    /// Whether the next token starts a `typedef` / `import`.
    pub(super) fn peek_typedef(&mut self) -> bool {
        self.peek_name_is("typedef")
    }

    /// Whether the next token is `import`.
    pub(super) fn peek_import(&mut self) -> bool {
        self.peek_name_is("import")
    }

    /// `package name; (typedef | parameter | localparam | import)* endpackage [: name]`
    /// (the keyword next).
    pub(super) fn package(&mut self) {
        self.bump();
        let name = match self.ident("a package name") {
            Ok((n, _)) => n,
            Err(_) => {
                self.skip_to_name("endpackage");
                return;
            }
        };
        if self
            .expect_p(Punct::Semi, "`;` after the package name")
            .is_err()
        {
            self.skip_to_name("endpackage");
            return;
        }
        self.types_enter_module();
        let mut pkg = Package::default();
        loop {
            let t = self.peek().clone();
            let k = match t.kind {
                TokenKind::Eof => {
                    self.error(t.pos, "missing `endpackage`");
                    return;
                }
                TokenKind::Ident(k) => k,
                _ => {
                    let d = self.describe(&t.kind);
                    self.unexpected(t.pos, "a package item", &d);
                    self.recover();
                    continue;
                }
            };
            if self.name_is(k, "endpackage") {
                self.bump();
                if self.eat_p(Punct::Colon) {
                    let _ = self.ident("the package name");
                }
                break;
            }
            let r = if self.name_is(k, "typedef") {
                let r = self.typedef();
                pkg.params.extend(self.take_pending());
                match r {
                    Ok((n, ty)) => {
                        pkg.types.insert(n, ty.clone());
                        // Later items of the package see it.
                        self.sv.mod_types.insert(n, ty);
                    }
                    Err(_) => self.skip_declaration(),
                }
                Ok(())
            } else if k == super::symbols::kw::PARAMETER || k == super::symbols::kw::LOCALPARAM {
                let mut v = Vec::new();
                let r = self.item(&mut v);
                for it in v {
                    if let Item::Param(mut pd) = it {
                        pd.local = true;
                        pkg.params.push(*pd);
                    }
                }
                r
            } else if self.name_is(k, "import") {
                self.unsupported(t.pos, "`import` inside a package");
                Err(super::parser::Stop)
            } else {
                let what = self.names.name(k).to_string();
                self.unsupported(t.pos, format!("`{what}` in a package (packages may hold `typedef`, `parameter` and `localparam`)"));
                self.skip_construct(k);
                continue;
            };
            if r.is_err() {
                self.recover();
            }
        }
        self.types_enter_module();
        self.sv.packages.insert(name, pkg);
    }

    /// `typedef` or `localparam`/`parameter` outside any module (the `$unit` scope): in
    /// force for the modules after it.
    pub(super) fn unit_item(&mut self, k: Sym) {
        let r = if self.name_is(k, "typedef") {
            let r = self.typedef();
            let p = self.take_pending();
            self.sv.unit_params.extend(p);
            match r {
                Ok((n, ty)) => {
                    self.sv.unit_types.insert(n, ty);
                }
                Err(_) => self.skip_declaration(),
            }
            Ok(())
        } else if self.name_is(k, "import") {
            self.import(true)
        } else {
            let mut v = Vec::new();
            let r = self.item(&mut v);
            for it in v {
                if let Item::Param(mut pd) = it {
                    pd.local = true;
                    self.sv.unit_params.push(*pd);
                }
            }
            r
        };
        if r.is_err() {
            self.recover();
        }
    }

    /// `name` followed by `::` in an expression: a package parameter, read by its own name
    /// (the package's parameters are copied into the module).
    pub(super) fn scoped_name(&mut self, pkg: Sym, pos: Pos) -> ParseResult<Expr> {
        let (n, p) = self.scoped(pkg, pos)?;
        let has = self.sv.packages.get(&pkg).is_some_and(|pk| {
            pk.params
                .iter()
                .any(|pd| pd.assigns.iter().any(|a| a.0 == n))
        });
        if !has {
            let (pn, nn) = (
                self.names.name(pkg).to_string(),
                self.names.name(n).to_string(),
            );
            return Err(self.error(p, format!("package `{pn}` declares no parameter `{nn}`")));
        }
        Ok(Expr::Ident(n, p))
    }

    /// A `typedef` among module items.
    pub(super) fn module_typedef(&mut self, out: &mut Vec<Item>) -> ParseResult<()> {
        let r = self.typedef();
        for pd in self.take_pending() {
            out.push(Item::Param(Box::new(pd)));
        }
        match r {
            Ok((n, ty)) => {
                self.sv.mod_types.insert(n, ty);
            }
            Err(_) => self.skip_declaration(),
        }
        Ok(())
    }
}
