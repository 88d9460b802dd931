"""Views given the wrong kind of argument raise typed ilkit errors (input audit of the views)."""

from __future__ import annotations

import matplotlib

matplotlib.use("Agg")

import pytest

import ilkit
from ilkit import views
from ilkit.errors import IlkitError, UnsupportedResultError

BEAM = ilkit.Beam(10, {0: "pin", 10: "roller"}, units="kN-m")
LINE = BEAM.moment(4)


@pytest.mark.parametrize("fn", [views.plot_line, views.sketch, views.derivation])
@pytest.mark.parametrize("bad", [5, "moment", None, BEAM])
def test_line_views_refuse_what_is_not_a_line(fn, bad):
    with pytest.raises(UnsupportedResultError, match="give an influence line"):
        fn(bad)


def test_draw_beam_refuses_what_is_not_a_beam():
    with pytest.raises(UnsupportedResultError, match=r"give an ilkit\.Beam"):
        views.draw_beam(LINE)


@pytest.mark.parametrize("fn, arg", [(views.plot_line, LINE), (views.sketch, LINE), (views.draw_beam, BEAM)])
def test_axes_must_be_matplotlib_axes(fn, arg):
    with pytest.raises(IlkitError, match="ax must be matplotlib axes"):
        fn(arg, ax="left")


@pytest.mark.parametrize("digits", [None, "4", 0, -1, True, 2.5])
def test_to_latex_digits_must_be_a_whole_number(digits):
    with pytest.raises(IlkitError, match="digits: give a whole number"):
        views.to_latex(LINE, digits=digits)


@pytest.mark.parametrize("path", [None, 5, ""])
def test_paths_must_be_paths(path):
    with pytest.raises(IlkitError, match="path must be a file path"):
        views.to_csv(LINE, path)
    with pytest.raises(IlkitError, match="path must be a file path"):
        views.write_calculation_sheet(BEAM, path)


def test_calculation_sheet_arguments(tmp_path):
    with pytest.raises(IlkitError, match="lines: give a list of influence lines"):
        views.write_calculation_sheet(BEAM, tmp_path / "s", lines=5)
    with pytest.raises(UnsupportedResultError, match="give influence lines"):
        views.write_calculation_sheet(BEAM, tmp_path / "s", lines=[5])
    with pytest.raises(IlkitError, match="info must be a mapping"):
        views.write_calculation_sheet(BEAM, tmp_path / "s", info="Bridge 12")
    assert not (tmp_path / "s.html").exists()


def test_plot_envelope_arguments():
    from ilkit import loads

    env = loads.envelope(BEAM, loads.lm2(), divisions=4)
    with pytest.raises(IlkitError, match="kind must be one of"):
        views.plot_envelope(env, kind=["moment"])
    with pytest.raises(UnsupportedResultError, match=r"loads\.envelope"):
        views.plot_envelope(LINE)


def test_explorer_side_is_checked():
    with pytest.raises(IlkitError, match="side"):
        BEAM.explore(side="abc")
    with pytest.raises(IlkitError, match="side"):
        BEAM.explore(side=5)
