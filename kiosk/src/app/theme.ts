import { createDarkTheme, type Theme } from '@fluentui/react-components';
import { BRAND_RAMP } from '@baytime/shared';

const base = createDarkTheme(BRAND_RAMP);

/** Fluent on the kiosk: Baytime's one brand ramp on the kiosk's dark surfaces. */
export const kioskTheme: Theme = {
  ...base,
  fontFamilyBase: "'Barlow', system-ui, sans-serif",
  colorNeutralBackground1: '#151d24',
  colorNeutralBackground2: '#1c2630',
  colorNeutralBackground3: '#0d1318',
  colorNeutralForeground1: '#edf2f6',
  colorNeutralForeground2: '#a6b4c0',
  colorNeutralStroke1: '#4a5d70',
  colorBrandForeground1: BRAND_RAMP[130],
  colorBrandForegroundLink: BRAND_RAMP[130],
};
