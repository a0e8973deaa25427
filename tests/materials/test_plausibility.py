"""Plausibility of every material file in data/materials.

Each file is read twice: straight from the TOML text (tomllib and pint, without the loader), and
through :mod:`heatcalc.materials`. The bounds are physical ranges for metals and for each category
(common practice, no source; wide enough for any real alloy of the category, narrow enough that a
value typed wrong by a factor of 10 in most properties, and by 1,000 in all, falls outside).
A self-test below corrupts values by 1,000 to show that the checks can fail.
"""

import copy
import re
import tomllib
from pathlib import Path

import numpy as np
import pint
import pytest
import scipy.constants as sc

DATA = Path(__file__).resolve().parents[2] / "data" / "materials"
FILES = sorted(DATA.glob("*.toml"))
KEYS = [p.stem for p in FILES]
T_ROOM = sc.zero_Celsius + 20.0
# Sommerfeld value of the Lorenz number pi^2/3 (k_B/e)^2 (free-electron theory)
L0 = np.pi**2 / 3 * (sc.k / sc.e) ** 2

ureg = pint.UnitRegistry()  # a registry of our own: this reading does not rely on the loader

TABLES = {
    "resistivity": "ohm*m",
    "thermal_conductivity": "W/(m*K)",
    "specific_heat": "J/(kg*K)",
    "density": "kg/m**3",
}
CATEGORIES = {"steel", "stainless", "aluminium", "copper", "brass", "iron", "filler"}
MAGNETIC_CATEGORIES = {"steel", "iron"}

# Bounds for any metal, solid or liquid (SI units)
METAL_BOUNDS = {
    "resistivity": (1e-8, 2e-6),
    "thermal_conductivity": (5.0, 500.0),
    "specific_heat": (100.0, 2000.0),
    "density": (2000.0, 12000.0),
}
# Narrower bounds by category, solid and liquid, room temperature to the working top
CATEGORY_BOUNDS = {
    "steel": {
        "resistivity": (1.0e-7, 1.4e-6),
        "thermal_conductivity": (15.0, 70.0),
        "specific_heat": (400.0, 2000.0),
        "density": (7200.0, 8000.0),
    },
    "stainless": {
        "resistivity": (5e-7, 1.4e-6),
        "thermal_conductivity": (10.0, 40.0),
        "specific_heat": (400.0, 800.0),
        "density": (7200.0, 8100.0),
    },
    "iron": {
        "resistivity": (8e-8, 1.5e-6),
        "thermal_conductivity": (20.0, 100.0),
        "specific_heat": (400.0, 2000.0),
        "density": (6800.0, 7950.0),
    },
    "aluminium": {
        "resistivity": (2.5e-8, 3.5e-7),
        "thermal_conductivity": (60.0, 260.0),
        "specific_heat": (850.0, 1300.0),
        "density": (2200.0, 2850.0),
    },
    "copper": {
        "resistivity": (1.5e-8, 2.5e-7),
        "thermal_conductivity": (140.0, 420.0),
        "specific_heat": (370.0, 560.0),
        "density": (7700.0, 9000.0),
    },
    "brass": {
        "resistivity": (3e-8, 3e-7),
        "thermal_conductivity": (80.0, 250.0),
        "specific_heat": (350.0, 550.0),
        "density": (7900.0, 8800.0),
    },
    "filler": {
        "resistivity": (1.5e-8, 5e-7),
        "thermal_conductivity": (20.0, 420.0),
        "specific_heat": (200.0, 600.0),
        "density": (7000.0, 10500.0),
    },
}
# Working tops [degC] the built-in materials must reach (jobs: through-heating and forging of
# steel to 1250 degC, melting of aluminium, copper as coil and workpiece, brass below its
# solidus). Files not listed here only have to start at room temperature.
REQUIRED_TOP_DEGC = {
    "aisi-1045": 1250.0,
    "aisi-4140": 1250.0,
    "aisi-304": 1200.0,
    "iron": 1250.0,
    "al-1050": 1000.0,
    "al-6061": 1000.0,
    "cu-etp": 1000.0,
    "brass-c26000": 850.0,
}
PROVENANCE = (
    "from memory",
    "recalled",
    "read",
    "computed",
    "estimate",
    "common practice",
    "invented",
)


