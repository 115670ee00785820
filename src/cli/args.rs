//! Argument types for every subcommand, in one place so `--help` and the README agree.

use clap::{Args, Parser, Subcommand};
use std::path::PathBuf;

/// rheoside: flow curves, line and tank answers for thick products, journalled per shift.
#[derive(Debug, Parser)]
#[command(name = "rheoside", version, about)]
pub struct Cli {
    #[command(subcommand)]
    pub command: Option<Command>,

    /// Site config (TOML). Default: the bundled demo site.
    #[arg(long, global = true, value_name = "FILE")]
    pub site: Option<PathBuf>,

    /// Continue an earlier session from its journal file.
    #[arg(long, value_name = "JOURNAL")]
    pub resume: Option<PathBuf>,

    /// Folder for session journals (default: logs/, or RHEOSIDE_LOG_DIR).
    #[arg(long, value_name = "DIR", env = "RHEOSIDE_LOG_DIR")]
    pub log_dir: Option<PathBuf>,

    /// Operator name for the journal (default: the OS user).
    #[arg(long)]
    pub operator: Option<String>,

    /// Plain ASCII borders and chart marks, for terminals without line drawing.
    #[arg(long)]
    pub ascii: bool,
}

#[derive(Debug, Subcommand)]
pub enum Command {
    /// Fit flow curves to viscometer readings from a CSV file.
    #[command(after_help = super::examples::FIT)]
    Fit(FitArgs),
    /// Validate a site config and print a summary of its equipment.
    #[command(after_help = super::examples::CHECK_SITE)]
    CheckSite(CheckSiteArgs),
    /// Append readings or a note to a session journal (headless).
    #[command(after_help = super::examples::RECORD)]
    Record(RecordArgs),
    /// Shift handover report from one or more journals.
    #[command(after_help = super::examples::REPORT)]
    Report(ReportArgs),
    /// A product's fitted constants over past sessions, against its spec limits.
    #[command(after_help = super::examples::TREND)]
    Trend(TrendArgs),
    /// Power, torque and caverns for an agitated tank; viscosity from a motor reading.
    #[command(after_help = super::examples::MIX)]
    Mix(Box<super::mix::args::MixArgs>),
    /// Pressure drop in a line for a flow, or the flow for a pressure drop.
    #[command(after_help = super::examples::LINE)]
    Line(Box<super::line_args::LineArgs>),
    /// Will a line restart after a stop, and the longest safe stop (gel build-up at rest).
    #[command(after_help = super::examples::RESTART)]
    Restart(super::restart::RestartArgs),
    /// A pump on a viscous product: ANSI/HI 9.6.7 correction, duty point, PD slip and relief.
    #[command(after_help = super::examples::PUMP)]
    Pump(super::pump::PumpArgs),
}

impl Command {
    /// The subcommand as typed, for messages.
    pub fn name(&self) -> &'static str {
        match self {
            Command::Fit(_) => "fit",
            Command::CheckSite(_) => "check-site",
            Command::Record(_) => "record",
            Command::Report(_) => "report",
            Command::Trend(_) => "trend",
            Command::Mix(_) => "mix",
            Command::Restart(_) => "restart",
            Command::Pump(_) => "pump",
            Command::Line(_) => "line",
        }
    }
}

