"""The explorer driven headless: set the controls in Python and compare every read-out
with the core result for the same beam and load (the explorer must only relay them)."""

from __future__ import annotations

import asyncio
import html
import re
import threading

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

pytest.importorskip("ipywidgets")
pytest.importorskip("matplotlib")

import ilkit
from ilkit.views.explorer import Explorer
from ilkit.views.livefigure import Coalescer

SUPPORTS = {0: "pin", 32: "roller", 76: "roller", 108: "roller"}


@pytest.fixture(scope="module")
def girder():
    # our own scenario: three spans with a suspended span on hinges at 41 and 67 (kN, m)
    return ilkit.Beam(108, SUPPORTS, hinges=[41, 67], units="kN-m")


@pytest.fixture
def ex(girder):
    explorer = Explorer(girder, backend="inline")
    yield explorer
    explorer.close()


def run_loop(make_coroutine):
    """Run a coroutine in a new event loop in its own thread (the main thread may hold
    another running loop, e.g. Playwright's)."""
    result = {}

    def target():
        try:
            result["value"] = asyncio.run(make_coroutine())
        except BaseException as err:  # re-raised in the test's thread
            result["error"] = err

    thread = threading.Thread(target=target)
    thread.start()
    thread.join()
    if "error" in result:
        raise result["error"]
    return result["value"]


def shown(explorer) -> float:
    """The number in the read-out's value field."""
    return float(re.search(r"class='ilkit-value'>([^<]+)<", explorer.readout.value).group(1))


def shown_unit(explorer) -> str:
    return re.search(r"class='ilkit-unit'>([^<]*)<", explorer.readout.value).group(1)


def message(explorer) -> str:
    return html.unescape(re.sub("<[^>]+>", "", explorer.message.value))


# ------------------------------------------------------------------ read-outs
def test_starts_on_the_moment_at_mid_first_span(ex, girder):
    assert ex.line is girder.moment(16)
    assert ex.location.value == "16"
    assert ex.value == girder.moment(16)(ex.position.value)


@pytest.fixture(scope="module")
def shared(girder):
    explorer = Explorer(girder, backend="inline")
    yield explorer
    explorer.close()


@settings(max_examples=60, deadline=None)
@given(st.floats(0, 108))
def test_slider_read_out_is_the_core_ordinate(shared, girder, x):
    shared.position.value = x
    want = girder.moment(16)(shared.position.value)
    assert shared.value == want
    assert shown(shared) == pytest.approx(want, abs=1e-4 * max(1.0, abs(want)))
    assert shown_unit(shared) == "kN·m/kN"


def test_typed_location_changes_the_line_and_the_read_out(ex, girder):
    ex.position.value = 54.0
    ex.location.value = "54"
    assert ex.line is girder.moment(54)
    assert ex.value == girder.moment(54)(54.0)  # 26 x 26 / 4 / 26 ... the core's number
    ex.location.value = "25/2"  # exact fractions are read too
    assert ex.line is girder.moment(12.5)
    assert ex.value == girder.moment(12.5)(54.0)


def test_quantity_chooser_keeps_the_location(ex, girder):
    ex.location.value = "20"
    ex.quantity.value = "shear"
    assert ex.line is girder.shear(20)
    ex.position.value = 10.0
    assert ex.value == girder.shear(20)(10.0)


def test_reaction_snaps_to_the_nearest_support(ex, girder):
    ex.location.value = "50"
    ex.quantity.value = "reaction"
    assert ex.line is girder.reaction(32)
    assert ex.location.value == "32"
    assert "exists only at the supports: taken at x = 32" in message(ex)
    ex.location.value = "100"
    assert ex.line is girder.reaction(108)
    ex.position.value = 90.0
    assert ex.value == girder.reaction(108)(90.0)


def test_hinge_shear_snaps_to_a_hinge(ex, girder):
    ex.quantity.value = "hinge_shear"
    assert ex.line is girder.hinge_shear(41)
    ex.location.value = "60"
    assert ex.line is girder.hinge_shear(67)


