import type { MRT_RowData, MRT_TableOptions } from 'mantine-react-table';

/**
 * Defaults every mantine-react-table in Shuntwise starts from: dense rows, no
 * full-screen toggle, our own paper. A type-only import, so this file does not pull the
 * data-grid library into a chunk by itself.
 */
export function denseTableOptions<T extends MRT_RowData>(): Partial<MRT_TableOptions<T>> {
  return {
    initialState: { density: 'xs' },
    // Columns take the width their content needs instead of 180 px each, so a table of
    // seven columns fits beside the navigation without scrolling sideways.
    layoutMode: 'semantic',
    defaultColumn: { size: 60, minSize: 40 },
    enableFullScreenToggle: false,
    enableDensityToggle: true,
    enableColumnActions: false,
    mantinePaperProps: { withBorder: true, shadow: undefined, radius: 'md' },
    mantineTableProps: { striped: false, highlightOnHover: true, fz: 'sm' },
  };
}
