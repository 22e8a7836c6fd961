//! Figures for chiwave, shared by the page and the CLI.
//!
//! One generic [`Figure`] (title, labelled axes with units, linear or log axes, line series with
//! gaps, shaded x-bands, error bars, point markers) is drawn by one routine, [`render`], into an
//! SVG string. [`render`] also returns a [`PlotFrame`]: the pixel rectangle of the plot area and
//! the axis ranges, so that the page can turn a mouse position back into data values.
//!
//! The builders in [`figures`] make the chiwave figures from plain arrays (α against b, rays in
//! the lens plane, |F| against w). The layout and wording are chiwave's own.
//!
//! The SVG is written by [`svg`] with fractional coordinates (no stair steps at any zoom) in a
//! standard font stack; text is never measured by a font engine but estimated ([`text`]), so
//! no font files are needed and the same code runs natively and in wasm without touching the
//! DOM. Colours, the colour-blind-safe series palette and the sky maps' perceptually uniform
//! scale: [`colour`]; their construction and sources are in `docs/figures.md`.

pub mod colour;
pub mod figures;
pub mod figures_encounter;
pub mod figures_waveform;
pub mod heatmap;
pub mod scene;
pub mod svg;
pub mod text;
pub mod ticks;

mod layout;
mod model;
#[cfg(test)]
mod quality_tests;
mod render;

pub use model::*;
pub use render::{render, render_for_page};
