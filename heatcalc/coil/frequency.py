"""Choice of frequency: sweeps of efficiency, power factor and heating pattern.

The heating pattern is judged by one ratio of a workpiece size to the skin depth
``delta`` (computed with the workpiece's resistivity and permeability as given, so pass the
properties of the state that matters, e.g. hot steel above the Curie temperature):

* solid cylinder, through-heating: ``D / delta``. At a fixed field and frequency the power per
  unit length is proportional to ``P(x) / x`` (``x = a / delta``, ``P`` the active-power
  function of :func:`heatcalc.em.cylinder_power_factors`), greatest at ``D / delta = 3.56``;
  below it the power falls fast and the coil efficiency with it. The band starts there
  (the trade rule is ``D / delta >= 3.5 to 4``) and ends at twice that ratio, where heating
  becomes increasingly concentrated in the skin (upper edge: common practice, no source).
* plate, through-heating: ``thickness / delta``, band from the optimum of ``F(x)/x``
  (``x = d / delta``, :func:`heatcalc.em.slab_power_factors`, about 2.25) to twice it.
* tube, through-heating: ``wall / delta``, band from the optimum of ``P/x`` for the tube's
  own bore ratio and permeability (:func:`heatcalc.em.tube_power_factors`; for a thin wall
  this is near ``a t / delta**2 = 1``) to twice it.
* surface hardening: ``delta / case depth`` from 2/3 to 3/2, i.e. the (hot) skin depth within
  a factor 1.5 of the case depth (common practice, no source).

Every band edge can be overridden with ``low=`` and ``high=``.
"""

from __future__ import annotations

import functools
from dataclasses import dataclass

import numpy as np
import pandas as pd
from matplotlib.figure import Figure
from scipy.constants import mu_0, pi
from scipy.optimize import minimize_scalar

from heatcalc import _checks as c
from heatcalc import em
from heatcalc.coil.circuit import coil_impedance
from heatcalc.coil.geometry import CylinderWorkpiece, SlabWorkpiece, TubeWorkpiece

__all__ = [
    "PURPOSES",
    "HeatingRule",
    "heating_rule",
    "relative_power_optimum",
    "FrequencyBand",
    "frequency_band",
    "frequency_sweep",
    "rank_frequencies",
    "plot_frequency_sweep",
]

PURPOSES = ("through_heating", "surface_hardening")


def relative_power_optimum(shape: str, inner_to_outer=None, mu_r=1.0) -> float:
    """Size-to-skin-depth ratio at which the power per unit length peaks at fixed field.

    Parameters
    ----------
    shape : str
        ``"cylinder"``: returns ``D / delta`` maximising ``P(x) / x``, ``x = a / delta``
        (:func:`heatcalc.em.cylinder_power_factors`); ``"slab"``: returns ``d / delta``
        maximising ``F(x) / x``, ``x = d / delta`` (:func:`heatcalc.em.slab_power_factors`);
        ``"tube"``: returns the outer ``D / delta`` maximising ``P(x, x b/a) / x``,
        ``x = a / delta`` (:func:`heatcalc.em.tube_power_factors`).
    inner_to_outer : float [-], optional
        Bore-to-outer radius ratio ``b / a`` in (0, 1); required for ``"tube"`` only.
    mu_r : float [-]
        Relative permeability of the tube wall, >= 1 (``"tube"`` only; it enters through
        the bore flux).

    Returns
    -------
    float [-]

    Raises
    ------
    ValueError
        For an invalid argument.

    Notes
    -----
    At fixed frequency and surface field, ``p = (rho / delta) P``, and ``rho / delta`` is
    proportional to ``1 / x`` when the resistivity varies: this optimum underlies the
    ``D / delta ~ 3.5`` rule of through-heating. For a thin tube it tends to
    ``a t / delta**2 = 1``, where the wall's own time constant ``mu_0 a t / (2 rho)`` equals
    ``1 / omega`` (shorted-turn view of the wall). Found by bounded scalar minimisation
    (absolute tolerance 1e-10 on ``x``).

    Examples
    --------
    >>> round(relative_power_optimum("cylinder"), 2)
    3.56
    """
    c.choice("shape", shape, ("cylinder", "slab", "tube"))
    if shape == "tube":
        if inner_to_outer is None:
            raise ValueError("inner_to_outer must be given for shape 'tube'")
        ratio = float(c.positive("inner_to_outer", inner_to_outer, "-"))
        if not ratio < 1.0:
            raise ValueError(f"inner_to_outer must be < 1 [-]; got {inner_to_outer!r}")
        mu = float(c.real("mu_r", mu_r, "-"))
        if not mu >= 1.0:
            raise ValueError(f"mu_r must be >= 1 [-]; got {mu_r!r}")
    else:
        ratio, mu = None, 1.0
    return _relative_power_optimum(shape, ratio, mu)


