//! One file per group of rules. Each `check` reads one item of the facts and returns the
//! findings it supports, unranked.

pub mod fit;
pub mod plant;
pub mod product;
pub mod pump;
pub mod readings;
pub mod regime;
pub mod restart;
pub mod tank;
