"""Equivalent circuit of a solenoid coil around a cylinder, tube or plate.

Geometry the model assumes (for cross-checks by field computation)
------------------------------------------------------------------
* The coil is a uniform current sheet at its bore face: round bore of diameter ``D_c``
  (``coil.inner_diameter``) or rectangular bore ``W x H``, axial length ``l_c``
  (``coil.length``, the winding length), ``N`` turns in series carrying the coil current
  ``I`` (RMS). The copper's radial depth does not enter the field model; the current flows
  in the tubing wall that faces the bore (thickness ``t = conductor.wall``), over the
  axial fraction ``k_f = coil.space_factor`` of the length.
* The workpiece is coaxial, axially centred, of heated perimeter ``p_w`` and cross-section
  ``A_w`` (cylinder: ``2 pi a`` and ``pi a**2``; tube: outer radius; plate: both broad faces
  ``2 b`` and ``b d``), of length ``l_w``. The length under the coil is
  ``l_h = min(l_w, l_c)``; any part beyond the coil ends is ignored (no power there, no
  effect on the flux).
* Field fringing at the coil ends, at the workpiece ends and edges, and the pitch of the
  turns are neglected, apart from the return-flux correction below.

Model
-----
Inside a long coil the axial field is uniform, ``H = N I_i / l_c``. The complex power into
the workpiece is ``Z_s H**2 p_w l_h`` (``Z_s`` its surface impedance, :mod:`heatcalc.em`),
and the flux in the air annulus is ``mu_0 H (A_c - A_w)`` over ``l_h`` and ``mu_0 H A_c``
over the rest of the coil. Referred to the coil terminals these are impedances in series:

``Z_i = (N / l_c)**2 [ l_h (p_w Z_s + j omega mu_0 (A_c - A_w)) + (l_c - l_h) j omega mu_0 A_c]``

For the long cylinder filling the coil length this is ``Z_w = N**2 (2 pi a / l_c) Z_s`` plus
the air-gap reactance ``omega mu_0 N**2 (A_c - pi a**2) / l_c``.

Short-coil correction (``method="nagaoka_return_path"``): the flux leaving the coil ends
closes through the space outside it. In a magnetic circuit that return path is a reluctance
in series with the interior; in the electrical circuit it is a reactance ``X_r = omega L_r``
in parallel with ``Z_i``, sized so that the empty coil has Nagaoka's inductance
(:func:`heatcalc.coil.inductance.return_path_inductance`, Nagaoka's coefficient of the
current sheet ``D_c x l_c``; for a rectangular bore the round bore of equal area). The
current through ``Z_i`` is ``I_i = I jX_r / (Z_i + jX_r)`` and the surface field is
``N |I_i| / l_c``. Assumptions: the return-path reluctance is that of the empty coil (the
workpiece changes only the interior), and it is driven by the length-averaged interior
flux. ``method="long_coil"`` drops the correction (``X_r`` infinite).

Permeable workpiece (``method="permeable_return_path"``, the default): the empty-coil return
path is, in demagnetising-factor terms, a permeable core magnetised uniformly, with the
magnetometric factor ``1 - K`` of the coil cylinder. A strongly permeable workpiece is not
magnetised uniformly: its flux leaks out of its sides near its ends and it returns through a
smaller reluctance, that of the workpiece as a permeable rod of its own length ``l_w`` and
round-equivalent diameter ``D_w = sqrt(4 A_w / pi)``. For ``mu -> inf`` an ellipsoid in a
uniform field ``H_a`` carries ``Phi = mu_0 A_w H_a / N_w``, so its return reluctance is
``N_w l_w / (mu_0 A_w)``, with ``N_w`` the demagnetising factor of the prolate spheroid of
axis ratio ``l_w / D_w`` (:func:`ellipsoid_demagnetising_factor`; Osborn 1945). Compared with
the empty-coil return reluctance ``(1 - K)/K l_c / (mu_0 A_c)`` the return reactance is
larger by

``g_inf = ((1 - K) / K) (A_w / A_c) (l_c / l_w) / N_w``.

The return part of an ellipsoid's reluctance grows with its permeability as ``1 - 1/mu``
(``Phi = mu_0 A mu H_a / (1 + N (mu - 1))``); with the interior's flux relative to the empty
coil, ``m = |Z_i| / X_0`` (``X_0 = omega mu_0 N**2 A_c / l_c``) as that permeability, the
return reactance is

``X_r' = X_r [1 + (g_inf - 1)(1 - 1/m)]`` for ``m > 1``, ``X_r' = X_r`` for ``m <= 1``,

which is the empty-coil value for a non-magnetic workpiece (eddy currents only expel flux,
``m <= 1``), so non-magnetic results equal those of ``"nagaoka_return_path"``. The two limits
are derived; the interpolation between them (``1 - 1/m``) is the ellipsoid's, taken over to a
cylinder with an imperfect fill and skin effect, and was checked, not fitted, against an
axisymmetric field solution (docs/fem_validation.md): with a permeable billet (``l_w = l_c``,
``mu_r`` 10 to 100) long coils (``l_c/D_c >= 4``) agree to about 10 % in power and 6 % in
reactance, where the empty-coil return path is up to 58 % low. A permeable workpiece longer
than the coil also carries power and flux beyond the coil ends, which the circuit leaves
out: expect the power low there (see the validation page).

Indicator: ``interior_to_return_ratio = |Z_i| / X_r`` (the method's ``X_r``; for
``"long_coil"`` the empty-coil ``X_r`` that was left out) says how much the end correction
changes the result. Above :data:`END_CORRECTION_WARNING_RATIO` the field computation and the
circuit differ by more than about 10 % and :func:`coil_circuit` emits an
:class:`EndCorrectionWarning`.

The coil conductor adds ``Z_cu = N**2 p_c Z_b / (k_f l_c)`` in series, where ``p_c`` is the
turn length along the bore face and ``Z_b`` the impedance of the backed copper wall
(:func:`heatcalc.coil.conductor.backed_sheet_impedance`: field on the bore face, none behind
it). Leads and bus bars may add a series ``lead_impedance``.

For a required workpiece power ``P_w``: ``I = sqrt(P_w / Re(Z_i || jX_r))``; the coil
voltage is ``I |Z|``. Power balance: ``Re(V I*) = P_w + I**2 Re(Z_cu) + I**2 Re(Z_lead)``.

References
----------
J. Davies and P. Simpson, Induction Heating Handbook, McGraw-Hill, 1979, ch. on coil design
(long-coil circuit referred to the coil; from memory).
R. M. Baker, "Design and calculation of induction-heating coils", AIEE Trans. Part II, 76,
1957 (return-path reactance from Nagaoka's coefficient; from memory).
J. A. Osborn, "Demagnetizing factors of the general ellipsoid", Phys. Rev. 67, 1945, eq. for
the prolate spheroid (from memory).
E. C. Stoner, "The demagnetizing factors for ellipsoids", Phil. Mag. 36, 1945 (from memory).
"""

