//! Parts shared by the engineering-job commands: reading quantities the state command does
//! not need (mass, flows, base conditions), building each model with the ideal gas beside it,
//! and running a job per model.

use crate::error::{from_eos, CliError};
use crate::feed::Feed;
use crate::models::{self, BuiltModel};
use crate::report::jobs_common::{FluidReport, StateReport};
use crate::units::{self, KG_PER_LB, M3_PER_FT3};
use eos::ideal::IdealGas;
use eos::jobs::BaseConditions;
use eos::solid::SolidCheck;

/// Seconds per hour and per day.
const S_PER_H: f64 = 3600.0;
const S_PER_D: f64 = 86_400.0;

/// The ambient pressure of gauge readings, Pa.
pub fn ambient(text: &str) -> Result<f64, CliError> {
    Ok(units::ambient_pressure(text)?)
}

/// An absolute pressure in Pa from a reading that may be gauge.
pub fn pressure(text: &str, ambient: f64) -> Result<f64, CliError> {
    Ok(units::pressure_reading(text, ambient)?.0)
}

/// A temperature in K.
pub fn temperature(text: &str) -> Result<f64, CliError> {
    Ok(units::temperature(text)?)
}

/// Splits "12 kg/h" into the number and the unit; the message names the option.
fn number_unit(
    text: &str,
    option: &str,
    accepted: &'static str,
) -> Result<(f64, String), CliError> {
    units::split(text, "quantity", accepted).map_err(|e| {
        CliError::BadInput(format!(
            "{option} \"{text}\": {}; accepted: {accepted}",
            e.problem
        ))
    })
}

const MASS_UNITS: &str = "a number with kg, g, t or lb, for example \"120 kg\"";

/// A mass in kg (above zero).
pub fn mass(text: &str, option: &str) -> Result<f64, CliError> {
    let (v, u) = number_unit(text, option, MASS_UNITS)?;
    let f = match u.to_ascii_lowercase().as_str() {
        "kg" => 1.0,
        "g" => 1e-3,
        "t" => 1e3,
        "lb" => KG_PER_LB,
        _ => {
            return Err(CliError::BadInput(format!(
                "{option} \"{text}\": unknown unit \"{u}\"; accepted: {MASS_UNITS}"
            )))
        }
    };
    let kg = v * f;
    if !(kg.is_finite() && kg > 0.0) {
        return Err(CliError::BadInput(format!(
            "{option} \"{text}\": a mass must be above zero"
        )));
    }
    Ok(kg)
}

/// A flow as entered, in SI per second.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum Flow {
    /// kg/s.
    Mass(f64),
    /// mol/s.
    Molar(f64),
    /// m3/s at the flowing (actual) conditions.
    Actual(f64),
    /// m3/s at base conditions, with the base the unit implies (Sm3: 15degC, Nm3: 0degC,
    /// scf: 60degF-14.696psia).
    Standard(f64, BaseConditions),
}

/// The flow units accepted.
pub const FLOW_UNITS: &str = "mass kg/s, kg/h, kg/d, t/h, t/d, lb/s, lb/h; molar mol/s, \
kmol/h, kmol/d, lbmol/h; actual volume m3/s, m3/h, m3/d, L/s, ft3/s, ft3/min, ft3/h (also am3/h, \
acfm); standard volume Sm3/s, Sm3/h, Sm3/d, MSm3/d (15 degC, 101.325 kPa), Nm3/s, Nm3/h, Nm3/d \
(0 degC, 101.325 kPa), scf/h, scf/d, scfm, Mscfd, MMscfd (60 degF, 14.696 psia; in any case: \
MMSCFD and mmscfd too, M being the trade's thousand); for example \"12000 Sm3/h\"";

