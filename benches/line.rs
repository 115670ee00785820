//! Pressure-drop curve of a Herschel–Bulkley paste: 200 flows on the demo paste line (invented
//! values), each a bracketed root-find for the wall stress, then the regime and friction.

use rheoside::line::{Fluid, Pipe, system_curve};
use rheoside::rheology::Model;

fn main() {
    divan::main();
}

#[divan::bench]
fn herschel_bulkley_curve_200_points() -> usize {
    let pipe = Pipe {
        inner_diameter_m: 0.0627,
        length_m: 32.0,
        fittings_length_m: 6.0,
        roughness_m: 1.5e-6,
        elevation_change_m: 2.0,
    };
    let fluid = Fluid {
        model: Model::HerschelBulkley {
            tau0: 160.0,
            k: 45.0,
            n: 0.33,
        },
        density_kg_m3: 1480.0,
    };
    let curve = system_curve(
        divan::black_box(&pipe),
        divan::black_box(&fluid),
        None,
        1e-4,
        0.02,
        200,
    );
    curve.map_or(0, |c| c.len())
}
