//! `zfactor state`: one state of a fluid or mixture, for each requested model.

use crate::cli::{RootArg, StateArgs};
use crate::commands::cp_range;
use crate::commands::each_model::{self, Answers};
use crate::error::{from_eos, from_pure, CliError};
use crate::feed::{self, Feed};
use crate::feed_input;
use crate::models::{self, BuiltModel, ModelState};
use crate::report::state::{
    ComponentFraction, CompositionRow, FugacityRow, ModelResult, PhaseResult, StateInput,
    StateReport,
};
use crate::units::{self, Density};
use eos::need::Need;
use eos::pure::Spec;
use eos::solid::SolidCheck;
use eos::state::RootChoice;

/// The two properties that fix the state, in SI.
#[derive(Debug, Clone, Copy)]
pub enum Given {
    /// T (K) and P (Pa).
    Tp(f64, f64),
    /// T (K) and molar density (mol/m3).
    TRho(f64, f64),
    /// P (Pa) and molar density (mol/m3).
    PRho(f64, f64),
    /// P (Pa) and molar enthalpy (J/mol), pure fluids.
    Ph(f64, f64),
    /// P (Pa) and molar entropy (J/(mol K)), pure fluids.
    Ps(f64, f64),
    /// T (K) and vapour quality, pure fluids.
    Tx(f64, f64),
    /// P (Pa) and vapour quality, pure fluids.
    Px(f64, f64),
}

impl Given {
    fn name(self) -> &'static str {
        match self {
            Given::Tp(..) => "T,P",
            Given::TRho(..) => "T,density",
            Given::PRho(..) => "P,density",
            Given::Ph(..) => "P,h",
            Given::Ps(..) => "P,s",
            Given::Tx(..) => "T,x",
            Given::Px(..) => "P,x",
        }
    }
}

