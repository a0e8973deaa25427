"""Specific enthalpy, its inverse and the charge-energy breakdown.

Outside references:
* NIST-JANAF / NIST Chemistry WebBook Shomate equations (M. W. Chase, NIST-JANAF
  Thermochemical Tables, 4th ed., J. Phys. Chem. Ref. Data Monograph 9, 1998): coefficients
  below are FROM MEMORY (they reproduce the tabulated Cp(298.15 K) of each metal, which the
  tests check first, so a mistyped coefficient fails).
* Latent heats of fusion from mendeleev (a general-purpose element database).
* Theoretical melting energies per tonne, CHECKS.md (computed from such data, +-2 %).
* scipy.integrate.quad as an independent route for the integral of the cp table.
"""

import numpy as np
import pytest
from scipy.integrate import quad

from heatcalc import materials
from heatcalc.materials import Material
from heatcalc.thermal import (
    REFERENCE_TEMPERATURE,
    charge_energy,
    enthalpy_curve,
    specific_enthalpy,
    temperature_from_enthalpy,
)

# Shomate coefficients A..F (kJ/mol with t = T/1000), NIST Chemistry WebBook after Chase 1998,
# from memory. H(T) - H(298.15) = A t + B t^2/2 + C t^3/3 + D t^4/4 - E/t + F (+ fusion enthalpy
# included in F of the liquid piece); Cp = A + B t + C t^2 + D t^3 + E/t^2 [J/(mol K)].
SHOMATE = {
    "Al_solid": (298.0, 933.45, (28.08920, -5.414849, 8.560423, 3.427370, -0.277375, -9.147187)),
    "Al_liquid": (
        933.45,
        2790.812,
        (31.75104, 3.935826e-8, -1.786515e-8, 2.694171e-9, 5.480037e-9, -0.945684),
    ),
    "Cu_solid": (298.0, 1357.77, (17.72891, 28.09870, -31.25289, 13.97243, 0.068611, -6.056591)),
    "Fe_1": (298.0, 700.0, (18.42868, 24.64301, -8.913720, 9.664706, -0.012643, -6.573022)),
    "Fe_2": (700.0, 1042.0, (-57767.65, 137919.7, -122773.2, 38682.42, 3993.080, 24078.67)),
    "Fe_3": (1042.0, 1100.0, (-325.8859, 28.92876, 0.0, 0.0, 411.9629, 745.8231)),
    "Fe_4": (1100.0, 1809.0, (-776.7387, 919.4005, -383.7184, 57.08148, 242.1369, 697.6234)),
}
MOLAR_MASS = {"Al": 26.9815385e-3, "Cu": 63.546e-3, "Fe": 55.845e-3}  # kg/mol (IUPAC)


def shomate_h(piece, temperature):
    """H(T) - H(298.15 K) [J/mol] of one Shomate piece."""
    _, _, (a, b, c, d, e, f) = SHOMATE[piece]
    t = temperature / 1000.0
    return 1e3 * (a * t + b * t**2 / 2 + c * t**3 / 3 + d * t**4 / 4 - e / t + f)


def shomate_cp(piece, temperature):
    _, _, (a, b, c, d, e, _) = SHOMATE[piece]
    t = temperature / 1000.0
    return a + b * t + c * t**2 + d * t**3 + e / t**2


def per_kg_from_298(key, temperature):
    """Enthalpy rise 298.15 K -> T [J/kg] of a material file."""
    return specific_enthalpy(key, temperature) - specific_enthalpy(key, 298.15)


@pytest.mark.parametrize(
    ("piece", "cp298"),
    # Cp(298.15 K) [J/(mol K)]: Al 24.20, Cu 24.44, Fe 25.10 (NIST-JANAF, Chase 1998, from
    # memory; mendeleev lists the same three values as molar_heat_capacity).
    [("Al_solid", 24.20), ("Cu_solid", 24.44), ("Fe_1", 25.10)],
)
def test_recalled_shomate_coefficients_reproduce_cp_298(piece, cp298):
    assert shomate_cp(piece, 298.15) == pytest.approx(cp298, abs=0.06)
    # and H(298.15) - H(298.15) = 0 to the coefficients' rounding
    assert abs(shomate_h(piece, 298.15)) < 5.0


@pytest.mark.parametrize("temperature", [400.0, 600.0, 800.0, 900.0])
def test_aluminium_1050_against_shomate(temperature):
    # 99.5 % aluminium against pure aluminium (NIST-JANAF Shomate, Chase 1998, from memory):
    # a few % allowed (the data file is the 1050 grade).
    ref = shomate_h("Al_solid", temperature) / MOLAR_MASS["Al"]
    got = per_kg_from_298("al-1050", temperature)
    assert got == pytest.approx(ref, rel=0.02)


