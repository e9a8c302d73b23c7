"""Hostile session files: every one is refused with a SessionError naming the problem, or loads valid.

The targeted tests feed one kind of bad input each and check the message names the
field (``slice.resolution: …``) or the file-level problem. The property tests mix
random JSON, huge numbers, NaN and infinities, long text and deep nesting into a valid
session and check that nothing but a valid state or a SessionError ever comes out.
"""

from __future__ import annotations

import json
import math
from typing import Any

import pytest
from hypothesis import HealthCheck, event, given, settings
from hypothesis import strategies as st

import zeffir.export._session as session_module
from zeffir.export import MAX_NESTING, MAX_SESSION_BYTES, SessionError, load_session, save_session
from zeffir.state import (
    ColourSettings,
    CompareSettings,
    OrbitalChoice,
    PairSettings,
    SliceSettings,
    Source,
    ViewState,
)

# A valid state that uses every part, so that a mutation can reach every field.
STATE = ViewState(
    left=Source("Fe3+", "clementi"),
    orbital=OrbitalChoice("3d", "complex", -2),
    view="slice",
    slice=SliceSettings(plane="custom", normal=(1.0, -1.0, 0.5), offset=0.25, extent=5.0,
                        resolution=96, colour=ColourSettings(limits="manual", low=0.0, high=2.0)),
    compare=CompareSettings(True, Source("Fe2+", "slater"), same_atom=False,
                            more=(Source("", "hydrogenic"), Source("Fe", "slater"))),
    pair=PairSettings(reference=(0.0, 0.5, 1.0), determinant=""),
).validated()


class Raw:
    """JSON text put into a document verbatim (what ``json.dumps`` cannot or will not write)."""

    def __init__(self, text: str) -> None:
        self.text = text


def _dumps(document: Any) -> str:
    """``json.dumps`` with :class:`Raw` pieces spliced in, and NaN/Infinity tokens allowed."""
    pieces: list[str] = []

    def encode(value: Any) -> Any:
        if isinstance(value, Raw):
            pieces.append(value.text)
            return f"@@raw{len(pieces) - 1}@@"
        if isinstance(value, dict):
            return {key: encode(v) for key, v in value.items()}
        if isinstance(value, list):
            return [encode(v) for v in value]
        return value

    text = json.dumps(encode(document), allow_nan=True)
    for index, piece in enumerate(pieces):
        text = text.replace(f'"@@raw{index}@@"', piece, 1)
    return text


_VALID_STATE = object()


def _document(state: Any = _VALID_STATE) -> dict[str, Any]:
    return {"kind": "zeffir-session", "version": 1, "saved_by": "zeffir 0.1.0",
            "state": STATE.to_dict() if state is _VALID_STATE else state}


def _write(tmp_path, content: str | bytes | dict[str, Any], name: str = "s.zeffir"):
    path = tmp_path / name
    if isinstance(content, dict):
        content = _dumps(content)
    if isinstance(content, str):
        content = content.encode("utf-8")
    path.write_bytes(content)
    return path


def _with(path: tuple[str | int, ...], value: Any) -> dict[str, Any]:
    """A valid session document whose state has ``value`` at ``path``."""
    document = _document()
    node: Any = document["state"]
    for key in path[:-1]:
        node = node[key]
    node[path[-1]] = value
    return document


def _refused(tmp_path, content) -> str:
    path = _write(tmp_path, content)
    with pytest.raises(SessionError) as caught:
        load_session(path)
    message = str(caught.value)
    assert message.startswith(f"{path}: ")
    assert len(message) < len(str(path)) + 400, "a message never repeats a huge value"
    return message[len(str(path)) + 2:]


# -- numbers -----------------------------------------------------------------------------

HUGE = "9" * 5000  # past Python's 4300-digit limit on int(str)


