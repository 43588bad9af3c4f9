#!/usr/bin/env python3
"""Writes qudt-units.txt: the local names of every qudt:Unit in the QUDT 3.1.0 unit vocabulary.

Source: the npm package @vocabulary/unit 2.0.0 (MIT), which ships https://qudt.org/3.1.0/vocab/unit as
N-Quads (unit.nq). QUDT itself is CC BY 4.0 (qudt.org); only the unit names are copied.

Rerun from the repository root (npm and Python 3, no other packages):
    npm pack @vocabulary/unit@2.0.0 && tar xzf vocabulary-unit-2.0.0.tgz
    python3 mapper/tools/qudt_units.py package/unit.nq mapper/src/main/resources/org/tufa/vocabulary/qudt-units.txt
"""
import re
import sys

UNIT = re.compile(r'^<http://qudt\.org/vocab/unit/([^>]+)> '
                  r'<http://www\.w3\.org/1999/02/22-rdf-syntax-ns#type> <http://qudt\.org/schema/qudt/Unit>')


def main(source, target):
    names = set()
    with open(source, encoding="utf-8") as f:
        for line in f:
            m = UNIT.match(line)
            if m:
                names.add(m.group(1))
    with open(target, "w", encoding="utf-8", newline="\n") as out:
        out.write("# Local names of the qudt:Unit individuals of QUDT 3.1.0 (http://qudt.org/vocab/unit/), one a line.\n")
        out.write("# QUDT is CC BY 4.0 (qudt.org). Written by mapper/tools/qudt_units.py; do not edit by hand.\n")
        for name in sorted(names):
            out.write(name + "\n")
    print(len(names), "units")


if __name__ == "__main__":
    main(sys.argv[1], sys.argv[2])
