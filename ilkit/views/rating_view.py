"""The rating view: pick a vehicle, see its rating factor along the girder, move it and watch the RF at a section.

``RatingView(rating)`` (``rating`` from :func:`ilkit.rating.rate_girder`) shows, in one widget:

* choosers for the vehicle, the action (moment or shear) and the rated section;
* a slider that moves the vehicle's axles along the girder (its front, in the beam's length unit) and a
  travel direction; the axles are drawn on the beam and on the section's influence line;
* the rating factor along the girder for the chosen vehicle (the table's smallest RF at every section), with
  the section marked and the RF of the vehicle where it stands now drawn on it;
* a read-out: the RF at the section with the vehicle where it stands (:meth:`ilkit.rating.GirderRating.
  standing`: its axles only, lane loads left out), the live effect, and the rated RF there (the worst
  placement), and a button that moves the vehicle to that worst placement.

Like :class:`ilkit.views.Explorer` it holds no engineering logic: every number comes from the rating (a core
object) and :func:`ilkit.loads.stand`; a slider step updates the read-out at once and the redraw is coalesced
(only the moving artists are redrawn on a cached background).  Results must be checked, and a rating sealed,
by a licensed engineer under the owner's rules.
"""

from __future__ import annotations

import base64
import html
import math
from typing import TYPE_CHECKING, Any, Literal

from ilkit.errors import IlkitError, RatingInputError
from ilkit.loads.primitives import AxleTrain
from ilkit.loads.standing import train_length
from ilkit.rating.lrfr import GirderRating, StandingRating
from ilkit.views import style
from ilkit.views.caution import CAUTION_SHORT
from ilkit.views.draw import draw_beam
from ilkit.views.livefigure import Backend, Coalescer, LiveFigure, _require
from ilkit.views.loaddraw import LoadArtists, Loading
from ilkit.views.numbers import short
from ilkit.views.plot import plot_line
from ilkit.views.rating_plots import plot_rating

if TYPE_CHECKING:  # pragma: no cover
    from ilkit.design.sections import Section

__all__ = ["RatingView"]


