import type { GlobalThemeOverrides } from 'naive-ui'

// Loudhour's own palette: a deep river teal for actions, amber for attention, and warm paper
// tones that stay readable outdoors. Contrast of body text on the backgrounds is above 7:1.
const fontFamily =
  "'IBM Plex Sans', system-ui, -apple-system, 'Segoe UI', Roboto, 'Helvetica Neue', Arial, sans-serif"
const fontFamilyMono = "'IBM Plex Mono', ui-monospace, SFMono-Regular, Menlo, Consolas, monospace"

const shared: GlobalThemeOverrides['common'] = {
  fontFamily,
  fontFamilyMono,
  borderRadius: '6px',
  borderRadiusSmall: '4px',
  fontSize: '15px',
  fontSizeMedium: '15px',
  lineHeight: '1.55',
}

export const lightTheme: GlobalThemeOverrides = {
  common: {
    ...shared,
    primaryColor: '#1f5e70',
    primaryColorHover: '#2a7388',
    primaryColorPressed: '#17495a',
    primaryColorSuppl: '#2a7388',
    warningColor: '#b86e00',
    warningColorHover: '#cc7c05',
    warningColorPressed: '#995b00',
    errorColor: '#b3261e',
    errorColorHover: '#c8372e',
    errorColorPressed: '#921d17',
    successColor: '#2e7d4f',
    infoColor: '#1f5e70',
    bodyColor: '#f7f5f0',
    cardColor: '#ffffff',
    textColorBase: '#1b2326',
    textColor1: '#1b2326',
    textColor2: '#2e3a3f',
    textColor3: '#56656b',
    borderColor: '#d9d4ca',
    dividerColor: '#e4dfd5',
  },
  Layout: { color: '#f7f5f0', headerColor: '#ffffff', siderColor: '#ffffff' },
}

export const darkTheme: GlobalThemeOverrides = {
  common: {
    ...shared,
    primaryColor: '#6cc3d5',
    primaryColorHover: '#86d1e0',
    primaryColorPressed: '#4fa9bc',
    primaryColorSuppl: '#86d1e0',
    warningColor: '#f0b354',
    warningColorHover: '#f5c273',
    warningColorPressed: '#d99a38',
    errorColor: '#ff8a80',
    errorColorHover: '#ffa49c',
    errorColorPressed: '#e57368',
    successColor: '#7fcf9a',
    infoColor: '#6cc3d5',
    bodyColor: '#121a1d',
    cardColor: '#1a2428',
    textColorBase: '#e9eef0',
    textColor1: '#e9eef0',
    textColor2: '#cdd7da',
    textColor3: '#9aa9ae',
    borderColor: '#2f3d42',
    dividerColor: '#27343a',
  },
  Layout: { color: '#121a1d', headerColor: '#172023', siderColor: '#172023' },
}

/** Chart colours follow the theme so lines keep their contrast in both modes. */
export interface ChartPalette {
  voltage: string
  charge: string
  limit: string
  lockout: string
  grid: string
  text: string
  series: string[]
}

export const lightChartPalette: ChartPalette = {
  voltage: '#1f5e70',
  charge: '#b86e00',
  limit: '#b3261e',
  lockout: '#6b4aa0',
  grid: '#e4dfd5',
  text: '#2e3a3f',
  series: ['#1f5e70', '#b86e00', '#2e7d4f', '#6b4aa0', '#8c5a3c', '#56656b'],
}

export const darkChartPalette: ChartPalette = {
  voltage: '#6cc3d5',
  charge: '#f0b354',
  limit: '#ff8a80',
  lockout: '#c3a6f0',
  grid: '#2f3d42',
  text: '#cdd7da',
  series: ['#6cc3d5', '#f0b354', '#7fcf9a', '#c3a6f0', '#e0a882', '#9aa9ae'],
}
