import { DEFAULT_THEME, type CSSVariablesResolver } from '@mantine/core';

/**
 * Text at least 4.5:1 against its background (WCAG 2.2, 1.4.3): in the light scheme the
 * dimmed grey and the text of light-variant badges, alerts and active links are one or two
 * shades darker than Mantine's defaults, which measure about 4:1 on white and on their tints.
 */
export const cssVariablesResolver: CSSVariablesResolver = (theme) => {
  const names = new Set([...Object.keys(DEFAULT_THEME.colors), ...Object.keys(theme.colors)]);
  const light: Record<string, string> = { '--mantine-color-dimmed': 'var(--mantine-color-gray-7)' };
  for (const name of names) {
    light[`--mantine-color-${name}-light-color`] = `var(--mantine-color-${name}-9)`;
    light[`--mantine-color-${name}-outline`] = `var(--mantine-color-${name}-9)`;
  }
  return { variables: {}, light, dark: {} };
};
