#!/usr/bin/python3
"""Reference maximum power points of the ideal diode, for the pvrec/lifetime tests (implied fill
factor, JV.MaxPower), computed with mpmath at 40 significant digits.

Run with Debian's python3-mpmath (make reference, or from the repository root):

    /usr/bin/python3 testdata/reference/lifetime_ff.py > testdata/reference/lifetime_ff.csv

For the ideal diode J = Jsc - J0 (exp(v) - 1), v = qV/kT (W. Shockley, Bell Syst. Tech. J. 28,
435 (1949)), with open-circuit voltage voc (Jsc/J0 = exp(voc) - 1), the power v J is largest
where exp(v) (1 + v) = exp(voc), that is 1 + vm = W0(exp(1 + voc)) with W0 the principal branch
of Lambert's W function (mpmath.lambertw). The fill factor is
FF = vm (1 - (exp(vm) - 1)/(exp(voc) - 1)) / voc. Columns: voc and vm (in units of kT/q), FF.
"""
import mpmath as mp

mp.mp.dps = 40
print('voc,vm,ff')
for voc in ['10', '15', '20', '25', '28', '30', '32']:
    v = mp.mpf(voc)
    vm = mp.lambertw(mp.e ** (1 + v)).real - 1
    assert abs(mp.e ** vm * (1 + vm) - mp.e ** v) < mp.mpf(10) ** (-30) * mp.e ** v
    ff = vm * (1 - mp.expm1(vm) / mp.expm1(v)) / v
    print('%s,%s,%s' % (voc, mp.nstr(vm, 20), mp.nstr(ff, 20)))
