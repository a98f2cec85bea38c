import { renderToStaticMarkup } from "react-dom/server";
import { createElement } from "react";
import { describe, expect, it } from "vitest";
import { Markdown } from "@/components/notes/markdown";
import { plotPalette } from "@/lib/figures/plot-palette";

const render = (source: string) => renderToStaticMarkup(createElement(Markdown, { source }));

describe("math in notes (KaTeX)", () => {
  it("typesets inline math with KaTeX, keeping the source as the MathML annotation", () => {
    const html = render("Einstein radius $\\theta_E = \\sqrt{4GM/c^2 \\cdot D}$ from the lens mass.");
    expect(html).toMatch(/^<div[^>]*><p>Einstein radius <span class="katex">/);
    expect(html).toContain('<annotation encoding="application/x-tex">\\theta_E = \\sqrt{4GM/c^2 \\cdot D}</annotation>');
    // θ with subscript E as MathML, and the square root, read by screen readers.
    expect(html).toContain("<msub><mi>θ</mi><mi>E</mi></msub>");
    expect(html).toContain("<msqrt>");
    expect(html).toContain(" from the lens mass.</p>");
    expect(html).not.toContain('class="katex-display"');
  });

  it("typesets $$…$$ as a display equation", () => {
    const html = render("Magnification:\n\n$$\nA = \\frac{u^2 + 2}{u\\sqrt{u^2 + 4}}\n$$\n");
    expect(html).toContain('<span class="katex-display"><span class="katex">');
    expect(html).toContain('<math xmlns="http://www.w3.org/1998/Math/MathML" display="block">');
    expect(html).toContain("A = \\frac{u^2 + 2}{u\\sqrt{u^2 + 4}}</annotation>");
  });

  it("makes no link, class or image from \\href, \\url, \\htmlClass or \\includegraphics (KaTeX trust off)", () => {
    const html = render(
      "$\\href{javascript:alert(1)}{x}$ and $\\url{javascript:alert(2)}$ and $\\htmlClass{evil}{y}$ and $\\htmlId{evil}{z}$ and $\\includegraphics{/x.png}$",
    );
    expect(html).not.toMatch(/<a[\s>]/);
    expect(html).not.toMatch(/href=/);
    expect(html).not.toMatch(/<img/);
    expect(html).not.toMatch(/class="[^"]*evil|id="evil"/);
    // Each command shows as its name in the error colour, as words.
    expect(html).toContain(`<mstyle mathcolor="${plotPalette.vermillion}"><mtext>\\href</mtext></mstyle>`);
    expect(html).toContain(`<mstyle mathcolor="${plotPalette.vermillion}"><mtext>\\htmlClass</mtext></mstyle>`);
  });

  it("shows a formula KaTeX cannot read as its source in the error colour, and renders the rest of the note", () => {
    const html = render("Before $\\frac{1}{$ after.\n\n## Next\n\nStill here: $x^2$");
    expect(html).toMatch(new RegExp(`<span class="katex-error" title="ParseError: KaTeX parse error: [^"]*" style="color:${plotPalette.vermillion}">\\\\frac\\{1\\}\\{</span>`));
    expect(html).toContain(" after.</p>");
    expect(html).toContain("<h2>Next</h2>");
    expect(html).toContain('<annotation encoding="application/x-tex">x^2</annotation>');
  });

  it("still drops raw HTML next to math: the sanitizer runs on the note before KaTeX", () => {
    const html = render('$a$ <span class="math-inline">\\href{javascript:alert(1)}{x}</span> <img src=x onerror="alert(2)">');
    expect(html).not.toMatch(/<img|onerror=|href=/);
    // The span's text stays plain words: only Markdown's own `$…$` becomes math.
    expect(html).toContain(" \\href{javascript:alert(1)}{x} </p>");
    expect(html.match(/class="katex"/g)).toHaveLength(1);
  });

  it("caps user sizes (\\rule) at 10 em so a formula cannot cover the page", () => {
    const html = render("$\\rule{500em}{500em}$");
    expect(html).toMatch(/border-right-width:10em;border-top-width:10em/);
  });
});
