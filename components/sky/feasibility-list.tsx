import type { FeasibilityItem } from "@/lib/workspace/verdicts";
import { verdictClass, verdictLabels } from "@/components/workspace/format";

/** A target's feasibility verdicts, each with the number behind it. */
export function FeasibilityList({ items }: { items: FeasibilityItem[] }) {
  return (
    <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-sm" data-testid="feasibility">
      {items.map((item) => (
        <div key={item.id} className="contents">
          <dt className="text-dusk-dim">{item.question}</dt>
          <dd data-testid={`feasibility-${item.id}`}>
            <span className={`font-semibold ${verdictClass[item.verdict]}`}>{verdictLabels[item.verdict]}</span>{" "}
            <span className="tabular-nums text-dusk-dim">{item.figure}</span>
          </dd>
        </div>
      ))}
    </dl>
  );
}
