//! The built-in reference data set `iso6976`: compression factors of pure gases at
//! 101.325 kPa and 0, 15 and 20 degC.
//!
//! ISO 6976:1995, *Natural gas - Calculation of calorific values, density, relative density
//! and Wobbe index from composition*, Table 2, gives summation factors sqrt(b) with
//! Z = 1 - b at the reference conditions (equivalently Z = 1 - (sqrt b)^2). The values in
//! `data/iso6976_compression_factors.csv` are the high-confidence rows of the project's
//! reference collection, recalled from memory of that table and cross-checked there against
//! second virial coefficients (Tsonopoulos correlation); each row keeps its source and
//! confidence mark. The file is in the format of a user's reference file
//! ([`super::data_file`]) with a `component` column.

use super::data_file::{self, Contents, FileError, Need, Options};

/// Name of the data set on the command line (`--reference iso6976`).
pub const ID: &str = "iso6976";

/// The embedded data.
pub const CSV: &str = include_str!("data/iso6976_compression_factors.csv");

/// The citation shown with results.
pub const CITATION: &str = "ISO 6976:1995, Natural gas - Calculation of calorific values, \
density, relative density and Wobbe index from composition, Table 2 (summation factors; \
Z = 1 - b), high-confidence rows recalled from memory";

/// Every row of the data set (no molar mass is needed: the values are Z).
pub fn rows() -> Result<Contents, FileError> {
    data_file::read(
        CSV,
        "built-in data set iso6976",
        Options {
            need: Need::Reference,
            molar_mass: 1.0,
            ambient_pa: crate::units::DEFAULT_AMBIENT_PA,
            skip_bad_rows: false,
        },
    )
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::compare::data_file::RefValue;

    #[test]
    fn the_data_set_reads_and_names_known_components() {
        let c = rows().unwrap();
        assert_eq!(c.rows.len(), 14);
        for r in &c.rows {
            let name = r.component.as_deref().unwrap();
            assert!(fluids::find(name).is_ok(), "{name}");
            // Every row is at the ISO 6976 reference pressure, 101.325 kPa.
            assert!((r.p - 101_325.0).abs() < 1e-9);
            // Z = 1 - (sqrt b)^2 to the five decimals printed: checked by the data file's
            // own sqrt_b column (ISO 6976:1995 Table 2, from memory).
            match r.value {
                Some(RefValue::Z(z)) => assert!(z > 0.97 && z < 1.0, "{z}"),
                other => panic!("{other:?}"),
            }
        }
        let sb: Vec<f64> = CSV
            .lines()
            .skip(1)
            .map(|l| l.split(',').nth(4).unwrap().parse().unwrap())
            .collect();
        for (r, s) in c.rows.iter().zip(sb) {
            let Some(RefValue::Z(z)) = r.value else {
                unreachable!("checked above")
            };
            // sqrt(b) is printed to 4 decimals, so b is known to 2 sqrt(b) 5e-5 <= 1.5e-5;
            // Z is printed to 5 decimals (5e-6).
            assert!((z - (1.0 - s * s)).abs() < 2.1e-5, "{z} vs sqrt(b) {s}");
        }
    }
}
