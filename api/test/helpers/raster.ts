import { join } from 'node:path';

/**
 * The scan rasteriser of test-fixtures (scripts/lib/raster.ts): outside the api's rootDir, so it
 * is required at run time (jest and tsx both compile it) and typed here.
 */
export interface RasterOptions {
  seed: number;
  dpi?: number;
  maxRotation?: number;
  noise?: number;
  specks?: number;
  quality?: number;
  pages?: number[];
}

export interface Rasterised {
  pdf: Buffer;
  pages: Array<{ page: number; rotation: number }>;
  dpi: number;
}

type RasteriserModule = { rasterisePdf: (source: Uint8Array, options: RasterOptions) => Promise<Rasterised> };

export function rasterisePdf(source: Uint8Array, options: RasterOptions): Promise<Rasterised> {
  const lib = require(join(__dirname, '..', '..', '..', 'test-fixtures', 'scripts', 'lib', 'raster')) as RasteriserModule;
  return lib.rasterisePdf(source, options);
}