def test_asks_for_the_face_where_the_quantity_jumps(ex, girder):
    ex.quantity.value = "shear"
    ex.location.value = "32"
    assert ex.side.layout.display != "none"
    assert ex.line is girder.shear(32, side="left")
    assert "jumps at x = 32" in message(ex)
    ex.side.value = "right"
    assert ex.line is girder.shear(32, side="right")
    ex.position.value = 20.0
    assert ex.value == girder.shear(32, side="right")(20.0)
    ex.location.value = "20"  # no jump here: the face control goes away
    assert ex.side.layout.display == "none"
    assert ex.line is girder.shear(20)


def test_quantities_offered_follow_the_beam(girder):
    explorer = Explorer(girder, backend="inline")
    kinds = [v for _, v in explorer.quantity.options]
    assert kinds == ["reaction", "shear", "moment", "hinge_shear"]  # no fixed support, no EI
    explorer.close()
    cantilever = ilkit.Beam(10, {0: "fixed"})
    explorer = Explorer(cantilever, quantity="moment_reaction", backend="inline")
    assert explorer.line is cantilever.moment_reaction(0)
    explorer.close()


# -------------------------------------------------------------- worst placement
@pytest.mark.parametrize(("kind", "at"), [("moment", "16"), ("moment", "32"), ("shear", "54"), ("reaction", "76")])
def test_worst_placement_of_the_unit_load_is_the_lines_extreme(ex, girder, kind, at):
    ex.quantity.value = kind
    ex.location.value = at
    line = ex.line
    ex.largest.click()
    assert ex.value == line.maximum.value
    assert ex.x == line.maximum.x
    ex.smallest.click()
    assert ex.value == line.minimum.value
    assert ex.x == line.minimum.x
    assert shown(ex) == pytest.approx(line.minimum.value, abs=1e-4 * max(1, abs(line.minimum.value)))


def test_worst_placement_at_a_jump_reads_the_one_sided_value(ex, girder):
    ex.quantity.value = "shear"
    ex.location.value = "32"
    line = girder.shear(32, side="left")
    ex.smallest.click()
    # the smallest shear on the left face of pier B: the load just left of the section (a jump)
    assert line.minimum.side == "left" and line.left(32) != line(32)
    assert ex.value == line.minimum.value == line.left(32)
    assert "just left of it" in ex.readout.value
    ex.position.value = 33.0  # moving on leaves the one-sided value
    assert ex.value == line(33.0)
    assert "just left" not in ex.readout.value


# ------------------------------------------------------------------ bad entries
@pytest.mark.parametrize(
    ("text", "expected"),
    [
        ("abc", "cannot read 'abc' as a number"),
        ("200", "x=200 is off the beam; give a position from 0 to 108"),
        ("-3", "off the beam"),
        ("nan", "not a finite number"),
        ("", "cannot read '' as a number"),
    ],
)
def test_bad_location_is_a_message_not_a_traceback(ex, girder, text, expected):
    ex.location.value = "20"
    ex.location.value = text
    assert expected in message(ex)
    assert "ilkit-error" in ex.message.value
    assert ex.line is girder.moment(20)  # the previous line stays
    assert ex.location.value == "20"  # and the box shows it again
    ex.location.value = "30"
    assert message(ex) == ""


def test_bad_arguments_of_the_constructor_raise(girder):
    with pytest.raises(ilkit.BeamInputError, match="x=500 is off the beam"):
        Explorer(girder, at=500, backend="inline")
    with pytest.raises(ilkit.SideRequiredError):
        girder.shear(32)
    explorer = Explorer(girder, quantity="shear", at=32, side="right", backend="inline")
    assert explorer.line is girder.shear(32, side="right")
    explorer.close()


def test_unknown_quantity_or_backend_is_a_typed_error(girder):
    with pytest.raises(ilkit.IlkitError, match="quantity: 'torque' is not offered; choose one of 'reaction'"):
        Explorer(girder, quantity="torque", backend="inline")
    with pytest.raises(ilkit.IlkitError, match="backend: unknown figure backend 'qt'"):
        Explorer(girder, backend="qt")


