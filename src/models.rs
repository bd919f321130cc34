//! Model ids of the command line and JSON, and how each model is built for a fluid.
//!
//! Two kinds of model sit behind one [`BuiltModel`]: those with a residual Helmholtz energy
//! ([`eos::Model`]: the ideal gas, the cubic family and its volume-translated forms, the
//! virial equation, the reference formulations) and those that answer at (T, P) directly
//! ([`eos::tp_explicit::TpModel`]: Lee-Kesler, the gas-gravity correlations, IAPWS-IF97).

use crate::error::{from_eos, CliError};
use crate::feed::Feed;
use eos::cubic::{Cubic, CubicKind};
use eos::gas_gravity::ZCorrelation;
use eos::ideal::IdealGas;
use eos::need::Need;
use eos::phase::Phase;
use eos::properties::Properties;
use eos::pure::PureFluid;
use eos::state::{RootChoice, State};
use eos::tp_explicit::{self, GravityModel, If97Model, LeeKeslerModel, TpModel};
use eos::translated::Translated;
use eos::virial::{Correlation, Virial};
use eos::Model;

/// Every model id the tool knows, simplest first.
pub const ALL_IDS: [&str; 16] = [
    "ideal",
    "vdw",
    "rk",
    "srk",
    "pr",
    "pr78",
    "srk-pen",
    "pr-pen",
    "pr78-pen",
    "virial",
    "lk",
    "dak",
    "hy",
    "if97",
    "sw12",
    "reference",
];

/// The ids "all" stands for: the ideal gas, the cubic family, and the fluid's reference
/// formulations where it has them.
const ALL_SET: [&str; 9] = [
    "ideal",
    "vdw",
    "rk",
    "srk",
    "pr",
    "pr78",
    "if97",
    "sw12",
    "reference",
];

/// The models that take a gas known only by its gravity (`--gravity`).
pub const GRAVITY_ONLY: [&str; 2] = ["dak", "hy"];

/// The models with an ideal-gas part of their own (the reference formulations and IAPWS-IF97):
/// the component table's heat-capacity fits, and their fitted ranges, do not enter them.
pub const OWN_IDEAL_GAS: [&str; 3] = ["reference", "sw12", "if97"];

/// How a model computes.
pub enum Engine {
    /// A residual Helmholtz energy in (T, rho).
    Helmholtz(Box<dyn Model>),
    /// Answers at (T, P).
    TpExplicit(Box<dyn TpModel>),
}

/// A model ready for a feed, with the notes that belong to its basis (k_ij used or missing).
pub struct BuiltModel {
    /// How it computes.
    pub engine: Engine,
    /// Its id.
    pub id: String,
    /// Its display name.
    pub name: String,
    /// The paper or standard it comes from.
    pub citation: String,
    /// Basis notes: which k_ij were used, which pairs had none.
    pub notes: Vec<String>,
    /// The same model as a pure fluid with its own saturation solver (cubic members and the
    /// Helmholtz formulations, for a single component), for states inside the dome and for
    /// the (P, h), (P, s) and quality inputs.
    pub pure: Option<Box<dyn PureFluid + Send + Sync>>,
}

/// A single-phase state from any model.
pub struct ModelState {
    pub props: Properties,
    pub phase: Phase,
    pub roots: usize,
    /// Inputs outside the model's published range.
    pub warnings: Vec<String>,
}

impl BuiltModel {
    /// The model as an [`eos::Model`], when it is one (phase equilibrium needs it).
    pub fn helmholtz(&self) -> Option<&dyn Model> {
        match &self.engine {
            Engine::Helmholtz(m) => Some(m.as_ref()),
            Engine::TpExplicit(_) => None,
        }
    }

    /// The components.
    pub fn components(&self) -> &[eos::Component] {
        match &self.engine {
            Engine::Helmholtz(m) => m.components(),
            Engine::TpExplicit(m) => m.components(),
        }
    }

    /// A pseudo-critical point (T, P) of composition x for naming phases and regions.
    pub fn pseudo_critical(&self, x: &[f64]) -> (f64, f64) {
        match &self.engine {
            Engine::Helmholtz(m) => m.pseudo_critical(x),
            Engine::TpExplicit(m) => m
                .components()
                .iter()
                .zip(x)
                .fold((0.0, 0.0), |(t, p), (c, &xi)| {
                    (t + xi * c.tc, p + xi * c.pc)
                }),
        }
    }