from __future__ import annotations

import warnings
from dataclasses import dataclass

import numpy as np
import pandas as pd
from scipy.constants import mu_0, pi

from heatcalc import _checks as c
from heatcalc import em
from heatcalc.coil.conductor import backed_sheet_impedance
from heatcalc.coil.geometry import (
    CylinderWorkpiece,
    RectangularSolenoidCoil,
    SlabWorkpiece,
    SolenoidCoil,
    TubeWorkpiece,
)
from heatcalc.coil.inductance import nagaoka, return_path_inductance

__all__ = [
    "END_CORRECTION_METHODS",
    "END_CORRECTION_WARNING_RATIO",
    "EndCorrectionWarning",
    "ellipsoid_demagnetising_factor",
    "end_correction_methods",
    "CoilImpedance",
    "CoilCircuitResult",
    "coil_impedance",
    "coil_circuit",
    "workpiece_power_at_current",
]

END_CORRECTION_METHODS = ("permeable_return_path", "nagaoka_return_path", "long_coil")

#: ``|Z_i| / X_r`` above which the circuit's power may differ from a field solution by more
#: than about 10 % (docs/fem_validation.md, table by the ratio) [-].
END_CORRECTION_WARNING_RATIO = 0.3


class EndCorrectionWarning(UserWarning):
    """The short-coil (end) correction dominates the result; the circuit is uncertain."""


