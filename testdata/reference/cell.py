#!/usr/bin/python3
"""Reference values for pvrec/cell tests, computed with mpmath at 40 significant digits.

Run with Debian's python3 (python3-mpmath):  make reference (or from the repository root: /usr/bin/python3 testdata/reference/cell.py > testdata/reference/cell.csv)

diode rows: worked ideal-diode cases, Voc = n (kT/q) ln(1 + Jsc/J0) (W. Shockley, Bell Syst.
  Tech. J. 28, 435 (1949)), with k and q the exact SI values. The cases are set up here:
  Jsc = 40 mA/cm^2 with J0 from 1 fA/cm^2 to 1 pA/cm^2, ideality 1 to 2, 25 and 60 degC, and a
  very small Jsc/J0.
ivoc rows: q iVoc = kT ln((n0 + dn)(p0 + dn)/ni^2) for the test's fixed material (Boltzmann,
  ni = 1e10 cm^-3, T = 300 K, no narrowing), n0 = N/2 + sqrt(N^2/4 + ni^2), p0 = ni^2/n0.
"""
from mpmath import mp, mpf, sqrt, log, log1p

mp.dps = 40
k = mpf("1.380649e-23")
q = mpf("1.602176634e-19")

print("kind,a,b,c,d,value")
for j0 in ["1e-15", "1e-14", "1e-13", "1e-12"]:
    for n in ["1", "1.5", "2"]:
        for t in ["298.15", "333.15"]:
            v = mpf(n) * k * mpf(t) / q * log1p(mpf("0.04") / mpf(j0))
            print("diode,%s,0.04,%s,%s,%s" % (j0, n, t, mp.nstr(v, 20)))
v = k * 300 / q * log1p(mpf("1e-20") / mpf("1e-12"))
print("diode,1e-12,1e-20,1,300,%s" % mp.nstr(v, 20))

ni = mpf("1e10")
vt = k * 300 / q
for nds, nas in [("0", "0"), ("1e12", "0"), ("0", "1e15"), ("1e16", "0"), ("0", "1e19")]:
    net = mpf(nds) - mpf(nas)
    if net >= 0:
        n0 = net / 2 + sqrt(net * net / 4 + ni * ni)
        p0 = ni * ni / n0
    else:
        p0 = -net / 2 + sqrt(net * net / 4 + ni * ni)
        n0 = ni * ni / p0
    for dns in ["1e-3", "1e8", "1e13", "1e15", "1e17", "1e19"]:
        dn = mpf(dns)
        v = vt * log((n0 + dn) * (p0 + dn) / (ni * ni))
        print("ivoc,%s,%s,%s,-,%s" % (nds, nas, dns, mp.nstr(v, 20)))
