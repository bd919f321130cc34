//! A natural gas known only by its specific gravity (`--gravity`, with `--n2`, `--co2`,
//! `--h2s`): Z and density from the gas-gravity correlations in every command where Z suffices
//! (state, table, vessel, flow), energies refused, and the same answer as the gas given by its
//! composition.

use assert_cmd::Command;
use serde_json::Value;

fn run(args: &[&str]) -> (i32, String, String) {
    let out = Command::cargo_bin("zfactor")
        .unwrap()
        .args(args)
        .output()
        .unwrap();
    (
        out.status.code().unwrap_or(-1),
        String::from_utf8_lossy(&out.stdout).to_string(),
        String::from_utf8_lossy(&out.stderr).to_string(),
    )
}

fn json(args: &[&str]) -> Value {
    let (code, out, err) = run(&[args, &["-f", "json"]].concat());
    assert!(code == 0 || code == 3, "{args:?}: exit {code}: {err}");
    serde_json::from_str(&out).unwrap()
}

fn z_of(v: &Value, model: &str) -> f64 {
    v["results"]
        .as_array()
        .unwrap()
        .iter()
        .find(|r| r["model"] == model)
        .unwrap_or_else(|| panic!("no {model} in {v}"))["z"]
        .as_f64()
        .unwrap()
}

#[test]
fn state_by_gravity_follows_the_published_equations() {
    // Sutton (1985), SPE 14265, in degrees Rankine and psia: Tpc = 169.2 + 349.5 g - 74.0 g^2,
    // Ppc = 756.8 - 131.0 g - 3.6 g^2 (from memory of the paper); Z from the
    // Dranchuk-Abou-Kassem fit at the pseudo-reduced state (eos::gas_gravity::dak, checked
    // there against the Standing-Katz chart).
    let v = json(&[
        "state",
        "--gravity",
        "0.65",
        "-t",
        "60 degC",
        "-p",
        "100 bar",
    ]);
    let g: f64 = 0.65;
    let tpc = (169.2 + 349.5 * g - 74.0 * g * g) * 5.0 / 9.0;
    let ppc = (756.8 - 131.0 * g - 3.6 * g * g) * 6_894.757_293_168_361;
    let mut w = Vec::new();
    let z = eos::gas_gravity::dak::z(333.15 / tpc, 100e5 / ppc, &mut w).unwrap();
    assert!(w.is_empty());
    assert!(
        (z_of(&v, "dak") - z).abs() < 1e-12,
        "{} vs {z}",
        z_of(&v, "dak")
    );
    // Both correlations by default, no energies (null in JSON), the gravity in the label.
    let r = &v["results"];
    assert_eq!(r.as_array().unwrap().len(), 2);
    assert!(r[0]["enthalpy_j_kg"].is_null() && r[1]["cp_j_mol_k"].is_null());
    assert_eq!(v["fluid"], "natural gas of gravity 0.65");
    let rho = r[0]["mass_density_kg_m3"].as_f64().unwrap();
    let m = 0.65 * 0.028_964_7;
    let expected = 100e5 * m / (z * eos::constants::R * 333.15);
    assert!((rho / expected - 1.0).abs() < 1e-12);
}

