/** Node-side tests: solver/, shared/, server/ unit specs plus tests/verification and tests/integration. */
module.exports = {
  displayName: 'node',
  testEnvironment: 'node',
  roots: ['<rootDir>/solver', '<rootDir>/shared', '<rootDir>/server', '<rootDir>/tests/verification', '<rootDir>/tests/integration'],
  testMatch: ['**/*.spec.ts', '**/*.test.ts'],
  transform: { '^.+\\.ts$': ['ts-jest', { tsconfig: '<rootDir>/tsconfig.server.json' }] },
  globalSetup: '<rootDir>/tests/integration/global-setup.ts',
  testTimeout: 60000,
};