/// Computes the state with every requested model.
pub fn run(args: &StateArgs) -> Result<StateReport, CliError> {
    let feed = feed_input::read_gas(&args.fluid, &args.gravity)?;
    let ambient = units::ambient_pressure(&args.shared.ambient)?;
    let (t, p) = units::optional_tp(
        args.temperature.as_deref(),
        args.pressure.as_deref(),
        ambient,
    )?;
    let density = args.density.as_deref().map(units::density).transpose()?;
    let rho = density.map(|d: Density| d.molar(feed.molar_mass()));
    let m = feed.molar_mass();
    let energy = |e: crate::energy_units::EnergyUnitError| CliError::BadInput(e.to_string());
    let h = args
        .enthalpy
        .as_deref()
        .map(crate::energy_units::enthalpy)
        .transpose()
        .map_err(energy)?;
    let s_in = args
        .entropy
        .as_deref()
        .map(crate::energy_units::entropy)
        .transpose()
        .map_err(energy)?;
    let x_in = args.quality.as_deref().map(units::quality).transpose()?;
    let given = match (t, p.map(|p| p.0), rho, h, s_in, x_in) {
        (Some(t), Some(p), None, None, None, None) => Given::Tp(t, p),
        (Some(t), None, Some(r), None, None, None) => Given::TRho(t, r),
        (None, Some(p), Some(r), None, None, None) => Given::PRho(p, r),
        (None, Some(p), None, Some(h), None, None) => Given::Ph(p, h.molar(m)),
        (None, Some(p), None, None, Some(s), None) => Given::Ps(p, s.molar(m)),
        (Some(t), None, None, None, None, Some(x)) => Given::Tx(t, x),
        (None, Some(p), None, None, None, Some(x)) => Given::Px(p, x),
        _ => {
            return Err(CliError::BadInput(
                "give two properties that fix the state: --temperature with --pressure or \
                 --density; --pressure with --density; and for a pure fluid also --pressure \
                 with --enthalpy, --entropy or --quality, or --temperature with --quality"
                    .to_string(),
            ))
        }
    };
    if feed.gravity.is_some() && !matches!(given, Given::Tp(..)) {
        return Err(CliError::BadInput(
            "a gas known by its --gravity takes --temperature and --pressure: the gas-gravity \
             correlations give Z at a temperature and pressure"
                .to_string(),
        ));
    }
    if !feed.is_pure()
        && matches!(
            given,
            Given::Ph(..) | Given::Ps(..) | Given::Tx(..) | Given::Px(..)
        )
    {
        return Err(CliError::BadInput(
            "--enthalpy, --entropy and --quality fix the state of a pure fluid; for a mixture \
             use `zfactor flash`"
                .to_string(),
        ));
    }
    let ids = models::resolve_ids(&args.shared.model, &feed)?;
    let root = match args.root {
        RootArg::Stable => RootChoice::LowestGibbs,
        RootArg::Liquid => RootChoice::Liquid,
        RootArg::Vapor => RootChoice::Vapor,
    };
    let Answers {
        mut results,
        mut warnings,
    } = each_model::run(&ids, |id| {
        let built = models::build(id, &feed)?;
        // A mass density is the same mass density for every model, whatever molar mass its
        // equation was published with (IAPWS-95's water, Setzmann-Wagner's methane).
        let given = match (given, density) {
            (Given::TRho(t, _), Some(Density::Mass(d))) => {
                Given::TRho(t, d / model_mass(&built, &feed))
            }
            (Given::PRho(p, _), Some(Density::Mass(d))) => {
                Given::PRho(p, d / model_mass(&built, &feed))
            }
            (g, _) => g,
        };
        compute(&built, &feed, given, root)
    })?;
    let split: Vec<&str> = results
        .iter()
        .filter(|r| r.vapor_fraction.is_some())
        .map(|r| r.model.as_str())
        .collect();
    if !split.is_empty() {
        warnings.push(format!(
            "the {} splits into vapour and liquid at this state ({}): a single-phase Z would \
             be meaningless; the phases are reported",
            if feed.is_pure() { "fluid" } else { "mixture" },
            split.join(", ")
        ));
    }
    // The solid region is the fluid's, not a model's: said once, in full.
    for r in &results {
        if let SolidCheck::Solid(why) | SolidCheck::MaybeSolid(why) =
            crate::solid_check::pure(&feed, r.temperature_k, r.pressure_pa)
        {
            let text = format!(
                "{why}; no model here describes a solid: the values shown are those of each \
                 model's metastable fluid"
            );
            if !warnings.contains(&text) {
                warnings.push(text);
            }
        }
    }
    for r in &results {
        warnings.extend(
            r.warnings
                .iter()
                .filter(|w| *w != IN_SOLID && *w != MAYBE_SOLID)
                .map(|w| format!("{}: {w}", r.model)),
        );
    }
    if let Some(r) = results.first() {
        warnings.extend(crate::solid_check::freeze_out(&feed, r.temperature_k));
    }
    // Only the models that take the component table's ideal-gas heat capacity depend on
    // its fitted range; the reference formulations and IF97 carry their own ideal part.
    let table_cp = |r: &ModelResult| !models::OWN_IDEAL_GAS.contains(&r.model.as_str());
    let using: Vec<ModelResult> = results.iter().filter(|r| table_cp(r)).cloned().collect();
    let (notes, more) = extrapolation_warnings(&feed, &using);
    warnings.extend(more);
    for r in results.iter_mut().filter(|r| table_cp(r)) {
        r.notes.extend(notes.iter().cloned());
    }
    Ok(StateReport {
        tool: format!("zfactor {}", env!("CARGO_PKG_VERSION")),
        fluid: feed.label(),
        input: StateInput {
            given: given.name(),
            temperature: args.temperature.clone(),
            pressure: args.pressure.clone(),
            density: args.density.clone(),
            enthalpy: args.enthalpy.clone(),
            entropy: args.entropy.clone(),
            quality: args.quality.clone(),
            temperature_k: t,
            pressure_pa: p.map(|p| p.0),
            pressure_is_gauge: p.is_some_and(|p| p.1),
            ambient_pressure_pa: ambient,
            basis: feed::basis_name(feed.basis),
            normalized_from: feed.normalized_from,
            root: match args.root {
                RootArg::Stable => "stable",
                RootArg::Liquid => "liquid",
                RootArg::Vapor => "vapor",
            },
        },
        composition: composition_rows(&feed),
        results,
        enthalpy_entropy_zero: feed.caloric_zero(),
        warnings,
        caution: crate::CAUTION,
    })
}

/// The composition table of a feed.
pub fn composition_rows(feed: &Feed) -> Vec<CompositionRow> {
    feed.records
        .iter()
        .enumerate()
        .map(|(i, r)| CompositionRow {
            id: r.id.clone(),
            name: r.name.clone(),
            as_entered: feed.as_entered[i],
            mole_fraction: feed.mole[i],
            mass_fraction: feed.mass[i],
        })
        .collect()
}

