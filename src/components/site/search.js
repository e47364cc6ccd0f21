// Search on a published guideline page: a combobox with a grouped listbox (the WAI-ARIA Authoring Practices' editable
// combobox with list autocomplete). The engine and this version's index for the visitor load on first focus; a result
// scrolls to its block, marks it briefly and moves focus there. A settled search that finds nothing is reported to
// the brand owner (never when the browser asks not to be tracked). Plain JavaScript (types in JSDoc, checked): each
// built version keeps its own copy of this file and of the engine, served as they are. Text only: results are built
// with textContent, never as HTML.
// @ts-check
/* global document, navigator, window, CSS */

/** How the results list names and orders each kind of result. */
const GROUPS = /** @type {const} */ ([
  ['section', 'Sections'],
  ['colour', 'Colours'],
  ['logo', 'Logos'],
  ['typeface', 'Typefaces'],
  ['file', 'Files'],
  ['block', 'Guidance'],
  ['text', 'Text'],
  ['note', 'For editors'],
]);
/** At most this many results per group, so one kind never buries the others. */
const PER_GROUP = 6;
/** A query left alone this long counts as settled (for the report of searches that found nothing). */
const SETTLE_MS = 1500;
/** The insights schema takes queries up to this long. */
const MAX_QUERY = 120;
/** How long a block we jumped to stays marked. */
const MARK_MS = 2200;

/**
 * @typedef {{ id: string, kind: string, title: string, detail: string, section: string, blockId: string, swatch: string | null, score: number }} Hit
 * @typedef {{ search: (query: string, options: object) => Hit[] }} Engine
 */

/** Whether the visitor's browser asks not to be tracked (Do Not Track, Global Privacy Control). */
const asksNotToTrack = () => {
  const nav = /** @type {Navigator & { globalPrivacyControl?: boolean, msDoNotTrack?: string }} */ (navigator);
  const win = /** @type {Window & { doNotTrack?: string }} */ (window);
  return nav.doNotTrack === '1' || nav.doNotTrack === 'yes' || win.doNotTrack === '1' || nav.globalPrivacyControl === true;
};

