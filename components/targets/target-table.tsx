"use client";

import { rowSortingFeature, tableFeatures, useTable, type ColumnDef, type SortingState } from "@tanstack/react-table";
import Link from "next/link";
import { useMemo, useState } from "react";
import useSWR from "swr";
import { statusLabels, targetStatuses } from "@/lib/workspace/status";
import { lensModelOf, type LensModelId } from "@/lib/lensing/registry";
import { lensModelLabels, lensModels } from "@/lib/workspace/target-schema";
import type { TargetPage, TargetView } from "@/lib/workspace/target-view";
import { verdicts } from "@/lib/lensing/feasibility-rules";
import { scienceCaseLabels } from "@/lib/lensing/science-cases";
import { scienceCaseIds } from "@/lib/lensing/science-case-inputs";
import { answerLine, caseVerdictLine } from "@/lib/workspace/case-verdict-words";
import { swrFetcher } from "@/components/shared/api-client";
import { ChoiceOptions } from "@/components/shared/choice-options";
import { verdictClass, verdictLabels } from "@/components/shared/format";
import { emptyFilters, initialTargetSorting, targetListUrl, targetPageSize, type TargetFilters } from "@/components/targets/target-table-state";
import { PageStepper } from "@/components/page-stepper";
import { formatSignificant } from "@/lib/numbers/significant";

const features = tableFeatures({ rowSortingFeature });

const numberCell = (digits = 4) => (info: { getValue: () => unknown }) => (
  <span className="tabular-nums">{formatSignificant(info.getValue() as number | null, digits)}</span>
);

/** The case's verdict naming the questions behind it; the title lists every answer. */
function caseVerdictCell(info: { row: { original: TargetView } }) {
  const t = info.row.original;
  return (
    <span className={`text-xs ${verdictClass[t.caseVerdict]}`} title={t.caseAnswers.map(answerLine).join("\n")} data-testid="case-verdict">
      {caseVerdictLine(t.caseVerdict, t.caseAnswers)}
    </span>
  );
}

function columnsFor(proposalId: string): ColumnDef<typeof features, TargetView>[] {
  return [
    {
      accessorKey: "name",
      header: "Target",
      cell: (info) => (
        <Link href={`/proposals/${proposalId}/targets/${info.row.original.id}`} className="font-semibold">
          {info.row.original.name}
        </Link>
      ),
    },
    { accessorKey: "raDeg", header: "RA", cell: (info) => <span className="tabular-nums">{info.row.original.raText}</span> },
    { accessorKey: "decDeg", header: "Dec", cell: (info) => <span className="tabular-nums">{info.row.original.decText}</span> },
    { accessorKey: "lensModel", header: "Lens", enableSorting: false, cell: (info) => lensModelOf(info.getValue() as LensModelId).shortLabel },
    { accessorKey: "priority", header: "Prio." },
    { accessorKey: "status", header: "Status", cell: (info) => statusLabels[info.row.original.status] },
    { accessorKey: "einsteinRadiusMas", header: "θE (mas)", cell: numberCell() },
    { accessorKey: "imageSeparationMas", header: "Sep. (mas)", cell: numberCell() },
    { accessorKey: "magnificationTotal", header: "μ total", cell: numberCell(3) },
    { accessorKey: "timeDelayDays", header: "Δt (d)", cell: numberCell(3) },
    { accessorKey: "crossingTimeDays", header: "tE (d)", cell: numberCell(3) },
    // The photon budget: "—" while a target has none (no telescope, source magnitude or schedule yet).
    {
      accessorKey: "timeRequestHours",
      header: () => <span title="Hours requested over the visits the science case needs: exposures plus overheads">Time request (h)</span>,
      cell: numberCell(3),
    },
    {
      accessorKey: "peakSignalToNoise",
      header: () => <span title="Signal-to-noise of what the science case measures at its brightest visit, exposing the whole time a visit leaves after its overhead">S/N at brightest</span>,
      cell: numberCell(3),
    },
    {
      accessorKey: "answeredCase",
      header: "Science case",
      enableSorting: false,
      cell: (info) => {
        const t = info.row.original;
        return t.answeredCase === null ? "—" : <span title={t.scienceCase === null ? "Inferred from the model and numbers" : "Chosen by the team"}>{scienceCaseLabels[t.answeredCase]}</span>;
      },
    },
    { accessorKey: "caseVerdict", header: "Case verdict", cell: caseVerdictCell },
  ];
}

/** A filter over a fixed list of values, "Any" first. */
function FilterSelect<T extends string>({ label, value, onChange, values, labels }: { label: string; value: string; onChange: React.ChangeEventHandler<HTMLSelectElement>; values: readonly T[]; labels: Record<T, string> }) {
  return (
    <label className="flex flex-col">
      {label}
      <select value={value} onChange={onChange} className="mt-1 rounded border border-void-edge bg-void px-2 py-1">
        <option value="">Any</option>
        <ChoiceOptions values={values} labels={labels} />
      </select>
    </label>
  );
}