def end_correction_methods() -> tuple[str, ...]:
    """Names accepted by the ``method`` argument of :func:`coil_impedance`.

    Examples
    --------
    >>> end_correction_methods()
    ('permeable_return_path', 'nagaoka_return_path', 'long_coil')
    """
    return END_CORRECTION_METHODS


def ellipsoid_demagnetising_factor(aspect_ratio):
    """Demagnetising factor along the axis of a spheroid (ellipsoid of revolution).

    Parameters
    ----------
    aspect_ratio : float or array [-]
        Axial length over diameter ``gamma = l / D``, > 0 (> 1 prolate, < 1 oblate).

    Returns
    -------
    float or array [-]
        ``N`` in (0, 1); ``H_inside = H_a - N M``.

    Raises
    ------
    ValueError
        If aspect_ratio is not finite and > 0.

    Notes
    -----
    Prolate (``gamma > 1``): ``N = [gamma arccosh(gamma) / sqrt(gamma**2 - 1) - 1] /
    (gamma**2 - 1)``; oblate (``gamma < 1``): ``N = [1 - gamma arccos(gamma) /
    sqrt(1 - gamma**2)] / (1 - gamma**2)``; the sphere ``1/3`` (limit of both; near it a
    series in the eccentricity squared is used). Long limit
    ``(ln(2 gamma) - 1) / gamma**2``. Exact for an ellipsoid; for a cylinder of the same
    ``l/D`` a common approximation of the factor of a highly permeable rod.

    References
    ----------
    J. A. Osborn, "Demagnetizing factors of the general ellipsoid", Phys. Rev. 67, 1945
    (from memory).

    Examples
    --------
    >>> round(float(ellipsoid_demagnetising_factor(10.0)), 5)
    0.02029
    """
    g = np.asarray(c.positive("aspect_ratio", aspect_ratio, "-"), dtype=float)
    # Near the sphere both closed forms are 0/0; there N = S(e2) / gamma**2 with
    # e2 = 1 - 1/gamma**2 (eccentricity squared, < 0 for oblate) and
    # S(x) = sum_k x**k / (2k + 3) (series of (atanh(e) - e)/e**3), 30 terms for |e2| < 0.2.
    e2 = 1.0 - 1.0 / (g * g)
    near = np.abs(e2) < 0.2
    x = np.where(near, e2, 0.0)
    series = sum(x**k / (2 * k + 3) for k in range(30)) / (g * g)
    safe = np.where(near, 2.0, g)  # keep the closed forms away from their 0/0 point
    ds = safe * safe - 1.0
    root = np.sqrt(np.abs(ds))
    prolate = (safe * np.arccosh(np.maximum(safe, 1.0)) / root - 1.0) / ds
    oblate = (1.0 - safe * np.arccos(np.minimum(safe, 1.0)) / root) / (-ds)
    value = np.where(near, series, np.where(safe > 1.0, prolate, oblate))
    return c.scalar_or_array(value)


def _check_coil(coil) -> None:
    if not isinstance(coil, SolenoidCoil | RectangularSolenoidCoil):
        raise ValueError(f"coil must be a SolenoidCoil or RectangularSolenoidCoil; got {coil!r}")


