#!/usr/bin/python3
"""Independent reference J0 of doped regions for pvrec/j0 (TestSolveIndependentReference).

Run with Debian's python3 (python3-scipy), from the repository root:
    /usr/bin/python3 testdata/reference/j0_emitter.py > testdata/reference/j0_emitter.csv   (or: make reference)

The region and its models are those of j0.SimpleModels, written out here from their
definitions (no pvrec code is used): T = 300 K, ni = 1e10 cm^-3, no band-gap narrowing,
Boltzmann statistics, complete ionisation, so that n0 = N/2 + sqrt(N^2/4 + ni^2) and
p0 = ni^2/n0 for the net doping N = Nd - Na > 0 (mirrored for p-type); the minority mobility of
G. Masetti, M. Severi and S. Solmi, IEEE Trans. Electron Devices 30, 764 (1983), at the total
dopant density (boron set for holes, phosphorus set for electrons, the parameters of
silicon.MasettiBoron and silicon.MasettiPhosphorus); D = mu kT/q; Auger recombination with the
constant coefficients of J. Dziewior and W. Schmid, Appl. Phys. Lett. 31, 346 (1977),
Cn = 2.8e-31, Cp = 9.9e-32 cm^6/s, so that in low injection R = c u with
c = (Cn n0 + Cp p0) n0 p0 and u = dn_min/n_min0.

Method (different from the Go solver's finite volumes): the minority-carrier equation
(a u')' = c u, a = D n_min0, with a u' = S n_min0 u at x = 0 and u = 1 at x = W, is linear, so
the admittance Y = a u'/u obeys the Riccati initial-value problem Y' = c - Y^2/a,
Y(0) = S n_min0(0), and J0 = q Y(W); for S = inf its reciprocal Z = 1/Y is integrated,
Z' = 1/a - c Z^2, Z(0) = 0. scipy.integrate.solve_ivp (DOP853) at rtol 1e-12; halving rtol and
atol changes J0 by less than 1e-10 (relative).

Columns: type (n or p: the region's majority dopant), shape (erfc or gauss), Ns (cm^-3),
L (cm), background (cm^-3, of the other type), W (cm), S (cm/s; inf for an ohmic contact),
J0 (A/cm^2).
"""
import math
from scipy.integrate import solve_ivp
from scipy.special import erfc

q = 1.602176634e-19
k = 1.380649e-23
T = 300.0
vt = k * T / q
ni = 1.0e10
Cn, Cp = 2.8e-31, 9.9e-32
boron = dict(mumin1=44.9, mumin2=0.0, mu1=29.0, mumax=470.5, cr=2.23e17, cs=6.10e20, alpha=0.719, beta=2.00, pc=9.23e16)
phos = dict(mumin1=68.5, mumin2=68.5, mu1=56.1, mumax=1414.0, cr=9.20e16, cs=3.41e20, alpha=0.711, beta=1.98, pc=0.0)


def masetti(p, n):
    mu = p["mumin1"] * (math.exp(-p["pc"] / n) if p["pc"] else 1.0)
    return mu + (p["mumax"] - p["mumin2"]) / (1 + (n / p["cr"]) ** p["alpha"]) - p["mu1"] / (1 + (p["cs"] / n) ** p["beta"])


def coefficients(typ, shape, ns, l, bg):
    def dop(x):
        return ns * (erfc(x / l) if shape == "erfc" else math.exp(-(x / l) ** 2))

    def ac(x):
        nmaj_dop = dop(x)
        net = nmaj_dop - bg
        tot = nmaj_dop + bg
        maj = net / 2 + math.hypot(net / 2, ni)
        mnr = ni * (ni / maj)
        if typ == "n":
            n0, p0, mu = maj, mnr, masetti(boron, tot)
        else:
            n0, p0, mu = mnr, maj, masetti(phos, tot)
        a = mu * vt * mnr
        c = (Cn * n0 + Cp * p0) * n0 * p0
        return a, c, mnr

    return ac


def j0(typ, shape, ns, l, bg, w, s):
    ac = coefficients(typ, shape, ns, l, bg)
    if s == "inf":
        def rhs(x, z):
            a, c, _ = ac(x)
            return [1 / a - c * z[0] ** 2]
        # Z = 1/Y is of order 1e-6..1e-4 cm^2 s: an absolute tolerance of 1e-22 is far below it.
        sol = solve_ivp(rhs, (0, w), [0.0], method="DOP853", rtol=1e-12, atol=1e-22)
        return q / sol.y[0][-1]
    sv = float(s)
    def rhs(x, y):
        a, c, _ = ac(x)
        return [c - y[0] ** 2 / a]
    y0 = sv * ac(0)[2]
    # Y is of order J0/q ~ 1e4..1e6 cm^-2 s^-1: an absolute tolerance of 1e-9 is far below it.
    sol = solve_ivp(rhs, (0, w), [y0], method="DOP853", rtol=1e-12, atol=1e-9)
    return q * sol.y[0][-1]


cases = [
    ("n", "erfc", "1e20", "0.2e-4", "1e16", "0.4e-4", "0"),
    ("n", "erfc", "1e20", "0.2e-4", "1e16", "0.4e-4", "1e3"),
    ("n", "erfc", "1e20", "0.2e-4", "1e16", "0.4e-4", "1e5"),
    ("n", "erfc", "1e20", "0.2e-4", "1e16", "0.4e-4", "inf"),
    ("n", "gauss", "3e20", "0.3e-4", "1e15", "0.7e-4", "1e4"),
    ("n", "erfc", "5e19", "1e-4", "1.5e16", "2e-4", "100"),
    ("p", "erfc", "1e19", "0.5e-4", "1e15", "1.2e-4", "30"),
    ("p", "gauss", "1e20", "0.4e-4", "5e15", "0.9e-4", "1e5"),
]
print("type,shape,Ns,L,background,W,S,J0")
for c in cases:
    typ, shape = c[0], c[1]
    ns, l, bg, w = (float(v) for v in c[2:6])
    print(",".join(c) + ",%.12e" % j0(typ, shape, ns, l, bg, w, c[6]))