@functools.cache
def _relative_power_optimum(shape: str, ratio: float | None, mu: float) -> float:
    if shape == "cylinder":

        def objective(x):
            return -em.cylinder_power_factors(x)[0] / x

        scale, upper = 2.0, 5.0
    elif shape == "slab":

        def objective(x):
            return -em.slab_power_factors(x)[0] / x

        scale, upper = 1.0, 6.0
    else:
        # thin walls peak near a t / delta^2 = 1, i.e. x = a/delta = (a / t)^(1/2)
        upper = 10.0 * max(5.0, float(np.sqrt(1.0 / (1.0 - ratio))))

        def objective(x):
            return -em.tube_power_factors(x, x * ratio, mu)[0] / x

        scale = 2.0
    res = minimize_scalar(
        objective, bounds=(0.05, upper), method="bounded", options={"xatol": 1e-10}
    )
    return scale * float(res.x)


@dataclass(frozen=True)
class HeatingRule:
    """A band of a size-to-skin-depth ratio that gives the wanted heating pattern.

    Attributes
    ----------
    quantity : str
        What the ratio is, e.g. ``"diameter / skin depth"``.
    dimension : float [m]
        The size in the ratio (diameter, wall, thickness or case depth).
    low, high : float [-]
        Band of the ratio.
    skin_depth_over_dimension : bool
        True if the ratio is ``skin depth / dimension`` (hardening), else
        ``dimension / skin depth``.
    reason : str
        Where the band comes from.
    """

    quantity: str
    dimension: float
    low: float
    high: float
    skin_depth_over_dimension: bool
    reason: str

    def ratio(self, skin_depth):
        """The rule's ratio for a skin depth [m] (float or array) [-]."""
        d = c.positive("skin_depth", skin_depth, "m")
        r = d / self.dimension if self.skin_depth_over_dimension else self.dimension / d
        return c.scalar_or_array(r)

    def skin_depth_range(self) -> tuple[float, float]:
        """Skin depths at the band edges, smallest first [m]."""
        if self.skin_depth_over_dimension:
            return self.low * self.dimension, self.high * self.dimension
        return self.dimension / self.high, self.dimension / self.low


def heating_rule(workpiece, purpose="through_heating", *, case_depth=None, low=None, high=None):
    """Ratio band for a workpiece and purpose (see the module notes for the defaults).

    Parameters
    ----------
    workpiece : CylinderWorkpiece, TubeWorkpiece or SlabWorkpiece
        The workpiece.
    purpose : str
        ``"through_heating"`` or ``"surface_hardening"``.
    case_depth : float [m], optional
        Wanted case depth, > 0; required for ``"surface_hardening"``.
    low, high : float [-], optional
        Band edges overriding the defaults, ``0 < low < high``.

    Returns
    -------
    HeatingRule

    Raises
    ------
    ValueError
        For an invalid argument.

    Examples
    --------
    >>> from heatcalc.coil import CylinderWorkpiece
    >>> rule = heating_rule(CylinderWorkpiece(0.05, 0.5, 1.2e-6))
    >>> rule.quantity, round(rule.low, 2), round(rule.high, 2)
    ('diameter / skin depth', 3.56, 7.11)
    """
    c.choice("purpose", purpose, PURPOSES)
    if purpose == "surface_hardening":
        if case_depth is None:
            raise ValueError("case_depth must be given for purpose 'surface_hardening'")
        x_c = float(c.positive("case_depth", case_depth, "m"))
        rule = ("skin depth / case depth", x_c, 2.0 / 3.0, 1.5, True)
        reason = "skin depth within a factor 1.5 of the case depth (common practice, no source)"
    elif isinstance(workpiece, CylinderWorkpiece):
        opt = relative_power_optimum("cylinder")
        rule = ("diameter / skin depth", 2.0 * workpiece.radius, opt, 2.0 * opt, False)
        reason = (
            f"D/delta from the P(m)/m optimum {opt:.2f} (trade rule D/delta >= 3.5-4) to "
            f"twice that (skin-concentrated beyond; common practice, no source)"
        )
    elif isinstance(workpiece, SlabWorkpiece):
        opt = relative_power_optimum("slab")
        rule = ("thickness / skin depth", workpiece.thickness, opt, 2.0 * opt, False)
        reason = f"d/delta from the F(x)/x optimum {opt:.2f} to twice that (common practice)"
    elif isinstance(workpiece, TubeWorkpiece):
        b_over_a = workpiece.inner_radius / workpiece.outer_radius
        opt_d = relative_power_optimum("tube", b_over_a, workpiece.mu_r)
        opt = opt_d * workpiece.wall / (2.0 * workpiece.outer_radius)
        rule = ("wall / skin depth", workpiece.wall, opt, 2.0 * opt, False)
        reason = (
            f"wall/delta from the P/x optimum of this tube {opt:.2f} (outer D/delta "
            f"{opt_d:.2f}) to twice that (common practice, no source)"
        )
    else:
        raise ValueError(
            f"workpiece must be a CylinderWorkpiece, TubeWorkpiece or SlabWorkpiece; "
            f"got {workpiece!r}"
        )
    quantity, dimension, lo, hi, inverse = rule
    if low is not None or high is not None:
        lo = float(c.positive("low", lo if low is None else low, "-"))
        hi = float(c.positive("high", hi if high is None else high, "-"))
        if not lo < hi:
            raise ValueError(f"low must be < high; got low={lo!r}, high={hi!r}")
        reason = f"band set by the user ({lo:g} to {hi:g})"
    return HeatingRule(quantity, dimension, lo, hi, inverse, reason)


