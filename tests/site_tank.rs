//! The optional `[[tank]]` fields for the mixing calculations: the site's own ks, Kp and
//! turbulent Np, a helical ribbon's shape, and the no-load power; each checked alone and
//! against the impeller type.

use rheoside::site::{self, DEMO_TOML, RibbonShape};

/// The demo with the first tank's impeller line replaced and `extra` added after it.
fn demo_tank(impeller: &str, extra: &str) -> String {
    let from = "impeller = \"anchor\"";
    assert!(DEMO_TOML.contains(from), "the demo's first tank changed");
    DEMO_TOML.replacen(from, &format!("impeller = \"{impeller}\"\n{extra}"), 1)
}

fn errors(text: &str) -> Vec<String> {
    match site::load_str(text, "t.toml") {
        Ok(_) => Vec::new(),
        Err(e) => {
            e.0.into_iter()
                .map(|e| format!("{}: {}", e.field, e.message))
                .collect()
        }
    }
}

#[test]
fn constants_and_no_load_power_load_in_si() {
    let text = demo_tank(
        "anchor",
        "ks = 28\nkp = 320\nnp_turbulent = 0.4\nno_load_power = \"0.3 kW\"",
    );
    let s = site::load_str(&text, "t.toml").expect("loads");
    let t = s.tank("TK-1").unwrap();
    assert_eq!(t.constants.ks, Some(28.0));
    assert_eq!(t.constants.kp, Some(320.0));
    assert_eq!(t.constants.np_turbulent, Some(0.4));
    // 0.3 kW = 300 W (SI prefix k = 10³).
    assert_eq!(t.no_load_power_w, Some(300.0));
    assert_eq!(t.ribbon, None);
}

#[test]
fn the_demo_tanks_have_no_constants_of_their_own() {
    let s = site::demo().expect("demo loads");
    for t in &s.tanks {
        assert_eq!(t.constants, site::TankConstants::default(), "{}", t.id);
    }
}

#[test]
fn a_ribbon_shape_loads_on_a_ribbon() {
    let text = demo_tank(
        "helical-ribbon",
        "ribbon_height = \"1.5 m\"\nribbon_pitch = \"1.6 m\"\nribbon_width = \"170 mm\"\nribbon_blades = 2",
    );
    let s = site::load_str(&text, "t.toml").expect("loads");
    let r = s.tank("TK-1").unwrap().ribbon.expect("ribbon");
    assert_eq!(
        r,
        RibbonShape {
            height_m: 1.5,
            pitch_m: 1.6,
            width_m: 0.17,
            blades: 2
        }
    );
}

#[test]
fn ribbon_shape_on_another_impeller_is_refused() {
    let text = demo_tank(
        "anchor",
        "ribbon_height = \"1.5 m\"\nribbon_pitch = \"1.6 m\"\nribbon_width = \"170 mm\"\nribbon_blades = 2",
    );
    let errs = errors(&text);
    assert_eq!(errs.len(), 1, "{errs:?}");
    assert!(
        errs[0].contains("helical-ribbon' only, not 'anchor'"),
        "{errs:?}"
    );
}

#[test]
fn a_partial_ribbon_shape_names_what_is_missing() {
    let text = demo_tank(
        "helical-ribbon",
        "ribbon_height = \"1.5 m\"\nribbon_blades = 2",
    );
    let errs = errors(&text);
    assert_eq!(errs.len(), 1, "{errs:?}");
    assert!(
        errs[0].contains("missing: ribbon_pitch, ribbon_width"),
        "{errs:?}"
    );
}

#[test]
fn bad_values_are_refused_with_what_is_accepted() {
    let ribbon = "ribbon_height = \"1.5 m\"\nribbon_pitch = \"1.6 m\"\nribbon_width = \"170 mm\"";
    let half = demo_tank("helical-ribbon", &format!("{ribbon}\nribbon_blades = 1.5"));
    assert!(
        errors(&half)[0].contains("whole number"),
        "{:?}",
        errors(&half)
    );
    let none = demo_tank("helical-ribbon", &format!("{ribbon}\nribbon_blades = 0"));
    assert!(
        errors(&none)[0].contains("between 1 and 8"),
        "{:?}",
        errors(&none)
    );
    let ks = errors(&demo_tank("anchor", "ks = -3"));
    assert!(
        ks[0].starts_with("tank.ks: must be greater than zero"),
        "{ks:?}"
    );
    let np = errors(&demo_tank("anchor", "np_turbulent = \"a lot\""));
    assert_eq!(np.len(), 1, "{np:?}");
    let no_load = errors(&demo_tank("anchor", "no_load_power = \"-1 kW\""));
    assert!(no_load[0].contains("must not be negative"), "{no_load:?}");
    let bare = errors(&demo_tank("anchor", "no_load_power = 300"));
    assert_eq!(bare.len(), 1, "a bare power is ambiguous: {bare:?}");
}
