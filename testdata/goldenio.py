"""Shared command line and output of the golden-file scripts gen_*.py.

Each script calls main(NAME, compute): the one optional argument is the
output directory (default: the scripts' directory), and compute()'s result
is written there as NAME.
"""
import json
import os
import sys


def output_dir():
    """The one optional argument: the output directory (default: this script's)."""
    args = sys.argv[1:]
    if len(args) > 1 or (args and args[0].startswith("-")):
        raise SystemExit("usage: python3 %s [OUTDIR]" % sys.argv[0])
    return args[0] if args else os.path.dirname(os.path.abspath(__file__))


def write_golden(out, outdir, name):
    """Write out as JSON (indent 1, keys in the insertion order fixed by the
    script, trailing newline) to outdir/name, via a temporary file so a
    failed run never leaves a truncated golden file behind."""
    os.makedirs(outdir, exist_ok=True)
    path = os.path.join(outdir, name)
    tmp = path + ".tmp"
    with open(tmp, "w", encoding="utf-8", newline="\n") as f:
        f.write(json.dumps(out, indent=1))
        f.write("\n")
    os.replace(tmp, path)
    print("wrote " + path, file=sys.stderr)


def main(name, compute):
    """Parse the command line, compute, and write the golden file."""
    outdir = output_dir()
    write_golden(compute(), outdir, name)