def _check_fit(coil, workpiece) -> None:
    if workpiece is None:
        return
    if not isinstance(workpiece, CylinderWorkpiece | TubeWorkpiece | SlabWorkpiece):
        raise ValueError(
            "workpiece must be a CylinderWorkpiece, TubeWorkpiece, SlabWorkpiece or None; "
            f"got {workpiece!r}"
        )
    if isinstance(workpiece, SlabWorkpiece):
        half = (workpiece.width / 2.0, workpiece.thickness / 2.0)
    else:
        r = workpiece.radius if isinstance(workpiece, CylinderWorkpiece) else workpiece.outer_radius
        half = (r, r)
    if isinstance(coil, SolenoidCoil):
        reach = float(np.hypot(*half)) if isinstance(workpiece, SlabWorkpiece) else half[0]
        fits = reach < coil.inner_diameter / 2.0
        bore = f"inner_diameter {coil.inner_diameter!r} m"
    else:
        fits = half[0] < coil.bore_width / 2.0 and half[1] < coil.bore_height / 2.0
        bore = f"bore {coil.bore_width!r} m x {coil.bore_height!r} m"
    if not fits:
        raise ValueError(f"workpiece must fit inside the coil bore ({bore}); got {workpiece!r}")


@dataclass(frozen=True)
class CoilImpedance:
    """Parts of the coil's equivalent circuit at one or more frequencies [ohm].

    Attributes
    ----------
    frequency : float or array [Hz]
    workpiece : complex or array [ohm]
        Workpiece referred to the coil over the heated length, ``(N/l_c)**2 l_h p_w Z_s``.
    gap_reactance : float or array [ohm]
        Air between workpiece and coil over the heated length.
    empty_bore_reactance : float or array [ohm]
        Coil length not occupied by the workpiece (0 if the workpiece is at least as long).
    return_reactance : float or array [ohm]
        Return-flux path in parallel with the interior; ``inf`` for ``method="long_coil"``.
    empty_return_reactance : float or array [ohm]
        Return-flux reactance of the empty coil from Nagaoka's coefficient (whatever the
        method).
    conductor : complex or array [ohm]
        Coil copper (resistance and internal reactance).
    leads : complex or array [ohm]
        Series lead and bus-bar impedance.
    nagaoka_coefficient : float [-]
        Nagaoka's coefficient of the coil's current sheet.
    method : str
        End-correction method used.
    """

    frequency: object
    workpiece: object
    gap_reactance: object
    empty_bore_reactance: object
    return_reactance: object
    empty_return_reactance: object
    conductor: object
    leads: object
    nagaoka_coefficient: float
    method: str

    @property
    def interior(self):
        """Series impedance of the coil interior, ``Z_i`` [ohm]."""
        return self.workpiece + 1j * (self.gap_reactance + self.empty_bore_reactance)

    @property
    def interior_to_return_ratio(self):
        """``|Z_i| / X_r``: how much the end correction changes the result [-].

        ``X_r`` is the method's return reactance; for ``method="long_coil"`` the empty-coil
        value that the method leaves out. See :data:`END_CORRECTION_WARNING_RATIO`.
        """
        x_r = self.empty_return_reactance if self.method == "long_coil" else self.return_reactance
        return np.abs(self.interior) / x_r

    @property
    def interior_current_ratio(self):
        """``I_i / I = jX_r / (Z_i + jX_r)`` (1 for the long-coil model) [-]."""
        # Z_i / (j X_r) = -j Z_i / X_r; X_r = inf gives 0 exactly, hence ratio 1.
        return 1.0 / (1.0 - 1j * self.interior / self.return_reactance)

    @property
    def load(self):
        """Impedance seen by the current sheet, ``Z_i || jX_r`` [ohm]."""
        return self.interior * self.interior_current_ratio

    @property
    def total(self):
        """Coil terminal impedance, load + conductor + leads [ohm]."""
        return self.load + self.conductor + self.leads

    @property
    def power_factor(self):
        """``R / |Z|`` of the coil at its terminals [-]."""
        return self.total.real / np.abs(self.total)

    @property
    def efficiency(self):
        """Coil (electrical) efficiency, workpiece power / (workpiece + copper) [-]."""
        r_load = self.load.real
        return r_load / (r_load + self.conductor.real)


