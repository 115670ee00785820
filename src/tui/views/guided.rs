//! The Checks view: the guided checks of `session::guided`, walked one step at a time. Each
//! step says what to read and where, with its caution; the reading typed into the step's
//! field (which owns every printable key) is checked through the readings catalogue and
//! journalled as a spot reading on the step's equipment, or the step is skipped. The last
//! step journals a note saying what was read and what was assumed, and shows the Findings
//! view, which works the findings out again as the records land.

use super::guided_draw;
use super::{Draft, Effect, View, ViewId};
use crate::journal::{Payload, Record};
use crate::present::findings::words;
use crate::session::findings::findings;
use crate::readings::parse_reading_arg_at;
use crate::session::guided::{self, CHECKS, Check, Outcome, Target};
use crate::tui::ctx::Ctx;
use crate::tui::keymap::{Action, Binding, Key, Scope, b};
use crate::tui::strings::guided as s;
use crate::tui::widgets::editing::{self, EditStep, Leave};
use crate::tui::widgets::field::{Field, FieldKind};
use ratatui::Frame;
use ratatui::layout::Rect;

/// This view's id.
pub const ID: ViewId = ViewId("checks");

/// Longest reading typed ("-12.345e-3 lbf/100ft2" and room to spare).
const READING_MAX_CHARS: usize = 32;

/// The Checks view's keys on its list of checks.
const LIST_KEYS: &[Binding] = &[b(Scope::View, &[Key::Enter], Action::Activate, s::START)];

/// Its keys while a check is walked; while typing, the field owns every other printable key.
const WALK_KEYS: &[Binding] = &[
    b(Scope::ViewTyping, &[Key::Enter, Key::Ctrl('s')], Action::Save, s::SAVE_READING),
    b(Scope::ViewTyping, &[Key::Ctrl('k')], Action::Skip, s::SKIP),
    b(Scope::View, &[Key::Enter], Action::Activate, s::TYPE),
    b(Scope::View, &[Key::Esc], Action::Close, s::STOP),
];

/// A check being walked.
#[derive(Debug, Clone, PartialEq)]
pub struct Walk {
    pub check: &'static Check,
    pub target: Target,
    /// The step asked now (`check.steps.len()` once done).
    pub step: usize,
    pub field: Field,
    pub outcomes: Vec<Outcome>,
    pub typing: bool,
    /// What the typed text will be saved as, or what is wrong with it.
    pub preview: Option<Result<String, String>>,
}

/// A finished check whose records are still on their way to the journal: once they are all
/// in the state, its findings are journalled as a note.
#[derive(Debug, Clone, PartialEq)]
struct Closing {
    check: &'static Check,
    target: Target,
}

#[derive(Debug, Default)]
pub struct GuidedView {
    cursor: usize,
    walk: Option<Walk>,
    /// Records this view sent that the journal has not numbered yet.
    outstanding: Vec<(Option<String>, Payload)>,
    closing: Option<Closing>,
    /// The message under the step or the list (a refusal, or what just happened).
    message: Option<String>,
}

impl Walk {
    fn new(check: &'static Check, target: Target) -> Walk {
        Walk {
            check,
            target,
            step: 0,
            field: Field::new(FieldKind::Text(READING_MAX_CHARS)),
            outcomes: Vec::new(),
            typing: true,
            preview: None,
        }
    }

    /// The typed text as a catalogue reading for this step.
    fn parse(&self, ctx: &Ctx) -> Option<Result<crate::readings::ParsedReading, String>> {
        let step = self.check.steps.get(self.step)?;
        let text = self.field.text().trim();
        if text.is_empty() {
            return None;
        }
        let atmosphere = ctx.site.atmospheric_pressure_pa;
        Some(
            parse_reading_arg_at(&format!("{}={text}", step.reading), atmosphere)
                .map_err(|e| e.to_string()),
        )
    }

    fn update_preview(&mut self, ctx: &Ctx) {
        let style = ctx.style();
        self.preview = self.parse(ctx).map(|r| {
            r.map(|p| {
                crate::present::quantity(p.value_si, p.kind.dimension, style)
            })
        });
    }

    /// On to the next step with an empty field, typing.
    fn advance(&mut self, outcome: Outcome) {
        self.outcomes.push(outcome);
        self.step += 1;
        self.field = Field::new(FieldKind::Text(READING_MAX_CHARS));
        self.typing = true;
        self.preview = None;
    }

    fn done(&self) -> bool {
        self.step >= self.check.steps.len()
    }
}

impl GuidedView {
    pub fn new(_ctx: &Ctx) -> GuidedView {
        GuidedView::default()
    }

    /// The check being walked, for tests.
    pub fn walk(&self) -> Option<&Walk> {
        self.walk.as_ref()
    }

    fn start(&mut self, ctx: &Ctx) -> Vec<Effect> {
        let Some(check) = CHECKS.get(self.cursor) else {
            return Vec::new();
        };
        let Some(target) = guided::target(&ctx.site, check.id, ctx.picks.equipment.as_deref())
        else {
            self.message = Some(format!("{}.", s::NOTHING_TO_CHECK));
            return Vec::new();
        };
        if check.id == guided::CheckId::PumpWillNotStart && target.pump.is_none() {
            self.message = Some(s::NEEDS_PUMP.to_string());
            return Vec::new();
        }
        self.message = None;
        self.walk = Some(Walk::new(check, target));
        Vec::new()
    }

