//! Randomised and mutation-based tests of every parser of user input on the command line:
//! quantities with units (temperature, pressure, density, volume) and compositions. Each
//! parser gets at least 100,000 inputs: valid seeds mutated by insertion, deletion,
//! duplication and replacement of characters (ASCII, digits, unit letters, separators and
//! multi-byte characters), plus purely random strings. The property: no panic; every accepted
//! value is finite and physically allowed; every refusal is a message that quotes the input.

use zfactor::cli::Basis;
use zfactor::feed::parse_mix;
use zfactor::units;

/// xorshift64*: a small deterministic generator, so failures reproduce.
struct Rng(u64);

impl Rng {
    fn next(&mut self) -> u64 {
        self.0 ^= self.0 >> 12;
        self.0 ^= self.0 << 25;
        self.0 ^= self.0 >> 27;
        self.0.wrapping_mul(0x2545_f491_4f6c_dd1d)
    }
    fn below(&mut self, n: usize) -> usize {
        (self.next() % n as u64) as usize
    }
}

const ALPHABET: &[&str] = &[
    "0", "1", "5", "9", ".", "-", "+", "e", "E", " ", "K", "C", "F", "R", "deg", "°", "bar", "g",
    "a", "Pa", "k", "M", "psi", "atm", "(", ")", "/", "m3", "kg", "mol", "L", "%", "=", ",", ";",
    ":", "methane", "ethane", "co2", "nan", "inf", "1e308", "1e-320", "µ", "³", "\u{0}", "\t", "ÿ",
    "🔥", "0.5", "100",
];

fn mutate(rng: &mut Rng, seed: &str) -> String {
    let mut s: Vec<char> = seed.chars().collect();
    for _ in 0..=rng.below(4) {
        let piece: Vec<char> = ALPHABET[rng.below(ALPHABET.len())].chars().collect();
        let at = if s.is_empty() {
            0
        } else {
            rng.below(s.len() + 1)
        };
        match rng.below(4) {
            0 => {
                s.splice(at..at, piece);
            }
            1 if !s.is_empty() => {
                let end = (at + 1 + rng.below(3)).min(s.len());
                s.drain(at.min(s.len() - 1)..end);
            }
            2 if !s.is_empty() => {
                let end = (at + rng.below(4)).min(s.len());
                let dup: Vec<char> = s[at.min(end)..end].to_vec();
                s.splice(at..at, dup);
            }
            _ => {
                let end = (at + 1).min(s.len());
                s.splice(at.min(end)..end, piece);
            }
        }
    }
    s.into_iter().collect()
}

fn random(rng: &mut Rng) -> String {
    (0..rng.below(12))
        .map(|_| ALPHABET[rng.below(ALPHABET.len())])
        .collect()
}

/// Runs `check` on `n` inputs made from `seeds`; returns (accepted, refused).
fn drive(seeds: &[&str], n: usize, mut check: impl FnMut(&str) -> bool) -> (usize, usize) {
    let mut rng = Rng(0x9e37_79b9_7f4a_7c15);
    let (mut ok, mut bad) = (0, 0);
    for k in 0..n {
        let input = if k % 5 == 4 {
            random(&mut rng)
        } else {
            let seed = seeds[rng.below(seeds.len())];
            mutate(&mut rng, seed)
        };
        if check(&input) {
            ok += 1;
        } else {
            bad += 1;
        }
    }
    (ok, bad)
}

const N: usize = 100_000;

#[test]
fn temperatures() {
    let seeds = ["300 K", "25 degC", "77 degF", "540 R", "-40 °C", "1e3 K"];
    let (ok, bad) = drive(&seeds, N, |s| match units::temperature(s) {
        Ok(t) => {
            assert!(t.is_finite() && t > 0.0, "{s:?} -> {t}");
            true
        }
        Err(e) => {
            assert!(
                e.to_string().contains(s.trim()) || s.trim().is_empty(),
                "{e}"
            );
            false
        }
    });
    assert_eq!(ok + bad, N);
    assert!(ok > 1000 && bad > 1000, "accepted {ok}, refused {bad}");
}