    /// The model as an [`eos::Model`], or a message saying that this model answers at
    /// (T, P) only (the engineering jobs and phase equilibrium need a Helmholtz energy).
    pub fn model(&self) -> Result<&dyn Model, CliError> {
        self.helmholtz().ok_or_else(|| {
            CliError::BadInput(format!(
                "model {} answers at given temperature and pressure only; this calculation \
                 needs a model with a Helmholtz energy (ideal, the cubic family, their \
                 Peneloux forms, virial, reference, sw12)",
                self.id
            ))
        })
    }

    /// The state at (T, P).
    pub fn at_tp(&self, t: f64, p: f64, x: &[f64], root: RootChoice) -> eos::Result<ModelState> {
        self.at_tp_need(t, p, x, root, Need::All)
    }

    /// The state at (T, P) with what `need` asks for computed (see
    /// [`eos::properties::Properties::computed`]).
    pub fn at_tp_need(
        &self,
        t: f64,
        p: f64,
        x: &[f64],
        root: RootChoice,
        need: Need,
    ) -> eos::Result<ModelState> {
        match &self.engine {
            Engine::Helmholtz(m) => {
                State::at_tp_need(m.as_ref(), t, p, x, root, need).map(from_state)
            }
            Engine::TpExplicit(m) => {
                tp_explicit::evaluate_need(m.as_ref(), t, p, x, root, need).map(from_tp)
            }
        }
    }

    /// The stable state at (T, P) (the root of lowest Gibbs energy) with what `need` asks;
    /// where the model knows the stable branch in advance only that branch is searched
    /// ([`State::stable_at_tp_need`]): the same values as [`BuiltModel::at_tp_need`], and
    /// `roots` counts the roots searched.
    pub fn stable_at_tp_need(
        &self,
        t: f64,
        p: f64,
        x: &[f64],
        need: Need,
    ) -> eos::Result<ModelState> {
        match &self.engine {
            Engine::Helmholtz(m) => {
                State::stable_at_tp_need(m.as_ref(), t, p, x, need).map(from_state)
            }
            Engine::TpExplicit(_) => self.at_tp_need(t, p, x, RootChoice::LowestGibbs, need),
        }
    }

    /// The state at (T, molar density).
    pub fn at_trho(
        &self,
        t: f64,
        rho: f64,
        x: &[f64],
        root: RootChoice,
    ) -> eos::Result<ModelState> {
        match &self.engine {
            Engine::Helmholtz(m) => State::at_trho(m.as_ref(), t, rho, x).map(from_state),
            Engine::TpExplicit(m) => {
                tp_explicit::state_trho(m.as_ref(), t, rho, x, root).map(from_tp)
            }
        }
    }

    /// The state at (P, molar density).
    pub fn at_prho(
        &self,
        p: f64,
        rho: f64,
        x: &[f64],
        root: RootChoice,
    ) -> eos::Result<ModelState> {
        match &self.engine {
            Engine::Helmholtz(m) => State::at_prho(m.as_ref(), p, rho, x).map(from_state),
            Engine::TpExplicit(m) => {
                tp_explicit::state_prho(m.as_ref(), p, rho, x, root).map(from_tp)
            }
        }
    }
}

fn from_state(s: State) -> ModelState {
    ModelState {
        props: s.props,
        phase: s.phase,
        roots: s.roots,
        warnings: Vec::new(),
    }
}

fn from_tp(s: tp_explicit::TpState) -> ModelState {
    ModelState {
        props: s.props,
        phase: s.phase,
        roots: 1,
        warnings: s.warnings,
    }
}

fn unknown(part: &str) -> CliError {
    CliError::BadInput(format!(
        "unknown model \"{part}\"; known models: {}, or all (run `zfactor models` for what each is)",
        ALL_IDS.join(", ")
    ))
}

/// Expands a `--model` value ("all", one id, or a comma-separated list) into ids, refusing
/// unknown ones with the list of known ids. "all" keeps only the models that apply to `feed`.
pub fn resolve_ids(spec: &str, feed: &Feed) -> Result<Vec<String>, CliError> {
    if spec.trim().eq_ignore_ascii_case("all") && feed.gravity.is_some() {
        return Ok(GRAVITY_ONLY.iter().map(|s| s.to_string()).collect());
    }
    if spec.trim().eq_ignore_ascii_case("all") {
        return Ok(ALL_SET
            .iter()
            .filter(|id| applies(id, feed))
            .map(|s| s.to_string())
            .collect());
    }
    parse_ids(spec)
}

