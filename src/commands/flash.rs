//! `zfactor flash`: the equilibrium state of a mixture at (T, P), (P, h) or (P, s), or its
//! bubble or dew point at T or P, for each requested model with a Helmholtz energy.
//!
//! The solvers are the library's ([`eos::equilibrium::flash`], [`eos::equilibrium::bubble`],
//! [`eos::equilibrium::dew`]); this command checks the input, reports each phase and, when no
//! bubble or dew point exists, traces the envelope ([`eos::equilibrium::envelope`]) to say
//! why (beyond the cricondenbar or the cricondentherm) as bad input.

use crate::cli::FlashArgs;
use crate::commands::cp_range;
use crate::commands::each_model::{self, Answers};
use crate::error::{from_eos, CliError};
use crate::exit::Exit;
use crate::feed::{self, Feed};
use crate::feed_input;
use crate::models::{self, BuiltModel};
use crate::report::flash::{FlashInput, FlashPhase, FlashReport, FlashResultReport};
use crate::report::state::ComponentFraction;
use crate::units::{self, PA_PER_BAR};
use eos::equilibrium::{
    bubble, dew, envelope, flash, EnvelopeOptions, FlashResult, SaturationPoint, Side,
};
use eos::properties::{evaluate, Properties};
use eos::Model;

/// Models without a liquid root: the ideal gas and the virial equation truncated after B.
pub const GAS_ONLY: [&str; 2] = ["ideal", "virial"];

/// What fixes the state, in SI.
#[derive(Debug, Clone, Copy)]
pub enum Spec {
    /// T (K), P (Pa).
    Tp(f64, f64),
    /// P (Pa), h (J/mol).
    Ph(f64, f64),
    /// P (Pa), s (J/(mol K)).
    Ps(f64, f64),
    /// A bubble or dew point at T (K).
    PointAtT(Side, f64),
    /// A bubble or dew point at P (Pa).
    PointAtP(Side, f64),
}

impl Spec {
    fn mode(self) -> &'static str {
        match self {
            Spec::Tp(..) => "T,P",
            Spec::Ph(..) => "P,h",
            Spec::Ps(..) => "P,s",
            Spec::PointAtT(Side::Bubble, _) => "bubble-pressure",
            Spec::PointAtT(Side::Dew, _) => "dew-pressure",
            Spec::PointAtP(Side::Bubble, _) => "bubble-temperature",
            Spec::PointAtP(Side::Dew, _) => "dew-temperature",
        }
    }
}

/// Runs the command and prints its report.
pub fn dispatch(args: &FlashArgs) -> Result<Exit, CliError> {
    let report = run(args)?;
    crate::render::output::render(&report, args.format)?;
    Ok(crate::commands::exit_for(&report.warnings))
}

/// The message for a pure fluid given to flash.
fn pure_fluid(feed: &Feed) -> CliError {
    CliError::BadInput(format!(
        "flash needs a mixture (--mix \"a=x,b=y\"); {} is a pure fluid, whose liquid and vapour \
         coexist only on its vapour-pressure curve: see `zfactor envelope --fluid {}` for the \
         curve and `zfactor state` for a single-phase state",
        feed.records[0].name, feed.records[0].id
    ))
}

/// Refuses a temperature below the triple point of every component, when every component
/// has a triple point on record (otherwise nothing is known and nothing is checked).
pub fn check_triple_points(feed: &Feed, t: f64, what: &str) -> Result<(), CliError> {
    let triples: Option<Vec<f64>> = feed.records.iter().map(|r| r.ttriple_k).collect();
    let Some(triples) = triples else {
        return Ok(());
    };
    let lowest = triples.iter().copied().fold(f64::INFINITY, f64::min);
    if t < lowest {
        let list: Vec<String> = feed
            .records
            .iter()
            .zip(&triples)
            .map(|(r, tt)| format!("{} {tt} K", r.name))
            .collect();
        return Err(CliError::BadInput(format!(
            "{what} T = {t:.3} K is below the triple point of every component ({}): the \
             mixture would be solid there, which no model of zfactor represents",
            list.join(", ")
        )));
    }
    Ok(())
}

