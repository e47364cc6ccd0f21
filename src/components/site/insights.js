// Section views for the brand owner's insights: one event per section, the first time its heading comes into view.
// Sends nothing when the visitor asks not to be tracked (Do Not Track, Global Privacy Control). Copied into each
// built version (static/insights.js) and loaded with defer; the events address sits beside the version's pages.
// @ts-check
/* global document, navigator, window, IntersectionObserver */
(() => {
  if (navigator.doNotTrack === '1' || /** @type {{ globalPrivacyControl?: boolean }} */ (navigator).globalPrivacyControl === true) return;
  if (!('IntersectionObserver' in window) || typeof navigator.sendBeacon !== 'function' || !document.currentScript) return;
  const address = new URL('../events', /** @type {HTMLScriptElement} */ (document.currentScript).src).href;
  const seen = new Set();
  const watcher = new IntersectionObserver((entries) => {
    for (const entry of entries) {
      if (!entry.isIntersecting) continue;
      const blockId = entry.target.getAttribute('data-block-id');
      watcher.unobserve(entry.target);
      if (!blockId || seen.has(blockId)) continue;
      seen.add(blockId);
      navigator.sendBeacon(address, JSON.stringify({ kind: 'section', blockId }));
    }
  });
  // Section headings only: other blocks carry data-block-id too (search jumps to them), but a view is counted per section.
  for (const heading of document.querySelectorAll('[data-section-heading][data-block-id]')) watcher.observe(heading);
})();
