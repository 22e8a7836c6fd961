//! The publications chiwave uses, once each: a registry of references with their BibTeX.
//!
//! Every formula in the core names its primary source in its doc comment; every output key of a
//! result names it in `sources` (a human string) and in `citations` (registry ids with the
//! equation or section). Both are generated from this registry, so a reference is written once
//! and a reader can look each one up: authors, year, title, journal, arXiv id, DOI.
//!
//! # How the entries were checked
//! Each entry carries a `checked` note. "arXiv page" means that the title, the authors and the
//! arXiv id were compared with the paper's arXiv abstract page (or a mirror of it) through a
//! literature search; journal, volume and page are given as recalled unless the note says they
//! were seen too. Books and papers older than the arXiv give only what can be stood behind
//! (publisher, year, edition); DOIs are given only where they follow from the journal's fixed
//! pattern (APS, Nature, JHEP, Living Reviews) or were seen. Where an equation number could not
//! be confirmed, the citations name the section or the result instead.
//!
//! # Examples
//! ```
//! use chiwave_core::references;
//! let r = references::get("herrmann2021").unwrap();
//! assert_eq!(r.arxiv, Some("2101.07255"));
//! assert!(r.short().starts_with("Herrmann, Parra-Martinez, Ruf & Zeng 2021"));
//! assert!(r.bibtex().starts_with("@article{herrmann2021,"));
//! ```

use serde::Serialize;
use std::collections::BTreeMap;

/// What kind of publication an entry is (its BibTeX entry type).
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "lowercase")]
pub enum Kind {
    /// A journal article (`@article`).
    Article,
    /// A book (`@book`).
    Book,
    /// A chapter in an edited book (`@incollection`).
    InCollection,
    /// A preprint, a resolution or a database (`@misc`).
    Misc,
}

/// One publication.
#[derive(Debug, Clone, PartialEq, Eq, Serialize)]
pub struct Reference {
    /// Stable identifier, also the BibTeX key (e.g. `bern2019`).
    pub id: &'static str,
    pub kind: Kind,
    /// Authors as "Last, First" (Unicode; escaped for BibTeX by [`Reference::bibtex`]); a last
    /// entry "others" stands for authors not listed (BibTeX "and others").
    pub authors: &'static [&'static str],
    pub year: u16,
    pub title: &'static str,
    /// Journal (articles), or the series of a book.
    pub journal: Option<&'static str>,
    pub volume: Option<&'static str>,
    /// First page or article number.
    pub pages: Option<&'static str>,
    /// Publisher (books).
    pub publisher: Option<&'static str>,
    pub edition: Option<&'static str>,
    /// The book a chapter appeared in, with its editors.
    pub booktitle: Option<&'static str>,
    pub editors: Option<&'static str>,
    /// arXiv identifier without the `arXiv:` prefix.
    pub arxiv: Option<&'static str>,
    pub doi: Option<&'static str>,
    /// What chiwave uses it for.
    pub used_for: &'static str,
    /// How the entry was checked (see the module documentation).
    pub checked: &'static str,
}

/// One citation of a registry entry: the reference and where in it (equation, section, table).
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
pub struct Citation {
    pub id: &'static str,
    /// Equation, section, table or result in the reference; empty for the work as a whole.
    #[serde(rename = "where")]
    pub at: &'static str,
}

/// The source of one output key: a short sentence saying what was done (may be empty) and the
/// citations behind it. [`source_maps`] turns a list of them into a result's `sources` (human
/// strings) and `citations` (ids with places).
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub struct Source {
    pub text: &'static str,
    pub cites: &'static [Citation],
}

/// A citation of registry entry `id` at `at` (an equation, section or result; may be empty).
pub const fn cite(id: &'static str, at: &'static str) -> Citation {
    Citation { id, at }
}

/// A source: what was done (`text`, may be empty) and the citations behind it.
pub const fn source(text: &'static str, cites: &'static [Citation]) -> Source {
    Source { text, cites }
}

/// A result's `sources` map: output key → human citation string.
pub type SourceMap = BTreeMap<&'static str, String>;
/// A result's `citations` map: output key → registry citations (for BibTeX on the page).
pub type CitationMap = BTreeMap<&'static str, Vec<Citation>>;

