"""Units: exact conversion factors, pint quantities in, the right numbers out, clear errors.

Reference definitions (NIST Special Publication 811, 2008 edition, Appendix B;
the international foot and pound of the 1959 agreement):
1 ft = 0.3048 m and 1 in = 0.0254 m exactly; 1 lbf = 4.4482216152605 N exactly
(0.45359237 kg times standard gravity 9.80665 m/s²), so 1 kip = 4.4482216152605 kN.
"""

from __future__ import annotations

import subprocess
import sys
from fractions import Fraction

import pint
import pytest
from hypothesis import given
from hypothesis import strategies as st
from scenarios import built_in_girder

import ilkit
from ilkit.units import FLEXURAL_STIFFNESS, LENGTH, SYSTEMS, conversion, factor_to, magnitude_in

ureg = pint.UnitRegistry()
Q_ = ureg.Quantity

FT = Fraction("0.3048")  # NIST SP 811 B.8
LBF = Fraction("4.4482216152605")  # NIST SP 811 B.8 (newtons per pound-force)


def test_system_factors_are_the_exact_definitions() -> None:
    assert conversion(SYSTEMS["kip-ft"], SYSTEMS["kN-m"]) == (FT, LBF)
    assert conversion(SYSTEMS["kN-m"], SYSTEMS["kip-ft"]) == (1 / FT, 1 / LBF)
    assert conversion(SYSTEMS["kip-in"], SYSTEMS["kip-ft"]) == (Fraction(1, 12), 1)
    assert conversion(SYSTEMS["lb-ft"], SYSTEMS["kip-ft"]) == (1, Fraction(1, 1000))


def test_feet_in_metres_beam() -> None:
    beam = ilkit.Beam(Q_(100, "ft"), {0: "fixed", Q_(100, "ft"): "roller"}, hinges=[Q_(40, "ft")], units="kN-m")
    assert beam.length == Fraction("30.48")  # 100 x 0.3048 m, exactly
    assert beam.hinges == (Fraction("12.192"),)
    # pint's own (floating-point) conversion agrees: an independent check of the factor
    assert float(beam.length) == pytest.approx(Q_(100, "ft").to("m").magnitude, rel=1e-15)


def test_metres_in_feet_beam_gives_round_feet() -> None:
    span = Q_(Fraction("30.48"), "m")
    beam = ilkit.Beam(span, {0: "pin", span: "roller"}, units="kip-ft")
    assert beam.length == 100


def test_mixed_length_units_on_a_declared_system_are_all_converted() -> None:
    beam = ilkit.Beam(Q_(37.2, "m"), {0: "fixed", Q_(3120, "cm"): "roller"}, hinges=[Q_(9600, "mm")], units="kN-m")
    assert beam == built_in_girder()


def test_flexural_stiffness_conversions() -> None:
    # 1 kip·ft² = 4.4482216152605 kN x 0.3048² m²
    beam = ilkit.Beam(10, {0: "pin", 10: "roller"}, EI=Q_(1, "kip * ft ** 2"), units="kN-m")
    assert beam.EI == LBF * FT**2
    # E = 29000 ksi, I = 1000 in⁴: EI = 29 000 000 kip·in² in the kip-in system
    steel = ilkit.Beam(120, {0: "pin", 120: "roller"}, EI=Q_(29000, "ksi") * Q_(1000, "in ** 4"), units="kip-in")
    assert steel.EI == 29_000_000
    # E = 200 GPa, I = 0.001 m⁴: EI = 200 000 kN·m²
    concrete = ilkit.Beam(10, {0: "pin", 10: "roller"}, EI=Q_(200, "GPa") * Q_(Fraction(1, 1000), "m ** 4"),
                          units="kN-m")
    assert concrete.EI == 200_000


@given(
    st.fractions(min_value=Fraction(1, 100), max_value=1000, max_denominator=1000),
    st.sampled_from([("m", Fraction(1)), ("mm", Fraction(1, 1000)), ("ft", FT), ("inch", Fraction("0.0254")),
                     ("yd", 3 * FT), ("km", Fraction(1000))]),
    st.sampled_from(["kN-m", "kip-ft", "N-mm", "kip-in"]),
)
def test_a_length_quantity_in_gives_the_exact_number_out(value: Fraction, unit: tuple[str, Fraction], system: str
                                                         ) -> None:
    name, metres = unit
    target = SYSTEMS[system]
    got = magnitude_in(Q_(value, name), dims=LENGTH, system=target, field="length")
    assert got == value * metres / target.metres_per_length


def test_in_units_converts_every_number_and_round_trips() -> None:
    beam = built_in_girder(shear_releases=[], EI=2.1e5)
    us = beam.in_units("kip-ft")
    assert us.length == Fraction("37.2") / FT and us.supports[1].at == Fraction("31.2") / FT
    assert us.EI == 210_000 / (LBF * FT**2)
    assert us.in_units("kN-m") == beam