/// Reads an explicit comma-separated list of model ids (not "all"), refusing unknown ones.
pub fn parse_ids(spec: &str) -> Result<Vec<String>, CliError> {
    let spec = spec.trim();
    let mut ids = Vec::new();
    for part in spec.split(',').map(str::trim).filter(|s| !s.is_empty()) {
        let id = part.to_ascii_lowercase();
        if !ALL_IDS.contains(&id.as_str()) {
            return Err(unknown(part));
        }
        if !ids.contains(&id) {
            ids.push(id);
        }
    }
    if ids.is_empty() {
        return Err(CliError::BadInput(format!(
            "--model \"{spec}\" names no model; known models: {}, or all",
            ALL_IDS.join(", ")
        )));
    }
    Ok(ids)
}

/// True when model `id` can be built for `feed` (reference formulations exist for a few pure
/// fluids, IF97 only for water).
pub fn applies(id: &str, feed: &Feed) -> bool {
    if feed.gravity.is_some() {
        return GRAVITY_ONLY.contains(&id);
    }
    match id {
        "reference" => {
            feed.is_pure() && eos::helmholtz::reference_for(&feed.records[0].id).is_some()
        }
        "sw12" => feed.is_pure() && eos::helmholtz::technical_for(&feed.records[0].id).is_some(),
        "if97" => feed.is_pure() && feed.records[0].id == "water",
        _ => true,
    }
}

fn info(id: &str) -> (String, String) {
    eos::catalogue::find(id).map_or_else(
        || (id.to_string(), String::new()),
        |m| (m.name.to_string(), m.citation.to_string()),
    )
}

/// Builds model `id` for `feed`.
pub fn build(id: &str, feed: &Feed) -> Result<BuiltModel, CliError> {
    if feed.gravity.is_some() && !GRAVITY_ONLY.contains(&id) {
        if !ALL_IDS.contains(&id) {
            return Err(unknown(id));
        }
        return Err(CliError::BadInput(format!(
            "model {id} needs each component's critical constants; a gas known by its \
             --gravity has Z and density from the gas-gravity correlations only: choose -m dak \
             or -m hy (or give the composition with --mix for the other models)"
        )));
    }
    let comps = feed.components();
    let ctx = format!("building model {id}");
    let err = |e| from_eos(&ctx, e);
    let mut notes = Vec::new();
    let mut pure: Option<Box<dyn PureFluid + Send + Sync>> = None;
    let pure_only = |what: &str| {
        CliError::BadInput(format!(
            "model {id} ({what}) is for a single fluid, not a mixture; choose a mixture model \
             such as pr or srk"
        ))
    };
    let engine = match id {
        "ideal" => Engine::Helmholtz(Box::new(IdealGas::new(&comps))),
        "vdw" | "rk" | "srk" | "pr" | "pr78" | "srk-pen" | "pr-pen" | "pr78-pen" => {
            let base = id.trim_end_matches("-pen");
            let kind = CubicKind::from_id(base).ok_or_else(|| unknown(id))?;
            let kij = kij_for(kind, feed, &mut notes);
            if id.ends_with("-pen") {
                // A Rackett Z_RA given with a user component sets its Peneloux shift.
                let z_ra: Option<Vec<f64>> =
                    feed.records.iter().any(|r| r.z_ra.is_some()).then(|| {
                        feed.records
                            .iter()
                            .map(|r| {
                                r.z_ra
                                    .unwrap_or_else(|| eos::translated::rackett_z(r.omega))
                            })
                            .collect()
                    });
                Engine::Helmholtz(Box::new(
                    Translated::peneloux(kind, &comps, kij.as_deref(), z_ra.as_deref())
                        .map_err(err)?,
                ))
            } else {
                let cubic = Cubic::new(kind, &comps, kij.as_deref()).map_err(err)?;
                if feed.is_pure() {
                    pure = Some(Box::new(cubic.clone()));
                }
                Engine::Helmholtz(Box::new(cubic))
            }
        }
        "virial" => Engine::Helmholtz(Box::new(
            Virial::new(&comps, Correlation::Tsonopoulos, None).map_err(err)?,
        )),
        "lk" => Engine::TpExplicit(Box::new(LeeKeslerModel::new(&comps, None).map_err(err)?)),
        "dak" => Engine::TpExplicit(Box::new(GravityModel::new(&comps, ZCorrelation::Dak))),
        "hy" => Engine::TpExplicit(Box::new(GravityModel::new(
            &comps,
            ZCorrelation::HallYarborough,
        ))),
        "if97" => {
            if !feed.is_pure() {
                return Err(pure_only("water and steam"));
            }
            if feed.records[0].id != "water" {
                return Err(CliError::BadInput(format!(
                    "model if97 is the industrial formulation for water and steam, not for {}",
                    feed.records[0].name
                )));
            }
            Engine::TpExplicit(Box::new(If97Model::new(comps[0].clone())))
        }
        "reference" | "sw12" => {
            if !feed.is_pure() {
                return Err(pure_only("a reference formulation"));
            }
            let rec = feed.records[0];
            let found = if id == "reference" {
                eos::helmholtz::reference_for(&rec.id)
            } else {
                eos::helmholtz::technical_for(&rec.id)
            };
            let f = found.ok_or_else(|| {
                CliError::BadInput(format!(
                    "{} has no {} formulation in zfactor; they exist for {}",
                    rec.name,
                    if id == "reference" {
                        "reference"
                    } else {
                        "12-term technical"
                    },
                    if id == "reference" {
                        "water, nitrogen, carbon dioxide, methane, argon and hydrogen"
                    } else {
                        "nitrogen, carbon dioxide, methane and argon"
                    }
                ))
            })?;
            let form = f.formulation();
            let name = format!("{} ({})", form.title, form.fluid);
            // The equation of this fluid, not the catalogue's list of every fluid's.
            let citation = form.citation.clone();
            return Ok(BuiltModel {
                engine: Engine::Helmholtz(Box::new(f.clone())),
                id: id.to_string(),
                name,
                citation,
                notes,
                pure: Some(Box::new(f)),
            });
        }
        _ => return Err(unknown(id)),
    };
    let (name, citation) = info(id);
    Ok(BuiltModel {
        engine,
        id: id.to_string(),
        name,
        citation,
        notes,
        pure,
    })
}

