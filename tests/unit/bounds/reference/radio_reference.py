"""Independent high-precision values for tests/unit/bounds/radio-accuracy.test.ts (mpmath, 40 digits).

Computed from the definitions, not from the engine's code: theta_n from mpmath's regularised
incomplete beta and findroot; Shannon's 1959 bound as the integral over V ~ chi_{n-1} of
Phi(V cot theta - s), with the chi density from log-gamma and mpmath's quadrature; the energy
converse in closed form; M-ary orthogonal signalling by quadrature. Run: python3 radio_reference.py
"""
from mpmath import mp, mpf, betainc, quad, exp, log, sqrt, loggamma, ncdf, erfc, cos, sin, pi, log10, inf

mp.dps = 40


def cot_theta(dims, k):
    a = mpf(dims - 1) / 2
    target = mpf(2) ** (1 - k)
    f = lambda t: log(betainc(a, mpf(1) / 2, 0, sin(t) ** 2, regularized=True)) - log(target)
    lo, hi = mpf(0), pi / 2
    for _ in range(200):  # bisection: robust, slow, careful
        mid = (lo + hi) / 2
        if f(mid) > 0:
            hi = mid
        else:
            lo = mid
    t = (lo + hi) / 2
    return cos(t) / sin(t)


def log_spb(dims, k, ebn0_db):
    s = sqrt(2 * k * mpf(10) ** (mpf(ebn0_db) / 10))
    c = cot_theta(dims, k)
    m = dims - 1  # degrees of freedom of V
    lnc = -(mpf(m) / 2 - 1) * log(2) - loggamma(mpf(m) / 2)
    g = lambda v: (m - 1) * log(v) - v * v / 2 + lnc + log(ncdf(c * v - s))
    # peak of the log-concave integrand by golden-section search, then quadrature around it
    lo, hi = mpf("1e-6"), sqrt(mpf(m)) + s + 50
    for _ in range(300):
        a, b = lo + (hi - lo) * mpf("0.381966"), lo + (hi - lo) * mpf("0.618034")
        if g(a) < g(b):
            lo = a
        else:
            hi = b
    v0 = (lo + hi) / 2
    top = g(v0)
    pts = [max(mpf("1e-12"), v0 - 12 + i) for i in range(25)]
    val = quad(lambda v: exp(g(v) - top), pts)
    return (top + log(val)) / log(10)


def root_of_decreasing(f, lo, hi, steps):
    """Bisection for the root of a decreasing function on [lo, hi]."""
    for _ in range(steps):
        mid = (lo + hi) / 2
        if f(mid) > 0:
            lo = mid
        else:
            hi = mid
    return (lo + hi) / 2


def spb_inverse_db(dims, k, eps):
    return root_of_decreasing(lambda db: log_spb(dims, k, db) - log10(mpf(eps)), mpf(-5), mpf(15), 70)


def qinv(p):
    return root_of_decreasing(lambda x: log(erfc(x / sqrt(2)) / 2) - log(p), mpf(-40), sqrt(-2 * log(p)) + 5, 200)


def energy_converse_db(k, eps):
    a = qinv(mpf(2) ** (-k)) + qinv(mpf(eps))
    return 10 * log10(a * a / 2 / k)


def orthogonal_log10(k, a):
    M1 = mpf(2) ** k - 1
    f = lambda z: exp(-(z - a) ** 2 / 2) / sqrt(2 * pi) * -mp.expm1(M1 * mp.log1p(-erfc(z / sqrt(2)) / 2))
    return log10(quad(f, [-inf, a - 10, a - 5, a, a + 5, a + 10, inf]))


def orthogonal_inverse_db(k, eps):
    a = root_of_decreasing(lambda a: orthogonal_log10(k, a) - log10(mpf(eps)), mpf(0), mpf(60), 70)
    return 10 * log10(a * a / 2 / k)


if __name__ == "__main__":
    import sys
    parts = sys.argv[1:] or ["spb", "conv", "orth", "thermal"]
    for dims, k, db in [(16, 8, 4), (128, 64, 3), (1024, 512, 1), (1024, 512, 2), (2048, 1024, 3), (8192, 7168, 5)]:
        if "spb" in parts: print("spb", dims, k, db, mp.nstr(log_spb(dims, k, db), 17))
    for dims, k, eps in [(128, 64, "1e-3"), (1024, 512, "1e-4"), (2048, 1024, "1e-10")]:
        if "spb" in parts: print("spbinv", dims, k, eps, mp.nstr(spb_inverse_db(dims, k, eps), 15))
    for k, eps in [(1, "1e-5"), (160, "1e-2"), (1000, "1e-3"), (100000, "1e-3"), (1000000, "1e-3")]:
        if "conv" in parts: print("conv", k, eps, mp.nstr(energy_converse_db(k, eps), 15))
    for k, eps in [(1, "1e-3"), (10, "1e-3"), (160, "1e-2")]:
        if "orth" in parts: print("orth", k, eps, mp.nstr(orthogonal_inverse_db(k, eps), 15))
    if "thermal" in parts: print("thermal", mp.nstr(10 * log10(mpf("1.380649e-23") * 290 / mpf("1e-3")), 20))
