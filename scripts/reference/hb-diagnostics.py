"""Reference values for the MCMC diagnostics (server/engine/hb/mcmc-diagnostics.ts).

Generates seeded AR(1) chains with numpy and prints split R-hat and effective sample sizes as
ArviZ computes them (arviz.rhat(method="split"), arviz.ess(method="mean")), written to
tests/fixtures/estimation/hb-diagnostics-reference.json. CI does not run this script; the
fixture is committed. Usage (ArviZ 0.23.4, numpy): python3 scripts/reference/hb-diagnostics.py
"""
import json
import pathlib

import arviz as az
import numpy as np


def ar1(rng, chains, draws, phi, offsets):
    out = np.empty((chains, draws))
    for c in range(chains):
        x = rng.normal() / np.sqrt(1 - phi * phi)
        for i in range(draws):
            x = phi * x + rng.normal()
            out[c, i] = x + offsets[c]
    return out


rng = np.random.default_rng(20260417)
cases = {
    "two chains, phi 0.7, odd length": ar1(rng, 2, 301, 0.7, [0.0, 0.0]),
    "two chains, phi 0.7, shifted mean": ar1(rng, 2, 300, 0.7, [0.0, 3.0]),
    "four chains, phi 0.95": ar1(rng, 4, 400, 0.95, [0.0, 0.0, 0.0, 0.0]),
    "one chain with a trend": ar1(rng, 1, 200, 0.3, [0.0]) + np.linspace(0, 3, 200),
}
fixture = {
    "source": f"ArviZ {az.__version__}: rhat(method='split'), ess(method='mean')",
    "cases": [
        {
            "name": name,
            "chains": draws.tolist(),
            "rhat": None if np.isnan(az.rhat(draws, method="split")) else float(az.rhat(draws, method="split")),
            "ess": float(az.ess(draws, method="mean")),
        }
        for name, draws in cases.items()
    ],
}
path = pathlib.Path(__file__).resolve().parents[2] / "tests/fixtures/estimation/hb-diagnostics-reference.json"
path.write_text(json.dumps(fixture) + "\n")
for case in fixture["cases"]:
    print(case["name"], case["rhat"], case["ess"])
