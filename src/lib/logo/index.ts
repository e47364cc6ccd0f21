// The logo library (browser-safe parts): SVG sanitising, clear space, minimum sizes and one-colour knockouts.
// Drawn bounds need sharp and live in bounds.server.ts.
export { LogoError, type LogoErrorCode, type LogoErrorInfo } from './errors';
export { MAX_SVG_UNITS, parseViewBox, svgLengthPx, type Box } from './geometry';
export { sanitizeSvg, toSanitizedSvg, MAX_SVG_BYTES, type SanitizeResult, type SanitizedSvg } from './sanitize';
export { clearSpace, type ClearSpace } from './clear-space';
export { minimumSize, MIN_STROKE_PRINT_PT, MIN_STROKE_SCREEN_PX, type MinimumSize } from './minimum-size';
export { knockoutSvg, drawnGround, paintLuminance, paintRole, GROUND_SPLIT_LUMINANCE, type DrawnGround, type PaintRole } from './knockout';
export { TRADEMARK_CAUTION } from '@/lib/cautions';
