import type { TargetView } from "@/lib/workspace/target-view";
import type { Provenance } from "@/lib/exports/provenance";
import type { ChosenColumn } from "./columns";

/** Everything a table export is written from; every format writes the same rows and provenance. */
export interface TargetTable {
  /** The proposal's title, for captions and resource names. */
  title: string;
  columns: ChosenColumn[];
  rows: TargetView[];
  provenance: Provenance;
}

/** Folds line breaks so a value fits one comment line of a text format. */
export function singleLine(text: string): string {
  return text.replace(/[\r\n]+/g, " ");
}
