import { renderToStaticMarkup } from "react-dom/server";
import { createElement } from "react";
import { describe, expect, it } from "vitest";
import { Markdown } from "@/components/workspace/markdown";

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
});
