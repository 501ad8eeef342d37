import { darkTheme, type GlobalTheme, type GlobalThemeOverrides } from 'naive-ui';
import type { ThemeMode } from '@/stores/theme';

const FONT = "'Inter', system-ui, sans-serif";

const darkOverrides: GlobalThemeOverrides = {
  common: {
    fontFamily: FONT,
    primaryColor: '#c9a24b',
    primaryColorHover: '#d8b466',
    primaryColorPressed: '#a8843a',
    primaryColorSuppl: '#c9a24b',
    bodyColor: '#0b0d12',
    cardColor: '#12151d',
    modalColor: '#12151d',
    popoverColor: '#171b25',
    tableColor: '#12151d',
  },
};

// Night vision: deep red on black and nothing else. No white, blue or green anywhere, so the eye
// keeps its dark adaptation; the reds are bright enough on black to stay readable.
const RED_TEXT = '#e0442f';
const RED_DIM = '#a8301f';
const RED_FAINT = '#6e1f14';
const RED_LINE = '#3a120c';
const BLACK = '#000000';
const NEAR_BLACK = '#0c0201';

const nightVisionOverrides: GlobalThemeOverrides = {
  common: {
    fontFamily: FONT,
    primaryColor: '#c4321f', primaryColorHover: '#d9402b', primaryColorPressed: '#9c2817', primaryColorSuppl: '#c4321f',
    infoColor: '#b33a22', infoColorHover: '#c9452c', infoColorPressed: '#8f2c19', infoColorSuppl: '#b33a22',
    successColor: '#b8481f', successColorHover: '#cc5428', successColorPressed: '#933a18', successColorSuppl: '#b8481f',
    warningColor: '#c25a1c', warningColorHover: '#d66624', warningColorPressed: '#9b4816', warningColorSuppl: '#c25a1c',
    errorColor: '#ff2a12', errorColorHover: '#ff4a33', errorColorPressed: '#cc210e', errorColorSuppl: '#ff2a12',
    textColorBase: RED_TEXT, textColor1: RED_TEXT, textColor2: RED_TEXT, textColor3: RED_DIM,
    textColorDisabled: RED_FAINT, placeholderColor: RED_FAINT, placeholderColorDisabled: RED_FAINT,
    iconColor: RED_DIM, iconColorHover: RED_TEXT, iconColorPressed: RED_DIM, iconColorDisabled: RED_FAINT,
    borderColor: RED_LINE, dividerColor: RED_LINE, closeIconColor: RED_DIM, clearColor: RED_DIM,
    bodyColor: BLACK, cardColor: NEAR_BLACK, modalColor: NEAR_BLACK, popoverColor: '#140402', tableColor: NEAR_BLACK,
    tableHeaderColor: '#140402', tableColorHover: '#1a0503', tableColorStriped: '#0f0201',
    inputColor: '#0f0201', inputColorDisabled: '#0a0100', actionColor: '#140402', hoverColor: '#1f0603', pressedColor: '#2a0804',
    buttonColor2: '#1a0503', buttonColor2Hover: '#240704', buttonColor2Pressed: '#2e0905',
    tagColor: '#1a0503', avatarColor: '#2a0804', progressRailColor: RED_LINE, railColor: RED_LINE,
    scrollbarColor: RED_LINE, scrollbarColorHover: RED_FAINT, invertedColor: BLACK,
    boxShadow1: 'none', boxShadow2: 'none', boxShadow3: 'none',
  },
  Button: { textColorPrimary: BLACK, textColorHoverPrimary: BLACK, textColorPressedPrimary: BLACK, textColorFocusPrimary: BLACK },
  Switch: { buttonColor: RED_TEXT },
  Tooltip: { color: '#140402', textColor: RED_TEXT },
};

/** The Naive UI theme and overrides for a mode. */
export function naiveTheme(mode: ThemeMode): { theme: GlobalTheme; overrides: GlobalThemeOverrides } {
  return { theme: darkTheme, overrides: mode === 'night-vision' ? nightVisionOverrides : darkOverrides };
}
