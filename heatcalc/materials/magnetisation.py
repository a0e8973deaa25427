"""Magnetisation model of ferromagnetic steels: saturation against temperature, B-H curve.

Notes
-----
Saturation polarisation against temperature after Kuz'min's shape function

.. math:: J_s(T) = J_{s0}\\,\\left(1 - s\\,\\tau^{3/2} - (1-s)\\,\\tau^{p}\\right)^{1/3},
          \\quad \\tau = T / T_c,

zero at and above the Curie temperature :math:`T_c`. The anhysteretic curve is an arctangent:

.. math:: B = \\mu_0 H + J_s \\frac{2}{\\pi}
          \\arctan\\!\\left(\\frac{\\pi(\\mu_i - 1)\\mu_0 H}{2 J_s}\\right),

with small-field slope :math:`\\mu_i\\mu_0` and saturation :math:`J_s`. The effective relative
permeability for a sinusoidal field of peak amplitude :math:`H` is taken as
:math:`\\mu_r = B(H)/(\\mu_0 H)` (the amplitude permeability), a common engineering
simplification; hysteresis loss is neglected beside eddy-current loss. The small-field
permeability is held constant up to the Curie temperature (the Hopkinson peak is ignored).

References
----------
M. D. Kuz'min, "Shape of temperature dependence of spontaneous magnetization of ferromagnets:
quantitative analysis", Phys. Rev. Lett. 94, 107204 (2005).
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np
from scipy.constants import mu_0

__all__ = ["MagnetisationModel"]


@dataclass(frozen=True)
class MagnetisationModel:
    """Temperature-dependent anhysteretic B-H model of a ferromagnetic material.

    Parameters
    ----------
    curie_temperature : float [K]
    saturation_flux_density : float [T]
        Saturation polarisation :math:`J_{s0}` at low temperature.
    initial_relative_permeability : float [-]
        Small-field relative permeability :math:`\\mu_i` (> 1).
    kuzmin_s, kuzmin_p : float [-]
        Shape parameters of :math:`J_s(T)` (iron: s = 0.35, p = 4, after Kuz'min 2005).

    Examples
    --------
    >>> m = MagnetisationModel(1043.0, 2.1, 400.0)
    >>> round(float(m.relative_permeability(1.0, 293.15)), 1)
    400.0
    >>> float(m.relative_permeability(1e4, 1100.0))
    1.0
    """

    curie_temperature: float
    saturation_flux_density: float
    initial_relative_permeability: float
    kuzmin_s: float = 0.35
    kuzmin_p: float = 4.0

    def __post_init__(self):
        for name in ("curie_temperature", "saturation_flux_density"):
            v = getattr(self, name)
            if not (np.isfinite(v) and v > 0):
                raise ValueError(f"{name}={v!r} must be a positive number")
        if not self.initial_relative_permeability > 1:
            raise ValueError(
                f"initial_relative_permeability={self.initial_relative_permeability!r} "
                "must be greater than 1"
            )
        if not (0 <= self.kuzmin_s < 2.5 and self.kuzmin_p > 1.5):
            raise ValueError(
                f"kuzmin_s={self.kuzmin_s!r}, kuzmin_p={self.kuzmin_p!r} out of the model's "
                "range (0 <= s < 5/2, p > 3/2)"
            )

    def saturation(self, temperature):
        """Saturation polarisation :math:`J_s(T)` [T]; zero at and above the Curie point."""
        tau = np.asarray(temperature, dtype=float) / self.curie_temperature
        if np.any(tau < 0):
            raise ValueError(f"temperature={temperature!r} must be in kelvin (>= 0)")
        s, p = self.kuzmin_s, self.kuzmin_p
        tau_c = np.minimum(tau, 1.0)  # the shape function is only defined up to T_c
        inner = 1.0 - s * tau_c**1.5 - (1.0 - s) * tau_c**p
        js = self.saturation_flux_density * np.cbrt(np.maximum(inner, 0.0))
        return np.where(tau >= 1.0, 0.0, js)

    def flux_density(self, h_peak, temperature):
        """Peak flux density :math:`B(H)` [T] for peak field `h_peak` [A/m]."""
        h = np.asarray(h_peak, dtype=float)
        if np.any(h < 0):
            raise ValueError(f"h_peak={h_peak!r} must be >= 0 (a field amplitude)")
        js = self.saturation(temperature)
        x = np.pi * (self.initial_relative_permeability - 1.0) * mu_0 * h
        with np.errstate(divide="ignore", invalid="ignore"):
            j = np.where(js > 0, js * (2 / np.pi) * np.arctan(x / (2 * np.where(js > 0, js, 1))), 0)
        return mu_0 * h + j

    def relative_permeability(self, h_peak, temperature):
        """Amplitude relative permeability :math:`B/(\\mu_0 H)` [-] (>= 1).

        At zero field the limit :math:`\\mu_i` is returned below the Curie temperature.
        """
        h = np.asarray(h_peak, dtype=float)
        if np.any(h < 0):
            raise ValueError(f"h_peak={h_peak!r} must be >= 0 (a field amplitude)")
        js = np.asarray(self.saturation(temperature))
        mu_i = self.initial_relative_permeability
        # x = arctan argument; mu_r - 1 = (mu_i - 1) * arctan(x)/x, with the x -> 0 limit 1.
        with np.errstate(divide="ignore", invalid="ignore"):
            x = np.pi * (mu_i - 1.0) * mu_0 * h / (2 * np.where(js > 0, js, 1.0))
            ratio = np.where(x > 1e-8, np.arctan(x) / np.where(x > 1e-8, x, 1.0), 1.0 - x**2 / 3)
        mu = 1.0 + (mu_i - 1.0) * ratio
        out = np.where(js > 0, mu, 1.0)
        return float(out) if out.ndim == 0 else out
