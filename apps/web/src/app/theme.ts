import { createLightTheme, type BrandVariants, type Theme } from '@fluentui/react-components';

/**
 * Rotaplex brand ramp: a deep sea-teal of our own, darkest (10) to lightest (160).
 * Shade 80 is the primary action colour; the light end tints selected and hovered surfaces.
 */
export const rotaplexBrand: BrandVariants = {
  10: '#021615',
  20: '#06221f',
  30: '#0a2f2c',
  40: '#0c3c39',
  50: '#0d4946',
  60: '#0d5653',
  70: '#0b6461',
  80: '#08726e',
  90: '#1d807c',
  100: '#348e89',
  110: '#4c9c97',
  120: '#66aaa5',
  130: '#80b8b4',
  140: '#9cc7c3',
  150: '#b8d6d3',
  160: '#d5e6e4',
};

const FONT_STACK = "'Open Sans', 'Segoe UI', system-ui, -apple-system, 'Helvetica Neue', Arial, sans-serif";

/** The one theme of the product. Components read it only through `tokens.*`. */
export const rotaplexTheme: Theme = {
  ...createLightTheme(rotaplexBrand),
  fontFamilyBase: FONT_STACK,
};
