//! Terminal table of `zfactor flow`.

use crate::render::model_grid::Grid;
use crate::render::number::{fixed, sig};
use crate::report::flow::FlowReport;
use crate::shown_units::{is_field_base, standard_volume_unit, TemperatureScale};

/// The flow report as text.
pub fn table(r: &FlowReport) -> String {
    let mut out = format!("{}\n", r.fluid.label);
    out.push_str(&format!("flow {} ({})", r.input.flow, r.input.kind));
    let scale = TemperatureScale::of_option(r.input.temperature.as_deref());
    if let Some(b) = &r.input.base {
        out.push_str(&format!(
            ", base {} ({} {}, {} kPa)",
            b.id,
            fixed(scale.from_kelvin(b.temperature_k), 2),
            scale.label(),
            sig(b.pressure_pa / 1e3, 6)
        ));
    }
    out.push('\n');
    let res = &r.results;
    let ids: Vec<String> = res.iter().map(|m| m.model.clone()).collect();
    let mut g = Grid::new(&ids);
    g.compared(
        "mass flow",
        "kg/h",
        &res.iter().map(|m| Some(m.mass_flow)).collect::<Vec<_>>(),
        1.0 / 3600.0,
    );
    g.compared(
        "molar flow",
        "kmol/h",
        &res.iter()
            .map(|m| Some(m.molar_flow_mol_s))
            .collect::<Vec<_>>(),
        1.0 / 3.6,
    );
    if let Some(first) = res.first() {
        for (k, v) in first.volumes.iter().enumerate() {
            let flows = res
                .iter()
                .map(|m| m.volumes.get(k).map(|x| x.volume_flow_m3_s))
                .collect::<Vec<_>>();
            if v.base == "actual" {
                let at = match (&r.input.temperature, &r.input.pressure) {
                    (Some(t), Some(p)) => format!("{}, {}", t.trim(), p.trim()),
                    _ => format!(
                        "{} {}, {} kPa",
                        fixed(scale.from_kelvin(v.temperature_k), 2),
                        scale.label(),
                        sig(v.pressure_pa / 1e3, 6)
                    ),
                };
                let name = format!("actual volume flow at {at}");
                g.compared(&name, "m3/h", &flows, 1.0 / 3600.0);
            } else {
                let (unit, m3) = standard_volume_unit(&v.base);
                let name = format!("volume flow at base {}", v.base);
                g.compared(&name, &format!("{unit}/h"), &flows, m3 / 3600.0);
                if is_field_base(&v.base) {
                    g.nums(
                        "  in MMscfd",
                        "MMscf/d",
                        &res.iter()
                            .map(|m| m.volumes.get(k).map(|x| x.volume_flow_m3_s.value))
                            .collect::<Vec<_>>(),
                        1e6 * m3 / 86_400.0,
                    );
                }
            }
            g.nums(
                "  Z there",
                "-",
                &res.iter()
                    .map(|m| m.volumes.get(k).map(|x| x.z))
                    .collect::<Vec<_>>(),
                1.0,
            );
        }
    }
    out.push_str(&g.finish());
    let sum = &r.iso6976_summation;
    if sum.values.is_empty() {
        if let Some(why) = &sum.unavailable {
            out.push_str(&format!("ISO 6976 summation: not available ({why}).\n"));
        }
    } else {
        let parts: Vec<String> = sum
            .values
            .iter()
            .map(|v| format!("{:.0} degC {}", v.temperature_k - 273.15, sig(v.z, 6)))
            .collect();
        let confidence = sum
            .values
            .iter()
            .map(|v| v.confidence.as_str())
            .min_by_key(|c| match *c {
                "high" => 2,
                "medium" => 1,
                _ => 0,
            })
            .unwrap_or("high");
        out.push_str(&format!(
            "Z by the ISO 6976 summation method at 101.325 kPa: {} (factors recalled from \
             memory; lowest confidence {confidence}).\n",
            parts.join(", ")
        ));
    }
    out.push_str(
        "every volume states its base; Z at each base is the model's own (ideal gas: 1).\n",
    );
    out.push_str(crate::render::model_grid::IDEAL_ERROR_NOTE);
    out
}
