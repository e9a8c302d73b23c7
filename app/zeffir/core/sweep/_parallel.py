"""Many configurations under one model, spread over processes, served from the disk cache.

Each configuration is built in a worker process (``spawn`` start method, so a caller
holding threads, such as the window, is safe), the heaviest first so the last one to
finish is short. Results already in the :class:`~zeffir.core.sweep.DiskCache` are
returned without computing; new ones are stored. A configuration a model refuses is
a point with its reason, never an exception, so one bad atom does not cost the sweep.
"""

from __future__ import annotations

import multiprocessing
import os
import threading
import time
from collections.abc import Callable, Iterable, Iterator
from contextlib import contextmanager
from dataclasses import dataclass

from zeffir.core._cancel import report_progress as ambient_report
from zeffir.core._cancel import should_stop as ambient_should_stop
from zeffir.core._errors import ComputationCancelled, ZeffirError
from zeffir.core.config import Configuration, element, parse_spec
from zeffir.core.models import get_model
from zeffir.core.orbitals import OrbitalSet
from zeffir.core.sweep._disk_cache import CacheEntry, DiskCache

__all__ = ["SweepCancelled", "SweepPoint", "build_many", "neutral_atoms"]

#: How often (seconds) a running sweep looks at its cancellation check.
_POLL_SECONDS = 0.05


@dataclass(frozen=True)
class SweepPoint:
    """One configuration of a sweep: its orbitals, or why the model refused it.

    Attributes
    ----------
    spec : str
        The spec as given.
    model : str
        The model's name.
    orbitals : OrbitalSet or None
        The result; None when the model refused.
    refusal : str or None
        The model's reason, or the spec error, when there is no result.
    cached : bool
        Served from the disk cache.
    seconds : float
        Wall time of the computation (0 when cached).
    """

    spec: str
    model: str
    orbitals: OrbitalSet | None
    refusal: str | None
    cached: bool
    seconds: float

    @property
    def ok(self) -> bool:
        """True when the point has orbitals."""
        return self.orbitals is not None


class SweepCancelled(ComputationCancelled):
    """A sweep stopped on request; :attr:`points` holds what finished before."""

    def __init__(self, points: list[SweepPoint]) -> None:
        super().__init__(f"sweep cancelled after {len(points)} configurations")
        self.points = points


def neutral_atoms(first: int = 1, last: int = 118) -> list[str]:
    """Symbols of the neutral atoms Z = first … last, as specs.

    Examples
    --------
    >>> neutral_atoms(1, 10)[-1], len(neutral_atoms())
    ('Ne', 118)
    """
    return [element(z).symbol for z in range(first, last + 1)]


def _build_one(task: tuple[int, str, str]) -> tuple[int, OrbitalSet | None, str | None, float]:
    """Worker: build one configuration; a refusal becomes its reason (picklable)."""
    index, spec, model = task
    start = time.perf_counter()
    try:
        orbitals = get_model(model).build(parse_spec(spec))
    except ComputationCancelled:
        raise
    except ZeffirError as error:
        return index, None, str(error), time.perf_counter() - start
    return index, orbitals, None, time.perf_counter() - start


def _available_cores() -> int:
    try:
        return len(os.sched_getaffinity(0))
    except AttributeError:  # pragma: no cover - not Linux
        return os.cpu_count() or 1


#: Thread-count variables of the numerical libraries a worker loads (OpenBLAS, OpenMP,
#: MKL, numba).
_THREAD_VARIABLES = ("OPENBLAS_NUM_THREADS", "OMP_NUM_THREADS", "MKL_NUM_THREADS",
                     "NUMBA_NUM_THREADS")
_ENVIRONMENT_LOCK = threading.Lock()


@contextmanager
def _one_thread_per_worker() -> Iterator[None]:
    """Start worker processes with one BLAS thread each (the parent keeps its own).

    Each worker is one process per core already; with the BLAS library's default of one
    thread per core as well, two workers on two cores ran four threads that thrashed
    each other in the matrix products: the H–Og Hartree–Fock sweep took 90 s against
    35 s with one thread per worker (measured here). A spawned worker reads these
    variables when it loads the libraries, so they are set while the pool starts and
    restored after.
    """
    with _ENVIRONMENT_LOCK:
        saved = {name: os.environ.get(name) for name in _THREAD_VARIABLES}
        os.environ.update({name: "1" for name in _THREAD_VARIABLES})
        try:
            yield
        finally:
            for name, value in saved.items():
                if value is None:
                    os.environ.pop(name, None)
                else:
                    os.environ[name] = value