/// The molar mass a model converts with (kg/mol): its equation's own where it has one.
fn model_mass(built: &BuiltModel, feed: &Feed) -> f64 {
    built
        .helmholtz()
        .map_or_else(|| feed.molar_mass(), |m| m.molar_mass(&feed.mole))
}

/// `v` as zero where it is zero within round-off of `scale` (an ideal gas's enthalpy and
/// entropy at the reference state come out as 1e-17, not 0).
fn snap(v: f64, scale: f64) -> f64 {
    if v.abs() < 1e-9 * scale {
        0.0
    } else {
        v
    }
}

/// The temperature and pressure the user gave, where given: a result echoes them rather
/// than the model's round trip (70 bar, not 7.000000000000001e6 Pa).
fn given_tp(asked: Given) -> (Option<f64>, Option<f64>) {
    match asked {
        Given::Tp(t, p) => (Some(t), Some(p)),
        Given::TRho(t, _) | Given::Tx(t, _) => (Some(t), None),
        Given::PRho(p, _) | Given::Ph(p, _) | Given::Ps(p, _) | Given::Px(p, _) => (None, Some(p)),
    }
}

/// One model's result. A mixture at (T, P) is flashed first: the state is reported as one
/// phase only when the stability test passes; otherwise as the split, with each phase.
fn compute(
    built: &BuiltModel,
    feed: &Feed,
    given: Given,
    root: RootChoice,
) -> Result<ModelResult, CliError> {
    let x = &feed.mole;
    let asked = given;
    let ctx = format!("model {}", built.id);
    let helmholtz = built
        .helmholtz()
        .filter(|_| built.id != "ideal" && !feed.is_pure());
    if let (Given::Tp(t, p), Some(m), RootChoice::LowestGibbs) = (given, helmholtz, root) {
        let flash = eos::equilibrium::flash::tp(m, t, p, x).map_err(|e| from_eos(&ctx, e))?;
        if let eos::equilibrium::flash::FlashResult::TwoPhase(split) = flash {
            return two_phase(built, m, feed, &split, asked);
        }
    }
    // IF97 is explicit in (T, P): (P, h), (P, s) and a quality are found by inverting its
    // forward equations (eos::if97::ph_ps); wet steam is reported by the lever rule.
    let given = if built.id == eos::if97::ID {
        match if97_state(given).map_err(|e| from_eos(&ctx, e))? {
            If97Given::State(Given::Tp(t, p)) if !matches!(given, Given::Tp(..)) => {
                Given::Tp(if97_refined(built, x, t, p, given), p)
            }
            If97Given::State(g) => g,
            If97Given::Wet { t, p, quality } => {
                return if97_wet(built, feed, t, p, quality, asked);
            }
        }
    } else {
        given
    };
    let mut named = None;
    let pure_spec = match given {
        Given::Tp(..) => None,
        Given::TRho(t, r) => Some(Spec::Tv { t, v: 1.0 / r }),
        Given::PRho(p, r) => Some(Spec::Pv { p, v: 1.0 / r }),
        Given::Ph(p, h) => Some(Spec::Ph { p, h }),
        Given::Ps(p, s) => Some(Spec::Ps { p, s }),
        Given::Tx(t, x) => Some(Spec::Tx { t, x }),
        Given::Px(p, x) => Some(Spec::Px { p, x }),
    };
    // A pure fluid at a density, enthalpy, entropy or quality goes through the model's own
    // saturation solver: inside the dome it is two-phase, by the lever rule.
    let given = match (pure_spec, &built.pure, built.helmholtz()) {
        (Some(spec), Some(pf), Some(m)) => {
            let ps = eos::pure::state(pf.as_ref(), spec).map_err(|e| from_pure(&ctx, e))?;
            if let (Some(q), Some(sat)) = (ps.quality, ps.saturation) {
                return pure_two_phase(built, m, feed, &sat, q, ps.phase, asked);
            }
            named = Some(ps.phase);
            Given::TRho(ps.t, ps.rho)
        }
        (Some(_), _, _) if !matches!(given, Given::TRho(..) | Given::PRho(..)) => {
            return Err(CliError::BadInput(format!(
                "model {} takes temperature, pressure and density only; enthalpy, entropy and \
                 quality need a model with its own saturation solver: vdw, rk, srk, pr, pr78, \
                 reference, sw12, or IAPWS-IF97 for water (if97)",
                built.id
            )))
        }
        _ => given,
    };
    // A gas known by its gravity has no ideal-gas heat capacity: Z and density only.
    let need = if feed.energy_known() {
        Need::All
    } else {
        Need::Volumetric
    };
    let mut state = match given {
        Given::Tp(t, p) => built.at_tp_need(t, p, x, root, need),
        Given::TRho(t, r) => built.at_trho(t, r, x, root),
        Given::PRho(p, r) => built.at_prho(p, r, x, root),
        _ => unreachable_pair(),
    }
    .map_err(|e| from_eos(&ctx, e))?;
    if let Some(phase) = named {
        state.phase = phase;
    }
    let mut warnings =
        crate::range::outside(built, feed, state.props.t, state.props.p, state.props.rho);
    warnings.append(&mut state.warnings);
    warnings.extend(crate::range::impossible(&state.props));
    match crate::solid_check::pure(feed, state.props.t, state.props.p) {
        SolidCheck::Solid(_) => {
            warnings.push(IN_SOLID.to_string());
            state.phase = eos::phase::Phase::Solid;
        }
        SolidCheck::MaybeSolid(_) => warnings.push(MAYBE_SOLID.to_string()),
        SolidCheck::Fluid => {}
    }
    let cv_withheld = crate::range::withhold_impossible(&mut state.props);
    let pr = &state.props;
    let (dev, of) = ideal_gas_error(asked, pr.z);
    let mut notes = built.notes.clone();
    if pr.cp.is_none() && feed.energy_known() {
        notes.push(
            "cp, speed of sound, Joule-Thomson coefficient and isentropic exponent are undefined: \
             the state is mechanically unstable (dP/drho <= 0)"
                .to_string(),
        );
    }
    if let (Some(m), false) = (helmholtz, matches!(given, Given::Tp(..))) {
        let st =
            eos::equilibrium::stability::test(m, pr.t, pr.p, x).map_err(|e| from_eos(&ctx, e))?;
        if !st.stable {
            return Err(CliError::Computation(format!(
                "model {}: the mixture at this state is not stable as one phase (it lies inside \
                 the two-phase region at T = {:.3} K ({:.2} degC), P = {:.6} bar abs); a \
                 single-phase Z would be meaningless. Give temperature and pressure to see the \
                 phase split.",
                built.id,
                pr.t,
                pr.t - crate::units::KELVIN_AT_0_DEGC,
                pr.p / crate::units::PA_PER_BAR
            )));
        }
    }
    let mm = pr.molar_mass;
    let (t_given, p_given) = given_tp(asked);
    let rt = eos::constants::R * pr.t;
    let energy = feed.energy_known();
    let (h, s) = (snap(pr.h, rt), snap(pr.s, eos::constants::R));
    let known = |v: f64| energy.then_some(v);
    let result = ModelResult {
        model: built.id.clone(),
        model_name: built.name.clone(),
        citation: built.citation.clone(),
        phase: state.phase.to_string(),
        roots: state.roots,
        temperature_k: t_given.unwrap_or(pr.t),
        pressure_pa: p_given.unwrap_or(pr.p),
        z: pr.z,
        molar_density_mol_m3: pr.rho,
        mass_density_kg_m3: pr.mass_density(),
        molar_volume_m3_mol: pr.molar_volume(),
        specific_volume_m3_kg: pr.molar_volume() / mm,
        ideal_gas_deviation_pct: 100.0 * dev,
        ideal_gas_deviation_of: of,
        enthalpy_j_mol: known(h),
        entropy_j_mol_k: known(s),
        internal_energy_j_mol: known(pr.u),
        enthalpy_j_kg: known(h / mm),
        entropy_j_kg_k: known(s / mm),
        cv_j_mol_k: (energy && !cv_withheld).then_some(pr.cv),
        cp_j_mol_k: pr.cp.filter(|_| energy),
        speed_of_sound_m_s: pr.w.filter(|_| energy),
        joule_thomson_k_pa: pr.jt.filter(|_| energy),
        isentropic_exponent: pr.isentropic_exponent.filter(|_| energy),
        residual_enthalpy_j_mol: known(pr.h_res),
        residual_entropy_j_mol_k: known(pr.s_res),
        residual_gibbs_j_mol: known(pr.g_res),
        vapor_fraction: None,
        phases: Vec::new(),
        fugacity: fugacities(feed, &pr.ln_phi, x, pr.p),
        notes,
        warnings,
    };
    check_finite(&result)?;
    Ok(result)
}

