/**
 * Every publication, standard and program the product cites for a method, a constant or a table: one
 * home, read by the references page, the BibTeX download and the provenance of every export. Code that
 * names a source points at a key here (`CitationKey`) rather than re-typing the citation.
 *
 * Entries are written from memory of the publications; they were not re-checked against the journals
 * while writing them. A DOI is given only where we are certain of it, otherwise left out (the ADS
 * bibcode, built from year, journal, volume and first page, finds the paper). `isFromMemory` marks
 * entries whose title words or pages we are less sure of: the page says so, and so does the BibTeX
 * (`annote`, which bibliography styles do not print).
 */

/** Journals by the abbreviation astronomers use in running text (the AAS and ADS abbreviations). */
export const journals = {
  "A&A": "Astronomy and Astrophysics",
  AJ: "The Astronomical Journal",
  ApJ: "The Astrophysical Journal",
  ApJL: "The Astrophysical Journal Letters",
  ApJS: "The Astrophysical Journal Supplement Series",
  "ARA&A": "Annual Review of Astronomy and Astrophysics",
  "Appl. Opt.": "Applied Optics",
  DIO: "DIO: The International Journal of Scientific History",
  "Exp. Astron.": "Experimental Astronomy",
  "J. Comput. Appl. Math.": "Journal of Computational and Applied Mathematics",
  MNRAS: "Monthly Notices of the Royal Astronomical Society",
  "New Astron. Rev.": "New Astronomy Reviews",
  "Numer. Algorithms": "Numerical Algorithms",
  "Numer. Math.": "Numerische Mathematik",
  PASP: "Publications of the Astronomical Society of the Pacific",
  "Phys. Rev. D": "Physical Review D",
  "Phys. Rev. Lett.": "Physical Review Letters",
  "PLoS ONE": "PLoS ONE",
  "Proc. R. Soc. A": "Proceedings of the Royal Society of London. Series A",
  "Prog. Opt.": "Progress in Optics",
  "Publ. RIMS": "Publications of the Research Institute for Mathematical Sciences, Kyoto University",
  "Rev. Mod. Phys.": "Reviews of Modern Physics",
  Science: "Science",
  "Sitzungsber. Preuss. Akad. Wiss.": "Sitzungsberichte der Königlich Preußischen Akademie der Wissenschaften (Berlin)",
  "Sky Telesc.": "Sky and Telescope",
  "Surv. Rev.": "Survey Review",
} as const;

export type JournalAbbreviation = keyof typeof journals;

/** Ends an author list we give only in part (BibTeX's "and others"). */
export const OTHERS = "others";

/** The BibTeX entry types the registry uses. */
export type ReferenceKind = "article" | "book" | "inproceedings" | "misc";

export interface Reference {
  kind: ReferenceKind;
  /**
   * Persons as "Last, Given" (BibTeX's form); an organization as its name without a comma (written
   * braced, so BibTeX takes it whole); `OTHERS` last for "et al." where we list only the first.
   */
  authors: readonly string[];
  year: number;
  title: string;
  journal?: JournalAbbreviation;
  volume?: string;
  number?: string;
  /** First page or article number, or a page range with an en dash written as "--". */
  pages?: string;
  /** Proceedings or collection holding an `inproceedings` entry. */
  booktitle?: string;
  editors?: readonly string[];
  publisher?: string;
  address?: string;
  edition?: string;
  /** Where a `misc` entry is found (an organization's resolution, a program's release). */
  howpublished?: string;
  url?: string;
  /** DOI without a resolver prefix; only where certain. */
  doi?: string;
  /** NASA ADS bibcode (19 characters). */
  bibcode?: string;
  /** arXiv identifier (`astro-ph/9905116`). */
  arxiv?: string;
  /** What the product takes from it, in words. */
  usedFor: string;
  /** Title words or pages recalled with less certainty (see the module comment). */
  isFromMemory?: boolean;
}