def test_beam_without_units(ex):
    beam = ilkit.Beam(10, {0: "pin", 10: "roller"})
    explorer = Explorer(beam, at=4, backend="inline")
    explorer.position.value = 6.0
    # simple span, section a=4: M = a (L - x) / L = 4 x 4 / 10 for x = 6 right of the section (closed form)
    assert explorer.value == pytest.approx(1.6, abs=1e-15)
    assert shown_unit(explorer) == ""
    explorer.close()


# ------------------------------------------------------------------- rendering
def test_inline_figure_is_one_output_replaced_in_place(ex):
    for x in np.linspace(0, 108, 25):
        ex.position.value = float(x)
    ex.quantity.value = "shear"
    ex.redraw()
    outputs = ex._figure.live.widget.outputs
    assert len(outputs) == 1
    assert set(outputs[0]["data"]) == {"image/png", "text/plain"}


def test_display_bundle_carries_a_still_for_pages_without_a_kernel(ex):
    bundle = ex._repr_mimebundle_()
    assert "application/vnd.jupyter.widget-view+json" in bundle
    assert bundle["image/png"].startswith("iVBORw0KGgo")  # base64 of the PNG signature
    assert bundle["text/plain"] == "<ilkit explorer: M at x=16, unit load at x=16>"


def test_still_is_the_figure_as_it_is_now(ex):
    ex.position.value = 70.0
    still = ex.still()
    assert still.data == ex._figure.live.png() and still.data.startswith(b"\x89PNG")


@pytest.fixture
def keep_backend():
    """Importing ipympl makes it matplotlib's backend: put the one before back for the other tests."""
    import matplotlib
    import matplotlib.pyplot as plt

    before = matplotlib.get_backend()
    yield
    plt.switch_backend(before)


def test_slider_steps_redraw_only_the_moving_load(girder, keep_backend):
    """In place: a step restores the cached background and redraws the load's artists; no full draw."""
    pytest.importorskip("ipympl")
    explorer = Explorer(girder, backend="ipympl")
    canvas = explorer._figure.live.figure.canvas
    full_draws = []
    canvas.mpl_connect("draw_event", lambda event: full_draws.append(1))
    stems = explorer._figure._load.stems
    explorer.position.value = 20.0
    explorer.position.value = 21.0
    assert full_draws == []
    assert explorer._figure._load.stems is stems
    assert stems.get_xdata()[0] == 21.0
    explorer.quantity.value = "shear"  # a new line is a new background: one full draw
    assert full_draws == [1]
    explorer.close()


def test_slider_events_in_a_burst_are_coalesced_into_one_redraw(girder, monkeypatch):
    """In a kernel's event loop, read-outs follow every event at once; the redraw runs once."""
    from ilkit.views import livefigure

    monkeypatch.setattr(livefigure, "_kernel_loop", asyncio.get_running_loop)

    async def drive() -> tuple[int, list[float]]:
        explorer = Explorer(girder, backend="inline")
        before = explorer._redraw.runs
        values = []
        for x in np.linspace(1, 100, 40):
            explorer.position.value = float(x)
            values.append(explorer.value)  # synchronous read-out
        assert explorer._redraw.pending
        await asyncio.sleep(0.1)
        runs = explorer._redraw.runs - before
        explorer.close()
        return runs, values

    runs, values = run_loop(drive)
    assert runs == 1
    line = girder.moment(16)
    assert values == [line(float(x)) for x in np.linspace(1, 100, 40)]


def test_coalescer_runs_at_once_outside_a_kernel():
    calls = []
    c = Coalescer(lambda: calls.append(1))
    c.request()
    c.request()
    assert calls == [1, 1] and not c.pending

    async def in_some_other_loop() -> None:  # e.g. a test's loop: not a kernel, so no waiting
        c.request()

    run_loop(in_some_other_loop)
    assert calls == [1, 1, 1]


def test_coalescer_flush_runs_a_pending_request_now(monkeypatch):
    from ilkit.views import livefigure

    monkeypatch.setattr(livefigure, "_kernel_loop", asyncio.get_running_loop)
    calls = []

    async def drive() -> None:
        c = Coalescer(lambda: calls.append(1), delay=10.0)
        c.request()
        c.request()
        assert c.pending and calls == []
        c.flush()
        assert not c.pending and calls == [1]

    run_loop(drive)


