"""The numba kernels of ``_kernels.py``, imported only when first needed.

They live at module level, not inside a factory function, so that numba's on-disk
cache recognises them in the next process (functions that call other compiled
functions through a closure are compiled again in every process).
"""

# mypy: disable-error-code="misc, no-untyped-def"

import numba as nb
import numpy as np

__all__ = ["add_term", "modulus_squared"]


@nb.njit(fastmath=True, cache=True)
def add_term(acc, row, d, coords, rad, half, angle):
    # acc += P(u) g(|u|) along one grid row, P of degree d by Horner's rule with the
    # last step fused into the accumulation; g is the quadrant row, read forwards for
    # i >= half and backwards for i < half.
    size = acc.size
    if d == 0:
        c0 = row[0]
        for i in range(half, size):
            acc[i] += c0 * rad[i - half]
        for i in range(half):
            acc[i] += c0 * rad[size - 1 - i - half]
        return
    if d == 1:
        c1 = row[1]
        c0 = row[0]
        for i in range(half, size):
            acc[i] += (c1 * coords[i] + c0) * rad[i - half]
        for i in range(half):
            acc[i] += (c1 * coords[i] + c0) * rad[size - 1 - i - half]
        return
    top = row[d]
    c = row[d - 1]
    for i in range(size):
        angle[i] = top * coords[i] + c
    for a in range(d - 2, 0, -1):
        c = row[a]
        for i in range(size):
            angle[i] = angle[i] * coords[i] + c
    c0 = row[0]
    for i in range(half, size):
        acc[i] += (angle[i] * coords[i] + c0) * rad[i - half]
    for i in range(half):
        acc[i] += (angle[i] * coords[i] + c0) * rad[size - 1 - i - half]

@nb.njit(parallel=True, fastmath=True, cache=True)
def modulus_squared(coords, radial, c_re, c_im, degrees, complex_terms, alpha, density, beta, chunks, out):
    # Chunks of rows run in parallel, each with its own scratch rows (more chunks than
    # threads, so that a thread held up elsewhere does not hold up the rest).
    # p_t,a(v) = Σ_b C_t[a, b] v^b are row j's coefficients of u^a.
    size = coords.size
    half = size // 2
    terms = c_re.shape[0]
    order = c_re.shape[1]
    with_density = beta != 0.0
    for chunk in nb.prange(chunks):
        acc_re = np.empty(size)
        acc_im = np.empty(size)
        angle = np.empty(size)
        row_re = np.empty(order)
        row_im = np.empty(order)
        for j in range(chunk * size // chunks, (chunk + 1) * size // chunks):
            v = coords[j]
            qj = j - half if j >= half else size - 1 - j - half
            acc_re[:] = 0.0
            if complex_terms:
                acc_im[:] = 0.0
            for t in range(terms):
                d = degrees[t]
                for a in range(d + 1):
                    total_re = 0.0
                    total_im = 0.0
                    power = 1.0
                    for b in range(d + 1):
                        total_re += c_re[t, a, b] * power
                        total_im += c_im[t, a, b] * power
                        power *= v
                    row_re[a] = total_re
                    row_im[a] = total_im
                add_term(acc_re, row_re, d, coords, radial[t, qj], half, angle)
                if complex_terms:
                    add_term(acc_im, row_im, d, coords, radial[t, qj], half, angle)
            line = out[j]
            if complex_terms:
                for i in range(size):
                    line[i] = alpha * (acc_re[i] * acc_re[i] + acc_im[i] * acc_im[i])
            else:
                for i in range(size):
                    line[i] = alpha * (acc_re[i] * acc_re[i])
            if with_density:
                density_row = density[qj]
                for i in range(half, size):
                    line[i] += beta * density_row[i - half]
                for i in range(half):
                    line[i] += beta * density_row[size - 1 - i - half]