#[test]
fn a_gas_by_gravity_equals_the_same_gas_by_composition() {
    // The gravity of this analysis from its molar masses (the component table's, from the
    // formulas with IUPAC atomic weights); the correlations take the non-hydrocarbons out of
    // the gravity in both ways in, so Z must agree to round-off.
    let mix = "methane=0.85,ethane=0.06,propane=0.02,nitrogen=0.03,co2=0.03,h2s=0.01";
    let by_mix = json(&[
        "state", "--mix", mix, "-t", "20 degC", "-p", "80 barg", "-m", "dak,hy",
    ]);
    let r = &by_mix["results"][0];
    let m = r["mass_density_kg_m3"].as_f64().unwrap() / r["molar_density_mol_m3"].as_f64().unwrap();
    // By hand from the rounded molar masses: 18.82 g/mol.
    assert!((m * 1e3 - 18.82).abs() < 0.01, "{m}");
    let gravity = format!("{:.15}", m / 0.028_964_7);
    let by_gravity = json(&[
        "state",
        "--gravity",
        &gravity,
        "--n2",
        "3%",
        "--co2",
        "0.03",
        "--h2s",
        "1 %",
        "-t",
        "20 degC",
        "-p",
        "80 barg",
    ]);
    for model in ["dak", "hy"] {
        let (a, b) = (z_of(&by_mix, model), z_of(&by_gravity, model));
        assert!(
            (a - b).abs() < 1e-9,
            "{model}: {a} by composition, {b} by gravity"
        );
    }
}

#[test]
fn a_methane_gravity_gives_methane_z_at_base_conditions() {
    // ISO 6976:1995 Table 2 (from memory; shared/reference/gases/iso6976_compression_factors
    // .csv): methane Z = 0.99800 at 288.15 K and 101.325 kPa. Sutton's correlation is a fit
    // to natural gases, so the gravity of methane (16.0425/28.9647) lands within 5e-4.
    let g = format!("{:.6}", 16.0425 / 28.9647);
    let v = json(&["state", "--gravity", &g, "-t", "15 degC", "-p", "1 atm"]);
    for model in ["dak", "hy"] {
        let z = z_of(&v, model);
        assert!((z - 0.998).abs() < 5e-4, "{model}: {z}");
    }
}

#[test]
fn table_vessel_and_flow_take_the_gravity() {
    let gas = ["--gravity", "0.7", "--co2", "2%", "-t", "15 degC"];
    let state = json(&[&["state"][..], &gas, &["-p", "200 barg", "-m", "dak"]].concat());
    let z = z_of(&state, "dak");
    // table: the same Z as state
    let (code, csv, err) = run(&[
        &["table"][..],
        &gas[..4],
        &["-t", "15 degC", "-p", "200 barg", "-m", "dak", "-f", "csv"],
    ]
    .concat());
    assert_eq!(code, 0, "{err}");
    // A gas-gravity correlation has no phase equilibrium: the basis must not claim a flash.
    let method = csv.lines().find(|l| l.starts_with("# method:")).unwrap();
    assert!(
        method.contains("not flashed") && !method.contains("is flashed"),
        "{method}"
    );
    let row = csv
        .lines()
        .find(|l| !l.starts_with('#') && !l.starts_with("temp"))
        .unwrap();
    let zt: f64 = row.split(',').nth(3).unwrap().parse().unwrap();
    assert!((zt - z).abs() < 1e-12, "{zt} vs {z}");
    // vessel: n = P V / (Z R T), energies null
    let v = json(
        &[
            &["vessel"][..],
            &gas,
            &["-p", "200 barg", "--volume", "50 L", "-m", "dak"],
        ]
        .concat(),
    );
    let r = &v["results"][0];
    let n = 201.01325e5 * 0.05 / (z * eos::constants::R * 288.15);
    assert!((r["moles_mol"].as_f64().unwrap() / n - 1.0).abs() < 1e-12);
    assert!(r["state"]["enthalpy_j_kg"].is_null());
    // flow: the same Z at the flowing conditions
    let f = json(
        &[
            &["flow"][..],
            &gas,
            &["-p", "200 barg", "--flow", "1 MMscfd", "-m", "dak"],
        ]
        .concat(),
    );
    let actual = f["results"][0]["volumes"]
        .as_array()
        .unwrap()
        .iter()
        .find(|v| v["base"] == "actual")
        .unwrap()["z"]
        .as_f64()
        .unwrap();
    assert!((actual - z).abs() < 1e-12);
}