# -- reading a file without the loader ----------------------------------------------------
def to_kelvin(value, unit):
    return ureg.Quantity(np.asarray(value, dtype=float), unit).to("K").magnitude


def read(path):
    """The file as a dict: raw TOML plus SI tables under doc['_si'] (temperatures in K)."""
    doc = tomllib.loads(Path(path).read_text(encoding="utf-8"))
    return with_si(doc)


def with_si(doc):
    tunit = doc["temperature_unit"]
    si = {}
    for q, unit in TABLES.items():
        if q in doc:
            b = doc[q]
            t = to_kelvin(b["temperature"], tunit)
            v = ureg.Quantity(np.asarray(b["value"], dtype=float), b["unit"]).to(unit).magnitude
            si[q] = (t, v)
    scalars = {}
    for block, names in (
        ("melting", ("solidus", "liquidus")),
        ("magnetic", ("curie_temperature",)),
        ("brazing", ("range_min", "range_max")),
    ):
        for name in names:
            if block in doc:
                scalars[name] = float(to_kelvin(doc[block][name], tunit))
    doc["_si"] = si
    doc["_t"] = scalars
    return doc


def table_sources(block):
    src = block["source"]
    return [src] if isinstance(src, str) else list(src)


# -- the checks, as functions returning a list of problems ----------------------------------
def problems(doc, key):
    """Every implausible item of one material file (empty list: plausible)."""
    out = []
    cat = doc.get("category")
    si, ts = doc["_si"], doc["_t"]

    def bad(msg):
        out.append(f"{key}: {msg}")

    # file-level items
    if doc.get("key") != key:
        bad(f"key={doc.get('key')!r} differs from the file name")
    if not doc.get("name"):
        bad("no name")
    if cat not in CATEGORIES:
        bad(f"category={cat!r}")
    if doc.get("temperature_unit") not in ("degC", "K", "degF"):
        bad("temperature_unit")
    sources = doc.get("sources", {})
    if not sources:
        bad("no [sources]")
    for s, text in sources.items():
        if len(text) < 30 or not any(p in text.lower() for p in PROVENANCE):
            bad(f"source {s} does not say where its figures come from: {text!r}")
        if not (
            re.search(r"\b(1[89]|20)\d\d\b", text) or re.search("common practice|undated", text)
        ):
            bad(f"source {s} has no year")

    # every table and block names known sources; every source is used
    used = set()
    for q in TABLES:
        if q in doc:
            keys = table_sources(doc[q])
            if len(keys) not in (1, len(doc[q]["value"])):
                bad(f"[{q}] has {len(keys)} sources for {len(doc[q]['value'])} points")
            used |= set(keys)
    for block in ("emissivity", "melting", "magnetic", "brazing", "composition"):
        if block in doc:
            if "source" not in doc[block]:
                bad(f"[{block}] has no source")
            else:
                used.add(doc[block]["source"])
    for s in used - set(sources):
        bad(f"source key {s!r} is not in [sources]")
    for s in set(sources) - used:
        bad(f"source {s!r} is never used")

    solidus, liquidus = ts.get("solidus"), ts.get("liquidus")
    for q, (t, v) in si.items():
        if len(doc[q]["temperature"]) != len(doc[q]["value"]) or t.size < 2:
            bad(f"[{q}] needs equal-length temperature and value lists of 2 points or more")
            continue
        if not (np.all(np.isfinite(t)) and np.all(np.isfinite(v))):
            bad(f"[{q}] holds non-finite numbers")
            continue
        dt = np.diff(t)
        if np.any(dt < 0):
            bad(f"[{q}] temperatures decrease")
        if np.any((dt[1:] == 0) & (dt[:-1] == 0)):
            bad(f"[{q}] a temperature appears three times")
        jumps = np.flatnonzero(dt == 0)
        if np.any(v[jumps] == v[jumps + 1]):
            bad(f"[{q}] a repeated temperature without a jump in value")
        lo, hi = METAL_BOUNDS[q]
        if np.any(v < lo) or np.any(v > hi):
            bad(f"[{q}] outside metal bounds {lo}-{hi}: {v.min()}-{v.max()}")
        if cat in CATEGORY_BOUNDS:
            clo, chi = CATEGORY_BOUNDS[cat][q]
            if np.any(v < clo) or np.any(v > chi):
                bad(f"[{q}] outside {cat} bounds {clo}-{chi}: {v.min()}-{v.max()}")
        # range: from room temperature to the working top
        if t[0] > T_ROOM + 0.01:
            bad(f"[{q}] starts at {t[0] - sc.zero_Celsius:.1f} degC, above room temperature")
        top = REQUIRED_TOP_DEGC.get(key)
        if top is not None and t[-1] < top + sc.zero_Celsius - 0.01:
            bad(f"[{q}] ends at {t[-1] - sc.zero_Celsius:.0f} degC, below {top:.0f} degC")
        # solid and liquid: a table that goes past the solidus holds the last solid value at
        # the solidus and the first liquid value at the liquidus, so that interpolation never
        # mixes them outside the melting range
        if solidus is not None and t[-1] > solidus + 0.01:
            if doc["melting"].get("latent_heat") is None:
                bad(f"[{q}] goes above the solidus but [melting] has no latent heat")
            at_sol = np.flatnonzero(np.isclose(t, solidus, atol=0.01))
            at_liq = np.flatnonzero(np.isclose(t, liquidus, atol=0.01))
            if at_sol.size == 0 or at_liq.size == 0 or t[-1] < liquidus:
                bad(f"[{q}] goes above the solidus without points at solidus and liquidus")
            else:
                v_sol, v_liq = v[at_sol[0]], v[at_liq[-1]]
                if np.any((t > solidus + 0.01) & (t < liquidus - 0.01)):
                    bad(f"[{q}] has points inside the melting range")
                if q == "resistivity" and not v_liq > v_sol:
                    bad("liquid resistivity not above the solid's")
                if q == "density" and not v_liq < v_sol:
                    bad("liquid density not below the solid's")

    # Wiedemann-Franz: k rho / T between 0.85 and 1.6 times the Sommerfeld value for metals
    # (electrons carry about L0; lattice conduction adds, most in steels at room temperature)
    if "resistivity" in si and "thermal_conductivity" in si:
        (tr, rv), (tk, kv) = si["resistivity"], si["thermal_conductivity"]
        inside = (tk >= tr[0]) & (tk <= tr[-1])
        for T, k in zip(tk[inside], kv[inside], strict=True):
            if solidus is not None and solidus < T < liquidus:
                continue
            ratio = k * np.interp(T, tr, rv) / T / L0
            if not 0.85 <= ratio <= 1.6:
                bad(f"Lorenz ratio {ratio:.2f} at {T:.0f} K outside 0.85-1.6")

    # emissivity
    if "emissivity" in doc:
        e = {c: x for c, x in doc["emissivity"].items() if c != "source"}
        if not e:
            bad("[emissivity] lists no surface")
        for c, x in e.items():
            if not (isinstance(x, (int, float)) and 0 < x <= 1):
                bad(f"emissivity {c}={x!r} not in (0, 1]")
        if {"bright", "oxidised"} <= set(e) and not e["bright"] < e["oxidised"]:
            bad("a bright surface should emit less than an oxidised one")
        if "molten" in e and not any(t[-1] > (liquidus or np.inf) for t, _ in si.values()):
            bad("molten emissivity for a material whose tables do not reach the liquid")

    # melting
    if "melting" in doc:
        if not solidus <= liquidus:
            bad("liquidus below solidus")
        if not 500.0 < solidus < 2000.0:
            bad(f"solidus {solidus} K")
        latent = doc["melting"].get("latent_heat")
        if latent is not None and not 1e5 <= latent <= 5e5:
            bad(f"latent heat {latent} J/kg outside 1e5-5e5")
        for q, (t, _) in si.items():
            if t[-1] > solidus + 0.01 and t[-1] < liquidus:
                bad(f"[{q}] ends inside the melting range")
    elif cat != "filler":
        bad("no [melting] block")

    # magnetic data only for ferromagnetic categories, and complete there
    if "magnetic" in doc:
        b = doc["magnetic"]
        if cat not in MAGNETIC_CATEGORIES:
            bad(f"[magnetic] for non-magnetic category {cat!r}")
        tc = ts["curie_temperature"]
        if not sc.zero_Celsius + 600 <= tc <= sc.zero_Celsius + 800:
            bad(f"Curie temperature {tc - sc.zero_Celsius:.0f} degC outside 600-800")
        if not 1.5 <= b["saturation_flux_density"] <= 2.2:
            bad("saturation flux density outside 1.5-2.2 T")
        if not 10 <= b["initial_relative_permeability"] <= 1e4:
            bad("initial relative permeability outside 10-1e4")
        if not (0 < b.get("kuzmin_s", 0.35) < 1 and b.get("kuzmin_p", 4.0) > 1.5):
            bad("Kuz'min shape parameters")
        if "specific_heat" in si:  # the magnetic change shows as the specific-heat peak
            t, v = si["specific_heat"]
            t_peak = t[np.argmax(v)]
            if abs(t_peak - tc) > 60.0:
                bad(f"specific-heat peak at {t_peak:.0f} K, far from Curie {tc:.0f} K")
    elif cat in MAGNETIC_CATEGORIES:
        bad("ferromagnetic category without [magnetic] block")

    # brazing data only for fillers, and complete there
    if "brazing" in doc:
        if cat != "filler":
            bad("[brazing] for a material that is not a filler")
        lo_b, hi_b = ts["range_min"], ts["range_max"]
        if not (solidus is not None and lo_b > solidus and hi_b > liquidus and hi_b > lo_b):
            bad("brazing range must start above the solidus and end above the liquidus")
        if hi_b - liquidus > 200.0:
            bad("brazing range ends far above the liquidus")
    elif cat == "filler":
        bad("filler without [brazing] block")
    return out


