#!/usr/bin/python3
"""Reference values of phi(t, K) = t + X coth X - e^t X / sinh X, X = sqrt(t^2 + K), for
pvrec/j0 (TestPhi): the recombination part of the exact cell fluxes of the solver.

Run with Debian's python3 (python3-mpmath), from the repository root:
    /usr/bin/python3 testdata/reference/j0_phi.py > testdata/reference/j0_phi.csv   (or: make reference)

Evaluated directly from the definition with mpmath at 50 significant digits (the cancellation
of the direct formula, which the Go code avoids, is harmless at that precision).
Columns: t, K, phi.
"""
from mpmath import mp, mpf, sqrt, coth, sinh, exp, nstr

mp.dps = 50
ts = ["-30", "-5", "-1.2", "-0.999", "-0.5", "-0.01", "0", "1e-6", "0.01", "0.5", "0.999", "1.2", "5", "30"]
ks = ["1e-12", "1e-6", "1e-3", "0.1", "0.5", "0.998", "1.002", "3", "100", "1e4"]
print("t,K,phi")
for ts_ in ts:
    for ks_ in ks:
        t, k = mpf(ts_), mpf(ks_)
        x = sqrt(t * t + k)
        phi = t + x * coth(x) - exp(t) * x / sinh(x)
        print("%s,%s,%s" % (ts_, ks_, nstr(phi, 20)))
