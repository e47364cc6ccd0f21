// "Add a block": a filterable, grouped list; arrow keys move, Enter adds, Escape closes and returns to the text.
import { useEffect, useId, useMemo, useRef, useState } from 'react';
import { filterItems, type InsertItem } from './insertItems';

export function InsertMenu({ items, position, onChoose, onClose }: { items: InsertItem[]; position: { top: number; left: number }; onChoose: (item: InsertItem) => void; onClose: () => void }) {
  const [query, setQuery] = useState('');
  const [active, setActive] = useState(0);
  const inputRef = useRef<HTMLInputElement>(null);
  const listId = useId();
  const shown = useMemo(() => filterItems(items, query), [items, query]);
  useEffect(() => inputRef.current?.focus(), []);
  useEffect(() => setActive(0), [query]);
  useEffect(() => {
    document.getElementById(`${listId}-${active}`)?.scrollIntoView({ block: 'nearest' });
  }, [active, listId]);

  const onKeyDown = (e: React.KeyboardEvent) => {
    if (e.key === 'ArrowDown') setActive((i) => Math.min(shown.length - 1, i + 1));
    else if (e.key === 'ArrowUp') setActive((i) => Math.max(0, i - 1));
    else if (e.key === 'Home') setActive(0);
    else if (e.key === 'End') setActive(shown.length - 1);
    else if (e.key === 'Enter' && shown[active]) onChoose(shown[active]);
    else if (e.key === 'Escape' || e.key === 'Tab') onClose();
    else return;
    e.preventDefault();
  };

  let lastGroup = '';
  return (
    <div
      role="dialog"
      aria-label="Add a block"
      className="panel fixed z-50 w-80 overflow-hidden shadow-lg"
      style={{ top: Math.min(position.top, window.innerHeight - 420), left: Math.min(position.left, window.innerWidth - 340) }}
      onBlur={(e) => {
        if (!e.currentTarget.contains(e.relatedTarget as Node | null)) onClose();
      }}
    >
      <div className="border-b border-rule p-2">
        <input
          ref={inputRef}
          className="field py-1.5 text-sm"
          placeholder="Find a block…"
          aria-label="Find a block"
          role="combobox"
          aria-expanded="true"
          aria-controls={listId}
          aria-activedescendant={shown[active] ? `${listId}-${active}` : undefined}
          value={query}
          onChange={(e) => setQuery(e.target.value)}
          onKeyDown={onKeyDown}
        />
      </div>
      <ul id={listId} role="listbox" aria-label="Blocks" className="max-h-80 overflow-y-auto py-1">
        {shown.length === 0 ? <li className="px-3 py-2 text-sm text-ink-soft">No block matches “{query}”.</li> : null}
        {shown.map((item, i) => {
          const heading = item.group !== lastGroup ? item.group : null;
          lastGroup = item.group;
          return (
            <li key={item.key} role="presentation">
              {heading ? <div className="eyebrow px-3 pb-1 pt-2" aria-hidden="true">{heading}</div> : null}
              <div
                id={`${listId}-${i}`}
                role="option"
                aria-selected={i === active}
                aria-label={`${item.label}, ${item.group}`}
                tabIndex={-1}
                className={`cursor-pointer px-3 py-1.5 ${i === active ? 'bg-plumb-wash' : ''}`}
                onMouseEnter={() => setActive(i)}
                onMouseDown={(e) => e.preventDefault()}
                onClick={() => onChoose(item)}
              >
                <div className="text-sm font-semibold text-ink">{item.label}</div>
                <div className="text-xs text-ink-soft">{item.description}</div>
              </div>
            </li>
          );
        })}
      </ul>
    </div>
  );
}
