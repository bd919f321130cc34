//! `zfactor vessel`: what a vessel or cylinder holds, and what happens to it when it is
//! heated or cooled, drawn down, filled to a rating, topped up or vented.

use crate::cli::vessel_args::VesselArgs;
use crate::commands::jobs_common::{self as jc, ctx, per_model, Pair};
use crate::error::CliError;
use crate::feed_input;
use crate::report::jobs_common::{Compared, StateReport};
use crate::report::vessel::{
    Fill, Heating, TargetReport, UsableGas, VentPointReport, VentingReport, VesselInput,
    VesselReport, VesselResult,
};
use crate::shown_units::TemperatureScale;
use crate::units;
use eos::jobs::base_conditions::molar_volume;
use eos::jobs::vessel::{self, Target};
use eos::jobs::BaseConditions;
use eos::phase::Phase;
use eos::Model;

/// The inputs in SI.
struct Input {
    v: f64,
    t: f64,
    p: f64,
    base: BaseConditions,
    to_t: Option<f64>,
    draw: Option<(f64, f64)>,
    rated: Option<(f64, f64)>,
    target: Option<Target>,
    back: f64,
    vent: Option<f64>,
    mdmt: Option<f64>,
    steps: usize,
    /// The vent pressure and the MDMT as typed, and the temperature scale of the user, for
    /// messages.
    vent_text: String,
    mdmt_text: String,
    scale: TemperatureScale,
}

/// Computes the report.
pub fn run(args: &VesselArgs) -> Result<VesselReport, CliError> {
    let feed = feed_input::read_gas(&args.fluid, &args.gravity)?;
    let amb = jc::ambient(&args.shared.ambient)?;
    let t = jc::temperature(&args.temperature)?;
    let opt_t = |s: &Option<String>| s.as_deref().map(jc::temperature).transpose();
    let opt_p = |s: &Option<String>| s.as_deref().map(|x| jc::pressure(x, amb)).transpose();
    let input = Input {
        v: units::volume(&args.volume)?,
        t,
        p: jc::pressure(&args.pressure, amb)?,
        base: jc::base(&args.base, amb)?,
        to_t: opt_t(&args.to_temperature)?,
        draw: opt_p(&args.draw_to_pressure)?
            .map(|p| Ok::<_, CliError>((opt_t(&args.draw_to_temperature)?.unwrap_or(t), p)))
            .transpose()?,
        rated: match (
            opt_p(&args.rated_pressure)?,
            opt_t(&args.rated_temperature)?,
        ) {
            (Some(p), Some(tr)) => Some((p, tr)),
            _ => None,
        },
        target: match (&args.target_pressure, &args.target_mass) {
            (Some(_), _) => opt_p(&args.target_pressure)?.map(Target::Pressure),
            (None, Some(m)) => Some(Target::Mass(jc::mass(m, "--target-mass")?)),
            _ => None,
        },
        back: opt_p(&args.back_pressure)?.unwrap_or(amb),
        vent: opt_p(&args.vent_to)?,
        mdmt: opt_t(&args.mdmt)?,
        steps: args.vent_steps,
        vent_text: args.vent_to.clone().unwrap_or_default(),
        mdmt_text: args.mdmt.clone().unwrap_or_default(),
        scale: TemperatureScale::of_input(&args.temperature),
    };
    if input.vent.is_some_and(|p2| p2 >= input.p) {
        return Err(CliError::BadInput(format!(
            "--vent-to \"{}\" is not below the vessel pressure \"{}\"",
            args.vent_to.as_deref().unwrap_or(""),
            args.pressure
        )));
    }
    if !(1..=10_000).contains(&input.steps) {
        return Err(CliError::BadInput(format!(
            "--vent-steps {} is outside 1 to 10000",
            input.steps
        )));
    }
    let x = feed.mole.clone();
    let (results, mut warnings) = per_model(&args.shared.model, &feed, |pair| {
        let mut r = one(pair, &input, &x, feed.energy_known())?;
        let edge = jc::edge_notes(pair, &feed, &[("contents", &r.state)]);
        r.notes.extend(edge);
        Ok(r)
    })?;
    for r in &results {
        warnings.extend(jc::raised(&r.model, &r.notes));
    }
    Ok(VesselReport {
        tool: format!("zfactor {}", env!("CARGO_PKG_VERSION")),
        fluid: jc::fluid_report(&feed),
        input: VesselInput {
            volume: args.volume.clone(),
            temperature: args.temperature.clone(),
            pressure: args.pressure.clone(),
            volume_m3: input.v,
            temperature_k: input.t,
            pressure_pa: input.p,
            ambient_pressure_pa: amb,
        },
        base: input.base.into(),
        results,
        warnings,
        caution: crate::CAUTION,
    })
}

