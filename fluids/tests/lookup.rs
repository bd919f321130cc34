//! Look-up behaviour: spellings, formulas, CAS numbers, suggestions, ambiguity, search.

use fluids::{find, search, LookupError};

fn id(q: &str) -> String {
    find(q)
        .map(|c| c.id.clone())
        .unwrap_or_else(|e| panic!("{q}: {e}"))
}

#[test]
fn spellings_are_forgiving() {
    for q in [
        "n-butane",
        "N-Butane",
        "n butane",
        "n_butane",
        "  nbutane\t",
        "nC4",
        "NC4",
        "R-600",
    ] {
        assert_eq!(id(q), "n-butane", "{q}");
    }
    assert_eq!(id("iC4"), "isobutane");
    assert_eq!(id("2-methylpropane"), "isobutane");
    assert_eq!(id("Carbon Dioxide"), "co2");
    assert_eq!(id("R134a"), "r134a");
    assert_eq!(id("r-134A"), "r134a");
    assert_eq!(id("HFO-1234yf"), "r1234yf");
    assert_eq!(id("steam"), "water");
}

#[test]
fn cas_numbers_resolve() {
    // CAS registry numbers: methane 74-82-8, carbon dioxide 124-38-9, water 7732-18-5.
    assert_eq!(id("74-82-8"), "methane");
    assert_eq!(id("124-38-9"), "co2");
    assert_eq!(id("7732-18-5"), "water");
}

#[test]
fn unique_formulas_resolve() {
    assert_eq!(id("CH4"), "methane");
    assert_eq!(id("c3h8"), "propane");
    assert_eq!(id("H2S"), "h2s");
    assert_eq!(id("SF6"), "sf6");
    assert_eq!(id("C2H2F4"), "r134a");
    assert_eq!(id("CH4O"), "methanol");
}

#[test]
fn isomer_formulas_are_ambiguous_and_list_candidates() {
    let cases: [(&str, &[&str]); 3] = [
        ("C4H10", &["n-butane", "isobutane"]),
        ("c5h12", &["n-pentane", "isopentane", "neopentane"]),
        ("C2H6O", &["ethanol", "dimethyl-ether"]),
    ];
    for (q, want) in cases {
        match find(q) {
            Err(LookupError::Ambiguous { query, candidates }) => {
                assert_eq!(query, q);
                let mut got = candidates.clone();
                got.sort();
                let mut w: Vec<String> = want.iter().map(|s| s.to_string()).collect();
                w.sort();
                assert_eq!(got, w);
                let msg = LookupError::Ambiguous { query, candidates }.to_string();
                assert!(msg.contains(q) && !msg.contains('\n'));
                for c in want {
                    assert!(msg.contains(c), "{msg}");
                }
            }
            other => panic!("{q}: expected ambiguity, got {other:?}"),
        }
    }
}

#[test]
fn unknown_names_get_close_suggestions() {
    for (typo, want) in [
        ("methan", "methane"),
        ("nitrogn", "nitrogen"),
        ("propan", "propane"),
        ("toulene", "toluene"),
        ("hydrogn", "hydrogen"),
        ("amonia", "ammonia"),
    ] {
        match find(typo) {
            Err(LookupError::Unknown { query, suggestions }) => {
                assert_eq!(query, typo);
                assert!(suggestions.len() <= 5);
                assert_eq!(
                    suggestions.first().map(String::as_str),
                    Some(want),
                    "{typo}: {suggestions:?}"
                );
            }
            other => panic!("{typo}: expected Unknown, got {other:?}"),
        }
    }
    let e = find("methan").unwrap_err().to_string();
    assert!(
        e.contains("\"methan\"") && e.contains("methane") && !e.contains('\n'),
        "{e}"
    );
}

#[test]
fn nonsense_gets_no_suggestions_but_a_clear_message() {
    match find("qqqqzzzz") {
        Err(LookupError::Unknown { suggestions, .. }) => assert!(suggestions.is_empty()),
        other => panic!("{other:?}"),
    }
    for q in ["", "   ", "-", "\u{1F600}", "C4H10C4H10C4H10"] {
        assert!(find(q).is_err(), "{q:?} should not resolve");
    }
    let e = find("qqqqzzzz").unwrap_err().to_string();
    assert!(e.contains("qqqqzzzz") && !e.contains('\n'));
}

#[test]
fn search_finds_substrings() {
    let ids = |t: &str| search(t).iter().map(|c| c.id.clone()).collect::<Vec<_>>();
    let butanes = ids("butane");
    assert!(butanes.contains(&"n-butane".to_string()));
    assert!(butanes.contains(&"isobutane".to_string()));
    assert!(!butanes.contains(&"propane".to_string()));
    let r = ids("R-");
    for want in ["r134a", "r32", "r1234yf", "propane", "water"] {
        assert!(
            r.contains(&want.to_string()),
            "{want} (alias R-...) missing from {r:?}"
        );
    }
    assert_eq!(ids("74-82-8"), ["methane"]);
    assert!(ids("zzzz").is_empty());
    assert_eq!(search("").len(), fluids::all().len());
}

#[test]
fn a_formula_never_resolves_to_another_component() {
    // A formula must name its own row, or be ambiguous among rows that include it; it must not
    // collide with another component's id, name or alias.
    for c in fluids::all() {
        let Some(f) = &c.formula else { continue };
        match find(f) {
            Ok(r) => assert_eq!(r.id, c.id, "formula {f}"),
            Err(LookupError::Ambiguous { candidates, .. }) => assert!(candidates.contains(&c.id)),
            Err(e) => panic!("formula {f}: {e}"),
        }
    }
}

#[test]
fn records_serialize_with_units_in_field_names() {
    let v = serde_json::to_value(find("methane").unwrap()).unwrap();
    assert_eq!(v["id"], "methane");
    assert_eq!(v["confidence"], "high");
    assert!((v["tc_k"].as_f64().unwrap() - 190.56).abs() < 1e-9);
    assert!((v["pc_pa"].as_f64().unwrap() - 4.599e6).abs() < 1e-3);
    assert_eq!(v["cp_segments"].as_array().unwrap().len(), 2);
    assert_eq!(v["cp_range_k"][1].as_f64(), Some(3500.0));
    assert!(v["source"].as_str().unwrap().contains("Poling"));
}
