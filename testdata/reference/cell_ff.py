#!/usr/bin/python3
"""Reference fill factors of the single-diode cell for pvrec/cell tests, computed with mpmath
at 40 significant digits.

Run with Debian's python3 (python3-mpmath):  make reference (or from the repository root:
/usr/bin/python3 testdata/reference/cell_ff.py > testdata/reference/cell_ff.csv)

In normalised units (u = qV/kT, j = J/Jph, j0 = J0/Jph = 1/expm1(voc), r = Rs Jph/(kT/q) =
rs voc with rs = Rs Jph/Voc, the series resistance in units of the characteristic resistance
Voc/Jph), the single-diode cell J = Jph - J0 (exp(q(V + J Rs)/kT) - 1) has the explicit
terminal voltage u(j) = ln((1 + j0 - j)/j0) - j r (W. Shockley, Bell Syst. Tech. J. 28, 435
(1949), with a lumped series resistance; e.g. M. A. Green, Solar Cells: Operating Principles,
Technology and System Applications, Prentice-Hall 1982).

ideal rows (rs = 0): u_mp = W(e^(voc + 1)) - 1 with the Lambert function W (mpmath.lambertw),
  j_mp = 1 - expm1(u_mp)/expm1(voc), ff = u_mp j_mp / voc.
rs rows: j_mp solves d(j u(j))/dj = u(j) - j/(1 + j0 - j) - j r = 0 in (0.5, 1) and the
  terminal short-circuit current j_sc solves u(j) = 0 in (0, 1); ff = j_mp u(j_mp)/(voc j_sc).

Columns: kind, voc (normalised Voc), rs, ff, vmp (normalised u_mp), jmp (J_mp/Jph), jsc (J_sc/Jph).
"""
from mpmath import mp, mpf, exp, expm1, log, lambertw, findroot

mp.dps = 40

print("kind,voc,rs,ff,vmp,jmp,jsc")
for voc in ["10", "12", "15", "20", "27", "30", "40"]:
    v = mpf(voc)
    um = lambertw(exp(v + 1)).real - 1
    jm = 1 - expm1(um) / expm1(v)
    print("ideal,%s,0,%s,%s,%s,1" % (voc, mp.nstr(um * jm / v, 25), mp.nstr(um, 25), mp.nstr(jm, 25)))
    for rs in ["0.02", "0.05", "0.1", "0.2", "0.3", "0.4"]:
        j0 = 1 / expm1(v)
        r = mpf(rs) * v
        u = lambda j: log((1 + j0 - j) / j0) - j * r
        jm = findroot(lambda j: u(j) - j / (1 + j0 - j) - j * r, (mpf("0.5"), mpf(1)), solver="anderson")
        jsc = findroot(u, (mpf(0), mpf(1)), solver="anderson")
        ff = jm * u(jm) / (v * jsc)
        print("rs,%s,%s,%s,%s,%s,%s" % (voc, rs, mp.nstr(ff, 25), mp.nstr(u(jm), 25), mp.nstr(jm, 25), mp.nstr(jsc, 25)))
