//! The unit table: every accepted spelling with its dimension and conversion to SI.
//!
//! Factors are exact where the definition is exact, built from the defining values in
//! NIST SP 811 (2008 edition), *Guide for the Use of the International System of Units*,
//! Appendix B (B.8, factors listed alphabetically; B.9, by kind of quantity). Composite
//! units are derived from those definitions rather than copied as rounded table entries.

use super::dimension::Dimension;

/// International foot, exact: 0.3048 m (NIST SP 811, App. B.8).
pub const FOOT: f64 = 0.3048;
/// International inch, exact: 0.0254 m (NIST SP 811, App. B.8).
pub const INCH: f64 = 0.0254;
/// Pound (avoirdupois), exact: 0.453 592 37 kg (NIST SP 811, App. B.8).
pub const POUND: f64 = 0.453_592_37;
/// Standard acceleration of gravity g_n, exact: 9.806 65 m/s² (NIST SP 811, App. B.8 notes).
pub const STANDARD_GRAVITY: f64 = 9.806_65;
/// Pound-force = lb × g_n = 4.448 221 615 260 5 N, exact (NIST SP 811, App. B.8).
pub const POUND_FORCE: f64 = POUND * STANDARD_GRAVITY;
/// US liquid gallon = 231 in³ = 3.785 411 784 × 10⁻³ m³, exact (NIST SP 811, App. B.8).
pub const US_GALLON: f64 = 231.0 * INCH * INCH * INCH;
/// Imperial gallon, exact: 4.546 09 × 10⁻³ m³ (NIST SP 811, App. B.8; UK Weights and
/// Measures Act 1985).
pub const IMPERIAL_GALLON: f64 = 4.546_09e-3;
/// Petroleum barrel = 42 US gallons (NIST SP 811, App. B.8: 1.589 873 E−01 m³).
pub const BARREL: f64 = 42.0 * US_GALLON;
/// Pound-force per square inch = lbf / in² ≈ 6894.757 293 168 Pa (NIST SP 811, App. B.8:
/// 6.894 757 E+03).
pub const PSI: f64 = POUND_FORCE / (INCH * INCH);
/// Oilfield stress unit lbf/100 ft² ≈ 0.478 802 6 Pa, derived from lbf and ft.
pub const LBF_PER_100_FT2: f64 = POUND_FORCE / (100.0 * FOOT * FOOT);
/// Density of water for the conventional water-column units and SG: 1000 kg/m³.
///
/// Convention chosen: the *conventional* water column, ρ = 1000 kg/m³ under g_n, so
/// mH2O = 9806.65 Pa and inH2O = 249.088 91 Pa exactly. NIST SP 811 App. B.8 also lists an
/// inch of water at 39.2 °F (4 °C), 2.490 82 E+02 Pa; it differs by 0.003 %, below any
/// plant gauge's resolution, and an exact value keeps round trips exact. Specific gravity
/// uses the same 1000 kg/m³ for the same reason (water at 4 °C is 999.972 kg/m³).
pub const WATER_DENSITY: f64 = 1000.0;
/// Metre of water, conventional: ρ g_n × 1 m = 9806.65 Pa.
pub const METRE_OF_WATER: f64 = WATER_DENSITY * STANDARD_GRAVITY;
/// Inch of water, conventional: ρ g_n × 1 in = 249.088 91 Pa.
pub const INCH_OF_WATER: f64 = METRE_OF_WATER * INCH;
/// Dyne per square centimetre = 0.1 Pa, exact (NIST SP 811, App. B.8).
pub const DYNE_PER_CM2: f64 = 0.1;
/// Horsepower (550 ft·lbf/s), the mechanical horsepower ≈ 745.699 871 582 27 W
/// (NIST SP 811, App. B.8: 7.456 999 E+02). Metric horsepower (735.5 W) is not accepted.
pub const HORSEPOWER: f64 = 550.0 * FOOT * POUND_FORCE;
/// Thermochemical calorie, exact: 4.184 J (NIST SP 811, App. B.8). Activation energies
/// in kcal/mol are conventionally thermochemical; the IT calorie (4.1868 J) is 0.07 % larger.
pub const CALORIE: f64 = 4.184;
/// Zero of the Celsius scale in kelvin, exact (NIST SP 811, App. B.8: T/K = t/°C + 273.15).
pub const CELSIUS_ZERO: f64 = 273.15;
/// Fahrenheit: T/K = (t/°F + 459.67)/1.8, exact (NIST SP 811, App. B.8).
pub const FAHRENHEIT_ZERO: f64 = 459.67;
/// One revolution in radians; 1 rpm = 2π/60 rad/s (NIST SP 811, App. B.8: 1.047 198 E−01).
pub const REVOLUTION: f64 = std::f64::consts::TAU;

