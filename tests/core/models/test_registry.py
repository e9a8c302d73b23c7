"""The model registry and the orbital sets models return."""

import pytest

from zeffir.core import ModelError, build, get_model, model_names
from zeffir.core.models import register


def test_three_models_are_registered():
    assert set(model_names()) >= {"hydrogenic", "slater", "clementi"}


def test_unknown_model_lists_the_known_ones():
    with pytest.raises(ModelError, match=r"unknown model .*slater"):
        get_model("nope")


def test_duplicate_registration_is_refused():
    with pytest.raises(ModelError):
        register(get_model("slater"))


@pytest.mark.parametrize("model", ["hydrogenic", "slater", "clementi"])
@pytest.mark.parametrize("spec", ["H", "Fe3+", "U", "Og", "He+ 2p1", "Na [Ne] 4d1", "H 20i1"])
def test_every_model_builds_normalised_orbitals(model, spec):
    orbitals = build(spec, model)
    assert orbitals.labels == tuple(s.label for s, _ in orbitals.configuration.occupations)
    for orbital in orbitals.orbitals:
        assert orbital.radial.norm() == pytest.approx(1.0, abs=1e-9)
        assert orbital.z_eff > 0 and orbital.zeta > 0


def test_hydrogenic_model_uses_the_bare_charge():
    orbital = build("Fe", "hydrogenic").orbital("3d")
    assert (orbital.z_eff, orbital.zeta, orbital.energy) == (26.0, 26.0 / 3, -(26.0**2) / 18)


def test_slater_extrapolated_n_star_is_flagged():
    orbital = build("H 8s1", "slater").orbital("8s")
    assert orbital.n_star == 4.2 and any("n* = 4.2 assumed" in note for note in orbital.notes)
