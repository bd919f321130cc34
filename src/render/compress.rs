//! Terminal table of `zfactor compress`.

use crate::render::model_grid::Grid;
use crate::render::number::sig;
use crate::report::compress::CompressReport;
use crate::report::jobs_common::Compared;
use crate::shown_units::{pressure_as_typed, TemperatureScale};

/// The compressor report as text.
pub fn table(r: &CompressReport) -> String {
    let i = &r.input;
    let mut out = format!("{}\n", r.fluid.label);
    let scale = TemperatureScale::of_input(&i.suction_temperature);
    out.push_str(&format!(
        "suction {}, {}; discharge {}, ratio {}; {} efficiency {}\n",
        pressure_as_typed(&i.suction_pressure, i.suction_pressure_pa),
        i.suction_temperature.trim(),
        pressure_as_typed(&i.discharge_pressure, i.discharge_pressure_pa),
        sig(i.pressure_ratio, 4),
        i.efficiency_kind,
        sig(i.efficiency, 4)
    ));
    if let Some(f) = &i.flow {
        out.push_str(&format!("flow {f}"));
        if let Some(b) = &i.flow_base {
            out.push_str(&format!(
                " (base {}: {} K, {} kPa)",
                b.id,
                sig(b.temperature_k, 6),
                sig(b.pressure_pa / 1e3, 6)
            ));
        }
        out.push('\n');
    }
    let res = &r.results;
    let ids: Vec<String> = res.iter().map(|m| m.model.clone()).collect();
    let mut g = Grid::new(&ids);
    let col = |f: &dyn Fn(&crate::report::compress::CompressResult) -> Compared| {
        res.iter().map(|m| Some(f(m))).collect::<Vec<_>>()
    };
    let num = |f: &dyn Fn(&crate::report::compress::CompressResult) -> f64| {
        res.iter().map(|m| Some(f(m))).collect::<Vec<_>>()
    };
    g.compared_temperature(
        "discharge temperature",
        scale,
        &col(&|m| Compared::new(m.discharge_temperature_k, m.discharge_temperature_ideal_k)),
    );
    g.row(
        "  discharge phase",
        "",
        res.iter().map(|m| m.discharge.phase.clone()).collect(),
    );
    g.compared(
        "specific work h2 - h1",
        "kJ/kg",
        &col(&|m| Compared::new(m.specific_work_j_kg, m.specific_work_ideal_j_kg)),
        1e3,
    );
    g.compared(
        "isentropic head",
        "kJ/kg",
        &col(&|m| m.isentropic_head_j_kg),
        1e3,
    );
    g.compared(
        "polytropic head, path",
        "kJ/kg",
        &col(&|m| m.polytropic_head_path_j_kg),
        1e3,
    );
    g.compared(
        "polytropic head, Schultz",
        "kJ/kg",
        &col(&|m| m.polytropic_head_schultz_j_kg),
        1e3,
    );
    g.nums(
        "Schultz - path",
        "%",
        &num(&|m| m.schultz_minus_path_pct),
        1.0,
    );
    g.nums("Schultz f", "-", &num(&|m| m.schultz_f), 1.0);
    g.temperatures(
        "Schultz discharge T",
        scale,
        &num(&|m| m.schultz_discharge_temperature_k),
    );
    g.nums(
        "isentropic efficiency",
        "-",
        &num(&|m| m.isentropic_efficiency),
        1.0,
    );
    g.nums(
        "polytropic efficiency",
        "-",
        &num(&|m| m.polytropic_efficiency),
        1.0,
    );
    g.nums("Z suction", "-", &num(&|m| m.z_suction), 1.0);
    g.nums("Z discharge", "-", &num(&|m| m.z_discharge), 1.0);
    g.nums(
        "cp0/cv0 suction (ideal gas)",
        "-",
        &num(&|m| m.exponents_suction.ideal_cp_cv),
        1.0,
    );
    g.nums(
        "k_v suction",
        "-",
        &num(&|m| m.exponents_suction.isentropic_volume_exponent),
        1.0,
    );
    g.nums(
        "k_T suction",
        "-",
        &num(&|m| m.exponents_suction.isentropic_temperature_exponent),
        1.0,
    );
    g.nums(
        "k_v discharge",
        "-",
        &num(&|m| m.exponents_discharge.isentropic_volume_exponent),
        1.0,
    );
    g.nums(
        "k_T discharge",
        "-",
        &num(&|m| m.exponents_discharge.isentropic_temperature_exponent),
        1.0,
    );
    g.temperatures(
        "T2 shortcut, cp0/cv0",
        scale,
        &num(&|m| m.shortcuts[0].discharge_temperature_k),
    );
    g.temperatures(
        "T2 shortcut, mean k_T",
        scale,
        &num(&|m| m.shortcuts[1].discharge_temperature_k),
    );
    if res.iter().any(|m| m.power_w.is_some()) {
        let opt = |f: &dyn Fn(&crate::report::compress::CompressResult) -> Option<Compared>| {
            res.iter().map(f).collect::<Vec<_>>()
        };
        g.compared("mass flow", "kg/s", &opt(&|m| m.mass_flow_kg_s), 1.0);
        g.compared(
            "actual inlet flow",
            "m3/h",
            &opt(&|m| m.actual_inlet_flow_m3_s),
            1.0 / 3600.0,
        );
        g.compared("power (gas)", "kW", &opt(&|m| m.power_w), 1e3);
    }
    out.push_str(&g.finish());
    for line in crate::render::notes::grouped(
        res.iter().map(|m| (m.model.as_str(), m.notes.as_slice())),
        |n| n.starts_with("warning: "),
    ) {
        out.push_str(&format!("{line}\n"));
    }
    if let Some(m) = res.first() {
        out.push_str(&format!("method: {}\n", m.method));
    }
    out.push_str(crate::render::model_grid::IDEAL_ERROR_NOTE);
    out
}
