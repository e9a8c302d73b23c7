"""Models: each turns a Configuration into an OrbitalSet. Adding a model is adding a module."""

from zeffir.core.models._clementi import ClementiModel, clementi_z_eff
from zeffir.core.models._hydrogenic import HydrogenicModel
from zeffir.core.models._lda import KohnShamModel, LDAModel, kohn_sham_models
from zeffir.core.models._registry import (
    DEFAULT_MODEL,
    Model,
    build,
    get_model,
    model_names,
    register,
)
from zeffir.core.models._slater_rules import (
    SLATER_N_STAR,
    SlaterRulesModel,
    slater_n_star,
    slater_screening,
)
from zeffir.core.models._variational import VariationalModel
from zeffir.core.models.hartree_fock import HartreeFockModel

register(HydrogenicModel())
register(SlaterRulesModel())
register(ClementiModel())
register(VariationalModel())
register(HartreeFockModel())
register(HartreeFockModel("hartree-fock-average", "Hartree–Fock, average of configuration",
                          "Roothaan 1960 (method); Slater 1960 (average of configuration)", average=True))
for _model in kohn_sham_models():
    register(_model)

__all__ = [
    "DEFAULT_MODEL",
    "SLATER_N_STAR",
    "ClementiModel",
    "HartreeFockModel",
    "HydrogenicModel",
    "KohnShamModel",
    "LDAModel",
    "Model",
    "SlaterRulesModel",
    "VariationalModel",
    "build",
    "clementi_z_eff",
    "get_model",
    "kohn_sham_models",
    "model_names",
    "register",
    "slater_n_star",
    "slater_screening",
]
