// The presentation in the browser: one slide at a time, moved by keys, buttons and swipes, announced to screen
// readers. Without this script (or on paper) the slides simply stand one under the other. Plain JavaScript (types
// in JSDoc, checked): each built version keeps its own copy of this file, served as it is.
// @ts-check
/* global document, history, location */

const NEXT_KEYS = new Set(['ArrowRight', 'ArrowDown', 'PageDown', ' ']);
const PREVIOUS_KEYS = new Set(['ArrowLeft', 'ArrowUp', 'PageUp']);
/** A horizontal swipe shorter than this (CSS px) is a tap or a wobble, not a turn. */
const SWIPE_MIN_PX = 48;

/** Wire up the deck in `root`; returns the function that shows slide `n` (0-based). */
/**
 * @param {HTMLElement} root
 * @returns {(n: number) => void}
 */
export function startDeck(root) {
  const slides = /** @type {HTMLElement[]} */ ([...root.querySelectorAll('[data-slide]')]);
  const bar = /** @type {HTMLElement | null} */ (document.querySelector('[data-deck-bar]'));
  const counter = /** @type {HTMLElement | null} */ (document.querySelector('[data-deck-count]'));
  const live = /** @type {HTMLElement | null} */ (document.querySelector('[data-deck-live]'));
  const previous = /** @type {HTMLButtonElement | null} */ (document.querySelector('[data-deck-previous]'));
  const next = /** @type {HTMLButtonElement | null} */ (document.querySelector('[data-deck-next]'));
  const full = /** @type {HTMLButtonElement | null} */ (document.querySelector('[data-deck-full]'));
  let current = -1;

  /** @type {(wanted: number, announce?: boolean) => void} */
  const show = (wanted, announce = true) => {
    const n = Math.max(0, Math.min(slides.length - 1, wanted));
    if (n === current) return;
    current = n;
    slides.forEach((slide, i) => {
      slide.hidden = i !== n;
      slide.toggleAttribute('data-current', i === n);
    });
    if (counter) counter.textContent = `${n + 1} / ${slides.length}`;
    if (previous) previous.disabled = n === 0;
    if (next) next.disabled = n === slides.length - 1;
    if (live && announce) live.textContent = `Slide ${n + 1} of ${slides.length}: ${slides[n].dataset.title ?? ''}`;
    history.replaceState(null, '', `#slide-${n + 1}`);
  };

  document.documentElement.dataset.deckMode = 'on';
  if (bar) bar.hidden = false;
  const fromHash = Number(location.hash.match(/^#slide-(\d+)$/)?.[1] ?? 1);
  show(Number.isInteger(fromHash) ? fromHash - 1 : 0, false);

  document.addEventListener('keydown', (e) => {
    if (e.altKey || e.ctrlKey || e.metaKey) return;
    const target = /** @type {HTMLElement | null} */ (e.target);
    // Space and Enter on a focused button or link belong to that control.
    if ((e.key === ' ' || e.key === 'Enter') && target?.closest('button, a, input, select, textarea')) return;
    if (e.key === 'Escape') {
      if (document.fullscreenElement) void document.exitFullscreen();
      return;
    }
    /** @type {number | null} */
    let to = null;
    if (NEXT_KEYS.has(e.key)) to = e.key === ' ' && e.shiftKey ? current - 1 : current + 1;
    else if (PREVIOUS_KEYS.has(e.key)) to = current - 1;
    else if (e.key === 'Home') to = 0;
    else if (e.key === 'End') to = slides.length - 1;
    else if (e.key === 'f' && full && !full.hidden) full.click();
    if (to === null) return;
    e.preventDefault();
    show(to);
  });

  previous?.addEventListener('click', () => show(current - 1));
  next?.addEventListener('click', () => show(current + 1));

  if (full) {
    if (!document.fullscreenEnabled) full.hidden = true;
    full.addEventListener('click', () => {
      if (document.fullscreenElement) void document.exitFullscreen();
      else void document.documentElement.requestFullscreen().catch(() => undefined);
    });
    document.addEventListener('fullscreenchange', () => {
      const on = !!document.fullscreenElement;
      full.textContent = on ? 'Leave full screen' : 'Full screen';
      full.setAttribute('aria-pressed', String(on));
    });
  }

  /** @type {{ x: number; y: number } | null} */
  let start = null;
  root.addEventListener('pointerdown', (e) => {
    if (e.pointerType !== 'mouse') start = { x: e.clientX, y: e.clientY };
  });
  root.addEventListener('pointerup', (e) => {
    if (!start) return;
    const dx = e.clientX - start.x;
    const dy = e.clientY - start.y;
    start = null;
    if (Math.abs(dx) >= SWIPE_MIN_PX && Math.abs(dx) > Math.abs(dy)) show(dx < 0 ? current + 1 : current - 1);
  });
  root.addEventListener('pointercancel', () => (start = null));

  return show;
}
