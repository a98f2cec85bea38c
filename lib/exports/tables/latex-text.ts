/**
 * Text as LaTeX source in plain ASCII, so that a table compiles whatever input encoding the
 * document uses: the ten special characters escaped (Lamport 1994, LaTeX: A Document Preparation
 * System, §2.2.1), accented Latin letters as accent commands, Greek letters and mathematical signs
 * in math mode (U+2212 as a true minus), and anything with no LaTeX form (an emoji, a control
 * character) written as its code point, `[U+1F52D]`. Everything compiles with the LaTeX kernel's
 * default OT1 encoding except the letters only T1 has (an ogonek as in ą, ę; đ, ð, þ, ŋ), which
 * need `\usepackage[T1]{fontenc}`.
 */

const specialCharacters: Record<string, string> = {
  "\\": "\\textbackslash{}",
  "&": "\\&",
  "%": "\\%",
  $: "\\$",
  "#": "\\#",
  _: "\\_",
  "{": "\\{",
  "}": "\\}",
  "~": "\\textasciitilde{}",
  "^": "\\textasciicircum{}",
  // OT1 sets < > | as ¡ ¿ —; the text commands take the symbol font's glyphs.
  "<": "\\textless{}",
  ">": "\\textgreater{}",
  "|": "\\textbar{}",
  // A row's `\\` would read a following [ as its optional spacing argument.
  "[": "{[}",
  "]": "{]}",
};

const greekLetters: Record<string, string> = {
  α: "\\alpha", β: "\\beta", γ: "\\gamma", δ: "\\delta", ε: "\\varepsilon", ϵ: "\\epsilon", ζ: "\\zeta", η: "\\eta",
  θ: "\\theta", ϑ: "\\vartheta", ι: "\\iota", κ: "\\kappa", λ: "\\lambda", μ: "\\mu", ν: "\\nu", ξ: "\\xi", π: "\\pi",
  ϖ: "\\varpi", ρ: "\\rho", ϱ: "\\varrho", σ: "\\sigma", ς: "\\varsigma", τ: "\\tau", υ: "\\upsilon", φ: "\\varphi",
  ϕ: "\\phi", χ: "\\chi", ψ: "\\psi", ω: "\\omega",
  Γ: "\\Gamma", Δ: "\\Delta", Θ: "\\Theta", Λ: "\\Lambda", Ξ: "\\Xi", Π: "\\Pi", Σ: "\\Sigma", Υ: "\\Upsilon",
  Φ: "\\Phi", Ψ: "\\Psi", Ω: "\\Omega",
  // µ (micro sign) as the Greek letter it is drawn with.
  µ: "\\mu",
};

/** Capital Greek letters drawn like Latin ones, which LaTeX sets as the Latin letters (common practice). */
const latinLookingGreek: Record<string, string> = { Α: "A", Β: "B", Ε: "E", Ζ: "Z", Η: "H", Ι: "I", Κ: "K", Μ: "M", Ν: "N", Ο: "O", Ρ: "P", Τ: "T", Χ: "X", ο: "o" };

/** Signs set in math mode, where the kernel has them in every encoding. */
const mathSigns: Record<string, string> = {
  "\u2212": "-", "±": "\\pm", "∓": "\\mp", "×": "\\times", "÷": "\\div", "·": "\\cdot", "⋅": "\\cdot", "∼": "\\sim",
  "≈": "\\approx", "≃": "\\simeq", "≤": "\\leq", "≥": "\\geq", "≠": "\\neq", "≡": "\\equiv", "∝": "\\propto",
  "∞": "\\infty", "°": "{}^{\\circ}", "′": "{}^{\\prime}", "″": "{}^{\\prime\\prime}", "√": "\\surd", "⊙": "\\odot",
  "☉": "\\odot", "⊕": "\\oplus", "→": "\\rightarrow", "←": "\\leftarrow", "↔": "\\leftrightarrow", "∗": "\\ast",
  "∂": "\\partial", "∇": "\\nabla", "∑": "\\sum", "∫": "\\int", "ℓ": "\\ell", "ħ": "\\hbar", "∈": "\\in",
};

/** Text-mode forms: typographic dashes and quotes as TeX writes them, spaces, and letters with a command of their own. */
const textSymbols: Record<string, string> = {
  "–": "--", "—": "---", "‘": "`", "’": "'", "“": "``", "”": "''", "…": "\\ldots{}", "•": "\\textbullet{}",
  "§": "\\S{}", "¶": "\\P{}", "©": "\\copyright{}", "†": "\\dag{}", "‡": "\\ddag{}", "£": "\\pounds{}",
  "¡": "!`", "¿": "?`", "\u00a0": "~", "\u2009": "\\,", "\u202f": "\\,", "\u00ad": "\\-",
  ø: "\\o{}", Ø: "\\O{}", ß: "\\ss{}", æ: "\\ae{}", Æ: "\\AE{}", œ: "\\oe{}", Œ: "\\OE{}", ł: "\\l{}", Ł: "\\L{}",
  ı: "\\i{}", ȷ: "\\j{}", å: "\\aa{}", Å: "\\AA{}",
  // T1 only (stated in the file's preamble comment).
  đ: "\\dj{}", Đ: "\\DJ{}", ð: "\\dh{}", Ð: "\\DH{}", þ: "\\th{}", Þ: "\\TH{}", ŋ: "\\ng{}", Ŋ: "\\NG{}",
};

