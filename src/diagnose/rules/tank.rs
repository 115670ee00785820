//! Rules on an agitated tank: power above the motor's rating, torque above the gearbox's
//! limit, current above full-load current, a cavern smaller than the tank.

use crate::diagnose::{Caution, Finding, Number, Rule, Severity, Sure, TankFacts};
use crate::units::Dimension;

pub fn check(t: &TankFacts) -> Vec<Finding> {
    let mut out = Vec::new();
    out.extend(over(t, Rule::MotorOverRating));
    out.extend(over(t, Rule::TorqueOverLimit));
    out.extend(current(t));
    out.extend(stagnant(t));
    out
}

/// Power over the motor's rating or torque over the gearbox's limit, judged on the range.
fn over(t: &TankFacts, rule: Rule) -> Option<Finding> {
    let (demand, limit, dim, what, limit_name) = match rule {
        Rule::MotorOverRating => (
            t.motor_demand_w?,
            t.motor_rating_w?,
            Dimension::Power,
            "motor power needed",
            "motor rating",
        ),
        _ => (
            t.torque_n_m?,
            t.gearbox_limit_n_m?,
            Dimension::Torque,
            "torque on the shaft",
            "gearbox torque limit",
        ),
    };
    let sure = demand.sure_above(limit)?;
    let severity = match sure {
        Sure::Possible => Severity::Caution,
        _ => Severity::Alarm,
    };
    let title = match (rule, sure) {
        (Rule::MotorOverRating, Sure::Possible) => {
            "The agitator may need more power than the motor's rating at the high end of the range"
        }
        (Rule::MotorOverRating, _) => "The agitator needs more power than the motor's rating",
        (_, Sure::Possible) => {
            "The torque may exceed the gearbox's limit at the high end of the range"
        }
        _ => "The torque on the agitator shaft is above the gearbox's limit",
    };
    Some(
        Finding::new(rule, severity, sure, &t.subject)
            .titled(title.into())
            .number(Number::new(what, demand, dim))
            .number(Number::plain(limit_name, limit, dim))
            .checks(&[
                "lower the agitator speed",
                "check the batch: thicker or colder than its spec",
                "check the liquid level against the design",
            ])
            .caution(Caution::StopAgitator),
    )
}

fn current(t: &TankFacts) -> Option<Finding> {
    let (i, full) = (t.current_a?, t.full_load_current_a?);
    let sure = i.sure_above(full)?;
    let severity = match sure {
        Sure::Possible => Severity::Caution,
        _ => Severity::Alarm,
    };
    Some(
        Finding::new(Rule::CurrentOverFullLoad, severity, sure, &t.subject)
            .titled(
                "The motor draws more current than its full-load current: it will run hot or trip"
                    .into(),
            )
            .number(Number::new("motor current", i, Dimension::Current))
            .number(Number::plain(
                "full-load current (from the nameplate)",
                full,
                Dimension::Current,
            ))
            .checks(&[
                "lower the agitator speed or stop it",
                "check the supply voltage on all three phases",
                "check the batch viscosity against its spec",
            ])
            .caution(Caution::StopAgitator),
    )
}

/// The cavern falls short of the tank wall: product outside it stands still.
fn stagnant(t: &TankFacts) -> Option<Finding> {
    let cavern = t.cavern_m?;
    let sure = cavern.sure_below(t.tank_diameter_m)?;
    let mut f = Finding::new(Rule::StagnantProduct, Severity::Caution, sure, &t.subject)
        .titled(
            "The moving cavern is smaller than the tank: product near the wall stands still".into(),
        )
        .number(Number::new("cavern diameter", cavern, Dimension::Length))
        .number(Number::plain(
            "tank diameter",
            t.tank_diameter_m,
            Dimension::Length,
        ))
        .checks(&[
            "raise the speed toward the speed that reaches the wall, within the drive's limits",
            "sample near the wall only with the agitator stopped and locked out",
            "consider a close-clearance impeller for this product",
        ])
        .caution(Caution::StopAgitator);
    if let Some(m) = t.moving_fraction {
        f = f.number(Number::plain(
            "share of the liquid moving",
            m,
            Dimension::Fraction,
        ));
    }
    Some(f)
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::diagnose::Measured;

    fn tank() -> TankFacts {
        TankFacts {
            subject: "tank TK-1".into(),
            motor_demand_w: None,
            motor_rating_w: Some(3000.0),
            torque_n_m: None,
            gearbox_limit_n_m: Some(1500.0),
            current_a: None,
            full_load_current_a: Some(6.3),
            cavern_m: None,
            tank_diameter_m: 1.8,
            moving_fraction: None,
        }
    }

    fn rules(t: &TankFacts) -> Vec<Rule> {
        check(t).iter().map(|f| f.rule).collect()
    }

    #[test]
    fn motor_over_rating_fires_above_the_rating_only() {
        let mut t = tank();
        t.motor_demand_w = Some(Measured::within(3500.0, (3200.0, 3900.0)));
        assert_eq!(rules(&t), vec![Rule::MotorOverRating]);
        t.motor_demand_w = Some(Measured::within(2000.0, (1800.0, 2200.0)));
        assert!(rules(&t).is_empty());
    }

    #[test]
    fn torque_over_limit_fires_above_the_gearbox_limit_only() {
        let mut t = tank();
        t.torque_n_m = Some(Measured::within(1600.0, (1550.0, 1700.0)));
        assert_eq!(rules(&t), vec![Rule::TorqueOverLimit]);
        t.torque_n_m = Some(Measured::within(1000.0, (900.0, 1100.0)));
        assert!(rules(&t).is_empty());
    }

    #[test]
    fn current_over_full_load_fires_above_it_only() {
        let mut t = tank();
        t.current_a = Some(Measured::within(7.5, (7.35, 7.65)));
        assert_eq!(rules(&t), vec![Rule::CurrentOverFullLoad]);
        t.current_a = Some(Measured::within(5.0, (4.9, 5.1)));
        assert!(rules(&t).is_empty());
    }

    #[test]
    fn stagnant_fires_when_the_cavern_falls_short_of_the_wall() {
        let mut t = tank();
        t.cavern_m = Some(Measured::within(1.2, (1.0, 1.4)));
        assert_eq!(rules(&t), vec![Rule::StagnantProduct]);
        t.cavern_m = Some(Measured::within(2.0, (1.9, 2.2)));
        assert!(rules(&t).is_empty());
    }
}