# ------------------------------------------------------- moving loads on a continuous girder
CONTINUOUS = {0: "pin", 30: "roller", 70: "roller", 100: "roller"}
# our own five-axle vehicle (kN, m), lead axle first
VEHICLE = ilkit.AxleTrain([60, 120, 120, 100, 100], [3.6, 1.4, 6.0, 1.4], units="kN-m", name="five-axle vehicle")


@pytest.fixture(scope="module")
def continuous():
    return ilkit.Beam(100, CONTINUOUS, EI=2.4e6, units="kN-m")


@pytest.fixture(scope="module")
def moving(continuous):
    explorer = Explorer(continuous, [VEHICLE, ilkit.loads.lm71(dynamic_factor=1.0)], backend="inline")
    explorer.load.value = "five-axle vehicle"
    yield explorer
    explorer.close()


def test_load_chooser_offers_the_travelling_parts_and_the_models(continuous):
    explorer = Explorer(continuous, {"HL-93": ilkit.loads.hl93(), "train": VEHICLE}, backend="inline")
    assert list(explorer.load.options) == [
        "unit load", "HL-93: design truck", "HL-93: design tandem", "HL-93: two design trucks", "train",
    ]  # fmt: skip
    assert list(explorer.model.options) == ["HL-93", "train"]
    kinds = [v for _, v in explorer.quantity.options]
    assert "deflection" in kinds and "rotation" in kinds  # EI is given
    explorer.close()


@settings(max_examples=40, deadline=None)
@given(st.floats(-20, 120), st.sampled_from(["left to right", "right to left"]))
def test_read_out_of_a_train_is_the_core_effect(moving, continuous, x, direction):
    moving.direction.value = direction
    moving.position.value = x
    assert moving.x == moving.position.value
    want = ilkit.stand(moving.line, VEHICLE, moving.x, direction=direction)
    assert moving.value == want.effect
    assert [a.x for a in moving.placement.axles] == [a.x for a in want.axles]
    assert shown(moving) == pytest.approx(want.effect, abs=1e-4 * max(1.0, abs(want.effect)))
    assert shown_unit(moving) == "kN·m"


@pytest.mark.parametrize(("kind", "at"), [("moment", "70"), ("moment", "50"), ("shear", "30"), ("reaction", "30")])
@pytest.mark.parametrize("extreme", ["max", "min"])
def test_worst_placement_of_a_train_is_the_core_placement(moving, continuous, kind, at, extreme):
    moving.quantity.value = kind
    moving.location.value = at
    (moving.largest if extreme == "max" else moving.smallest).click()
    best = ilkit.place(moving.line, VEHICLE, extreme, beam=continuous)
    assert moving.value == best.value
    assert moving.x == moving.position.value == best.placements[0].front
    assert moving.direction.value == best.placements[0].direction
    assert "worst placement" in moving.readout.value
    moving.slider.value += 1  # one step on: the load as it stands
    assert "worst placement" not in moving.readout.value
    want = ilkit.stand(moving.line, VEHICLE, moving.x, direction=moving.direction.value)
    assert moving.value == want.effect


def test_worst_placement_keeps_the_spacing_of_a_variable_train(continuous):
    truck = ilkit.loads.design_truck()  # rear spacing 14 to 30 ft (AASHTO LRFD 3.6.1.2.2)
    explorer = Explorer(continuous, [truck], quantity="moment", at=70, backend="inline")
    explorer.load.value = "design truck"
    explorer.smallest.click()
    best = ilkit.place(explorer.line, truck, "min", beam=continuous).placements[0]
    assert explorer.value == best.effect
    explorer.slider.value -= 1
    want = ilkit.stand(explorer.line, truck, explorer.x, direction=best.direction, spacings=best.spacings)
    assert explorer.value == want.effect
    assert "spacings" in explorer.readout.value
    explorer.close()