/**
 * The proposal's targets: sorted, filtered and paged on the server (so 10,000 targets cost one page
 * of rows here), with the computed lensing columns and each target's science case and its verdict.
 */
export function TargetTable({ proposalId, initialPage }: { proposalId: string; initialPage: TargetPage }) {
  const [sorting, setSorting] = useState<SortingState>(initialTargetSorting);
  const [page, setPage] = useState(1);
  const [filters, setFilters] = useState<TargetFilters>(emptyFilters);
  const initialUrl = targetListUrl(proposalId, initialTargetSorting, 1, targetPageSize, emptyFilters);
  const url = targetListUrl(proposalId, sorting, page, targetPageSize, filters);
  const { data, error } = useSWR<TargetPage>(url, swrFetcher, {
    fallbackData: url === initialUrl ? initialPage : undefined,
    keepPreviousData: true,
  });
  const rows = useMemo(() => data?.rows ?? [], [data]);
  const columns = useMemo(() => columnsFor(proposalId), [proposalId]);
  const table = useTable({
    features,
    columns,
    data: rows,
    manualSorting: true,
    enableMultiSort: false,
    state: { sorting },
    onSortingChange: (updater) => {
      setSorting(updater);
      setPage(1);
    },
  });
  const total = data?.total ?? 0;
  const pageCount = Math.max(1, Math.ceil(total / targetPageSize));
  const setFilter = (key: keyof TargetFilters) => (event: React.ChangeEvent<HTMLInputElement | HTMLSelectElement>) => {
    setFilters((f) => ({ ...f, [key]: event.target.value }));
    setPage(1);
  };

  return (
    <div className="space-y-3">
      <div className="flex flex-wrap items-end gap-3 text-sm" role="search" aria-label="Filter targets">
        <label className="flex flex-col">
          Name contains
          <input value={filters.q} onChange={setFilter("q")} className="mt-1 rounded border border-void-edge bg-void px-2 py-1" />
        </label>
        <FilterSelect label="Status" value={filters.status} onChange={setFilter("status")} values={targetStatuses} labels={statusLabels} />
        <FilterSelect label="Lens model" value={filters.lensModel} onChange={setFilter("lensModel")} values={lensModels} labels={lensModelLabels} />
        <FilterSelect label="Science case" value={filters.answeredCase} onChange={setFilter("answeredCase")} values={scienceCaseIds} labels={scienceCaseLabels} />
        <FilterSelect label="Case verdict" value={filters.caseVerdict} onChange={setFilter("caseVerdict")} values={verdicts} labels={verdictLabels} />
        <label className="flex flex-col">
          Tag
          <input value={filters.tag} onChange={setFilter("tag")} className="mt-1 w-28 rounded border border-void-edge bg-void px-2 py-1" />
        </label>
        <span className="ml-auto text-dusk-dim" aria-live="polite">
          {data ? `${total} target${total === 1 ? "" : "s"}` : "Loading…"}
        </span>
      </div>
      {error && <p role="alert" className="text-alarm">{error.message}</p>}
      <div className="overflow-x-auto rounded-lg border border-void-edge">
        <table className="w-full text-left text-sm" data-testid="target-table">
          <thead className="bg-void-raised text-dusk-dim">
            {table.getHeaderGroups().map((group) => (
              <tr key={group.id}>
                {group.headers.map((header) => {
                  const sorted = header.column.getIsSorted();
                  const canSort = header.column.getCanSort();
                  return (
                    <th key={header.id} scope="col" className="px-3 py-2 font-semibold" aria-sort={sorted ? (sorted === "asc" ? "ascending" : "descending") : undefined}>
                      {canSort ? (
                        <button type="button" className="hover:text-dusk" onClick={header.column.getToggleSortingHandler()}>
                          <table.FlexRender header={header} />
                          {sorted === "asc" ? " ▲" : sorted === "desc" ? " ▼" : ""}
                        </button>
                      ) : (
                        <table.FlexRender header={header} />
                      )}
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody className="divide-y divide-void-edge">
            {table.getRowModel().rows.map((row) => (
              <tr key={row.id} data-testid="target-row">
                {row.getAllCells().map((cell) => (
                  <td key={cell.id} className="px-3 py-2" data-column={cell.column.id}>
                    <table.FlexRender cell={cell} />
                  </td>
                ))}
              </tr>
            ))}
            {rows.length === 0 && data && (
              <tr>
                <td colSpan={columns.length} className="px-3 py-6 text-center text-dusk-dim">
                  No targets match.
                </td>
              </tr>
            )}
          </tbody>
        </table>
      </div>
      <PageStepper label="Target pages" page={page} pageCount={pageCount} onPageChange={setPage} />
    </div>
  );
}
