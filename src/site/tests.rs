//! Loader checks: the demo's values in SI (by the unit definitions), and each validation
//! rule that the invalid-site files in tests/ do not already cover.

use super::*;
use crate::instrument::Geometry;
use std::f64::consts::PI;

fn close(a: f64, b: f64) -> bool {
    (a - b).abs() <= 1e-9 * b.abs().max(1e-12)
}

const HEAD: &str = "[site]\nid = \"t\"\nname = \"Test (invented)\"\nunit_system = \"si\"\n";
const LINE: &str = "[[line]]\nid = \"L-1\"\ninner_diameter = \"50 mm\"\nlength = \"20 m\"\n\
                    roughness = \"0.0015 mm\"\ndesign_pressure = \"10 bar\"\n";

/// Messages (without the path prefix) for a config made of HEAD + `body`.
fn errors(body: &str) -> Vec<String> {
    let text = format!("{HEAD}{body}");
    match load_str(&text, "t.toml") {
        Ok(_) => Vec::new(),
        Err(e) => {
            e.0.iter()
                .map(|e| e.to_string().replacen("t.toml:", "", 1))
                .collect()
        }
    }
}

fn one_error_containing(body: &str, needle: &str) {
    let errs = errors(body);
    assert_eq!(errs.len(), 1, "{errs:#?}");
    assert!(errs[0].contains(needle), "{errs:#?}");
}

#[test]
fn demo_loads_with_values_in_si() {
    let site = demo().expect("the demo always loads");
    assert_eq!(site.unit_system, crate::units::UnitSystem::Si);
    let l1 = site.line("L-1").expect("L-1");
    // SI prefixes and bar = 1e5 Pa (NIST SP 811, App. B.8).
    assert!(close(l1.inner_diameter_m, 0.0729));
    assert!(close(l1.design_pressure_pa, 10e5));
    assert!(close(l1.total_length_m(), 99.0));
    let p1 = site.pump("P-1").expect("P-1");
    // 1 rpm = 2π/60 rad/s.
    assert!(close(p1.rated_speed_rad_s, 1450.0 * 2.0 * PI / 60.0));
    // 10 m3/h = 10/3600 m3/s, and "55 %" = 0.55.
    assert!(close(p1.curve()[2].flow_m3_s, 10.0 / 3600.0));
    assert!(close(p1.curve()[2].efficiency, 0.55));
    let p2 = site.pump("P-2").expect("P-2");
    // 0.42 L = 0.42e-3 m3, per revolution.
    assert_eq!(
        p2.kind,
        PumpKind::PositiveDisplacement {
            displacement_m3_per_rev: 0.42e-3
        }
    );
    assert!(
        close(p2.pressure_limit_pa(), 12e5),
        "relief below the 14 bar casing limit"
    );
    let paste = site.product("filler-paste").expect("paste");
    // 20 °C = 293.15 K; 2 h = 7200 s.
    assert!(close(paste.reference_temperature_k, 293.15));
    let gel = paste.gel.expect("gels at rest");
    assert!(close(gel.rebuild_time_s, 7200.0));
    assert!(gel.long_rest_pa > gel.initial_pa);
}

#[test]
fn demo_has_every_capability_the_brief_names() {
    let site = demo().expect("demo");
    assert_eq!(site.products.len(), 3);
    assert!(site.products.iter().any(|p| p.gel.is_some()));
    assert!(
        site.viscometer("VIS-A")
            .is_some_and(|v| v.geometry == Geometry::StandardSixSpeed)
    );
    let Some(Geometry::Coaxial(c)) = site.viscometer("VIS-B").map(|v| &v.geometry) else {
        panic!("VIS-B is coaxial");
    };
    // 14.4 mN.m over 100 dial units.
    assert!(close(c.torque_per_dial_n_m, 14.4e-3 / 100.0));
    assert_eq!(site.lines.len(), 2);
    assert!(
        site.pumps
            .iter()
            .any(|p| matches!(p.kind, PumpKind::Centrifugal { .. }))
    );
    assert!(
        site.pumps
            .iter()
            .any(|p| matches!(p.kind, PumpKind::PositiveDisplacement { .. }))
    );
    assert_ne!(site.tanks[0].impeller, site.tanks[1].impeller);
    assert_eq!(site.equipment_ids().len(), 8);
    assert!(site.has_equipment("TK-2") && !site.has_equipment("chilli-sauce"));
    assert!(
        summary::pressure_cautions(&site).is_empty(),
        "the demo's pumps suit its lines"
    );
}