def coil_impedance(
    coil,
    workpiece,
    frequency,
    *,
    method="permeable_return_path",
    surface_impedance=None,
    lead_impedance=0.0,
):
    """Equivalent-circuit impedances of a solenoid coil with a workpiece.

    Parameters
    ----------
    coil : SolenoidCoil or RectangularSolenoidCoil
        The coil.
    workpiece : CylinderWorkpiece, TubeWorkpiece, SlabWorkpiece or None
        The workpiece; None for the empty coil.
    frequency : float or array [Hz]
        Frequency, > 0.
    method : str
        End correction: ``"permeable_return_path"`` (default; Nagaoka's return path of the
        empty coil, enlarged for a permeable workpiece), ``"nagaoka_return_path"`` (the
        empty-coil return path whatever the workpiece) or ``"long_coil"`` (none). See
        :func:`end_correction_methods` and the module notes.
    surface_impedance : complex or array [ohm], optional
        Workpiece surface impedance to use instead of the analytic one of the workpiece,
        e.g. the ``surface_impedance`` of :func:`heatcalc.em.solve_radial_field` for
        properties that vary with radius. Real part > 0. Broadcast with ``frequency``.
    lead_impedance : complex [ohm]
        Series impedance of leads and bus bars, real part >= 0.

    Returns
    -------
    CoilImpedance

    Raises
    ------
    ValueError
        For an invalid argument or a workpiece that does not fit the bore.

    Notes
    -----
    See the module notes for the model and its assumptions.

    Examples
    --------
    Empty long coil: the reactance is the long-solenoid value.

    >>> from heatcalc.coil import SolenoidCoil, RectangularTube
    >>> tube = RectangularTube(0.01, 0.01, 0.001)
    >>> coil = SolenoidCoil(10, 2.0, 0.1, tube, 1.7e-8)
    >>> z = coil_impedance(coil, None, 1e3, method="long_coil")
    >>> round(float(z.load.imag), 6)
    0.003101
    """
    _check_coil(coil)
    _check_fit(coil, workpiece)
    c.choice("method", method, END_CORRECTION_METHODS)
    f = c.positive("frequency", frequency, "Hz")
    z_lead = complex(c.complex_value("lead_impedance", lead_impedance, "ohm"))
    if z_lead.real < 0.0:
        raise ValueError(f"lead_impedance must have a real part >= 0 [ohm]; got {z_lead!r}")

    omega = 2.0 * pi * f
    n2_per_l2 = (coil.turns / coil.length) ** 2
    if workpiece is None:
        if surface_impedance is not None:
            raise ValueError("surface_impedance must be None for an empty coil (workpiece=None)")
        heated = 0.0
        z_w = np.zeros_like(omega, dtype=complex)
        x_gap = np.zeros_like(omega)
    else:
        heated = min(workpiece.length, coil.length)
        if surface_impedance is None:
            z_s = np.asarray(workpiece.surface_impedance(f), dtype=complex)
        else:
            z_s = c.complex_value("surface_impedance", surface_impedance, "ohm")
            if not np.all(z_s.real > 0.0):
                raise ValueError(
                    f"surface_impedance must have a real part > 0 [ohm]; got {surface_impedance!r}"
                )
            z_s = np.broadcast_to(z_s, np.broadcast_shapes(z_s.shape, f.shape))
        z_w = n2_per_l2 * heated * workpiece.perimeter * z_s
        x_gap = n2_per_l2 * heated * omega * mu_0 * (coil.bore_area - workpiece.area)
    x_empty = n2_per_l2 * (coil.length - heated) * omega * mu_0 * coil.bore_area

    k_n = float(nagaoka(coil.equivalent_diameter, coil.length))
    x_empty_ret = omega * return_path_inductance(coil.equivalent_diameter, coil.length, coil.turns)
    if method == "long_coil":
        x_ret = np.full_like(omega, np.inf)
    elif method == "nagaoka_return_path" or workpiece is None:
        x_ret = x_empty_ret
    else:
        x_ret = x_empty_ret * _permeable_return_factor(
            coil, workpiece, k_n, np.abs(z_w + 1j * (x_gap + x_empty)), omega
        )

    z_sheet = backed_sheet_impedance(coil.conductor.wall, coil.resistivity, f)
    z_cu = coil.turns**2 * coil.current_path_length * z_sheet / (coil.space_factor * coil.length)

    s = c.scalar_or_array
    return CoilImpedance(
        frequency=s(f),
        workpiece=s(z_w),
        gap_reactance=s(x_gap),
        empty_bore_reactance=s(x_empty),
        return_reactance=s(x_ret),
        empty_return_reactance=s(x_empty_ret),
        conductor=s(z_cu),
        leads=s(np.full_like(omega, z_lead, dtype=complex)),
        nagaoka_coefficient=k_n,
        method=method,
    )


