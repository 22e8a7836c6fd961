//! Figures for chiwave (plotters SVG backend), shared by the page and the CLI.
