//! Terminal tables of `zfactor process` and `zfactor relief`.

use crate::render::model_grid::Grid;
use crate::report::jobs_common::Compared;
use crate::report::process::{ProcessReport, ProcessResult};
use crate::report::relief::ReliefReport;
use crate::shown_units::{pressure_as_typed, TemperatureScale};
use crate::units::PA_PER_BAR;

/// The process report as text.
pub fn table(r: &ProcessReport) -> String {
    let i = &r.input;
    let mut out = format!("{}\n", r.fluid.label);
    let scale = TemperatureScale::of_input(&i.temperature);
    out.push_str(&format!(
        "{} path from {}, {} to {}\n",
        i.path,
        i.temperature.trim(),
        pressure_as_typed(&i.pressure, i.pressure_pa),
        match (&i.to_temperature, &i.to_pressure, i.end_pressure_pa) {
            (Some(t), _, _) => t.trim().to_string(),
            (_, Some(p), Some(pa)) => pressure_as_typed(p, pa),
            _ => "-".to_string(),
        }
    ));
    let res = &r.results;
    let ids: Vec<String> = res.iter().map(|m| m.model.clone()).collect();
    let mut g = Grid::new(&ids);
    let col =
        |f: &dyn Fn(&ProcessResult) -> Compared| res.iter().map(|m| Some(f(m))).collect::<Vec<_>>();
    g.row(
        "start phase",
        "",
        res.iter().map(|m| m.start.phase.clone()).collect(),
    );
    g.row(
        "end phase",
        "",
        res.iter().map(|m| m.end.phase.clone()).collect(),
    );
    g.compared_temperature("end temperature", scale, &col(&|m| m.end_temperature_k));
    g.compared(
        "end pressure",
        "bar abs",
        &col(&|m| m.end_pressure_pa),
        PA_PER_BAR,
    );
    g.compared("temperature change", "K", &col(&|m| m.delta_t_k), 1.0);
    g.compared("heat in", "kJ/kg", &col(&|m| m.heat_j_kg), 1e3);
    g.compared(
        "work out (closed system)",
        "kJ/kg",
        &col(&|m| m.work_j_kg),
        1e3,
    );
    g.compared(
        "work out (steady flow)",
        "kJ/kg",
        &col(&|m| m.flow_work_j_kg),
        1e3,
    );
    g.compared("delta u", "kJ/kg", &col(&|m| m.delta_u_j_kg), 1e3);
    g.compared("delta h", "kJ/kg", &col(&|m| m.delta_h_j_kg), 1e3);
    g.compared("delta s", "kJ/(kg K)", &col(&|m| m.delta_s_j_kg_k), 1e3);
    g.nums(
        "end vapour mass fraction",
        "-",
        &res.iter()
            .map(|m| m.end.vapor_mass_fraction)
            .collect::<Vec<_>>(),
        1.0,
    );
    out.push_str(&g.finish());
    out.push_str(&format!("sign convention: {}.\n", i.convention));
    out.push_str(crate::render::model_grid::IDEAL_ERROR_NOTE);
    out
}

/// The relief report as text.
pub fn relief(r: &ReliefReport) -> String {
    let i = &r.input;
    let mut out = format!("{}\n", r.fluid.label);
    out.push_str(&format!(
        "relieving conditions {}, {}\n",
        i.temperature.trim(),
        pressure_as_typed(&i.pressure, i.pressure_pa)
    ));
    let res = &r.results;
    let ids: Vec<String> = res.iter().map(|m| m.model.clone()).collect();
    let mut g = Grid::new(&ids);
    g.row(
        "phase",
        "",
        res.iter().map(|m| m.state.phase.clone()).collect(),
    );
    g.compared(
        "Z",
        "-",
        &res.iter().map(|m| Some(m.z)).collect::<Vec<_>>(),
        1.0,
    );
    g.compared(
        "isentropic exponent k",
        "-",
        &res.iter()
            .map(|m| Some(m.isentropic_exponent))
            .collect::<Vec<_>>(),
        1.0,
    );
    g.compared(
        "critical pressure ratio",
        "-",
        &res.iter()
            .map(|m| Some(m.critical_pressure_ratio))
            .collect::<Vec<_>>(),
        1.0,
    );
    g.compared(
        "C (API 520, SI)",
        "-",
        &res.iter()
            .map(|m| Some(m.sizing_coefficient_c))
            .collect::<Vec<_>>(),
        1.0,
    );
    g.nums(
        "molar mass",
        "g/mol",
        &res.iter()
            .map(|m| Some(m.molar_mass_kg_mol))
            .collect::<Vec<_>>(),
        1e-3,
    );
    g.row(
        &format!("Z outside {}-{}", i.z_range.0, i.z_range.1),
        "",
        res.iter()
            .map(|m| {
                if m.z_outside_range {
                    "YES".into()
                } else {
                    "no".into()
                }
            })
            .collect(),
    );
    out.push_str(&g.finish());
    out.push_str(
        "k: the model's real-gas -(v/P)(dP/dv)_s; its ideal-gas row is cp0/cv0 at the same T.\n\
         critical pressure ratio (2/(k+1))^(k/(k-1)) and C = 0.03948 sqrt(k (2/(k+1))^((k+1)/(k-1)))\n\
         from each k; C is for A = W / (C Kd P1 Kb Kc) sqrt(T Z / M), A mm2, W kg/h, P1 kPa abs,\n\
         T K, M kg/kmol (API 520 Part I; 520 x the root in US units).\n\
         Z outside the range: the ideal-gas sizing equations, with Z as a correction, lose\n\
         accuracy there (common practice); size with a real-gas method.\n",
    );
    out
}
