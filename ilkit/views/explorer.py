"""The influence-line explorer: move a load along a beam and watch the response.

``beam.explore()`` (or ``Explorer(beam)``) shows, in one widget:

* the beam with its supports and releases, and the influence line of the
  chosen quantity with its key ordinates and shaded areas;
* a chooser for the quantity and a box for its location (reactions snap to
  the supports, hinge shears to the hinges; where the quantity jumps the
  explorer asks for the face);
* a load chooser (a unit load and the load models given), a slider for the
  load's position and a travel direction; the axles are drawn on the beam and
  on the line, and the current value of the quantity is read out with units;
* buttons that jump to the worst placement (largest, smallest), and an
  envelope view of a chosen load model.

The explorer holds no engineering logic: every number it shows comes from a
core call (the line's ordinates and extremes, :func:`ilkit.loads.stand`,
:func:`ilkit.loads.place`, :func:`ilkit.loads.envelope`), and the drawings
come from :mod:`ilkit.views.draw` and :mod:`ilkit.views.plot`.

Speed: a slider step updates the read-out at once (synchronously, so a cell
that sets ``explorer.position.value`` and then reads ``explorer.value`` sees
the new value); the redraw is coalesced (:class:`ilkit.views.livefigure.Coalescer`)
and only redraws the moving load on a cached background.  A bad entry is
shown as a message inside the widget, never as a traceback.

Results must be checked by a qualified engineer; local codes and licensed
practice govern.
"""

from __future__ import annotations

import base64
import html
import math
from collections.abc import Mapping, Sequence
from fractions import Fraction
from typing import TYPE_CHECKING, Any, Literal

from ilkit._exact import fmt, to_exact
from ilkit.errors import IlkitError, SideRequiredError
from ilkit.quantity import KINDS
from ilkit.views._explorer_figure import Axle, ExplorerFigure, Loading
from ilkit.views.livefigure import Backend, Coalescer, _require

if TYPE_CHECKING:  # pragma: no cover
    from ilkit.influence import InfluenceLine
    from ilkit.model import Beam

__all__ = ["Explorer", "UNIT_LOAD"]

UNIT_LOAD = "unit load"
"""Name of the unit load in the load chooser."""

Extreme = Literal["max", "min"]
Direction = Literal["left to right", "right to left"]

_WORDS = {
    "reaction": "reaction",
    "moment_reaction": "moment reaction",
    "shear": "shear",
    "moment": "bending moment",
    "hinge_shear": "hinge shear",
    "deflection": "deflection",
    "rotation": "rotation",
}


