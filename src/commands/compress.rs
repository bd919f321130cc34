//! `zfactor compress`: one compression stage per model, with the ideal-gas answer beside it.

use crate::cli::compress_args::CompressArgs;
use crate::commands::jobs_common::{self as jc, ctx, molar_flow, per_model, Flow, Pair};
use crate::error::CliError;
use crate::feed_input;
use crate::report::compress::{
    CompressInput, CompressReport, CompressResult, ExponentsReport, Shortcut,
};
use crate::report::jobs_common::{BaseReport, Compared, StateReport};
use eos::jobs::compressor::{stage, Efficiency, Exponents, Stage};
use eos::phase::Phase;
use eos::Model;

/// Computes the report.
pub fn run(args: &CompressArgs) -> Result<CompressReport, CliError> {
    let feed = feed_input::read(&args.fluid)?;
    let amb = jc::ambient(&args.shared.ambient)?;
    let p1 = jc::pressure(&args.suction_pressure, amb)?;
    let t1 = jc::temperature(&args.suction_temperature)?;
    let p2 = jc::pressure(&args.discharge_pressure, amb)?;
    if p2 <= p1 {
        return Err(CliError::BadInput(format!(
            "--discharge-pressure \"{}\" ({} bar abs) is not above --suction-pressure \"{}\" \
             ({} bar abs): a compressor raises the pressure",
            args.discharge_pressure,
            p2 / crate::units::PA_PER_BAR,
            args.suction_pressure,
            p1 / crate::units::PA_PER_BAR
        )));
    }
    let (eff, kind, value) = match (args.isentropic_efficiency, args.polytropic_efficiency) {
        (Some(e), None) => (Efficiency::Isentropic(e), "isentropic", e),
        (None, Some(e)) => (Efficiency::Polytropic(e), "polytropic", e),
        _ => {
            return Err(CliError::BadInput(
                "give one of --isentropic-efficiency and --polytropic-efficiency".to_string(),
            ))
        }
    };
    if !(value > 0.0 && value <= 1.0) {
        return Err(CliError::BadInput(format!(
            "--{kind}-efficiency {value} is outside (0, 1]: give a fraction above 0 and at \
             most 1 (0.8, not 80)"
        )));
    }
    let base = args.base.as_deref().map(|b| jc::base(b, amb)).transpose()?;
    let flow = args
        .flow
        .as_deref()
        .map(|f| jc::flow(f, "--flow", base))
        .transpose()?;
    let x = feed.mole.clone();
    let (results, mut warnings) = per_model(&args.shared.model, &feed, |pair| {
        let mut r = one(pair, p1, t1, p2, eff, flow, &x)?;
        let edge = jc::edge_notes(
            pair,
            &feed,
            &[("suction", &r.suction), ("discharge", &r.discharge)],
        );
        r.notes.extend(edge);
        Ok(r)
    })?;
    for r in &results {
        warnings.extend(jc::raised(&r.model, &r.notes));
    }
    let flow_base: Option<BaseReport> = match flow {
        Some(Flow::Standard(_, b)) => Some(b.into()),
        _ => None,
    };
    Ok(CompressReport {
        tool: format!("zfactor {}", env!("CARGO_PKG_VERSION")),
        fluid: jc::fluid_report(&feed),
        input: CompressInput {
            suction_pressure: args.suction_pressure.clone(),
            suction_temperature: args.suction_temperature.clone(),
            discharge_pressure: args.discharge_pressure.clone(),
            suction_pressure_pa: p1,
            suction_temperature_k: t1,
            discharge_pressure_pa: p2,
            pressure_ratio: p2 / p1,
            efficiency_kind: kind,
            efficiency: value,
            flow: args.flow.clone(),
            flow_base,
            ambient_pressure_pa: amb,
        },
        results,
        warnings,
        caution: crate::CAUTION,
    })
}

fn exps(e: &Exponents) -> ExponentsReport {
    ExponentsReport {
        ideal_cp_cv: e.ideal_k,
        isentropic_volume_exponent: e.volume_k,
        isentropic_temperature_exponent: e.temperature_k,
    }
}

/// T2 from the constant-exponent shortcut with the given efficiency.
fn shortcut(t1: f64, r: f64, k: f64, eff: Efficiency) -> f64 {
    match eff {
        Efficiency::Isentropic(e) => t1 + t1 * (r.powf((k - 1.0) / k) - 1.0) / e,
        Efficiency::Polytropic(e) => t1 * r.powf((k - 1.0) / (k * e)),
    }
}

