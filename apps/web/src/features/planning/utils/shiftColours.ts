import { tokens } from '@fluentui/react-components';
import type { ShiftColour } from '@rotaplex/contracts';

/** How each key of Rotaplex's shift palette is drawn: a tinted fill, a readable text colour and an edge. */
export const SHIFT_COLOUR_TOKENS: Record<
  ShiftColour,
  { background: string; foreground: string; border: string }
> = {
  teal: {
    background: tokens.colorPaletteTealBackground2,
    foreground: tokens.colorPaletteTealForeground2,
    border: tokens.colorPaletteTealBorderActive,
  },
  amber: {
    background: tokens.colorPaletteMarigoldBackground2,
    foreground: tokens.colorPaletteMarigoldForeground2,
    border: tokens.colorPaletteMarigoldBorderActive,
  },
  plum: {
    background: tokens.colorPalettePlumBackground2,
    foreground: tokens.colorPalettePlumForeground2,
    border: tokens.colorPalettePlumBorderActive,
  },
  slate: {
    background: tokens.colorPaletteSteelBackground2,
    foreground: tokens.colorPaletteSteelForeground2,
    border: tokens.colorPaletteSteelBorderActive,
  },
  moss: {
    background: tokens.colorPaletteForestBackground2,
    foreground: tokens.colorPaletteForestForeground2,
    border: tokens.colorPaletteForestBorderActive,
  },
  coral: {
    background: tokens.colorPalettePeachBackground2,
    foreground: tokens.colorPalettePeachForeground2,
    border: tokens.colorPalettePeachBorderActive,
  },
  sky: {
    background: tokens.colorPaletteCornflowerBackground2,
    foreground: tokens.colorPaletteCornflowerForeground2,
    border: tokens.colorPaletteCornflowerBorderActive,
  },
  sand: {
    background: tokens.colorPaletteBeigeBackground2,
    foreground: tokens.colorPaletteBeigeForeground2,
    border: tokens.colorPaletteBeigeBorderActive,
  },
};

/** Names people read beside each swatch (colour is never the only cue: the shift code is always shown). */
export const SHIFT_COLOUR_LABELS: Record<ShiftColour, string> = {
  teal: 'Teal',
  amber: 'Amber',
  plum: 'Plum',
  slate: 'Slate',
  moss: 'Moss',
  coral: 'Coral',
  sky: 'Sky',
  sand: 'Sand',
};
