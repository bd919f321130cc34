//! The user's interaction parameters: `--kij "methane-co2=0.10,ethane-co2@srk=0.13"` and
//! `--kij-file FILE`, read into [`fluids::UserKij`] values that override the built-in table.
//!
//! A pair is written `A-B`, where A and B are any names the component lookup accepts; as
//! names may hold a hyphen themselves (n-butane), the pair is split at the one hyphen that
//! leaves two known components on either side. `@pr` or `@srk` after the pair sets the value
//! for one model family; without it the value is for every family that takes k_ij (the
//! Peng-Robinson members and SRK).
//!
//! The file is CSV: columns `component 1`, `component 2`, `value` (or `k_ij`), and optional
//! `family` (pr, srk, or empty for every family) and `source` (free text, shown with the
//! value); header names in any case. Every error names the file, the line and the column.

use crate::error::CliError;
use fluids::{KijFamily, UserKij};

/// k_ij at or beyond these bounds make a_ij = sqrt(a_i a_j) (1 - k_ij) vanish, change sign
/// or double: refused as a mistake (published values lie well within; common practice).
const LIMIT: f64 = 1.0;

/// Splits "n-butane-co2" into two known component ids.
fn split_pair(pair: &str) -> Result<(String, String), String> {
    let mut found = Vec::new();
    for (i, _) in pair.match_indices('-') {
        let (a, b) = (pair[..i].trim(), pair[i + 1..].trim());
        if let (Ok(ra), Ok(rb)) = (fluids::find(a), fluids::find(b)) {
            found.push((ra.id.clone(), rb.id.clone()));
        }
    }
    match found.len() {
        1 => {
            let (a, b) = found.remove(0);
            if a == b {
                Err(format!("\"{pair}\" pairs {a} with itself"))
            } else {
                Ok((a, b))
            }
        }
        0 => Err(format!(
            "\"{pair}\" is not two known components joined by '-' (e.g. methane-co2, \
             n-butane-nitrogen); see `zfactor fluids`"
        )),
        _ => Err(format!(
            "\"{pair}\" can be read as more than one pair of components; write it with the \
             components' ids (see `zfactor fluids`)"
        )),
    }
}

fn family(text: &str) -> Result<Option<KijFamily>, String> {
    let t = text.trim();
    if t.is_empty() || t.eq_ignore_ascii_case("all") || t == "*" {
        return Ok(None);
    }
    match KijFamily::parse(t) {
        Some(f) => Ok(Some(f)),
        None => Err(format!(
            "family \"{t}\" is not known: write pr (Peng-Robinson, PR78 too), srk, or leave it \
             empty for both"
        )),
    }
}

fn value(text: &str) -> Result<f64, String> {
    let v: f64 = text
        .trim()
        .parse()
        .map_err(|_| format!("\"{}\" is not a number", text.trim()))?;
    if !(v.is_finite() && v.abs() < LIMIT) {
        return Err(format!(
            "k_ij = {} is not accepted: a k_ij lies between -1 and 1 (published values of \
             natural-gas pairs lie between about -0.1 and 0.2)",
            text.trim()
        ));
    }
    Ok(v)
}

/// Reads `--kij "A-B=0.1,C-D@srk=0.2"`.
pub fn parse_list(text: &str) -> Result<Vec<UserKij>, CliError> {
    let bad = |m: String| CliError::BadInput(format!("--kij \"{text}\": {m}"));
    let mut out: Vec<UserKij> = Vec::new();
    for item in text
        .split([',', ';'])
        .map(str::trim)
        .filter(|s| !s.is_empty())
    {
        let (pair, v) = item
            .split_once('=')
            .ok_or_else(|| bad(format!("\"{item}\" is not A-B=value")))?;
        let (pair, fam) = match pair.split_once('@') {
            Some((p, f)) => (p, family(f).map_err(&bad)?),
            None => (pair, None),
        };
        let (a, b) = split_pair(pair.trim()).map_err(&bad)?;
        let v = value(v).map_err(|m| bad(format!("{}: {m}", pair.trim())))?;
        let same =
            |u: &UserKij| u.family == fam && ((u.a == a && u.b == b) || (u.a == b && u.b == a));
        if out.iter().any(same) {
            return Err(bad(format!("{a}-{b} is given twice")));
        }
        out.push(UserKij {
            a,
            b,
            family: fam,
            value: v,
            origin: "--kij".to_string(),
            layer: 1,
        });
    }
    if out.is_empty() {
        return Err(bad(
            "no pair given; write e.g. \"methane-co2=0.10\"".to_string()
        ));
    }
    Ok(out)
}