/// One spelling of a unit: SI value = (typed value + `offset`) × `factor`.
///
/// `alias` is stored already normalised (lower case, no spaces, `·` written `.`), the form
/// the parser reduces typed text to; a test checks that every alias is in that form.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct UnitRow {
    pub alias: &'static str,
    pub dim: Dimension,
    pub factor: f64,
    pub offset: f64,
}

const fn r(alias: &'static str, dim: Dimension, factor: f64) -> UnitRow {
    UnitRow {
        alias,
        dim,
        factor,
        offset: 0.0,
    }
}

const fn affine(alias: &'static str, dim: Dimension, factor: f64, offset: f64) -> UnitRow {
    UnitRow {
        alias,
        dim,
        factor,
        offset,
    }
}

use Dimension as D;

const MINUTE: f64 = 60.0;
const HOUR: f64 = 3600.0;
const LITRE: f64 = 1e-3;

/// Every accepted spelling. Stress has no rows of its own: it uses Pressure's.
#[rustfmt::skip]
pub const TABLE: &[UnitRow] = &[
    r("pa", D::Pressure, 1.0), r("n/m2", D::Pressure, 1.0),
    r("kpa", D::Pressure, 1e3), r("mpa", D::Pressure, 1e6),
    r("bar", D::Pressure, 1e5), r("mbar", D::Pressure, 1e2),
    r("psi", D::Pressure, PSI), r("lbf/in2", D::Pressure, PSI),
    r("inh2o", D::Pressure, INCH_OF_WATER), r("inwc", D::Pressure, INCH_OF_WATER),
    r("mh2o", D::Pressure, METRE_OF_WATER), r("mwc", D::Pressure, METRE_OF_WATER),
    r("dyn/cm2", D::Pressure, DYNE_PER_CM2), r("dyne/cm2", D::Pressure, DYNE_PER_CM2),
    r("lbf/100ft2", D::Pressure, LBF_PER_100_FT2), r("lb/100ft2", D::Pressure, LBF_PER_100_FT2),
    r("m3/h", D::Flow, 1.0 / HOUR), r("m3/hr", D::Flow, 1.0 / HOUR),
    r("m3/s", D::Flow, 1.0),
    r("l/s", D::Flow, LITRE), r("l/min", D::Flow, LITRE / MINUTE), r("lpm", D::Flow, LITRE / MINUTE),
    r("gpm", D::Flow, US_GALLON / MINUTE), r("gal/min", D::Flow, US_GALLON / MINUTE),
    r("usgpm", D::Flow, US_GALLON / MINUTE), r("gpm(us)", D::Flow, US_GALLON / MINUTE),
    r("igpm", D::Flow, IMPERIAL_GALLON / MINUTE), r("impgpm", D::Flow, IMPERIAL_GALLON / MINUTE),
    r("gpm(uk)", D::Flow, IMPERIAL_GALLON / MINUTE),
    r("bbl/min", D::Flow, BARREL / MINUTE), r("bpm", D::Flow, BARREL / MINUTE),
    r("m", D::Length, 1.0), r("cm", D::Length, 1e-2), r("mm", D::Length, 1e-3),
    r("in", D::Length, INCH), r("inch", D::Length, INCH), r("inches", D::Length, INCH),
    r("ft", D::Length, FOOT), r("foot", D::Length, FOOT), r("feet", D::Length, FOOT),
    r("pa.s", D::DynamicViscosity, 1.0), r("pas", D::DynamicViscosity, 1.0),
    r("mpa.s", D::DynamicViscosity, 1e-3), r("mpas", D::DynamicViscosity, 1e-3),
    r("cp", D::DynamicViscosity, 1e-3), r("centipoise", D::DynamicViscosity, 1e-3),
    r("p", D::DynamicViscosity, 0.1), r("poise", D::DynamicViscosity, 0.1),
    r("cst", D::KinematicViscosity, 1e-6), r("centistokes", D::KinematicViscosity, 1e-6),
    r("mm2/s", D::KinematicViscosity, 1e-6), r("m2/s", D::KinematicViscosity, 1.0),
    r("rpm", D::Speed, REVOLUTION / MINUTE), r("rev/min", D::Speed, REVOLUTION / MINUTE),
    r("r/min", D::Speed, REVOLUTION / MINUTE),
    r("rps", D::Speed, REVOLUTION), r("rev/s", D::Speed, REVOLUTION), r("r/s", D::Speed, REVOLUTION),
    r("rad/s", D::Speed, 1.0),
    r("kg/m3", D::Density, 1.0), r("g/cm3", D::Density, 1e3), r("g/cc", D::Density, 1e3),
    r("g/ml", D::Density, 1e3), r("kg/l", D::Density, 1e3),
    r("lb/ft3", D::Density, POUND / (FOOT * FOOT * FOOT)),
    r("lbm/ft3", D::Density, POUND / (FOOT * FOOT * FOOT)),
    r("lb/gal", D::Density, POUND / US_GALLON), r("ppg", D::Density, POUND / US_GALLON),
    r("sg", D::Density, WATER_DENSITY),
    r("k", D::Temperature, 1.0), r("kelvin", D::Temperature, 1.0),
    affine("c", D::Temperature, 1.0, CELSIUS_ZERO),
    affine("degc", D::Temperature, 1.0, CELSIUS_ZERO),
    affine("celsius", D::Temperature, 1.0, CELSIUS_ZERO),
    affine("f", D::Temperature, 1.0 / 1.8, FAHRENHEIT_ZERO),
    affine("degf", D::Temperature, 1.0 / 1.8, FAHRENHEIT_ZERO),
    affine("fahrenheit", D::Temperature, 1.0 / 1.8, FAHRENHEIT_ZERO),
    r("w", D::Power, 1.0), r("kw", D::Power, 1e3), r("hp", D::Power, HORSEPOWER),
    r("a", D::Current, 1.0), r("amp", D::Current, 1.0), r("amps", D::Current, 1.0),
    r("v", D::Voltage, 1.0), r("volt", D::Voltage, 1.0), r("volts", D::Voltage, 1.0),
    r("kv", D::Voltage, 1e3),
    r("s", D::Time, 1.0), r("sec", D::Time, 1.0), r("second", D::Time, 1.0),
    r("seconds", D::Time, 1.0),
    r("min", D::Time, MINUTE), r("minute", D::Time, MINUTE), r("minutes", D::Time, MINUTE),
    r("h", D::Time, HOUR), r("hr", D::Time, HOUR), r("hour", D::Time, HOUR),
    r("hours", D::Time, HOUR),
    r("d", D::Time, 24.0 * HOUR), r("day", D::Time, 24.0 * HOUR), r("days", D::Time, 24.0 * HOUR),
    r("1/s", D::ShearRate, 1.0), r("s-1", D::ShearRate, 1.0), r("/s", D::ShearRate, 1.0),
    r("1/sec", D::ShearRate, 1.0), r("sec-1", D::ShearRate, 1.0),
    r("n.m", D::Torque, 1.0), r("nm", D::Torque, 1.0), r("kn.m", D::Torque, 1e3),
    r("knm", D::Torque, 1e3), r("mn.m", D::Torque, 1e-3),
    r("lbf.ft", D::Torque, POUND_FORCE * FOOT), r("ft.lbf", D::Torque, POUND_FORCE * FOOT),
    r("lb.ft", D::Torque, POUND_FORCE * FOOT), r("ft.lb", D::Torque, POUND_FORCE * FOOT),
    r("lbf.in", D::Torque, POUND_FORCE * INCH), r("in.lbf", D::Torque, POUND_FORCE * INCH),
    r("lb.in", D::Torque, POUND_FORCE * INCH), r("in.lb", D::Torque, POUND_FORCE * INCH),
    r("dyn.cm", D::Torque, 1e-7), r("dyne.cm", D::Torque, 1e-7),
    r("j/mol", D::MolarEnergy, 1.0), r("kj/mol", D::MolarEnergy, 1e3),
    r("kcal/mol", D::MolarEnergy, 1e3 * CALORIE),
    r("", D::Fraction, 1.0), r("%", D::Fraction, 1e-2),
    r("", D::Dimensionless, 1.0),
];

/// The row for a normalised spelling within a dimension's family.
pub fn find(alias: &str, dim: Dimension) -> Option<&'static UnitRow> {
    let family = dim.family();
    TABLE
        .iter()
        .find(|row| row.dim == family && row.alias == alias)
}

/// The row for a normalised spelling in any dimension (to say "that is a density").
pub fn find_any(alias: &str) -> Option<&'static UnitRow> {
    if alias.is_empty() {
        return None;
    }
    TABLE.iter().find(|row| row.alias == alias)
}

impl UnitRow {
    /// SI value of `value` in this unit.
    pub fn to_si(&self, value: f64) -> f64 {
        (value + self.offset) * self.factor
    }

    /// Value in this unit of an SI value.
    pub fn from_si(&self, si: f64) -> f64 {
        si / self.factor - self.offset
    }
}
