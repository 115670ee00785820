//! Tank power-curve speed: a 200-point speed sweep of one tank (power, torque, regime at
//! each speed), the same with the ranges and drive checks at every point, and one full tank
//! answer (with the cavern's speed to the wall). Run with `cargo bench --bench mixing`.
//! The tank is the invented demo site's slurry tank (Marrowdale TK-2) with an invented
//! Herschel–Bulkley slurry.

use divan::black_box;
use rheoside::mixing::{self, Baffling, Drive, Fluid, ImpellerKind, Overrides, Vessel};
use rheoside::rheology::Model;
use rheoside::session::tank;
use rheoside::session::tank_input::{Source, TankRequest};

fn main() {
    divan::main();
}

fn vessel() -> Vessel {
    Vessel {
        impeller: ImpellerKind::PitchedBladeTurbine,
        impeller_diameter_m: 0.8,
        baffling: Baffling::Baffled,
        tank_diameter_m: Some(2.4),
        liquid_height_m: Some(2.2),
        overrides: Overrides::default(),
        ribbon: None,
    }
}

fn fluid() -> Fluid {
    Fluid {
        density_kg_m3: 1550.0,
        model: Model::HerschelBulkley {
            tau0: 30.0,
            k: 2.0,
            n: 0.5,
        },
    }
}

fn drive() -> Drive {
    Drive {
        motor_rating_w: Some(4000.0),
        gearbox_efficiency: Some(0.95),
        gearbox_torque_limit_n_m: Some(600.0),
    }
}

#[divan::bench]
fn speed_sweep_200(bencher: divan::Bencher) {
    let (v, f) = (vessel(), fluid());
    bencher.bench(|| mixing::speed_sweep(black_box(&v), black_box(&f), 0.05, 5.0, 200));
}

#[divan::bench]
fn operate_with_ranges_200(bencher: divan::Bencher) {
    let (v, f, d) = (vessel(), fluid(), drive());
    let speeds = mixing::log_spaced(0.05, 5.0, 200).unwrap();
    bencher.bench(|| {
        speeds
            .iter()
            .map(|&n| mixing::operate(black_box(&v), &d, &f, n).map(|o| o.power_w.high))
            .collect::<Result<Vec<_>, _>>()
    });
}

#[divan::bench]
fn tank_answer_with_cavern(bencher: divan::Bencher) {
    let req = TankRequest {
        vessel: vessel(),
        drive: drive(),
        fluid: fluid(),
        speed_rps: 1.4,
        motor: None,
        speed_from: Source::Flag,
    };
    bencher.bench(|| tank::analyse(black_box(&req)));
}
