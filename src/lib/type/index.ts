// The typography library: modular scales, unit conversions, font metrics and measure.
export { TypographyError, type TypographyErrorCode } from './errors';
export { SCALE_RATIOS, modularScale, scaleRatio, type ScaleRatioName, type ScaleStep, type ModularScaleInput } from './scale';
export * from './units';
export {
  fontMetrics,
  openFont,
  naturalLineHeight,
  lineHeightFromMetrics,
  BODY_LINE_HEIGHT_MIN,
  type FontMetrics,
} from './metrics';
export { measure, columnWidthFor, averageAdvanceEm, MEASURE_RANGE, MEASURE_SAMPLE, type Measure, type MeasureVerdict } from './measure';
export { FONT_LICENCE_CAUTION } from '@/lib/cautions';