/// `sources` and `citations` of a result from its list of (output key, source).
///
/// The human string is the source's text followed by each citation in the form
/// "Authors Year, arXiv:id (or journal), where"; an id missing from the registry is a bug and
/// is written as `[unknown reference id]` (the registry test looks for it).
pub fn source_maps(entries: &[(&'static str, Source)]) -> (SourceMap, CitationMap) {
    let mut s = SourceMap::new();
    let mut c = CitationMap::new();
    for (key, src) in entries {
        s.insert(key, src.render());
        c.insert(key, src.cites.to_vec());
    }
    (s, c)
}

impl Source {
    /// The human string: text, then the citations separated by "; ".
    pub fn render(&self) -> String {
        let cites: Vec<String> = self.cites.iter().map(Citation::render).collect();
        match (self.text.is_empty(), cites.is_empty()) {
            (true, _) => cites.join("; "),
            (false, true) => self.text.to_string(),
            (false, false) => format!("{}: {}", self.text, cites.join("; ")),
        }
    }
}

impl Citation {
    /// "Authors Year, arXiv:id (or journal), where".
    pub fn render(&self) -> String {
        let Some(r) = get(self.id) else {
            return format!("[unknown reference id {}]", self.id);
        };
        if self.at.is_empty() {
            r.short()
        } else {
            format!("{}, {}", r.short(), self.at)
        }
    }
}

impl Reference {
    /// Last names in citation style: "A", "A & B", "A, B & C", "A, B, C & D", "A et al." (five or more).
    pub fn author_names(&self) -> String {
        let last: Vec<&str> = self.authors.iter().map(|a| a.split(',').next().unwrap_or(a).trim()).collect();
        if last.len() > 1 && last[last.len() - 1] == "others" {
            return format!("{} et al.", last[0]);
        }
        match last.len() {
            0 => String::new(),
            1 => last[0].to_string(),
            2..=4 => format!("{} & {}", last[..last.len() - 1].join(", "), last[last.len() - 1]),
            _ => format!("{} et al.", last[0]),
        }
    }

    /// Where to look it up: "arXiv:id" when there is one, else the journal reference (articles),
    /// the title and edition (books) or the book a chapter is in.
    pub fn locator(&self) -> String {
        if let Some(a) = self.arxiv {
            return format!("arXiv:{a}");
        }
        match self.kind {
            Kind::Book => match self.edition {
                Some(e) => format!("{}, {e} ed.", self.title),
                None => self.title.to_string(),
            },
            Kind::InCollection => format!("in {}", self.booktitle.unwrap_or(self.title)),
            Kind::Article | Kind::Misc => match (self.journal, self.volume, self.pages) {
                (Some(j), Some(v), Some(p)) => format!("{j} {v}, {p}"),
                (Some(j), _, _) => j.to_string(),
                _ => self.title.to_string(),
            },
        }
    }

    /// Short citation: "Authors Year, locator" (e.g. "Damour 2018, arXiv:1710.10599").
    pub fn short(&self) -> String {
        format!("{} {}, {}", self.author_names(), self.year, self.locator())
    }

    /// Full reference in one line, for listings.
    pub fn full(&self) -> String {
        let mut s = format!("{} ({}). {}.", self.authors.join("; "), self.year, self.title);
        if let Some(j) = self.journal {
            s.push_str(&format!(" {j}"));
            if let Some(v) = self.volume {
                s.push_str(&format!(" {v}"));
            }
            if let Some(p) = self.pages {
                s.push_str(&format!(", {p}"));
            }
            s.push('.');
        }
        if let Some(b) = self.booktitle {
            s.push_str(&format!(" In {b}"));
            if let Some(e) = self.editors {
                s.push_str(&format!(", eds. {e}"));
            }
            s.push('.');
        }
        if let Some(e) = self.edition {
            s.push_str(&format!(" {e} ed."));
        }
        if let Some(p) = self.publisher {
            s.push_str(&format!(" {p}."));
        }
        if let Some(a) = self.arxiv {
            s.push_str(&format!(" arXiv:{a}."));
        }
        if let Some(d) = self.doi {
            s.push_str(&format!(" doi:{d}."));
        }
        s
    }

    /// The BibTeX entry (ASCII: accents and symbols as LaTeX commands; the title in double
    /// braces so that its capitals are kept).
    pub fn bibtex(&self) -> String {
        let ty = match self.kind {
            Kind::Article => "article",
            Kind::Book => "book",
            Kind::InCollection => "incollection",
            Kind::Misc => "misc",
        };
        let mut f: Vec<(&str, String)> = Vec::new();
        let authors: Vec<String> = self.authors.iter().map(|a| latex(a)).collect();
        f.push(("author", authors.join(" and ")));
        f.push(("title", format!("{{{}}}", latex(self.title))));
        if let Some(b) = self.booktitle {
            f.push(("booktitle", latex(b)));
        }
        if let Some(e) = self.editors {
            f.push(("editor", latex(e)));
        }
        let book = matches!(self.kind, Kind::Book);
        if let Some(j) = self.journal {
            f.push((if book { "series" } else { "journal" }, latex(j)));
        }
        if let Some(v) = self.volume {
            f.push((if book { "number" } else { "volume" }, v.to_string()));
        }
        if let Some(p) = self.pages {
            f.push(("pages", p.to_string()));
        }
        if let Some(e) = self.edition {
            f.push(("edition", e.to_string()));
        }
        if let Some(p) = self.publisher {
            f.push(("publisher", latex(p)));
        }
        f.push(("year", self.year.to_string()));
        if let Some(a) = self.arxiv {
            f.push(("eprint", a.to_string()));
            f.push(("archivePrefix", "arXiv".to_string()));
        }
        if let Some(d) = self.doi {
            f.push(("doi", d.to_string()));
        }
        let body: Vec<String> = f.iter().map(|(k, v)| format!("  {k} = {{{v}}}")).collect();
        format!("@{ty}{{{},\n{}\n}}\n", self.id, body.join(",\n"))
    }
}

/// Unicode → LaTeX for the characters the registry uses (accents, Greek letters, super- and
/// subscripts); anything else non-ASCII is kept (the registry test insists the output is ASCII).
fn latex(s: &str) -> String {
    let mut out = String::with_capacity(s.len());
    for ch in s.chars() {
        let rep = match ch {
            'á' => "{\\'a}",
            'é' => "{\\'e}",
            'É' => "{\\'E}",
            'è' => "{\\`e}",
            'ø' => "{\\o}",
            'ñ' => "{\\~n}",
            'ç' => "{\\c{c}}",
            'ß' => "{\\ss}",
            'í' => "{\\'i}",
            'ó' => "{\\'o}",
            'ń' => "{\\'n}",
            'ć' => "{\\'c}",
            'ä' => "{\\\"a}",
            'ö' => "{\\\"o}",
            'ü' => "{\\\"u}",
            'Ü' => "{\\\"U}",
            'š' => "{\\v{s}}",
            'ł' => "{\\l}",
            '–' => "--",
            '—' => "---",
            '’' => "'",
            'α' => "$\\alpha$",
            'γ' => "$\\gamma$",
            '³' => "$^3$",
            '⁵' => "$^5$",
            '&' => "\\&",
            _ => {
                out.push(ch);
                continue;
            }
        };
        out.push_str(rep);
    }
    out
}

/// Every reference, ordered by id.
pub fn all() -> &'static [Reference] {
    REFERENCES
}

/// The reference with this id.
pub fn get(id: &str) -> Option<&'static Reference> {
    REFERENCES.iter().find(|r| r.id == id)
}

/// One registry entry as the CLI's `sources --json` and the page's References panel get it:
/// every field of the [`Reference`], its short citation and its BibTeX entry.
#[derive(Debug, Clone, PartialEq, Eq, Serialize)]
pub struct Listed {
    #[serde(flatten)]
    pub reference: &'static Reference,
    pub short: String,
    pub bibtex: String,
}

/// The whole registry with short citations and BibTeX, ordered by id.
pub fn listing() -> Vec<Listed> {
    REFERENCES.iter().map(|r| Listed { reference: r, short: r.short(), bibtex: r.bibtex() }).collect()
}

/// All BibTeX entries, separated by blank lines.
pub fn bibtex_all() -> String {
    REFERENCES.iter().map(Reference::bibtex).collect::<Vec<_>>().join("\n")
}

const ART: Reference = Reference {
    id: "",
    kind: Kind::Article,
    authors: &[],
    year: 0,
    title: "",
    journal: None,
    volume: None,
    pages: None,
    publisher: None,
    edition: None,
    booktitle: None,
    editors: None,
    arxiv: None,
    doi: None,
    used_for: "",
    checked: "",
};

const BOOK: Reference = Reference { kind: Kind::Book, ..ART };

/// Note for arXiv entries whose title, authors and id were compared with the abstract page.
const SEEN: &str = "title, authors and arXiv id compared with the arXiv abstract page; journal reference as recalled";
/// Note for arXiv entries not looked up again.
const RECALLED: &str = "recalled from memory (title, authors, journal, arXiv id); not compared with the abstract page";
/// Note for books.
const BOOK_NOTE: &str = "book: authors, title, publisher, year and edition as recalled; no DOI given";
/// Note for papers older than the arXiv.
const OLD_NOTE: &str = "predates the arXiv: journal, volume, first page and year as recalled; not compared with the journal";

