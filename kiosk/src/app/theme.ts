import { createDarkTheme, type BrandVariants, type Theme } from '@fluentui/react-components';

/** Baytime's own brand ramp: a steel cyan, darkest to lightest. */
const baytimeBrand: BrandVariants = {
  10: '#03090b',
  20: '#0a1a1f',
  30: '#0e2730',
  40: '#11343f',
  50: '#14414f',
  60: '#174f60',
  70: '#1a5d71',
  80: '#1e6c83',
  90: '#2a7b93',
  100: '#3b8ba3',
  110: '#4f9cb3',
  120: '#4fb0c6',
  130: '#79c2d3',
  140: '#98d1de',
  150: '#b8e0e9',
  160: '#d9eff4',
};

const base = createDarkTheme(baytimeBrand);

export const kioskTheme: Theme = {
  ...base,
  fontFamilyBase: "'Barlow', system-ui, sans-serif",
  colorNeutralBackground1: '#151d24',
  colorNeutralBackground2: '#1c2630',
  colorNeutralBackground3: '#0d1318',
  colorNeutralForeground1: '#edf2f6',
  colorNeutralForeground2: '#a6b4c0',
  colorNeutralStroke1: '#4a5d70',
  colorBrandForeground1: baytimeBrand[130],
  colorBrandForegroundLink: baytimeBrand[130],
};
