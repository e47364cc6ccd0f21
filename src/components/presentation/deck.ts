// The presentation in the browser: one slide at a time, moved by keys, buttons and swipes, announced to screen
// readers. Without this script (or on paper) the slides simply stand one under the other.

const NEXT_KEYS = new Set(['ArrowRight', 'ArrowDown', 'PageDown', ' ']);
const PREVIOUS_KEYS = new Set(['ArrowLeft', 'ArrowUp', 'PageUp']);
/** A horizontal swipe shorter than this (CSS px) is a tap or a wobble, not a turn. */
const SWIPE_MIN_PX = 48;

/** Wire up the deck in `root`; returns the function that shows slide `n` (0-based). */
export function startDeck(root: HTMLElement): (n: number) => void {
  const slides = [...root.querySelectorAll<HTMLElement>('[data-slide]')];
  const bar = document.querySelector<HTMLElement>('[data-deck-bar]');
  const counter = document.querySelector<HTMLElement>('[data-deck-count]');
  const live = document.querySelector<HTMLElement>('[data-deck-live]');
  const previous = document.querySelector<HTMLButtonElement>('[data-deck-previous]');
  const next = document.querySelector<HTMLButtonElement>('[data-deck-next]');
  const full = document.querySelector<HTMLButtonElement>('[data-deck-full]');
  let current = -1;

  const show = (wanted: number, announce = true) => {
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
    const target = e.target as HTMLElement | null;
    // Space and Enter on a focused button or link belong to that control.
    if ((e.key === ' ' || e.key === 'Enter') && target?.closest('button, a, input, select, textarea')) return;
    if (e.key === 'Escape') {
      if (document.fullscreenElement) void document.exitFullscreen();
      return;
    }
    let to: number | null = null;
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

  let start: { x: number; y: number } | null = null;
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
