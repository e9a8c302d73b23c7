"""The reference tables in tests/reference/data/: each names its source and reads as a table."""

import itertools
import re

import pytest
from reference_data import DATA, header, rows

DATA_FILES = sorted(path.name for path in DATA.iterdir() if path.is_file())


def test_the_data_folder_holds_the_reference_tables():
    assert {"koga_rhf_energies.csv", "lda-total-energies.csv", "nist_ion_ground_levels.csv",
            "nist_neutral_ground_levels.csv"} <= set(DATA_FILES)


@pytest.mark.parametrize("name", DATA_FILES)
def test_every_data_file_starts_with_a_header_naming_its_source(name):
    assert name.endswith(".csv"), "only CSV tables belong in tests/reference/data/"
    assert (DATA / name).read_text(encoding="utf-8").startswith("# ")
    lines = header(name)
    source = [i for i, line in enumerate(lines) if re.match(r"Sources?:", line)]
    assert source, f"{name}: no 'Source:' line in its header"
    # The source line (or the lines after 'Sources:') names a publication: authors and a year,
    # or a NIST database.
    cited = " ".join(lines[source[0]:source[0] + 4])
    assert re.search(r"\(\d{4}\)|NIST", cited), cited
    assert rows(name), f"{name}: no rows"


def test_lda_total_energies_read_and_name_nist_srd_141():
    lines = header("lda-total-energies.csv")
    assert any("NIST Standard Reference Database 141" in line for line in lines)
    assert any("Phys. Rev. A 55, 191 (1997)" in line for line in lines)
    table = rows("lda-total-energies.csv")
    assert [int(row["Z"]) for row in table] == list(range(1, 93))
    energies = [float(row["lda_total_energy_hartree"]) for row in table]
    assert all(later < earlier < 0 for earlier, later in itertools.pairwise(energies))
    assert table[0]["symbol"] == "H" and energies[0] == -0.445671
    assert table[-1]["symbol"] == "U"


def test_nist_tables_cover_what_their_headers_say():
    neutral = rows("nist_neutral_ground_levels.csv")
    assert [int(row["Z"]) for row in neutral] == list(range(1, 104))
    ions = rows("nist_ion_ground_levels.csv")
    assert len(ions) == 55 and len({row["spec"] for row in ions}) == 55
    koga = rows("koga_rhf_energies.csv")
    assert {row["paper"] for row in koga} == {"koga1999", "koga2000"}
    assert all(float(row["value_hartree"]) < 0 for row in koga)