# -- tests: the TOML read directly ----------------------------------------------------------
def test_files_exist():
    assert len(FILES) >= 10
    assert {"aisi-1045", "aisi-4140", "aisi-304", "iron", "al-1050", "al-6061", "cu-etp",
            "bag-7", "bcup-5"} <= set(KEYS)  # fmt: skip
    assert any(k.startswith("brass-") for k in KEYS)


@pytest.mark.parametrize("path", FILES, ids=KEYS)
def test_file_is_plausible(path):
    assert problems(read(path), path.stem) == []


@pytest.mark.parametrize("path", FILES, ids=KEYS)
def test_factor_1000_errors_are_caught(path):
    """Self-test of the checks: any table value or scalar off by 1,000 is reported.

    (Off by 10, all but a few of the table values of the built-in files are reported too.)
    """
    doc = tomllib.loads(path.read_text(encoding="utf-8"))
    cases = []
    for q in TABLES:
        if q in doc:
            for i in range(len(doc[q]["value"])):
                for f in (1e3, 1e-3):
                    cases.append((q, "value", i, f))
    for block, name in (
        ("melting", "latent_heat"),
        ("magnetic", "saturation_flux_density"),
        ("magnetic", "initial_relative_permeability"),
        ("emissivity", "oxidised"),
    ):
        if name in doc.get(block, {}):
            cases.append((block, name, None, 1e3))
    assert cases
    for block, name, i, f in cases:
        wrong = copy.deepcopy(doc)
        if i is None:
            wrong[block][name] *= f
        else:
            wrong[block][name][i] *= f
        assert problems(with_si(wrong), path.stem), (block, name, i, f)