/// Reads the specification from the arguments.
fn spec(args: &FlashArgs, feed: &Feed, ambient: f64) -> Result<Spec, CliError> {
    let (t, p) = units::optional_tp(
        args.temperature.as_deref(),
        args.pressure.as_deref(),
        ambient,
    )?;
    let p = p.map(|(pa, _gauge)| pa);
    let mm = feed.molar_mass();
    let h = args
        .enthalpy
        .as_deref()
        .map(crate::energy_units::enthalpy)
        .transpose()?
        .map(|v| v.molar(mm));
    let s = args
        .entropy
        .as_deref()
        .map(crate::energy_units::entropy)
        .transpose()?
        .map(|v| v.molar(mm));
    let need = |what: &str| CliError::BadInput(what.to_string());
    if args.bubble_pressure || args.dew_pressure {
        let side = if args.bubble_pressure {
            Side::Bubble
        } else {
            Side::Dew
        };
        let t = t.ok_or_else(|| need("--bubble-pressure and --dew-pressure need --temperature"))?;
        return Ok(Spec::PointAtT(side, t));
    }
    if args.bubble_temperature || args.dew_temperature {
        let side = if args.bubble_temperature {
            Side::Bubble
        } else {
            Side::Dew
        };
        let p =
            p.ok_or_else(|| need("--bubble-temperature and --dew-temperature need --pressure"))?;
        return Ok(Spec::PointAtP(side, p));
    }
    match (t, p, h, s) {
        (Some(t), Some(p), None, None) => Ok(Spec::Tp(t, p)),
        (None, Some(p), Some(h), None) => Ok(Spec::Ph(p, h)),
        (None, Some(p), None, Some(s)) => Ok(Spec::Ps(p, s)),
        (None, None, Some(_), None) | (None, None, None, Some(_)) => Err(need(
            "--enthalpy and --entropy need --pressure: the flash is at (P, h) or (P, s)",
        )),
        _ => Err(need(
            "give --temperature and --pressure, or --pressure with --enthalpy or --entropy, or \
             --temperature with --bubble-pressure or --dew-pressure, or --pressure with \
             --bubble-temperature or --dew-temperature",
        )),
    }
}

