"""The truss explorer: move a vehicle along the deck and see the force in every member.

``truss.explore(loads)`` (or ``TrussExplorer(truss, loads)``) shows, in one
widget:

* the truss with every member drawn by its force for the load where it
  stands now (tension solid, compression hollow, the weight growing with the
  force, each force written beside its member);
* the deck with the load on it (axle arrows, loaded stretches);
* the influence line of a chosen member (or reaction) with the ordinates under
  the axles;
* a chooser for that member, a load chooser (a unit load and the loads
  given), a slider and a box for the load's position, the travel direction,
  buttons that jump to the worst placement for the chosen member, and a
  read-out of its force and of the largest tension and compression in the
  truss for this position.

Like :class:`ilkit.views.explorer.Explorer` it holds no engineering logic:
forces come from the lines' ordinates and :func:`ilkit.loads.stand`, the
worst placements from :func:`ilkit.loads.place`.  A slider step updates the
numbers at once and redraws only the members and the load on a cached
background (:class:`ilkit.views.livefigure.LiveFigure`).

Results must be checked by a qualified engineer; local codes and licensed
practice govern.
"""

from __future__ import annotations

import base64
import html
import math
from typing import TYPE_CHECKING, Any, Literal

from ilkit.errors import IlkitError
from ilkit.views import style
from ilkit.views.caution import CAUTION_SHORT
from ilkit.views.explorer import UNIT_LOAD, _choice_error, _number, _read_loads, _slider_range, _train_length
from ilkit.views.livefigure import Backend, Coalescer, LiveFigure, _require
from ilkit.views.loaddraw import Axle, LoadArtists, Loading

if TYPE_CHECKING:  # pragma: no cover
    from ilkit.influence import InfluenceLine
    from ilkit.loads import LoadPlacement
    from ilkit.trusses.model import Truss

__all__ = ["TrussExplorer"]


