"""Invented test scenario shared by the coil tests (Harrowgate Forge Ltd, part HF-2210).

Also independent routes used by several test files: formulas written here from their
published form, not taken from heatcalc.
"""

import numpy as np
from scipy import special
from scipy.constants import mu_0, pi

from heatcalc.coil import (
    CylinderWorkpiece,
    RectangularTube,
    RoundTube,
    SlabWorkpiece,
    SolenoidCoil,
    TubeWorkpiece,
)

# Copper coil resistivity at about 40 degC (annealed copper 1.7241e-8 at 20 degC, IEC 60028,
# raised by alpha = 0.00393 /K over 20 K); a plausible figure for a water-cooled coil.
RHO_COPPER = 1.7241e-8 * (1.0 + 0.00393 * 20.0)
# Plain carbon steel above the Curie temperature, about 1.1-1.2 micro-ohm m (BISRA 1953).
RHO_HOT_STEEL = 1.2e-6

TUBE_20x12 = RectangularTube(axial_width=0.020, radial_depth=0.012, wall=0.0015)


def billet_coil(turns=12, length=0.3, inner_diameter=0.14, conductor=TUBE_20x12):
    """Coil for a 100 mm billet heater (invented)."""
    return SolenoidCoil(turns, length, inner_diameter, conductor, RHO_COPPER)


def hot_billet(length=0.3, radius=0.05):
    return CylinderWorkpiece(radius=radius, length=length, resistivity=RHO_HOT_STEEL)


def round_tube_coil(turns=8, length=0.2, inner_diameter=0.08):
    return SolenoidCoil(turns, length, inner_diameter, RoundTube(0.01, 0.001), RHO_COPPER)


def steel_tube(length=0.2):
    return TubeWorkpiece(0.03, 0.025, length, RHO_HOT_STEEL)


def plate(length=0.5):
    return SlabWorkpiece(0.02, 0.3, length, RHO_HOT_STEEL)


def delta(rho, f, mu_r=1.0):
    """Skin depth sqrt(2 rho / (omega mu_0 mu_r)) (Davies 1990, ch. 2)."""
    return np.sqrt(2.0 * rho / (2.0 * pi * f * mu_0 * mu_r))


def cylinder_zs_bessel(radius, rho, f, mu_r=1.0):
    """Surface impedance of a solid cylinder by complex Bessel functions (independent route).

    H_z = H0 J0(k r)/J0(k a) with k = (1 - j)/delta solves the diffusion equation for
    exp(j omega t); E_phi = rho J_phi and Z_s = -rho k J1(k a)/J0(k a), which tends to
    (1 + j) rho/delta for a thick cylinder (CHECKS.md: Re[k delta J1/J0] route).
    """
    d = delta(rho, f, mu_r)
    k = (1.0 - 1.0j) / d
    # exponentially scaled jve: the common factor exp(-|Im z|) cancels in the ratio
    return -rho * k * special.jve(1, k * radius) / special.jve(0, k * radius)
