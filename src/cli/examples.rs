//! The example that ends each subcommand's `--help`. Every one runs as written from the
//! project folder on the bundled demo site (tests/help_examples.rs runs them all), so the
//! help cannot drift from the program. The readings they use are invented samples. A long
//! example continues on the next line after a trailing backslash, as in a shell.

pub const FIT: &str = "Example (bundled demo site, invented sample readings):
  rheoside fit site-configs/samples/sauce-six-speed.csv --viscometer VIS-A";

pub const CHECK_SITE: &str = "Example:
  rheoside check-site site-configs/demo.toml";

pub const RECORD: &str = "Example (gauge pressures as the plant gauges read them):
  rheoside record --equipment P-1 --reading \"discharge=3.2 barg\" \\
    --reading \"flow=2.5 m3/h\" --note \"after the weekend stop\"";

pub const REPORT: &str = "Example (a journal that record or the screens wrote):
  rheoside report logs/<journal>.jsonl --format md";

pub const TREND: &str = "Example:
  rheoside trend --product chilli-sauce --since 30d";

pub const MIX: &str = "Example (bundled demo site):
  rheoside mix --tank TK-1 --product chilli-sauce";

pub const LINE: &str = "Example (bundled demo site):
  rheoside line --line L-1 --product chilli-sauce --flow \"3 m3/h\"";

pub const RESTART: &str = "Example (bundled demo site, invented sample gel readings):
  rheoside restart --line L-2 --pump P-2 --product filler-paste \\
    --gel-readings site-configs/samples/paste-gel.csv";

pub const PUMP: &str = "Example (bundled demo site):
  rheoside pump --pump P-1 --product chilli-sauce";
