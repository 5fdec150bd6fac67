#!/usr/bin/python3
"""Reference solutions of the extended SRH interface model for the pvrec/surface tests,
computed with mpmath at 20 significant digits.

Run with Debian's python3-mpmath (make reference, or from the repository root):

    /usr/bin/python3 testdata/reference/surface_extsrh.py > testdata/reference/surface_extsrh.csv

This is an independent implementation of the defining equations (not a port of the Go code):
the model of R. B. M. Girisch, R. P. Mertens, R. F. De Keersmaecker, IEEE Trans. Electron
Devices 35, 203 (1988) and A. G. Aberle, S. Glunz, W. Warta, J. Appl. Phys. 71, 4422 (1992),
with flat quasi-Fermi levels and Boltzmann statistics:

    ns = n exp(y), ps = p exp(-y), y = psi_s / Vt,
    Qs(y) = -sign(y) sqrt(2 eps Vt / q) sqrt(p (e^-y + y - 1) + n (e^y - y - 1))    [cm^-2]
    f(E)  = (cn ns + cp p1) / (cn (ns + n1) + cp (ps + p1)),  cn = sigma_n vth, cp = sigma_p vth
    Qit   = int_{E > E_N} -Dit f dE + int_{E < E_N} Dit (1 - f) dE       (if charged states)
    Qf + Qit(y) + Qs(y) = 0                                   (solved by mpmath.findroot)
    Us    = int Dit (n p - ni^2) / ((ns + n1)/cp + (ps + p1)/cn) dE       (mpmath.quad)
    n1 = ni exp(e/Vt), p1 = ni exp(-e/Vt), e = E - Ei from -Vt ln(Nv/ni) to Vt ln(Nc/ni),
    Seff = Us / dn,  J0s = q Us ni^2 / (n p - ni^2).

The material is the one the Go test builds with package silicon: T = 300 K, Boltzmann
statistics, FixedNi ni = 1e10 cm^-3, no band-gap narrowing, Green 1990 DOS at 300 K
(Nc = 2.86e19, Nv = 3.10e19 cm^-3), complete ionisation; n0 and p0 from Boltzmann charge
neutrality. Constants: k and q exact SI values; eps0 = 8.854187817620389e-12 F/m (gonum's
value); eps_r = 11.9, vth = 1e7 cm/s (the Go defaults). Dit, cross sections and charges are
invented test inputs, not data of any real dielectric.

Columns: case, y = psi_s/Vt, ns, ps (cm^-3), Qit, Qs (cm^-2), Us (cm^-2 s^-1), Seff (cm/s),
J0s (A/cm^2).
"""
import mpmath as mp

mp.mp.dps = 20
q = mp.mpf('1.602176634e-19')
Vt = mp.mpf('1.380649e-23') / q * 300
eps = mp.mpf('11.9') * mp.mpf('8.854187817620389e-12') / 100  # F/cm
Nc, Nv, ni = mp.mpf('2.86e19'), mp.mpf('3.10e19'), mp.mpf('1e10')
vth = mp.mpf('1e7')


def const(v):
    return lambda e: mp.mpf(v)


def ushape(mid, tc, tv, ec, ev, wc, wv):
    mid, tc, tv, ec, ev, wc, wv = map(mp.mpf, (mid, tc, tv, ec, ev, wc, wv))
    return lambda e: mid + tc * mp.exp((e - ec) / wc) + tv * mp.exp((ev - e) / wv)


def gauss(peak, e0, w):
    peak, e0, w = map(mp.mpf, (peak, e0, w))
    return lambda e: peak * mp.exp(-(e - e0) ** 2 / (2 * w * w))


def logtable(es, ss):
    es = [mp.mpf(x) for x in es]
    ss = [mp.mpf(x) for x in ss]

    def f(e):
        if e <= es[0]:
            return ss[0]
        if e >= es[-1]:
            return ss[-1]
        for i in range(len(es) - 1):
            if es[i] <= e <= es[i + 1]:
                t = (e - es[i]) / (es[i + 1] - es[i])
                return ss[i] * (ss[i + 1] / ss[i]) ** t
    return f