class Explorer:
    """Interactive influence-line explorer of a beam (an ipywidgets layout).

    Parameters
    ----------
    beam:
        The beam to explore.
    loads:
        Load models offered besides the unit load: one model, a list, or a
        ``{name: model}`` mapping (see :mod:`ilkit.loads`).  Needs a beam with
        units.
    quantity:
        The quantity shown first (``"moment"``, ``"shear"``, ``"reaction"``,
        ...; default ``"moment"``).
    at:
        Its location (beam length unit); default: the middle of the first span
        (the first support for reactions).
    side:
        The face, where the quantity jumps at ``at``.
    backend:
        ``"inline"`` or ``"ipympl"``; default: follow matplotlib's backend.

    Attributes
    ----------
    quantity, location, side, load, direction, position, largest, smallest, envelope:
        The controls (ipywidgets); set their ``value`` to drive the explorer
        from code.
    readout, message:
        The read-out and the message area (HTML widgets).
    widget:
        The whole layout.
    """

    def __init__(
        self,
        beam: Beam,
        loads: Any = None,
        *,
        quantity: str = "moment",
        at: Any = None,
        side: Literal["left", "right"] | None = None,
        backend: Backend | None = None,
    ) -> None:
        w = _require("ipywidgets")
        self.beam = beam
        self._loads = _read_loads(loads)
        self.line: InfluenceLine | None = None
        self.value: float = 0.0
        """The value read out now (ordinate for the unit load, effect for a load model)."""
        self._limit: Literal["left", "right"] | None = None  # one-sided value after a jump to a worst placement
        self._quiet = False  # set while the explorer itself changes a control

        kinds = [k for k in KINDS if self._offers(k)]
        if quantity not in kinds:
            raise _choice_error("quantity", quantity, kinds)
        self.quantity = w.Dropdown(
            options=[(_WORDS[k], k) for k in kinds], value=quantity, description="quantity",
            layout=w.Layout(width="15.5em"), style={"description_width": "4.8em"},
        )  # fmt: skip
        self.location = w.Text(
            value="", description="at x =", continuous_update=False,
            layout=w.Layout(width="11em"), style={"description_width": "3.5em"},
        )  # fmt: skip
        self.side = w.ToggleButtons(
            options=[("left face", "left"), ("right face", "right")], value=side or "left",
            style={"button_width": "6.5em"}, layout=w.Layout(display="none"),
        )  # fmt: skip
        self.load = w.Dropdown(
            options=list(self._loads), value=UNIT_LOAD, description="load",
            layout=w.Layout(width="15.5em"), style={"description_width": "4.8em"},
        )  # fmt: skip
        self.direction = w.ToggleButtons(
            options=[("→", "left to right"), ("←", "right to left")], value="left to right",
            tooltips=["travelling left to right", "travelling right to left"], style={"button_width": "2.6em"},
        )  # fmt: skip
        self.position = w.FloatSlider(
            description="load at x", continuous_update=True, readout_format=".2f",
            layout=w.Layout(width="36em"), style={"description_width": "4.8em"},
        )  # fmt: skip
        narrow = w.Layout(width="6.5em")
        self.largest = w.Button(
            description="largest", tooltip="jump to the placement of the largest value", layout=narrow
        )
        self.smallest = w.Button(
            description="smallest", tooltip="jump to the placement of the smallest value", layout=narrow
        )
        self.envelope = w.ToggleButton(
            value=False, description="envelope", tooltip="envelope of the chosen load", layout=narrow
        )
        self.readout = w.HTML()
        self.message = w.HTML()
        for name in ("quantity", "location", "side", "load", "direction", "position", "readout", "message"):
            getattr(self, name).add_class(f"ilkit-{name}")
        self.largest.add_class("ilkit-largest")
        self.smallest.add_class("ilkit-smallest")
        self.envelope.add_class("ilkit-envelope")

        self._figure = ExplorerFigure(beam, backend=backend)
        self._redraw = Coalescer(self._render)
        self._background_stale = True
        self.widget = w.VBox(
            [
                w.HBox([self.quantity, self.location, self.side]),
                w.HBox([self.load, self.direction, self.largest, self.smallest, self.envelope]),
                self.position,
                self.readout,
                self.message,
                self._figure.live.widget,
            ]
        )
        self.widget.add_class("ilkit-explorer")

        self._set_section(at if at is not None else self._default_location(quantity), side)
        self._load_changed()
        self.quantity.observe(self._on_quantity, "value")
        self.location.observe(self._on_location, "value")
        self.side.observe(self._on_side, "value")
        self.load.observe(self._on_load, "value")
        self.direction.observe(self._on_move, "value")
        self.position.observe(self._on_move, "value")
        self.largest.on_click(lambda _: self.jump("max"))
        self.smallest.on_click(lambda _: self.jump("min"))
        self.envelope.observe(self._on_envelope, "value")
        self._render()

    # ------------------------------------------------------------------ display
    def _repr_mimebundle_(self, include: Any = None, exclude: Any = None) -> dict[str, Any]:
        data = self.widget._repr_mimebundle_(include=include, exclude=exclude)
        # a still of the figure: pages rendered without a kernel show it
        data["image/png"] = base64.b64encode(self._figure.live.png()).decode("ascii")
        data["text/plain"] = repr(self)
        return data

    def __repr__(self) -> str:
        line = self.line.quantity.label if self.line is not None else "no line"
        return f"<ilkit explorer: {line}, {self.load.value} at x={self.position.value:.6g}>"

    def redraw(self) -> None:
        """Draw the figure now (normally done for you, coalesced, right after a change)."""
        self._redraw.flush()
        if self._background_stale:
            self._render()

    def close(self) -> None:
        """Close the widgets and release the figure."""
        self._figure.live.close()
        self.widget.close_all() if hasattr(self.widget, "close_all") else self.widget.close()

    # ---------------------------------------------------------------- section
    def _offers(self, kind: str) -> bool:
        if not hasattr(self.beam, kind):
            return False
        places = self.beam.locations(kind)
        if places is not None:
            return len(places) > 0
        if kind in ("deflection", "rotation"):
            return self.beam.EI is not None
        return True

    def _default_location(self, kind: str) -> Fraction:
        places = self.beam.locations(kind)
        if places:
            return places[0]
        spans = self.beam.spans
        a, b = spans[0] if spans else (Fraction(0), self.beam.length)
        return (a + b) / 2

    def _on_quantity(self, change: dict[str, Any]) -> None:
        if self._quiet:
            return
        current = self.line.quantity.at if self.line is not None else self._default_location(change["new"])
        self._set_section(current, None)

    def _on_location(self, change: dict[str, Any]) -> None:
        if self._quiet:
            return
        self._set_section(change["new"], None)

    def _on_side(self, change: dict[str, Any]) -> None:
        if self._quiet or self.line is None:
            return
        self._set_section(self.line.quantity.at, change["new"])

    def _set_section(self, raw: Any, side: Literal["left", "right"] | None) -> None:
        """Take the quantity at ``raw`` (text or number); on a bad entry show why and keep the old line."""
        kind = self.quantity.value
        try:
            at = to_exact(raw, field="location")
            note = ""
            places = self.beam.locations(kind)
            if places:
                nearest = min(places, key=lambda p: (abs(p - at), p))
                if nearest != at:
                    where = "supports" if kind in ("reaction", "moment_reaction") else "hinges"
                    note = f"The {_WORDS[kind]} exists only at the {where}: taken at x = {fmt(nearest)}."
                at = nearest
            try:
                line = self.beam.line(kind, at)
                needs_side = False
            except SideRequiredError:
                needs_side = True
                line = self.beam.line(kind, at, side=side or self.side.value)
        except IlkitError as err:
            self._show_message(str(err), error=True)
            self._set_quietly(self.location, _text(self.line.quantity.at) if self.line is not None else "")
            if self.line is not None:
                self._set_quietly(self.quantity, self.line.quantity.kind)
            return
        self.line = line
        self._set_quietly(self.location, _text(at))
        self._set_quietly(self.side, line.quantity.side or self.side.value)
        self.side.layout.display = "" if needs_side else "none"
        if needs_side:
            face = f"The {_WORDS[kind]} jumps at x = {fmt(at)}: showing the {line.quantity.side} face."
            note = f"{note} {face}".strip()
        self._show_message(note)
        self._limit = None
        self._background_stale = True
        self._update_value()
        self._redraw.request()

    # ------------------------------------------------------------------- load
    def _on_load(self, change: dict[str, Any]) -> None:
        if self._quiet:
            return
        self._load_changed()
        self._background_stale = True
        self._update_value()
        self._redraw.request()

    def _load_changed(self) -> None:
        """Set the slider's range and step for the chosen load, and the direction control."""
        load = self._loads[self.load.value]
        length = float(self.beam.length)
        extent = 0.0 if load is None else _extent(load)
        step = _nice_step(length / 400)
        lo, hi = -extent, length + extent
        lo, hi = math.floor(lo / step) * step, math.ceil(hi / step) * step
        self._quiet = True
        try:
            slider = self.position
            if hi > slider.min:
                slider.max = hi
                slider.min = lo
            else:
                slider.min = lo
                slider.max = hi
            slider.step = step
            if not lo <= slider.value <= hi:
                slider.value = min(max(slider.value, lo), hi)
            self.direction.disabled = load is None
        finally:
            self._quiet = False

    def _on_move(self, change: dict[str, Any]) -> None:
        if self._quiet:
            return
        self._limit = None
        self._update_value()
        self._redraw.request()

    def _update_value(self) -> None:
        """Ask the core for the value of the load where it stands now; update the read-out at once."""
        line = self.line
        if line is None:
            return
        x = float(self.position.value)
        load = self._loads[self.load.value]
        try:
            if load is None:
                value = _one_sided(line, x, self._limit)
                loading = Loading((Axle(x, 1.0, value),))
            else:
                from ilkit.loads import stand

                placed = stand(line, load, x, direction=self.direction.value, extreme=self._limit_extreme)
                value = placed.effect
                loading = _loading(placed)
        except IlkitError as err:
            self._show_message(str(err), error=True)
            return
        self.value = float(value)
        self._figure.set_loading(loading)
        self._write_readout()

    _limit_extreme: Extreme | None = None

    # ----------------------------------------------------------------- worst
    def jump(self, extreme: Extreme) -> None:
        """Move the load to its worst placement: ``"max"`` (largest value) or ``"min"`` (smallest)."""
        if extreme not in ("max", "min"):
            raise _choice_error("extreme", extreme, ["max", "min"])
        line = self.line
        if line is None:
            return
        load = self._loads[self.load.value]
        try:
            if load is None:
                found = line.maximum if extreme == "max" else line.minimum
                x, direction, limit = found.x, self.direction.value, found.side
            else:
                from ilkit.loads import place

                best = place(line, load, extreme, beam=self.beam).placements[0]
                x, direction, limit = best.axles[0].x, best.direction or self.direction.value, None
        except IlkitError as err:
            self._show_message(str(err), error=True)
            return
        self._quiet = True
        try:
            self.direction.value = direction
            self.position.value = min(max(x, self.position.min), self.position.max)
        finally:
            self._quiet = False
        self._limit = limit
        self._limit_extreme = extreme if load is not None else None
        self._show_message("")
        self._update_value()
        self._redraw.request()

    # --------------------------------------------------------------- envelope
    def _on_envelope(self, change: dict[str, Any]) -> None:
        self._background_stale = True
        self._redraw.request()

    # -------------------------------------------------------------- read-out
    def _write_readout(self) -> None:
        line = self.line
        assert line is not None
        q = line.quantity
        length_unit = f" {line.units.length}" if line.units else ""
        load_name = self.load.value
        where = f"{html.escape(load_name)} at x = {self.position.value:.2f}{length_unit}"
        if self._limit:
            where += f" ({'just left of' if self._limit == 'left' else 'just right of'} it)"
        if self._loads[load_name] is None:
            unit = line.unit
            what = "ordinate"
        else:
            from ilkit.loads.results import effect_unit

            unit = effect_unit(q, line.units) if line.units else ""
            what = "effect"
            where += f", travelling {self.direction.value}"
        side = f", {q.side} face" if q.side else ""
        self.readout.value = (
            f"<div class='ilkit-readout-text'><b>{html.escape(_WORDS[q.kind])}</b> at x = {fmt(q.at)}"
            f"{html.escape(length_unit)}{side} &nbsp;·&nbsp; {where} &nbsp;·&nbsp; {what} "
            f"<b><span class='ilkit-value'>{_number(self.value)}</span> "
            f"<span class='ilkit-unit'>{html.escape(unit)}</span></b></div>"
        )

    def _show_message(self, text: str, *, error: bool = False) -> None:
        if not text:
            self.message.value = ""
            return
        colour = "#8a1c1c" if error else "#1c1c1c"
        kind = "ilkit-error" if error else "ilkit-note"
        self.message.value = f"<div class='{kind}' style='color:{colour}'>{html.escape(text)}</div>"

    # ---------------------------------------------------------------- drawing
    def _render(self) -> None:
        if self._background_stale:
            self._background_stale = False
            self._draw_background()
            self._figure.draw()
        else:
            self._figure.refresh()

    def _draw_background(self) -> None:
        line = self.line
        assert line is not None
        title = f"Influence line: {_WORDS[line.quantity.kind]} {line.quantity.label}"
        self._figure.show_line(line, title=title)

    # ----------------------------------------------------------------- helpers
    def _set_quietly(self, control: Any, value: Any) -> None:
        self._quiet = True
        try:
            control.value = value
        finally:
            self._quiet = False


