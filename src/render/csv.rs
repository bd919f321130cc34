//! CSV output: one row per result, SI units, a header row with the unit in each name.

use crate::error::CliError;
use crate::render::number::sig;
use crate::report::fluids::FluidsReport;
use crate::report::state::StateReport;

fn finish(w: csv::Writer<Vec<u8>>) -> Result<String, CliError> {
    let bytes = w
        .into_inner()
        .map_err(|e| CliError::Output(e.to_string()))?;
    String::from_utf8(bytes).map_err(|e| CliError::Output(e.to_string()))
}

fn full(v: f64) -> String {
    format!("{v:e}")
}

fn opt(v: Option<f64>) -> String {
    v.map(full).unwrap_or_default()
}

/// The state report as CSV.
pub fn state(r: &StateReport) -> Result<String, CliError> {
    let mut w = csv::Writer::from_writer(Vec::new());
    let mut header: Vec<String> = [
        "model",
        "phase",
        "temperature_k",
        "pressure_pa",
        "z",
        "molar_density_mol_m3",
        "mass_density_kg_m3",
        "ideal_gas_deviation_pct",
        "ideal_gas_deviation_of",
        "enthalpy_j_mol",
        "entropy_j_mol_k",
        "cp_j_mol_k",
        "cv_j_mol_k",
        "speed_of_sound_m_s",
        "joule_thomson_k_pa",
        "isentropic_exponent",
        "residual_enthalpy_j_mol",
        "residual_entropy_j_mol_k",
        "residual_gibbs_j_mol",
        "vapor_fraction",
    ]
    .iter()
    .map(|s| s.to_string())
    .collect();
    header.extend(r.composition.iter().map(|c| format!("phi_{}", c.id)));
    let err = |e: csv::Error| CliError::Output(e.to_string());
    w.write_record(&header).map_err(err)?;
    for m in &r.results {
        let mut row = vec![
            m.model.clone(),
            m.phase.clone(),
            full(m.temperature_k),
            full(m.pressure_pa),
            full(m.z),
            full(m.molar_density_mol_m3),
            full(m.mass_density_kg_m3),
            full(m.ideal_gas_deviation_pct),
            m.ideal_gas_deviation_of.to_string(),
            opt(m.enthalpy_j_mol),
            opt(m.entropy_j_mol_k),
            opt(m.cp_j_mol_k),
            opt(m.cv_j_mol_k),
            opt(m.speed_of_sound_m_s),
            opt(m.joule_thomson_k_pa),
            opt(m.isentropic_exponent),
            opt(m.residual_enthalpy_j_mol),
            opt(m.residual_entropy_j_mol_k),
            opt(m.residual_gibbs_j_mol),
            opt(m.vapor_fraction),
        ];
        row.extend(m.fugacity.iter().map(|f| opt(f.phi)));
        w.write_record(&row).map_err(err)?;
    }
    finish(w)
}

/// The component list as CSV.
pub fn fluids(r: &FluidsReport) -> Result<String, CliError> {
    let mut w = csv::Writer::from_writer(Vec::new());
    let err = |e: csv::Error| CliError::Output(e.to_string());
    w.write_record([
        "id",
        "name",
        "formula",
        "cas",
        "molar_mass_kg_mol",
        "tc_k",
        "pc_pa",
        "omega",
        "tb_k",
        "confidence",
        "source",
    ])
    .map_err(err)?;
    for c in &r.components {
        w.write_record([
            c.id.clone(),
            c.name.clone(),
            c.formula.clone().unwrap_or_default(),
            c.cas.clone(),
            sig(c.molar_mass_kg_mol, 9),
            sig(c.tc_k, 9),
            sig(c.pc_pa, 9),
            sig(c.omega, 6),
            c.tb_k.map(|t| sig(t, 9)).unwrap_or_default(),
            format!("{:?}", c.confidence).to_lowercase(),
            c.source.clone(),
        ])
        .map_err(err)?;
    }
    finish(w)
}

/// The model catalogue as CSV.
pub fn models(r: &crate::report::models::ModelsReport) -> Result<String, CliError> {
    let mut w = csv::Writer::from_writer(Vec::new());
    let err = |e: csv::Error| CliError::Output(e.to_string());
    w.write_record(["id", "name", "citation", "validity", "good_at", "poor_at"])
        .map_err(err)?;
    for m in &r.models {
        w.write_record([
            m.id,
            m.name,
            m.citation,
            m.validity,
            &m.good_at.join(" | "),
            &m.poor_at.join(" | "),
        ])
        .map_err(err)?;
    }
    finish(w)
}
