/** Unit specs live beside the code (src/**\/*.spec.ts); integration specs against the real
 * MariaDB live in test/ (*.e2e-spec.ts). Type-checking is its own step (tsc --noEmit). */
module.exports = {
  testEnvironment: 'node',
  rootDir: '.',
  testMatch: ['<rootDir>/src/**/*.spec.ts', '<rootDir>/test/**/*.e2e-spec.ts'],
  transform: { '^.+\\.ts$': ['ts-jest', { tsconfig: '<rootDir>/tsconfig.json' }] },
  moduleNameMapper: { '^@shuntwise/contracts$': '<rootDir>/../contracts/src/index.ts' },
  globalSetup: '<rootDir>/test/setup/global-setup.ts',
  globalTeardown: '<rootDir>/test/setup/global-teardown.ts',
  testTimeout: 60000,
};
