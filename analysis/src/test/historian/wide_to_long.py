#!/usr/bin/env python3
"""Streams a wide trend CSV (timestamp,<series>,...) as long rows (series_id,ts,value) on stdout, for loading a
trend file into a PostgreSQL historian table with COPY. Empty cells are left out. Used by the historian benchmark
(DEVELOPERS.md, "Benchmarks"):

    python3 wide_to_long.py trends.csv | psql ... -c "COPY trend_samples (series_id, ts, value) FROM STDIN (FORMAT csv)"
"""
import csv
import sys


def main(path):
    out = sys.stdout
    with open(path, newline="", encoding="utf-8") as f:
        rows = csv.reader(f)
        header = next(rows)
        names = header[1:]
        write = out.write
        for row in rows:
            ts = row[0]
            for name, value in zip(names, row[1:]):
                if value:
                    write(f"{name},{ts},{value}\n")


if __name__ == "__main__":
    main(sys.argv[1])