/** The registry. Keys are lower case, first author and year; BibTeX keys are case-insensitive. */
export const references = {
  // ── Constants and units ─────────────────────────────────────────────────────────────────────────
  cgpm1983: {
    kind: "misc",
    authors: ["Conférence Générale des Poids et Mesures"],
    year: 1983,
    title: "Resolution 1 of the 17th CGPM: Definition of the metre",
    howpublished: "Bureau International des Poids et Mesures, Sèvres",
    usedFor: "The speed of light in vacuum, exact by the definition of the metre.",
  },
  cgpm2018: {
    kind: "misc",
    authors: ["Conférence Générale des Poids et Mesures"],
    year: 2018,
    title: "Resolution 1 of the 26th CGPM: On the revision of the International System of Units (SI)",
    howpublished: "Bureau International des Poids et Mesures, Sèvres",
    usedFor: "The Planck constant, exact by the definition of the kilogram.",
  },
  iau2012b2: {
    kind: "misc",
    authors: ["International Astronomical Union"],
    year: 2012,
    title: "Resolution B2 of the XXVIII General Assembly: On the re-definition of the astronomical unit of length",
    howpublished: "IAU XXVIII General Assembly, Beijing",
    usedFor: "The astronomical unit, 149 597 870 700 m exactly.",
  },
  iau2015b2: {
    kind: "misc",
    authors: ["International Astronomical Union"],
    year: 2015,
    title: "Resolution B2 of the XXIX General Assembly: On recommended zero points for the absolute and apparent bolometric magnitude scales",
    howpublished: "IAU XXIX General Assembly, Honolulu",
    usedFor: "The parsec as (648 000/π) au exactly (a note of the resolution).",
    isFromMemory: true,
  },
  prsa2016: {
    kind: "article",
    authors: ["Prša, Andrej", "Harmanec, Petr", "Torres, Guillermo", OTHERS],
    year: 2016,
    title: "Nominal values for selected solar and planetary quantities: IAU 2015 Resolution B3",
    journal: "AJ",
    volume: "152",
    pages: "41",
    doi: "10.3847/0004-6256/152/2/41",
    bibcode: "2016AJ....152...41P",
    usedFor: "The nominal solar, terrestrial and Jovian mass parameters and radii (IAU 2015 Resolution B3).",
    isFromMemory: true,
  },
  tiesinga2021: {
    kind: "article",
    authors: ["Tiesinga, Eite", "Mohr, Peter J.", "Newell, David B.", "Taylor, Barry N."],
    year: 2021,
    title: "CODATA recommended values of the fundamental physical constants: 2018",
    journal: "Rev. Mod. Phys.",
    volume: "93",
    pages: "025010",
    doi: "10.1103/RevModPhys.93.025010",
    usedFor: "The Newtonian constant of gravitation G (CODATA 2018), needed only to read masses typed in kilograms.",
  },
  wilkins1989: {
    kind: "misc",
    authors: ["Wilkins, George A."],
    year: 1989,
    title: "The IAU Style Manual (1989): The Preparation of Astronomical Papers and Reports",
    howpublished: "Transactions of the International Astronomical Union, Vol. XXB",
    usedFor: "The day of 86 400 SI seconds, the Julian year of 365.25 days and the light year; sexagesimal notation.",
    isFromMemory: true,
  },

  // ── Cosmology ───────────────────────────────────────────────────────────────────────────────────
  hogg1999: {
    kind: "misc",
    authors: ["Hogg, David W."],
    year: 1999,
    title: "Distance measures in cosmology",
    arxiv: "astro-ph/9905116",
    bibcode: "1999astro.ph..5116H",
    usedFor: "Comoving and angular-diameter distances in a flat Lambda-CDM universe (eqs. 14-16 and 19).",
  },

  // ── Gravitational lensing ───────────────────────────────────────────────────────────────────────
  paczynski1986: {
    kind: "article",
    authors: ["Paczyński, Bohdan"],
    year: 1986,
    title: "Gravitational microlensing by the galactic halo",
    journal: "ApJ",
    volume: "304",
    pages: "1--5",
    doi: "10.1086/164140",
    bibcode: "1986ApJ...304....1P",
    usedFor: "The point-lens light curve, magnification and Einstein radius; the u0 ≤ 1 event criterion.",
  },
  refsdal1964: {
    kind: "article",
    authors: ["Refsdal, Sjur"],
    year: 1964,
    title: "On the possibility of determining Hubble's parameter and the masses of galaxies from the gravitational lens effect",
    journal: "MNRAS",
    volume: "128",
    pages: "307",
    bibcode: "1964MNRAS.128..307R",
    usedFor: "The time delay between the images of a lens (the method).",
  },
  schneider1992: {
    kind: "book",
    authors: ["Schneider, Peter", "Ehlers, Jürgen", "Falco, Emilio E."],
    year: 1992,
    title: "Gravitational Lenses",
    publisher: "Springer",
    address: "Berlin",
    usedFor: "The singular isothermal sphere and the lens equation in general.",
  },
  wittmao1994: {
    kind: "article",
    authors: ["Witt, Hans J.", "Mao, Shude"],
    year: 1994,
    title: "Can lensed stars be regarded as pointlike for microlensing by MACHOs?",
    journal: "ApJ",
    volume: "430",
    pages: "505",
    bibcode: "1994ApJ...430..505W",
    usedFor: "The magnification of a finite, uniform source by a point lens.",
  },
  lee2009: {
    kind: "article",
    authors: ["Lee, Chien-Hsiu", "Riffeser, Arno", "Seitz, Stella", "Bender, Ralf"],
    year: 2009,
    title: "Finite-source effects in microlensing: a precise, easy to implement, fast, and numerically stable formalism",
    journal: "ApJ",
    volume: "695",
    pages: "200",
    bibcode: "2009ApJ...695..200L",
    usedFor: "The finite-source magnification with limb darkening as a one-dimensional integral.",
  },
  gould2000: {
    kind: "article",
    authors: ["Gould, Andrew"],
    year: 2000,
    title: "A natural formalism for microlensing",
    journal: "ApJ",
    volume: "542",
    pages: "785",
    bibcode: "2000ApJ...542..785G",
    usedFor: "The microlens parallax π_E and the relations between θ_E, π_E and the lens mass.",
  },
  wozniak1997: {
    kind: "article",
    authors: ["Woźniak, Przemysław", "Paczyński, Bohdan"],
    year: 1997,
    title: "Microlensing of blended stellar images",
    journal: "ApJ",
    volume: "487",
    pages: "55",
    bibcode: "1997ApJ...487...55W",
    usedFor: "The blending model of microlensing photometry, A f_s + (1 − f_s).",
    isFromMemory: true,
  },
  walker1995: {
    kind: "article",
    authors: ["Walker, Mark A."],
    year: 1995,
    title: "Microlensed image motions",
    journal: "ApJ",
    volume: "453",
    pages: "37",
    bibcode: "1995ApJ...453...37W",
    usedFor: "The astrometric centroid shift of a point-lens event.",
    isFromMemory: true,
  },
  miyamoto1995: {
    kind: "article",
    authors: ["Miyamoto, Masanori", "Yoshii, Yuzuru"],
    year: 1995,
    title: "Astrometry for determining the MACHO mass and trajectory",
    journal: "AJ",
    volume: "110",
    pages: "1427",
    bibcode: "1995AJ....110.1427M",
    usedFor: "The astrometric centroid shift of a point-lens event.",
    isFromMemory: true,
  },
  hog1995: {
    kind: "article",
    authors: ["Høg, Erik", "Novikov, Igor D.", "Polnarev, Alexander G."],
    year: 1995,
    title: "MACHO photometry and astrometry",
    journal: "A&A",
    volume: "294",
    pages: "287",
    bibcode: "1995A&A...294..287H",
    usedFor: "The astrometric centroid shift of a point-lens event.",
    isFromMemory: true,
  },
  sahu2017: {
    kind: "article",
    authors: ["Sahu, Kailash C.", "Anderson, Jay", "Casertano, Stefano", OTHERS],
    year: 2017,
    title: "Relativistic deflection of background starlight measures the mass of a nearby white dwarf star",
    journal: "Science",
    volume: "356",
    pages: "1046",
    bibcode: "2017Sci...356.1046S",
    usedFor: "Nearby lenses found by their astrometric shift (the astrometric default case).",
    isFromMemory: true,
  },
  eht2019: {
    kind: "article",
    authors: ["Event Horizon Telescope Collaboration"],
    year: 2019,
    title: "First M87 Event Horizon Telescope Results. I. The Shadow of the Supermassive Black Hole",
    journal: "ApJL",
    volume: "875",
    pages: "L1",
    doi: "10.3847/2041-8213/ab0ec7",
    bibcode: "2019ApJ...875L...1E",
    usedFor: "A ring one beam across is imaged: the shadow rule's scale.",
  },
  synge1966: {
    kind: "article",
    authors: ["Synge, John L."],
    year: 1966,
    title: "The escape of photons from gravitationally intense stars",
    journal: "MNRAS",
    volume: "131",
    pages: "463",
    bibcode: "1966MNRAS.131..463S",
    usedFor: "The angular size of a black hole's shadow, 2√27 GM/(c² D) for a distant observer.",
    isFromMemory: true,
  },
  virbhadra2000: {
    kind: "article",
    authors: ["Virbhadra, Kumar S.", "Ellis, George F. R."],
    year: 2000,
    title: "Schwarzschild black hole lensing",
    journal: "Phys. Rev. D",
    volume: "62",
    pages: "084003",
    doi: "10.1103/PhysRevD.62.084003",
    usedFor: "The exact lens equation of a compact lens and its relativistic images.",
  },
  bozza2002: {
    kind: "article",
    authors: ["Bozza, Valerio"],
    year: 2002,
    title: "Gravitational lensing in the strong field limit",
    journal: "Phys. Rev. D",
    volume: "66",
    pages: "103001",
    doi: "10.1103/PhysRevD.66.103001",
    usedFor: "The strong-deflection limit of the Schwarzschild deflection angle.",
  },
  keeton2005: {
    kind: "article",
    authors: ["Keeton, Charles R.", "Petters, Arlie O."],
    year: 2005,
    title: "Formalism for testing theories of gravity using lensing by compact objects: Static, spherically symmetric black holes",
    journal: "Phys. Rev. D",
    volume: "72",
    pages: "104006",
    doi: "10.1103/PhysRevD.72.104006",
    usedFor: "The weak-field series of the deflection angle.",
  },
  darwin1959: {
    kind: "article",
    authors: ["Darwin, Charles"],
    year: 1959,
    title: "The gravity field of a particle",
    journal: "Proc. R. Soc. A",
    volume: "249",
    pages: "180",
    usedFor: "The exact Schwarzschild deflection angle in elliptic integrals.",
  },
  darwin1961: {
    kind: "article",
    authors: ["Darwin, Charles"],
    year: 1961,
    title: "The gravity field of a particle. II",
    journal: "Proc. R. Soc. A",
    volume: "263",
    pages: "39",
    usedFor: "Timelike orbits in the Schwarzschild field (periastron advance).",
  },
  chandrasekhar1983: {
    kind: "book",
    authors: ["Chandrasekhar, Subrahmanyan"],
    year: 1983,
    title: "The Mathematical Theory of Black Holes",
    publisher: "Clarendon Press",
    address: "Oxford",
    usedFor: "Geodesics of the Schwarzschild metric (chapter 3).",
  },
  einstein1915: {
    kind: "article",
    authors: ["Einstein, Albert"],
    year: 1915,
    title: "Erklärung der Perihelbewegung des Merkur aus der allgemeinen Relativitätstheorie",
    journal: "Sitzungsber. Preuss. Akad. Wiss.",
    pages: "831--839",
    usedFor: "The first-order periastron advance per orbit.",
  },
  shapiro1964: {
    kind: "article",
    authors: ["Shapiro, Irwin I."],
    year: 1964,
    title: "Fourth test of general relativity",
    journal: "Phys. Rev. Lett.",
    volume: "13",
    pages: "789",
    doi: "10.1103/PhysRevLett.13.789",
    usedFor: "The Shapiro delay (one way and the radar echo's round trip).",
  },
  cutler1994: {
    kind: "article",
    authors: ["Cutler, Curt", "Kennefick, Daniel", "Poisson, Eric"],
    year: 1994,
    title: "Gravitational radiation reaction for bound motion around a Schwarzschild black hole",
    journal: "Phys. Rev. D",
    volume: "50",
    pages: "3816",
    doi: "10.1103/PhysRevD.50.3816",
    usedFor: "Bound orbits of the Schwarzschild field in the (p, e) parametrization.",
  },
  thompson2017: {
    kind: "book",
    authors: ["Thompson, A. Richard", "Moran, James M.", "Swenson, Jr., George W."],
    year: 2017,
    title: "Interferometry and Synthesis in Radio Astronomy",
    edition: "3rd",
    publisher: "Springer",
    address: "Cham",
    usedFor: "The resolution λ/B of an interferometer's longest baseline.",
  },

  // ── Numerical methods ───────────────────────────────────────────────────────────────────────────
  carlson1995: {
    kind: "article",
    authors: ["Carlson, Bille C."],
    year: 1995,
    title: "Numerical computation of real or complex elliptic integrals",
    journal: "Numer. Algorithms",
    volume: "10",
    pages: "13--26",
    usedFor: "Carlson's symmetric elliptic integrals R_F, R_D, R_J.",
  },
  dormand1980: {
    kind: "article",
    authors: ["Dormand, John R.", "Prince, Peter J."],
    year: 1980,
    title: "A family of embedded Runge-Kutta formulae",
    journal: "J. Comput. Appl. Math.",
    volume: "6",
    pages: "19--26",
    usedFor: "The Runge–Kutta pair that integrates rays and orbits.",
  },
  hairer1993: {
    kind: "book",
    authors: ["Hairer, Ernst", "Nørsett, Syvert P.", "Wanner, Gerhard"],
    year: 1993,
    title: "Solving Ordinary Differential Equations I: Nonstiff Problems",
    edition: "2nd",
    publisher: "Springer",
    address: "Berlin",
    usedFor: "Step-size control and dense output of the Dormand–Prince integrator.",
  },
  takahasi1974: {
    kind: "article",
    authors: ["Takahasi, Hidetosi", "Mori, Masatake"],
    year: 1974,
    title: "Double exponential formulas for numerical integration",
    journal: "Publ. RIMS",
    volume: "9",
    pages: "721--741",
    usedFor: "Tanh-sinh quadrature of the finite-source integrals.",
    isFromMemory: true,
  },
  dekker1971: {
    kind: "article",
    authors: ["Dekker, Theodorus J."],
    year: 1971,
    title: "A floating-point technique for extending the available precision",
    journal: "Numer. Math.",
    volume: "18",
    pages: "224--242",
    usedFor: "Exact products and sums in double-double arithmetic.",
  },

  // ── Photometry ──────────────────────────────────────────────────────────────────────────────────
  bessell2005: {
    kind: "article",
    authors: ["Bessell, Michael S."],
    year: 2005,
    title: "Standard photometric systems",
    journal: "ARA&A",
    volume: "43",
    pages: "293--336",
    doi: "10.1146/annurev.astro.41.082801.100251",
    bibcode: "2005ARA&A..43..293B",
    usedFor: "Effective wavelengths of the Johnson–Cousins bands (Table 1).",
  },
  bessell1998: {
    kind: "article",
    authors: ["Bessell, Michael S.", "Castelli, Fiorella", "Plez, Bertrand"],
    year: 1998,
    title: "Model atmospheres broad-band colors, bolometric corrections and temperature calibrations for O-M stars",
    journal: "A&A",
    volume: "333",
    pages: "231",
    bibcode: "1998A&A...333..231B",
    usedFor: "Zero points of the Johnson–Cousins bands (Table A2).",
  },
  fukugita1996: {
    kind: "article",
    authors: ["Fukugita, Masataka", "Ichikawa, Takashi", "Gunn, James E.", "Doi, Mamoru", "Shimasaku, Kazuhiro", "Schneider, Donald P."],
    year: 1996,
    title: "The Sloan Digital Sky Survey photometric system",
    journal: "AJ",
    volume: "111",
    pages: "1748",
    bibcode: "1996AJ....111.1748F",
    usedFor: "Effective wavelengths and widths of the SDSS bands (Table 2).",
  },
  oke1983: {
    kind: "article",
    authors: ["Oke, J. Beverley", "Gunn, James E."],
    year: 1983,
    title: "Secondary standard stars for absolute spectrophotometry",
    journal: "ApJ",
    volume: "266",
    pages: "713",
    bibcode: "1983ApJ...266..713O",
    usedFor: "The AB magnitude system: 3631 Jy at magnitude 0.",
  },
  cohen2003: {
    kind: "article",
    authors: ["Cohen, Martin", "Wheaton, William A.", "Megeath, S. Thomas"],
    year: 2003,
    title: "Spectral irradiance calibration in the infrared. XIV. The absolute calibration of 2MASS",
    journal: "AJ",
    volume: "126",
    pages: "1090",
    bibcode: "2003AJ....126.1090C",
    usedFor: "Wavelengths, widths and zero points of the 2MASS J, H and Ks bands (Table 2).",
  },
  blanton2007: {
    kind: "article",
    authors: ["Blanton, Michael R.", "Roweis, Sam"],
    year: 2007,
    title: "K-corrections and filter transformations in the ultraviolet, optical, and near-infrared",
    journal: "AJ",
    volume: "133",
    pages: "734",
    bibcode: "2007AJ....133..734B",
    usedFor: "The AB − Vega offset of each built-in band (Table 1).",
  },
  willmer2018: {
    kind: "article",
    authors: ["Willmer, Christopher N. A."],
    year: 2018,
    title: "The absolute magnitude of the Sun in several filters",
    journal: "ApJS",
    volume: "236",
    pages: "47",
    bibcode: "2018ApJS..236...47W",
    usedFor: "The Sun's colours that carry the moonlit sky from V to other bands (Table 3).",
  },
  benn1998: {
    kind: "article",
    authors: ["Benn, Chris R.", "Ellison, Sara L."],
    year: 1998,
    title: "Brightness of the night sky over La Palma",
    journal: "New Astron. Rev.",
    volume: "42",
    pages: "503",
    bibcode: "1998NewAR..42..503B",
    usedFor: "The dark-sky brightness and extinction of the typical dark site.",
  },
  krisciunas1991: {
    kind: "article",
    authors: ["Krisciunas, Kevin", "Schaefer, Bradley E."],
    year: 1991,
    title: "A model of the brightness of moonlight",
    journal: "PASP",
    volume: "103",
    pages: "1033",
    bibcode: "1991PASP..103.1033K",
    usedFor: "The moonlit and dark sky brightness in V at a visit's zenith distances, Moon separation and phase.",
  },
  merline1995: {
    kind: "article",
    authors: ["Merline, William J.", "Howell, Steve B."],
    year: 1995,
    title: "A realistic model for point-sources imaged on array detectors: the model and initial results",
    journal: "Exp. Astron.",
    volume: "6",
    pages: "163",
    bibcode: "1995ExA.....6..163M",
    usedFor: "The CCD equation: signal-to-noise of a point source with sky, dark current and read noise.",
    isFromMemory: true,
  },
  howell2006: {
    kind: "book",
    authors: ["Howell, Steve B."],
    year: 2006,
    title: "Handbook of CCD Astronomy",
    edition: "2nd",
    publisher: "Cambridge University Press",
    address: "Cambridge",
    usedFor: "The CCD equation as written there (eq. 4.4) and the full-well check.",
  },
  lindegren1978: {
    kind: "inproceedings",
    authors: ["Lindegren, Lennart"],
    year: 1978,
    title: "Photoelectric astrometry: a comparison of methods for precise image location",
    booktitle: "Modern Astrometry, IAU Colloquium 48",
    editors: ["Prochazka, Franz V.", "Tucker, Richard H."],
    pages: "197",
    bibcode: "1978moas.coll..197L",
    usedFor: "The photon-limited centroid precision of a star image.",
    isFromMemory: true,
  },
  moffat1969: {
    kind: "article",
    authors: ["Moffat, Anthony F. J."],
    year: 1969,
    title: "A theoretical investigation of focal stellar images in the photographic emulsion and application to photographic photometry",
    journal: "A&A",
    volume: "3",
    pages: "455",
    bibcode: "1969A&A.....3..455M",
    usedFor: "The Moffat profile of a seeing-limited star image.",
  },
  trujillo2001: {
    kind: "article",
    authors: ["Trujillo, Ignacio", "Aguerri, J. Alfonso L.", "Cepa, Jordi", "Gutiérrez, Carlos M."],
    year: 2001,
    title: "The effects of seeing on Sérsic profiles - II. The Moffat PSF",
    journal: "MNRAS",
    volume: "328",
    pages: "977",
    bibcode: "2001MNRAS.328..977T",
    usedFor: "The Moffat index β = 4.765 of atmospheric turbulence.",
  },
  roddier1981: {
    kind: "article",
    authors: ["Roddier, François"],
    year: 1981,
    title: "The effects of atmospheric turbulence in optical astronomy",
    journal: "Prog. Opt.",
    volume: "19",
    pages: "281",
    usedFor: "Seeing growing as the air mass to the power 3/5 and as the wavelength to the power −1/5.",
  },

  // ── Sky and time ────────────────────────────────────────────────────────────────────────────────
  astronomyengine: {
    kind: "misc",
    authors: ["Cross, Don"],
    year: 2024,
    title: "Astronomy Engine: astronomy calculation library, version 2.1.19",
    howpublished: "npm package astronomy-engine, MIT licence",
    url: "https://github.com/cosinekitty/astronomy",
    usedFor: "Positions of the Sun and Moon, precession–nutation, sidereal time, refraction and the standard atmosphere.",
    isFromMemory: true,
  },
  pickering2002: {
    kind: "article",
    authors: ["Pickering, Keith A."],
    year: 2002,
    title: "The southern limits of the ancient star catalog and the commentary of Hipparchos",
    journal: "DIO",
    volume: "12",
    pages: "3",
    usedFor: "The air mass from the apparent altitude, valid to the horizon: the airmass limit and every visit's air mass.",
    isFromMemory: true,
  },
  kasten1989: {
    kind: "article",
    authors: ["Kasten, Fritz", "Young, Andrew T."],
    year: 1989,
    title: "Revised optical air mass tables and approximation formula",
    journal: "Appl. Opt.",
    volume: "28",
    pages: "4735",
    doi: "10.1364/AO.28.004735",
    usedFor: "An independent air mass formula the tests compare with.",
  },
  saemundsson1986: {
    kind: "article",
    authors: ["Sæmundsson, Þorsteinn"],
    year: 1986,
    title: "Astronomical refraction",
    journal: "Sky Telesc.",
    volume: "72",
    pages: "70",
    usedFor: "The refraction formula astronomy-engine applies (as given by Meeus, eq. 16.4).",
    isFromMemory: true,
  },
  meeus1998: {
    kind: "book",
    authors: ["Meeus, Jean"],
    year: 1998,
    title: "Astronomical Algorithms",
    edition: "2nd",
    publisher: "Willmann-Bell",
    address: "Richmond, Virginia",
    usedFor: "Refraction (eq. 16.4).",
  },
  ussa1976: {
    kind: "book",
    authors: ["National Oceanic and Atmospheric Administration", "National Aeronautics and Space Administration", "United States Air Force"],
    year: 1976,
    title: "U.S. Standard Atmosphere, 1976",
    publisher: "U.S. Government Printing Office",
    address: "Washington, D.C.",
    usedFor: "The air density at the site's elevation that scales refraction.",
  },
  vincenty1975: {
    kind: "article",
    authors: ["Vincenty, Thaddeus"],
    year: 1975,
    title: "Direct and inverse solutions of geodesics on the ellipsoid with application of nested equations",
    journal: "Surv. Rev.",
    volume: "23",
    number: "176",
    pages: "88--93",
    usedFor: "The angular separation of two positions (its spherical case), for matching imported rows.",
  },

  // ── Figures ─────────────────────────────────────────────────────────────────────────────────────
  okabe2008: {
    kind: "misc",
    authors: ["Okabe, Masataka", "Ito, Kei"],
    year: 2008,
    title: "Color Universal Design (CUD): how to make figures and presentations that are friendly to colorblind people",
    howpublished: "J*Fly",
    url: "https://jfly.uni-koeln.de/color/",
    usedFor: "The colour-blind-safe palette of the figures' series.",
    isFromMemory: true,
  },
  nunez2018: {
    kind: "article",
    authors: ["Nuñez, Jamie R.", "Anderton, Christopher R.", "Renslow, Ryan S."],
    year: 2018,
    title: "Optimizing colormaps with consideration for color vision deficiency to enable accurate interpretation of scientific data",
    journal: "PLoS ONE",
    volume: "13",
    pages: "e0199239",
    doi: "10.1371/journal.pone.0199239",
    usedFor: "The cividis colour map of the season chart (monotonic in lightness, readable with colour-vision deficiency).",
  },
} as const satisfies Record<string, Reference>;

export type CitationKey = keyof typeof references;

/** Every key, in the registry's order (by subject). */
export const citationKeys = Object.keys(references) as CitationKey[];

/** The reference of a key (typed, so an unknown key does not compile). */
export function referenceOf(key: CitationKey): Reference {
  return references[key];
}

/** Whether a string names a reference (for keys read from a query string). */
export function isCitationKey(key: string): key is CitationKey {
  return Object.hasOwn(references, key);
}