class TrussExplorer:
    """Interactive explorer of a truss (an ipywidgets layout).

    Parameters
    ----------
    truss:
        The truss to explore (:class:`ilkit.trusses.Truss`).
    loads:
        Loads offered besides the unit load, as for
        :class:`ilkit.views.explorer.Explorer` (one load or model, a list, or
        a ``{name: load}`` mapping); needs a truss with units.
    member:
        The member whose influence line is shown first (default: the first
        member); ``"R at <joint>"`` shows a reaction.
    backend:
        ``"inline"`` or ``"ipympl"``; default: follow matplotlib's backend.

    Attributes
    ----------
    member, load, direction, slider, position, largest, smallest:
        The controls (ipywidgets); set their ``value`` (or ``click()`` a
        button) to drive the explorer from code.
    readout, message, caution:
        HTML widgets: the numbers, messages, and the caution that results must
        be checked by a qualified engineer.
    x:
        Where the load stands (its front), on the deck coordinate.
    forces:
        ``{member: force}`` for the load where it stands now (force unit,
        tension positive; the unit load's ordinates for the unit load; the
        effect of the load alone, unfactored, otherwise).
    value:
        The chosen member's (or reaction's) value in :attr:`forces` terms.
    line:
        The influence line shown.
    placement:
        Where the chosen load stands on that line (``None`` for the unit load).
    widget:
        The whole layout.
    """

    def __init__(self, truss: Truss, loads: Any = None, *, member: str | None = None,
                 backend: Backend | None = None) -> None:
        w = _require("ipywidgets")
        self.truss = truss
        self._travelling, self._models = _read_loads(loads)
        self._lines = {f"N in {m}": line for m, line in truss.member_forces().items()}
        self._lines.update({f"R at {j}": truss.reaction(j) for j in truss.supports})
        self._members = truss.member_forces()
        choices = list(self._lines)
        first = choices[0] if member is None else (member if member in self._lines else f"N in {member}")
        if first not in self._lines:
            raise _choice_error("member", member, list(truss.members))
        self.x = 0.0
        self.forces: dict[str, float] = {}
        self.value = 0.0
        self.placement: LoadPlacement | None = None
        self._worst: LoadPlacement | None = None
        self._quiet = False
        length = f" [{truss.units.length}]" if truss.units else ""
        wide = {"description_width": "5em"}
        self.member = w.Dropdown(options=choices, value=first, description="line of", style=wide,
                                 layout=w.Layout(width="16em"))
        self.load = w.Dropdown(options=list(self._travelling), value=UNIT_LOAD, description="load", style=wide,
                               layout=w.Layout(width="21em"))
        self.direction = w.ToggleButtons(options=[("→", "left to right"), ("←", "right to left")],
                                         value="left to right", style={"button_width": "2.6em"},
                                         tooltips=["travelling left to right", "travelling right to left"])
        self.slider = w.IntSlider(description="move load", readout=False, continuous_update=True, style=wide,
                                  layout=w.Layout(width="27em"))
        self.position = w.FloatText(description=f"load at x{length}", style={"description_width": "7em"},
                                    layout=w.Layout(width="14em"))
        narrow = w.Layout(width="6.5em")
        self.largest = w.Button(description="largest", layout=narrow,
                                tooltip="the placement of the largest value of the chosen line")
        self.smallest = w.Button(description="smallest", layout=narrow,
                                 tooltip="the placement of the smallest value of the chosen line")
        self.readout = w.HTML()
        self.message = w.HTML()
        self.caution = w.HTML(f"<div style='color:#5a5a5a; font-size:0.85em'>{html.escape(CAUTION_SHORT)}</div>")
        for name in ("member", "load", "direction", "slider", "position", "largest", "smallest", "readout",
                     "message", "caution"):
            getattr(self, name).add_class(f"ilkit-{name}")
        self._x0, self._step = 0.0, 1.0
        self._live = LiveFigure((8.6, 6.0), backend=backend)
        self._redraw = Coalescer(self._render)
        self._stale = True
        self._build_figure()
        self.widget = w.VBox([
            w.HBox([self.member, self.load, self.direction]),
            w.HBox([self.slider, self.position, self.largest, self.smallest]),
            self.readout, self.message, self._live.widget, self.caution,
        ])
        self.widget.add_class("ilkit-truss-explorer")
        self._load_changed()
        self._update()
        self.member.observe(self._on_member, "value")
        self.load.observe(self._on_load, "value")
        self.direction.observe(self._on_move, "value")
        self.slider.observe(self._on_slider, "value")
        self.position.observe(self._on_position, "value")
        self.largest.on_click(lambda _: self.jump("max"))
        self.smallest.on_click(lambda _: self.jump("min"))
        self._render()

    # ------------------------------------------------------------------ display
    def _repr_mimebundle_(self, include: Any = None, exclude: Any = None) -> dict[str, Any]:
        data = self.widget._repr_mimebundle_(include=include, exclude=exclude)
        data["image/png"] = base64.b64encode(self._live.png()).decode("ascii")
        data["text/plain"] = repr(self)
        return data

    def __repr__(self) -> str:
        return f"<ilkit truss explorer: {self.member.value}, {self.load.value} at x={self.x:.6g}>"

    def redraw(self) -> None:
        """Draw the figure now (normally done for you, coalesced, right after a change)."""
        self._redraw.flush()
        if self._stale:
            self._render()

    def close(self) -> None:
        """Close the widgets and release the figure."""
        self._live.close()

        def close_tree(widget: Any) -> None:
            for child in getattr(widget, "children", ()):
                close_tree(child)
            widget.close()

        close_tree(self.widget)

    @property
    def line(self) -> InfluenceLine:
        """The influence line shown (the chosen member's force or support's reaction)."""
        return self._lines[self.member.value]

    # -------------------------------------------------------------------- load
    def _load_changed(self) -> None:
        load = self._travelling[self.load.value]
        length = float(self.truss.length)
        try:
            extent = 0.0 if load is None else _train_length(self.truss, load, None)  # type: ignore[arg-type]
        except IlkitError as err:
            self._show(str(err), error=True)
            extent = 0.0
        self._x0, step, count = _slider_range(length, extent)
        self._step = step
        self._quietly(self.slider, 0)
        self._quiet = True
        try:
            self.slider.max = count
        finally:
            self._quiet = False
        self.direction.disabled = load is None
        self._place(min(max(self.x, self._x0), self._x0 + self.slider.max * step))

    def _place(self, x: float) -> None:
        self.x = x
        self._quietly(self.position, x)
        self._quietly(self.slider, min(max(round((x - self._x0) / self._step), 0), self.slider.max))

    def _on_load(self, change: dict[str, Any]) -> None:
        if self._quiet:
            return
        self._worst = None
        self._load_changed()
        self._show("")
        self._update()

    def _on_slider(self, change: dict[str, Any]) -> None:
        if self._quiet:
            return
        self.x = round(self._x0 + change["new"] * self._step, 12)
        self._quietly(self.position, self.x)
        self._on_move(change)

    def _on_position(self, change: dict[str, Any]) -> None:
        if self._quiet:
            return
        x = float(change["new"])
        top = self._x0 + self.slider.max * self._step
        if not (math.isfinite(x) and self._x0 <= x <= top):
            self._show(f"load position: x={x:g} is outside the load's travel; give a position from {self._x0:g} "
                       f"to {top:g} (the front of the load, on the deck coordinate).", error=True)
            self._quietly(self.position, self.x)
            return
        self._place(x)
        self._show("")
        self._on_move(change)

    def _on_move(self, change: dict[str, Any]) -> None:
        if self._quiet:
            return
        self._worst = None
        self._update()

    def _on_member(self, change: dict[str, Any]) -> None:
        if self._quiet:
            return
        self._worst = None
        self._stale = True
        self._update()

    def jump(self, extreme: Literal["max", "min"]) -> None:
        """Move the load to the worst placement for the chosen line: ``"max"`` (largest) or ``"min"``."""
        if extreme not in ("max", "min"):
            raise _choice_error("extreme", extreme, ["max", "min"])
        load = self._travelling[self.load.value]
        try:
            if load is None:
                found = self.line.maximum if extreme == "max" else self.line.minimum
                front, direction, worst = found.x, self.direction.value, None
            else:
                from ilkit.loads import place

                worst = place(self.line, load, extreme).placements[0]
                assert worst.front is not None
                front, direction = worst.front, worst.direction or self.direction.value
        except IlkitError as err:
            self._show(str(err), error=True)
            return
        self._quietly(self.direction, direction)
        self._place(min(max(front, self._x0), self._x0 + self.slider.max * self._step))
        self._show("")
        self._update()
        self._worst = worst

    # ------------------------------------------------------------------- numbers
    def _update(self) -> None:
        """Ask the core for every member's force with the load where it stands; update the read-out."""
        load = self._travelling[self.load.value]
        x, direction = self.x, self.direction.value
        try:
            if load is None:
                values = {name: float(line(x)) for name, line in self._lines.items()}
                self.placement = None
                loading = Loading((Axle(x, 1.0, values[self.member.value]),))
            else:
                from ilkit.loads import stand

                placed = {name: stand(line, load, x, direction=direction) for name, line in self._lines.items()}
                values = {name: p.effect for name, p in placed.items()}
                self.placement = placed[self.member.value]
                loading = Loading.of([self.placement])
        except IlkitError as err:
            self._show(str(err), error=True)
            return
        self.forces = {m: values[f"N in {m}"] for m in self._members}
        self.value = values[self.member.value]
        self._loading = loading
        self._write_readout()
        self._redraw.request()

    def _write_readout(self) -> None:
        u = self.truss.units
        force = u.force if u else ""
        unit = force if self.placement is not None else (f"{force}/{force}" if u else "")
        what = "ordinate" if self.placement is None else "effect of this load alone (unfactored)"
        tension = max(self.forces.items(), key=lambda kv: kv[1])
        compression = min(self.forces.items(), key=lambda kv: kv[1])
        length = f" {u.length}" if u else ""
        self.readout.value = (
            f"<div class='ilkit-readout-text'><b>{html.escape(self.member.value)}</b> &nbsp;·&nbsp; "
            f"{html.escape(self.load.value)} at x = <span class='ilkit-at'>{self.x:.2f}</span>{length} &nbsp;·&nbsp; "
            f"{what} <b><span class='ilkit-value'>{_number(self.value)}</span> {html.escape(unit)}</b></div>"
            f"<div class='ilkit-readout-text' style='color:#5a5a5a'>largest tension: {html.escape(tension[0])} "
            f"<span class='ilkit-tension'>{_number(max(tension[1], 0.0))}</span>; largest compression: "
            f"{html.escape(compression[0])} <span class='ilkit-compression'>{_number(min(compression[1], 0.0))}"
            f"</span> {html.escape(unit)} (tension positive)</div>"
        )

    def _show(self, text: str, *, error: bool = False) -> None:
        if not text:
            self.message.value = ""
            return
        colour = "#8a1c1c" if error else "#1c1c1c"
        kind = "ilkit-error" if error else "ilkit-note"
        self.message.value = f"<div class='{kind}' style='color:{colour}'>{html.escape(text)}</div>"

    # ------------------------------------------------------------------- drawing
    def _build_figure(self) -> None:
        from ilkit.views.draw import draw_floor
        from ilkit.views.truss import _frame, _joints, _legend, _supports

        fig = self._live.figure
        with style.context():
            self._ax_truss, self._ax_deck, self._ax_line = fig.subplots(3, 1, height_ratios=[1.6, 0.45, 1.5])
            fig.subplots_adjust(left=0.06, right=0.98, top=0.96, bottom=0.08, hspace=0.25)
            truss = self.truss
            _joints(self._ax_truss, truss, names=False)
            _supports(self._ax_truss, truss)
            _frame(self._ax_truss, truss, pad_below=0.3)
            _legend(self._ax_truss, truss.units.force if truss.units else "")
            self._ax_truss.apply_aspect()
            xlim = self._ax_truss.get_xlim()
            deck = self._ax_deck
            points = [float(p) for p in truss.panel_points]
            deck.plot([points[0], points[-1]], [0, 0], color=style.INK, linewidth=2.0, gid="deck")
            draw_floor(deck, points)
            deck.set_xlim(*xlim)
            deck.set_ylim(-0.3, 0.7)
            deck.set_axis_off()
            self._member_artists = self._make_members()
            self._load_artists = LoadArtists(deck, self._ax_line)
            self._live.animate(*[a for arts in self._member_artists.values() for a in arts],
                               *self._load_artists.artists)

    def _make_members(self) -> dict[str, list[Any]]:
        from ilkit.views.plot import LABEL_BOX
        from ilkit.views.truss import _xy

        out = {}
        for name, (a, b) in self.truss.members.items():
            (xa, ya), (xb, yb) = _xy(self.truss, a), _xy(self.truss, b)
            (bar,) = self._ax_truss.plot([xa, xb], [ya, yb], solid_capstyle="butt", zorder=3, gid=f"member:{name}")
            label = self._ax_truss.annotate("", ((xa + xb) / 2, (ya + yb) / 2), ha="center", va="center",
                                           fontsize=5.5, zorder=7, gid=f"force:{name}", bbox=LABEL_BOX)
            out[name] = [bar, label]
        return out

    def _style_members(self) -> None:
        from matplotlib.patheffects import Stroke

        from ilkit.views.numbers import clean, short

        scale = max((abs(v) for v in self.forces.values()), default=0.0)
        for name, (bar, label) in self._member_artists.items():
            n = clean(self.forces.get(name, 0.0), scale) if scale else 0.0
            weight = 1.2 + 4.2 * abs(n) / scale if scale else 1.2
            if n > 0:
                bar.set(color=style.INK, linewidth=weight, linestyle="-", path_effects=[], gid=f"tension:{name}")
            elif n < 0:
                outer = weight + 1.6
                bar.set(color="white", linewidth=outer - 1.6, linestyle="-", gid=f"compression:{name}",
                        path_effects=[Stroke(linewidth=outer, foreground=style.INK),
                                      Stroke(linewidth=outer - 1.6, foreground="white")])
            else:
                bar.set(color=style.MUTED, linewidth=0.8, linestyle=(0, (1, 2)), path_effects=[],
                        gid=f"no-force:{name}")
            label.set_text(short(n, 3) if n else "")
            label.set_visible(bool(n))

    def _render(self) -> None:
        from ilkit.views.plot import plot_line

        self._style_members()
        line = self.line
        self._load_artists.update(self._loading, line)
        if self._stale:
            self._stale = False
            with style.context():
                old = self._load_artists.artists
                self._live.forget(*old)
                for artist in old:
                    if artist.axes is self._ax_deck:
                        artist.remove()
                self._ax_line.clear()
                plot_line(line, ax=self._ax_line, title=f"Influence line: {self.member.value}")
                self._ax_line.set_xlim(*self._ax_deck.get_xlim())
                self._load_artists = LoadArtists(self._ax_deck, self._ax_line)
                self._live.animate(*self._load_artists.artists)
                self._load_artists.update(self._loading, line)
                self._live.draw()
        else:
            self._live.refresh()

    def _quietly(self, control: Any, value: Any) -> None:
        self._quiet = True
        try:
            control.value = value
        finally:
            self._quiet = False
