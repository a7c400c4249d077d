import type { ThemeConfig } from 'ant-design-vue/es/config-provider/context';

/**
 * Busbar's look, defined once. The ant-design-vue tokens and the CSS variables below are both
 * derived from this palette; contrast ratios in comments are against the background named, and
 * tests/unit/theme-contrast.test.ts holds every text colour to WCAG AA (4.5:1) on its background.
 */
export const palette = {
  copper: '#A4532A', // white text on it 5.5:1
  copperHover: '#B45F33', // white text on it 4.5:1
  copperActive: '#8C4522',
  copperSoft: '#FFF4EC',
  copperOnDark: '#D9894F', // on graphite 6.0:1
  graphite: '#1B1F24',
  graphiteRaised: '#2C3238',
  heading: '#1F252B',
  text: '#2A3138',
  textMuted: '#5F6872', // on the page surface 5.1:1
  textPlaceholder: '#666E77', // lighter than entered text, still 5.2:1 in a white field
  textOnDark: '#C3C7CC',
  page: '#F2F4F6',
  surface: '#FFFFFF',
  border: '#D5DAE0',
  borderSoft: '#E6E9ED',
  tableHeader: '#EEF1F4',
} as const;

/** Status tones: text on its own background always passes WCAG AA (4.5:1 or better). */
export const tones = {
  success: { text: '#1B6B3A', background: '#E6F2EA', border: '#A9D3B8' },
  info: { text: '#1F5A8A', background: '#E7F0F8', border: '#A9C6E0' },
  warning: { text: '#8A5200', background: '#FBF1E0', border: '#E6C48A' },
  danger: { text: '#A3262A', background: '#FBE9E9', border: '#E4A9AB' },
  neutral: { text: '#4A525A', background: '#ECEEF0', border: '#C9CED4' },
} as const;
export type Tone = keyof typeof tones;

const fontFamily = "'Noto Sans', system-ui, -apple-system, 'Segoe UI', sans-serif";

export const themeConfig: ThemeConfig = {
  token: {
    colorPrimary: palette.copper,
    colorPrimaryHover: palette.copperHover,
    colorPrimaryActive: palette.copperActive,
    colorLink: palette.copper,
    colorLinkHover: palette.copperActive,
    colorLinkActive: palette.copperActive,
    colorInfo: tones.info.text,
    colorInfoBg: tones.info.background,
    colorInfoBorder: tones.info.border,
    colorSuccess: '#1E7A43',
    colorSuccessBg: tones.success.background,
    colorSuccessBorder: tones.success.border,
    colorWarning: '#A15C00',
    colorWarningBg: tones.warning.background,
    colorWarningBorder: tones.warning.border,
    colorError: '#B42318',
    colorErrorBg: tones.danger.background,
    colorErrorBorder: tones.danger.border,
    colorTextBase: palette.text,
    colorTextSecondary: palette.textMuted,
    // The kit draws these from the text colour at 45 % and 25 % opacity (about 2.5:1 and 1.6:1 on
    // white); placeholders, empty notes and help icons must be read, so they get solid colours.
    colorTextTertiary: palette.textMuted,
    colorTextDescription: palette.textMuted,
    colorTextPlaceholder: palette.textPlaceholder,
    colorBgLayout: palette.page,
    colorBgContainer: palette.surface,
    colorBorder: palette.border,
    colorBorderSecondary: palette.borderSoft,
    colorFillAlter: palette.tableHeader,
    borderRadius: 6,
    borderRadiusLG: 8,
    borderRadiusSM: 4,
    fontFamily,
    fontSize: 14,
    wireframe: false,
  },
  components: {
    Layout: { colorBgHeader: palette.surface, colorBgBody: palette.page, colorBgTrigger: palette.graphiteRaised },
    Menu: {
      colorItemBg: palette.graphite,
      colorSubItemBg: palette.graphite,
      colorItemText: palette.textOnDark,
      colorItemTextHover: '#FFFFFF',
      colorItemTextSelected: '#FFFFFF',
      colorItemBgHover: palette.graphiteRaised,
      colorItemBgSelected: palette.copper,
    },
  },
};

/** Publishes the palette as CSS variables (`--bb-copper`, `--bb-tone-success-text`, …) for our own styles. */
export function applyThemeVariables(root: HTMLElement): void {
  const kebab = (name: string) => name.replace(/[A-Z]/g, (c) => `-${c.toLowerCase()}`);
  for (const [name, value] of Object.entries(palette)) root.style.setProperty(`--bb-${kebab(name)}`, value);
  for (const [tone, colours] of Object.entries(tones)) {
    for (const [part, value] of Object.entries(colours)) root.style.setProperty(`--bb-tone-${tone}-${part}`, value);
  }
  root.style.setProperty('--bb-font', fontFamily);
}
