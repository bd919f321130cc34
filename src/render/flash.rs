//! The flash report as a terminal table, CSV (one row per model and phase, SI units) or
//! JSON (the report struct as it is).

use crate::error::CliError;
use crate::render::house_table;
use crate::render::number::{opt, sig};
use crate::report::flash::{FlashReport, FlashResultReport};
use crate::units::{KELVIN_AT_0_DEGC, PA_PER_BAR};
use comfy_table::{CellAlignment, Table};

fn right(t: &mut Table, from: usize) {
    let n = t.column_count();
    for c in from..n {
        if let Some(col) = t.column_mut(c) {
            col.set_cell_alignment(CellAlignment::Right);
        }
    }
}

fn mode_line(r: &FlashReport) -> String {
    let i = &r.input;
    let t = i.temperature_k.map(|t| {
        format!(
            "T = {} K ({} degC)",
            sig(t, 6),
            sig(t - KELVIN_AT_0_DEGC, 5)
        )
    });
    let p = i
        .pressure_pa
        .map(|p| format!("P = {} bar abs", sig(p / PA_PER_BAR, 6)));
    let h = i.enthalpy_j_mol.map(|h| format!("h = {} J/mol", sig(h, 6)));
    let s = i
        .entropy_j_mol_k
        .map(|s| format!("s = {} J/(mol K)", sig(s, 6)));
    let given: Vec<String> = [t, p, h, s].into_iter().flatten().collect();
    let what = match i.mode {
        "T,P" => "flash at",
        "P,h" => "flash at",
        "P,s" => "flash at",
        "bubble-pressure" => "bubble-point pressure at",
        "dew-pressure" => "dew-point pressure at",
        "bubble-temperature" => "bubble-point temperature at",
        _ => "dew-point temperature at",
    };
    format!("{what} {}\n", given.join(", "))
}

/// The report as text.
pub fn text(r: &FlashReport) -> String {
    let mut out = format!("{}\n{}", r.fluid, mode_line(r));
    let mut c = house_table::new();
    c.set_header(vec!["component", "mole fraction", "mass fraction"]);
    for row in &r.composition {
        c.add_row(vec![
            row.id.clone(),
            sig(row.mole_fraction, 6),
            sig(row.mass_fraction, 6),
        ]);
    }
    right(&mut c, 1);
    out.push_str(&format!("feed\n{c}\n"));
    for m in &r.results {
        out.push_str(&model_text(m));
    }
    out.push_str(&format!("caution: {}\n", r.caution));
    out
}

