#!/usr/bin/python3
"""Reference values from the fluids library (Caleb Bell; Debian package python3-fluids).

Reads a JSON list of cases on stdin, each {"fn": name, "args": [...], "kwargs": {...}}, and prints
{"library": "fluids", "version": ..., "results": [value or {"error": text}, ...]} on stdout.
Only the functions listed in ALLOWED can be called.
"""
import json
import sys

try:
    import fluids
except ImportError as exc:  # the TypeScript side turns this into an install hint
    print(json.dumps({"error": "missing-module", "module": "fluids", "detail": str(exc)}))
    sys.exit(3)

ALLOWED = {
    "friction_factor": fluids.friction_factor,
    "Colebrook": fluids.Colebrook,
    "Clamond": fluids.Clamond,
    "friction_laminar": fluids.friction_laminar,
    "ft_Crane": fluids.ft_Crane,
    "bend_rounded": fluids.bend_rounded,
    "bend_rounded_Crane": fluids.bend_rounded_Crane,
    "entrance_sharp": fluids.entrance_sharp,
    "exit_normal": fluids.exit_normal,
    "diffuser_sharp": fluids.diffuser_sharp,
    "contraction_sharp": fluids.contraction_sharp,
}


def run(case):
    fn = ALLOWED.get(case.get("fn"))
    if fn is None:
        return {"error": "function not allowed: %r" % case.get("fn")}
    try:
        return float(fn(*case.get("args", []), **case.get("kwargs", {})))
    except Exception as exc:  # report per case, keep the others
        return {"error": "%s: %s" % (type(exc).__name__, exc)}


def main():
    cases = json.load(sys.stdin)
    print(json.dumps({"library": "fluids", "version": fluids.__version__, "results": [run(c) for c in cases]}))


if __name__ == "__main__":
    main()
