import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { envSchema, parseEnv } from './env';

/** `.env.example` is the settings' documentation: it must name every variable the API reads, and nothing else. */
describe('.env.example', () => {
  const text = readFileSync(join(__dirname, '..', '..', '..', '.env.example'), 'utf8');
  // A variable counts as documented whether it is set or commented out ("# NAME=").
  const documented = new Set([...text.matchAll(/^#?\s*([A-Z][A-Z0-9_]+)=/gm)].map((m) => m[1]));
  const read = Object.keys(envSchema.shape);

  it('documents every setting the API reads', () => {
    expect(read.filter((name) => !documented.has(name))).toEqual([]);
  });

  it('documents no setting the API does not read', () => {
    expect([...documented].filter((name) => !read.includes(name))).toEqual([]);
  });

  it('says what happens without the two secrets, and the API does exactly that', () => {
    expect(text).toMatch(/DB_PASSWORD and JWT_SECRET have no default/);
    expect(() => parseEnv({})).toThrow(/DB_PASSWORD[\s\S]*JWT_SECRET/);
  });

  it('holds values the API accepts', () => {
    const set = Object.fromEntries([...text.matchAll(/^([A-Z][A-Z0-9_]+)=([^#\n]*)/gm)].map((m) => [m[1], m[2].trim()]));
    expect(() => parseEnv({ ...set, DB_PASSWORD: 'x', JWT_SECRET: 'x'.repeat(32) })).not.toThrow();
  });
});
