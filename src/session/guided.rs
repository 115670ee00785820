//! Guided checks: walk-throughs that ask for the readings a common complaint needs, in
//! order, and end with the session's findings. Each check is data: a list of steps, each
//! naming a reading of the catalogue (`readings`), what to read and where, the caution for
//! that step, and what is assumed when the step is skipped. The faces only drive them.
//!
//! The order of the steps follows common practice (no source): what is known without
//! touching the plant first, then what needs a gauge or a sample. Each step asks for a
//! reading the findings use (`session::findings`); one kept only for the handover says so.

use super::state::SessionState;
use crate::readings::{ReadingKind, find};
use crate::site::Site;

/// The start of the note a finished check journals, so the findings can say what it assumed.
pub const NOTE_PREFIX: &str = "Guided check";

/// Which equipment a step's reading is filed under.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum At {
    Line,
    Pump,
    Tank,
}

/// One step: a reading to take, where, and its caution.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub struct Step {
    /// The reading's catalogue name (`readings::CATALOGUE`).
    pub reading: &'static str,
    /// What to read and where, in plain words.
    pub ask: &'static str,
    pub at: At,
    pub caution: &'static str,
    /// Said in the answer when the step is skipped.
    pub if_skipped: &'static str,
}

/// Which check.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum CheckId {
    PumpWillNotStart,
    MixerTripsOrHot,
    BatchThickerOrThinner,
}

/// One guided check.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub struct Check {
    pub id: CheckId,
    pub title: &'static str,
    /// What the check needs picked before it starts, in words.
    pub needs: &'static str,
    pub steps: &'static [Step],
}

const LOCK_OUT: &str =
    "Isolate and lock out the pump before going near it; do not try a start to find out.";
const WEAKEST: &str = "Never exceed the rated pressure of the weakest part; never raise the \
                       relief setting to get product moving.";
const AGITATOR: &str = "Stop and lock out the agitator before sampling or reaching into the tank.";
const ELECTRICAL: &str = "Read the motor only from the panel meter or a clamp meter used by \
                          someone authorised; never open a live terminal box.";
const SAMPLE: &str =
    "Take the sample where the procedure says; hot product needs face and hand protection.";

/// Every guided check, in the order the Checks view lists them.
pub const CHECKS: &[Check] = &[
    Check {
        id: CheckId::PumpWillNotStart,
        title: "Pump will not start after a stop",
        needs: "a line with a pump (pick the line or its pump on the Site view)",
        steps: &[
            Step {
                reading: "rest-time",
                ask: "How long has the line stood since the pump stopped? Read it off the \
                      shift log or the control system (e.g. 62 h).",
                at: At::Line,
                caution: LOCK_OUT,
                if_skipped: "the stop was not given, so the restart is judged only where a \
                             stop is already in the journal",
            },
            Step {
                reading: "yield-stress",
                ask: "Gel strength of the product after that rest: a vane or gel test on a \
                      sample drawn from the line (skip if none was made).",
                at: At::Line,
                caution: "Isolate and lock out the line before opening a sample point; \
                          product under pressure can spray.",
                if_skipped: "no gel test: the product's gel build-up from the site config \
                             was used",
            },
            Step {
                reading: "discharge-pressure",
                ask: "Discharge pressure at the pump outlet gauge when the start was \
                      tried (gauge, e.g. 13 bar).",
                at: At::Pump,
                caution: WEAKEST,
                if_skipped: "no discharge pressure: the pump's pressure against its relief \
                             setting was not checked",
            },
        ],
    },
    Check {
        id: CheckId::MixerTripsOrHot,
        title: "Mixer motor trips or runs hot",
        needs: "a tank (pick it on the Site view; else the first tank)",
        steps: &[
            Step {
                reading: "agitator-speed",
                ask: "Agitator shaft speed, from the drive display or a tachometer on the \
                      shaft (e.g. 30 rpm).",
                at: At::Tank,
                caution: AGITATOR,
                if_skipped: "no speed: the agitator's rated speed from the site config was \
                             used",
            },
            Step {
                reading: "motor-current",
                ask: "Motor current, one phase, from the panel ammeter while it runs.",
                at: At::Tank,
                caution: ELECTRICAL,
                if_skipped: "no current: the motor's current against its full-load current \
                             was not checked",
            },
            Step {
                reading: "motor-power",
                ask: "Electrical power drawn by the motor, from the drive or a power meter.",
                at: At::Tank,
                caution: ELECTRICAL,
                if_skipped: "no power: the drive's demand was worked out from the product's \
                             curve, not measured",
            },
            Step {
                reading: "liquid-level",
                ask: "Liquid height above the tank bottom, from the level gauge.",
                at: At::Tank,
                caution: AGITATOR,
                if_skipped: "no level: the tank's usual liquid height from the site config \
                             was used",
            },
        ],
    },
    Check {
        id: CheckId::BatchThickerOrThinner,
        title: "Batch looks thicker or thinner than usual",
        needs: "a line the batch runs through; best after a viscometer set of it",
        steps: &[
            Step {
                reading: "temperature",
                ask: "Product temperature where the batch is sampled: a cold batch looks \
                      thick, a hot one thin. Kept for the handover: the findings judge the \
                      viscometer set's own temperature.",
                at: At::Line,
                caution: SAMPLE,
                if_skipped: "no temperature at the line: only the viscometer set's own \
                             temperature was judged",
            },
            Step {
                reading: "flow",
                ask: "Flow in the line, from the flow meter (e.g. 6 m3/h).",
                at: At::Line,
                caution: WEAKEST,
                if_skipped: "no flow: the line's pressure drop could not be compared with the \
                             viscometer's curve",
            },
            Step {
                reading: "pressure-drop",
                ask: "Pressure difference between the line's first and last tappings.",
                at: At::Line,
                caution: WEAKEST,
                if_skipped: "no pressure drop: the plant was not compared with the \
                             viscometer's curve",
            },
        ],
    },
];