#[test]
fn missing_site_table_points_at_the_top() {
    let errs = match load_str(LINE, "t.toml") {
        Err(e) => e.0,
        Ok(_) => panic!("must fail"),
    };
    assert_eq!(
        errs[0].to_string(),
        "t.toml:1:1: missing table [site] — give the site's id, name and unit_system"
    );
}

#[test]
fn line_cross_field_checks() {
    let steep = LINE.replace(
        "length = \"20 m\"",
        "length = \"20 m\"\nelevation_change = \"-25 m\"",
    );
    one_error_containing(&steep, "larger than the line's length");
    let rough = LINE.replace("0.0015 mm", "5 mm");
    one_error_containing(&rough, "under 5 % of the inner diameter");
    one_error_containing(
        &LINE.replace("\"20 m\"", "\"20\""),
        "a bare number is ambiguous",
    );
}

#[test]
fn restart_settings_on_a_line() {
    // Defaults: no back-pressure, a 10 % margin (common practice, no source), no cold case.
    let site = load_str(&format!("{HEAD}{LINE}"), "t.toml").expect("plain line loads");
    let l = site.line("L-1").expect("L-1");
    assert_eq!(l.back_pressure_pa, 0.0);
    assert!(close(l.restart_margin, 0.10));
    assert_eq!((l.coldest_temperature_k, l.gel_cold_factor), (None, None));
    let set = format!(
        "{LINE}back_pressure = \"0.5 bar\"\nrestart_margin = \"15 %\"\n\
         coldest_temperature = \"-5 C\"\ngel_cold_factor = 1.5\n"
    );
    let site = load_str(&format!("{HEAD}{set}"), "t.toml").expect("restart settings load");
    let l = site.line("L-1").expect("L-1");
    // bar = 1e5 Pa (NIST SP 811); −5 °C = 268.15 K; "15 %" = 0.15.
    assert!(close(l.back_pressure_pa, 0.5e5));
    assert!(close(l.restart_margin, 0.15));
    assert!(close(l.coldest_temperature_k.unwrap_or(0.0), 268.15));
    assert_eq!(l.gel_cold_factor, Some(1.5));
    one_error_containing(&format!("{LINE}gel_cold_factor = 0.5\n"), "gel_cold_factor");
    one_error_containing(&format!("{LINE}restart_margin = 0.95\n"), "restart_margin");
    one_error_containing(
        &format!("{LINE}back_pressure = \"-1 bar\"\n"),
        "back_pressure",
    );
}

#[test]
fn pump_motor_and_volumetric_efficiency() {
    let pd = "[[pump]]\nid = \"P\"\nkind = \"positive-displacement\"\nfeeds = \"L-1\"\n\
              rated_speed = \"300 rpm\"\nrelief_setting = \"6 bar\"\ndisplacement = \"1 L/rev\"\n";
    let ok = format!("{HEAD}{LINE}{pd}volumetric_efficiency = \"90 %\"\nmotor_rating = \"4 kW\"\n");
    let site = load_str(&ok, "t.toml").expect("loads");
    let p = site.pump("P").expect("P");
    assert_eq!(p.volumetric_efficiency, Some(0.9));
    assert!(close(p.motor_rating_w.unwrap_or(0.0), 4000.0));
    one_error_containing(
        &format!("{LINE}{pd}volumetric_efficiency = 1.2\n"),
        "volumetric_efficiency",
    );
    let centrifugal = format!(
        "{LINE}{PUMP}volumetric_efficiency = 0.9\ncurve = [{{ flow = \"0 m3/h\", head = \"30 m\", \
         efficiency = 0 }}, {{ flow = \"5 m3/h\", head = \"28 m\", efficiency = 0.5 }}, \
         {{ flow = \"9 m3/h\", head = \"25 m\", efficiency = 0.6 }}]\n"
    );
    one_error_containing(&centrifugal, "used only with kind 'positive-displacement'");
}

