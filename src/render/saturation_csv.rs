//! The saturation report as CSV: one row per model, SI units.

use crate::error::CliError;
use crate::report::saturation::SaturationReport;

/// The report as CSV.
pub fn render(r: &SaturationReport) -> Result<String, CliError> {
    let mut w = csv::Writer::from_writer(Vec::new());
    let header = [
        "model",
        "temperature_k",
        "pressure_pa",
        "liquid_molar_density_mol_m3",
        "vapor_molar_density_mol_m3",
        "liquid_mass_density_kg_m3",
        "vapor_mass_density_kg_m3",
        "liquid_enthalpy_j_mol",
        "vapor_enthalpy_j_mol",
        "latent_heat_j_mol",
        "liquid_entropy_j_mol_k",
        "vapor_entropy_j_mol_k",
        "latent_heat_j_kg",
    ];
    let out = |e: csv::Error| CliError::Output(e.to_string());
    w.write_record(header).map_err(out)?;
    for m in &r.results {
        let mut rec = vec![m.model.clone()];
        rec.extend(
            [
                m.temperature_k,
                m.pressure_pa,
                m.liquid.molar_density_mol_m3,
                m.vapor.molar_density_mol_m3,
                m.liquid.mass_density_kg_m3,
                m.vapor.mass_density_kg_m3,
                m.liquid.enthalpy_j_mol,
                m.vapor.enthalpy_j_mol,
                m.latent_heat_j_mol,
                m.liquid.entropy_j_mol_k,
                m.vapor.entropy_j_mol_k,
                m.latent_heat_j_kg,
            ]
            .iter()
            .map(|v| format!("{v:e}")),
        );
        w.write_record(&rec).map_err(out)?;
    }
    let bytes = w
        .into_inner()
        .map_err(|e| CliError::Output(e.to_string()))?;
    String::from_utf8(bytes).map_err(|e| CliError::Output(e.to_string()))
}
