import { makeStyles, mergeClasses, tokens, type GriffelStyle } from '@fluentui/react-components';
import { SHIFT_COLOURS, type ShiftColour } from '@rotaplex/contracts';
import { SHIFT_COLOUR_TOKENS } from '@/features/planning/utils/shiftColours';

const useColourStyles = makeStyles(
  Object.fromEntries(
    SHIFT_COLOURS.map((c): [ShiftColour, GriffelStyle] => [
      c,
      {
        backgroundColor: SHIFT_COLOUR_TOKENS[c].background,
        color: SHIFT_COLOUR_TOKENS[c].foreground,
        borderLeftColor: SHIFT_COLOUR_TOKENS[c].border,
      },
    ]),
  ) as Record<ShiftColour, GriffelStyle>,
);

const useStyles = makeStyles({
  chip: {
    display: 'inline-flex',
    alignItems: 'center',
    justifyContent: 'center',
    minWidth: '2.25rem',
    padding: `${tokens.spacingVerticalXXS} ${tokens.spacingHorizontalS}`,
    borderRadius: tokens.borderRadiusMedium,
    fontWeight: tokens.fontWeightSemibold,
    fontSize: tokens.fontSizeBase200,
    lineHeight: tokens.lineHeightBase200,
    borderLeftWidth: tokens.strokeWidthThicker,
    borderLeftStyle: 'solid',
    boxSizing: 'border-box',
  },
});

export interface ShiftChipProps {
  code: string;
  colour: ShiftColour;
  className?: string;
  /** Tooltip, e.g. the shift type's name. */
  title?: string;
}

/** A shift code on its palette colour; the code itself is the readable cue, never the colour alone. */
export function ShiftChip({ code, colour, className, title }: ShiftChipProps) {
  const styles = useStyles();
  const colours = useColourStyles();
  return (
    <span className={mergeClasses(styles.chip, colours[colour], className)} title={title}>
      {code}
    </span>
  );
}