/// Computes the flash (or the saturation point) with every requested model.
pub fn run(args: &FlashArgs) -> Result<FlashReport, CliError> {
    let feed = feed_input::read(&args.fluid)?;
    if feed.is_pure() {
        return Err(pure_fluid(&feed));
    }
    let ambient = units::ambient_pressure(&args.ambient)?;
    let spec = spec(args, &feed, ambient)?;
    if let Spec::Tp(t, _) | Spec::PointAtT(_, t) = spec {
        check_triple_points(&feed, t, "the temperature")?;
    }
    let mut ids = models::resolve_ids(&args.model, &feed)?;
    if args.model.trim().eq_ignore_ascii_case("all") {
        // "all" means every model that can show two phases: the ideal gas never condenses.
        ids.retain(|id| id != "ideal");
    }
    if matches!(spec, Spec::PointAtT(..) | Spec::PointAtP(..)) {
        if let Some(id) = ids.iter().find(|id| GAS_ONLY.contains(&id.as_str())) {
            return Err(CliError::BadInput(format!(
                "model {id} describes the gas only (it has no liquid root), so it has no \
                 bubble or dew points; choose a model such as pr or srk"
            )));
        }
    }
    let Answers {
        results,
        mut warnings,
    } = each_model::run(&ids, |id| {
        let b = models::build(id, &feed)?;
        if b.helmholtz().is_none() {
            return Err(CliError::BadInput(format!(
                "model {id} ({}) answers at given (T, P) only and has no Helmholtz energy, so \
                 it gives no fugacities and no phase equilibrium; choose a model with one: \
                 ideal, vdw, rk, srk, pr, pr78, srk-pen, pr-pen, pr78-pen or virial",
                b.name
            )));
        }
        let found = compute(&b, &feed, spec)?;
        for r in &found {
            check_triple_points(&feed, r.temperature_k, "the state found lies at")?;
        }
        Ok(found)
    })?;
    // A model may give two bubble or dew points (both branches of a retrograde curve).
    let mut results: Vec<FlashResultReport> = results.into_iter().flatten().collect();
    // The split at (T, P) and the bubble and dew points do not depend on the ideal-gas heat
    // capacity; only the (P, h) and (P, s) flashes do. Elsewhere its extrapolation is a
    // note on the printed h and s, not a warning about the answer.
    let energy_spec = matches!(spec, Spec::Ph(..) | Spec::Ps(..));
    for r in &mut results {
        let (mut notes, mut more) = cp_range::extrapolation(
            &feed,
            r.temperature_k,
            "enthalpy and entropy are less certain (the phase split at given T and P is not affected)",
        );
        if !energy_spec {
            notes.append(&mut more);
        }
        r.notes.extend(notes);
        let freeze = crate::solid_check::freeze_out(&feed, r.temperature_k);
        for w in more.into_iter().chain(freeze) {
            if !warnings.contains(&w) {
                warnings.push(w);
            }
        }
    }
    let (t_in, p_in, h_in, s_in) = match spec {
        Spec::Tp(t, p) => (Some(t), Some(p), None, None),
        Spec::Ph(p, h) => (None, Some(p), Some(h), None),
        Spec::Ps(p, s) => (None, Some(p), None, Some(s)),
        Spec::PointAtT(_, t) => (Some(t), None, None, None),
        Spec::PointAtP(_, p) => (None, Some(p), None, None),
    };
    Ok(FlashReport {
        tool: format!("zfactor {}", env!("CARGO_PKG_VERSION")),
        fluid: feed.label(),
        input: FlashInput {
            mode: spec.mode(),
            temperature: args.temperature.clone(),
            pressure: args.pressure.clone(),
            enthalpy: args.enthalpy.clone(),
            entropy: args.entropy.clone(),
            temperature_k: t_in,
            pressure_pa: p_in,
            enthalpy_j_mol: h_in,
            entropy_j_mol_k: s_in,
            ambient_pressure_pa: ambient,
            basis: feed::basis_name(feed.basis),
            normalized_from: feed.normalized_from,
        },
        composition: crate::commands::state::composition_rows(&feed),
        results,
        warnings,
        caution: crate::CAUTION,
    })
}

/// One model's answer: one state, or every bubble or dew point at the given T or P (two
/// where the curve is retrograde, labelled by branch).
fn compute(
    built: &BuiltModel,
    feed: &Feed,
    spec: Spec,
) -> Result<Vec<FlashResultReport>, CliError> {
    let Some(m) = built.helmholtz() else {
        return Err(CliError::BadInput(format!(
            "model {} has no Helmholtz energy",
            built.id
        )));
    };
    let z = &feed.mole;
    let ctx = format!("model {}", built.id);
    let err = |e| from_eos(&ctx, e);
    let result = match spec {
        Spec::Tp(t, p) => {
            let f = flash::tp(m, t, p, z).map_err(err)?;
            from_flash(built, m, feed, &f)
        }
        Spec::Ph(p, h) => {
            let f = flash::ph(m, p, h, z).map_err(err)?;
            from_flash(built, m, feed, &f.flash)
        }
        Spec::Ps(p, s) => {
            let f = flash::ps(m, p, s, z).map_err(err)?;
            from_flash(built, m, feed, &f.flash)
        }
        Spec::PointAtT(side, t) => {
            let r = match side {
                Side::Bubble => bubble::pressures(m, t, z),
                Side::Dew => dew::pressures(m, t, z),
            };
            return points(built, m, feed, spec, r);
        }
        Spec::PointAtP(side, p) => {
            let r = match side {
                Side::Bubble => bubble::temperatures(m, p, z),
                Side::Dew => dew::temperatures(m, p, z),
            };
            return points(built, m, feed, spec, r);
        }
    };
    check_finite(&result)?;
    Ok(vec![result])
}