def test_envelope_view_draws_the_core_envelope_and_reads_out_the_extremes(continuous):
    explorer = Explorer(continuous, [VEHICLE], quantity="moment", at=70, backend="inline")
    explorer.envelope.value = True
    explorer.redraw()
    env = ilkit.envelope(continuous, VEHICLE)
    drawn = next(a for a in explorer._figure.ax_line.get_lines() if a.get_gid() == "largest")
    assert sorted(drawn.get_ydata()) == pytest.approx(sorted(env.sections["M max [kN·m]"]), rel=1e-12)
    both = ilkit.extremes(continuous.moment(70), VEHICLE, beam=continuous)
    text = explorer.readout.value
    got_max = float(re.search(r"ilkit-envelope-max'>([^<]+)<", text).group(1))
    got_min = float(re.search(r"ilkit-envelope-min'>([^<]+)<", text).group(1))
    assert got_max == pytest.approx(both.maximum.value, rel=1e-4)
    assert got_min == pytest.approx(both.minimum.value, rel=1e-4)
    explorer.quantity.value = "deflection"  # no envelope of deflections: the line is shown, with a note
    explorer.redraw()
    assert "Envelopes are drawn for bending moment, shear and reactions" in message(explorer)
    explorer.close()


def test_a_load_on_a_beam_without_units_is_a_message(girder):
    bare = ilkit.Beam(20, {0: "pin", 20: "roller"})
    explorer = Explorer(bare, [VEHICLE], backend="inline")
    explorer.load.value = "five-axle vehicle"
    assert "declares no units" in message(explorer)
    assert explorer.load.value == "unit load"
    explorer.close()


def test_something_that_is_not_a_load_is_a_typed_error(continuous):
    with pytest.raises(ilkit.LoadInputError, match="loads: 42 is not a load"):
        Explorer(continuous, [42], backend="inline")


def test_missing_widgets_package_names_the_install(girder, monkeypatch):
    import sys

    monkeypatch.setitem(sys.modules, "ipywidgets", None)  # as if ipywidgets were not installed
    with pytest.raises(ilkit.MissingDependencyError, match=r"pip install 'ilkit\[notebook\]'"):
        girder.explore()


def test_the_slider_moves_by_steps_and_the_box_takes_an_exact_position(moving, continuous):
    """The slider counts steps (a browser cannot snap or round them); the position box is exact."""
    moving.quantity.value = "moment"
    moving.location.value = "70"
    moving.smallest.click()
    front = ilkit.place(moving.line, VEHICLE, "min", beam=continuous).placements[0].front
    assert moving.x == moving.position.value == front  # exact, between the slider's steps
    k = moving.slider.value
    moving.slider.value = k  # what a browser sends back for a step it shows: no change
    assert moving.x == front and "worst placement" in moving.readout.value
    xs = []
    for j in (1, 2, 3):
        moving.slider.value = k + j
        xs.append(moving.x)
    assert xs[2] - xs[1] == pytest.approx(xs[1] - xs[0]) and xs[1] > xs[0]  # equal steps
    assert abs(xs[0] - front) <= xs[1] - xs[0]  # the first step on is next to where the load was
    moving.position.value = 61.234  # typed: taken as it is
    assert moving.x == 61.234
    assert moving.value == ilkit.stand(moving.line, VEHICLE, 61.234, direction=moving.direction.value).effect
    moving.position.value = 1e4  # beyond the load's travel: a message, the load stays
    assert "outside the load's travel" in message(moving) and moving.x == 61.234


def test_close_closes_every_control(girder):
    explorer = Explorer(girder, backend="inline")
    controls = [explorer.quantity, explorer.location, explorer.slider, explorer.position, explorer.readout]
    explorer.close()
    assert all(c.comm is None for c in controls)


@pytest.mark.parametrize(
    "supports",
    [{0: "pin", 10: "fixed", 26: "roller"}, {0: "pin", 10: ilkit.Spring(rotational=2e4), 26: "roller"}],
    ids=["interior fixed support", "interior rotational spring"],
)
def test_envelope_toggle_on_a_beam_whose_moment_jumps_at_a_support(supports):
    # regression: the envelope sorted ties of two faces on result objects (TypeError in the toggle's callback)
    beam = ilkit.Beam(26, supports, EI=1e5, units="kN-m")
    lane = ilkit.UniformLoad(5, units="kN-m", name="lane")
    explorer = Explorer(beam, [lane], quantity="moment", at=10, side="right", backend="inline")
    explorer.envelope.value = True
    explorer.redraw()
    env = ilkit.envelope(beam, lane)
    drawn = next(a for a in explorer._figure.ax_line.get_lines() if a.get_gid() == "smallest")
    assert sorted(drawn.get_ydata()) == pytest.approx(sorted(env.sections["M min [kN·m]"]), rel=1e-12)
    assert "ilkit-error" not in explorer.message.value
    explorer.close()