@pytest.mark.parametrize("temperature", [400.0, 700.0, 1000.0, 1300.0])
def test_copper_etp_against_shomate(temperature):
    # Solid copper (NIST-JANAF Shomate, Chase 1998, from memory), within 2 %.
    ref = shomate_h("Cu_solid", temperature) / MOLAR_MASS["Cu"]
    got = per_kg_from_298("cu-etp", temperature)
    assert got == pytest.approx(ref, rel=0.02)


@pytest.mark.parametrize(
    ("piece", "temperature"),
    [("Fe_1", 500.0), ("Fe_1", 700.0), ("Fe_2", 900.0), ("Fe_3", 1100.0), ("Fe_4", 1400.0)],
)
def test_iron_against_shomate(piece, temperature):
    # Iron through the Curie peak and the alpha-gamma change (NIST-JANAF Shomate pieces, Chase
    # 1998, from memory). The pieces do not join exactly at 700, 1042 and 1100 K, and the file
    # spreads the transformation enthalpies over 40 K: 3 % allowed.
    ref = shomate_h(piece, temperature) / MOLAR_MASS["Fe"]
    got = per_kg_from_298("iron", temperature)
    assert got == pytest.approx(ref, rel=0.03)


def test_aluminium_melting_energy_per_tonne():
    # CHECKS.md: theoretical energy from 25 degC, aluminium just molten about 295 kWh/t and to
    # 750 degC about 325 kWh/t (computed from NIST-JANAF data; +-2 %).
    al = materials.get("al-1050")
    molten = charge_energy(al, al.liquidus, t_initial=298.15)
    pour = charge_energy(al, 1023.15, t_initial=298.15)
    assert molten.per_tonne == pytest.approx(295.0, rel=0.02)
    assert pour.per_tonne == pytest.approx(325.0, rel=0.02)
    # the same from the Shomate pieces (Chase 1998, from memory), independent of CHECKS.md
    shomate = shomate_h("Al_liquid", 1023.15) / MOLAR_MASS["Al"] / 3.6e3  # kWh/t
    assert pour.per_tonne == pytest.approx(shomate, rel=0.02)


def test_iron_to_1200_degc_per_tonne():
    # CHECKS.md: iron from 25 degC to 1200 degC about 222 kWh/t (+-2 %).
    e = charge_energy("iron", 1473.15, t_initial=298.15)
    assert e.per_tonne == pytest.approx(222.0, rel=0.02)
    assert e.latent == 0.0 and e.sensible_liquid == 0.0


@pytest.mark.parametrize(("key", "symbol"), [("al-1050", "Al"), ("iron", "Fe"), ("cu-etp", "Cu")])
def test_latent_heat_against_mendeleev(key, symbol):
    # Latent heat of fusion from mendeleev (element.fusion_heat, kJ/mol); 2 % (CHECKS.md notes
    # copper sources differ by about 2 %).
    mendeleev = pytest.importorskip("mendeleev")
    element = mendeleev.element(symbol)
    ref = element.fusion_heat * 1e3 / (element.atomic_weight * 1e-3)
    mat = materials.get(key)
    t_hot = mat.liquidus + 20.0
    e = charge_energy(mat, t_hot, t_initial=mat.solidus - 20.0)
    assert e.latent == pytest.approx(ref, rel=0.025)


def test_integral_is_exact_for_the_piecewise_linear_table():
    # Independent route: adaptive quadrature of the material's own cp table (scipy.integrate).
    steel = materials.get("aisi-1045")
    table = steel.tables["specific_heat"]
    for t in [350.0, 1000.0, 1010.0, 1043.0, 1500.0]:
        ref, _ = quad(
            lambda x: float(steel.specific_heat(x)),
            REFERENCE_TEMPERATURE,
            t,
            points=table.temperature,
            limit=200,
            epsabs=1e-6,
        )
        assert specific_enthalpy(steel, t) == pytest.approx(ref, rel=1e-10)


def test_pure_metal_step_and_plateau_inverse():
    m = Material.constant(
        specific_heat=900.0,
        t_min=250.0,
        t_max=1500.0,
        solidus=933.47,
        liquidus=933.47,
        latent_heat=3.97e5,
    )
    h_solid = specific_enthalpy(m, 933.47)
    assert h_solid == pytest.approx(900.0 * (933.47 - 293.15), rel=1e-12)  # solid value at Tm
    assert specific_enthalpy(m, 933.47 + 1e-9) == pytest.approx(h_solid + 3.97e5, abs=1e-3)
    # anywhere on the step the inverse returns the melting point
    h = h_solid + np.linspace(0.0, 3.97e5, 7)
    assert np.all(temperature_from_enthalpy(m, h) == pytest.approx(933.47, abs=1e-9))
    assert temperature_from_enthalpy(m, h_solid + 3.97e5 + 900.0) == pytest.approx(934.47)


