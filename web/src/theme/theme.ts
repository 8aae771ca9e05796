import { createTheme, type MantineColorsTuple, type MantineThemeComponents } from '@mantine/core';

// Shuntwise's own palette: a warm copper (the colour of the traces a regulator diode
// sits between) as the working colour, a verdigris green for "cleared", and a warm
// graphite for the dark scheme.
const copper: MantineColorsTuple = ['#fdf4ee', '#f8e4d6', '#f0c6a8', '#e7a677', '#df8a4e', '#d97835', '#c2661f', '#a4541a', '#834316', '#63320f'];

// Mantine's orange, yellow, lime and green, with shades 7–9 dark enough for text and white-on-colour
// at 4.5:1 (WCAG 2.2, 1.4.3); shades 0–6 as Mantine has them.
const orange: MantineColorsTuple = ['#fff4e6', '#ffe8cc', '#ffd8a8', '#ffc078', '#ffa94d', '#ff922b', '#fd7e14', '#c2410c', '#9a3412', '#7c2d12'];
const yellow: MantineColorsTuple = ['#fff9db', '#fff3bf', '#ffec99', '#ffe066', '#ffd43b', '#fcc419', '#fab005', '#a16207', '#854d0e', '#713f12'];
const lime: MantineColorsTuple = ['#f4fce3', '#e9fac8', '#d8f5a2', '#c0eb75', '#a9e34b', '#94d82d', '#82c91e', '#4d7c0f', '#3f6212', '#365314'];
// Red: the light scheme's filled shade (8) carries white badge text ("Fail") at 5.3:1; Mantine's own is 4.2:1.
const red: MantineColorsTuple = ['#fff5f5', '#ffe3e3', '#ffc9c9', '#ffa8a8', '#ff8787', '#ff6b6b', '#fa5252', '#e03131', '#c92a2a', '#a51d1d'];
const green: MantineColorsTuple = ['#ebfbee', '#d3f9d8', '#b2f2bb', '#8ce99a', '#69db7c', '#51cf66', '#40c057', '#2b8a3e', '#1f6f33', '#14532d'];

const verdigris: MantineColorsTuple = ['#ebf7f3', '#d5ece5', '#a8d8cb', '#78c3ae', '#52b196', '#3aa587', '#2d8f74', '#237a62', '#19634f', '#0d4b3b'];

const graphite: MantineColorsTuple = ['#dcd9d4', '#bdb9b2', '#948f87', '#6f6a63', '#4d4945', '#3b3835', '#2d2b29', '#232220', '#1b1a19', '#141312'];

// Default props as plain objects, not `Table.extend(...)`: importing the components here
// would put every one of them into the first chunk the sign-in page downloads.
const components: MantineThemeComponents = {
  // Engineers compare many rows at once: tables are dense unless a screen says otherwise.
  Table: {
    defaultProps: {
      verticalSpacing: 4,
      horizontalSpacing: 'sm',
      fz: 'sm',
      highlightOnHover: true,
      withTableBorder: true,
      withColumnBorders: false,
    },
  },
  Badge: { defaultProps: { variant: 'light', radius: 'sm', tt: 'none' } },
  Button: { defaultProps: { fw: 500 } },
  Paper: { defaultProps: { withBorder: true, radius: 'md', p: 'md' } },
  Alert: { defaultProps: { variant: 'light', radius: 'md' } },
  NavLink: { defaultProps: { fz: 'sm' } },
  // The close button of every dialog is an icon: give it a name (axe button-name, screen readers).
  Modal: { defaultProps: { closeButtonProps: { 'aria-label': 'Close' } } },
  Drawer: { defaultProps: { closeButtonProps: { 'aria-label': 'Close' } } },
  // Toasts: a named close button, and the message in the text colour (Mantine's dimmed grey is 3.3:1 on white).
  Notification: { defaultProps: { closeButtonProps: { 'aria-label': 'Close message' } }, styles: { description: { color: 'var(--mantine-color-text)' } } },
};

const fontFamily = 'Lexend, "Segoe UI", system-ui, -apple-system, sans-serif';

export const theme = createTheme({
  primaryColor: 'copper',
  // Shade 8 in the light scheme: filled buttons, links and outlines at 4.5:1 or more on white.
  primaryShade: { light: 8, dark: 5 },
  colors: { copper, verdigris, orange, yellow, lime, green, red, dark: graphite },
  fontFamily,
  fontFamilyMonospace: '"DejaVu Sans Mono", "Cascadia Mono", Menlo, monospace',
  headings: { fontFamily, fontWeight: '500' },
  defaultRadius: 'sm',
  cursorType: 'pointer',
  components,
});
