/**
 * A list that renders only the rows in view (plus a few), so 10,000 entries scroll smoothly.
 * Rows have a fixed height; the container scrolls; absent rows are stood in for by one spacer.
 */
import type { ComponentChildren } from "preact";
import { useEffect, useRef, useState } from "preact/hooks";

export function WindowedList<T>(p: {
  items: readonly T[];
  rowHeight: number;
  /** Height of the scrolling box (px). */
  height: number;
  label: string;
  keyOf: (item: T) => string;
  renderRow: (item: T, index: number) => ComponentChildren;
  overscan?: number;
}) {
  const ref = useRef<HTMLDivElement>(null);
  const [scrollTop, setScrollTop] = useState(0);
  const overscan = p.overscan ?? 4;
  const total = p.items.length * p.rowHeight;
  const boxHeight = Math.min(p.height, Math.max(total, p.rowHeight));
  const first = Math.max(0, Math.floor(scrollTop / p.rowHeight) - overscan);
  const last = Math.min(
    p.items.length,
    Math.ceil((scrollTop + boxHeight) / p.rowHeight) + overscan,
  );

  // When the list shrinks (filter), keep the scroll position inside it.
  useEffect(() => {
    const el = ref.current;
    if (el && scrollTop > Math.max(0, total - boxHeight)) {
      el.scrollTop = Math.max(0, total - boxHeight);
      setScrollTop(el.scrollTop);
    }
  }, [total, boxHeight, scrollTop]);

  const rows: ComponentChildren[] = [];
  for (let i = first; i < last; i++) {
    const item = p.items[i] as T;
    rows.push(
      <li
        key={p.keyOf(item)}
        class="dm-log-row"
        style={{ top: `${i * p.rowHeight}px`, height: `${p.rowHeight}px` }}
        aria-setsize={p.items.length}
        aria-posinset={i + 1}
      >
        {p.renderRow(item, i)}
      </li>,
    );
  }
  return (
    <div
      ref={ref}
      class="dm-log-window"
      style={{ height: `${boxHeight}px` }}
      onScroll={(e) => setScrollTop((e.currentTarget as HTMLDivElement).scrollTop)}
      data-testid="log-window"
    >
      <ul class="dm-log-list" aria-label={p.label} style={{ height: `${total}px` }}>
        {rows}
      </ul>
    </div>
  );
}
