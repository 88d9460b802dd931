"""Views benchmark: how long derivations, drawings, displays and a calculation sheet take.

Prints wall-clock figures for the demo girder (seven influence lines) and
ratios against the core computation of the same lines, so a slow view shows
up as a large ratio.  Not a test: run with ``make bench``.
"""

from __future__ import annotations

import tempfile
import time
from collections.abc import Callable

import matplotlib

matplotlib.use("Agg")

from ilkit.views import derivation
from ilkit.views.demo import demo_lines, suspended_span_girder, write_demo_sheet
from ilkit.views.display import line_figure
from ilkit.views.style import figure_svg


def best_of(fn: Callable[[], object], repeat: int = 3) -> float:
    times = []
    for _ in range(repeat):
        start = time.perf_counter()
        fn()
        times.append(time.perf_counter() - start)
    return min(times)


def main() -> None:
    def core() -> None:
        beam = suspended_span_girder()  # a fresh beam: no cached lines
        demo_lines(beam)

    beam = suspended_span_girder()
    lines = demo_lines(beam)
    n = len(lines)
    t_core = best_of(core)
    t_derive = best_of(lambda: [derivation(line).to_markdown() for line in lines])
    t_sketch = best_of(lambda: [figure_svg(line_figure(line)) for line in lines])
    t_display = best_of(lambda: [line._repr_mimebundle_() for line in lines])
    with tempfile.TemporaryDirectory() as tmp:
        t_sheet = best_of(lambda: write_demo_sheet(tmp), repeat=2)
    print(f"demo girder, {n} influence lines")
    print(f"  core lines                 {1e3 * t_core:8.1f} ms")
    print(f"  derivations (Markdown)     {1e3 * t_derive:8.1f} ms   {t_derive / t_core:6.1f} x core")
    print(f"  sketches (SVG)             {1e3 * t_sketch:8.1f} ms   {t_sketch / t_core:6.1f} x core")
    print(f"  notebook displays          {1e3 * t_display:8.1f} ms   {t_display / t_core:6.1f} x core")
    print(f"  calculation sheet          {1e3 * t_sheet:8.1f} ms   {1e3 * t_sheet / n:6.1f} ms per line")


if __name__ == "__main__":
    main()
