"use client";

import { useRef, type ReactNode } from "react";
import { useVirtualizer } from "@tanstack/react-virtual";

interface VirtualRowsProps<T> {
  rows: readonly T[];
  /** The table's accessible name. */
  label: string;
  /** The rows' estimated height; a taller row (wrapped errors) is measured. */
  rowHeightPx: number;
  /** The scroller's height class, e.g. "h-96". */
  heightClass: string;
  keyOf: (row: T) => string | number;
  /** `data-*` attributes of a row (its test id, its state). */
  attributesOf: (row: T) => Record<`data-${string}`, string | boolean>;
  /** A row's cells (`role="cell"` elements). */
  children: (row: T) => ReactNode;
}

/** A file's rows as a table, virtualised so a 10,000-row file scrolls smoothly: only the rows in view are in the page. */
export function VirtualRows<T>({ rows, label, rowHeightPx, heightClass, keyOf, attributesOf, children }: VirtualRowsProps<T>) {
  const scroller = useRef<HTMLDivElement>(null);
  const virtualizer = useVirtualizer({ count: rows.length, getScrollElement: () => scroller.current, estimateSize: () => rowHeightPx, overscan: 12 });
  return (
    <div ref={scroller} className={`${heightClass} overflow-auto rounded-lg border border-void-edge`} role="table" aria-label={label}>
      <div style={{ height: virtualizer.getTotalSize(), position: "relative" }}>
        {virtualizer.getVirtualItems().map((item) => {
          const row = rows[item.index];
          return (
            <div
              key={keyOf(row)}
              role="row"
              {...attributesOf(row)}
              className="absolute left-0 right-0 flex gap-3 border-b border-void-edge px-3 py-1 text-sm"
              style={{ top: item.start, minHeight: rowHeightPx }}
              ref={virtualizer.measureElement}
              data-index={item.index}
            >
              {children(row)}
            </div>
          );
        })}
      </div>
    </div>
  );
}