/// The bubble or dew points found at the given T or P, each labelled by its branch when
/// there are two ("lower" and "upper" in the free variable), or why there is none.
fn points(
    built: &BuiltModel,
    m: &dyn Model,
    feed: &Feed,
    spec: Spec,
    found: eos::Result<Vec<SaturationPoint>>,
) -> Result<Vec<FlashResultReport>, CliError> {
    let found = found.map_err(|e| diagnose(built, m, &feed.mole, spec, e))?;
    let n = found.len();
    let mut out = Vec::with_capacity(n);
    for (k, sp) in found.iter().enumerate() {
        let mut r = from_point(built, m, feed, sp);
        if n > 1 {
            r.branch = Some(match (k, n) {
                (0, _) => "lower".to_string(),
                (k, n) if k + 1 == n => "upper".to_string(),
                (k, _) => format!("middle {k}"),
            });
        }
        check_finite(&r)?;
        out.push(r);
    }
    Ok(out)
}

/// Why a bubble or dew point was not found: beyond the extent of its branch of the envelope
/// (bad input), or a solver failure.
fn diagnose(built: &BuiltModel, m: &dyn Model, z: &[f64], spec: Spec, e: eos::Error) -> CliError {
    let ctx = format!("model {}", built.id);
    if !matches!(
        e,
        eos::Error::NoSolution(_) | eos::Error::NotConverged { .. }
    ) {
        return from_eos(&ctx, e);
    }
    let Ok(env) = envelope::trace(m, z, EnvelopeOptions::default()) else {
        return from_eos(&ctx, e);
    };
    let side_of = |vf: f64| if vf < 0.5 { Side::Bubble } else { Side::Dew };
    let (side, name) = match spec {
        Spec::PointAtT(s, _) | Spec::PointAtP(s, _) => (
            s,
            match s {
                Side::Bubble => "bubble",
                Side::Dew => "dew",
            },
        ),
        _ => return from_eos(&ctx, e),
    };
    let branch: Vec<_> = env
        .points
        .iter()
        .filter(|pt| side_of(pt.vapor_fraction) == side)
        .collect();
    let t_max = branch.iter().map(|pt| pt.t).fold(f64::NAN, f64::max);
    let p_max = branch.iter().map(|pt| pt.p).fold(f64::NAN, f64::max);
    let (ccb, cct) = (env.cricondenbar, env.cricondentherm);
    let crit = env.critical.map_or_else(String::new, |c| {
        format!("; critical point {:.2} K, {:.3} bar", c.t, c.p / PA_PER_BAR)
    });
    let extremes = format!(
        "cricondenbar {:.3} bar at {:.2} K, cricondentherm {:.2} K at {:.3} bar{crit}",
        ccb.p / PA_PER_BAR,
        ccb.t,
        cct.t,
        cct.p / PA_PER_BAR
    );
    match spec {
        Spec::PointAtP(_, p) if p_max.is_finite() && p > p_max.max(ccb.p * (1.0 + 1e-9)) => {
            CliError::BadInput(format!(
                "no {name} point at P = {:.4} bar with model {}: the pressure is above the \
                 cricondenbar of this mixture ({extremes}); the feed is one phase at every \
                 temperature at this pressure",
                p / PA_PER_BAR,
                built.id
            ))
        }
        Spec::PointAtP(_, p) if p_max.is_finite() && p > p_max * (1.0 + 1e-9) => {
            CliError::BadInput(format!(
                "no {name} point at P = {:.4} bar with model {}: the {name}-point curve of this \
                 mixture reaches at most {:.4} bar ({extremes})",
                p / PA_PER_BAR,
                built.id,
                p_max / PA_PER_BAR
            ))
        }
        Spec::PointAtT(_, t) if t_max.is_finite() && t > cct.t.max(t_max) => {
            CliError::BadInput(format!(
                "no {name} point at T = {t:.3} K with model {}: the temperature is above the \
                 cricondentherm of this mixture ({extremes}); the feed is one phase at every \
                 pressure at this temperature",
                built.id
            ))
        }
        Spec::PointAtT(_, t) if t_max.is_finite() && t > t_max * (1.0 + 1e-9) => {
            CliError::BadInput(format!(
                "no {name} point at T = {t:.3} K with model {}: the {name}-point curve of this \
                 mixture reaches at most {t_max:.3} K ({extremes})",
                built.id
            ))
        }
        _ => from_eos(&ctx, e),
    }
}