# ------------------------------------------------------------ mix-ups (regressions: each fault by name)
def test_two_loads_with_the_same_name_are_refused(continuous):
    # regression: the second load silently replaced the first in the chooser and the envelope view
    other = ilkit.AxleTrain([50, 50], [2.0], units="kN-m", name="five-axle vehicle")
    with pytest.raises(ilkit.LoadInputError, match="is named 'five-axle vehicle', as is another load"):
        Explorer(continuous, [VEHICLE, other], backend="inline")
    with pytest.raises(ilkit.LoadInputError, match="named '1', as is another load"):
        Explorer(continuous, {1: VEHICLE, "1": other}, backend="inline")
    with pytest.raises(ilkit.LoadInputError, match="as is the explorer's unit load"):
        Explorer(continuous, [ilkit.AxleTrain([1], [], units="kN-m", name="unit load")], backend="inline")
    # a load named like a model's part: both would be offered as 'HL-93: design truck'
    clash = ilkit.AxleTrain([100], [], units="kip-ft", name="HL-93: design truck")
    with pytest.raises(ilkit.LoadInputError, match=r"two loads would be offered as 'HL-93: design truck'"):
        Explorer(continuous, [ilkit.loads.hl93(), clash], backend="inline")
    # explicit names in a mapping tell them apart
    explorer = Explorer(continuous, {"vehicle A": VEHICLE, "vehicle B": other}, backend="inline")
    assert list(explorer.load.options) == ["unit load", "vehicle A", "vehicle B"]
    explorer.load.value = "vehicle B"
    explorer.position.value = 40.0
    assert explorer.value == ilkit.stand(explorer.line, other, 40.0).effect
    explorer.close()


def test_an_error_from_a_bad_entry_is_cleared_by_the_next_valid_move(continuous):
    # regression: the message of a bad entry stayed on screen after later valid moves
    explorer = Explorer(continuous, [VEHICLE], backend="inline")
    explorer.load.value = "five-axle vehicle"
    moves = [
        ("slider", lambda: setattr(explorer.slider, "value", explorer.slider.value + 3)),
        ("direction", lambda: setattr(explorer.direction, "value", "right to left")),
        ("largest", lambda: explorer.largest.click()),
        ("envelope", lambda: setattr(explorer.envelope, "value", not explorer.envelope.value)),
    ]
    for name, move in moves:
        explorer.position.value = 1e4  # a bad entry
        assert "outside the load's travel" in message(explorer), name
        move()
        assert explorer.message.value == "", name
    explorer.location.value = "abc"  # a bad section, then a move of the load
    assert "cannot read 'abc'" in message(explorer)
    explorer.slider.value -= 1
    assert explorer.message.value == ""
    # a note (not an error) stays: the face shown where the quantity jumps
    explorer.quantity.value = "shear"
    explorer.location.value = "30"
    explorer.slider.value += 1
    assert "jumps at x = 30" in message(explorer)
    explorer.close()


def test_an_envelope_that_cannot_be_drawn_turns_its_toggle_off_with_the_reason():
    bare = ilkit.Beam(20, {0: "pin", 20: "roller"})
    explorer = Explorer(bare, [VEHICLE], backend="inline")
    explorer.envelope.value = True
    explorer.redraw()
    assert explorer.envelope.value is False and "declares no units" in message(explorer)
    assert "Showing the influence line" in message(explorer)
    explorer.slider.value += 2
    assert explorer.message.value == ""
    explorer.close()


