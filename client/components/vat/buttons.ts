import type { ButtonProps } from 'naive-ui';

// Button sizes for wet hands. The view's config provider already makes every button at
// least 48 px tall; the main action of a card is taller still.
export const HUGE_BUTTON: ButtonProps['themeOverrides'] = {
  heightLarge: '76px',
  fontSizeLarge: '1.45rem',
  borderRadiusLarge: '14px',
};

export const TALL_BUTTON: ButtonProps['themeOverrides'] = {
  heightLarge: '60px',
  fontSizeLarge: '1.15rem',
  borderRadiusLarge: '12px',
};
