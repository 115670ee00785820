//! Drawing the viscometer-set form: picks, viscometer, temperature, the reading table with
//! what each row will store, notes, and the message for the selected field.

use super::readings_form::{Focus, Form};
use super::readings_preview::RowPreview;
use crate::present;
use crate::text::sanitize;
use crate::tui::ctx::Ctx;
use crate::tui::layout::{clip_words, row};
use crate::tui::strings::readings as s;
use crate::tui::theme::Theme;
use crate::tui::widgets::field::{Checked, Field};
use crate::units::Dimension;
use ratatui::Frame;
use ratatui::layout::Rect;
use ratatui::style::Style;
use ratatui::text::{Line, Span};
use ratatui::widgets::{Paragraph, Wrap};

const LABEL_W: u16 = 14;
const SPEED_W: u16 = 14;
const DIAL_W: u16 = 10;
/// Column where the speed field starts in a table row ("  1  ").
const ROW_NUM_W: u16 = 5;

pub fn draw(frame: &mut Frame, area: Rect, form: &Form, editing: bool, ctx: &Ctx) {
    let t = &ctx.theme;
    draw_picks(frame, row(area, 0), ctx);
    draw_viscometer(frame, row(area, 1), form, editing, ctx);
    label(frame, row(area, 2), s::TEMPERATURE, t);
    draw_field(
        frame,
        row(area, 2),
        LABEL_W,
        16,
        form,
        Focus::Temperature,
        editing,
        t,
    );
    draw_si(frame, row(area, 2), LABEL_W + 18, &form.temperature, t);
    if form.temperature.value().is_none() && form.temperature.error().is_none() {
        let hint = Rect {
            x: area.x + LABEL_W + 18,
            ..row(area, 2)
        }
        .intersection(area);
        let text = format!(
            "({} {})",
            Dimension::Temperature.default_unit(),
            s::UNLESS_UNIT
        );
        frame.render_widget(Paragraph::new(ctx.style().text(&text)).style(t.dim), hint);
    }
    let speed = format!("{} ({})", s::SPEED, Dimension::Speed.default_unit());
    let header = format!(
        "  #  {:<w1$}  {:<w2$}  {}",
        speed,
        s::DIAL,
        s::STORES,
        w1 = usize::from(SPEED_W),
        w2 = usize::from(DIAL_W)
    );
    frame.render_widget(Paragraph::new(header).style(t.dim), row(area, 3));
    let previews = form.preview(ctx.site.viscometers.get(form.viscometer));
    for (i, r) in form.rows.iter().enumerate() {
        let line = row(area, 4 + i as u16);
        let number = Span::styled(format!("{:>3}", i + 1), t.dim);
        frame.render_widget(Paragraph::new(number), line);
        draw_field(
            frame,
            line,
            ROW_NUM_W,
            SPEED_W,
            form,
            Focus::Speed(i),
            editing,
            t,
        );
        draw_field(
            frame,
            line,
            ROW_NUM_W + SPEED_W + 2,
            DIAL_W,
            form,
            Focus::Dial(i),
            editing,
            t,
        );
        let stored = Rect {
            x: line.x + ROW_NUM_W + SPEED_W + DIAL_W + 4,
            ..line
        }
        .intersection(line);
        let preview = previews.get(i).cloned().unwrap_or_default();
        let line = row_stored(&r.speed, &r.dial, &preview, stored.width, ctx);
        frame.render_widget(Paragraph::new(line), stored);
    }
    let notes_row = 4 + form.rows.len() as u16;
    label(frame, row(area, notes_row), s::NOTES, t);
    let notes_w = area.width.saturating_sub(LABEL_W + 1);
    draw_field(
        frame,
        row(area, notes_row),
        LABEL_W,
        notes_w,
        form,
        Focus::Notes,
        editing,
        t,
    );
    let save_style = if form.focus == Focus::Save && editing {
        t.selected
    } else {
        t.dim
    };
    let save = Paragraph::new(Span::styled(s::SAVE_LINE_HINT, save_style));
    frame.render_widget(
        save,
        Rect {
            x: area.x + LABEL_W,
            ..row(area, notes_row + 1)
        }
        .intersection(area),
    );
    let message = Rect {
        y: area.y + notes_row + 2,
        height: area.height.saturating_sub(notes_row + 2),
        ..area
    }
    .intersection(area);
    frame.render_widget(message_for(form, editing, &previews, ctx), message);
}

/// Styles only the label's own cells, so fields drawn beside it start from plain cells.
fn label(frame: &mut Frame, area: Rect, text: &str, t: &Theme) {
    frame.render_widget(Paragraph::new(Span::styled(text, t.dim)), area);
}

fn draw_picks(frame: &mut Frame, area: Rect, ctx: &Ctx) {
    let t = &ctx.theme;
    let picked = |v: &Option<String>| match v {
        Some(x) => Span::styled(sanitize(x, false), t.title),
        None => Span::styled(s::NOT_PICKED, t.warn),
    };
    let line = Line::from(vec![
        Span::styled(
            format!("{:<w$}", s::SAMPLE_POINT, w = usize::from(LABEL_W)),
            t.dim,
        ),
        picked(&ctx.picks.equipment),
        Span::styled(format!("   {}  ", s::PRODUCT), t.dim),
        picked(&ctx.picks.product),
    ]);
    frame.render_widget(Paragraph::new(line), area);
}

