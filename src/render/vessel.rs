//! Terminal table of `zfactor vessel`.

use crate::render::model_grid::Grid;
use crate::render::number::{fixed, sig};
use crate::report::vessel::VesselReport;
use crate::shown_units::{pressure_as_typed, standard_volume_unit, TemperatureScale};
use crate::units::PA_PER_BAR;

/// The vessel report as text.
pub fn table(r: &VesselReport) -> String {
    let mut out = format!("{}\n", r.fluid.label);
    let i = &r.input;
    let scale = TemperatureScale::of_input(&i.temperature);
    let (sv, m3_per_sv) = standard_volume_unit(&r.base.id);
    out.push_str(&format!(
        "vessel {} at {}, {}; {sv} at {} ({} {}, {} kPa)\n",
        i.volume.trim(),
        i.temperature.trim(),
        pressure_as_typed(&i.pressure, i.pressure_pa),
        r.base.id,
        fixed(scale.from_kelvin(r.base.temperature_k), 2),
        scale.label(),
        sig(r.base.pressure_pa / 1e3, 6)
    ));
    let res = &r.results;
    let ids: Vec<String> = res.iter().map(|m| m.model.clone()).collect();
    let mut g = Grid::new(&ids);
    g.row(
        "phase",
        "",
        res.iter().map(|m| m.state.phase.clone()).collect(),
    );
    g.nums(
        "Z",
        "-",
        &res.iter().map(|m| Some(m.state.z)).collect::<Vec<_>>(),
        1.0,
    );
    let c = |v: f64, i: f64| Some(crate::report::jobs_common::Compared::new(v, i));
    g.compared(
        "mass",
        "kg",
        &res.iter()
            .map(|m| c(m.mass_kg, m.mass_ideal_kg))
            .collect::<Vec<_>>(),
        1.0,
    );
    g.compared(
        "standard volume",
        sv,
        &res.iter()
            .map(|m| c(m.standard_volume_m3, m.standard_volume_ideal_m3))
            .collect::<Vec<_>>(),
        m3_per_sv,
    );
    if res.iter().any(|m| m.heating.is_some()) {
        let t2 = res
            .iter()
            .find_map(|m| m.heating.as_ref())
            .map_or(0.0, |h| h.temperature_k);
        g.compared(
            &format!(
                "pressure at {} {}",
                fixed(scale.from_kelvin(t2), 2),
                scale.label()
            ),
            "bar abs",
            &res.iter()
                .map(|m| m.heating.as_ref().map(|h| h.pressure_pa))
                .collect::<Vec<_>>(),
            PA_PER_BAR,
        );
        g.row(
            "  phase there",
            "",
            res.iter()
                .map(|m| {
                    m.heating
                        .as_ref()
                        .map_or("-".into(), |h| h.end_state.phase.clone())
                })
                .collect(),
        );
        g.nums(
            "  vapour mass fraction",
            "-",
            &res.iter()
                .map(|m| {
                    m.heating
                        .as_ref()
                        .and_then(|h| h.end_state.vapor_mass_fraction)
                })
                .collect::<Vec<_>>(),
            1.0,
        );
    }
    if res.iter().any(|m| m.usable.is_some()) {
        g.compared(
            "usable gas",
            "kg",
            &res.iter()
                .map(|m| m.usable.as_ref().map(|u| u.mass_kg))
                .collect::<Vec<_>>(),
            1.0,
        );
        g.compared(
            "usable gas, standard volume",
            sv,
            &res.iter()
                .map(|m| m.usable.as_ref().map(|u| u.standard_volume_m3))
                .collect::<Vec<_>>(),
            m3_per_sv,
        );
    }
    if res.iter().any(|m| m.fill.is_some()) {
        g.compared(
            "fill pressure now",
            "bar abs",
            &res.iter()
                .map(|m| m.fill.as_ref().map(|f| f.fill_pressure_pa))
                .collect::<Vec<_>>(),
            PA_PER_BAR,
        );
    }
    if res.iter().any(|m| m.target.is_some()) {
        g.compared(
            "mass to add (+) / vent (-)",
            "kg",
            &res.iter()
                .map(|m| m.target.as_ref().map(|t| t.delta_mass_kg))
                .collect::<Vec<_>>(),
            1.0,
        );
    }
    if res.iter().any(|m| m.venting.is_some()) {
        let v = |f: &dyn Fn(
            &crate::report::vessel::VentingReport,
        ) -> crate::report::jobs_common::Compared| {
            res.iter()
                .map(|m| m.venting.as_ref().map(f))
                .collect::<Vec<_>>()
        };
        g.compared_temperature(
            "vented: final gas temperature",
            scale,
            &v(&|x| x.final_temperature_k),
        );
        g.compared_temperature(
            "vented: lowest temperature",
            scale,
            &v(&|x| x.min_temperature_k),
        );
        g.compared("vented: mass left", "kg", &v(&|x| x.mass_left_kg), 1.0);
        g.row(
            "  below MDMT",
            "",
            res.iter()
                .map(|m| {
                    m.venting
                        .as_ref()
                        .and_then(|x| x.below_mdmt)
                        .map_or(
                            "-".to_string(),
                            |b| if b { "YES".into() } else { "no".into() },
                        )
                })
                .collect(),
        );
    }
    out.push_str(&g.finish());
    for line in crate::render::notes::grouped(
        res.iter().map(|m| (m.model.as_str(), m.notes.as_slice())),
        |n| n.starts_with("warning: "),
    ) {
        out.push_str(&format!("{line}\n"));
    }
    out.push_str(crate::render::model_grid::IDEAL_ERROR_NOTE);
    out
}
