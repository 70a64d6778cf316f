#!/usr/bin/env python3
"""Reference table: IAPWS-IF97 saturation properties from Debian's python3-iapws.

Writes src/engine/__tests__/fixtures/iapws-if97-saturation.json (or prints it
with --stdout). The engine's own IF97 code is checked against this table; the
table is committed so the tests run where python3-iapws is not installed.
Run with /usr/bin/python3 (Debian's python, where python3-iapws lives).
"""
import json
import math
import sys
from pathlib import Path

import iapws
from iapws import IAPWS97

# Absolute pressures, kPa: a log-spaced sweep over region 4 up to the region-3
# boundary, plus the gauge pressures of the trade over a standard atmosphere.
sweep = [round(0.7 * (16500 / 0.7) ** (i / 39), 6) for i in range(40)]
trade_gauge_kpa = [0, 34.4738, 103.421, 344.738, 689.476, 1034.21, 1723.69, 2068.43, 4136.85, 100, 200, 500, 700, 1000]
rows = []
for p_kpa in sorted(set(sweep + [round(g + 101.325, 6) for g in trade_gauge_kpa])):
    p_mpa = p_kpa / 1000
    liquid = IAPWS97(P=p_mpa, x=0)
    vapour = IAPWS97(P=p_mpa, x=1)
    rows.append({
        "absolutePressureKPa": p_kpa,
        "saturationTemperatureC": liquid.T - 273.15,
        "liquidEnthalpyJPerKg": liquid.h * 1000,
        "vapourEnthalpyJPerKg": vapour.h * 1000,
        "latentHeatJPerKg": (vapour.h - liquid.h) * 1000,
    })

table = {
    "source": "IAPWS-IF97 via python3-iapws " + getattr(iapws, "__version__", "?") + " (IAPWS97(P, x=0/1))",
    "generator": "scripts/reference/iapws_saturation.py",
    "rows": rows,
}
text = json.dumps(table, indent=1) + "\n"
if "--stdout" in sys.argv:
    sys.stdout.write(text)
else:
    out = Path(__file__).resolve().parents[2] / "src/engine/__tests__/fixtures/iapws-if97-saturation.json"
    out.write_text(text)
    print(f"wrote {len(rows)} rows to {out}")