/// The inventory from a model explicit in (T, P) (Lee-Kesler, the gas-gravity correlations,
/// IF97): what the vessel holds needs only Z, n = P V / (Z R T), and its standard volume Z at
/// the base. The other operations follow the contents through heat and work, or solve for a
/// state, and are refused for these models.
fn inventory_only(
    pair: &Pair,
    inp: &Input,
    x: &[f64],
    energy: bool,
) -> Result<VesselResult, CliError> {
    let id = pair.built.id.as_str();
    let asked: Vec<&str> = [
        (inp.to_t.is_some(), "--to-temperature"),
        (inp.draw.is_some(), "--draw-to-pressure"),
        (inp.rated.is_some(), "--rated-pressure"),
        (inp.target.is_some(), "--target-pressure/--target-mass"),
        (inp.vent.is_some(), "--vent-to"),
    ]
    .into_iter()
    .filter_map(|(on, name)| on.then_some(name))
    .collect();
    if !asked.is_empty() {
        return Err(CliError::BadInput(format!(
            "model {id} gives Z at (T, P) only: it answers the inventory (mass, standard \
             volume), but {} needs a model with a Helmholtz energy (ideal, the cubic family, \
             their Peneloux forms, virial, reference, sw12)",
            asked.join(", ")
        )));
    }
    let e = ctx(id);
    let root = eos::state::RootChoice::LowestGibbs;
    let need = if energy {
        eos::need::Need::All
    } else {
        eos::need::Need::Volumetric
    };
    let st = pair
        .built
        .at_tp_need(inp.t, inp.p, x, root, need)
        .map_err(&e)?;
    let at_base = pair
        .built
        .at_tp_need(inp.base.t, inp.base.p, x, root, eos::need::Need::Volumetric)
        .map_err(&e)?;
    let inv_i = vessel::inventory(&pair.ideal, inp.v, inp.t, inp.p, x).map_err(&e)?;
    let (vb_i, _) = molar_volume(&pair.ideal, inp.base.t, inp.base.p, x).map_err(&e)?;
    let moles = inp.v * st.props.rho;
    let mass = moles * st.props.molar_mass;
    let standard = moles / at_base.props.rho;
    let mut notes = pair.built.notes.clone();
    notes.extend(st.warnings.iter().map(|w| format!("warning: {w}")));
    Ok(VesselResult {
        model: id.to_string(),
        model_name: pair.built.name.clone(),
        state: jc::explicit_state(&st, inp.t, inp.p),
        mass_kg: mass,
        mass_ideal_kg: inv_i.mass,
        mass_ideal_error_pct: Compared::new(mass, inv_i.mass).ideal_error_pct,
        moles_mol: moles,
        moles_ideal_mol: inv_i.moles,
        standard_volume_m3: standard,
        standard_volume_ideal_m3: inv_i.moles * vb_i,
        standard_volume_ideal_error_pct: Compared::new(standard, inv_i.moles * vb_i)
            .ideal_error_pct,
        heating: None,
        usable: None,
        fill: None,
        target: None,
        venting: None,
        notes,
    })
}

fn cmp(a: f64, b: f64) -> Compared {
    Compared::new(a, b)
}

