//! The five flow-model families and the names of their parameters (JSON keys, symbols, labels).

use super::error::FitError;

/// A flow-model family, without numbers.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, serde::Serialize, serde::Deserialize)]
#[serde(rename_all = "kebab-case")]
pub enum ModelKind {
    Newtonian,
    PowerLaw,
    Bingham,
    HerschelBulkley,
    Casson,
}

impl ModelKind {
    /// Every family, simplest first (the order candidates are listed in).
    pub const ALL: [ModelKind; 5] = [
        ModelKind::Newtonian,
        ModelKind::PowerLaw,
        ModelKind::Bingham,
        ModelKind::HerschelBulkley,
        ModelKind::Casson,
    ];

    /// Machine name, as typed on the command line and written in JSON.
    pub fn name(self) -> &'static str {
        match self {
            ModelKind::Newtonian => "newtonian",
            ModelKind::PowerLaw => "power-law",
            ModelKind::Bingham => "bingham",
            ModelKind::HerschelBulkley => "herschel-bulkley",
            ModelKind::Casson => "casson",
        }
    }

    /// Name for people, with the published spelling.
    pub fn title(self) -> &'static str {
        match self {
            ModelKind::Newtonian => "Newtonian",
            ModelKind::PowerLaw => "power law",
            ModelKind::Bingham => "Bingham",
            ModelKind::HerschelBulkley => "Herschel–Bulkley",
            ModelKind::Casson => "Casson",
        }
    }

    /// The parameters in the order estimates are reported.
    pub fn param_names(self) -> &'static [ParamName] {
        match self {
            ModelKind::Newtonian => &[ParamName::Mu],
            ModelKind::PowerLaw => &[ParamName::K, ParamName::N],
            ModelKind::Bingham => &[ParamName::Tau0, ParamName::MuP],
            ModelKind::HerschelBulkley => &[ParamName::Tau0, ParamName::K, ParamName::N],
            ModelKind::Casson => &[ParamName::Tau0, ParamName::MuC],
        }
    }

    /// Number of parameters p (the k of AICc; σ is not counted).
    pub fn param_count(self) -> usize {
        self.param_names().len()
    }
}

impl std::fmt::Display for ModelKind {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        f.write_str(self.title())
    }
}

impl std::str::FromStr for ModelKind {
    type Err = FitError;

    /// Accepts the machine names in any case, with `_` or a space for `-`.
    fn from_str(s: &str) -> Result<Self, Self::Err> {
        let wanted = s.trim().to_ascii_lowercase().replace(['_', ' '], "-");
        ModelKind::ALL
            .into_iter()
            .find(|k| k.name() == wanted)
            .ok_or_else(|| FitError::UnknownModel {
                given: s.to_string(),
            })
    }
}

/// One model parameter.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, serde::Serialize, serde::Deserialize)]
pub enum ParamName {
    Mu,
    K,
    N,
    Tau0,
    MuP,
    MuC,
}

impl ParamName {
    /// Key in JSON output, with the SI unit in it.
    pub fn json_key(self) -> &'static str {
        match self {
            ParamName::Mu => "mu_pa_s",
            ParamName::K => "k_pa_sn",
            ParamName::N => "n",
            ParamName::Tau0 => "tau0_pa",
            ParamName::MuP => "mu_p_pa_s",
            ParamName::MuC => "mu_c_pa_s",
        }
    }

    pub fn symbol(self) -> &'static str {
        match self {
            ParamName::Mu => "μ",
            ParamName::K => "K",
            ParamName::N => "n",
            ParamName::Tau0 => "τ0",
            ParamName::MuP => "μp",
            ParamName::MuC => "μc",
        }
    }

    /// The trade term.
    pub fn label(self) -> &'static str {
        match self {
            ParamName::Mu => "viscosity",
            ParamName::K => "consistency index",
            ParamName::N => "flow behaviour index",
            ParamName::Tau0 => "yield stress",
            ParamName::MuP => "plastic viscosity",
            ParamName::MuC => "Casson viscosity",
        }
    }

    /// SI unit as printed ("" for the dimensionless n).
    pub fn unit(self) -> &'static str {
        match self {
            ParamName::Mu | ParamName::MuP | ParamName::MuC => "Pa·s",
            ParamName::K => "Pa·sⁿ",
            ParamName::N => "",
            ParamName::Tau0 => "Pa",
        }
    }
}