def test_checks_catch_structural_errors():
    """Self-test of the checks on one file: sources, ordering, melting and magnetic blocks."""
    doc = tomllib.loads((DATA / "cu-etp.toml").read_text(encoding="utf-8"))
    edits = {
        "unknown source": lambda d: d["density"].__setitem__("source", "NOPE"),
        "orphan source": lambda d: d["sources"].__setitem__("EXTRA", "Somebody, 1999, from memory"),
        "order": lambda d: d["density"]["temperature"].reverse(),
        "magnetic copper": lambda d: d.__setitem__(
            "magnetic",
            {
                "curie_temperature": 1000,
                "saturation_flux_density": 2.0,
                "initial_relative_permeability": 300,
                "source": "DENSITY",
            },
        ),  # fmt: skip
        "liquid lighter": lambda d: d["density"]["value"].__setitem__(-3, 9000),
        "no latent heat": lambda d: d["melting"].pop("latent_heat"),
        "too short": lambda d: d.__setitem__(
            "resistivity",
            {k: (v[:12] if isinstance(v, list) else v) for k, v in d["resistivity"].items()},
        ),
    }
    for what, edit in edits.items():
        wrong = copy.deepcopy(doc)
        edit(wrong)
        assert problems(with_si(wrong), "cu-etp"), what


