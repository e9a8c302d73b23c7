"""Term and level labels in the trade's notation: ``3P``, ``4S3/2``, ``3P°2``."""

from __future__ import annotations

from numbers import Integral, Real
from typing import Final, Literal

from zeffir.core._errors import QuantumNumberError

__all__ = ["L_SYMBOLS", "MULTIPLICITY_NAMES", "Parity", "half_integer_text", "quantum_number_text",
           "term_label"]

#: Parity of a configuration and of all its terms and levels.
Parity = Literal["even", "odd"]

#: Letters for L = 0..16. After S P D F G H I the sequence runs on alphabetically,
#: skipping J and the letters already used (P, S).
L_SYMBOLS: Final[str] = "SPDFGHIKLMNOQRTUV"

#: Names of the multiplicities 2S + 1 = 1..9 (Condon & Shortley, The Theory of Atomic
#: Spectra, 1935, ch. VII); beyond nine the trade writes the number.
MULTIPLICITY_NAMES: Final[tuple[str, ...]] = (
    "singlet", "doublet", "triplet", "quartet", "quintet", "sextet", "septet", "octet", "nonet")

#: Mark placed after the L letter of an odd term (the trade writes a superscript o).
ODD_MARK: Final[str] = "°"


def two_times(value: float, name: str) -> int:
    """Return ``2 * value`` as an integer, or raise if ``value`` is not a multiple of 1/2."""
    if isinstance(value, bool) or not isinstance(value, Real):
        raise QuantumNumberError(f"{name} = {value!r}: must be a number")
    doubled = 2 * float(value)
    if doubled != doubled or doubled in (float("inf"), float("-inf")) or doubled != int(doubled):
        raise QuantumNumberError(f"{name} = {value!r}: must be a whole or half-whole number")
    return int(doubled)


def half_integer_text(two_x: int) -> str:
    """Write x = two_x / 2 as the trade does: ``'2'``, ``'3/2'``.

    Examples
    --------
    >>> half_integer_text(4), half_integer_text(3)
    ('2', '3/2')
    """
    return str(two_x // 2) if two_x % 2 == 0 else f"{two_x}/2"


def quantum_number_text(value: float) -> str:
    """Write a whole or half-whole quantum number (S, J, M) as the trade does.

    Parameters
    ----------
    value : float
        A multiple of 1/2; it is rounded to the nearest one.

    Returns
    -------
    str
        ``'2'``, ``'3/2'``, ``'0'``.

    Examples
    --------
    Round-trips through :func:`half_integer_text` for every multiple of 1/2:

    >>> all(quantum_number_text(k / 2) == half_integer_text(k) for k in range(20))
    True
    >>> quantum_number_text(2.5), quantum_number_text(4.0)
    ('5/2', '4')
    """
    return half_integer_text(round(2 * value))


def l_symbol(L: int) -> str:
    """The spectroscopic letter of L, or ``[L=n]`` beyond the last letter (V, L = 16)."""
    return L_SYMBOLS[L] if L < len(L_SYMBOLS) else f"[L={L}]"


def term_label(
    S: float,
    L: int,
    J: float | None = None,
    parity: Parity = "even",
) -> str:
    """Label a term (or, with J, a level) in Russell–Saunders notation.

    Parameters
    ----------
    S : float
        Total spin, a non-negative multiple of 1/2.
    L : int
        Total orbital angular momentum, L >= 0.
    J : float, optional
        Total angular momentum of a level, |L - S| <= J <= L + S in whole steps.
    parity : {"even", "odd"}
        Odd terms get ``°`` after the L letter; even terms no mark.

    Returns
    -------
    str
        ``'{2S+1}{letter}'`` followed by ``°`` if odd and J if given, e.g. ``'3P'``,
        ``'4S3/2'``, ``'3H°4'``. Letters run S P D F G H I K L M N O Q R T U V for
        L = 0..16 (J is skipped); larger L is written ``[L=17]``.

    Raises
    ------
    QuantumNumberError
        If S, L or J is out of range or not a (half-)integer, or parity is unknown.

    Notes
    -----
    The superscript 2S + 1 is the multiplicity; the letter sequence and the odd
    mark follow Condon & Shortley's usage.

    References
    ----------
    E. U. Condon and G. H. Shortley, *The Theory of Atomic Spectra* (Cambridge
    University Press, 1935), the Russell–Saunders notation for terms.

    Examples
    --------
    >>> term_label(1, 1), term_label(1.5, 0, 1.5), term_label(1, 5, 4, parity="odd")
    ('3P', '4S3/2', '3H°4')
    >>> term_label(0.5, 7)  # K follows I
    '2K'
    """
    two_s = two_times(S, "S")
    if two_s < 0:
        raise QuantumNumberError(f"S = {S!r}: must not be negative")
    if isinstance(L, bool) or not isinstance(L, Integral) or L < 0:
        raise QuantumNumberError(f"L = {L!r}: must be a whole number >= 0")
    if parity not in ("even", "odd"):
        raise QuantumNumberError(f"parity = {parity!r}: must be 'even' or 'odd'")
    text = f"{two_s + 1}{l_symbol(int(L))}{ODD_MARK if parity == 'odd' else ''}"
    if J is None:
        return text
    two_j = two_times(J, "J")
    check_two_j(two_s, L, two_j)
    return text + half_integer_text(two_j)


def check_two_j(two_s: int, L: int, two_j: int) -> None:
    """Raise unless J = two_j / 2 is one of |L - S|, ..., L + S."""
    low, high = abs(2 * L - two_s), 2 * L + two_s
    if not (low <= two_j <= high and (two_j - low) % 2 == 0):
        raise QuantumNumberError(
            f"J = {half_integer_text(two_j)}: with S = {half_integer_text(two_s)} and L = {L}, "
            f"J must be one of {half_integer_text(low)} … {half_integer_text(high)} in steps of 1"
        )