def _permeable_return_factor(coil, workpiece, k_n, interior_magnitude, omega):
    """``X_r' / X_r = 1 + (g_inf - 1)(1 - 1/m)`` for ``m > 1``, else 1 (module notes)."""
    x_open = omega * mu_0 * (coil.turns / coil.length) ** 2 * coil.length * coil.bore_area
    m = interior_magnitude / x_open
    d_w = np.sqrt(4.0 * workpiece.area / pi)
    n_w = float(ellipsoid_demagnetising_factor(workpiece.length / d_w))
    fill = workpiece.area / coil.bore_area
    g_inf = (1.0 - k_n) / k_n * fill * (coil.length / workpiece.length) / n_w
    # m <= 1 (a non-magnetic load only expels flux): the empty-coil return path, unchanged
    weight = np.where(m > 1.0, 1.0 - 1.0 / np.maximum(m, 1.0), 0.0)
    return 1.0 + (g_inf - 1.0) * weight


_ROWS = (
    ("frequency", "frequency", "Hz"),
    ("coil resistance", "resistance", "ohm"),
    ("coil reactance", "reactance", "ohm"),
    ("workpiece resistance referred to coil (interior)", "workpiece_resistance", "ohm"),
    ("workpiece reactance referred to coil (interior)", "workpiece_reactance", "ohm"),
    ("workpiece resistance at coil terminals", "load_resistance", "ohm"),
    ("workpiece and air reactance at coil terminals", "load_reactance", "ohm"),
    ("copper resistance", "copper_resistance", "ohm"),
    ("copper internal reactance", "copper_reactance", "ohm"),
    ("air-gap reactance", "gap_reactance", "ohm"),
    ("return-path reactance", "return_reactance", "ohm"),
    ("interior to return-path ratio", "interior_to_return_ratio", "-"),
    ("Nagaoka coefficient", "nagaoka_coefficient", "-"),
    ("workpiece skin depth", "workpiece_skin_depth", "m"),
    ("copper skin depth", "copper_skin_depth", "m"),
    ("power factor", "power_factor", "-"),
    ("coil efficiency", "efficiency", "-"),
    ("efficiency including leads", "overall_efficiency", "-"),
    ("coil current", "coil_current", "A"),
    ("coil voltage", "coil_voltage", "V"),
    ("ampere-turns", "ampere_turns", "A"),
    ("surface field", "surface_field", "A/m"),
    ("workpiece power", "workpiece_power", "W"),
    ("copper loss", "copper_loss", "W"),
    ("lead loss", "lead_loss", "W"),
    ("input power", "input_power", "W"),
    ("reactive power", "reactive_power", "var"),
    ("apparent power", "apparent_power", "VA"),
)