#[test]
fn viscometer_rules() {
    let std_with_dims =
        "[[viscometer]]\nid = \"V\"\ngeometry = \"standard-six-speed\"\nfull_scale_dial = 300\n";
    one_error_containing(std_with_dims, "not used with geometry 'standard-six-speed'");
    let coax = "[[viscometer]]\nid = \"V\"\ngeometry = \"coaxial\"\nbob_radius = \"14 mm\"\n\
                cup_radius = \"15 mm\"\nbob_length = \"40 mm\"\nfull_scale_dial = 100\n";
    one_error_containing(coax, "missing field 'full_scale_torque'");
    let both = format!("{coax}full_scale_torque = \"10 mN.m\"\ntorque_per_dial = \"0.1 mN.m\"\n");
    one_error_containing(&both, "not both");
    let spindle_key = format!("{coax}full_scale_torque = \"10 mN.m\"\nradius = \"5 mm\"\n");
    one_error_containing(&spindle_key, "used only with geometry 'spindle'");
    let factor = format!("{coax}full_scale_torque = \"10 mN.m\"\nend_effect_factor = 0.8\n");
    one_error_containing(&factor, "must be between 1 and 2");
    let with_torque = format!("{coax}full_scale_torque = \"10 mN.m\"\n");
    let half = format!("{with_torque}min_speed = \"1 rpm\"\n");
    one_error_containing(&half, "given without max_speed");
    let reversed = format!("{with_torque}min_speed = \"100 rpm\"\nmax_speed = \"10 rpm\"\n");
    one_error_containing(&reversed, "must be above min_speed");
    let std_range = "[[viscometer]]\nid = \"V\"\ngeometry = \"standard-six-speed\"\n\
                     max_speed = \"900 rpm\"\n";
    one_error_containing(std_range, "it runs at 3 to 600 rpm");
    let ranged = format!("{with_torque}min_speed = \"0.5 rpm\"\nmax_speed = \"200 rpm\"\n");
    let site =
        load_str(&format!("{HEAD}{ranged}"), "t.toml").expect("a coaxial with a speed range");
    let (lo, hi) = site.viscometers[0].speed_range_rpm.expect("a range");
    assert!(
        (lo - 0.5).abs() < 1e-9 && (hi - 200.0).abs() < 1e-9,
        "{lo} {hi}"
    );
}

const PUMP: &str = "[[pump]]\nid = \"P\"\nkind = \"centrifugal\"\nfeeds = \"L-1\"\n\
                    rated_speed = \"1450 rpm\"\nmax_discharge_pressure = \"8 bar\"\n";

#[test]
fn pump_rules() {
    let two = format!(
        "{LINE}{PUMP}curve = [{{ flow = \"0 m3/h\", head = \"30 m\", efficiency = 0 }}, \
                       {{ flow = \"5 m3/h\", head = \"28 m\", efficiency = 0.5 }}]\n"
    );
    one_error_containing(&two, "has 2 point(s); a water curve needs at least 3");
    let zero_eff = format!(
        "{LINE}{PUMP}curve = [{{ flow = \"0 m3/h\", head = \"30 m\", efficiency = 0 }}, \
                            {{ flow = \"5 m3/h\", head = \"28 m\", efficiency = 0 }}, \
                            {{ flow = \"9 m3/h\", head = \"25 m\", efficiency = 0.6 }}]\n"
    );
    one_error_containing(&zero_eff, "above 0 except at zero flow");
    let no_limit = PUMP
        .replace("max_discharge_pressure = \"8 bar\"\n", "")
        .replace("centrifugal", "positive-displacement");
    let pd = format!("{LINE}{no_limit}displacement = \"1 L/rev\"\n");
    one_error_containing(&pd, "missing field 'max_discharge_pressure'");
    let pd_curve = format!("{pd}relief_setting = \"6 bar\"\ncurve = []\n");
    one_error_containing(&pd_curve, "no head curve");
}

