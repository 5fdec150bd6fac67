#!/usr/bin/python3
"""Reference values for pvrec/j0 tests, computed with mpmath at 40 significant digits.

Run with Debian's python3 (python3-mpmath):  make reference (or from the repository root: /usr/bin/python3 testdata/reference/j0_base.py > testdata/reference/j0_base.csv)

J0 of a uniform base, the textbook solution of the minority-carrier diffusion equation
(M. A. Green, Solar Cells, Prentice-Hall 1982):
  J0 = q (ni^2/N) (D/L) (S L/D + tanh(W/L)) / (1 + (S L/D) tanh(W/L)),  L = sqrt(D tau),
with q the exact SI elementary charge; for S = inf the factor is coth(W/L).
Columns: niEff, N, W, tau, D, S, J0 (A/cm^2). The cases are set up here (p-type and
n-type wafers, thin and thick, passivated and contacted rears).
"""
from mpmath import mp, mpf, sqrt, tanh, coth, inf

mp.dps = 40
q = mpf("1.602176634e-19")
cases = [
    ("1e10", "1.5e16", "0.018", "1e-3", "30", "0"),
    ("1e10", "1.5e16", "0.018", "1e-3", "30", "10"),
    ("1e10", "1.5e16", "0.018", "1e-3", "30", "1e7"),
    ("1e10", "1.5e16", "0.018", "1e-3", "30", "inf"),
    ("1.05e10", "5e15", "0.016", "5e-3", "11", "1"),
    ("1.05e10", "5e15", "0.016", "5e-6", "11", "100"),
    ("1.05e10", "5e15", "0.3", "1e-6", "11", "1e3"),
    ("2.5e10", "1e19", "1e-4", "1e-7", "2", "1e4"),
    ("1e10", "1e12", "0.02", "1e-2", "35", "inf"),
]
print("niEff,N,W,tau,D,S,J0")
for c in cases:
    ni, n, w, tau, d = (mpf(x) for x in c[:5])
    l = sqrt(d * tau)
    if c[5] == "inf":
        g = coth(w / l)
    else:
        r = mpf(c[5]) * l / d
        g = (r + tanh(w / l)) / (1 + r * tanh(w / l))
    j0 = q * ni * ni / n * d / l * g
    print(",".join(c) + "," + mp.nstr(j0, 20))
