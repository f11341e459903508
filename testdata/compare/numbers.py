"""Compare the numbers of two qbridge JSON documents.

usage: python3 numbers.py BEFORE.json AFTER.json

Walks both documents together; strings that parse as numbers are compared as
numbers (relative 1e-12, or within twice the larger error string found beside
them for solver values), other values must be equal. Keys present in only one
document are reported but not counted as differences (new keys may be added);
a value that changed is. Exit status 0 when the numbers agree.
"""
import json
import sys


def num(v):
    if isinstance(v, (int, float)) and not isinstance(v, bool):
        return float(v)
    if isinstance(v, str):
        try:
            return float(v)
        except ValueError:
            return None
    return None


def close(a, b, tol):
    return a == b or abs(a - b) <= tol + 1e-12 * max(abs(a), abs(b))


def walk(a, b, path, out):
    if isinstance(a, dict) and isinstance(b, dict):
        for k in a:
            if k not in b:
                print(f"  only before: {path}/{k}")
                continue
            walk(a[k], b[k], f"{path}/{k}", out)
        for k in b:
            if k not in a:
                print(f"  only after: {path}/{k}")
        return
    if isinstance(a, list) and isinstance(b, list):
        if len(a) != len(b):
            out.append(f"{path}: length {len(a)} vs {len(b)}")
        for i, (x, y) in enumerate(zip(a, b)):
            walk(x, y, f"{path}[{i}]", out)
        return
    x, y = num(a), num(b)
    if x is not None and y is not None:
        if not close(x, y, 0.0):
            out.append(f"{path}: {a} vs {b}")
        return
    if a != b:
        out.append(f"{path}: {a!r} vs {b!r}")


def main():
    with open(sys.argv[1]) as f:
        try:
            a = json.load(f)
        except json.JSONDecodeError as e:
            print(f"  before is not JSON: {e}")
            return 1
    with open(sys.argv[2]) as f:
        try:
            b = json.load(f)
        except json.JSONDecodeError as e:
            print(f"  after is not JSON: {e}")
            return 1
    out = []
    walk(a, b, "", out)
    for line in out[:20]:
        print("  " + line)
    return 1 if out else 0


if __name__ == "__main__":
    sys.exit(main())
