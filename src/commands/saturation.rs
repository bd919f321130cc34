//! `zfactor saturation`: the saturation state of a pure fluid at a temperature or a pressure,
//! for each requested model (the cubics and, where the fluid has one, its reference or 12-term
//! Helmholtz formulation), through `eos::pure`.

use crate::cli::saturation_args::SaturationArgs;
use crate::commands::each_model::{self, Answers};
use crate::error::{from_pure, CliError};
use crate::feed::Feed;
use crate::feed_input;
use crate::report::saturation::{
    SaturatedPhase, SaturationInput, SaturationReport, SaturationResult,
};
use crate::units;
use eos::cubic::{Cubic, CubicKind};
use eos::helmholtz::{reference_for, technical_for, HelmholtzFluid};
use eos::properties::Properties;
use eos::pure::{PureError, PureFluid, SatState};

/// Model ids of this command, cubics first.
pub const IDS: [&str; 7] = ["vdw", "rk", "srk", "pr", "pr78", "reference", "sw12"];

/// A pure-fluid model with its names.
struct Built {
    id: String,
    name: String,
    citation: String,
    reference_state: String,
    fluid: Box<dyn PureFluid>,
}

fn helmholtz_for(id: &str, feed: &Feed) -> Option<HelmholtzFluid> {
    let r = feed.records[0];
    let find = |name: &str| match id {
        "reference" => reference_for(name),
        _ => technical_for(name),
    };
    find(&r.id).or_else(|| find(&r.name))
}

fn build(id: &str, feed: &Feed) -> Result<Option<Built>, CliError> {
    if let Some(kind) = CubicKind::from_id(id) {
        let cubic = Cubic::new(kind, &feed.components(), None)
            .map_err(|e| crate::error::from_eos(&format!("building model {id}"), e))?;
        let spec = kind.spec();
        return Ok(Some(Built {
            id: id.to_string(),
            name: spec.name.to_string(),
            citation: spec.citation.to_string(),
            reference_state: feed.caloric_zero(),
            fluid: Box::new(cubic),
        }));
    }
    Ok(helmholtz_for(id, feed).map(|h| {
        let f = h.formulation();
        Built {
            id: id.to_string(),
            name: f.title.to_string(),
            citation: f.title.to_string(),
            reference_state: feed.caloric_zero(),
            fluid: Box::new(h),
        }
    }))
}

/// The requested ids ("all": every cubic, and the formulations the fluid has).
fn resolve(spec: &str) -> Result<(Vec<String>, bool), CliError> {
    let spec = spec.trim();
    if spec.eq_ignore_ascii_case("all") {
        return Ok((IDS.iter().map(|s| s.to_string()).collect(), true));
    }
    let mut ids = Vec::new();
    for part in spec.split(',').map(str::trim).filter(|s| !s.is_empty()) {
        let id = part.to_ascii_lowercase();
        if !IDS.contains(&id.as_str()) {
            return Err(CliError::BadInput(format!(
                "unknown model \"{part}\" for saturation; known models: {}, or all",
                IDS.join(", ")
            )));
        }
        if !ids.contains(&id) {
            ids.push(id);
        }
    }
    if ids.is_empty() {
        return Err(CliError::BadInput(format!(
            "--model \"{spec}\" names no model; known models: {}, or all",
            IDS.join(", ")
        )));
    }
    Ok((ids, false))
}

fn phase(p: &Properties, m: f64) -> SaturatedPhase {
    SaturatedPhase {
        molar_density_mol_m3: p.rho,
        mass_density_kg_m3: p.rho * m,
        specific_volume_m3_kg: 1.0 / (p.rho * m),
        z: p.z,
        enthalpy_j_mol: p.h,
        enthalpy_j_kg: p.h / m,
        entropy_j_mol_k: p.s,
        entropy_j_kg_k: p.s / m,
    }
}