#[test]
fn displacement_accepts_litres_cubic_metres_and_gallons() {
    assert_eq!(pump::per_revolution("0.5 L/rev"), Some(0.5e-3));
    assert_eq!(pump::per_revolution("0.002 m3/REV"), Some(0.002));
    // US gallon = 231 in3 = 3.785411784 L (NIST SP 811, App. B.8).
    let gal = pump::per_revolution("1 gal/rev").expect("gallons");
    assert!((gal - 3.785_411_784e-3).abs() < 1e-12);
    assert_eq!(pump::per_revolution("0.5 L"), None);
    assert_eq!(pump::per_revolution("/rev"), None);
}

#[test]
fn product_limit_rules() {
    let p =
        "[[product]]\nname = \"s\"\ndensity = \"1100 kg/m3\"\nreference_temperature = \"25 C\"\n";
    one_error_containing(
        &format!("{p}limit = [{{ property = \"flow-index\" }}]\n"),
        "give 'min', 'max' or both",
    );
    let reversed = format!("{p}limit = [{{ property = \"flow-index\", min = 0.5, max = 0.3 }}]\n");
    one_error_containing(&reversed, "must not be below 'min'");
    let rate = format!(
        "{p}limit = [{{ property = \"yield-stress\", shear_rate = \"10 1/s\", max = \"5 Pa\" }}]\n"
    );
    one_error_containing(&rate, "used only with property 'apparent-viscosity'");
    let mu = format!("{p}limit = [{{ property = \"apparent-viscosity\", max = \"1 Pa.s\" }}]\n");
    one_error_containing(&mu, "missing field 'shear_rate'");
    one_error_containing(
        &p.replace("1100 kg/m3", "1.1 kg/m3"),
        "between 300 and 5000 kg/m3",
    );
}

#[test]
fn tank_impeller_must_fit() {
    let text = demo_with(
        "impeller_diameter = \"0.8 m\"",
        "impeller_diameter = \"2.4 m\"",
    );
    let errs = load_str(&text, "d")
        .expect_err("impeller as wide as the tank")
        .0;
    assert_eq!(errs.len(), 1);
    assert!(errs[0].message.contains("smaller than the tank diameter"));
}

fn demo_with(from: &str, to: &str) -> String {
    assert!(DEMO_TOML.contains(from));
    DEMO_TOML.replacen(from, to, 1)
}

#[test]
fn operator_names_and_site_names_are_sanitised() {
    let text = demo_with("\"J. Ferreira\"", "\"J. \\u001b[31mFerreira\"");
    let site = load_str(&text, "d").expect("loads");
    assert_eq!(site.operators[0], "J. Ferreira");
    let bad = demo_with("\"J. Ferreira\"", "42");
    let errs = load_str(&bad, "d").expect_err("number in the list").0;
    assert_eq!(errs[0].kind, ErrorKind::WrongType);
}

#[test]
fn us_customary_summary_uses_us_units() {
    let text = demo_with("unit_system = \"si\"", "unit_system = \"us-customary\"");
    let site = load_str(&text, "d").expect("loads");
    let s = summary(&site);
    assert!(
        s.contains("psi") && s.contains("lb/ft3") && s.contains("gal/rev"),
        "{s}"
    );
    assert!(
        s.lines()
            .all(|l| l.chars().count() <= 80 && !l.ends_with('~')),
        "{s}"
    );
}

