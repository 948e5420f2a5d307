//! Command-line mirrors of library enums: `cli_enum!` declares a `clap::ValueEnum` type with
//! the same variants (and help text) as a library type and the conversion into it, so that
//! the library itself does not depend on the argument parser. The conversion goes both ways, so
//! a variant added to the library type and missing here is a compile error.

/// `cli_enum! { /// doc  Wrapper => LibraryType { /// doc  Variant, ... } }`
macro_rules! cli_enum {
    (
        $(#[$meta:meta])*
        $name:ident => $lib:ident {
            $( $(#[$vmeta:meta])* $variant:ident ),* $(,)?
        }
    ) => {
        $(#[$meta])*
        #[derive(Copy, Clone, Debug, PartialEq, Eq, clap::ValueEnum)]
        pub enum $name {
            $( $(#[$vmeta])* $variant ),*
        }

        impl From<$name> for $lib {
            fn from(x: $name) -> $lib {
                match x {
                    $( $name::$variant => $lib::$variant ),*
                }
            }
        }

        // The reverse conversion is never called; its match makes the compiler check that
        // the mirror lists every variant of the library type.
        #[allow(dead_code)]
        impl From<$lib> for $name {
            fn from(x: $lib) -> $name {
                match x {
                    $( $lib::$variant => $name::$variant ),*
                }
            }
        }
    };
}
