import { BadRequestException } from '@nestjs/common';
import { WellFormedTextPipe } from './well-formed-text.pipe';

const pipe = new WellFormedTextPipe();
const body = { type: 'body' as const };
const refusal = (value: unknown, meta: Parameters<WellFormedTextPipe['transform']>[1] = body) => {
  try {
    pipe.transform(value, meta);
    return null;
  } catch (error) {
    expect(error).toBeInstanceOf(BadRequestException);
    return (error as BadRequestException).getResponse() as { errors: Array<{ path: string; message: string }> };
  }
};

describe('WellFormedTextPipe', () => {
  it('passes well-formed text, tabs and line breaks, astral characters and buffers', () => {
    const value = { note: 'line 1\r\n\tline 2 — 5.1 V ±5 % 😀', list: [1, 'two'], file: Buffer.from([0, 1, 2]) };
    expect(pipe.transform(value, body)).toBe(value);
  });

  it('names the field holding a lone surrogate (high or low)', () => {
    expect(refusal({ spec: { note: 'a\ud800b' } })?.errors).toEqual([{ path: 'spec.note', message: expect.stringMatching(/surrogate/) }]);
    expect(refusal({ items: ['ok', '\udc00'] })?.errors[0].path).toBe('items.1');
    expect(refusal({ q: '\ud83d' }, { type: 'query' })?.errors[0].path).toBe('query.q');
  });

  it('refuses control characters other than tab and line breaks, in values and keys', () => {
    expect(refusal({ summary: 'x\u0000y' })?.errors[0]).toEqual({ path: 'summary', message: expect.stringMatching(/control character/) });
    expect(refusal({ summary: 'esc \u001b[31m' })?.errors[0].path).toBe('summary');
    expect(refusal({ 'a\u0007': 1 })?.errors[0].path).toBe('(key)');
  });

  it('refuses nesting deeper than it will walk', () => {
    let deep: unknown = 'leaf';
    for (let i = 0; i < 200; i++) deep = [deep];
    expect(refusal({ deep })?.errors[0].message).toMatch(/nested deeper/);
  });
});
