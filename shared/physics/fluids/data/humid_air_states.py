"""Humid-air states from the IAPWS humid-air formulation, shared by generate_humid_air.py
(the shipped table) and tests/fixtures/humid_air_reference.py (off-grid check points).

Thermodynamics (rho, cp, beta at fixed composition): IAPWS G8-10 (2010), "Guideline on an
Equation of State for Humid Air in Contact with Seawater and Ice" (Feistel et al.), as
implemented by iapws.humidAir (dry air: Lemmon et al. 2000; water vapour: IAPWS-95;
air-water interaction: second and third cross virial coefficients).

Saturation: the vapour mole fraction x_sat(T, p) of air in equilibrium with liquid water
(chemical potentials equal, so the enhancement factor is included), solved here by
bracketing just above Raoult's law, because iapws' own solver starts from A = 0.95 and
fails below about 300 K. Relative humidity follows the WMO definition phi = x_w / x_sat. Where liquid
water would boil at p (T >= T_b(p)), no air can stay saturated and x_sat = 1: phi = 100 %
is then pure steam.

Transport (iapws.humidAir gives none): Wilke (J. Chem. Phys. 18, 517, 1950) for mu and the
Wassiljewa form with the Mason & Saxena (Phys. Fluids 1, 361, 1958) coefficients
A_ij = 1.065 Phi_ij (Wilke's Phi_ij) for k, over dry air (Lemmon & Jacobsen 2004) and
water vapour (IAPWS 2008 viscosity, IAPWS 2011 conductivity), each at its partial density.
"""

import math

from iapws import IAPWS95
from iapws._iapws import _ThCond, _Viscosity
from iapws.humidAir import Air, HumidAir
from iapws.iapws97 import _PSat_T
from scipy.optimize import brentq

M_W = 18.015268  # g/mol, IAPWS-95
M_A = 28.96546  # g/mol, IAPWS G8-10 dry air
R = 8.314472  # J/(mol K), as in iapws.humidAir
MASON_SAXENA_EPSILON = 1.065

_HA = HumidAir()


def mass_fraction_air(x_w):
    """A (kg dry air per kg humid air) from the vapour mole fraction."""
    x_a = 1.0 - x_w
    return x_a * M_A / (x_a * M_A + x_w * M_W)


def boiling_temperature(p_mpa):
    return IAPWS95(P=p_mpa, x=0).T


def saturation_mole_fraction(T, p_mpa):
    """x_sat(T, p): vapour mole fraction of saturated humid air; 1 at and above T_b(p)."""
    # IAPWS-95 saturation pressure; below the triple point (273.16 K) the IF97 saturation
    # equation, which holds down to 273.15 K (supercooled liquid for 0.01 K).
    p_sat = IAPWS95(T=T, x=0).P if T >= 273.16 else _PSat_T(T)
    if p_sat >= p_mpa:
        return 1.0
    g_liquid = IAPWS95(T=T, P=p_mpa).g
    x0 = p_sat / p_mpa

    def residual(x_w):
        A = mass_fraction_air(x_w)
        rho = _gas_density(T, p_mpa, A)
        f = _HA._fav(T, rho, A)
        return g_liquid - (f["fir"] + rho * f["fird"] - A * f["fira"])

    # The enhancement factor is a few per mille: the root lies close above Raoult's x0.
    x_w = brentq(residual, 0.9 * x0, min(1.2 * x0, 1 - 1e-9), xtol=1e-15, rtol=1e-13)
    if abs(residual(x_w)) > 1e-8:
        raise RuntimeError(f"no saturation state at T={T} K, p={p_mpa} MPa")
    return x_w


def _gas_density(T, p_mpa, A):
    """Gas root of p(T, rho, A) = p, bracketed around the ideal-gas value."""
    x_w = 1.0 - (A * M_W / M_A / (1 - A * (1 - M_W / M_A)))
    rho_ideal = p_mpa * 1e6 * (x_w * M_W + (1 - x_w) * M_A) * 1e-3 / (R * T)

    def f(rho):
        return rho**2 * _HA._fav(T, rho, A)["fird"] / 1000.0 - p_mpa

    return brentq(f, 0.9 * rho_ideal, 1.1 * rho_ideal, xtol=1e-14, rtol=1e-14)


def _wilke_phi(mu_i, mu_j, M_i, M_j):
    return (1 + (mu_i / mu_j) ** 0.5 * (M_j / M_i) ** 0.25) ** 2 / (8 * (1 + M_i / M_j)) ** 0.5


def mixture_transport(x_w, mu_a, k_a, mu_w, k_w):
    """Wilke mu and Mason-Saxena k of the two-component gas."""
    x = [1.0 - x_w, x_w]
    mu = [mu_a, mu_w]
    k = [k_a, k_w]
    M = [M_A, M_W]
    mu_mix = 0.0
    k_mix = 0.0
    for i in range(2):
        if x[i] == 0:
            continue
        den_mu = 0.0
        den_k = 0.0
        for j in range(2):
            phi = 1.0 if i == j else _wilke_phi(mu[i], mu[j], M[i], M[j])
            den_mu += x[j] * phi
            den_k += x[j] * (1.0 if i == j else MASON_SAXENA_EPSILON * phi)
        mu_mix += x[i] * mu[i] / den_mu
        k_mix += x[i] * k[i] / den_k
    return mu_mix, k_mix


def state(T, p_mpa, phi, x_sat=None):
    """[rho kg/m^3, cp J/(kg K), mu Pa s, k W/(m K), beta 1/K, x_w] of humid air."""
    if x_sat is None:
        x_sat = saturation_mole_fraction(T, p_mpa)
    x_w = phi * x_sat
    if x_w > 1 - 1e-12:
        # Pure steam (phi = 100 % at or above the boiling point at p).
        s = IAPWS95(T=T, P=p_mpa)
        if s.rho > 50:
            raise RuntimeError(f"steam at T={T} K, p={p_mpa} MPa is liquid")
        return [s.rho, s.cp * 1e3, s.mu, s.k, s.alfav, 1.0]
    A = mass_fraction_air(x_w)
    rho = _gas_density(T, p_mpa, A)
    prop = _HA._prop(T, rho, _HA._fav(T, rho, A))
    if abs(prop["P"] / p_mpa - 1) > 1e-10:
        raise RuntimeError(f"pressure not met at T={T}, p={p_mpa}, phi={phi}")
    rho_a = A * rho
    rho_w = (1 - A) * rho
    air = Air(T=T, rho=rho_a)
    mu_a, k_a = air.mu, air.k
    if rho_w > 0:
        mu_w = _Viscosity(rho_w, T)
        k_w = _ThCond(rho_w, T)
    else:
        mu_w, k_w = 1.0, 1.0  # unused: x_w = 0
    mu, k = mixture_transport(x_w, mu_a, k_a, mu_w, k_w)
    return [rho, prop["cp"] * 1e3, mu, k, prop["alfav"], x_w]
