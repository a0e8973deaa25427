"""Loading material files (TOML) from the built-in library or from a user's path.

The file format is documented in ``data/materials/README.md`` (shipped inside the package as
``heatcalc/_data/materials/README.md``).
"""

from __future__ import annotations

import functools
import tomllib
from pathlib import Path
from types import MappingProxyType

import numpy as np
import pandas as pd

from .._paths import shipped
from ..units import Q_, ureg
from .magnetisation import MagnetisationModel
from .material import TABLE_PROPERTIES, Material
from .tables import PropertyTable

__all__ = ["available", "get", "load", "catalogue", "data_dir", "MaterialFileError"]


class MaterialFileError(ValueError):
    """A material file is malformed (missing keys, unknown source, wrong units...)."""


def data_dir():
    """Folder of the built-in material files (a :mod:`importlib.resources` traversable)."""
    return shipped("_data", "data").joinpath("materials")


def _builtin_files() -> dict[str, object]:
    return {p.name[: -len(".toml")]: p for p in data_dir().iterdir() if p.name.endswith(".toml")}


def available() -> list[str]:
    """Keys of the built-in materials, sorted.

    Examples
    --------
    >>> "aisi-1045" in available()
    True
    """
    return sorted(_builtin_files())


def get(key: str) -> Material:
    """The built-in material with exactly this key (no fuzzy matching).

    Raises
    ------
    KeyError
        If no built-in material has that key; the message lists the available keys.
    """
    if isinstance(key, Material):
        return key
    files = _builtin_files()
    if key not in files:
        raise KeyError(
            f"material={key!r} is not in the library; available: {', '.join(sorted(files))}. "
            "Load your own file with heatcalc.materials.load(path)."
        )
    return _load_builtin(key)


@functools.lru_cache(maxsize=64)
def _load_builtin(key: str) -> Material:
    path = _builtin_files()[key]
    return _parse(path.read_text(encoding="utf-8"), str(path), expected_key=key)


def load(path) -> Material:
    """Load a material from a TOML file of the documented format."""
    p = Path(path)
    if not p.is_file():
        raise FileNotFoundError(f"path={str(path)!r}: no such material file")
    return _parse(p.read_text(encoding="utf-8"), str(p), expected_key=p.stem)


def catalogue() -> pd.DataFrame:
    """One row per built-in material: key, name, category, temperature range, sources."""
    rows = []
    for key in available():
        m = get(key)
        if m.tables:
            lo, hi = m.temperature_range()
            rng = f"{lo - 273.15:.0f} to {hi - 273.15:.0f} degC"
        else:
            rng = "-"
        rows.append(
            {
                "key": key,
                "name": m.name,
                "category": m.category,
                "tables cover": rng,
                "sources": "; ".join(m.sources.values()),
            }
        )
    return pd.DataFrame(rows)


