"""Cooperative cancellation: long model builds stop when their caller asks."""

import pytest

from zeffir.core import ModelError, build
from zeffir.core._cancel import cancellation, should_stop


def test_nothing_is_cancelled_without_a_check():
    assert not should_stop()


def test_variational_build_stops_when_asked():
    with cancellation(lambda: True), pytest.raises(ModelError, match="cancelled"):
        build("C", "variational")
    assert not should_stop()  # the check is gone after the block


def test_hartree_fock_stops_when_asked():
    with cancellation(lambda: True), pytest.raises(ModelError, match="cancelled"):
        build("Ar", "hartree-fock")


def test_long_builds_report_progress_to_whoever_listens():
    from zeffir.core._cancel import progress_reporting

    messages: list[str] = []
    with progress_reporting(messages.append):
        build("C", "variational")
    assert messages and "optimising exponents" in messages[-1]