# name: (nd, na, dn, Qf, charged, neutral level, Dit, sigma_n, sigma_p, breakpoints)
GAUSS_BREAKS = [0.2 + 0.05 * k for k in range(-8, 9)]
SIG_E = ['-0.3', '0', '0.3']
CASES = [
    ('p16_flat', 0, '1e16', '1e15', '0', False, 0, const('1e11'), const('1e-16'), const('1e-16'), []),
    ('p16_acc', 0, '1e16', '1e15', '-1e12', False, 0, const('1e11'), const('1e-16'), const('1e-16'), []),
    ('p16_inv', 0, '1e16', '1e15', '3e11', False, 0, const('1e11'), const('1e-16'), const('1e-16'), []),
    ('n15_ushape_charged', '1e15', 0, '1e14', '2e12', True, 0,
     ushape('1e10', '1e13', '1e13', '0.56', '-0.56', '0.08', '0.1'), const('1e-14'), const('1e-16'), [0]),
    ('p18_gauss_charged', 0, '1e18', '1e12', '-5e11', True, '0.1',
     lambda e: gauss('1e12', '0.2', '0.05')(e) + mp.mpf('1e9'),
     logtable(SIG_E, ['1e-15', '1e-16', '1e-17']), const('1e-16'), GAUSS_BREAKS + [0.1] + [float(x) for x in SIG_E]),
    ('n14_highinj_inv', '1e14', 0, '1e17', '-1e13', True, 0, const('1e12'), const('1e-16'), const('1e-15'), [0]),
    ('p14_strong_inv', 0, '1e14', '1e12', '1e13', True, 0, const('1e11'), const('1e-15'), const('1e-16'), [0]),
    ('p5e15_depl_charged', 0, '5e15', '3e13', '-1e10', True, 0, const('3e11'), const('1e-16'), const('1e-16'), [0]),
]


def solve(nd, na, dn, Qf, charged, neutral, dit, sn, sp, breaks):
    nd, na, dn, Qf, neutral = map(mp.mpf, (nd, na, dn, Qf, neutral))
    N = nd - na
    if N >= 0:
        n0 = N / 2 + mp.sqrt(N * N / 4 + ni * ni)
        p0 = ni * ni / n0
    else:
        p0 = -N / 2 + mp.sqrt(N * N / 4 + ni * ni)
        n0 = ni * ni / p0
    n, p = n0 + dn, p0 + dn
    np_ = n * p - ni * ni
    eLo, eHi = -Vt * mp.log(Nv / ni), Vt * mp.log(Nc / ni)
    pts = [eLo + (eHi - eLo) * k / 30 for k in range(31)]
    pts += [mp.mpf(b) for b in breaks if eLo < b < eHi]
    pts = sorted(set(pts))
    k2 = 2 * eps * Vt / q

    def qs(y):
        g = p * (mp.exp(-y) + y - 1) + n * (mp.exp(y) - y - 1)
        return -mp.sign(y) * mp.sqrt(k2 * g)

    def qit(y):
        if not charged:
            return mp.mpf(0)
        ns, ps = n * mp.exp(y), p * mp.exp(-y)

        def integrand(e):
            cn, cp = sn(e) * vth, sp(e) * vth
            n1, p1 = ni * mp.exp(e / Vt), ni * mp.exp(-e / Vt)
            den = cn * (ns + n1) + cp * (ps + p1)
            if e > neutral:
                return -dit(e) * (cn * ns + cp * p1) / den
            return dit(e) * (cn * n1 + cp * ps) / den
        return mp.quad(integrand, pts)

    F = lambda y: Qf + qit(y) + qs(y)
    # bracket then bisect to 1e-8, then a bracketing secant (Anderson-Bjorck) to full precision
    if F(0) == 0:
        y = mp.mpf(0)
    else:
        s = 1 if F(0) > 0 else -1
        lo, hi = mp.mpf(0), mp.mpf(s)
        while (F(hi) > 0) == (F(0) > 0):
            lo, hi = hi, 2 * hi
        for _ in range(20):
            mid = (lo + hi) / 2
            if (F(mid) > 0) == (F(lo) > 0):
                lo = mid
            else:
                hi = mid
        y = mp.findroot(F, (lo, hi), solver='anderson', tol=mp.mpf(10) ** (-30), verify=False)
        assert abs(F(y)) <= mp.mpf(10) ** (-15) * (abs(Qf) + abs(qs(y))), F(y)
    ns, ps = n * mp.exp(y), p * mp.exp(-y)

    def rate(e):
        cn, cp = sn(e) * vth, sp(e) * vth
        n1, p1 = ni * mp.exp(e / Vt), ni * mp.exp(-e / Vt)
        return dit(e) * np_ / ((ns + n1) / cp + (ps + p1) / cn)
    us = mp.quad(rate, pts)
    return y, ns, ps, qit(y), qs(y), us, us / dn, q * us * ni * ni / np_


print('case,y,ns,ps,Qit,Qs,Us,Seff,J0s')
for c in CASES:
    r = solve(*c[1:])
    print(c[0] + ',' + ','.join(mp.nstr(v, 17, min_fixed=1, max_fixed=0) for v in r), flush=True)
