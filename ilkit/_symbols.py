"""The sympy symbol of the load position (imported lazily: sympy is slow to import)."""

import sympy

x = sympy.Symbol("x", real=True)
"""Position of the travelling unit load, from the left end of the beam."""
