import { startStack } from '../../src/dev/stack';

/**
 * The API as its own process for the fault tests (started with register-ts.cjs): the stack
 * against a MariaDB the test runs (FAULT_DB_SOCKET), listening on PORT. Prints "ready" once
 * it serves; SIGTERM stops it cleanly, SIGKILL is what the test is about.
 */
async function main() {
  const socket = process.env.FAULT_DB_SOCKET;
  if (!socket) throw new Error('FAULT_DB_SOCKET is not set');
  const stack = await startStack({ externalDatabase: { socket }, seed: (process.env.SEED as 'users' | 'none') ?? 'users', quiet: true });
  process.stdout.write(`ready ${stack.url}\n`);
  process.once('SIGTERM', () => void stack.stop().then(() => process.exit(0)));
}

main().catch((error: Error) => {
  process.stderr.write(`api-process did not start: ${error.stack ?? error.message}\n`);
  process.exit(1);
});
