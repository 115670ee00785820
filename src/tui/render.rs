//! Drawing a whole frame from the app's state: top bar, view tabs, the active view, its
//! caution, the status line, the footer from the key map, and any overlay. Below the
//! minimum size a "too small" screen is drawn instead.

use super::app::App;
use super::ctx::Ctx;
use super::keymap;
use super::layout::{self, MIN_HEIGHT, MIN_WIDTH, Regions, clip_end};
use super::overlay::{self, Overlay};
use super::session_log::JournalState;
use super::strings::{self, small, top};
use super::theme::Theme;
use crate::text::sanitize;
use ratatui::Frame;
use ratatui::layout::{HorizontalAlignment, Rect};
use ratatui::text::{Line, Span};
use ratatui::widgets::{Paragraph, Wrap};

/// Draw the app. Pure: reads state, writes the frame's buffer, nothing else.
pub fn draw(app: &App, frame: &mut Frame) {
    let area = frame.area();
    if area.is_empty() {
        return;
    }
    let t = &app.ctx.theme;
    if layout::fits(area) {
        let status = status_text(app);
        let r = Regions::with_status(area, layout::wrapped_lines(&status.0, area.width));
        draw_top(frame, r.top, &app.ctx);
        draw_tabs(frame, r.tabs, app);
        app.active_view().render(frame, r.body, &app.ctx);
        let caution = Paragraph::new(app.active_view().caution()).style(t.caution);
        frame.render_widget(caution, r.caution);
        draw_status(frame, r.status, status);
        draw_footer(frame, r.footer, app);
    } else {
        draw_too_small(frame, area, t);
    }
    match app.overlay() {
        Overlay::None => {}
        Overlay::Help { scroll } => overlay::draw_help(frame, *scroll, app.views(), t),
        Overlay::ConfirmQuit { .. } => overlay::draw_confirm(frame, &app.unsaved_reasons(), t),
        Overlay::Note(field) => overlay::draw_note(frame, field, t),
    }
    if app.ctx.style().ascii {
        ascii_cells(frame);
    }
}

/// Under `--ascii` or TERM=dumb, the last word on every cell: our own words are spelt in
/// ASCII where they are drawn (tau0, Pa.s^n); what is left is text typed by the operator or
/// names from the site config, drawn one character to a cell, so each non-ASCII character
/// becomes one ASCII character ('-' for a dash, '?' where there is no one-letter spelling)
/// and the cursor stays where the field put it.
fn ascii_cells(frame: &mut Frame) {
    let buf = frame.buffer_mut();
    for cell in buf.content.iter_mut() {
        let symbol = cell.symbol();
        if symbol.is_ascii() {
            continue;
        }
        let folded = crate::present::ascii_fold(symbol);
        let one = if folded.chars().count() == 1 {
            folded
        } else {
            "?".to_string()
        };
        cell.set_symbol(&one);
    }
}

fn draw_top(frame: &mut Frame, area: Rect, ctx: &Ctx) {
    let t = &ctx.theme;
    let journal = match ctx.log.state(&ctx.session) {
        JournalState::Saved if ctx.session.log.is_empty() => {
            Span::styled(top::JOURNAL_EMPTY, t.dim)
        }
        JournalState::Saved => Span::styled(top::JOURNAL_SAVED, t.ok),
        JournalState::Unsaved(n) => Span::styled(format!("{n} {}", top::JOURNAL_UNSAVED), t.warn),
        JournalState::Error { unsaved, .. } => Span::styled(
            format!("{}: {unsaved} {}", top::JOURNAL_ERROR, top::JOURNAL_UNSAVED),
            t.error,
        ),
    };
    let right = Line::from(vec![
        Span::raw(ctx.clock.now.format("%H:%M:%S").to_string()),
        Span::styled(
            format!(" {} {}  ", top::UP, ctx.clock.elapsed_text()),
            t.dim,
        ),
        journal,
        Span::raw(" "),
    ]);
    let right_w = right.width() as u16;
    let app_name = format!(" {} ", strings::APP_NAME);
    let operator = clip_end(&sanitize(&ctx.operator, false), 16, t.marks.cut);
    let op_label = format!("  {} ", top::OPERATOR);
    // The operator is never cut off; a long site name gives way first.
    let fixed = right_w as usize + 3 + app_name.len() + op_label.len() + operator.chars().count();
    let site_room = usize::from(area.width).saturating_sub(fixed);
    let left = Line::from(vec![
        Span::styled(app_name, t.tab_active),
        Span::styled(
            format!(
                " {}",
                clip_end(
                    &ctx.style().text(&sanitize(&ctx.site.name, false)),
                    site_room,
                    t.marks.cut
                )
            ),
            t.title,
        ),
        Span::styled(op_label, t.dim),
        Span::raw(operator),
    ]);
    let left_area = Rect {
        width: area.width.saturating_sub(right_w + 1),
        ..area
    };
    frame.render_widget(Paragraph::new(left), left_area);
    frame.render_widget(
        Paragraph::new(right).alignment(HorizontalAlignment::Right),
        area,
    );
}