fn fractions(feed: &Feed, x: &[f64]) -> Vec<ComponentFraction> {
    feed.records
        .iter()
        .zip(x)
        .map(|(r, &f)| ComponentFraction {
            component: r.id.clone(),
            mole_fraction: f,
        })
        .collect()
}

fn phase(
    feed: &Feed,
    name: String,
    amount: f64,
    mass_amount: f64,
    pr: &Properties,
    x: &[f64],
) -> FlashPhase {
    FlashPhase {
        phase: name,
        amount,
        mass_amount,
        z: pr.z,
        molar_density_mol_m3: pr.rho,
        mass_density_kg_m3: pr.mass_density(),
        molar_mass_kg_mol: pr.molar_mass,
        composition: fractions(feed, x),
    }
}

fn base(built: &BuiltModel, phase: String, t: f64, p: f64, mm: f64) -> FlashResultReport {
    FlashResultReport {
        model: built.id.clone(),
        model_name: built.name.clone(),
        citation: built.citation.clone(),
        phase,
        branch: None,
        temperature_k: t,
        pressure_pa: p,
        vapor_fraction: None,
        vapor_mass_fraction: None,
        z: f64::NAN,
        molar_density_mol_m3: f64::NAN,
        mass_density_kg_m3: f64::NAN,
        molar_mass_kg_mol: mm,
        enthalpy_j_mol: f64::NAN,
        entropy_j_mol_k: f64::NAN,
        phases: Vec::new(),
        iterations: 0,
        fugacity_residual: None,
        notes: built.notes.clone(),
    }
}

/// The report of a flash result.
fn from_flash(
    built: &BuiltModel,
    m: &dyn Model,
    feed: &Feed,
    f: &FlashResult,
) -> FlashResultReport {
    let z = &feed.mole;
    let mm = m.molar_mass(z);
    let mut r = base(built, String::new(), f.t(), f.p(), mm);
    r.enthalpy_j_mol = flash::enthalpy(m, f, z);
    r.entropy_j_mol_k = flash::entropy(m, f, z);
    match f {
        FlashResult::SinglePhase(s) => {
            let pr = evaluate(m, s.t, s.rho, z);
            r.phase = s.phase.to_string();
            r.z = s.p / (s.rho * eos::constants::R * s.t);
            r.molar_density_mol_m3 = s.rho;
            r.mass_density_kg_m3 = s.rho * mm;
            r.phases = vec![phase(feed, s.phase.to_string(), 1.0, 1.0, &pr, z)];
            if s.tm_min < 0.0 {
                r.notes.push(format!(
                    "on the phase boundary: the stability test finds the feed unstable only by \
                     tm = {:.2e}, below the solvers' resolution, and no split with a finite \
                     amount of a second phase exists; reported as one phase",
                    s.tm_min
                ));
            }
        }
        FlashResult::TwoPhase(s) => {
            let vap = evaluate(m, s.t, s.rho_v, &s.y);
            let liq = evaluate(m, s.t, s.rho_l, &s.x);
            let beta = s.vapor_fraction;
            let beta_mass = beta * vap.molar_mass / mm;
            let v = beta / s.rho_v + (1.0 - beta) / s.rho_l;
            r.phase = eos::phase::Phase::TwoPhase.to_string();
            r.vapor_fraction = Some(beta);
            r.vapor_mass_fraction = Some(beta_mass);
            r.z = s.p * v / (eos::constants::R * s.t);
            r.molar_density_mol_m3 = 1.0 / v;
            r.mass_density_kg_m3 = mm / v;
            r.iterations = s.iterations;
            r.fugacity_residual = Some(s.fugacity_residual);
            r.phases = vec![
                phase(feed, "vapor".into(), beta, beta_mass, &vap, &s.y),
                phase(
                    feed,
                    "liquid".into(),
                    1.0 - beta,
                    1.0 - beta_mass,
                    &liq,
                    &s.x,
                ),
            ];
        }
    }
    r
}