@pytest.mark.parametrize(
    ("path", "literal", "message"),
    [
        (("slice", "resolution"), HUGE, "slice.resolution: must be between 16 and 1024"),
        (("slice", "resolution"), "-" + HUGE, "slice.resolution: must be between 16 and 1024"),
        (("slice", "contours"), "9" * 400, "slice.contours: between 0 and 40"),
        (("two_electron", "resolution"), "1" + "0" * 99, "two_electron.resolution: must be between"),
        (("orbital", "m"), HUGE, "orbital.m: must be between -2 and 2 for 3d"),
        (("slice", "extent"), HUGE, "slice.extent: must be a positive number of bohr"),
        (("slice", "extent"), "1e17", "slice.extent: must be a positive number of bohr"),
        (("slice", "extent"), str(10**17), "slice.extent: must be a positive number of bohr"),
        (("slice", "extent"), "1e400", "slice.extent: expected a finite number, got 1e400 (too large"),
        (("radial", "r_limit"), "-1E+999", "radial.r_limit: expected a finite number, got -1E+999 ("),
        (("slice", "offset"), "-1e17", "slice.offset: must be a number of bohr between"),
        (("radial", "r_limit"), "1e17", "radial.r_limit: must be a positive number of bohr"),
        (("radial", "r_limit"), "0", "radial.r_limit: must be a positive number of bohr"),
        (("two_electron", "r_limit"), "-3", "two_electron.r_limit: must be a positive number"),
        (("slice", "colour", "high"), "1e31", "slice.colour.high: must be a positive finite number"),
        (("pair", "colour", "low"), "-" + HUGE, "pair.colour.low: must be a finite number"),
        (("slice", "colour", "log_decades"), "1e300", "slice.colour.log_decades: between 1 and 16"),
        (("slice", "normal"), f"[{HUGE}, 0, 0]", "slice.normal: three numbers, not all zero"),
        (("slice", "normal"), "[1e-300, 0, 0]", "slice.normal: three numbers, not all zero"),
        (("slice", "normal"), "[1, 0]", "slice.normal: expected a list of 3 numbers"),
        (("pair", "reference"), "[0, 0, 1e17]", "pair.reference: three coordinates in bohr"),
    ],
)
def test_numbers_out_of_range_are_refused_naming_the_field(tmp_path, path, literal, message):
    assert _refused(tmp_path, _with(path, Raw(literal))).startswith(f"invalid session: {message}")


@pytest.mark.parametrize("token", ["NaN", "Infinity", "-Infinity"])
@pytest.mark.parametrize(
    "path",
    [("slice", "extent"), ("slice", "offset"), ("radial", "r_limit"), ("two_electron", "r_limit"),
     ("slice", "colour", "low"), ("slice", "colour", "high"), ("two_electron", "colour", "log_decades"),
     ("pair", "colour", "high")],
)
def test_nan_and_infinity_tokens_are_refused_naming_the_field(tmp_path, token, path):
    field = ".".join(path)
    assert _refused(tmp_path, _with(path, Raw(token))).startswith(
        f"invalid session: {field}: expected a finite number")


@pytest.mark.parametrize("token", ["NaN", "Infinity", "-Infinity"])
@pytest.mark.parametrize(("path", "field"), [(("slice", "normal"), "slice.normal"),
                                              (("pair", "reference"), "pair.reference")])
def test_nan_and_infinity_in_coordinates_are_refused(tmp_path, token, path, field):
    message = _refused(tmp_path, _with(path, Raw(f"[0, {token}, 1]")))
    assert message.startswith(f"invalid session: {field}: expected 3 finite numbers")


@pytest.mark.parametrize("token", ["NaN", "Infinity", HUGE])
def test_nan_infinity_or_huge_numbers_in_integer_fields_are_refused(tmp_path, token):
    message = _refused(tmp_path, _with(("slice", "resolution"), Raw(token)))
    assert message.startswith("invalid session: slice.resolution: ")


# -- types --------------------------------------------------------------------------------

@pytest.mark.parametrize(
    ("path", "value", "message"),
    [
        (("slice", "resolution"), "256", "slice.resolution: expected a whole number"),
        (("slice", "resolution"), True, "slice.resolution: expected a whole number"),
        (("slice", "resolution"), 256.0, "slice.resolution: expected a whole number"),
        (("orbital", "m"), False, "orbital.m: expected a whole number"),
        (("slice", "extent"), "8", "slice.extent: expected a number"),
        (("slice", "extent"), True, "slice.extent: expected a number"),
        (("slice", "extent"), None, "slice.extent: expected a number"),
        (("radial", "r_limit"), [3], "radial.r_limit: expected a number or null"),
        (("radial", "log_r"), "yes", "radial.log_r: expected true or false"),
        (("radial", "weighted"), 1, "radial.weighted: expected true or false"),
        (("slice",), [], "slice: expected an object"),
        (("slice", "colour"), [1, 2], "slice.colour: expected an object"),
        (("compare", "right"), "Na", "compare.right: expected an object"),
        (("slice", "normal"), {"x": 1}, "slice.normal: expected a list of 3 numbers"),
        (("slice", "normal"), [0, "1", 0], "slice.normal: expected a list of 3 numbers"),
        (("slice", "normal"), [0, True, 0], "slice.normal: expected a list of 3 numbers"),
        (("left", "spec"), 5, "left.spec: expected text"),
        (("view",), ["radial"], "view: expected text"),
        (("compare", "more"), {"spec": "Na"}, "compare.more: expected a list of objects"),
        (("compare", "more"), [1, 2], "compare.more: expected a list of objects"),
        (("compare", "more"), [{"spec": "Na", "model": 3}], "compare.more[0].model: expected text"),
    ],
)
def test_wrong_types_are_refused_naming_the_field(tmp_path, path, value, message):
    assert _refused(tmp_path, _with(path, value)).startswith(f"invalid session: {message}")