fn model_text(m: &FlashResultReport) -> String {
    let mut out = format!("\n{} ({}): {}", m.model, m.model_name, m.phase);
    match m.branch.as_deref() {
        Some("upper") if m.phase == "dew-point" => {
            out.push_str(", upper branch (retrograde dew point)")
        }
        Some(b) => out.push_str(&format!(", {b} branch")),
        None => {}
    }
    out.push('\n');
    let mut s = house_table::new();
    s.set_header(vec!["quantity", "value", "unit"]);
    let mut row = |q: &str, v: String, u: &str| {
        s.add_row(vec![q.to_string(), v, u.to_string()]);
    };
    row(
        "temperature",
        format!(
            "{} K ({} degC)",
            sig(m.temperature_k, 6),
            sig(m.temperature_k - KELVIN_AT_0_DEGC, 5)
        ),
        "",
    );
    row("pressure", sig(m.pressure_pa / PA_PER_BAR, 6), "bar abs");
    row(
        "vapour fraction (molar)",
        opt(m.vapor_fraction, 6),
        "mol/mol",
    );
    row(
        "vapour fraction (mass)",
        opt(m.vapor_mass_fraction, 6),
        "kg/kg",
    );
    row("Z (feed as a whole)", sig(m.z, 6), "-");
    row(
        "density (feed as a whole)",
        sig(m.mass_density_kg_m3, 6),
        "kg/m3",
    );
    row(
        "molar density (feed)",
        sig(m.molar_density_mol_m3, 6),
        "mol/m3",
    );
    row("molar mass", sig(m.molar_mass_kg_mol * 1e3, 6), "g/mol");
    let per_kg = 1e3 * m.molar_mass_kg_mol;
    row("enthalpy", sig(m.enthalpy_j_mol / per_kg, 6), "kJ/kg");
    row("entropy", sig(m.entropy_j_mol_k / per_kg, 6), "kJ/(kg K)");
    if let Some(res) = m.fugacity_residual {
        row("fugacity residual", sig(res, 3), "max |ln f_V - ln f_L|");
    }
    right(&mut s, 1);
    out.push_str(&format!("{s}\n"));
    let mut p = house_table::new();
    let mut header = vec!["phase".to_string()];
    // Mole fractions of a vapour are written y, of a liquid x (common practice).
    header.extend(m.phases.iter().map(|ph| match ph.phase.as_str() {
        "vapor" => "vapor (y)".to_string(),
        "liquid" => "liquid (x)".to_string(),
        other => other.to_string(),
    }));
    p.set_header(header);
    let line = |name: &str, f: &dyn Fn(&crate::report::flash::FlashPhase) -> String| {
        let mut v = vec![name.to_string()];
        v.extend(m.phases.iter().map(f));
        v
    };
    p.add_row(line("amount [mol/mol feed]", &|ph| sig(ph.amount, 6)));
    p.add_row(line("amount [kg/kg feed]", &|ph| sig(ph.mass_amount, 6)));
    p.add_row(line("Z [-]", &|ph| sig(ph.z, 6)));
    p.add_row(line("density [kg/m3]", &|ph| sig(ph.mass_density_kg_m3, 6)));
    p.add_row(line("molar density [mol/m3]", &|ph| {
        sig(ph.molar_density_mol_m3, 6)
    }));
    p.add_row(line("molar mass [g/mol]", &|ph| {
        sig(ph.molar_mass_kg_mol * 1e3, 6)
    }));
    if let Some(first) = m.phases.first() {
        for (k, c) in first.composition.iter().enumerate() {
            p.add_row(line(&format!("{} [mol/mol]", c.component), &|ph| {
                sig(ph.composition[k].mole_fraction, 6)
            }));
        }
    }
    right(&mut p, 1);
    out.push_str(&format!("{p}\n"));
    if m.phase == "bubble-point" || m.phase == "dew-point" {
        out.push_str(
            "at the saturation point the feed is all of one phase; the other column is the \
             incipient phase (amount zero)\n",
        );
    }
    for n in &m.notes {
        out.push_str(&format!("note: {n}\n"));
    }
    out
}

/// One row per model and phase, SI units; the phase's mole fractions as x_<component>.
pub fn csv(r: &FlashReport) -> Result<String, CliError> {
    let mut w = csv::Writer::from_writer(Vec::new());
    let err = |e: csv::Error| CliError::Output(e.to_string());
    let mut header: Vec<String> = [
        "model",
        "state",
        "temperature_k",
        "pressure_pa",
        "vapor_fraction",
        "vapor_mass_fraction",
        "phase",
        "amount",
        "mass_amount",
        "z",
        "molar_density_mol_m3",
        "mass_density_kg_m3",
        "molar_mass_kg_mol",
    ]
    .iter()
    .map(|s| s.to_string())
    .collect();
    header.extend(r.composition.iter().map(|c| format!("x_{}", c.id)));
    w.write_record(&header).map_err(err)?;
    let num = |v: f64| format!("{v:e}");
    for m in &r.results {
        for ph in &m.phases {
            let mut rec = vec![
                m.model.clone(),
                m.phase.clone(),
                num(m.temperature_k),
                num(m.pressure_pa),
                m.vapor_fraction.map(num).unwrap_or_default(),
                m.vapor_mass_fraction.map(num).unwrap_or_default(),
                ph.phase.clone(),
                num(ph.amount),
                num(ph.mass_amount),
                num(ph.z),
                num(ph.molar_density_mol_m3),
                num(ph.mass_density_kg_m3),
                num(ph.molar_mass_kg_mol),
            ];
            rec.extend(ph.composition.iter().map(|c| num(c.mole_fraction)));
            w.write_record(&rec).map_err(err)?;
        }
    }
    let bytes = w
        .into_inner()
        .map_err(|e| CliError::Output(e.to_string()))?;
    String::from_utf8(bytes).map_err(|e| CliError::Output(e.to_string()))
}
