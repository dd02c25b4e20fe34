import { tokens } from '@fluentui/react-components';

/** Chart colours from the theme's tokens (CSS variables work in SVG fills), never raw colours. */
export const CHART_COLOURS = {
  worked: tokens.colorBrandBackground,
  target: tokens.colorNeutralStroke1Pressed,
  nights: tokens.colorPalettePlumBorderActive,
  weekends: tokens.colorPaletteMarigoldBorderActive,
  metTarget: tokens.colorPaletteGreenBorderActive,
  metMin: tokens.colorPaletteYellowBorderActive,
  belowMin: tokens.colorPaletteRedBorderActive,
  grid: tokens.colorNeutralStroke2,
  text: tokens.colorNeutralForeground2,
} as const;

/** Height of a horizontal bar chart with one row per person: enough room for each name. */
export function rowsHeight(rows: number): string {
  return `${Math.max(8, rows * 2.2 + 4)}rem`;
}

/** Legend entries in the body text colour: the swatch carries the series colour, the words stay readable. */
export function legendText(value: string) {
  return <span style={{ color: CHART_COLOURS.text }}>{value}</span>;
}
