#!/usr/bin/python3
"""Reference values for the pvrec/silicon tests, computed with mpmath at 40 digits.

Run from the repository root with Debian's python3-mpmath (or: make reference):

    /usr/bin/python3 testdata/reference/silicon_statistics.py > testdata/reference/silicon_statistics.csv

The models are evaluated from their defining formulas, independently of the Go code:
Pässler 2002 band gap (R. Pässler, Phys. Rev. B 66, 085201 (2002)) with the Si parameters of
NewPassler2002, Green 1990 densities of states (M. A. Green, J. Appl. Phys. 67, 2944 (1990)),
Couderc 2014 intrinsic density (R. Couderc, M. Amara, M. Lemiti, J. Appl. Phys. 115, 093705
(2014)), no band-gap narrowing, complete ionisation. Equilibrium rows solve charge neutrality
n0 - p0 = Nd - Na with n0 = Nc F(eta_n), p0 = Nv F(eta_p), eta_n + eta_p = -ln(Nc Nv / ni^2),
F = exp (Boltzmann) or F_{1/2} (Fermi-Dirac, normalised so F -> e^eta as eta -> -inf), by
mpmath.findroot on the reduced Fermi level of the majority band. NiEff rows give
ni * sqrt(gamma_n gamma_p), gamma = F_{1/2}(eta)/e^eta with N = Nc F_{1/2}(eta).
"""
import mpmath as mp

mp.mp.dps = 40
K = mp.mpf('1.380649e-23') / mp.mpf('1.602176634e-19')  # k/q, eV/K (exact SI)


def passler(T):
    E0, a, th, D = mp.mpf('1.1701'), mp.mpf('3.23e-4'), mp.mpf(446), mp.mpf('0.51')
    x = 2 * T / th
    poly = 1 + mp.pi**2 / (3 * (1 + D**2)) * x**2 + (3 * D**2 - 1) / 4 * x**3 + mp.mpf(8) / 3 * x**4 + x**6
    return E0 - a * th * ((1 - 3 * D**2) / (mp.exp(th / T) - 1) + 3 * D**2 / 2 * (poly ** (mp.mpf(1) / 6) - 1))


def dos(T):
    r = T / 300
    return mp.mpf('2.86e19') * r ** mp.mpf('1.58'), mp.mpf('3.10e19') * r ** mp.mpf('1.85')


def ni(T):
    return mp.mpf('1.541e15') * T ** mp.mpf('1.712') * mp.exp(-passler(T) / (2 * K * T))


def f_half(eta):
    """F_{1/2}(eta) = -Li_{3/2}(-e^eta): alternating series for eta < -1, quadrature otherwise."""
    if eta < -1:
        x = mp.exp(eta)
        return mp.nsum(lambda k: (-1) ** (k + 1) * x**k / k ** mp.mpf(1.5), [1, mp.inf])
    g = lambda t: mp.sqrt(t) / (1 + mp.exp(t - eta))
    pts = [0, eta, eta + 40, mp.inf] if eta > 0 else [0, 40, mp.inf]
    return mp.quad(g, pts) / mp.gamma(mp.mpf(1.5))


def inv_half(y):
    eta0 = mp.log(y) if y < 1 else (y * mp.gamma(mp.mpf(2.5))) ** (mp.mpf(2) / 3)
    return mp.findroot(lambda e: f_half(e) - y, eta0)


def equilibrium(T, nd, na, stat):
    nc, nv = dos(T)
    n_i = ni(T)
    g = mp.log(nc * nv / n_i**2)
    F = mp.exp if stat == 'B' else f_half
    net = nd - na
    if net >= 0:
        maj, mn = nc, nv
    else:
        maj, mn, net = nv, nc, -net
    nb = net / 2 + mp.sqrt(net**2 / 4 + n_i**2)
    h = lambda e: (maj * F(e) - mn * F(-g - e) - net) / nb
    eta = mp.findroot(h, mp.log(nb / maj))
    a, b = maj * F(eta), mn * F(-g - eta)
    return (a, b) if nd - na >= 0 else (b, a)


def gamma(y):
    return y / mp.exp(inv_half(y))


def main():
    print('# kind,T_K,a,b,stat,x,y  (eg: x = Eg eV; ni: x = ni; eq: a = Nd, b = Na, x = n0, y = p0; nieff: a = n, b = p, x = NiEff; cm^-3)')
    for T in ['77', '200', '250', '300', '350', '400', '500']:
        print('eg,%s,0,0,-,%s,0' % (T, mp.nstr(passler(mp.mpf(T)), 20)))
    for T in ['200', '250', '300', '350', '400', '500']:
        print('ni,%s,0,0,-,%s,0' % (T, mp.nstr(ni(mp.mpf(T)), 20)))
    cases = [
        ('300', '1e15', '0', 'FD'), ('300', '1e18', '0', 'FD'), ('300', '1e19', '0', 'FD'),
        ('300', '1e20', '0', 'FD'), ('300', '3e20', '0', 'FD'), ('300', '0', '1e20', 'FD'),
        ('300', '0', '1e16', 'FD'), ('300', '2e19', '1e19', 'FD'), ('300', '0', '0', 'FD'),
        ('300', '1e16', '1e16', 'FD'), ('350', '1e19', '0', 'FD'), ('250', '0', '5e19', 'FD'),
        ('300', '1e20', '0', 'B'), ('300', '0', '1e16', 'B'), ('300', '1e12', '0', 'B'),
    ]
    for T, nd, na, st in cases:
        n0, p0 = equilibrium(mp.mpf(T), mp.mpf(nd), mp.mpf(na), st)
        print('eq,%s,%s,%s,%s,%s,%s' % (T, nd, na, st, mp.nstr(n0, 20), mp.nstr(p0, 20)))
    for T, n, p in [('300', '2e16', '1e10'), ('300', '1e20', '1e3'), ('300', '1e19', '1e19'), ('300', '1e15', '1e17'), ('300', '5e17', '2e5')]:
        nc, nv = dos(mp.mpf(T))
        v = ni(mp.mpf(T)) * mp.sqrt(gamma(mp.mpf(n) / nc) * gamma(mp.mpf(p) / nv))
        print('nieff,%s,%s,%s,FD,%s,0' % (T, n, p, mp.nstr(v, 20)))


main()
