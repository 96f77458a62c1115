"""Python's standard csv module reading an ephemeris CSV into floats and epochs: the anchor of the
ingest row of bench/wire.bench.ts (Eclipta's upload of the same file must be at least as fast).

A plain script as a user would write it: csv.reader over the file, the header skipped, each
epoch through datetime.fromisoformat into seconds since 1970 and every other cell through float().
Prints JSON: the rows read and the seconds taken (reading and converting, no output).
"""
import csv
import json
import sys
import time
from datetime import datetime


def main():
    path = sys.argv[1]
    started = time.perf_counter()
    epochs = []
    values = []
    with open(path, newline="") as f:
        rows = csv.reader(f)
        next(rows)
        for row in rows:
            epochs.append(datetime.fromisoformat(row[0]).timestamp())
            values.append([float(cell) for cell in row[1:]])
    seconds = time.perf_counter() - started
    json.dump({"rows": len(epochs), "seconds": seconds}, sys.stdout)


if __name__ == "__main__":
    main()
