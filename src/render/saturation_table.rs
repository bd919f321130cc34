//! The saturation report as a terminal table: one column per model.

use crate::render::number::sig;
use crate::report::saturation::SaturationReport;
use crate::units::{KELVIN_AT_0_DEGC, PA_PER_BAR};
use comfy_table::{CellAlignment, ContentArrangement, Table};

/// The report as text.
pub fn render(r: &SaturationReport) -> String {
    let mut out = format!("{}: saturation\n", r.fluid);
    let inp = &r.input;
    if let Some(t) = inp.temperature_k {
        out.push_str(&format!(
            "at T = {} K ({} degC)\n",
            sig(t, 6),
            sig(t - KELVIN_AT_0_DEGC, 5)
        ));
    }
    if let Some(p) = inp.pressure_pa {
        let mut s = format!("at P = {} bar abs", sig(p / PA_PER_BAR, 6));
        if inp.pressure_is_gauge {
            s.push_str(&format!(
                " (entered as {}, ambient {} bar)",
                inp.pressure.as_deref().unwrap_or(""),
                sig(inp.ambient_pressure_pa / PA_PER_BAR, 6)
            ));
        }
        out.push_str(&s);
        out.push('\n');
    }
    let mut t = Table::new();
    t.load_style(crate::render::house_table::STYLE)
        .set_content_arrangement(ContentArrangement::Disabled);
    let mut header = vec!["property".to_string(), "unit".to_string()];
    header.extend(r.results.iter().map(|m| m.model.clone()));
    t.set_header(header);
    let res = &r.results;
    let mut row = |name: &str, unit: &str, f: &dyn Fn(usize) -> String| {
        let mut cells = vec![name.to_string(), unit.to_string()];
        cells.extend((0..res.len()).map(f));
        t.add_row(cells);
    };
    if inp.temperature_k.is_none() {
        row("saturation temperature", "K", &|i| {
            sig(res[i].temperature_k, 7)
        });
    }
    if inp.pressure_pa.is_none() {
        row("saturation pressure", "bar abs", &|i| {
            sig(res[i].pressure_pa / PA_PER_BAR, 7)
        });
    }
    row("liquid density", "kg/m3", &|i| {
        sig(res[i].liquid.mass_density_kg_m3, 6)
    });
    row("vapour density", "kg/m3", &|i| {
        sig(res[i].vapor.mass_density_kg_m3, 6)
    });
    row("liquid enthalpy", "kJ/kg", &|i| {
        sig(res[i].liquid.enthalpy_j_kg / 1e3, 6)
    });
    row("vapour enthalpy", "kJ/kg", &|i| {
        sig(res[i].vapor.enthalpy_j_kg / 1e3, 6)
    });
    row("latent heat", "kJ/kg", &|i| {
        sig(res[i].latent_heat_j_kg / 1e3, 6)
    });
    row("liquid entropy", "kJ/(kg K)", &|i| {
        sig(res[i].liquid.entropy_j_kg_k / 1e3, 6)
    });
    row("vapour entropy", "kJ/(kg K)", &|i| {
        sig(res[i].vapor.entropy_j_kg_k / 1e3, 6)
    });
    row("liquid Z", "-", &|i| sig(res[i].liquid.z, 5));
    row("vapour Z", "-", &|i| sig(res[i].vapor.z, 5));
    for (i, col) in t.column_iter_mut().enumerate() {
        if i >= 2 {
            col.set_cell_alignment(CellAlignment::Right);
        }
    }
    out.push_str(&format!("{t}\n"));
    if let Some(m) = res.first() {
        out.push_str(&format!("h and s: {}.\n", m.reference_state));
    }
    out.push_str(&format!("caution: {}\n", r.caution));
    out
}
