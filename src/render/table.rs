//! Terminal tables. State results put the models side by side, one column each, so the
//! ideal-gas answer and every real-gas model can be read across one row.

use crate::render::house_table;
use crate::render::model_grid::{Grid, WIDTH};
use crate::render::number::{opt, sig};
use crate::report::fluids::FluidsReport;
use crate::report::state::{CompositionRow, ModelResult, StateReport};
use crate::units::{KELVIN_AT_0_DEGC, PA_PER_BAR};
use comfy_table::{CellAlignment, ContentArrangement, Table};

/// The state report as text.
pub fn state(r: &StateReport) -> String {
    let mut out = String::new();
    out.push_str(&format!("{}\n", r.fluid));
    let inp = &r.input;
    let mut given = Vec::new();
    if let Some(t) = inp.temperature_k {
        given.push(format!(
            "T = {} K ({} degC)",
            sig(t, 6),
            sig(t - KELVIN_AT_0_DEGC, 5)
        ));
    }
    if let Some(p) = inp.pressure_pa {
        let mut s = format!("P = {} bar abs", sig(p / PA_PER_BAR, 6));
        if inp.pressure_is_gauge {
            s.push_str(&format!(
                " (entered as {}, ambient {} bar)",
                inp.pressure.as_deref().unwrap_or(""),
                sig(inp.ambient_pressure_pa / PA_PER_BAR, 6)
            ));
        }
        given.push(s);
    }
    for (name, v) in [
        ("density", &inp.density),
        ("enthalpy", &inp.enthalpy),
        ("entropy", &inp.entropy),
        ("quality", &inp.quality),
    ] {
        if let Some(v) = v {
            given.push(format!("{name} = {v}"));
        }
    }
    out.push_str(&format!("state: {}\n", given.join(", ")));
    if r.composition.len() > 1 {
        let mut c = house_table::new();
        c.set_header(vec![
            "component",
            "entered",
            "mole fraction",
            "mass fraction",
        ]);
        for row in &r.composition {
            c.add_row(vec![
                row.name.clone(),
                sig(row.as_entered, 6),
                sig(row.mole_fraction, 6),
                sig(row.mass_fraction, 6),
            ]);
        }
        right_align(&mut c, 1);
        out.push_str(&format!("{c}\n"));
        if let Some(s) = inp.normalized_from {
            out.push_str(&format!("(entered fractions summed to {s}; normalised)\n"));
        }
    }

    let models: Vec<String> = r.results.iter().map(|m| m.model.clone()).collect();
    let mut t = Grid::labelled("property", &models);
    let row = |t: &mut Grid, name: &str, unit: &str, f: &dyn Fn(usize) -> String| {
        t.row(name, unit, (0..r.results.len()).map(f).collect());
    };
    let res = &r.results;
    row(&mut t, "phase", "", &|i| res[i].phase.clone());
    if res.iter().any(|m| m.vapor_fraction.is_some()) {
        row(&mut t, "vapour fraction", "mol/mol", &|i| {
            opt(res[i].vapor_fraction, 5)
        });
        row(&mut t, "vapour density", "kg/m3", &|i| {
            opt(res[i].phases.first().map(|p| p.mass_density_kg_m3), 6)
        });
        row(&mut t, "liquid density", "kg/m3", &|i| {
            opt(res[i].phases.get(1).map(|p| p.mass_density_kg_m3), 6)
        });
    }
    if inp.temperature_k.is_none() {
        row(&mut t, "temperature", "K", &|i| {
            sig(res[i].temperature_k, 6)
        });
    }
    if inp.pressure_pa.is_none() {
        row(&mut t, "pressure", "bar abs", &|i| {
            sig(res[i].pressure_pa / PA_PER_BAR, 6)
        });
    }
    row(&mut t, "Z", "-", &|i| sig(res[i].z, 6));
    row(&mut t, "density", "kg/m3", &|i| {
        sig(res[i].mass_density_kg_m3, 6)
    });
    row(&mut t, "molar density", "mol/m3", &|i| {
        sig(res[i].molar_density_mol_m3, 6)
    });
    row(&mut t, "specific volume", "m3/kg", &|i| {
        sig(res[i].specific_volume_m3_kg, 6)
    });
    let of = res[0].ideal_gas_deviation_of;
    row(&mut t, &format!("ideal-gas error in {of}"), "%", &|i| {
        sig(res[i].ideal_gas_deviation_pct, 4)
    });
    // A gas known by its gravity has no energy properties: their rows are left out.
    let energy = res.iter().any(|m| m.enthalpy_j_kg.is_some());
    if energy {
        energy_rows(&mut t, res, &r.composition);
    }
    out.push_str(&t.finish());
    let notes = crate::render::notes::grouped(
        res.iter().map(|m| (m.model.as_str(), m.notes.as_slice())),
        |_| false,
    );
    if !notes.is_empty() {
        out.push_str("notes:\n");
        for n in notes {
            out.push_str(&format!("  {n}\n"));
        }
    }
    if energy {
        out.push_str(&format!("h and s: {}.\n", r.enthalpy_entropy_zero));
    } else {
        out.push_str(
            "h, s, cp, speed of sound, fugacities: not available for a gas known by its \
             gravity\n(no ideal-gas heat capacity); give its composition with --mix.\n",
        );
    }
    out.push_str(&format!("caution: {}\n", r.caution));
    out
}