#[test]
fn pressures() {
    let seeds = [
        "70 barg",
        "5 MPa",
        "14.7 psia",
        "100 psig",
        "1 atm",
        "3 bar(g)",
        "250 kPa",
    ];
    let (ok, bad) = drive(&seeds, N, |s| match units::pressure(s) {
        Ok(p) => {
            match units::absolute_pressure(s, p, units::DEFAULT_AMBIENT_PA) {
                Ok(abs) => assert!(abs.is_finite() && abs > 0.0, "{s:?}"),
                Err(e) => assert!(e.to_string().contains(s.trim())),
            }
            true
        }
        Err(e) => {
            assert!(
                e.to_string().contains(s.trim()) || s.trim().is_empty(),
                "{e}"
            );
            false
        }
    });
    assert!(ok > 1000 && bad > 1000, "accepted {ok}, refused {bad}");
}

#[test]
fn densities_and_volumes() {
    let seeds = [
        "50 kg/m3",
        "0.9 g/cm3",
        "2 mol/L",
        "1 lb/ft3",
        "1 m3",
        "50 L",
    ];
    let (ok, bad) = drive(&seeds, N, |s| {
        let d = units::density(s);
        let v = units::volume(s);
        if let Ok(d) = &d {
            let m = d.molar(0.016);
            assert!(m.is_finite() && m > 0.0, "{s:?}");
        }
        if let Ok(v) = v {
            assert!(v.is_finite() && v > 0.0, "{s:?}");
        }
        d.is_ok()
    });
    assert!(ok > 1000 && bad > 1000, "accepted {ok}, refused {bad}");
}

#[test]
fn compositions() {
    let seeds = [
        "methane=0.9,ethane=0.1",
        "CH4=90%,C2H6=10%",
        "methane:0.5;co2:0.5",
        "nitrogen=0.78,oxygen=0.21,argon=0.01",
    ];
    let (ok, bad) = drive(&seeds, N, |s| {
        for basis in [Basis::Mole, Basis::Mass] {
            match parse_mix(s, basis, true) {
                Ok(f) => {
                    let sum: f64 = f.mole.iter().sum();
                    assert!((sum - 1.0).abs() < 1e-9, "{s:?}: {sum}");
                    assert!(f
                        .mole
                        .iter()
                        .chain(&f.mass)
                        .all(|x| x.is_finite() && *x > 0.0));
                }
                Err(e) => {
                    assert!(!e.to_string().is_empty());
                    return false;
                }
            }
        }
        true
    });
    assert!(ok > 1000 && bad > 1000, "accepted {ok}, refused {bad}");
}

#[test]
fn grid_axes() {
    use zfactor::compare::grid::parse_axis;
    let seeds = [
        "250 K,300 K,350 K",
        "200..400 K step 25",
        "1..150 bar n 20",
        "1..100 bar n 10 log",
        "0..40 degC step 10",
    ];
    let (ok, bad) = drive(&seeds, N, |s| {
        let t = parse_axis(s, units::temperature);
        let p = parse_axis(s, |q| {
            units::pressure(q).and_then(|r| units::absolute_pressure(q, r, 101_325.0))
        });
        for axis in [&t, &p].into_iter().flatten() {
            assert!(!axis.is_empty(), "{s:?}: empty axis accepted");
            assert!(axis.iter().all(|v| v.is_finite() && *v > 0.0), "{s:?}");
        }
        t.is_ok() || p.is_ok()
    });
    assert!(ok > 1000 && bad > 1000, "accepted {ok}, refused {bad}");
}

#[test]
fn reference_data_files() {
    use zfactor::compare::data_file::{read, Need, Options};
    let seeds = [
        "T [K],P [bar],Z,source\n300,10,0.98,lab\n320,20,0.97,lab\n",
        "T [degC],P [MPa],density [kg/m3],source,phase\n25,1,7.5,x,gas\n30,2,15,y,two-phase\n",
        "P [psia],T [degF],Z,source\n100,60,0.99,a\n",
    ];
    let opts = |skip| Options {
        need: Need::Reference,
        molar_mass: 0.016,
        ambient_pa: 101_325.0,
        skip_bad_rows: skip,
    };
    // Fewer inputs than the one-line parsers: each is a whole file.
    let n = N;
    let (ok, bad) = drive(&seeds, n, |s| {
        let strict = read(s, "fuzz.csv", opts(false));
        let lenient = read(s, "fuzz.csv", opts(true));
        for c in [&strict, &lenient].into_iter().flatten() {
            for r in &c.rows {
                assert!(
                    r.t.is_finite() && r.t > 0.0 && r.p.is_finite() && r.p > 0.0,
                    "{s:?}"
                );
            }
        }
        if let Err(e) = &strict {
            assert!(e.to_string().contains("fuzz.csv"), "{e}");
        }
        strict.is_ok()
    });
    assert!(ok > 100 && bad > 1000, "accepted {ok}, refused {bad}");
}
