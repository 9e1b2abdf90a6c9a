import { useLayoutEffect, useRef, useState, type Key, type ReactNode } from 'react';
import { useWindowVirtualizer } from '@tanstack/react-virtual';

/**
 * A long list inside the page's own scroll (a phone scrolls the window): only the rows on screen, and a few either
 * side, are in the DOM (TanStack Virtual), so 200 vans cost what 15 do. Rows are measured as they render, so they
 * may wrap to any height; estimateRowPx only sizes the list before that. Screen readers are told each row's place.
 */
export function WindowedList<T>({
  items,
  itemKey,
  renderItem,
  estimateRowPx,
  label,
}: {
  items: readonly T[];
  itemKey: (item: T) => Key;
  renderItem: (item: T) => ReactNode;
  estimateRowPx: number;
  label?: string;
}) {
  const listRef = useRef<HTMLUListElement>(null);
  const [scrollMargin, setScrollMargin] = useState(0);
  useLayoutEffect(() => {
    const list = listRef.current;
    if (!list) return;
    // The list's distance from the top of the page moves when anything above it changes size. Measured only when the
    // observer reports, after the browser's own layout: measured here, straight after React has put the page in,
    // it forced a layout of the whole page and a second render before the first paint (a 4x slowed profile of the
    // large firm's overview: 174 ms of 1.3 s). Until then the rows are placed from the list's top as they are after.
    const measure = () => setScrollMargin(Math.round(list.getBoundingClientRect().top + window.scrollY));
    const observer = new ResizeObserver(measure);
    observer.observe(document.body);
    return () => observer.disconnect();
  }, []);
  const virtualizer = useWindowVirtualizer({
    count: items.length,
    estimateSize: () => estimateRowPx,
    overscan: 6,
    scrollMargin,
  });
  return (
    <ul ref={listRef} aria-label={label} className="relative" style={{ height: virtualizer.getTotalSize() }}>
      {virtualizer.getVirtualItems().map((row) => {
        const item = items[row.index]!;
        return (
          <li
            key={itemKey(item)}
            data-index={row.index}
            ref={virtualizer.measureElement}
            aria-setsize={items.length}
            aria-posinset={row.index + 1}
            className="absolute inset-x-0 top-0 border-b border-line"
            style={{ transform: `translateY(${row.start - scrollMargin}px)` }}
          >
            {renderItem(item)}
          </li>
        );
      })}
    </ul>
  );
}