def test_a_state_that_is_not_an_object_is_refused(tmp_path):
    for state in ([], "state", 3, None):
        assert _refused(tmp_path, _document(state)) == "invalid session: state: expected an object"


# -- names and text -------------------------------------------------------------------------

@pytest.mark.parametrize(
    ("path", "value", "message"),
    [
        (("left", "model"), "nope", "model: nope: unknown model"),
        (("compare", "right", "model"), "nope", "compare.right.model: nope: unknown model"),
        (("compare", "more", 1, "model"), "ab" * 500_000, "compare.more[1].model: 'abab"),
        (("view",), "cube", "view: 'cube' is not one of"),
        (("view",), "v" * 1_000_000, "view: 'vvvv"),
        (("left", "spec"), "Na" * 500_000, "spec: at most 256 characters, got 1000000"),
        (("compare", "right", "spec"), "C" * 300, "compare.right.spec: at most 256 characters"),
        (("compare", "more", 0, "spec"), " " * 300, "compare.more[0].spec: at most 256 characters"),
        (("pair", "determinant"), "x" * 1_000_000, "pair.determinant: at most 256 characters"),
        (("orbital", "subshell"), "3" * 1000, "orbital.subshell: at most 8 characters"),
        (("left", "spec"), "Na\u0000", "spec: contains control characters"),
        (("pair", "determinant"), "\ud800", "pair.determinant: contains control characters or "
                                            "unpaired surrogates"),
        (("slice", "colour", "sequential_map"), "jet", "slice.colour.sequential_map: 'jet' is not one"),
    ],
)
def test_unknown_names_and_over_long_text_are_refused(tmp_path, path, value, message):
    assert _refused(tmp_path, _with(path, value)).startswith(f"invalid session: {message}")


def test_a_comparison_that_is_off_still_has_its_model_checked(tmp_path):
    document = _with(("compare", "enabled"), False)
    document["state"]["compare"]["right"]["model"] = "nope"
    assert _refused(tmp_path, document).startswith("invalid session: compare.right.model: nope")


def test_more_than_four_further_series_are_refused(tmp_path):
    more = [{"spec": "", "model": "slater"}] * 5
    message = _refused(tmp_path, _with(("compare", "more"), more))
    assert message == "invalid session: compare.more: at most 4 further series (6 in all)"
    message = _refused(tmp_path, _with(("compare", "more"), [{}] * 200_000))
    assert message == "invalid session: compare.more: at most 4 further series (6 in all)"


@pytest.mark.parametrize(("subshell", "m", "message"), [
    ("3d", 3, "orbital.m: must be between -2 and 2 for 3d"),
    ("3d", -3, "orbital.m: must be between -2 and 2 for 3d"),
    ("3s", 1, "orbital.m: must be between 0 and 0 for 3s"),
    ("", 7, "orbital.m: must be between -6 and 6"),
])
def test_m_outside_plus_minus_l_is_refused(tmp_path, subshell, m, message):
    document = _with(("orbital", "subshell"), subshell)
    document["state"]["orbital"]["m"] = m
    assert _refused(tmp_path, document) == f"invalid session: {message}"


# -- the file itself -------------------------------------------------------------------------

def test_a_file_over_the_size_limit_is_refused_before_it_is_parsed(tmp_path, monkeypatch):
    def never(*_args, **_kwargs):
        raise AssertionError("a file over the limit must not be parsed")

    text = _dumps(_document())
    big = text[:-1] + " " * (MAX_SESSION_BYTES - len(text) + 1) + "}"
    assert len(big) == MAX_SESSION_BYTES + 1 == 2 * 1024 * 1024 + 1
    monkeypatch.setattr(session_module.json, "loads", never)
    assert _refused(tmp_path, big) == "not a Zeffir session (larger than 2 MiB)"


