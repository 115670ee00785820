//! The six impeller types and their published power-curve constants: Metzner–Otto ks, the
//! laminar Kp = Np·Re, the turbulent power number with and without baffles, and where each
//! regime starts. One item per impeller, each with its source and range.

use serde::Serialize;

/// Impeller types the mixing calculations know (the engine's own list; the site maps to it).
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "kebab-case")]
pub enum ImpellerKind {
    RushtonTurbine,
    PitchedBladeTurbine,
    Propeller,
    Hydrofoil,
    Anchor,
    HelicalRibbon,
}

/// A constant with the range the literature gives around it (low ≤ value ≤ high).
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct Spread {
    pub low: f64,
    pub value: f64,
    pub high: f64,
}

impl Spread {
    pub const fn new(low: f64, value: f64, high: f64) -> Spread {
        Spread { low, value, high }
    }

    /// A value known exactly (a site's own constant): no range around it.
    pub const fn exact(value: f64) -> Spread {
        Spread::new(value, value, value)
    }
}

/// What the literature gives for one impeller type in a standard geometry.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct ImpellerConstants {
    /// Metzner–Otto constant: effective shear rate = ks·N (N in rev/s).
    pub ks: Spread,
    /// Laminar constant Kp = Np·Re.
    pub kp: Spread,
    /// Turbulent power number in a fully baffled tank.
    pub np_turbulent_baffled: Spread,
    /// Turbulent power number without baffles (swirl and a surface vortex cut the power).
    pub np_turbulent_unbaffled: Spread,
    /// Laminar below this impeller Reynolds number.
    pub re_laminar_below: f64,
    /// Turbulent (constant Np) above this impeller Reynolds number.
    pub re_turbulent_above: f64,
}

/// Six-blade Rushton (disc) turbine, D/T ≈ 1/3, four wall baffles of T/10.
///
/// - ks 11.5 (range 10–13): 13 in Metzner & Otto (1957), AIChE J 3:3, and in Wu, Graham &
///   Noui-Mehidi (2006), AIChE J 52:2323; 11.5 also published; "10–13 for turbines".
/// - Kp 70 (65–75) and laminar below Re ≈ 10: common handbook values, from memory.
/// - Turbulent Np ≈ 6 in Rushton, Costich & Everett (1950), Chem. Eng. Prog. 46 (volume and
///   pages from memory), for the standard geometry; 5.0–5.5 for others; constant above
///   Re ≈ 10⁴. Give the site's own value where the maker states one.
/// - Unbaffled turbulent Np ≈ 1 (0.8–1.5), falling with the Froude number as the vortex
///   deepens: from memory.
pub const RUSHTON_TURBINE: ImpellerConstants = ImpellerConstants {
    ks: Spread::new(10.0, 11.5, 13.0),
    kp: Spread::new(65.0, 70.0, 75.0),
    np_turbulent_baffled: Spread::new(5.0, 5.5, 6.0),
    np_turbulent_unbaffled: Spread::new(0.8, 1.0, 1.5),
    re_laminar_below: 10.0,
    re_turbulent_above: 1.0e4,
};

/// Four-blade 45° pitched-blade turbine, D/T ≈ 1/3, baffled.
///
/// - ks 11 (10–13): "about 10–13" for turbines; 9.5 in one secondary sheet. From memory.
/// - Kp 45 (40–50), laminar below Re ≈ 10: from memory.
/// - Turbulent Np 1.27 (1.1–1.5) above Re ≈ 10⁴: from memory.
/// - Unbaffled turbulent Np ≈ 0.7 (0.5–0.9): from memory.
pub const PITCHED_BLADE_TURBINE: ImpellerConstants = ImpellerConstants {
    ks: Spread::new(10.0, 11.0, 13.0),
    kp: Spread::new(40.0, 45.0, 50.0),
    np_turbulent_baffled: Spread::new(1.1, 1.27, 1.5),
    np_turbulent_unbaffled: Spread::new(0.5, 0.7, 0.9),
    re_laminar_below: 10.0,
    re_turbulent_above: 1.0e4,
};

/// Three-blade marine propeller, pitch = diameter, baffled.
///
/// - ks ≈ 10 (9–11), Kp ≈ 40 (35–45), laminar below Re ≈ 10: from memory.
/// - Turbulent Np ≈ 0.35 (0.3–0.4) above Re ≈ 10⁴; unbaffled ≈ 0.25 (0.2–0.3): from memory.
pub const PROPELLER: ImpellerConstants = ImpellerConstants {
    ks: Spread::new(9.0, 10.0, 11.0),
    kp: Spread::new(35.0, 40.0, 45.0),
    np_turbulent_baffled: Spread::new(0.3, 0.35, 0.4),
    np_turbulent_unbaffled: Spread::new(0.2, 0.25, 0.3),
    re_laminar_below: 10.0,
    re_turbulent_above: 1.0e4,
};

