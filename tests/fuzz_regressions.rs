//! Inputs the fuzz targets (fuzz/) found, kept so the answers stay right. Each gave a number
//! that is not finite as if it were an answer; now each is refused with a message, or
//! answered with finite numbers.

use rheoside::line::{Fluid, Pipe, flow_for_pressure, pressure_drop};
use rheoside::mixing::{
    Baffling, Drive, Fluid as TankFluid, ImpellerKind, Overrides, Vessel, operate,
};
use rheoside::rheology::Model;

// fuzz target `line`, crash-dc317968…: a subnormal flow (1.1e-321 m³/s) of an almost weightless
// product in a 5 km bore gave a pressure drop of NaN.
#[test]
fn a_subnormal_flow_in_a_huge_bore_is_refused_not_nan() {
    let pipe = Pipe {
        inner_diameter_m: 4984.375,
        length_m: 2343.75,
        fittings_length_m: 43_906_250.0,
        roughness_m: 234.375,
        elevation_change_m: 4984.375,
    };
    let fluid = Fluid {
        model: Model::Newtonian { mu: 167.1875 },
        density_kg_m3: 1e-11,
    };
    match pressure_drop(&pipe, &fluid, 1.1e-321) {
        Ok(a) => assert!(
            a.pressure_drop_pa.is_finite() && a.reynolds.is_finite(),
            "{a:?}"
        ),
        Err(e) => assert!(e.to_string().contains("beyond what can be computed"), "{e}"),
    }
}

// fuzz target `mixing`, crash-f626b152…: a subnormal speed (2.9e-319 rev/s) gave a power
// number of infinity.
#[test]
fn a_subnormal_speed_is_refused_not_an_infinite_power_number() {
    let vessel = Vessel {
        impeller: ImpellerKind::ALL[3],
        impeller_diameter_m: 4984.375,
        baffling: Baffling::Unbaffled,
        tank_diameter_m: Some(4.984_375e9),
        liquid_height_m: Some(4546.875),
        overrides: Overrides::default(),
        ribbon: None,
    };
    let drive = Drive {
        motor_rating_w: Some(0.4984375),
        gearbox_efficiency: None,
        gearbox_torque_limit_n_m: Some(4546.875),
    };
    let fluid = TankFluid {
        density_kg_m3: 4546.875,
        model: Model::Newtonian { mu: 0.453125 },
    };
    match operate(&vessel, &drive, &fluid, 2.8711e-319) {
        Ok(op) => assert!(op.point.power_number.is_finite(), "{op:?}"),
        Err(e) => assert!(e.to_string().contains("beyond what can be computed"), "{e}"),
    }
}

// fuzz target `line`, crash-4737ed01… and crash-e38e9edd…: the flow for a pressure drop in a
// bore of kilometres came out infinite (inputs far outside plant sizes, found after the first
// fix). Each is refused, or answered with finite numbers.
#[test]
fn the_flow_for_a_pressure_drop_is_never_infinite() {
    let cases = [
        (
            Pipe {
                inner_diameter_m: 2_968_750.0,
                length_m: 0.002_968_75,
                fittings_length_m: 496.875,
                roughness_m: 1.796_875e-9,
                elevation_change_m: 1.5e-6,
            },
            Fluid {
                model: Model::Bingham {
                    tau0: 1.453_125e-4,
                    mu_p: 2.676_037_107_453_547e-139,
                },
                density_kg_m3: 10.0,
            },
            496.875,
        ),
        (
            Pipe {
                inner_diameter_m: 448.4375,
                length_m: 3.671_875e-5,
                fittings_length_m: 3.671_875e-9,
                roughness_m: 4.484_375e-5,
                elevation_change_m: 1.718_75e-5,
            },
            Fluid {
                model: Model::PowerLaw {
                    k: 498.4375,
                    n: 2343.75,
                },
                density_kg_m3: 159.375,
            },
            1000.0,
        ),
    ];
    for (pipe, fluid, dp) in cases {
        for result in [
            flow_for_pressure(&pipe, &fluid, dp).map(|a| a.flow_m3_s),
            pressure_drop(&pipe, &fluid, dp).map(|a| a.pressure_drop_pa),
        ] {
            match result {
                Ok(x) => assert!(x.is_finite(), "{x}"),
                Err(e) => assert!(!e.to_string().is_empty()),
            }
        }
    }
}
