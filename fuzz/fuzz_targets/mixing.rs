//! Agitator power at a speed on arbitrary tanks and products: finite numbers or a refusal.
#![no_main]
use libfuzzer_sys::fuzz_target;
use rheoside::mixing::{Baffling, Drive, Fluid, ImpellerKind, Overrides, Vessel, operate};
use rheoside::rheology::Model;

#[path = "bytes.rs"]
mod bytes;
use bytes::{Bytes, assert_finite};

fuzz_target!(|data: &[u8]| {
    let mut b = Bytes(data);
    let impeller = ImpellerKind::ALL[usize::from(b.byte()) % ImpellerKind::ALL.len()];
    let vessel = Vessel {
        impeller,
        impeller_diameter_m: b.sized(),
        baffling: if b.byte() % 2 == 0 {
            Baffling::Baffled
        } else {
            Baffling::Unbaffled
        },
        tank_diameter_m: Some(b.sized()),
        liquid_height_m: Some(b.sized()),
        overrides: Overrides::default(),
        ribbon: None,
    };
    let drive = Drive {
        motor_rating_w: Some(b.sized()),
        gearbox_efficiency: None,
        gearbox_torque_limit_n_m: Some(b.sized()),
    };
    let model = match b.byte() % 3 {
        0 => Model::Newtonian { mu: b.sized() },
        1 => Model::PowerLaw {
            k: b.sized(),
            n: b.sized(),
        },
        _ => Model::HerschelBulkley {
            tau0: b.sized(),
            k: b.sized(),
            n: b.sized(),
        },
    };
    let fluid = Fluid {
        density_kg_m3: b.sized(),
        model,
    };
    if let Ok(op) = operate(&vessel, &drive, &fluid, b.sized()) {
        assert_finite("power number", op.point.power_number);
        assert_finite("power", op.power_w.value);
    }
});