# ---------------------------------------------------- words and units (regressions: each fault by name)
def test_controls_and_read_out_say_what_each_number_contains(continuous):
    explorer = Explorer(continuous, [VEHICLE], quantity="moment", at=50, backend="inline")
    # every box has a label with its unit (regression: the position box had none; "at x =" had no unit)
    assert explorer.location.description == "at x [m]"
    assert explorer.position.description == "load at x [m]"
    assert explorer.model.description == "load model"  # regression: the control was labelled "of"
    assert [label for label, _ in explorer.side.options] == ["left side", "right side"]  # one word, as side=
    explorer.redraw()
    assert explorer._figure.ax_line.get_title(loc="left") == "Influence line: bending moment M at x = 50 m"
    assert "most negative" in explorer.smallest.tooltip
    explorer.load.value = "five-axle vehicle"
    assert "effect of this load alone (unfactored" in explorer.readout.value
    explorer.envelope.value = True
    text = explorer.readout.value
    assert "five-axle vehicle here (the governing case, factored" in text and "smallest (most negative)" in text
    assert "qualified engineer" in explorer.caution.value and explorer.caution in explorer.widget.children
    explorer.quantity.value = "shear"
    explorer.location.value = "30"
    assert "showing the left side" in message(explorer) and "left face" not in explorer.readout.value
    explorer.close()


def test_deflection_read_out_is_in_millimetres_as_in_the_plot(continuous):
    # regression: deflection lines were plotted in m/kN with a 1e-5 axis offset
    explorer = Explorer(continuous, quantity="deflection", at=50, backend="inline")
    explorer.position.value = 45.0
    line = continuous.deflection(50)
    assert explorer.value == line(45.0)  # the core value, in m/kN
    assert shown_unit(explorer) == "mm/kN"
    assert shown(explorer) == pytest.approx(1000 * line(45.0), rel=1e-4)
    explorer.redraw()
    ax = explorer._figure.ax_line
    assert ax.get_ylabel() == "ordinate [mm/kN]"
    ax.figure.canvas.draw()
    assert ax.yaxis.get_offset_text().get_text() == ""
    ticks = [(t.get_loc(), t.label1.get_text()) for t in ax.yaxis.get_major_ticks() if t.label1.get_text()]
    assert len(ticks) >= 3
    for loc, text in ticks:  # each label reads the tick's position in mm/kN
        assert float(text.replace("−", "-")) == pytest.approx(1000 * loc, abs=1e-9)
    explorer.close()


# ------------------------------------------------------------ factored effect for a limit state (issue 11)
def factored_shown(explorer) -> float:
    return float(re.search(r"class='ilkit-factored'>([^<]+)<", explorer.readout.value).group(1))


@pytest.fixture(scope="module")
def highway():
    # our own three-span girder (kip, ft) and one girder's share of HL-93, given
    from ilkit import design

    beam = ilkit.Beam(295, {0: "pin", 90: "roller", 205: "roller", 295: "roller"}, EI=1e8, units="kip-ft")
    g = design.given_distribution(0.68, 0.88, includes_multiple_presence=True)
    return beam, design.GirderLiveLoad(ilkit.loads.hl93(), distribution=g, name="HL-93, girder 2")


@pytest.mark.parametrize(("label", "quantity", "at", "side", "expected"), [
    # γLL 1.75 (Strength I, AASHTO LRFD Table 3.4.1-1, from memory) × IM 1.33 on the truck (Table 3.6.2.1-1, from
    # memory) × gM 0.68 (given); the two-truck case also × 0.90 (3.6.1.3.1, from memory); shear × gV 0.88
    ("design truck", "moment", 36, None, 1.75 * 1.33 * 0.68),
    ("two design trucks", "moment", 90, None, 1.75 * 1.33 * 0.90 * 0.68),
    ("design tandem", "shear", 90, "right", 1.75 * 1.33 * 0.88),
    ("design truck", "reaction", 90, None, 1.75 * 1.33 * 0.88),
])
def test_the_factored_effect_is_the_core_effect_times_the_named_factors(highway, label, quantity, at, side,
                                                                         expected):
    beam, live = highway
    explorer = Explorer(beam, live=live, limit_state="Strength I", quantity=quantity, at=at, side=side,
                        backend="inline")
    assert explorer.limit_state.value == "Strength I" and explorer.limit_state.layout.display == ""
    explorer.load.value = f"HL-93, girder 2: {label}"
    for x in (40.0, 117.5, 233.0):
        explorer.position.value = x
        part = next(p for c in live.model.cases for p in c.parts if p.name == label)
        effect = ilkit.stand(explorer.line, part, x).effect
        assert explorer.value == effect
        assert explorer.factored == pytest.approx(expected * effect, rel=1e-12)
        assert factored_shown(explorer) == pytest.approx(expected * effect, rel=1e-4, abs=1e-4)
    explorer.jump("max")  # the worst placement, factored the same way
    assert explorer.factored == pytest.approx(expected * explorer.value, rel=1e-12)
    text = html.unescape(explorer.readout.value)
    assert "IM 33 %" in text and "γLL 1.75" in text and "(unfactored" in text
    assert ("case factor 0.9" in text) == (label == "two design trucks")
    explorer.close()