/// The rows of enthalpy, entropy, heat capacities, speed of sound, Joule-Thomson coefficient,
/// isentropic exponent and fugacity coefficients.
fn energy_rows(t: &mut Grid, res: &[ModelResult], composition: &[CompositionRow]) {
    let row = |t: &mut Grid, name: &str, unit: &str, f: &dyn Fn(usize) -> String| {
        t.row(name, unit, (0..res.len()).map(f).collect());
    };
    row(t, "enthalpy", "kJ/kg", &|i| {
        opt(res[i].enthalpy_j_kg.map(|h| h / 1e3), 6)
    });
    row(t, "entropy", "kJ/(kg K)", &|i| {
        opt(res[i].entropy_j_kg_k.map(|s| s / 1e3), 6)
    });
    let mm = |i: usize| res[i].mass_density_kg_m3 / res[i].molar_density_mol_m3;
    row(t, "cp", "kJ/(kg K)", &|i| {
        opt(res[i].cp_j_mol_k.map(|c| c / mm(i) / 1e3), 5)
    });
    row(t, "cv", "kJ/(kg K)", &|i| {
        opt(res[i].cv_j_mol_k.map(|c| c / mm(i) / 1e3), 5)
    });
    row(t, "speed of sound", "m/s", &|i| {
        opt(res[i].speed_of_sound_m_s, 5)
    });
    row(t, "Joule-Thomson coeff.", "K/bar", &|i| {
        opt(res[i].joule_thomson_k_pa.map(|j| j * PA_PER_BAR), 4)
    });
    row(t, "isentropic exponent", "-", &|i| {
        opt(res[i].isentropic_exponent, 5)
    });
    for (k, c) in composition.iter().enumerate() {
        let name = if composition.len() == 1 {
            "fugacity coeff.".to_string()
        } else {
            format!("fugacity coeff. {}", c.id)
        };
        row(t, &name, "-", &|i| {
            opt(res[i].fugacity.get(k).and_then(|f| f.phi), 6)
        });
    }
}

/// The component list or one component's record, as text.
pub fn fluids(r: &FluidsReport) -> String {
    if r.components.len() == 1 && r.query.is_some() {
        return one_fluid(r.components[0]);
    }
    let mut t = house_table::new();
    t.set_header(vec![
        "id", "name", "formula", "M g/mol", "Tc K", "Pc bar", "omega", "Tb K",
    ]);
    for c in &r.components {
        t.add_row(vec![
            c.id.clone(),
            c.name.clone(),
            c.formula.clone().unwrap_or_default(),
            sig(c.molar_mass_kg_mol * 1e3, 6),
            sig(c.tc_k, 5),
            sig(c.pc_pa / PA_PER_BAR, 5),
            sig(c.omega, 3),
            c.tb_k.map_or_else(|| "-".to_string(), |t| sig(t, 5)),
        ]);
    }
    right_align(&mut t, 3);
    t.set_content_arrangement(ContentArrangement::Dynamic);
    t.set_width(WIDTH as u16);
    format!(
        "{t}\n{} components; `zfactor fluids NAME` shows one with its sources.\n",
        r.components.len()
    )
}