/// Three-blade hydrofoil (narrow-blade, high-efficiency), baffled.
///
/// - ks ≈ 10 (9–11) and Kp ≈ 40 (35–50), laminar below Re ≈ 10: from memory, and thinly
///   documented for this type; give the maker's values as site constants where known.
/// - Turbulent Np ≈ 0.3 (0.25–0.35) above Re ≈ 10⁴; unbaffled ≈ 0.2 (0.15–0.25): from memory.
pub const HYDROFOIL: ImpellerConstants = ImpellerConstants {
    ks: Spread::new(9.0, 10.0, 11.0),
    kp: Spread::new(35.0, 40.0, 50.0),
    np_turbulent_baffled: Spread::new(0.25, 0.3, 0.35),
    np_turbulent_unbaffled: Spread::new(0.15, 0.2, 0.25),
    re_laminar_below: 10.0,
    re_turbulent_above: 1.0e4,
};

/// Anchor, close wall clearance (D/T ≈ 0.9–0.95), normally run without baffles.
///
/// - ks ≈ 25 (20–35), rising as the wall clearance narrows: from memory.
/// - Kp ≈ 300 (200–400), laminar up to Re ≈ 30: from memory (secondary sheets give 200).
/// - Turbulent Np ≈ 0.35 (0.3–0.5) above Re ≈ 10⁴, baffled or not (the blades sweep the
///   wall, so baffles change little): from memory; anchors are seldom run turbulent.
pub const ANCHOR: ImpellerConstants = ImpellerConstants {
    ks: Spread::new(20.0, 25.0, 35.0),
    kp: Spread::new(200.0, 300.0, 400.0),
    np_turbulent_baffled: Spread::new(0.3, 0.35, 0.5),
    np_turbulent_unbaffled: Spread::new(0.3, 0.35, 0.5),
    re_laminar_below: 30.0,
    re_turbulent_above: 1.0e4,
};

/// Double helical ribbon, close wall clearance, unbaffled.
///
/// - ks ≈ 30 (25–35): from memory (secondary sheets give 30).
/// - Kp ≈ 350 (300–1000) for an unknown geometry, laminar up to Re ≈ 60: from memory. When
///   the ribbon's height, pitch, width and blade count are known, Kp comes from Rieger,
///   Novák & Havelková (1988), Int. Chem. Eng. 28:376, see [`super::ribbon::kp_rieger`].
/// - Turbulent Np ≈ 0.35 (0.3–0.5) above Re ≈ 10⁴: from memory; ribbons are not run there.
pub const HELICAL_RIBBON: ImpellerConstants = ImpellerConstants {
    ks: Spread::new(25.0, 30.0, 35.0),
    kp: Spread::new(300.0, 350.0, 1000.0),
    np_turbulent_baffled: Spread::new(0.3, 0.35, 0.5),
    np_turbulent_unbaffled: Spread::new(0.3, 0.35, 0.5),
    re_laminar_below: 60.0,
    re_turbulent_above: 1.0e4,
};

impl ImpellerKind {
    pub const ALL: [ImpellerKind; 6] = [
        ImpellerKind::RushtonTurbine,
        ImpellerKind::PitchedBladeTurbine,
        ImpellerKind::Propeller,
        ImpellerKind::Hydrofoil,
        ImpellerKind::Anchor,
        ImpellerKind::HelicalRibbon,
    ];

    /// The published constants for this type.
    pub fn constants(self) -> &'static ImpellerConstants {
        match self {
            ImpellerKind::RushtonTurbine => &RUSHTON_TURBINE,
            ImpellerKind::PitchedBladeTurbine => &PITCHED_BLADE_TURBINE,
            ImpellerKind::Propeller => &PROPELLER,
            ImpellerKind::Hydrofoil => &HYDROFOIL,
            ImpellerKind::Anchor => &ANCHOR,
            ImpellerKind::HelicalRibbon => &HELICAL_RIBBON,
        }
    }

    /// The command-line and config spelling, e.g. `pitched-blade-turbine`.
    pub fn name(self) -> &'static str {
        match self {
            ImpellerKind::RushtonTurbine => "rushton-turbine",
            ImpellerKind::PitchedBladeTurbine => "pitched-blade-turbine",
            ImpellerKind::Propeller => "propeller",
            ImpellerKind::Hydrofoil => "hydrofoil",
            ImpellerKind::Anchor => "anchor",
            ImpellerKind::HelicalRibbon => "helical-ribbon",
        }
    }

    /// The type spelled `name`, if any.
    pub fn from_name(name: &str) -> Option<ImpellerKind> {
        let wanted = name.trim().to_ascii_lowercase();
        Self::ALL.into_iter().find(|k| k.name() == wanted)
    }

    /// Close-clearance types sweep the wall; the others stand off it.
    pub fn sweeps_wall(self) -> bool {
        matches!(self, ImpellerKind::Anchor | ImpellerKind::HelicalRibbon)
    }
}