/// One row per component; a model that gives no component fugacities (an empty `ln_phi`)
/// gets empty rows rather than fewer rows.
fn fugacities(feed: &Feed, ln_phi: &[f64], x: &[f64], p: f64) -> Vec<FugacityRow> {
    feed.records
        .iter()
        .enumerate()
        .map(|(i, r)| {
            let phi = ln_phi.get(i).map(|lp| lp.exp());
            FugacityRow {
                component: r.id.clone(),
                phi,
                fugacity_pa: phi.map(|f| x[i] * f * p),
            }
        })
        .collect()
}

/// The result for a feed that splits into vapour and liquid: bulk values by the lever rule,
/// each phase with its amount, Z, densities and composition.
fn two_phase(
    built: &BuiltModel,
    m: &dyn eos::Model,
    feed: &Feed,
    split: &eos::equilibrium::flash::TwoPhase,
    asked: Given,
) -> Result<ModelResult, CliError> {
    let vap = eos::properties::evaluate(m, split.t, split.rho_v, &split.y);
    let liq = eos::properties::evaluate(m, split.t, split.rho_l, &split.x);
    two_phase_of(built, feed, split, &vap, &liq, asked)
}

/// The two-phase result of `split` from the properties of its vapour and liquid.
fn two_phase_of(
    built: &BuiltModel,
    feed: &Feed,
    split: &eos::equilibrium::flash::TwoPhase,
    vap: &eos::properties::Properties,
    liq: &eos::properties::Properties,
    asked: Given,
) -> Result<ModelResult, CliError> {
    let (t, p, beta) = (split.t, split.p, split.vapor_fraction);
    let bulk = |v: f64, l: f64| beta * v + (1.0 - beta) * l;
    let v_molar = bulk(1.0 / vap.rho, 1.0 / liq.rho);
    let rho = 1.0 / v_molar;
    let mm = feed.molar_mass();
    let z = p * v_molar / (eos::constants::R * t);
    let phase = |name, amount: f64, pr: &eos::properties::Properties, comp: &[f64]| PhaseResult {
        phase: name,
        amount,
        z: pr.z,
        molar_density_mol_m3: pr.rho,
        mass_density_kg_m3: pr.mass_density(),
        composition: feed
            .records
            .iter()
            .zip(comp)
            .map(|(r, &f)| ComponentFraction {
                component: r.id.clone(),
                mole_fraction: f,
            })
            .collect(),
    };
    let mut notes = built.notes.clone();
    notes.push(format!(
        "the feed splits into vapour ({:.4} mol/mol) and liquid ({:.4} mol/mol): Z and density \
         are bulk values of both phases together, and a single-phase Z would be meaningless here",
        beta,
        1.0 - beta
    ));
    let result = ModelResult {
        model: built.id.clone(),
        model_name: built.name.clone(),
        citation: built.citation.clone(),
        phase: eos::phase::Phase::TwoPhase.to_string(),
        roots: 0,
        temperature_k: t,
        pressure_pa: p,
        z,
        molar_density_mol_m3: rho,
        mass_density_kg_m3: rho * mm,
        molar_volume_m3_mol: v_molar,
        specific_volume_m3_kg: v_molar / mm,
        ideal_gas_deviation_pct: 100.0 * ideal_gas_error(asked, z).0,
        ideal_gas_deviation_of: ideal_gas_error(asked, z).1,
        enthalpy_j_mol: Some(bulk(vap.h, liq.h)),
        entropy_j_mol_k: Some(bulk(vap.s, liq.s)),
        internal_energy_j_mol: Some(bulk(vap.u, liq.u)),
        enthalpy_j_kg: Some(bulk(vap.h, liq.h) / mm),
        entropy_j_kg_k: Some(bulk(vap.s, liq.s) / mm),
        cv_j_mol_k: None,
        cp_j_mol_k: None,
        speed_of_sound_m_s: None,
        joule_thomson_k_pa: None,
        isentropic_exponent: None,
        residual_enthalpy_j_mol: None,
        residual_entropy_j_mol_k: None,
        residual_gibbs_j_mol: None,
        vapor_fraction: Some(beta),
        phases: vec![
            phase("vapor", beta, vap, &split.y),
            phase("liquid", 1.0 - beta, liq, &split.x),
        ],
        fugacity: fugacities(feed, &vap.ln_phi, &split.y, p),
        notes,
        warnings: crate::range::outside(built, feed, t, p, split.rho_l),
    };
    check_finite(&result)?;
    Ok(result)
}