def test_the_limit_state_control_switches_the_factored_read_out(highway):
    beam, live = highway
    explorer = Explorer(beam, live=live, limit_state=["Strength I", "Service II"], at=36, backend="inline")
    assert [v for _, v in explorer.limit_state.options] == ["", "Strength I", "Service II"]
    assert "ilkit-factored" not in explorer.readout.value and explorer.factored is None  # the unit load
    assert "choose one of them as the load" in html.unescape(explorer.readout.value)
    explorer.load.value = "HL-93, girder 2: design truck"
    explorer.position.value = 50.0
    strength = explorer.factored
    explorer.limit_state.value = "Service II"  # γLL 1.30 (Table 3.4.1-1, from memory)
    assert explorer.factored == pytest.approx(strength * 1.30 / 1.75, rel=1e-12)
    explorer.limit_state.value = ""
    assert explorer.factored is None and "ilkit-factored" not in explorer.readout.value
    explorer.quantity.value = "rotation"
    explorer.limit_state.value = "Strength I"
    assert explorer.factored is None and "not for the rotation" in html.unescape(explorer.readout.value)
    explorer.close()


def test_without_a_girder_live_load_the_one_load_model_is_one_lane(highway):
    beam, _ = highway
    explorer = Explorer(beam, ilkit.loads.hl93(), limit_state="Service I", at=36, backend="inline")
    explorer.load.value = "HL-93: design truck"
    explorer.position.value = 40.0
    assert explorer.live.name == "HL-93, one lane"
    assert explorer.factored == pytest.approx(1.33 * explorer.value, rel=1e-12)  # γLL 1.00, IM 33 %, 1 lane
    assert "NL 1.00" in html.unescape(explorer.readout.value)
    explorer.close()


def test_a_limit_state_the_live_load_does_not_suit_is_a_typed_error(highway):
    beam, live = highway
    with pytest.raises(ilkit.DesignInputError, match="Fatigue I calls for a dynamic allowance of 15 %"):
        Explorer(beam, live=live, limit_state="Fatigue I", backend="inline")
    with pytest.raises(ilkit.DesignInputError, match="unknown limit state 'Strength VI'"):
        Explorer(beam, live=live, limit_state="Strength VI", backend="inline")
    with pytest.raises(ilkit.DesignInputError, match="say whose live load it factors"):
        Explorer(beam, [ilkit.loads.hl93(), VEHICLE.converted("kip-ft")], limit_state="Strength I",
                 backend="inline")
    with pytest.raises(ilkit.DesignInputError, match="give the girder's live load"):
        Explorer(beam, live=ilkit.loads.hl93(), limit_state="Strength I", backend="inline")


def test_a_vehicle_that_is_not_the_girders_live_load_is_not_factored(highway):
    beam, live = highway
    truck = ilkit.AxleTrain([30, 40], [14], units="kip-ft", name="site truck")
    explorer = Explorer(beam, {"site truck": truck, "HL-93": ilkit.loads.hl93()}, live=live,
                        limit_state="Strength I", backend="inline")
    explorer.load.value = "site truck"
    assert explorer.factored is None
    assert "factored effects are those of the vehicles of HL-93, girder 2" in html.unescape(explorer.readout.value)
    explorer.load.value = "HL-93: design truck"  # the same truck, offered by the model given as a load
    assert explorer.factored == pytest.approx(1.75 * 1.33 * 0.68 * explorer.value, rel=1e-12)
    explorer.close()
