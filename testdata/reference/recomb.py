#!/usr/bin/python3
"""Reference rates for pvrec/recomb tests, computed with mpmath at 40 significant digits.

Run with Debian's python3 (python3-mpmath):  make reference (or from the repository root: /usr/bin/python3 testdata/reference/recomb.py > testdata/reference/recomb.csv)

The material is the test's fixed one: Boltzmann statistics, no band-gap narrowing,
ni = 1e10 cm^-3, Nc = 2.86e19, Nv = 3.10e19 cm^-3, T = 300 K, kT/q from the exact
SI values of k and q (as gonum.org/v1/gonum/unit/constant has them). Equilibrium: n0 = N/2 + sqrt(N^2/4 + ni^2), p0 = ni^2/n0
for net donors N >= 0 (mirrored for acceptors). The formulas are written out here
independently of the Go code, from the papers:
  Richter2012:   A. Richter et al., Phys. Rev. B 86, 165202 (2012)
  KerrCuevas2002: M. J. Kerr and A. Cuevas, J. Appl. Phys. 91, 2473 (2002)
  Altermatt1997:  P. P. Altermatt et al., J. Appl. Phys. 82, 4938 (1997) (300 K, value from memory)
  SRH:           W. Shockley and W. T. Read, Phys. Rev. 87, 835 (1952)
Columns: model, nd, na, dn, level (for SRH: ref:E), rate in cm^-3 s^-1.
"""
from mpmath import mp, mpf, sqrt, tanh, exp, log

mp.dps = 40
ni = mpf("1e10")
nc = mpf("2.86e19")
nv = mpf("3.10e19")
vt = mpf("1.380649e-23") / mpf("1.602176634e-19") * 300


def equilibrium(nd, na):
    net = nd - na
    if net >= 0:
        n0 = net / 2 + sqrt(net * net / 4 + ni * ni)
        return n0, ni * ni / n0
    p0 = -net / 2 + sqrt(net * net / 4 + ni * ni)
    return ni * ni / p0, p0


def richter(n0, p0, dn):
    geeh = 1 + 13 * (1 - tanh((n0 / mpf("3.3e17")) ** mpf("0.66")))
    gehh = 1 + mpf("7.5") * (1 - tanh((p0 / mpf("7.0e17")) ** mpf("0.63")))
    return mpf("2.5e-31") * geeh * n0 + mpf("8.5e-32") * gehh * p0 + mpf("3.0e-29") * dn ** mpf("0.92")


def kerr(n0, p0, dn):
    return mpf("1.8e-24") * n0 ** mpf("0.65") + mpf("6e-25") * p0 ** mpf("0.65") + mpf("3e-27") * dn ** mpf("0.8")


def altermatt(n0, p0, dn):
    geeh = 1 + 44 * (1 - tanh((n0 / mpf("3.3e17")) ** mpf("0.34")))
    gehh = 1 + 44 * (1 - tanh((p0 / mpf("7.0e17")) ** mpf("0.29")))
    return mpf("2.8e-31") * geeh * n0 + mpf("9.9e-32") * gehh * p0


def srh(ref, e, n, p, taun, taup):
    if ref == "ev":
        p1 = nv * exp(-e / vt)
        n1 = ni * ni / p1
    elif ref == "ec":
        n1 = nc * exp(-e / vt)
        p1 = ni * ni / n1
    else:
        n1 = ni * exp(e / vt)
        p1 = ni * exp(-e / vt)
    return 1 / (taup * (n + n1) + taun * (p + p1))


rows = []
dopings = [("1e12", "0"), ("1e15", "0"), ("0", "1e16"), ("5e17", "0"), ("0", "1e19"), ("1e20", "0")]
dns = ["1e9", "1e13", "1e15", "1e17"]
for nds, nas in dopings:
    nd, na = mpf(nds), mpf(nas)
    n0, p0 = equilibrium(nd, na)
    for dns_ in dns:
        dn = mpf(dns_)
        n, p = n0 + dn, p0 + dn
        excess = dn * (n0 + p0 + dn)  # = n p - ni^2 exactly
        rows.append(("Richter2012", nds, nas, dns_, "-", excess * richter(n0, p0, dn)))
        rows.append(("KerrCuevas2002", nds, nas, dns_, "-", excess * kerr(n0, p0, dn)))
        if dn <= mpf("0.1") * (n0 + p0):
            rows.append(("Altermatt1997", nds, nas, dns_, "-", excess * altermatt(n0, p0, dn)))
        rows.append(("DziewiorSchmid1977", nds, nas, dns_, "-", excess * (mpf("2.8e-31") * n + mpf("9.9e-32") * p)))
        for ref, e in [("ev", "0.38"), ("ec", "0.26"), ("ei", "0"), ("ei", "-0.15")]:
            rows.append(("SRH", nds, nas, dns_, ref + ":" + e,
                         excess * srh(ref, mpf(e), n, p, mpf("1e-3"), mpf("3e-3"))))

print("model,nd,na,dn,level,rate")
for r in rows:
    print("%s,%s,%s,%s,%s,%s" % (r[0], r[1], r[2], r[3], r[4], mp.nstr(r[5], 20)))
