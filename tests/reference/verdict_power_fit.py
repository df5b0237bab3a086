"""Reference for RunWatch's power-law radius fit: scipy.optimize.curve_fit of r = k*A**p.

Arguments: comma-separated A values, comma-separated r values. Prints k p se_k se_p.
Start value from the log-log line, as the C# fit does; pcov = s^2 (J^T J)^-1 (absolute_sigma=False).
"""
import sys

import numpy as np
from scipy.optimize import curve_fit

a = np.array([float(v) for v in sys.argv[1].split(",")])
r = np.array([float(v) for v in sys.argv[2].split(",")])
slope, intercept = np.polyfit(np.log(a), np.log(r), 1)
popt, pcov = curve_fit(lambda x, k, p: k * x**p, a, r, p0=[np.exp(intercept), slope], xtol=1e-15, ftol=1e-15, gtol=1e-15, maxfev=10000)
se = np.sqrt(np.diag(pcov))
print(f"{popt[0]!r} {popt[1]!r} {se[0]!r} {se[1]!r}")
