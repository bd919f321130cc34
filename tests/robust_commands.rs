//! Property-based tests (proptest) of the command paths: random fluids, mixtures, states and
//! models through every command of the binary. Whatever the input, the process ends with a
//! documented exit code (0, 1, 2 or 3; never a panic, which would be 101), prints valid JSON
//! when it succeeds, and one message on stderr when it does not.

use proptest::prelude::*;
use std::process::Command;

const FLUIDS: [&str; 10] = [
    "methane", "ethane", "propane", "n-butane", "nitrogen", "co2", "water", "hydrogen", "h2s",
    "n-decane",
];
/// Every model id of the tool, so that mixtures meet every model (the gas-gravity
/// correlations among them, which give no component fugacities).
const MODELS: [&str; 16] = [
    "pr",
    "srk",
    "vdw",
    "rk",
    "pr78",
    "pr-pen",
    "virial",
    "lk",
    "reference",
    "ideal",
    "srk-pen",
    "pr78-pen",
    "dak",
    "hy",
    "if97",
    "sw12",
];

/// The output formats every command has; JSON is checked for validity, the others only for
/// a clean end.
const FORMATS: [&str; 3] = ["json", "table", "csv"];

fn run(args: &[String], json: bool) {
    let out = Command::new(env!("CARGO_BIN_EXE_zfactor"))
        .args(args)
        .output()
        .unwrap();
    let code = out.status.code();
    let err = String::from_utf8_lossy(&out.stderr);
    assert!(
        matches!(code, Some(0..=3)),
        "{args:?}: exit {code:?}: {err}"
    );
    assert!(!err.contains("panicked"), "{args:?}: {err}");
    match code {
        Some(0 | 3) if json => {
            let v: Result<serde_json::Value, _> = serde_json::from_slice(&out.stdout);
            assert!(v.is_ok(), "{args:?}: stdout is not JSON");
        }
        Some(0 | 3) => assert!(!out.stdout.is_empty(), "{args:?}: success without output"),
        _ => {
            assert!(out.stdout.is_empty(), "{args:?}: partial output on failure");
            assert!(!err.trim().is_empty(), "{args:?}: failed without a message");
        }
    }
}

fn s(v: &str) -> String {
    v.to_string()
}

proptest! {
    #![proptest_config(ProptestConfig { cases: 160, .. ProptestConfig::default() })]

    #[test]
    fn every_command_ends_cleanly(
        a in 0usize..10,
        b in 0usize..10,
        frac in 0.05f64..0.95,
        mixed in any::<bool>(),
        t in 20.0f64..1500.0,
        log_p in 3.0f64..8.3,
        m in 0usize..16,
        command in 0usize..9,
        f in 0usize..3,
    ) {
        let fluid: Vec<String> = if mixed && a != b {
            vec![s("--mix"), format!("{}={frac},{}={}", FLUIDS[a], FLUIDS[b], 1.0 - frac)]
        } else {
            vec![s("--fluid"), s(FLUIDS[a])]
        };
        let t_s = format!("{t} K");
        let p = 10f64.powf(log_p);
        let p_s = format!("{p} Pa");
        let p2_s = format!("{} Pa", p * 3.0);
        let model = s(MODELS[m]);
        let format = [s("--format"), s(FORMATS[f])];
        let mut args: Vec<String> = match command {
            0 => vec![s("state"), s("-t"), t_s, s("-p"), p_s, s("-m"), model],
            1 => vec![s("flash"), s("-t"), t_s, s("-p"), p_s, s("-m"), model],
            2 => vec![s("vessel"), s("--volume"), s("1 m3"), s("-t"), t_s, s("-p"), p_s,
                      s("--to-temperature"), format!("{} K", t * 1.2), s("-m"), model],
            3 => vec![s("compress"), s("--suction-temperature"), t_s,
                      s("--suction-pressure"), p_s, s("--discharge-pressure"), p2_s,
                      s("--isentropic-efficiency"), s("0.8"), s("-m"), model],
            4 => vec![s("relief"), s("-t"), t_s, s("-p"), p_s, s("-m"), model],
            5 => vec![s("process"), s("--path"), s("isenthalpic"), s("-t"), t_s, s("-p"),
                      p2_s, s("--to-pressure"), p_s, s("-m"), model],
            6 => vec![s("saturation"), s("-t"), t_s, s("-m"), model],
            7 => vec![s("table"), s("-t"), format!("{t_s},{} K", t * 1.1), s("-p"), p_s,
                      s("-m"), model],
            _ => vec![s("compare"), s("-t"), t_s, s("-p"), p_s, s("-m"), model],
        };
        args.splice(1..1, fluid);
        args.extend(format);
        run(&args, f == 0);
    }
}

