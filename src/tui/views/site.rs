//! The Site view: pick the sample point (a tank, line or pump of the site) and the product
//! that new readings are filed under.

use super::{Effect, View, ViewId};
use crate::text::sanitize;
use crate::tui::ctx::Ctx;
use crate::tui::keymap::{Action, Binding, Key, Scope, b};
use crate::tui::strings::{caution, keys, views as names};
use crate::tui::layout;
use crate::tui::strings::site as s;
use crate::tui::widgets::list::{ListRow, draw_list};
use ratatui::Frame;
use ratatui::layout::{Constraint, Layout, Rect};
use ratatui::text::{Line, Span};
use ratatui::widgets::Paragraph;

/// This view's id.
pub const ID: ViewId = ViewId("site");

/// The Site view's own keys.
const KEYS: &[Binding] = &[b(Scope::View, &[Key::Enter, Key::Char(' ')], Action::Activate, keys::PICK)];

#[derive(Debug, Clone, Copy, PartialEq, Eq)]
enum Column {
    Equipment,
    Product,
}

pub struct SiteView {
    column: Column,
    equipment_cursor: usize,
    product_cursor: usize,
}

impl SiteView {
    pub fn new(_ctx: &Ctx) -> SiteView {
        SiteView {
            column: Column::Equipment,
            equipment_cursor: 0,
            product_cursor: 0,
        }
    }

    fn move_cursor(&mut self, ctx: &Ctx, to: impl Fn(usize, usize) -> usize) {
        let (cursor, len) = match self.column {
            Column::Equipment => (&mut self.equipment_cursor, ctx.sample_points().len()),
            Column::Product => (&mut self.product_cursor, ctx.site.products.len()),
        };
        *cursor = to(*cursor, len).min(len.saturating_sub(1));
    }

    fn pick(&mut self, ctx: &Ctx) -> Vec<Effect> {
        match self.column {
            Column::Equipment => self.pick_equipment(ctx),
            Column::Product => match ctx.site.products.get(self.product_cursor) {
                Some(p) => vec![
                    Effect::PickProduct(p.name.clone()),
                    Effect::Status(format!(
                        "{} {}. {}",
                        s::PICKED,
                        clean(&p.name),
                        s::NEXT_STEP
                    )),
                ],
                None => Vec::new(),
            },
        }
    }

    fn pick_equipment(&mut self, ctx: &Ctx) -> Vec<Effect> {
        let points = ctx.sample_points();
        let Some(&(id, _, _)) = points.get(self.equipment_cursor) else {
            return Vec::new();
        };
        self.column = Column::Product;
        let mut effects = vec![Effect::PickEquipment(id.to_string())];
        // A tank holds one product: take it as the likely one (the operator can change it).
        let held = ctx.site.tank(id).and_then(|tank| {
            let i = ctx
                .site
                .products
                .iter()
                .position(|p| p.name == tank.product)?;
            Some((i, tank.product.clone()))
        });
        let status = match held {
            Some((i, product)) => {
                self.product_cursor = i;
                let text = format!(
                    "{} {} ({} {}). {}",
                    s::PICKED,
                    clean(id),
                    s::HOLDS,
                    clean(&product),
                    s::NEXT_STEP
                );
                effects.push(Effect::PickProduct(product));
                text
            }
            None => format!("{} {}. {}", s::PICKED, clean(id), s::NOW_PRODUCT),
        };
        effects.push(Effect::Status(status));
        effects
    }

    fn render_lists(&self, frame: &mut Frame, area: Rect, ctx: &Ctx) {
        let [left, right] =
            Layout::horizontal([Constraint::Percentage(55), Constraint::Percentage(45)])
                .areas(area);
        let picked_eq = ctx.picks.equipment.as_deref();
        let eq_rows: Vec<ListRow> = ctx
            .sample_points()
            .into_iter()
            .map(|(id, kind, desc)| ListRow {
                text: format!("{id}  {}  {desc}", kind.name()),
                picked: Some(id) == picked_eq,
            })
            .collect();
        let picked_p = ctx.picks.product.as_deref();
        let p_rows: Vec<ListRow> = ctx
            .site
            .products
            .iter()
            .map(|p| ListRow {
                text: format!("{}  {}", p.name, p.description),
                picked: Some(p.name.as_str()) == picked_p,
            })
            .collect();
        let focus = |c| (self.column == c).then_some(());
        let eq_cursor = focus(Column::Equipment).map(|()| self.equipment_cursor);
        let p_cursor = focus(Column::Product).map(|()| self.product_cursor);
        draw_list(
            frame,
            left,
            s::EQUIPMENT,
            &eq_rows,
            eq_cursor,
            s::NONE,
            &ctx.theme,
        );
        draw_list(
            frame,
            right,
            s::PRODUCTS,
            &p_rows,
            p_cursor,
            s::NONE,
            &ctx.theme,
        );
    }

    /// The site and where its config came from (the source only if it fits).
    fn render_info(&self, frame: &mut Frame, area: Rect, ctx: &Ctx) {
        let t = &ctx.theme;
        let mut spans = vec![
            Span::styled(format!("{}: ", s::SITE), t.dim),
            Span::styled(sanitize(&ctx.site.name, false), t.title),
        ];
        let source = format!("  ({})", sanitize(&ctx.site.source, false));
        let used: usize = spans.iter().map(Span::width).sum();
        if used + source.chars().count() <= usize::from(area.width) {
            spans.push(Span::styled(source, t.dim));
        }
        frame.render_widget(Paragraph::new(Line::from(spans)), area);
    }
}

fn clean(text: &str) -> String {
    sanitize(text, false)
}

impl View for SiteView {
    view_identity!(ID, names::SITE, caution::SITE, KEYS);


    fn handle(&mut self, action: Action, ctx: &Ctx) -> Vec<Effect> {
        match action {
            Action::Up => self.move_cursor(ctx, |c, _| c.saturating_sub(1)),
            Action::Down => self.move_cursor(ctx, |c, _| c.saturating_add(1)),
            Action::PageUp => self.move_cursor(ctx, |c, _| c.saturating_sub(10)),
            Action::PageDown => self.move_cursor(ctx, |c, _| c.saturating_add(10)),
            Action::Home => self.move_cursor(ctx, |_, _| 0),
            Action::End => self.move_cursor(ctx, |_, len| len),
            Action::Left => self.column = Column::Equipment,
            Action::Right => self.column = Column::Product,
            Action::Activate => return self.pick(ctx),
            _ => {}
        }
        Vec::new()
    }

    fn render(&self, frame: &mut Frame, area: Rect, ctx: &Ctx) {
        let lists = Rect {
            height: area.height.saturating_sub(1),
            ..area
        };
        self.render_lists(frame, lists, ctx);
        self.render_info(frame, layout::row(area, area.height.saturating_sub(1)), ctx);
    }
}
