"""The influence-line explorer: move a load along a beam and watch the response.

``beam.explore()`` (or ``Explorer(beam)``) shows, in one widget:

* the beam with its supports and releases, and the influence line of the
  chosen quantity with its key ordinates and shaded areas;
* a chooser for the quantity and a box for its location (reactions snap to
  the supports, hinge shears to the hinges; where the quantity jumps the
  explorer asks for the side);
* a load chooser (a unit load and the load models given), a slider that
  moves the load by steps, a box for its exact position and a travel
  direction; the axles are drawn on the beam and
  on the line, and the current value of the quantity is read out with units;
* buttons that jump to the worst placement (largest, smallest), and an
  envelope view of a chosen load model;
* when asked for a limit state (``limit_state=``, with the girder's live load
  ``live=``), the factored effect of the vehicle beside the unfactored one,
  with the factors named (dynamic allowance, case factor, the girder's share,
  γLL): :meth:`ilkit.design.GirderLiveLoad.part_factor`.

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
from ilkit.errors import IlkitError, LoadInputError, SideRequiredError
from ilkit.quantity import KINDS
from ilkit.views._explorer_figure import ExplorerFigure
from ilkit.views.caution import CAUTION_SHORT
from ilkit.views.derive import quantity_title
from ilkit.views.livefigure import Backend, Coalescer, _require
from ilkit.views.loaddraw import Axle, Loading
from ilkit.views.numbers import effect_display, ordinate_unit

if TYPE_CHECKING:  # pragma: no cover
    from ilkit.influence import InfluenceLine
    from ilkit.loads import Envelope, Extremes, LoadPlacement
    from ilkit.loads.standing import Travelling
    from ilkit.model import Beam

__all__ = ["Explorer", "UNIT_LOAD"]

UNIT_LOAD = "unit load"
"""Name of the unit load in the load chooser."""

Extreme = Literal["max", "min"]



def _words(kind: str) -> str:
    """Plain words for a quantity kind (``"bending moment"``), as :mod:`ilkit.quantity` names it."""
    return KINDS[kind][1]


class Explorer:
    """Interactive influence-line explorer of a beam (an ipywidgets layout).

    Parameters
    ----------
    beam:
        The beam to explore.
    loads:
        Loads offered besides the unit load: one load or load model, a list,
        or a ``{name: load}`` mapping (see :mod:`ilkit.loads`).  Axle trains,
        knife-edge loads and blocks travel along the beam with the slider; a
        load model or combination offers its travelling parts to the slider
        and itself to the envelope view.  Needs a beam with units.
    quantity:
        The quantity shown first (``"moment"``, ``"shear"``, ``"reaction"``,
        ...; default ``"moment"``).
    at:
        Its location (beam length unit); default: the middle of the first span
        (the first support for reactions).
    side:
        The side, where the quantity jumps at ``at``.
    backend:
        ``"inline"`` or ``"ipympl"``; default: follow matplotlib's backend.
    limit_state:
        A limit state (a name such as ``"Strength I"``, a
        :class:`~ilkit.design.LimitState`, ``"AASHTO"``, or a list): the
        read-out then also gives the factored effect of the vehicle on the
        girder for the limit state chosen in the ``limit_state`` control.
    live:
        The girder's live load (:class:`~ilkit.design.GirderLiveLoad`: a load
        model and the girder's share); its model's vehicles are offered when
        ``loads`` is not given.  Default with a limit state: one lane of the
        one load model given (``GirderLiveLoad(model, lanes=1)``).

    Attributes
    ----------
    quantity, location, side, load, direction, slider, position, largest, smallest, envelope, model, limit_state:
        The controls (ipywidgets); set their ``value`` (or ``click()`` a
        button) to drive the explorer from code.  ``slider`` moves the load by
        steps (its value counts the steps); ``position`` is the exact position
        of the load (a number box; setting it moves the load).
    readout, message, caution:
        The read-out, the message area and the caution that results must be
        checked by a qualified engineer (HTML widgets).
    line:
        The influence line shown (a core object).
    x:
        Where the load stands: the unit load, or the front (lead axle) of a
        travelling load, in the beam's length unit (``position.value``).
    value:
        The number read out: the ordinate under the unit load, or the effect
        of the load (unfactored) in the beam's units.
    placement:
        Where the chosen load stands and what each axle contributes
        (:class:`ilkit.loads.LoadPlacement`), ``None`` for the unit load.
    factored:
        With a limit state chosen: the factored effect of the vehicle on the
        girder (``value`` times :meth:`~ilkit.design.GirderLiveLoad.part_factor`),
        in the beam's units; ``None`` otherwise (the unit load, a load that is
        not part of the girder's live load, a quantity without a share).
    live:
        The girder's live load the limit states apply to (``None`` without
        a limit state).
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
        limit_state: Any = None,
        live: Any = None,
    ) -> None:
        w = _require("ipywidgets")
        self.beam = beam
        if live is not None and loads is None:
            loads = {getattr(live, "name", "live load"): getattr(live, "model", live)}
        self._travelling, self._models = _read_loads(loads)
        self.live, states = _read_design(live, limit_state, self._models)
        self._states = {s.name: s for s in states}
        self.factored: float | None = None
        self.line: InfluenceLine | None = None
        self.value: float = 0.0
        self.x: float = 0.0
        self.placement: LoadPlacement | None = None
        self._limit: Literal["left", "right"] | None = None  # unit load: one-sided value after a jump
        self._worst: LoadPlacement | None = None  # a load model's worst placement, until the load moves
        self._worst_value = 0.0  # the extreme's value (core) while at a worst placement
        self._spacings: tuple[float, ...] | None = None  # spacings of a variable train chosen by a jump
        self._envelopes: dict[str, Envelope] = {}
        self._extremes: dict[tuple[InfluenceLine, str], Extremes] = {}
        self._quiet = False  # set while the explorer itself changes a control
        self._facts_of: InfluenceLine | None = None
        self._facts_html = ""
        self._error_shown = False  # an error is on screen: the next valid change clears it

        kinds = [k for k in KINDS if self._offers(k)]
        if not isinstance(quantity, str) or quantity not in kinds:
            raise _choice_error("quantity", quantity, kinds)
        if side is not None and (not isinstance(side, str) or side not in ("left", "right")):
            raise _choice_error("side", side, ("left", "right"))
        wide = {"description_width": "4.8em"}
        length = f" [{beam.units.length}]" if beam.units else ""
        self.quantity = w.Dropdown(
            options=[(_words(k), k) for k in kinds], value=quantity, description="quantity",
            layout=w.Layout(width="18em"), style=wide,
        )  # fmt: skip
        self.location = w.Text(
            value="", description=f"at x{length}", continuous_update=False,
            layout=w.Layout(width="12em"), style={"description_width": "4.5em"},
            tooltip="the section (or support, or hinge) of the quantity",
        )  # fmt: skip
        self.side = w.ToggleButtons(
            options=[("left side", "left"), ("right side", "right")], value=side or "left",
            style={"button_width": "6.5em"}, layout=w.Layout(display="none"),
            tooltips=["just left of the section", "just right of the section"],
        )  # fmt: skip
        self.load = w.Dropdown(
            options=list(self._travelling), value=UNIT_LOAD, description="load",
            layout=w.Layout(width="21em"), style=wide,
        )  # fmt: skip
        self.direction = w.ToggleButtons(
            options=[("→", "left to right"), ("←", "right to left")], value="left to right",
            tooltips=["travelling left to right", "travelling right to left"], style={"button_width": "2.6em"},
        )  # fmt: skip
        # The slider counts steps (integers): a browser's slider snaps any value between
        # its steps (or with rounding noise) to a step and sends it back, which would move
        # a load put exactly somewhere (a worst placement) and race with later settings.
        self.slider = w.IntSlider(
            description="move load", continuous_update=True, readout=False,
            layout=w.Layout(width="27em"), style=wide,
        )  # fmt: skip
        self.position = w.FloatText(
            description=f"load at x{length}", layout=w.Layout(width="14em"), style={"description_width": "7em"},
            tooltip="exact position of the load: the unit load, or the front (lead axle) of a vehicle",
        )  # fmt: skip
        self._x0, self._step = 0.0, 1.0  # the slider's step k stands for x = x0 + k * step
        narrow = w.Layout(width="6.5em")
        self.largest = w.Button(description="largest", tooltip="jump to the placement of the largest value",
                                layout=narrow)  # fmt: skip
        self.smallest = w.Button(description="smallest",
                                 tooltip="jump to the placement of the smallest value (the most negative)",
                                 layout=narrow)  # fmt: skip
        self.envelope = w.ToggleButton(value=False, description="envelope", layout=narrow,
                                       tooltip="show the envelope of the load model along the beam")  # fmt: skip
        self.model = w.Dropdown(
            options=list(self._models), value=next(iter(self._models), None), description="load model",
            layout=w.Layout(width="19em", display="" if self._models else "none"),
            style={"description_width": "5.5em"}, tooltip="the load model whose envelope is shown",
        )  # fmt: skip
        self.envelope.layout.display = "" if self._models else "none"
        self.limit_state = w.Dropdown(
            options=[("unfactored", ""), *((n, n) for n in self._states)], value=next(iter(self._states), ""),
            description="limit state", layout=w.Layout(width="17em", display="" if self._states else "none"),
            style={"description_width": "5.5em"},
            tooltip="read out the factored effect of the vehicle on the girder for this limit state",
        )  # fmt: skip
        self.readout = w.HTML()
        self.message = w.HTML()
        self.caution = w.HTML(
            f"<div style='color:#5a5a5a; font-size:0.85em'>{html.escape(CAUTION_SHORT)}</div>"
        )
        for name in ("quantity", "location", "side", "load", "direction", "slider", "position", "largest",
                     "smallest", "envelope", "model", "limit_state", "readout", "message", "caution"):  # fmt: skip
            getattr(self, name).add_class(f"ilkit-{name}")

        self._figure = ExplorerFigure(beam, backend=backend)
        self._redraw = Coalescer(self._render)
        self._background_stale = True
        self.widget = w.VBox(
            [
                w.HBox([self.quantity, self.location, self.side]),
                w.HBox([self.load, self.direction, self.largest, self.smallest, self.limit_state]),
                w.HBox([self.slider, self.position, self.envelope, self.model]),
                self.readout,
                self.message,
                self._figure.live.widget,
                self.caution,
            ]
        )
        self.widget.add_class("ilkit-explorer")

        self._load_changed()
        self._set_section(at if at is not None else self._default_location(quantity), side, strict=True)
        assert self.line is not None
        self._place_at(float(self.line.quantity.at))  # the unit load starts at the section
        self._update_value()
        self.quantity.observe(self._on_quantity, "value")
        self.location.observe(self._on_location, "value")
        self.side.observe(self._on_side, "value")
        self.load.observe(self._on_load, "value")
        self.direction.observe(self._on_move, "value")
        self.slider.observe(self._on_slider, "value")
        self.position.observe(self._on_position, "value")
        self.largest.on_click(lambda _: self.jump("max"))
        self.smallest.on_click(lambda _: self.jump("min"))
        self.envelope.observe(self._on_envelope, "value")
        self.model.observe(self._on_envelope, "value")
        self.limit_state.observe(lambda _: self._write_readout(), "value")
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
        return f"<ilkit explorer: {line}, {self.load.value} at x={self.x:.6g}>"

    def still(self) -> Any:
        """The figure as it is now, as an image for the notebook (e.g. for the calculation record)."""
        from IPython.display import Image

        self.redraw()
        return Image(data=self._figure.live.png(), format="png")

    def redraw(self) -> None:
        """Draw the figure now (normally done for you, coalesced, right after a change)."""
        self._redraw.flush()
        if self._background_stale:
            self._render()

    def close(self) -> None:
        """Close the widgets (every control and box) and release the figure."""
        self._figure.live.close()

        def close_tree(widget: Any) -> None:
            for child in getattr(widget, "children", ()):
                close_tree(child)
            widget.close()

        close_tree(self.widget)

    # ---------------------------------------------------------------- section
    def _offers(self, kind: str) -> bool:
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

    def _set_section(self, raw: Any, side: Literal["left", "right"] | None, *, strict: bool = False) -> None:
        """Take the quantity at ``raw`` (text or number); on a bad entry show why and keep the old line
        (``strict``: raise the error instead, for the constructor's arguments)."""
        kind = self.quantity.value
        try:
            at = to_exact(raw, field="location")
            note = ""
            places = self.beam.locations(kind)
            if places:
                nearest = min(places, key=lambda p: (abs(p - at), p))
                if nearest != at:
                    where = "supports" if kind in ("reaction", "moment_reaction") else "hinges"
                    note = f"The {_words(kind)} exists only at the {where}: taken at x = {fmt(nearest)}."
                at = nearest
            try:
                line = self.beam.line(kind, at)
                needs_side = False
            except SideRequiredError:
                needs_side = True
                line = self.beam.line(kind, at, side=side or self.side.value)
        except IlkitError as err:
            if strict:
                raise
            self._show_message(str(err), error=True)
            self._set_quietly(self.location, fmt(self.line.quantity.at) if self.line is not None else "")
            if self.line is not None:
                self._set_quietly(self.quantity, self.line.quantity.kind)
            return
        self.line = line
        self._set_quietly(self.location, fmt(at))
        self._set_quietly(self.side, line.quantity.side or self.side.value)
        self.side.layout.display = "" if needs_side else "none"
        if needs_side:
            face = f"The {_words(kind)} jumps at x = {fmt(at)}: showing the {line.quantity.side} side."
            note = f"{note} {face}".strip()
        self._show_message(note)
        self._limit = self._worst = None
        self._background_stale = True
        self._update_value()
        self._redraw.request()

    # ------------------------------------------------------------------- load
    def _on_load(self, change: dict[str, Any]) -> None:
        if self._quiet:
            return
        self._spacings = None
        self._limit = self._worst = None
        if not self._load_changed():
            self._set_quietly(self.load, change["old"])
            self._load_changed()
            return
        self._show_message("")
        self._update_value()
        self._redraw.request()

    def _load_changed(self) -> bool:
        """Set the slider's range and step for the chosen load; False (and a message) if it cannot be used."""
        load = self._travelling[self.load.value]
        length = float(self.beam.length)
        try:
            extent = 0.0 if load is None else _train_length(self.beam, load, self._spacings)
        except IlkitError as err:
            self._show_message(str(err), error=True)
            return False
        self._x0, step, count = _slider_range(length, extent)
        self._step = step
        self._set_quietly(self.slider, 0)
        self._quiet = True
        try:
            self.slider.max = count
        finally:
            self._quiet = False
        self.direction.disabled = load is None
        self._place_at(min(max(self.x, self._x0), self._x0 + self.slider.max * step))
        return True

    def _place_at(self, x: float) -> None:
        """Put the load at ``x`` exactly: the position box shows it, the slider the step nearest to it."""
        self.x = x
        self._set_quietly(self.position, x)
        self._set_quietly(self.slider, min(max(round((x - self._x0) / self._step), 0), self.slider.max))

    def _on_slider(self, change: dict[str, Any]) -> None:
        if self._quiet:
            return
        x = round(self._x0 + change["new"] * self._step, 12)
        self.x = x
        self._set_quietly(self.position, x)
        self._on_move(change)

    def _on_position(self, change: dict[str, Any]) -> None:
        if self._quiet:
            return
        x = float(change["new"])
        top = self._x0 + self.slider.max * self._step
        if not (math.isfinite(x) and self._x0 <= x <= top):
            self._show_message(
                f"load position: x={x:g} is outside the load's travel; give a position from "
                f"{self._x0:g} to {top:g} (the front of the load, in the beam's length unit).",
                error=True,
            )
            self._set_quietly(self.position, self.x)
            return
        self._place_at(x)
        self._show_message("")
        self._on_move(change)

    def _on_move(self, change: dict[str, Any]) -> None:
        if self._quiet:
            return
        self._limit = self._worst = None
        self._update_value()
        self._redraw.request()

    def _update_value(self) -> None:
        """Ask the core for the value of the load where it stands now; update the read-out at once."""
        line = self.line
        if line is None:
            return
        x = self.x
        load = self._travelling[self.load.value]
        try:
            if load is None:
                self.value = _one_sided(line, x, self._limit)
                self.placement = None
                loading = Loading((Axle(x, 1.0, self.value),))
            else:
                from ilkit.loads import stand

                if self._worst is not None:
                    placed, self.value = self._worst, self._worst_value
                else:
                    placed = stand(line, load, x, direction=self.direction.value, spacings=self._spacings)
                    self.value = placed.effect
                self.placement = placed
                loading = Loading.of([placed])
        except IlkitError as err:
            self._show_message(str(err), error=True)
            return
        if self._error_shown:  # a valid state again: an earlier error no longer applies
            self._show_message("")
        self._figure.set_loading(loading)
        self._write_readout()

    # ----------------------------------------------------------------- worst
    def jump(self, extreme: Extreme) -> None:
        """Move the load to its worst placement: ``"max"`` (largest value) or ``"min"`` (smallest)."""
        if extreme not in ("max", "min"):
            raise _choice_error("extreme", extreme, ["max", "min"])
        line = self.line
        if line is None:
            return
        load = self._travelling[self.load.value]
        try:
            if load is None:
                found = line.maximum if extreme == "max" else line.minimum
                front, direction, worst, limit = found.x, self.direction.value, None, found.side
            else:
                from ilkit.loads import place

                found = place(line, load, extreme, beam=self.beam)
                worst = found.placements[0]
                assert worst.front is not None
                front, direction, limit = worst.front, worst.direction or self.direction.value, None
                if getattr(load, "is_variable", False):
                    self._spacings = worst.spacings
                    self._load_changed()  # the slider's range follows the train's length
        except IlkitError as err:
            self._show_message(str(err), error=True)
            return
        self._set_quietly(self.direction, direction)
        self._place_at(min(max(front, self._x0), self._x0 + self.slider.max * self._step))
        self._limit, self._worst = limit, worst
        self._worst_value = found.value
        self._show_message("")
        self._update_value()
        self._redraw.request()

    # --------------------------------------------------------------- envelope
    def _on_envelope(self, change: dict[str, Any]) -> None:
        if self._error_shown:
            self._show_message("")
        self._background_stale = True
        self._write_readout()
        self._redraw.request()

    def _envelope_of(self, name: str) -> Envelope:
        if name not in self._envelopes:
            from ilkit.loads import envelope

            self._envelopes[name] = envelope(self.beam, self._models[name])
        return self._envelopes[name]

    def _extremes_of(self, name: str) -> Extremes:
        assert self.line is not None
        key = (self.line, name)
        if key not in self._extremes:
            from ilkit.loads import extremes

            self._extremes[key] = extremes(self.line, self._models[name], beam=self.beam)
        return self._extremes[key]

    # -------------------------------------------------------------- read-out
    def _write_readout(self) -> None:
        line = self.line
        assert line is not None
        q = line.quantity
        length_unit = f" {line.units.length}" if line.units else ""
        load_name = self.load.value
        x = self.x
        where = (
            f"{html.escape(load_name)} at x = "
            f"<span class='ilkit-at' data-x='{x!r}'>{x:.2f}</span>{html.escape(length_unit)}"
        )
        rows = []
        if self.placement is None:
            factor, unit = ordinate_unit(line)
            what = "ordinate"
            if self._limit:
                where += f" (just {self._limit} of it)"
        else:
            factor, unit = effect_display(q, line.units)
            what = "effect of this load alone (unfactored: no dynamic effect, no other loads, no factors)"
            placed = self.placement
            if placed.direction:
                where += f", travelling <span class='ilkit-travel'>{placed.direction}</span>"
            if self._spacings:
                where += ", spacings " + ", ".join(f"{s:g}" for s in self._spacings) + length_unit
            if self._worst is not None:
                off = [str(a.number) for a in placed.axles if not a.counted and 0 <= a.x <= line.length]
                left_off = f"; axle {', '.join(off)} left off (it would reduce the extreme)" if off else ""
                rows.append(f"worst placement{left_off}")
        side = f", {q.side} side" if q.side else ""
        rows.insert(
            0,
            f"<b>{html.escape(_words(q.kind))}</b> at x = {fmt(q.at)}{html.escape(length_unit)}{side}"
            f" &nbsp;·&nbsp; {where} &nbsp;·&nbsp; {what} "
            f"<b><span class='ilkit-value'>{_number(self.value * factor)}</span> "
            f"<span class='ilkit-unit'>{html.escape(unit)}</span></b>",
        )
        self.factored = None
        if self.limit_state.value:
            rows.insert(1, self._factored_row(self._states[self.limit_state.value], factor, unit))
        if self.envelope.value and self.model.value is not None:
            rows.append(self._envelope_row())
        rows.append(self._facts(line))
        self.readout.value = "".join(f"<div class='ilkit-readout-text'>{r}</div>" for r in rows)

    def _facts(self, line: InfluenceLine) -> str:
        """The line's sign convention, extremes and areas (the views' facts of a line), in small print."""
        if self._facts_of is not line:
            from ilkit.views.display import line_facts

            facts = line_facts(line)[:5]
            self._facts_html = "<span style='color:#5a5a5a; font-size:0.9em'>" + " &nbsp;·&nbsp; ".join(
                html.escape(f"{label} {text}" if label != "sign convention" else text) for label, text in facts
            ) + "</span>"
            self._facts_of = line
        return self._facts_html

    def _factored_row(self, state: Any, factor: float, unit: str) -> str:
        """The factored effect of the vehicle on the girder for ``state`` (core: ``live.part_factor``)."""
        assert self.line is not None and self.live is not None
        kind = self.line.quantity.kind
        head = f"<b>{html.escape(state.name)}</b>: "
        part = self._travelling[self.load.value]
        parts = [p for c in self.live.model.cases for p in c.parts]
        if part is None or not any(p is part or p == part for p in parts):
            return head + html.escape(
                f"factored effects are those of the vehicles of {self.live.name} "
                f"({', '.join(dict.fromkeys(p.name for p in parts))}); choose one of them as the load.")
        if kind not in ("moment", "shear", "reaction", "deflection"):
            return head + html.escape(f"the girder's share is given for moment, shear, reaction and deflection, not "
                                      f"for the {_words(kind)}.")
        try:
            multiplier, words = self.live.part_factor(part.name, kind, state)
        except IlkitError as err:
            return head + html.escape(str(err))
        self.factored = multiplier * self.value
        return (
            f"{head}factored effect on the girder ({html.escape(self.live.name)}) = {html.escape(words)} × this "
            f"load's effect = <b><span class='ilkit-factored'>{_number(self.factored * factor)}</span> "
            f"{html.escape(unit)}</b>"
        )

    def _envelope_row(self) -> str:
        """The extremes of the envelope's load model at the section (core placement)."""
        name = self.model.value
        try:
            found = self._extremes_of(name)
        except IlkitError as err:
            return html.escape(str(err))
        hi, lo = found.maximum, found.minimum
        dynamic = "; ".join(dict.fromkeys(e.dynamic.words for e in (hi, lo) if e.dynamic is not None))
        return (
            f"{html.escape(name)} here (the governing case, factored: {html.escape(dynamic or 'dynamic effect')}, "
            f"every load of the case and its factors included): largest <span class='ilkit-envelope-max'>"
            f"{_number(hi.value)}</span> "
            f"({html.escape(hi.case)}), smallest (most negative) "
            f"<span class='ilkit-envelope-min'>{_number(lo.value)}</span> ({html.escape(lo.case)}) "
            f"{html.escape(hi.unit)}"
        )

    def _show_message(self, text: str, *, error: bool = False) -> None:
        self._error_shown = error and bool(text)
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
        q = line.quantity
        if self.envelope.value and self.model.value is not None:
            from ilkit.views.moving import ENVELOPE_KINDS

            if q.kind in ENVELOPE_KINDS:
                try:
                    found = self._envelope_of(self.model.value)
                except IlkitError as err:
                    # the toggle goes off with the reason: what is drawn is the line, as the controls say
                    self._set_quietly(self.envelope, False)
                    self._show_message(f"envelope: {err} Showing the influence line.", error=True)
                    self._write_readout()
                else:
                    self._figure.show_envelope(found, q.kind, at=float(q.at))
                    return
            else:
                self._show_message(
                    "Envelopes are drawn for bending moment, shear and reactions; showing the influence line."
                )
        title = quantity_title(q, line.units.length if line.units else "")
        self._figure.show_line(line, title=f"Influence line: {title}")

    # ----------------------------------------------------------------- helpers
    def _set_quietly(self, control: Any, value: Any) -> None:
        self._quiet = True
        try:
            control.value = value
        finally:
            self._quiet = False