def test_alloy_releases_latent_heat_linearly():
    m = Material.constant(
        specific_heat=1000.0, t_min=250.0, t_max=1500.0, solidus=900.0, liquidus=950.0,
        latent_heat=4e5,
    )  # fmt: skip
    curve = enthalpy_curve(m)
    assert curve.heat_capacity(925.0) == pytest.approx(1000.0 + 4e5 / 50.0)
    mid = specific_enthalpy(m, 925.0) - specific_enthalpy(m, 900.0)
    assert mid == pytest.approx(1000.0 * 25.0 + 2e5)
    e = charge_energy(m, 925.0, t_initial=293.15)
    assert e.latent == pytest.approx(2e5)
    assert e.total == pytest.approx(specific_enthalpy(m, 925.0))


@pytest.mark.parametrize("key", ["aisi-1045", "iron", "al-1050", "cu-etp", "aisi-304"])
def test_inverse_round_trip(key):
    mat = materials.get(key)
    lo, hi = enthalpy_curve(mat).t_min, enthalpy_curve(mat).t_max
    t = np.linspace(lo, hi, 997)
    if mat.solidus is not None and mat.solidus == mat.liquidus:
        t = t[np.abs(t - mat.solidus) > 1e-6]
    back = temperature_from_enthalpy(mat, specific_enthalpy(mat, t))
    np.testing.assert_allclose(back, t, rtol=0, atol=1e-8)


def test_fast_inverse_table_error_bound():
    # The solver's tabulated inverse stays within its documented 1e-4 K.
    for key in ["aisi-1045", "iron", "al-1050"]:
        curve = enthalpy_curve(materials.get(key))
        knots_h, knots_t, _ = curve.inverse_table(max_error=1e-4)
        h = np.linspace(curve.h0[0], curve.h1[-1], 100_001)
        err = np.abs(np.interp(h, knots_h, knots_t) - curve.temperature(h))
        assert err.max() < 1e-4


def test_scalar_and_array_broadcast():
    h = specific_enthalpy("aisi-1045", 500.0)
    assert isinstance(h, float)
    arr = specific_enthalpy("aisi-1045", np.array([[400.0, 500.0], [600.0, 700.0]]))
    assert arr.shape == (2, 2) and arr[0, 1] == h
    assert isinstance(temperature_from_enthalpy("aisi-1045", h), float)


def test_breakdown_table_and_html():
    e = charge_energy("al-1050", 1023.15, mass=500.0)
    frame = e.to_frame()
    assert list(frame["component"]) == [
        "sensible heat, solid",
        "latent heat",
        "sensible heat, liquid",
        "total",
    ]
    assert frame["energy_J"].iloc[:3].sum() == pytest.approx(frame["energy_J"].iloc[3])
    assert frame["kWh_per_t"].iloc[3] == pytest.approx(e.per_tonne)
    assert e.total == pytest.approx(500.0 * specific_enthalpy("al-1050", 1023.15))
    assert "<table" in e._repr_html_() and "al-1050" in e._repr_html_()


def test_material_without_latent_heat_stops_at_solidus():
    m = Material.constant(specific_heat=500.0, t_min=250.0, t_max=2000.0, solidus=1700.0,
                          liquidus=1750.0)  # fmt: skip
    assert specific_enthalpy(m, 1600.0) == pytest.approx(500.0 * (1600.0 - 293.15))
    with pytest.raises(ValueError, match="no latent_heat"):
        specific_enthalpy(m, 1720.0)


# -- bad input ------------------------------------------------------------------------------
def test_bad_input_messages():
    with pytest.raises(ValueError, match=r"temperature=2000.00 K .* outside the specific-heat"):
        specific_enthalpy("al-1050", 2000.0)
    with pytest.raises(ValueError, match="temperature must be finite"):
        specific_enthalpy("al-1050", np.nan)
    with pytest.raises(ValueError, match="enthalpy=.* is outside the range"):
        temperature_from_enthalpy("al-1050", 1e9)
    with pytest.raises(ValueError, match="not in the library"):
        specific_enthalpy("no-such-alloy", 300.0)
    with pytest.raises(ValueError, match="material must be a Material"):
        specific_enthalpy(42, 300.0)
    with pytest.raises(ValueError, match="reference=.* lies outside"):
        specific_enthalpy("al-1050", 400.0, reference=100.0)
    with pytest.raises(ValueError, match="reference must be an absolute temperature"):
        specific_enthalpy("al-1050", 400.0, reference=-5.0)
    with pytest.raises(ValueError, match="no specific_heat table"):
        specific_enthalpy(Material.constant(density=7800.0), 400.0)
    with pytest.raises(ValueError, match="mass must be > 0"):
        charge_energy("al-1050", 900.0, mass=0.0)
    with pytest.raises(ValueError, match="t_final=.* must be >= t_initial"):
        charge_energy("al-1050", 400.0, t_initial=500.0)
    with pytest.raises(ValueError, match="t_initial must be an absolute temperature"):
        charge_energy("al-1050", 400.0, t_initial=0.0)
