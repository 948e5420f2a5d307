//! Command-line mirrors of library enums: `cli_enum!` declares a `clap::ValueEnum` type with
//! the same variants (and help text) as a library type and the conversion into it, so that
//! the library itself does not depend on the argument parser.

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
    };
}
