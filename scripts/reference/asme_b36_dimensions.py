#!/usr/bin/env python3
"""Reference table: ASME B36.10M / B36.19M pipe dimensions from Debian's python3-fluids.

Writes src/engine/__tests__/fixtures/asme-b36-dimensions.json (or prints it
with --stdout): outside diameter and wall, mm, per NPS and schedule, read from
fluids.piping's B36.10M/B36.19M tables. The engine's own (inch) table is checked
against it. Run with /usr/bin/python3.
"""
import json
import sys
from pathlib import Path

import fluids
from fluids.piping import schedule_lookup

SCHEDULES = {"ASME-B36.10M": ["10", "40", "80", "160", "STD", "XS"], "ASME-B36.19M": ["5S", "10S", "40S", "80S"]}
rows = []
for standard, schedules in SCHEDULES.items():
    for schedule in schedules:
        nps_list, _inner, outer, wall = schedule_lookup[schedule]
        for nps, od_mm, t_mm in zip(nps_list, outer, wall):
            if 0.5 <= nps <= 24:
                rows.append({"standard": standard, "schedule": schedule, "nps": nps, "outerDiameterMm": od_mm, "wallMm": t_mm})

table = {
    "source": "ASME B36.10M / B36.19M tables of python3-fluids " + fluids.__version__ + " (fluids.piping.schedule_lookup)",
    "generator": "scripts/reference/asme_b36_dimensions.py",
    "rows": rows,
}
text = json.dumps(table, indent=1) + "\n"
if "--stdout" in sys.argv:
    sys.stdout.write(text)
else:
    out = Path(__file__).resolve().parents[2] / "src/engine/__tests__/fixtures/asme-b36-dimensions.json"
    out.write_text(text)
    print(f"wrote {len(rows)} rows to {out}")
