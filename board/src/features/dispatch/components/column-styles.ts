import { makeStyles, tokens } from '@fluentui/react-components';

/** The frame shared by the queue and the technician lanes, and how a drop target lights up. */
export const useColumnStyles = makeStyles({
  column: {
    display: 'flex',
    flexDirection: 'column',
    gap: tokens.spacingVerticalS,
    padding: tokens.spacingHorizontalS,
    borderRadius: tokens.borderRadiusLarge,
    backgroundColor: tokens.colorNeutralBackground3,
    outline: `${tokens.strokeWidthThick} solid transparent`,
    outlineOffset: '-2px',
    transitionProperty: 'outline-color, background-color',
    transitionDuration: tokens.durationFast,
    minWidth: 0,
  },
  head: {
    display: 'flex',
    flexDirection: 'column',
    gap: '2px',
    padding: `0 ${tokens.spacingHorizontalXS}`,
  },
  headRow: { display: 'flex', alignItems: 'center', gap: tokens.spacingHorizontalS, minHeight: '28px' },
  list: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalS },
  target: { outlineColor: tokens.colorNeutralStroke1, outlineStyle: 'dashed' },
  over: {
    outlineStyle: 'solid',
    outlineColor: tokens.colorBrandStroke1,
    backgroundColor: tokens.colorBrandBackground2,
  },
  overWarn: {
    outlineStyle: 'solid',
    outlineColor: tokens.colorStatusWarningBorder2,
    backgroundColor: tokens.colorStatusWarningBackground1,
  },
});
