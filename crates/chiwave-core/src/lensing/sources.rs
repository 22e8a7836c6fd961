//! The sources of the lens result's output keys (`sources`: output key → citation).

pub(crate) const SRC_EINSTEIN: &str = "Einstein 1936; Refsdal 1964; Schneider, Ehlers & Falco 1992, Gravitational Lenses";
pub(crate) const SRC_IMAGES: &str = "Paczyński 1986, ApJ 304, 1; Schneider, Ehlers & Falco 1992";
pub(crate) const SRC_DELAY: &str = "Takahashi & Nakamura 2003, ApJ 595, 1039, arXiv:astro-ph/0305055 (T(y) in units of 4GM_Lz/c³)";
pub(crate) const SRC_WAVE: &str = "Takahashi & Nakamura 2003, ApJ 595, 1039, arXiv:astro-ph/0305055 (point-lens F(w, y), e^{-iωt} convention)";
