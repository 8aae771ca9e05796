import 'reflect-metadata';
import { Logger } from '@nestjs/common';
import { createApp } from './app.factory';
import { parseEnv, publicUrl } from './config/env';

/** Runs the API alone against services that are already up (see dev/start.ts for the local stack). */
async function main() {
  const env = parseEnv();
  const app = await createApp(env, { shutdownHooks: true });
  await app.listen(env.PORT, env.HOST);
  new Logger('Shuntwise').log(`listening on ${publicUrl(env)}`);
}

main().catch((error) => {
  console.error(error instanceof Error ? error.message : error);
  process.exit(1);
});