fn one(
    pair: &Pair,
    p1: f64,
    t1: f64,
    p2: f64,
    eff: Efficiency,
    flow: Option<Flow>,
    x: &[f64],
) -> Result<CompressResult, CliError> {
    let m: &dyn Model = pair.built.model()?;
    let ig: &dyn Model = &pair.ideal;
    let id = pair.built.id.as_str();
    let e = ctx(id);
    let s: Stage = stage(m, p1, t1, p2, x, eff).map_err(&e)?;
    let si: Stage = stage(ig, p1, t1, p2, x, eff).map_err(&e)?;
    let c = Compared::new;
    let mut notes = pair.built.notes.clone();
    if s.discharge.phase == Phase::TwoPhase || s.discharge.phase == Phase::Liquid {
        notes.push(format!(
            "warning: the discharge state is {} by the flash; the stage was computed for gas",
            s.discharge.phase
        ));
    }
    let (mass_flow, actual, power) = match flow {
        Some(f) => {
            let n = molar_flow(m, f, x, (t1, p1)).map_err(&e)?;
            let ni = molar_flow(ig, f, x, (t1, p1)).map_err(&e)?;
            let mm = s.suction.molar_mass;
            let (q, qi) = (n * mm, ni * mm);
            (
                Some(c(q, qi)),
                Some(c(n / s.suction.rho, ni / si.suction.rho)),
                Some(c(q * s.specific_work, qi * si.specific_work)),
            )
        }
        None => (None, None, None),
    };
    let r = p2 / p1;
    let k_t = 0.5 * (s.exponents_suction.temperature_k + s.exponents_discharge.temperature_k);
    let method = match eff {
        Efficiency::Isentropic(_) => {
            "h2 = h1 + (h(P2, s1) - h1)/eta_s from the model's enthalpy and entropy; no \
             exponent assumed"
        }
        Efficiency::Polytropic(_) => {
            "polytropic path dh = v dP/eta_p integrated in ln P (Runge-Kutta) from the \
             model's enthalpy and volume; no exponent assumed"
        }
    };
    Ok(CompressResult {
        model: id.to_string(),
        model_name: pair.built.name.clone(),
        discharge_temperature_k: s.discharge.t,
        discharge_temperature_ideal_k: si.discharge.t,
        discharge_temperature_ideal_error_pct: c(s.discharge.t, si.discharge.t).ideal_error_pct,
        specific_work_j_kg: s.specific_work,
        specific_work_ideal_j_kg: si.specific_work,
        specific_work_ideal_error_pct: c(s.specific_work, si.specific_work).ideal_error_pct,
        method: format!("{method} ({} steps)", s.path_steps),
        isentropic_head_j_kg: c(s.isentropic_head, si.isentropic_head),
        polytropic_head_path_j_kg: c(s.polytropic_head_path, si.polytropic_head_path),
        polytropic_head_schultz_j_kg: c(s.schultz.head, si.schultz.head),
        schultz_minus_path_pct: 100.0 * s.head_difference,
        schultz_f: s.schultz.f,
        schultz_n: s.schultz.n,
        schultz_discharge_temperature_k: s.schultz.discharge.t,
        head_quadrature_j_kg: s.polytropic_head_quadrature,
        isentropic_efficiency: s.isentropic_efficiency,
        polytropic_efficiency: s.polytropic_efficiency,
        isentropic_discharge_temperature_k: c(s.isentropic_discharge.t, si.isentropic_discharge.t),
        z_suction: s.suction.z,
        z_discharge: s.discharge.z,
        exponents_suction: exps(&s.exponents_suction),
        exponents_discharge: exps(&s.exponents_discharge),
        shortcuts: vec![
            Shortcut {
                exponent_used: "ideal-gas cp0/cv0 at suction",
                k: s.exponents_suction.ideal_k,
                discharge_temperature_k: shortcut(t1, r, s.exponents_suction.ideal_k, eff),
            },
            Shortcut {
                exponent_used:
                    "real-gas isentropic temperature exponent, mean of suction and discharge",
                k: k_t,
                discharge_temperature_k: shortcut(t1, r, k_t, eff),
            },
        ],
        mass_flow_kg_s: mass_flow,
        actual_inlet_flow_m3_s: actual,
        power_w: power,
        suction: StateReport::from(&s.suction),
        discharge: StateReport::from(&s.discharge),
        notes,
    })
}
