//! The units a terminal table shows results in: the temperature scale the user typed, and
//! standard volumes labelled by their base conditions (Sm3, Nm3, scf). Files and JSON stay
//! SI; only the terminal text speaks the user's units.

use crate::units::{KELVIN_AT_0_DEGC, K_PER_R, M3_PER_FT3};

/// A temperature scale, read from the unit of a temperature as typed.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default)]
pub enum TemperatureScale {
    #[default]
    Kelvin,
    Celsius,
    Fahrenheit,
    Rankine,
}

impl TemperatureScale {
    /// The scale of a temperature as typed ("25 degC", "540 R"); kelvin when it has no unit
    /// that [`crate::units::temperature`] reads.
    pub fn of_input(input: &str) -> TemperatureScale {
        let unit = input
            .trim()
            .trim_start_matches(|c: char| c.is_ascii_digit() || "+-.eE".contains(c))
            .trim()
            .replace('°', "deg")
            .to_ascii_lowercase();
        match unit.as_str() {
            "degc" | "c" | "deg c" | "celsius" => TemperatureScale::Celsius,
            "degf" | "f" | "deg f" | "fahrenheit" => TemperatureScale::Fahrenheit,
            "r" | "degr" | "deg r" | "rankine" => TemperatureScale::Rankine,
            _ => TemperatureScale::Kelvin,
        }
    }

    /// The scale of an optional input; kelvin without one.
    pub fn of_option(input: Option<&str>) -> TemperatureScale {
        input.map_or(TemperatureScale::Kelvin, TemperatureScale::of_input)
    }

    /// A temperature in kelvin on this scale.
    pub fn from_kelvin(self, k: f64) -> f64 {
        match self {
            TemperatureScale::Kelvin => k,
            TemperatureScale::Celsius => k - KELVIN_AT_0_DEGC,
            TemperatureScale::Fahrenheit => (k - KELVIN_AT_0_DEGC) / K_PER_R + 32.0,
            TemperatureScale::Rankine => k / K_PER_R,
        }
    }

    /// The unit's name as the tool prints it.
    pub fn label(self) -> &'static str {
        match self {
            TemperatureScale::Kelvin => "K",
            TemperatureScale::Celsius => "degC",
            TemperatureScale::Fahrenheit => "degF",
            TemperatureScale::Rankine => "R",
        }
    }
}

/// A pressure as typed, followed by its value in bar absolute unless it was typed so
/// ("70 barg (71.0132 bar abs)", "110 bar").
pub fn pressure_as_typed(typed: &str, pa: f64) -> String {
    let typed = typed.trim();
    let unit = typed
        .trim_start_matches(|c: char| c.is_ascii_digit() || "+-.eE".contains(c))
        .trim()
        .to_ascii_lowercase();
    if unit == "bar" || unit == "bara" || unit == "bar abs" {
        typed.to_string()
    } else {
        format!(
            "{typed} ({} bar abs)",
            crate::render::number::sig(pa / crate::units::PA_PER_BAR, 6)
        )
    }
}

/// How standard volumes at base conditions `id` are labelled, and the cubic metres in one
/// such unit: "Nm3" at 0 degC, "Sm3" at the other metric bases (15 degC is ISO 13443's),
/// "scf" (cubic feet) at 60 degF, plain "m3" at a base of the user's own; the base is named
/// beside them.
pub fn standard_volume_unit(base_id: &str) -> (&'static str, f64) {
    match base_id {
        "0degC" => ("Nm3", 1.0),
        id if id.starts_with("60degF") => ("scf", M3_PER_FT3),
        "custom" => ("m3", 1.0),
        _ => ("Sm3", 1.0),
    }
}

/// Whether a base is the field's (60 degF): flows there are also given in MMscfd.
pub fn is_field_base(base_id: &str) -> bool {
    base_id.starts_with("60degF")
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn the_scale_follows_the_unit_typed() {
        assert_eq!(
            TemperatureScale::of_input("25 degC"),
            TemperatureScale::Celsius
        );
        assert_eq!(
            TemperatureScale::of_input("-40C"),
            TemperatureScale::Celsius
        );
        assert_eq!(
            TemperatureScale::of_input("77 °F"),
            TemperatureScale::Fahrenheit
        );
        assert_eq!(
            TemperatureScale::of_input("540 R"),
            TemperatureScale::Rankine
        );
        assert_eq!(
            TemperatureScale::of_input("300 K"),
            TemperatureScale::Kelvin
        );
        // Fixed points of the scales (common practice).
        let c = TemperatureScale::Celsius.from_kelvin(273.15);
        assert!(c.abs() < 1e-12);
        let f = TemperatureScale::Fahrenheit.from_kelvin(373.15);
        assert!((f - 212.0).abs() < 1e-9);
        let r = TemperatureScale::Rankine.from_kelvin(300.0);
        assert!((r - 540.0).abs() < 1e-9);
    }

    #[test]
    fn a_pressure_in_bar_absolute_is_not_repeated() {
        assert_eq!(pressure_as_typed("110 bar", 110e5), "110 bar");
        assert_eq!(
            pressure_as_typed("70 barg", 7_101_325.0),
            "70 barg (71.0132 bar abs)"
        );
        assert_eq!(pressure_as_typed("5 MPa", 5e6), "5 MPa (50.0000 bar abs)");
    }

    #[test]
    fn standard_volumes_carry_their_base() {
        assert_eq!(standard_volume_unit("15degC").0, "Sm3");
        assert_eq!(standard_volume_unit("20degC").0, "Sm3");
        assert_eq!(standard_volume_unit("custom").0, "m3");
        assert_eq!(standard_volume_unit("0degC").0, "Nm3");
        let (scf, m3) = standard_volume_unit("60degF-14.696psia");
        assert_eq!(scf, "scf");
        // One cubic foot is 0.028316846592 m3 (exact by the definition of the foot).
        assert!((m3 - 0.028_316_846_592).abs() < 1e-15);
    }
}