#[test]
fn pressure_caution_when_a_pump_can_exceed_its_line() {
    let text = demo_with("relief_setting = \"12 bar\"", "relief_setting = \"18 bar\"").replacen(
        "max_discharge_pressure = \"14 bar\"",
        "max_discharge_pressure = \"20 bar\"",
        1,
    );
    let site = load_str(&text, "d").expect("loads");
    let cautions = summary::pressure_cautions(&site);
    assert_eq!(cautions.len(), 1);
    assert!(
        cautions[0].contains("P-2") && cautions[0].contains("L-2"),
        "{cautions:?}"
    );
    assert!(summary(&site).contains("CAUTION"));
}

#[test]
fn a_big_site_falls_back_to_one_line_per_kind() {
    let mut text = DEMO_TOML.to_string();
    for i in 0..20 {
        text.push_str(&LINE.replace("L-1", &format!("X-{i}")));
    }
    let site = load_str(&text, "big").expect("loads");
    let s = summary(&site);
    assert!(s.lines().count() <= summary::SUMMARY_LINES, "{s}");
    assert!(s.contains("Lines (22): L-1, L-2, X-0"), "{s}");
}

#[test]
fn unreadable_and_oversized_files() {
    let dir = tempfile::tempdir().expect("tempdir");
    let missing = dir.path().join("none.toml");
    let e = load_file(&missing).expect_err("missing").0;
    assert_eq!(
        (e[0].line, e[0].column, e[0].kind),
        (0, 0, ErrorKind::Unreadable)
    );
    let big = dir.path().join("big.toml");
    std::fs::write(&big, vec![b'#'; (MAX_FILE_BYTES + 10) as usize]).expect("write");
    let e = load_file(&big).expect_err("too big").0;
    assert!(e[0].message.contains("larger than 1024 KiB"), "{}", e[0]);
    let latin1 = dir.path().join("latin1.toml");
    std::fs::write(&latin1, b"name = \"caf\xe9\"\n").expect("write");
    let e = load_file(&latin1).expect_err("not UTF-8").0;
    assert!(e[0].message.contains("not UTF-8"), "{}", e[0]);
}

const PRODUCT: &str = "[[product]]\nname = \"p\"\ndensity = \"1100 kg/m3\"\n\
                       reference_temperature = \"20 C\"\n[product.nominal]\n";

#[test]
fn demo_products_carry_nominal_curves() {
    let site = demo().expect("demo");
    let nominal = |name: &str| site.product(name).and_then(|p| p.nominal);
    assert_eq!(
        nominal("chilli-sauce"),
        Some(NominalCurve::PowerLaw {
            k_pa_sn: 15.0,
            n: 0.38
        })
    );
    assert!(matches!(
        nominal("filler-paste"),
        Some(NominalCurve::HerschelBulkley { tau0_pa, .. }) if close(tau0_pa, 160.0)
    ));
    // 0.25 Pa.s = 0.25 Pa·s; 35 Pa.
    assert_eq!(
        nominal("chalk-slurry"),
        Some(NominalCurve::Bingham {
            tau0_pa: 35.0,
            mu_p_pa_s: 0.25
        })
    );
}

#[test]
fn nominal_curve_takes_only_its_models_constants() {
    let ok = format!("{PRODUCT}model = \"bingham\"\ntau0 = \"5 Pa\"\nmu_p = \"120 cP\"\n");
    assert!(errors(&ok).is_empty(), "{:#?}", errors(&ok));
    one_error_containing(
        &format!("{PRODUCT}model = \"bingham\"\ntau0 = \"5 Pa\"\nmu_p = \"1 Pa.s\"\nk = 3\n"),
        "not a constant of this model; it takes tau0 and mu_p",
    );
    one_error_containing(
        &format!("{PRODUCT}model = \"herschel-bulkley\"\ntau0 = \"5 Pa\"\nk = 3\n"),
        "missing field 'n' in [product.nominal]",
    );
    one_error_containing(
        &format!("{PRODUCT}model = \"plastic\"\nmu = \"1 Pa.s\"\n"),
        "use one of 'newtonian', 'power-law'",
    );
    one_error_containing(
        &format!("{PRODUCT}model = \"power-law\"\nk = 3\nn = 30\n"),
        "must be between 0.05 and 3",
    );
}
