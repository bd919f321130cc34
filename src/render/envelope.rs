//! The envelope report as a terminal table, CSV (one row per point, SI units) or JSON.

use crate::error::CliError;
use crate::render::number::sig;
use crate::report::envelope::{EnvelopeReport, TpPoint};
use crate::units::PA_PER_BAR;
use comfy_table::{CellAlignment, ContentArrangement, Table};

fn point(name: &str, p: Option<TpPoint>) -> Option<String> {
    p.map(|p| {
        format!(
            "{name:<15} T = {} K, P = {} bar abs\n",
            sig(p.temperature_k, 6),
            sig(p.pressure_pa / PA_PER_BAR, 6)
        )
    })
}

/// The report as text.
pub fn text(r: &EnvelopeReport) -> String {
    let what = if r.kind == "pure" {
        "vapour-pressure curve"
    } else {
        "phase envelope"
    };
    let mut out = format!(
        "{what} of {}\nmodel {} ({})\n",
        r.fluid, r.model, r.model_name
    );
    for s in [
        point("critical point", r.critical_point),
        point("cricondenbar", r.cricondenbar),
        point("cricondentherm", r.cricondentherm),
    ]
    .into_iter()
    .flatten()
    {
        out.push_str(&s);
    }
    let mut t = Table::new();
    t.load_style(crate::render::house_table::STYLE)
        .set_content_arrangement(ContentArrangement::Dynamic)
        .set_width(crate::render::model_grid::WIDTH as u16);
    t.set_header(vec![
        "T [K]",
        "P [bar abs]",
        "branch",
        "liquid [kg/m3]",
        "vapour [kg/m3]",
        "liquid [mol/m3]",
        "vapour [mol/m3]",
    ]);
    for p in &r.points {
        t.add_row(vec![
            sig(p.temperature_k, 6),
            sig(p.pressure_pa / PA_PER_BAR, 6),
            p.branch.to_string(),
            sig(p.liquid_mass_density_kg_m3, 5),
            sig(p.vapor_mass_density_kg_m3, 5),
            sig(p.liquid_molar_density_mol_m3, 5),
            sig(p.vapor_molar_density_mol_m3, 5),
        ]);
    }
    for c in [0, 1, 3, 4, 5, 6] {
        if let Some(col) = t.column_mut(c) {
            col.set_cell_alignment(CellAlignment::Right);
        }
    }
    out.push_str(&format!("{t}\n"));
    out.push_str(&format!("{} points; trace: {}\n", r.points.len(), r.stop));
    for c in &r.charts {
        out.push_str(&format!("chart written: {c}\n"));
    }
    for n in &r.notes {
        out.push_str(&format!("note: {n}\n"));
    }
    out.push_str(&format!("caution: {}\n", r.caution));
    out
}

/// One row per point, SI units.
pub fn csv(r: &EnvelopeReport) -> Result<String, CliError> {
    let mut w = csv::Writer::from_writer(Vec::new());
    let err = |e: csv::Error| CliError::Output(e.to_string());
    w.write_record([
        "temperature_k",
        "pressure_pa",
        "branch",
        "liquid_molar_density_mol_m3",
        "vapor_molar_density_mol_m3",
        "liquid_mass_density_kg_m3",
        "vapor_mass_density_kg_m3",
    ])
    .map_err(err)?;
    let num = |v: f64| format!("{v:e}");
    for p in &r.points {
        w.write_record([
            num(p.temperature_k),
            num(p.pressure_pa),
            p.branch.to_string(),
            num(p.liquid_molar_density_mol_m3),
            num(p.vapor_molar_density_mol_m3),
            num(p.liquid_mass_density_kg_m3),
            num(p.vapor_mass_density_kg_m3),
        ])
        .map_err(err)?;
    }
    let bytes = w
        .into_inner()
        .map_err(|e| CliError::Output(e.to_string()))?;
    String::from_utf8(bytes).map_err(|e| CliError::Output(e.to_string()))
}
