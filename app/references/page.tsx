import type { Metadata } from "next";
import { bibtexEntry } from "@/lib/citations/bibtex";
import { citationKeys, journals, OTHERS, referenceOf } from "@/lib/citations/references";
import { feasibilityRuleReferences } from "@/lib/lensing/feasibility-rules";

export const metadata: Metadata = { title: "References" };

const authorList = (authors: readonly string[]) => authors.map((a) => (a === OTHERS ? "et al." : a)).join("; ");

/** Every publication, standard and program the product cites, with its BibTeX; open without signing in. */
export default function ReferencesPage() {
  return (
    <section className="space-y-6">
      <h1 className="text-3xl font-bold text-dusk">References</h1>
      <p className="max-w-3xl text-dusk-dim">
        The methods, constants and tables Arcwright computes with, and where each comes from. Every export names the
        keys it depends on in its provenance, with a link to their BibTeX.
      </p>
      <p>
        <a href="/api/references" download className="rounded-md border border-void-edge px-3 py-1.5 text-sm no-underline">
          Download every reference as BibTeX (.bib)
        </a>
      </p>
      <ol className="space-y-5">
        {citationKeys.map((key) => {
          const r = referenceOf(key);
          const rules = feasibilityRuleReferences.filter((rule) => rule.references.includes(key)).map((rule) => rule.rule);
          const where = r.journal === undefined ? (r.booktitle ?? r.publisher ?? r.howpublished ?? (r.arxiv === undefined ? "" : `arXiv:${r.arxiv}`)) : journals[r.journal];
          return (
            <li key={key} id={key} className="space-y-1 text-sm" data-testid={`reference-${key}`}>
              <p>
                <span className="font-mono text-dusk-dim">{key}</span> — {authorList(r.authors)} ({r.year}). <cite>{r.title}</cite>
                {where === "" ? "" : `. ${where}`}
                {r.volume === undefined ? "" : ` ${r.volume}`}
                {r.pages === undefined ? "" : `, ${r.pages.replace("--", "–")}`}.
                {r.doi !== undefined && (
                  <>
                    {" "}
                    <a href={`https://doi.org/${r.doi}`}>doi:{r.doi}</a>
                  </>
                )}
                {r.arxiv !== undefined && (
                  <>
                    {" "}
                    <a href={`https://arxiv.org/abs/${r.arxiv}`}>arXiv:{r.arxiv}</a>
                  </>
                )}
                {r.bibcode !== undefined && (
                  <>
                    {" "}
                    <a href={`https://ui.adsabs.harvard.edu/abs/${encodeURIComponent(r.bibcode)}`}>ADS {r.bibcode}</a>
                  </>
                )}
              </p>
              <p className="text-dusk-dim">Used for: {r.usedFor}</p>
              {rules.length > 0 && <p className="text-dusk-dim">Feasibility rules resting on it: {rules.join("; ")}.</p>}
              {r.isFromMemory && <p className="text-dusk-dim">Details written from memory of the publication: check them against it before citing.</p>}
              <details>
                <summary className="cursor-pointer">BibTeX</summary>
                <pre className="overflow-x-auto whitespace-pre rounded-md border border-void-edge p-2 text-xs">{bibtexEntry(key)}</pre>
              </details>
            </li>
          );
        })}
      </ol>
    </section>
  );
}
