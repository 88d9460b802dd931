"""Views: drawings, derivations, notebook displays, tables and calculation sheets."""
