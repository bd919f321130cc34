//! Integrity and plausibility of the component table: every row loads, names are unique and
//! resolve to their own row, sources resolve, and the constants obey physical bounds and
//! identities.

use approx::assert_relative_eq;
use fluids::{all, find, normalize, source};
use std::collections::HashMap;

/// Molar gas constant, J/(mol K): exact since the 2019 SI (CODATA 2018).
const R: f64 = 8.314_462_618;

#[test]
fn data_loads_and_has_the_engineering_set() {
    fluids::data_status().expect("embedded data must load");
    assert!(all().len() >= 45, "only {} components", all().len());
    for id in [
        "methane",
        "ethane",
        "propane",
        "n-butane",
        "n-pentane",
        "n-hexane",
        "n-heptane",
        "n-octane",
        "n-nonane",
        "n-decane",
        "isobutane",
        "isopentane",
        "neopentane",
        "ethylene",
        "propylene",
        "acetylene",
        "nitrogen",
        "oxygen",
        "argon",
        "helium",
        "neon",
        "hydrogen",
        "co",
        "co2",
        "h2s",
        "so2",
        "water",
        "ammonia",
        "methanol",
        "ethanol",
        "benzene",
        "toluene",
        "cyclohexane",
        "air",
        "r134a",
        "r32",
        "r1234yf",
        "sf6",
        "dimethyl-ether",
        "chlorine",
        "hcl",
        "n2o",
        "krypton",
        "xenon",
    ] {
        assert_eq!(find(id).map(|c| c.id.as_str()), Ok(id));
    }
}

#[test]
fn ids_unique_and_lowercase() {
    let mut seen = HashMap::new();
    for c in all() {
        assert_eq!(c.id, c.id.to_lowercase(), "id {} not lowercase", c.id);
        assert!(
            seen.insert(c.id.clone(), ()).is_none(),
            "duplicate id {}",
            c.id
        );
    }
}

#[test]
fn every_name_resolves_to_its_own_row_and_none_is_shared() {
    let mut owner: HashMap<String, &str> = HashMap::new();
    for c in all() {
        let names = [&c.id, &c.name, &c.cas].into_iter().chain(c.aliases.iter());
        for n in names {
            assert_eq!(find(n).map(|r| r.id.as_str()), Ok(c.id.as_str()), "{n}");
            if let Some(other) = owner.insert(normalize(n), &c.id) {
                assert_eq!(other, c.id, "\"{n}\" is shared by {other} and {}", c.id);
            }
        }
    }
}

#[test]
fn every_source_key_resolves() {
    for c in all() {
        assert_eq!(c.source_key, c.source_keys[0]);
        let cp_keys: Vec<&str> = c.cp_source_key.split(';').collect();
        for k in c.source_keys.iter().map(String::as_str).chain(cp_keys) {
            assert!(source(k).is_some(), "{}: source key {k} unresolved", c.id);
        }
        assert!(!c.source.is_empty() && !c.cp_source.is_empty());
    }
}

#[test]
fn constants_are_physically_plausible() {
    for c in all() {
        assert!(
            c.tc_k > 0.0 && c.pc_pa > 0.0 && c.molar_mass_kg_mol > 0.0,
            "{}",
            c.id
        );
        assert!(
            c.omega > -0.5 && c.omega < 1.5,
            "{} omega {}",
            c.id,
            c.omega
        );
        if let Some(tb) = c.tb_k {
            assert!(
                tb > 0.0 && tb < c.tc_k,
                "{}: Tb {tb} vs Tc {}",
                c.id,
                c.tc_k
            );
        }
        if let Some(tt) = c.ttriple_k {
            assert!(tt > 0.0 && tt < c.tc_k, "{}", c.id);
            if let Some(tb) = c.tb_k {
                assert!(tt < tb, "{}: triple point above Tb", c.id);
            }
        }
        // Every Zc of a real fluid lies between about 0.2 (water 0.229) and 0.32 (quantum gases).
        if let Some(zc) = c.zc {
            assert!(zc > 0.2 && zc < 0.32, "{} Zc {zc}", c.id);
        }
    }
}