/// The check with this id.
pub fn check(id: CheckId) -> &'static Check {
    CHECKS.iter().find(|c| c.id == id).unwrap_or(&CHECKS[0])
}

impl Step {
    /// The catalogue entry this step reads; every step names one (tested).
    pub fn kind(&self) -> Option<&'static ReadingKind> {
        find(self.reading)
    }
}

/// The equipment a check is about: ids on the site.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct Target {
    pub line: Option<String>,
    pub pump: Option<String>,
    pub tank: Option<String>,
}

impl Target {
    /// Where a step's reading is filed.
    pub fn equipment(&self, at: At) -> Option<&str> {
        match at {
            At::Line => self.line.as_deref().or(self.pump.as_deref()),
            At::Pump => self.pump.as_deref().or(self.line.as_deref()),
            At::Tank => self.tank.as_deref(),
        }
    }

    /// "line L-2, pump P-2".
    pub fn words(&self) -> String {
        let parts: Vec<String> = [
            self.line.as_ref().map(|l| format!("line {l}")),
            self.pump.as_ref().map(|p| format!("pump {p}")),
            self.tank.as_ref().map(|t| format!("tank {t}")),
        ]
        .into_iter()
        .flatten()
        .collect();
        parts.join(", ")
    }
}

/// The equipment a check walks, from the Site view's pick: a line or a pump (with the line
/// it feeds, or the first pump feeding the line) for the line checks; a tank for the mixer.
/// `None` when the site has nothing the check can be about.
pub fn target(site: &Site, id: CheckId, picked: Option<&str>) -> Option<Target> {
    match id {
        CheckId::MixerTripsOrHot => {
            let tank = picked
                .and_then(|p| site.tanks.iter().find(|t| t.id == p))
                .or(site.tanks.first())?;
            Some(Target {
                line: None,
                pump: None,
                tank: Some(tank.id.clone()),
            })
        }
        CheckId::PumpWillNotStart | CheckId::BatchThickerOrThinner => {
            let from_pick = picked.and_then(|p| {
                site.line(p)
                    .or_else(|| site.pump(p).and_then(|x| site.line(&x.feeds)))
            });
            let line = from_pick
                .or_else(|| {
                    site.lines
                        .iter()
                        .find(|l| !site.pumps_feeding(&l.id).is_empty())
                })
                .or(site.lines.first())?;
            let feeding = site.pumps_feeding(&line.id);
            let pump = picked
                .and_then(|p| feeding.iter().find(|x| x.id == p))
                .or(feeding.first());
            Some(Target {
                line: Some(line.id.clone()),
                pump: pump.map(|p| p.id.clone()),
                tank: None,
            })
        }
    }
}

/// What became of one step.
#[derive(Debug, Clone, PartialEq)]
pub enum Outcome {
    /// The reading as typed, journalled.
    Read(String),
    Skipped,
}

