//! Pipe flow: pressure drop for a flow and flow for a pressure drop, on arbitrary pipes and
//! products; an answer with finite numbers or a refusal, never a panic or a hang.
#![no_main]
use libfuzzer_sys::fuzz_target;
use rheoside::line::{Fluid, Pipe, flow_for_pressure, pressure_drop};
use rheoside::rheology::Model;

#[path = "bytes.rs"]
mod bytes;
use bytes::{Bytes, assert_finite};

fuzz_target!(|data: &[u8]| {
    let mut b = Bytes(data);
    let pipe = Pipe {
        inner_diameter_m: b.sized(),
        length_m: b.sized(),
        fittings_length_m: b.sized(),
        roughness_m: b.sized(),
        elevation_change_m: b.sized(),
    };
    let model = match b.byte() % 5 {
        0 => Model::Newtonian { mu: b.sized() },
        1 => Model::PowerLaw {
            k: b.sized(),
            n: b.sized(),
        },
        2 => Model::Bingham {
            tau0: b.sized(),
            mu_p: b.sized(),
        },
        3 => Model::HerschelBulkley {
            tau0: b.sized(),
            k: b.sized(),
            n: b.sized(),
        },
        _ => Model::Casson {
            tau0: b.sized(),
            mu_c: b.sized(),
        },
    };
    let fluid = Fluid {
        model,
        density_kg_m3: b.sized(),
    };
    if let Ok(a) = pressure_drop(&pipe, &fluid, b.sized()) {
        assert_finite("pressure drop", a.pressure_drop_pa);
        assert_finite("reynolds", a.reynolds);
    }
    if let Ok(a) = flow_for_pressure(&pipe, &fluid, b.sized()) {
        assert_finite("flow", a.flow_m3_s);
    }
});