#[test]
fn the_argument_forms_above_compute_on_ordinary_states() {
    // Guards the property test against passing on argument errors alone: the same forms on
    // an ordinary state must succeed (exit 0 or 3).
    let z = env!("CARGO_BIN_EXE_zfactor");
    let cases: [&[&str]; 8] = [
        &[
            "state", "--fluid", "methane", "-t", "300 K", "-p", "1e6 Pa", "-m", "pr",
        ],
        &[
            "flash",
            "--mix",
            "methane=0.5,propane=0.5",
            "-t",
            "250 K",
            "-p",
            "2e6 Pa",
            "-m",
            "pr",
        ],
        &[
            "vessel",
            "--fluid",
            "methane",
            "--volume",
            "1 m3",
            "-t",
            "300 K",
            "-p",
            "1e6 Pa",
            "--to-temperature",
            "360 K",
            "-m",
            "pr",
        ],
        &[
            "compress",
            "--fluid",
            "methane",
            "--suction-temperature",
            "300 K",
            "--suction-pressure",
            "1e6 Pa",
            "--discharge-pressure",
            "3e6 Pa",
            "--isentropic-efficiency",
            "0.8",
            "-m",
            "pr",
        ],
        &[
            "relief", "--fluid", "methane", "-t", "300 K", "-p", "1e6 Pa", "-m", "pr",
        ],
        &[
            "process",
            "--fluid",
            "methane",
            "--path",
            "isenthalpic",
            "-t",
            "300 K",
            "-p",
            "3e6 Pa",
            "--to-pressure",
            "1e6 Pa",
            "-m",
            "pr",
        ],
        &[
            "saturation",
            "--fluid",
            "methane",
            "-t",
            "150 K",
            "-m",
            "pr",
        ],
        &[
            "table",
            "--fluid",
            "methane",
            "-t",
            "300 K,330 K",
            "-p",
            "1e6 Pa",
            "-m",
            "pr",
        ],
    ];
    for args in cases {
        let out = Command::new(z)
            .args(args)
            .args(["--format", "json"])
            .output()
            .unwrap();
        assert!(
            matches!(out.status.code(), Some(0 | 3)),
            "{args:?}: {}",
            String::from_utf8_lossy(&out.stderr)
        );
    }
}

#[test]
fn state_of_a_mixture_ends_cleanly_with_every_model_in_every_format() {
    // The gas-gravity correlations give no component fugacities; the table renderer once
    // indexed them and panicked (exit 101) on a mixture.
    for model in MODELS {
        for format in FORMATS {
            let args: Vec<String> = [
                "state",
                "--mix",
                "methane=0.9,ethane=0.1",
                "-t",
                "40 degC",
                "-p",
                "70 barg",
                "-m",
                model,
                "--format",
                format,
            ]
            .iter()
            .map(|a| s(a))
            .collect();
            run(&args, format == "json");
        }
    }
    for model in ["dak", "hy"] {
        let out = Command::new(env!("CARGO_BIN_EXE_zfactor"))
            .args(["state", "--mix", "methane=0.9,ethane=0.1", "-t", "40 degC"])
            .args(["-p", "70 barg", "-m", model])
            .output()
            .unwrap();
        assert!(
            matches!(out.status.code(), Some(0 | 3)),
            "{model}: {}",
            String::from_utf8_lossy(&out.stderr)
        );
    }
}