fn one(pair: &Pair, inp: &Input, x: &[f64], energy: bool) -> Result<VesselResult, CliError> {
    let Some(m) = pair.built.helmholtz() else {
        return inventory_only(pair, inp, x, energy);
    };
    let ig: &dyn Model = &pair.ideal;
    let id = pair.built.id.as_str();
    let e = ctx(id);
    let inv = vessel::inventory(m, inp.v, inp.t, inp.p, x).map_err(&e)?;
    let inv_i = vessel::inventory(ig, inp.v, inp.t, inp.p, x).map_err(&e)?;
    if !(inv.mass.is_finite() && inv_i.mass.is_finite()) {
        return Err(CliError::BadInput(format!(
            "model {id}: the contents of {:e} m3 overflow a floating-point number; give the \
             vessel's real volume",
            inp.v
        )));
    }
    let (vb, base_state) = molar_volume(m, inp.base.t, inp.base.p, x).map_err(&e)?;
    let (vb_i, _) = molar_volume(ig, inp.base.t, inp.base.p, x).map_err(&e)?;
    let mut notes = pair.built.notes.clone();
    if matches!(
        base_state.phase,
        Phase::Liquid | Phase::TwoPhase | Phase::SaturatedLiquid
    ) {
        notes.push(format!(
            "warning: at the base conditions the fluid is {} with this model, so its \
             standard volume is that of a condensed fluid, not of a gas; a gas standard volume \
             is not meaningful for it",
            base_state.phase
        ));
    }
    if inv.state.phase == Phase::TwoPhase {
        notes.push(format!(
            "warning: the contents are two-phase at the given state (vapour mass fraction {:.4})",
            inv.state
                .split
                .as_ref()
                .map_or(f64::NAN, |s| s.vapor_mass_fraction)
        ));
    }
    let heating = match inp.to_t {
        Some(t2) => {
            let r = vessel::retemper(m, inp.v, inp.t, inp.p, t2, x).map_err(&e)?;
            let ri = vessel::retemper(ig, inp.v, inp.t, inp.p, t2, x).map_err(&e)?;
            if r.end.state.phase == Phase::TwoPhase {
                notes.push(format!(
                    "warning: at {t2:.2} K the contents condense: vapour mass fraction {:.4}",
                    r.end
                        .state
                        .split
                        .as_ref()
                        .map_or(f64::NAN, |s| s.vapor_mass_fraction)
                ));
            }
            Some(Heating {
                temperature_k: t2,
                pressure_pa: cmp(r.end.state.p, ri.end.state.p),
                end_state: StateReport::from(&r.end.state),
                mass_balance: r.mass_balance,
            })
        }
        None => None,
    };
    let usable = match inp.draw {
        Some((t2, p2)) => {
            let u = vessel::usable(m, inp.v, (inp.t, inp.p), (t2, p2), x).map_err(&e)?;
            let ui = vessel::usable(ig, inp.v, (inp.t, inp.p), (t2, p2), x).map_err(&e)?;
            Some(UsableGas {
                end_temperature_k: t2,
                end_pressure_pa: p2,
                mass_kg: cmp(u.mass, ui.mass),
                standard_volume_m3: cmp(u.moles * vb, ui.moles * vb_i),
                end_state: StateReport::from(&u.end.state),
            })
        }
        None => None,
    };
    let fill = match inp.rated {
        Some((pr, tr)) => {
            let f = vessel::fill_pressure(m, inp.t, pr, tr, x).map_err(&e)?;
            let fi = vessel::fill_pressure(ig, inp.t, pr, tr, x).map_err(&e)?;
            Some(Fill {
                rated_pressure_pa: pr,
                reference_temperature_k: tr,
                fill_temperature_k: inp.t,
                fill_pressure_pa: cmp(f.fill.p, fi.fill.p),
                fill_state: StateReport::from(&f.fill),
            })
        }
        None => None,
    };
    let target = match inp.target {
        Some(tg) => {
            let r = vessel::to_target(m, inp.v, inp.t, inp.p, tg, inp.back, x).map_err(&e)?;
            let ri = vessel::to_target(ig, inp.v, inp.t, inp.p, tg, inp.back, x).map_err(&e)?;
            let (kind, value) = match tg {
                Target::Pressure(p) => ("pressure", p),
                Target::Mass(kg) => ("mass", kg),
            };
            Some(TargetReport {
                target: kind,
                target_value: value,
                action: if r.delta_mass >= 0.0 { "add" } else { "vent" },
                delta_mass_kg: cmp(r.delta_mass, ri.delta_mass),
                end_pressure_pa: cmp(r.end.state.p, ri.end.state.p),
                end_state: StateReport::from(&r.end.state),
            })
        }
        None => None,
    };
    let venting = match inp.vent {
        Some(p2) => {
            let v = vessel::vent_isentropic(m, inp.v, inp.t, inp.p, p2, inp.steps, inp.mdmt, x)
                .map_err(&e)?;
            let vi = vessel::vent_isentropic(ig, inp.v, inp.t, inp.p, p2, inp.steps, inp.mdmt, x)
                .map_err(&e)?;
            let end = &v.path[v.path.len() - 1];
            let end_i = &vi.path[vi.path.len() - 1];
            if v.below_mdmt == Some(true) {
                notes.push(format!(
                    "warning: venting to {} cools the gas to {:.2} {}, below the minimum design \
                     metal temperature of {}",
                    inp.vent_text.trim(),
                    inp.scale.from_kelvin(v.t_min),
                    inp.scale.label(),
                    inp.mdmt_text.trim()
                ));
            }
            if end.state.phase == Phase::TwoPhase {
                notes.push(
                    "warning: the vented contents reach the two-phase region (liquid forms)"
                        .to_string(),
                );
            }
            Some(VentingReport {
                final_pressure_pa: p2,
                final_temperature_k: cmp(end.t, end_i.t),
                min_temperature_k: cmp(v.t_min, vi.t_min),
                mass_left_kg: cmp(v.mass_left, vi.mass_left),
                mass_vented_kg: cmp(v.mass_vented, vi.mass_vented),
                entropy_drift_j_mol_k: v.entropy_drift,
                mdmt_k: inp.mdmt,
                below_mdmt: v.below_mdmt,
                end_state: StateReport::from(&end.state),
                path: v
                    .path
                    .iter()
                    .map(|pt| VentPointReport {
                        pressure_pa: pt.p,
                        temperature_k: pt.t,
                        mass_kg: pt.mass,
                        phase: pt.state.phase.to_string(),
                    })
                    .collect(),
            })
        }
        None => None,
    };
    Ok(VesselResult {
        model: id.to_string(),
        model_name: pair.built.name.clone(),
        state: StateReport::from(&inv.state),
        mass_kg: inv.mass,
        mass_ideal_kg: inv_i.mass,
        mass_ideal_error_pct: Compared::new(inv.mass, inv_i.mass).ideal_error_pct,
        moles_mol: inv.moles,
        moles_ideal_mol: inv_i.moles,
        standard_volume_m3: inv.moles * vb,
        standard_volume_ideal_m3: inv_i.moles * vb_i,
        standard_volume_ideal_error_pct: Compared::new(inv.moles * vb, inv_i.moles * vb_i)
            .ideal_error_pct,
        heating,
        usable,
        fill,
        target,
        venting,
        notes,
    })
}
