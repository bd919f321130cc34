//! The house style of every terminal table: a rule of dashes above it, under its header and
//! below it; no vertical lines and no rules between rows, so long lists stay compact (and
//! [`crate::render::wrap`] knows a table by its three rules and leaves it whole).

use comfy_table::{ContentArrangement, LineStyle, Table, TableStyle};

/// The rules of a house table.
pub const STYLE: TableStyle = TableStyle::new()
    .top_border(LineStyle::none().fill('-').junction('-'))
    .header_separator(LineStyle::none().fill('-').junction('-'))
    .bottom_border(LineStyle::none().fill('-').junction('-'));

/// An empty table in the house style, each column as wide as its widest cell.
pub fn new() -> Table {
    let mut t = Table::new();
    t.load_style(STYLE)
        .set_content_arrangement(ContentArrangement::Disabled);
    t
}
