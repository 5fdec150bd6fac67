#!/usr/bin/python3
"""Reference roots of the fundamental-mode equation of A. B. Sproul, J. Appl. Phys. 76, 2851
(1994), for the pvrec/surface tests, computed with mpmath at 40 significant digits.

Run with Debian's python3-mpmath (make reference, or from the repository root):

    /usr/bin/python3 testdata/reference/surface_sproul.py > testdata/reference/surface_sproul.csv

For a wafer of thickness W, diffusivity D and surface recombination velocities S1, S2, the
fundamental mode decays with 1/tau_s = D alpha^2, where x = alpha W is the root in (0, pi) of

    tan(x) = x (h1 + h2) / (x^2 - h1 h2),   h_i = S_i W / D,

solved here in the pole-free form (x^2 - h1 h2) sin x - (h1 + h2) x cos x = 0 by
mpmath.findroot (Anderson-Bjorck, bracketing) on (0, pi). Columns: h1, h2, x, and
tau_s D / W^2 = 1/x^2.
"""
import mpmath as mp

mp.mp.dps = 40
H = ['1e-6', '1e-3', '0.01', '0.3', '1', '3', '10', '100', '1e4', '1e7']
print('h1,h2,x,tauDW2')
for i, a in enumerate(H):
    for b in ['0'] + H[i:]:
        h1, h2 = mp.mpf(a), mp.mpf(b)
        f = lambda x: (x * x - h1 * h2) * mp.sin(x) - (h1 + h2) * x * mp.cos(x)
        lo = min(mp.pi / 2, mp.sqrt(h1 + h2) / 10)
        while f(lo) >= 0:
            lo /= 16
        x = mp.findroot(f, (lo, mp.pi), solver='anderson', tol=mp.mpf(10) ** (-60), verify=False)
        assert abs(f(x)) < mp.mpf(10) ** (-35) * (1 + h1 * h2 + h1 + h2)
        print('%s,%s,%s,%s' % (a, b, mp.nstr(x, 20), mp.nstr(1 / x ** 2, 20)))