fn draw_viscometer(frame: &mut Frame, area: Rect, form: &Form, editing: bool, ctx: &Ctx) {
    let t = &ctx.theme;
    let focused = form.focus == Focus::Viscometer && editing;
    let (name, desc) = match ctx.site.viscometers.get(form.viscometer) {
        Some(v) => (
            format!("< {} >", sanitize(&v.id, false)),
            sanitize(&v.description, false),
        ),
        None => (s::NO_VISCOMETER.to_string(), String::new()),
    };
    let style = if focused { t.selected } else { t.base };
    let line = Line::from(vec![
        Span::styled(
            format!("{:<w$}", s::VISCOMETER, w = usize::from(LABEL_W)),
            t.dim,
        ),
        Span::styled(name, style),
        Span::styled(format!("  {desc}"), t.dim),
    ]);
    frame.render_widget(Paragraph::new(line), area);
}

/// A field at column `x` of `line`, `width` wide, styled by focus and editing.
#[allow(clippy::too_many_arguments)]
fn draw_field(
    frame: &mut Frame,
    line: Rect,
    x: u16,
    width: u16,
    form: &Form,
    focus: Focus,
    editing: bool,
    t: &Theme,
) {
    let Some(field) = form.field(focus) else {
        return;
    };
    let area = Rect {
        x: line.x.saturating_add(x),
        width,
        ..line
    }
    .intersection(line);
    let selected = form.focus == focus;
    let style = match (selected, editing) {
        // Its text is selected: the next key replaces it.
        (true, true) if form.replace_next => t.selected,
        (true, true) => t.field_editing,
        (true, false) => t.selected,
        _ if field.error().is_some() => t.error,
        _ => t.field,
    };
    let editing = selected && editing;
    crate::tui::widgets::field::draw_in_form(frame, (area, line), field, style, editing, t.error);
}

fn draw_si(frame: &mut Frame, line: Rect, x: u16, field: &Field, t: &Theme) {
    let area = Rect {
        x: line.x.saturating_add(x),
        ..line
    }
    .intersection(line);
    let text = match field.checked() {
        Checked::Value(_) => format!("= {}", field.si_text()),
        _ => String::new(),
    };
    frame.render_widget(Paragraph::new(text).style(t.ok), area);
}

/// What a row will give (its shear rate and shear stress, bright once it has a dial), then
/// its first check in short words (the message line below the form has the full words), or
/// which part is wrong.
fn row_stored<'a>(
    speed: &Field,
    dial: &Field,
    preview: &RowPreview,
    width: u16,
    ctx: &Ctx,
) -> Line<'a> {
    let t = &ctx.theme;
    let style = ctx.style();
    let problem = speed
        .error()
        .map(|e| (s::SPEED, e))
        .or(dial.error().map(|e| (s::DIAL, e)));
    if let Some((which, err)) = problem {
        // The full words are on the message line when the row is selected.
        let text = style.text(&format!("{which}: {err}"));
        return Line::styled(clip_words(&text, usize::from(width), t.marks.cut), t.error);
    }
    let rate = preview
        .rate_per_s
        .map(|r| present::quantity(r, Dimension::ShearRate, style));
    let stress = preview
        .stress_pa
        .map(|p| present::quantity(p, Dimension::Stress, style));
    let mut spans = match (rate, stress) {
        // Fixed columns, so a typed digit redraws its own value only.
        (Some(r), Some(p)) => vec![Span::styled(format!("{r:<10}{p:<10}"), t.ok)],
        (Some(r), None) => vec![Span::styled(format!("{r:<20}"), t.dim)],
        (None, Some(_)) => vec![Span::styled(format!("! {}", s::DIAL_NEEDS_SPEED), t.error)],
        (None, None) => Vec::new(),
    };
    if let Some(note) = preview.notes.first() {
        let mark = if note.is_strong() { t.error } else { t.warn };
        spans.push(Span::styled(
            format!("! {}", style.text(&note.short())),
            mark,
        ));
    }
    Line::from(spans)
}

/// The selected field's problem in words, the checks on the selected row in full, or a hint
/// for where the cursor is; wrapped, so a long message is never cut.
fn message_for(
    form: &Form,
    editing: bool,
    previews: &[RowPreview],
    ctx: &Ctx,
) -> Paragraph<'static> {
    let t = &ctx.theme;
    let error = form.field(form.focus).and_then(Field::error);
    let row_notes = match form.focus {
        Focus::Speed(i) | Focus::Dial(i) => previews.get(i).map(|p| p.notes.as_slice()),
        _ => None,
    }
    .unwrap_or_default();
    let (text, style): (String, Style) = match (editing, error, form.focus) {
        (false, _, _) => (s::PARKED_HINT.to_string(), t.dim),
        (true, Some(err), _) => (format!("! {err}"), t.error),
        (true, None, _) if !row_notes.is_empty() => {
            let words: Vec<String> = row_notes.iter().map(|n| n.words()).collect();
            let strong = row_notes.iter().any(|n| n.is_strong());
            let mark = if strong { t.error } else { t.warn };
            (format!("! {}.", words.join("; ")), mark)
        }
        (true, None, Focus::Viscometer) => (s::ON_VISCOMETER.to_string(), t.dim),
        (true, None, Focus::Save) => (s::ON_SAVE_LINE.to_string(), t.dim),
        (true, None, _) => (s::OK_HINT.to_string(), t.dim),
    };
    Paragraph::new(ctx.style().text(&text))
        .style(style)
        .wrap(Wrap { trim: true })
}