/// The report of a bubble or dew point: the feed phase (all of the feed) and the incipient
/// phase (none of it yet).
fn from_point(
    built: &BuiltModel,
    m: &dyn Model,
    feed: &Feed,
    sp: &SaturationPoint,
) -> FlashResultReport {
    let z = &feed.mole;
    let mm = m.molar_mass(z);
    let liq = evaluate(m, sp.t, sp.rho_l, &sp.x);
    let vap = evaluate(m, sp.t, sp.rho_v, &sp.y);
    let (name, vf, feed_props) = match sp.side {
        Side::Bubble => ("bubble-point", 0.0, &liq),
        Side::Dew => ("dew-point", 1.0, &vap),
    };
    let mut r = base(built, name.to_string(), sp.t, sp.p, mm);
    r.vapor_fraction = Some(vf);
    r.vapor_mass_fraction = Some(vf);
    r.z = sp.p / (feed_props.rho * eos::constants::R * sp.t);
    r.molar_density_mol_m3 = feed_props.rho;
    r.mass_density_kg_m3 = feed_props.rho * mm;
    r.enthalpy_j_mol = feed_props.h;
    r.entropy_j_mol_k = feed_props.s;
    r.iterations = sp.iterations;
    let mut ll = vec![0.0; z.len()];
    let mut lv = vec![0.0; z.len()];
    m.ln_phi(sp.t, sp.rho_l, &sp.x, &mut ll);
    m.ln_phi(sp.t, sp.rho_v, &sp.y, &mut lv);
    let resid = (0..z.len())
        .filter(|&i| sp.x[i] > 0.0 && sp.y[i] > 0.0)
        .map(|i| ((sp.y[i].ln() + lv[i]) - (sp.x[i].ln() + ll[i])).abs())
        .fold(0.0, f64::max);
    r.fugacity_residual = Some(resid);
    r.phases = vec![
        phase(feed, "vapor".into(), vf, vf, &vap, &sp.y),
        phase(feed, "liquid".into(), 1.0 - vf, 1.0 - vf, &liq, &sp.x),
    ];
    r
}

/// Refuses a result carrying NaN or infinity: no such number reaches the output silently.
fn check_finite(r: &FlashResultReport) -> Result<(), CliError> {
    let mut values = vec![
        r.temperature_k,
        r.pressure_pa,
        r.z,
        r.molar_density_mol_m3,
        r.mass_density_kg_m3,
        r.molar_mass_kg_mol,
        r.enthalpy_j_mol,
        r.entropy_j_mol_k,
    ];
    values.extend(r.vapor_fraction);
    values.extend(r.vapor_mass_fraction);
    values.extend(r.fugacity_residual);
    for ph in &r.phases {
        values.extend([
            ph.amount,
            ph.mass_amount,
            ph.z,
            ph.molar_density_mol_m3,
            ph.mass_density_kg_m3,
            ph.molar_mass_kg_mol,
        ]);
        values.extend(ph.composition.iter().map(|c| c.mole_fraction));
    }
    if values.iter().all(|v| v.is_finite()) {
        Ok(())
    } else {
        Err(CliError::Computation(format!(
            "model {} gave a non-finite value for this state",
            r.model
        )))
    }
}
