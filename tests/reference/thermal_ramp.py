"""Reference for RunWatch's thermal integrator: the integral of exp(-Ea/(kB*T(t))) over a linear ramp
T(t) = T0 + beta*t, by adaptive quadrature (scipy.integrate.quad) and by the E1 closed form with scipy.special.exp1.

Usage: thermal_ramp.py EA_EV T0_K BETA_K_PER_S DURATION_S [...more quadruples]
Prints one line per ramp: "<quad> <closed_form>" with 17 significant digits.
"""
import math
import sys

from scipy import integrate, special

KB_EV_PER_K = 1.380649e-23 / 1.602176634e-19  # 2019 SI, exact quotient


def closed_form(a, t0, beta, duration):
    def f(temperature):
        x = a / temperature
        # F(T) = T*exp(-x) - a*E1(x), written as T*exp(-x)*(1 - x*exp(x)*E1(x)) to avoid cancellation.
        return temperature * math.exp(-x) * (1.0 - x * special.exp1(x) * math.exp(x)) if x < 700 else 0.0
    return (f(t0 + beta * duration) - f(t0)) / beta


def main(args):
    values = [float(v) for v in args]
    for i in range(0, len(values), 4):
        ea, t0, beta, duration = values[i:i + 4]
        a = ea / KB_EV_PER_K
        quad, _ = integrate.quad(lambda t: math.exp(-a / (t0 + beta * t)), 0.0, duration,
                                 epsabs=0.0, epsrel=1e-13, limit=500)
        print(f"{quad:.17g} {closed_form(a, t0, beta, duration):.17g}")


if __name__ == "__main__":
    main(sys.argv[1:])
