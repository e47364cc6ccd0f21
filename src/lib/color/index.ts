// The colour library: parsing, notations, contrast, difference, colour-vision previews, palette reports.
export { ColorError, type ColorErrorCode } from './errors';
export { parseColor, toColor, rgb255, type Color, type ParseColorResult } from './parse';
export { colorValues, plainCmyk, type ColorValues } from './values';
export { contrastRatio, relativeLuminance, wcagLevels, flatten, WCAG_THRESHOLDS, type WcagLevels } from './contrast';
export { apcaContrast } from './apca';
export { deltaE2000, type Lab } from './difference';
export { simulateColorVision, MACHADO_2009_MATRICES, COLOR_VISION_KINDS, type ColorVisionKind, type Matrix3 } from './vision';
export { nearestPassing, type PassingShade } from './nearest';
export { paletteReport, NEAR_DUPLICATE_DELTA_E, type PaletteColor, type PalettePair, type PaletteReport } from './palette';
export { APCA_CAUTION, COLOR_VISION_CAUTION, CONTRAST_CAUTION, PRINT_CAUTION } from '@/lib/cautions';