# -------------------------------------------------------------------- helpers
def _read_loads(loads: Any) -> tuple[dict[str, Travelling | None], dict[str, Any]]:
    """The loads for the slider (unit load first) and the models for the envelope view."""
    from ilkit.loads import AxleTrain, Combination, KnifeEdge, LoadModel, UniformBlocks, UniformLoad

    travelling: dict[str, Travelling | None] = {UNIT_LOAD: None}
    models: dict[str, Any] = {}
    if loads is None:
        return travelling, models
    if isinstance(loads, Mapping):
        items = [(str(k), v) for k, v in loads.items()]
    elif isinstance(loads, Sequence) and not isinstance(loads, (str, bytes)):
        items = [(getattr(m, "name", f"load {k + 1}"), m) for k, m in enumerate(loads)]
    else:
        items = [(getattr(loads, "name", "load"), loads)]
    moving = (AxleTrain, KnifeEdge, UniformBlocks)
    owners: dict[str, str] = {UNIT_LOAD: UNIT_LOAD}

    def offer(label: str, part: Travelling, owner: str) -> None:
        if label in travelling and not (owners[label] == owner and travelling[label] == part):
            first = "the explorer's unit load" if label == UNIT_LOAD else f"a part of {owners[label]!r}"
            raise LoadInputError(
                f"loads: two loads would be offered as {label!r} ({first} and a part of {owner!r}), so one "
                "would be lost. Rename one (e.g. AxleTrain(..., name='second truck')), or give a mapping "
                "{name: load} with distinct names.",
                field="loads",
                value=label,
            )
        travelling[label], owners[label] = part, owner

    for name, item in items:
        if name in models or name == UNIT_LOAD:
            first = "the explorer's unit load" if name == UNIT_LOAD else "another load"
            raise LoadInputError(
                f"loads: {item!r} is named {name!r}, as is {first}; the explorer offers loads by name, so one "
                "would be lost. Rename one (e.g. AxleTrain(..., name='second truck')), or give a mapping "
                "{name: load} with distinct names.",
                field="loads",
                value=name,
            )
        if isinstance(item, moving):
            offer(name, item, name)
        elif isinstance(item, (Combination, LoadModel)):
            cases = item.cases if isinstance(item, LoadModel) else (item,)
            for part in (p for case in cases for p in case.parts if isinstance(p, moving)):
                offer(name if part.name == name else f"{name}: {part.name}", part, name)
        elif not isinstance(item, UniformLoad):
            raise LoadInputError(
                f"loads: {item!r} is not a load; give axle trains, knife-edge loads, blocks, uniform loads, "
                "combinations or load models from ilkit.loads (e.g. ilkit.loads.hl93()).",
                field="loads",
                value=item,
            )
        models[name] = item
    return travelling, models


