// The reveal presentation's page body: every slide as a labelled region, and the bar that moves between them
// (shown by deck.js; without script the slides stand one under the other, which is also how they print).
import type { DeckSlide } from './slides';

export interface PresentationProps {
  brandName: string;
  slides: DeckSlide[];
  /** The guideline site this presentation belongs to. */
  guidelinesHref: string;
  pdfHref: string;
}

export function Presentation({ brandName, slides, guidelinesHref, pdfHref }: PresentationProps) {
  return (
    <>
      <main className="deck" data-deck aria-label={`${brandName}: the identity`}>
        {slides.map((slide, i) => (
          <section
            key={slide.key}
            id={`slide-${i + 1}`}
            className="slide"
            data-slide={slide.key}
            data-title={slide.title}
            aria-roledescription="slide"
            aria-label={`${i + 1} of ${slides.length}: ${slide.title}`}
          >
            {slide.content}
          </section>
        ))}
      </main>
      <nav className="deck-bar" data-deck-bar hidden aria-label="Presentation">
        <a href={guidelinesHref}>Guidelines</a>
        <button type="button" data-deck-previous aria-label="Previous slide" aria-keyshortcuts="ArrowLeft PageUp">
          ←
        </button>
        <p className="deck-count" data-deck-count>
          1 / {slides.length}
        </p>
        <button type="button" data-deck-next aria-label="Next slide" aria-keyshortcuts="ArrowRight PageDown Space">
          →
        </button>
        <button type="button" data-deck-full aria-pressed="false" aria-keyshortcuts="F">
          Full screen
        </button>
        <a href={pdfHref}>PDF</a>
      </nav>
      <p className="sr-only" aria-live="polite" data-deck-live />
    </>
  );
}
