//! Terminal tables with one column per model, the quantity and its unit first. More than
//! [`MAX_SIDE_BY_SIDE`] models are shown in parts one under the other, so that a line stays
//! within about 100 columns (common practice for terminal output).

use crate::render::number::{fixed, opt, sig};
use crate::report::jobs_common::Compared;
use crate::shown_units::TemperatureScale;
use comfy_table::{CellAlignment, ContentArrangement, Table};

/// Models shown side by side in one part of a table.
pub const MAX_SIDE_BY_SIDE: usize = 4;

/// The note under a table of compared values.
pub const IDEAL_ERROR_NOTE: &str = "ideal-gas error = (ideal-gas answer - model answer) / model \
answer; for a temperature, the difference in K.\n";

/// The widest a table line should be, in characters (a terminal of 100 columns).
pub const WIDTH: usize = 100;

/// A table with one column per model.
pub struct Grid {
    head: Vec<String>,
    rows: Vec<Vec<String>>,
    n: usize,
}

impl Grid {
    /// A table with the model ids as column heads.
    pub fn new(models: &[String]) -> Self {
        Self::labelled("quantity", models)
    }

    /// A table whose first column is headed `label`, with the model ids as column heads.
    pub fn labelled(label: &str, models: &[String]) -> Self {
        let mut head = vec![label.to_string(), "unit".to_string()];
        head.extend(models.iter().cloned());
        Grid {
            head,
            rows: Vec::new(),
            n: models.len(),
        }
    }

    /// One row of text cells.
    pub fn row(&mut self, name: &str, unit: &str, cells: Vec<String>) {
        let mut c = vec![name.to_string(), unit.to_string()];
        c.extend(cells);
        c.resize(self.n + 2, "-".to_string());
        self.rows.push(c);
    }

    /// One row of numbers, `scale` dividing SI values into the display unit.
    pub fn nums(&mut self, name: &str, unit: &str, vals: &[Option<f64>], scale: f64) {
        let cells = vals
            .iter()
            .map(|v| v.map_or_else(|| "-".to_string(), |v| sig(v / scale, 6)))
            .collect();
        self.row(name, unit, cells);
    }

    /// A compared value: the model's, the ideal gas's, and the ideal-gas error in percent.
    pub fn compared(&mut self, name: &str, unit: &str, vals: &[Option<Compared>], scale: f64) {
        let f = |g: &dyn Fn(&Compared) -> String| -> Vec<String> {
            vals.iter()
                .map(|v| v.as_ref().map_or_else(|| "-".to_string(), g))
                .collect()
        };
        self.row(name, unit, f(&|c| sig(c.value / scale, 6)));
        self.row("  ideal gas", unit, f(&|c| sig(c.ideal / scale, 6)));
        self.row("  ideal-gas error", "%", f(&|c| opt(c.ideal_error_pct, 3)));
    }

    /// Temperatures on the user's scale, to 0.01 degree.
    pub fn temperatures(&mut self, name: &str, scale: TemperatureScale, vals: &[Option<f64>]) {
        let cells = vals
            .iter()
            .map(|v| v.map_or_else(|| "-".to_string(), |k| fixed(scale.from_kelvin(k), 2)))
            .collect();
        self.row(name, scale.label(), cells);
    }

    /// A compared temperature: the model's and the ideal gas's on the user's scale, and the
    /// ideal-gas error as a difference in kelvin (a percentage of an absolute temperature
    /// means nothing on the Celsius scale and little on any).
    pub fn compared_temperature(
        &mut self,
        name: &str,
        scale: TemperatureScale,
        vals: &[Option<Compared>],
    ) {
        let pick = |f: &dyn Fn(&Compared) -> f64| -> Vec<Option<f64>> {
            vals.iter().map(|v| v.as_ref().map(f)).collect()
        };
        self.temperatures(name, scale, &pick(&|c| c.value));
        self.temperatures("  ideal gas", scale, &pick(&|c| c.ideal));
        let cells = pick(&|c| c.ideal - c.value)
            .iter()
            .map(|d| d.map_or_else(|| "-".to_string(), |d| fixed(d, 2)))
            .collect();
        self.row("  ideal-gas error", "K", cells);
    }

    /// The table as text: models side by side, at most [`MAX_SIDE_BY_SIDE`] and no more than
    /// fit in [`WIDTH`] columns, in parts of nearly equal numbers of models one under the
    /// other, each with the row labels.
    pub fn finish(self) -> String {
        let most = self.n.clamp(1, MAX_SIDE_BY_SIDE);
        let fits = (1..=most)
            .rev()
            .find(|&k| self.parts(k).iter().all(|p| widest(p) <= WIDTH))
            .unwrap_or(1);
        self.parts(fits).concat()
    }

    /// The parts with at most `k` models each, as text.
    fn parts(&self, k: usize) -> Vec<String> {
        let parts = self.n.div_ceil(k).max(1);
        let per_part = self.n.div_ceil(parts).max(1);
        (0..parts)
            .map(|part| {
                let cols = 2 + part * per_part..(2 + (part + 1) * per_part).min(self.n + 2);
                let pick = |r: &[String]| -> Vec<String> {
                    r[..2].iter().chain(&r[cols.clone()]).cloned().collect()
                };
                let mut table = Table::new();
                table
                    .load_style(crate::render::house_table::STYLE)
                    .set_content_arrangement(ContentArrangement::Disabled)
                    .set_header(pick(&self.head));
                for r in &self.rows {
                    table.add_row(pick(r));
                }
                for (i, col) in table.column_iter_mut().enumerate() {
                    if i >= 2 {
                        col.set_cell_alignment(CellAlignment::Right);
                    }
                }
                format!("{table}\n")
            })
            .collect()
    }
}

/// The longest line of a text, in characters.
fn widest(text: &str) -> usize {
    text.lines().map(|l| l.chars().count()).max().unwrap_or(0)
}