/// What an IF97 request becomes: a state the model answers directly, or wet steam.
enum If97Given {
    State(Given),
    Wet { t: f64, p: f64, quality: f64 },
}

/// The (T, P) of an IF97 request given by (P, h), (P, s) or a quality, or the request as it
/// is. Enthalpy and entropy are per mole with IF97's molar mass, the factor the model's own
/// results are converted with, so a state given in kJ/kg comes back with that value.
fn if97_state(given: Given) -> eos::Result<If97Given> {
    use eos::if97::ph_ps::{self, PhaseState};
    use eos::tp_explicit::if97::M_WATER;
    let found = |p: f64, st: PhaseState| match st {
        PhaseState::Single(s) => If97Given::State(Given::Tp(s.t, p)),
        PhaseState::Wet {
            quality, liquid, ..
        } => If97Given::Wet {
            t: liquid.t,
            p,
            quality,
        },
    };
    Ok(match given {
        Given::Ph(p, h) => found(p, ph_ps::ph(p, h / M_WATER)?),
        Given::Ps(p, s) => found(p, ph_ps::ps(p, s / M_WATER)?),
        Given::Tx(t, quality) => If97Given::Wet {
            t,
            p: eos::if97::psat(t)?,
            quality,
        },
        Given::Px(p, quality) => If97Given::Wet {
            t: eos::if97::tsat(p)?,
            p,
            quality,
        },
        other => If97Given::State(other),
    })
}