@dataclass(frozen=True)
class CoilCircuitResult:
    """Coil electricals at one frequency for one operating point (SI units).

    ``to_frame()`` gives a table of quantity, value and unit; in a notebook the object shows
    that table. ``impedance`` holds the circuit parts. ``workpiece_resistance`` and
    ``workpiece_reactance`` are the workpiece referred to the coil as the series interior
    element ``(N/l_c)**2 l_h p_w Z_s``; ``load_resistance`` and ``load_reactance`` are what
    the coil terminals see of workpiece, air gap and return path together
    (``Z_i || jX_r``). ``efficiency`` is the coil efficiency (workpiece / (workpiece +
    copper)); ``overall_efficiency`` also counts the lead loss.
    ``interior_to_return_ratio`` is ``|Z_i| / X_r``, how much the end correction matters;
    above :data:`END_CORRECTION_WARNING_RATIO` :func:`coil_circuit` warns
    (:class:`EndCorrectionWarning`).
    """

    frequency: float
    method: str
    resistance: float
    reactance: float
    workpiece_resistance: float
    workpiece_reactance: float
    load_resistance: float
    load_reactance: float
    copper_resistance: float
    copper_reactance: float
    gap_reactance: float
    return_reactance: float
    interior_to_return_ratio: float
    nagaoka_coefficient: float
    workpiece_skin_depth: float
    copper_skin_depth: float
    power_factor: float
    efficiency: float
    overall_efficiency: float
    coil_current: float
    coil_voltage: float
    ampere_turns: float
    surface_field: float
    workpiece_power: float
    copper_loss: float
    lead_loss: float
    input_power: float
    reactive_power: float
    apparent_power: float
    impedance: CoilImpedance

    def to_frame(self) -> pd.DataFrame:
        """Table with columns quantity, value, unit."""
        rows = [(label, float(getattr(self, name)), unit) for label, name, unit in _ROWS]
        rows.insert(1, ("end correction", self.method, "-"))
        return pd.DataFrame(rows, columns=["quantity", "value", "unit"])

    def _repr_html_(self) -> str:
        return self.to_frame().to_html(index=False)


