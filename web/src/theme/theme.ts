import { createTheme, type MantineColorsTuple, type MantineThemeComponents } from '@mantine/core';

// Shuntwise's own palette: a warm copper (the colour of the traces a regulator diode
// sits between) as the working colour, a verdigris green for "cleared", and a warm
// graphite for the dark scheme.
const copper: MantineColorsTuple = [
  '#fdf4ee',
  '#f8e4d6',
  '#f0c6a8',
  '#e7a677',
  '#df8a4e',
  '#d97835',
  '#c2661f',
  '#a4541a',
  '#834316',
  '#63320f',
];

const verdigris: MantineColorsTuple = [
  '#ebf7f3',
  '#d5ece5',
  '#a8d8cb',
  '#78c3ae',
  '#52b196',
  '#3aa587',
  '#2d8f74',
  '#237a62',
  '#19634f',
  '#0d4b3b',
];

const graphite: MantineColorsTuple = [
  '#dcd9d4',
  '#bdb9b2',
  '#948f87',
  '#6f6a63',
  '#4d4945',
  '#3b3835',
  '#2d2b29',
  '#232220',
  '#1b1a19',
  '#141312',
];

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
};

const fontFamily = 'Lexend, "Segoe UI", system-ui, -apple-system, sans-serif';

export const theme = createTheme({
  primaryColor: 'copper',
  primaryShade: { light: 6, dark: 5 },
  colors: { copper, verdigris, dark: graphite },
  fontFamily,
  fontFamilyMonospace: '"DejaVu Sans Mono", "Cascadia Mono", Menlo, monospace',
  headings: { fontFamily, fontWeight: '500' },
  defaultRadius: 'sm',
  cursorType: 'pointer',
  components,
});