class RatingView:
    """Interactive rating view of a girder's rating (an ipywidgets layout).

    Parameters
    ----------
    rating:
        A :class:`~ilkit.rating.GirderRating`.
    vehicle:
        The vehicle shown first (default: the one with the smallest controlling RF).
    quantity:
        ``"moment"`` or ``"shear"`` (default: the controlling one of that vehicle).
    at, side:
        The rated section (default: the vehicle's controlling section).
    backend:
        ``"inline"`` or ``"ipympl"``; default: follow matplotlib's backend.

    Attributes
    ----------
    vehicle, quantity, section, direction, slider, worst:
        The controls; set their ``value`` (or ``worst.click()``) to drive the view from code.  The slider
        counts steps of the vehicle's front (lead axle) along the girder.
    front:
        Where the vehicle's front stands, in the beam's length unit.
    readout, message, caution:
        HTML widgets.
    standing:
        The :class:`~ilkit.rating.StandingRating` where the vehicle stands now (``standing.rf`` is the RF at
        the section; ``math.inf`` where the vehicle causes nothing there).
    rated:
        The rated RF at the section (the worst placement; dimensionless).
    widget:
        The whole layout.
    """

    def __init__(self, rating: GirderRating, *, vehicle: str | None = None, quantity: str | None = None,
                 at: float | None = None, side: Literal["left", "right"] | None = None,
                 backend: Backend | None = None) -> None:
        if not isinstance(rating, GirderRating):
            raise RatingInputError(f"RatingView: give ilkit.rating.rate_girder(...), got {type(rating).__name__}.",
                                   field="rating", value=rating)
        w = _require("ipywidgets")
        self.rating = rating
        top = rating.controlling().sort_values("RF").iloc[0]
        vehicle = vehicle if vehicle is not None else top["vehicle"]
        rating.load(vehicle)  # an unknown vehicle is refused with the names
        first = rating.controlling().set_index("vehicle").loc[vehicle]
        actions = rating.resistances.actions
        quantity = quantity if quantity is not None else first["quantity"]
        if quantity not in actions:
            raise RatingInputError(f"RatingView: quantity must be one of {list(actions)}, got {quantity!r}.",
                                   field="quantity", value=quantity)
        self._sections = list(rating.sections)
        labels = [(self._label(s), k) for k, s in enumerate(self._sections)]
        if at is None:
            at, side = float(first["x"]), (first["side"] or None)
        start = self._section_index(float(at), side)
        length = float(rating.beam.length)
        unit = rating.beam.units.length if rating.beam.units else ""
        wide = {"description_width": "5em"}
        self.vehicle = w.Dropdown(options=[r.name for r in rating.loads], value=vehicle, description="vehicle",
                                  layout=w.Layout(width="19em"), style=wide)
        self.quantity = w.Dropdown(options=list(actions), value=quantity, description="action",
                                   layout=w.Layout(width="13em"), style=wide)
        self.section = w.Dropdown(options=labels, value=start, description="section",
                                  layout=w.Layout(width="17em"), style=wide)
        self.direction = w.ToggleButtons(options=[("→", "left to right"), ("←", "right to left")],
                                         value="left to right", style={"button_width": "2.6em"},
                                         tooltips=["travelling left to right", "travelling right to left"])
        # the slider counts steps (integers), as the explorer's does: a browser snaps a slider's value to its
        # steps and sends it back, which would move a vehicle put exactly at its worst placement
        self._step = _step(length)
        self.slider = w.IntSlider(value=0, min=0, max=1, description="move", readout=False,
                                  continuous_update=True, layout=w.Layout(width="30em"), style=wide,
                                  tooltip=f"moves the vehicle's front (lead axle) by {self._step:g} {unit}")
        self.front = 0.0
        self.worst = w.Button(description="worst placement", layout=w.Layout(width="11em"),
                              tooltip="move the vehicle to where it gives the rated RF at the section")
        self.readout = w.HTML()
        self.message = w.HTML()
        self.caution = w.HTML(f"<div style='color:#5a5a5a; font-size:0.85em'>{html.escape(CAUTION_SHORT)} "
                              "A rating is sealed by a licensed engineer under the owner's rules.</div>")
        for name in ("vehicle", "quantity", "section", "direction", "slider", "worst", "readout", "message",
                     "caution"):
            getattr(self, name).add_class(f"ilkit-rating-{name}")
        self.standing: StandingRating | None = None
        self._loading = Loading()
        self._at_worst = False
        self.rated = math.inf
        self._quiet = False
        self._live = LiveFigure((8.6, 6.2), backend=backend)
        fig = self._live.figure
        with style.context():
            self._ax_beam, self._ax_line, self._ax_rf = fig.subplots(3, 1, height_ratios=[0.9, 1.8, 2.0])
        fig.subplots_adjust(left=0.09, right=0.98, top=0.96, bottom=0.08, hspace=0.55)
        self._moving: list[Any] = []
        self._redraw = Coalescer(self._render)
        self._stale = True
        self.widget = w.VBox([
            w.HBox([self.vehicle, self.quantity, self.section]),
            w.HBox([self.slider, self.direction, self.worst]),
            self.readout, self.message, self._live.widget, self.caution,
        ])
        self.widget.add_class("ilkit-rating-view")
        self._set_travel()
        self.move_to_worst(redraw=False)
        for control in (self.vehicle, self.quantity, self.section):
            control.observe(self._on_choice, "value")
        self.slider.observe(self._on_move, "value")
        self.direction.observe(self._on_move, "value")
        self.worst.on_click(lambda _: self.move_to_worst())
        self._render()

    # ------------------------------------------------------------------ display
    def _repr_mimebundle_(self, include: Any = None, exclude: Any = None) -> dict[str, Any]:
        data = self.widget._repr_mimebundle_(include=include, exclude=exclude)
        data["image/png"] = base64.b64encode(self._live.png()).decode("ascii")
        return data

    def __repr__(self) -> str:
        return (f"RatingView({self.vehicle.value}, {self.quantity.value} at {self._label(self._section)}: "
                f"RF {self._rf_text(self.standing.rf if self.standing else math.inf)} with the front at "
                f"x={short(self.front, 5)}; rated {self._rf_text(self.rated)})")

    # --------------------------------------------------------------- the state
    @property
    def _section(self) -> Section:
        return self._sections[self.section.value]

    def _label(self, s: Section) -> str:
        unit = self.rating.beam.units.length if self.rating.beam.units else ""
        return f"x = {short(float(s.x), 5)} {unit}".rstrip() + (f" ({s.side} face)" if s.side else "")

    def _section_index(self, at: float, side: str | None) -> int:
        for k, s in enumerate(self._sections):
            if abs(float(s.x) - at) <= 1e-9 * float(self.rating.beam.length) and (s.side == side or s.side is None):
                return k
        raise RatingInputError(f"RatingView: no rated section at x={at:g}" + (f" ({side} face)" if side else "")
                               + "; choose one of the rating's sections (rating.sections).", field="at", value=at)

    def _set_travel(self) -> None:
        """The slider covers every position where the vehicle's axles can stand on the girder."""
        r = self.rating.load(self.vehicle.value)
        train = next((p for p in r.model.cases[0].parts if isinstance(p, AxleTrain)), None)
        extra = train_length(train) if train is not None else 0.0
        self._set_quietly(self.slider, "max", math.ceil((float(self.rating.beam.length) + extra) / self._step))

    def _set_quietly(self, control: Any, name: str, value: Any) -> None:
        self._quiet = True
        try:
            setattr(control, name, value)
        finally:
            self._quiet = False

    # ----------------------------------------------------------------- actions
    def move_to_worst(self, *, redraw: bool = True) -> None:
        """Move the vehicle to the placement that gives the rated RF at the section (the smaller of the two
        senses); its axles stand as there (a lane load of the model is not drawn)."""
        s = self._section
        q = self.quantity.value
        name = self.vehicle.value
        f = self.rating.frame
        rows = f[(f["vehicle"] == name) & (f["quantity"] == q) & (f["x"] == float(s.x)) & (f["side"] == (s.side or ""))]
        if rows.empty:
            self.rated = math.inf
            self._show_message(f"{name} causes no {q} at {self._label(s)}.")
            self._update(redraw)
            return
        row = rows.loc[rows["RF"].idxmin()]
        self.rated = float(row["RF"])
        extreme = self.rating.extreme(name, q, float(s.x), row["sense"], s.side)
        placed = next((p for p in extreme.placements if p.front is not None and p.axles), None)
        if placed is not None:
            self._set_quietly(self.direction, "value", placed.direction or "left to right")
            self.front = float(placed.front)
            self._set_quietly(self.slider, "value", min(max(round(self.front / self._step), 0), self.slider.max))
        # the worst placement as the rating found it (an axle exactly at a jump takes the worse face; the lane
        # load of the case is part of it), until the vehicle moves
        self.standing = StandingRating(self.rated, float(row["live"]), row["sense"], float(row["capacity"]),
                                       float(row["dead"]), placed)  # type: ignore[arg-type]
        self._loading = Loading.of(extreme.placements)
        self._at_worst = True
        self._write_readout()
        if redraw:
            self._redraw.request()

    def _on_choice(self, change: dict[str, Any]) -> None:
        if self._quiet:
            return
        if change["owner"] is self.vehicle:
            self._set_travel()
        self._stale = True
        self._show_message("")
        self.move_to_worst()

    def _on_move(self, change: dict[str, Any]) -> None:
        if self._quiet:
            return
        if change["owner"] is self.slider:
            self.front = round(change["new"] * self._step, 12)
        self._update(True)

    def _update(self, redraw: bool) -> None:
        """Ask the core for the RF at the section with the vehicle where it stands; the read-out at once."""
        s = self._section
        try:
            self.standing = self.rating.standing(self.vehicle.value, self.quantity.value, float(s.x),
                                                 self.front, side=s.side, direction=self.direction.value)
        except IlkitError as err:
            self._show_message(str(err), error=True)
            return
        self._loading = Loading.of([self.standing.placement])
        self._at_worst = False
        self._write_readout()
        if redraw:
            self._redraw.request()

    # ---------------------------------------------------------------- read-out
    @staticmethod
    def _rf_text(value: float) -> str:
        return "∞ (no effect)" if math.isinf(value) else f"{value:.3g}"

    def _write_readout(self) -> None:
        st = self.standing
        assert st is not None
        u = self.rating.beam.units
        unit = (u.moment if self.quantity.value == "moment" else u.force) if u else ""
        name = html.escape(self.vehicle.value)
        where = html.escape(self._label(self._section))
        share = "with IM and the girder's share" + ("" if self._at_worst else "; axles only")
        self.readout.value = (
            f"<div class='ilkit-rating-readout' data-rf='{st.rf!r}' data-front='{self.front!r}'>"
            f"<b>RF = <span class='ilkit-rf'>{self._rf_text(st.rf)}</span></b> at {where} ({self.quantity.value},"
            f" {st.sense}) with {name}'s front at x = {short(self.front, 5)}: live effect "
            f"{short(st.live, 5)} {unit} ({share}), C = "
            f"{short(st.capacity, 5)} {unit}, Σγp P = {short(st.dead, 5)} {unit}. "
            f"Rated RF at this section (worst placement): <b>{self._rf_text(self.rated)}</b>.</div>")

    def _show_message(self, text: str, *, error: bool = False) -> None:
        colour = "#8a1c1c" if error else "#1c1c1c"
        self.message.value = f"<div style='color:{colour}'>{html.escape(text)}</div>" if text else ""

    # ------------------------------------------------------------------ drawing
    def _render(self) -> None:
        if self._stale:
            self._stale = False
            self._draw_background()
            self._draw_moving()
            with style.context():
                self._live.draw()
        else:
            self._draw_moving()
            self._live.refresh()

    def _draw_background(self) -> None:
        self._live.forget(*self._moving)
        s = self._section
        line = self.rating.beam.line(self.quantity.value, s.x, s.side)
        self._line = line
        for ax in (self._ax_beam, self._ax_line, self._ax_rf):
            ax.clear()
        length = float(self.rating.beam.length)
        with style.context():
            draw_beam(self.rating.beam, ax=self._ax_beam)
            plot_line(line, ax=self._ax_line, title=f"Influence line: {self.quantity.value} at {self._label(s)}")
            plot_rating(self.rating, self.vehicle.value, ax=self._ax_rf, quantity=self.quantity.value)
            for ax in (self._ax_line, self._ax_rf):
                ax.axvline(float(s.x), color=style.MUTED, linewidth=0.8, linestyle=(0, (4, 3)), zorder=0,
                           gid="section")
            for ax in (self._ax_beam, self._ax_line, self._ax_rf):
                ax.set_xlim(-0.05 * length, 1.05 * length)
            self._load = LoadArtists(self._ax_beam, self._ax_line)
            self._here = self._ax_rf.plot([], [], "o", color="#b03030", markersize=7, zorder=7,
                                          gid="rf-standing")[0]
        self._moving = [*self._load.artists, self._here]
        self._live.animate(*self._moving)

    def _draw_moving(self) -> None:
        st = self.standing
        if st is None:
            return
        self._load.update(self._loading, self._line)
        top = self._ax_rf.get_ylim()[1]
        value = st.rf if math.isfinite(st.rf) else top
        self._here.set_data([float(self._section.x)], [min(max(value, 0.0), top)])


def _step(length: float) -> float:
    """A slider step: about a two-hundredth of the girder, rounded to 1, 2 or 5 times a power of ten."""
    raw = length / 200.0
    power = 10 ** math.floor(math.log10(raw))
    return next(m * power for m in (1, 2, 5, 10) if m * power >= raw)
