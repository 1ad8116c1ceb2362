# Generates passive-sphere-mpmath.csv: probability that a molecule released at distance d from the
# centre of a sphere of radius r is inside it at time t (free-space Green's function integrated over
# the ball). Value: the exact integral
#   P(t) = (erfc(a/s) - erfc(b/s))/2 - s/(2 d sqrt(pi)) (exp(-a^2/s^2) - exp(-b^2/s^2)),
#   a = d - r, b = d + r, s = sqrt(4 D t),
# evaluated with mpmath at 80 digits (the cancellation that troubles doubles costs < 30 digits here),
# cross-checked to 1e-9 relative against mpmath quadrature of the radial form
#   P(t) = 1/(d s sqrt(pi)) * int_0^r rho [exp(-(d-rho)^2/s^2) - exp(-(d+rho)^2/s^2)] drho.
# Run: python3 passive_sphere_reference.py > passive-sphere-mpmath.csv
import mpmath
from mpmath import mp, mpf, exp, sqrt, pi, quad, expm1, nstr, erfc
mp.dps = 80
print("# Source: mpmath %s, exact ball integral at 80 digits, checked by quadrature (passive_sphere_reference.py)"
      % mpmath.__version__)
print("distance_um,radius_um,diffusion_um2_per_s,time_s,inside_probability")
cases = [(100, 5, 80), (20, 5, 80), (6, 5, 80), (1000, 5, 80), (12, 10, 1), (50, 0.5, 500)]
for d, r, D in cases:
    d, r, D = mpf(d), mpf(r), mpf(D)
    for t in ['1e-3', '0.01', '0.03', '0.1', '0.3', '1', '3', '10', '100', '1e4', '1e7']:
        t = mpf(t)
        s = sqrt(4 * D * t)
        a, b = d - r, d + r
        p = (erfc(a / s) - erfc(b / s)) / 2 - s / (2 * d * sqrt(pi)) * (exp(-a * a / s / s) - exp(-b * b / s / s))
        if p < mpf('1e-280'):
            continue
        f = lambda rho: rho * exp(-(d - rho) ** 2 / s ** 2) * -expm1(-4 * rho * d / s ** 2)
        width = min(r, s * s / (2 * (d - r)), s)
        pts = sorted(set([r - width * j / 8 for j in range(0, 161) if r - width * j / 8 > 0]
                         + [r * j / 64 for j in range(0, 65)]))
        q = quad(f, pts) / (d * s * sqrt(pi))
        assert abs(p - q) <= mpf('1e-9') * p, (d, r, D, t, p, q)
        print("%s,%s,%s,%s,%s" % (nstr(d, 17), nstr(r, 17), nstr(D, 17), nstr(t, 17), nstr(p, 20)))