    fn save(&mut self, ctx: &Ctx) -> Vec<Effect> {
        let Some(walk) = &mut self.walk else {
            return Vec::new();
        };
        let Some(step) = walk.check.steps.get(walk.step) else {
            return Vec::new();
        };
        let parsed = match walk.parse(ctx) {
            None => {
                self.message = Some(s::EMPTY_READING.to_string());
                walk.typing = true;
                return Vec::new();
            }
            Some(Err(e)) => {
                self.message = Some(e);
                walk.typing = true;
                return Vec::new();
            }
            Some(Ok(p)) => p,
        };
        let equipment = walk.target.equipment(step.at).map(str::to_string);
        self.outstanding
            .push((equipment.clone(), parsed.payload()));
        let mut effects = vec![Effect::Journal(Draft::new(parsed.payload(), equipment))];
        if let Some(note) = parsed.conversion_note() {
            effects.push(Effect::Status(note));
        }
        walk.advance(Outcome::Read(parsed.raw.clone()));
        self.message = None;
        effects.extend(self.finish_if_done());
        effects
    }

    fn skip(&mut self) -> Vec<Effect> {
        let Some(walk) = &mut self.walk else {
            return Vec::new();
        };
        walk.advance(Outcome::Skipped);
        self.message = None;
        self.finish_if_done()
    }

    /// After the last step: journal what was read and assumed, and show the findings.
    fn finish_if_done(&mut self) -> Vec<Effect> {
        if !self.walk.as_ref().is_some_and(Walk::done) {
            return Vec::new();
        }
        let Some(walk) = self.walk.take() else {
            return Vec::new();
        };
        let text = guided::summary(walk.check, &walk.target, &walk.outcomes);
        let equipment = walk
            .target
            .line
            .clone()
            .or(walk.target.tank.clone())
            .or(walk.target.pump.clone());
        self.message = Some(s::FINISHED.to_string());
        let note = Payload::Note { text };
        self.outstanding.push((equipment.clone(), note.clone()));
        self.closing = Some(Closing {
            check: walk.check,
            target: walk.target,
        });
        vec![
            Effect::Journal(Draft::new(note, equipment)),
            Effect::Status(s::FINISHED.to_string()),
            Effect::Show(super::findings::ID),
        ]
    }

    fn handle_walk(&mut self, action: Action, ctx: &Ctx) -> Vec<Effect> {
        match action {
            Action::Save => return self.save(ctx),
            Action::Skip => return self.skip(),
            _ => {}
        }
        let Some(walk) = &mut self.walk else {
            return Vec::new();
        };
        if walk.typing {
            match editing::apply(&mut walk.field, action) {
                // Esc leaves the field (the text is kept), so the view's keys work again.
                EditStep::Cancelled => walk.typing = false,
                // Tab accepts and goes on, as in every form: here that is the next step.
                EditStep::Accepted(Leave::Next) => return self.save(ctx),
                EditStep::Typing | EditStep::Accepted(_) => {}
            }
            walk.update_preview(ctx);
            return Vec::new();
        }
        match action {
            Action::Activate => {
                walk.typing = true;
                walk.field.begin_edit();
            }
            Action::Close => {
                self.walk = None;
                self.message = Some(s::STOPPED.to_string());
                return vec![Effect::Status(s::STOPPED.to_string())];
            }
            _ => {}
        }
        Vec::new()
    }
}

impl View for GuidedView {
    fn id(&self) -> ViewId {
        ID
    }

    fn title(&self) -> &'static str {
        s::NAME
    }

    fn caution(&self) -> &'static str {
        s::CAUTION
    }

    fn keys(&self) -> &'static [Binding] {
        match self.walk {
            Some(_) => WALK_KEYS,
            None => LIST_KEYS,
        }
    }

    fn handle(&mut self, action: Action, ctx: &Ctx) -> Vec<Effect> {
        if self.walk.is_some() {
            return self.handle_walk(action, ctx);
        }
        let last = CHECKS.len().saturating_sub(1);
        match action {
            Action::Up => self.cursor = self.cursor.saturating_sub(1),
            Action::Down => self.cursor = (self.cursor + 1).min(last),
            Action::Activate => return self.start(ctx),
            _ => {}
        }
        Vec::new()
    }

    fn answer(&mut self, record: &Record, ctx: &Ctx) -> Vec<Effect> {
        let ours = self
            .outstanding
            .iter()
            .position(|(e, p)| *p == record.payload && *e == record.equipment);
        let Some(i) = ours else {
            return Vec::new();
        };
        self.outstanding.remove(i);
        if !self.outstanding.is_empty() {
            return Vec::new();
        }
        let Some(c) = self.closing.take() else {
            return Vec::new();
        };
        // In the site's units, not folded: the journal is not the screen.
        let style = crate::present::Style::new(ctx.site.unit_system, false);
        let headlines: Vec<String> = findings(&ctx.session, &ctx.site)
            .iter()
            .map(|f| words(f, style).headline)
            .collect();
        let text = guided::findings_note(c.check, &c.target, &headlines);
        let equipment = c.target.line.clone().or(c.target.tank.clone());
        vec![Effect::Journal(Draft::new(Payload::Note { text }, equipment))]
    }

    fn render(&self, frame: &mut Frame, area: Rect, ctx: &Ctx) {
        let screen = guided_draw::GuidedScreen {
            cursor: self.cursor,
            walk: self.walk.as_ref(),
            message: self.message.as_deref(),
        };
        screen.draw(frame, area, ctx);
    }

    fn editing(&self) -> bool {
        self.walk.as_ref().is_some_and(|w| w.typing)
    }

    fn unsaved_input(&self) -> Option<&'static str> {
        self.walk
            .as_ref()
            .is_some_and(|w| !w.field.is_empty())
            .then_some(s::UNSAVED)
    }
}
