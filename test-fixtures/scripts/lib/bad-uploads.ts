import PDFDocument from 'pdfkit';
import { greyPng } from './png';
import { Prng } from './prng';
import { FIXTURE_DATE, Sheet } from './sheet';

/**
 * Files an upload must refuse or treat specially. Each is described in README.md; the
 * over-size case is made at test time instead of being committed.
 */

/** A page image that looks like printed lines of text, for the scan fixture. */
function scannedPage(prng: Prng): Buffer {
  const width = 620;
  const height = 877;
  const lines: Array<{ y: number; words: Array<[number, number]> }> = [];
  for (let y = 60; y < height - 60; y += prng.int(14, 22)) {
    const words: Array<[number, number]> = [];
    for (let x = 50; x < width - 60;) {
      const w = prng.int(12, 60);
      words.push([x, Math.min(x + w, width - 50)]);
      x += w + prng.int(5, 10);
    }
    lines.push({ y, words });
  }
  const noise = new Prng(99);
  return greyPng(width, height, (x, y) => {
    const speck = noise.next() < 0.004 ? 120 : 0;
    for (const line of lines) {
      if (y >= line.y && y < line.y + 7) {
        for (const [a, b] of line.words) if (x >= a && x < b) return 40 + speck;
      }
    }
    return 238 - speck;
  });
}

function render(doc: PDFKit.PDFDocument): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    doc.on('data', (c: Buffer) => chunks.push(c));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
    doc.end();
  });
}

export async function scannedPdf(): Promise<Buffer> {
  const prng = new Prng(4242);
  const doc = new PDFDocument({
    size: 'A4',
    margin: 0,
    autoFirstPage: false,
    info: { Title: 'Scanned datasheet', Creator: 'Shuntwise test-fixtures generator', Producer: 'pdfkit', CreationDate: FIXTURE_DATE, ModDate: FIXTURE_DATE },
  });
  for (let page = 0; page < 2; page++) {
    doc.addPage({ size: 'A4', margin: 0 });
    doc.image(scannedPage(prng), 0, 0, { width: 595.28, height: 841.89 });
  }
  return render(doc);
}

export async function encryptedPdf(): Promise<Buffer> {
  const sheet = new Sheet({ vendor: 'Brackenford Semiconductor', title: 'BRZ05 series', docId: 'DS-0412', revision: 'C' }, { userPassword: 'open-sesame' });
  sheet.text('This datasheet is protected: a password is needed to open it.', 50, 80, { size: 10 });
  return sheet.finish();
}

/** A PNG screenshot saved with a .pdf name. */
export function notAPdf(): Buffer {
  return greyPng(64, 32, (x, y) => (((x >> 3) + (y >> 3)) % 2 ? 255 : 30));
}

/** The first part of a real datasheet, cut off mid-file as an interrupted download would be. */
export function truncatedPdf(full: Buffer): Buffer {
  return full.subarray(0, Math.floor(full.length * 0.45));
}

/** A PDF header, then garbage, then an end-of-file marker: it looks complete but is not a PDF inside. */
export function corruptPdf(): Buffer {
  const prng = new Prng(1313);
  return Buffer.concat([Buffer.from('%PDF-1.7\n%\xE2\xE3\xCF\xD3\n', 'latin1'), prng.bytes(24_000), Buffer.from('\n%%EOF\n', 'latin1')]);
}