/// Reads a flow. `base` overrides the base the unit implies for standard volumes.
pub fn flow(text: &str, option: &str, base: Option<BaseConditions>) -> Result<Flow, CliError> {
    let (v, u) = number_unit(text, option, FLOW_UNITS)?;
    let named =
        |id: &str| BaseConditions::named(id).unwrap_or(eos::jobs::base_conditions::NAMED[1]);
    let std = |f: f64, implied: &str| Flow::Standard(v * f, base.unwrap_or_else(|| named(implied)));
    let key: String = u.chars().filter(|c| !c.is_whitespace()).collect();
    // The trade writes standard cubic feet in any case (MMscfd, MMSCFD, mmscfd: M is the
    // Roman thousand, not an SI prefix); they are read in any case.
    let field = key.to_ascii_lowercase();
    let f = match field.as_str() {
        "scf/h" => std(M3_PER_FT3 / S_PER_H, "60degF-14.696psia"),
        "scf/d" | "scfd" => std(M3_PER_FT3 / S_PER_D, "60degF-14.696psia"),
        "scfm" | "scf/min" => std(M3_PER_FT3 / 60.0, "60degF-14.696psia"),
        "mscfd" | "mscf/d" => std(1e3 * M3_PER_FT3 / S_PER_D, "60degF-14.696psia"),
        "mmscfd" | "mmscf/d" => std(1e6 * M3_PER_FT3 / S_PER_D, "60degF-14.696psia"),
        _ => flow_si(v, &key, &std).ok_or_else(|| {
            CliError::BadInput(format!(
                "{option} \"{text}\": unknown flow unit \"{u}\"; accepted: {FLOW_UNITS}"
            ))
        })?,
    };

    let raw = match f {
        Flow::Mass(x) | Flow::Molar(x) | Flow::Actual(x) | Flow::Standard(x, _) => x,
    };
    if !(raw.is_finite() && raw > 0.0) {
        return Err(CliError::BadInput(format!(
            "{option} \"{text}\": a flow must be above zero"
        )));
    }
    Ok(f)
}

/// The accepted base names.
pub const BASE_NAMES: &str = "0degC (normal), 15degC (standard, iso), 20degC, \
60degF-14.696psia (scf), 60degF-14.73psia, or \"T,P\" with units, e.g. \"15 degC, 1 atm\"";

/// Reads base conditions: a name, or "T,P" with units.
pub fn base(text: &str, ambient: f64) -> Result<BaseConditions, CliError> {
    // A name is read with or without spaces ("15degC", "15 degC"), as every quantity is.
    let compact: String = text.chars().filter(|c| !c.is_whitespace()).collect();
    if let Some(b) = BaseConditions::named(&compact) {
        return Ok(b);
    }
    if let Some((t, p)) = text.split_once(',') {
        let t = temperature(t.trim())?;
        let p = pressure(p.trim(), ambient)?;
        return BaseConditions::custom(t, p).map_err(|e| from_eos("--base", e));
    }
    Err(CliError::BadInput(format!(
        "--base \"{text}\" is not a known base; accepted: {BASE_NAMES}"
    )))
}

/// A model with the ideal gas of the same components beside it.
pub struct Pair {
    /// The model.
    pub built: BuiltModel,
    /// The ideal gas.
    pub ideal: IdealGas,
}

/// The fluid part of a job report.
pub fn fluid_report(feed: &Feed) -> FluidReport {
    FluidReport {
        label: feed.label(),
        composition: crate::commands::state::composition_rows(feed),
    }
}

/// Runs `job` for each model of `spec`; of several, a model that fails is left out with a
/// warning ([`crate::commands::each_model`]).
pub fn per_model<T>(
    spec: &str,
    feed: &Feed,
    mut job: impl FnMut(&Pair) -> Result<T, CliError>,
) -> Result<(Vec<T>, Vec<String>), CliError> {
    let all = spec.trim().eq_ignore_ascii_case("all");
    // "all" keeps the models with a Helmholtz energy (the jobs need one); IF97 is left out.
    let ids: Vec<String> = models::resolve_ids(spec, feed)?
        .into_iter()
        .filter(|id| !all || id != "if97")
        .collect();
    let ideal = IdealGas::new(&feed.components());
    let answers = crate::commands::each_model::run(&ids, |id| {
        job(&Pair {
            built: models::build(id, feed)?,
            ideal: ideal.clone(),
        })
    })?;
    Ok((answers.results, answers.warnings))
}

/// Warnings (each as a note starting "warning: ", which the jobs raise to the report) for a
/// state of a job that lies outside its model's range or in the solid region, or where a
/// mixture component may freeze out: the same checks as `zfactor state`.
pub fn edge_notes(pair: &Pair, feed: &Feed, states: &[(&str, &StateReport)]) -> Vec<String> {
    states
        .iter()
        .flat_map(|(what, s)| edge_notes_of(pair, feed, what, s))
        .collect()
}

/// The warnings a job's notes carry ("warning: ..."), as report warnings naming the model.
pub fn raised(model: &str, notes: &[String]) -> Vec<String> {
    notes
        .iter()
        .filter_map(|n| n.strip_prefix("warning: "))
        .map(|w| format!("{model}: {w}"))
        .collect()
}