const superscripts = "⁰¹²³⁴⁵⁶⁷⁸⁹⁺⁻";
const subscripts = "₀₁₂₃₄₅₆₇₈₉₊₋";
const scriptCharacters = [..."0123456789+", "$-$"];

/** Combining marks (after NFD) and the accent command that puts each on a letter. */
const accentCommands: Record<string, string> = {
  "\u0300": "\\`", "\u0301": "\\'", "\u0302": "\\^", "\u0303": "\\~", "\u0304": "\\=", "\u0306": "\\u", "\u0307": "\\.",
  "\u0308": '\\"', "\u030a": "\\r", "\u030b": "\\H", "\u030c": "\\v", "\u0323": "\\d", "\u0327": "\\c", "\u0328": "\\k",
  "\u0331": "\\b",
};

/** Characters a document never shows (joiners, variation selectors, byte-order mark): dropped. */
const invisible = /^[\u200b-\u200d\u2060\ufe00-\ufe0f\ufeff\u{e0020}-\u{e007f}\u{e0100}-\u{e01ef}]$/u;

/** Marks that sit above a letter, for which i and j lose their dot (LaTeX's \i, \j). */
const marksAbove = /[\u0300-\u030c]/;

/** A letter with accents as nested accent commands (`\'{S}`, `\={\i}`), or null when a mark has no command. */
function accentedLetter(character: string): string | null {
  const [base, ...marks] = [...character.normalize("NFD")];
  if (marks.length === 0 || !/^[A-Za-z]$/.test(base) || marks.some((m) => !(m in accentCommands))) return null;
  let letter = marks.some((m) => marksAbove.test(m)) && (base === "i" || base === "j") ? `\\${base}` : base;
  for (const mark of marks) letter = `${accentCommands[mark]}{${letter}}`;
  return letter;
}

function codePoint(character: string): string {
  return `{[}U+${character.codePointAt(0)!.toString(16).toUpperCase().padStart(4, "0")}{]}`;
}

/** Pairs TeX fonts join into one glyph (`--` an en dash, `''` a quote, `!`` ¡, `,,` „), kept apart with `{}` where two characters meet. */
const ligatureStart = /[-,'`!?]$/;
const ligatureEnd = /^[-,'`]/;

/** One character (a code point, NFC) as LaTeX, and whether it belongs in math mode. */
function characterLatex(character: string): { latex: string; isMath: boolean } {
  const text = (latex: string) => ({ latex, isMath: false });
  if (character in specialCharacters) return text(specialCharacters[character]);
  if (/^[\x20-\x7e]$/.test(character)) return text(character);
  if (/^[\t\n\r]$/.test(character) || /^\p{Zs}$/u.test(character) && !(character in textSymbols)) return text(" ");
  if (character in greekLetters) return { latex: greekLetters[character], isMath: true };
  if (character in mathSigns) return { latex: mathSigns[character], isMath: true };
  if (character in latinLookingGreek) return text(latinLookingGreek[character]);
  if (character in textSymbols) return text(textSymbols[character]);
  const superscript = superscripts.indexOf(character);
  if (superscript >= 0) return text(`\\textsuperscript{${scriptCharacters[superscript]}}`);
  const subscript = subscripts.indexOf(character);
  if (subscript >= 0) return text(`\\textsubscript{${scriptCharacters[subscript]}}`);
  if (invisible.test(character)) return text("");
  return text(accentedLetter(character) ?? codePoint(character));
}

/**
 * Any text as LaTeX source in printable ASCII for a paragraph or table cell (see the module
 * comment). Consecutive mathematical characters share one `$…$`.
 */
export function latexText(text: string): string {
  let out = "";
  let math = "";
  const append = (latex: string) => {
    out += (ligatureStart.test(out) && ligatureEnd.test(latex) ? "{}" : "") + latex;
  };
  const flushMath = () => {
    if (math !== "") append(`$${math}$`);
    math = "";
  };
  for (const character of text.normalize("NFC")) {
    const { latex, isMath } = characterLatex(character);
    if (isMath) {
      // A command followed by a letter needs a space to end its name (\alpha b, not \alphab).
      math += /\\[A-Za-z]+$/.test(math) && /^[A-Za-z]/.test(latex) ? ` ${latex}` : latex;
    } else if (latex !== "") {
      flushMath();
      append(latex);
    }
  }
  flushMath();
  // A leading * would be read as the star of the previous row's \\.
  return out.startsWith("*") ? `{*}${out.slice(1)}` : out;
}
