"""Power schedules for the transient solver: a list of segments run one after the other.

A segment is one coil of a heating line, one phase of a cycle (heat, transfer through air,
soak), or one step of a stepwise power programme. Its ``mode`` says what is held constant:

* ``"power"``: power absorbed per unit heated surface [W/m2] (the supply is regulated to
  deliver constant power to the workpiece). With a ``frequency`` the power is distributed in
  depth by the induced-current solution; without one it enters as a surface heat flux (the
  high-frequency limit, and the textbook constant-flux problem).
* ``"field"``: RMS surface field strength [A/m] (constant coil current); the absorbed power then
  follows the workpiece's resistivity and permeability, so it changes through the Curie
  temperature.
* ``"off"``: no power (transfer between coils or to the press, soak).
"""

from __future__ import annotations

from dataclasses import dataclass

from .. import _checks as chk
from .surface_loss import SurfaceLoss

__all__ = ["MODES", "Segment", "heat_segment", "soak_segment", "transfer_segment"]

MODES = ("power", "field", "off")


@dataclass(frozen=True)
class Segment:
    """One segment of a power schedule.

    Parameters
    ----------
    duration : float [s]
        > 0.
    mode : {"power", "field", "off"}
    value : float
        Absorbed power per heated area [W/m2] (``"power"``, >= 0) or RMS surface field [A/m]
        (``"field"``, > 0); ignored (must be 0) for ``"off"``.
    frequency : float [Hz], optional
        Required for ``"field"``; optional for ``"power"`` (None: surface heat flux).
    loss : SurfaceLoss, optional
        Surface losses during the segment (None: none).
    label : str
        Name shown in results (e.g. ``"coil 2"``, ``"transfer"``).
    """

    duration: float
    mode: str = "power"
    value: float = 0.0
    frequency: float | None = None
    loss: SurfaceLoss | None = None
    label: str = ""

    def __post_init__(self):
        chk.positive("duration", self.duration, "s")
        chk.choice("mode", self.mode, MODES)
        if self.mode == "power":
            chk.non_negative("value", self.value, "W/m2")
        elif self.mode == "field":
            chk.positive("value", self.value, "A/m")
            if self.frequency is None:
                raise ValueError("frequency must be given for mode='field' [Hz]; got None")
        elif self.value != 0:
            raise ValueError(f"value must be 0 for mode='off'; got {self.value!r}")
        if self.frequency is not None:
            chk.positive("frequency", self.frequency, "Hz")
        if self.loss is not None and not isinstance(self.loss, SurfaceLoss):
            raise ValueError(f"loss must be a SurfaceLoss or None; got {self.loss!r}")

    @property
    def induction(self) -> bool:
        """True if the segment needs the induced-current solution."""
        return self.mode != "off" and self.frequency is not None


def heat_segment(
    duration, *, power_per_area=None, h_surface=None, frequency=None, loss=None, label="heat"
):
    """A heating segment at constant absorbed power per area or constant surface field.

    Give exactly one of `power_per_area` [W/m2] and `h_surface` [A/m, RMS].

    Examples
    --------
    >>> heat_segment(60.0, power_per_area=2e5, frequency=1e3).mode
    'power'
    """
    if (power_per_area is None) == (h_surface is None):
        raise ValueError(
            f"give exactly one of power_per_area and h_surface; got power_per_area="
            f"{power_per_area!r}, h_surface={h_surface!r}"
        )
    if power_per_area is not None:
        return Segment(duration, "power", power_per_area, frequency, loss, label)
    return Segment(duration, "field", h_surface, frequency, loss, label)


def transfer_segment(duration, loss, label="transfer"):
    """Transfer without power (cooling in air with the given `loss`)."""
    return Segment(duration, "off", 0.0, None, loss, label)


def soak_segment(duration, loss=None, *, power_per_area=0.0, frequency=None, label="soak"):
    """Soak: zero power (e.g. in an insulated chamber, `loss`) or a low holding power."""
    if power_per_area == 0.0:
        return Segment(duration, "off", 0.0, None, loss, label)
    return Segment(duration, "power", power_per_area, frequency, loss, label)