/// The note a finished check journals: which check, on what, what was read and what was
/// assumed for each step skipped.
pub fn summary(check: &Check, target: &Target, outcomes: &[Outcome]) -> String {
    let read: Vec<String> = check
        .steps
        .iter()
        .zip(outcomes)
        .filter_map(|(s, o)| match o {
            Outcome::Read(raw) => Some(format!("{} {raw}", s.reading)),
            Outcome::Skipped => None,
        })
        .collect();
    let assumed: Vec<&str> = check
        .steps
        .iter()
        .zip(outcomes)
        .filter(|(_, o)| **o == Outcome::Skipped)
        .map(|(s, _)| s.if_skipped)
        .collect();
    let read = match read.is_empty() {
        true => "nothing read".to_string(),
        false => format!("read {}", read.join(", ")),
    };
    let assumed = match assumed.is_empty() {
        true => "no step skipped".to_string(),
        false => format!("assumed: {}", assumed.join("; ")),
    };
    format!(
        "{NOTE_PREFIX} '{}' on {}: {read}; {assumed}.",
        check.title,
        target.words()
    )
}

/// The start of the note journalled once a check's records are in: its findings.
pub const FINDINGS_PREFIX: &str = "Findings at the end of guided check";

/// "Findings at the end of guided check '…' on line L-2, pump P-2 (2, worst first):
/// 1. ALARM, certain: … 2. …", from the findings' headlines in rank order.
pub fn findings_note(check: &Check, target: &Target, headlines: &[String]) -> String {
    let head = format!("{FINDINGS_PREFIX} '{}' on {}", check.title, target.words());
    if headlines.is_empty() {
        return format!("{head}: none.");
    }
    let listed: Vec<String> = headlines
        .iter()
        .enumerate()
        .map(|(i, h)| format!("{}. {h}", i + 1))
        .collect();
    format!(
        "{head} ({}, worst first): {}",
        headlines.len(),
        listed.join(" ")
    )
}

/// The newest guided-check note in the session, for the findings to show beside them.
pub fn latest_summary(state: &SessionState) -> Option<String> {
    state
        .notes
        .iter()
        .rev()
        .find(|n| n.item.starts_with(NOTE_PREFIX))
        .map(|n| n.item.clone())
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn every_step_names_a_reading_the_catalogue_knows() {
        for c in CHECKS {
            assert!(!c.steps.is_empty(), "{}", c.title);
            for s in c.steps {
                assert!(s.kind().is_some(), "{}: {}", c.title, s.reading);
                assert!(!s.caution.is_empty() && !s.if_skipped.is_empty());
            }
        }
    }

    #[test]
    fn the_pump_check_asks_for_the_stop_first_and_files_the_pressure_on_the_pump() {
        let c = check(CheckId::PumpWillNotStart);
        assert_eq!(c.steps[0].reading, "rest-time");
        let d = c
            .steps
            .iter()
            .find(|s| s.reading == "discharge-pressure")
            .map(|s| s.at);
        assert_eq!(d, Some(At::Pump));
    }

    #[test]
    fn a_pump_pick_brings_its_line_and_a_tank_pick_is_kept_for_the_mixer() {
        let site = crate::site::demo().unwrap();
        let t = target(&site, CheckId::PumpWillNotStart, Some("P-2")).unwrap();
        assert_eq!(
            (t.line.as_deref(), t.pump.as_deref()),
            (Some("L-2"), Some("P-2"))
        );
        assert_eq!(t.equipment(At::Pump), Some("P-2"));
        assert_eq!(t.equipment(At::Line), Some("L-2"));
        let m = target(&site, CheckId::MixerTripsOrHot, Some("TK-2")).unwrap();
        assert_eq!(m.equipment(At::Tank), Some("TK-2"));
        // A line pick gives no tank: the mixer check falls back to the first tank.
        let m = target(&site, CheckId::MixerTripsOrHot, Some("L-2")).unwrap();
        assert_eq!(m.tank.as_deref(), Some("TK-1"));
    }

    #[test]
    fn a_skipped_step_is_said_as_assumed() {
        let c = check(CheckId::PumpWillNotStart);
        let t = Target {
            line: Some("L-2".into()),
            pump: Some("P-2".into()),
            tank: None,
        };
        let o = [
            Outcome::Read("62 h".into()),
            Outcome::Skipped,
            Outcome::Read("13 bar".into()),
        ];
        let text = summary(c, &t, &o);
        assert!(text.starts_with(NOTE_PREFIX), "{text}");
        assert!(
            text.contains("read rest-time 62 h, discharge-pressure 13 bar"),
            "{text}"
        );
        assert!(text.contains("assumed: no gel test"), "{text}");
        let f = findings_note(c, &t, &["ALARM, certain: pump P-2. Too high.".into()]);
        assert!(
            f.ends_with("(1, worst first): 1. ALARM, certain: pump P-2. Too high."),
            "{f}"
        );
        assert!(findings_note(c, &t, &[]).ends_with("pump P-2: none."));
        let all = [Outcome::Read("1".into()), Outcome::Read("2".into())];
        assert!(summary(c, &t, &all).contains("no step skipped"));
    }
}
