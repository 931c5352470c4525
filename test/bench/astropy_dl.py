#!/usr/bin/env python3
"""Times astropy's FlatLambdaCDM.luminosity_distance on N redshifts, for side-by-side timing with the
tool's batch luminosityDistancesMpc. Usage: astropy_dl.py N REPS. Same redshifts as bench.ts
(0.01 + 20 i/N) and the parameters of the astropy fixture's flat_radiation case (massless neutrinos).
Prints one JSON line: astropy version, median seconds over REPS."""
import json
import sys
import time

import astropy
import numpy as np
from astropy import units as u
from astropy.cosmology import FlatLambdaCDM

n, reps = int(sys.argv[1]), int(sys.argv[2])
z = 0.01 + 20 * np.arange(n) / n
cosmo = FlatLambdaCDM(H0=67.66, Om0=0.3111, Ob0=0.048975, Tcmb0=2.7255, Neff=3.046, m_nu=0 * u.eV)
times = []
for _ in range(reps):
    t = time.perf_counter()
    d = cosmo.luminosity_distance(z)
    times.append(time.perf_counter() - t)
print(json.dumps({"astropy": astropy.__version__, "seconds": float(np.median(times)), "checksum": float(d.value.sum())}))