def _frequency_for_skin_depth(delta, workpiece):
    return workpiece.resistivity / (pi * mu_0 * workpiece.mu_r * delta**2)


@dataclass(frozen=True)
class FrequencyBand:
    """Recommended frequency band [Hz] and why."""

    low: float
    high: float
    reason: str


def frequency_band(workpiece, rule: HeatingRule) -> FrequencyBand:
    """Frequencies at which the workpiece's ratio lies within the rule's band.

    Parameters
    ----------
    workpiece : CylinderWorkpiece, TubeWorkpiece or SlabWorkpiece
        The workpiece (its resistivity and permeability set the skin depth).
    rule : HeatingRule
        From :func:`heating_rule`.

    Returns
    -------
    FrequencyBand
        Band edges from ``f = rho / (pi mu_0 mu_r delta**2)`` at the edge skin depths.

    Raises
    ------
    ValueError
        If rule is not a HeatingRule.
    """
    if not isinstance(rule, HeatingRule):
        raise ValueError(f"rule must be a HeatingRule; got {rule!r}")
    d_small, d_large = rule.skin_depth_range()
    f_low = float(_frequency_for_skin_depth(d_large, workpiece))
    f_high = float(_frequency_for_skin_depth(d_small, workpiece))
    return FrequencyBand(
        f_low, f_high, f"{rule.quantity} {rule.low:.3g} to {rule.high:.3g}: {rule.reason}"
    )


def frequency_sweep(coil, workpiece, frequencies, *, rule=None, **options) -> pd.DataFrame:
    """Efficiency, power factor and heating pattern over a set of frequencies.

    Parameters
    ----------
    coil : SolenoidCoil or RectangularSolenoidCoil
        The coil.
    workpiece : CylinderWorkpiece, TubeWorkpiece or SlabWorkpiece
        The workpiece.
    frequencies : array [Hz]
        Frequencies, > 0 (one-dimensional).
    rule : HeatingRule, optional
        Rule for the ratio column; default ``heating_rule(workpiece)`` (through-heating).
    **options
        ``method``, ``lead_impedance`` as for :func:`heatcalc.coil.circuit.coil_impedance`.

    Returns
    -------
    pandas.DataFrame
        Columns ``frequency`` [Hz], ``skin_depth`` [m] (workpiece), ``ratio`` [-] (the
        rule's quantity, named in ``attrs["ratio"]``), ``in_band`` [bool], ``efficiency``
        [-] (coil efficiency), ``power_factor`` [-], ``resistance`` and ``reactance`` [ohm]
        (coil terminals), ``relative_power`` [-] (workpiece power at a fixed coil current,
        divided by its largest value in the sweep). ``attrs["band"]`` holds the rule's
        ``(low, high)``.

    Raises
    ------
    ValueError
        For an invalid argument.
    """
    f = c.positive("frequencies", frequencies, "Hz")
    if f.ndim != 1 or f.size == 0:
        raise ValueError(f"frequencies must be a non-empty one-dimensional array; got {f!r}")
    if rule is None:
        rule = heating_rule(workpiece)
    elif not isinstance(rule, HeatingRule):
        raise ValueError(f"rule must be a HeatingRule; got {rule!r}")
    parts = coil_impedance(coil, workpiece, f, **options)
    delta = np.asarray(em.skin_depth(workpiece.resistivity, f, workpiece.mu_r))
    ratio = np.asarray(rule.ratio(delta))
    p_rel = np.asarray(parts.load).real
    table = pd.DataFrame(
        {
            "frequency": f,
            "skin_depth": delta,
            "ratio": ratio,
            "in_band": (ratio >= rule.low) & (ratio <= rule.high),
            "efficiency": np.asarray(parts.efficiency),
            "power_factor": np.asarray(parts.power_factor),
            "resistance": np.asarray(parts.total).real,
            "reactance": np.asarray(parts.total).imag,
            "relative_power": p_rel / p_rel.max(),
        }
    )
    table.attrs["ratio"] = rule.quantity
    table.attrs["band"] = (rule.low, rule.high)
    return table