/** @param {HTMLElement} root */
export function startSearch(root) {
  const input = /** @type {HTMLInputElement} */ (root.querySelector('[data-search-input]'));
  const panel = /** @type {HTMLElement} */ (root.querySelector('[data-search-panel]'));
  const list = /** @type {HTMLElement} */ (root.querySelector('[data-search-list]'));
  const message = /** @type {HTMLElement} */ (root.querySelector('[data-search-message]'));
  const status = /** @type {HTMLElement} */ (root.querySelector('[data-search-status]'));
  if (!input || !panel || !list || !message || !status) return;
  const { index: indexHref = '', engine: engineHref = '', events: eventsHref = '' } = root.dataset;
  root.hidden = false;

  /** @type {Promise<{ engine: Engine, options: object }> | null} */
  let loading = null;
  /** @type {Hit[]} */
  let shown = [];
  let active = -1;
  /** @type {ReturnType<typeof setTimeout> | undefined} */
  let settleTimer;
  /** Queries already reported, so a settled search is told once. */
  const reported = new Set();

  const load = () => {
    loading ??= Promise.all([import(engineHref), fetch(indexHref, { credentials: 'same-origin' })]).then(async ([module, response]) => {
      if (!response.ok) throw new Error(`index answered ${response.status}`);
      const file = await response.json();
      const MiniSearch = module.default;
      const engine = MiniSearch.loadJS(file.index, { fields: file.fields, storeFields: file.storeFields, idField: 'id' });
      return { engine, options: file.searchOptions };
    });
    return loading;
  };

  /** @param {boolean} open */
  const setOpen = (open) => {
    panel.hidden = !open;
    input.setAttribute('aria-expanded', String(open && shown.length > 0));
  };

  /** @param {number} n */
  const setActive = (n) => {
    const options = /** @type {HTMLElement[]} */ ([...list.querySelectorAll('[role="option"]')]);
    active = options.length ? (n + options.length) % options.length : -1;
    options.forEach((option, i) => option.setAttribute('aria-selected', String(i === active)));
    const current = options[active];
    if (current) {
      input.setAttribute('aria-activedescendant', current.id);
      current.scrollIntoView({ block: 'nearest' });
    } else input.removeAttribute('aria-activedescendant');
  };

  /** @param {string} text */
  const say = (text) => {
    message.textContent = text;
    message.hidden = !text;
  };

  /** @param {Hit[]} hits */
  const draw = (hits) => {
    list.replaceChildren();
    shown = [];
    for (const [kind, label] of GROUPS) {
      const group = hits.filter((h) => h.kind === kind).slice(0, PER_GROUP);
      if (!group.length) continue;
      const box = document.createElement('div');
      box.setAttribute('role', 'group');
      const heading = document.createElement('div');
      heading.setAttribute('role', 'presentation');
      heading.id = `${list.id}-${kind}`;
      heading.className = 'px-3 pb-1 pt-3 text-xs font-semibold uppercase tracking-widest text-ink-soft';
      heading.textContent = label;
      box.setAttribute('aria-labelledby', heading.id);
      box.append(heading);
      for (const hit of group) {
        const option = document.createElement('div');
        option.setAttribute('role', 'option');
        option.setAttribute('aria-selected', 'false');
        option.id = `${list.id}-option-${shown.length}`;
        option.dataset.index = String(shown.length);
        option.className = 'flex cursor-pointer items-center gap-3 rounded-md px-3 py-2 text-left aria-selected:bg-black/10 hover:bg-black/5';
        if (hit.swatch && /^#[0-9a-f]{6}$/.test(hit.swatch)) {
          const swatch = document.createElement('span');
          swatch.setAttribute('aria-hidden', 'true');
          swatch.className = 'h-8 w-8 shrink-0 rounded border border-black/20';
          swatch.style.backgroundColor = hit.swatch;
          option.append(swatch);
        }
        const words = document.createElement('span');
        words.className = 'min-w-0 flex-1';
        const title = document.createElement('span');
        title.className = 'block truncate font-semibold';
        title.textContent = hit.title;
        words.append(title);
        const detail = [hit.detail, hit.section && hit.section !== hit.title ? `in ${hit.section}` : ''].filter(Boolean).join(' · ');
        if (detail) {
          const line = document.createElement('span');
          line.className = 'block truncate text-xs text-ink-soft';
          line.textContent = detail;
          words.append(line);
        }
        option.append(words);
        box.append(option);
        shown.push(hit);
      }
      list.append(box);
    }
    active = -1;
    input.removeAttribute('aria-activedescendant');
  };

  /** The visitor's words as the insights schema takes them. */
  const cleanQuery = () => input.value.trim().replace(/\s+/g, ' ').slice(0, MAX_QUERY).trim();

  /** A settled query that found nothing goes to the brand owner's insights, once, unless the visitor opted out. */
  const settle = () => {
    clearTimeout(settleTimer);
    const query = cleanQuery();
    if (!query || shown.length > 0 || reported.has(query) || !eventsHref || asksNotToTrack()) return;
    reported.add(query);
    try {
      navigator.sendBeacon?.(eventsHref, JSON.stringify({ kind: 'search', query, results: 0 }));
    } catch {
      // Reporting is best effort; the search itself is done.
    }
  };

  const run = async () => {
    const query = cleanQuery();
    clearTimeout(settleTimer);
    if (!query) {
      draw([]);
      say('');
      status.textContent = '';
      setOpen(false);
      return;
    }
    say('Loading the index…');
    setOpen(true);
    let found;
    try {
      const { engine, options } = await load();
      found = engine.search(query, options);
    } catch {
      draw([]);
      say('Search could not be loaded. Reload the page to try again.');
      setOpen(true);
      return;
    }
    if (query !== cleanQuery()) return; // a newer keystroke is on its way
    draw(found);
    const count = shown.length;
    say(count ? '' : `Nothing found for “${query}”. Try a colour value, a name or a word from the guidelines.`);
    status.textContent = count ? `${count} result${count === 1 ? '' : 's'}. Arrow keys move through them, Enter goes there.` : 'Nothing found.';
    setOpen(true);
    settleTimer = setTimeout(settle, SETTLE_MS);
  };

  /** @param {number} n */
  const go = (n) => {
    const hit = shown[n];
    if (!hit) return;
    const target = /** @type {HTMLElement | null} */ (document.querySelector(`[data-block-id="${CSS.escape(hit.blockId)}"]`));
    setOpen(false);
    if (!target) return;
    const still = window.matchMedia('(prefers-reduced-motion: reduce)').matches;
    target.scrollIntoView({ behavior: still ? 'auto' : 'smooth', block: 'start' });
    if (!target.hasAttribute('tabindex')) target.setAttribute('tabindex', '-1');
    target.focus({ preventScroll: true });
    target.setAttribute('data-search-target', '');
    setTimeout(() => target.removeAttribute('data-search-target'), MARK_MS);
    status.textContent = `Moved to ${hit.title}.`;
  };

  input.addEventListener('focus', () => {
    load().catch(() => {});
    if (cleanQuery()) run();
  });
  input.addEventListener('input', () => run());
  input.addEventListener('keydown', (e) => {
    if (e.key === 'ArrowDown' || e.key === 'ArrowUp') {
      if (!shown.length) return;
      e.preventDefault();
      setOpen(true);
      setActive(active === -1 ? (e.key === 'ArrowDown' ? 0 : shown.length - 1) : active + (e.key === 'ArrowDown' ? 1 : -1));
    } else if (e.key === 'Enter') {
      e.preventDefault();
      settle();
      if (shown.length) go(active === -1 ? 0 : active);
    } else if (e.key === 'Escape') {
      if (!panel.hidden) setOpen(false);
      else input.value = '';
      setActive(-1);
    }
  });
  // A pointer choice keeps focus in the box until the jump moves it.
  list.addEventListener('mousedown', (e) => e.preventDefault());
  list.addEventListener('click', (e) => {
    const option = /** @type {HTMLElement | null} */ (/** @type {HTMLElement} */ (e.target).closest('[role="option"]'));
    if (option) go(Number(option.dataset.index));
  });
  root.addEventListener('focusout', (e) => {
    if (!root.contains(/** @type {Node | null} */ (e.relatedTarget))) setOpen(false);
  });
  // "/" anywhere but in a field goes to the box.
  document.addEventListener('keydown', (e) => {
    if (e.key !== '/' || e.ctrlKey || e.metaKey || e.altKey) return;
    const at = /** @type {HTMLElement | null} */ (document.activeElement);
    if (at && (at.isContentEditable || /^(INPUT|TEXTAREA|SELECT)$/.test(at.tagName))) return;
    e.preventDefault();
    input.focus();
    input.select();
  });
}

const root = /** @type {HTMLElement | null} */ (document.querySelector('[data-site-search]'));
if (root) startSearch(root);
