#!/usr/bin/python3
"""Reference values from the iapws library (J. J. Gómez Romera; Debian package python3-iapws).

Reads a JSON list of cases on stdin and prints
{"library": "iapws", "version": ..., "results": [...]} on stdout. Cases:
  {"fn": "psat", "T": K}                 IF97 region 4 saturation pressure, MPa (iapws97._PSat_T)
  {"fn": "tsat", "P": MPa}               IF97 region 4 saturation temperature, K (iapws97._TSat_P)
  {"fn": "region1", "T": K, "P": MPa}    IF97 region 1 specific volume, m3/kg (iapws97._Region1)
  {"fn": "iapws95", "T": K, "P": MPa}    IAPWS-95 density kg/m3 and viscosity Pa s (IAPWS95)
  {"fn": "iapws97", "T": K, "P": MPa}    IAPWS-IF97 density kg/m3 and viscosity Pa s (IAPWS97)
  {"fn": "viscosity", "rho": kg/m3, "T": K}  IAPWS 2008 viscosity, Pa s, no critical enhancement
"""
import json
import sys

try:
    import iapws
    from iapws import IAPWS95, IAPWS97
    from iapws._iapws import _Viscosity
    from iapws.iapws97 import _PSat_T, _TSat_P, _Region1
except ImportError as exc:
    print(json.dumps({"error": "missing-module", "module": "iapws", "detail": str(exc)}))
    sys.exit(3)


def run(case):
    fn = case.get("fn")
    try:
        if fn == "psat":
            return _PSat_T(case["T"])
        if fn == "tsat":
            return _TSat_P(case["P"])
        if fn == "region1":
            return _Region1(case["T"], case["P"])["v"]
        if fn == "iapws95":
            state = IAPWS95(T=case["T"], P=case["P"])
            return {"rho": state.rho, "mu": state.mu}
        if fn == "iapws97":
            state = IAPWS97(T=case["T"], P=case["P"])
            return {"rho": state.rho, "mu": state.mu}
        if fn == "viscosity":
            return _Viscosity(case["rho"], case["T"])
        return {"error": "unknown case %r" % fn}
    except Exception as exc:
        return {"error": "%s: %s" % (type(exc).__name__, exc)}


def main():
    cases = json.load(sys.stdin)
    version = getattr(iapws, "__version__", None)
    print(json.dumps({"library": "iapws", "version": version, "results": [run(c) for c in cases]}))


if __name__ == "__main__":
    main()
