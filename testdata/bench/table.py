#!/usr/bin/env python3
"""Turn 'go test ./... -run ^$ -bench . -benchmem' output into the
markdown table of the README's benchmark section. Run from the repository
root:

    go test ./... -run '^$' -bench . -benchmem > bench.txt
    python3 testdata/bench/table.py bench.txt

Times are printed with four significant figures in ns, us, ms or s; the
custom metrics (evals, steps, errors ...) follow in the last column.
"""
import re
import sys


def fmt_time(ns):
    for unit, scale in (("s", 1e9), ("ms", 1e6), ("µs", 1e3)):
        if ns >= scale:
            return "%.4g %s" % (ns / scale, unit)
    return "%.4g ns" % ns


def main():
    pkg = ""
    print("| package | benchmark | time/op | B/op | allocs/op | other metrics |")
    print("| --- | --- | ---: | ---: | ---: | --- |")
    for line in open(sys.argv[1]):
        if line.startswith("pkg: "):
            pkg = line.split()[1].removeprefix("centra/")
            continue
        if not line.startswith("Benchmark"):
            continue
        f = line.split()
        name = re.sub(r"-\d+$", "", f[0]).removeprefix("Benchmark")
        vals = {}
        other = []
        for i in range(2, len(f) - 1, 2):
            v, u = f[i], f[i + 1]
            if u in ("ns/op", "B/op", "allocs/op"):
                vals[u] = float(v)
            else:
                other.append("%s %s" % (v, u))
        print("| %s | %s | %s | %s | %s | %s |" % (
            pkg, name, fmt_time(vals.get("ns/op", 0)), "%.0f" % vals.get("B/op", 0),
            "%.0f" % vals.get("allocs/op", 0), ", ".join(other)))


if __name__ == "__main__":
    main()