def build_many(
    specs: Iterable[str],
    model: str = "hartree-fock",
    *,
    processes: int | None = None,
    cache: DiskCache | bool = True,
    progress: Callable[[str], None] | None = None,
    should_stop: Callable[[], bool] | None = None,
) -> list[SweepPoint]:
    """Build every spec under ``model``, in parallel processes, using the disk cache.

    Parameters
    ----------
    specs : iterable of str
        Configurations in the spec syntax (``"Fe"``, ``"Cu+"``, ``"Cr [Ar] 3d5 4s1"``).
    model : str
        A registered model name.
    processes : int, optional
        Worker processes; the cores available to this process when omitted. With
        one process (or at most one configuration to compute) the work runs here.
    cache : DiskCache or bool
        The cache to read and fill; True for the default one, False for none.
    progress : callable, optional
        Receives one line per finished configuration (what, how far, the energy);
        the ambient :func:`~zeffir.core.progress_reporting` when omitted.
    should_stop : callable, optional
        Polled while waiting; True stops the workers at once and raises
        :class:`SweepCancelled` holding the points finished so far. The ambient
        :func:`~zeffir.core.cancellation` check when omitted.

    Returns
    -------
    list of SweepPoint
        One per spec, in the order given.

    Raises
    ------
    ModelError
        ``model`` is not a registered model.
    SweepCancelled
        The sweep was asked to stop.

    Notes
    -----
    The workers are started with the ``spawn`` method (no fork of a process that may
    hold Qt or numba threads), so each one imports the calling script anew: a script
    that calls this at its top level must do so under ``if __name__ == "__main__":``,
    as the :mod:`multiprocessing` documentation requires for ``spawn``.

    Examples
    --------
    Slater's-rules exponents of the first row, in this process, without the cache;
    ζ of the 2p orbital grows by 0.65 per unit of Z (common practice: the rules):

    >>> points = build_many(["B", "C", "N"], "slater", processes=1, cache=False)
    >>> [round(p.orbitals.orbital("2p").zeta, 3) for p in points]
    [1.3, 1.625, 1.95]
    """
    report = progress or ambient_report
    stop = should_stop or ambient_should_stop
    get_model(model)  # an unknown model is refused before any work starts
    store = DiskCache() if cache is True else (cache or None)
    specs = list(specs)
    points: list[SweepPoint | None] = [None] * len(specs)
    todo: list[tuple[int, str, str]] = []
    configurations: dict[int, Configuration] = {}
    for index, spec in enumerate(specs):
        try:
            configuration = parse_spec(spec)
        except ZeffirError as error:
            points[index] = SweepPoint(spec, model, None, str(error), False, 0.0)
            continue
        configurations[index] = configuration
        entry = store.get(configuration, model) if store is not None else None
        if entry is not None:
            points[index] = SweepPoint(spec, model, entry.orbitals, entry.refusal, True, 0.0)
        else:
            todo.append((index, spec, model))
    # Heaviest first: the electrons are a fair proxy for the cost.
    todo.sort(key=lambda task: -configurations[task[0]].n_electrons)
    done = len(specs) - len(todo)

    def finished(index: int, orbitals: OrbitalSet | None, refusal: str | None, seconds: float) -> None:
        nonlocal done
        done += 1
        spec = specs[index]
        points[index] = SweepPoint(spec, model, orbitals, refusal, False, seconds)
        if store is not None:
            store.put(configurations[index], model, CacheEntry(orbitals, refusal))
        energy = None if orbitals is None else orbitals.total_energy
        outcome = (f"refused ({refusal})" if refusal is not None
                   else f"E = {energy:.6f} Eh" if energy is not None else "done")
        report(f"{model}: {done}/{len(specs)} {spec} {outcome} ({seconds:.1f} s)")

    workers = min(processes or _available_cores(), len(todo))
    if workers <= 1:
        for task in todo:
            if stop():
                raise SweepCancelled([p for p in points if p is not None])
            finished(*_build_one(task))
        return [p for p in points if p is not None]

    context = multiprocessing.get_context("spawn")
    with _one_thread_per_worker():
        pool = context.Pool(workers)
    try:
        results = pool.imap_unordered(_build_one, todo, chunksize=1)
        for _ in range(len(todo)):
            while True:
                if stop():
                    pool.terminate()
                    raise SweepCancelled([p for p in points if p is not None])
                try:
                    outcome = results.next(timeout=_POLL_SECONDS)
                except multiprocessing.TimeoutError:
                    continue
                break
            finished(*outcome)
        pool.close()
    finally:
        pool.terminate()
        pool.join()
    return [p for p in points if p is not None]
