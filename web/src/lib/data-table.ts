import type { MRT_RowData, MRT_TableOptions } from 'mantine-react-table';

/**
 * Defaults every mantine-react-table in Shuntwise starts from: dense rows, no
 * full-screen toggle, our own paper. A type-only import, so this file does not pull the
 * data-grid library into a chunk by itself.
 */
export function denseTableOptions<T extends MRT_RowData>(): Partial<MRT_TableOptions<T>> {
  return {
    initialState: { density: 'xs' },
    enableFullScreenToggle: false,
    enableDensityToggle: true,
    enableColumnActions: false,
    mantinePaperProps: { withBorder: true, shadow: undefined, radius: 'md' },
    mantineTableProps: { striped: false, highlightOnHover: true, fz: 'sm' },
  };
}