def _read_design(live: Any, limit_state: Any, models: Mapping[str, Any]) -> tuple[Any, tuple[Any, ...]]:
    """The girder's live load and the limit states the explorer factors the vehicle's effect for."""
    from ilkit.design import GirderLiveLoad, limit_states
    from ilkit.errors import DesignInputError

    if live is not None and not isinstance(live, GirderLiveLoad):
        raise DesignInputError(
            f"live: give the girder's live load, e.g. design.GirderLiveLoad(loads.hl93(), distribution=...), got "
            f"{type(live).__name__} {live!r:.60}.", field="live", value=live)
    if limit_state is None:
        return live, ()
    states = limit_states(limit_state)
    if live is None:
        if len(models) != 1:
            raise DesignInputError(
                f"limit_state: say whose live load it factors: give live=design.GirderLiveLoad(model, "
                f"distribution=...) (the explorer was given {len(models)} load models).", field="live")
        name, model = next(iter(models.items()))
        live = GirderLiveLoad(model, lanes=1, name=f"{name}, one lane")
    for state in states:
        live.check(state)
    return live, states


def _train_length(beam: Beam, load: Travelling, spacings: Sequence[float] | None) -> float:
    from ilkit.loads.standing import train_length, units_for

    return train_length(load.converted(units_for(load, beam.units, load.name)), spacings)


def _one_sided(line: InfluenceLine, x: float, side: Literal["left", "right"] | None) -> float:
    if side == "left":
        return float(line.left(x))
    if side == "right":
        return float(line.right(x))
    return float(line(x))


def _slider_range(length: float, extent: float) -> tuple[float, float, int]:
    """The slider of a load ``extent`` long moving over a structure ``length`` long, from wholly off its left
    end to wholly off its right end: the position of step 0, the step (a 1-2-5 number near length/400) and
    the number of steps."""
    step = _nice_step(length / 400)
    first, last = math.floor(-extent / step), math.ceil((length + extent) / step)
    return first * step, step, last - first


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


def _choice_error(field: str, value: object, choices: Sequence[str]) -> IlkitError:
    from ilkit.errors import BeamInputError

    return BeamInputError(
        f"{field}: {value!r} is not offered; choose one of {', '.join(repr(c) for c in choices)}.",
        field=field,
        value=value,
    )