/// The temperature at which the model's own molar h or s (what the output prints) equals the
/// given one, by Newton steps from IF97's T(p, h) or T(p, s) (dh/dT = cp, ds/dT = cp/T at
/// fixed P): the IF97 molar conversion differs from the output's by a few parts in 1e6, and
/// an input should come back as it was typed.
fn if97_refined(built: &BuiltModel, x: &[f64], mut t: f64, p: f64, given: Given) -> f64 {
    for _ in 0..3 {
        let Ok(st) = built.at_tp(t, p, x, RootChoice::LowestGibbs) else {
            return t;
        };
        let Some(cp) = st.props.cp.filter(|c| *c > 0.0) else {
            return t;
        };
        let step = match given {
            Given::Ph(_, h) => (st.props.h - h) / cp,
            Given::Ps(_, s) => (st.props.s - s) * t / cp,
            _ => return t,
        };
        t -= step;
        if step.abs() < 1e-12 * t {
            break;
        }
    }
    t
}

/// Wet steam from IF97: the saturated liquid and vapour at (T, P) by the lever rule.
fn if97_wet(
    built: &BuiltModel,
    feed: &Feed,
    t: f64,
    p: f64,
    quality: f64,
    asked: Given,
) -> Result<ModelResult, CliError> {
    let ctx = format!("model {}", built.id);
    let x = &feed.mole;
    let side = |root| {
        built
            .at_tp(t, p, x, root)
            .map(|s| s.props)
            .map_err(|e| from_eos(&ctx, e))
    };
    let (liq, vap) = (side(RootChoice::Liquid)?, side(RootChoice::Vapor)?);
    let split = eos::equilibrium::flash::TwoPhase {
        t,
        p,
        vapor_fraction: quality,
        x: vec![1.0],
        y: vec![1.0],
        rho_l: liq.rho,
        rho_v: vap.rho,
        iterations: 0,
        fugacity_residual: 0.0,
    };
    let mut r = two_phase_of(built, feed, &split, &vap, &liq, asked)?;
    r.phase = if quality <= 0.0 {
        "saturated liquid".to_string()
    } else if quality >= 1.0 {
        "saturated vapor".to_string()
    } else {
        eos::phase::Phase::TwoPhase.to_string()
    };
    if let Some(n) = r.notes.last_mut() {
        *n = format!(
            "wet steam (IAPWS-IF97 region 4) at {t:.6} K and {p:.6e} Pa with quality              {quality:.6}: Z and density are bulk values of both phases together"
        );
    }
    Ok(r)
}