#[test]
fn zc_matches_pc_vc_over_r_tc() {
    // Identity Zc = Pc Vc / (R Tc); 0.01 covers the rounding of the tabulated columns
    // (the worst row, CO, is 0.003 off, as noted in its row).
    let mut checked = 0;
    for c in all() {
        if let (Some(vc), Some(zc)) = (c.vc_m3_mol, c.zc) {
            let z = c.pc_pa * vc / (R * c.tc_k);
            assert!(
                (z - zc).abs() < 0.01,
                "{}: Zc {zc} vs PcVc/RTc {z:.4}",
                c.id
            );
            checked += 1;
        }
    }
    assert!(checked >= 45);
}

/// IUPAC 2007 standard atomic weights, g/mol (from memory of the IUPAC 2007 table, Pure Appl.
/// Chem. 81 (2009) 2131).
fn atomic_weight(symbol: &str) -> Option<f64> {
    Some(match symbol {
        "H" => 1.00794,
        "He" => 4.002602,
        "C" => 12.0107,
        "N" => 14.0067,
        "O" => 15.9994,
        "F" => 18.9984032,
        "Ne" => 20.1797,
        "S" => 32.065,
        "Cl" => 35.453,
        "Ar" => 39.948,
        "Kr" => 83.798,
        "Xe" => 131.293,
        _ => return None,
    })
}

/// Molar mass of a plain formula such as C2H6O; `None` if it is not one.
fn formula_mass(f: &str) -> Option<f64> {
    let chars: Vec<char> = f.chars().collect();
    let (mut i, mut m) = (0, 0.0);
    while i < chars.len() {
        if !chars[i].is_ascii_uppercase() {
            return None;
        }
        let mut sym = chars[i].to_string();
        i += 1;
        while i < chars.len() && chars[i].is_ascii_lowercase() {
            sym.push(chars[i]);
            i += 1;
        }
        let mut n = 0u32;
        while i < chars.len() && chars[i].is_ascii_digit() {
            n = n * 10 + chars[i].to_digit(10)?;
            i += 1;
        }
        m += atomic_weight(&sym)? * f64::from(n.max(1));
    }
    Some(m)
}

#[test]
fn formula_parser_works_on_known_masses() {
    // ISO 6976:2016 molar masses (from memory): CH4 16.04246, N2 28.0134.
    assert_relative_eq!(formula_mass("CH4").unwrap(), 16.04246, epsilon = 1e-5);
    assert_relative_eq!(formula_mass("N2").unwrap(), 28.0134, epsilon = 1e-5);
    assert!(formula_mass("N2/O2").is_none());
}

#[test]
fn molar_mass_equals_formula_sum() {
    let mut checked = 0;
    for c in all() {
        let Some(f) = &c.formula else { continue };
        let m = formula_mass(f).unwrap_or_else(|| panic!("{}: formula {f} not plain", c.id));
        let tab = c.molar_mass_kg_mol * 1e3;
        assert!(
            (m - tab).abs() < 0.01,
            "{}: M {tab} vs formula {m:.5}",
            c.id
        );
        checked += 1;
    }
    // Only air has no formula.
    assert_eq!(checked, all().len() - 1);
}

#[test]
fn air_molar_mass_is_its_composition_average() {
    // Lemmon et al. (2000) composition 0.7812 N2, 0.2096 O2, 0.0092 Ar and M = 28.9586 g/mol.
    let m = 0.7812 * formula_mass("N2").unwrap()
        + 0.2096 * formula_mass("O2").unwrap()
        + 0.0092 * formula_mass("Ar").unwrap();
    assert_relative_eq!(m, 28.9586, epsilon = 1e-3);
    assert_relative_eq!(
        find("air").unwrap().molar_mass_kg_mol * 1e3,
        28.9586,
        epsilon = 1e-9
    );
}

#[test]
fn to_component_carries_si_values() {
    for c in all() {
        let k = c.to_component();
        assert_relative_eq!(k.tc, c.tc_k);
        assert_relative_eq!(k.pc, c.pc_pa);
        assert_relative_eq!(k.molar_mass, c.molar_mass_kg_mol);
        assert_eq!(k.vc.is_some(), c.vc_m3_mol.is_some());
        assert_eq!(k.cp.range(), c.cp_range_k);
    }
    // Water: IAPWS-95 critical point 647.096 K, 22.064 MPa (from memory of Wagner & Pruss 2002).
    let w = find("H2O").unwrap().to_component();
    assert_relative_eq!(w.tc, 647.096, epsilon = 1e-9);
    assert_relative_eq!(w.pc, 22.064e6, max_relative = 1e-12);
    assert_relative_eq!(w.molar_mass, 0.01801528, max_relative = 1e-12);
}
