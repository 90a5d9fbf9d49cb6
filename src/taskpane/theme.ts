/* global Office */

// The pane follows the Office theme where the host reports one, the system's light or dark preference otherwise.

function luminance(hex: string): number | undefined {
  const m = /^#?([0-9a-f]{6})$/i.exec(hex.trim());
  if (!m) return undefined;
  const [r, g, b] = [0, 2, 4].map((i) => parseInt(m[1].slice(i, i + 2), 16) / 255)
    .map((c) => (c <= 0.03928 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4));
  return 0.2126 * r + 0.7152 * g + 0.0722 * b; // WCAG 2 relative luminance
}

/** 'dark' or 'light' from an Office theme's body background, or undefined when the host gives none. */
export function themeFromOffice(theme: { bodyBackgroundColor?: string } | undefined): 'dark' | 'light' | undefined {
  const l = theme?.bodyBackgroundColor === undefined ? undefined : luminance(theme.bodyBackgroundColor);
  return l === undefined ? undefined : l < 0.2 ? 'dark' : 'light';
}

/** Sets the page's theme class from Office.context.officeTheme; without one, CSS follows prefers-color-scheme. */
export function applyOfficeTheme(): void {
  let theme: { bodyBackgroundColor?: string } | undefined;
  try {
    theme = (Office.context as unknown as { officeTheme?: { bodyBackgroundColor?: string } }).officeTheme;
  } catch {
    theme = undefined;
  }
  const choice = themeFromOffice(theme);
  document.documentElement.classList.toggle('theme-dark', choice === 'dark');
  document.documentElement.classList.toggle('theme-light', choice === 'light');
}
