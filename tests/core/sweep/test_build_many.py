"""Parallel builds of many configurations and their disk cache."""

from __future__ import annotations

import os
import pickle
import time

import pytest

from zeffir import __version__
from zeffir.core import ModelError, build, parse_spec
from zeffir.core.sweep import CacheEntry, DiskCache, SweepCancelled, build_many, neutral_atoms


@pytest.fixture
def cache(tmp_path) -> DiskCache:
    return DiskCache(tmp_path / "cache")


def test_parallel_results_equal_single_builds(cache):
    specs = ["Ne", "Na+", "Ar", "Fe"]
    lines: list[str] = []
    points = build_many(specs, "hartree-fock", processes=2, cache=cache, progress=lines.append)
    assert [p.spec for p in points] == specs  # the order given, whatever the finishing order
    for point in points:
        assert point.ok and not point.cached and point.seconds > 0
        # Workers run one BLAS thread (see _one_thread_per_worker); a BLAS library that
        # splits a reduction over several threads sums in another order, which can move
        # the last bit, so equal to rounding rather than bit for bit.
        assert point.orbitals.total_energy == pytest.approx(
            build(point.spec, "hartree-fock").total_energy, rel=1e-13, abs=0.0)
    assert len(lines) == 4 and all(line.startswith("hartree-fock: ") for line in lines)
    assert lines[-1].split()[1] == "4/4"


def test_second_call_is_served_from_the_cache(cache):
    first = build_many(["C", "O"], "variational", processes=1, cache=cache)
    second = build_many(["C", "O"], "variational", processes=2, cache=cache)
    assert all(p.cached and p.seconds == 0 for p in second)
    assert [p.orbitals.total_energy for p in second] == [p.orbitals.total_energy for p in first]
    # The same configuration written another way is the same entry.
    assert build_many(["C [He] 2s2 2p2"], "variational", cache=cache)[0].cached


def test_entries_are_per_model_and_per_version(cache, tmp_path):
    build_many(["N"], "slater", processes=1, cache=cache)
    assert not build_many(["N"], "clementi", processes=1, cache=cache)[0].cached
    assert cache.directory.name == f"v{__version__}"
    assert len(list(cache.directory.glob("*.pickle"))) == 2


def test_refusals_and_bad_specs_are_points_not_exceptions(cache):
    points = build_many(["Be-", "Qq", "Li"], "hartree-fock", processes=1, cache=cache)
    assert [p.ok for p in points] == [False, False, True]
    assert "Be-" in points[0].refusal
    assert "Qq" in points[1].refusal and "unknown element" in points[1].refusal
    again = build_many(["Be-"], "hartree-fock", processes=1, cache=cache)[0]
    assert again.cached and again.refusal == points[0].refusal  # a refusal is deterministic too


def test_unknown_model_is_refused_before_any_work(cache):
    with pytest.raises(ModelError, match="unknown model"):
        build_many(["H"], "no-such-model", cache=cache)


def test_damaged_or_foreign_entries_are_recomputed(cache):
    build_many(["Ne"], "slater", processes=1, cache=cache)
    (entry,) = cache.directory.glob("*.pickle")
    entry.write_bytes(b"not a pickle")
    point = build_many(["Ne"], "slater", processes=1, cache=cache)[0]
    assert point.ok and not point.cached
    # A valid pickle under the wrong name (copied from another entry) is not trusted.
    other = cache.directory / ("0" * 64 + ".pickle")
    other.write_bytes(entry.read_bytes())
    assert cache.get(parse_spec("Ne"), "slater") is not None
    stored = pickle.loads(entry.read_bytes())
    entry.write_bytes(pickle.dumps({"key": "f" * 64, "entry": stored["entry"]}))
    assert cache.get(parse_spec("Ne"), "slater") is None


def test_an_unwritable_cache_still_returns_results(tmp_path):
    blocked = tmp_path / "file-not-dir"
    blocked.write_text("x")
    points = build_many(["He", "Li"], "slater", processes=1, cache=DiskCache(blocked))
    assert all(p.ok and not p.cached for p in points)


@pytest.mark.skipif(os.geteuid() == 0, reason="root ignores directory permissions")
def test_a_read_only_cache_directory_is_skipped(cache):
    cache.directory.mkdir(parents=True)
    cache.directory.chmod(0o500)
    try:
        assert build_many(["He"], "slater", processes=1, cache=cache)[0].ok
        assert not list(cache.directory.iterdir())
    finally:
        cache.directory.chmod(0o700)


def test_cancel_stops_the_workers_and_keeps_what_finished(cache):
    asked = {"stop": False}

    def progress(line: str) -> None:
        asked["stop"] = True  # stop as soon as the first result arrives

    start = time.perf_counter()
    with pytest.raises(SweepCancelled) as caught:
        build_many(neutral_atoms(30, 60), "hartree-fock", processes=2, cache=cache,
                   progress=progress, should_stop=lambda: asked["stop"])
    assert 1 <= len(caught.value.points) < 31
    assert all(p.ok or p.refusal for p in caught.value.points)
    assert time.perf_counter() - start < 60  # the remaining atoms were not computed


def test_cache_round_trip_of_an_entry(cache):
    neon = parse_spec("Ne")
    cache.put(neon, "hartree-fock", CacheEntry(None, "a reason"))
    assert cache.get(neon, "hartree-fock") == CacheEntry(None, "a reason")
    assert cache.clear() == 1 and cache.get(neon, "hartree-fock") is None


def test_default_directory_follows_the_environment(monkeypatch, tmp_path):
    from zeffir.core.sweep import default_cache_directory

    monkeypatch.setenv("ZEFFIR_CACHE_DIR", str(tmp_path / "here"))
    assert default_cache_directory() == tmp_path / "here"
    monkeypatch.delenv("ZEFFIR_CACHE_DIR")
    monkeypatch.setenv("XDG_CACHE_HOME", str(tmp_path / "xdg"))
    assert default_cache_directory() == tmp_path / "xdg" / "zeffir"
    monkeypatch.setenv("XDG_CACHE_HOME", "relative/not/allowed")
    assert default_cache_directory().parts[-2:] == (".cache", "zeffir")


def test_workers_start_with_one_blas_thread_and_the_parent_keeps_its_own(monkeypatch):
    # Two workers on two cores, each with a BLAS thread per core, thrash each other;
    # the pool starts with one thread per worker and the caller's settings come back.
    import os

    from zeffir.core.sweep._parallel import _THREAD_VARIABLES, _one_thread_per_worker

    monkeypatch.setenv("OPENBLAS_NUM_THREADS", "7")
    monkeypatch.delenv("OMP_NUM_THREADS", raising=False)
    with _one_thread_per_worker():
        assert all(os.environ[name] == "1" for name in _THREAD_VARIABLES)
    assert os.environ["OPENBLAS_NUM_THREADS"] == "7"
    assert "OMP_NUM_THREADS" not in os.environ