def test_lines_of_a_converted_beam_scale_as_their_units() -> None:
    metric = built_in_girder()
    us = metric.in_units("kip-ft")
    x_m = Fraction("34.2")
    x_ft = x_m / FT
    # a reaction line is force per force: the same number in any system
    assert us.reaction(Fraction("31.2") / FT).ordinate_exact(x_ft) == metric.reaction(31.2).ordinate_exact(x_m)
    # a moment line is a length (force x length per force): feet = metres / 0.3048
    assert us.moment(Fraction("4.8") / FT).ordinate_exact(x_ft) == metric.moment(4.8).ordinate_exact(x_m) / FT
    # a load position given as a quantity is converted too
    assert metric.moment(4.8)(Q_(x_ft, "ft")) == pytest.approx(metric.moment(4.8)(34.2), rel=1e-14)
    assert metric.moment(Q_(480, "cm")) is metric.moment(4.8)


def test_quantity_without_declared_units_names_the_fix() -> None:
    with pytest.raises(ilkit.UnitsError, match=r"declares no unit system.*units='kN-m'.*units='kip-ft'"):
        ilkit.Beam(Q_(30, "m"), {0: "pin", 30: "roller"})
    with pytest.raises(ilkit.UnitsError, match="declares no unit system"):
        ilkit.Beam(30, {0: "pin", 30: "roller"}).moment(Q_(5, "m"))
    with pytest.raises(ilkit.UnitsError, match="declares no unit system"):
        ilkit.Beam(30, {0: "pin", 30: "roller"}).moment(5)(Q_(5, "m"))


def test_wrong_dimension_and_unknown_units_are_errors() -> None:
    with pytest.raises(ilkit.UnitsError, match=r"is a force, but length must be a length; give it in m"):
        ilkit.Beam(Q_(30, "kN"), {0: "pin", 30: "roller"}, units="kN-m")
    with pytest.raises(ilkit.UnitsError, match=r"flexural stiffness"):
        ilkit.Beam(30, {0: "pin", 30: "roller"}, EI=Q_(5, "kN * m"), units="kN-m")
    with pytest.raises(ilkit.UnitsError, match=r"no exact conversion for the unit 'nautical_mile'.*\.to\('m'\)"):
        ilkit.Beam(Q_(1, "nmi"), {0: "pin", Q_(1, "nmi"): "roller"}, units="kN-m")
    with pytest.raises(ilkit.UnitsError) as err:
        factor_to(Q_(1, "s"), dims=FLEXURAL_STIFFNESS, system=SYSTEMS["kip-ft"], field="EI")
    assert "kip * ft ** 2" in str(err.value)
    assert isinstance(err.value, ilkit.BeamInputError) and err.value.field == "EI"


def test_changing_units_without_converting_is_refused() -> None:
    beam = ilkit.Beam(30, {0: "pin", 30: "roller"}, units="kN-m")
    with pytest.raises(ilkit.UnitsError, match=r"beam\.in_units\('kip-ft'\)"):
        beam.replace(units="kip-ft")
    # declaring units on a beam that had none reinterprets nothing
    assert ilkit.Beam(30, {0: "pin", 30: "roller"}).replace(units="kip-ft").units is SYSTEMS["kip-ft"]
    with pytest.raises(ilkit.UnitsError, match="declares no unit system"):
        ilkit.Beam(30, {0: "pin", 30: "roller"}).in_units("kN-m")


def test_plain_numbers_still_exact_and_core_imports_without_pint() -> None:
    code = (
        "import sys; sys.modules['pint'] = None\n"
        "import ilkit\n"
        "b = ilkit.Beam('12.5', {0: 'pin', '12.5': 'roller'}, units='kip-ft')\n"
        "print(b.length, b.moment(5).ordinate_exact(5))"
    )
    out = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True, check=True)
    assert out.stdout.split() == ["25/2", "3"]  # a (L - a) / L = 5 x 7.5 / 12.5 = 3


def test_stiffness_ranges_and_springs_convert() -> None:
    # EI ranges with quantity positions and stiffnesses
    half, end = Q_(10, "ft"), Q_(20, "ft")
    beam = ilkit.Beam(end, {0: "pin", end: "roller"},
                      EI=[(0, half, Q_(1, "kip * ft ** 2")), (half, end, Q_(2, "kip * ft ** 2"))], units="kN-m")
    assert beam.EI == ((0, 10 * FT, LBF * FT**2), (10 * FT, 20 * FT, 2 * LBF * FT**2))
    # springs convert with in_units: vertical force/length, rotational force x length
    metric = ilkit.Beam(10, {0: "pin", 10: ilkit.Spring(vertical=1000, rotational=500)}, EI=100, units="kN-m")
    us = metric.in_units("kip-ft")
    spring = us.supports[1].spring
    assert spring.vertical == 1000 * FT / LBF and spring.rotational == 500 / (LBF * FT)
    assert us.in_units("kN-m") == metric
    # the spring's force line is the same number in any system (force per force)
    assert us.reaction(10 / FT, exact=True).ordinate_exact(5 / FT) == metric.reaction(10, exact=True).ordinate_exact(5)
