"""Rich notebook display for core objects, drawn by the views layer on demand.

Why a ``_repr_mimebundle_`` method rather than registering IPython formatters:
Jupyter asks an object for ``_repr_mimebundle_`` whenever it is shown, in any
kernel and front end, without the user importing anything or ilkit touching
IPython's global state.  The method imports :mod:`ilkit.views.display` only
when a notebook asks for the display, so ``import ilkit`` stays fast and
headless, and the core modules never import the views at import time.  The
views layer decides, per type, what to show (see
:func:`ilkit.views.display.mimebundle`); ``repr`` stays short and
constructor-like.
"""

from __future__ import annotations

from typing import Any

__all__ = ["RichDisplay"]


class RichDisplay:
    """Mixin: a notebook shows the object through :func:`ilkit.views.display.mimebundle`."""

    __slots__ = ()

    def _repr_mimebundle_(self, include: Any = None, exclude: Any = None) -> dict[str, Any]:
        from ilkit.views.display import mimebundle

        return mimebundle(self, include=include, exclude=exclude)
