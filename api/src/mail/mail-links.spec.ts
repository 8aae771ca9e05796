import fc from 'fast-check';
import { absoluteLinks } from './mail-links';

// Mail clients open links only with a scheme and host (RFC 3986 §4.3: a relative reference
// needs a base URI, and a mail has none): every app path in a mail becomes absolute.
describe('absoluteLinks', () => {
  const base = 'http://127.0.0.1:8080';

  it('prefixes app paths at the start of a line, after a space or a colon', () => {
    const body = ['Open it in Shuntwise: /qualifications/12', '', 'Sources of HP-1: /sources?housePartId=3', '/board', '(see /find).'].join('\n');
    expect(absoluteLinks(body, `${base}/`)).toBe(
      [
        'Open it in Shuntwise: http://127.0.0.1:8080/qualifications/12',
        '',
        'Sources of HP-1: http://127.0.0.1:8080/sources?housePartId=3',
        'http://127.0.0.1:8080/board',
        '(see http://127.0.0.1:8080/find).',
      ].join('\n'),
    );
  });

  it('leaves absolute links, units and fractions alone', () => {
    const body = 'Set it here: https://shuntwise.example/invitation/abc\n5 mV/K, 250 K/W, (TJ max − 25 °C)/RthJA, 1/2';
    expect(absoluteLinks(body, base)).toBe(body);
  });

  it('never leaves a relative app path in generated text (fast-check; print the seed to replay)', () => {
    const seed = Number(process.env.FC_SEED ?? Date.now() % 2 ** 31);
    console.log(`absoluteLinks seed ${seed}`);
    const word = fc.stringMatching(/^[a-z][a-z0-9-]{0,10}$/);
    fc.assert(
      fc.property(
        fc.array(word, { minLength: 1, maxLength: 3 }),
        fc.array(fc.stringMatching(/^[A-Za-z0-9 .,:]{0,12}$/), { maxLength: 4 }),
        (segments, words) => {
          const path = `/${segments.join('/')}`;
          const out = absoluteLinks([...words, path].join(' '), base);
          return out.endsWith(`${base}${path}`) && !new RegExp(`(^|\\s)${path.replace(/[-/]/g, '\\$&')}$`).test(out);
        },
      ),
      { seed },
    );
  });
});
