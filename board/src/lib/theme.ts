import {
  createDarkTheme,
  createLightTheme,
  type BrandVariants,
  type Theme,
} from '@fluentui/react-components';
import { BRAND_RAMP, SIGNAL_PALETTE } from '@baytime/shared';

/** Baytime's one brand ramp (shared with the kiosk), darkest (10) to lightest (160). */
export const baytimeBrand: BrandVariants = BRAND_RAMP;

/** The wall's and the kiosk's type: Barlow for text, its semi-condensed cut for headings and the rail. */
/** The wall's and the kiosk's heading type: the office rail and page titles use it too. */
export const HEADING_FONT = "'Barlow Semi Condensed', 'Barlow', system-ui, sans-serif";

const fonts = {
  fontFamilyBase: "'Barlow', 'Segoe UI', system-ui, sans-serif",
  fontFamilyNumeric: "'Barlow', 'Segoe UI', system-ui, sans-serif",
};

/** The kiosk's rounder corners: Fluent's stock radii are the stock admin look. */
const shapes = {
  borderRadiusSmall: '4px',
  borderRadiusMedium: '8px',
  borderRadiusLarge: '12px',
  borderRadiusXLarge: '14px',
};

/**
 * Fluent's warning (orange, yellow) and success (green) tones are bay-state hues on this product's
 * palette. A warning is Baytime's attention colour; a success is told by its words and tick, in
 * neutral tones.
 */
function statusTokens(mode: 'light' | 'dark'): Partial<Theme> {
  const light = mode === 'light';
  const attention = light ? SIGNAL_PALETTE.attention.onLight : SIGNAL_PALETTE.attention.onDark;
  const quiet = light ? '#F1F3F6' : '#1E242C';
  return {
    colorStatusWarningBackground1: light ? '#FCEEF0' : '#2D1A1F',
    colorStatusWarningBackground2: light ? '#F7D7DC' : '#3F2229',
    colorStatusWarningBackground3: attention,
    colorStatusWarningForeground1: attention,
    colorStatusWarningForeground2: attention,
    colorStatusWarningForeground3: attention,
    colorStatusWarningForegroundInverted: light
      ? SIGNAL_PALETTE.attention.onDark
      : SIGNAL_PALETTE.attention.onLight,
    colorStatusWarningBorderActive: attention,
    colorStatusWarningBorder1: light ? '#E6CBCB' : '#6B3440',
    colorStatusWarningBorder2: attention,
    colorStatusSuccessBackground1: quiet,
    colorStatusSuccessBackground2: light ? '#E3E7EC' : '#262D36',
    colorStatusSuccessBackground3: light ? '#4A5563' : '#C9D1DB',
    colorStatusSuccessForeground1: light ? '#2B333D' : '#E3E8EE',
    colorStatusSuccessForeground2: light ? '#2B333D' : '#E3E8EE',
    colorStatusSuccessForeground3: light ? '#2B333D' : '#E3E8EE',
    colorStatusSuccessForegroundInverted: light ? '#E3E8EE' : '#2B333D',
    colorStatusSuccessBorderActive: light ? '#4A5563' : '#C9D1DB',
    colorStatusSuccessBorder1: light ? '#C9D1DB' : '#3A4450',
    colorStatusSuccessBorder2: light ? '#4A5563' : '#C9D1DB',
  };
}

export const baytimeLightTheme: Theme = {
  ...createLightTheme(baytimeBrand),
  ...fonts,
  ...shapes,
  ...statusTokens('light'),
};

const dark = createDarkTheme(baytimeBrand);
export const baytimeDarkTheme: Theme = {
  ...dark,
  ...fonts,
  ...shapes,
  ...statusTokens('dark'),
  // The dark theme's default brand text is too dim on this ramp: lift it for 4.5:1 on the dark surfaces.
  colorBrandForeground1: baytimeBrand[130],
  colorBrandForeground2: baytimeBrand[140],
  colorBrandForegroundLink: baytimeBrand[130],
  colorBrandForegroundLinkHover: baytimeBrand[140],
};

/**
 * The office rail: the dark theme on the kiosk's blue-grey surfaces (page, raised, raised and
 * pressed), so the office frame is drawn in the same colours as the tablets and the wall.
 */
export const baytimeRailTheme: Theme = {
  ...baytimeDarkTheme,
  colorNeutralBackground1: '#1C2630',
  colorNeutralBackground1Hover: '#243140',
  colorNeutralBackground1Pressed: '#2E3C4A',
  colorNeutralBackground1Selected: '#243140',
  colorNeutralStroke1: '#4A5D70',
  colorNeutralStroke2: '#2E3C4A',
  colorNeutralForeground2: '#C3CAD3',
  colorNeutralForeground3: '#A6B4C0',
};
