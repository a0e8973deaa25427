"""Andrews' transformation temperatures against the formula's own worked values and handbooks."""

import pytest

from heatcalc.materials import ac1_andrews, ac3_andrews


def test_andrews_ac3_for_1045():
    # Andrews, J. Iron Steel Inst. 203 (1965) 721, Ac3 formula evaluated by hand for
    # C 0.45, Mn 0.75, Si 0.25 (mass %): 910 - 203*sqrt(0.45) + 44.7*0.25 = 784.99 degC.
    comp = {"C": 0.45, "Mn": 0.75, "Si": 0.25}
    assert ac3_andrews(comp) - 273.15 == pytest.approx(784.99, abs=0.01)
    # Handbook Ac3 of AISI 1045 is about 780 degC (ASM Handbook vol. 4, 1991; from memory, +-15)
    assert ac3_andrews(comp) - 273.15 == pytest.approx(780, abs=15)


def test_andrews_ac1_near_eutectoid_temperature():
    # Plain carbon steel: Ac1 close to the Fe-C eutectoid 727 degC (ASM Handbook vol. 3, Fe-C
    # diagram; from memory): Andrews gives 723 - 10.7*Mn + 29.1*Si.
    assert ac1_andrews({"C": 0.45, "Mn": 0.75, "Si": 0.25}) - 273.15 == pytest.approx(727, abs=8)


def test_trends():
    # more carbon lowers Ac3; more silicon raises it (Andrews 1965, signs of the coefficients)
    assert ac3_andrews({"C": 0.6}) < ac3_andrews({"C": 0.2})
    assert ac3_andrews({"C": 0.4, "Si": 1.0}) > ac3_andrews({"C": 0.4})


@pytest.mark.parametrize(
    ("comp", "match"),
    [
        ({"C": 0.8}, "beyond Andrews"),
        ({"C": 0.4, "Xx": 1.0}, "'Xx' is not known"),
        ({"C": -0.1}, r"composition\['C'\]"),
        ({"Mn": 0.5}, "carbon content"),
    ],
)
def test_bad_composition(comp, match):
    with pytest.raises(ValueError, match=match):
        ac3_andrews(comp)