/// Computes the saturation state with every requested model.
pub fn run(args: &SaturationArgs) -> Result<SaturationReport, CliError> {
    let feed = feed_input::read(&args.fluid)?;
    if !feed.is_pure() {
        return Err(CliError::BadInput(format!(
            "saturation is for a pure fluid, but {} was given; use --fluid NAME, or for a \
             mixture's bubble and dew points `zfactor flash --mix ... --bubble-pressure` or \
             --dew-pressure at a temperature, --bubble-temperature or --dew-temperature at a \
             pressure (and `zfactor envelope` for the whole curve)",
            feed.label()
        )));
    }
    let ambient = units::ambient_pressure(&args.ambient)?;
    let (t, p) = units::optional_tp(
        args.temperature.as_deref(),
        args.pressure.as_deref(),
        ambient,
    )?;
    if t.is_some() == p.is_some() {
        return Err(CliError::BadInput(
            "give exactly one of --temperature (for the saturation pressure) and --pressure \
             (for the saturation temperature)"
                .to_string(),
        ));
    }
    let (ids, all) = resolve(&args.model)?;
    // "all" stands for the models that have this fluid.
    let ids: Vec<String> = ids
        .into_iter()
        .filter(|id| !all || build(id, &feed).ok().flatten().is_some())
        .collect();
    let Answers {
        results,
        mut warnings,
    } = each_model::run(&ids, |id| {
        let Some(built) = build(id, &feed)? else {
            return Err(CliError::BadInput(format!(
                "{} has no {} formulation here; models for it: {}",
                feed.label(),
                if id == "reference" {
                    "reference"
                } else {
                    "12-term (sw12)"
                },
                IDS.iter()
                    .filter(|i| build(i, &feed).ok().flatten().is_some())
                    .copied()
                    .collect::<Vec<_>>()
                    .join(", ")
            )));
        };
        let ctx = format!("model {}", built.id);
        let f = built.fluid.as_ref();
        let sat: SatState = match (t, p) {
            (Some(t), _) => f.saturation_t(t),
            (_, Some((p, _))) => f.saturation_p(p),
            _ => unreachable_pair(),
        }
        .map_err(|e| from_pure(&ctx, e))?;
        let finite = [
            sat.t,
            sat.p,
            sat.liquid.rho,
            sat.vapor.rho,
            sat.liquid.h,
            sat.vapor.h,
            sat.liquid.s,
            sat.vapor.s,
        ]
        .iter()
        .all(|v| v.is_finite());
        if !finite {
            return Err(CliError::Computation(format!(
                "{ctx} gave a non-finite saturation property"
            )));
        }
        // Molar mass of the model where it carries its own (the formulations).
        let mm = f.molar_mass();
        Ok(SaturationResult {
            model: built.id,
            model_name: built.name,
            citation: built.citation,
            temperature_k: sat.t,
            pressure_pa: sat.p,
            liquid: phase(&sat.liquid, mm),
            vapor: phase(&sat.vapor, mm),
            latent_heat_j_mol: sat.latent_heat(),
            latent_heat_j_kg: sat.latent_heat() / mm,
            reference_state: built.reference_state,
        })
    })?;
    // Below the triple point the liquid-vapour equilibrium a model computes is metastable.
    if let Some(tt) = crate::solid_check::triple_point(&feed) {
        for r in results.iter().filter(|r| r.temperature_k < tt) {
            warnings.push(format!(
                "{}: the saturation state at {} K is below the triple point of {} ({tt} K): \
                 there the liquid is metastable and the stable equilibrium is solid-vapour \
                 (sublimation), which no model here describes",
                r.model,
                r.temperature_k,
                feed.label()
            ));
        }
    }
    Ok(SaturationReport {
        tool: format!("zfactor {}", env!("CARGO_PKG_VERSION")),
        fluid: feed.label(),
        input: SaturationInput {
            given: if t.is_some() { "T" } else { "P" },
            temperature: args.temperature.clone(),
            pressure: args.pressure.clone(),
            temperature_k: t,
            pressure_pa: p.map(|p| p.0),
            pressure_is_gauge: p.is_some_and(|p| p.1),
            ambient_pressure_pa: ambient,
        },
        results,
        warnings,
        caution: crate::CAUTION,
    })
}

/// Exactly one of T and P is present after the check above; this arm cannot be reached, and
/// answers with a bad-input error rather than a panic should it ever be.
fn unreachable_pair() -> Result<SatState, PureError> {
    Err(PureError::UnsupportedPair {
        given: "neither or both of T and P".to_string(),
    })
}

/// Computes and prints.
pub fn run_and_render(args: &SaturationArgs) -> Result<crate::exit::Exit, CliError> {
    let report = run(args)?;
    crate::render::output::render(&report, args.format)?;
    Ok(super::exit_for(&report.warnings))
}
