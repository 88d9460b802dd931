"""The rating view headless: pick a vehicle, move it, the RF at the section changes (values from the core)."""

from __future__ import annotations

import math

import pytest

import ilkit
from ilkit import rating, views
from ilkit.design import DistributedLoad, given_distribution, permanent_effects

pytest.importorskip("ipywidgets")
pytest.importorskip("matplotlib")

BEAM = ilkit.Beam(150, {0: "pin", 45: "roller", 105: "roller", 150: "roller"}, EI=5e7, units="kip-ft")


@pytest.fixture(scope="module")
def rated():
    perm = permanent_effects(BEAM, [DistributedLoad("steel and deck", "DC", 1.1)], divisions=4,
                             quantities=("moment", "shear"))
    return rating.rate_girder(BEAM, permanent=perm, distribution=given_distribution(0.65, 0.75), divisions=4,
                              loads=["design", "Type 3", "Type 3S2"],
                              resistances=rating.Resistances(positive_moment=3200, negative_moment=2900, shear=260))


def test_the_view_opens_at_the_controlling_rating(rated):
    view = views.RatingView(rated, backend="inline")
    top = rated.controlling().sort_values("RF").iloc[0]
    assert view.vehicle.value == top["vehicle"] and view.quantity.value == top["quantity"]
    assert view.standing.rf == pytest.approx(top["RF"]) and view.rated == pytest.approx(top["RF"])
    assert "RF = " in view.readout.value and "licensed engineer" in view.caution.value
    assert "image/png" in view._repr_mimebundle_()


def test_moving_the_vehicle_changes_the_rf_at_the_section(rated):
    view = views.RatingView(rated, vehicle="Type 3", quantity="moment", at=22.5, backend="inline")
    assert view.standing.rf == pytest.approx(rated.rf("Type 3", "moment", 22.5))
    before = view.standing.rf
    view.slider.value = view.slider.value + 10
    moved = view.front
    assert moved == pytest.approx(view.slider.value * view._step)
    expected = rated.standing("Type 3", "moment", 22.5, moved, direction=view.direction.value)
    assert view.standing.rf == pytest.approx(expected.rf) and view.standing.rf != pytest.approx(before)
    assert view.standing.rf >= view.rated - 1e-9  # the rated RF is the worst placement's
    view.direction.value = "left to right"
    view.slider.value = 0  # the front at the left end, travelling right: the vehicle is off the girder
    assert view.standing.rf == math.inf and "no effect" in view.readout.value
    view.worst.click()
    assert view.standing.rf == pytest.approx(view.rated)


def test_choosing_a_vehicle_and_a_section(rated):
    view = views.RatingView(rated, vehicle="Type 3", backend="inline")
    view.vehicle.value = "Type 3S2"
    assert view.rated == pytest.approx(rated.rf("Type 3S2", view.quantity.value, float(view._section.x),
                                                side=view._section.side))
    view.section.value = 3
    s = rated.sections[3]
    assert view.rated == pytest.approx(rated.rf("Type 3S2", view.quantity.value, float(s.x), side=s.side))
    with pytest.raises(ilkit.RatingInputError):
        views.RatingView(rated, vehicle="Type 9")
    with pytest.raises(ilkit.RatingInputError):
        views.RatingView("rating")