/// Reads a k_ij file (see the module documentation).
pub fn read_file(path: &str) -> Result<Vec<UserKij>, CliError> {
    let fail = |line: Option<usize>, column: Option<&str>, m: String| {
        let at = crate::file_header::place(path, line, column);
        CliError::BadInput(format!("--kij-file {at}: {m}"))
    };
    let file = std::fs::File::open(path).map_err(|e| fail(None, None, e.to_string()))?;
    let mut rdr = csv::ReaderBuilder::new()
        .trim(csv::Trim::All)
        .flexible(true)
        .from_reader(std::io::BufReader::new(file));
    let headers: Vec<String> = rdr
        .headers()
        .map_err(|e| fail(Some(1), None, format!("the header cannot be read: {e}")))?
        .iter()
        .map(str::to_string)
        .collect();
    let find = |names: &[&str]| {
        headers.iter().position(|h| {
            let h = h.to_ascii_lowercase().replace(['_', ' '], "");
            names.iter().any(|n| h == *n)
        })
    };
    let col_a = find(&["component1", "a", "i"]);
    let col_b = find(&["component2", "b", "j"]);
    let col_v = find(&["value", "kij", "k_ij"]);
    let (Some(ia), Some(ib), Some(iv)) = (col_a, col_b, col_v) else {
        return Err(fail(
            Some(1),
            None,
            format!(
                "the header needs \"component 1\", \"component 2\" and \"value\" (optional \
                 \"family\" and \"source\"); it has: {}",
                headers.join(", ")
            ),
        ));
    };
    let i_family = find(&["family", "model", "eos"]);
    let i_source = find(&["source"]);
    let mut out: Vec<UserKij> = Vec::new();
    for rec in rdr.records() {
        let rec = rec.map_err(|e| {
            let line = e.position().map(|p| p.line() as usize);
            fail(line, None, format!("the line cannot be read: {e}"))
        })?;
        let line = rec.position().map_or(0, |p| p.line() as usize);
        if rec.iter().all(str::is_empty) {
            continue;
        }
        let cell = |i: usize| rec.get(i).unwrap_or("").trim();
        let name = |i: usize| headers[i].as_str();
        let component = |i: usize| {
            fluids::find(cell(i))
                .map(|r| r.id.clone())
                .map_err(|e| fail(Some(line), Some(name(i)), e.to_string()))
        };
        let (a, b) = (component(ia)?, component(ib)?);
        if a == b {
            return Err(fail(
                Some(line),
                Some(name(ib)),
                format!("pairs {a} with itself"),
            ));
        }
        let v = value(cell(iv)).map_err(|m| fail(Some(line), Some(name(iv)), m))?;
        let fam = match i_family {
            Some(i) => family(cell(i)).map_err(|m| fail(Some(line), Some(name(i)), m))?,
            None => None,
        };
        let same =
            |u: &UserKij| u.family == fam && ((u.a == a && u.b == b) || (u.a == b && u.b == a));
        if let Some(first) = out.iter().find(|u| same(u)) {
            return Err(fail(
                Some(line),
                None,
                format!("{a}-{b} is given twice (first at {})", first.origin),
            ));
        }
        let source = i_source.map(cell).filter(|s| !s.is_empty());
        out.push(UserKij {
            a,
            b,
            family: fam,
            value: v,
            origin: match source {
                Some(s) => format!("{path} line {line}: {s}"),
                None => format!("{path} line {line}"),
            },
            layer: 0,
        });
    }
    Ok(out)
}

/// The user's k_ij from a file and the command line (the command line's after the file's,
/// so that they win), and a note for each command-line pair that is not in the mixture
/// `ids` (none when there is no one mixture, as in an audit).
pub fn read(
    list: Option<&str>,
    file: Option<&str>,
    ids: Option<&[&str]>,
) -> Result<Vec<UserKij>, CliError> {
    let mut out = match file {
        Some(p) => read_file(p)?,
        None => Vec::new(),
    };
    if let Some(text) = list {
        let given = parse_list(text)?;
        if let Some(ids) = ids {
            for u in &given {
                if !(ids.contains(&u.a.as_str()) && ids.contains(&u.b.as_str())) {
                    crate::input_notes::push(format!(
                        "--kij {}-{}: the pair is not in the mixture; the value is not used",
                        u.a, u.b
                    ));
                }
            }
        }
        out.extend(given);
    }
    Ok(out)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn pairs_split_where_both_sides_are_components() {
        assert_eq!(
            split_pair("n-butane-co2").unwrap(),
            ("n-butane".to_string(), "co2".to_string())
        );
        assert_eq!(
            split_pair("CH4-CO2").unwrap(),
            ("methane".to_string(), "co2".to_string())
        );
        assert!(split_pair("methane-methane").is_err());
        assert!(split_pair("methane-unobtainium").is_err());
    }

    #[test]
    fn the_list_is_read_with_families_and_checked() {
        let k = parse_list("methane-co2=0.10, ethane-co2@srk=0.13").unwrap();
        assert_eq!(k.len(), 2);
        assert_eq!(k[0].family, None);
        assert_eq!(k[1].family, Some(KijFamily::Soave));
        assert!((k[1].value - 0.13).abs() < 1e-15);
        for bad in [
            "methane-co2",
            "methane-co2=x",
            "methane-co2=1.5",
            "methane-co2=0.1,co2-methane=0.2",
            "methane-co2@vdw=0.1",
            "",
        ] {
            assert!(parse_list(bad).is_err(), "{bad}");
        }
    }
}