#[test]
fn flow_answers_with_the_gas_gravity_correlations_for_a_mixture() {
    // Was refused ("needs a model with a Helmholtz energy"), though a flow needs only Z.
    let v = json(&[
        "flow",
        "--mix",
        "methane=0.9,ethane=0.1",
        "--flow",
        "10 kg/s",
        "-m",
        "dak,hy",
    ]);
    assert_eq!(v["results"].as_array().unwrap().len(), 2);
    let s = json(&[
        "state",
        "--mix",
        "methane=0.9,ethane=0.1",
        "-t",
        "15 degC",
        "-p",
        "101.325 kPa",
        "-m",
        "dak",
    ]);
    let at15 = v["results"][0]["volumes"]
        .as_array()
        .unwrap()
        .iter()
        .find(|v| v["base"] == "15degC")
        .unwrap()["z"]
        .as_f64()
        .unwrap();
    assert!((at15 - z_of(&s, "dak")).abs() < 1e-12);
}

#[test]
fn what_a_gravity_cannot_give_is_refused_with_the_reason() {
    let base = ["--gravity", "0.65", "-t", "15 degC", "-p", "70 barg"];
    let cases: [(&[&str], &str); 6] = [
        (&["state", "-m", "pr"], "choose -m dak or -m hy"),
        (
            &["table", "-m", "dak", "--properties", "z,h"],
            "heat capacity",
        ),
        (
            &[
                "vessel",
                "--volume",
                "1 m3",
                "--to-temperature",
                "50 degC",
                "-m",
                "dak",
            ],
            "--to-temperature",
        ),
        (&["state", "--kij", "methane-co2=0.1"], "--kij"),
        (
            &["state", "--co2", "0.6", "--gravity", "0.6"],
            "hydrocarbon part would have gravity",
        ),
        (&["state", "--n2", "5"], "above one"),
    ];
    for (args, text) in cases {
        let mut all: Vec<&str> = args.to_vec();
        for a in base {
            if !(args.contains(&"--gravity") && (a == "--gravity" || a == "0.65")) {
                all.push(a);
            }
        }
        let (code, _, err) = run(&all);
        assert_eq!(code, 2, "{all:?}: {err}");
        assert!(err.contains(text), "{all:?}: {err}");
    }
    // a density or an enthalpy is not a gravity gas's input
    let (code, _, err) = run(&[
        "state",
        "--gravity",
        "0.65",
        "-t",
        "15 degC",
        "-d",
        "50 kg/m3",
    ]);
    assert_eq!(code, 2);
    assert!(err.contains("--temperature and --pressure"), "{err}");
    // --co2 without --gravity, and --gravity beside --fluid, are refused by the parser
    assert_eq!(
        run(&["state", "--fluid", "methane", "--co2", "0.1", "-t", "15 degC", "-p", "1 bar"]).0,
        2
    );
    assert_eq!(
        run(&[
            "state",
            "--fluid",
            "methane",
            "--gravity",
            "0.6",
            "-t",
            "15 degC",
            "-p",
            "1 bar"
        ])
        .0,
        2
    );
    // commands that need heat or phase equilibrium do not offer --gravity at all
    for cmd in [
        "relief",
        "compress",
        "flash",
        "envelope",
        "saturation",
        "compare",
        "process",
    ] {
        let (_, help, _) = run(&[cmd, "--help"]);
        assert!(!help.contains("--gravity"), "{cmd} offers --gravity");
    }
}

#[test]
fn a_mass_flow_comes_back_as_given_with_a_reference_formulation() {
    // The flow's molar mass is the model's own (Setzmann-Wagner methane's), so 10 kg/s is
    // 10 kg/s again, not 10 x (M_table / M_formulation).
    let v = json(&[
        "flow",
        "--fluid",
        "methane",
        "--flow",
        "10 kg/s",
        "-m",
        "reference,dak",
    ]);
    for r in v["results"].as_array().unwrap() {
        let m = r["mass_flow_kg_s"].as_f64().unwrap();
        assert!((m - 10.0).abs() < 1e-12, "{}: {m}", r["model"]);
    }
}
