import { renderToStaticMarkup } from "react-dom/server";
import { createElement } from "react";
import { describe, expect, it } from "vitest";
import { Markdown } from "@/components/notes/markdown";

const render = (source: string) => renderToStaticMarkup(createElement(Markdown, { source }));

describe("note Markdown", () => {
  it("renders emphasis, lists and tables (GitHub flavour)", () => {
    const html = render("**peak** in *9 d*\n\n- seeing 0.8″\n\n| a | b |\n|---|---|\n| 1 | 2 |");
    expect(html).toContain("<strong>peak</strong>");
    expect(html).toContain("<li>seeing 0.8″</li>");
    expect(html).toContain("<table>");
  });

  it("never lets a script run: raw HTML, javascript: links and event handlers are dropped", () => {
    const html = render('<script>alert(1)</script>\n\n<img src=x onerror="alert(2)">\n\n[click](javascript:alert(3))\n\n<a href="#" onclick="alert(4)">x</a>');
    expect(html).not.toMatch(/<script/i);
    expect(html).not.toMatch(/onerror|onclick/i);
    expect(html).not.toMatch(/href="javascript:/i);
    expect(html).not.toMatch(/<img/i);
  });

  it("shows an image from another site as a link to it (the CSP would block it), and the app's own image as an image", () => {
    const html = render("![finder chart](https://archive.example.org/k17.png)\n\n![](//cdn.example.org/a.png)\n\n![local chart](/charts/k17.png)");
    expect(html).toContain('<a href="https://archive.example.org/k17.png" target="_blank" rel="noopener noreferrer nofollow">Image: finder chart</a>');
    expect(html).toContain('<a href="//cdn.example.org/a.png" target="_blank" rel="noopener noreferrer nofollow">Image: //cdn.example.org/a.png</a>');
    expect(html).toContain('<img src="/charts/k17.png" alt="local chart"/>');
    expect(html.match(/<img/g)).toHaveLength(1);
    // A source the sanitizer refuses keeps only the words.
    const refused = render("![a chart](javascript:alert(1))");
    expect(refused).toContain("<p><span>a chart</span></p>");
    expect(refused).not.toMatch(/<img|javascript:/);
  });
});