def test_a_file_at_the_size_limit_still_loads(tmp_path):
    text = _dumps(_document())
    path = _write(tmp_path, text[:-1] + " " * (MAX_SESSION_BYTES - len(text)) + "}")
    assert path.stat().st_size == MAX_SESSION_BYTES
    assert load_session(path) == STATE


BOM = "not a Zeffir session (it starts with a UTF-16 byte-order mark"


@pytest.mark.parametrize(
    ("content", "message"),
    [
        (b"", "not a Zeffir session (the file is empty)"),
        (b" \n\t\n", "not a Zeffir session (the file is empty)"),
        (b'{"kind": "zeffir-session", "version": 1, "state": {"left": {"spec": "N\xe9"}}}',
         "not a Zeffir session (not UTF-8 text: byte 70 is invalid)"),
        (_dumps(_document()).encode("utf-16"), BOM),
        (b"[1, 2, 3]", "not a Zeffir session (expected a JSON object, found an array)"),
        (b'"zeffir-session"', "not a Zeffir session (expected a JSON object, found a string)"),
        (b"1e999", "not a Zeffir session (expected a JSON object, found a number)"),
        (b"null", "not a Zeffir session (expected a JSON object, found null)"),
        (b'{"kind": "zeffir-session", "version": 1, "state": {}, "kind": "other"}',
         "not a Zeffir session: the key 'kind' appears twice in one object"),
        (b'{"kind": "zeffir-session", "version": 1, "state": {"slice": {"resolution": 64, '
         b'"resolution": 5000}}}', "not a Zeffir session: the key 'resolution' appears twice"),
        (b"[" * 100_000 + b"]" * 100_000, "not a Zeffir session: JSON nested too deeply"),
        (b'{"kind": "zeffir-session", "version": 1, "state": {}, "x": '
         + b"[" * (MAX_NESTING + 1) + b"]" * (MAX_NESTING + 1) + b"}",
         f"not a Zeffir session: JSON nested deeper than {MAX_NESTING} levels"),
        (b'{"kind": "zeffir-session", "version": ' + HUGE.encode() + b', "state": {}}',
         "not a Zeffir session (version a very large number is not a whole number from 1)"),
        (b'{"kind": "' + b"k" * 1_000_000 + b'", "version": 1}', "not a Zeffir session (its kind "
                                                                  "is 'kkkk"),
        (b'{"kind": "zeffir-session", "version": NaN, "state": {}}',
         "not a Zeffir session (version nan is not a whole number from 1)"),
    ],
)
def test_file_level_problems_are_named(tmp_path, content, message):
    assert _refused(tmp_path, content).startswith(message)


def test_a_nested_document_inside_an_ignored_key_within_the_limit_loads(tmp_path):
    deep = Raw("[" * (MAX_NESTING - 3) + "]" * (MAX_NESTING - 3))
    document = _document()
    document["state"]["future_option"] = deep
    assert load_session(_write(tmp_path, document)) == STATE


# -- property tests --------------------------------------------------------------------------

def _paths(node: Any, prefix: tuple[str | int, ...] = ()) -> list[tuple[str | int, ...]]:
    """Every path into a JSON tree, inner nodes included."""
    found = [prefix]
    if isinstance(node, dict):
        for key, value in node.items():
            found += _paths(value, (*prefix, key))
    elif isinstance(node, list):
        for index, value in enumerate(node):
            found += _paths(value, (*prefix, index))
    return found


VALID = _document()
PATHS = _paths(VALID)[1:]  # not the document itself (a top-level non-object is a case above)

_names = st.sampled_from(["Na", "Fe3+", "C 1s2 2s2 2p3", "xz", "custom", "psi", "density", "3d",
                          "2p", "slater", "clementi", "hydrogenic", "radial", "manual", "extremes",
                          "viridis", "RdBu", "up", "down", "collinear", "angstrom", "", " ",
                          "zeffir-session", "He+ 2p1", "Xx", "C 2p7"])
_numbers = (st.integers() | st.integers(min_value=-(10**20), max_value=10**20)
            | st.floats(allow_nan=True, allow_infinity=True)
            | st.sampled_from([0, 1, -1, 3, 16, 1024, 1025, 10**17, 1e17, 1e-320, -0.0, 1e4, 1e-3]))
_huge = (st.integers(min_value=300, max_value=6000).map(lambda n: Raw("9" * n))
         | st.sampled_from([Raw("NaN"), Raw("Infinity"), Raw("-Infinity"), Raw("1e400"),
                            Raw("-" + HUGE)]))
_text = (st.text(max_size=30)
         | st.text(alphabet=st.characters(min_codepoint=0, max_codepoint=0xDFFF), max_size=5)
         | st.integers(min_value=257, max_value=1_000_000).map(lambda n: "N" * n))