fn edge_notes_of(pair: &Pair, feed: &Feed, what: &str, s: &StateReport) -> Vec<String> {
    let (t, p) = (s.temperature_k, s.pressure_pa);
    let rho = s.mass_density_kg_m3 / feed.molar_mass();
    let mut out: Vec<String> = crate::range::outside(&pair.built, feed, t, p, rho);
    if let SolidCheck::Solid(why) | SolidCheck::MaybeSolid(why) =
        crate::solid_check::pure(feed, t, p)
    {
        out.push(format!("{why}; the values are those of a metastable fluid"));
    }
    out.extend(crate::solid_check::freeze_out(feed, t));
    out.into_iter()
        .map(|w| format!("warning: {what}: {w}"))
        .collect()
}

/// Maps a library error with the model's id as context.
pub fn ctx(id: &str) -> impl Fn(eos::Error) -> CliError + '_ {
    move |e| from_eos(&format!("model {id}"), e)
}

/// Molar flow (mol/s) of `flow` for a model, with the actual conditions (T, P) of an actual
/// volume flow.
pub fn molar_flow(
    model: &dyn eos::Model,
    flow: Flow,
    x: &[f64],
    actual: (f64, f64),
) -> Result<f64, eos::Error> {
    use eos::jobs::base_conditions::molar_volume;
    Ok(match flow {
        Flow::Mass(q) => q / model.molar_mass(x),
        Flow::Molar(q) => q,
        Flow::Actual(q) => q / molar_volume(model, actual.0, actual.1, x)?.0,
        Flow::Standard(q, b) => q / molar_volume(model, b.t, b.p, x)?.0,
    })
}

/// The flow units written with SI symbols, case as written (Sm3 and sm3 alike, since no other
/// unit shares the spelling).
fn flow_si(v: f64, key: &str, std: &dyn Fn(f64, &str) -> Flow) -> Option<Flow> {
    Some(match key {
        "kg/s" => Flow::Mass(v),
        "kg/h" => Flow::Mass(v / S_PER_H),
        "kg/d" => Flow::Mass(v / S_PER_D),
        "t/h" => Flow::Mass(v * 1e3 / S_PER_H),
        "t/d" => Flow::Mass(v * 1e3 / S_PER_D),
        "lb/s" => Flow::Mass(v * KG_PER_LB),
        "lb/h" => Flow::Mass(v * KG_PER_LB / S_PER_H),
        "mol/s" => Flow::Molar(v),
        "kmol/h" => Flow::Molar(v * 1e3 / S_PER_H),
        "kmol/d" => Flow::Molar(v * 1e3 / S_PER_D),
        "lbmol/h" => Flow::Molar(v * KG_PER_LB * 1e3 / S_PER_H),
        "m3/s" | "am3/s" => Flow::Actual(v),
        "m3/h" | "am3/h" => Flow::Actual(v / S_PER_H),
        "m3/d" | "am3/d" => Flow::Actual(v / S_PER_D),
        "L/s" | "l/s" => Flow::Actual(v * 1e-3),
        "ft3/s" => Flow::Actual(v * M3_PER_FT3),
        "ft3/min" | "acfm" => Flow::Actual(v * M3_PER_FT3 / 60.0),
        "ft3/h" => Flow::Actual(v * M3_PER_FT3 / S_PER_H),
        "Sm3/s" | "sm3/s" => std(1.0, "15degC"),
        "Sm3/h" | "sm3/h" => std(1.0 / S_PER_H, "15degC"),
        "Sm3/d" | "sm3/d" => std(1.0 / S_PER_D, "15degC"),
        "MSm3/d" | "MMSm3/d" => std(1e6 / S_PER_D, "15degC"),
        "Nm3/s" | "nm3/s" => std(1.0, "0degC"),
        "Nm3/h" | "nm3/h" => std(1.0 / S_PER_H, "0degC"),
        "Nm3/d" | "nm3/d" => std(1.0 / S_PER_D, "0degC"),
        _ => return None,
    })
}

/// The job state of a model explicit in (T, P) (one phase: these models do not split a
/// feed), from its properties at (T, P).
pub fn explicit_state(st: &crate::models::ModelState, t: f64, p: f64) -> StateReport {
    let pr = &st.props;
    let m = pr.molar_mass;
    // Z and density only (a gas known by its gravity): no energies to show.
    let energy = pr.computed == eos::need::Need::All;
    StateReport {
        temperature_k: t,
        pressure_pa: p,
        phase: st.phase.to_string(),
        z: pr.z,
        mass_density_kg_m3: pr.rho * m,
        enthalpy_j_kg: energy.then(|| pr.h / m),
        entropy_j_kg_k: energy.then(|| pr.s / m),
        internal_energy_j_kg: energy.then(|| pr.u / m),
        vapor_mass_fraction: None,
        vapor_mole_fraction: None,
        liquid_composition: None,
        vapor_composition: None,
    }
}
