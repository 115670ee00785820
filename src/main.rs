//! The `rheoside` binary: parses the command line and hands over to a face.

fn main() -> std::process::ExitCode {
    rheoside::cli::main()
}