_deep = st.integers(min_value=MAX_NESTING - 4, max_value=100_000).map(
    lambda n: Raw("[" * n + "]" * n))
_leaves = st.none() | st.booleans() | _numbers | _names | _text | _huge
_trees = st.recursive(
    _leaves,
    lambda inner: st.lists(inner, max_size=6) | st.dictionaries(
        st.sampled_from(["spec", "model", "subshell", "kind", "m", "plane", "normal", "resolution",
                         "extent", "enabled", "quantity", "r_limit", "colour", "high", "low",
                         "more", "right", "same_atom"]) | st.text(max_size=4), inner, max_size=5),
    max_leaves=10,
)
_nearby = (st.integers(min_value=-50, max_value=1100) | st.floats(min_value=-2e4, max_value=2e4)
           | st.booleans() | _names)
DELETE = object()  # a mutation that removes the key (missing keys take their defaults)
# Mostly single values (plausible or hostile), then random trees, rarely deep nesting.
_hostile = st.integers(min_value=0, max_value=19).flatmap(
    lambda k: _deep if k == 0 else _trees if k < 5 else _leaves if k < 12 else _nearby
    if k < 18 else st.just(DELETE))


def _mutated(document: Any, changes: list[tuple[tuple[str | int, ...], Any]]) -> Any:
    document = json.loads(json.dumps(document))
    for path, value in changes:
        node = document
        for key in path[:-1]:
            if not isinstance(node, dict | list):
                break
            try:
                node = node[key]
            except (KeyError, IndexError, TypeError):
                break
        else:
            if value is DELETE:
                if isinstance(node, dict):
                    node.pop(path[-1], None)
            elif isinstance(node, dict) or (isinstance(node, list) and isinstance(path[-1], int)
                                            and path[-1] < len(node)):
                node[path[-1]] = value
    return document


def _check_outcome(tmp_path_factory, content: str | bytes) -> None:
    folder = tmp_path_factory.mktemp("hostile")
    path = _write(folder, content)
    try:
        state = load_session(path)
    except SessionError as error:
        assert str(error).startswith(f"{path}: ")
        assert len(str(error)) < len(str(path)) + 400
        event("refused: " + str(error)[len(str(path)) + 2:][:40])
        return
    event("loaded")
    assert isinstance(state, ViewState)
    assert state.validated() == state
    # What loaded can be saved and loads back unchanged (no lone surrogate, no NaN).
    again = save_session(folder / "again.zeffir", state)
    assert load_session(again) == state
    assert all(math.isfinite(v) for v in state.slice.normal + state.pair.reference)


@settings(max_examples=400, deadline=2000, suppress_health_check=[HealthCheck.too_slow])
@given(changes=st.lists(st.tuples(st.sampled_from(PATHS), _hostile), min_size=1, max_size=3))
def test_hostile_values_anywhere_in_a_session_load_valid_or_raise_session_error(
        tmp_path_factory, changes):
    _check_outcome(tmp_path_factory, _dumps(_mutated(VALID, changes)))


@settings(max_examples=100, deadline=2000)
@given(state=_trees | _deep | _leaves)
def test_a_hostile_state_loads_valid_or_raises_session_error(tmp_path_factory, state):
    _check_outcome(tmp_path_factory, _dumps(_document(state)))


@settings(max_examples=100, deadline=2000)
@given(cut=st.integers(min_value=0, max_value=len(_dumps(VALID))), noise=st.binary(max_size=8),
       at_start=st.booleans())
def test_a_cut_or_noisy_file_loads_valid_or_raises_session_error(tmp_path_factory, cut, noise,
                                                                 at_start):
    text = _dumps(VALID).encode("utf-8")
    content = noise + text[:cut] if at_start else text[:cut] + noise + text[cut:]
    _check_outcome(tmp_path_factory, content)


def test_a_utf8_byte_order_mark_is_harmless(tmp_path):
    # Some editors write one; the session reads as without it.
    with_mark = _write(tmp_path, b"\xef\xbb\xbf" + _dumps(_document()).encode(), "bom.zeffir")
    assert load_session(with_mark) == load_session(_write(tmp_path, _document(), "plain.zeffir"))


def test_a_fifo_is_refused_without_opening_it(tmp_path):
    import os

    from zeffir.export import SessionError, load_session

    fifo = tmp_path / "session.zeffir"
    os.mkfifo(fifo)
    with pytest.raises(SessionError, match="not a regular file"):
        load_session(fifo)
