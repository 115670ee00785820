//! Rules on a pump: discharge above its maximum or relief setting, a centrifugal far from its
//! best-efficiency flow, a shear-thickening product on a positive-displacement pump.

use crate::diagnose::{Caution, Finding, Number, PumpFacts, PumpType, Rule, Severity, Sure};
use crate::units::Dimension;

/// The preferred operating region of a centrifugal pump, as shares of its best-efficiency
/// flow (ANSI/HI 9.6.3 preferred operating region 70 % to 120 %, from memory).
pub const PREFERRED_REGION: (f64, f64) = (0.7, 1.2);

pub fn check(p: &PumpFacts) -> Vec<Finding> {
    let mut out = Vec::new();
    out.extend(discharge_over_limit(p));
    out.extend(far_from_bep(p));
    out.extend(shear_thickening(p));
    out
}

/// The lower of the casing maximum and the relief setting, with its name.
fn lowest_limit(p: &PumpFacts) -> Option<(f64, &'static str)> {
    let limits = [
        p.relief_pa.map(|x| (x, "relief setting")),
        p.max_discharge_pa
            .map(|x| (x, "maximum discharge pressure")),
    ];
    limits
        .into_iter()
        .flatten()
        .min_by(|a, b| a.0.total_cmp(&b.0))
}

fn discharge_over_limit(p: &PumpFacts) -> Option<Finding> {
    let discharge = p.discharge_pa?;
    let (limit, name) = lowest_limit(p)?;
    let sure = discharge.sure_above(limit)?;
    let severity = match sure {
        Sure::Possible => Severity::Caution,
        _ => Severity::Alarm,
    };
    let title = match sure {
        Sure::Possible => {
            format!("The discharge pressure is at its {name}: within the gauge's error of it")
        }
        _ => format!("The discharge pressure is above the pump's {name}"),
    };
    let relief_check = if p.relief_pa.is_some() && name == "maximum discharge pressure" {
        "the relief is set above the casing's maximum: have it reset by a competent person"
    } else {
        "check the relief valve lifts at its setting (it may be stuck or set wrong)"
    };
    Some(
        Finding::new(Rule::DischargeOverLimit, severity, sure, &p.subject)
            .titled(title)
            .number(Number::new(
                "discharge pressure",
                discharge,
                Dimension::Pressure,
            ))
            .number(Number::plain(name, limit, Dimension::Pressure))
            .checks(&[
                "reduce the pump speed or stop the pump",
                "look for a closed or blocked valve downstream, or a gelled line",
                relief_check,
                "check the gauge against a second one",
            ])
            .caution(Caution::WeakestPart),
    )
}

fn far_from_bep(p: &PumpFacts) -> Option<Finding> {
    if p.kind != PumpType::Centrifugal {
        return None;
    }
    let (flow, bep) = (p.flow_m3_s?, p.bep_flow_m3_s?);
    let share = flow / bep;
    if !share.is_finite() || (PREFERRED_REGION.0..=PREFERRED_REGION.1).contains(&share) {
        return None;
    }
    let side = if share < PREFERRED_REGION.0 {
        "below"
    } else {
        "above"
    };
    Some(
        Finding::new(
            Rule::FarFromBestEfficiency,
            Severity::Caution,
            Sure::Likely,
            &p.subject,
        )
        .titled(format!(
            "The centrifugal pump runs far {side} its best-efficiency flow: expect heat, vibration and wear"
        ))
        .number(Number::plain("flow", flow, Dimension::Flow))
        .number(Number::plain("best-efficiency flow", bep, Dimension::Flow))
        .number(Number::plain("share of best-efficiency flow", share, Dimension::Fraction))
        .checks(&[
            "check the valve positions and the system's resistance",
            "for thick product a positive-displacement pump may serve better",
        ])
        .caution(Caution::IsolateBeforeOpening),
    )
}

fn shear_thickening(p: &PumpFacts) -> Option<Finding> {
    if p.kind != PumpType::PositiveDisplacement {
        return None;
    }
    let n = p.flow_index?;
    let sure = n.sure_above(1.0)?;
    Some(
        Finding::new(
            Rule::ShearThickeningOnDisplacement,
            Severity::Caution,
            sure,
            &p.subject,
        )
        .titled(
            "The product thickens with shear on a positive-displacement pump: pressure rises faster than speed"
                .into(),
        )
        .number(Number::new("flow behaviour index n", n, Dimension::Dimensionless))
        .checks(&[
            "raise the speed in small steps, watching the discharge pressure",
            "confirm the relief valve is set and works before the start",
        ])
        .caution(Caution::WeakestPart),
    )
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::diagnose::Measured;

    fn pd() -> PumpFacts {
        PumpFacts {
            subject: "pump P-2".into(),
            kind: PumpType::PositiveDisplacement,
            discharge_pa: None,
            max_discharge_pa: Some(14e5),
            relief_pa: Some(12e5),
            flow_m3_s: None,
            bep_flow_m3_s: None,
            flow_index: None,
        }
    }

    fn rules(p: &PumpFacts) -> Vec<Rule> {
        check(p).iter().map(|f| f.rule).collect()
    }

    #[test]
    fn discharge_over_limit_names_the_lower_limit() {
        let mut p = pd();
        p.discharge_pa = Some(Measured::within(13e5, (12.74e5, 13.26e5)));
        let f = check(&p);
        assert_eq!(f[0].rule, Rule::DischargeOverLimit);
        assert_eq!((f[0].severity, f[0].sure), (Severity::Alarm, Sure::Certain));
        assert!(f[0].title.contains("relief setting"));
        p.discharge_pa = Some(Measured::within(9e5, (8.8e5, 9.2e5)));
        assert!(rules(&p).is_empty());
    }

    #[test]
    fn far_from_bep_fires_outside_the_preferred_region_only() {
        let mut p = pd();
        p.kind = PumpType::Centrifugal;
        p.bep_flow_m3_s = Some(0.005);
        p.flow_m3_s = Some(0.002);
        assert_eq!(rules(&p), vec![Rule::FarFromBestEfficiency]);
        p.flow_m3_s = Some(0.005);
        assert!(rules(&p).is_empty());
    }

    #[test]
    fn shear_thickening_fires_on_a_pd_pump_with_n_above_one_only() {
        let mut p = pd();
        p.flow_index = Some(Measured::within(1.3, (1.2, 1.4)));
        assert_eq!(rules(&p), vec![Rule::ShearThickeningOnDisplacement]);
        p.flow_index = Some(Measured::within(0.4, (0.35, 0.45)));
        assert!(rules(&p).is_empty());
        p.flow_index = Some(Measured::within(1.3, (1.2, 1.4)));
        p.kind = PumpType::Centrifugal;
        assert!(rules(&p).is_empty());
    }
}