def coil_circuit(
    coil,
    workpiece,
    frequency,
    *,
    workpiece_power=None,
    coil_current=None,
    method="permeable_return_path",
    surface_impedance=None,
    lead_impedance=0.0,
):
    """Coil current, voltage, losses and efficiency for a workpiece power or a coil current.

    Parameters
    ----------
    coil : SolenoidCoil or RectangularSolenoidCoil
        The coil.
    workpiece : CylinderWorkpiece, TubeWorkpiece, SlabWorkpiece or None
        The workpiece (None: empty coil, then give ``coil_current``).
    frequency : float [Hz]
        Frequency, > 0.
    workpiece_power : float [W], optional
        Power to induce in the workpiece, > 0. Give this or ``coil_current``.
    coil_current : float [A], optional
        Coil current (RMS), > 0.
    method, surface_impedance, lead_impedance
        As for :func:`coil_impedance`.

    Returns
    -------
    CoilCircuitResult

    Raises
    ------
    ValueError
        For an invalid argument, or unless exactly one of workpiece_power and coil_current
        is given.

    Warns
    -----
    EndCorrectionWarning
        If ``interior_to_return_ratio`` exceeds :data:`END_CORRECTION_WARNING_RATIO`: the
        end correction dominates and the power may be off by more than about 10 %.

    Examples
    --------
    >>> from heatcalc.coil import SolenoidCoil, RectangularTube, CylinderWorkpiece
    >>> coil = SolenoidCoil(12, 0.3, 0.14, RectangularTube(0.02, 0.012, 0.0015), 1.9e-8)
    >>> billet = CylinderWorkpiece(0.05, 0.3, 1.2e-6)
    >>> res = coil_circuit(coil, billet, 3e3, workpiece_power=100e3)
    >>> round(res.input_power - res.copper_loss - res.workpiece_power, 6)
    0.0
    """
    if (workpiece_power is None) == (coil_current is None):
        raise ValueError(
            "give exactly one of workpiece_power and coil_current; got "
            f"workpiece_power={workpiece_power!r}, coil_current={coil_current!r}"
        )
    f = float(c.positive("frequency", frequency, "Hz"))
    parts = coil_impedance(
        coil,
        workpiece,
        f,
        method=method,
        surface_impedance=surface_impedance,
        lead_impedance=lead_impedance,
    )
    load = complex(parts.load)
    total = complex(parts.total)
    if coil_current is None:
        p_w = float(c.positive("workpiece_power", workpiece_power, "W"))
        if workpiece is None:
            raise ValueError("workpiece_power needs a workpiece; got workpiece=None")
        current = float(np.sqrt(p_w / load.real))
    else:
        current = float(c.positive("coil_current", coil_current, "A"))
    ratio = float(parts.interior_to_return_ratio)
    if ratio > END_CORRECTION_WARNING_RATIO:
        warnings.warn(
            f"interior_to_return_ratio |Z_i|/X_r = {ratio:.3g} exceeds "
            f"{END_CORRECTION_WARNING_RATIO:g} (method {method!r}): the end correction "
            "dominates; the workpiece power may be off by more than about 10 %, check with "
            "a field computation",
            EndCorrectionWarning,
            stacklevel=2,
        )
    i_interior = current * complex(parts.interior_current_ratio)
    p_work = abs(i_interior) ** 2 * complex(parts.workpiece).real
    s_in = current**2 * total
    if workpiece is None:
        delta_w = float("nan")
    else:
        delta_w = float(em.skin_depth(workpiece.resistivity, f, workpiece.mu_r))
    return CoilCircuitResult(
        frequency=f,
        method=method,
        resistance=total.real,
        reactance=total.imag,
        workpiece_resistance=complex(parts.workpiece).real,
        workpiece_reactance=complex(parts.workpiece).imag,
        load_resistance=load.real,
        load_reactance=load.imag,
        copper_resistance=complex(parts.conductor).real,
        copper_reactance=complex(parts.conductor).imag,
        gap_reactance=float(parts.gap_reactance),
        return_reactance=float(parts.return_reactance),
        interior_to_return_ratio=ratio,
        nagaoka_coefficient=parts.nagaoka_coefficient,
        workpiece_skin_depth=delta_w,
        copper_skin_depth=float(em.skin_depth(coil.resistivity, f)),
        power_factor=float(parts.power_factor),
        efficiency=float(parts.efficiency),
        overall_efficiency=p_work / s_in.real,
        coil_current=current,
        coil_voltage=current * abs(total),
        ampere_turns=coil.turns * current,
        surface_field=coil.turns * abs(i_interior) / coil.length,
        workpiece_power=p_work,
        copper_loss=current**2 * complex(parts.conductor).real,
        lead_loss=current**2 * complex(parts.leads).real,
        input_power=s_in.real,
        reactive_power=s_in.imag,
        apparent_power=abs(s_in),
        impedance=parts,
    )


def workpiece_power_at_current(coil, workpiece, frequency, coil_current, **options):
    """Workpiece power and coil terminal impedance for a given coil current.

    Parameters
    ----------
    coil : SolenoidCoil or RectangularSolenoidCoil
        The coil.
    workpiece : CylinderWorkpiece, TubeWorkpiece or SlabWorkpiece
        The workpiece.
    frequency : float [Hz]
        Frequency, > 0.
    coil_current : float [A]
        Coil current (RMS), > 0.
    **options
        ``method``, ``surface_impedance``, ``lead_impedance`` as for :func:`coil_impedance`.

    Returns
    -------
    workpiece_power : float [W]
        Power induced in the workpiece.
    impedance : complex [ohm]
        Coil terminal impedance (copper and leads included).
    load_impedance : complex [ohm]
        Impedance seen by the current sheet (workpiece, air gap and return path only), the
        quantity a field computation with an imposed sheet current gives.

    Raises
    ------
    ValueError
        For an invalid argument.
    """
    res = coil_circuit(coil, workpiece, frequency, coil_current=coil_current, **options)
    return res.workpiece_power, complex(res.impedance.total), complex(res.impedance.load)
