"use client";

import { rowSortingFeature, tableFeatures, useTable, type ColumnDef, type SortingState } from "@tanstack/react-table";
import Link from "next/link";
import { useMemo, useState } from "react";
import useSWR from "swr";
import { statusLabels, targetStatuses } from "@/lib/workspace/status";
import { lensModelOf, type LensModelId } from "@/lib/lensing/registry";
import { lensModelLabels, lensModels } from "@/lib/workspace/target-schema";
import type { TargetPage, TargetView } from "@/lib/server/targets";
import { cycleNightCount, skySiteOf } from "@/lib/workspace/proposal-schema";
import { darkHoursOfSeason, type FeasibilitySettings } from "@/lib/workspace/derived";
import { feasibilityReport, interferometerBeamMicroarcsec, type CycleDarkHours } from "@/lib/workspace/verdicts";
import { useSeason } from "@/components/sky/use-season";
import { swrFetcher } from "@/components/workspace/api-client";
import { ChoiceOptions } from "@/components/workspace/choice-options";
import { formatQuantity, verdictClass, verdictLabels } from "@/components/workspace/format";
import { emptyFilters, initialTargetSorting, targetListUrl, targetPageSize, type TargetFilters } from "@/components/workspace/target-table-state";
import { PageStepper } from "@/components/page-stepper";

const features = tableFeatures({ rowSortingFeature });

const numberCell = (digits = 4) => (info: { getValue: () => unknown }) => (
  <span className="tabular-nums">{formatQuantity(info.getValue() as number | null, digits)}</span>
);

/** Shadow against λ/B and dark hours in the cycle, graded on read (no stored column yet). */
function onReadVerdictsCell(settings: FeasibilitySettings, darkHoursById: Map<string, CycleDarkHours> | null, isComputing: boolean) {
  return (info: { row: { original: TargetView } }) => {
    const t = info.row.original;
    const dark = darkHoursById?.get(t.id) ?? null;
    const [, , , shadow, darkHours] = feasibilityReport(t, settings.instrument, dark);
    const isCyclePending = settings.cycleStartDate !== null && dark === null;
    const beam = interferometerBeamMicroarcsec(settings.instrument.interferometerWavelengthMm, settings.instrument.interferometerBaselineKm);
    const shadowRatio = beam !== null && t.shadowDiameterMicroarcsec !== null ? ` (${formatQuantity(t.shadowDiameterMicroarcsec / beam, 3)}×)` : "";
    return (
      <span className="whitespace-nowrap text-xs" data-testid="on-read-verdicts">
        <span className={`${verdictClass[shadow.verdict]} mr-2`} title={shadow.figure}>
          {verdictLabels[shadow.verdict]}
          {shadowRatio}
        </span>
        <span className={isCyclePending ? "text-dusk-dim" : verdictClass[darkHours.verdict]} title={darkHours.figure}>
          {isCyclePending ? (isComputing ? "computing…" : "—") : dark === null ? verdictLabels[darkHours.verdict] : `${verdictLabels[darkHours.verdict]} (${dark.totalHoursDark.toFixed(0)} h)`}
        </span>
      </span>
    );
  };
}

function columnsFor(proposalId: string, onRead: ReturnType<typeof onReadVerdictsCell> | null): ColumnDef<typeof features, TargetView>[] {
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
    {
      id: "verdicts",
      header: "Resolution · cadence · campaign",
      enableSorting: false,
      cell: (info) => {
        const t = info.row.original;
        return (
          <span className="whitespace-nowrap text-xs">
            {[t.resolutionVerdict, t.cadenceVerdict, t.campaignVerdict].map((v, i) => (
              <span key={i} className={`${verdictClass[v]} mr-2`}>
                {verdictLabels[v]}
              </span>
            ))}
          </span>
        );
      },
    },
    ...(onRead ? [{ id: "onReadVerdicts", header: "Shadow vs λ/B · dark hours", enableSorting: false, cell: onRead } satisfies ColumnDef<typeof features, TargetView>] : []),
  ];
}

/** The season of one page of rows over the proposal's cycle, in the sky worker; null without a cycle. */
function usePageDarkHours(rows: TargetView[], settings: FeasibilitySettings | undefined) {
  const request = useMemo(() => {
    if (!settings || settings.cycleStartDate === null || settings.cycleEndDate === null || rows.length === 0) return null;
    return {
      site: skySiteOf(settings.site),
      targets: rows.map((r) => ({ raDeg: r.raDeg, decDeg: r.decDeg })),
      startNightIso: settings.cycleStartDate,
      nightCount: cycleNightCount(settings.cycleStartDate, settings.cycleEndDate),
      limits: { airmassLimit: settings.instrument.airmassLimit },
    };
  }, [rows, settings]);
  const season = useSeason(request);
  const byId = useMemo(() => {
    if (!season.season || season.season.targets.length !== rows.length) return null;
    const computed = season.season;
    // A season answer belongs to these rows only when every position matches (stale pages are dropped).
    if (!rows.every((r, i) => computed.targets[i].raDeg === r.raDeg && computed.targets[i].decDeg === r.decDeg)) return null;
    return new Map(rows.map((r, i) => [r.id, darkHoursOfSeason(computed, i)]));
  }, [season.season, rows]);
  return { byId, isComputing: season.status === "computing" };
}

/**
 * The proposal's targets: sorted, filtered and paged on the server (so 10,000 targets cost one page
 * of rows here), with the computed lensing columns and feasibility verdicts.
 */
export function TargetTable({ proposalId, initialPage, settings }: { proposalId: string; initialPage: TargetPage; settings?: FeasibilitySettings }) {
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
  const darkHours = usePageDarkHours(rows, settings);
  const table = useTable({
    features,
    columns: columnsFor(proposalId, settings ? onReadVerdictsCell(settings, darkHours.byId, darkHours.isComputing) : null),
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
        <label className="flex flex-col">
          Status
          <select value={filters.status} onChange={setFilter("status")} className="mt-1 rounded border border-void-edge bg-void px-2 py-1">
            <option value="">Any</option>
            <ChoiceOptions values={targetStatuses} labels={statusLabels} />
          </select>
        </label>
        <label className="flex flex-col">
          Lens model
          <select value={filters.lensModel} onChange={setFilter("lensModel")} className="mt-1 rounded border border-void-edge bg-void px-2 py-1">
            <option value="">Any</option>
            <ChoiceOptions values={lensModels} labels={lensModelLabels} />
          </select>
        </label>
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
                <td colSpan={13} className="px-3 py-6 text-center text-dusk-dim">
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
