import { deflateRawSync, constants } from 'node:zlib';

/**
 * A small, well-formed PDF whose one content stream is a Flate stream of zeros that inflates
 * to `inflatedBytes` (a "decompression bomb"): about 1 000 : 1, so 2.5 MB on disk is 2.5 GB
 * inflated. Built from one deflate block repeated (a full flush makes each copy stand alone,
 * DEFLATE, RFC 1951) inside a zlib wrapper with its Adler-32 (RFC 1950), so it is made in
 * milliseconds instead of compressing gigabytes.
 */
export function zeroBombPdf(inflatedBytes: number): Buffer {
  const chunkSize = 16 * 1024 * 1024;
  const copies = Math.max(1, Math.round(inflatedBytes / chunkSize));
  const block = deflateRawSync(Buffer.alloc(chunkSize), { level: 9, finishFlush: constants.Z_FULL_FLUSH });
  const last = deflateRawSync(Buffer.alloc(0)); // a final, empty block
  const total = copies * chunkSize;
  // Adler-32 of n zero bytes: a = 1, b = n mod 65521.
  const adler = Buffer.alloc(4);
  adler.writeUInt32BE((((total % 65521) << 16) | 1) >>> 0);
  const stream = Buffer.concat([Buffer.from([0x78, 0xda]), ...Array<Buffer>(copies).fill(block), last, adler]);

  const parts: Buffer[] = [Buffer.from('%PDF-1.7\n%\xE2\xE3\xCF\xD3\n', 'latin1')];
  const offsets: number[] = [];
  let length = parts[0].length;
  const add = (b: Buffer) => {
    parts.push(b);
    length += b.length;
  };
  const object = (n: number, body: Buffer | string) => {
    offsets[n] = length;
    add(Buffer.from(`${n} 0 obj\n`, 'latin1'));
    add(typeof body === 'string' ? Buffer.from(body, 'latin1') : body);
    add(Buffer.from('\nendobj\n', 'latin1'));
  };
  object(1, '<< /Type /Catalog /Pages 2 0 R >>');
  object(2, '<< /Type /Pages /Kids [3 0 R] /Count 1 >>');
  object(3, '<< /Type /Page /Parent 2 0 R /MediaBox [0 0 595 842] /Resources << >> /Contents 4 0 R >>');
  object(
    4,
    Buffer.concat([Buffer.from(`<< /Length ${stream.length} /Filter /FlateDecode >>\nstream\n`, 'latin1'), stream, Buffer.from('\nendstream', 'latin1')]),
  );
  const xref = length;
  const rows = [1, 2, 3, 4].map((n) => `${String(offsets[n]).padStart(10, '0')} 00000 n \n`).join('');
  add(Buffer.from(`xref\n0 5\n0000000000 65535 f \n${rows}trailer\n<< /Size 5 /Root 1 0 R >>\nstartxref\n${xref}\n%%EOF\n`, 'latin1'));
  return Buffer.concat(parts);
}