def rank_frequencies(coil, workpiece, frequencies, *, rule=None, **options) -> pd.DataFrame:
    """Rank a fixed list of available supply frequencies for a workpiece and coil.

    Parameters
    ----------
    coil, workpiece, rule, **options
        As for :func:`frequency_sweep`.
    frequencies : array [Hz]
        Available frequencies, > 0.

    Returns
    -------
    pandas.DataFrame
        The sweep columns plus ``rank`` (1 = best) and ``reason``. Frequencies within the band
        come first, by coil efficiency (highest first); then the others, nearest the band
        first (distance ``|ln(ratio / nearest band edge)|``).

    Raises
    ------
    ValueError
        For an invalid argument.
    """
    if rule is None:
        rule = heating_rule(workpiece)
    table = frequency_sweep(coil, workpiece, frequencies, rule=rule, **options)
    ratio = table["ratio"].to_numpy()
    distance = np.where(
        ratio < rule.low,
        np.log(rule.low / ratio),
        np.where(ratio > rule.high, np.log(ratio / rule.high), 0.0),
    )
    table["band_distance"] = distance
    reasons = []
    for r, eff in zip(ratio, table["efficiency"], strict=True):
        if r < rule.low:
            where = f"below the band ({rule.quantity} {r:.3g} < {rule.low:.3g})"
        elif r > rule.high:
            where = f"above the band ({rule.quantity} {r:.3g} > {rule.high:.3g})"
        else:
            where = f"in the band ({rule.quantity} {r:.3g})"
        reasons.append(f"{where}; coil efficiency {eff:.3f}")
    table["reason"] = reasons
    order = np.lexsort((-table["efficiency"].to_numpy(), distance))
    table = table.iloc[order].reset_index(drop=True)
    table.insert(0, "rank", np.arange(1, len(table) + 1))
    return table


def plot_frequency_sweep(table: pd.DataFrame, band: FrequencyBand | None = None) -> Figure:
    """Plot a :func:`frequency_sweep` table: efficiency, power factor and the ratio.

    Parameters
    ----------
    table : pandas.DataFrame
        Output of :func:`frequency_sweep`.
    band : FrequencyBand, optional
        Shaded as the recommended band.

    Returns
    -------
    matplotlib.figure.Figure
        A new figure (not shown; the caller displays or saves it).

    Raises
    ------
    ValueError
        If the table lacks the sweep columns.
    """
    needed = {"frequency", "efficiency", "power_factor", "ratio"}
    if not isinstance(table, pd.DataFrame) or not needed <= set(table.columns):
        raise ValueError(f"table must be a frequency_sweep table with columns {sorted(needed)}")
    fig = Figure(figsize=(7.0, 4.0), layout="constrained")
    ax = fig.add_subplot()
    f = table["frequency"].to_numpy()
    ax.semilogx(f, table["efficiency"], label="coil efficiency")
    ax.semilogx(f, table["power_factor"], label="power factor")
    ax.set_xlabel("frequency [Hz]")
    ax.set_ylabel("efficiency, power factor [-]")
    ax.set_ylim(0.0, 1.0)
    ax.grid(True, which="both", alpha=0.3)
    ax2 = ax.twinx()
    ax2.semilogx(f, table["ratio"], color="0.3", linestyle="--", label=table.attrs.get("ratio"))
    ax2.set_ylabel(f"{table.attrs.get('ratio', 'ratio')} [-]")
    if band is not None:
        ax.axvspan(band.low, band.high, color="tab:green", alpha=0.15, label="recommended band")
    lines = ax.get_legend_handles_labels()
    lines2 = ax2.get_legend_handles_labels()
    ax.legend(lines[0] + lines2[0], lines[1] + lines2[1], loc="lower right", fontsize="small")
    return fig
