"""The Examples in the docstrings of ``zeffir.core`` and ``zeffir.state`` run as tests.

Each Example checks an identity or a published value; a docstring that drifts from
the code fails here.
"""

from __future__ import annotations

import doctest
import importlib
import pkgutil

import pytest

import zeffir.core
import zeffir.state


def _modules() -> list[str]:
    names = []
    for package in (zeffir.core, zeffir.state):
        names.append(package.__name__)
        for info in pkgutil.walk_packages(package.__path__, prefix=f"{package.__name__}."):
            names.append(info.name)
    return sorted(set(names))


@pytest.mark.parametrize("name", _modules())
def test_docstring_examples(name):
    module = importlib.import_module(name)
    finder = doctest.DocTestFinder(exclude_empty=True)
    runner = doctest.DocTestRunner(optionflags=doctest.ELLIPSIS | doctest.NORMALIZE_WHITESPACE)
    for test in finder.find(module, name):
        if test.examples and (test.filename or "").endswith(".py"):
            runner.run(test, out=lambda text: print(text, end=""))
    result = runner.summarize(verbose=False)
    assert result.failed == 0, f"{result.failed} of {result.attempted} examples failed in {name}"


def test_the_examples_are_found():
    # A guard against a finder that silently finds nothing: the core has many examples.
    total = 0
    for name in _modules():
        module = importlib.import_module(name)
        total += sum(len(t.examples) for t in doctest.DocTestFinder().find(module, name))
    assert total >= 20
