import { tokens } from '@fluentui/react-components';

/** Series colours of the demand charts, from the theme's tokens (never raw colours). */
export const DEMAND_COLOURS = {
  contacts: tokens.colorNeutralStroke1,
  required: tokens.colorPaletteRedBorderActive,
  planned: tokens.colorPaletteMarigoldBorderActive,
  rostered: tokens.colorBrandBackground,
  target: tokens.colorPaletteRedBorderActive,
} as const;
