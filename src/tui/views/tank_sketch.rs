//! A side view of a tank in characters: the walls and bottom, the liquid level, the shaft
//! and impeller, and the product that moves (the cavern, for a yield-stress product) against
//! the product that stands still. Drawn to scale across and up, cell by cell.

/// The glyphs of the side view (plain ASCII under `--ascii`).
#[derive(Debug, Clone, Copy)]
pub struct SketchGlyphs {
    pub wall: char,
    pub bottom: char,
    pub corner_left: char,
    pub corner_right: char,
    pub level: char,
    pub shaft: char,
    pub impeller: char,
    pub moving: char,
    pub still: char,
}

pub const UNICODE: SketchGlyphs = SketchGlyphs {
    wall: '│',
    bottom: '─',
    corner_left: '└',
    corner_right: '┘',
    level: '~',
    shaft: '│',
    impeller: '━',
    moving: '░',
    still: '·',
};

pub const ASCII: SketchGlyphs = SketchGlyphs {
    wall: '|',
    bottom: '-',
    corner_left: '+',
    corner_right: '+',
    level: '~',
    shaft: '|',
    impeller: '=',
    moving: ':',
    still: '.',
};

/// What the side view is drawn from, metres.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct TankShape {
    pub tank_diameter_m: f64,
    pub liquid_height_m: f64,
    /// The tank's working level (the site's), which sets the drawn tank height.
    pub full_height_m: f64,
    pub impeller_diameter_m: f64,
    /// Diameter and height of the moving region; `None` when the whole tank moves.
    pub cavern_m: Option<(f64, f64)>,
}

/// The impeller is drawn a third of the way up the liquid, where impellers that stand off
/// the bottom are commonly set (common practice, no source; the site does not give it).
const IMPELLER_AT: f64 = 1.0 / 3.0;
/// Head space above the working level in the drawing (for the picture only).
const HEAD_SPACE: f64 = 1.4;

/// The side view as `height` rows of `width` characters.
pub fn side_view(shape: &TankShape, width: usize, height: usize, g: SketchGlyphs) -> Vec<String> {
    let sized = |m: f64| m.is_finite() && m > 0.0;
    let drawable =
        sized(shape.tank_diameter_m) && sized(shape.liquid_height_m.max(shape.full_height_m));
    if width < 5 || height < 3 || !drawable {
        return Vec::new();
    }
    let rows = height - 1;
    let cols = width - 2;
    let tall = HEAD_SPACE * shape.full_height_m.max(shape.liquid_height_m);
    let row_height = tall / rows as f64;
    // The row holding the surface: counted from the bottom.
    let level_from_bottom = (shape.liquid_height_m / row_height).round() as usize;
    let level_row = rows.saturating_sub(level_from_bottom.clamp(1, rows));
    let imp_y = IMPELLER_AT * shape.liquid_height_m;
    let imp_row = rows.saturating_sub(1 + (imp_y / row_height).floor() as usize);
    let x_of = |c: usize| ((c as f64 + 0.5) / cols as f64 - 0.5) * shape.tank_diameter_m;
    let y_of = |r: usize| (rows - r) as f64 * row_height - 0.5 * row_height;
    let shaft_col = cols / 2;
    let mut out = Vec::with_capacity(height);
    for r in 0..rows {
        let mut line = String::with_capacity(width);
        line.push(g.wall);
        for c in 0..cols {
            let x = x_of(c);
            let ch = if r == imp_row && x.abs() <= shape.impeller_diameter_m / 2.0 {
                g.impeller
            } else if c == shaft_col && r < imp_row {
                g.shaft
            } else if r < level_row {
                ' '
            } else if r == level_row {
                g.level
            } else if moves(shape, x, y_of(r), imp_y) {
                g.moving
            } else {
                g.still
            };
            line.push(ch);
        }
        line.push(g.wall);
        out.push(line);
    }
    let mut bottom = String::with_capacity(width);
    bottom.push(g.corner_left);
    bottom.extend(std::iter::repeat_n(g.bottom, cols));
    bottom.push(g.corner_right);
    out.push(bottom);
    out
}

/// Inside the cavern (a cylinder centred on the impeller), or anywhere with no cavern.
fn moves(shape: &TankShape, x: f64, y: f64, imp_y: f64) -> bool {
    match shape.cavern_m {
        None => true,
        Some((dc, hc)) => x.abs() <= dc / 2.0 && (y - imp_y).abs() <= hc / 2.0,
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn shape(cavern: Option<(f64, f64)>) -> TankShape {
        TankShape {
            tank_diameter_m: 2.0,
            liquid_height_m: 2.0,
            full_height_m: 2.0,
            impeller_diameter_m: 0.5,
            cavern_m: cavern,
        }
    }

    #[test]
    fn a_narrow_cavern_leaves_still_product_at_the_wall() {
        let v = side_view(&shape(Some((1.0, 0.4))), 22, 8, ASCII);
        assert_eq!(v.len(), 8);
        assert!(v.iter().all(|l| l.chars().count() == 22));
        let text = v.join("\n");
        assert!(text.contains('~') && text.contains('=') && text.contains(':'));
        // Half the tank's width is in the cavern: the cells next to each wall stand still.
        let imp = v
            .iter()
            .find(|l| l.contains('='))
            .map_or("", |l| l.as_str());
        assert!(imp.starts_with("|.") && imp.ends_with(".|"), "{text}");
        assert_eq!(v[7], format!("+{}+", "-".repeat(20)));
    }

    #[test]
    fn with_no_cavern_all_the_liquid_moves() {
        let v = side_view(&shape(None), 22, 8, UNICODE).join("\n");
        assert!(!v.contains('·'), "{v}");
        assert!(v.contains('░'));
    }
}
