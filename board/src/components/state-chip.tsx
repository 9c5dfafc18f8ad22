import { BAY_PALETTE, type BayState } from '@baytime/shared';
import { makeStyles, tokens } from '@fluentui/react-components';
import { Glyph } from './glyph';

const useStyles = makeStyles({
  chip: {
    display: 'inline-flex',
    alignItems: 'center',
    gap: tokens.spacingHorizontalXS,
    padding: `2px ${tokens.spacingHorizontalS}`,
    borderRadius: tokens.borderRadiusMedium,
    fontWeight: tokens.fontWeightSemibold,
    textTransform: 'uppercase',
    letterSpacing: '0.03em',
    fontSize: tokens.fontSizeBase200,
    lineHeight: tokens.lineHeightBase300,
    whiteSpace: 'nowrap',
    // Keeps the lightest fills apart from a white page (WCAG 1.4.11).
    boxShadow: `inset 0 0 0 1px rgba(11, 13, 16, 0.35)`,
  },
  glyph: { width: '1.15em', height: '1.15em', flexShrink: 0 },
});

/** A bay state as word, icon and colour together. */
export function StateChip({ state }: { state: BayState }) {
  const styles = useStyles();
  const look = BAY_PALETTE[state];
  return (
    <span className={styles.chip} style={{ backgroundColor: look.colour, color: look.textColour }}>
      <Glyph name={look.icon} className={styles.glyph} />
      {look.label}
    </span>
  );
}
