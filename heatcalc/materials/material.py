"""The :class:`Material` object: property tables, melting, emissivity, magnetisation."""

from __future__ import annotations

from dataclasses import dataclass, field
from types import MappingProxyType

import numpy as np
import pandas as pd

from .magnetisation import MagnetisationModel
from .tables import PropertyTable

__all__ = ["Material", "TABLE_PROPERTIES"]

#: Temperature tables a material may carry, with their SI unit.
TABLE_PROPERTIES = {
    "resistivity": "ohm*m",
    "thermal_conductivity": "W/(m*K)",
    "specific_heat": "J/(kg*K)",
    "density": "kg/m**3",
}


@dataclass(frozen=True)
class Material:
    """A material with temperature-dependent properties, all in SI units (kelvin).

    Build one from a data file with :func:`heatcalc.materials.get` or
    :func:`heatcalc.materials.load`, or with constant properties with :meth:`constant`.

    Property methods take temperature in kelvin (float or array) and raise
    :class:`~heatcalc.materials.OutOfRangeError` outside the table unless
    ``extrapolate=True`` is passed, which extrapolates linearly with an
    :class:`~heatcalc.materials.ExtrapolationWarning`.
    """

    key: str
    name: str
    category: str
    tables: MappingProxyType
    sources: MappingProxyType
    emissivities: MappingProxyType = field(default_factory=lambda: MappingProxyType({}))
    emissivity_source: str | None = None
    solidus: float | None = None
    liquidus: float | None = None
    latent_heat: float | None = None
    melting_source: str | None = None
    magnetisation: MagnetisationModel | None = None
    magnetic_source: str | None = None
    brazing_range: tuple[float, float] | None = None
    brazing_classification: str | None = None
    brazing_source: str | None = None
    composition: MappingProxyType = field(default_factory=lambda: MappingProxyType({}))
    composition_source: str | None = None
    notes: str = ""
    path: str | None = None

    # -- temperature tables -------------------------------------------------------------
    def _table(self, quantity: str) -> PropertyTable:
        try:
            return self.tables[quantity]
        except KeyError:
            raise ValueError(
                f"material {self.key!r} has no {quantity} table; it has {sorted(self.tables)}"
            ) from None

    def value(self, quantity: str, temperature, extrapolate: bool = False):
        """Value of table `quantity` at `temperature` [K] in SI units."""
        return self._table(quantity)(temperature, extrapolate=extrapolate)

    def resistivity(self, temperature, extrapolate: bool = False):
        """Electrical resistivity [ohm m] at `temperature` [K]."""
        return self.value("resistivity", temperature, extrapolate)

    def thermal_conductivity(self, temperature, extrapolate: bool = False):
        """Thermal conductivity [W/(m K)] at `temperature` [K]."""
        return self.value("thermal_conductivity", temperature, extrapolate)

    def specific_heat(self, temperature, extrapolate: bool = False):
        """Specific heat capacity [J/(kg K)] at `temperature` [K] (sensible heat only)."""
        return self.value("specific_heat", temperature, extrapolate)

    def density(self, temperature, extrapolate: bool = False):
        """Density [kg/m3] at `temperature` [K]."""
        return self.value("density", temperature, extrapolate)

    def temperature_range(self, quantity: str | None = None) -> tuple[float, float]:
        """Range [K] of one table, or the range common to all tables."""
        if quantity is not None:
            t = self._table(quantity)
            return t.t_min, t.t_max
        if not self.tables:
            raise ValueError(f"material {self.key!r} has no temperature tables")
        return (
            max(t.t_min for t in self.tables.values()),
            min(t.t_max for t in self.tables.values()),
        )

    # -- other properties ---------------------------------------------------------------
    @property
    def curie_temperature(self) -> float | None:
        """Curie temperature [K], or None for a non-magnetic material."""
        return None if self.magnetisation is None else self.magnetisation.curie_temperature

    @property
    def is_magnetic(self) -> bool:
        return self.magnetisation is not None

    def relative_permeability(self, h_peak, temperature):
        """Effective relative permeability for a field of peak amplitude `h_peak` [A/m].

        1 for non-magnetic materials and above the Curie temperature; see
        :mod:`heatcalc.materials.magnetisation` for the model.
        """
        if self.magnetisation is None:
            out = np.ones(np.broadcast(np.asarray(h_peak), np.asarray(temperature)).shape)
            return float(out) if out.ndim == 0 else out
        return self.magnetisation.relative_permeability(h_peak, temperature)

    def emissivity(self, surface: str | None = None) -> float:
        """Total hemispherical emissivity for a surface condition.

        Parameters
        ----------
        surface : str, optional
            A condition listed in the material file (e.g. ``"oxidised"``, ``"bright"``,
            ``"molten"``). May be omitted only when the file lists exactly one.
        """
        if not self.emissivities:
            raise ValueError(f"material {self.key!r} has no emissivity data")
        if surface is None:
            if len(self.emissivities) == 1:
                return next(iter(self.emissivities.values()))
            raise ValueError(
                f"surface=None is ambiguous for {self.key!r}; choose one of "
                f"{sorted(self.emissivities)}"
            )
        try:
            return self.emissivities[surface]
        except KeyError:
            raise ValueError(
                f"surface={surface!r} is not listed for {self.key!r}; expected one of "
                f"{sorted(self.emissivities)}"
            ) from None

    @property
    def melting_point(self) -> float | None:
        """Liquidus [K] (the melting point of a pure metal)."""
        return self.liquidus

    # -- display ------------------------------------------------------------------------
    def to_frame(self) -> pd.DataFrame:
        """All temperature tables as one long table (degC, SI values, source)."""
        rows = []
        for q, tab in self.tables.items():
            srcs = tab.sources or ("",) * tab.temperature.size
            for t, v, s in zip(tab.temperature, tab.value, srcs, strict=True):
                rows.append(
                    {
                        "property": q,
                        "temperature_degC": t - 273.15,
                        "value": v,
                        "unit": tab.unit,
                        "source": s,
                    }
                )
        return pd.DataFrame(rows)

    def summary(self) -> pd.DataFrame:
        """Scalar data with their sources (melting, magnetic, emissivity, brazing)."""
        rows = []

        def add(what, value, unit, src):
            rows.append({"quantity": what, "value": value, "unit": unit, "source": src})

        if self.solidus is not None:
            add("solidus", self.solidus - 273.15, "degC", self.melting_source)
            add("liquidus", self.liquidus - 273.15, "degC", self.melting_source)
        if self.latent_heat is not None:
            add("latent heat", self.latent_heat / 1e3, "kJ/kg", self.melting_source)
        if self.magnetisation is not None:
            m = self.magnetisation
            add("Curie temperature", m.curie_temperature - 273.15, "degC", self.magnetic_source)
            add("saturation flux density", m.saturation_flux_density, "T", self.magnetic_source)
            add(
                "initial rel. permeability",
                m.initial_relative_permeability,
                "-",
                self.magnetic_source,
            )
        for cond, e in self.emissivities.items():
            add(f"emissivity ({cond})", e, "-", self.emissivity_source)
        if self.brazing_range is not None:
            add("brazing range, low", self.brazing_range[0] - 273.15, "degC", self.brazing_source)
            add("brazing range, high", self.brazing_range[1] - 273.15, "degC", self.brazing_source)
        return pd.DataFrame(rows)

    def _repr_html_(self) -> str:
        return f"<h4>{self.name} ({self.key})</h4>" + self.summary().to_html(index=False)

    # -- construction -------------------------------------------------------------------
    @classmethod
    def constant(
        cls,
        key: str = "constant",
        *,
        resistivity: float | None = None,
        thermal_conductivity: float | None = None,
        specific_heat: float | None = None,
        density: float | None = None,
        emissivity: float | None = None,
        t_min: float = 0.0,
        t_max: float = 5000.0,
        solidus: float | None = None,
        liquidus: float | None = None,
        latent_heat: float | None = None,
        magnetisation: MagnetisationModel | None = None,
    ) -> Material:
        """A user-defined material with constant properties between `t_min` and `t_max` [K].

        Meant for checks against textbook solutions and for quick studies.

        Examples
        --------
        >>> m = Material.constant(thermal_conductivity=40.0, specific_heat=500.0, density=7800.0)
        >>> m.specific_heat(1000.0)
        500.0
        """
        given = {
            "resistivity": resistivity,
            "thermal_conductivity": thermal_conductivity,
            "specific_heat": specific_heat,
            "density": density,
        }
        tables = {}
        for q, v in given.items():
            if v is None:
                continue
            if not (np.isfinite(v) and v > 0):
                raise ValueError(f"{q}={v!r} must be a positive number")
            tables[q] = PropertyTable(
                key,
                q,
                np.array([t_min, t_max]),
                np.array([v, v]),
                TABLE_PROPERTIES[q],
                ("user", "user"),
            )
        emis = {} if emissivity is None else {"user": float(emissivity)}
        if (solidus is None) != (liquidus is None):
            raise ValueError("solidus and liquidus must be given together")
        return cls(
            key=key,
            name=f"{key} (constant properties)",
            category="user",
            tables=MappingProxyType(tables),
            sources=MappingProxyType({"user": "constant properties given by the user"}),
            emissivities=MappingProxyType(emis),
            emissivity_source="user" if emis else None,
            solidus=solidus,
            liquidus=liquidus,
            latent_heat=latent_heat,
            melting_source="user" if solidus is not None else None,
            magnetisation=magnetisation,
            magnetic_source="user" if magnetisation else None,
        )
