import {
  createDarkTheme,
  createLightTheme,
  type BrandVariants,
  type Theme,
} from '@fluentui/react-components';

/** Baytime's own petrol ramp, darkest (10) to lightest (160). */
export const baytimeBrand: BrandVariants = {
  10: '#05171A',
  20: '#072227',
  30: '#072F36',
  40: '#083B44',
  50: '#0A4752',
  60: '#0C535F',
  70: '#0D5F6D',
  80: '#0F6A7B',
  90: '#138296',
  100: '#18A6BF',
  110: '#1CC5E3',
  120: '#3CCDE7',
  130: '#60D6EB',
  140: '#84E0F0',
  150: '#B6E4ED',
  160: '#E2F5F8',
};

const fonts = {
  fontFamilyBase: "'Barlow', 'Segoe UI', system-ui, sans-serif",
  fontFamilyNumeric: "'Barlow', 'Segoe UI', system-ui, sans-serif",
};

export const baytimeLightTheme: Theme = { ...createLightTheme(baytimeBrand), ...fonts };

const dark = createDarkTheme(baytimeBrand);
export const baytimeDarkTheme: Theme = {
  ...dark,
  ...fonts,
  // The dark theme's default brand text is too dim on this ramp: lift it for 4.5:1 on the dark surfaces.
  colorBrandForeground1: baytimeBrand[110],
  colorBrandForeground2: baytimeBrand[120],
  colorBrandForegroundLink: baytimeBrand[120],
  colorBrandForegroundLinkHover: baytimeBrand[130],
};
