// Caution texts the product shows where the work can hurt someone. Plain words, shown once where they matter.

/** Shown beside every CMYK value: screen-to-press conversion is an estimate, not a press value. */
export const PRINT_CAUTION =
  'CMYK values here are estimates converted from screen colour with a generic profile. Press results depend on the ' +
  'printer, the ink and the paper stock: ask your printer for their profile and approve a physical proof before a print run.';

/** Shown where print-ready PDF and EPS logo files are offered, beside PRINT_CAUTION. */
export const VECTOR_PRINT_NOTE =
  'Print PDF and EPS files are vectors made from the SVG logo, one page cut to its drawn bounds. In the CMYK files the colours ' +
  'are converted by formula and a generic profile, not your printer’s: replace them with the proofed or spot values your printer ' +
  'gives you. Logos uploaded as PNG get no PDF or EPS, since wrapping pixels would not make a vector file.';

/** Shown beside contrast results: guidance, not an accessibility certification. */
export const CONTRAST_CAUTION =
  'Contrast checks follow the WCAG 2.2 formula and are guidance only, not an accessibility certification. ' +
  'Real legibility also depends on type size, weight, rendering and the reader; test with people and an accessibility specialist.';

/** Shown beside APCA values: a draft method offered as a second opinion. */
export const APCA_CAUTION =
  'APCA is a draft contrast method proposed for a future WCAG 3. It is shown as a second opinion only; ' +
  'WCAG 2.2 contrast ratios remain the reference for conformance today.';

/** Shown beside colour-vision previews: simulations approximate, they do not reproduce anyone’s sight. */
export const COLOR_VISION_CAUTION =
  'Colour-vision previews are a model (Machado, Oliveira & Fernandes 2009) of the strongest forms of each deficiency. ' +
  'People see differently; never rely on colour alone to carry meaning.';

/** Shown wherever a typeface is added or served: the designer confirms the licence. */
export const FONT_LICENCE_CAUTION =
  'A font licence for desktop use does not always allow web embedding or serving the files from a published site. ' +
  'Confirm that your licence covers each use before the font is served.';

/** Shown on logo and brand-name pages: clearance is a legal matter. */
export const TRADEMARK_CAUTION =
  'Plumbline does not check trademarks. Before launch, have a trademark attorney search and clear the name and mark ' +
  'in every market where the brand will be used.';

/** Shown under print mock-ups: a picture of the identity in use, not artwork for the press. */
export const MOCKUP_PRINT_NOTE =
  'Mock-ups show the identity in use; they are not print-ready artwork. Their PDFs are RGB with 3 mm bleed and crop marks ' +
  'inside the bleed: confirm bleed, marks, colours and stock with your printer and approve a physical proof before a print run.';