# -- tests: the same files through the loader -------------------------------------------------
def test_loader_lists_exactly_the_files():
    from heatcalc import materials

    assert materials.available() == KEYS


@pytest.mark.parametrize("key", KEYS)
def test_loaded_material_matches_file_and_bounds(key):
    from heatcalc import materials

    doc = read(DATA / f"{key}.toml")
    m = materials.get(key)
    assert m.key == key and m.category == doc["category"]
    for q, (t, v) in doc["_si"].items():
        tab = m.tables[q]
        # the loader serves the file's values in SI units, at the file's temperatures
        np.testing.assert_allclose(tab.temperature, t, rtol=1e-12)
        np.testing.assert_allclose(tab.value, v, rtol=1e-12)
        assert set(tab.sources) <= set(m.sources)
        assert m.temperature_range(q) == pytest.approx((t[0], t[-1]))
        # values between the points stay inside the bounds, scalar and array calls agree
        grid = np.linspace(t[0], t[-1], 400)
        vals = m.value(q, grid)
        lo, hi = CATEGORY_BOUNDS.get(doc["category"], METAL_BOUNDS)[q]
        assert np.all((vals >= lo) & (vals <= hi)), q
        assert m.value(q, float(grid[7])) == pytest.approx(vals[7])
        # outside the table: refused, not extrapolated
        with pytest.raises(materials.OutOfRangeError):
            m.value(q, t[-1] + 1.0)
        with pytest.raises(ValueError):
            m.value(q, t[0] - 1.0)
    for name, value in doc["_t"].items():
        got = {
            "solidus": m.solidus,
            "liquidus": m.liquidus,
            "curie_temperature": m.curie_temperature,
            "range_min": m.brazing_range[0] if m.brazing_range else None,
            "range_max": m.brazing_range[1] if m.brazing_range else None,
        }[name]
        assert got == pytest.approx(value), name
    for cond, e in doc.get("emissivity", {}).items():
        if cond != "source":
            assert m.emissivity(cond) == e


@pytest.mark.parametrize("key", KEYS)
def test_loaded_permeability_is_plausible(key):
    from heatcalc import materials

    m = materials.get(key)
    h = np.array([1e3, 1e4, 1e5])  # A/m, the range of induction-heating surface fields
    mu = m.relative_permeability(h, T_ROOM)
    if m.curie_temperature is None:
        np.testing.assert_array_equal(mu, 1.0)
        return
    # ferromagnetic below Curie: falling with field, a few hundred at 1 kA/m, towards 1 at
    # high field; non-magnetic just above Curie (common practice, no source)
    assert np.all(np.diff(mu) < 0)
    assert 100.0 <= mu[0] <= 2000.0
    assert 1.0 < mu[-1] < 30.0
    assert m.relative_permeability(1e4, m.curie_temperature + 5.0) == 1.0
