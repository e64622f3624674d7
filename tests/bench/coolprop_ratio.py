#!/usr/bin/env python3
"""Side by side in one run: the same 10,000 property states (5,000 air, 5,000 liquid water)
through Leeward's engine and through CoolProp 8.0.0 from Python; prints both and the ratio.

    python3 -m pip install CoolProp==8.0.0
    python3 tests/bench/coolprop_ratio.py

CoolProp is called through its fast low-level interface (AbstractState.update then the four
properties), HEOS::Air and IF97::Water, so the comparison is not of PropsSI's string parsing.
"""
import os, random, subprocess, sys, tempfile, time
import CoolProp

random.seed(20261202)
states = [("air", random.uniform(250, 900), random.uniform(80e3, 300e3)) for _ in range(5000)]
states += [("water", random.uniform(280, 360), random.uniform(101325, 1e6)) for _ in range(5000)]

root = os.path.dirname(os.path.dirname(os.path.dirname(os.path.abspath(__file__))))
with tempfile.NamedTemporaryFile("w", suffix=".csv", delete=False) as f:
    f.write("\n".join(f"{a},{t!r},{p!r}" for a, t, p in states))
    path = f.name
out = subprocess.run(["cargo", "run", "--quiet", "--profile", "native", "--no-default-features",
                      "--example", "props_timing", "--", path],
                     cwd=root, check=True, capture_output=True, text=True).stdout
engine_ns = float(out.strip())

air = CoolProp.AbstractState("HEOS", "Air")
wat = CoolProp.AbstractState("IF97", "Water")
best = float("inf")
for _ in range(3):
    t0 = time.perf_counter()
    acc = 0.0
    for a, T, p in states:
        s = air if a == "air" else wat
        s.update(CoolProp.PT_INPUTS, p, T)
        acc += s.rhomass() + s.viscosity() + s.conductivity() + s.cpmass()
    best = min(best, time.perf_counter() - t0)
coolprop_ns = best / len(states) * 1e9

# The everyday call, PropsSI, once per property.
from CoolProp.CoolProp import PropsSI
t0 = time.perf_counter()
for a, T, p in states:
    fl = "HEOS::Air" if a == "air" else "IF97::Water"
    acc += sum(PropsSI(q, "T", T, "P", p, fl) for q in ("D", "V", "L", "C"))
propssi_ns = (time.perf_counter() - t0) / len(states) * 1e9
print(f"states: {len(states)} (5000 air, 5000 liquid water), rho mu k cp each")
print(f"Leeward engine (native, opt 3):  {engine_ns:10.1f} ns/state")
print(f"CoolProp {CoolProp.__version__} AbstractState:   {coolprop_ns:10.1f} ns/state  (Leeward {coolprop_ns / engine_ns:.0f}x faster)")
print(f"CoolProp {CoolProp.__version__} PropsSI x4:      {propssi_ns:10.1f} ns/state  (Leeward {propssi_ns / engine_ns:.0f}x faster)")
os.unlink(path)