/// The view tabs: padded when they fit, else packed (one space between, the active one
/// still padded) so that every view's name shows at 80 columns.
fn draw_tabs(frame: &mut Frame, area: Rect, app: &App) {
    let t = &app.ctx.theme;
    let active = app.active_id();
    let titles: Vec<(&str, bool)> = app
        .views()
        .iter()
        .map(|v| (v.title(), v.id() == active))
        .collect();
    let padded: usize = 1 + titles
        .iter()
        .map(|(t, _)| t.chars().count() + 3)
        .sum::<usize>();
    let roomy = padded <= usize::from(area.width);
    let mut spans = vec![Span::raw(" ")];
    for (title, is_active) in titles {
        let style = if is_active { t.tab_active } else { t.tab };
        let text = if roomy || is_active {
            format!(" {title} ")
        } else {
            title.to_string()
        };
        spans.push(Span::styled(text, style));
        spans.push(Span::raw(" "));
    }
    frame.render_widget(Paragraph::new(Line::from(spans)), area);
}

/// The status message as drawn (cleaned, in ASCII when asked) and its style.
fn status_text(app: &App) -> (String, ratatui::style::Style) {
    let t = &app.ctx.theme;
    let (text, style) = match app.ctx.log.state(&app.ctx.session) {
        JournalState::Error { message, .. } => (message, t.error),
        _ => (app.status().to_string(), t.base),
    };
    (app.ctx.style().text(&sanitize(&text, false)), style)
}

/// The status message, wrapped at word boundaries into the lines made for it.
fn draw_status(frame: &mut Frame, area: Rect, (text, style): (String, ratatui::style::Style)) {
    let p = Paragraph::new(text).style(style).wrap(Wrap { trim: true });
    frame.render_widget(p, area);
}

/// The footer: as many of the context's bindings as fit, in key-map order.
fn draw_footer(frame: &mut Frame, area: Rect, app: &App) {
    let t = &app.ctx.theme;
    let mut spans = Vec::new();
    let mut used = 0usize;
    for (key, label) in keymap::footer(app.context(), app.active_view().keys()) {
        let need = key.chars().count() + label.chars().count() + 3;
        if used + need > usize::from(area.width) {
            break;
        }
        used += need;
        spans.push(Span::styled(format!(" {key}"), t.key));
        spans.push(Span::styled(format!(" {label} "), t.dim));
    }
    frame.render_widget(Paragraph::new(Line::from(spans)), area);
}

fn draw_too_small(frame: &mut Frame, area: Rect, t: &Theme) {
    let text = vec![
        Line::styled(
            format!("{} ({}x{}).", small::NEEDS, area.width, area.height),
            t.warn,
        ),
        Line::raw(format!("{} {MIN_WIDTH}x{MIN_HEIGHT},", small::ENLARGE)),
        Line::raw(small::OR_QUIT),
    ];
    frame.render_widget(Paragraph::new(text).wrap(Wrap { trim: true }), area);
}
