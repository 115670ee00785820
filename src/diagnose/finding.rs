//! What a finding is: which rule, how bad, how sure, the numbers behind it, what to check
//! next and the caution that applies. Data only; `present::findings` words the numbers.

use crate::units::Dimension;

/// How bad. Declared worst first, so the derived order ranks alarms first.
#[derive(Debug, Clone, Copy, PartialEq, Eq, PartialOrd, Ord, Hash)]
pub enum Severity {
    /// Act now: a limit is crossed, or the line or pump will not do what is asked.
    Alarm,
    /// Check before relying on the answer or before the next start.
    Caution,
    /// Worth knowing; nothing to do unless other findings point the same way.
    Information,
}

impl Severity {
    /// The stable key for JSON and CSV.
    pub fn code(self) -> &'static str {
        match self {
            Severity::Alarm => "alarm",
            Severity::Caution => "caution",
            Severity::Information => "information",
        }
    }
}

/// How sure, from where the value's interval lies against the limit. Declared surest first.
#[derive(Debug, Clone, Copy, PartialEq, Eq, PartialOrd, Ord, Hash)]
pub enum Sure {
    /// The whole interval lies beyond the limit.
    Certain,
    /// The value lies beyond the limit, part of its interval does not (or no interval is known).
    Likely,
    /// The value lies inside the limit, part of its interval beyond it.
    Possible,
}

impl Sure {
    pub fn code(self) -> &'static str {
        match self {
            Sure::Certain => "certain",
            Sure::Likely => "likely",
            Sure::Possible => "possible",
        }
    }
}

/// A value with its 95 % interval (low, high) when one is known, SI.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Measured {
    pub value: f64,
    pub interval: Option<(f64, f64)>,
}

impl Measured {
    pub fn exact(value: f64) -> Measured {
        Measured {
            value,
            interval: None,
        }
    }

    pub fn within(value: f64, interval: (f64, f64)) -> Measured {
        Measured {
            value,
            interval: Some(interval),
        }
    }

    /// How sure it is that the value lies above `limit`; `None` when not even possible.
    /// Without an interval a value beyond the limit is "likely": its error is unknown.
    pub fn sure_above(&self, limit: f64) -> Option<Sure> {
        let (lo, hi) = self.interval.unwrap_or((self.value, self.value));
        if self.interval.is_some() && lo > limit {
            Some(Sure::Certain)
        } else if self.value > limit {
            Some(Sure::Likely)
        } else if hi > limit {
            Some(Sure::Possible)
        } else {
            None
        }
    }

    /// How sure it is that the value lies below `limit`.
    pub fn sure_below(&self, limit: f64) -> Option<Sure> {
        let flipped = Measured {
            value: -self.value,
            interval: self.interval.map(|(lo, hi)| (-hi, -lo)),
        };
        flipped.sure_above(-limit)
    }
}

/// One number behind a finding, SI, with its interval when known.
#[derive(Debug, Clone, PartialEq)]
pub struct Number {
    /// What it is, in plain words ("discharge pressure", "relief setting").
    pub name: String,
    pub value_si: f64,
    pub dimension: Dimension,
    pub interval: Option<(f64, f64)>,
}

impl Number {
    pub fn new(name: &str, m: Measured, dimension: Dimension) -> Number {
        Number {
            name: name.to_string(),
            value_si: m.value,
            dimension,
            interval: m.interval,
        }
    }

    pub fn plain(name: &str, value_si: f64, dimension: Dimension) -> Number {
        Number::new(name, Measured::exact(value_si), dimension)
    }
}

/// The caution that goes with a finding. One per finding: the one the next check needs.
#[derive(Debug, Clone, Copy, PartialEq, Eq, PartialOrd, Ord, Hash)]
pub enum Caution {
    /// Before opening anything to look.
    IsolateBeforeOpening,
    /// Before pushing harder on a line or a pump.
    WeakestPart,
    /// Before sampling or looking into a tank.
    StopAgitator,
    /// Taking a sample or a reading again.
    SampleSafely,
    /// Any other finding: the tool advises only.
    AdvisesOnly,
}

impl Caution {
    pub fn code(self) -> &'static str {
        match self {
            Caution::IsolateBeforeOpening => "isolate-before-opening",
            Caution::WeakestPart => "weakest-part",
            Caution::StopAgitator => "stop-agitator",
            Caution::SampleSafely => "sample-safely",
            Caution::AdvisesOnly => "advises-only",
        }
    }

    pub fn text(self) -> &'static str {
        match self {
            Caution::IsolateBeforeOpening => {
                "Isolate and lock out the pump and the line before opening anything to look."
            }
            Caution::WeakestPart => {
                "Never exceed the rated pressure of the weakest part of the line, and never raise \
                 a relief setting to get product moving."
            }
            Caution::StopAgitator => {
                "Stop and lock out the agitator before sampling from the tank or reaching into it."
            }
            Caution::SampleSafely => {
                "Take the sample where the procedure says; hot product needs face and hand \
                 protection."
            }
            Caution::AdvisesOnly => {
                "The tool advises; it does not certify. Confirm against the plant's procedures, \
                 local codes and licensed practice."
            }
        }
    }
}

/// One finding, ready to rank and to show.
#[derive(Debug, Clone, PartialEq)]
pub struct Finding {
    pub rule: super::Rule,
    pub severity: Severity,
    pub sure: Sure,
    /// What it is about ("set 4, chilli-sauce", "pump P-2"): also the last ranking key.
    pub subject: String,
    /// Plain words, no numbers (those are in `numbers`, shown in the site's units).
    pub title: String,
    pub numbers: Vec<Number>,
    pub next_checks: Vec<String>,
    pub caution: Caution,
}

impl Finding {
    /// A finding with no numbers or checks yet.
    pub fn new(rule: super::Rule, severity: Severity, sure: Sure, subject: &str) -> Finding {
        Finding {
            rule,
            severity,
            sure,
            subject: subject.to_string(),
            title: String::new(),
            numbers: Vec::new(),
            next_checks: Vec::new(),
            caution: Caution::AdvisesOnly,
        }
    }

    pub fn titled(mut self, title: String) -> Finding {
        self.title = title;
        self
    }

    pub fn number(mut self, n: Number) -> Finding {
        self.numbers.push(n);
        self
    }

    pub fn checks(mut self, checks: &[&str]) -> Finding {
        self.next_checks = checks.iter().map(|c| c.to_string()).collect();
        self
    }

    pub fn caution(mut self, c: Caution) -> Finding {
        self.caution = c;
        self
    }
}
