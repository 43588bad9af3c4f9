#!/usr/bin/env python3
"""Scores a mapping report (tufa map --report) against the demo answer key, for rule-file authors.

    python3 demo-data/tools/score_mapping.py mapping.csv demo-data/src/main/resources/org/tufa/demo/answer-key.csv

Brick declares Supply_Air_Temperature_Sensor owl:equivalentClass Discharge_Air_Temperature_Sensor, so either
name counts as right for the other. Prints the share right and every miss.
"""
import csv
import sys

EQUIVALENT = {"Supply_Air_Temperature_Sensor": "Discharge_Air_Temperature_Sensor"}


def norm(c):
    return EQUIVALENT.get(c, c)


def main(report, key):
    rows = list(csv.DictReader(open(report, encoding="utf-8")))
    answers = list(csv.DictReader(open(key, encoding="utf-8")))
    assert len(rows) == len(answers), (len(rows), len(answers))
    right = 0
    fcu_total = fcu_right = 0
    for r, a in zip(rows, answers):
        got_cls = r["class"] if r["status"] in ("mapped", "duplicate") else ""
        ok = norm(got_cls) == norm(a["expected_class"]) and (r["equipment"] or "") == a["expected_equipment"]
        right += ok
        if a["expected_equipment_class"] == "Fan_Coil_Unit":
            fcu_total += 1
            fcu_right += ok
        if not ok:
            print(f"miss line {r['line']}: {r['point']}: got {r['status']} {got_cls} on {r['equipment']!r}, "
                  f"expected {a['expected_class']} on {a['expected_equipment']!r}")
    print(f"all points: {right}/{len(rows)} = {100 * right / len(rows):.1f} %; "
          f"fan coil unit points: {fcu_right}/{fcu_total} = {100 * fcu_right / fcu_total:.1f} %")


if __name__ == "__main__":
    main(sys.argv[1], sys.argv[2])
