"""The Adams–Moulton loops of ``_two_component_kernels`` compiled by numba (cached on disk)."""

from __future__ import annotations

from numba import njit

from zeffir.core.dft import _two_component_kernels as _plain

integrate_out = njit(cache=True)(_plain.integrate_out)
integrate_in = njit(cache=True)(_plain.integrate_in)