#[derive(Debug, Args)]
pub struct FitArgs {
    /// CSV with header `rpm,dial` or `shear_rate,shear_stress` (SI), optional `temperature`;
    /// or plant readings `flow,pressure_drop` with --diameter/--length or --line.
    pub file: PathBuf,
    /// Viscometer geometry when the CSV holds rpm and dial readings.
    #[arg(long, value_name = "NAME")]
    pub geometry: Option<String>,
    /// Viscometer id from the site config (with --site).
    #[arg(long, value_name = "ID")]
    pub viscometer: Option<String>,
    /// auto, newtonian, power-law, bingham, herschel-bulkley or casson.
    #[arg(long, default_value = "auto")]
    pub model: String,
    /// Use the Newtonian (Margules) shear rate instead of the n-corrected one.
    #[arg(long)]
    pub no_rate_correction: bool,
    /// `none` (default), `relative` (each point by 1/stress, for data spanning decades) or
    /// `log` (least squares on ln stress, as published constants are usually fitted).
    #[arg(long, value_name = "WEIGHT")]
    pub weight: Option<String>,
    /// Keep readings at or above full scale (pegged dial) in the fit; by default they are
    /// left out and listed.
    #[arg(long)]
    pub include_off_scale: bool,
    /// One JSON object on stdout, SI units.
    #[arg(long)]
    pub json: bool,
    #[command(flatten)]
    pub pipe: super::fit_pipe::PipeFitArgs,
}

#[derive(Debug, Args)]
pub struct CheckSiteArgs {
    /// Site config (TOML).
    pub file: PathBuf,
}

#[derive(Debug, Args)]
pub struct RecordArgs {
    /// Equipment id from the site config.
    #[arg(long)]
    pub equipment: String,
    /// A reading as `NAME=VALUE UNIT`, e.g. `discharge=6.2 bar`; repeat for several.
    #[arg(long = "reading", value_name = "NAME=VALUE UNIT")]
    pub readings: Vec<String>,
    /// A free-text note.
    #[arg(long)]
    pub note: Option<String>,
    /// Append to this session file instead of starting a new one.
    #[arg(long, value_name = "FILE")]
    pub session: Option<PathBuf>,
    /// Folder for the new session's journal (default: logs/, or RHEOSIDE_LOG_DIR).
    #[arg(long, value_name = "DIR", env = "RHEOSIDE_LOG_DIR")]
    pub log_dir: Option<PathBuf>,
    /// Operator name for the journal (default: the OS user).
    #[arg(long)]
    pub operator: Option<String>,
}

#[derive(Debug, Args)]
pub struct ReportArgs {
    /// Journal files.
    #[arg(required = true)]
    pub journals: Vec<PathBuf>,
    /// md, csv or json.
    #[arg(long, default_value = "md")]
    pub format: String,
}

#[derive(Debug, Args)]
pub struct TrendArgs {
    /// Product name from the site config.
    #[arg(long)]
    pub product: String,
    /// How far back, e.g. 30d, 12h, 8w.
    #[arg(long, default_value = "30d")]
    pub since: String,
    /// Property to chart: consistency-index (k), flow-index (n), yield-stress (tau0) or
    /// apparent-viscosity (mu-a). Default: each property the product has a limit on.
    #[arg(long, value_name = "NAME")]
    pub property: Option<String>,
    /// Folder of session journals to read (default: logs/, or RHEOSIDE_LOG_DIR).
    #[arg(long, value_name = "DIR", env = "RHEOSIDE_LOG_DIR")]
    pub log_dir: Option<PathBuf>,
}

impl RecordArgs {
    /// The journal folder: this subcommand's option, else one given before the subcommand.
    pub fn log_dir(&self, cli: &Cli) -> PathBuf {
        either_log_dir(&self.log_dir, cli)
    }

    /// The operator: this subcommand's option, else one given before the subcommand.
    pub fn operator<'a>(&'a self, cli: &'a Cli) -> Option<&'a str> {
        self.operator.as_deref().or(cli.operator.as_deref())
    }
}

impl TrendArgs {
    /// The journal folder: this subcommand's option, else one given before the subcommand.
    pub fn log_dir(&self, cli: &Cli) -> PathBuf {
        either_log_dir(&self.log_dir, cli)
    }
}

fn either_log_dir(own: &Option<PathBuf>, cli: &Cli) -> PathBuf {
    own.clone()
        .or_else(|| cli.log_dir.clone())
        .unwrap_or_else(|| PathBuf::from("logs"))
}
