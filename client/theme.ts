import type { GlobalThemeOverrides } from 'naive-ui';

// Rindwise's own palette: a washed-rind brown, a cave-cellar green and a butter cream.
export const palette = {
  rind: '#6b3f1d',
  rindHover: '#85532b',
  rindPressed: '#553014',
  curd: '#fbf6ea',
  paper: '#fffdf8',
  butter: '#e9c46a',
  cellar: '#3f5e4a',
  ink: '#2d241c',
  muted: '#6f6254',
  line: '#e6dccb',
  warn: '#b5562b',
};

export const headingFont = "'Lora', Georgia, 'Times New Roman', serif";
export const bodyFont = "'Source Sans 3', 'Segoe UI', system-ui, sans-serif";

export const themeOverrides: GlobalThemeOverrides = {
  common: {
    fontFamily: bodyFont,
    fontSize: '16px',
    fontSizeMedium: '16px',
    primaryColor: palette.rind,
    primaryColorHover: palette.rindHover,
    primaryColorPressed: palette.rindPressed,
    primaryColorSuppl: palette.rindHover,
    infoColor: palette.cellar,
    warningColor: palette.warn,
    textColorBase: palette.ink,
    textColor1: palette.ink,
    textColor2: palette.ink,
    textColor3: palette.muted,
    bodyColor: palette.curd,
    cardColor: palette.paper,
    borderColor: palette.line,
    dividerColor: palette.line,
    borderRadius: '6px',
  },
  Layout: { color: palette.curd, headerColor: palette.paper },
  Card: { borderRadius: '10px' },
  Button: { fontWeight: '600' },
};