/// A result's own warning in the solid region (the report says why, once).
const IN_SOLID: &str = "in the solid region: the values are those of the model's metastable fluid";
/// A result's own warning where a solid may form.
const MAYBE_SOLID: &str = "a solid may form at this state (see the report's warnings)";

/// The ideal gas's error, in percent of the model's answer, in the quantity the inputs leave
/// free: (ideal - model) / model. With T and density given that is the pressure
/// (P_ideal / P = 1/Z); with P and density the temperature (T_ideal / T = Z); otherwise the
/// density at the state's T and P (rho_ideal / rho = Z).
fn ideal_gas_error(given: Given, z: f64) -> (f64, &'static str) {
    let (e, of) = match given {
        Given::TRho(..) => (1.0 / z - 1.0, "pressure"),
        Given::PRho(..) => (z - 1.0, "temperature"),
        _ => (z - 1.0, "density"),
    };
    // Round-off (the ideal gas against itself) is no error: 0.
    let rounded = if e.abs() < crate::report::jobs_common::ROUND_OFF {
        0.0
    } else {
        e
    };
    (rounded, of)
}

/// The pairs that reach the single-phase evaluation are (T, P), (T, rho) and (P, rho); the
/// others are turned into (T, rho) by the pure-fluid solver first.
fn unreachable_pair() -> eos::Result<ModelState> {
    Err(eos::Error::NoSolution(
        "this pair of properties needs a pure-fluid model".to_string(),
    ))
}

/// A pure fluid inside the dome (or saturated): both phases from the model's saturation
/// solver, evaluated on zfactor's zero of h and s, in proportion of the quality.
fn pure_two_phase(
    built: &BuiltModel,
    m: &dyn eos::Model,
    feed: &Feed,
    sat: &eos::pure::SatState,
    quality: f64,
    phase: eos::phase::Phase,
    asked: Given,
) -> Result<ModelResult, CliError> {
    let split = eos::equilibrium::flash::TwoPhase {
        t: sat.t,
        p: sat.p,
        vapor_fraction: quality,
        x: vec![1.0],
        y: vec![1.0],
        rho_l: sat.liquid.rho,
        rho_v: sat.vapor.rho,
        iterations: 0,
        fugacity_residual: 0.0,
    };
    let mut r = two_phase(built, m, feed, &split, asked)?;
    r.phase = phase.to_string();
    if let Some(n) = r.notes.last_mut() {
        *n = format!(
            "saturated at {:.6} K and {:.6e} Pa with quality {quality:.6}: Z and density are \
             bulk values of both phases together",
            sat.t, sat.p
        );
    }
    Ok(r)
}

/// Refuses a result carrying NaN or infinity: no such number reaches the output silently.
fn check_finite(r: &ModelResult) -> Result<(), CliError> {
    let values = [
        r.z,
        r.molar_density_mol_m3,
        r.mass_density_kg_m3,
        r.temperature_k,
        r.pressure_pa,
    ];
    let optional = [
        r.enthalpy_j_mol,
        r.entropy_j_mol_k,
        r.cv_j_mol_k,
        r.cp_j_mol_k,
        r.speed_of_sound_m_s,
        r.joule_thomson_k_pa,
        r.isentropic_exponent,
        r.residual_enthalpy_j_mol,
        r.residual_entropy_j_mol_k,
        r.residual_gibbs_j_mol,
        r.vapor_fraction,
    ];
    let fug = r.fugacity.iter().filter_map(|f| f.phi);
    if values
        .into_iter()
        .chain(optional.into_iter().flatten())
        .chain(fug)
        .all(f64::is_finite)
    {
        Ok(())
    } else {
        Err(CliError::Computation(format!(
            "model {} gave a non-finite property at this state",
            r.model
        )))
    }
}

/// Notes and warnings for heat capacities used outside their fitted range: (notes, warnings).
fn extrapolation_warnings(feed: &Feed, results: &[ModelResult]) -> (Vec<String>, Vec<String>) {
    match results.first() {
        Some(r) => cp_range::extrapolation(
            feed,
            r.temperature_k,
            "h, s, cp, cv and w are less certain (Z and density are not affected)",
        ),
        None => (Vec::new(), Vec::new()),
    }
}