/// The registry, ordered by id.
static REFERENCES: &[Reference] = &[
    Reference {
        id: "abramowitz1964",
        authors: &["Abramowitz, Milton", "Stegun, Irene A."],
        year: 1964,
        title: "Handbook of Mathematical Functions with Formulas, Graphs, and Mathematical Tables",
        journal: Some("National Bureau of Standards Applied Mathematics Series"),
        volume: Some("55"),
        publisher: Some("U.S. Government Printing Office, Washington"),
        used_for: "Gauss–Legendre rules (eq. 25.4.29); integral representations and small-argument limits of K0, K1 (eqs. 9.6.13, 9.6.24); Stirling series of ln Γ (eqs. 6.1.40, 6.1.41)",
        checked: BOOK_NOTE,
        ..BOOK
    },
    Reference {
        id: "ajith2011",
        authors: &["Ajith, P."],
        year: 2011,
        title: "Addressing the spin question in gravitational-wave searches: Waveform templates for inspiralling compact binaries with nonprecessing spins",
        journal: Some("Phys. Rev. D"),
        volume: Some("84"),
        pages: Some("084037"),
        arxiv: Some("1107.1267"),
        doi: Some("10.1103/PhysRevD.84.084037"),
        used_for: "analytic fit to the Advanced LIGO zero-detuned high-power noise PSD (noise curve `aligo`)",
        checked: "title, author and arXiv id compared with the arXiv abstract page; the fit itself could not be seen (see docs/physics/detection.md)",
        ..ART
    },
    Reference {
        id: "antonelli2019",
        authors: &["Antonelli, Andrea", "Buonanno, Alessandra", "Steinhoff, Jan", "van de Meent, Maarten", "Vines, Justin"],
        year: 2019,
        title: "Energetics of two-body Hamiltonians in post-Minkowskian gravity",
        journal: Some("Phys. Rev. D"),
        volume: Some("99"),
        pages: Some("104004"),
        arxiv: Some("1901.07102"),
        doi: Some("10.1103/PhysRevD.99.104004"),
        used_for: "the mass-polynomial form of the 3PM angle (χ₃ as test-body part plus ν term)",
        checked: RECALLED,
        ..ART
    },
    Reference {
        id: "asada2003",
        authors: &["Asada, Hideki", "Kasai, Masumi", "Yamamoto, Tatsuya"],
        year: 2003,
        title: "Separability of rotational effects on a gravitational lens",
        journal: Some("Phys. Rev. D"),
        volume: Some("67"),
        pages: Some("043006"),
        arxiv: Some("astro-ph/0301099"),
        doi: Some("10.1103/PhysRevD.67.043006"),
        used_for: "the Kerr deflection linear in M equals a translated Schwarzschild lens, 4M/(b + a) (test of the Kerr series)",
        checked: SEEN,
        ..ART
    },
    Reference {
        id: "bardeen1972",
        authors: &["Bardeen, James M.", "Press, William H.", "Teukolsky, Saul A."],
        year: 1972,
        title: "Rotating black holes: locally nonrotating frames, energy extraction, and scalar synchrotron radiation",
        journal: Some("Astrophys. J."),
        volume: Some("178"),
        pages: Some("347"),
        used_for: "equatorial Kerr photon orbits r_ph(a) and the critical impact parameter b_c = 3√(M r_ph) − a",
        checked: OLD_NOTE,
        ..ART
    },
    Reference {
        id: "bern2019",
        authors: &["Bern, Zvi", "Cheung, Clifford", "Roiban, Radu", "Shen, Chia-Hsien", "Solon, Mikhail P.", "Zeng, Mao"],
        year: 2019,
        title: "Scattering amplitudes and the conservative Hamiltonian for binary systems at third post-Minkowskian order",
        journal: Some("Phys. Rev. Lett."),
        volume: Some("122"),
        pages: Some("201603"),
        arxiv: Some("1901.04424"),
        doi: Some("10.1103/PhysRevLett.122.201603"),
        used_for: "the conservative 3PM scattering angle",
        checked: "title, authors and journal reference as quoted on the arXiv abstract pages of later papers (Damour 2020, arXiv:1912.02139 and 2010.01641); arXiv id recalled",
        ..ART
    },
    Reference {
        id: "bern2019long",
        authors: &["Bern, Zvi", "Cheung, Clifford", "Roiban, Radu", "Shen, Chia-Hsien", "Solon, Mikhail P.", "Zeng, Mao"],
        year: 2019,
        title: "Black hole binary dynamics from the double copy and effective theory",
        journal: Some("J. High Energy Phys."),
        volume: Some("10"),
        pages: Some("206"),
        arxiv: Some("1908.01493"),
        doi: Some("10.1007/JHEP10(2019)206"),
        used_for: "the long version of the conservative 3PM result",
        checked: RECALLED,
        ..ART
    },
    Reference {
        id: "bern2023",
        kind: Kind::Misc,
        authors: &["Bern, Zvi", "Herrmann, Enrico", "Roiban, Radu", "Ruf, Michael S.", "Smirnov, Alexander V.", "Smirnov, Vladimir A.", "Zeng, Mao"],
        year: 2023,
        title: "Conservative binary dynamics at order O(α⁵) in electrodynamics",
        arxiv: Some("2305.08981"),
        used_for: "the electromagnetic scattering angle of two charges order by order in the coupling (second-order two-body term)",
        checked: "title, authors and arXiv id compared with the arXiv abstract page; journal reference not verified, so none is given",
        ..ART
    },
    Reference {
        id: "bini2017",
        authors: &["Bini, Donato", "Damour, Thibault"],
        year: 2017,
        title: "Gravitational scattering of two black holes at the fourth post-Newtonian approximation",
        journal: Some("Phys. Rev. D"),
        volume: Some("96"),
        pages: Some("064021"),
        arxiv: Some("1706.06877"),
        doi: Some("10.1103/PhysRevD.96.064021"),
        used_for: "the 2PM scattering angle and the test-mass PM coefficients",
        checked: RECALLED,
        ..ART
    },
    Reference {
        id: "bozza2002",
        authors: &["Bozza, V."],
        year: 2002,
        title: "Gravitational lensing in the strong field limit",
        journal: Some("Phys. Rev. D"),
        volume: Some("66"),
        pages: Some("103001"),
        arxiv: Some("gr-qc/0208075"),
        doi: Some("10.1103/PhysRevD.66.103001"),
        used_for: "the strong-deflection (logarithmic) limit of the Schwarzschild light deflection, ā = 1 and b̄",
        checked: RECALLED,
        ..ART
    },
    Reference {
        id: "braginsky1987",
        authors: &["Braginsky, V. B.", "Thorne, K. S."],
        year: 1987,
        title: "Gravitational-wave bursts with memory and experimental prospects",
        journal: Some("Nature"),
        volume: Some("327"),
        pages: Some("123"),
        doi: Some("10.1038/327123a0"),
        used_for: "the gravitational-wave memory of an unbound encounter from the change of the bodies' momenta",
        checked: OLD_NOTE,
        ..ART
    },
    Reference {
        id: "carlson1995",
        authors: &["Carlson, B. C."],
        year: 1995,
        title: "Numerical computation of real or complex elliptic integrals",
        journal: Some("Numer. Algorithms"),
        volume: Some("10"),
        pages: Some("13"),
        arxiv: Some("math/9409227"),
        used_for: "the symmetric elliptic integral R_F used to evaluate Darwin's closed form",
        checked: RECALLED,
        ..ART
    },
    Reference {
        id: "carter1968",
        authors: &["Carter, Brandon"],
        year: 1968,
        title: "Global structure of the Kerr family of gravitational fields",
        journal: Some("Phys. Rev."),
        volume: Some("174"),
        pages: Some("1559"),
        doi: Some("10.1103/PhysRev.174.1559"),
        used_for: "the separated equations of Kerr geodesics (equatorial radial potential, orbit equation)",
        checked: OLD_NOTE,
        ..ART
    },
    Reference {
        id: "chandrasekhar1983",
        authors: &["Chandrasekhar, S."],
        year: 1983,
        title: "The Mathematical Theory of Black Holes",
        publisher: Some("Clarendon Press, Oxford"),
        used_for: "Schwarzschild timelike geodesics and their capture (ch. 3); Reissner–Nordström null geodesics and photon sphere (ch. 5)",
        checked: BOOK_NOTE,
        ..BOOK
    },
    Reference {
        id: "codata2018",
        authors: &["Tiesinga, Eite", "Mohr, Peter J.", "Newell, David B.", "Taylor, Barry N."],
        year: 2021,
        title: "CODATA recommended values of the fundamental physical constants: 2018",
        journal: Some("Rev. Mod. Phys."),
        volume: Some("93"),
        pages: Some("025010"),
        doi: Some("10.1103/RevModPhys.93.025010"),
        used_for: "G, ħ and the electromagnetic constants (CODATA 2018 values)",
        checked: RECALLED,
        ..ART
    },
    Reference {
        id: "cooley1965",
        authors: &["Cooley, James W.", "Tukey, John W."],
        year: 1965,
        title: "An algorithm for the machine calculation of complex Fourier series",
        journal: Some("Math. Comp."),
        volume: Some("19"),
        pages: Some("297"),
        used_for: "the radix-2 FFT of a test that checks the burst spectrum against the sampled waveform",
        checked: OLD_NOTE,
        ..ART
    },
    Reference {
        id: "cutler1994",
        authors: &["Cutler, Curt", "Flanagan, Éanna E."],
        year: 1994,
        title: "Gravitational waves from merging compact binaries: How accurately can one extract the binary's parameters from the inspiral waveform?",
        journal: Some("Phys. Rev. D"),
        volume: Some("49"),
        pages: Some("2658"),
        arxiv: Some("gr-qc/9402014"),
        doi: Some("10.1103/PhysRevD.49.2658"),
        used_for: "the matched-filter signal-to-noise ratio ρ² = 4∫|h̃|²/S_n df",
        checked: RECALLED,
        ..ART
    },
    Reference {
        id: "damour1988",
        authors: &["Damour, T.", "Schäfer, G."],
        year: 1988,
        title: "Higher-order relativistic periastron advances and binary pulsars",
        journal: Some("Nuovo Cimento B"),
        volume: Some("101"),
        pages: Some("127"),
        used_for: "Hadamard's finite part in the expansion of orbit integrals (generation of the test-body PM coefficients)",
        checked: OLD_NOTE,
        ..ART
    },
    Reference {
        id: "damour2014",
        authors: &["Damour, Thibault", "Guercilena, Federico", "Hinder, Ian", "Hopper, Seth", "Nagar, Alessandro", "Rezzolla, Luciano"],
        year: 2014,
        title: "Strong-field scattering of two black holes: Numerics versus analytics",
        journal: Some("Phys. Rev. D"),
        volume: Some("89"),
        pages: Some("081503"),
        arxiv: Some("1402.7307"),
        doi: Some("10.1103/PhysRevD.89.081503"),
        used_for: "numerical-relativity scattering angles and the use of the initial-data energy and angular momentum as asymptotic values",
        checked: RECALLED,
        ..ART
    },
    Reference {
        id: "damour2016",
        authors: &["Damour, Thibault"],
        year: 2016,
        title: "Gravitational scattering, post-Minkowskian approximation and effective one-body theory",
        journal: Some("Phys. Rev. D"),
        volume: Some("94"),
        pages: Some("104015"),
        arxiv: Some("1609.00354"),
        doi: Some("10.1103/PhysRevD.94.104015"),
        used_for: "the 1PM scattering angle in the two-body variables (γ, j, ν) and the energy map h = √(1 + 2ν(γ − 1))",
        checked: RECALLED,
        ..ART
    },
    Reference {
        id: "damour2018",
        authors: &["Damour, Thibault"],
        year: 2018,
        title: "High-energy gravitational scattering and the general relativistic two-body problem",
        journal: Some("Phys. Rev. D"),
        volume: Some("97"),
        pages: Some("044038"),
        arxiv: Some("1710.10599"),
        doi: Some("10.1103/PhysRevD.97.044038"),
        used_for: "the 2PM angle, the energy-gauge effective one-body radial potential built from the PM angles (the strong-field estimate)",
        checked: RECALLED,
        ..ART
    },
    Reference {
        id: "damour2020a",
        authors: &["Damour, Thibault"],
        year: 2020,
        title: "Classical and quantum scattering in post-Minkowskian gravity",
        journal: Some("Phys. Rev. D"),
        volume: Some("102"),
        pages: Some("024060"),
        arxiv: Some("1912.02139"),
        doi: Some("10.1103/PhysRevD.102.024060"),
        used_for: "mass polynomiality of the PM angle (h^{n−1}χ_n polynomial in ν) and the 3PM angle in that form",
        checked: SEEN,
        ..ART
    },
    Reference {
        id: "damour2020b",
        authors: &["Damour, Thibault"],
        year: 2020,
        title: "Radiative contribution to classical gravitational scattering at the third order in G",
        journal: Some("Phys. Rev. D"),
        volume: Some("102"),
        pages: Some("124008"),
        arxiv: Some("2010.01641"),
        doi: Some("10.1103/PhysRevD.102.124008"),
        used_for: "the radiated angular momentum at O(G²), the linear-response formula and the radiation-reaction part of the 3PM angle",
        checked: SEEN,
        ..ART
    },
    Reference {
        id: "damour2023",
        authors: &["Damour, Thibault", "Rettegno, Piero"],
        year: 2023,
        title: "Strong-field scattering of two black holes: Numerical relativity meets post-Minkowskian gravity",
        journal: Some("Phys. Rev. D"),
        volume: Some("107"),
        pages: Some("064051"),
        arxiv: Some("2211.01399"),
        doi: Some("10.1103/PhysRevD.107.064051"),
        used_for: "resumming the PM angles into an effective radial potential (the strong-field estimate) and its comparison with numerical relativity",
        checked: RECALLED,
        ..ART
    },
    Reference {
        id: "darwin1913",
        authors: &["Darwin, C. G."],
        year: 1913,
        title: "On some orbits of an electron",
        journal: Some("Phil. Mag."),
        volume: Some("25"),
        pages: Some("201"),
        used_for: "the exact scattering angle of a relativistic test charge in a Coulomb field",
        checked: OLD_NOTE,
        ..ART
    },
    Reference {
        id: "darwin1959",
        authors: &["Darwin, Charles"],
        year: 1959,
        title: "The gravity field of a particle",
        journal: Some("Proc. R. Soc. Lond. A"),
        volume: Some("249"),
        pages: Some("180"),
        used_for: "the exact Schwarzschild light deflection as elliptic integrals, closest approach and capture radius",
        checked: OLD_NOTE,
        ..ART
    },
    Reference {
        id: "davis1984",
        authors: &["Davis, Philip J.", "Rabinowitz, Philip"],
        year: 1984,
        title: "Methods of Numerical Integration",
        edition: Some("2nd"),
        publisher: Some("Academic Press, Orlando"),
        used_for: "composite and adaptive quadrature, interval bisection",
        checked: BOOK_NOTE,
        ..BOOK
    },
    Reference {
        id: "divecchia2020",
        authors: &["Di Vecchia, Paolo", "Heissenberg, Carlo", "Russo, Rodolfo", "Veneziano, Gabriele"],
        year: 2020,
        title: "Universality of ultra-relativistic gravitational scattering",
        journal: Some("Phys. Lett. B"),
        volume: Some("811"),
        pages: Some("135924"),
        arxiv: Some("2008.12743"),
        used_for: "the radiation-reaction part of the 3PM angle and its high-energy limit",
        checked: RECALLED,
        ..ART
    },
    Reference {
        id: "divecchia2021",
        authors: &["Di Vecchia, Paolo", "Heissenberg, Carlo", "Russo, Rodolfo", "Veneziano, Gabriele"],
        year: 2021,
        title: "Radiation reaction from soft theorems",
        journal: Some("Phys. Lett. B"),
        volume: Some("818"),
        pages: Some("136379"),
        arxiv: Some("2101.05772"),
        used_for: "the closed form of the zero-frequency limit dE/dω(ω → 0) of the leading-order waveform",
        checked: RECALLED,
        ..ART
    },
    Reference {
        id: "dlmf",
        kind: Kind::Book,
        authors: &["Olver, Frank W. J.", "Lozier, Daniel W.", "Boisvert, Ronald F.", "Clark, Charles W."],
        year: 2010,
        title: "NIST Handbook of Mathematical Functions",
        publisher: Some("Cambridge University Press, Cambridge"),
        used_for: "elliptic integrals (§19.11, 19.25.5), Kummer's function ₁F₁ (13.2.1, 13.2.2, 13.7.2), Stirling series (5.11.1); the same numbering as the online DLMF",
        checked: BOOK_NOTE,
        ..ART
    },
    Reference {
        id: "einstein1915",
        authors: &["Einstein, Albert"],
        year: 1915,
        title: "Erklärung der Perihelbewegung des Merkur aus der allgemeinen Relativitätstheorie",
        journal: Some("Sitzungsber. Preuss. Akad. Wiss."),
        volume: Some("1915"),
        pages: Some("831"),
        used_for: "the light deflection 4GM/(c²b) at first order",
        checked: OLD_NOTE,
        ..ART
    },
    Reference {
        id: "einstein1918",
        authors: &["Einstein, Albert"],
        year: 1918,
        title: "Über Gravitationswellen",
        journal: Some("Sitzungsber. Preuss. Akad. Wiss."),
        volume: Some("1918"),
        pages: Some("154"),
        used_for: "the quadrupole formula (slow-motion waveform and radiated power)",
        checked: OLD_NOTE,
        ..ART
    },
    Reference {
        id: "einstein1936",
        authors: &["Einstein, Albert"],
        year: 1936,
        title: "Lens-like action of a star by the deviation of light in the gravitational field",
        journal: Some("Science"),
        volume: Some("84"),
        pages: Some("506"),
        used_for: "the Einstein radius of a point lens",
        checked: OLD_NOTE,
        ..ART
    },
    Reference {
        id: "eiroa2002",
        authors: &["Eiroa, Ernesto F.", "Romero, Gustavo E.", "Torres, Diego F."],
        year: 2002,
        title: "Reissner–Nordström black hole lensing",
        journal: Some("Phys. Rev. D"),
        volume: Some("66"),
        pages: Some("024010"),
        arxiv: Some("gr-qc/0203049"),
        doi: Some("10.1103/PhysRevD.66.024010"),
        used_for: "the weak-field Reissner–Nordström deflection (orders ≤ 3)",
        checked: RECALLED,
        ..ART
    },
    Reference {
        id: "gradshteyn2007",
        authors: &["Gradshteyn, I. S.", "Ryzhik, I. M."],
        year: 2007,
        title: "Table of Integrals, Series, and Products",
        edition: Some("7th"),
        publisher: Some("Academic Press, Amsterdam"),
        used_for: "the Fourier integrals of the Coulomb profiles in terms of K0 and K1 (3.754.2; entry number recalled, the integrals are checked numerically in the tests)",
        checked: BOOK_NOTE,
        ..BOOK
    },
    Reference {
        id: "hansen1972",
        authors: &["Hansen, R. O."],
        year: 1972,
        title: "Post-Newtonian gravitational radiation from point masses in a hyperbolic Kepler orbit",
        journal: Some("Phys. Rev. D"),
        volume: Some("5"),
        pages: Some("1021"),
        doi: Some("10.1103/PhysRevD.5.1021"),
        used_for: "the quadrupole energy radiated along a Newtonian hyperbola (relativistic capture estimate)",
        checked: OLD_NOTE,
        ..ART
    },
    Reference {
        id: "herrmann2021",
        authors: &["Herrmann, Enrico", "Parra-Martinez, Julio", "Ruf, Michael S.", "Zeng, Mao"],
        year: 2021,
        title: "Gravitational bremsstrahlung from reverse unitarity",
        journal: Some("Phys. Rev. Lett."),
        volume: Some("126"),
        pages: Some("201602"),
        arxiv: Some("2101.07255"),
        doi: Some("10.1103/PhysRevLett.126.201602"),
        used_for: "the radiated energy-momentum P_rad^μ at O(G³) (function E(γ))",
        checked: RECALLED,
        ..ART
    },
    Reference {
        id: "herrmann2021long",
        authors: &["Herrmann, Enrico", "Parra-Martinez, Julio", "Ruf, Michael S.", "Zeng, Mao"],
        year: 2021,
        title: "Radiative classical gravitational observables at O(G³) from scattering amplitudes",
        journal: Some("J. High Energy Phys."),
        volume: Some("10"),
        pages: Some("148"),
        arxiv: Some("2104.03957"),
        doi: Some("10.1007/JHEP10(2021)148"),
        used_for: "the long version of the O(G³) radiated energy-momentum",
        checked: RECALLED,
        ..ART
    },
    Reference {
        id: "iau2012",
        kind: Kind::Misc,
        authors: &["International Astronomical Union"],
        year: 2012,
        title: "Resolution B2 on the re-definition of the astronomical unit of length",
        journal: Some("IAU XXVIII General Assembly, Beijing"),
        used_for: "the astronomical unit, 149 597 870 700 m exactly (and the parsec from it)",
        checked: "resolution: number and content as recalled; no DOI",
        ..ART
    },
    Reference {
        id: "iyer2007",
        authors: &["Iyer, Sumanta V.", "Petters, Arlie O."],
        year: 2007,
        title: "Light's bending angle due to black holes: from the photon sphere to infinity",
        journal: Some("Gen. Relativ. Gravit."),
        volume: Some("39"),
        pages: Some("1563"),
        arxiv: Some("gr-qc/0611086"),
        used_for: "the strong-deflection series of the Schwarzschild angle (compared, not used for values)",
        checked: RECALLED,
        ..ART
    },
    Reference {
        id: "iyer2009",
        authors: &["Iyer, Sumanta V.", "Hansen, Edward C."],
        year: 2009,
        title: "Light's bending angle in the equatorial plane of a Kerr black hole",
        journal: Some("Phys. Rev. D"),
        volume: Some("80"),
        pages: Some("124023"),
        arxiv: Some("0908.0085"),
        doi: Some("10.1103/PhysRevD.80.124023"),
        used_for: "the equatorial Kerr deflection integral (chiwave evaluates it by quadrature instead of their elliptic form)",
        checked: RECALLED,
        ..ART
    },
    Reference {
        id: "jackson1999",
        authors: &["Jackson, John David"],
        year: 1999,
        title: "Classical Electrodynamics",
        edition: Some("3rd"),
        publisher: Some("Wiley, New York"),
        used_for: "the Liénard–Wiechert radiation field (§14.1), the Liénard and Larmor powers (§14.2), dipole radiation (§9.2)",
        checked: BOOK_NOTE,
        ..BOOK
    },
    Reference {
        id: "jakobsen2021",
        authors: &["Jakobsen, Gustav Uhre", "Mogull, Gustav", "Plefka, Jan", "Steinhoff, Jan"],
        year: 2021,
        title: "Classical gravitational bremsstrahlung from a worldline quantum field theory",
        journal: Some("Phys. Rev. Lett."),
        volume: Some("126"),
        pages: Some("201103"),
        arxiv: Some("2101.12688"),
        doi: Some("10.1103/PhysRevLett.126.201103"),
        used_for: "an independent leading-order scattering waveform (chiwave's derivation agrees with it through the checks listed in docs/physics/waveform.md)",
        checked: RECALLED,
        ..ART
    },
    Reference {
        id: "keeton2005",
        authors: &["Keeton, Charles R.", "Petters, A. O."],
        year: 2005,
        title: "Formalism for testing theories of gravity using lensing by compact objects: Static, spherically symmetric black holes",
        journal: Some("Phys. Rev. D"),
        volume: Some("72"),
        pages: Some("104006"),
        arxiv: Some("gr-qc/0511019"),
        doi: Some("10.1103/PhysRevD.72.104006"),
        used_for: "the weak-field series of the Schwarzschild and Reissner–Nordström deflection (orders 1–4)",
        checked: RECALLED,
        ..ART
    },
    Reference {
        id: "kosower2019",
        authors: &["Kosower, David A.", "Maybee, Ben", "O'Connell, Donal"],
        year: 2019,
        title: "Amplitudes, observables, and classical scattering",
        journal: Some("J. High Energy Phys."),
        volume: Some("02"),
        pages: Some("137"),
        arxiv: Some("1811.10950"),
        doi: Some("10.1007/JHEP02(2019)137"),
        used_for: "the leading and next-to-leading impulse of two bodies",
        checked: RECALLED,
        ..ART
    },
    Reference {
        id: "kovacs1978",
        authors: &["Kovács, Sándor J.", "Thorne, Kip S."],
        year: 1978,
        title: "The generation of gravitational waves. IV. Bremsstrahlung",
        journal: Some("Astrophys. J."),
        volume: Some("224"),
        pages: Some("62"),
        used_for: "gravitational bremsstrahlung of two bodies on weakly deflected orbits (the leading-order waveform)",
        checked: OLD_NOTE,
        ..ART
    },
    Reference {
        id: "kronrod1965",
        authors: &["Kronrod, A. S."],
        year: 1965,
        title: "Nodes and Weights of Quadrature Formulas",
        publisher: Some("Consultants Bureau, New York"),
        used_for: "the 15-point Kronrod extension of the 7-point Gauss rule",
        checked: BOOK_NOTE,
        ..BOOK
    },
    Reference {
        id: "lambert2009",
        authors: &["Lambert, S. B.", "Le Poncin-Lafitte, C."],
        year: 2009,
        title: "Determining the relativistic parameter γ using very long baseline interferometry",
        journal: Some("Astron. Astrophys."),
        volume: Some("499"),
        pages: Some("331"),
        arxiv: Some("0903.1615"),
        used_for: "the PPN deflection at finite solar elongation, (1 + γ)(GM/c²b)(1 + cos φ)",
        checked: RECALLED,
        ..ART
    },
    Reference {
        id: "landau1975",
        authors: &["Landau, L. D.", "Lifshitz, E. M."],
        year: 1975,
        title: "The Classical Theory of Fields",
        edition: Some("4th"),
        publisher: Some("Pergamon Press, Oxford"),
        used_for: "relativistic Coulomb scattering (§39 and its problem), the pseudotensor of the relaxed Einstein equations (§96), the quadrupole formula (§110)",
        checked: BOOK_NOTE,
        ..BOOK
    },
    Reference {
        id: "landau1976",
        authors: &["Landau, L. D.", "Lifshitz, E. M."],
        year: 1976,
        title: "Mechanics",
        edition: Some("3rd"),
        publisher: Some("Pergamon Press, Oxford"),
        used_for: "the Kepler hyperbola and Rutherford's formula, tan(χ/2) = GM/(b v²) (§19)",
        checked: BOOK_NOTE,
        ..BOOK
    },
    Reference {
        id: "maggiore2008",
        authors: &["Maggiore, Michele"],
        year: 2008,
        title: "Gravitational Waves. Vol. 1: Theory and Experiments",
        publisher: Some("Oxford University Press, Oxford"),
        used_for: "the energy flux of a gravitational wave (ch. 1) and the quadrupole waveform (§3.3)",
        checked: BOOK_NOTE,
        ..BOOK
    },
    Reference {
        id: "mino2003",
        authors: &["Mino, Yasushi"],
        year: 2003,
        title: "Perturbative approach to an orbital evolution around a supermassive black hole",
        journal: Some("Phys. Rev. D"),
        volume: Some("67"),
        pages: Some("084027"),
        arxiv: Some("gr-qc/0302075"),
        doi: Some("10.1103/PhysRevD.67.084027"),
        used_for: "the Mino time parameter, in which the Kerr geodesic equations decouple (ray tracing for the figures)",
        checked: SEEN,
        ..ART
    },
    Reference {
        id: "moshier1989",
        authors: &["Moshier, Stephen L."],
        year: 1989,
        title: "Methods and Programs for Mathematical Functions",
        publisher: Some("Ellis Horwood, Chichester"),
        used_for: "the Chebyshev expansions of K0 and K1 (the Cephes library)",
        checked: BOOK_NOTE,
        ..BOOK
    },
    Reference {
        id: "mougiakakos2021",
        authors: &["Mougiakakos, Stavros", "Riva, Massimiliano Maria", "Vernizzi, Filippo"],
        year: 2021,
        title: "Gravitational bremsstrahlung in the post-Minkowskian effective field theory",
        journal: Some("Phys. Rev. D"),
        volume: Some("104"),
        pages: Some("024041"),
        arxiv: Some("2102.08339"),
        doi: Some("10.1103/PhysRevD.104.024041"),
        used_for: "an independent leading-order scattering waveform and its frequency-domain (Bessel) structure",
        checked: RECALLED,
        ..ART
    },
    Reference {
        id: "mtw1973",
        authors: &["Misner, Charles W.", "Thorne, Kip S.", "Wheeler, John Archibald"],
        year: 1973,
        title: "Gravitation",
        publisher: Some("W. H. Freeman, San Francisco"),
        used_for: "the Schwarzschild effective potential and its unstable circular orbit (§25.5)",
        checked: BOOK_NOTE,
        ..BOOK
    },
    Reference {
        id: "nakamura1999",
        authors: &["Nakamura, Takahiro T.", "Deguchi, Shuji"],
        year: 1999,
        title: "Wave optics in gravitational lensing",
        journal: Some("Prog. Theor. Phys. Suppl."),
        volume: Some("133"),
        pages: Some("137"),
        used_for: "the diffraction integral of a point lens",
        checked: OLD_NOTE,
        ..ART
    },
    Reference {
        id: "nordstrom1918",
        authors: &["Nordström, G."],
        year: 1918,
        title: "On the energy of the gravitation field in Einstein's theory",
        journal: Some("Proc. K. Ned. Akad. Wet."),
        volume: Some("20"),
        pages: Some("1238"),
        used_for: "the Reissner–Nordström metric",
        checked: OLD_NOTE,
        ..ART
    },
    Reference {
        id: "oleary2009",
        authors: &["O'Leary, Ryan M.", "Kocsis, Bence", "Loeb, Abraham"],
        year: 2009,
        title: "Gravitational waves from scattering of stellar-mass black holes in galactic nuclei",
        journal: Some("Mon. Not. R. Astron. Soc."),
        volume: Some("395"),
        pages: Some("2127"),
        arxiv: Some("0807.2638"),
        used_for: "the largest impact parameter for capture by gravitational radiation in one passage (Newtonian, parabolic)",
        checked: RECALLED,
        ..ART
    },
    Reference {
        id: "paczynski1986",
        authors: &["Paczyński, B."],
        year: 1986,
        title: "Gravitational microlensing by the galactic halo",
        journal: Some("Astrophys. J."),
        volume: Some("304"),
        pages: Some("1"),
        used_for: "point-lens image positions and magnifications",
        checked: OLD_NOTE,
        ..ART
    },
    Reference {
        id: "peters1963",
        authors: &["Peters, P. C.", "Mathews, J."],
        year: 1963,
        title: "Gravitational radiation from point masses in a Keplerian orbit",
        journal: Some("Phys. Rev."),
        volume: Some("131"),
        pages: Some("435"),
        doi: Some("10.1103/PhysRev.131.435"),
        used_for: "the quadrupole power of a Kepler orbit as a function of the true anomaly",
        checked: OLD_NOTE,
        ..ART
    },
    Reference {
        id: "peters1964",
        authors: &["Peters, P. C."],
        year: 1964,
        title: "Gravitational radiation and the motion of two point masses",
        journal: Some("Phys. Rev."),
        volume: Some("136"),
        pages: Some("B1224"),
        doi: Some("10.1103/PhysRev.136.B1224"),
        used_for: "energy and angular-momentum loss of a Kepler orbit, the basis of the capture estimate",
        checked: OLD_NOTE,
        ..ART
    },
    Reference {
        id: "peters1974",
        authors: &["Peters, P. C."],
        year: 1974,
        title: "Index of refraction for scalar, electromagnetic, and gravitational waves in weak gravitational fields",
        journal: Some("Phys. Rev. D"),
        volume: Some("9"),
        pages: Some("2207"),
        doi: Some("10.1103/PhysRevD.9.2207"),
        used_for: "wave optics of a point lens (earlier derivation of the amplification factor)",
        checked: OLD_NOTE,
        ..ART
    },
    Reference {
        id: "piessens1983",
        authors: &["Piessens, Robert", "de Doncker-Kapenga, Elise", "Überhuber, Christoph W.", "Kahaner, David K."],
        year: 1983,
        title: "QUADPACK: A Subroutine Package for Automatic Integration",
        publisher: Some("Springer, Berlin"),
        used_for: "the Gauss–Kronrod (7, 15) nodes and weights and the adaptive strategy",
        checked: BOOK_NOTE,
        ..BOOK
    },
    Reference {
        id: "planck2020",
        authors: &["Planck Collaboration"],
        year: 2020,
        title: "Planck 2018 results. VI. Cosmological parameters",
        journal: Some("Astron. Astrophys."),
        volume: Some("641"),
        pages: Some("A6"),
        arxiv: Some("1807.06209"),
        used_for: "the Hubble constant H₀ = 67.4 km/s/Mpc of the redshift caution",
        checked: RECALLED,
        ..ART
    },
    Reference {
        id: "poisson2014",
        authors: &["Poisson, Eric", "Will, Clifford M."],
        year: 2014,
        title: "Gravity: Newtonian, Post-Newtonian, Relativistic",
        publisher: Some("Cambridge University Press, Cambridge"),
        used_for: "the relaxed Einstein equations in harmonic gauge and the Landau–Lifshitz pseudotensor (ch. 6)",
        checked: BOOK_NOTE,
        ..BOOK
    },
    Reference {
        id: "portilla1980",
        authors: &["Portilla, M."],
        year: 1980,
        title: "Scattering of two gravitating particles: classical approach",
        journal: Some("J. Phys. A"),
        volume: Some("13"),
        pages: Some("3677"),
        used_for: "the 1PM scattering angle of two bodies",
        checked: OLD_NOTE,
        ..ART
    },
    Reference {
        id: "prsa2016",
        authors: &["Prša, Andrej", "others"],
        year: 2016,
        title: "Nominal values for selected solar and planetary quantities: IAU 2015 Resolution B3",
        journal: Some("Astron. J."),
        volume: Some("152"),
        pages: Some("41"),
        arxiv: Some("1605.09788"),
        used_for: "the nominal solar, terrestrial and Jovian GM and radii (IAU 2015 Resolution B3)",
        checked: "title, first author, journal and arXiv id as recalled; the other 20 authors are not listed (BibTeX \"and others\")",
        ..ART
    },
    Reference {
        id: "quinlan1989",
        authors: &["Quinlan, Gerald D.", "Shapiro, Stuart L."],
        year: 1989,
        title: "Dynamical evolution of dense clusters of compact stars",
        journal: Some("Astrophys. J."),
        volume: Some("343"),
        pages: Some("725"),
        used_for: "the cross-section for capture by gravitational radiation in one close passage",
        checked: OLD_NOTE,
        ..ART
    },
    Reference {
        id: "refsdal1964",
        authors: &["Refsdal, S."],
        year: 1964,
        title: "The gravitational lens effect",
        journal: Some("Mon. Not. R. Astron. Soc."),
        volume: Some("128"),
        pages: Some("295"),
        used_for: "point-lens images and time delay",
        checked: OLD_NOTE,
        ..ART
    },
    Reference {
        id: "reissner1916",
        authors: &["Reissner, H."],
        year: 1916,
        title: "Über die Eigengravitation des elektrischen Feldes nach der Einsteinschen Theorie",
        journal: Some("Ann. Phys."),
        volume: Some("355"),
        pages: Some("106"),
        used_for: "the Reissner–Nordström metric",
        checked: OLD_NOTE,
        ..ART
    },
    Reference {
        id: "robson2019",
        authors: &["Robson, Travis", "Cornish, Neil J.", "Liu, Chang"],
        year: 2019,
        title: "The construction and use of LISA sensitivity curves",
        journal: Some("Class. Quantum Grav."),
        volume: Some("36"),
        pages: Some("105011"),
        arxiv: Some("1803.01944"),
        used_for: "the LISA sensitivity curve (instrument noise, transfer frequency, sky-averaged response) and the galactic confusion-noise fit (noise curves `lisa`, `lisa-Nyr`)",
        checked: "title, authors, arXiv id, journal (Class. Quantum Grav. 36, 105011, May 2019) and L = 2.5 Gm, f* = 19.09 mHz seen on the abstract and bibliographic pages; the equations could not be seen (see docs/physics/detection.md)",
        ..ART
    },
    Reference {
        id: "rybicki1979",
        authors: &["Rybicki, George B.", "Lightman, Alan P."],
        year: 1979,
        title: "Radiative Processes in Astrophysics",
        publisher: Some("Wiley, New York"),
        used_for: "Lorentz transformation of radiation: Doppler factor and aberration of the observer direction (ch. 4)",
        checked: BOOK_NOTE,
        ..BOOK
    },
    Reference {
        id: "saketh2022",
        authors: &["Saketh, Sasha", "Vines, Justin", "Steinhoff, Jan", "Buonanno, Alessandra"],
        year: 2022,
        title: "Conservative and radiative dynamics in classical relativistic scattering and bound systems",
        journal: Some("Phys. Rev. Research"),
        volume: Some("4"),
        pages: Some("013127"),
        arxiv: Some("2109.05994"),
        doi: Some("10.1103/PhysRevResearch.4.013127"),
        used_for: "the electromagnetic scattering of two charges order by order in the coupling (second-order two-body term, radiated momentum)",
        checked: "title, authors and journal (Phys. Rev. Research, February 2022) seen on the journal's listing; volume, article number and arXiv id as recalled",
        ..ART
    },
    Reference {
        id: "sathyaprakash2009",
        authors: &["Sathyaprakash, B. S.", "Schutz, Bernard F."],
        year: 2009,
        title: "Physics, astrophysics and cosmology with gravitational waves",
        journal: Some("Living Rev. Relativ."),
        volume: Some("12"),
        pages: Some("2"),
        arxiv: Some("0903.0338"),
        doi: Some("10.12942/lrr-2009-2"),
        used_for: "analytic fits to ground-based noise curves (mentioned, not used: see docs/physics/detection.md)",
        checked: RECALLED,
        ..ART
    },
    Reference {
        id: "schneider1992",
        authors: &["Schneider, Peter", "Ehlers, Jürgen", "Falco, Emilio E."],
        year: 1992,
        title: "Gravitational Lenses",
        publisher: Some("Springer, Berlin"),
        used_for: "the point lens: Einstein radius, images, magnifications, time delay",
        checked: BOOK_NOTE,
        ..BOOK
    },
    Reference {
        id: "sereno2006",
        authors: &["Sereno, M.", "De Luca, F."],
        year: 2006,
        title: "Analytical Kerr black hole lensing in the weak deflection limit",
        journal: Some("Phys. Rev. D"),
        volume: Some("74"),
        pages: Some("123009"),
        arxiv: Some("astro-ph/0609435"),
        doi: Some("10.1103/PhysRevD.74.123009"),
        used_for: "the weak-field Kerr deflection in the equatorial plane (orders ≤ 3)",
        checked: RECALLED,
        ..ART
    },
    Reference {
        id: "smarr1977",
        authors: &["Smarr, Larry"],
        year: 1977,
        title: "Gravitational radiation from distant encounters and from head-on collisions of black holes: The zero-frequency limit",
        journal: Some("Phys. Rev. D"),
        volume: Some("15"),
        pages: Some("2069"),
        doi: Some("10.1103/PhysRevD.15.2069"),
        used_for: "the zero-frequency limit of the radiated spectrum from the memory",
        checked: OLD_NOTE,
        ..ART
    },
    Reference {
        id: "takahashi2003",
        authors: &["Takahashi, Ryuichi", "Nakamura, Takashi"],
        year: 2003,
        title: "Wave effects in the gravitational lensing of gravitational waves from chirping binaries",
        journal: Some("Astrophys. J."),
        volume: Some("595"),
        pages: Some("1039"),
        arxiv: Some("astro-ph/0305055"),
        used_for: "the point-lens amplification factor F(w, y), the dimensionless frequency w and the time delay",
        checked: RECALLED,
        ..ART
    },
    Reference {
        id: "thorne1987",
        kind: Kind::InCollection,
        authors: &["Thorne, Kip S."],
        year: 1987,
        title: "Gravitational radiation",
        booktitle: Some("300 Years of Gravitation"),
        editors: Some("Hawking, S. W. and Israel, W."),
        publisher: Some("Cambridge University Press, Cambridge"),
        pages: Some("330--458"),
        used_for: "the interferometer antenna pattern F₊, F× and its sky average ⟨F²⟩ = 1/5",
        checked: "chapter in an edited book: editors, publisher and year as recalled; page range recalled",
        ..ART
    },
    Reference {
        id: "turner1977",
        authors: &["Turner, Michael"],
        year: 1977,
        title: "Gravitational radiation from point-masses in unbound orbits: Newtonian results",
        journal: Some("Astrophys. J."),
        volume: Some("216"),
        pages: Some("610"),
        used_for: "the quadrupole energy radiated on parabolic and hyperbolic orbits",
        checked: OLD_NOTE,
        ..ART
    },
    Reference {
        id: "westpfahl1985",
        authors: &["Westpfahl, K."],
        year: 1985,
        title: "High-speed scattering of charged and uncharged particles in general relativity",
        journal: Some("Fortschr. Phys."),
        volume: Some("33"),
        pages: Some("417"),
        used_for: "the 1PM and 2PM scattering angle and impulse of two bodies",
        checked: OLD_NOTE,
        ..ART
    },
    Reference {
        id: "will2014",
        authors: &["Will, Clifford M."],
        year: 2014,
        title: "The confrontation between general relativity and experiment",
        journal: Some("Living Rev. Relativ."),
        volume: Some("17"),
        pages: Some("4"),
        arxiv: Some("1403.7377"),
        doi: Some("10.12942/lrr-2014-4"),
        used_for: "the PPN light deflection [(1 + γ)/2]·4GM/(c²b) and the measured bounds on γ",
        checked: RECALLED,
        ..ART
    },
];

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn ids_sorted_unique_and_bibtex_ascii() {
        for w in REFERENCES.windows(2) {
            assert!(w[0].id < w[1].id, "{} !< {}", w[0].id, w[1].id);
        }
        for r in REFERENCES {
            assert!(r.id.chars().all(|c| c.is_ascii_lowercase() || c.is_ascii_digit()), "{}", r.id);
            assert!(!r.authors.is_empty() && !r.title.is_empty() && r.year > 1800, "{}", r.id);
            assert!(!r.used_for.is_empty() && !r.checked.is_empty(), "{}", r.id);
            let b = r.bibtex();
            assert!(b.is_ascii(), "{}: {b}", r.id);
            let (open, close) = (b.matches('{').count(), b.matches('}').count());
            assert_eq!(open, close, "{}: {b}", r.id);
            match r.kind {
                Kind::Article => assert!(r.journal.is_some(), "{}", r.id),
                Kind::Book => assert!(r.publisher.is_some(), "{}", r.id),
                Kind::InCollection => assert!(r.booktitle.is_some() && r.publisher.is_some(), "{}", r.id),
                Kind::Misc => assert!(r.arxiv.is_some() || r.journal.is_some(), "{}", r.id),
            }
        }
    }

    #[test]
    fn short_citations() {
        assert_eq!(get("damour2018").unwrap().short(), "Damour 2018, arXiv:1710.10599");
        assert_eq!(get("bern2019").unwrap().short(), "Bern et al. 2019, arXiv:1901.04424");
        assert_eq!(get("peters1963").unwrap().short(), "Peters & Mathews 1963, Phys. Rev. 131, 435");
        assert_eq!(get("jackson1999").unwrap().short(), "Jackson 1999, Classical Electrodynamics, 3rd ed.");
        let c = cite("herrmann2021", "E(γ)").render();
        assert_eq!(c, "Herrmann, Parra-Martinez, Ruf & Zeng 2021, arXiv:2101.07255, E(γ)");
        assert!(cite("nope", "").render().contains("unknown reference id"));
    }

    #[test]
    fn bibtex_entry_shape() {
        let b = get("peters1964").unwrap().bibtex();
        assert_eq!(
            b,
            "@article{peters1964,\n  author = {Peters, P. C.},\n  title = {{Gravitational radiation and the motion of two point masses}},\n  journal = {Phys. Rev.},\n  volume = {136},\n  pages = {B1224},\n  year = {1964},\n  doi = {10.1103/PhysRev.136.B1224}\n}\n"
        );
        let p = get("paczynski1986").unwrap().bibtex();
        assert!(p.contains("Paczy{\\'n}ski"), "{p}");
        let a = get("robson2019").unwrap().bibtex();
        assert!(a.contains("eprint = {1803.01944},\n  archivePrefix = {arXiv}"), "{a}");
    }
}
