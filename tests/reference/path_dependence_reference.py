#!/usr/bin/env python3
"""Exact reference values for tests/reference/path_dependence_test.cpp (SymPy, rational arithmetic).

Field F = (y*z, x^2, x*y*z) newtons, positions in metres (not conservative: curl F = (x z, y - y z, 2x - z) != 0).
Paths from (0,0,0) to (1,1,1):
  twisted cubic r(t) = (t, t^2, t^3), t in [0, 1]
  straight segment r(t) = (t, t, t), t in [0, 1]
Run: python3 tests/reference/path_dependence_reference.py
"""
import sympy as sp

t = sp.symbols('t')
x, y, z = sp.symbols('x y z')
F = sp.Matrix([y * z, x**2, x * y * z])


def work(r):
    sub = {x: r[0], y: r[1], z: r[2]}
    integrand = (F.subs(sub).T * sp.diff(r, t))[0]
    return sp.integrate(sp.expand(integrand), (t, 0, 1))


cubic = work(sp.Matrix([t, t**2, t**3]))
line = work(sp.Matrix([t, t, t]))
print('curl F =', [sp.diff(F[2], y) - sp.diff(F[1], z), sp.diff(F[0], z) - sp.diff(F[2], x),
                   sp.diff(F[1], x) - sp.diff(F[0], y)])
print('twisted cubic:', cubic, '=', sp.N(cubic, 20))
print('straight segment:', line, '=', sp.N(line, 20))

# Arc length of the twisted cubic on [0, 1]: integral of sqrt(1 + 4 t^2 + 9 t^4), 30 digits.
import mpmath as mp
mp.mp.dps = 30
print('twisted cubic length:', mp.quad(lambda u: mp.sqrt(1 + 4 * u**2 + 9 * u**4), [0, 1]))
