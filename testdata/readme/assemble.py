#!/usr/bin/env python3
"""Assemble README.md from README.template.md and the command sections.

Each command's section is written by whoever builds the command, with real
output, in testdata/readme/<command>.md; this script puts them in order
under "Commands" (demoting their headings to sit below it) and adds the
benchmark section at the end. Run from the repository root:

    python3 testdata/readme/assemble.py
"""
import os
import re

HERE = os.path.dirname(os.path.abspath(__file__))
ORDER = ["ephemeris", "passes", "atmosphere", "lifetime", "ballistic",
         "transfer", "lambert", "plot", "sweep"]


def demote(text, top):
    """Shift headings so that the fragment's top level becomes `top`."""
    levels = [len(m.group(1)) for m in re.finditer(r"^(#{2,6}) ", text, re.M)]
    if not levels:
        return text
    shift = top - min(levels)
    out, fence = [], False
    for line in text.splitlines():
        if line.startswith("```"):
            fence = not fence
        m = re.match(r"^(#{2,6}) ", line)
        if m and not fence:
            line = "#" * (len(m.group(1)) + shift) + line[len(m.group(1)):]
        out.append(line)
    return "\n".join(out).rstrip() + "\n"


def main():
    tmpl = open(os.path.join(HERE, "README.template.md")).read()
    parts = []
    for name in ORDER:
        p = os.path.join(HERE, name + ".md")
        if os.path.exists(p):
            parts.append(demote(open(p).read(), 3))
    readme = tmpl.replace("<!-- FRAGMENTS -->\n", "\n".join(parts))
    rel = os.path.join(HERE, "reliability.md")
    if os.path.exists(rel):
        readme = readme.rstrip() + "\n\n" + demote(open(rel).read(), 2)
    bench = os.path.join(HERE, "benchmarks.md")
    if os.path.exists(bench):
        readme = readme.rstrip() + "\n\n" + demote(open(bench).read(), 2)
    root = os.path.dirname(os.path.dirname(HERE))
    open(os.path.join(root, "README.md"), "w").write(readme)


if __name__ == "__main__":
    main()