# -- parsing -------------------------------------------------------------------------------
def _parse(text: str, where: str, expected_key: str) -> Material:
    try:
        doc = tomllib.loads(text)
    except tomllib.TOMLDecodeError as exc:
        raise MaterialFileError(f"{where}: not valid TOML: {exc}") from None

    def need(block: dict, name: str, ctx: str):
        if name not in block:
            raise MaterialFileError(f"{where}: {ctx} is missing '{name}'")
        return block[name]

    key = need(doc, "key", "the file")
    if key != expected_key:
        raise MaterialFileError(f"{where}: key={key!r} must equal the file name {expected_key!r}")
    tunit = doc.get("temperature_unit", "degC")
    if tunit not in ("degC", "K", "degF"):
        raise MaterialFileError(f"{where}: temperature_unit={tunit!r}; expected degC, K or degF")
    sources = need(doc, "sources", "the file")
    if not isinstance(sources, dict) or not sources:
        raise MaterialFileError(f"{where}: [sources] must map short keys to references")

    def kelvin(v):
        return Q_(np.asarray(v, dtype=float), tunit).to(ureg.kelvin).magnitude

    def check_source(src, ctx, n=None):
        keys = [src] if isinstance(src, str) else list(src)
        if n is not None and not isinstance(src, str) and len(keys) != n:
            raise MaterialFileError(f"{where}: [{ctx}] lists {len(keys)} sources for {n} points")
        for s in keys:
            if s not in sources:
                raise MaterialFileError(
                    f"{where}: [{ctx}] names source {s!r}, which is not in [sources]"
                )
        return keys

    tables = {}
    for q, si_unit in TABLE_PROPERTIES.items():
        if q not in doc:
            continue
        block = doc[q]
        unit = need(block, "unit", f"[{q}]")
        t = kelvin(need(block, "temperature", f"[{q}]"))
        raw = np.asarray(need(block, "value", f"[{q}]"), dtype=float)
        try:
            v = Q_(raw, unit).to(si_unit).magnitude
        except Exception as exc:
            raise MaterialFileError(f"{where}: [{q}] unit={unit!r}: {exc}") from None
        src = check_source(need(block, "source", f"[{q}]"), q, t.size)
        srcs = tuple(src * t.size if len(src) == 1 else src)
        try:
            tables[q] = PropertyTable(key, q, t, v, si_unit, srcs)
        except ValueError as exc:
            raise MaterialFileError(f"{where}: {exc}") from None

    emis = {}
    emis_src = None
    if "emissivity" in doc:
        block = dict(doc["emissivity"])
        emis_src = check_source(need(block, "source", "[emissivity]"), "emissivity")[0]
        block.pop("source")
        for cond, e in block.items():
            if not (isinstance(e, (int, float)) and 0 < e <= 1):
                raise MaterialFileError(f"{where}: emissivity {cond}={e!r} must be in (0, 1]")
            emis[cond] = float(e)

    solidus = liquidus = latent = msrc = None
    if "melting" in doc:
        b = doc["melting"]
        solidus = float(kelvin(need(b, "solidus", "[melting]")))
        liquidus = float(kelvin(need(b, "liquidus", "[melting]")))
        if liquidus < solidus:
            raise MaterialFileError(f"{where}: liquidus is below solidus")
        latent = b.get("latent_heat")
        latent = None if latent is None else float(latent)
        msrc = check_source(need(b, "source", "[melting]"), "melting")[0]

    mag = magsrc = None
    if "magnetic" in doc:
        b = doc["magnetic"]
        try:
            mag = MagnetisationModel(
                curie_temperature=float(kelvin(need(b, "curie_temperature", "[magnetic]"))),
                saturation_flux_density=float(need(b, "saturation_flux_density", "[magnetic]")),
                initial_relative_permeability=float(
                    need(b, "initial_relative_permeability", "[magnetic]")
                ),
                kuzmin_s=float(b.get("kuzmin_s", 0.35)),
                kuzmin_p=float(b.get("kuzmin_p", 4.0)),
            )
        except ValueError as exc:
            raise MaterialFileError(f"{where}: [magnetic] {exc}") from None
        magsrc = check_source(need(b, "source", "[magnetic]"), "magnetic")[0]

    braze = bclass = bsrc = None
    if "brazing" in doc:
        b = doc["brazing"]
        braze = (
            float(kelvin(need(b, "range_min", "[brazing]"))),
            float(kelvin(need(b, "range_max", "[brazing]"))),
        )
        if braze[1] <= braze[0]:
            raise MaterialFileError(f"{where}: brazing range_max must exceed range_min")
        bclass = b.get("classification")
        bsrc = check_source(need(b, "source", "[brazing]"), "brazing")[0]

    comp = {}
    csrc = None
    if "composition" in doc:
        block = dict(doc["composition"])
        csrc = check_source(need(block, "source", "[composition]"), "composition")[0]
        block.pop("source")
        for el, v in block.items():
            if not (isinstance(v, (int, float)) and 0 <= v <= 100):
                raise MaterialFileError(f"{where}: composition {el}={v!r} must be a mass %")
            comp[el] = float(v)

    return Material(
        key=key,
        name=need(doc, "name", "the file"),
        category=need(doc, "category", "the file"),
        tables=MappingProxyType(tables),
        sources=MappingProxyType(dict(sources)),
        emissivities=MappingProxyType(emis),
        emissivity_source=emis_src,
        solidus=solidus,
        liquidus=liquidus,
        latent_heat=latent,
        melting_source=msrc,
        magnetisation=mag,
        magnetic_source=magsrc,
        brazing_range=braze,
        brazing_classification=bclass,
        brazing_source=bsrc,
        composition=MappingProxyType(comp),
        composition_source=csrc,
        notes=doc.get("notes", ""),
        path=where,
    )
