"""Spherical harmonics: real against complex, orthonormality, labels."""

import numpy as np
import pytest
from numpy.polynomial.legendre import leggauss

from zeffir.core import QuantumNumberError, complex_harmonic, real_harmonic, real_labels
from zeffir.core.orbitals import real_m_from_label, solid_harmonic


def _sphere_quadrature(order=20):
    """Gauss–Legendre in cos θ times the trapezoid rule in φ: exact for l + l' <= 2·order - 1."""
    t, w = leggauss(order)
    phi = np.linspace(0.0, 2 * np.pi, 2 * order + 1)[:-1]
    theta = np.arccos(t)
    th, ph = np.meshgrid(theta, phi, indexing="ij")
    weights = np.outer(w, np.full(phi.size, 2 * np.pi / phi.size))
    return th, ph, weights


def test_real_harmonics_are_the_standard_combinations_of_complex_ones():
    rng = np.random.default_rng(7)
    theta = np.concatenate(([0.0, np.pi], rng.uniform(0, np.pi, 40)))
    phi = np.concatenate(([0.0, 2 * np.pi], rng.uniform(0, 2 * np.pi, 40)))
    with np.errstate(all="raise"):
        for l in range(7):
            for m in range(-l, l + 1):
                y = complex_harmonic(l, abs(m), theta, phi)
                expected = y.real if m == 0 else np.sqrt(2) * (-1) ** m * (y.real if m > 0 else y.imag)
                np.testing.assert_allclose(real_harmonic(l, m, theta, phi), expected, atol=1e-13)


def test_real_harmonics_are_orthonormal():
    th, ph, w = _sphere_quadrature()
    values = [real_harmonic(l, m, th, ph) for l in range(7) for m in range(-l, l + 1)]
    gram = np.array([[np.sum(w * a * b) for b in values] for a in values])
    np.testing.assert_allclose(gram, np.eye(len(values)), atol=1e-12)


def test_condon_shortley_phase():
    # Y_1^1 = -√(3/8π) sin θ e^{iφ} (Condon & Shortley 1935).
    assert complex_harmonic(1, 1, np.pi / 2, 0.0).real == pytest.approx(-np.sqrt(3 / (8 * np.pi)))


def test_unsold_sum_rule():
    # Σ_m |Y_lm|² = (2l+1)/4π (Unsöld 1927).
    rng = np.random.default_rng(3)
    th, ph = rng.uniform(0, np.pi, 30), rng.uniform(0, 2 * np.pi, 30)
    for l in range(7):
        total = sum(real_harmonic(l, m, th, ph) ** 2 for m in range(-l, l + 1))
        np.testing.assert_allclose(total, (2 * l + 1) / (4 * np.pi), rtol=1e-12)


def test_standard_labels_point_along_their_axes():
    x, y, z = np.eye(3)
    assert solid_harmonic(1, real_m_from_label(1, "px"), *x) > 0
    assert solid_harmonic(1, real_m_from_label(1, "py"), *y) > 0
    assert solid_harmonic(1, real_m_from_label(1, "pz"), *z) > 0
    assert solid_harmonic(2, real_m_from_label(2, "dxy"), 1.0, 1.0, 0.0) > 0
    assert solid_harmonic(2, real_m_from_label(2, "dx2-y2"), 1.0, 0.0, 0.0) > 0
    assert solid_harmonic(3, real_m_from_label(3, "fxyz"), 1.0, 1.0, 1.0) > 0
    assert [name for name, _ in real_labels(2)] == ["dz2", "dxz", "dyz", "dx2-y2", "dxy"]
    assert len(real_labels(6)) == 13


def test_bad_quantum_numbers_are_rejected():
    with pytest.raises(QuantumNumberError):
        real_harmonic(2, 3, 0.0, 0.0)
    with pytest.raises(QuantumNumberError):
        real_m_from_label(1, "dxy")