# -------------------------------------------------------------------- helpers
def _read_loads(loads: Any) -> dict[str, Any]:
    out: dict[str, Any] = {UNIT_LOAD: None}
    if loads is None:
        return out
    if isinstance(loads, Mapping):
        items = list(loads.items())
    elif isinstance(loads, Sequence) and not isinstance(loads, (str, bytes)):
        items = [(getattr(m, "name", f"load {k + 1}"), m) for k, m in enumerate(loads)]
    else:
        items = [(getattr(loads, "name", "load"), loads)]
    for name, model in items:
        out[str(name)] = model
    return out


def _one_sided(line: InfluenceLine, x: float, side: Literal["left", "right"] | None) -> float:
    if side == "left":
        return float(line.left(x))
    if side == "right":
        return float(line.right(x))
    return float(line(x))


def _loading(placed: Any) -> Loading:
    axles = tuple(Axle(a.x, a.load, a.ordinate, a.counted) for a in placed.axles)
    patches = tuple((p.start, p.end, p.intensity) for p in placed.patches)
    return Loading(axles, patches)


def _extent(load: Any) -> float:
    from ilkit.loads import stand

    return float(stand.extent(load))  # type: ignore[attr-defined]


def _nice_step(raw: float) -> float:
    """The 1-2-5 number nearest below ``raw`` (a slider step)."""
    if raw <= 0:
        return 1.0
    power = 10 ** math.floor(math.log10(raw))
    for m in (5, 2, 1):
        if m * power <= raw:
            return float(m * power)
    return float(power)


def _number(value: float) -> str:
    """A read-out number: five significant figures, at most six decimals, no ``-0``."""
    if value == 0 or not math.isfinite(value):
        return "0" if value == 0 else str(value)
    decimals = min(6, max(0, 4 - math.floor(math.log10(abs(value)))))
    text = f"{value:.{decimals}f}"
    return "0" if float(text) == 0 else text


def _text(at: Fraction) -> str:
    return fmt(at)


def _choice_error(field: str, value: object, choices: Sequence[str]) -> IlkitError:
    from ilkit.errors import BeamInputError

    return BeamInputError(
        f"{field}: {value!r} is not offered; choose one of {', '.join(repr(c) for c in choices)}.",
        field=field,
        value=value,
    )