fn one_fluid(c: &fluids::ComponentRecord) -> String {
    let mut t = house_table::new();
    t.set_header(vec!["field", "value"]);
    let rows: Vec<(&str, String)> = vec![
        ("id", c.id.clone()),
        ("name", c.name.clone()),
        ("aliases", c.aliases.join(", ")),
        ("formula", c.formula.clone().unwrap_or_else(|| "-".into())),
        ("CAS", c.cas.clone()),
        (
            "molar mass",
            format!("{} g/mol", sig(c.molar_mass_kg_mol * 1e3, 7)),
        ),
        ("critical temperature", format!("{} K", sig(c.tc_k, 6))),
        (
            "critical pressure",
            format!("{} bar", sig(c.pc_pa / PA_PER_BAR, 6)),
        ),
        ("acentric factor", sig(c.omega, 4)),
        (
            "critical volume",
            c.vc_m3_mol
                .map_or_else(|| "-".into(), |v| format!("{} cm3/mol", sig(v * 1e6, 5))),
        ),
        ("critical Z", opt(c.zc, 4)),
        (
            "normal boiling point",
            c.tb_k
                .map_or_else(|| "-".into(), |t| format!("{} K", sig(t, 6))),
        ),
        ("confidence", format!("{:?}", c.confidence).to_lowercase()),
        ("source", c.source.clone()),
        ("source detail", c.source_detail.clone()),
        ("notes", c.notes.clone()),
        (
            "ideal-gas cp",
            format!(
                "{} K to {} K, {}",
                sig(c.cp_range_k.0, 5),
                sig(c.cp_range_k.1, 5),
                c.cp_source
            ),
        ),
    ];
    for (k, v) in rows {
        t.add_row(vec![k.to_string(), v]);
    }
    t.set_content_arrangement(ContentArrangement::Dynamic);
    t.set_width(WIDTH as u16);
    format!("{t}\n")
}

fn right_align(t: &mut Table, from: usize) {
    for (i, col) in t.column_iter_mut().enumerate() {
        if i >= from {
            col.set_cell_alignment(CellAlignment::Right);
        }
    }
}

/// The model catalogue as text: a short list, or one model in full.
pub fn models(r: &crate::report::models::ModelsReport) -> String {
    let mut t = house_table::new();
    if r.models.len() == 1 {
        let m = &r.models[0];
        t.set_header(vec!["field", "value"]);
        t.add_row(vec!["id".to_string(), m.id.to_string()]);
        t.add_row(vec!["name".to_string(), m.name.to_string()]);
        t.add_row(vec!["source".to_string(), m.citation.to_string()]);
        t.add_row(vec!["validity".to_string(), m.validity.to_string()]);
        for f in &m.fluid_ranges {
            t.add_row(vec![
                format!("range, {}", f.fluid),
                format!(
                    "{} K to {} K, up to {} MPa ({})",
                    f.t_min_k,
                    f.t_max_k,
                    f.p_max_pa / 1e6,
                    f.formulation
                ),
            ]);
        }
        t.add_row(vec![
            "gas density".to_string(),
            if m.density_uncertainty_pct > 0.0 {
                format!(
                    "typically within {} % inside its range (the audit names no cause within it)",
                    m.density_uncertainty_pct
                )
            } else {
                "no bound: its error, Z - 1, is what the other models measure".to_string()
            },
        ]);
        for g in &m.good_at {
            t.add_row(vec!["good at".to_string(), g.to_string()]);
        }
        for p in &m.poor_at {
            t.add_row(vec!["poor at".to_string(), p.to_string()]);
        }
        t.set_content_arrangement(ContentArrangement::Dynamic);
        t.set_width(WIDTH as u16);
        return format!("{t}\n");
    }
    t.set_header(vec!["id", "model", "validity"]);
    for m in &r.models {
        t.add_row(vec![m.id, m.name, m.validity]);
    }
    t.set_content_arrangement(ContentArrangement::Dynamic);
    t.set_width(WIDTH as u16);
    format!(
        "{t}\n`zfactor models ID` shows one model with its source, its range for each fluid, \
         strengths and weaknesses. A state outside a model's range is still computed, with a \
         warning beside it and exit code 3.\n"
    )
}