/// The k_ij matrix a cubic member uses for `feed` (the user's values over the built-in
/// ones), with a note that lists every pair's value and origin.
pub fn kij_for(kind: CubicKind, feed: &Feed, notes: &mut Vec<String>) -> Option<Vec<f64>> {
    let family = match kind {
        CubicKind::Pr76 | CubicKind::Pr78 => Some(fluids::KijFamily::PengRobinson),
        CubicKind::Srk => Some(fluids::KijFamily::Soave),
        CubicKind::Vdw | CubicKind::Rk => None,
    };
    if feed.is_pure() {
        return None;
    }
    let Some(f) = family else {
        notes.push("k_ij = 0 for every pair (this member is used without k_ij)".to_string());
        return None;
    };
    let ids = feed.ids();
    let (values, uses) = fluids::kij::resolve(&ids, f, &feed.kij);
    notes.push(kij_note(f, &uses));
    Some(values)
}

/// "k_ij (pr family): methane-co2 = 0.0919 [built-in: knapp1982], ..." for every pair.
pub fn kij_note(family: fluids::KijFamily, uses: &[fluids::KijUse]) -> String {
    use fluids::KijOrigin;
    let pairs: Vec<String> = uses
        .iter()
        .map(|u| {
            let origin = match &u.origin {
                KijOrigin::BuiltIn {
                    source_key,
                    fitted_for,
                    substituted,
                } => {
                    if *substituted {
                        format!(
                            "built-in {source_key}, fitted for {}: no {} value at hand",
                            fitted_for.key(),
                            family.key()
                        )
                    } else {
                        format!("built-in {source_key}")
                    }
                }
                KijOrigin::User(o) => format!("user: {o}"),
                KijOrigin::Unknown => "zero: no value known".to_string(),
            };
            format!("{}-{} = {} [{origin}]", u.a, u.b, u.value)
        })
        .collect();
    format!("k_ij ({} family): {}", family.key(), pairs.join("; "))
}
