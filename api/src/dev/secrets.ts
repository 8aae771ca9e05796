import { randomBytes } from 'node:crypto';
import { chmodSync, existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';

export interface LocalSecrets {
  jwtSecret: string;
  dbPassword: string;
}

/** Secrets generated at first set-up into the git-ignored data folder (mode 600), reused after. */
export function loadOrCreateSecrets(dataDir: string): LocalSecrets {
  mkdirSync(dataDir, { recursive: true });
  const file = join(dataDir, 'secrets.json');
  if (existsSync(file)) return JSON.parse(readFileSync(file, 'utf8')) as LocalSecrets;
  const secrets: LocalSecrets = { jwtSecret: randomBytes(48).toString('base64url'), dbPassword: randomBytes(18).toString('base64url') };
  writeFileSync(file, JSON.stringify(secrets, null, 2), { mode: 0o600 });
  chmodSync(file, 0o600);
  return secrets;
}
